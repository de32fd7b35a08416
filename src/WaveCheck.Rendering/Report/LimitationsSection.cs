using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using static WaveCheck.Rendering.Report.ReportFormat;

namespace WaveCheck.Rendering.Report;

/// <summary>What the capture could not show, and the cautions that go with the report.</summary>
internal static class LimitationsSection
{
    internal static void Limitations(HtmlWriter html, AnalysisResult analysis)
    {
        var capture = analysis.Capture;
        html.Raw("<section id=\"limits\">\n<h2>What this capture could not show</h2>\n<ul>\n");
        html.Raw("<li>").Text($"Nothing above {Hertz(capture.NyquistHz)} (half the sample rate) is seen.").Raw("</li>\n");
        if (capture.SensorCoupling == SensorCoupling.Ac)
        {
            html.Raw("<li><strong>").Text("The sensor is AC-coupled: smooth DC is invisible to it, so the DC figures and anything decided by them are incomplete. Measure again with a DC-coupled sensor (fluxgate or Hall-effect).").Raw("</strong></li>\n");
        }
        else if (capture.SensorCoupling == SensorCoupling.Unknown)
        {
            html.Raw("<li>").Text("The sensor coupling was not stated: if the sensor is a plain current transformer, smooth DC was not recorded.").Raw("</li>\n");
        }

        if (capture.FullScaleA is double fullScale)
        {
            html.Raw("<li>").Text($"The recorder clips at {CurrentText.WithUnit(fullScale)}.").Raw("</li>\n");
        }

        var clipped = analysis.Trend.Count(w => w.Clipped);
        if (clipped > 0)
        {
            html.Raw("<li><strong>").Text($"{clipped} of the {analysis.Trend.Count} windows in the trend contain clipped samples: peaks and RMS there are too low, and the spectrum holds products of the clipping.").Raw("</strong></li>\n");
        }

        foreach (var warning in analysis.Warnings)
        {
            html.Raw("<li>").Text(warning.Message);
            if (warning.TimeS is double t)
            {
                html.Text($" (at {Seconds(t)})");
            }

            html.Raw("</li>\n");
        }

        html.Raw("</ul>\n</section>\n");
    }

    internal static void Cautions(HtmlWriter html, AssessmentResult? assessment)
    {
        html.Raw("<section id=\"cautions\">\n<h2>Cautions</h2>\n");
        // An assessment carries the standing cautions in its own words (verify on site, local codes, maker's data,
        // licensed people) plus the capture's limitations; printing both lists said each thing twice.
        var all = assessment is { Cautions.Count: > 0 } ? assessment.Cautions : ReportWriter.StandingCautions;
        List(html, all, null);
        html.Raw("</section>\n");
    }
}
