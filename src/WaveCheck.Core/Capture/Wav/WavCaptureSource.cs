using System.Buffers;
using System.Globalization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Streams a WAV file (PCM 8/16/24/32-bit integer, IEEE float 32/64-bit, plain or WAVE_FORMAT_EXTENSIBLE, any channel count)
/// block by block; nothing is buffered beyond one block. Each stored sample is a fraction of full scale and becomes
/// amperes through the calibration (<c>--scale</c>, <c>--range</c>/<c>--sensitivity</c>, or our own <c>wvck</c> chunk).
/// Not thread-safe.
/// </summary>
/// <remarks>
/// The header is parsed once, here (<see cref="RiffLayout"/>, <see cref="WavFormat"/>), and the sample bytes are then
/// read straight from the file. NAudio, which writes our WAV files (<see cref="CaptureWriter"/>), is not asked to
/// parse the header a second time: ours places every fault at its byte and holds each field to the bounds of
/// <see cref="CaptureLimits"/>, which NAudio's reader does not, and once that is done reading the data chunk is a
/// plain read from the stream. Integer samples are normalised as <c>value / 2^(bits-1)</c> (<see cref="WavSampleDecoder"/>).
/// </remarks>
public sealed class WavCaptureSource : ICaptureSource
{
    private readonly string _path;
    private readonly FileStream _stream;
    private readonly WavFormat _format;
    private readonly WavSampleDecoder _decoder;
    private readonly ChannelSelection _selection;
    private readonly double[] _toAmperes;
    private readonly long _dataOffset;
    private readonly List<CaptureWarning> _warnings = [];
    private long _frame;
    private byte[] _bytes = [];

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
            _format = WavFormat.Read(_stream, path, layout.FormatOffset, layout.FormatBytes);
            var blockAlign = _format.BlockAlign;
            var claimedBytes = layout.DataClaimedBytes;
            var presentBytes = Math.Min(claimedBytes, _stream.Length - layout.DataOffset);
            var frames = presentBytes / blockAlign;
            if (frames == 0)
            {
                throw new CaptureFormatException(path, string.Create(CultureInfo.InvariantCulture,
                    $"the data chunk holds {presentBytes} bytes{(presentBytes < claimedBytes ? $" (its header claims {claimedBytes})" : "")}, less than one sample frame of {blockAlign} bytes: the capture has no samples"),
                    byteOffset: layout.DataOffset - 8);
            }

            if (presentBytes < claimedBytes)
            {
                var missingBytes = claimedBytes - presentBytes;
                var missingFrames = claimedBytes / blockAlign - frames;
                _warnings.Add(new CaptureWarning("truncated",
                    string.Create(CultureInfo.InvariantCulture,
                        $"The header claims {claimedBytes} data bytes but the file holds {presentBytes}: {missingFrames} frames ({missingBytes} bytes) missing; analysing the {frames} frames present."),
                    frames / (double)_format.SampleRateHz));
            }

            var (fileScaleA, fileSensor) = ReadOwnChunk(layout);
            var calibration = Calibrate(path, options, fileScaleA);
            var scaleA = calibration.ScaleA;
            _decoder = new WavSampleDecoder(_format, scaleA);

            var channelCount = _format.Channels;
            var channels = new ChannelInfo[channelCount];
            var all = new int[channelCount];
            for (var c = 0; c < channelCount; c++)
            {
                channels[c] = new ChannelInfo(c, $"ch{c + 1}", "FS", ChannelQuantity.Current, scaleA, scaleA);
                all[c] = c;
            }

            var voltages = VoltageSelection.Indices(channels, options, problem => new CaptureFormatException(path, problem));
            var voltageScale = options.VoltageScale;
            if (voltages.Count > 0 && voltageScale is null)
            {
                throw new CaptureFormatException(path,
                    $"{Setting.Ref(nameof(ImportOptions.VoltageChannels))} on a WAV file needs {Setting.Ref(nameof(ImportOptions.VoltageScale))} (circuit volts at full scale, e.g. 500V)");
            }

            foreach (var v in voltages)
            {
                // The decoder scales every channel by the current's full scale; the voltage's own scale is applied
                // when the volts are formed (VoltageInput), so the channel is described in volts here.
                channels[v] = new ChannelInfo(v, $"ch{v + 1}", "FS", ChannelQuantity.Voltage, voltageScale!.Value, voltageScale);
            }

            _selection = ChannelSelection.Resolve(channels, options, VoltageSelection.Without(all, voltages), "the file has no channels",
                problem => new CaptureFormatException(path, problem));
            if (_selection.Warning is { } guessed)
            {
                _warnings.Add(guessed);
            }

            var voltage = VoltageSelection.Build(channels, voltages, _selection.Indices, voltages.Count == 0 ? options : options with { VoltageScale = null },
                _ => voltageScale!.Value / scaleA,
                string.Create(CultureInfo.InvariantCulture, $"{Setting.Ref(nameof(ImportOptions.VoltageScale))} {voltageScale:G6} V full scale"),
                (_, problem) => new CaptureFormatException(path, problem));
            _toAmperes = _selection.AmperesPerSiUnit(channels, options, (_, problem) => new CaptureFormatException(path, problem));
            var sensor = options.Sensor != SensorCoupling.Unknown ? options.Sensor : fileSensor ?? SensorCoupling.Unknown;
            Info = new CaptureInfo
            {
                FilePath = path,
                Format = "wav",
                Encoding = $"{_format.Name}, {channelCount} channel{(channelCount == 1 ? "" : "s")}",
                Channels = channels,
                ResidualSource = _selection.Source,
                ResidualChannels = _selection.Indices,
                SampleRateHz = _format.SampleRateHz,
                SampleCount = frames,
                StartTime = layout.StartTime,
                Calibration = calibration,
                SensorCoupling = sensor,
                FullScaleA = _selection.Indices.Count == 1 ? scaleA : null,
                Voltage = voltage,
            };
            _dataOffset = layout.DataOffset;
            _stream.Position = layout.DataOffset;
        }
        catch
        {
            _stream.Dispose();
            throw;
        }
    }

    /// <inheritdoc />
    public CaptureInfo Info { get; }

    /// <inheritdoc />
    public IReadOnlyList<CaptureWarning> Warnings => _warnings;

    /// <inheritdoc />
    public CaptureBlock CreateBlock(int capacity = 65536) => new(_format.Channels, capacity, Info.SampleRateHz);

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

        var blockAlign = _format.BlockAlign;
        var byteCount = wanted * blockAlign;
        if (_bytes.Length < byteCount)
        {
            if (_bytes.Length > 0)
            {
                ArrayPool<byte>.Shared.Return(_bytes);
            }

            _bytes = ArrayPool<byte>.Shared.Rent(byteCount);
        }

        // Info.SampleCount counts only the frames the file holds, so a short read means the file shrank under us.
        var filled = _stream.ReadAtLeast(_bytes.AsSpan(0, byteCount), byteCount, throwOnEndOfStream: false);
        var frames = filled / blockAlign;
        if (frames == 0)
        {
            block.Length = 0;
            return false;
        }

        _decoder.Decode(_bytes.AsSpan(0, frames * blockAlign), block, frames);
        if (_format.Kind == WavSampleKind.Float)
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
        _stream.Dispose();
        if (_bytes.Length > 0)
        {
            ArrayPool<byte>.Shared.Return(_bytes);
            _bytes = [];
        }
    }

    private void CheckSamples(CaptureBlock block, int frames)
    {
        for (var c = 0; c < _format.Channels; c++)
        {
            var values = block.ChannelBuffer(c)[..frames];
            var bad = CaptureLimits.IndexOfInvalid(values);
            if (bad >= 0)
            {
                var sample = _frame + bad;
                throw new CaptureFormatException(_path,
                    CaptureLimits.SampleProblem(Info.Channels[c].Name, values[bad], sample / Info.SampleRateHz, "A"),
                    byteOffset: _dataOffset + (sample * _format.BlockAlign) + (c * _format.BytesPerSample), sampleIndex: sample);
            }
        }
    }

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
            var source = string.Create(CultureInfo.InvariantCulture, $"{Setting.Ref(nameof(ImportOptions.ScaleA))} {scale:G6} A full scale");
            return new Calibration(scale, 0, fromFile is null ? source : $"{source} (overrides the file's {fromFile})");
        }

        if (options.RangeV is { } range && options.SensitivityVPerA is { } sensitivity)
        {
            var fullScale = range / sensitivity;
            if (CaptureLimits.ScaleProblem("full scale (range / sensitivity)", fullScale, "A") is { } fullScaleProblem)
            {
                throw new CaptureFormatException(path, $"{Setting.Ref(nameof(ImportOptions.RangeV))} and {Setting.Ref(nameof(ImportOptions.SensitivityVPerA))}: {fullScaleProblem}");
            }

            var source = string.Create(CultureInfo.InvariantCulture,
                $"range {range:G6} V / sensitivity {sensitivity:G6} mV/mA = {fullScale:G6} A full scale");
            return new Calibration(fullScale, 0, fromFile is null ? source : $"{source} (overrides the file's {fromFile})");
        }

        if (options.RangeV is not null || options.SensitivityVPerA is not null)
        {
            throw new CaptureFormatException(path,
                options.RangeV is null
                    ? $"{Setting.Ref(nameof(ImportOptions.SensitivityVPerA))} needs {Setting.Ref(nameof(ImportOptions.RangeV))} to scale a WAV file (or give {Setting.Ref(nameof(ImportOptions.ScaleA))})"
                    : $"{Setting.Ref(nameof(ImportOptions.RangeV))} needs {Setting.Ref(nameof(ImportOptions.SensitivityVPerA))} to scale a WAV file (or give {Setting.Ref(nameof(ImportOptions.ScaleA))})");
        }

        if (fileScaleA is { } own)
        {
            return new Calibration(own, 0, $"file metadata (wvck chunk): {fromFile}");
        }

        throw new CaptureFormatException(path,
            $"WAV samples are fractions of full scale and the file states no scale: give {Setting.Ref(nameof(ImportOptions.ScaleA))} (amperes at full scale) or {Setting.Ref(nameof(ImportOptions.SensitivityVPerA))} with {Setting.Ref(nameof(ImportOptions.RangeV))}");
    }
}
