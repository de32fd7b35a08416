using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowMeasurementMutantTests
{
    private const double Fs = 10_000;

    // One 10-cycle window at exactly 50 Hz (2 000 samples, bins 5 Hz apart).
    private static double[] Window(Func<double, double> valueAt) => Synth.Make(Fs, 0.2, valueAt);

    private static WindowMeasurement Measurement(double? fullScaleA = null, (double, double)[]? bands = null,
        LeakageWindowMeasurement? leakage = null) =>
        new(Fs, 10, 50, bands ?? [], WaveformShape.DefaultRestBandA, fullScaleA, leakage);

    [Theory]
    [InlineData(1e-9, 0, false)]
    [InlineData(2e-9, 0, true)]
    [InlineData(1e-3, 1.0, true)]
    [InlineData(0.999e-3, 1.0, false)]
    [InlineData(5e-10, 1e-9, false)]
    public void AFundamentalNeedsMoreThanOneNanoampereAndATenthOfAPercentOfTheAc(double mainsRmsA, double acRmsA,
        bool has)
    {
        // The rule as documented on HasFundamental (engineering choice): a fundamental above 1 nA and at least 0.1 %
        // of the window's AC RMS; both limits exact here (1e-3 · 1.0 is exactly 1e-3 in binary64).
        Assert.Equal(has, WindowMeasurement.HasFundamental(mainsRmsA, acRmsA));
    }

    [Fact]
    public void ThdIsNotReferredToAFundamentalBelowATenthOfAPercentOfTheAc()
    {
        // 10 mA peak at 250 Hz with 5 µA peak at 50 Hz: closed form, mains RMS 3.5 µA (well above 1 nA) but only
        // 0.05 % of the 7.07 mA AC RMS, so no THD (rule of HasFundamental); with 20 µA (0.2 %) it is
        // A5/A1 = 10/0.02 = 50 000 % (IEC 61000-4-7 groups of pure tones on bins). 1e-6 relative: FFT rounding.
        var small = Window(t => (0.01 * Math.Sin(2 * Math.PI * 250 * t)) + (5e-6 * Math.Sin(2 * Math.PI * 50 * t)));
        var w = Measurement().Measure(WindowSlots.Load(small, 0, 50));
        Assert.Equal(5e-6 / Math.Sqrt(2), w.MainsRmsA, 1e-12);
        Assert.Null(w.ThdPercent);

        var enough = Window(t => (0.01 * Math.Sin(2 * Math.PI * 250 * t)) + (2e-5 * Math.Sin(2 * Math.PI * 50 * t)));
        var thd = Measurement().Measure(WindowSlots.Load(enough, 0, 50)).ThdPercent;
        Assert.NotNull(thd);
        Assert.Equal(50_000, thd.Value, 50_000 * 1e-6);
    }

    [Fact]
    public void AcRmsAndCrestFactorOfASineOnDc()
    {
        // x = 3 mA + 10 mA·sin(2π·50 t) over 10 whole cycles. Closed form: mean 3 mA, AC RMS = A/√2 = 7.0711 mA
        // (mean square of a sine A²/2), RMS = √(3² + 10²/2) mA = √59 mA, peak 13 mA (sample 50 is at the crest,
        // sin(π/2) = 1), crest factor = peak/RMS = 13/√59 (docs/methods.md: largest |sample| / RMS).
        // 1e-12 relative: rounding of 2 000 sums only.
        var x = Window(t => 0.003 + (0.01 * Math.Sin(2 * Math.PI * 50 * t)));
        var w = Measurement().Measure(WindowSlots.Load(x, 0, 50));
        Assert.Equal(0.003, w.DcA, 1e-15);
        Assert.Equal(0.01 / Math.Sqrt(2), w.AcRmsA, 1e-14);
        Assert.Equal(Math.Sqrt(59e-6), w.RmsA, 1e-14);
        Assert.Equal(0.013, w.PeakPositiveA, 1e-15);
        Assert.Equal(13 / Math.Sqrt(59), w.CrestFactor, 1e-11);
    }

    [Fact]
    public void AnAllZeroWindowHasNeitherCrestFactorNorThd()
    {
        // A flat channel (CONVENTIONS.md asks for its policy): a window of zeros has RMS 0 and no fundamental, so
        // crest factor (peak/RMS) and THD (harmonics/fundamental) are both 0/0, undefined; the crest factor is
        // reported as 0 and THD as absent (HasFundamental needs more than 1 nA), never NaN.
        var w = Measurement().Measure(WindowSlots.Load(new double[2_000], 0, 50));
        Assert.Equal(0, w.RmsA);
        Assert.Equal(0, w.CrestFactor);
        Assert.Null(w.ThdPercent);
    }

    [Fact]
    public void APeakOfExactlyTheClipShareOfFullScaleIsClipped()
    {
        // The rule (ClipShare, engineering choice): a sample at or beyond 0.999 of full scale counts as clipped; at a
        // 1 A full scale the limit is exactly 0.999 A (0.999 · 1.0 in binary64), and one sample equal to it reaches it.
        var x = Window(t => 0.01 * Math.Sin(2 * Math.PI * 50 * t));
        x[25] = 0.999;
        Assert.True(Measurement(fullScaleA: 1.0).Measure(WindowSlots.Load(x, 0, 50)).Clipped);
        x[25] = 0.998;
        Assert.False(Measurement(fullScaleA: 1.0).Measure(WindowSlots.Load(x, 0, 50)).Clipped);
    }

    [Fact]
    public void ABandStartingAtTheNyquistBinHoldsNoBinAndIsLeftOut()
    {
        // Closed form: 2 000 samples have N/2 + 1 = 1 001 real-FFT bins (numpy 1.24 np.fft.rfft), the last at
        // 5 kHz. A band (5.0, 5.2] kHz begins after bin 1 000, beyond the spectrum: it is not counted; the band
        // (4.0, 4.2] kHz below it holds the 4.1 kHz tone, 2 mA peak, mean square A²/2.
        var x = Window(t => 0.002 * Math.Sin(2 * Math.PI * 4100 * t));
        var slot = WindowSlots.Load(x, 0, 50, bandCount: 2);
        Measurement(bands: [(4000, 4200), (5000, 5200)]).Measure(slot);
        Assert.Equal(1, slot.Figures.BandCount);
        Assert.Equal(0.002 * 0.002 / 2, slot.Figures.BandA2[0], 1e-16);
    }

    [Theory]
    [InlineData(196, 9, 9)]
    [InlineData(200, 9, 10)]
    [InlineData(208, 9, 10)]
    public void OnlyGroupsWhollyWithinTheSpectrumAreMeasured(int samples, int harmonicOrders, int interharmonicOrders)
    {
        // 10 cycles at 50 Hz in `samples` samples (fs = 5·samples, bins 5 Hz apart); the real FFT has bins 0 .. N/2
        // (N/2 + 1 of them, numpy 1.24 np.fft.rfft). IEC 61000-4-7 (10-cycle windows): harmonic group n spans bins
        // 10n − 5 .. 10n + 5, interharmonic group n (between n and n + 1) bins 10n + 1 .. 10n + 9. Highest whole
        // harmonic group: 10n + 5 ≤ N/2, so n = 9 for N/2 = 98, 100 and 104; interharmonic groups 0 .. n with
        // 10n + 9 ≤ N/2: 9 of them for N/2 = 98, 10 for 100 and 104. A 3 mA-peak tone at order 9 lands in group 9
        // alone (mean square A²/2).
        var fs = 5.0 * samples;
        var x = Synth.Make(fs, 0.2, t => (0.01 * Math.Sin(2 * Math.PI * 50 * t)) + (0.003 * Math.Sin(2 * Math.PI * 450 * t)));
        Assert.Equal(samples, x.Length);
        var slot = WindowSlots.Load(x, 0, 50);
        new WindowMeasurement(fs, 10, 50, [], WaveformShape.DefaultRestBandA, null).Measure(slot);
        Assert.Equal(harmonicOrders, slot.Figures.HarmonicOrders);
        Assert.Equal(interharmonicOrders, slot.Figures.InterharmonicOrders);
        Assert.Equal(0.003 * 0.003 / 2, slot.Figures.HarmonicGroupA2[9], 1e-14);
        Assert.Equal(0.003 * 0.003 / 2, slot.Figures.HarmonicsA2, 1e-14);
    }

    [Fact]
    public void AWindowWithVoltageIsSplitAgainstIt()
    {
        // 230 V RMS at 50 Hz carried beside 1 mA RMS in phase with it: closed form, the voltage's fundamental RMS is
        // 230 V and the current is wholly resistive, 1 mA (G = I/V); the window is split because 230 V is above the
        // 20 V minimum. 1e-9 relative: whole cycles, no leakage.
        var x = Window(t => 0.001 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * t));
        var slot = new WindowSlot(x.Length, 50, 0, voltageChannels: 1);
        x.CopyTo(slot.Samples, 0);
        for (var i = 0; i < x.Length; i++)
        {
            slot.Volts[0][i] = 230 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * i / Fs);
        }

        slot.Length = x.Length;
        slot.Start = 10_000;
        slot.FrequencyHz = 50;
        slot.Moments = SampleMath.Moments(x);
        new RealSpectrum(x.Length).Power(x, slot.Power);
        Measurement(leakage: new LeakageWindowMeasurement(Fs, 10, 1)).Measure(slot);
        Assert.True(slot.Leakage.Valid);
        Assert.Equal(1.0, slot.Leakage.StartS, 1e-12);
        Assert.Equal(230, slot.Leakage.VoltageRmsV, 230 * 1e-9);
        Assert.Equal(0.001, slot.Leakage.ResistiveA, 1e-12);
        Assert.Equal(0, slot.Leakage.CapacitiveA, 1e-12);
    }
}
