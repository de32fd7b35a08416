using System.Runtime.CompilerServices;
using System.Numerics;
using System.Buffers;
using System.Buffers.Binary;
using System.Globalization;
using System.Runtime.InteropServices;
using NAudio.Wave;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Streams a WAV file (PCM 8/16/24/32-bit integer, IEEE float 32/64-bit, plain or WAVE_FORMAT_EXTENSIBLE, any channel count)
/// block by block; nothing is buffered beyond one block. Each stored sample is a fraction of full scale and becomes
/// amperes through the calibration (<c>--scale</c>, <c>--range</c>/<c>--sensitivity</c>, or our own <c>wvck</c> chunk).
/// Not thread-safe.
/// </summary>
/// <remarks>Integer samples are normalised as <c>value / 2^(bits-1)</c>, so full scale 1.0 is the negative limit and
/// the positive limit is one LSB short of it.</remarks>
public sealed class WavCaptureSource : ICaptureSource
{
    private static readonly Guid PcmSubFormat = new("00000001-0000-0010-8000-00aa00389b71");
    private static readonly Guid FloatSubFormat = new("00000003-0000-0010-8000-00aa00389b71");

    private readonly string _path;
    private readonly FileStream _stream;
    private readonly WaveFileReader _reader;
    private readonly SampleKind _kind;
    private readonly int _bytesPerSample;
    private readonly int _channelCount;
    private readonly int _blockAlign;
    private readonly double _scaleA;
    private readonly ChannelSelection _selection;
    private readonly double[] _toAmperes;
    private readonly long _dataOffset;
    private readonly List<CaptureWarning> _warnings = [];
    private long _frame;
    private byte[] _bytes = [];

    private enum SampleKind
    {
        Pcm,
        Float,
    }

    /// <summary>Opens <paramref name="path"/> for streaming.</summary>
    /// <param name="path">The WAV file, as the user named it.</param>
    /// <param name="options">Calibration, channel choice and sensor coupling.</param>
    /// <exception cref="CaptureFormatException">Not a WAV file (with the byte offset), an encoding not supported,
    /// no calibration, or an unknown channel.</exception>
    public WavCaptureSource(string path, ImportOptions options)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        _path = path;
        _stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        try
        {
            var layout = RiffLayout.Scan(_stream, path);
            var format = FormatChunk.Read(_stream, path, layout.FormatOffset, layout.FormatBytes);
            _stream.Position = 0;
            try
            {
                _reader = new WaveFileReader(_stream);
            }
            catch (Exception ex) when (ex is FormatException or InvalidDataException or EndOfStreamException or ArgumentException
                                           or OverflowException or IndexOutOfRangeException)
            {
                throw new CaptureFormatException(path, $"not a readable WAV file: {ex.Message}", byteOffset: _stream.Position);
            }

            _kind = format.Kind;
            var encodingName = format.Name;
            _bytesPerSample = format.BitsPerSample / 8;
            _channelCount = format.Channels;
            _blockAlign = format.BlockAlign;

            var claimedBytes = layout.DataClaimedBytes;
            var presentBytes = Math.Min(claimedBytes, _stream.Length - layout.DataOffset);
            var frames = presentBytes / _blockAlign;
            if (frames == 0)
            {
                throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                    $"the data chunk holds {presentBytes} bytes{(presentBytes < claimedBytes ? $" (its header claims {claimedBytes})" : "")}, less than one sample frame of {_blockAlign} bytes: the capture has no samples"),
                    byteOffset: layout.DataOffset - 8);
            }

            if (presentBytes < claimedBytes)
            {
                var missingBytes = claimedBytes - presentBytes;
                var missingFrames = claimedBytes / _blockAlign - frames;
                _warnings.Add(new CaptureWarning("truncated",
                    string.Create(CultureInfo.InvariantCulture,
                        $"The header claims {claimedBytes} data bytes but the file holds {presentBytes}: {missingFrames} frames ({missingBytes} bytes) missing; analysing the {frames} frames present."),
                    frames / (double)format.SampleRateHz));
            }

            var (fileScaleA, fileSensor) = ReadOwnChunk(layout);
            var calibration = Calibrate(path, options, fileScaleA);
            _scaleA = calibration.ScaleA;

            var channels = new ChannelInfo[_channelCount];
            var all = new int[_channelCount];
            for (var c = 0; c < _channelCount; c++)
            {
                channels[c] = new ChannelInfo(c, $"ch{c + 1}", "FS", ChannelQuantity.Current, _scaleA, _scaleA);
                all[c] = c;
            }

            _selection = ChannelSelection.Resolve(channels, options, all, "the file has no channels",
                problem => new CaptureFormatException(path, problem));
            if (_selection.Warning is { } guessed)
            {
                _warnings.Add(guessed);
            }

            _toAmperes = _selection.AmperesPerSiUnit(channels, options, (_, problem) => new CaptureFormatException(path, problem));
            var sensor = options.Sensor != SensorCoupling.Unknown ? options.Sensor : fileSensor ?? SensorCoupling.Unknown;
            Info = new CaptureInfo
            {
                FilePath = path,
                Format = "wav",
                Encoding = $"{encodingName}, {_channelCount} channel{(_channelCount == 1 ? "" : "s")}",
                Channels = channels,
                ResidualSource = _selection.Source,
                ResidualChannels = _selection.Indices,
                SampleRateHz = format.SampleRateHz,
                SampleCount = frames,
                Calibration = calibration,
                SensorCoupling = sensor,
                FullScaleA = _selection.Indices.Count == 1 ? _scaleA : null,
            };
            _dataOffset = layout.DataOffset;
            _stream.Position = layout.DataOffset;
        }
        catch
        {
            _reader?.Dispose();
            _stream.Dispose();
            throw;
        }
    }

    /// <inheritdoc />
    public CaptureInfo Info { get; }

    /// <inheritdoc />
    public IReadOnlyList<CaptureWarning> Warnings => _warnings;

    /// <inheritdoc />
    public CaptureBlock CreateBlock(int capacity = 65536) => new(_channelCount, capacity, Info.SampleRateHz);

    /// <inheritdoc />
    public bool Read(CaptureBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        block.StartSample = _frame;
        var wanted = (int)Math.Min(block.Capacity, Info.SampleCount - _frame);
        if (wanted <= 0)
        {
            block.Length = 0;
            return false;
        }

        var byteCount = wanted * _blockAlign;
        if (_bytes.Length < byteCount)
        {
            if (_bytes.Length > 0)
            {
                ArrayPool<byte>.Shared.Return(_bytes);
            }

            _bytes = ArrayPool<byte>.Shared.Rent(byteCount);
        }

        var filled = 0;
        while (filled < byteCount)
        {
            var n = _reader.Read(_bytes.AsSpan(filled, byteCount - filled));
            if (n <= 0)
            {
                break;
            }

            filled += n;
        }

        var frames = filled / _blockAlign;
        if (frames == 0)
        {
            block.Length = 0;
            return false;
        }

        Decode(_bytes.AsSpan(0, frames * _blockAlign), block, frames);
        if (_kind == SampleKind.Float)
        {
            // Integer samples scaled by a bounded full scale are always finite; floats may hold NaN or infinities.
            CheckSamples(block, frames);
        }

        _selection.FormResidual(block, frames, _toAmperes);
        block.Length = frames;
        _frame += frames;
        return true;
    }

    /// <inheritdoc />
    public void Dispose()
    {
        _reader.Dispose();
        _stream.Dispose();
        if (_bytes.Length > 0)
        {
            ArrayPool<byte>.Shared.Return(_bytes);
            _bytes = [];
        }
    }

    private void CheckSamples(CaptureBlock block, int frames)
    {
        for (var c = 0; c < _channelCount; c++)
        {
            var values = block.ChannelBuffer(c)[..frames];
            var bad = CaptureLimits.IndexOfInvalid(values);
            if (bad >= 0)
            {
                var sample = _frame + bad;
                throw new CaptureFormatException(_path,
                    CaptureLimits.SampleProblem(Info.Channels[c].Name, values[bad], sample / Info.SampleRateHz, "A"),
                    byteOffset: _dataOffset + (sample * _blockAlign) + (c * _bytesPerSample), sampleIndex: sample);
            }
        }
    }

    private void Decode(ReadOnlySpan<byte> bytes, CaptureBlock block, int frames)
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
                case (SampleKind.Pcm, 1):
                    for (var n = 0; n < frames; n++)
                    {
                        target[n] = (bytes[n * stride + c] - 128) / 128.0 * scale;
                    }

                    break;
                case (SampleKind.Pcm, 2):
                    {
                        var s = MemoryMarshal.Cast<byte, short>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = LittleEndian(s[n * stride + c]) / 32768.0 * scale;
                        }

                        break;
                    }

                case (SampleKind.Pcm, 3):
                    for (var n = 0; n < frames; n++)
                    {
                        var i = (n * stride + c) * 3;
                        var v = bytes[i] | (bytes[i + 1] << 8) | ((sbyte)bytes[i + 2] << 16);
                        target[n] = v / 8388608.0 * scale;
                    }

                    break;
                case (SampleKind.Pcm, 4):
                    {
                        var s = MemoryMarshal.Cast<byte, int>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = LittleEndian(s[n * stride + c]) / 2147483648.0 * scale;
                        }

                        break;
                    }

                case (SampleKind.Float, 4):
                    {
                        var s = MemoryMarshal.Cast<byte, float>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = s[n * stride + c] * scale;
                        }

                        break;
                    }

                case (SampleKind.Float, 8):
                    {
                        var s = MemoryMarshal.Cast<byte, double>(bytes);
                        for (var n = 0; n < frames; n++)
                        {
                            target[n] = s[n * stride + c] * scale;
                        }

                        break;
                    }

                default:
                    throw new InvalidOperationException("sample kind checked at open");
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
        if (_kind == SampleKind.Float && _bytesPerSample == 4 && BitConverter.IsLittleEndian)
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

        if (_kind == SampleKind.Pcm && _bytesPerSample == 2 && BitConverter.IsLittleEndian)
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

    private (double? FullScaleA, SensorCoupling? Sensor) ReadOwnChunk(RiffLayout layout)
    {
        if (layout.OwnChunkOffset is not { } offset)
        {
            return (null, null);
        }

        var payload = new byte[layout.OwnChunkLength];
        _stream.Position = offset;
        _stream.ReadExactly(payload);
        return WaveCheckChunk.Parse(_path, offset - 8, payload);
    }

    private static Calibration Calibrate(string path, ImportOptions options, double? fileScaleA)
    {
        var fromFile = fileScaleA is { } fs
            ? string.Create(CultureInfo.InvariantCulture, $"{fs:G6} A full scale")
            : null;
        if (options.ScaleA is { } scale)
        {

            var source = string.Create(CultureInfo.InvariantCulture, $"--scale {scale:G6} A full scale");
            return new Calibration(scale, 0, fromFile is null ? source : $"{source} (overrides the file's {fromFile})");
        }

        if (options.RangeV is { } range && options.SensitivityVPerA is { } sensitivity)
        {
            var fullScale = range / sensitivity;
            if (CaptureLimits.ScaleProblem("full scale (range / sensitivity)", fullScale, "A") is { } fullScaleProblem)
            {
                throw new CaptureFormatException(path, $"--range and --sensitivity: {fullScaleProblem}");
            }

            var source = string.Create(CultureInfo.InvariantCulture,
                $"range {range:G6} V / sensitivity {sensitivity:G6} mV/mA = {fullScale:G6} A full scale");
            return new Calibration(fullScale, 0, fromFile is null ? source : $"{source} (overrides the file's {fromFile})");
        }

        if (options.RangeV is not null || options.SensitivityVPerA is not null)
        {
            throw new CaptureFormatException(path,
                options.RangeV is null
                    ? "--sensitivity needs --range to scale a WAV file (or give --scale)"
                    : "--range needs --sensitivity to scale a WAV file (or give --scale)");
        }

        if (fileScaleA is { } own)
        {
            return new Calibration(own, 0, $"file metadata (wvck chunk): {fromFile}");
        }

        throw new CaptureFormatException(path,
            "WAV samples are fractions of full scale and the file states no scale: give --scale (amperes at full scale) or --sensitivity with --range");
    }

    /// <summary>Where the RIFF chunks lie, walked by hand so that problems carry a byte offset.</summary>
    private sealed record RiffLayout(long FormatOffset, int FormatBytes, long DataOffset, long DataClaimedBytes,
        long? OwnChunkOffset, int OwnChunkLength)
    {
        /// <summary>Largest calibration chunk read (ours holds some 40 bytes of text).</summary>
        private const int MaxOwnChunkBytes = 4096;

        public static RiffLayout Scan(FileStream stream, string path)
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

            return new RiffLayout(fmt.Value, fmtBytes, data.Value, dataBytes, own, ownLength);
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

    /// <summary>The fmt chunk's fields, each checked where it lies so that a message names its byte.</summary>
    private sealed record FormatChunk(SampleKind Kind, string Name, int Channels, int SampleRateHz, int BlockAlign, int BitsPerSample)
    {
        private const ushort TagPcm = 1;
        private const ushort TagFloat = 3;
        private const ushort TagExtensible = 0xFFFE;

        public static FormatChunk Read(FileStream stream, string path, long chunkOffset, int chunkBytes)
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

            (SampleKind Kind, string Name) kind = (effective, bits) switch
            {
                (TagPcm, 8 or 16 or 24 or 32) => (SampleKind.Pcm, $"PCM {bits}-bit{suffix}"),
                (TagFloat, 32 or 64) => (SampleKind.Float, $"IEEE float {bits}-bit{suffix}"),
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

            return new FormatChunk(kind.Kind, kind.Name, channels, (int)rate, blockAlign, bits);
        }
    }
}
