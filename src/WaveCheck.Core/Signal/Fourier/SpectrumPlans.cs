namespace WaveCheck.Core.Signal;

/// <summary>
/// The few <see cref="RealSpectrum"/> plans a tracked analysis needs: windows differ in length by a sample or two as
/// the mains frequency drifts, so the most recently used lengths are kept (least recently used one dropped).
/// Not thread-safe.
/// </summary>
public sealed class SpectrumPlans
{
    private readonly RealSpectrum?[] _plans;
    private readonly long[] _lastUse;
    private long _clock;

    /// <summary>Creates a cache of <paramref name="capacity"/> plans.</summary>
    public SpectrumPlans(int capacity = 6)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(capacity, 1);
        _plans = new RealSpectrum?[capacity];
        _lastUse = new long[capacity];
    }

    /// <summary>The plan for windows of <paramref name="length"/> samples, built on first use.</summary>
    public RealSpectrum For(int length)
    {
        _clock++;
        var oldest = 0;
        for (var i = 0; i < _plans.Length; i++)
        {
            if (_plans[i]?.Length == length)
            {
                _lastUse[i] = _clock;
                return _plans[i]!;
            }

            if (_lastUse[i] < _lastUse[oldest])
            {
                oldest = i;
            }
        }

        _plans[oldest] = new RealSpectrum(length);
        _lastUse[oldest] = _clock;
        return _plans[oldest]!;
    }
}
