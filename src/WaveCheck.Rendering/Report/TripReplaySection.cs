using System.Globalization;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Report;

/// <summary>
/// The report's trip-replay section: the "would have tripped" alerts first, then the finding of each device over the
/// capture, the plot of the surges against the time limits, a table of the episodes, what to do, and the rules.
/// </summary>
internal static class TripReplaySection
{
    /// <summary>Most episodes in the table (engineering choice: the plot shows them all; the table the first ones).</summary>
    public const int MaxRows = 50;

    /// <summary>Writes the section; nothing when the assessment carries no replay.</summary>
    public static void Write(HtmlWriter html, AssessmentResult? assessment)
    {
        if (assessment?.TripReplay is not { } r)
        {
            return;
        }

        html.Raw("<section id=\"trip-replay\">\n<h2>").Text($"Trip replay: surges against the device time limits (IΔn {CurrentText.WithUnit(r.RatedResidualCurrentA)})").Raw("</h2>\n");
        foreach (var alert in r.Alerts)
        {
            html.Raw("<div class=\"alert\">").Text("Test the device: " + alert).Raw("</div>\n");
        }

        html.Raw("<p>").Text(r.Summary + ".").Raw("</p>\n");
        html.Raw("<table>\n<thead><tr><th>Device</th><th>Over the capture</th><th>Deciding figures</th></tr></thead>\n<tbody>\n");
        foreach (var f in r.Overall)
        {
            html.Raw("<tr><td>").Text(TripReplayText.Device(f.Device) + (f.Device.Installed ? " (installed rating)" : " (alternative)"))
                .Raw("</td><td class=\"verdict-cell\">").Text(Symbol(f.Finding) + " " + TripReplayText.Finding(f.Finding))
                .Raw("</td><td>").Text(f.Reason).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n");
        if (r.EpisodesFound > 0)
        {
            html.Raw("<figure id=\"plot-trip-replay\">\n");
            html.Raw(InlineSvg.Prepare(TripReplayPlot.RenderSvg(r), "ptr-", "Surges against the device time limits"));
            html.Raw("\n<figcaption>").Text("Each surge drawn as its profile: how long its half-cycle RMS stayed at or above each multiple of IΔn. A profile right of a break-time line reached a must-trip limit of that device; one left of the type S non-actuating line rides through a compliant time-delayed device. Below the non-operating line no compliant device trips.").Raw("</figcaption>\n</figure>\n");
            Episodes(html, r);
        }

        html.Raw("<h3>What to do</h3>\n<ul>\n");
        foreach (var line in r.Recommendations)
        {
            html.Raw("<li>").Text(line).Raw("</li>\n");
        }

        html.Raw("</ul>\n<h3>Rules of the replay</h3>\n<ul class=\"muted\">\n");
        foreach (var line in r.Notes)
        {
            html.Raw("<li>").Text(line).Raw("</li>\n");
        }

        html.Raw("</ul>\n</section>\n");
    }

    private static void Episodes(HtmlWriter html, TripReplayResult r)
    {
        var devices = r.Devices;
        html.Raw("<table class=\"wide\">\n<thead><tr><th class=\"num\">Start, s</th><th class=\"num\">≥ 0.5 IΔn</th><th class=\"num\">≥ IΔn</th>")
            .Raw("<th class=\"num\">Highest half-cycle RMS</th><th class=\"num\">Peak</th>");
        foreach (var d in devices)
        {
            html.Raw("<th>").Text(TripReplayText.Device(d)).Raw("</th>");
        }

        html.Raw("</tr></thead>\n<tbody>\n");
        foreach (var e in r.Episodes.Take(MaxRows))
        {
            html.Raw("<tr>");
            Num(html, e.StartS.ToString("0.###", CultureInfo.InvariantCulture));
            Num(html, Ms(e.AboveHalfRatedS));
            Num(html, Ms(e.AboveRatedS));
            Num(html, Multiple(e.MaxHalfCycleRmsMultiple) + (e.DcDominated ? " DC" : string.Empty));
            Num(html, Multiple(e.PeakMultiple));
            foreach (var f in e.Findings)
            {
                html.Raw("<td title=\"").Text(f.Reason).Raw("\">").Text(Symbol(f.Finding) + " " + TripReplayText.Finding(f.Finding)
                    + (f.MustTripReached ? " — must-trip limit reached" : string.Empty)).Raw("</td>");
            }

            html.Raw("</tr>\n");
        }

        html.Raw("</tbody>\n</table>\n");
        if (r.Episodes.Count > MaxRows || r.EpisodesFound > r.Episodes.Count)
        {
            html.Raw("<p class=\"muted\">").Text($"{Math.Min(MaxRows, r.Episodes.Count)} of {r.EpisodesFound} episodes listed; the findings over the capture count them all.").Raw("</p>\n");
        }
    }

    private static void Num(HtmlWriter html, string value) => html.Raw("<td class=\"num\">").Text(value).Raw("</td>");

    private static string Ms(double seconds) => string.Create(CultureInfo.InvariantCulture, $"{seconds * 1000:0} ms");

    private static string Multiple(double multiple) => string.Create(CultureInfo.InvariantCulture, $"{multiple:0.##} IΔn");

    private static string Symbol(TripFinding finding) => finding switch
    {
        TripFinding.WillNotTrip => "✔",
        TripFinding.MayTrip => "?",
        _ => "✘",
    };
}
