using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// What the first lines of a delimited text capture tell: the delimiter, the decimal mark, where the header is, the
/// header's cells and the first row's, and the first values of the time column (for its nominal step). Read with
/// bounded memory: leading comment lines are counted, not kept, and at most <see cref="PrescanLines"/> lines or
/// <see cref="PrescanChars"/> characters after them are looked at.
/// </summary>
/// <remarks>
/// Each line is split into cells by the parser that then reads the rows (<see cref="CsvLineSplitter"/>), so both
/// agree on where a cell ends, on quoted cells and on comment lines among the data. Before the header, the lines are
/// only sorted into comments, <c>key: value</c> metadata, the header and data (which before a header is an error).
/// </remarks>
internal sealed class CsvDialect
{
    /// <summary>Lines read up front (after any leading comment lines) to find the dialect, header and rate.</summary>
    public const int PrescanLines = 400;

    /// <summary>Characters read up front at most, whatever the line count (bounds the memory of the first pass).</summary>
    private const int PrescanChars = 4 << 20;

    /// <summary>The field delimiter: tab, semicolon or comma.</summary>
    public char Delimiter { get; private init; }

    /// <summary>Whether numbers are written with a decimal comma (only with tab or semicolon as delimiter).</summary>
    public bool DecimalComma { get; private init; }

    /// <summary>1-based line of the header.</summary>
    public long HeaderLine { get; private init; }

    /// <summary>1-based line of the first data row.</summary>
    public long FirstDataLine { get; private init; }

    /// <summary>The header's cells, trimmed and unquoted.</summary>
    public string[] Header { get; private init; } = [];

    /// <summary>The first data row's cells, trimmed.</summary>
    public string[] FirstRow { get; private init; } = [];

    /// <summary>Data rows among the lines looked at.</summary>
    public int DataRows { get; private init; }

    /// <summary>Whether the lines looked at are the whole file.</summary>
    public bool ReachedEnd { get; private init; }

    /// <summary>Mean characters per data row (line end included), for an estimate of the row count.</summary>
    public double BytesPerDataRow { get; private init; }

    /// <summary>The time column's values in the data rows looked at, seconds (from the first stamp for time stamps).</summary>
    public List<double> TimeValues { get; } = [];

    /// <summary>0-based index of the first time column, -1 if none.</summary>
    public int TimeColumn { get; private set; } = -1;

    /// <summary>When the recording started: the first row's time stamp for a time-stamp column, else the preamble's
    /// <c>start:</c> line (docs/formats.md), else null.</summary>
    public DateTimeOffset? StartTime { get; private set; }

    /// <summary>The preamble's <c>start: 2026-11-20T09:14:00Z</c> line, commented or not; null when there is none.</summary>
    private DateTimeOffset? StatedStart { get; init; }

    /// <summary>The dialect as a person reads it, e.g. <c>delimiter ';', decimal comma, 2 preamble lines</c>.</summary>
    public string Description =>
        $"delimiter {DelimiterName(Delimiter)}, decimal {(DecimalComma ? "comma" : "point")}" +
        (HeaderLine > 1 ? $", {HeaderLine - 1} preamble lines" : "");

    /// <summary>Reads the first lines of <paramref name="path"/>.</summary>
    /// <param name="path">The text file, as the user named it.</param>
    /// <exception cref="CaptureFormatException">Empty, comments only, no header, no data row after it, a first row
    /// shorter than the header, a line the parser cannot split (an unbalanced quote), or a time value that cannot be
    /// read (each with line and column).</exception>
    public static CsvDialect Detect(string path)
    {
        var (lines, first, reachedEnd, statedStart) = ReadFirstLines(path);
        long LineOf(int i) => first + i;
        var splitter = new CsvLineSplitter(lines.Max(l => l.Length));
        var content = new List<int>();
        for (var i = 0; i < lines.Count; i++)
        {
            if (!IsCommentOrBlank(lines[i]))
            {
                content.Add(i);
            }
        }

        var (delimiter, fieldCount) = ChooseDelimiter(lines, content, splitter);
        var headerIndex = -1;
        string[] header = [];
        foreach (var i in content)
        {
            var fields = splitter.Split(lines[i], delimiter, out var fault);
            if (fields is null)
            {
                // A logger's note may hold a stray quote; a line that should be the header or data may not.
                if (IsMetadata(lines[i]))
                {
                    continue;
                }

                throw new CaptureFormatException(path, fault.Problem, LineOf(i), fault.Column);
            }

            if (IsMetadata(lines[i]) && StartStamp(lines[i]) is { } stamp)
            {
                statedStart ??= stamp;
            }

            if (fields.Length == fieldCount && !IsMetadata(lines[i]) && !LooksLikeData(fields, false, out _))
            {
                headerIndex = i;
                header = [.. fields.Select(Unquoted)];
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

        // From the header on every line is a row for the parser: split once, a line it cannot split refused here
        // as it would be when read. Blank lines and comment lines are passed over, as the reader passes over them.
        var rows = new List<(int Index, string[] Cells)>();
        long dataChars = 0;
        for (var i = headerIndex + 1; i < lines.Count; i++)
        {
            if (lines[i].Trim().Length == 0)
            {
                continue;
            }

            var cells = splitter.Split(lines[i], delimiter, out var fault)
                ?? throw new CaptureFormatException(path, fault.Problem, LineOf(i), fault.Column);
            if (cells.Length > 0)
            {
                rows.Add((i, cells));
                dataChars += lines[i].Length + 1;
            }
        }

        if (rows.Count == 0)
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
            for (var r = 0; r < rows.Count && !decimalComma; r++)
            {
                LooksLikeData(rows[r].Cells, true, out decimalComma);
            }
        }

        // Data rows must line up with the header (a longer row is fine: trailing delimiters are common).
        var (firstIndex, firstRow) = rows[0];
        if (firstRow.Length < header.Length)
        {
            throw new CaptureFormatException(path,
                $"row has {firstRow.Length} fields, the header has {header.Length}", LineOf(firstIndex), firstRow.Length + 1);
        }

        var dialect = new CsvDialect
        {
            Delimiter = delimiter,
            DecimalComma = decimalComma,
            HeaderLine = LineOf(headerIndex),
            FirstDataLine = LineOf(firstIndex),
            Header = header,
            FirstRow = firstRow,
            DataRows = rows.Count,
            ReachedEnd = reachedEnd,
            BytesPerDataRow = dataChars / (double)rows.Count,
            StatedStart = statedStart,
            StartTime = statedStart,
        };
        if (header.Length <= CaptureLimits.MaxCsvColumns)
        {
            dialect.CollectTimes(rows, path, first);
        }

        return dialect;
    }

    /// <summary>The delimiter as a person reads it.</summary>
    public static string DelimiterName(char delimiter) => delimiter switch
    {
        '\t' => "tab",
        _ => $"'{delimiter}'",
    };

    /// <summary>Leading comment and blank lines are counted, not kept: a preamble of any length is passed over with
    /// bounded memory. From the first other line, up to <see cref="PrescanLines"/> lines are kept; lines[i] is line
    /// first + i.</summary>
    private static (List<string> Lines, long First, bool ReachedEnd, DateTimeOffset? StatedStart) ReadFirstLines(string path)
    {
        DateTimeOffset? statedStart = null;
        var lines = new List<string>(PrescanLines);
        using var reader = new StreamReader(path, detectEncodingFromByteOrderMarks: true);
        var source = new BoundedLineReader(reader, path);
        string line;
        long leading = 0;
        while (source.TryRead(out line) && IsCommentOrBlank(line))
        {
            leading++;
            statedStart ??= StartStamp(line);
        }

        if (source.LineNumber == leading)
        {
            throw new CaptureFormatException(path, leading == 0
                ? "empty file: no header and no data"
                : $"no header: the file holds only {leading} comment or blank lines", Math.Max(1, leading), 1);
        }

        lines.Add(line);
        long chars = line.Length;
        while (lines.Count < PrescanLines && chars < PrescanChars && source.TryRead(out line))
        {
            lines.Add(line);
            chars += line.Length;
        }

        return (lines, leading + 1, !source.TryRead(out _), statedStart);
    }

    /// <summary>The first time column's values, read as the reader reads them (same words for a bad cell).</summary>
    private void CollectTimes(List<(int Index, string[] Cells)> rows, string path, long first)
    {
        for (var c = 0; c < Header.Length; c++)
        {
            var column = CsvColumn.Parse(c + 1, Header[c], FirstRow[c], out _);
            if (column.Kind is not (CsvColumnKind.TimeSeconds or CsvColumnKind.TimeStamp))
            {
                continue;
            }

            TimeColumn = c;
            var axis = new CsvTimeAxis(column, double.NaN, rateGiven: false);
            var number = CsvCells.NumberFormat(DecimalComma);
            foreach (var (index, cells) in rows)
            {
                if (cells.Length <= c)
                {
                    break;
                }

                if (axis.TryRead(cells[c], number, out var t) is { } problem)
                {
                    throw new CaptureFormatException(path, problem, first + index, c + 1);
                }

                TimeValues.Add(t);
            }

            StartTime = axis.FirstStamp ?? StatedStart;
            return;
        }
    }

    /// <summary>The time of a preamble line <c>start: 2026-11-20T09:14:00Z</c> (also <c>start=</c>, <c>start time:</c>,
    /// after a comment mark), read as time-stamp cells are read (ISO 8601; no offset: UTC); null for any other line or
    /// a value that is no time (a logger's note is not refused for it).</summary>
    internal static DateTimeOffset? StartStamp(string line)
    {
        var t = line.AsSpan().Trim();
        t = t.StartsWith("//", StringComparison.Ordinal) ? t[2..] : t.Length > 0 && t[0] is '#' or '%' or '!' ? t[1..] : t;
        var mark = t.IndexOfAny(':', '=');
        if (mark <= 0)
        {
            return null;
        }

        var key = t[..mark].Trim();
        var isStart = key.Equals("start", StringComparison.OrdinalIgnoreCase) || key.Equals("start time", StringComparison.OrdinalIgnoreCase)
            || key.Equals("start_time", StringComparison.OrdinalIgnoreCase) || key.Equals("starttime", StringComparison.OrdinalIgnoreCase);
        return isStart && CsvCells.TryParseStamp(t[(mark + 1)..].Trim(), out var stamp) is null ? stamp : null;
    }

    private static bool IsCommentOrBlank(string line)
    {
        var t = line.AsSpan().Trim();
        return t.IsEmpty || t[0] is '#' or '%' or '!' || t.StartsWith("//", StringComparison.Ordinal);
    }

    /// <summary>Tab, then semicolon, then comma: the first for which at least 80 % of the last content lines split into
    /// the same count of two or more fields (a preamble line or a faulty row does not spoil the choice).</summary>
    private static (char Delimiter, int FieldCount) ChooseDelimiter(List<string> lines, List<int> content, CsvLineSplitter splitter)
    {
        var sample = content.Skip(Math.Max(0, content.Count - 50)).ToList();
        foreach (var candidate in new[] { '\t', ';', ',' })
        {
            var (count, share) = CommonFieldCount(lines, sample, candidate, splitter);
            if (count >= 2 && share >= 0.8)
            {
                return (candidate, count);
            }
        }

        return (',', CommonFieldCount(lines, sample, ',', splitter).Count);
    }

    /// <summary>The most common count of cells, and the share of lines that have it; a line the parser cannot split
    /// with this delimiter counts as none.</summary>
    private static (int Count, double Share) CommonFieldCount(List<string> lines, List<int> sample, char delimiter, CsvLineSplitter splitter)
    {
        var counts = new Dictionary<int, int>();
        foreach (var i in sample)
        {
            var n = splitter.Split(lines[i], delimiter, out _)?.Length ?? -1;
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

    /// <summary>Whether every non-empty cell is a number (or a date-time stamp); quotes the parser left, after a space
    /// before them, are looked through, since only the shape of the line matters here.</summary>
    private static bool LooksLikeData(string[] fields, bool commaAllowed, out bool decimalComma)
    {
        decimalComma = false;
        var any = false;
        foreach (var cell in fields)
        {
            var field = Unquoted(cell);
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
                double.TryParse(field, NumberStyles.Float, CsvCells.NumberFormat(decimalComma: true), out _))
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

    /// <summary>A cell without the quotes the parser leaves when a space comes before them (<c> "I [mA]"</c>).</summary>
    private static string Unquoted(string cell) => cell.Trim('"').Trim();
}
