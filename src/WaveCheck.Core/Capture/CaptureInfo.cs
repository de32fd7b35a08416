using System.Text.Json.Serialization;

namespace WaveCheck.Core.Capture;

/// <summary>
/// What is known about a capture before and while it is read. Serialised under <c>capture</c> in the info and
/// analysis JSON (camelCase, SI units).
/// </summary>
public sealed record CaptureInfo
{
    /// <summary>The file as the user named it.</summary>
    public required string FilePath { get; init; }

    /// <summary>Container format: <c>wav</c>, <c>csv</c> or <c>comtrade</c>.</summary>
    public required string Format { get; init; }

    /// <summary>Detail of the encoding, e.g. <c>PCM 24-bit, 2 channels</c>, <c>delimiter ';', decimal comma</c>.</summary>
    public required string Encoding { get; init; }

    /// <summary>Every channel found in the file.</summary>
    public required IReadOnlyList<ChannelInfo> Channels { get; init; }

    /// <summary>What forms the residual current: a channel name, or <c>L1+L2+L3+N</c> for a sum.</summary>
    public required string ResidualSource { get; init; }

    /// <summary>Indices into <see cref="Channels"/> summed to form the residual current (one entry: a plain channel).</summary>
    public required IReadOnlyList<int> ResidualChannels { get; init; }

    /// <summary>Sample rate stated by the file or by <c>--rate</c>, hertz.</summary>
    public required double SampleRateHz { get; init; }

    /// <summary>Sample rate measured from a time column, hertz; null where the format has no time column.</summary>
    public double? MeasuredSampleRateHz { get; init; }

    /// <summary>Number of samples (frames); for formats read in one pass it is the count once reading has finished, or an estimate.</summary>
    public required long SampleCount { get; init; }

    /// <summary>True when <see cref="SampleCount"/> is exact (known from a header or after a full read).</summary>
    public bool SampleCountExact { get; init; } = true;

    /// <summary>Duration, seconds (<see cref="SampleCount"/> / <see cref="SampleRateHz"/>).</summary>
    public double DurationS => SampleRateHz > 0 ? SampleCount / SampleRateHz : 0;

    /// <summary>Start of the recording, where the file states it.</summary>
    public DateTimeOffset? StartTime { get; init; }

    /// <summary>Trigger time, where the format states one (COMTRADE).</summary>
    public DateTimeOffset? TriggerTime { get; init; }

    /// <summary>Trigger time as seconds from the start of the recording; null unless both times are stated.</summary>
    public double? TriggerOffsetS => TriggerTime is { } trigger && StartTime is { } start ? (trigger - start).TotalSeconds : null;

    /// <summary>Calibration of the residual-current channel.</summary>
    public required Calibration Calibration { get; init; }

    /// <summary>Sensor coupling as declared by the user (or the file).</summary>
    public SensorCoupling SensorCoupling { get; init; } = SensorCoupling.Unknown;

    /// <summary>Amperes at which the residual channel clips, where known (WAV full scale × scale).</summary>
    public double? FullScaleA { get; init; }

    /// <summary>The channels carrying the circuit voltage beside the residual current; null (and absent from the JSON)
    /// when the capture has none.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public VoltageInput? Voltage { get; init; }

    /// <summary>Half the sample rate: nothing above it is seen, hertz.</summary>
    public double NyquistHz => SampleRateHz / 2;
}
