using NAudio.Wave;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>The one parse of a WAV header (<see cref="RiffLayout"/>, <see cref="WavFormat"/>), checked against NAudio's
/// reader as an outside reference on files NAudio writes, and on the RIFF padding rule NAudio's reader bends.</summary>
public sealed class RiffLayoutTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    public static TheoryData<int, int, bool> Formats => new()
    {
        { 1, 16, false },
        { 2, 24, true },
        { 3, 32, false },
        { 1, 64, false },
    };

    [Theory]
    [MemberData(nameof(Formats))]
    public void Layout_and_format_agree_with_NAudio_on_files_it_writes(int channels, int bits, bool extensible)
    {
        // Reference: NAudio's WaveFileReader (an independent RIFF parser) on a file NAudio's WaveFileWriter wrote,
        // with an odd-sized chunk before ours and the data, so the padding rule is exercised.
        var path = _folder.File($"n{channels}-{bits}.wav");
        WaveFormat format = bits == 64
            ? WaveFormat.CreateCustomFormat(WaveFormatEncoding.IeeeFloat, 8000, channels, 8000 * channels * 8, channels * 8, 64)
            : extensible ? new WaveFormatExtensible(8000, bits, channels) : new WaveFormat(8000, bits, channels);
        var data = Enumerable.Range(0, 100 * format.BlockAlign).Select(i => (byte)(i * 7)).ToArray();
        using (var writer = new WaveFileWriter(path, format))
        {
            writer.AddChunk("note", [1, 2, 3], ChunkPosition.BeforeData);
            writer.AddChunk("wvck", "fullScaleA=0.1"u8.ToArray(), ChunkPosition.BeforeData);
            writer.Write(data, 0, data.Length);
        }

        using var stream = File.OpenRead(path);
        var layout = RiffLayout.Scan(stream, path);
        var ours = WavFormat.Read(stream, path, layout.FormatOffset, layout.FormatBytes);
        using var reference = new WaveFileReader(path);
        Assert.Equal(reference.WaveFormat.Channels, ours.Channels);
        Assert.Equal(reference.WaveFormat.SampleRate, ours.SampleRateHz);
        Assert.Equal(reference.WaveFormat.BlockAlign, ours.BlockAlign);
        Assert.Equal(reference.WaveFormat.BitsPerSample, ours.BitsPerSample);
        Assert.Equal(reference.Length, layout.DataClaimedBytes);
        Assert.Equal(reference.Chunks.Single(c => c.IdentifierAsString == "wvck").StreamPosition, layout.OwnChunkOffset);

        // The data starts where NAudio's reader starts reading it.
        var first = new byte[10 * format.BlockAlign]; // NAudio reads whole frames only
        reference.ReadExactly(first);
        stream.Position = layout.DataOffset;
        var mine = new byte[first.Length];
        stream.ReadExactly(mine);
        Assert.Equal(first, mine);
        Assert.Equal(data[..first.Length], mine);
    }

    [Fact]
    public void An_odd_chunk_is_followed_by_its_pad_byte_whatever_the_byte_holds()
    {
        // Microsoft RIFF specification: a chunk of odd size is followed by one pad byte, not counted in its size.
        // NAudio's reader skips the pad only when it is 0; ours always does, so the data chunk behind is found.
        var samples = new byte[] { 0, 0, 0, 64, 0, 192 };
        byte[] body =
        [
            .. "WAVE"u8,
            .. "fmt "u8, 16, 0, 0, 0, 1, 0, 1, 0, 0x40, 0x1F, 0, 0, 0x80, 0x3E, 0, 0, 2, 0, 16, 0,
            .. "LIST"u8, 5, 0, 0, 0, 1, 2, 3, 4, 5, 0xAA,
            .. "data"u8, (byte)samples.Length, 0, 0, 0, .. samples,
        ];
        var path = _folder.File("pad.wav");
        File.WriteAllBytes(path, [.. "RIFF"u8, (byte)body.Length, 0, 0, 0, .. body]);

        using (var stream = File.OpenRead(path))
        {
            var layout = RiffLayout.Scan(stream, path);
            Assert.Equal(12, layout.FormatOffset);
            Assert.Equal(8 + 4 + 24 + 8 + 5 + 1 + 8, layout.DataOffset); // RIFF header, WAVE, fmt, LIST and its pad, data header
            Assert.Equal(samples.Length, layout.DataClaimedBytes);
            Assert.Null(layout.OwnChunkOffset);
        }

        // 16-bit codes 0, 0x4000, 0xC000 of full scale 0.1 A: 0, +0.05 A, -0.05 A (closed form: code / 32768).
        using var source = CaptureOpener.Open(path, new ImportOptions { ScaleA = 0.1 });
        Assert.Equal([0, 0.05, -0.05], Signals.ReadAll(source).Residual);
    }

    [Fact]
    public void Trailing_bytes_after_the_data_are_not_a_chunk_and_are_ignored()
    {
        var path = _folder.File("tail.wav");
        CaptureWriter.WriteWav(path, [new double[10]], 1000, 1, WavSampleFormat.Pcm16);
        File.AppendAllText(path, "\u0001\u0002\u0003\u0004\u0005\u0006\u0007\u0008\u0009");
        using var stream = File.OpenRead(path);
        var layout = RiffLayout.Scan(stream, path);
        Assert.Equal(20, layout.DataClaimedBytes); // 10 frames of 2 bytes
    }

    [Fact]
    public void A_data_size_of_all_ones_runs_to_the_end_of_the_file()
    {
        // 0xFFFFFFFF is what streaming writers put in a size they cannot know (and the only way past 4 GiB): the
        // samples run to the end of the file, even when they look like a chunk header (common practice, no source).
        var samples = new byte[] { 0, 0, 0, 64, (byte)'L', (byte)'I', (byte)'S', (byte)'T', 0, 192 };
        byte[] body =
        [
            .. "WAVE"u8,
            .. "fmt "u8, 16, 0, 0, 0, 1, 0, 1, 0, 0x40, 0x1F, 0, 0, 0x80, 0x3E, 0, 0, 2, 0, 16, 0,
            .. "data"u8, 0xFF, 0xFF, 0xFF, 0xFF, .. samples,
        ];
        var path = _folder.File("stream.wav");
        File.WriteAllBytes(path, [.. "RIFF"u8, 0xFF, 0xFF, 0xFF, 0xFF, .. body]);
        using (var stream = File.OpenRead(path))
        {
            var layout = RiffLayout.Scan(stream, path);
            Assert.Equal(samples.Length, layout.DataClaimedBytes);
        }

        // 16-bit codes 0, 0x4000, 0x494C, 0x5453, 0xC000 of full scale 1 A (closed form: code / 32768), no warning.
        using var source = CaptureOpener.Open(path, new ImportOptions { ScaleA = 1 });
        Assert.Equal([0, 0.5, 0x494C / 32768.0, 0x5453 / 32768.0, -0.5], Signals.ReadAll(source).Residual);
        Assert.Empty(source.Warnings);
    }
}
