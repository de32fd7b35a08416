using System.Buffers.Binary;
using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Where the chunks of a RIFF/WAVE file lie: the <c>fmt </c> and <c>data</c> chunks and our own <c>wvck</c>
/// calibration chunk. Walked by hand, chunk header by chunk header, so that every problem carries its byte offset.
/// </summary>
/// <param name="FormatOffset">Byte offset of the <c>fmt </c> chunk's header.</param>
/// <param name="FormatBytes">Size the <c>fmt </c> chunk claims.</param>
/// <param name="DataOffset">Byte offset of the first sample (after the <c>data</c> chunk's header).</param>
/// <param name="DataClaimedBytes">Size the <c>data</c> chunk claims; the file may hold less (a recording cut short).</param>
/// <param name="OwnChunkOffset">Byte offset of the <c>wvck</c> chunk's payload, if the file has one.</param>
/// <param name="OwnChunkLength">Size of that payload.</param>
internal sealed record RiffLayout(long FormatOffset, int FormatBytes, long DataOffset, long DataClaimedBytes,
    long? OwnChunkOffset, int OwnChunkLength)
{
    /// <summary>When the recording started, from a Broadcast Wave <c>bext</c> chunk's origination date and time or,
    /// failing that, a <c>LIST</c>/<c>INFO</c> chunk's <c>ICRD</c> (creation date); null when neither states one.
    /// Neither field carries a time zone: the time is taken as stated, with offset zero (as a CSV stamp without one).</summary>
    public DateTimeOffset? StartTime { get; init; }

    /// <summary>Offset of <c>OriginationDate</c> in a <c>bext</c> chunk: after Description (256), Originator (32) and
    /// OriginatorReference (32) bytes (EBU Tech 3285, from memory).</summary>
    private const int BextDateOffset = 320;

    /// <summary>Largest <c>LIST</c> chunk looked into for a creation date (engineering choice: INFO lists are short).</summary>
    private const int MaxListBytes = 64 << 10;

    /// <summary>Largest calibration chunk read (ours holds some 40 bytes of text).</summary>
    private const int MaxOwnChunkBytes = 4096;

    /// <summary>Walks the chunks from the start of <paramref name="stream"/>.</summary>
    /// <param name="stream">The file, seekable; left at an unspecified position.</param>
    /// <param name="path">The file as the user named it, for messages.</param>
    /// <exception cref="CaptureFormatException">Not RIFF/WAVE, a chunk header that is not one, a chunk (other than
    /// <c>data</c>) past the end of the file, a second <c>fmt </c>, <c>data</c> or <c>wvck</c> chunk, a calibration
    /// chunk of an implausible size, no <c>fmt </c> or <c>data</c> chunk, or a RIFF size that ends before them.</exception>
    public static RiffLayout Scan(Stream stream, string path)
    {
        Span<byte> header = stackalloc byte[12];
        var got = stream.ReadAtLeast(header, 12, throwOnEndOfStream: false);
        if (got < 4 || !header[..4].SequenceEqual("RIFF"u8))
        {
            throw new CaptureFormatException(path,
                got == 0 ? "empty file" : "not a WAV file: expected 'RIFF' at the start", byteOffset: 0);
        }

        if (got < 12 || !header[8..12].SequenceEqual("WAVE"u8))
        {
            throw new CaptureFormatException(path, "not a WAV file: expected 'WAVE' after the RIFF header", byteOffset: 8);
        }

        var length = stream.Length;
        var riffSize = BinaryPrimitives.ReadUInt32LittleEndian(header[4..]);
        long? fmt = null;
        var fmtBytes = 0;
        long? data = null;
        long dataBytes = 0;
        long? own = null;
        var ownLength = 0;
        DateTimeOffset? bextStart = null;
        DateTimeOffset? listStart = null;
        var position = 12L;
        Span<byte> chunk = stackalloc byte[8];
        while (position + 8 <= length)
        {
            stream.Position = position;
            stream.ReadExactly(chunk);
            var size = BinaryPrimitives.ReadUInt32LittleEndian(chunk[4..]);
            var id = chunk[..4];
            if (!IsChunkId(id))
            {
                if (data is not null)
                {
                    break; // trailing bytes after the audio: ignored, the data is intact
                }

                throw new CaptureFormatException(path, "not a WAV chunk header: expected a four-letter chunk id", byteOffset: position);
            }

            var name = System.Text.Encoding.ASCII.GetString(id);
            var end = position + 8 + size;
            if (id.SequenceEqual("data"u8))
            {
                if (data is { } first)
                {
                    throw new CaptureFormatException(path,
                        $"a second 'data' chunk (the first at byte {first - 8}): a WAV file holds its samples in one", byteOffset: position);
                }

                // A data chunk may claim more than the file holds: a recording cut short, read as far as it goes.
                data = position + 8;
                dataBytes = size;
                if (size == uint.MaxValue)
                {
                    // 0xFFFFFFFF marks samples written as a stream of unknown length, and is the only way a RIFF file
                    // holds more than 4 GiB of them (a day at 50 kS/s in PCM16 is 8.6 GB): they run to the end of the file.
                    dataBytes = length - (position + 8);
                    break;
                }
            }
            else if (end > length)
            {
                throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                    $"the '{ShownText.Of(name)}' chunk claims {size} bytes but the file ends {length - position - 8} bytes after its header"),
                    byteOffset: position + 4);
            }
            else if (id.SequenceEqual("fmt "u8))
            {
                if (fmt is { } first)
                {
                    throw new CaptureFormatException(path,
                        $"a second 'fmt ' chunk (the first at byte {first}): a WAV file has one format", byteOffset: position);
                }

                fmt = position;
                fmtBytes = (int)size;
            }
            else if (id.SequenceEqual("wvck"u8))
            {
                if (own is { } first)
                {
                    throw new CaptureFormatException(path,
                        $"a second calibration chunk 'wvck' (the first at byte {first - 8})", byteOffset: position);
                }

                if (size is 0 or > MaxOwnChunkBytes)
                {
                    throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                        $"calibration chunk 'wvck' claims {size} bytes: expected 1 to {MaxOwnChunkBytes}"), byteOffset: position + 4);
                }

                own = position + 8;
                ownLength = (int)size;
            }
            else if (id.SequenceEqual("bext"u8) && size >= BextDateOffset + 18)
            {
                bextStart ??= BextStart(stream, position + 8);
            }
            else if (id.SequenceEqual("LIST"u8) && size is >= 12 and <= MaxListBytes)
            {
                listStart ??= InfoCreationDate(stream, position + 8, (int)size);
            }

            position = end + (size & 1);
        }

        if (fmt is null)
        {
            throw new CaptureFormatException(path, "WAV file has no 'fmt ' chunk", byteOffset: 12);
        }

        if (data is null)
        {
            throw new CaptureFormatException(path, "WAV file has no 'data' chunk", byteOffset: length);
        }

        // A RIFF size past the end of the file is a recording cut short (read as far as it goes); one that ends
        // before the chunks' headers leaves them outside the file's own account of itself.
        if (riffSize + 8L < Math.Max(fmt.Value + 8, data.Value))
        {
            throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                $"RIFF size {riffSize} ends the file at byte {riffSize + 8L}, before the '{(fmt.Value + 8 > data.Value ? "fmt " : "data")}' chunk at byte {Math.Max(fmt.Value, data.Value - 8)}"),
                byteOffset: 4);
        }

        return new RiffLayout(fmt.Value, fmtBytes, data.Value, dataBytes, own, ownLength) { StartTime = bextStart ?? listStart };
    }

    /// <summary>A <c>bext</c> chunk's <c>OriginationDate</c> (<c>yyyy-mm-dd</c>) and <c>OriginationTime</c>
    /// (<c>hh:mm:ss</c>; any separator); null when they do not make a date and time.</summary>
    private static DateTimeOffset? BextStart(Stream stream, long payload)
    {
        Span<byte> field = stackalloc byte[18];
        stream.Position = payload + BextDateOffset;
        stream.ReadExactly(field);
        var text = System.Text.Encoding.ASCII.GetString(field);
        var digits = new System.Text.StringBuilder(14);
        foreach (var c in text)
        {
            if (char.IsAsciiDigit(c))
            {
                digits.Append(c);
            }
        }

        return digits.Length == 14 && DateTime.TryParseExact(digits.ToString(), "yyyyMMddHHmmss", CultureInfo.InvariantCulture,
            DateTimeStyles.None, out var stamp)
            ? new DateTimeOffset(stamp, TimeSpan.Zero)
            : null;
    }

    /// <summary>The <c>ICRD</c> entry of a <c>LIST</c> chunk of type <c>INFO</c>, read as an ISO 8601 date or date
    /// and time; null when there is none or it is no date.</summary>
    private static DateTimeOffset? InfoCreationDate(Stream stream, long payload, int size)
    {
        var bytes = new byte[size];
        stream.Position = payload;
        stream.ReadExactly(bytes);
        if (!bytes.AsSpan(0, 4).SequenceEqual("INFO"u8))
        {
            return null;
        }

        var at = 4;
        while (at + 8 <= size)
        {
            var length = BinaryPrimitives.ReadInt32LittleEndian(bytes.AsSpan(at + 4));
            if (length < 0 || at + 8 + length > size)
            {
                return null;
            }

            if (bytes.AsSpan(at, 4).SequenceEqual("ICRD"u8))
            {
                var text = System.Text.Encoding.ASCII.GetString(bytes, at + 8, length).TrimEnd('\0', ' ');
                return DateTimeOffset.TryParse(text, CultureInfo.InvariantCulture,
                    DateTimeStyles.AssumeUniversal | DateTimeStyles.AllowWhiteSpaces, out var stamp) ? stamp : null;
            }

            at += 8 + length + (length & 1);
        }

        return null;
    }

    private static bool IsChunkId(ReadOnlySpan<byte> id)
    {
        foreach (var b in id)
        {
            if (b < 0x20 || b > 0x7E)
            {
                return false;
            }
        }

        return true;
    }
}
