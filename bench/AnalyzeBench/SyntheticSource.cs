using System.Diagnostics;
using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;

namespace WaveCheck.AnalyzeBench;

/// <summary>A phase-controlled half-wave at 49.95 Hz on 4 mA smooth DC, a 16 kHz switching tone and noise: 20 s
/// (999 whole cycles) computed once and repeated, so generating costs a copy and the timing is the engine's.</summary>
internal sealed class SyntheticSource(long total, double rate) : ICaptureSource
{
    private readonly double[] _period = Period(rate);
    private long _position;

    private static double[] Period(double rate)
    {
        var random = new Random(1);
        var samples = new double[(int)(20 * rate)];
        for (var i = 0; i < samples.Length; i++)
        {
            var t = i / rate;
            var theta = 2 * Math.PI * 49.95 * t % (2 * Math.PI);
            samples[i] = 0.004 + (theta >= 1.2 && theta < Math.PI ? 0.03 * Math.Sin(theta) : 0)
                + (0.002 * Math.Sin(2 * Math.PI * 16_000 * t)) + (0.0002 * (random.NextDouble() - 0.5));
        }

        return samples;
    }

    public CaptureInfo Info { get; } = new MemoryCaptureSource([0.0], rate, SensorCoupling.Dc, "synthetic").Info with
    {
        SampleCount = total,
    };

    public IReadOnlyList<CaptureWarning> Warnings { get; } = [];

    public CaptureBlock CreateBlock(int capacity = 65536) => new(1, capacity, rate);

    public bool Read(CaptureBlock block)
    {
        var count = (int)Math.Min(block.Capacity, total - _position);
        block.StartSample = _position;
        block.Length = Math.Max(0, count);
        var buffer = block.ResidualBuffer;
        for (var i = 0; i < count;)
        {
            var at = (int)((_position + i) % _period.Length);
            var take = Math.Min(count - i, _period.Length - at);
            _period.AsSpan(at, take).CopyTo(buffer[i..]);
            i += take;
        }

        _position += Math.Max(0, count);
        return count > 0;
    }

    public void Dispose()
    {
    }
}
