using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WaveformShapeTests
{
    private const double Fs = 50_000;
    private const double F = 50;

    private static (ShapeFigures Shape, double Mean) Measure(Func<double, double> valueAt)
    {
        var window = Synth.Make(Fs, 0.2, valueAt);
        var (sum, _, min, max) = SampleMath.Moments(window);
        var mean = sum / window.Length;
        return (new WaveformShape().Measure(window, 10, mean, min, max), mean);
    }

    [Fact]
    public void HalfWaveOnSmoothDcHasItsFloorAsSmoothDc()
    {
        // Worked example, closed form: 30 mA peak half-wave (mean Ipk/π) on 8 mA smooth DC: mean 8 + 30/π ≈ 17.55 mA,
        // smooth DC 8 mA. 0.2 % of reading (the brief's accuracy target).
        var (shape, mean) = Measure(t => 0.008 + Synth.PhaseCut(t, F, 0.030, 0));
        Assert.Equal(0.008 + (0.030 / Math.PI), mean, 0.002 * mean);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0.008, shape.SmoothDcA, 0.002 * 0.008);
    }

    [Fact]
    public void NoisyHalfWaveKeepsItsFloorAndAngle()
    {
        // Worked example with 0.2 mA rms Gaussian noise: smooth DC 8 mA within 1 % (the floor band's median is
        // unbiased by symmetric noise; 1 % covers the edge samples the band takes in), delay angle 90° within 2°.
        var random = new Random(8);
        var (shape, _) = Measure(t => 0.008 + Synth.PhaseCut(t, F, 0.030, Math.PI / 2) + (0.0002 * Synth.Gaussian(random)));
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0.008, shape.SmoothDcA, 0.01 * 0.008);
        Assert.NotNull(shape.CurrentDelayAngleDeg);
        Assert.Equal(90, shape.CurrentDelayAngleDeg!.Value, 2.0);
    }

    [Fact]
    public void NegativeHalfWaveRidesOnItsCeiling()
    {
        // Mirror of the worked example (closed form): −30 mA half-wave on −8 mA: smooth DC −8 mA.
        var (shape, _) = Measure(t => -0.008 - Synth.PhaseCut(t, F, 0.030, 0));
        Assert.True(shape.PulsatingDc);
        Assert.Equal(-0.008, shape.SmoothDcA, 0.002 * 0.008);
    }

    [Fact]
    public void SineWithOffsetIsNotPulsatingAndItsSmoothDcIsTheMean()
    {
        // Closed form: 20 mA DC + 10 mA peak sine is unipolar but never rests at a floor: smooth DC = mean = 20 mA.
        var (shape, mean) = Measure(t => 0.020 + (0.010 * Math.Sin(2 * Math.PI * F * t)));
        Assert.False(shape.PulsatingDc);
        Assert.Null(shape.CurrentDelayAngleDeg);
        Assert.Equal(0.020, shape.SmoothDcA, 0.002 * 0.020);
        Assert.Equal(mean, shape.SmoothDcA, 1e-12);
    }

    [Fact]
    public void PureDcAndSquareWaveAreNotPulsating()
    {
        // Definitions in WaveformShape: a flat window has smooth DC = its value; a ±5 mA square wave rests at both
        // extremes, so it is AC, smooth DC = mean = 0.
        var (flat, _) = Measure(_ => 0.004);
        Assert.False(flat.PulsatingDc);
        Assert.Equal(0.004, flat.SmoothDcA, 1e-12);
        var (square, mean) = Measure(t => (t * F % 1) < 0.5 ? 0.005 : -0.005);
        Assert.False(square.PulsatingDc);
        Assert.Equal(mean, square.SmoothDcA, 1e-12);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(45)]
    [InlineData(90)]
    [InlineData(135)]
    public void DelayAngleOfPhaseControlledHalfWave(double alphaDeg)
    {
        // Closed form: conduction from α to π; mean Ipk(1 + cos α)/(2π). Angle within 0.5° (1000 samples per cycle:
        // 0.36° per sample). The mean is checked within 0.2 % plus one sample of the firing step per cycle
        // (Ipk·sin α/1000): sampling a step that falls on a sample instant counts that sample fully.
        var alpha = alphaDeg * Math.PI / 180;
        var (shape, mean) = Measure(t => Synth.PhaseCut(t, F, 0.030, alpha));
        Assert.Equal(0.030 * (1 + Math.Cos(alpha)) / (2 * Math.PI), mean, (0.002 * mean) + (0.030 * Math.Sin(alpha) / 1000));
        Assert.True(shape.PulsatingDc);
        Assert.NotNull(shape.CurrentDelayAngleDeg);
        Assert.Equal(alphaDeg, shape.CurrentDelayAngleDeg!.Value, 0.5);
        Assert.Equal(0, shape.SmoothDcA, 1e-9);
    }

    [Fact]
    public void FullWavePhaseCutIsNotPulsatingDc()
    {
        // Two conduction intervals per cycle at α = 90° leave two rests of 90°: never the single rest of at least
        // 150° that IEC 61008-1's definition of pulsating DC asks for (from memory; REFERENCE.md). Its mean is DC
        // that does not rest at zero: type B.
        var alpha = Math.PI / 2;
        var (shape, mean) = Measure(t => Synth.PhaseCut(t, F, 0.030, alpha) + Synth.PhaseCut(t + (0.5 / F), F, 0.030, alpha));
        Assert.False(shape.PulsatingDc);
        Assert.Null(shape.CurrentDelayAngleDeg);
        Assert.Equal(mean, shape.SmoothDcA, 1e-12);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(6)]
    public void MultiPulseRectifiedCurrentIsNotPulsatingDcAndItsDcIsItsMean(int pulses)
    {
        // Closed form of the p-pulse rectifier: upper envelope of p sines, mean Ipk·(p/π)·sin(π/p); it never rests
        // at zero for 150° (it touches zero only at instants for p = 2, never for p = 3 or 6), so it is rectified
        // current from two or more phases, not pulsating DC (IEC 61008-1 definition, from memory; IEC 62423 type B).
        // The old flaw read the rounded tops of a three-pulse current as a floor: the smooth DC must be the mean.
        var segment = 2 * Math.PI / pulses;
        var (shape, mean) = Measure(t => 0.010 * Math.Cos((2 * Math.PI * F * t % segment) - (segment / 2)));
        Assert.False(shape.PulsatingDc);
        Assert.Equal(0.010 * (pulses / Math.PI) * Math.Sin(Math.PI / pulses), mean, 1e-5);
        Assert.Equal(mean, shape.SmoothDcA, 1e-12);
    }

    [Theory]
    [InlineData(148, false)]
    [InlineData(152, true)]
    public void RestOfOneHundredFiftyDegreesDecides(double restDeg, bool pulsating)
    {
        // IEC 61008-1 definition (from memory): at rest for a single interval of at least 150° each cycle. A pulse
        // that steps to 5 mA and rounds to 20 mA (a half-sine on a step, so no flat top to mistake for a floor)
        // lasting 360° − rest, resting at zero for the rest: 148° fails, 152° passes (1000 samples per cycle: 0.36°
        // per sample).
        var conductDeg = 360 - restDeg;
        var (shape, _) = Measure(t =>
        {
            var deg = t * F % 1 * 360;
            return deg < conductDeg ? 0.005 + (0.015 * Math.Sin(Math.PI * deg / conductDeg)) : 0;
        });
        Assert.Equal(pulsating, shape.PulsatingDc);
    }
}
