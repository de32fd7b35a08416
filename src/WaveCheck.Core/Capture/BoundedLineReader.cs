using System.Globalization;
using System.Text;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Reads lines from a text reader, ending them at <c>\n</c>, <c>\r</c> or <c>\r\n</c> like
/// <see cref="TextReader.ReadLine"/>, but refuses a line longer than <see cref="CaptureLimits.MaxLineLength"/>
/// characters as soon as it gets there, so a file with a 100 MB line costs 1 MiB, not 100 MB. Reads one character at
/// a time from the reader (which buffers), so the reader is left exactly after the last line returned and another
/// parser can go on from there. Not thread-safe.
/// </summary>
internal sealed class BoundedLineReader(TextReader reader, string path)
{
    private readonly StringBuilder _line = new();

    /// <summary>1-based number of the last line returned (0 before the first).</summary>
    public long LineNumber { get; private set; }

    /// <summary>The next line without its line end; false at the end of the text.</summary>
    /// <exception cref="CaptureFormatException">The line is longer than the limit (with its line number).</exception>
    public bool TryRead(out string line)
    {
        _line.Clear();
        int c;
        while ((c = reader.Read()) >= 0)
        {
            if (c == '\n' || c == '\r')
            {
                if (c == '\r' && reader.Peek() == '\n')
                {
                    reader.Read();
                }

                LineNumber++;
                line = _line.ToString();
                return true;
            }

            if (_line.Length == CaptureLimits.MaxLineLength)
            {
                throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                    $"the line is longer than {CaptureLimits.MaxLineLength} characters (1 MiB), the limit for a line of a capture"),
                    LineNumber + 1, 1);
            }

            _line.Append((char)c);
        }

        if (_line.Length == 0)
        {
            line = string.Empty;
            return false;
        }

        LineNumber++;
        line = _line.ToString();
        return true;
    }
}
