using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

public sealed class CaptureScanTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void ClippingAtAKnownFullScaleIsCountedAndPlaced()
    {
        // 5 Hz sine of 1.2 × full scale, 10 kHz, 1 s, written to 16-bit PCM: the recorder clamps at full scale.
        const double rate = 10_000, f = 5, fullScaleA = 0.1;
        var x = Signals.Sine(10_000, rate, f, 1.2 * fullScaleA);
        var path = _folder.File("clip.wav");
        CaptureWriter.WriteWav(path, Signals.Blocks(x, 3000), rate, fullScaleA, WavSampleFormat.Pcm16);
        using var source = CaptureOpener.Open(path, new ImportOptions());
        var result = CaptureScan.Run(source, 2000, 1024);

        // closed form: |1.2 sin θ| ≥ 0.999 for a share 1 − (2/π)·asin(0.999/1.2) of the time; each of the 4 threshold
        // crossings per cycle can shift the count by one sample, so 4 × 5 cycles is the tolerance.
        var expected = (1 - 2 / Math.PI * Math.Asin(0.999 / 1.2)) * x.Length;
        var stats = result.Channels[0];
        Assert.InRange(stats.ClippedSamples, expected - 20, expected + 20);
        // closed form: first crossing at asin(0.999/1.2) / (2π f); one sample (1e-4 s) of tolerance.
        Assert.Equal(Math.Asin(0.999 / 1.2) / (2 * Math.PI * f), stats.FirstClipS!.Value, 1e-4);
        var warning = Assert.Single(result.Warnings, w => w.Code == "clipping");
        Assert.Contains("within 0.1 % of full scale 100 mA", warning.Message);
        Assert.Equal(stats.FirstClipS, warning.TimeS);
    }

    [Fact]
    public void ClippingWithoutFullScaleIsFoundFromRepeatedExtremes()
    {
        // A flat-topped wave: 1.2 sin clamped to ±1 A, full scale not known to the reader.
        const double rate = 10_000;
        var x = Signals.Sine(10_000, rate, 5, 1.2).Select(v => Math.Clamp(v, -1, 1)).ToArray();
        var result = Scan(new MemoryCaptureSource(x, rate), 2000);
        // closed form: |1.2 sin θ| ≥ 1 for 1 − (2/π)·asin(1/1.2) of the time; ±4 samples per cycle.
        var expected = (1 - 2 / Math.PI * Math.Asin(1 / 1.2)) * x.Length;
        Assert.InRange(result.Channels[0].ClippedSamples, expected - 20, expected + 20);
        Assert.Contains(result.Warnings, w => w.Code == "clipping" && w.Message.Contains("own extreme", StringComparison.Ordinal));
    }

    [Fact]
    public void AnUnclippedSineHasNoClippingAndExactRangeAndMean()
    {
        // 50 Hz at 10 kHz: 200 samples a cycle, the crest lands on a sample; mean over whole cycles is the offset (closed form).
        var x = Signals.Sine(10_000, 10_000, 50, 0.03, 0, 0.005);
        var result = Scan(new MemoryCaptureSource(x, 10_000), 2000);
        var s = result.Channels[0];
        Assert.Equal(0.035, s.MaxSi, 1e-15);
        Assert.Equal(-0.025, s.MinSi, 1e-15);
        Assert.Equal(0.005, s.MeanSi, 1e-15);
        Assert.Equal(0, s.ClippedSamples);
        Assert.Empty(result.Warnings);
    }

    [Theory]
    [InlineData(0.0, "all-zero")]
    [InlineData(0.005, "flat")]
    public void FlatAndZeroChannelsAreNamed(double value, string code)
    {
        var x = Enumerable.Repeat(value, 500).ToArray();
        var result = Scan(new MemoryCaptureSource(x, 50_000), 20_000);
        var warning = Assert.Single(result.Warnings);
        Assert.Equal(code, warning.Code);
        Assert.Equal(0, result.Channels[0].ClippedSamples);
    }

    [Theory]
    [InlineData(10_000, true)]
    [InlineData(40_000, false)]
    public void ARateTooLowForTheBandIsWarnedWithTheNyquistFrequency(double rate, bool warned)
    {
        var x = Signals.Sine(1000, rate, 50, 0.01);
        var result = Scan(new MemoryCaptureSource(x, rate), 20_000);
        // Nyquist: rate / 2 must reach the 20 kHz band of interest.
        Assert.Equal(warned, result.Warnings.Any(w => w.Code == "rate-low" && w.Message.Contains($"up to {rate / 2} Hz (Nyquist)", StringComparison.Ordinal)));
    }

    private static CaptureScanResult Scan(ICaptureSource source, double band)
    {
        using (source)
        {
            return CaptureScan.Run(source, band, 777);
        }
    }
}
