using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class CaptureAccumulatorTests
{
    private const double Fs = 1_000;

    private static CaptureAccumulator Accumulator(int maxOrder = 3) =>
        new(Fs, 10, 50, maxOrder, [(200, 300), (300, 400)], maxLength: 8, highBandUpperHz: 150_000);

    // A slot of four samples whose figures are set by hand (what WindowMeasurement would have written).
    private static WindowSlot Slot(long start, double rmsA, Action<WindowFigures> set, double[]? samples = null,
        bool pulsating = false)
    {
        var slot = new WindowSlot(8, 3, 2) { Start = start, Length = 4 };
        (samples ?? [rmsA, -rmsA, rmsA, -rmsA]).CopyTo(slot.Samples, 0);
        slot.Figures.Result = WindowSlots.Result(start / Fs, rmsA, durationS: 4 / Fs, pulsating: pulsating);
        set(slot.Figures);
        return slot;
    }

    [Fact]
    public void GroupsAreTheRmsOverWindowsOfTheirMeanSquares()
    {
        // IEC 61000-4-7 aggregation: a group's figure over windows is √(mean of its mean squares), its maximum
        // √(largest). Group 1: 4e-6 and 16e-6 A² → √1e-5 and 4 mA. Group 3 lies within the spectrum of the first
        // window only, so it is that window's alone; group 2's interharmonic neighbour likewise; a group no window saw
        // is NaN.
        var acc = Accumulator();
        acc.Add(Slot(0, 0.003, f =>
        {
            (f.HarmonicOrders, f.HarmonicGroupA2[1], f.HarmonicGroupA2[2], f.HarmonicGroupA2[3]) = (3, 4e-6, 1e-6, 9e-6);
            (f.InterharmonicOrders, f.InterharmonicGroupA2[0], f.InterharmonicGroupA2[1]) = (2, 1e-8, 4e-8);
            (f.BandCount, f.BandA2[0]) = (1, 25e-6);
        }));
        acc.Add(Slot(4, 0.005, f =>
        {
            (f.HarmonicOrders, f.HarmonicGroupA2[1], f.HarmonicGroupA2[2]) = (2, 16e-6, 1e-6);
            (f.InterharmonicOrders, f.InterharmonicGroupA2[0]) = (1, 9e-8);
            f.BandCount = 0;
        }));

        var harmonics = acc.Harmonics(50);
        Assert.Equal((1, 50.0), (harmonics[0].Order, harmonics[0].FrequencyHz));
        Assert.Equal(Math.Sqrt(1e-5), harmonics[0].RmsA, 1e-15);
        Assert.Equal(0.004, harmonics[0].MaxA, 1e-15);
        Assert.Equal(0.001, harmonics[1].RmsA, 1e-15);
        Assert.Equal(0.003, harmonics[2].RmsA, 1e-15);
        var inter = acc.Interharmonics(50);
        Assert.Equal(75.0, inter[1].FrequencyHz);
        Assert.Equal(Math.Sqrt(5e-8), inter[0].RmsA, 1e-15);
        Assert.Equal(0.0002, inter[1].RmsA, 1e-15);
        Assert.True(double.IsNaN(inter[2].RmsA));
        var bands = acc.Bands();
        Assert.Equal((200.0, 300.0, 0.005), (bands[0].LowHz, bands[0].HighHz, bands[0].RmsA));
        Assert.True(double.IsNaN(bands[1].RmsA) && double.IsNaN(bands[1].MaxA));
        Assert.Equal(2, acc.WindowCount);
    }

    [Fact]
    public void TheSummaryCoversEverySampleOnce()
    {
        // Closed form over the samples 1, 2, 3 (a window) and −4 (the tail): mean 0.5, mean square 7.5, AC RMS
        // √(7.5 − 0.25), peak 4, crest 4/√7.5.
        var acc = Accumulator();
        acc.AddSamples(SampleMath.Moments([1.0, 2.0, 3.0]), 3);
        acc.AddSamples(SampleMath.Moments([-4.0]), 1);
        var s = acc.Summary();
        Assert.Equal(0.5, s.DcA);
        Assert.Equal(0.5, acc.MeanA);
        Assert.Equal(Math.Sqrt(7.5), s.RmsA, 1e-15);
        Assert.Equal(Math.Sqrt(7.25), s.AcRmsA, 1e-15);
        Assert.Equal((4.0, 3.0, -4.0), (s.PeakA, s.PeakPositiveA, s.PeakNegativeA));
        Assert.Equal(4 / Math.Sqrt(7.5), s.CrestFactor, 1e-15);
    }

    [Fact]
    public void TheWorstWindowIsTheOneWithTheHighestRms()
    {
        var acc = Accumulator();
        acc.Add(Slot(0, 0.001, _ => { }));
        acc.Add(Slot(4, 0.003, _ => { }, [0.1, 0.2, 0.3, 0.4]));
        acc.Add(Slot(8, 0.002, _ => { }));
        var worst = acc.WorstWindow();
        Assert.Equal(4 / Fs, worst.StartS);
        Assert.Equal([0.1, 0.2, 0.3, 0.4], worst.SamplesA);
        // Its figures are the window's own, the ones measured for it.
        Assert.Equal(0.003, worst.Figures!.RmsA);
        Assert.Equal(4 / Fs, worst.Figures.StartS);
        Assert.Equal(3, acc.Trend().Count);
    }

    [Fact]
    public void TheNonPulsatingFiguresCountOnlyWindowsThatAreNotPulsatingDc()
    {
        // The harmonics up to 1 kHz and the 1 kHz group are evidence of AC at other frequencies only in windows that
        // are not pulsating DC (the measurement leaves them null in those that are): the largest of those counts.
        var acc = Accumulator();
        acc.Add(Slot(0, 0.003, f => (f.HarmonicsTo1kHzA2, f.OneKHzGroupA2) = (9e-6, 1e-6)));
        acc.Add(Slot(4, 0.003, f => (f.HarmonicsTo1kHzA2, f.OneKHzGroupA2) = (4e-6, null)));
        acc.Add(Slot(8, 0.003, f => (f.HarmonicsTo1kHzA2, f.OneKHzGroupA2) = (null, null), pulsating: true));
        var spectrum = acc.Spectrum(50);
        var c = acc.Components(spectrum, acc.Summary(), toneCount: 0);
        Assert.Equal(0.003, c.NonPulsatingHarmonicsTo1kMaxA, 1e-15);
        Assert.Equal(0.001, c.NonPulsating1kGroupMaxA, 1e-15);
        Assert.Equal(1 / 3.0, c.PulsatingDcShare, 1e-15);
        Assert.False(c.PulsatingDc);
    }
}
