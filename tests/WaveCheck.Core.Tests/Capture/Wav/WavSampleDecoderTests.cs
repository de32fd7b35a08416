using System.Buffers.Binary;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>The decoder's fast paths (whole vectors for mono float32 and PCM16) and its general loop, each against a
/// plain per-sample reading of the same bytes with <see cref="BinaryPrimitives"/>.</summary>
public sealed class WavSampleDecoderTests
{
    /// <summary>The slow, obviously correct reading: little-endian sample, as a fraction of full scale
    /// (integers over 2^(bits-1), 8-bit unsigned around 128; Microsoft RIFF/WAVE), times the full scale.</summary>
    private static double Reference(ReadOnlySpan<byte> sample, WavSampleKind kind, int bits, double scaleA) => (kind, bits) switch
    {
        (WavSampleKind.Pcm, 8) => (sample[0] - 128) / 128.0 * scaleA,
        (WavSampleKind.Pcm, 16) => BinaryPrimitives.ReadInt16LittleEndian(sample) / 32768.0 * scaleA,
        (WavSampleKind.Pcm, 24) => ((sample[0] | (sample[1] << 8) | (sample[2] << 16)) << 8 >> 8) / 8388608.0 * scaleA,
        (WavSampleKind.Pcm, 32) => BinaryPrimitives.ReadInt32LittleEndian(sample) / 2147483648.0 * scaleA,
        (WavSampleKind.Float, 32) => BinaryPrimitives.ReadSingleLittleEndian(sample) * scaleA,
        _ => BinaryPrimitives.ReadDoubleLittleEndian(sample) * scaleA,
    };

    public static TheoryData<bool, int, int, int> Cases()
    {
        var data = new TheoryData<bool, int, int, int>();
        foreach (var (isFloat, bits) in new[] { (false, 8), (false, 16), (false, 24), (false, 32), (true, 32), (true, 64) })
        {
            foreach (var channels in new[] { 1, 3 })
            {
                // 1 and 7 frames are shorter than a vector, 1031 leaves a tail after the whole vectors.
                foreach (var frames in new[] { 1, 7, 1031 })
                {
                    data.Add(isFloat, bits, channels, frames);
                }
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void Every_path_decodes_as_the_plain_reading(bool isFloat, int bits, int channels, int frames)
    {
        var kind = isFloat ? WavSampleKind.Float : WavSampleKind.Pcm;
        const double scaleA = 0.3;
        var size = bits / 8;
        var bytes = new byte[frames * channels * size];
        new Random(frames * 31 + bits).NextBytes(bytes);
        if (kind == WavSampleKind.Float)
        {
            // Random bytes would hold NaNs; store random fractions instead.
            var random = new Random(bits + channels);
            for (var i = 0; i < frames * channels; i++)
            {
                var x = (random.NextDouble() * 2) - 1;
                if (bits == 32)
                {
                    BinaryPrimitives.WriteSingleLittleEndian(bytes.AsSpan(i * 4), (float)x);
                }
                else
                {
                    BinaryPrimitives.WriteDoubleLittleEndian(bytes.AsSpan(i * 8), x);
                }
            }
        }

        var format = new WavFormat(kind, "test", channels, 8000, channels * size, bits);
        var block = new CaptureBlock(channels, frames + 5, 8000);
        new WavSampleDecoder(format, scaleA).Decode(bytes, block, frames);
        for (var c = 0; c < channels; c++)
        {
            var decoded = block.ChannelBuffer(c);
            for (var n = 0; n < frames; n++)
            {
                // Exact: both multiply the same integer (or float widened to double) by the same constants; the
                // vector path's one product by scale/32768 for PCM16 differs by at most one rounding, 2^-52 relative.
                var expected = Reference(bytes.AsSpan(((n * channels) + c) * size, size), kind, bits, scaleA);
                Assert.Equal(expected, decoded[n], Math.Abs(expected) * 1e-15);
            }
        }
    }
}
