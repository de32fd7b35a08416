using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Min/max envelope in at most <see cref="MaxBuckets"/> equal buckets of a power-of-two number of samples: when the
/// buckets are full, neighbours are merged in pairs and the bucket length doubles, so memory stays fixed however long
/// the capture is and no peak is lost. Not thread-safe.
/// </summary>
public sealed class EnvelopeBuilder
{
    /// <summary>Most buckets kept.</summary>
    public const int MaxBuckets = 4000;

    private readonly double _sampleRateHz;
    private readonly double[] _min = new double[MaxBuckets];
    private readonly double[] _max = new double[MaxBuckets];
    private long _bucketSamples;
    private int _count;
    private long _filled;

    /// <summary>Creates a builder.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="expectedSamples">Expected capture length (an estimate is fine), to choose the first bucket length.</param>
    public EnvelopeBuilder(double sampleRateHz, long expectedSamples)
    {
        _sampleRateHz = sampleRateHz;
        _bucketSamples = 1;
        // Bounded: an absurd expected length (a header's claim) must not double the bucket into an overflow.
        while (_bucketSamples * MaxBuckets < expectedSamples && _bucketSamples < (1L << 40))
        {
            _bucketSamples *= 2;
        }
    }

    /// <summary>Adds consecutive samples, amperes.</summary>
    public void Push(ReadOnlySpan<double> samplesA)
    {
        while (samplesA.Length > 0)
        {
            if (_filled == 0)
            {
                if (_count == MaxBuckets)
                {
                    MergePairs();
                }

                _min[_count] = double.PositiveInfinity;
                _max[_count] = double.NegativeInfinity;
                _count++;
            }

            var take = (int)Math.Min(samplesA.Length, _bucketSamples - _filled);
            var (lo, hi) = SampleMath.MinMax(samplesA[..take]);
            var b = _count - 1;
            _min[b] = Math.Min(_min[b], lo);
            _max[b] = Math.Max(_max[b], hi);
            _filled += take;
            if (_filled == _bucketSamples)
            {
                _filled = 0;
            }

            samplesA = samplesA[take..];
        }
    }

    /// <summary>The envelope so far.</summary>
    public EnvelopeResult Result() =>
        new(_bucketSamples / _sampleRateHz, _min.AsSpan(0, _count).ToArray(), _max.AsSpan(0, _count).ToArray());

    private void MergePairs()
    {
        var half = _count / 2;
        for (var i = 0; i < half; i++)
        {
            _min[i] = Math.Min(_min[2 * i], _min[(2 * i) + 1]);
            _max[i] = Math.Max(_max[2 * i], _max[(2 * i) + 1]);
        }

        _count = half;
        _bucketSamples *= 2;
    }
}
