using WaveCheck.Core.Capture;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Synthesis;

public class SurgeComponentTests
{
    [Fact]
    public void A_surge_is_a_sine_between_its_switching_instants_and_zero_outside()
    {
        // Closed form: √2·RMS·sin(2π f t) for round(t0·fs) ≤ n < round((t0 + d)·fs), else 0; 10 kS/s, 30 mA at 50 Hz
        // from 0.1 s for 40 ms: samples 1000 to 1399.
        var surge = new SurgeComponent(0.030, 50, 0.1, 0.04);
        var buffer = new double[3000];
        surge.AddTo(0, 10_000, buffer);
        for (var n = 0; n < buffer.Length; n++)
        {
            var expected = n is >= 1000 and < 1400 ? 0.030 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * n / 10_000.0) : 0;
            Assert.Equal(expected, buffer[n], 1e-12);
        }
    }

    [Fact]
    public void Block_boundaries_do_not_move_the_surge_and_the_decay_is_exponential()
    {
        // The same samples in blocks of 7 as in one block; with τ = 20 ms the envelope after 20 ms is e⁻¹ of the start
        // (closed form of the exponential), checked on the peaks of the 50 Hz sine (a quarter period after 0.1 s).
        var surge = new SurgeComponent(0.030, 50, 0.1, 0.2, DecayS: 0.02);
        var whole = new double[4000];
        surge.AddTo(0, 10_000, whole);
        var pieces = new double[4000];
        for (var start = 0; start < pieces.Length; start += 7)
        {
            surge.AddTo(start, 10_000, pieces.AsSpan(start, Math.Min(7, pieces.Length - start)));
        }

        Assert.Equal(whole, pieces);
        var peakAt = whole[1050]; // 0.105 s: sin = 1, 5 ms into the surge
        var later = whole[1250]; // 0.125 s: sin = 1, 25 ms in
        Assert.Equal(Math.Exp(-0.020 / 0.02), later / peakAt, 1e-9);
        Assert.Equal(0.030 * Math.Sqrt(2) * Math.Exp(-0.005 / 0.02), peakAt, 1e-12);
    }

    [Fact]
    public void The_spec_reads_a_surge_with_times_in_seconds_or_milliseconds()
    {
        var surge = Assert.IsType<SurgeComponent>(Assert.Single(SynthesisSpec.Parse("surge:rms=40mA,start=2s,duration=120ms,decay=50ms", 60)));
        Assert.Equal("surge 40 mA rms at 60 Hz from 2 s for 120 ms, decay 50 ms", surge.Describe());
        var error = Assert.Throws<OptionValueException>(() => SynthesisSpec.Parse("surge:duration=-3ms", 50));
        Assert.Contains("a time of 0 or more", error.Message, StringComparison.Ordinal);
    }
}
