using System.Text;
using System.Text.RegularExpressions;

namespace WaveCheck.Cli;

/// <summary>
/// Wraps text on words to a width: lines break only at spaces, a figure stays with its unit (<c>30.0 mA</c>) and a
/// lone symbol with the word it marks (<c>✔ adequate</c>, <c>→ B</c>), and a prefix on the first line is matched by an
/// indent on the others. A single word longer than a whole line (a long
/// path) is the one thing that must be cut; it is cut after a <c>/</c> or <c>\</c> where it has one, else after a
/// <c>-</c>, <c>_</c>, <c>,</c> or <c>.</c>, else at the width.
/// </summary>
internal static partial class WordWrap
{
    /// <summary>Stands in for the space between a figure and its unit while wrapping, so the two are never parted.</summary>
    private const char Glue = '\u00A0';

    /// <summary>The lines of <paramref name="text"/> (its own line breaks kept) within <paramref name="width"/>
    /// columns, the first after <paramref name="firstPrefix"/>, the rest after <paramref name="restPrefix"/> (the
    /// same width of spaces when null).</summary>
    public static List<string> Lines(string text, int width, string firstPrefix = "", string? restPrefix = null)
    {
        ArgumentNullException.ThrowIfNull(text);
        ArgumentNullException.ThrowIfNull(firstPrefix);
        restPrefix ??= new string(' ', firstPrefix.Length);
        var lines = new List<string>();
        var prefix = firstPrefix;
        foreach (var paragraph in text.Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n'))
        {
            foreach (var line in Wrap(paragraph, Math.Max(1, width - prefix.Length), Math.Max(1, width - restPrefix.Length)))
            {
                lines.Add((prefix + line).TrimEnd());
                prefix = restPrefix;
            }
        }

        return lines;
    }

    /// <summary>The longest word of <paramref name="text"/> as <see cref="Lines"/> keeps it together: the narrowest
    /// width at which no word is cut.</summary>
    public static int LongestWord(string text) =>
        Words(text).Select(w => w.Length).DefaultIfEmpty(0).Max();

    /// <summary>The longest line of <paramref name="text"/>: the width at which nothing wraps.</summary>
    public static int LongestLine(string text) =>
        text.Split('\n').Select(l => l.TrimEnd().Length).DefaultIfEmpty(0).Max();

    private static IEnumerable<string> Words(string text) =>
        GlueFigures(text).Split([' ', '\n'], StringSplitOptions.RemoveEmptyEntries);

    private static List<string> Wrap(string paragraph, int firstWidth, int restWidth)
    {
        var lines = new List<string>();
        var line = new StringBuilder();
        var limit = firstWidth;
        foreach (var word in GlueFigures(paragraph).Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            var rest = word;
            while (rest.Length > 0)
            {
                var needed = line.Length == 0 ? rest.Length : line.Length + 1 + rest.Length;
                if (needed <= limit)
                {
                    if (line.Length > 0)
                    {
                        line.Append(' ');
                    }

                    line.Append(rest);
                    rest = "";
                }
                else if (line.Length > 0)
                {
                    lines.Add(line.ToString());
                    line.Clear();
                    limit = restWidth;
                }
                else
                {
                    // Longer than a whole line: cut at a natural point, else at the width.
                    var cut = rest.Length <= limit ? rest.Length : CutPoint(rest, limit);
                    lines.Add(rest[..cut]);
                    rest = rest[cut..];
                    limit = restWidth;
                }
            }
        }

        if (line.Length > 0 || lines.Count == 0)
        {
            lines.Add(line.ToString());
        }

        return [.. lines.Select(l => l.Replace(Glue, ' '))];
    }

    /// <summary>Where to cut a word longer than a line: after the last path separator within the line, else after
    /// the last other natural break, else at the width.</summary>
    private static int CutPoint(string word, int limit)
    {
        foreach (var breaks in (char[][])[['/', '\\'], ['-', '_', ',', '.', Glue]])
        {
            for (var i = limit; i > limit / 3; i--)
            {
                if (Array.IndexOf(breaks, word[i - 1]) >= 0)
                {
                    return i;
                }
            }
        }

        return limit;
    }

    /// <summary>Joins a figure to the unit after it (<c>30.0 mA</c>, <c>50 kS/s</c>, <c>17 %</c>), and a symbol standing
    /// alone to the word after it (<c>✔ remedied</c>, <c>= unchanged</c>): either alone at a line's end says nothing.</summary>
    private static string GlueFigures(string text) =>
        SymbolAndWord().Replace(
            FigureAndUnit().Replace(text, m => m.Groups[1].Value + Glue + m.Groups[2].Value),
            m => m.Groups[1].Value + Glue);

    [GeneratedRegex(@"(\d) (mA|A|µA|kA|Hz|kHz|MHz|s|ms|min|h|%|S/s|kS/s|MS/s|V|mV|°|IΔn|cycles?|windows?)(?![\p{L}\d])")]
    private static partial Regex FigureAndUnit();

    /// <summary>A symbol or dash that is a word of its own (<c>✔</c>, <c>▲</c>, <c>=</c>, <c>→</c>, <c>–</c>) and the
    /// space before the next word.</summary>
    [GeneratedRegex(@"(?<!\S)([\p{S}\p{Pd}]) (?=\S)")]
    private static partial Regex SymbolAndWord();
}
