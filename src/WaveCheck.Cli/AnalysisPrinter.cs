using System.Globalization;
using Spectre.Console;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Cli;

/// <summary>
/// What <c>analyze</c> prints. By default a first screen that fits about 25 lines at 80 columns: the capture in one
/// line, the verdict, one line per device type and per margin, the first cautions, where the details went, and the
/// verdict again as the last line. With <c>--details</c>, the full tables and every caution and warning in between.
/// </summary>
internal static class AnalysisPrinter
{
    /// <summary>An output written by the run, named for the "Details" line (<c>report</c>, <c>fan.html</c>).</summary>
    public readonly record struct Written(string What, string Path);

    public static void Print(Screen screen, AnalysisResult result, AssessmentResult a, bool details, bool showTouchCurrent,
        bool chargingPoint, IReadOnlyList<Written> written)
    {
        // Warnings that make every figure below them suspect come before the verdict (and again with the others).
        foreach (var warning in result.Warnings.Where(w => w.Code == Core.Evaluation.ImplausibleResidualCode))
        {
            screen.Paragraph(warning.Message, "WARNING: not a residual current? ", "  ", labelStyle: new Style(Color.Red, decoration: Decoration.Bold));
        }

        VerdictPrinter.Verdict(screen, a, full: details);
        if (details)
        {
            VerdictPrinter.Tables(screen, a, showTouchCurrent);
            LeakageSplitLine.Print(screen, result.LeakageSplit, details: true);
            TripReplayLines(screen, a, details: true);
            Quantities(screen, result);
            foreach (var warning in result.Warnings)
            {
                screen.Paragraph($"{warning.Code}: {warning.Message}", "warning ", "  ", labelStyle: new Style(Color.Yellow));
            }

            screen.Paragraph(WhereText(written, details: true), VerdictPrinter.Label("Written"), labelStyle: new Style(decoration: Decoration.Bold));
        }
        else
        {
            VerdictPrinter.TypeLines(screen, a);
            VerdictPrinter.MarginLines(screen, a, chargingPoint);
            LeakageSplitLine.Print(screen, result.LeakageSplit, details: false);
            TripReplayLines(screen, a, details: false);
            var more = VerdictPrinter.TopCautions(screen, a, VerdictPrinter.SummaryCautions);
            var info = result.Capture;
            screen.Paragraph(string.Create(CultureInfo.InvariantCulture,
                    $"{Path.GetFileName(info.FilePath)}: {info.DurationS:0.##} s at {info.SampleRateHz / 1000:0.###} kS/s, mains {result.Mains.FrequencyHz:0.00} Hz, RMS {CurrentText.WithUnit(result.Summary.RmsA)}"),
                VerdictPrinter.Label("Capture"), labelStyle: new Style(decoration: Decoration.Bold));
            var where = WhereText(written, details: false);
            screen.Paragraph((more > 0 ? $"{more} more cautions, evidence and measurements: --details" : "evidence and measurements: --details")
                             + (where.Length > 0 ? "; " + where : ""),
                VerdictPrinter.Label("Details"), labelStyle: new Style(decoration: Decoration.Bold));
        }

        VerdictPrinter.LastLine(screen, a);
    }

    /// <summary>The trip replay's one line, and each event a compliant device should have tripped on, loudly.</summary>
    private static void TripReplayLines(Screen screen, AssessmentResult a, bool details)
    {
        // On the first screen only when a surge reached 0.5 IΔn (the level the replay starts from).
        if (a.TripReplay is not { } replay || (!details && replay.EpisodesFound == 0 && replay.Alerts.Count == 0))
        {
            return;
        }

        screen.Paragraph(replay.Summary, VerdictPrinter.Label("Surges"), VerdictPrinter.Indent, labelStyle: new Style(decoration: Decoration.Bold));
        foreach (var alert in replay.Alerts)
        {
            screen.Paragraph(alert, "TEST THE DEVICE: ", "  ", labelStyle: new Style(Color.Red, decoration: Decoration.Bold));
        }
    }

    private static string WhereText(IReadOnlyList<Written> written, bool details) =>
        written.Count == 0
            ? details ? "nothing (a report with --report FILE, JSON with --json FILE)" : ""
            : string.Join("; ", written.Select(w => $"{w.What} {w.Path}"));

    private static void Quantities(Screen screen, AnalysisResult result)
    {
        var s = result.Summary;
        var c = result.Components;
        var m = result.Mains;
        var table = new TextTable(result.Capture.FilePath, new("quantity"), new("value", Right: true), new("note"));
        table.AddRow("RMS", CurrentText.WithUnit(s.RmsA), "true RMS, whole capture");
        table.AddRow("mean (DC)", CurrentText.WithUnit(s.DcA), "");
        table.AddRow("smooth DC", CurrentText.WithUnit(c.SmoothDcA), $"worst window {CurrentText.WithUnit(c.SmoothDcMaxA)}");
        table.AddRow("AC RMS", CurrentText.WithUnit(s.AcRmsA), "");
        table.AddRow("peak + / −", $"{CurrentText.Milliamps(s.PeakPositiveA)} / {CurrentText.Milliamps(s.PeakNegativeA)} mA",
            string.Create(CultureInfo.InvariantCulture, $"crest factor {s.CrestFactor:0.00}"));
        table.AddRow("mains", string.Create(CultureInfo.InvariantCulture, $"{m.FrequencyHz:0.000} Hz"),
            string.Create(CultureInfo.InvariantCulture, $"{m.Source}, {m.MinHz:0.000} to {m.MaxHz:0.000} Hz"));
        table.AddRow("fundamental", CurrentText.WithUnit(c.MainsRmsA), "harmonic group 1");
        table.AddRow("below mains", CurrentText.WithUnit(c.BelowMainsRmsA), "");
        table.AddRow("harmonics 2-50", CurrentText.WithUnit(c.HarmonicsRmsA),
            c.ThdPercent is { } thd ? string.Create(CultureInfo.InvariantCulture, $"THD {thd:0.0} %") : "no fundamental");
        table.AddRow("above 1 kHz", CurrentText.WithUnit(c.Above1kHzRmsA), "");
        table.AddRow("above 9 kHz", CurrentText.WithUnit(c.Above9kHzRmsA), "");
        table.AddRow("pulsating DC", c.PulsatingDc ? "yes" : "no",
            string.Create(CultureInfo.InvariantCulture, $"{c.PulsatingDcShare * 100:0} % of windows")
            + (c.CurrentDelayAngleDeg is { } angle ? string.Create(CultureInfo.InvariantCulture, $", delay angle {angle:0} °") : ""));
        foreach (var tone in c.Tones)
        {
            table.AddRow("tone", CurrentText.WithUnit(tone.RmsA), string.Create(CultureInfo.InvariantCulture, $"{tone.FrequencyHz:0.#} Hz"));
        }

        table.AddRow("windows", result.Windows.Count.ToString(CultureInfo.InvariantCulture),
            string.Create(CultureInfo.InvariantCulture, $"{result.Windows.CyclesPerWindow} cycles, {result.Events.Count} events"));
        screen.Table(table);
    }
}
