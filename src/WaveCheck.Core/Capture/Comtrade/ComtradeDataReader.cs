using System.Buffers;
using System.Buffers.Binary;
using System.Globalization;

namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>
/// Streams the samples of a COMTRADE data file (or a .cff's DAT section) as raw stored values <c>x</c>, frame by
/// frame: analog values interleaved (frame-major), NaN where the file marks a value missing; time stamps in file
/// units, -1 where missing. Digital status words are read past. Not thread-safe.
/// </summary>
internal abstract class ComtradeDataReader : IDisposable
{
    protected ComtradeDataReader(string filePath, ComtradeConfig config)
    {
        FilePath = filePath;
        Config = config;
    }

    /// <summary>The file named in error messages.</summary>
    public string FilePath { get; }

    protected ComtradeConfig Config { get; }

    /// <summary>Frames read or skipped so far (0-based index of the next frame).</summary>
    public long Position { get; protected set; }

    /// <summary>Where reading stopped, for a message about a file that ends early (e.g. <c>line 12</c>, <c>byte 480</c>).</summary>
    public abstract string Place { get; }

    /// <summary>True when the file holds more than the cfg's samples (checked once the cfg's samples have been read).</summary>
    public abstract bool HasExtraData();

    /// <summary>Opens the reader for a data section.</summary>
    /// <param name="filePath">File named in messages.</param>
    /// <param name="stream">Stream positioned at the first sample; owned by the reader.</param>
    /// <param name="config">The cfg.</param>
    /// <param name="byteLength">Bytes of the section (binary .cff), or null for "to the end of the stream".</param>
    /// <param name="firstLineNumber">Line number of the first data line (ASCII), for messages.</param>
    public static ComtradeDataReader Create(string filePath, Stream stream, ComtradeConfig config, long? byteLength,
        long firstLineNumber) =>
        config.FileType == ComtradeDataFileType.Ascii
            ? new ComtradeAsciiReader(filePath, stream, config, firstLineNumber)
            : new ComtradeBinaryReader(filePath, stream, config, byteLength);

    /// <summary>Opens the data of a located record, positioned at its first sample.</summary>
    /// <param name="container">Where the data lies (a .dat, or a .cff's DAT section).</param>
    /// <param name="config">The cfg.</param>
    public static ComtradeDataReader Open(ComtradeContainer container, ComtradeConfig config)
    {
        var stream = new FileStream(container.DataPath, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
        try
        {
            stream.Seek(container.DataOffset, SeekOrigin.Begin);
            return Create(container.DataPath, stream, config, container.DataBytes, container.DataFirstLine);
        }
        catch
        {
            stream.Dispose();
            throw;
        }
    }

    /// <summary>Reads up to <paramref name="maxFrames"/> frames.</summary>
    /// <param name="raw">Receives <c>frames × analog count</c> stored values, frame-major.</param>
    /// <param name="stamps">Receives one time stamp per frame (file units, -1 missing).</param>
    /// <param name="maxFrames">Frames wanted.</param>
    /// <returns>Frames read; fewer only at the end of the data.</returns>
    public abstract int Read(Span<double> raw, Span<long> stamps, int maxFrames);

    /// <summary>Skips <paramref name="frames"/> frames (to reach a later rate section).</summary>
    public abstract void Skip(long frames);

    /// <summary>An error placed at one value of the last <see cref="Read"/>: the line and field (ASCII) or the byte
    /// (binary), and the sample.</summary>
    /// <param name="frame">Frame index within the last read.</param>
    /// <param name="channel">0-based analog channel.</param>
    /// <param name="problem">What is wrong.</param>
    public abstract CaptureFormatException ValueError(int frame, int channel, string problem);

    /// <inheritdoc />
    public abstract void Dispose();
}

/// <summary>BINARY (int16), BINARY32 (int32) and FLOAT32 data (C37.111-2013 clause 8.4, from memory): per sample a
/// uint32 sample number, a uint32 time stamp, the analog values, then 16-bit status words; little-endian.</summary>
internal sealed class ComtradeBinaryReader : ComtradeDataReader
{
    private const int FramesPerChunk = 4096;
    private readonly Stream _stream;
    private readonly long _dataStart;
    private readonly long _availableBytes;
    private readonly int _frameBytes;
    private byte[] _chunk;

    public ComtradeBinaryReader(string filePath, Stream stream, ComtradeConfig config, long? byteLength)
        : base(filePath, config)
    {
        _stream = stream;
        _dataStart = stream.Position;
        _frameBytes = config.BinaryFrameBytes;
        var toEnd = stream.Length - _dataStart;
        _availableBytes = byteLength is null ? toEnd : Math.Min(byteLength.Value, toEnd);
        var whole = _availableBytes / _frameBytes;
        if (config.TotalSamples > whole)
        {
            // TotalSamples is bounded by the cfg parser (2^40), so the product cannot overflow.
            var needed = config.TotalSamples * _frameBytes;
            throw new CaptureFormatException(filePath,
                $"the data ends after {whole} whole samples ({_availableBytes} bytes); the cfg says {config.TotalSamples} samples of {_frameBytes} bytes ({needed} bytes)",
                byteOffset: _dataStart + _availableBytes, sampleIndex: whole);
        }

        _chunk = ArrayPool<byte>.Shared.Rent(_frameBytes * FramesPerChunk);
    }

    private long _lastReadStart;

    public override string Place => $"byte {_dataStart + (Position * _frameBytes)}";

    public override CaptureFormatException ValueError(int frame, int channel, string problem)
    {
        var sample = _lastReadStart + frame;
        return new CaptureFormatException(FilePath, problem,
            byteOffset: _dataStart + (sample * _frameBytes) + 8 + (channel * Config.AnalogValueBytes), sampleIndex: sample);
    }

    public override bool HasExtraData() => _availableBytes > Config.TotalSamples * _frameBytes;

    public override int Read(Span<double> raw, Span<long> stamps, int maxFrames)
    {
        var analogCount = Config.Analog.Count;
        var valueBytes = Config.AnalogValueBytes;
        var type = Config.FileType;
        var done = 0;
        _lastReadStart = Position;
        while (done < maxFrames)
        {
            var frames = (int)Math.Min(Math.Min(maxFrames - done, FramesPerChunk), (_availableBytes / _frameBytes) - Position);
            if (frames <= 0)
            {
                break;
            }

            var bytes = _chunk.AsSpan(0, frames * _frameBytes);
            _stream.ReadExactly(bytes);
            for (var f = 0; f < frames; f++)
            {
                var frame = bytes.Slice(f * _frameBytes, _frameBytes);
                var stamp = BinaryPrimitives.ReadUInt32LittleEndian(frame[4..]);
                stamps[done + f] = stamp == uint.MaxValue ? -1 : stamp; // 0xFFFFFFFF: stamp missing (2013, from memory)
                var values = raw.Slice((done + f) * analogCount, analogCount);
                for (var c = 0; c < analogCount; c++)
                {
                    var at = frame.Slice(8 + (c * valueBytes), valueBytes);
                    values[c] = type switch
                    {
                        ComtradeDataFileType.Binary => BinaryPrimitives.ReadInt16LittleEndian(at) is var s && s == short.MinValue ? double.NaN : s,
                        ComtradeDataFileType.Binary32 => BinaryPrimitives.ReadInt32LittleEndian(at) is var i && i == int.MinValue ? double.NaN : i,
                        _ => BinaryPrimitives.ReadSingleLittleEndian(at),
                    };
                }
            }

            done += frames;
            Position += frames;
        }

        return done;
    }

    public override void Skip(long frames)
    {
        Position += frames;
        _stream.Seek(_dataStart + (Position * _frameBytes), SeekOrigin.Begin);
    }

    public override void Dispose()
    {
        if (_chunk.Length > 0)
        {
            ArrayPool<byte>.Shared.Return(_chunk);
            _chunk = [];
        }

        _stream.Dispose();
    }
}

/// <summary>ASCII data (C37.111-2013 clause 8.3, from memory): one sample per line, <c>n,timestamp,A1..An,D1..Dm</c>;
/// an empty analog field is a missing value, an empty time stamp is allowed where the cfg gives rates.
/// In a .cff the section ends at the next <c>---</c> header line.</summary>
internal sealed class ComtradeAsciiReader : ComtradeDataReader
{
    private readonly Stream _stream;
    private byte[] _buffer = ArrayPool<byte>.Shared.Rent(1 << 16);
    private int _start;
    private int _end;
    private bool _eof;
    private bool _sectionEnded;
    private long _lineNumber;
    private long _lastReadStart;
    private long[] _frameLines = [];

    public ComtradeAsciiReader(string filePath, Stream stream, ComtradeConfig config, long firstLineNumber)
        : base(filePath, config)
    {
        _stream = stream;
        _lineNumber = firstLineNumber - 1;
    }

    public override string Place => $"line {_lineNumber}";

    public override CaptureFormatException ValueError(int frame, int channel, string problem) =>
        new(FilePath, problem, _frameLines[frame], channel + 3, sampleIndex: _lastReadStart + frame);

    public override bool HasExtraData() => TryNextLine(out _);

    public override int Read(Span<double> raw, Span<long> stamps, int maxFrames)
    {
        var analogCount = Config.Analog.Count;
        var done = 0;
        _lastReadStart = Position;
        if (_frameLines.Length < maxFrames)
        {
            _frameLines = new long[maxFrames];
        }

        while (done < maxFrames && TryNextLine(out var line))
        {
            ParseLine(line, raw.Slice(done * analogCount, analogCount), out stamps[done]);
            _frameLines[done] = _lineNumber;
            done++;
            Position++;
        }

        return done;
    }

    public override void Skip(long frames)
    {
        for (long i = 0; i < frames && TryNextLine(out _); i++)
        {
            Position++;
        }
    }

    private void ParseLine(ReadOnlySpan<byte> line, Span<double> values, out long stamp)
    {
        stamp = -1;
        var field = 0;
        var needed = 2 + values.Length;
        while (field < needed)
        {
            var comma = line.IndexOf((byte)',');
            var text = (comma < 0 ? line : line[..comma]).Trim((byte)' ');
            if (field == 0)
            {
                if (!long.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out _))
                {
                    throw Error($"sample number '{Text(text)}' is not a whole number", 1);
                }
            }
            else if (field == 1)
            {
                if (text.Length > 0 && !long.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out stamp))
                {
                    throw Error($"time stamp '{Text(text)}' is not a whole number", 2);
                }
            }
            else if (text.Length == 0)
            {
                values[field - 2] = double.NaN;
            }
            else if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out values[field - 2]))
            {
                throw Error($"analog channel {field - 1} value '{Text(text)}' is not a number", field + 1);
            }
            else if (!double.IsFinite(values[field - 2]))
            {
                // NaN and infinities are no measurements; a missing value is an empty field (clause 8.3).
                throw Error($"analog channel {field - 1} value '{Text(text)}' is not a finite number", field + 1);
            }

            field++;
            if (comma < 0)
            {
                break;
            }

            line = line[(comma + 1)..];
        }

        if (field < needed)
        {
            throw Error($"expected at least {needed} fields (n,timestamp and {values.Length} analog values), found {field}", null);
        }
    }

    private CaptureFormatException Error(string problem, int? column) =>
        new(FilePath, problem, _lineNumber, column, sampleIndex: Position);

    private static string Text(ReadOnlySpan<byte> utf8) => ShownText.Of(utf8);

    /// <summary>Next non-blank line without its line end; false at the end of the data.</summary>
    private bool TryNextLine(out ReadOnlySpan<byte> line)
    {
        while (!_sectionEnded)
        {
            var newline = _buffer.AsSpan(_start, _end - _start).IndexOf((byte)'\n');
            if (newline < 0 && !_eof)
            {
                Fill();
                continue;
            }

            var length = newline < 0 ? _end - _start : newline;
            if (newline < 0 && length == 0)
            {
                break;
            }

            line = _buffer.AsSpan(_start, length).TrimEnd((byte)'\r');
            _start += newline < 0 ? length : length + 1;
            _lineNumber++;
            if (line.StartsWith("---"u8))
            {
                _sectionEnded = true; // the next section of a .cff
                break;
            }

            if (!line.Trim((byte)' ').IsEmpty)
            {
                return true;
            }
        }

        line = default;
        return false;
    }

    private void Fill()
    {
        if (_start > 0)
        {
            _buffer.AsSpan(_start, _end - _start).CopyTo(_buffer);
            _end -= _start;
            _start = 0;
        }

        if (_end >= CaptureLimits.MaxLineLength)
        {
            throw new CaptureFormatException(FilePath, string.Create(CultureInfo.InvariantCulture,
                $"the line is longer than {CaptureLimits.MaxLineLength} bytes (1 MiB), the limit for a line of a COMTRADE file"), _lineNumber + 1);
        }

        if (_end == _buffer.Length)
        {
            var larger = ArrayPool<byte>.Shared.Rent(_buffer.Length * 2); // a line longer than the buffer
            _buffer.AsSpan(0, _end).CopyTo(larger);
            ArrayPool<byte>.Shared.Return(_buffer);
            _buffer = larger;
        }

        var read = _stream.Read(_buffer, _end, _buffer.Length - _end);
        _end += read;
        _eof = read == 0;
    }

    public override void Dispose()
    {
        if (_buffer.Length > 0)
        {
            ArrayPool<byte>.Shared.Return(_buffer);
            _buffer = [];
        }

        _stream.Dispose();
    }
}
