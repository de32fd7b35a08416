using System.CommandLine;
using System.CommandLine.Parsing;
using System.Globalization;
using WaveCheck.Core;
using WaveCheck.Rendering.Report;
using WaveCheck.Rendering.Plots;
using WaveCheck.Core.Model;

namespace WaveCheck.Cli;

/// <summary>What a person asked to get out besides the console summary: report, plots, exit-code policy, progress.</summary>
internal sealed class ReportOptionSet
{
    public Option<string?> Report { get; } = new("--report") { Description = "Write a self-contained HTML report to this file." };

    public Option<string?> Plots { get; } = new("--plots") { Description = "Write the plots into this folder." };

    public Option<string> PlotFormat { get; } = new("--plot-format")
    {
        Description = "Plot files: png or svg.",
        DefaultValueFactory = _ => "png",
    };

    public Option<string?> Site { get; } = new("--site") { Description = "Site named in the report header, e.g. \"Unit 4, Fernbrook estate\"." };

    public Option<string?> Circuit { get; } = new("--circuit") { Description = "Circuit named in the report header, e.g. \"C2 extractor fan\"." };

    public Option<string?> Note { get; } = new("--note") { Description = "A note printed in the report header." };

    public Option<string?> FailOn { get; } = new("--fail-on")
    {
        Description = "Exit with code 1 on these findings, comma-separated: upgrade (installed type not adequate), " +
                      "nuisance (nuisance-trip risk possible or likely), alarm (a window above --alarm).",
    };

    public Option<bool> Quiet { get; } = new("--quiet", "-q") { Description = "No progress display." };

    public Option<string?> Pdf { get; } = new("--pdf")
    {
        Description = "Also print the report to this PDF file, with a Chromium, Chrome or Edge found on this machine (headless).",
    };

    public Option<PaperSize> Paper { get; } = new("--paper")
    {
        Description = "Paper the report is laid out for when printed: a4 or letter.",
        DefaultValueFactory = _ => PaperSize.A4,
        CustomParser = result => ParsePaper(result),
    };

    public Option<string?> ReportNumber { get; } = new("--report-number") { Description = "Report number printed on every page, e.g. \"WS-2026-014\"." };

    public Option<string?> Client { get; } = new("--client") { Description = "Client the test was made for." };

    public Option<string?> Address { get; } = new("--address") { Description = "Postal address of the site." };

    public Option<string?> Operator { get; } = new("--operator") { Description = "Who made the recording (printed under 'Tested by')." };

    public Option<string?> Instrument { get; } = new("--instrument") { Description = "Recorder or meter used." };

    public Option<string?> InstrumentSerial { get; } = new("--instrument-serial") { Description = "Serial number of the recorder." };

    public Option<string?> Clamp { get; } = new("--clamp") { Description = "Current clamp or sensor used." };

    public Option<string?> ClampSerial { get; } = new("--clamp-serial") { Description = "Serial number of the clamp." };

    public Option<DateOnly?> CalibrationDue { get; } = new("--calibration-due")
    {
        Description = "Date the instrument's calibration is due, e.g. 2027-03-31.",
        CustomParser = result => ParseDate(result),
    };

    public Option<DateTimeOffset?> Recorded { get; } = new("--recorded")
    {
        Description = "When the capture was recorded, e.g. 2026-11-20T09:14 (UTC unless an offset is given); used only where the file does not say.",
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

    public PlotFormat ReadPlotFormat(ParseResult parse) => (parse.GetValue(PlotFormat) ?? "png").Trim().ToLowerInvariant() switch
    {
        "png" => Rendering.Plots.PlotFormat.Png,
        "svg" => Rendering.Plots.PlotFormat.Svg,
        var other => throw new OptionValueException("--plot-format", other, "png or svg"),
    };

    public FailOnFindings ReadFailOn(ParseResult parse)
    {
        var text = parse.GetValue(FailOn);
        var findings = FailOnFindings.None;
        if (text is null)
        {
            return findings;
        }

        foreach (var word in text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            findings |= word.ToLowerInvariant() switch
            {
                "upgrade" => FailOnFindings.Upgrade,
                "nuisance" => FailOnFindings.Nuisance,
                "alarm" => FailOnFindings.Alarm,
                _ => throw new OptionValueException("--fail-on", text, "upgrade, nuisance and/or alarm, comma-separated"),
            };
        }

        return findings;
    }
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
