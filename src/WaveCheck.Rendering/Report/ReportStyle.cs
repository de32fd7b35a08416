namespace WaveCheck.Rendering.Report;

/// <summary>The report's inline style sheet: screen and print (A4 or Letter: the page size is left to the printer).</summary>
internal static class ReportStyle
{
    public const string Css = """
        :root { --ink: #1a1a1a; --muted: #555; --rule: #bbb; --panel: #f4f4f4; --accent: #0072b2; --warn: #d55e00; }
        * { box-sizing: border-box; }
        body { font-family: "DejaVu Sans", "Segoe UI", Helvetica, Arial, sans-serif; color: var(--ink); margin: 0 auto;
               max-width: 1060px; padding: 16px 24px 40px; font-size: 14px; line-height: 1.45; background: #fff; }
        h1 { font-size: 24px; margin: 0 0 4px; }
        h2 { font-size: 18px; margin: 28px 0 8px; border-bottom: 2px solid var(--ink); padding-bottom: 2px; }
        h3 { font-size: 15px; margin: 18px 0 6px; }
        p { margin: 6px 0; }
        .muted { color: var(--muted); }
        dl.facts { display: grid; grid-template-columns: max-content 1fr max-content 1fr; gap: 2px 14px; margin: 10px 0; }
        dl.facts dt { font-weight: bold; }
        dl.facts dd { margin: 0; overflow-wrap: anywhere; }
        .verdict { border: 3px solid var(--ink); padding: 12px 16px; margin: 14px 0; background: var(--panel); }
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
        .yes::before, .no::before, .unknown::before { display: inline-block; width: 1.2em; }
        ul.reasons { margin: 0; padding-left: 18px; }
        figure { margin: 12px 0 18px; break-inside: avoid; page-break-inside: avoid; }
        figure svg { width: 100%; height: auto; display: block; border: 1px solid var(--rule); }
        figcaption { font-size: 12px; color: var(--muted); margin-top: 4px; }
        code { font-family: "DejaVu Sans Mono", monospace; font-size: 12px; }
        footer { margin-top: 30px; font-size: 12px; color: var(--muted); border-top: 1px solid var(--rule); padding-top: 6px; }
        @page { margin: 14mm 12mm; }
        @media print {
          body { max-width: none; padding: 0; font-size: 10.5pt; }
          h2 { break-after: avoid; page-break-after: avoid; }
          table, .verdict, .alert { break-inside: avoid; page-break-inside: avoid; }
          tr { break-inside: avoid; page-break-inside: avoid; }
          dl.facts { grid-template-columns: max-content 1fr; }
        }
        """;
}
