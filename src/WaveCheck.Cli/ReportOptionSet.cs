using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;
using WaveCheck.Core;
using WaveCheck.Core.Model;
using WaveCheck.Rendering.Plots;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Cli;

/// <summary>What a person asked to get out besides the console summary: report, plots, exit-code policy, progress.</summary>
internal sealed class ReportOptionSet
{
    public Option<string?> Report { get; } = ValueOptions.Text("--report", "Write a self-contained HTML report to this file.", "FILE");

    public Option<string?> Plots { get; } = ValueOptions.Text("--plots", "Write the plots into this folder.", "DIR");

    public Option<PlotFormat?> PlotFormat { get; } = ValueOptions.Choice("--plot-format",
        $"Plot files: png or svg (default {DefaultPlotFormat.ToString().ToLowerInvariant()}).",
        ("png", Rendering.Plots.PlotFormat.Png), ("svg", Rendering.Plots.PlotFormat.Svg));

    public Option<string?> Site { get; } = ValueOptions.Text("--site", "Site named in the report header, e.g. \"Unit 4, Fernbrook estate\".", "TEXT");

    public Option<string?> Circuit { get; } = ValueOptions.Text("--circuit", "Circuit named in the report header, e.g. \"C2 extractor fan\".", "TEXT");

    public Option<string?> Note { get; } = ValueOptions.Text("--note", "A note printed in the report header.", "TEXT");

    public Option<Finding?> FailOn { get; } = ValueOptions.Findings("--fail-on",
        "Exit with code 1 on these findings, comma-separated: upgrade (installed type not adequate; needs --device), " +
        "nuisance (nuisance-trip risk possible or likely), alarm (a window above --alarm).",
        ("upgrade", Finding.Upgrade), ("nuisance", Finding.Nuisance), ("alarm", Finding.Alarm));

    public Option<bool> Quiet { get; } = new("--quiet", "-q") { Description = "No progress display." };

    /// <summary>Plot files when <c>--plot-format</c> is not given.</summary>
    private const PlotFormat DefaultPlotFormat = Rendering.Plots.PlotFormat.Png;

    public Option<string?> Pdf { get; } = ValueOptions.Text("--pdf",
        "Also print the report to this PDF file, with a Chromium, Chrome or Edge found on this machine (headless).", "FILE");

    public Option<PaperSize> Paper { get; } = new("--paper")
    {
        Description = "Paper the report is laid out for when printed: a4 or letter.",
        HelpName = "a4|letter",
        DefaultValueFactory = _ => PaperSize.A4,
        CustomParser = result => ParsePaper(result),
    };

    public Option<string?> ReportNumber { get; } = ValueOptions.Text("--report-number", "Report number printed on every page, e.g. \"WS-2026-014\".", "TEXT");

    public Option<string?> Client { get; } = ValueOptions.Text("--client", "Client the test was made for.", "TEXT");

    public Option<string?> Address { get; } = ValueOptions.Text("--address", "Postal address of the site.", "TEXT");

    public Option<string?> Operator { get; } = ValueOptions.Text("--operator", "Who made the recording (printed under 'Tested by').", "TEXT");

    public Option<string?> Instrument { get; } = ValueOptions.Text("--instrument", "Recorder or meter used.", "TEXT");

    public Option<string?> InstrumentSerial { get; } = ValueOptions.Text("--instrument-serial", "Serial number of the recorder.", "TEXT");

    public Option<string?> Clamp { get; } = ValueOptions.Text("--clamp", "Current clamp or sensor used.", "TEXT");

    public Option<string?> ClampSerial { get; } = ValueOptions.Text("--clamp-serial", "Serial number of the clamp.", "TEXT");

    public Option<DateOnly?> CalibrationDue { get; } = new("--calibration-due")
    {
        Description = "Date the instrument's calibration is due, e.g. 2027-03-31.",
        HelpName = "DATE",
        CustomParser = result => ParseDate(result),
    };

    public Option<DateTimeOffset?> Recorded { get; } = new("--recorded")
    {
        Description = "When the capture was recorded, e.g. 2026-11-20T09:14 (UTC unless an offset is given); used only where the file does not say.",
        HelpName = "TIME",
        CustomParser = result => ParseTime(result),
    };

    public Option<bool> ProductTest { get; } = new("--product-test")
    {
        Description = "This is a product (equipment) test: compare the IEC 60990 touch-current readings with the product standards' limits in the report.",
    };

    public void AddTo(Command command)
    {
        command.Options.Add(Report);
        command.Options.Add(Plots);
        command.Options.Add(PlotFormat);
        command.Options.Add(Site);
        command.Options.Add(Circuit);
        command.Options.Add(Note);
        command.Options.Add(FailOn);
        command.Options.Add(Quiet);
    }

    public PlotFormat ReadPlotFormat(ParseResult parse) => parse.GetValue(PlotFormat) ?? DefaultPlotFormat;

    /// <summary>Adds the identity and print options (<c>analyze</c>: the report's identity block, paper and PDF).</summary>
    public void AddIdentityTo(Command command)
    {
        foreach (var option in new Option[] { Pdf, Paper, ReportNumber, Client, Address, Operator, Instrument, InstrumentSerial, Clamp, ClampSerial, CalibrationDue, Recorded, ProductTest })
        {
            command.Options.Add(option);
        }
    }

    /// <summary>The identity the options state (site and circuit included); blank text counts as not given.</summary>
    public ReportIdentity ReadIdentity(ParseResult parse)
    {
        string? Text(Option<string?> option) => parse.GetValue(option) is { } t && !string.IsNullOrWhiteSpace(t) ? t.Trim() : null;
        return new ReportIdentity
        {
            ReportNumber = Text(ReportNumber),
            Client = Text(Client),
            Site = Text(Site),
            SiteAddress = Text(Address),
            Circuit = Text(Circuit),
            Operator = Text(Operator),
            Instrument = Text(Instrument),
            InstrumentSerial = Text(InstrumentSerial),
            Clamp = Text(Clamp),
            ClampSerial = Text(ClampSerial),
            CalibrationDue = parse.GetValue(CalibrationDue),
            StatedRecordedAt = parse.GetValue(Recorded),
            ProductTest = parse.GetValue(ProductTest),
        };
    }

    private static PaperSize ParsePaper(ArgumentResult result)
    {
        var text = result.Tokens.Count > 0 ? result.Tokens[^1].Value : "a4";
        switch (text.Trim().ToLowerInvariant())
        {
            case "a4": return PaperSize.A4;
            case "letter": return PaperSize.Letter;
            default:
                result.AddError($"--paper: cannot use '{text}': expected a4 or letter");
                return PaperSize.A4;
        }
    }

    private static DateOnly? ParseDate(ArgumentResult result)
    {
        var text = result.Tokens.Count > 0 ? result.Tokens[^1].Value : string.Empty;
        if (DateOnly.TryParseExact(text.Trim(), "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var date))
        {
            return date;
        }

        result.AddError($"--calibration-due: cannot use '{text}': expected a date such as 2027-03-31 (year-month-day)");
        return null;
    }

    private static DateTimeOffset? ParseTime(ArgumentResult result)
    {
        var text = result.Tokens.Count > 0 ? result.Tokens[^1].Value.Trim() : string.Empty;
        if (text.Length >= 10 && DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal, out var time))
        {
            return time;
        }

        result.AddError($"--recorded: cannot use '{text}': expected a date or date and time such as 2026-11-20 or 2026-11-20T09:14:00Z");
        return null;
    }

    /// <summary>The findings to fail on; <c>upgrade</c> without an installed device is refused, as it could never
    /// fire (there is nothing to upgrade) and a pipeline would read exit 0 as "adequate".</summary>
    /// <param name="parse">The parse result.</param>
    /// <param name="deviceGiven">Whether an installed device is known for the capture(s).</param>
    /// <exception cref="UserInputException"><c>upgrade</c> without a device.</exception>
    public FailOnFindings ReadFailOn(ParseResult parse, bool deviceGiven)
    {
        var findings = (FailOnFindings)(parse.GetValue(FailOn) ?? Finding.None);
        if (findings.HasFlag(FailOnFindings.Upgrade) && !deviceGiven)
        {
            throw new UserInputException(UpgradeWithoutDevice);
        }

        return findings;
    }

    /// <summary>Why <c>--fail-on upgrade</c> needs a device.</summary>
    public const string UpgradeWithoutDevice =
        "--fail-on upgrade: judges the installed device, so it needs --device (e.g. --device A); without one nothing can need an upgrade and the exit code would always be 0";
}

/// <summary>Findings that turn the exit code to 1.</summary>
[Flags]
internal enum FailOnFindings
{
    None = WaveCheck.Core.Model.Finding.None,
    Upgrade = WaveCheck.Core.Model.Finding.Upgrade,
    Nuisance = WaveCheck.Core.Model.Finding.Nuisance,
    Alarm = WaveCheck.Core.Model.Finding.Alarm,
}
