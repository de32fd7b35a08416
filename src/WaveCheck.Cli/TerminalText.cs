using System.Globalization;
using System.Text;
using Spectre.Console;
using Spectre.Console.Rendering;

namespace WaveCheck.Cli;

/// <summary>
/// Makes text that came from a file or a name safe to print on a terminal: every control character is shown as a
/// visible escape (<c>\x1B</c>) instead of being sent, so a CSV cell, a COMTRADE station name or a file name cannot
/// move the cursor, clear the screen, set the window title or disguise what is printed.
/// </summary>
/// <remarks>
/// Escaped: all of C0 (U+0000 to U+001F, tab and line breaks included: a name never needs them, and a message stays
/// one line), DEL (U+007F), all of C1 (U+0080 to U+009F, where U+009B is a one-character CSI on some terminals),
/// and the bidirectional formatting characters (U+200E, U+200F, U+202A to U+202E, U+2066 to U+2069), which reorder
/// what is displayed. With ESC and CSI escaped, no escape sequence can start, so the rest of one prints as plain text.
/// Applied at the print edges: every renderable on the standard-output console (<see cref="Hook"/>), every stderr
/// line (<see cref="CliRun"/>), the progress description, and text laid out by <see cref="Screen"/> and
/// <see cref="TextTable"/>, cleaned before it is measured.
/// </remarks>
internal static class TerminalText
{
    /// <summary><paramref name="text"/> with every control character replaced by a visible escape.</summary>
    public static string Clean(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var first = 0;
        while (first < text.Length && !IsControl(text[first]))
        {
            first++;
        }

        if (first == text.Length)
        {
            return text;
        }

        var clean = new StringBuilder(text.Length + 16).Append(text, 0, first);
        for (var i = first; i < text.Length; i++)
        {
            var c = text[i];
            if (!IsControl(c))
            {
                clean.Append(c);
            }
            else if (c <= 0xFF)
            {
                clean.Append(CultureInfo.InvariantCulture, $"\\x{(int)c:X2}");
            }
            else
            {
                clean.Append(CultureInfo.InvariantCulture, $"\\u{(int)c:X4}");
            }
        }

        return clean.ToString();
    }

    /// <summary><see cref="Clean"/> applied to each line of <paramref name="text"/>, its line breaks kept: for text laid
    /// out by <see cref="WordWrap"/>, which must measure what will be printed.</summary>
    public static string CleanLines(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return text.Contains('\n', StringComparison.Ordinal)
            ? string.Join('\n', text.Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n').Select(Clean))
            : Clean(text);
    }

    /// <summary>Whether <paramref name="c"/> is escaped by <see cref="Clean"/>.</summary>
    public static bool IsControl(char c) =>
        c < 0x20 || (c >= 0x7F && c <= 0x9F) || c is '\u200E' or '\u200F' || (c >= '\u202A' && c <= '\u202E') ||
        (c >= '\u2066' && c <= '\u2069');

    /// <summary>A render hook that cleans the text of every segment a console renders (its own cursor and line-break
    /// segments pass unchanged), so nothing printed through that console can carry a control character.</summary>
    public static IRenderHook Hook { get; } = new CleaningHook();

    private sealed class CleaningHook : IRenderHook
    {
        public IEnumerable<IRenderable> Process(RenderOptions options, IEnumerable<IRenderable> renderables) =>
            renderables.Select(r => (IRenderable)new CleanRenderable(r));
    }

    private sealed class CleanRenderable(IRenderable inner) : IRenderable
    {
        public Measurement Measure(RenderOptions options, int maxWidth) => inner.Measure(options, maxWidth);

        public IEnumerable<Segment> Render(RenderOptions options, int maxWidth)
        {
            foreach (var segment in inner.Render(options, maxWidth))
            {
                if (segment.IsControlCode || segment.IsLineBreak)
                {
                    yield return segment;
                    continue;
                }

                var text = Clean(segment.Text);
                yield return ReferenceEquals(text, segment.Text) ? segment : new Segment(text, segment.Style);
            }
        }
    }
}
