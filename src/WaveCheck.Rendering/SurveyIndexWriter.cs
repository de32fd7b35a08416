using System.Globalization;
using System.Net;
using System.Text;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering;

/// <summary>
/// The survey's index page: one self-contained HTML file (inline CSS, no scripts) with a row per capture linking its
/// report, the upstream checks below, and the cautions. Verdicts are shown as a symbol and a word, never by colour
/// alone. Every string from the survey is HTML-escaped; report links are percent-encoded per path segment.
/// </summary>
public static class SurveyIndexWriter
{
    private const string Style = """
        body{font-family:system-ui,sans-serif;margin:2em;color:#1a1a1a;max-width:90em}
        h1{font-size:1.5em}h2{font-size:1.2em;margin-top:2em}
        table{border-collapse:collapse;width:100%;font-size:.9em}
        th,td{border:1px solid #bbb;padding:.3em .5em;text-align:left;vertical-align:top}
        th{background:#eee}td.n{text-align:right;font-variant-numeric:tabular-nums}
        .v-ok{background:#e3f4e1}.v-upgrade{background:#fbe0dc}.v-cannot-tell{background:#fff4cc}.v-error{background:#e6e6e6}
        tr.circuit td{border-top:2px solid #555}tr.capture td:first-child{padding-left:1.5em}
        .cautions{border:2px solid #a60;padding:.5em 1em;background:#fff8ee}
        """;

    /// <summary>Writes the index whole or not at all.</summary>
    /// <param name="path">Target file, normally in the survey's output folder (report links are relative to it).</param>
    /// <param name="survey">The survey.</param>
    public static void Write(string path, SurveyDocument survey) => AtomicFile.WriteText(path, Render(survey));

    /// <summary>The index as HTML text.</summary>
    /// <param name="survey">The survey.</param>
    public static string Render(SurveyDocument survey)
    {
        ArgumentNullException.ThrowIfNull(survey);
        var html = new StringBuilder(16_384);
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>")
            .Append(E($"Residual-current survey: {survey.Site}")).Append("</title>\n<style>").Append(Style).Append("</style>\n</head>\n<body>\n");
        html.Append("<h1>").Append(E($"Residual-current survey: {survey.Site}")).Append("</h1>\n<p>")
            .Append(E($"{survey.Rows.Count} captures{(survey.Circuits.Count > 0 ? $" of {survey.Circuits.Count} circuits" : string.Empty)}, written {survey.GeneratedAt.ToString("yyyy-MM-dd HH:mm zzz", CultureInfo.InvariantCulture)}.")).Append(' ')
            .Append(E(Tally(survey.Rows))).Append("</p>\n");
        Cautions(html, survey.Cautions);
        Circuits(html, survey.Circuits);
        Schedule(html, survey.Actions, survey.Circuits.Count > 0);
        Captures(html, survey.Rows);
        Upstream(html, survey.Upstream);
        html.Append("</body>\n</html>\n");
        return html.ToString();
    }

    /// <summary>The symbol and word shown for a verdict.</summary>
    /// <param name="verdict">A <see cref="SurveyRow.Verdict"/> value.</param>
    public static string VerdictLabel(SurveyVerdict verdict) => verdict switch
    {
        SurveyVerdict.Ok => "✔ OK",
        SurveyVerdict.Upgrade => "✖ upgrade",
        SurveyVerdict.CannotTell => "? cannot tell",
        _ => "⚠ error",
    };

    /// <summary>One row per circuit with its verdict over all its captures, each capture listed under it.</summary>
    private static void Circuits(StringBuilder html, IReadOnlyList<CircuitVerdict> circuits)
    {
        if (circuits.Count == 0)
        {
            return;
        }

        html.Append("<h2>Circuits</h2>\n<p>One verdict per circuit: the strongest requirement over its captures, never weaker than any of them.</p>\n<table>\n")
            .Append("<tr><th>Circuit / capture</th><th>Installed</th><th>IΔn</th><th>Required type</th><th>Verdict</th>")
            .Append("<th>Worst-window RMS</th><th>Smooth DC</th><th>Nuisance tripping</th><th>Reason</th></tr>\n");
        foreach (var circuit in circuits)
        {
            var required = circuit.RequiredType?.ToTradeName() ?? (circuit.MinimumType is { } minimum ? $"at least {minimum.ToTradeName()}" : "—");
            html.Append("<tr class=\"circuit v-").Append(E(VerdictText.Of(circuit.Verdict))).Append("\"><td><strong>").Append(E(circuit.Circuit))
                .Append("</strong></td><td>").Append(E(circuit.InstalledType?.ToTradeName() ?? "not given"))
                .Append("</td><td class=\"n\">").Append(E(CurrentText.WithUnit(circuit.RatedResidualCurrentA)))
                .Append("</td><td>").Append(E(required))
                .Append("</td><td><strong>").Append(E(VerdictLabel(circuit.Verdict))).Append("</strong>")
                .Append("</td><td class=\"n\">").Append(E(Amps(circuit.WorstWindowRmsA)))
                .Append("</td><td class=\"n\">").Append(E(Amps(circuit.SmoothDcA) + (circuit.SmoothDcKnown == false ? " (sensor cannot show DC)" : string.Empty)))
                .Append("</td><td>").Append(E(circuit.NuisanceRisk is not { } risk ? "—" : $"{VerdictText.Of(risk)}, margin {Amps(circuit.NuisanceMarginA)}"))
                .Append("</td><td>").Append(E(circuit.Reason)).Append("</td></tr>\n");
            foreach (var capture in circuit.Captures)
            {
                var name = Path.GetFileName(capture.File);
                html.Append("<tr class=\"capture\"><td>↳ ");
                if (capture.State is { Length: > 0 } state)
                {
                    html.Append(E(state)).Append(": ");
                }

                if (capture.ReportPath is { Length: > 0 } report)
                {
                    html.Append("<a href=\"").Append(E(Href(report))).Append("\">").Append(E(name)).Append("</a>");
                }
                else
                {
                    html.Append(E(name));
                }

                var own = capture.RequiredType?.ToTradeName() ?? (capture.MinimumType is { } m ? $"at least {m.ToTradeName()}" : "—");
                html.Append("</td><td></td><td></td><td>").Append(E(own))
                    .Append("</td><td>").Append(E(VerdictLabel(capture.Verdict)))
                    .Append("</td><td class=\"n\">").Append(E(Amps(capture.WorstWindowRmsA)))
                    .Append("</td><td></td><td></td><td></td></tr>\n");
            }
        }

        html.Append("</table>\n");
    }

    /// <summary>The remedial schedule: what to do, most urgent first.</summary>
    private static void Schedule(StringBuilder html, IReadOnlyList<RemedialAction> actions, bool judged)
    {
        if (!judged)
        {
            return;
        }

        html.Append("<h2>Remedial schedule</h2>\n");
        if (actions.Count == 0)
        {
            html.Append("<p>No circuit needs action.</p>\n");
            return;
        }

        html.Append("<p>Most urgent first: a device too weak for its circuit, then what the survey could not show, then nuisance tripping, then the leakage budget (also in actions.csv).</p>\n<table>\n")
            .Append("<tr><th>#</th><th>Priority</th><th>Circuit</th><th>Installed</th><th>IΔn</th><th>Required</th><th>Reason</th></tr>\n");
        foreach (var action in actions)
        {
            html.Append("<tr><td class=\"n\">").Append(action.Rank.ToString(CultureInfo.InvariantCulture))
                .Append("</td><td><strong>").Append(E(PriorityLabel(action.Priority))).Append("</strong>")
                .Append("</td><td>").Append(E(action.Circuit + (action.Upstream ? " (upstream device)" : string.Empty)))
                .Append("</td><td>").Append(E(action.InstalledType?.ToTradeName() ?? "not given"))
                .Append("</td><td class=\"n\">").Append(E(CurrentText.WithUnit(action.RatedResidualCurrentA)))
                .Append("</td><td>").Append(E(action.Required))
                .Append("</td><td>").Append(E(action.Reason)).Append("</td></tr>\n");
        }

        html.Append("</table>\n");
    }

    /// <summary>The words shown for a schedule priority.</summary>
    /// <param name="priority">The priority.</param>
    public static string PriorityLabel(ActionPriority priority) => priority switch
    {
        ActionPriority.DeviceTooWeak => "1 safety: device too weak",
        ActionPriority.TestDevice => "2 safety: test the device",
        ActionPriority.NotShown => "3 safety not shown",
        ActionPriority.NuisanceTripping => "4 nuisance tripping",
        _ => "5 leakage budget",
    };

    private static void Captures(StringBuilder html, IReadOnlyList<SurveyRow> rows)
    {
        html.Append("<h2>Captures</h2>\n<table>\n<tr><th>Circuit</th><th>Capture</th><th>Installed</th><th>IΔn</th>")
            .Append("<th>Required type</th><th>Verdict</th><th>Worst-window RMS</th><th>Smooth DC</th><th>Above 1 kHz</th>")
            .Append("<th>Nuisance tripping</th><th>Finding</th></tr>\n");
        foreach (var row in rows)
        {
            html.Append("<tr class=\"v-").Append(E(VerdictText.Of(row.Verdict))).Append("\"><td>").Append(E(row.Circuit ?? "—")).Append("</td><td>");
            var name = Path.GetFileName(row.File);
            if (row.ReportPath is { Length: > 0 } report)
            {
                html.Append("<a href=\"").Append(E(Href(report))).Append("\">").Append(E(name)).Append("</a>");
            }
            else
            {
                html.Append(E(name));
            }

            var required = row.RequiredType?.ToTradeName() ?? (row.MinimumType is { } minimum ? $"at least {minimum.ToTradeName()}" : "—");
            html.Append("</td><td>").Append(E(row.InstalledType?.ToTradeName() ?? "not given"))
                .Append("</td><td class=\"n\">").Append(E(CurrentText.WithUnit(row.RatedResidualCurrentA)))
                .Append("</td><td>").Append(E(required))
                .Append("</td><td><strong>").Append(E(VerdictLabel(row.Verdict))).Append("</strong>")
                .Append("</td><td class=\"n\">").Append(E(Amps(row.WorstWindowRmsA)))
                .Append("</td><td class=\"n\">").Append(E(Amps(row.SmoothDcA) + (row.SmoothDcKnown == false ? " (sensor cannot show DC)" : string.Empty)))
                .Append("</td><td class=\"n\">").Append(E(Amps(row.Above1kHzRmsA)))
                .Append("</td><td>").Append(E(row.NuisanceRisk is not { } risk ? "—" : $"{VerdictText.Of(risk)}, margin {Amps(row.NuisanceMarginA)}"))
                .Append("</td><td>").Append(E(row.Error ?? row.Headline ?? string.Empty)).Append("</td></tr>\n");
        }

        html.Append("</table>\n");
    }

    private static void Upstream(StringBuilder html, IReadOnlyList<UpstreamResult> upstream)
    {
        if (upstream.Count == 0)
        {
            return;
        }

        html.Append("<h2>Upstream devices</h2>\n<table>\n<tr><th>Device</th><th>Check</th><th>Finding</th><th>Explanation</th></tr>\n");
        foreach (var group in upstream)
        {
            var device = $"{group.Name} (type {group.DeviceType.ToTradeName()}, {CurrentText.WithUnit(group.RatedResidualCurrentA)}, {group.Members.Count} circuits)"
                + (group.Complete ? string.Empty : " — incomplete");
            html.Append("<tr><td rowspan=\"3\">").Append(E(device)).Append("</td>");
            Check(html, "Standing leakage", VerdictText.Of(group.LeakageRisk), group.LeakageExplanation, group.LeakageRisk == RiskLevel.Low);
            html.Append("<tr>");
            Check(html, "Smooth DC (blinding)", VerdictText.Of(group.DcRisk), group.DcExplanation, group.DcBlinded == false);
            html.Append("<tr>");
            Check(html, "Device type", VerdictText.Of(group.TypeRisk), group.TypeExplanation, group.TypeMismatch == false);
        }

        html.Append("</table>\n");
    }

    private static void Check(StringBuilder html, string check, string risk, string explanation, bool good)
    {
        var symbol = good ? "✔" : risk is "cannot-tell" or "incomplete" ? "?" : "✖";
        html.Append("<td>").Append(E(check)).Append("</td><td><strong>").Append(E($"{symbol} {risk}"))
            .Append("</strong></td><td>").Append(E(explanation)).Append("</td></tr>\n");
    }

    private static void Cautions(StringBuilder html, IReadOnlyList<string> cautions)
    {
        html.Append("<div class=\"cautions\"><strong>Before acting on this survey</strong>\n<ul>\n");
        foreach (var caution in cautions)
        {
            html.Append("<li>").Append(E(caution)).Append("</li>\n");
        }

        html.Append("</ul></div>\n");
    }

    private static string Tally(IReadOnlyList<SurveyRow> rows)
    {
        int ok = 0, upgrade = 0, cannot = 0, error = 0;
        foreach (var row in rows)
        {
            switch (row.Verdict)
            {
                case SurveyVerdict.Ok: ok++; break;
                case SurveyVerdict.Upgrade: upgrade++; break;
                case SurveyVerdict.Error: error++; break;
                default: cannot++; break;
            }
        }

        return $"{ok} OK, {upgrade} to upgrade, {cannot} cannot tell, {error} could not be analysed.";
    }

    private static string Amps(double? amperes) => amperes is { } a ? CurrentText.WithUnit(a) : "—";

    /// <summary>A relative link: each path segment percent-encoded, so no file name can leave the attribute or form a scheme.</summary>
    private static string Href(string relative) =>
        string.Join('/', relative.Replace('\\', '/').Split('/').Select(Uri.EscapeDataString));

    private static string E(string text) => WebUtility.HtmlEncode(text);
}
