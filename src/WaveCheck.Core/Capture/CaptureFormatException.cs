namespace WaveCheck.Core.Capture;

/// <summary>
/// A capture (or an option describing it) cannot be read as given. Carries the place: file, and where known
/// the line and column (text formats), the byte offset or the sample index (binary formats).
/// The CLI prints <see cref="Exception.Message"/> as one line and exits with code 2.
/// </summary>
public sealed class CaptureFormatException : UserInputException
{
    /// <summary>Creates the exception; the message is composed as <c>file:line:column: problem</c> or <c>file: sample N: problem</c>.</summary>
    /// <param name="filePath">The file being read (as the user named it).</param>
    /// <param name="problem">What is wrong, with the value found and the value expected.</param>
    /// <param name="line">1-based line number (text formats).</param>
    /// <param name="column">1-based column number (text formats), counted in fields for CSV.</param>
    /// <param name="byteOffset">Byte offset from the start of the file (binary formats).</param>
    /// <param name="sampleIndex">0-based sample (frame) index.</param>
    public CaptureFormatException(string filePath, string problem, long? line = null, long? column = null,
        long? byteOffset = null, long? sampleIndex = null)
        : base(Compose(filePath, problem, line, column, byteOffset, sampleIndex))
    {
        FilePath = filePath;
        Problem = Setting.Render(problem, Setting.PropertyName);
        Line = line;
        Column = column;
        ByteOffset = byteOffset;
        SampleIndex = sampleIndex;
    }

    /// <summary>The file being read.</summary>
    public string FilePath { get; }

    /// <summary>What is wrong, without the place (settings by their property names).</summary>
    public string Problem { get; }

    /// <summary>1-based line, where the format has lines.</summary>
    public long? Line { get; }

    /// <summary>1-based column (CSV: field number), where the format has columns.</summary>
    public long? Column { get; }

    /// <summary>Byte offset, for binary formats.</summary>
    public long? ByteOffset { get; }

    /// <summary>0-based sample index, where the problem is tied to one sample.</summary>
    public long? SampleIndex { get; }

    private static string Compose(string file, string problem, long? line, long? column, long? byteOffset, long? sample)
    {
        var place = file;
        if (line is not null)
        {
            place += $":{line}";
            if (column is not null)
            {
                place += $":{column}";
            }
        }

        var extra = new List<string>(2);
        if (byteOffset is not null)
        {
            extra.Add($"byte {byteOffset}");
        }

        if (sample is not null)
        {
            extra.Add($"sample {sample}");
        }

        // One line whatever the file name or a quoted cell holds: control characters are shown escaped.
        return ShownText.Escape(extra.Count == 0 ? $"{place}: {problem}" : $"{place}: {string.Join(", ", extra)}: {problem}");
    }
}
