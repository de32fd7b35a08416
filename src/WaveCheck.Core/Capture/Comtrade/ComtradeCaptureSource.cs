using System.Buffers;
using System.Globalization;

namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>
/// A COMTRADE record (IEEE C37.111-1991/-1999/-2013, IEC 60255-24:2013) opened for streaming: a .cfg with its .dat,
/// or a single .cff. Each analog channel is delivered as <c>a·x + b</c> in SI units (A or V), secondary values
/// unless <see cref="ImportOptions.Primary"/> asks for primary; the residual current is one channel or a sum.
/// Not thread-safe.
/// </summary>
/// <remarks>
/// Where the cfg has several sample-rate sections, only the longest (in seconds; on a tie the faster) is delivered,
/// with a <c>rate-sections</c> warning: one block carries one rate, and resampling would either invent bandwidth the
/// slow section never had or throw away what the fast section recorded. A missing value is replaced by the channel's
/// previous value (0 before the first) and counted in a <c>missing-values</c> warning.
/// </remarks>
public sealed class ComtradeCaptureSource : ICaptureSource
{
    private static readonly HashSet<string> ResidualWords = new(StringComparer.OrdinalIgnoreCase)
    {
        "N", "IN", "E", "IE", "3I0", "3IO", "I0", "IRES", "RES", "RESIDUAL", "EARTH", "NEUTRAL", "IEARTH", "INEUTRAL",
    };

    private readonly ComtradeDataReader _reader;
    private readonly List<CaptureWarning> _warnings;
    private readonly double[] _scale;
    private readonly double[] _offset;
    private readonly double[] _held;
    private readonly ChannelSelection _selection;
    private readonly double[] _toAmperes;
    private readonly long _missingBefore;
    private long _delivered;
    private long _missing;
    private long _firstMissing = -1;
    private int _firstMissingChannel;
    private bool _finished;

    private ComtradeCaptureSource(ComtradeConfig config, ComtradeDataReader reader, CaptureInfo info,
        List<CaptureWarning> warnings, double[] scale, double[] offset, ChannelSelection selection, double[] toAmperes)
    {
        Config = config;
        _reader = reader;
        Info = info;
        _warnings = warnings;
        _scale = scale;
        _offset = offset;
        _held = new double[scale.Length];
        _selection = selection;
        _toAmperes = toAmperes;
        _missingBefore = reader.Position;
    }

    /// <summary>The parsed configuration.</summary>
    public ComtradeConfig Config { get; }

    /// <inheritdoc />
    public CaptureInfo Info { get; }

    /// <inheritdoc />
    public IReadOnlyList<CaptureWarning> Warnings => _warnings;

    /// <summary>Opens a COMTRADE record for streaming.</summary>
    /// <param name="path">A .cfg (its .dat or .DAT beside it) or a .cff.</param>
    /// <param name="options">Channel choice, primary/secondary, sensitivity for a voltage channel, sensor coupling.</param>
    /// <returns>A source positioned at the first sample of the delivered rate section; the caller disposes it.</returns>
    /// <exception cref="CaptureFormatException">Missing files, a cfg line that does not parse (line and field),
    /// a data file shorter than the cfg says, a channel named in the options that the cfg does not have (or one
    /// named twice), a voltage channel without a sensitivity.</exception>
    public static ICaptureSource Open(string path, ImportOptions options)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(options);
        if (!File.Exists(path))
        {
            throw new CaptureFormatException(path, "no such file");
        }

        var container = ComtradeContainer.Locate(path);
        var warnings = new List<CaptureWarning>();
        var config = ComtradeConfigParser.Parse(container.CfgPath, container.CfgLines, container.CfgFirstLine, warnings);
        if (config.Analog.Count == 0)
        {
            throw new CaptureFormatException(path, "the cfg has no analog channels: there is no current to analyse");
        }

        CheckDataCanHold(container, config);
        var reader = ComtradeDataReader.Open(container, config);
        try
        {
            return Build(container, config, reader, options, warnings);
        }
        catch
        {
            reader.Dispose();
            throw;
        }
    }

    /// <inheritdoc />
    public CaptureBlock CreateBlock(int capacity = 65536) => new(Config.Analog.Count, capacity, Info.SampleRateHz);

    /// <inheritdoc />
    public bool Read(CaptureBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        var analogCount = Config.Analog.Count;
        var wanted = (int)Math.Min(block.Capacity, Info.SampleCount - _delivered);
        block.StartSample = _delivered;
        block.Length = 0;
        if (wanted <= 0)
        {
            Finish();
            return false;
        }

        var raw = ArrayPool<double>.Shared.Rent(wanted * analogCount);
        var stamps = ArrayPool<long>.Shared.Rent(wanted);
        try
        {
            var got = _reader.Read(raw, stamps, wanted);
            if (got < wanted)
            {
                throw new CaptureFormatException(_reader.FilePath,
                    $"the data ends after {_reader.Position} samples at {_reader.Place}; the cfg says {Config.TotalSamples}",
                    sampleIndex: _reader.Position);
            }

            Calibrate(raw.AsSpan(0, got * analogCount), block, got);
        }
        finally
        {
            ArrayPool<double>.Shared.Return(raw);
            ArrayPool<long>.Shared.Return(stamps);
        }

        block.Length = wanted;
        _delivered += wanted;
        if (_delivered == Info.SampleCount)
        {
            Finish();
        }

        return true;
    }

    /// <inheritdoc />
    public void Dispose() => _reader.Dispose();

    private void Calibrate(ReadOnlySpan<double> raw, CaptureBlock block, int frames)
    {
        var analogCount = _scale.Length;
        for (var c = 0; c < analogCount; c++)
        {
            var output = block.ChannelBuffer(c);
            double scale = _scale[c], offset = _offset[c], held = _held[c];
            for (var i = 0; i < frames; i++)
            {
                var x = raw[(i * analogCount) + c];
                if (double.IsNaN(x))
                {
                    NoteMissing(i, c);
                    output[i] = held;
                    continue;
                }

                held = (x * scale) + offset;
                output[i] = held;
            }

            _held[c] = held;
            var bad = CaptureLimits.IndexOfInvalid(output[..frames]);
            if (bad >= 0)
            {
                throw _reader.ValueError(bad, c, CaptureLimits.SampleProblem(Config.Analog[c].Id, output[bad],
                    (_delivered + bad) / Info.SampleRateHz, Info.Channels[c].Quantity == ChannelQuantity.Voltage ? "V" : "A"));
            }
        }

        _selection.FormResidual(block, frames, _toAmperes);
        var residual = block.ResidualBuffer[..frames];
        var badResidual = CaptureLimits.IndexOfInvalid(residual);
        if (badResidual >= 0)
        {
            // Only a voltage divided by a tiny sensitivity gets here: every channel was checked above.
            throw _reader.ValueError(badResidual, _selection.Indices[0], CaptureLimits.SampleProblem($"residual ({Info.ResidualSource})",
                residual[badResidual], (_delivered + badResidual) / Info.SampleRateHz, "A"));
        }
    }

    private void NoteMissing(int frameInBlock, int channel)
    {
        if (_missing++ == 0)
        {
            _firstMissing = _delivered + frameInBlock;
            _firstMissingChannel = channel;
        }
    }

    private void Finish()
    {
        if (_finished)
        {
            return;
        }

        _finished = true;
        if (_missing > 0)
        {
            _warnings.Add(new CaptureWarning("missing-values",
                $"{_missing} values are marked missing in the data (first at sample {_firstMissing + _missingBefore + 1} of the file, channel '{Config.Analog[_firstMissingChannel].Id}'); each was replaced by the channel's previous value",
                _firstMissing / Info.SampleRateHz));
        }

        if (_reader.Position == Config.TotalSamples && _reader.HasExtraData())
        {
            _warnings.Add(new CaptureWarning("extra-data",
                $"the data file holds more than the {Config.TotalSamples} samples the cfg declares; the rest is ignored"));
        }
    }

    /// <summary>Refuses a sample count ASCII data cannot hold (before any loop runs on it): a sample line is at least
    /// <c>n,,</c>, one comma per analog value and a line end. Binary data is checked by its reader, to the byte.</summary>
    private static void CheckDataCanHold(ComtradeContainer container, ComtradeConfig config)
    {
        if (config.FileType != ComtradeDataFileType.Ascii)
        {
            return;
        }

        var bytes = container.DataBytes ?? Math.Max(0, new FileInfo(container.DataPath).Length - container.DataOffset);
        var least = config.Analog.Count + 3;
        var most = bytes / least;
        if (config.TotalSamples > most)
        {
            var last = config.RateSections[^1];
            throw new CaptureFormatException(container.CfgPath, string.Create(CultureInfo.InvariantCulture,
                $"sample rate {config.RateSections.Count}: last sample number {last.LastSample} is more than the data can hold: {bytes} bytes of ASCII data hold at most {most} sample lines of {least} or more bytes"),
                last.Line > 0 ? last.Line : null, last.Line > 0 ? 2 : null);
        }
    }

    private static ComtradeCaptureSource Build(ComtradeContainer container, ComtradeConfig config,
        ComtradeDataReader reader, ImportOptions options, List<CaptureWarning> warnings)
    {
        var path = container.CfgPath;
        var (section, sectionStartS) = ComtradeSections.Choose(config, warnings);
        var rateHz = section.RateHz;
        if (config.TimestampsOnly)
        {
            rateHz = ComtradeSections.RateFromTimestamps(container, config, warnings);
        }

        var conversions = new ComtradeChannelConversion[config.Analog.Count];
        var channels = new ChannelInfo[config.Analog.Count];
        for (var c = 0; c < conversions.Length; c++)
        {
            conversions[c] = ComtradeChannelConversion.For(config.Analog[c], options.Primary);
            if (CaptureLimits.ScaleProblem($"analog channel {c + 1}: multiplier × unit × transformer ratio", conversions[c].Scale, string.Empty) is { } scaleProblem)
            {
                throw new CaptureFormatException(path, scaleProblem, config.Analog[c].Line > 0 ? config.Analog[c].Line : null);
            }

            channels[c] = conversions[c].Info(c, config.Analog[c]);
        }

        var voltageChannels = VoltageSelection.Indices(channels, options, problem => new CaptureFormatException(path, problem));
        var selection = ChooseResidual(path, config, channels, options, voltageChannels);
        if (selection.Warning is { } guessed)
        {
            warnings.Add(guessed);
        }

        var residual = selection.Indices;
        var voltage = VoltageSelection.Build(channels, voltageChannels, residual, options, _ => 1.0,
            string.Join(", ", voltageChannels.Select(i => $"cfg a·x+b of '{channels[i].Name}' ({conversions[i].Describe(config.Analog[i])})")),
            (_, problem) => new CaptureFormatException(path, problem));
        var weights = selection.AmperesPerSiUnit(channels, options, (_, problem) => new CaptureFormatException(path, problem));
        foreach (var index in residual)
        {
            if (conversions[index].Note is { } note)
            {
                warnings.Add(new CaptureWarning("primary-secondary", $"channel '{channels[index].Name}': {note}"));
            }
        }

        if (!config.TimeZoneStated)
        {
            warnings.Add(new CaptureWarning("time-zone-unstated",
                $"the {config.RevisionYear} cfg does not state the time zone of its time stamps; they are shown as written, with offset +00:00"));
        }

        reader.Skip(section.FirstSample - 1);
        var single = residual.Count == 1;
        var first = conversions[residual[0]];
        var calibration = single
            ? new Calibration(first.Scale * weights[0], first.Offset * weights[0],
                $"cfg a·x+b of '{channels[residual[0]].Name}' ({first.Describe(config.Analog[residual[0]])}"
                + (weights[0] != 1.0 ? $", sensitivity {(1 / weights[0]).ToString(CultureInfo.InvariantCulture)} V/A)" : ")"))
            : Calibration.Amperes("sum of channels, each a·x+b from the cfg");
        var scale = new double[conversions.Length];
        var offset = new double[conversions.Length];
        for (var c = 0; c < conversions.Length; c++)
        {
            scale[c] = conversions[c].Scale;
            offset[c] = conversions[c].Offset;
        }

        var info = new CaptureInfo
        {
            FilePath = path,
            Format = "comtrade",
            Encoding = $"C37.111-{config.RevisionYear} {config.FileType.ToString().ToUpperInvariant()}{(container.SingleFile ? " (.cff)" : string.Empty)}, "
                + $"{config.Analog.Count} analog + {config.Digital.Count} digital channels, station '{config.StationName}', device '{config.DeviceId}'",
            Channels = channels,
            ResidualSource = selection.Source,
            ResidualChannels = residual,
            SampleRateHz = rateHz,
            SampleCount = section.SampleCount,
            StartTime = config.StartTime?.AddTicks((long)Math.Round(sectionStartS * TimeSpan.TicksPerSecond)),
            TriggerTime = config.TriggerTime,
            Calibration = calibration,
            SensorCoupling = options.Sensor,
            FullScaleA = single && channels[residual[0]].FullScaleSi is { } fs ? fs * weights[0] : null,
            Voltage = voltage,
        };
        return new ComtradeCaptureSource(config, reader, info, warnings, scale, offset, selection, weights);
    }

    /// <summary>The shared channel choice; with nothing chosen, the one current channel named as residual or earth
    /// current, else the only current channel with a <c>channel-guessed</c> warning; several are refused.</summary>
    private static ChannelSelection ChooseResidual(string path, ComtradeConfig config, ChannelInfo[] channels, ImportOptions options,
        IReadOnlyList<int> voltageChannels)
    {
        var currents = new List<int>();
        var named = new List<int>();
        foreach (var channel in channels)
        {
            if (channel.Quantity == ChannelQuantity.Current && !voltageChannels.Contains(channel.Index))
            {
                currents.Add(channel.Index);
                if (SuggestsResidual(config.Analog[channel.Index]))
                {
                    named.Add(channel.Index);
                }
            }
        }

        const string words = "(N, IN, 3I0, Ires, IE, E)";
        var unnamed = named.Count switch
        {
            1 => null,
            0 => $"no channel is named as the residual or earth current {words}",
            _ => $"{named.Count} channels ({string.Join(", ", named.Select(i => channels[i].Name))}) are named as the residual or earth current, not one",
        };
        return ChannelSelection.Resolve(channels, options, named.Count == 1 ? named : currents,
            $"no analog channel is a current (A, kA, mA); choose one with {Setting.Ref(nameof(ImportOptions.Channel))} (and {Setting.Ref(nameof(ImportOptions.SensitivityVPerA))} for a voltage)",
            problem => new CaptureFormatException(path, problem), unnamed);
    }

    private static bool SuggestsResidual(ComtradeAnalogChannel channel)
    {
        if (ResidualWords.Contains(channel.Phase.Trim()) || ResidualWords.Contains(channel.Id.Trim()))
        {
            return true;
        }

        foreach (var word in channel.Id.Split([' ', '_', '-', '.', '/'], StringSplitOptions.RemoveEmptyEntries))
        {
            if (ResidualWords.Contains(word))
            {
                return true;
            }
        }

        return false;
    }
}
