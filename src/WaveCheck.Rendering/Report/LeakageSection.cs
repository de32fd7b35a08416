using System.Globalization;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Report;

/// <summary>The report's section on the leakage split (only for a capture with a voltage channel): the insulation
/// finding first, the figures, the model test or the three-phase location, the notes, and the phasor and trend plots.</summary>
internal static class LeakageSection
{
    public static void Write(HtmlWriter html, AnalysisResult analysis)
    {
        if (analysis.LeakageSplit is not { } split)
        {
            return;
        }

        html.Raw("<section id=\"leakage-split\">\n<h2>Resistive and capacitive leakage</h2>\n<p>").Text(
            $"The residual current's fundamental split against the {split.Kind} voltage ({string.Join(", ", split.VoltageChannels)}): the part in phase with the voltage flows through resistance (insulation), the part leading it by 90° through capacitance (filters, cables).").Raw("</p>\n");
        if (split.Insulation is { } insulation)
        {
            var css = insulation.State is InsulationState.BelowMinimum or InsulationState.AtLimit ? "alert" : "muted";
            html.Raw("<p class=\"").Raw(css).Raw("\">").Text(insulation.Message).Raw("</p>\n");
        }

        if (split.Windows > 0)
        {
            html.Raw("<table><tbody>\n");
            Row(html, "voltage (fundamental, mean)", string.Create(CultureInfo.InvariantCulture, $"{split.VoltageRmsV:0.#} V at {split.FrequencyHz:0.##} Hz"));
            Row(html, "resistive I_R (mean / max)", $"{CurrentText.WithUnit(split.ResistiveA.Mean)} / {CurrentText.WithUnit(split.ResistiveA.Max)}");
            Row(html, "capacitive I_C (mean / max)", $"{CurrentText.WithUnit(split.CapacitiveA.Mean)} / {CurrentText.WithUnit(split.CapacitiveA.Max)}");
            Row(html, "leakage resistance R = V / I_R (mean / least)",
                $"{Ohms(split.ResistanceOhm)} / {Ohms(split.LeastResistanceOhm)}");
            Row(html, "capacitance C = I_C / (2π f V) (mean)", ImpedanceText.Capacitance(split.CapacitanceF.Mean));
            if (split.Fit is { } fit)
            {
                Row(html, "R-C fit over harmonic orders " + string.Join(", ", fit.Orders),
                    $"R {Ohms(fit.ResistanceOhm)}, C {ImpedanceText.Capacitance(fit.CapacitanceF)}, "
                    + (fit.WindowsTested == 0
                        ? "not tested (one order)"
                        : string.Create(CultureInfo.InvariantCulture, $"residual {fit.Residual.P95 * 100:0.#} % (95th percentile; limit {fit.ResidualLimit * 100:0} %): {(fit.SimpleRc == false ? "not a simple R-C leakage" : "an R ∥ C leakage")}")));
            }

            Row(html, "windows split", string.Create(CultureInfo.InvariantCulture, $"{split.Windows} (without voltage: {split.WindowsWithoutVoltage})"));
            html.Raw("</tbody></table>\n");
        }

        if (split.Location is { } location)
        {
            html.Raw("<h3>Where the asymmetry lies</h3>\n<table>\n<thead><tr><th>Phase</th><th>Kind</th><th class=\"num\">Mean current</th><th class=\"num\">Equivalent</th></tr></thead>\n<tbody>\n");
            foreach (var d in location.Directions)
            {
                var dominant = d.Phase == location.DominantPhase && d.Kind == location.DominantKind;
                html.Raw(dominant ? "<tr class=\"dominant\"><td>" : "<tr><td>").Text(d.Phase).Raw("</td><td>").Text(d.Kind + (dominant ? " (dominant)" : string.Empty))
                    .Raw("</td><td class=\"num\">").Text(CurrentText.WithUnit(d.MeanA)).Raw("</td><td class=\"num\">")
                    .Text(d.ResistanceOhm is { } r ? ImpedanceText.Resistance(r) : d.CapacitanceF is { } c && d.MeanA > 0 ? ImpedanceText.Capacitance(c) : "-")
                    .Raw("</td></tr>\n");
            }

            html.Raw("</tbody></table>\n<p>").Text($"Assumption: {location.Assumption}.").Raw("</p>\n");
        }

        if (split.Notes.Count > 0)
        {
            html.Raw("<ul>\n");
            foreach (var note in split.Notes.Where(n => n != split.Insulation?.Message))
            {
                html.Raw("<li>").Text(note).Raw("</li>\n");
            }

            html.Raw("</ul>\n");
        }

        if (split.Windows > 0)
        {
            Plot(html, "leakage-phasors", "p-leak-phasor-", "Leakage phasors", LeakagePlot.Phasors(split),
                "Mean phasors at the fundamental. Voltages are drawn to the longest voltage, currents to the residual current; the residual current is the sum of I_R along the voltage and I_C a quarter-period ahead of it.");
            Plot(html, "leakage-trend", "p-leak-trend-", "Leakage trend", LeakagePlot.Trend(split),
                "I_R and I_C of each window. A resistive part that grows while the capacitive part stays level points to insulation, not to the equipment's filters. Dotted: the resistive current of the minimum insulation resistance at the measured voltage.");
        }

        html.Raw("</section>\n");
    }

    private static void Plot(HtmlWriter html, string id, string prefix, string title, OxyPlot.PlotModel model, string caption)
    {
        using var buffer = new MemoryStream();
        PlotRenderer.Export(model, PlotFormat.Svg, buffer);
        html.Raw("<figure id=\"").Raw(id).Raw("\">\n");
        html.Raw(InlineSvg.Prepare(System.Text.Encoding.UTF8.GetString(buffer.ToArray()), prefix, title));
        html.Raw("\n<figcaption>").Text(caption).Raw("</figcaption>\n</figure>\n");
    }

    private static string Ohms(double? ohms) => ohms is { } r ? ImpedanceText.Resistance(r) : "no resistive part";

    private static void Row(HtmlWriter html, string name, string value) =>
        html.Raw("<tr><th>").Text(name).Raw("</th><td class=\"num\">").Text(value).Raw("</td></tr>\n");
}
