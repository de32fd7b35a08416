using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowMeasurementTests
{
    private const double Fs = 10_000;

    // One 10-cycle window at exactly 50 Hz (2 000 samples, bins 5 Hz apart).
    private static double[] Window(Func<double, double> valueAt) => Synth.Make(Fs, 0.2, valueAt);

    private static WindowMeasurement Measurement(double? fullScaleA = null, (double, double)[]? bands = null) =>
        new(Fs, 10, 50, bands ?? FrequencyBands.For(Fs, 150_000), WaveformShape.DefaultRestBandA, fullScaleA);

    [Fact]
    public void PureHarmonicsLandInTheirGroupsAlone()
    {
        // Closed form: a sine of amplitude A in a synchronised window is one bin of mean square A²/2, so harmonic group
        // n holds exactly its own component (IEC 61000-4-7); THD = A5/A1 = 40 %. 1e-12 relative: FFT rounding only.
        var x = Window(t => (0.01 * Math.Sin(2 * Math.PI * 50 * t)) + (0.004 * Math.Sin(2 * Math.PI * 250 * t)));
        var slot = WindowSlots.Load(x, 20_000, 50, bandCount: FrequencyBands.For(Fs, 150_000).Length);
        var w = Measurement().Measure(slot);
        var f = slot.Figures;
        Assert.Equal(50, f.HarmonicOrders);
        Assert.Equal(50, f.InterharmonicOrders);
        Assert.Equal(0.01 * 0.01 / 2, f.MainsA2, 1e-12 * 1e-4);
        Assert.Equal(0.004 * 0.004 / 2, f.HarmonicGroupA2[5], 1e-12 * 1e-4);
        Assert.Equal(0.004 * 0.004 / 2, f.HarmonicsA2, 1e-12 * 1e-4);
        for (var n = 2; n <= 50; n++)
        {
            Assert.Equal(n == 5 ? 0.004 * 0.004 / 2 : 0, f.HarmonicGroupA2[n], 1e-16);
            Assert.Equal(0, f.InterharmonicGroupA2[n - 1], 1e-16);
        }

        Assert.Equal(40, w.ThdPercent!.Value, 1e-8);
        Assert.Equal(Math.Sqrt((0.01 * 0.01 / 2) + (0.004 * 0.004 / 2)), w.RmsA, 1e-12);
        Assert.Equal(2.0, w.StartS);
        Assert.Equal(0.2, w.DurationS);
        Assert.Equal(0, f.SyncErrorPercent, 1e-12);
        Assert.False(w.PulsatingDc);
        Assert.Same(w, f.Result);
    }

    [Fact]
    public void OneKilohertzGroupIsKeptApartFromTheHarmonicsBelowIt()
    {
        // Closed form: 3rd harmonic (150 Hz) 2 mA peak and a 1 kHz component (order 20) 3 mA peak on a bipolar
        // window: the harmonics up to 1 kHz hold only the 3rd, the 1 kHz group only the 1 kHz part (IEC 62423's
        // composite test current has one).
        var x = Window(t => (0.01 * Math.Sin(2 * Math.PI * 50 * t)) + (0.002 * Math.Sin(2 * Math.PI * 150 * t))
            + (0.003 * Math.Sin(2 * Math.PI * 1000 * t)));
        var slot = WindowSlots.Load(x, 0, 50);
        Measurement(bands: []).Measure(slot);
        Assert.Equal(0.002 * 0.002 / 2, slot.Figures.HarmonicsTo1kHzA2!.Value, 1e-16);
        Assert.Equal(0.003 * 0.003 / 2, slot.Figures.OneKHzGroupA2!.Value, 1e-16);
    }

    [Fact]
    public void PulsatingWindowKeepsTheMedianOfItsRestAndNoBipolarHarmonics()
    {
        // The worked example of docs/methods.md (closed form): 30 mA-peak half-waves on 8 mA smooth DC have a mean of
        // 8 + 30/π = 17.5 mA but a smooth DC of 8 mA; a half-wave's own harmonics are its shape, so none are counted
        // as AC at other frequencies. 1 µA: the rest is exactly 8 mA.
        var x = Window(t => 0.008 + Synth.PhaseCut(t, 50, 0.03, 0));
        var slot = WindowSlots.Load(x, 0, 50);
        var w = Measurement(bands: []).Measure(slot);
        Assert.True(w.PulsatingDc);
        Assert.Equal(0.008, w.SmoothDcA, 1e-6);
        Assert.Equal(0.008 + (0.03 / Math.PI), w.DcA, 1e-5);
        Assert.Null(slot.Figures.HarmonicsTo1kHzA2);
        Assert.Null(slot.Figures.OneKHzGroupA2);
    }

    [Fact]
    public void SmoothDcOfABipolarWindowLeavesAMotorFrequencyOut()
    {
        // The smooth-DC choice (formerly in the thread scheduler): a bipolar window's DC comes from the sub-mains fit.
        // Closed form: 2.4 cycles of a 12 Hz, 9.8 mA-peak motor current bias the plain mean by
        // Ipk·(1 − cos 2πβ)/(2πβ) ≈ 1.2 mA; the fit recovers the 3 mA DC within 0.1 mA (as SubMainsDcTests).
        var x = Synth.Make(50_000, 0.2, t => 0.003 + (0.0098 * Math.Sin(2 * Math.PI * 12 * t))
            + (0.0098 * Math.Sin(2 * Math.PI * 50 * t)));
        var slot = WindowSlots.Load(x, 0, 50);
        var w = new WindowMeasurement(50_000, 10, 50, [], WaveformShape.DefaultRestBandA, null).Measure(slot);
        Assert.False(w.PulsatingDc);
        Assert.True(Math.Abs(w.DcA - 0.003) > 0.001, $"the plain mean is biased: {w.DcA}");
        Assert.Equal(0.003, w.SmoothDcA, 0.0001);
    }

    [Theory]
    [InlineData(0.009995, true)]
    [InlineData(0.009985, false)]
    public void ClippedFromTheFullScaleShare(double peakA, bool clipped)
    {
        // The rule: a window is clipped when its largest absolute sample reaches 0.999 of the full scale (10 mA here,
        // so 9.99 mA); the peak is one exact sample, negative, on a sine of half its size.
        var x = Window(t => peakA / 2 * Math.Sin(2 * Math.PI * 50 * t));
        x[25] = -peakA;
        var w = Measurement(fullScaleA: 0.01, bands: []).Measure(WindowSlots.Load(x, 0, 50));
        Assert.Equal(clipped, w.Clipped);
        Assert.False(Measurement(fullScaleA: null, bands: []).Measure(WindowSlots.Load(x, 0, 50)).Clipped);
    }

    [Fact]
    public void BandsAboveTheSpectrumAreNotMeasured()
    {
        // A band whose lower edge lies beyond the Nyquist frequency (5 kHz) holds no bin: it and every band above it
        // are left out (the window count of that band stays lower); the two below are the sums of their bins, the
        // 2.1 kHz tone (2 mA peak) wholly in the first (closed form A²/2).
        var x = Window(t => 0.002 * Math.Sin(2 * Math.PI * 2100 * t));
        var slot = WindowSlots.Load(x, 0, 50, bandCount: 3);
        Measurement(bands: [(2000, 2200), (4000, 4200), (6000, 6200)]).Measure(slot);
        Assert.Equal(2, slot.Figures.BandCount);
        Assert.Equal(0.002 * 0.002 / 2, slot.Figures.BandA2[0], 1e-16);
        Assert.Equal(0, slot.Figures.BandA2[1], 1e-16);
    }

    [Fact]
    public void SyncErrorIsTheLengthsDistanceFromWholeCycles()
    {
        // Closed form: 10 cycles at 49.97 Hz and 50 kS/s are 10 006.0036 samples; the window holds 10 006, so it is
        // 0.0036/10 006.0036 = 3.6·10⁻⁵ % short.
        var x = Synth.Make(50_000, 10_006 / 50_000.0, t => 0.01 * Math.Sin(2 * Math.PI * 49.97 * t));
        var slot = WindowSlots.Load(x, 0, 49.97);
        new WindowMeasurement(50_000, 10, 50, [], WaveformShape.DefaultRestBandA, null).Measure(slot);
        var exact = 10 * 50_000 / 49.97;
        Assert.Equal((exact - 10_006) / exact * 100, slot.Figures.SyncErrorPercent, 1e-12);
    }
}
