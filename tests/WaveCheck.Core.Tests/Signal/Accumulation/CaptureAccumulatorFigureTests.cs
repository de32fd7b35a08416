using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// The capture figures <see cref="CaptureAccumulator"/> folds from windows built by hand (no measurement, no whole
/// capture): the averaged spectrum and its extent, the components as RMS over windows, the means, shares and extremes
/// of the window figures, the frequency range, the summary's edge cases and the worst window.
/// </summary>
public class CaptureAccumulatorFigureTests
{
    private const double Fs = 1_000;

    // 10 cycles of 50 Hz at 1 kHz: bins 5 Hz apart (IEC 61000-4-7 window of 10 cycles).
    private static CaptureAccumulator Accumulator(int maxLength = 8, double highBandUpperHz = 150_000) =>
        new(Fs, 10, 50, 3, [], maxLength, highBandUpperHz);

    private static WindowResult Figures(double startS, double rmsA = 0.001) => WindowSlots.Result(startS, rmsA);

    // A window of `length` samples starting at sample `start`, with its figures and its mean-square spectrum given.
    private static WindowSlot Slot(long start, int length, WindowResult result, Action<WindowFigures>? set = null,
        double[]? power = null)
    {
        var slot = new WindowSlot(length, 3, 0) { Start = start, Length = length };
        slot.Figures.Result = result;
        power?.CopyTo(slot.Power, 0);
        set?.Invoke(slot.Figures);
        return slot;
    }

    private static ComponentsResult Components(CaptureAccumulator acc) =>
        acc.Components(acc.Spectrum(50), acc.Summary(), toneCount: 0);

    [Fact]
    public void TheAveragedSpectrumIsTheRmsOverWindowsOfEachBin()
    {
        // Closed form: bin k of the averaged spectrum is √(mean over windows of its mean square), at k·f/N (f the
        // mean mains frequency, N = 10 cycles). Two windows of 8 samples (5 bins): √((p1 + p2)/2).
        var acc = Accumulator();
        acc.Add(Slot(0, 8, Figures(0), power: [1, 4, 9, 16, 25]));
        acc.Add(Slot(8, 8, Figures(0.008), power: [3, 0, 7, 0, 11]));
        var s = acc.Spectrum(50.2);

        // closed form: resolution 50.2 Hz / 10 cycles
        Assert.Equal(5.02, s.ResolutionHz, 1e-12);
        Assert.Equal(new[] { 0, 5.02, 10.04, 15.06, 20.08 }, s.FrequenciesHz.Select(f => Math.Round(f, 9)));
        // numpy 1.24: np.sqrt((np.array([1,4,9,16,25.]) + np.array([3,0,7,0,11.]))/2)
        double[] expected = [1.41421356, 1.41421356, 2.82842712, 2.82842712, 4.24264069];
        Assert.Equal(expected.Length, s.RmsA.Count);
        for (var k = 0; k < expected.Length; k++)
        {
            Assert.Equal(expected[k], s.RmsA[k], 1e-8);
        }
    }

    [Fact]
    public void TheSpectrumEndsAtTheHighestFrequencyOfInterest()
    {
        // Closed form: bins 0 .. ⌊20 Hz / 5 Hz⌋ = 5 bins up to 20 Hz, though each window of 16 samples has 9.
        var acc = Accumulator(maxLength: 16, highBandUpperHz: 20);
        acc.Add(Slot(0, 16, Figures(0), power: [1, 1, 1, 1, 1, 1, 1, 1, 1]));
        var s = acc.Spectrum(50);
        Assert.Equal(new[] { 0.0, 5, 10, 15, 20 }, s.FrequenciesHz);
        Assert.All(s.RmsA, a => Assert.Equal(1.0, a));
    }

    [Fact]
    public void TheSpectrumEndsAtTheNyquistFrequency()
    {
        // Closed form: at 1 kHz the Nyquist frequency is 500 Hz, bins 0 .. 500/5 = 101 bins, while windows of 400
        // samples (40 cycles' worth) carry 201 bins and the band of interest reaches 150 kHz.
        var acc = Accumulator(maxLength: 400);
        acc.Add(Slot(0, 400, Figures(0), power: Enumerable.Repeat(4.0, 201).ToArray()));
        var s = acc.Spectrum(50);
        Assert.Equal(101, s.RmsA.Count);
        Assert.Equal(500.0, s.FrequenciesHz[^1], 1e-9);
        Assert.All(s.RmsA, a => Assert.Equal(2.0, a));
    }

    [Fact]
    public void TheSpectrumEndsWithTheLongestWindowsBins()
    {
        // Closed form: a window of at most 8 samples has 8/2 + 1 = 5 bins (0 .. 20 Hz at 5 Hz).
        var acc = Accumulator(maxLength: 8);
        acc.Add(Slot(0, 8, Figures(0), power: [4, 4, 4, 4, 4]));
        var s = acc.Spectrum(50);
        Assert.Equal(5, s.RmsA.Count);
        Assert.All(s.RmsA, a => Assert.Equal(2.0, a));
    }

    [Fact]
    public void TheSpectrumStopsWhereNoWindowReached()
    {
        // Room for 9 bins (16-sample windows), but the only window had 8 samples: its 5 bins are the spectrum (a bin
        // no window measured has no value; 0/0 would be NaN).
        var acc = Accumulator(maxLength: 16);
        acc.Add(Slot(0, 8, Figures(0), power: [9, 9, 9, 9, 9]));
        var s = acc.Spectrum(50);
        Assert.Equal(5, s.RmsA.Count);
        Assert.All(s.RmsA, a => Assert.Equal(3.0, a));
    }

    [Fact]
    public void ComponentsAreTheRmsOverWindowsOfTheirMeanSquares()
    {
        // IEC 61000-4-7 aggregation over equal windows: √(mean of the windows' mean squares).
        // numpy 1.24: np.sqrt(np.mean([1e-4, 4e-4, 1e-4])) = 0.01414213562373095,
        //             np.sqrt(np.mean([1e-6, 2e-6, 3e-6])) = 0.001414213562373095.
        var acc = Accumulator();
        double[] mains = [1e-4, 4e-4, 1e-4];
        double[] rest = [1e-6, 2e-6, 3e-6];
        for (var i = 0; i < 3; i++)
        {
            var (m, r) = (mains[i], rest[i]);
            acc.Add(Slot(8 * i, 8, Figures(0.008 * i), f =>
                (f.MainsA2, f.BelowMainsA2, f.HarmonicsA2, f.Above1kHzA2, f.Above9kHzA2) = (m, r, r, r, r)));
        }

        var c = Components(acc);
        Assert.Equal(0.01414213562373095, c.MainsRmsA, 1e-15);
        Assert.Equal(0.001414213562373095, c.BelowMainsRmsA, 1e-15);
        Assert.Equal(0.001414213562373095, c.HarmonicsRmsA, 1e-15);
        Assert.Equal(0.001414213562373095, c.Above1kHzRmsA, 1e-15);
        Assert.Equal(0.001414213562373095, c.Above9kHzRmsA, 1e-15);
        // IEC 61000-4-7 THD: harmonics RMS over fundamental RMS, here √2e-6 / √2e-4 = 10 %.
        Assert.Equal(10.0, c.ThdPercent!.Value, 1e-9);
    }

    [Fact]
    public void ThereIsNoThdWithoutAFundamental()
    {
        // IEC 61000-4-7 THD is relative to the fundamental: with none (group 1 empty) it is undefined, not 0/0.
        var acc = Accumulator();
        acc.AddSamples(SampleMath.Moments([0.002, -0.002]), 2);
        acc.Add(Slot(0, 8, Figures(0), f => (f.MainsA2, f.HarmonicsA2) = (0, 4e-6)));
        Assert.Null(Components(acc).ThdPercent);
    }

    [Fact]
    public void SmoothDcIsTheMeanOverWindowsAndItsMaximumTheLargestInMagnitude()
    {
        // numpy 1.24: np.mean([0.002, -0.006, 0.001]) = -0.001; the largest magnitude keeps its sign (docs/methods.md
        // II.1: smooth DC is judged by abs(smoothDcMaxA)). The sample summary's DC (+0.05) is a different figure.
        var acc = Accumulator();
        acc.AddSamples(SampleMath.Moments([0.05, 0.05]), 2);
        double[] smooth = [0.002, -0.006, 0.001];
        for (var i = 0; i < 3; i++)
        {
            acc.Add(Slot(8 * i, 8, WindowSlots.Result(0.008 * i, 0.001, smoothDcA: smooth[i])));
        }

        var c = Components(acc);
        Assert.Equal(-0.001, c.SmoothDcA, 1e-15);
        Assert.Equal(-0.006, c.SmoothDcMaxA);
    }

    [Fact]
    public void OfEqualSmoothDcMagnitudesTheFirstIsTheMaximum()
    {
        // The first of equal extremes counts, as numpy's argmax (numpy 1.24: np.argmax(np.abs([-0.004, 0.004])) = 0)
        // and as the smoothDcA maximum of windows.statistics.
        var acc = Accumulator();
        acc.Add(Slot(0, 8, WindowSlots.Result(0, 0.001, smoothDcA: -0.004)));
        acc.Add(Slot(8, 8, WindowSlots.Result(0.008, 0.001, smoothDcA: 0.004)));
        Assert.Equal(-0.004, Components(acc).SmoothDcMaxA);
        Assert.Equal(-0.004, acc.Windows(50).Statistics["smoothDcA"].Max);
    }

    [Fact]
    public void WithoutWindowsTheComponentsFallBackToTheSummary()
    {
        // No window (never in an analysis, which refuses a capture shorter than one window; the contract of the
        // type): smooth DC is the samples' mean (closed form: mean of 0.003, 0.005 = 0.004), shares are 0, and no
        // angle or THD exists (nothing to average: not 0/0).
        var acc = Accumulator();
        acc.AddSamples(SampleMath.Moments([0.003, 0.005]), 2);
        var c = Components(acc);
        Assert.Equal(0.004, c.SmoothDcA, 1e-15);
        Assert.Equal(0.004, c.SmoothDcMaxA, 1e-15);
        Assert.False(c.PulsatingDc);
        Assert.Equal(0.0, c.PulsatingDcShare);
        Assert.Equal(0.0, c.ClippedWindowShare);
        Assert.Null(c.CurrentDelayAngleDeg);
        Assert.Null(c.ThdPercent);
        Assert.Equal(0.0, c.MainsRmsA);
    }

    [Fact]
    public void WithoutWindowsTheFrequencyIsTheFallback()
    {
        // No window measured a frequency: the mean is the one given, the range collapses onto it.
        var acc = Accumulator();
        Assert.Equal(60.0, acc.MeanFrequencyHz(60));
        Assert.Equal((59.5, 59.5), acc.FrequencyRange(59.5));
        Assert.Equal(0.0, acc.MeanA);
    }

    [Fact]
    public void TheFrequencyIsTheMeanOverWindowsWithItsRange()
    {
        // numpy 1.24: np.mean([49.9, 50.1, 50.3]) = 50.1, min 49.9, max 50.3.
        var acc = Accumulator();
        double[] hz = [50.1, 49.9, 50.3];
        for (var i = 0; i < 3; i++)
        {
            acc.Add(Slot(8 * i, 8, WindowSlots.Result(0.008 * i, 0.001, frequencyHz: hz[i])));
        }

        Assert.Equal(50.1, acc.MeanFrequencyHz(50), 1e-12);
        Assert.Equal((49.9, 50.3), acc.FrequencyRange(50.1));
    }

    [Fact]
    public void PulsatingDcIsAMajorityOfWindows()
    {
        // ComponentsResult.PulsatingDc: "most windows" (more than half); the share is the plain fraction.
        var two = Accumulator();
        two.Add(Slot(0, 8, WindowSlots.Result(0, 0.001, pulsating: true)));
        two.Add(Slot(8, 8, WindowSlots.Result(0.008, 0.001)));
        Assert.False(Components(two).PulsatingDc); // one of two is not most
        Assert.Equal(0.5, Components(two).PulsatingDcShare);

        var three = Accumulator();
        three.Add(Slot(0, 8, WindowSlots.Result(0, 0.001, pulsating: true)));
        three.Add(Slot(8, 8, WindowSlots.Result(0.008, 0.001, pulsating: true)));
        three.Add(Slot(16, 8, WindowSlots.Result(0.016, 0.001)));
        Assert.True(Components(three).PulsatingDc); // two of three are
        Assert.Equal(2 / 3.0, Components(three).PulsatingDcShare, 1e-15);
    }

    [Fact]
    public void ThePulseMeanIsTheLargestMeanAboveTheFloorAmongPulsatingWindows()
    {
        // docs/methods.md I.4 worked example: a 30 mA-peak half-wave on 8 mA smooth DC has a mean of 8 + 30/π mA;
        // its mean above the floor is 30/π = 9.549 mA (closed form: mean of a half-wave rectified sine is peak/π).
        // A non-pulsating window with a larger mean − smooth DC does not count (docs/methods.md II.1).
        var acc = Accumulator();
        acc.Add(Slot(0, 8, WindowSlots.Result(0, 0.02, dcA: 0.008 + (0.03 / Math.PI), smoothDcA: 0.008,
            pulsating: true)));
        acc.Add(Slot(8, 8, WindowSlots.Result(0.008, 0.01, dcA: 0.004 + (0.01 / Math.PI), smoothDcA: 0.004,
            pulsating: true)));
        acc.Add(Slot(16, 8, WindowSlots.Result(0.016, 0.05, dcA: 0.05, smoothDcA: 0)));
        Assert.Equal(0.009549296585513721, Components(acc).PulsatingMeanMaxA, 1e-15);
    }

    [Fact]
    public void TheClippedShareIsTheFractionOfClippedWindows()
    {
        // Closed form: one clipped window of four = 0.25.
        var acc = Accumulator();
        for (var i = 0; i < 4; i++)
        {
            acc.Add(Slot(8 * i, 8, WindowSlots.Result(0.008 * i, 0.001, clipped: i == 2)));
        }

        Assert.Equal(0.25, Components(acc).ClippedWindowShare);
    }

    [Fact]
    public void TheDelayAngleIsTheMeanOverWindowsThatHaveOneWhenAtLeastHalfDo()
    {
        // Closed form: mean of 30° and 40° = 35°. Engineering choice (stated here, the rule of the result): a capture
        // is a phase-controlled half-wave when at least half its windows are, so 2 of 3 and 1 of 2 give the mean,
        // 1 of 3 gives none.
        static WindowResult At(int i, double? angle) =>
            WindowSlots.Result(0.008 * i, 0.001) with { CurrentDelayAngleDeg = angle };

        var twoOfThree = Accumulator();
        twoOfThree.Add(Slot(0, 8, At(0, 30)));
        twoOfThree.Add(Slot(8, 8, At(1, null)));
        twoOfThree.Add(Slot(16, 8, At(2, 40)));
        Assert.Equal(35.0, Components(twoOfThree).CurrentDelayAngleDeg!.Value, 1e-12);

        var oneOfTwo = Accumulator();
        oneOfTwo.Add(Slot(0, 8, At(0, null)));
        oneOfTwo.Add(Slot(8, 8, At(1, 50)));
        Assert.Equal(50.0, Components(oneOfTwo).CurrentDelayAngleDeg!.Value, 1e-12);

        var oneOfThree = Accumulator();
        oneOfThree.Add(Slot(0, 8, At(0, 30)));
        oneOfThree.Add(Slot(8, 8, At(1, null)));
        oneOfThree.Add(Slot(16, 8, At(2, null)));
        Assert.Null(Components(oneOfThree).CurrentDelayAngleDeg);
    }

    [Fact]
    public void TheWindowsCarryTheirStatisticsLengthAndLargestSyncError()
    {
        // Closed form: 10 cycles of 50 Hz last 0.2 s (IEC 61000-4-7 window); the largest sync error is the worst.
        // numpy 1.24 over the window RMS values [1, 4, 6, 2, 3] mA: mean 0.0032, np.percentile(r, 95) = 0.0056
        // (linear interpolation), max 0.006 at the third window (start 0.016 s).
        var acc = Accumulator();
        double[] rms = [0.001, 0.004, 0.006, 0.002, 0.003];
        double[] sync = [0.01, 0.02, 0.005, 0, 0];
        for (var i = 0; i < rms.Length; i++)
        {
            var e = sync[i];
            acc.Add(Slot(8 * i, 8, Figures(0.008 * i, rms[i]), f => f.SyncErrorPercent = e));
        }

        var w = acc.Windows(50);
        Assert.Equal(5, w.Count);
        Assert.Equal(10, w.CyclesPerWindow);
        Assert.Equal(0.2, w.LengthS, 1e-15);
        Assert.Equal(0.02, w.MaxSyncErrorPercent);
        var r = w.Statistics["rmsA"];
        Assert.Equal(0.0032, r.Mean, 1e-15);
        Assert.Equal(0.0056, r.P95, 1e-15);
        Assert.Equal((0.006, 0.016), (r.Max, r.TimeOfMaxS));
    }

    [Fact]
    public void OfEqualWindowsTheFirstIsTheWorst()
    {
        // The first of equal maxima is the worst window, as numpy's argmax and the time of windows.statistics.rmsA's
        // maximum (numpy 1.24: np.argmax([0.001, 0.003, 0.003]) = 1); docs/methods.md I.5 names it "the window with
        // the highest RMS".
        var acc = Accumulator();
        acc.Add(Slot(0, 8, Figures(0, 0.001)));
        acc.Add(Slot(8, 8, Figures(0.008, 0.003)));
        acc.Add(Slot(16, 8, Figures(0.016, 0.003)));
        var worst = acc.WorstWindow();
        Assert.Equal(0.008, worst.StartS, 1e-15);
        Assert.Equal(acc.Windows(50).Statistics["rmsA"].TimeOfMaxS, worst.StartS, 1e-15);
        Assert.Equal("window with the highest RMS", worst.Reason);
    }

    [Fact]
    public void TheSummaryOfNothingOrOfZerosIsZero()
    {
        // No sample: every figure 0 (no NaN from 0/0). Samples all 0: RMS 0 and a crest factor of 0, not 0/0.
        var none = Accumulator().Summary();
        Assert.Equal(new SummaryResult(0, 0, 0, 0, 0, 0, 0), none);

        var zeros = Accumulator();
        zeros.AddSamples(SampleMath.Moments([0.0, 0.0, 0.0]), 3);
        var s = zeros.Summary();
        Assert.Equal((0.0, 0.0), (s.RmsA, s.CrestFactor));
    }

    [Fact]
    public void TheNegativePeakIsTheLeastSampleOfAnyBlock()
    {
        // Closed form over the samples −1, 2 and 3: least −1, greatest 3, peak 3.
        var acc = Accumulator();
        acc.AddSamples(SampleMath.Moments([-1.0, 2.0]), 2);
        acc.AddSamples(SampleMath.Moments([3.0]), 1);
        var s = acc.Summary();
        Assert.Equal((3.0, -1.0, 3.0), (s.PeakPositiveA, s.PeakNegativeA, s.PeakA));
    }
}
