using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using static WaveCheck.Rendering.Report.ReportFormat;

namespace WaveCheck.Rendering.Report;

/// <summary>The methods with the standards they rest on, and the appendix of thresholds applied with the status of each.</summary>
internal static class MethodsSection
{
    internal static void Methods(HtmlWriter html, AnalysisResult analysis, ReportContext context)
    {
        html.Raw("<section id=\"methods\">\n<h2>Methods</h2>\n<p>")
            .Text($"Mains frequency: {analysis.Mains.Method}. The capture is cut into synchronised windows of {analysis.Windows.CyclesPerWindow} mains cycles; spectra, harmonic groups and bands are computed per window and combined as the RMS over windows. Analysis by WaveCheck {analysis.ToolVersion}; report by WaveCheck {context.ToolVersion}.")
            .Raw("</p>\n<table>\n<thead><tr><th>Standard</th><th>Used for</th></tr></thead>\n<tbody>\n");
        foreach (var (standard, use) in ReportWriter.Standards)
        {
            html.Raw("<tr><td>").Text(standard).Raw("</td><td>").Text(use).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    internal static void Thresholds(HtmlWriter html, AssessmentResult a)
    {
        html.Raw("<section id=\"thresholds\">\n<h2>Appendix: thresholds applied</h2>\n<p>")
            .Text($"Status of each value: \"std\" is the standard's value as reproduced in public sources; values marked {FigureLabels.ToConfirm} were taken from memory of the standard and not checked against its text; \"engineering choice\" and \"practice\" are this tool's or the trade's choices, not a standard's.")
            .Raw("</p>\n<table class=\"wide\">\n<thead><tr><th>Threshold</th><th class=\"num\">Value</th><th>Source</th><th>Status</th></tr></thead>\n<tbody>\n");
        foreach (var t in a.Thresholds)
        {
            html.Raw("<tr><td>").Text(FigureLabels.Threshold(t.Name)).Raw("</td>");
            Num(html, t.Unit == "A" ? CurrentText.WithUnit(t.Value) : t.Unit == "1" ? Number(t.Value, "0.####") : t.Unit == "deg" ? Number(t.Value, "0.#") + "°" : $"{Number(t.Value, "0.####")} {t.Unit}");
            html.Raw("<td>").Text(FigureLabels.ForClient(t.Source)).Raw("</td><td>").Text(Status(t.Source)).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    /// <summary>The status of a limit from its source text (docs/references.md): from memory, standard, engineering
    /// choice or practice; "overridden" when the user set it.</summary>
    internal static string Status(string source)
    {
        var status = FigureLabels.FromMemory(source) ? "from memory: to confirm against the standard"
            : source.Contains("engineering choice", StringComparison.OrdinalIgnoreCase) ? "engineering choice"
            : source.Contains("practice", StringComparison.OrdinalIgnoreCase) ? "practice of the trade"
            : source.Contains("(std)", StringComparison.Ordinal) ? "standard"
            : "as stated";
        return source.Contains("(overridden)", StringComparison.Ordinal) ? status + "; overridden by the user" : status;
    }
}
