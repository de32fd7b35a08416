using System.CommandLine;
using WaveCheck.Core;
using WaveCheck.Core.Model;
using WaveCheck.Rendering.Plots;

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
