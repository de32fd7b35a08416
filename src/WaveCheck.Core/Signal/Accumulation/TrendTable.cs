using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Per-window rows for trend plots in at most <see cref="MaxRows"/> rows: each row covers a power-of-two number of
/// consecutive windows and holds, per metric, the worst value among them (largest magnitude, lowest negative peak,
/// frequency furthest from nominal); when full, neighbouring rows merge in pairs. Not thread-safe.
/// </summary>
public sealed class TrendTable
{
    /// <summary>Most rows kept.</summary>
    public const int MaxRows = 2000;

    private readonly double _nominalHz;
    private readonly List<WindowResult> _rows = new(MaxRows);
    private int _windowsPerRow = 1;
    private WindowResult? _pending;
    private int _pendingCount;

    /// <summary>Creates a table.</summary>
    /// <param name="nominalHz">Nominal mains frequency: the worst frequency is the one furthest from it, hertz.</param>
    public TrendTable(double nominalHz) => _nominalHz = nominalHz;

    /// <summary>Adds the next window.</summary>
    public void Add(WindowResult window)
    {
        _pending = _pending is null ? window : Worst(_pending, window);
        _pendingCount++;
        if (_pendingCount < _windowsPerRow)
        {
            return;
        }

        if (_rows.Count == MaxRows)
        {
            for (var i = 0; i < MaxRows / 2; i++)
            {
                _rows[i] = Worst(_rows[2 * i], _rows[(2 * i) + 1]);
            }

            _rows.RemoveRange(MaxRows / 2, MaxRows / 2);
            _windowsPerRow *= 2;
            if (_pendingCount < _windowsPerRow)
            {
                return;
            }
        }

        _rows.Add(_pending);
        _pending = null;
        _pendingCount = 0;
    }

    /// <summary>The rows, including a last partly filled one.</summary>
    public IReadOnlyList<WindowResult> Result()
    {
        var rows = new List<WindowResult>(_rows);
        if (_pending is not null)
        {
            rows.Add(_pending);
        }

        return rows;
    }

    /// <summary>Combines two consecutive rows into one covering both, keeping each metric's worst value.</summary>
    public WindowResult Worst(WindowResult a, WindowResult b) => new()
    {
        StartS = a.StartS,
        DurationS = b.StartS + b.DurationS - a.StartS,
        FrequencyHz = Math.Abs(b.FrequencyHz - _nominalHz) > Math.Abs(a.FrequencyHz - _nominalHz) ? b.FrequencyHz : a.FrequencyHz,
        RmsA = Math.Max(a.RmsA, b.RmsA),
        DcA = Signed(a.DcA, b.DcA),
        AcRmsA = Math.Max(a.AcRmsA, b.AcRmsA),
        PeakPositiveA = Math.Max(a.PeakPositiveA, b.PeakPositiveA),
        PeakNegativeA = Math.Min(a.PeakNegativeA, b.PeakNegativeA),
        CrestFactor = Math.Max(a.CrestFactor, b.CrestFactor),
        SmoothDcA = Signed(a.SmoothDcA, b.SmoothDcA),
        PulsatingDc = a.PulsatingDc || b.PulsatingDc,
        CurrentDelayAngleDeg = Larger(a.CurrentDelayAngleDeg, b.CurrentDelayAngleDeg),
        MainsRmsA = Math.Max(a.MainsRmsA, b.MainsRmsA),
        BelowMainsRmsA = Math.Max(a.BelowMainsRmsA, b.BelowMainsRmsA),
        HarmonicsRmsA = Math.Max(a.HarmonicsRmsA, b.HarmonicsRmsA),
        Above1kHzRmsA = Math.Max(a.Above1kHzRmsA, b.Above1kHzRmsA),
        Above9kHzRmsA = Math.Max(a.Above9kHzRmsA, b.Above9kHzRmsA),
        ThdPercent = Larger(a.ThdPercent, b.ThdPercent),
        Clipped = a.Clipped || b.Clipped,
    };

    private static double Signed(double a, double b) => Math.Abs(b) > Math.Abs(a) ? b : a;

    private static double? Larger(double? a, double? b) => a is null ? b : b is null ? a : Math.Max(a.Value, b.Value);
}
