using WaveCheck.Core.Capture;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Synthesis;

public class SynthCaptureSourceTests
{
    private const double RateHz = 50_000;

    private static double[] Render(IReadOnlyList<WaveformComponent> parts, double durationS, int blockSize = 65536, double? clipA = null)
    {
        using var source = new SynthCaptureSource(parts, RateHz, durationS, clipA: clipA);
        var block = source.CreateBlock(blockSize);
        var samples = new List<double>();
        while (source.Read(block))
        {
            samples.AddRange(block.ResidualA.ToArray());
        }

        return [.. samples];
    }

    private static (double Mean, double Rms) Moments(double[] x)
    {
        double sum = 0, sumSq = 0;
        foreach (var v in x)
        {
            sum += v;
            sumSq += v * v;
        }

        return (sum / x.Length, Math.Sqrt(sumSq / x.Length));
    }

    [Fact]
    public void Sine_has_the_stated_rms_and_no_mean()
    {
        // Closed form: a sine's RMS is its peak / √2 and its mean over whole cycles is 0.
        var x = Render([new SineComponent(0.030, 50)], 1.0);
        var (mean, rms) = Moments(x);
        Assert.Equal(0.030, rms, 1e-9);
        Assert.Equal(0.0, mean, 1e-9);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(90.0)]
    [InlineData(135.0)]
    public void Phase_controlled_half_wave_matches_rectifier_closed_forms(double alphaDeg)
    {
        // Textbook rectifier analysis (REFERENCE.md, closed forms): mean Ipk(1+cos α)/(2π),
        // RMS² = Ipk²((π−α)/2 + sin 2α/4)/(2π). 1000 samples per cycle: the sum of samples differs from the
        // integral by at most one sample of the conduction step, Ipk·sin α / 1000 per cycle, plus 0.2 % of reading.
        const double peak = 0.030;
        var x = Render([new HalfWaveComponent(peak, 50, alphaDeg)], 1.0);
        var (mean, rms) = Moments(x);
        var a = alphaDeg * Math.PI / 180;
        var expectedMean = peak * (1 + Math.Cos(a)) / (2 * Math.PI);
        var expectedRms = Math.Sqrt(peak * peak * ((Math.PI - a) / 2 + Math.Sin(2 * a) / 4) / (2 * Math.PI));
        var step = peak * Math.Sin(a) / 1000;
        Assert.Equal(expectedMean, mean, expectedMean * 2e-3 + step);
        Assert.Equal(expectedRms * expectedRms, rms * rms, expectedRms * expectedRms * 2e-3 + step * peak);
    }

    [Fact]
    public void Half_wave_on_smooth_dc_has_the_worked_example_mean()
    {
        // Worked example of the analysis issue: 30 mA peak half-wave on 8 mA smooth DC: mean = 8 + 30/π ≈ 17.55 mA
        // (closed form: half-wave mean Ipk/π).
        var x = Render([new HalfWaveComponent(0.030, 50), new SmoothDcComponent(0.008)], 1.0);
        Assert.Equal(0.008 + 0.030 / Math.PI, Moments(x).Mean, 1e-5);
        Assert.Equal(0.008, x.Min(), 1e-12);
    }

    [Fact]
    public void Six_pulse_bridge_has_its_mean_and_ripple()
    {
        // Closed form of the six-pulse bridge: mean = (3/π)·peak; minimum = peak·cos 30°.
        var x = Render([new SixPulseComponent(0.020, 50)], 1.0);
        var peak = 0.020 * Math.PI / 3;
        Assert.Equal(0.020, Moments(x).Mean, 0.020 * 1e-3);
        Assert.Equal(peak, x.Max(), peak * 1e-4);
        Assert.Equal(peak * Math.Cos(Math.PI / 6), x.Min(), peak * 1e-3);
    }

    [Fact]
    public void Noise_has_its_rms_and_does_not_depend_on_block_size()
    {
        // Property: a Gaussian of σ = 1 mA has RMS 1 mA; 50 000 samples give a relative standard error ≈ 0.3 %,
        // so 2 % is more than six standard errors.
        var a = Render([new NoiseComponent(0.001, 7)], 1.0, blockSize: 65536);
        var b = Render([new NoiseComponent(0.001, 7)], 1.0, blockSize: 999);
        Assert.Equal(0.001, Moments(a).Rms, 0.001 * 0.02);
        Assert.Equal(a, b);
    }

    [Fact]
    public void Clipping_limits_the_sum_at_full_scale()
    {
        var x = Render([new SineComponent(0.030, 50)], 0.2, clipA: 0.030);
        Assert.Equal(0.030, x.Max(), 1e-12);
        Assert.Equal(-0.030, x.Min(), 1e-12);
    }

    [Fact]
    public void Composite_preset_splits_rms_equally_over_three_frequencies()
    {
        // Parseval (orthogonal components add in quadrature): three sines of rms/√3 each give the stated total RMS.
        var parts = SynthesisSpec.Parse("composite:rms=21mA,motor=10Hz", 50);
        Assert.Equal(3, parts.Count);
        var x = Render(parts, 1.0);
        Assert.Equal(0.021, Moments(x).Rms, 0.021 * 1e-3);
    }

    [Theory]
    [InlineData("triangle:rms=1mA", "a kind among")]
    [InlineData("dc:level=eight", "a current")]
    [InlineData("halfwave:peak=30mA,polarity=up", "pos or neg")]
    [InlineData("dc:volume=3", "keys of 'dc'")]
    // One rule for units (issue 14): a part's current or frequency without its unit is refused with a suggestion.
    [InlineData("sine:rms=30", "did you mean 30mA?")]
    [InlineData("sine:rms=30mA,freq=150", "did you mean 150Hz?")]
    [InlineData("dc:8", "did you mean 8mA?")]
    public void Bad_descriptions_name_what_is_expected(string text, string expected)
    {
        var ex = Assert.Throws<OptionValueException>(() => SynthesisSpec.Parse(text, 50));
        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
    }
}
