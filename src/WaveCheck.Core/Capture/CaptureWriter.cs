using System.Buffers;
using System.Buffers.Binary;
using System.Globalization;
using System.Text;
using NAudio.Wave;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Capture;

/// <summary>Sample encodings <see cref="CaptureWriter.WriteWav(string, IEnumerable{double[][]}, double, double, WavSampleFormat, SensorCoupling)"/> can write.</summary>
public enum WavSampleFormat
{
    /// <summary>16-bit signed integer PCM.</summary>
    Pcm16,

    /// <summary>24-bit signed integer PCM (WAVE_FORMAT_EXTENSIBLE).</summary>
    Pcm24,

    /// <summary>32-bit signed integer PCM (WAVE_FORMAT_EXTENSIBLE).</summary>
    Pcm32,

    /// <summary>32-bit IEEE float.</summary>
    Float32,

    /// <summary>64-bit IEEE float.</summary>
    Float64,
}

/// <summary>
/// Writes captures as WAV (with our own <c>wvck</c> chunk holding the full-scale amperes, so the file calibrates itself)
/// or as CSV (<c>time [s]</c>, <c>I [mA]</c>, invariant culture). Streams block by block; each file is written whole
/// or not at all (<see cref="AtomicFile"/>).
/// </summary>
public static class CaptureWriter
{
    /// <summary>Writes a multi-channel WAV file.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="blocksA">Blocks of samples, amperes; each block is one array per channel, all of the same length.</param>
    /// <param name="sampleRateHz">Sample rate, hertz (a whole number for WAV).</param>
    /// <param name="fullScaleA">Amperes stored as full scale 1.0; larger values clip, as a recorder would.</param>
    /// <param name="format">Sample encoding.</param>
    /// <param name="sensor">Sensor coupling, stored in the chunk.</param>
    /// <returns>Frames written.</returns>
    public static long WriteWav(string path, IEnumerable<double[][]> blocksA, double sampleRateHz, double fullScaleA,
        WavSampleFormat format, SensorCoupling sensor = SensorCoupling.Unknown)
    {
        ArgumentNullException.ThrowIfNull(blocksA);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(fullScaleA);
        if (sampleRateHz <= 0 || sampleRateHz != Math.Round(sampleRateHz) || sampleRateHz > int.MaxValue)
        {
            throw new ArgumentOutOfRangeException(nameof(sampleRateHz), sampleRateHz, "WAV needs a positive whole number of hertz");
        }

        long frames = 0;
        AtomicFile.Write(path, stream =>
        {
            WaveFileWriter? writer = null;
            var bytes = Array.Empty<byte>();
            var channels = 0;
            try
            {
                foreach (var block in blocksA)
                {
                    if (writer is null)
                    {
                        channels = block.Length;
                        ArgumentOutOfRangeException.ThrowIfLessThan(channels, 1, nameof(blocksA));
                        writer = new WaveFileWriter(stream, CreateFormat((int)sampleRateHz, channels, format));
                        writer.AddChunk(WaveCheckChunk.Id, WaveCheckChunk.Format(fullScaleA, sensor), ChunkPosition.BeforeData);
                    }
                    else if (block.Length != channels)
                    {
                        throw new ArgumentException($"every block needs {channels} channels (got {block.Length})", nameof(blocksA));
                    }

                    var length = block[0].Length;
                    if (frames + length > MaxWavFrames(format, channels))
                    {
                        throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                            $"more than {MaxWavFrames(format, channels):N0} frames do not fit a {format} WAV of {channels} channel(s) (4 GiB of sample data at most): write a CSV or a shorter capture"));
                    }

                    var needed = length * channels * BytesPerSample(format);
                    if (bytes.Length < needed)
                    {
                        ArrayPool<byte>.Shared.Return(bytes);
                        bytes = ArrayPool<byte>.Shared.Rent(needed);
                    }

                    Encode(block, length, 1.0 / fullScaleA, format, bytes);
                    writer.Write(bytes.AsSpan(0, needed));
                    frames += length;
                }

                writer ??= new WaveFileWriter(stream, CreateFormat((int)sampleRateHz, 1, format));
            }
            finally
            {
                writer?.Dispose();
                ArrayPool<byte>.Shared.Return(bytes);
            }
        });
        return frames;
    }

    /// <summary>Writes a mono WAV file.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="blocksA">Blocks of samples, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz (whole number).</param>
    /// <param name="fullScaleA">Amperes stored as full scale.</param>
    /// <param name="format">Sample encoding.</param>
    /// <param name="sensor">Sensor coupling, stored in the chunk.</param>
    /// <returns>Frames written.</returns>
    public static long WriteWav(string path, IEnumerable<double[]> blocksA, double sampleRateHz, double fullScaleA,
        WavSampleFormat format, SensorCoupling sensor = SensorCoupling.Unknown)
    {
        ArgumentNullException.ThrowIfNull(blocksA);
        return WriteWav(path, blocksA.Select(b => new[] { b }), sampleRateHz, fullScaleA, format, sensor);
    }

    /// <summary>Writes the residual current of <paramref name="source"/> as a mono WAV file.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="source">Capture to copy; read to its end.</param>
    /// <param name="fullScaleA">Amperes stored as full scale.</param>
    /// <param name="format">Sample encoding.</param>
    /// <param name="cancellationToken">Checked before each block; a cancelled write leaves no file.</param>
    /// <returns>Frames written.</returns>
    public static long WriteWav(string path, ICaptureSource source, double fullScaleA, WavSampleFormat format,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(source);
        return WriteWav(path, ResidualBlocks(source, cancellationToken), source.Info.SampleRateHz, fullScaleA, format,
            source.Info.SensorCoupling);
    }

    /// <summary>Writes a CSV file with a <c>time [s]</c> column and an <c>I [mA]</c> column (invariant culture, round-trip precision).</summary>
    /// <param name="path">Target file.</param>
    /// <param name="blocksA">Blocks of samples, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <returns>Rows written.</returns>
    public static long WriteCsv(string path, IEnumerable<double[]> blocksA, double sampleRateHz)
    {
        ArgumentNullException.ThrowIfNull(blocksA);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(sampleRateHz);
        long rows = 0;
        AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            writer.Write("time [s],I [mA]\n");
            Span<char> buffer = stackalloc char[64];
            foreach (var block in blocksA)
            {
                foreach (var amperes in block)
                {
                    WriteNumber(writer, rows / sampleRateHz, buffer);
                    writer.Write(',');
                    WriteNumber(writer, amperes * 1000.0, buffer);
                    writer.Write('\n');
                    rows++;
                }
            }
        });
        return rows;
    }

    /// <summary>Writes the residual current of <paramref name="source"/> as CSV.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="source">Capture to copy; read to its end.</param>
    /// <param name="cancellationToken">Checked before each block; a cancelled write leaves no file.</param>
    /// <returns>Rows written.</returns>
    public static long WriteCsv(string path, ICaptureSource source, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(source);
        return WriteCsv(path, ResidualBlocks(source, cancellationToken), source.Info.SampleRateHz);
    }

    /// <summary>Writes the residual current of <paramref name="source"/> and its voltage channels
    /// (<see cref="CaptureInfo.Voltage"/>) as a WAV file: channel 1 the current, then one channel per voltage, stored
    /// as a fraction of <paramref name="voltageFullScaleV"/> (read it back with <c>--voltage ch2 --voltage-scale</c>).</summary>
    /// <param name="path">Target file.</param>
    /// <param name="source">Capture with voltage channels; read to its end.</param>
    /// <param name="fullScaleA">Amperes stored as full scale on the current channel.</param>
    /// <param name="voltageFullScaleV">Volts stored as full scale on the voltage channels.</param>
    /// <param name="format">Sample encoding.</param>
    /// <param name="cancellationToken">Checked before each block; a cancelled write leaves no file.</param>
    /// <returns>Frames written.</returns>
    public static long WriteWavWithVoltage(string path, ICaptureSource source, double fullScaleA, double voltageFullScaleV,
        WavSampleFormat format, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(source);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(voltageFullScaleV);
        // The writer scales every channel by 1/fullScaleA: a voltage is given in the current's scale so that it is
        // stored as v / voltageFullScaleV.
        return WriteWav(path, BlocksWithVoltage(source, fullScaleA / voltageFullScaleV, cancellationToken), source.Info.SampleRateHz,
            fullScaleA, format, source.Info.SensorCoupling);
    }

    /// <summary>Writes the residual current of <paramref name="source"/> and its voltage channels as CSV:
    /// <c>time [s]</c>, <c>I [mA]</c>, then one <c>NAME [V]</c> column per voltage.</summary>
    /// <param name="path">Target file.</param>
    /// <param name="source">Capture with voltage channels; read to its end.</param>
    /// <param name="cancellationToken">Checked before each block; a cancelled write leaves no file.</param>
    /// <returns>Rows written.</returns>
    public static long WriteCsvWithVoltage(string path, ICaptureSource source, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(source);
        var voltage = source.Info.Voltage ?? throw new ArgumentException("the source has no voltage channel", nameof(source));
        var rate = source.Info.SampleRateHz;
        long rows = 0;
        AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 16, leaveOpen: true);
            writer.Write("time [s],I [mA]" + string.Concat(voltage.Names.Select(n => $",{n} [V]")) + "\n");
            Span<char> buffer = stackalloc char[64];
            foreach (var block in BlocksWithVoltage(source, 1.0, cancellationToken))
            {
                for (var i = 0; i < block[0].Length; i++)
                {
                    WriteNumber(writer, rows / rate, buffer);
                    writer.Write(',');
                    WriteNumber(writer, block[0][i] * 1000.0, buffer);
                    for (var c = 1; c < block.Length; c++)
                    {
                        writer.Write(',');
                        WriteNumber(writer, block[c][i], buffer);
                    }

                    writer.Write('\n');
                    rows++;
                }
            }
        });
        return rows;
    }

    private static IEnumerable<double[][]> BlocksWithVoltage(ICaptureSource source, double voltageFactor, CancellationToken cancellationToken)
    {
        var voltage = source.Info.Voltage ?? throw new ArgumentException("the source has no voltage channel", nameof(source));
        var block = source.CreateBlock();
        while (source.Read(block))
        {
            cancellationToken.ThrowIfCancellationRequested();
            var channels = new double[1 + voltage.Channels.Count][];
            channels[0] = block.ResidualA.ToArray();
            for (var p = 0; p < voltage.Channels.Count; p++)
            {
                channels[p + 1] = new double[block.Length];
                voltage.Form(block, p, channels[p + 1]);
                for (var i = 0; i < block.Length; i++)
                {
                    channels[p + 1][i] *= voltageFactor;
                }
            }

            yield return channels;
        }
    }

    private static void WriteNumber(StreamWriter writer, double value, Span<char> buffer)
    {
        value.TryFormat(buffer, out var written, "R", CultureInfo.InvariantCulture);
        writer.Write(buffer[..written]);
    }

    /// <summary>Copies each block's residual current, since the source reuses its block.</summary>
    private static IEnumerable<double[]> ResidualBlocks(ICaptureSource source, CancellationToken cancellationToken)
    {
        var block = source.CreateBlock();
        while (source.Read(block))
        {
            cancellationToken.ThrowIfCancellationRequested();
            yield return block.ResidualA.ToArray();
        }
    }

    /// <summary>Most frames a plain (not RF64) WAV of <paramref name="format"/> and <paramref name="channels"/> holds:
    /// its sizes are 32-bit, so 4 GiB of sample data less room for the header chunks.</summary>
    /// <param name="format">Sample encoding.</param>
    /// <param name="channels">Channels per frame, at least 1.</param>
    public static long MaxWavFrames(WavSampleFormat format, int channels) =>
        (uint.MaxValue - 4096L) / ((long)Math.Max(1, channels) * BytesPerSample(format));

    private static int BytesPerSample(WavSampleFormat format) => format switch
    {
        WavSampleFormat.Pcm16 => 2,
        WavSampleFormat.Pcm24 => 3,
        WavSampleFormat.Pcm32 or WavSampleFormat.Float32 => 4,
        WavSampleFormat.Float64 => 8,
        _ => throw new ArgumentOutOfRangeException(nameof(format), format, null),
    };

    private static WaveFormat CreateFormat(int rate, int channels, WavSampleFormat format) => format switch
    {
        WavSampleFormat.Pcm16 => new WaveFormat(rate, 16, channels),
        WavSampleFormat.Pcm24 => new WaveFormatExtensible(rate, 24, channels, false, 24, 0),
        WavSampleFormat.Pcm32 => new WaveFormatExtensible(rate, 32, channels, false, 32, 0),
        WavSampleFormat.Float32 => WaveFormat.CreateIeeeFloatWaveFormat(rate, channels),
        WavSampleFormat.Float64 => WaveFormat.CreateCustomFormat(WaveFormatEncoding.IeeeFloat, rate, channels,
            rate * channels * 8, channels * 8, 64),
        _ => throw new ArgumentOutOfRangeException(nameof(format), format, null),
    };

    private static void Encode(double[][] block, int length, double perA, WavSampleFormat format, Span<byte> bytes)
    {
        var channels = block.Length;
        var size = BytesPerSample(format);
        for (var c = 0; c < channels; c++)
        {
            var samples = block[c];
            if (samples.Length != length)
            {
                throw new ArgumentException("every channel of a block needs the same length");
            }

            for (var n = 0; n < length; n++)
            {
                var x = Math.Clamp(samples[n] * perA, -1.0, 1.0);
                var target = bytes.Slice((n * channels + c) * size, size);
                switch (format)
                {
                    case WavSampleFormat.Pcm16:
                        BinaryPrimitives.WriteInt16LittleEndian(target, (short)Math.Clamp(Math.Round(x * 32768.0), short.MinValue, short.MaxValue));
                        break;
                    case WavSampleFormat.Pcm24:
                        {
                            var v = (int)Math.Clamp(Math.Round(x * 8388608.0), -8388608, 8388607);
                            target[0] = (byte)v;
                            target[1] = (byte)(v >> 8);
                            target[2] = (byte)(v >> 16);
                            break;
                        }

                    case WavSampleFormat.Pcm32:
                        BinaryPrimitives.WriteInt32LittleEndian(target, (int)Math.Clamp(Math.Round(x * 2147483648.0), int.MinValue, int.MaxValue));
                        break;
                    case WavSampleFormat.Float32:
                        BinaryPrimitives.WriteSingleLittleEndian(target, (float)x);
                        break;
                    default:
                        BinaryPrimitives.WriteDoubleLittleEndian(target, x);
                        break;
                }
            }
        }
    }
}
