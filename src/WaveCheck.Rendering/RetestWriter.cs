using System.Net;
using System.Text;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering;

/// <summary>
/// The retest page: one self-contained HTML file (inline CSS, no scripts) with a row per circuit: its outcome as a
/// symbol and a word (never colour alone), the figures before and after, and what changed. Every string is
/// HTML-escaped.
/// </summary>
public static class RetestWriter
{
    private const string Style = """
        body{font-family:system-ui,sans-serif;margin:2em;color:#1a1a1a;max-width:90em}
        h1{font-size:1.5em}
        table{border-collapse:collapse;width:100%;font-size:.9em}
        th,td{border:1px solid #bbb;padding:.3em .5em;text-align:left;vertical-align:top}
        th{background:#eee}td.n{text-align:right;font-variant-numeric:tabular-nums}
        .o-remedied,.o-better{background:#e3f4e1}.o-worse{background:#fbe0dc}.o-not-retested,.o-new{background:#fff4cc}
        ul{margin:0;padding-left:1.2em}
        """;

    /// <summary>Writes the page whole or not at all.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="comparison">The comparison.</param>
    public static void Write(string path, RetestComparison comparison) => AtomicFile.WriteText(path, Render(comparison));

    /// <summary>The page as HTML text.</summary>
    /// <param name="comparison">The comparison.</param>
    public static string Render(RetestComparison comparison)
    {
        ArgumentNullException.ThrowIfNull(comparison);
        var title = comparison.Site is { } site ? $"Retest: {site}" : "Retest";
        var html = new StringBuilder(8_192);
        html.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n<title>")
            .Append(E(title)).Append("</title>\n<style>").Append(Style).Append("</style>\n</head>\n<body>\n<h1>").Append(E(title)).Append("</h1>\n<p>")
            .Append(E($"Before: {comparison.BeforePath}. After: {comparison.AfterPath}.")).Append("</p>\n<p>")
            .Append(E(Tally(comparison.Circuits))).Append("</p>\n<table>\n<tr><th>Circuit</th><th>Outcome</th><th>Required type</th><th>Verdict</th>")
            .Append("<th>Worst-window RMS</th><th>Smooth DC</th><th>Nuisance margin</th><th>What changed</th></tr>\n");
        foreach (var change in comparison.Circuits)
        {
            html.Append("<tr class=\"o-").Append(E(VerdictText.Of(change.Outcome))).Append("\"><td>").Append(E(change.Circuit))
                .Append(change.Match == RetestMatch.File ? " <small>(matched by file name)</small>" : string.Empty)
                .Append("</td><td><strong>").Append(E(OutcomeLabel(change.Outcome))).Append("</strong></td><td>")
                .Append(E(Pair(change, c => c.RequiredType?.ToTradeName() ?? (c.MinimumType is { } m ? $"at least {m.ToTradeName()}" : "—"))))
                .Append("</td><td>").Append(E(Pair(change, c => VerdictText.Of(c.Verdict))))
                .Append("</td><td class=\"n\">").Append(E(Pair(change, c => Amps(c.WorstWindowRmsA))))
                .Append("</td><td class=\"n\">").Append(E(Pair(change, c => Amps(c.SmoothDcA))))
                .Append("</td><td class=\"n\">").Append(E(Pair(change, c => Amps(c.NuisanceMarginA))))
                .Append("</td><td><ul>");
            foreach (var line in change.Changes)
            {
                html.Append("<li>").Append(E(line)).Append("</li>");
            }

            html.Append("</ul></td></tr>\n");
        }

        html.Append("</table>\n</body>\n</html>\n");
        return html.ToString();
    }

    /// <summary>The symbol and word shown for an outcome.</summary>
    /// <param name="outcome">The outcome.</param>
    public static string OutcomeLabel(RetestOutcome outcome) => outcome switch
    {
        RetestOutcome.Remedied => "✔ remedied",
        RetestOutcome.Better => "▲ better",
        RetestOutcome.Unchanged => "= unchanged",
        RetestOutcome.Worse => "✖ worse",
        RetestOutcome.NotRetested => "? not retested",
        _ => "+ new",
    };

    /// <summary>"before → after" for one figure; a dash for a missing side.</summary>
    public static string Pair(CircuitChange change, Func<CircuitFigures, string> figure)
    {
        ArgumentNullException.ThrowIfNull(change);
        ArgumentNullException.ThrowIfNull(figure);
        return $"{(change.Before is { } b ? figure(b) : "—")} → {(change.After is { } a ? figure(a) : "—")}";
    }

    /// <summary>How many circuits had each outcome, in words.</summary>
    public static string Tally(IReadOnlyList<CircuitChange> circuits)
    {
        ArgumentNullException.ThrowIfNull(circuits);
        var parts = Enum.GetValues<RetestOutcome>()
            .Select(o => (Outcome: o, Count: circuits.Count(c => c.Outcome == o)))
            .Where(t => t.Count > 0)
            .Select(t => $"{t.Count} {VerdictText.Of(t.Outcome)}");
        return $"{circuits.Count} circuits: {string.Join(", ", parts)}.";
    }

    private static string Amps(double? amperes) => amperes is { } a ? CurrentText.WithUnit(a) : "—";

    private static string E(string text) => WebUtility.HtmlEncode(text);
}
