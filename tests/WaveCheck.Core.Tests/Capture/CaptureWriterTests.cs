using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

public sealed class CaptureWriterTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void CsvRoundTripsThroughTheReader()
    {
        var x = Signals.Sine(700, 2000, 50, 0.02, 0.1, -0.001);
        var path = _folder.File("out.csv");
        Assert.Equal(700, CaptureWriter.WriteCsv(path, Signals.Blocks(x, 256), 2000));
        Assert.StartsWith("time [s],I [mA]\n0,", File.ReadAllText(path));
        using var source = CaptureOpener.Open(path, new ImportOptions());
        var residual = Signals.ReadAll(source).Residual;
        // Round-trip text of mA, then × 1e-3: a couple of ulps, far below 1e-15 A.
        for (var n = 0; n < x.Length; n++)
        {
            Assert.Equal(x[n], residual[n], 1e-15);
        }

        Assert.Equal(2000, source.Info.SampleRateHz, 1e-6);
    }

    [Fact]
    public void CopyingASourceToWavKeepsTheSamplesAndTheSensor()
    {
        var x = Signals.Sine(1500, 4000, 50, 0.02);
        var path = _folder.File("copy.wav");
        using (var memory = new MemoryCaptureSource(x, 4000, SensorCoupling.Ac))
        {
            CaptureWriter.WriteWav(path, memory, 0.05, WavSampleFormat.Float64);
        }

        using var source = CaptureOpener.Open(path, new ImportOptions());
        Assert.Equal(SensorCoupling.Ac, source.Info.SensorCoupling);
        Assert.Equal(x[123], Signals.ReadAll(source).Residual[123], 1e-16);
    }

    [Fact]
    public void AFailedWriteLeavesThePreviousFileUntouched()
    {
        var path = _folder.Write("keep.csv", "previous");
        Assert.Throws<InvalidOperationException>(() => CaptureWriter.WriteCsv(path, Failing(), 1000));
        Assert.Equal("previous", File.ReadAllText(path));
        Assert.Single(Directory.GetFiles(_folder.Path));
    }

    private static IEnumerable<double[]> Failing()
    {
        yield return [0.001, 0.002];
        throw new InvalidOperationException("source failed part-way");
    }
}
