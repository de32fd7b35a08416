using System.Globalization;
using Sylvan.Data.Csv;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Streams a delimited text capture (CSV, semicolon or tab separated; decimal point or decimal comma) row by row.
/// The dialect, the header (names and units) and the nominal sample rate are found from the first few hundred lines
/// (<see cref="CsvDialect"/>); the rest is read in one pass by Sylvan.Data.Csv, so the sample count and the measured
/// rate are final only after the last block. Time-axis faults (gaps, jitter, steps backwards) are reported as
/// warnings, never repaired (<see cref="CsvTimeAxis"/>). Not thread-safe.
/// </summary>
/// <remarks>
/// Edge cases: blank lines are skipped; an empty cell or a non-number is an error with line and column; columns without
/// a unit (an index, a flag) are skipped with a warning. Samples are taken as evenly spaced at
/// <see cref="CaptureInfo.SampleRateHz"/>; a gap therefore shortens the analysed time and is only warned about.
/// </remarks>
public sealed class CsvCaptureSource : ICaptureSource
{
    private readonly string _path;
    private readonly StreamReader _text;
    private readonly CsvDataReader _csv;
    private readonly NumberFormatInfo _number;
    private readonly CsvColumn? _time;
    private readonly CsvTimeAxis? _axis;
    private readonly CsvColumn[] _dataColumns;
    private readonly int _fieldCount;
    private readonly int[] _ignoredColumns;
    private long[] _rowLines = [];
    private long _commentLines;
    private readonly long _headerLine;
    private readonly ChannelSelection _selection;
    private readonly double[] _toAmperes;
    private readonly List<CaptureWarning> _warnings = [];
    private long _row;
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
        var dialect = CsvDialect.Detect(path);
        _number = CsvCells.NumberFormat(dialect.DecimalComma);
        var headerLine = _headerLine = dialect.HeaderLine;
        _fieldCount = dialect.Header.Length;
        if (_fieldCount > CaptureLimits.MaxCsvColumns)
        {
            throw new CaptureFormatException(path,
                $"the header has {_fieldCount} columns: at most {CaptureLimits.MaxCsvColumns} are read", headerLine, 1);
        }

        var columns = new List<CsvColumn>(dialect.Header.Length);
        var ignored = new List<string>();
        for (var i = 0; i < dialect.Header.Length; i++)
        {
            var column = CsvColumn.Parse(i + 1, dialect.Header[i], dialect.FirstRow[i], out var problem);
            if (problem is not null)
            {
                throw new CaptureFormatException(path, problem, headerLine, i + 1);
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
                headerLine, columns[CaptureLimits.MaxChannels].FileColumn);
        }

        var dataColumns = _dataColumns = [.. columns];
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

        var voltageChannels = VoltageSelection.Indices(channels, options, problem => new CaptureFormatException(path, problem, headerLine, 1));
        var spareVoltages = VoltageSelection.Without(voltages, voltageChannels);
        // Of several current columns, the one named as the residual current is taken (Ires_mA beside L1_A, L2_A);
        // otherwise all are candidates, and several are refused by the shared choice.
        var named = currents.Where(i => NamesResidualCurrent(channels[i].Name)).ToList();
        _selection = ChannelSelection.Resolve(channels, options, named.Count == 1 ? named : currents.Count > 0 ? currents : spareVoltages,
            "no current or voltage column found: name the unit in the header, e.g. 'I [mA]'",
            problem => new CaptureFormatException(path, problem, headerLine, 1),
            writtenNames: [.. dataColumns.Select(c => dialect.Header[c.FileColumn - 1])]);
        if (_selection.Warning is { } guessed)
        {
            _warnings.Add(guessed);
        }

        var voltage = VoltageSelection.Build(channels, voltageChannels, _selection.Indices, options, _ => 1.0,
            string.Join(", ", voltageChannels.Select(i => $"column unit {dataColumns[i].Unit}").Distinct()),
            (index, problem) => new CaptureFormatException(path, problem, headerLine, index >= 0 ? dataColumns[index].FileColumn : 1));
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
                $"{Setting.Ref(nameof(ImportOptions.ScaleA))} and {Setting.Ref(nameof(ImportOptions.RangeV))} apply to WAV full scale; a CSV states its units in the header, so they were not used."));
        }

        if (options.RateHz is { } givenRate && CaptureLimits.RateProblem(givenRate) is { } givenProblem)
        {
            throw new OptionValueException(Setting.Ref(nameof(ImportOptions.RateHz)), CaptureLimits.Hz(givenRate), $"a sample rate from {CaptureLimits.RateRange} ({givenProblem})");
        }

        var medianStepS = dialect.TimeColumn < 0
            ? double.NaN
            : CsvTimeAxis.MedianStep(dialect.TimeValues, options.RateHz is not null,
                problem => new CaptureFormatException(path, problem, dialect.FirstDataLine, dialect.TimeColumn + 1));
        double rateHz;
        double? measuredHz = null;
        var rateGiven = false;
        if (_time is not null && !double.IsNaN(medianStepS))
        {
            measuredHz = 1.0 / medianStepS;
            rateHz = options.RateHz ?? measuredHz.Value;
            rateGiven = options.RateHz is not null;
        }
        else if (options.RateHz is { } given)
        {
            rateHz = given;
        }
        else
        {
            throw new CaptureFormatException(path,
                $"no time column (a header such as 'time [s]') and no sample rate: give {Setting.Ref(nameof(ImportOptions.RateHz))}, e.g. {Setting.Ref(nameof(ImportOptions.RateHz))} 10kHz", headerLine, 1);
        }

        _axis = _time is null ? null : new CsvTimeAxis(_time, medianStepS, rateGiven);
        var first = _dataColumns[_selection.Indices[0]];
        var estimate = dialect.ReachedEnd
            ? dialect.DataRows
            : (long)Math.Round(fileLength / Math.Max(1.0, dialect.BytesPerDataRow));
        Info = new CaptureInfo
        {
            FilePath = path,
            Format = "csv",
            Encoding = dialect.Description,
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
            Voltage = voltage,
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
    public IReadOnlyList<CaptureWarning> Warnings =>
        _finished && _axis is not null ? [.. _warnings, .. _axis.Warnings] : _warnings;

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
            if (_axis is not null)
            {
                var cell = _csv.GetFieldSpan(_time!.FileColumn - 1).Trim();
                if (_axis.TryRead(cell, _number, out var t) is { } timeProblem)
                {
                    throw new CaptureFormatException(_path, timeProblem, line, _time.FileColumn);
                }

                _axis.Add(t, line);
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
            throw new CaptureFormatException(_path, CsvCells.DescribeFault(e), line, e.FieldOrdinal + 1);
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
        return CsvCells.TryParseNumber(cell, _number, out var value) is { } problem
            ? throw new CaptureFormatException(_path, problem, line, fileColumn)
            : value;
    }

    private void Finish()
    {
        _finished = true;
        if (_row == 0)
        {
            throw new CaptureFormatException(_path, "the header is followed by no data rows", _headerLine + 1, 1);
        }

        var measured = _axis is null ? Info.MeasuredSampleRateHz : _axis.Finish(Info.SampleRateHz, Info.MeasuredSampleRateHz);
        Info = Info with { SampleCount = _row, SampleCountExact = true, MeasuredSampleRateHz = measured };
    }

    /// <summary>Words of a column name that mark it as the residual current. Unlike COMTRADE's phase labels, N is not
    /// among them: in a logger export of conductor currents N is the neutral conductor, one of the currents to sum.</summary>
    private static readonly HashSet<string> ResidualWords = new(StringComparer.OrdinalIgnoreCase)
    {
        "IRES", "RES", "RESIDUAL", "IDELTA", "IΔ", "IΔN", "IDN", "LEAK", "LEAKAGE", "EARTH", "IEARTH", "RCM",
    };

    /// <summary>Whether a column's name (without its unit), or a word of it, names the residual current.</summary>
    internal static bool NamesResidualCurrent(string name)
    {
        foreach (var word in name.Split([' ', '_', '-', '.', '/'], StringSplitOptions.RemoveEmptyEntries))
        {
            if (ResidualWords.Contains(word))
            {
                return true;
            }
        }

        return false;
    }
}
