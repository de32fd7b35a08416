using System.Globalization;
using Spectre.Console;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Cli;

/// <summary>The terminal summary's line on the leakage split (only for a capture with a voltage channel).</summary>
internal static class LeakageSplitLine
{
    public static void Print(Screen screen, LeakageSplitResult? split, bool details)
    {
        if (split is null)
        {
            return;
        }

        screen.Paragraph(Text(split), VerdictPrinter.Label("Leakage"), VerdictPrinter.Indent);
        if (split.Insulation is { State: InsulationState.BelowMinimum or InsulationState.AtLimit } insulation)
        {
            // The first screen keeps the finding and what to do; the reasoning comes with --details.
            var message = details ? insulation.Message : insulation.Summary + " Reasoning: --details.";
            screen.Paragraph(message, VerdictPrinter.Indent);
        }
    }

    /// <summary>One line: the split, R and C (or the located phase), the model test.</summary>
    public static string Text(LeakageSplitResult split)
    {
        if (split.Windows == 0)
        {
            return "Leakage split: no window with a usable voltage (" + string.Join(", ", split.VoltageChannels) + ").";
        }

        var r = split.ResistanceOhm is { } ohms ? ImpedanceText.Resistance(ohms) : "no resistive part";
        var c = ImpedanceText.Capacitance(split.CapacitanceF.Mean);
        var head = string.Create(CultureInfo.InvariantCulture,
            $"Leakage split ({split.Kind}, {split.VoltageRmsV:0} V): resistive {CurrentText.WithUnit(split.ResistiveA.Mean)}, capacitive {CurrentText.WithUnit(split.CapacitiveA.Mean)}");
        if (split.Location is { } location)
        {
            var dominant = location.Directions.First(d => d.Phase == location.DominantPhase && d.Kind == location.DominantKind);
            var equivalent = dominant.ResistanceOhm is { } dr ? ImpedanceText.Resistance(dr)
                : dominant.CapacitanceF is { } dc ? ImpedanceText.Capacitance(dc) : "-";
            return string.Create(CultureInfo.InvariantCulture,
                $"{head}; asymmetry mostly {location.DominantKind} on {location.DominantPhase} ({CurrentText.WithUnit(dominant.MeanA)}, {equivalent}), assuming balanced capacitances cancel.");
        }

        var model = split.Fit?.SimpleRc switch
        {
            true => "; fits an R ∥ C leakage over the voltage's harmonics",
            false => "; NOT a simple R-C leakage (harmonic fit residual too large)",
            _ => string.Empty,
        };
        return $"{head}: R {r}, C {c}{model}.";
    }
}
