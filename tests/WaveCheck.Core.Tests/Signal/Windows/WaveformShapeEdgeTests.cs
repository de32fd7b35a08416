using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// The edges of <see cref="WaveformShape"/>'s rules: the flat-window test, the floor band's median against an exact
/// sort, the dwell gate and the 150° rest at their exact limits, the circular rest and its bridged gaps, and the
/// delay angle's limits (r range, start count, hysteresis). Windows are built sample by sample so that counts are
/// exact: a "pulse" is 5 mA + 15 mA·sin over its samples (a step, then a rounded top: it dwells near its peak about a
/// third of its length, so it never rests there), a rest is 0.
/// </summary>
public class WaveformShapeEdgeTests
{
    private const double PulseBaseA = 0.005;
    private const double PulseSwingA = 0.015;

    private static ShapeFigures Measure(double[] samplesA, int cycles, double restBandA = WaveformShape.DefaultRestBandA)
    {
        // The caller's contract: the window's mean, minimum and maximum as the analysis gives them (SampleMath.Moments).
        var (sum, _, min, max) = SampleMath.Moments(samplesA);
        return new WaveformShape(restBandA).Measure(samplesA, cycles, sum / samplesA.Length, min, max);
    }

    private static double Mean(double[] samplesA) => SampleMath.Moments(samplesA).Sum / samplesA.Length;

    private static double[] Pulse(int samples)
    {
        var pulse = new double[samples];
        for (var k = 0; k < samples; k++)
        {
            pulse[k] = PulseBaseA + (PulseSwingA * Math.Sin(Math.PI * (k + 0.5) / samples));
        }

        return pulse;
    }

    private static double[] Level(double levelA, int samples) => Enumerable.Repeat(levelA, samples).ToArray();

    /// <summary>The pieces, concatenated, repeated for each cycle; times <paramref name="sign"/>.</summary>
    private static double[] Window(int cycles, double sign, params double[][] pieces)
    {
        var cycle = pieces.SelectMany(p => p).ToArray();
        var window = new double[cycles * cycle.Length];
        for (var c = 0; c < cycles; c++)
        {
            for (var k = 0; k < cycle.Length; k++)
            {
                window[(c * cycle.Length) + k] = sign * cycle[k];
            }
        }

        return window;
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-0.002)]
    public void BandThatIsNotPositiveIsRefused(double restBandA)
    {
        // Documented contract of the constructor: the floor band's width must be > 0.
        Assert.Throws<ArgumentOutOfRangeException>(() => new WaveformShape(restBandA));
    }

    [Fact]
    public void AllZeroAndOneSampleWindowsAreNotPulsatingAndNaNFree()
    {
        // Edge-case policy (WaveformShape: fewer than 4 samples or no range are not measured): smooth DC = the mean
        // given, no angle, no NaN.
        var zero = Measure(new double[1000], 10);
        Assert.Equal(new ShapeFigures(0, false, null), zero);
        var one = new WaveformShape().Measure([0.003], 1, 0.003, 0.003, 0.003);
        Assert.Equal(new ShapeFigures(0.003, false, null), one);
    }

    [Fact]
    public void ThreeSamplesAreNotMeasuredFourAre()
    {
        // Edge of the "n < 4" rule. With a band narrower than a histogram bin (1 nA, 1 µA), [0, 0, 30 mA] would rest
        // two thirds of its one cycle at 0 and [0, 0, 10 mA, 20 mA] rests half (180°) of it: by the definition of
        // pulsating DC the second is pulsating with smooth DC 0 (its floor samples are exactly 0); the first, under
        // four samples, is reported as its mean (closed form: 10 mA).
        double[] threeA = [0, 0, 0.030];
        Assert.Equal(0.010, Mean(threeA), 1e-15);
        Assert.Equal(new ShapeFigures(Mean(threeA), false, null), Measure(threeA, 1, restBandA: 1e-9));
        var four = Measure([0, 0, 0.010, 0.020], 1, restBandA: 1e-6);
        Assert.True(four.PulsatingDc);
        Assert.Equal(0, four.SmoothDcA);
    }

    [Theory]
    [InlineData(1.5e-9, false)]
    [InlineData(3e-9, true)]
    public void RangeWithinOnePartPerBillionOfTheLevelIsFlat(double peakA, bool measured)
    {
        // The flat rule: range ≤ 1 pA + 1e-9·max(|min|, |max|) is rounding of a constant. On 2 A that is 2.001 nA:
        // a 1.5 nA half-wave is flat (smooth DC = its mean), a 3 nA one is measured and, with a band of 0.1 pA,
        // is pulsating DC on its 2 A floor (the rest samples are exactly 2 A). Closed form of the half-wave as in
        // WaveformShapeTests; 1000 samples per cycle, 10 cycles.
        var window = Window(10, 1, Enumerable.Range(0, 1000)
            .Select(k => 2.0 + (k < 500 ? peakA * Math.Sin(Math.PI * k / 500) : 0)).ToArray());
        var shape = Measure(window, 10, restBandA: 1e-13);
        Assert.Equal(measured, shape.PulsatingDc);
        Assert.Equal(measured ? 2.0 : Mean(window), shape.SmoothDcA);
    }

    [Fact]
    public void RangeExactlyAtTheFlatLimitIsFlat()
    {
        // At the limit itself: with min 0 the limit is R = 1e-12 + 1e-9·R, whose double fixed point is
        // 1.000000001e-12 (iterated in the comment's arithmetic, numpy float64 gives the same). A half-wave of peak
        // exactly R is flat ("range > limit" is strict); the same shape at 2R is pulsating on 0.
        var r = 1e-12;
        for (var k = 0; k < 5; k++)
        {
            r = 1e-12 + (1e-9 * r);
        }

        Assert.Equal(r, 1e-12 + (1e-9 * r));
        foreach (var (peakA, pulsating) in new[] { (r, false), (2 * r, true) })
        {
            var window = Window(10, 1, Enumerable.Range(0, 1000)
                .Select(k => k == 250 ? peakA : k < 500 ? peakA * Math.Sin(Math.PI * k / 500) : 0).ToArray());
            Assert.Equal(peakA, window.Max());
            var shape = Measure(window, 10, restBandA: r / 100);
            Assert.Equal(pulsating, shape.PulsatingDc);
        }
    }

    /// <summary>A cycle of 1003 samples (not a multiple of any vector width) on a spread floor: floor samples
    /// 1 mA·frac(0.618…·m) (deterministic, all distinct), a 400-sample pulse that straddles the cycle's cut (the window
    /// starts in a pulse: samples 0 to 397 and 1001, 1002 of each cycle).</summary>
    private static double[] SpreadFloorWindow(double sign)
    {
        const int cycle = 1003;
        var pulse = Pulse(400);
        var window = new double[10 * cycle];
        for (var m = 0; m < window.Length; m++)
        {
            var p = ((m % cycle) + 2) % cycle;
            var value = p < 400 ? pulse[p] : 0.001 * ((0.6180339887498949 * m) % 1.0);
            window[m] = sign * value;
        }

        return window;
    }

    [Theory]
    [InlineData(1.0)]
    [InlineData(-1.0)]
    public void SmoothDcIsTheFloorBandsMedianToTheRefinedResolution(double sign)
    {
        // Reference: an exact sort. The floor band is every sample within 2 mA of the floor; here the floor samples
        // lie in [0, 1 mA) and the pulses at 5 mA or more, so the band is exactly the floor samples whatever the band's
        // percentile estimate. The measure's median is the band's value at rank (count − 1)/2 rounded down (the lower
        // median), found to the refined resolution range/4096² (class remarks); its fine bin's centre is within half
        // of that of the sample (+1 fA for rounding). Mirrored (sign −1), the band is the ceiling.
        var window = SpreadFloorWindow(sign);
        var band = window.Where(x => Math.Abs(x) < 0.0025).Order().ToArray();
        Assert.Equal(10 * 603, band.Length);
        var expected = band[(band.Length - 1) / 2];
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        var fineWidthA = (window.Max() - window.Min()) / (4096.0 * 4096.0);
        Assert.Equal(expected, shape.SmoothDcA, (0.5 * fineWidthA) + 1e-15);
    }

    [Fact]
    public void AnInstanceForgetsTheWindowBefore()
    {
        // Property of the scratch histograms (the class holds them between calls): measuring a window after other
        // windows gives what a fresh instance gives, and the exact-sort median of the test above.
        var window = SpreadFloorWindow(1);
        var fresh = Measure(window, 10);
        var shape = new WaveformShape();
        foreach (var before in new[] { SpreadFloorWindow(-1), window })
        {
            shape.Measure(before, 10, Mean(before), before.Min(), before.Max());
        }

        var again = shape.Measure(window, 10, Mean(window), window.Min(), window.Max());
        Assert.Equal(fresh, again);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(45)]
    [InlineData(90)]
    [InlineData(135)]
    public void DelayAngleOfNegativePhaseControlledHalfWave(double alphaDeg)
    {
        // Mirror of WaveformShapeTests' closed form (conduction from α to π, mean Ipk(1 + cos α)/(2π)): negative
        // pulses hang from a 0 ceiling; angle within 0.5° (0.36° per sample).
        var alpha = alphaDeg * Math.PI / 180;
        var window = Synth.Make(50_000, 0.2, t => -Synth.PhaseCut(t, 50, 0.030, alpha));
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0, shape.SmoothDcA, 1e-9);
        Assert.NotNull(shape.CurrentDelayAngleDeg);
        Assert.Equal(alphaDeg, shape.CurrentDelayAngleDeg!.Value, 0.5);
    }

    [Fact]
    public void PulseFatterThanAHalfSineHasNoDelayAngle()
    {
        // A trapezoid of 180° (ramps of 60°, top of 60°) resting 180°: r = mean/height = 1/3 (closed form: area
        // (30 + 60 + 30)/360), above a half-wave's 1/π by more than the 2 % allowed (r ≤ 1.02/π): no phase-cut sine
        // has this shape, so no angle; it is still pulsating DC on 0. Its conducting share (about 1/2) would match an
        // angle of 0°, so only the r limit rejects it. 1200 samples per cycle.
        var ramp = Enumerable.Range(0, 200).Select(k => 0.100 * (k + 0.5) / 200).ToArray();
        var window = Window(10, 1, ramp, Level(0.100, 200), ramp.Reverse().ToArray(), Level(0, 600));
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0, shape.SmoothDcA);
        Assert.Null(shape.CurrentDelayAngleDeg);
    }

    [Fact]
    public void MeanOnTheFloorHasNoDelayAngle()
    {
        // r = 0: the pulses' charge (30 samples of 2⁻⁵ A per 1000) is balanced by 480 samples of −2⁻⁹ A inside the
        // band, so the mean is exactly the floor 0 (dyadic values: the sums are exact). The closed form
        // r = (1 + cos α)/(2π sin α) reaches 0 only at α = 180°, no conduction; these pulses conduct: no angle.
        var window = Window(10, 1, Level(1.0 / 32, 30), Level(-1.0 / 512, 480), Level(0, 490));
        Assert.Equal(0, Mean(window));
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0, shape.SmoothDcA);
        Assert.Null(shape.CurrentDelayAngleDeg);
    }

    [Fact]
    public void ConductingShareFarFromThePhaseCutsHasNoDelayAngle()
    {
        // A 90° rectangle every cycle: r = 1/4, so the closed form gives α = acos(2π/4 − 1) ≈ 55.2° and an expected
        // conducting share (π − α − asin 0.02)/(2π) ≈ 0.344; the rectangle conducts 0.25, off by more than 0.05.
        // One start per cycle, so only the share rejects it.
        var window = Window(10, 1, Level(0.020, 250), Level(0, 750));
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        Assert.Null(shape.CurrentDelayAngleDeg);
    }

    [Theory]
    [InlineData(0.05, true)]
    [InlineData(0.0, false)]
    public void ConductionStartsHaveHysteresis(double notchShare, bool angle)
    {
        // Half-wave at α = 90° (closed form as above), 30 mA, with a two-sample notch at 135° down to a share of the
        // height. To 5 %: above the 2 % conduction level, below the 10 % start level, one start per cycle, angle
        // 90° (within 1°: the notch takes about 2·21 mA / 1000 from the mean, Δr ≈ 0.0014, Δα ≈ 2π·Δr rad ≈ 0.5°).
        // To 0: a second start in every cycle, 20 against 10, more than the cycles/4 allowed: no angle.
        var window = Synth.Make(50_000, 0.2, t => Synth.PhaseCut(t, 50, 0.030, Math.PI / 2));
        for (var c = 0; c < 10; c++)
        {
            window[(c * 1000) + 375] = notchShare * 0.030;
            window[(c * 1000) + 376] = notchShare * 0.030;
        }

        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        if (angle)
        {
            Assert.NotNull(shape.CurrentDelayAngleDeg);
            Assert.Equal(90, shape.CurrentDelayAngleDeg!.Value, 1.0);
        }
        else
        {
            Assert.Null(shape.CurrentDelayAngleDeg);
        }
    }

    [Fact]
    public void PulseCutByTheWindowIsCountedOnce()
    {
        // The start count takes the window as circular: a window starting and ending inside a pulse holds that
        // pulse's start once. Three cycles of a 30 mA half-wave at α = 90° on −20 mA smooth DC, from 120° (inside a
        // pulse), declared as two cycles (a window one cycle longer than its count: one start too many is allowed,
        // max(1, cycles/4)): three starts, angle 90° within 0.5°. Counting the cut pulse as a fourth would reject it.
        var window = Synth.Make(50_000, 0.06, t => -0.020 + Synth.PhaseCut(t + (120.0 / 360 / 50), 50, 0.030, Math.PI / 2));
        var shape = Measure(window, 2);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(-0.020, shape.SmoothDcA, 1e-9);
        Assert.NotNull(shape.CurrentDelayAngleDeg);
        Assert.Equal(90, shape.CurrentDelayAngleDeg!.Value, 0.5);
    }

    [Fact]
    public void RestAcrossTheWindowsCutCountsWhole()
    {
        // Definition (class remarks): a rest that spans the cycle's cut counts whole. A rest of 444 samples of 1000
        // (159.8°) split 222 + 222 by the window's start is one rest ≥ 150°: pulsating; 222 alone is not.
        var window = Window(10, 1, Level(0, 222), Pulse(556), Level(0, 222));
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0, shape.SmoothDcA);
    }

    [Fact]
    public void TwoRestsOfNinetyDegreesAreNotOne()
    {
        // Full-wave phase control cut at a conduction start: pulse, rest 90°, pulse, rest 90° in each cycle. The rest
        // at the end of the cycle must not be joined to the one in its middle (the cycle began in a pulse): no single
        // rest of 150° (IEC 61008-1 definition, from memory), not pulsating, smooth DC = mean.
        var window = Window(10, 1, Pulse(250), Level(0, 250), Pulse(250), Level(0, 250));
        var shape = Measure(window, 10);
        Assert.False(shape.PulsatingDc);
        Assert.Equal(Mean(window), shape.SmoothDcA);
    }

    [Theory]
    [InlineData(10, true)]
    [InlineData(11, false)]
    public void GapsUpToOnePercentOfTheCycleAreBridged(int gapSamples, bool pulsating)
    {
        // RestGapShare: an excursion of up to 1 % of the cycle (10 of 1000 samples) out of the band is part of the
        // rest. Two rests of 222 samples (79.9°) around a 20 mA spike: bridged they are 454 samples ≥ 150°; a spike of
        // 11 samples splits them into two rests under 150°. The samples in the band are 444 either way (≥ 150°).
        var window = Window(10, 1, Pulse(556 - gapSamples), Level(0, 222), Level(0.020, gapSamples), Level(0, 222));
        Assert.Equal(pulsating, Measure(window, 10).PulsatingDc);
    }

    [Fact]
    public void CycleWithoutAPulseRestsWhole()
    {
        // A missed firing: one of ten half-wave cycles has no pulse. That cycle rests its whole 360° (≥ 150°), so the
        // window stays pulsating DC on its 0 floor.
        var window = Window(10, 1, Pulse(500), Level(0, 500));
        Array.Clear(window, 4000, 500);
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0, shape.SmoothDcA);
    }

    [Theory]
    [InlineData(500, 1.0, true)]
    [InlineData(499, 1.0, false)]
    [InlineData(500, -1.0, true)]
    [InlineData(499, -1.0, false)]
    public void RestOfExactlyOneHundredFiftyDegreesCounts(int restSamples, double sign, bool pulsating)
    {
        // IEC 61008-1 definition (from memory): "a single interval of at least 150°". 1200 samples per cycle (0.3°):
        // 500 samples are exactly 150° (5000/12000 and 150/360 round to the same double), 499 are 149.7°. Both
        // polarities.
        var window = Window(10, sign, Pulse(1200 - restSamples), Level(0, restSamples));
        Assert.Equal(pulsating, Measure(window, 10).PulsatingDc);
    }

    [Theory]
    [InlineData(499, 1.0, true)]
    [InlineData(500, 1.0, false)]
    [InlineData(499, -1.0, true)]
    [InlineData(500, -1.0, false)]
    public void RestingAtLeastOneHundredFiftyDegreesAtTheTopToo(int topSamples, double sign, bool pulsating)
    {
        // Class remarks: a current resting that long at both extremes is not pulsating. Steps: floor 0 for the rest
        // of the cycle (≥ 162.6°), 10 mA for 50 samples, 20 mA for the top; 1200 samples per cycle. A top of 150°
        // (500 samples) rests at both extremes: not pulsating; 149.7° does not: pulsating. Both polarities.
        var window = Window(10, sign, Level(0, 1150 - topSamples), Level(0.010, 50), Level(0.020, topSamples));
        var shape = Measure(window, 10);
        Assert.Equal(pulsating, shape.PulsatingDc);
        Assert.Equal(pulsating ? 0 : Mean(window), shape.SmoothDcA);
    }

    [Theory]
    [InlineData(455, 1.0, false)]
    [InlineData(445, 1.0, true)]
    [InlineData(455, -1.0, false)]
    [InlineData(445, -1.0, true)]
    public void FloorMustRestThirtyDegreesLongerThanTheTop(int topSamples, double sign, bool pulsating)
    {
        // RestContrastDeg: the floor side must dwell 30° more than the other extreme. Floor 550 samples (165°), top
        // 455 (136.5°: 28.5° less) fails, 445 (133.5°: 31.5° less) passes; 1200 samples per cycle, both polarities.
        var window = Window(10, sign, Level(0, 550), Level(0.010, 650 - topSamples), Level(0.020, topSamples));
        Assert.Equal(pulsating, Measure(window, 10).PulsatingDc);
    }

    [Fact]
    public void SineSmallerThanTheBandIsNotPulsating()
    {
        // Class remarks: a current whose whole range is within the band rests at both extremes. A 1.5 mA peak sine
        // (range 3 mA, band 2 mA) rests about equally at both: not pulsating, smooth DC = mean (0 within 1e-9).
        var window = Synth.Make(50_000, 0.2, t => 0.0015 * Math.Sin(2 * Math.PI * 50 * t));
        var shape = Measure(window, 10);
        Assert.False(shape.PulsatingDc);
        Assert.Equal(Mean(window), shape.SmoothDcA);
    }

    [Fact]
    public void DipsBelowTheFloorUnderTwoPercentDoNotMoveIt()
    {
        // The band starts at the 2nd percentile, not at the minimum: 1 % of the samples (10 per cycle) dipping to
        // −5 mA inside the rest leave numpy.percentile(x, 2) (linear, index 0.02(n − 1)) at the 0 floor, so the
        // half-wave stays pulsating on 0 (the band's median is 0: the dips are 100 of its 5000 samples, all below it).
        var window = Window(10, 1, Pulse(500), Level(0, 245), Level(-0.005, 10), Level(0, 245));
        var shape = Measure(window, 10);
        Assert.True(shape.PulsatingDc);
        Assert.Equal(0, shape.SmoothDcA);
    }

    [Theory]
    [InlineData(20, true)]
    [InlineData(21, false)]
    public void SpikesBeyondANegativeCeilingAtTheNinetyEighthPercentile(int spikesPerCycle, bool pulsating)
    {
        // The band of a negative window ends at the 98th percentile. numpy.percentile(x, 98) (linear, index
        // 0.98(n − 1) = 9799.02 of 10000): with 200 samples at +5 mA above the 0 ceiling it is 0.02 of the way from 0
        // to 5 mA (0.1 mA), so the ceiling is in the band and the negative half-wave is pulsating; with 210 it is
        // 5 mA and the band holds only the spikes (2.1 %): not pulsating.
        var window = Window(10, 1, Pulse(500).Select(x => -x).ToArray(), Level(0, 250 - spikesPerCycle),
            Level(0.005, spikesPerCycle), Level(0, 250));
        Assert.Equal(pulsating, Measure(window, 10).PulsatingDc);
    }
}
