using WaveCheck.Core.Model;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Report;

/// <summary>The plots, inline as SVG, each with its title and caption.</summary>
internal static class PlotsSection
{
    internal static void Plots(HtmlWriter html, AnalysisResult analysis, AssessmentResult? assessment)
    {
        html.Raw("<section id=\"plots\">\n<h2>Plots</h2>\n");
        var index = 0;
        foreach (var kind in PlotRenderer.Applicable(analysis))
        {
            var (title, caption) = PlotCaption(kind, assessment);
            var svg = PlotRenderer.RenderSvg(kind, analysis, assessment);
            html.Raw("<figure id=\"plot-").Raw(kind.ToString().ToLowerInvariant()).Raw("\">\n");
            html.Raw(InlineSvg.Prepare(svg, $"p{index}-", title));
            html.Raw("\n<figcaption>").Text(caption).Raw("</figcaption>\n</figure>\n");
            index++;
        }

        html.Raw("</section>\n");
    }

    internal static (string Title, string Caption) PlotCaption(PlotKind kind, AssessmentResult? assessment)
    {
        var lines = assessment is null ? string.Empty : $" Dashed and dotted lines: {assessment.NonOperatingLimitText()} (non-operating limit) and {assessment.LeakageBudgetText()} (leakage budget).";
        return kind switch
        {
            PlotKind.Overview => ("Residual current over the whole capture",
                "The band spans the smallest and largest sample in each time bucket, so no peak is lost. Black dashed: the DC level." + lines + " Vertical lines: events."),
            PlotKind.Cycles => ("Mains cycles of the worst window",
                "Consecutive mains cycles of the window with the highest RMS drawn over one period. 0° is the start of the excerpt, not a voltage zero crossing."),
            PlotKind.Spectrum => ("Spectrum",
                "RMS per frequency bin on logarithmic axes; DC is stated above the plot. Shading shows which device types are specified for each frequency range; content in the unshaded part lies outside every type's range."),
            PlotKind.Trend => ("Trend", "One point per window (decimated, worst value kept, for long captures)." + lines),
            _ => (kind.ToString(), string.Empty),
        };
    }
}
