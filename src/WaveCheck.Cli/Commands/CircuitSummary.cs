using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using WaveCheck.Rendering;

namespace WaveCheck.Cli.Commands;

/// <summary>The survey's circuits (each with its captures under it) and its remedial schedule, on the terminal.</summary>
internal static class CircuitSummary
{
    public static void Print(Screen screen, SurveyDocument document)
    {
        if (document.Circuits.Count == 0)
        {
            return;
        }

        var table = new TextTable($"{document.Circuits.Count} circuits: one verdict each, the strongest over its captures",
            new("circuit / capture"), new("installed"), new("required"), new("verdict"), new("worst-window RMS", Right: true), new("nuisance"));
        foreach (var circuit in document.Circuits)
        {
            table.AddRow(
                circuit.Circuit,
                circuit.InstalledType is { } i ? $"{i.ToTradeName()} {CurrentText.WithUnit(circuit.RatedResidualCurrentA)}" : "-",
                Required(circuit.RequiredType, circuit.MinimumType),
                SurveyIndexWriter.VerdictLabel(circuit.Verdict),
                circuit.WorstWindowRmsA is { } rms ? CurrentText.WithUnit(rms) : "",
                circuit.NuisanceRisk is { } risk ? VerdictText.Of(risk) : "");
            foreach (var capture in circuit.Captures)
            {
                var name = Path.GetFileName(capture.File);
                table.AddRow(
                    "  - " + (capture.State is { Length: > 0 } state ? $"{state}: {name}" : name),
                    "",
                    Required(capture.RequiredType, capture.MinimumType),
                    SurveyIndexWriter.VerdictLabel(capture.Verdict),
                    capture.WorstWindowRmsA is { } own ? CurrentText.WithUnit(own) : "",
                    "");
            }
        }

        screen.Table(table);
        if (document.Actions.Count == 0)
        {
            screen.Paragraph("Remedial schedule: no circuit needs action.");
            return;
        }

        screen.Paragraph("Remedial schedule (most urgent first; also actions.csv):");
        foreach (var action in document.Actions)
        {
            screen.Paragraph($"{action.Rank}. [{SurveyIndexWriter.PriorityLabel(action.Priority)}] {action.Circuit}"
                + $"{(action.Upstream ? " (upstream device)" : "")}: installed {action.InstalledType?.ToTradeName() ?? "not given"}, required {action.Required}. {action.Reason}", "  ", "     ");
        }
    }

    private static string Required(DeviceType? required, DeviceType? minimum) =>
        required?.ToTradeName() ?? (minimum is { } m ? $"at least {m.ToTradeName()}" : "-");
}
