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
        _path = path;
        _stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        try
        {
            var layout = RiffLayout.Scan(_stream, path);
            _stream.Position = 0;
            try
            {
                _reader = new WaveFileReader(_stream);
            }
            catch (Exception ex) when (ex is FormatException or InvalidDataException or EndOfStreamException or ArgumentException)
            {
                throw new CaptureFormatException(path, $"not a readable WAV file: {ex.Message}", byteOffset: _stream.Position);
            }

            var format = _reader.WaveFormat;
            (_kind, var encodingName) = Classify(format, layout.FormatOffset);
            _bytesPerSample = format.BitsPerSample / 8;
            _channelCount = format.Channels;
            _blockAlign = format.BlockAlign;
            if (_channelCount < 1 || _blockAlign != _bytesPerSample * _channelCount || format.SampleRate <= 0)
            {
                throw new CaptureFormatException(path,
                    $"inconsistent fmt chunk: {_channelCount} channels, {format.BitsPerSample} bits, block align {_blockAlign}, rate {format.SampleRate} Hz",
                    byteOffset: layout.FormatOffset);
            }

            var claimedBytes = layout.DataClaimedBytes;
            var presentBytes = Math.Min(claimedBytes, _stream.Length - layout.DataOffset);
            var frames = presentBytes / _blockAlign;
            if (presentBytes < claimedBytes)
            {
                var missingBytes = claimedBytes - presentBytes;
                var missingFrames = claimedBytes / _blockAlign - frames;
                _warnings.Add(new CaptureWarning("truncated",
                    string.Create(CultureInfo.InvariantCulture,
                        $"The header claims {claimedBytes} data bytes but the file holds {presentBytes}: {missingFrames} frames ({missingBytes} bytes) missing; analysing the {frames} frames present."),
                    frames / (double)format.SampleRate));
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

            _selection = ChannelSelection.Resolve(channels, options, all,
                problem => new CaptureFormatException(path, problem));
            if (_selection.Warning is { } guessed)
            {
                _warnings.Add(guessed);
            }

            _toAmperes = new double[_selection.Indices.Count];
            Array.Fill(_toAmperes, 1.0);
            var sensor = options.Sensor != SensorCoupling.Unknown ? options.Sensor : fileSensor ?? SensorCoupling.Unknown;
            Info = new CaptureInfo
            {
                FilePath = path,
                Format = "wav",
                Encoding = $"{encodingName}, {_channelCount} channel{(_channelCount == 1 ? "" : "s")}",
                Channels = channels,
                ResidualSource = _selection.Source,
                ResidualChannels = _selection.Indices,
                SampleRateHz = format.SampleRate,
                SampleCount = frames,
                Calibration = calibration,
                SensorCoupling = sensor,
                FullScaleA = _selection.Indices.Count == 1 ? _scaleA : null,
            };
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

    private (SampleKind Kind, string Name) Classify(WaveFormat format, long formatOffset)
    {
        var encoding = format.Encoding;
        var extensible = false;
        if (encoding == WaveFormatEncoding.Extensible)
        {
            // The SubFormat GUID sits 24 bytes into the fmt data; its first two bytes are the plain format tag.
            extensible = true;
            var subFormat = ReadSubFormat(formatOffset);
            encoding = subFormat == PcmSubFormat ? WaveFormatEncoding.Pcm
                : subFormat == FloatSubFormat ? WaveFormatEncoding.IeeeFloat
                : WaveFormatEncoding.Unknown;
        }

        var bits = format.BitsPerSample;
        var suffix = extensible ? " (extensible)" : "";
        if (encoding == WaveFormatEncoding.Pcm && bits is 8 or 16 or 24 or 32)
        {
            return (SampleKind.Pcm, $"PCM {bits}-bit{suffix}");
        }

        if (encoding == WaveFormatEncoding.IeeeFloat && bits is 32 or 64)
        {
            return (SampleKind.Float, $"IEEE float {bits}-bit{suffix}");
        }

        throw new CaptureFormatException(_path,
            $"WAV encoding {format.Encoding} with {bits} bits is not supported: expected PCM 8/16/24/32-bit or IEEE float 32/64-bit",
            byteOffset: formatOffset);
    }

    private Guid? ReadSubFormat(long formatOffset)
    {
        Span<byte> guid = stackalloc byte[16];
        _stream.Position = formatOffset + 8 + 24;
        return _stream.ReadAtLeast(guid, 16, throwOnEndOfStream: false) == 16 ? new Guid(guid) : null;
    }

    private (double? FullScaleA, SensorCoupling? Sensor) ReadOwnChunk(RiffLayout layout)
    {
        if (layout.OwnChunkOffset is not { } offset || layout.OwnChunkLength is <= 0 or > 4096)
        {
            return (null, null);
        }

        var payload = new byte[layout.OwnChunkLength];
        _stream.Position = offset;
        _stream.ReadExactly(payload);
        return WaveCheckChunk.Parse(payload);
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
    private sealed record RiffLayout(long FormatOffset, long DataOffset, long DataClaimedBytes, long? OwnChunkOffset, int OwnChunkLength)
    {
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

            long? fmt = null;
            long? data = null;
            long dataBytes = 0;
            long? own = null;
            var ownLength = 0;
            var position = 12L;
            Span<byte> chunk = stackalloc byte[8];
            while (position + 8 <= stream.Length)
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

                if (id.SequenceEqual("fmt "u8))
                {
                    fmt = position;
                }
                else if (id.SequenceEqual("data"u8))
                {
                    data = position + 8;
                    dataBytes = size;
                }
                else if (id.SequenceEqual("wvck"u8))
                {
                    own = position + 8;
                    ownLength = (int)Math.Min(size, int.MaxValue);
                }

                position += 8 + size + (size & 1);
            }

            if (fmt is null)
            {
                throw new CaptureFormatException(path, "WAV file has no 'fmt ' chunk", byteOffset: 12);
            }

            if (data is null)
            {
                throw new CaptureFormatException(path, "WAV file has no 'data' chunk", byteOffset: stream.Length);
            }

            return new RiffLayout(fmt.Value, data.Value, dataBytes, own, ownLength);
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
}
