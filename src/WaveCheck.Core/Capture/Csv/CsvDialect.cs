using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// What the first lines of a delimited text capture tell: the delimiter, the decimal mark, where the header is, the
/// header's cells and the first row's, and the first values of the time column (for its nominal step). Read with
/// bounded memory: leading comment lines are counted, not kept, and at most <see cref="PrescanLines"/> lines or
/// <see cref="PrescanChars"/> characters after them are looked at.
/// </summary>
internal sealed class CsvDialect
{
    /// <summary>Lines read up front (after any leading comment lines) to find the dialect, header and rate.</summary>
    public const int PrescanLines = 400;

    /// <summary>Characters read up front at most, whatever the line count (bounds the memory of the first pass).</summary>
    private const int PrescanChars = 4 << 20;

    public char Delimiter { get; private init; }

    public bool DecimalComma { get; private init; }

    public long HeaderLine { get; private init; }

    /// <summary>1-based line of the first data row.</summary>
    public long FirstDataLine { get; private init; }

    public string[] Header { get; private init; } = [];

    public string[]? FirstRow { get; private init; }

    public int DataRows { get; private set; }

    public bool ReachedEnd { get; private init; }

    public double BytesPerDataRow { get; private init; }

    public List<double> TimeValues { get; } = [];

    public int TimeColumn { get; private set; } = -1;

    public DateTimeOffset? StartTime { get; private set; }

    /// <summary>The dialect as a person reads it, e.g. <c>delimiter ';', decimal comma, 2 preamble lines</c>.</summary>
    public string Description =>
        $"delimiter {DelimiterName(Delimiter)}, decimal {(DecimalComma ? "comma" : "point")}" +
        (HeaderLine > 1 ? $", {HeaderLine - 1} preamble lines" : "");

    /// <summary>Reads the first lines of <paramref name="path"/>.</summary>
    /// <param name="path">The text file, as the user named it.</param>
    /// <exception cref="CaptureFormatException">Empty, comments only, no header, no data row after it, a first row
    /// shorter than the header, an unbalanced quote, or a time value that cannot be read (each with line and
    /// column).</exception>
    public static CsvDialect Detect(string path)
    {
        // Leading comment and blank lines are counted, not kept: a preamble of any length is passed over with
        // bounded memory. From the first other line, up to PrescanLines lines are kept. lines[i] is line first + i.
        var lines = new List<string>(PrescanLines);
        long first;
        bool reachedEnd;
        using (var reader = new StreamReader(path, detectEncodingFromByteOrderMarks: true))
        {
            var source = new BoundedLineReader(reader, path);
            string line;
            long leading = 0;
            while (source.TryRead(out line) && IsCommentOrBlank(line))
            {
                leading++;
            }

            if (source.LineNumber == leading)
            {
                throw new CaptureFormatException(path, leading == 0
                    ? "empty file: no header and no data"
                    : $"no header: the file holds only {leading} comment or blank lines", Math.Max(1, leading), 1);
            }

            first = leading + 1;
            lines.Add(line);
            long chars = line.Length;
            while (lines.Count < PrescanLines && chars < PrescanChars && source.TryRead(out line))
            {
                lines.Add(line);
                chars += line.Length;
            }

            reachedEnd = !source.TryRead(out _);
        }

        long LineOf(int i) => first + i;
        var content = new List<int>();
        for (var i = 0; i < lines.Count; i++)
        {
            if (!IsCommentOrBlank(lines[i]))
            {
                content.Add(i);
            }
        }

        var (delimiter, fieldCount) = ChooseDelimiter(lines, content);
        var headerIndex = -1;
        foreach (var i in content)
        {
            var fields = Split(lines[i], delimiter);
            if (fields.Length == fieldCount && !IsMetadata(lines[i]) && !LooksLikeData(fields, false, out _))
            {
                headerIndex = i;
                break;
            }

            if (LooksLikeData(fields, delimiter != ',', out _))
            {
                throw new CaptureFormatException(path,
                    "no header line: expected column names with units before the data, e.g. 'time [s],I [mA]'", LineOf(i), 1);
            }
        }

        if (headerIndex < 0)
        {
            throw new CaptureFormatException(path,
                $"no header line with {fieldCount} fields (delimiter {DelimiterName(delimiter)}) found", LineOf(content[0]), 1);
        }

        for (var i = headerIndex; i < lines.Count; i++)
        {
            if (UnclosedQuoteColumn(lines[i], delimiter) is { } column)
            {
                throw new CaptureFormatException(path,
                    "unbalanced quote: the field opens a quote that the line does not close (a capture row must be one line)",
                    LineOf(i), column);
            }
        }

        var header = Split(lines[headerIndex], delimiter);
        var firstData = -1;
        for (var i = headerIndex + 1; i < lines.Count; i++)
        {
            if (lines[i].Trim().Length > 0)
            {
                firstData = i;
                break;
            }
        }

        if (firstData < 0)
        {
            if (reachedEnd)
            {
                throw new CaptureFormatException(path, "the header is followed by no data rows", LineOf(headerIndex) + 1, 1);
            }

            throw new CaptureFormatException(path, $"no data row within the first {lines.Count} lines after line {first - 1}", LineOf(headerIndex) + 1, 1);
        }

        var decimalComma = false;
        if (delimiter != ',')
        {
            for (var i = firstData; i < lines.Count && !decimalComma; i++)
            {
                LooksLikeData(Split(lines[i], delimiter), true, out decimalComma);
            }
        }

        var dataRows = 0;
        long dataChars = 0;
        string[]? firstRow = null;
        for (var i = firstData; i < lines.Count; i++)
        {
            if (lines[i].Trim().Length == 0)
            {
                continue;
            }

            dataRows++;
            dataChars += lines[i].Length + 1;
            firstRow ??= Split(lines[i], delimiter);
        }

        // Data rows must line up with the header (a longer row is fine: trailing delimiters are common).
        if (firstRow!.Length < header.Length)
        {
            throw new CaptureFormatException(path,
                $"row has {firstRow.Length} fields, the header has {header.Length}", LineOf(firstData), firstRow.Length + 1);
        }

        var dialect = new CsvDialect
        {
            Delimiter = delimiter,
            DecimalComma = decimalComma,
            HeaderLine = LineOf(headerIndex),
            FirstDataLine = LineOf(firstData),
            Header = header,
            FirstRow = firstRow,
            DataRows = dataRows,
            ReachedEnd = reachedEnd,
            BytesPerDataRow = dataRows > 0 ? dataChars / (double)dataRows : 1,
        };
        if (header.Length <= CaptureLimits.MaxCsvColumns)
        {
            dialect.CollectTimes(lines, firstData, path, first);
        }

        return dialect;
    }

    /// <summary>1-based field of a quote the line opens and never closes; null when every quote is closed.</summary>
    private static int? UnclosedQuoteColumn(string line, char delimiter)
    {
        var quoted = false;
        var field = 1;
        var openedIn = 0;
        foreach (var c in line)
        {
            if (c == '"')
            {
                quoted = !quoted;
                openedIn = field;
            }
            else if (c == delimiter && !quoted)
            {
                field++;
            }
        }

        return quoted ? openedIn : null;
    }

    private void CollectTimes(List<string> lines, int firstData, string path, long first)
    {
        for (var c = 0; c < Header.Length; c++)
        {
            var column = CsvColumn.Parse(c + 1, Header[c], FirstRow?[c], out _);
            if (column.Kind is not (CsvColumnKind.TimeSeconds or CsvColumnKind.TimeStamp))
            {
                continue;
            }

            TimeColumn = c;
            var number = DecimalComma ? new NumberFormatInfo { NumberDecimalSeparator = "," } : NumberFormatInfo.InvariantInfo;
            DateTimeOffset? origin = null;
            for (var i = firstData; i < lines.Count; i++)
            {
                if (lines[i].Trim().Length == 0)
                {
                    continue;
                }

                var fields = Split(lines[i], Delimiter);
                if (fields.Length <= c)
                {
                    break;
                }

                if (column.Kind == CsvColumnKind.TimeStamp)
                {
                    if (!DateTimeOffset.TryParse(fields[c], CultureInfo.InvariantCulture,
                            DateTimeStyles.AssumeUniversal | DateTimeStyles.AllowWhiteSpaces, out var stamp))
                    {
                        throw new CaptureFormatException(path, $"'{ShownText.Of(fields[c])}' is not an ISO 8601 time stamp", first + i, c + 1);
                    }

                    origin ??= stamp;
                    TimeValues.Add((stamp - origin.Value).TotalSeconds);
                }
                else if (double.TryParse(fields[c], NumberStyles.Float, number, out var t) && double.IsFinite(t))
                {
                    TimeValues.Add(t * column.Factor);
                }
                else
                {
                    throw new CaptureFormatException(path, $"'{ShownText.Of(fields[c])}' is not a finite number", first + i, c + 1);
                }
            }

            StartTime = origin;
            return;
        }
    }

    private static bool IsCommentOrBlank(string line)
    {
        var t = line.AsSpan().Trim();
        return t.IsEmpty || t[0] is '#' or '%' or '!' || t.StartsWith("//", StringComparison.Ordinal);
    }

    /// <summary>Tab, then semicolon, then comma: the first for which at least 80 % of the last content lines split into
    /// the same count of two or more fields (a preamble line or a faulty row does not spoil the choice).</summary>
    private static (char Delimiter, int FieldCount) ChooseDelimiter(List<string> lines, List<int> content)
    {
        var sample = content.Skip(Math.Max(0, content.Count - 50)).ToList();
        foreach (var candidate in new[] { '\t', ';', ',' })
        {
            var (count, share) = CommonFieldCount(lines, sample, candidate);
            if (count >= 2 && share >= 0.8)
            {
                return (candidate, count);
            }
        }

        return (',', CommonFieldCount(lines, sample, ',').Count);
    }

    private static (int Count, double Share) CommonFieldCount(List<string> lines, List<int> sample, char delimiter)
    {
        var counts = new Dictionary<int, int>();
        foreach (var i in sample)
        {
            var n = Split(lines[i], delimiter).Length;
            counts[n] = counts.GetValueOrDefault(n) + 1;
        }

        var best = counts.MaxBy(kv => (kv.Value, kv.Key));
        return (best.Key, best.Value / (double)sample.Count);
    }

    /// <summary>A <c>key: value</c> or <c>key=value</c> line of a logger's preamble.</summary>
    private static bool IsMetadata(string line)
    {
        var colon = line.IndexOfAny([':', '=']);
        return colon > 0 && !line.AsSpan(0, colon).ContainsAny('[', '(');
    }

    private static bool LooksLikeData(string[] fields, bool commaAllowed, out bool decimalComma)
    {
        decimalComma = false;
        var any = false;
        foreach (var field in fields)
        {
            if (field.Length == 0)
            {
                continue;
            }

            any = true;
            if (double.TryParse(field, NumberStyles.Float, CultureInfo.InvariantCulture, out _))
            {
                continue;
            }

            if (commaAllowed && field.Contains(',', StringComparison.Ordinal) &&
                double.TryParse(field, NumberStyles.Float, new NumberFormatInfo { NumberDecimalSeparator = "," }, out _))
            {
                decimalComma = true;
                continue;
            }

            if (field.Length >= 10 && field[4] == '-' && field[7] == '-' &&
                DateTimeOffset.TryParse(field, CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal, out _))
            {
                continue;
            }

            return false;
        }

        return any;
    }

    public static string[] Split(string line, char delimiter)
    {
        var parts = line.Split(delimiter);
        for (var i = 0; i < parts.Length; i++)
        {
            parts[i] = parts[i].Trim().Trim('"').Trim();
        }

        return parts;
    }

    /// <summary>The delimiter as a person reads it.</summary>
    public static string DelimiterName(char delimiter) => delimiter switch
    {
        '\t' => "tab",
        _ => $"'{delimiter}'",
    };
}
