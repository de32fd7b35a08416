using System.Text;
using Spectre.Console;

namespace WaveCheck.Cli;

/// <summary>
/// A table laid out for a width without cutting a word: each column is at least as wide as its longest word, the
/// remaining room goes first to the columns that need least of it to stay on one line. Where
/// even the longest words do not fit side by side, each row is printed as its first cell followed by the others as
/// labelled, indented lines. Rounded Unicode borders on a terminal, ASCII when piped: one style per output.
/// </summary>
internal sealed class TextTable
{
    private readonly List<Column> _columns;
    private readonly List<Cell[]> _rows = [];

    public TextTable(string? title, params Column[] columns)
    {
        ArgumentNullException.ThrowIfNull(columns);
        if (columns.Length == 0)
        {
            throw new ArgumentException("a table needs at least one column", nameof(columns));
        }

        // Cleaned before measuring: an escaped control character is wider than the character.
        Title = title is null ? null : TerminalText.CleanLines(title);
        _columns = [.. columns];
    }

    public string? Title { get; }

    /// <summary>A column: its heading and whether its cells align right (figures).</summary>
    public sealed record Column(string Heading, bool Right = false);

    /// <summary>A cell's text (line breaks kept) and its style.</summary>
    public readonly record struct Cell(string Text, Style? Style = null)
    {
        public static implicit operator Cell(string text) => new(text);
    }

    public int RowCount => _rows.Count;

    public void AddRow(params Cell[] cells)
    {
        ArgumentNullException.ThrowIfNull(cells);
        if (cells.Length != _columns.Count)
        {
            throw new ArgumentException($"a row needs {_columns.Count} cells (got {cells.Length})", nameof(cells));
        }

        _rows.Add([.. cells.Select(c => c with { Text = TerminalText.CleanLines(c.Text) })]);
    }

    /// <summary>The lines of the table, each a list of styled spans no longer than <paramref name="width"/> in all.</summary>
    public List<List<(string Text, Style? Style)>> Render(int width, bool unicode)
    {
        var lines = new List<List<(string, Style?)>>();
        if (Title is not null)
        {
            lines.AddRange(WordWrap.Lines(Title, width).Select(l => new List<(string, Style?)> { (l, new Style(decoration: Decoration.Bold)) }));
        }

        var widths = Widths(width);
        if (widths is null)
        {
            Stacked(lines, width);
            return lines;
        }

        var b = unicode ? Unicode : Ascii;
        lines.Add([(Rule(b.TopLeft, b.TopJoin, b.TopRight, b.Horizontal, widths), null)]);
        AddCells(lines, [.. _columns.Select(c => new Cell(c.Heading, new Style(decoration: Decoration.Bold)))], widths, b, header: true);
        lines.Add([(Rule(b.MidLeft, b.MidJoin, b.MidRight, b.Horizontal, widths), null)]);
        foreach (var row in _rows)
        {
            AddCells(lines, row, widths, b, header: false);
        }

        lines.Add([(Rule(b.BottomLeft, b.BottomJoin, b.BottomRight, b.Horizontal, widths), null)]);
        return lines;
    }

    /// <summary>Each column's inner width, or null when the longest words do not fit side by side.</summary>
    private int[]? Widths(int width)
    {
        var n = _columns.Count;
        var available = width - (3 * n) - 1; // "│ " + " │ " between + " │"
        var min = new int[n];
        var max = new int[n];
        for (var i = 0; i < n; i++)
        {
            min[i] = Math.Max(1, WordWrap.LongestWord(_columns[i].Heading));
            max[i] = Math.Max(1, WordWrap.LongestLine(_columns[i].Heading));
            foreach (var row in _rows)
            {
                min[i] = Math.Max(min[i], WordWrap.LongestWord(row[i].Text));
                max[i] = Math.Max(max[i], WordWrap.LongestLine(row[i].Text));
            }
        }

        if (max.Sum() <= available)
        {
            return max;
        }

        if (min.Sum() > available)
        {
            return null;
        }

        // The columns that need least to stay on one line get it first; the widest text wraps in what is left.
        var widths = (int[])min.Clone();
        var spare = available - min.Sum();
        foreach (var i in Enumerable.Range(0, n).OrderBy(i => max[i] - min[i]))
        {
            var add = Math.Min(max[i] - min[i], spare);
            widths[i] += add;
            spare -= add;
        }

        return widths;
    }

    private void AddCells(List<List<(string, Style?)>> lines, Cell[] cells, int[] widths, Border b, bool header)
    {
        var wrapped = cells.Select((c, i) => WordWrap.Lines(c.Text, widths[i])).ToArray();
        var height = wrapped.Max(w => w.Count);
        for (var r = 0; r < height; r++)
        {
            var line = new List<(string, Style?)> { (b.Vertical + " ", null) };
            for (var i = 0; i < cells.Length; i++)
            {
                var text = r < wrapped[i].Count ? wrapped[i][r] : "";
                var pad = new string(' ', widths[i] - text.Length);
                var right = !header && _columns[i].Right;
                line.Add(right ? (pad, null) : (text, cells[i].Style));
                line.Add(right ? (text, cells[i].Style) : (pad, null));
                line.Add((i == cells.Length - 1 ? " " + b.Vertical : " " + b.Vertical + " ", null));
            }

            lines.Add(line);
        }
    }

    /// <summary>Each row as its first cell, then the other cells as "heading: value" on wrapped, indented lines.</summary>
    private void Stacked(List<List<(string, Style?)>> lines, int width)
    {
        foreach (var row in _rows)
        {
            foreach (var line in WordWrap.Lines(row[0].Text, width))
            {
                lines.Add([(line, new Style(decoration: Decoration.Bold))]);
            }

            var rest = string.Join("; ", Enumerable.Range(1, _columns.Count - 1)
                .Where(i => row[i].Text.Length > 0)
                .Select(i => $"{_columns[i].Heading}: {row[i].Text.Replace('\n', ' ')}"));
            if (rest.Length > 0)
            {
                lines.AddRange(WordWrap.Lines(rest, width, "    ").Select(l => new List<(string, Style?)> { (l, null) }));
            }
        }
    }

    private static string Rule(char left, char join, char right, char horizontal, int[] widths)
    {
        var rule = new StringBuilder().Append(left);
        for (var i = 0; i < widths.Length; i++)
        {
            rule.Append(horizontal, widths[i] + 2).Append(i == widths.Length - 1 ? right : join);
        }

        return rule.ToString();
    }

    private sealed record Border(char TopLeft, char TopJoin, char TopRight, char MidLeft, char MidJoin, char MidRight,
        char BottomLeft, char BottomJoin, char BottomRight, char Horizontal, char Vertical);

    private static readonly Border Unicode = new('╭', '┬', '╮', '├', '┼', '┤', '╰', '┴', '╯', '─', '│');

    private static readonly Border Ascii = new('+', '+', '+', '+', '+', '+', '+', '+', '+', '-', '|');
}
