using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="MainsFrequency.Detect"/> on short synthetic captures chosen so that each step decides the outcome: the
/// least stretch searched, the bins searched, the peak-to-median test, the spectrum's window and DC removal, the
/// nominal chosen, the refinement and the thresholds. Hann spectra of tones on bins are worked by hand: a tone on
/// bin m puts its power in bins m (weight ¼ of the amplitude) and m ± 1 (⅛ each, so a quarter of the power) and
/// exactly none elsewhere (closed form of the periodic Hann window, ½ − ½cos(2πi/N)).
/// </summary>
public class MainsFrequencyDetectEdgeTests
{
    private static double[] Tones(double sampleRateHz, double durationS, double dcA,
        params (double FrequencyHz, double PeakA, double PhaseRad)[] tones) =>
        Synth.Make(sampleRateHz, durationS, t =>
        {
            var v = dcA;
            foreach (var (f, a, p) in tones)
            {
                v += a * Math.Sin((2 * Math.PI * f * t) + p);
            }

            return v;
        });

    [Theory]
    [InlineData(2005, 201, false)] // 100 block means of 2 samples at 1002.5 Hz: 0.09975 s
    [InlineData(2005, 202, true)] // 101 of them: 0.10075 s
    [InlineData(10_000, 500, false)] // 0.05 s: 2.5 cycles
    [InlineData(10_000, 1000, true)] // exactly 0.1 s (100 means of 10 samples)
    [InlineData(160, 16, true)] // 16 samples at 160 Hz: the least count, 0.1 s
    [InlineData(10_000, 1110, false)] // 0.111 s: bins every 9.009 Hz, none within ±5 % of 50 or 60 Hz
    public void NeedsATenthOfASecondOfBlockMeansAndABinInTheBand(double sampleRateHz, int count, bool found)
    {
        // Contract of Detect: the spectrum is taken of block means at 1 to 2 kHz over at least 0.1 s (16 values at
        // least), and searched only in the bins within ±5 % of 50 and 60 Hz. A 10 mA, 50 Hz sine. Closed form of the
        // bins: resolution = rate/count, so 0.1 s gives 10 Hz bins (bin 5 = 50 Hz, bin 6 = 60 Hz) and 0.111 s gives
        // 9.009 Hz bins (45.0, 54.0, 63.1 Hz: none within 47.5…52.5 or 57…63 Hz).
        var x = Tones(sampleRateHz, count / sampleRateHz, 0, (50, 0.01, 0.3));
        var detection = MainsFrequency.Detect(x, sampleRateHz, null);
        Assert.Equal(found, detection.Found);
        Assert.Equal(50, detection.NominalHz);
        // 50 Hz to 0.02 Hz (at 160 Hz over 0.1 s the phase method reads 49.983 Hz: numpy 1.24, the same sums).
        Assert.Equal(50, detection.FrequencyHz, 0.02);
    }

    [Fact]
    public void FindsFiftyHertzSampledJustAboveTwiceMains()
    {
        // 110 Hz sampling for 1 s: bins 0…55 (1 Hz each), the 60 Hz band lies above Nyquist (55 Hz) and must not be
        // read. Closed form: the 50 Hz sine sits on bin 50; the phase method over 25 cycles returns 50 Hz.
        var x = Tones(110, 1, 0, (50, 0.01, 0.3));
        var detection = MainsFrequency.Detect(x, 110, null);
        Assert.True(detection.Found);
        Assert.Equal(50, detection.NominalHz);
        Assert.Equal(50, detection.FrequencyHz, 1e-6);
        Assert.Equal(0.01 / Math.Sqrt(2), detection.FundamentalRmsA, 0.01 / Math.Sqrt(2) * 1e-3);
    }

    [Theory]
    // 70 Hz at 10 % of the power (bins 13, 14, 15 = ¼, 1, ¼ of it): values of bins 7, 13, 14 = 0, 2.5 %, 10 %;
    // median 2.5 % of the peak, ratio 40 < 100: not found.
    [InlineData(null, 50, 70, 0.1, 0, 0, false)]
    // The same at 2 %: median 0.5 %, ratio 200: found.
    [InlineData(null, 50, 70, 0.02, 0, 0, true)]
    // 35 Hz and 70 Hz at 2 % each: bins 7, 13, 14 = 2 %, 0.5 %, 2 %; median (sorted) 2 %, ratio 50: not found.
    [InlineData(null, 50, 70, 0.02, 35, 0.02, false)]
    // 65 Hz at 2 % (bins 12, 13, 14 = 0.5 %, 2 %, 0.5 %): values 0, 2 %, 0.5 %; median 0.5 %, ratio 200: found.
    [InlineData(null, 50, 65, 0.02, 0, 0, true)]
    // Given 60 Hz: the median range is 42…78 Hz (bins 8…15, less 10…14); 35 Hz at 10 % puts only a quarter of it in
    // bin 8: values 2.5 %, 0, 0; median 0: found.
    [InlineData(60.0, 60, 35, 0.1, 0, 0, true)]
    public void NeedsAPeakAHundredTimesTheMedianBinAround(double? givenHz, double mainsHz, double otherHz,
        double otherPowerShare, double thirdHz, double thirdPowerShare, bool found)
    {
        // MinPeakToMedianPower = 100 (engineering choice); median of the bins within 0.7…1.3 times 55 Hz (or the given
        // frequency), less the peak and two bins either side. 0.2 s at 1 kHz: bins every 5 Hz, 55 Hz → bins 7…14;
        // every tone on a bin, so the powers are the closed-form Hann weights (class comment). The peak is a 10 mA
        // mains sine; the others have the given share of its power (amplitude √share).
        var x = Tones(1000, 0.2, 0, (mainsHz, 0.01, 0.3), (otherHz, 0.01 * Math.Sqrt(otherPowerShare), 1.1),
            (thirdHz, 0.01 * Math.Sqrt(thirdPowerShare), 0.7));
        var detection = MainsFrequency.Detect(x, 1000, givenHz);
        Assert.Equal(found, detection.Found);
        Assert.Equal(mainsHz, detection.NominalHz);
        if (found)
        {
            // Within 0.1 Hz: the other tones, 15 Hz or more away, pull the phase a little over 0.1 s stretches.
            Assert.Equal(mainsHz, detection.FrequencyHz, 0.1);
        }
    }

    [Theory]
    [InlineData(51.25)]
    [InlineData(52.5)]
    public void FindsAToneBetweenBins(double frequencyHz)
    {
        // Closed form: under the Hann window a tone between bins leaks as 1/d³ (d bins away); 52.5 Hz is half a 5 Hz
        // bin off, bins 7, 13, 14 are 3.5 to 6.5 bins away, their power below 1e-5 of the peak's. Without the
        // window (or with it inverted) the leakage falls only as 1/d, 1e-2 of the peak, and the ratio test fails.
        var x = Tones(1000, 0.2, 0, (frequencyHz, 0.01, 0.3));
        var detection = MainsFrequency.Detect(x, 1000, null);
        Assert.True(detection.Found);
        Assert.Equal(50, detection.NominalHz);
        Assert.Equal(frequencyHz, detection.FrequencyHz, 0.01);
    }

    [Fact]
    public void FindsARailwaySupplyOnDc()
    {
        // A 16.7 Hz supply (railway traction, EN 50163's nominal) given: 10 mA on 20 mA DC, 0.12 s at 10 kHz (block
        // means of 10). Bins of 8.33 Hz: the band 15.9…17.5 Hz holds only bin 2, its neighbours are bins 1 and 3.
        // The mean must go before the spectrum: left in, its Hann leakage fills bin 1 and points the interpolation
        // to 8.3 Hz, less than a cycle per half-window. Closed form: 16.7 Hz comes back, within 1e-3 Hz, nominal as
        // given (not the nearer of 50 and 60 Hz).
        var x = Tones(10_000, 0.12, 0.02, (16.7, 0.01, 1.0));
        var detection = MainsFrequency.Detect(x, 10_000, 16.7);
        Assert.True(detection.Found);
        Assert.Equal(16.7, detection.NominalHz);
        Assert.Equal(16.7, detection.FrequencyHz, 1e-3);
        // AC RMS: 10/√2 mA, the DC not in it (two whole cycles, to 0.2 % by the 0.004 cycle over).
        Assert.Equal(0.01 / Math.Sqrt(2), detection.AcRmsA, 0.01 / Math.Sqrt(2) * 2e-3);
    }

    [Fact]
    public void ReportsNoMainsWhenTheInterpolationPointsBelowACycle()
    {
        // Given 16.7 Hz, 0.12 s: a strong 8.35 Hz component (10 mA) fills bin 1 beside a weak 16.7 Hz one (1 mA) in
        // bin 2. The interpolation goes to bin 1 (8.33 Hz), where half the window holds less than one cycle: the phase
        // method cannot run, and Detect reports no mains (it does not throw).
        var x = Tones(1000, 0.12, 0, (8.35, 0.01, 0.3), (16.7, 0.001, 1.0));
        var detection = MainsFrequency.Detect(x, 1000, 16.7);
        Assert.False(detection.Found);
        Assert.Equal(16.7, detection.FrequencyHz);
        Assert.Equal(0, detection.FundamentalRmsA);
    }

    [Theory]
    [InlineData(46.7, 47.5)]
    [InlineData(53.3, 52.5)]
    public void HoldsAToneJustOutsideTheRangeAtItsEdge(double frequencyHz, double edgeHz)
    {
        // 1 s at 1 kHz, 1 Hz bins; the 50 Hz band is bins 48…52. A tone 0.7 Hz beyond the edge bin's neighbour
        // (46.7 or 53.3 Hz) peaks at the edge bin; the Hann interpolation (δ clamped to 1) puts it one bin further
        // out, within the phase method's ±0.97 Hz reach, and each refinement is held at the tracking range's edge,
        // 50 Hz ± 5 % (TrackingRange). Interpolating from the wrong side, or reflected, leaves it 1.3 Hz or more
        // away, the phase wraps, and the estimate lands inside the range instead.
        var x = Tones(1000, 1, 0, (frequencyHz, 0.01, 0.3));
        var detection = MainsFrequency.Detect(x, 1000, null);
        Assert.True(detection.Found);
        Assert.Equal(50, detection.NominalHz);
        Assert.Equal(edgeHz, detection.FrequencyHz, 1e-9);
    }

    [Fact]
    public void LooksOnlyInTheBandsNotAtAStrongerSlowSwing()
    {
        // 2 mA of 50 Hz on a 10 mA swing at 1 Hz (1 s at 1 kHz): bin 1 is the strongest of the spectrum but lies
        // outside both bands; the 50 Hz is found (closed form 2/√2 mA, 50 Hz).
        var x = Tones(1000, 1, 0, (1, 0.01, 0.3), (50, 0.002, 1.0));
        var detection = MainsFrequency.Detect(x, 1000, null);
        Assert.True(detection.Found);
        Assert.Equal(50, detection.NominalHz);
        Assert.Equal(50, detection.FrequencyHz, 1e-3);
        Assert.Equal(0.002 / Math.Sqrt(2), detection.FundamentalRmsA, 0.002 / Math.Sqrt(2) * 0.01);
    }

    [Theory]
    [InlineData(null)]
    [InlineData(50.0)]
    public void LooksOnlyInTheBandsNotAtAStrongerHarmonic(double? givenHz)
    {
        // 2 mA of 50 Hz under a 10 mA third harmonic (0.5 s at 1 kHz): 150 Hz is above the 50 Hz band; the 50 Hz is
        // found (closed form 50 Hz, 2/√2 mA).
        var x = Tones(1000, 0.5, 0, (150, 0.01, 0.3), (50, 0.002, 1.0));
        var detection = MainsFrequency.Detect(x, 1000, givenHz);
        Assert.True(detection.Found);
        Assert.Equal(50, detection.FrequencyHz, 1e-3);
        Assert.Equal(0.002 / Math.Sqrt(2), detection.FundamentalRmsA, 0.002 / Math.Sqrt(2) * 0.01);
    }

    [Fact]
    public void LooksOnlyNearTheGivenFrequency()
    {
        // Given 60 Hz: 4 mA at 60 Hz beside a stronger 6 mA at 50 Hz (1 s at 1 kHz). Only the 60 Hz band is searched,
        // so the 60 Hz component is found (closed form 60 Hz, 4/√2 mA; the 50 Hz one, 10 bins away, pulls by less
        // than 0.05 Hz and 5 % over 0.5 s Hann stretches).
        var x = Tones(1000, 1, 0, (50, 0.006, 0.3), (60, 0.004, 1.0));
        var detection = MainsFrequency.Detect(x, 1000, 60);
        Assert.True(detection.Found);
        Assert.Equal(60, detection.NominalHz);
        Assert.Equal(60, detection.FrequencyHz, 0.05);
        Assert.Equal(0.004 / Math.Sqrt(2), detection.FundamentalRmsA, 0.004 / Math.Sqrt(2) * 0.05);
    }

    [Fact]
    public void IgnoresAToneBelowAHundredNanoamperes()
    {
        // MinFundamentalA = 1e-7 A (engineering choice): a clean 50 Hz sine of 50 nA peak (35 nA RMS) is all the AC
        // there is, yet below the floor: not found.
        var x = Tones(1000, 0.2, 0, (50, 5e-8, 0.3));
        var detection = MainsFrequency.Detect(x, 1000, null);
        Assert.False(detection.Found);
        Assert.Equal(5e-8 / Math.Sqrt(2), detection.AcRmsA, 1e-12);
    }

    [Theory]
    [InlineData(0.003)]
    [InlineData(-0.004)]
    public void GivesTheAcRmsWithoutTheDc(double dcA)
    {
        // Closed form: 10 cycles of a 10 mA sine on DC have AC RMS 10/√2 mA whatever the DC.
        var x = Tones(1000, 0.2, dcA, (50, 0.01, 0.3));
        var detection = MainsFrequency.Detect(x, 1000, null);
        Assert.True(detection.Found);
        Assert.Equal(0.01 / Math.Sqrt(2), detection.AcRmsA, 1e-12);
    }

    [Theory]
    [InlineData(0.5, 1e-6)]
    [InlineData(1.0, 1e-6)]
    [InlineData(0.3, 1e-8)]
    public void GivesTheAcRmsOfASmallRippleOnALargeDc(double dcA, double peakA)
    {
        // Closed form: 10 cycles of a sine of peak a have AC RMS a/√2 on any DC. Squaring the deviations from the
        // mean keeps it to 1e-9 relative (Python floats, the same sums in the same order: 7e-10 at 10 nA on 0.3 A);
        // the algebraically equal Σ(v + mean)(v − mean) turns the mean's last-digit rounding into 1e-4 relative or
        // a negative sum (Python floats, same data).
        var x = Tones(1000, 0.2, dcA, (50, peakA, 0.3));
        var detection = MainsFrequency.Detect(x, 1000, null);
        Assert.Equal(peakA / Math.Sqrt(2), detection.AcRmsA, peakA / Math.Sqrt(2) * 1e-6);
    }

    [Fact]
    public void EmptyCaptureHasNoMainsAndNoAc()
    {
        // No samples: nothing found, the nominal fallback, AC RMS 0 (not 0/0).
        var detection = MainsFrequency.Detect([], 1000, null);
        Assert.False(detection.Found);
        Assert.Equal(50, detection.FrequencyHz);
        Assert.Equal(0, detection.AcRmsA);
    }
}
