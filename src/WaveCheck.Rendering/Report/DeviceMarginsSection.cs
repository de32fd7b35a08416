using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using static WaveCheck.Rendering.Report.ReportFormat;

namespace WaveCheck.Rendering.Report;

/// <summary>The margins for the device: nuisance tripping with its frequency ranges, smooth-DC blinding, EV charging,
/// GFCI (UL 943) and touch current (IEC 60990).</summary>
internal static class DeviceMarginsSection
{
    internal static void DeviceMargins(HtmlWriter html, AnalysisResult analysis, AssessmentResult a, bool productTest)
    {
        var trip = a.NuisanceTrip;
        html.Raw("<section id=\"device\">\n<h2>").Text($"Margins for a type {trip.DeviceType.ToTradeName()} device, IΔn {CurrentText.WithUnit(a.RatedResidualCurrentA)}").Raw("</h2>\n");
        html.Raw("<h3>Nuisance tripping</h3>\n<table><tbody>\n");
        Row(html, "Risk", RiskText(trip.Risk));
        Row(html, "Standing residual current (each frequency range's worst window, combined; unweighted)", CurrentText.WithUnit(trip.StandingA));
        Row(html, "As a typical device responds (frequency-weighted, second figure)", CurrentText.WithUnit(trip.TypicalStandingA));
        Row(html, $"Non-operating limit {a.NonOperatingLimitText()}", CurrentText.WithUnit(trip.NonOperatingLimitA));
        Row(html, "Margin to the limit", $"{CurrentText.WithUnit(trip.MarginA)} ({Percent(trip.MarginPercent)} of the limit){(trip.MarginA < 0 ? " — above the limit" : string.Empty)}");
        Row(html, $"Leakage budget {a.LeakageBudgetText()}", $"{CurrentText.WithUnit(trip.LeakageBudgetA)}: {(trip.WithinLeakageBudget ? "✔ within" : "✘ exceeded")}");
        html.Raw("</tbody></table>\n<p>").Text(trip.Explanation).Raw("</p>\n");
        if (trip.Contributions.Count > 0)
        {
            html.Raw("<table>\n<thead><tr><th>Frequency range</th><th class=\"num\">From</th><th class=\"num\">To</th><th class=\"num\">RMS</th><th class=\"num\">Trip factor</th><th class=\"num\">Weighted RMS</th></tr></thead>\n<tbody>\n");
            foreach (var c in trip.Contributions)
            {
                html.Raw("<tr><td>").Text(c.Label).Raw("</td>");
                Num(html, Hertz(c.LowHz));
                Num(html, Hertz(c.HighHz));
                Num(html, CurrentText.WithUnit(c.RmsA));
                Num(html, double.IsPositiveInfinity(c.TripFactor) ? "does not respond" : Number(c.TripFactor, "0.##"));
                Num(html, CurrentText.WithUnit(c.WeightedRmsA));
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        var blinding = a.Blinding;
        html.Raw("<h3>Smooth-DC blinding</h3>\n<table><tbody>\n");
        Row(html, "Smooth DC (worst window)", CurrentText.WithUnit(blinding.SmoothDcA));
        Row(html, $"Type {blinding.DeviceType.ToTradeName()} tolerance", blinding.ToleranceA is double t ? CurrentText.WithUnit(t) : "none specified");
        Row(html, "Blinded", blinding.Blinded switch { true => "✘ yes: may not trip on a fault", false => "✔ no", null => "? cannot be determined with this sensor" });
        html.Raw("</tbody></table>\n<p>").Text(blinding.Explanation).Raw("</p>\n");

        var ev = a.EvCharging;
        html.Raw("<h3>EV charging points</h3>\n<table><tbody>\n");
        Row(html, "Smooth DC (worst window)", CurrentText.WithUnit(ev.SmoothDcA));
        Row(html, "RDC-DD threshold (IEC 62955)", CurrentText.WithUnit(ev.RdcDdThresholdA));
        Row(html, "DC above the threshold", ev.DcAboveRdcDdThreshold switch { true => "✘ yes", false => "✔ no", null => "? cannot be determined" });
        Row(html, "Recommendation", ev.Recommendation);
        html.Raw("</tbody></table>\n");

        if (a.Gfci is { } gfci)
        {
            html.Raw("<h3>GFCI (UL 943)</h3>\n<table><tbody>\n");
            Row(html, $"Standing residual current ({FigureLabels.WorstWindowRms})", CurrentText.WithUnit(gfci.StandingRmsA));
            Row(html, "Class A (6 mA) trips on the standing current alone", TripsText(gfci.ClassATripsAlone));
            Row(html, "Class A trip time at that level", gfci.ClassATripTimeS is double ta ? Seconds(ta) : "not applicable (below 6 mA)");
            Row(html, "Special-purpose (20 mA) trips on it alone", TripsText(gfci.SpecialPurposeTripsAlone));
            Row(html, "Special-purpose trip time", gfci.SpecialPurposeTripTimeS is double ts ? Seconds(ts) : "not applicable (below 20 mA)");
            html.Raw("</tbody></table>\n");
            List(html, gfci.Notes, null);
        }

        if (!productTest)
        {
            if (a.TouchCurrent is not null || analysis.TouchCurrent is not null)
            {
                html.Raw("<p class=\"muted\">").Text("Touch-current readings (IEC 60990) are in the analysis JSON; their limits belong to product (equipment) tests and are compared only when one is asked for (--product-test, or \"productTest\": true in the site file).").Raw("</p>\n");
            }
        }
        else if (a.TouchCurrent is { } touch)
        {
            html.Raw("<h3>Touch current (IEC 60990)</h3>\n");
            TouchReadings(html, touch.Readings);
            if (touch.Comparisons.Count > 0)
            {
                html.Raw("<table class=\"wide\">\n<thead><tr><th>Limit</th><th>Reading</th><th class=\"num\">Reading value</th><th class=\"num\">Limit value</th><th>Within</th><th>Source</th></tr></thead>\n<tbody>\n");
                foreach (var c in touch.Comparisons)
                {
                    html.Raw("<tr><td>").Text(c.Limit).Raw("</td><td>").Text(c.Reading).Raw("</td>");
                    Num(html, CurrentText.WithUnit(c.ValueA));
                    Num(html, CurrentText.WithUnit(c.LimitA));
                    html.Raw("<td class=\"verdict-cell\">").Text(c.Within ? "✔ within" : "✘ above").Raw("</td><td>").Text(FigureLabels.ForClient(c.Source)).Raw("</td></tr>\n");
                }

                html.Raw("</tbody>\n</table>\n");
            }
        }
        else if (analysis.TouchCurrent is { } readings)
        {
            html.Raw("<h3>Touch current (IEC 60990)</h3>\n");
            TouchReadings(html, readings);
        }

        html.Raw("</section>\n");
    }

    internal static void TouchReadings(HtmlWriter html, TouchCurrentResult r)
    {
        html.Raw("<table>\n<thead><tr><th>Network</th><th class=\"num\">Peak</th><th class=\"num\">RMS</th></tr></thead>\n<tbody>\n");
        TouchRow(html, "unweighted", r.UnweightedPeakA, r.UnweightedRmsA);
        TouchRow(html, "perception/reaction", r.PerceptionPeakA, r.PerceptionRmsA);
        TouchRow(html, "let-go", r.LetGoPeakA, r.LetGoRmsA);
        html.Raw("<tr><td>DC (mean, unweighted)</td>");
        Num(html, CurrentText.WithUnit(r.DcA));
        Num(html, string.Empty);
        html.Raw("</tr>\n</tbody>\n</table>\n");
    }

    internal static void TouchRow(HtmlWriter html, string network, double peakA, double rmsA)
    {
        html.Raw("<tr><td>").Text(network).Raw("</td>");
        Num(html, CurrentText.WithUnit(peakA));
        Num(html, CurrentText.WithUnit(rmsA));
        html.Raw("</tr>\n");
    }
}
