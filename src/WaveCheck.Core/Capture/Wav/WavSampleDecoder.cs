using System.Buffers.Binary;
using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Turns a WAV file's stored samples into amperes: each sample is a fraction of full scale times
/// <c>scaleA</c>. Integer samples are normalised as <c>value / 2^(bits-1)</c> (8-bit as <c>(value - 128) / 128</c>),
/// so full scale 1.0 is the negative limit and the positive limit is one LSB short of it. Stateless apart from its
/// format and scale; thread-safe.
/// </summary>
/// <param name="format">The checked <c>fmt </c> chunk.</param>
/// <param name="scaleA">Amperes at full scale.</param>
internal sealed class WavSampleDecoder(WavFormat format, double scaleA)
{
    private readonly WavSampleKind _kind = format.Kind;
    private readonly int _bytesPerSample = format.BytesPerSample;
    private readonly int _channelCount = format.Channels;
    private readonly double _scaleA = scaleA;

    /// <summary>Decodes <paramref name="frames"/> frames into the block's channel buffers, amperes.</summary>
    /// <param name="bytes">Whole frames, interleaved as stored.</param>
    /// <param name="block">Its first <paramref name="frames"/> samples of each channel are written.</param>
    /// <param name="frames">Frames in <paramref name="bytes"/>.</param>
    public void Decode(ReadOnlySpan<byte> bytes, CaptureBlock block, int frames)
    {
        var stride = _channelCount;
        if (stride == 1 && Vector.IsHardwareAccelerated && DecodeMonoVectorised(bytes, block.ChannelBuffer(0)[..frames]))
        {
            return;
        }

        for (var c = 0; c < stride; c++)
        {
            var target = block.ChannelBuffer(c)[..frames];
            var scale = _scaleA;
            switch (_kind, _bytesPerSample)
            {
                case (WavSampleKind.Pcm, 1):
                    for (var n = 0; n < frames; n++)
                    {
                        target[n] = (bytes[n * stride + c] - 128) / 128.0 * scale;
                    }

                    break;
                case (WavSampleKind.Pcm, 2):
                    {
                        var s = MemoryMarshal.Cast<byte, short>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = LittleEndian(s[n * stride + c]) / 32768.0 * scale;
                        }

                        break;
                    }

                case (WavSampleKind.Pcm, 3):
                    for (var n = 0; n < frames; n++)
                    {
                        var i = (n * stride + c) * 3;
                        var v = bytes[i] | (bytes[i + 1] << 8) | ((sbyte)bytes[i + 2] << 16);
                        target[n] = v / 8388608.0 * scale;
                    }

                    break;
                case (WavSampleKind.Pcm, 4):
                    {
                        var s = MemoryMarshal.Cast<byte, int>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = LittleEndian(s[n * stride + c]) / 2147483648.0 * scale;
                        }

                        break;
                    }

                case (WavSampleKind.Float, 4):
                    {
                        var s = MemoryMarshal.Cast<byte, float>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = s[n * stride + c] * scale;
                        }

                        break;
                    }

                case (WavSampleKind.Float, 8):
                    {
                        var s = MemoryMarshal.Cast<byte, double>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = s[n * stride + c] * scale;
                        }

                        break;
                    }

                default:
                    throw new InvalidOperationException("sample kind checked by WavFormat");
            }
        }
    }

    /// <summary>One channel of 32-bit float or 16-bit PCM on whole vectors (the common logger formats); false for
    /// other formats, which the general loop decodes.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private bool DecodeMonoVectorised(ReadOnlySpan<byte> bytes, Span<double> target)
    {
        var frames = target.Length;
        var vectors = MemoryMarshal.Cast<double, Vector<double>>(target);
        if (_kind == WavSampleKind.Float && _bytesPerSample == 4 && BitConverter.IsLittleEndian)
        {
            var source = MemoryMarshal.Cast<byte, float>(bytes)[..frames];
            var scale = new Vector<double>(_scaleA);
            var whole = frames / Vector<float>.Count;
            var input = MemoryMarshal.Cast<float, Vector<float>>(source)[..whole];
            for (var v = 0; v < input.Length; v++)
            {
                Vector.Widen(input[v], out var low, out var high);
                vectors[2 * v] = low * scale;
                vectors[(2 * v) + 1] = high * scale;
            }

            for (var n = whole * Vector<float>.Count; n < frames; n++)
            {
                target[n] = source[n] * _scaleA;
            }

            return true;
        }

        if (_kind == WavSampleKind.Pcm && _bytesPerSample == 2 && BitConverter.IsLittleEndian)
        {
            var source = MemoryMarshal.Cast<byte, short>(bytes)[..frames];
            var factor = _scaleA / 32768.0;
            var scale = new Vector<double>(factor);
            var whole = frames / Vector<short>.Count;
            var input = MemoryMarshal.Cast<short, Vector<short>>(source)[..whole];
            for (var v = 0; v < input.Length; v++)
            {
                // short → int → long → double, four vectors of doubles per vector of shorts.
                Vector.Widen(input[v], out var lowInts, out var highInts);
                Vector.Widen(lowInts, out var a, out var b);
                Vector.Widen(highInts, out var c, out var d);
                vectors[4 * v] = Vector.ConvertToDouble(a) * scale;
                vectors[(4 * v) + 1] = Vector.ConvertToDouble(b) * scale;
                vectors[(4 * v) + 2] = Vector.ConvertToDouble(c) * scale;
                vectors[(4 * v) + 3] = Vector.ConvertToDouble(d) * scale;
            }

            for (var n = whole * Vector<short>.Count; n < frames; n++)
            {
                target[n] = source[n] * factor;
            }

            return true;
        }

        return false;
    }

    private static short LittleEndian(short value) =>
        BitConverter.IsLittleEndian ? value : BinaryPrimitives.ReverseEndianness(value);

    private static int LittleEndian(int value) =>
        BitConverter.IsLittleEndian ? value : BinaryPrimitives.ReverseEndianness(value);
}
