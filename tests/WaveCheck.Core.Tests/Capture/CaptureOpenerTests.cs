using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

public sealed class CaptureOpenerTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void MissingFileDirectoryEmptyAndUnknownFormatEachSaySo()
    {
        Assert.Contains("no such file", Open(_folder.File("nope.wav")).Message);
        Assert.Contains("is a directory", Open(_folder.Path).Message);
        var emptyCsv = Open(_folder.Write("empty.csv", ""));
        Assert.Equal((1L, 1L), (emptyCsv.Line!.Value, emptyCsv.Column!.Value));
        Assert.Contains("empty file (0 bytes)", emptyCsv.Message);
        Assert.Equal(0, Open(_folder.Write("empty.wav", "")).ByteOffset);
        Assert.Contains("unknown capture format (extension '.xyz'", Open(_folder.Write("data.xyz", "hello")).Message);
        // A .cfg goes to the COMTRADE reader, which looks for its data file beside it first.
        Assert.Contains("data file not found", Open(_folder.Write("record.cfg", "station,1\n")).Message);
    }

    [Fact]
    public void RiffWaveContentIsReadWhateverTheExtension()
    {
        var path = _folder.File("capture.bin");
        CaptureWriter.WriteWav(path, [new[] { 0.01, -0.01, 0.02 }], 1000, 0.1, WavSampleFormat.Float32);
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Assert.Equal("wav", source.Info.Format);
        Assert.Equal(3, source.Info.SampleCount);
    }

    private static CaptureFormatException Open(string path) =>
        Assert.Throws<CaptureFormatException>(() => CaptureOpener.Open(path, new ImportOptions { ScaleA = 1 }));
}
