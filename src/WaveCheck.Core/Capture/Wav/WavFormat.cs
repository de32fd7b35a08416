using System.Buffers.Binary;
using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>How a WAV file stores its samples.</summary>
internal enum WavSampleKind
{
    /// <summary>Signed integers (unsigned for 8 bits), a fraction of full scale.</summary>
    Pcm,

    /// <summary>IEEE floats, a fraction of full scale.</summary>
    Float,
}

/// <summary>The <c>fmt </c> chunk's fields (Microsoft WAVEFORMATEX / WAVEFORMATEXTENSIBLE), each checked where it lies
/// so that a message names its byte.</summary>
/// <param name="Kind">Integer or float samples.</param>
/// <param name="Name">The encoding for a person, e.g. <c>PCM 24-bit (extensible)</c>.</param>
/// <param name="Channels">Channels per frame, 1 to <see cref="CaptureLimits.MaxChannels"/>.</param>
/// <param name="SampleRateHz">Frames per second, within the bounds of <see cref="CaptureLimits"/>.</param>
/// <param name="BlockAlign">Bytes per frame.</param>
/// <param name="BitsPerSample">Bits per stored sample: 8, 16, 24, 32 (PCM) or 32, 64 (float).</param>
internal sealed record WavFormat(WavSampleKind Kind, string Name, int Channels, int SampleRateHz, int BlockAlign, int BitsPerSample)
{
    private const ushort TagPcm = 1;
    private const ushort TagFloat = 3;
    private const ushort TagExtensible = 0xFFFE;

    private static readonly Guid PcmSubFormat = new("00000001-0000-0010-8000-00aa00389b71");
    private static readonly Guid FloatSubFormat = new("00000003-0000-0010-8000-00aa00389b71");

    /// <summary>Bytes per stored sample.</summary>
    public int BytesPerSample => BitsPerSample / 8;

    /// <summary>Reads and checks the chunk at <paramref name="chunkOffset"/>.</summary>
    /// <param name="stream">The file, seekable.</param>
    /// <param name="path">The file as the user named it, for messages.</param>
    /// <param name="chunkOffset">Byte offset of the chunk's header.</param>
    /// <param name="chunkBytes">Size the chunk claims.</param>
    /// <exception cref="CaptureFormatException">A field out of bounds or inconsistent with the others, or an
    /// encoding not supported, with the field's byte offset.</exception>
    public static WavFormat Read(Stream stream, string path, long chunkOffset, int chunkBytes)
    {
        var at = chunkOffset + 8;
        if (chunkBytes < 16)
        {
            throw new CaptureFormatException(path, $"the 'fmt ' chunk is {chunkBytes} bytes: expected at least 16", byteOffset: chunkOffset + 4);
        }

        Span<byte> f = stackalloc byte[40];
        stream.Position = at;
        stream.ReadExactly(f[..Math.Min(40, chunkBytes)]);
        var tag = BinaryPrimitives.ReadUInt16LittleEndian(f);
        var channels = BinaryPrimitives.ReadUInt16LittleEndian(f[2..]);
        var rate = BinaryPrimitives.ReadUInt32LittleEndian(f[4..]);
        var byteRate = BinaryPrimitives.ReadUInt32LittleEndian(f[8..]);
        var blockAlign = BinaryPrimitives.ReadUInt16LittleEndian(f[12..]);
        var bits = BinaryPrimitives.ReadUInt16LittleEndian(f[14..]);
        if (channels is < 1 or > CaptureLimits.MaxChannels)
        {
            throw new CaptureFormatException(path,
                $"fmt chunk: channel count {channels}: expected 1 to {CaptureLimits.MaxChannels}", byteOffset: at + 2);
        }

        if (CaptureLimits.RateProblem(rate) is { } rateProblem)
        {
            throw new CaptureFormatException(path, $"fmt chunk: {rateProblem}", byteOffset: at + 4);
        }

        var effective = tag;
        var suffix = string.Empty;
        if (tag == TagExtensible)
        {
            if (chunkBytes < 40)
            {
                throw new CaptureFormatException(path,
                    $"the 'fmt ' chunk of a WAVE_FORMAT_EXTENSIBLE file is {chunkBytes} bytes: expected at least 40", byteOffset: chunkOffset + 4);
            }

            var extraSize = BinaryPrimitives.ReadUInt16LittleEndian(f[16..]);
            if (extraSize < 22)
            {
                throw new CaptureFormatException(path,
                    $"fmt chunk: extension size {extraSize} bytes: WAVE_FORMAT_EXTENSIBLE needs 22", byteOffset: at + 16);
            }

            var validBits = BinaryPrimitives.ReadUInt16LittleEndian(f[18..]);
            if (validBits > bits)
            {
                throw new CaptureFormatException(path,
                    $"fmt chunk: {validBits} valid bits in a {bits}-bit sample", byteOffset: at + 18);
            }

            // The SubFormat GUID sits 24 bytes into the fmt data; its first two bytes are the plain format tag.
            var subFormat = new Guid(f.Slice(24, 16));
            effective = subFormat == PcmSubFormat ? TagPcm : subFormat == FloatSubFormat ? TagFloat : (ushort)0;
            if (effective == 0)
            {
                throw new CaptureFormatException(path,
                    $"fmt chunk: extensible sub-format {subFormat} is not supported: expected PCM or IEEE float", byteOffset: at + 24);
            }

            suffix = " (extensible)";
        }

        (WavSampleKind Kind, string Name) kind = (effective, bits) switch
        {
            (TagPcm, 8 or 16 or 24 or 32) => (WavSampleKind.Pcm, $"PCM {bits}-bit{suffix}"),
            (TagFloat, 32 or 64) => (WavSampleKind.Float, $"IEEE float {bits}-bit{suffix}"),
            (TagPcm or TagFloat, _) => throw new CaptureFormatException(path,
                $"fmt chunk: {bits} bits per sample is not supported for {(effective == TagPcm ? "PCM" : "IEEE float")}: expected PCM 8/16/24/32-bit or IEEE float 32/64-bit",
                byteOffset: at + 14),
            _ => throw new CaptureFormatException(path,
                $"WAV encoding tag {tag} (0x{tag:X4}) is not supported: expected PCM (1), IEEE float (3) or extensible (0xFFFE)",
                byteOffset: at),
        };

        var expectedAlign = channels * (bits / 8);
        if (blockAlign != expectedAlign)
        {
            throw new CaptureFormatException(path,
                $"fmt chunk: block align {blockAlign} bytes does not match {channels} channel{(channels == 1 ? "" : "s")} of {bits} bits ({expectedAlign} bytes)", byteOffset: at + 12);
        }

        if (byteRate != (long)rate * blockAlign)
        {
            throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                $"fmt chunk: byte rate {byteRate} does not match {rate} Hz × {blockAlign} bytes ({(long)rate * blockAlign})"), byteOffset: at + 8);
        }

        return new WavFormat(kind.Kind, kind.Name, channels, (int)rate, blockAlign, bits);
    }
}
