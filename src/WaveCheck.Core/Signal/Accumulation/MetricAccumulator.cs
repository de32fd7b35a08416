using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Mean, 95th percentile and maximum (with its time) of one window metric over a capture, in bounded memory.
/// Not thread-safe.
/// </summary>
/// <remarks>
/// For a signed metric (DC, smooth DC, negative peak) the maximum is the value of largest magnitude with its sign, and
/// the 95th percentile is taken of the magnitude and given the sign of that maximum; the mean is the signed mean.
/// </remarks>
public sealed class MetricAccumulator
{
    private readonly bool _signed;
    private readonly StreamingQuantile _p95 = new(0.95);
    private double _sum;
    private double _max = double.NaN;
    private double _timeOfMax = double.NaN;

    /// <summary>Creates an accumulator.</summary>
    /// <param name="signed">True for a signed metric (see remarks).</param>
    public MetricAccumulator(bool signed) => _signed = signed;

    /// <summary>Values added (NaN ignored).</summary>
    public long Count { get; private set; }

    /// <summary>Adds a window's value.</summary>
    /// <param name="value">The value; NaN (not measured in this window) is ignored.</param>
    /// <param name="startS">Window start, seconds.</param>
    public void Add(double value, double startS)
    {
        if (double.IsNaN(value))
        {
            return;
        }

        Count++;
        _sum += value;
        var magnitude = _signed ? Math.Abs(value) : value;
        _p95.Add(magnitude);
        if (double.IsNaN(_max) || magnitude > (_signed ? Math.Abs(_max) : _max))
        {
            _max = value;
            _timeOfMax = startS;
        }
    }

    /// <summary>The statistics; all NaN when nothing was added.</summary>
    public MetricStatistics Result()
    {
        if (Count == 0)
        {
            return new MetricStatistics(double.NaN, double.NaN, double.NaN, double.NaN);
        }

        var p95 = _p95.Value;
        if (_signed && _max < 0)
        {
            p95 = -p95;
        }

        return new MetricStatistics(_sum / Count, p95, _max, _timeOfMax);
    }
}
