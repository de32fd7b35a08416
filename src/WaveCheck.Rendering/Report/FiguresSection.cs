using System.Globalization;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using static WaveCheck.Rendering.Report.ReportFormat;

namespace WaveCheck.Rendering.Report;

/// <summary>The measurement tables: whole-capture figures, components, tones, harmonic groups, bands above 2 kHz,
/// events and the statistics over windows.</summary>
internal static class FiguresSection
{
    internal static void Figures(HtmlWriter html, AnalysisResult analysis)
    {
        var s = analysis.Summary;
        var c = analysis.Components;
        html.Raw("<section id=\"figures\">\n<h2>Measured figures</h2>\n<h3>Whole capture</h3>\n<table><tbody>\n");
        Row(html, Capitalised(FigureLabels.WholeCaptureRms), CurrentText.WithUnit(s.RmsA));
        if (analysis.Windows.Statistics.TryGetValue("rmsA", out var rmsStats))
        {
            Row(html, Capitalised(FigureLabels.WorstWindowRms), $"{CurrentText.WithUnit(rmsStats.Max)} (at {Seconds(rmsStats.TimeOfMaxS)})");
            Row(html, $"RMS, {FigureLabels.Percentile95}", CurrentText.WithUnit(rmsStats.P95));
        }

        Row(html, "DC (mean)", CurrentText.WithUnit(s.DcA));
        Row(html, "AC RMS (mean removed)", CurrentText.WithUnit(s.AcRmsA));
        Row(html, "Peak (largest absolute sample)", CurrentText.WithUnit(s.PeakA));
        Row(html, "Highest / lowest sample", $"{CurrentText.WithUnit(s.PeakPositiveA)} / {CurrentText.WithUnit(s.PeakNegativeA)}");
        Row(html, "Crest factor", double.IsFinite(s.CrestFactor) ? Number(s.CrestFactor, "0.00") : "not defined (no current)");
        html.Raw("</tbody></table>\n<h3>Components</h3>\n<table><tbody>\n");
        Row(html, "Smooth DC (whole capture / worst window)", $"{CurrentText.WithUnit(c.SmoothDcA)} / {CurrentText.WithUnit(c.SmoothDcMaxA)}");
        Row(html, "Pulsating DC", $"{(c.PulsatingDc ? "yes" : "no")} ({Percent(c.PulsatingDcShare * 100)} of windows)");
        Row(html, "Current-delay angle", c.CurrentDelayAngleDeg is double alpha ? Number(alpha, "0") + "°" : "not a phase-controlled half-wave");
        Row(html, "Mains frequency (harmonic group 1)", CurrentText.WithUnit(c.MainsRmsA));
        Row(html, "Below mains frequency", CurrentText.WithUnit(c.BelowMainsRmsA));
        Row(html, "Harmonics 2 to 50", CurrentText.WithUnit(c.HarmonicsRmsA));
        Row(html, "Above 1 kHz", CurrentText.WithUnit(c.Above1kHzRmsA));
        Row(html, "Above 9 kHz", CurrentText.WithUnit(c.Above9kHzRmsA));
        Row(html, "THD", c.ThdPercent is double thd ? Percent(thd) : "no fundamental");
        html.Raw("</tbody></table>\n");
        if (c.Tones.Count > 0)
        {
            html.Raw("<h3>Strongest tones that are not mains harmonics</h3>\n<table>\n<thead><tr><th class=\"num\">Frequency</th><th class=\"num\">RMS</th></tr></thead>\n<tbody>\n");
            foreach (var tone in c.Tones)
            {
                html.Raw("<tr>");
                Num(html, Hertz(tone.FrequencyHz));
                Num(html, CurrentText.WithUnit(tone.RmsA));
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        Harmonics(html, analysis);
        Bands(html, analysis);
        Events(html, analysis.Events);
        Statistics(html, analysis.Windows);
        html.Raw("</section>\n");
    }

    internal static void Harmonics(HtmlWriter html, AnalysisResult analysis)
    {
        var level = TableSignificance.LevelA(analysis);
        var shown = analysis.Harmonics.Where(h => h.Order is >= 1 and <= 50 && TableSignificance.Significant(h.RmsA, level)).ToList();
        var fundamental = analysis.Harmonics.FirstOrDefault(h => h.Order == 1)?.RmsA ?? 0;
        html.Raw("<h3>Harmonic groups (IEC 61000-4-7)</h3>\n");
        if (shown.Count == 0)
        {
            html.Raw("<p>").Text($"No harmonic group at or above {CurrentText.WithUnit(level)}.").Raw("</p>\n");
        }
        else
        {
            html.Raw("<table>\n<thead><tr><th class=\"num\">Order</th><th class=\"num\">Frequency</th><th class=\"num\">Whole-capture RMS</th><th class=\"num\">Worst window</th><th class=\"num\">Of fundamental</th></tr></thead>\n<tbody>\n");
            foreach (var h in shown)
            {
                html.Raw("<tr>");
                Num(html, h.Order.ToString(CultureInfo.InvariantCulture));
                Num(html, Hertz(h.FrequencyHz));
                Num(html, CurrentText.WithUnit(h.RmsA));
                Num(html, CurrentText.WithUnit(h.MaxA));
                Num(html, fundamental > 0 ? Percent(100 * h.RmsA / fundamental) : "–");
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        html.Raw("<p class=\"muted\">").Text(FloorNote(analysis.Harmonics.Count - shown.Count, "harmonic groups", level)).Raw("</p>\n");
    }

    internal static void Bands(HtmlWriter html, AnalysisResult analysis)
    {
        var bands = analysis.Bands;
        var level = TableSignificance.LevelA(analysis);
        var shown = bands.Where(b => TableSignificance.Significant(b.RmsA, level)).ToList();
        html.Raw("<h3>Frequency bands above 2 kHz</h3>\n");
        if (shown.Count == 0)
        {
            html.Raw("<p>").Text($"No band at or above {CurrentText.WithUnit(level)}.").Raw("</p>\n");
        }
        else
        {
            html.Raw("<table>\n<thead><tr><th class=\"num\">From</th><th class=\"num\">To</th><th class=\"num\">Whole-capture RMS</th><th class=\"num\">Worst window</th></tr></thead>\n<tbody>\n");
            foreach (var b in shown)
            {
                html.Raw("<tr>");
                Num(html, Hertz(b.LowHz));
                Num(html, Hertz(b.HighHz));
                Num(html, CurrentText.WithUnit(b.RmsA));
                Num(html, CurrentText.WithUnit(b.MaxA));
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        html.Raw("<p class=\"muted\">").Text(FloorNote(bands.Count - shown.Count, "bands", level)).Raw("</p>\n");
    }

    internal static void Events(HtmlWriter html, IReadOnlyList<EventRecord> events)
    {
        html.Raw("<h3>Events</h3>\n");
        if (events.Count == 0)
        {
            html.Raw("<p>No alarms or transients.</p>\n");
            return;
        }

        html.Raw("<table class=\"wide\">\n<thead><tr><th>Kind</th><th class=\"num\">Start</th><th class=\"num\">Duration</th><th class=\"num\">Value</th><th>Description</th></tr></thead>\n<tbody>\n");
        foreach (var e in events.Take(ReportWriter.MaxEventRows))
        {
            html.Raw("<tr><td>").Text(e.Kind).Raw("</td>");
            Num(html, Seconds(e.StartS));
            Num(html, Seconds(e.DurationS));
            Num(html, CurrentText.WithUnit(e.ValueA));
            html.Raw("<td>").Text(e.Message).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n");
        if (events.Count > ReportWriter.MaxEventRows)
        {
            html.Raw("<p class=\"muted\">").Text($"First {ReportWriter.MaxEventRows} of {events.Count} events listed; the analysis JSON holds them all.").Raw("</p>\n");
        }
    }

    internal static void Statistics(HtmlWriter html, WindowsResult windows)
    {
        html.Raw("<h3>Statistics over windows</h3>\n<p>")
            .Text($"{windows.Count} windows of {windows.CyclesPerWindow} mains cycles ({Seconds(windows.LengthS)}); largest synchronisation error {Percent(windows.MaxSyncErrorPercent)}.")
            .Raw("</p>\n");
        if (windows.Statistics.Count == 0)
        {
            return;
        }

        html.Raw("<table>\n<thead><tr><th>Figure per window</th><th class=\"num\">Mean of windows</th><th class=\"num\">95th percentile</th><th class=\"num\">Worst window</th><th class=\"num\">At</th></tr></thead>\n<tbody>\n");
        foreach (var (name, stat) in windows.Statistics.OrderBy(p => FigureLabels.MetricRank(p.Key)).ThenBy(p => p.Key, StringComparer.Ordinal))
        {
            if (!double.IsFinite(stat.Mean) && !double.IsFinite(stat.Max))
            {
                continue; // a figure no window had (no delay angle, no THD): nothing to list
            }

            html.Raw("<tr><td>").Text(FigureLabels.Metric(name)).Raw("</td>");
            Num(html, MetricValue(name, stat.Mean));
            Num(html, MetricValue(name, stat.P95));
            Num(html, MetricValue(name, stat.Max));
            Num(html, Seconds(stat.TimeOfMaxS));
            html.Raw("</tr>\n");
        }

        html.Raw("</tbody>\n</table>\n");
    }
}
