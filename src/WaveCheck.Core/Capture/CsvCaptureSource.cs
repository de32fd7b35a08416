using System.Globalization;
using Sylvan.Data.Csv;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Streams a delimited text capture (CSV, semicolon or tab separated; decimal point or decimal comma) row by row.
/// The dialect, the header (names and units) and the nominal sample rate are found from the first few hundred lines;
/// the rest is read in one pass, so the sample count and the measured rate are final only after the last block.
/// Time-axis faults (gaps, jitter, steps backwards) are reported as warnings, never repaired. Not thread-safe.
/// </summary>
/// <remarks>
/// Edge cases: blank lines are skipped; an empty cell or a non-number is an error with line and column; columns without
/// a unit (an index, a flag) are skipped with a warning. Samples are taken as evenly spaced at
/// <see cref="CaptureInfo.SampleRateHz"/>; a gap therefore shortens the analysed time and is only warned about.
/// </remarks>
public sealed class CsvCaptureSource : ICaptureSource
{
    /// <summary>Lines read up front (after any leading comment lines) to find the dialect, header and rate.</summary>
    private const int PrescanLines = 400;

    /// <summary>Characters read up front at most, whatever the line count (bounds the memory of the first pass).</summary>
    private const int PrescanChars = 4 << 20;

    /// <summary>Engineering choice: a step longer than 1.5 median steps is a gap (at least one sample missing would be 2×).</summary>
    private const double GapFactor = 1.5;

    /// <summary>Engineering choice: step spread (standard deviation) above 1 % of the median step is worth a warning.</summary>
    private const double JitterLimit = 0.01;

    /// <summary>Individual warnings per kind of time fault before only the count is given.</summary>
    private const int ListedFaults = 5;

    private readonly string _path;
    private readonly StreamReader _text;
    private readonly CsvDataReader _csv;
    private readonly NumberFormatInfo _number;
    private readonly CsvColumn? _time;
    private readonly CsvColumn[] _dataColumns;
    private readonly int _fieldCount;
    private readonly int[] _ignoredColumns;
    private long[] _rowLines = [];
    private long _commentLines;
    private readonly long _headerLine;
    private readonly ChannelSelection _selection;
    private readonly double[] _toAmperes;
    private readonly double _medianStepS;
    private readonly bool _rateGiven;
    private readonly List<CaptureWarning> _warnings = [];
    private readonly List<CaptureWarning> _timeWarnings = [];
    private long _row;
    private double _firstT = double.NaN;
    private double _previousT = double.NaN;
    private long _previousTicks;
    private long _firstTicks;
    private long _goodSteps;
    private double _stepMean;
    private double _stepM2;
    private long _gapCount;
    private double _gapTotalS;
    private double _gapLongestS;
    private long _backwardCount;
    private bool _finished;

    /// <summary>Opens <paramref name="path"/> and reads its dialect, header and nominal rate.</summary>
    /// <param name="path">The text file, as the user named it.</param>
    /// <param name="options">Channel choice, <c>--rate</c>, <c>--sensitivity</c> for voltage columns, sensor coupling.</param>
    /// <exception cref="CaptureFormatException">Empty, header only, no header, unknown unit, non-numeric cell,
    /// unknown channel, no time column and no rate, a voltage column without a sensitivity (each with line and column).</exception>
    public CsvCaptureSource(string path, ImportOptions options)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(options);
        _path = path;
        var fileLength = new FileInfo(path).Length;
        var dialect = Dialect.Detect(path);
        _number = dialect.DecimalComma
            ? new NumberFormatInfo { NumberDecimalSeparator = ",", NegativeSign = "-" }
            : NumberFormatInfo.InvariantInfo;
        _headerLine = dialect.HeaderLine;
        _fieldCount = dialect.Header.Length;
        if (_fieldCount > CaptureLimits.MaxCsvColumns)
        {
            throw new CaptureFormatException(path,
                $"the header has {_fieldCount} columns: at most {CaptureLimits.MaxCsvColumns} are read", _headerLine, 1);
        }

        var columns = new List<CsvColumn>(dialect.Header.Length);
        var ignored = new List<string>();
        for (var i = 0; i < dialect.Header.Length; i++)
        {
            var column = CsvColumn.Parse(i + 1, dialect.Header[i], dialect.FirstRow?[i], out var problem);
            if (problem is not null)
            {
                throw new CaptureFormatException(path, problem, _headerLine, i + 1);
            }

            if (column.Kind is CsvColumnKind.TimeSeconds or CsvColumnKind.TimeStamp && _time is null)
            {
                _time = column;
            }
            else if (column.Kind is CsvColumnKind.Current or CsvColumnKind.Voltage)
            {
                columns.Add(column);
            }
            else
            {
                ignored.Add(column.Name.Length > 0 ? column.Name : $"column {i + 1}");
            }
        }

        if (ignored.Count > 0)
        {
            _warnings.Add(new CaptureWarning("column-ignored",
                $"Columns without a current, voltage or time unit were skipped: {string.Join(", ", ignored)}."));
        }

        if (columns.Count > CaptureLimits.MaxChannels)
        {
            throw new CaptureFormatException(path,
                $"the header has {columns.Count} current and voltage columns: at most {CaptureLimits.MaxChannels} channels are read",
                _headerLine, columns[CaptureLimits.MaxChannels].FileColumn);
        }

        _dataColumns = [.. columns];
        _ignoredColumns = [.. Enumerable.Range(1, _fieldCount).Where(c => c != _time?.FileColumn && !columns.Any(d => d.FileColumn == c))];
        var channels = new ChannelInfo[_dataColumns.Length];
        var currents = new List<int>();
        var voltages = new List<int>();
        for (var i = 0; i < channels.Length; i++)
        {
            var c = _dataColumns[i];
            var quantity = c.Kind == CsvColumnKind.Current ? ChannelQuantity.Current : ChannelQuantity.Voltage;
            channels[i] = new ChannelInfo(i, c.Name, c.Unit, quantity, c.Factor, null);
            (quantity == ChannelQuantity.Current ? currents : voltages).Add(i);
        }

        var headerLine = _headerLine;
        _selection = ChannelSelection.Resolve(channels, options, currents.Count > 0 ? currents : voltages,
            "no current or voltage column found: name the unit in the header, e.g. 'I [mA]'",
            problem => new CaptureFormatException(path, problem, headerLine, 1));
        if (_selection.Warning is { } guessed)
        {
            _warnings.Add(guessed);
        }

        var dataColumns = _dataColumns;
        _toAmperes = _selection.AmperesPerSiUnit(channels, options,
            (index, problem) => new CaptureFormatException(path, problem, headerLine, dataColumns[index].FileColumn));
        var units = new List<string>(_toAmperes.Length);
        foreach (var index in _selection.Indices)
        {
            var column = _dataColumns[index];
            units.Add(column.Kind == CsvColumnKind.Voltage
                ? string.Create(CultureInfo.InvariantCulture, $"column unit {column.Unit} / sensitivity {options.SensitivityVPerA:G6} mV/mA")
                : $"column unit {column.Unit}");
        }

        if (options.ScaleA is not null || options.RangeV is not null)
        {
            _warnings.Add(new CaptureWarning("option-ignored",
                "--scale and --range apply to WAV full scale; a CSV states its units in the header, so they were not used."));
        }

        if (options.RateHz is { } givenRate && CaptureLimits.RateProblem(givenRate) is { } givenProblem)
        {
            throw new OptionValueException("--rate", CaptureLimits.Hz(givenRate), $"a sample rate from {CaptureLimits.RateRange} ({givenProblem})");
        }

        _medianStepS = MedianStep(dialect, path, options.RateHz is not null);
        double rateHz;
        double? measuredHz = null;
        if (_time is not null && !double.IsNaN(_medianStepS))
        {
            measuredHz = 1.0 / _medianStepS;
            rateHz = options.RateHz ?? measuredHz.Value;
            _rateGiven = options.RateHz is not null;
        }
        else if (options.RateHz is { } given)
        {
            rateHz = given;
        }
        else
        {
            throw new CaptureFormatException(path,
                "no time column (a header such as 'time [s]') and no sample rate: give --rate, e.g. --rate 10kHz", _headerLine, 1);
        }

        var first = _dataColumns[_selection.Indices[0]];
        var estimate = dialect.ReachedEnd
            ? dialect.DataRows
            : (long)Math.Round(fileLength / Math.Max(1.0, dialect.BytesPerDataRow));
        Info = new CaptureInfo
        {
            FilePath = path,
            Format = "csv",
            Encoding = $"delimiter {DelimiterName(dialect.Delimiter)}, decimal {(dialect.DecimalComma ? "comma" : "point")}" +
                       (dialect.HeaderLine > 1 ? $", {dialect.HeaderLine - 1} preamble lines" : ""),
            Channels = channels,
            ResidualSource = _selection.Source,
            ResidualChannels = _selection.Indices,
            SampleRateHz = rateHz,
            MeasuredSampleRateHz = measuredHz,
            SampleCount = estimate,
            SampleCountExact = dialect.ReachedEnd,
            StartTime = dialect.StartTime,
            Calibration = new Calibration(first.Factor * _toAmperes[0], 0, string.Join("; ", units.Distinct())),
            SensorCoupling = options.Sensor,
        };

        _text = new StreamReader(path, detectEncodingFromByteOrderMarks: true);
        var skip = new BoundedLineReader(_text, path);
        while (skip.LineNumber < _headerLine && skip.TryRead(out _))
        {
        }

        _csv = CsvDataReader.Create(_text, new CsvDataReaderOptions
        {
            HasHeaders = false,
            Delimiter = dialect.Delimiter,
            OwnsReader = false,
            BufferSize = 1 << 16,
            // A record may grow to the line limit; beyond it (a huge cell, or a quote never closed) it is refused.
            MaxBufferSize = CaptureLimits.MaxLineLength,
            // Comment lines are skipped by the parser; counted here so that line numbers stay those of the file.
            CommentHandler = (Action<string>)(_ => _commentLines++),
        });
    }

    /// <inheritdoc />
    public CaptureInfo Info { get; private set; }

    /// <inheritdoc />
    public IReadOnlyList<CaptureWarning> Warnings => _finished ? [.. _warnings, .. _timeWarnings] : _warnings;

    /// <inheritdoc />
    public CaptureBlock CreateBlock(int capacity = 65536) => new(Math.Max(1, _dataColumns.Length), capacity, Info.SampleRateHz);

    /// <inheritdoc />
    public bool Read(CaptureBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        block.StartSample = _row;
        if (_rowLines.Length < block.Capacity)
        {
            _rowLines = new long[block.Capacity];
        }

        var n = 0;
        while (n < block.Capacity && !_finished)
        {
            if (!NextRecord())
            {
                Finish();
                break;
            }

            var line = _headerLine + _commentLines + _csv.RowNumber;
            var fields = _csv.RowFieldCount;
            if (fields <= 1 && _csv.GetFieldSpan(0).IsWhiteSpace())
            {
                continue;
            }

            if (fields < _fieldCount)
            {
                throw new CaptureFormatException(_path, $"row has {fields} fields, the header has {_fieldCount}", line, fields + 1);
            }

            CheckOneLine(line, fields);
            if (_time is not null)
            {
                Step(line);
            }

            for (var c = 0; c < _dataColumns.Length; c++)
            {
                var column = _dataColumns[c];
                var value = ParseNumber(column.FileColumn, line) * column.Factor;
                if (!(Math.Abs(value) <= CaptureLimits.MaxSampleMagnitude))
                {
                    throw new CaptureFormatException(_path, CaptureLimits.SampleProblem(column.Name, value,
                        _row / Info.SampleRateHz, column.Kind == CsvColumnKind.Voltage ? "V" : "A"), line, column.FileColumn);
                }

                block.ChannelBuffer(c)[n] = value;
            }

            _rowLines[n] = line;
            n++;
            _row++;
        }

        if (n > 0)
        {
            _selection.FormResidual(block, n, _toAmperes);
            var bad = CaptureLimits.IndexOfInvalid(block.ResidualBuffer[..n]);
            if (bad >= 0)
            {
                // Only a voltage divided by a tiny sensitivity gets here: every column was checked above.
                throw new CaptureFormatException(_path, CaptureLimits.SampleProblem($"residual ({Info.ResidualSource})",
                    block.ResidualBuffer[bad], (block.StartSample + bad) / Info.SampleRateHz, "A"), _rowLines[bad], 1);
            }
        }

        block.Length = n;
        return n > 0;
    }

    /// <inheritdoc />
    public void Dispose()
    {
        _csv.Dispose();
        _text.Dispose();
    }

    /// <summary>The next record from the parser, its faults turned into placed messages.</summary>
    private bool NextRecord()
    {
        try
        {
            return _csv.Read();
        }
        catch (CsvFormatException e)
        {
            // The record that failed starts on the line after the last one read (comment lines counted).
            var line = _headerLine + _commentLines + e.RowNumber;
            var problem = e is CsvRecordTooLargeException
                ? string.Create(CultureInfo.InvariantCulture,
                    $"the row is longer than {CaptureLimits.MaxLineLength} characters (1 MiB), the limit for a line of a capture; a quote opened and never closed also makes a row run on")
                : e is CsvInvalidCharacterException { InvalidCharacter: '"' } || e.Message.Contains("quote", StringComparison.OrdinalIgnoreCase)
                    ? "a quoted field is not closed before the end of the file: unbalanced quote"
                    : $"the row cannot be read as delimited text: {e.Message}";
            throw new CaptureFormatException(_path, problem, line, e.FieldOrdinal + 1);
        }
    }

    /// <summary>A record must be one line: a quoted line break would shift every line number after it. Parsed cells
    /// fail as numbers anyway; the others are looked at here.</summary>
    private void CheckOneLine(long line, int fields)
    {
        foreach (var c in _ignoredColumns)
        {
            RefuseLineBreak(c, line);
        }

        for (var c = _fieldCount + 1; c <= fields; c++)
        {
            RefuseLineBreak(c, line);
        }
    }

    private void RefuseLineBreak(int fileColumn, long line)
    {
        var cell = _csv.GetFieldSpan(fileColumn - 1);
        if (cell.IndexOfAny('\n', '\r') >= 0)
        {
            throw new CaptureFormatException(_path,
                $"quoted field '{ShownText.Of(cell)}' holds a line break: a capture row must be one line", line, fileColumn);
        }
    }

    private double ParseNumber(int fileColumn, long line)
    {
        var cell = _csv.GetFieldSpan(fileColumn - 1).Trim();
        if (double.TryParse(cell, NumberStyles.Float, _number, out var value))
        {
            if (double.IsFinite(value))
            {
                return value;
            }

            throw new CaptureFormatException(_path,
                $"'{ShownText.Of(cell)}' is not a finite number: NaN and infinities are not measurements", line, fileColumn);
        }

        throw new CaptureFormatException(_path,
            cell.IsEmpty ? "empty cell: expected a number" : $"'{ShownText.Of(cell)}' is not a number{(_number.NumberDecimalSeparator == "," ? " (decimal comma expected)" : "")}",
            line, fileColumn);
    }

    private void Step(long line)
    {
        double t;
        if (_time!.Kind == CsvColumnKind.TimeStamp)
        {
            var cell = _csv.GetFieldSpan(_time.FileColumn - 1).Trim();
            if (!DateTimeOffset.TryParse(cell, CultureInfo.InvariantCulture,
                    DateTimeStyles.AssumeUniversal | DateTimeStyles.AllowWhiteSpaces, out var stamp))
            {
                throw new CaptureFormatException(_path, $"'{ShownText.Of(cell)}' is not an ISO 8601 time stamp", line, _time.FileColumn);
            }

            if (_row == 0)
            {
                _firstTicks = stamp.UtcTicks;
            }

            t = (stamp.UtcTicks - _firstTicks) / (double)TimeSpan.TicksPerSecond;
            _previousTicks = stamp.UtcTicks;
        }
        else
        {
            t = ParseNumber(_time.FileColumn, line) * _time.Factor;
        }

        if (_row == 0)
        {
            _firstT = t;
            _previousT = t;
            return;
        }

        var step = t - _previousT;
        var at = _previousT - _firstT;
        if (step <= 0)
        {
            _backwardCount++;
            if (_backwardCount <= ListedFaults)
            {
                _timeWarnings.Add(new CaptureWarning("time-non-monotonic", string.Create(CultureInfo.InvariantCulture,
                    $"Time does not increase at line {line}: step {step:G4} s after t = {at:G6} s."), at));
            }
        }
        else if (step > GapFactor * _medianStepS)
        {
            _gapCount++;
            var gap = step - _medianStepS;
            _gapTotalS += gap;
            _gapLongestS = Math.Max(_gapLongestS, gap);
            if (_gapCount <= ListedFaults)
            {
                var missing = Math.Round(step / _medianStepS) - 1;
                _timeWarnings.Add(new CaptureWarning("time-gap", string.Create(CultureInfo.InvariantCulture,
                    $"Gap in the time column at line {line}: {gap:G4} s (about {missing:0} samples) missing after t = {at:G6} s."), at));
            }
        }
        else
        {
            _goodSteps++;
            var delta = step - _stepMean;
            _stepMean += delta / _goodSteps;
            _stepM2 += delta * (step - _stepMean);
        }

        _previousT = t;
    }

    private void Finish()
    {
        _finished = true;
        if (_row == 0)
        {
            throw new CaptureFormatException(_path, "the header is followed by no data rows", _headerLine + 1, 1);
        }

        if (_gapCount > ListedFaults)
        {
            _timeWarnings.Add(new CaptureWarning("time-gap", string.Create(CultureInfo.InvariantCulture,
                $"{_gapCount} gaps in the time column in all, {_gapTotalS:G4} s missing, the longest {_gapLongestS:G4} s (first {ListedFaults} listed).")));
        }

        if (_backwardCount > ListedFaults)
        {
            _timeWarnings.Add(new CaptureWarning("time-non-monotonic",
                $"{_backwardCount} steps backwards or zero in the time column in all (first {ListedFaults} listed)."));
        }

        double? measured = Info.MeasuredSampleRateHz;
        if (_time is not null && _goodSteps > 0)
        {
            measured = 1.0 / _stepMean;
            var spread = _goodSteps > 1 ? Math.Sqrt(_stepM2 / (_goodSteps - 1)) : 0;
            if (spread > JitterLimit * _medianStepS)
            {
                _timeWarnings.Add(new CaptureWarning("time-jitter", string.Create(CultureInfo.InvariantCulture,
                    $"Time steps vary: standard deviation {spread:G3} s is {100 * spread / _medianStepS:0.#} % of the median step {_medianStepS:G4} s; samples are treated as evenly spaced.")));
            }

            if (Math.Abs(Info.SampleRateHz - measured.Value) > 0.01 * measured.Value)
            {
                // Without --rate the rate came from the median step of the first lines (rounded time stamps can
                // bias it); say so rather than blame an option the user did not give.
                var used = Info.SampleRateHz;
                var message = _rateGiven
                    ? string.Create(CultureInfo.InvariantCulture, $"--rate {used:G6} Hz differs from the time column's {measured.Value:G6} Hz; --rate is used.")
                    : string.Create(CultureInfo.InvariantCulture, $"the median time step of the first lines gives {used:G6} Hz, the mean step of the whole file {measured.Value:G6} Hz; {used:G6} Hz is used (give --rate to set it).");
                _timeWarnings.Add(new CaptureWarning("rate-mismatch", message));
            }
        }

        Info = Info with { SampleCount = _row, SampleCountExact = true, MeasuredSampleRateHz = measured };
    }

    private static double MedianStep(Dialect dialect, string path, bool rateGiven)
    {
        if (dialect.TimeColumn < 0)
        {
            return double.NaN;
        }

        if (dialect.TimeValues.Count < 2)
        {
            if (rateGiven)
            {
                return double.NaN;
            }

            throw new CaptureFormatException(path,
                "only one data row: the sample rate needs at least two time values (or give --rate)",
                dialect.FirstDataLine, dialect.TimeColumn + 1);
        }

        var steps = new double[dialect.TimeValues.Count - 1];
        for (var i = 1; i < dialect.TimeValues.Count; i++)
        {
            steps[i - 1] = dialect.TimeValues[i] - dialect.TimeValues[i - 1];
        }

        Array.Sort(steps);
        var median = steps.Length % 2 == 1 ? steps[steps.Length / 2] : 0.5 * (steps[steps.Length / 2 - 1] + steps[steps.Length / 2]);
        if (!(median > 0))
        {
            throw new CaptureFormatException(path, "the time column does not increase: the median step is not positive",
                dialect.FirstDataLine, dialect.TimeColumn + 1);
        }

        if (!rateGiven && CaptureLimits.RateProblem(1 / median) is { } problem)
        {
            throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                $"the time column's median step is {median:G6} s: {problem}; check the time unit in the header, or give --rate"),
                dialect.FirstDataLine, dialect.TimeColumn + 1);
        }

        return median;
    }

    private static string DelimiterName(char delimiter) => delimiter switch
    {
        '\t' => "tab",
        _ => $"'{delimiter}'",
    };

    /// <summary>What the first lines tell: delimiter, decimal mark, where the header is, the first time values.</summary>
    private sealed class Dialect
    {
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

        public static Dialect Detect(string path)
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

            var dialect = new Dialect
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
    }
}
