using System.CommandLine;
using WaveCheck.Core;
using WaveCheck.Core.Model;
using WaveCheck.Rendering.Plots;

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
