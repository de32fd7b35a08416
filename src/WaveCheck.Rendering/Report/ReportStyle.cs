using System.Globalization;
using System.Text;

namespace WaveCheck.Rendering.Report;

/// <summary>
/// The report's inline style sheet: screen (down to a 390 px phone without sideways scrolling) and print (CSS paged
/// media: A4 or US Letter, margins, a running header with site, circuit and report number, "page X of Y", no table
/// row split across pages, headings kept with what follows, plots never cut).
/// </summary>
internal static class ReportStyle
{
    /// <summary>Longest running header, characters; a longer one is shortened with an ellipsis (one line at 8 pt).</summary>
    public const int MaxRunningHeaderChars = 110;

    /// <summary>The style sheet for <paramref name="paper"/> with <paramref name="runningHeader"/> at the top of every printed page.</summary>
    public static string Css(PaperSize paper, string runningHeader) =>
        Screen + Print
            .Replace("{{SIZE}}", paper == PaperSize.Letter ? "letter" : "A4", StringComparison.Ordinal)
            .Replace("{{HEADER}}", CssString(Shorten(runningHeader)), StringComparison.Ordinal);

    /// <summary>A CSS string literal of <paramref name="text"/>: every character that could end the string, the rule
    /// or the style element is written as a hex escape.</summary>
    internal static string CssString(string text)
    {
        var css = new StringBuilder(text.Length + 8).Append('"');
        foreach (var c in text)
        {
            if (char.IsLetterOrDigit(c) || c is ' ' or ',' or '.' or '-' or '_' or ':' or '/' or '(' or ')' or '·' or '–')
            {
                css.Append(c);
            }
            else
            {
                css.Append('\\').Append(((int)c).ToString("x", CultureInfo.InvariantCulture)).Append(' ');
            }
        }

        return css.Append('"').ToString();
    }

    private static string Shorten(string text) =>
        text.Length <= MaxRunningHeaderChars ? text : text[..(MaxRunningHeaderChars - 1)] + "…";

    private static readonly string Screen = $$"""
        :root { --ink: {{ReportPalette.Ink}}; --muted: {{ReportPalette.Muted}}; --rule: #b3b3b3; --panel: {{ReportPalette.Panel}}; --warn: {{ReportPalette.NotAdequateInk}}; }
        * { box-sizing: border-box; }
        body { font-family: "DejaVu Sans", "Segoe UI", Helvetica, Arial, sans-serif; color: var(--ink); margin: 0 auto;
               max-width: 1060px; padding: 16px 24px 40px; font-size: 14px; line-height: 1.45; background: {{ReportPalette.Page}}; }
        h1 { font-size: 24px; margin: 0 0 4px; }
        h2 { font-size: 18px; margin: 28px 0 8px; border-bottom: 2px solid var(--ink); padding-bottom: 2px; }
        h3 { font-size: 15px; margin: 18px 0 6px; }
        p { margin: 6px 0; }
        .muted { color: var(--muted); }
        .doc-no { font-size: 15px; margin: 0 0 8px; }
        table.identity { width: 100%; min-width: 0; table-layout: fixed; }
        table.identity th { width: 11em; min-width: 0; }
        table.identity td { overflow-wrap: anywhere; }
        .blank { display: inline-block; min-width: 14em; max-width: 100%; border-bottom: 1px solid var(--ink); height: 1.1em; }
        .from { color: var(--muted); font-size: 12px; }
        dl.facts { display: grid; grid-template-columns: max-content 1fr max-content 1fr; gap: 2px 14px; margin: 10px 0; }
        dl.facts dt { font-weight: bold; }
        dl.facts dd { margin: 0; overflow-wrap: anywhere; }
        .verdict { border: 3px solid var(--ink); padding: 12px 16px; margin: 14px 0; background: var(--panel); }
        .verdict .outcome { display: inline-block; font-size: 20px; font-weight: bold; padding: 4px 12px; margin: 0 0 10px; border-width: 3px; }
        .outcome.adequate { color: {{ReportPalette.AdequateInk}}; background: {{ReportPalette.AdequatePaper}}; border-style: solid; border-color: {{ReportPalette.AdequateInk}}; }
        .outcome.not-adequate { color: {{ReportPalette.NotAdequateInk}}; background: {{ReportPalette.NotAdequatePaper}}; border-style: double; border-width: 5px; border-color: {{ReportPalette.NotAdequateInk}}; }
        .outcome.cannot-tell { color: {{ReportPalette.CannotTellInk}}; background: {{ReportPalette.CannotTellPaper}}; border-style: dashed; border-color: {{ReportPalette.CannotTellInk}}; }
        .verdict .required { font-size: 22px; font-weight: bold; margin: 0 0 6px; }
        .verdict .headline { font-size: 16px; margin: 0; }
        .alert { border: 3px double var(--warn); padding: 10px 14px; margin: 12px 0; font-weight: bold; }
        .alert::before { content: "⚠ "; }
        table { border-collapse: collapse; width: auto; min-width: 55%; margin: 8px 0 12px; font-size: 13px; }
        table.wide { width: 100%; }
        tbody th { font-weight: normal; background: var(--panel); min-width: 22em; }
        th, td { border: 1px solid var(--rule); padding: 3px 6px; text-align: left; vertical-align: top; }
        th { background: var(--panel); }
        td.num, th.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        td.verdict-cell { white-space: nowrap; font-weight: bold; }
        ul.reasons { margin: 0; padding-left: 18px; }
        figure { margin: 12px 0 18px; break-inside: avoid; page-break-inside: avoid; }
        figure svg { width: 100%; height: auto; display: block; border: 1px solid var(--rule); }
        figcaption { font-size: 12px; color: var(--muted); margin-top: 4px; }
        code { font-family: "DejaVu Sans Mono", monospace; font-size: 12px; }
        table.signoff { width: 100%; table-layout: fixed; }
        table.signoff td { height: 3.2em; }
        footer { margin-top: 30px; font-size: 12px; color: var(--muted); border-top: 1px solid var(--rule); padding-top: 6px; }
        @media (max-width: 640px) {
          body { padding: 10px 10px 30px; font-size: 13px; }
          h1 { font-size: 20px; }
          dl.facts { grid-template-columns: max-content 1fr; }
          table { min-width: 0; width: 100%; font-size: 12px; }
          tbody th { min-width: 0; width: 40%; }
          table.identity th { width: 40%; }
          th, td { padding: 2px 4px; }
          table.identity td, tbody th { overflow-wrap: anywhere; }
          /* A data table of several columns scrolls inside itself: words are not broken letter by letter, and the
             page never scrolls sideways. */
          table:has(> thead):not(.signoff) { display: block; overflow-x: auto; max-width: 100%; }
          table:has(> thead):not(.signoff) td:last-child { min-width: 15em; }
          .blank { min-width: 6em; }
          .verdict { padding: 8px 10px; }
          .verdict .required { font-size: 18px; }
          .verdict .outcome { font-size: 17px; }
        }

        """;

    private const string Print = """
        @page {
          size: {{SIZE}};
          margin: 20mm 14mm 16mm 14mm;
          @top-left { content: {{HEADER}}; font-family: "DejaVu Sans", sans-serif; font-size: 8pt; color: #4d4d4d; vertical-align: bottom; padding-bottom: 3mm; }
          @bottom-right { content: "page " counter(page) " of " counter(pages); font-family: "DejaVu Sans", sans-serif; font-size: 8pt; color: #4d4d4d; }
          @bottom-left { content: "WaveCheck residual-current report"; font-family: "DejaVu Sans", sans-serif; font-size: 8pt; color: #4d4d4d; }
        }
        @media print {
          body { max-width: none; padding: 0; font-size: 9.5pt; line-height: 1.35; }
          h1 { font-size: 17pt; }
          h2 { font-size: 13pt; margin-top: 16pt; }
          h3 { font-size: 11pt; }
          h2, h3, .keep-with-next { break-after: avoid; page-break-after: avoid; }
          p:has(+ table), p:has(+ figure) { break-after: avoid; }
          table { font-size: 8.5pt; }
          tbody th { min-width: 16em; }
          thead { display: table-header-group; }
          tr, .verdict, .alert, table.identity, table.signoff, .signoff-block { break-inside: avoid; page-break-inside: avoid; }
          figure { break-inside: avoid; page-break-inside: avoid; }
          dl.facts { grid-template-columns: max-content 1fr max-content 1fr; }
          a { color: inherit; text-decoration: none; }
        }
        """;
}
