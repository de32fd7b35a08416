using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using static WaveCheck.Rendering.Report.ReportFormat;

namespace WaveCheck.Rendering.Report;

/// <summary>The verdict box with its alerts, the classes of residual current the verdict rests on, and each device
/// type's verdict with its evidence.</summary>
internal static class VerdictSection
{
    /// <summary>Words and a symbol for a type's verdict, never colour alone.</summary>
    internal static string SuitabilityText(bool? suitable) => suitable switch
    {
        true => "✔ suitable",
        false => "✘ not suitable",
        null => "? cannot be determined",
    };

    /// <summary>The verdict box's outcome at a glance: its CSS class and its words with a symbol (never colour alone).</summary>
    internal static (string CssClass, string Text) Outcome(AssessmentResult a) => (a.InstalledType, a.InstalledAdequate) switch
    {
        (not null, true) => ("adequate", "✔ Adequate: the installed device suits this circuit"),
        (not null, false) => ("not-adequate", "✘ Not adequate: the installed device does not suit this circuit"),
        (not null, null) => ("cannot-tell", "? Cannot tell whether the installed device suits this circuit"),
        _ => ("cannot-tell", "? Cannot tell: no installed device was stated (--device)"),
    };

    /// <summary>Words and a symbol for the installed device's adequacy.</summary>
    internal static string AdequacyText(bool? adequate) => adequate switch
    {
        true => "✔ adequate",
        false => "✘ not adequate",
        null => "? cannot be determined",
    };

    internal static void Verdict(HtmlWriter html, AssessmentResult a)
    {
        html.Raw("<section id=\"verdict\">\n<h2>Verdict</h2>\n<div class=\"verdict\">\n");
        var (outcomeClass, outcomeText) = Outcome(a);
        html.Raw("<p class=\"outcome ").Raw(outcomeClass).Raw("\">").Text(outcomeText).Raw("</p>\n<p class=\"required\">");
        if (a.RequiredType is { } required)
        {
            html.Text($"Required RCD type: {required.ToTradeName()}");
        }
        else
        {
            html.Text($"Required RCD type: cannot be determined from this capture (at least type {a.MinimumType.ToTradeName()})");
        }

        html.Raw("</p>\n<p class=\"headline\">").Text(a.Headline).Raw("</p>\n");
        if (a.AcceptedProtection is { } accepted && accepted != $"type {a.RequiredType?.ToTradeName()}")
        {
            html.Raw("<p>").Text($"Accepted protection: {accepted}.").Raw("</p>\n");
        }
        if (a.InstalledType is { } installed)
        {
            html.Raw("<p><strong>").Text($"Installed {a.InstalledProtection?.ToTradeName() ?? "type " + installed.ToTradeName()}: {AdequacyText(a.InstalledAdequate)}").Raw("</strong></p>\n");
        }

        html.Raw("<p class=\"muted\">").Text($"Rated residual operating current assessed: IΔn = {CurrentText.WithUnit(a.RatedResidualCurrentA)}; rules: {RegimeText(a.Regime)}.").Raw("</p>\n");
        html.Raw("</div>\n");
        if (a.TripReplay is { Alerts.Count: > 0 } replay)
        {
            // Beside the verdict, not only in the replay's section: an adequate type does not make a silent device safe.
            html.Raw("<div class=\"alert\">").Text($"Test the device: {replay.Alerts.Count} recorded event(s) reached a current and duration at which a compliant device of this rating must trip (see the trip replay below). If the installed device did not trip, test it with an RCD tester before relying on it.").Raw("</div>\n");
        }

        if (a.Blinding.Blinded == true)
        {
            html.Raw("<div class=\"alert\">").Text($"Blinding: the smooth DC of {CurrentText.WithUnit(a.Blinding.SmoothDcA)} exceeds what a type {a.Blinding.DeviceType.ToTradeName()} device is specified to work with ({Current(a.Blinding.ToleranceA)}). It may fail to trip on a real earth fault.").Raw("</div>\n");
        }

        html.Raw("</section>\n");
    }

    /// <summary>The classes of residual current the verdict rests on: figure, threshold, presence, least type.</summary>
    internal static void ClassTable(HtmlWriter html, AssessmentResult a)
    {
        if (a.Classes.Count == 0)
        {
            return;
        }

        html.Raw("<section id=\"classes\">\n<h2>Classes of residual current</h2>\n<p>").Text(
            $"The required type is the least type that detects every class present. Each figure is compared with its threshold allowing for the measurement uncertainty ({a.Accuracy}); a figure within it counts as present (the safe side).")
            .Raw("</p>\n<table class=\"wide\">\n<thead><tr><th>Class</th><th>Found</th><th class=\"num\">Figure</th><th class=\"num\">Threshold</th><th>Least type</th><th>Evidence</th></tr></thead>\n<tbody>\n");
        foreach (var c in a.Classes)
        {
            html.Raw("<tr><td>").Text(c.Name).Raw("</td><td>").Text(VerdictText.Of(c.Presence)).Raw("</td><td class=\"num\">")
                .Text(c.FigureA is { } f ? CurrentText.WithUnit(f) : "rule").Raw("</td><td class=\"num\">")
                .Text(c.ThresholdA is { } t ? CurrentText.WithUnit(t) : "–").Raw("</td><td>")
                .Text(c.CoveredByDcDetection ? $"{c.LeastType.ToTradeName()} (or A + 6 mA DC detection)" : c.LeastType.ToTradeName()).Raw("</td><td>")
                .Text(c.Text).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    internal static void TypeTable(HtmlWriter html, AssessmentResult a)
    {
        html.Raw("<section id=\"types\">\n<h2>Each device type</h2>\n<table class=\"wide\">\n<thead><tr><th>Type</th><th>Verdict</th><th>Evidence</th></tr></thead>\n<tbody>\n");
        foreach (var type in a.Types)
        {
            html.Raw("<tr><td><strong>").Text(type.Type.ToTradeName()).Raw("</strong></td><td class=\"verdict-cell\">").Text(SuitabilityText(type.Suitable)).Raw("</td><td>");
            List(html, type.Reasons, "reasons");
            html.Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }
}
