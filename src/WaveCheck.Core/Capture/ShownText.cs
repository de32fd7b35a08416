using System.Globalization;
using System.Text;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Text taken from a file for a one-line message: control characters (line breaks, tabs, escape sequences) are
/// written as <c>\n</c>, <c>\t</c> or <c>\xNN</c>, and a long text is cut, so the message stays one readable line.
/// </summary>
public static class ShownText
{
    /// <summary>Characters of file text shown before it is cut.</summary>
    public const int MaxShown = 60;

    /// <summary>The text made safe for a one-line message.</summary>
    /// <param name="text">Text from a file.</param>
    /// <param name="max">Characters kept before an ellipsis.</param>
    public static string Of(ReadOnlySpan<char> text, int max = MaxShown)
    {
        var cut = text.Length > max;
        var shown = cut ? text[..max] : text;
        var builder = new StringBuilder(shown.Length + 8);
        foreach (var c in shown)
        {
            Append(builder, c);
        }

        if (cut)
        {
            builder.Append("...");
        }

        return builder.ToString();
    }

    /// <summary>UTF-8 bytes from a file made safe for a one-line message (invalid sequences shown as U+FFFD).</summary>
    public static string Of(ReadOnlySpan<byte> utf8, int max = MaxShown)
    {
        var take = Math.Min(utf8.Length, (max * 4) + 4);
        var text = Encoding.UTF8.GetString(utf8[..take]);
        return Of(text.AsSpan(), utf8.Length > take ? Math.Min(max, text.Length - 1) : max);
    }

    /// <summary>Escapes control characters only, without cutting (for a whole message).</summary>
    public static string Escape(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var clean = true;
        foreach (var c in text)
        {
            if (IsControl(c))
            {
                clean = false;
                break;
            }
        }

        if (clean)
        {
            return text;
        }

        var builder = new StringBuilder(text.Length + 8);
        foreach (var c in text)
        {
            Append(builder, c);
        }

        return builder.ToString();
    }

    private static bool IsControl(char c) => c < 0x20 || c is >= '\u007f' and <= '\u009f' || c is '\u2028' or '\u2029';

    private static void Append(StringBuilder builder, char c)
    {
        switch (c)
        {
            case '\n': builder.Append("\\n"); break;
            case '\r': builder.Append("\\r"); break;
            case '\t': builder.Append("\\t"); break;
            default:
                if (IsControl(c))
                {
                    builder.Append(c <= 0xff
                        ? string.Create(CultureInfo.InvariantCulture, $"\\x{(int)c:X2}")
                        : string.Create(CultureInfo.InvariantCulture, $"\\u{(int)c:x4}"));
                }
                else
                {
                    builder.Append(c);
                }

                break;
        }
    }
}
