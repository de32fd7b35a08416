using Spectre.Console;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using WaveCheck.Rendering;

namespace WaveCheck.Cli.Commands;

/// <summary>The survey's circuits (each with its captures under it) and its remedial schedule, on the terminal.</summary>
internal static class CircuitSummary
{
    public static void Print(IAnsiConsole console, SurveyDocument document)
    {
        if (document.Circuits.Count == 0)
        {
            return;
        }

        var plain = ConsoleOutput.Plain;
        var table = new Table().Border(plain ? TableBorder.Ascii : TableBorder.Rounded)
            .Title($"{document.Circuits.Count} circuits: one verdict each, the strongest over its captures");
        foreach (var column in new[] { "circuit / capture", "installed", "required", "verdict", "worst-window RMS", "nuisance" })
        {
            table.AddColumn(column);
        }

        foreach (var circuit in document.Circuits)
        {
            table.AddRow(
                new Text(circuit.Circuit),
                new Text(circuit.InstalledType is { } i ? $"{i} {CurrentText.WithUnit(circuit.RatedResidualCurrentA)}" : "-"),
                new Text(Required(circuit.RequiredType, circuit.MinimumType)),
                new Text(SurveyIndexWriter.VerdictLabel(circuit.Verdict)),
                new Text(circuit.WorstWindowRmsA is { } rms ? CurrentText.WithUnit(rms) : ""),
                new Text(circuit.NuisanceRisk is { } risk ? VerdictText.Of(risk) : ""));
            foreach (var capture in circuit.Captures)
            {
                var name = Path.GetFileName(capture.File);
                table.AddRow(
                    new Text("  - " + (capture.State is { Length: > 0 } state ? $"{state}: {name}" : name)),
                    new Text(""),
                    new Text(Required(capture.RequiredType, capture.MinimumType)),
                    new Text(SurveyIndexWriter.VerdictLabel(capture.Verdict)),
                    new Text(capture.WorstWindowRmsA is { } own ? CurrentText.WithUnit(own) : ""),
                    new Text(""));
            }
        }

        console.Write(table);
        if (document.Actions.Count == 0)
        {
            console.WriteLine("Remedial schedule: no circuit needs action.");
            return;
        }

        console.WriteLine("Remedial schedule (most urgent first; also actions.csv):");
        foreach (var action in document.Actions)
        {
            console.WriteLine($"  {action.Rank}. [{SurveyIndexWriter.PriorityLabel(action.Priority)}] {action.Circuit}"
                + $"{(action.Upstream ? " (upstream device)" : "")}: installed {action.InstalledType ?? "not given"}, required {action.Required}. {action.Reason}");
        }
    }

    private static string Required(DeviceType? required, DeviceType? minimum) =>
        required?.ToTradeName() ?? (minimum is { } m ? $"≥ {m.ToTradeName()}?" : "-");
}
