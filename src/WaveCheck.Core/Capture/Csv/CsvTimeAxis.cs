using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// The time column of a CSV capture. At open, its nominal step: the median of the steps of the first lines
/// (<see cref="MedianStep"/>), which a gap or a stray row there does not move. While reading, each row's time against
/// that step: gaps, steps backwards or zero and the spread of the good steps (jitter) are warned about with where they
/// are, never repaired; the mean of the good steps gives the measured rate. Not thread-safe.
/// </summary>
internal sealed class CsvTimeAxis
{
    /// <summary>Engineering choice: a step longer than 1.5 median steps is a gap (at least one sample missing would be 2×).</summary>
    private const double GapFactor = 1.5;

    /// <summary>Engineering choice: step spread (standard deviation) above 1 % of the median step is worth a warning.</summary>
    private const double JitterLimit = 0.01;

    /// <summary>Individual warnings per kind of time fault before only the count is given.</summary>
    private const int ListedFaults = 5;

    /// <summary>The rate setting, named in the rate warnings.</summary>
    private static readonly string Rate = Setting.Ref(nameof(ImportOptions.RateHz));

    private readonly CsvColumn _column;
    private readonly double _medianStepS;
    private readonly bool _rateGiven;
    private readonly List<CaptureWarning> _warnings = [];
    private long _rows;
    private double _firstT = double.NaN;
    private double _previousT = double.NaN;
    private DateTimeOffset? _firstStamp;
    private long _goodSteps;
    private double _stepMean;
    private double _stepM2;
    private long _gapCount;
    private double _gapTotalS;
    private double _gapLongestS;
    private long _backwardCount;

    /// <summary>Starts the axis.</summary>
    /// <param name="column">The time column: seconds times a unit factor, or ISO 8601 stamps.</param>
    /// <param name="medianStepS">The nominal step from the first lines, seconds (NaN when they gave none).</param>
    /// <param name="rateGiven">Whether the rate used was given by the user (<see cref="ImportOptions.RateHz"/>) rather
    /// than taken from <paramref name="medianStepS"/>, for the words of a rate mismatch.</param>
    public CsvTimeAxis(CsvColumn column, double medianStepS, bool rateGiven)
    {
        _column = column;
        _medianStepS = medianStepS;
        _rateGiven = rateGiven;
    }

    /// <summary>The first time stamp read, for a time-stamp column: stamps count from it.</summary>
    public DateTimeOffset? FirstStamp => _firstStamp;

    /// <summary>Time faults found so far; complete after <see cref="Finish"/>.</summary>
    public IReadOnlyList<CaptureWarning> Warnings => _warnings;

    /// <summary>The nominal step of the first lines: the median of their steps.</summary>
    /// <param name="times">The time column's values in the first lines, seconds, in file order.</param>
    /// <param name="rateGiven">Whether the user gave the rate: then too few values is no fault, and the step need not
    /// give a rate within the bounds.</param>
    /// <param name="fail">Builds the exception for a problem, placed at the first data row's time cell.</param>
    /// <returns>The median step, seconds; NaN when fewer than two values came and the rate is given.</returns>
    public static double MedianStep(IReadOnlyList<double> times, bool rateGiven, Func<string, Exception> fail)
    {
        if (times.Count < 2)
        {
            return rateGiven
                ? double.NaN
                : throw fail($"only one data row: the sample rate needs at least two time values (or give {Setting.Ref(nameof(ImportOptions.RateHz))})");
        }

        var steps = new double[times.Count - 1];
        for (var i = 1; i < times.Count; i++)
        {
            steps[i - 1] = times[i] - times[i - 1];
        }

        Array.Sort(steps);
        var median = steps.Length % 2 == 1 ? steps[steps.Length / 2] : 0.5 * (steps[steps.Length / 2 - 1] + steps[steps.Length / 2]);
        if (!(median > 0))
        {
            throw fail("the time column does not increase: the median step is not positive");
        }

        if (!rateGiven && CaptureLimits.RateProblem(1 / median) is { } problem)
        {
            throw fail(string.Create(CultureInfo.InvariantCulture,
                $"the time column's median step is {median:G6} s: {problem}; check the time unit in the header, or give {Setting.Ref(nameof(ImportOptions.RateHz))}"));
        }

        return median;
    }

    /// <summary>Reads the next row's time cell: seconds times the column's unit, or seconds from the first stamp read
    /// for a time-stamp column.</summary>
    /// <param name="cell">The cell, trimmed.</param>
    /// <param name="number">The dialect's number format.</param>
    /// <param name="seconds">The time; meaningful only when no problem is returned.</param>
    /// <returns>Null, or what is wrong with the cell.</returns>
    public string? TryRead(ReadOnlySpan<char> cell, NumberFormatInfo number, out double seconds)
    {
        if (_column.Kind != CsvColumnKind.TimeStamp)
        {
            var problem = CsvCells.TryParseNumber(cell, number, out var value);
            seconds = value * _column.Factor;
            return problem;
        }

        if (CsvCells.TryParseStamp(cell, out var stamp) is { } stampProblem)
        {
            seconds = double.NaN;
            return stampProblem;
        }

        _firstStamp ??= stamp;
        seconds = (stamp.UtcTicks - _firstStamp.Value.UtcTicks) / (double)TimeSpan.TicksPerSecond;
        return null;
    }

    /// <summary>Takes the next row's time and checks its step.</summary>
    /// <param name="t">Seconds, as <see cref="TryRead"/> gave them.</param>
    /// <param name="line">The row's line in the file, for the warnings.</param>
    public void Add(double t, long line)
    {
        if (_rows++ == 0)
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
                _warnings.Add(new CaptureWarning("time-non-monotonic", string.Create(CultureInfo.InvariantCulture,
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
                _warnings.Add(new CaptureWarning("time-gap", string.Create(CultureInfo.InvariantCulture,
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

    /// <summary>Ends the axis: counts of the faults beyond those listed, the jitter, and a rate that differs from the
    /// one used.</summary>
    /// <param name="usedRateHz">The rate the samples are taken at.</param>
    /// <param name="measuredHz">The rate measured so far (from the first lines), kept when no good step came.</param>
    /// <returns>The measured rate: the inverse of the mean good step of the whole file.</returns>
    public double? Finish(double usedRateHz, double? measuredHz)
    {
        if (_gapCount > ListedFaults)
        {
            _warnings.Add(new CaptureWarning("time-gap", string.Create(CultureInfo.InvariantCulture,
                $"{_gapCount} gaps in the time column in all, {_gapTotalS:G4} s missing, the longest {_gapLongestS:G4} s (first {ListedFaults} listed).")));
        }

        if (_backwardCount > ListedFaults)
        {
            _warnings.Add(new CaptureWarning("time-non-monotonic",
                $"{_backwardCount} steps backwards or zero in the time column in all (first {ListedFaults} listed)."));
        }

        if (_goodSteps == 0)
        {
            return measuredHz;
        }

        var measured = 1.0 / _stepMean;
        var spread = _goodSteps > 1 ? Math.Sqrt(_stepM2 / (_goodSteps - 1)) : 0;
        if (spread > JitterLimit * _medianStepS)
        {
            _warnings.Add(new CaptureWarning("time-jitter", string.Create(CultureInfo.InvariantCulture,
                $"Time steps vary: standard deviation {spread:G3} s is {100 * spread / _medianStepS:0.#} % of the median step {_medianStepS:G4} s; samples are treated as evenly spaced.")));
        }

        if (Math.Abs(usedRateHz - measured) > 0.01 * measured)
        {
            // Without --rate the rate came from the median step of the first lines (rounded time stamps can
            // bias it); say so rather than blame an option the user did not give.
            var message = _rateGiven
                ? string.Create(CultureInfo.InvariantCulture, $"{Rate} {usedRateHz:G6} Hz differs from the time column's {measured:G6} Hz; {Rate} is used.")
                : string.Create(CultureInfo.InvariantCulture, $"the median time step of the first lines gives {usedRateHz:G6} Hz, the mean step of the whole file {measured:G6} Hz; {usedRateHz:G6} Hz is used (give {Rate} to set it).");
            _warnings.Add(new CaptureWarning("rate-mismatch", message));
        }

        return measured;
    }
}
