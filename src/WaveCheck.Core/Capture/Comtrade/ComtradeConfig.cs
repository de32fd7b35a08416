namespace WaveCheck.Core.Capture.Comtrade;

/// <summary>How the samples are stored in the data file (IEEE C37.111-2013 clause 7.4.10, field <c>ft</c>).</summary>
public enum ComtradeDataFileType
{
    /// <summary>Text, one sample per line: <c>n,timestamp,A1..An,D1..Dm</c>.</summary>
    Ascii,

    /// <summary>Binary, analog values as 16-bit two's complement integers (all revisions).</summary>
    Binary,

    /// <summary>Binary, analog values as 32-bit two's complement integers (2013 only).</summary>
    Binary32,

    /// <summary>Binary, analog values as IEEE 754 single-precision floats (2013 only).</summary>
    Float32,
}

/// <summary>One analog channel line of a cfg (IEEE C37.111-1999 clause 6.4.3 / -2013 clause 7.4.3).</summary>
/// <param name="Number">The channel index <c>An</c> as written (1-based).</param>
/// <param name="Id">Channel name <c>ch_id</c>.</param>
/// <param name="Phase">Phase identification <c>ph</c> (may be empty).</param>
/// <param name="Circuit">Circuit component being monitored <c>ccbm</c>.</param>
/// <param name="Unit">Channel unit <c>uu</c> as written (<c>A</c>, <c>kA</c>, <c>V</c>, <c>kV</c>...).</param>
/// <param name="A">Multiplier <c>a</c>: value = a·x + b, in <paramref name="Unit"/>.</param>
/// <param name="B">Offset adder <c>b</c>, in <paramref name="Unit"/>.</param>
/// <param name="SkewS">Time skew between channels, seconds (the cfg states microseconds).</param>
/// <param name="Min">Smallest stored value <c>x</c> the channel can take.</param>
/// <param name="Max">Largest stored value <c>x</c> the channel can take.</param>
/// <param name="Primary">Transformer ratio, primary factor (0 when absent: 1991).</param>
/// <param name="Secondary">Transformer ratio, secondary factor (0 when absent: 1991).</param>
/// <param name="PrimaryOrSecondary">'P' or 'S': which side a·x + b gives; null when absent (1991).</param>
public sealed record ComtradeAnalogChannel(int Number, string Id, string Phase, string Circuit, string Unit, double A,
    double B, double SkewS, double Min, double Max, double Primary, double Secondary, char? PrimaryOrSecondary)
{
    /// <summary>1-based line of the channel in the cfg (for messages); 0 when not read from a file.</summary>
    public long Line { get; init; }
}

/// <summary>One digital (status) channel line of a cfg (IEEE C37.111-2013 clause 7.4.4).</summary>
/// <param name="Number">The channel index <c>Dn</c> as written.</param>
/// <param name="Id">Channel name.</param>
/// <param name="NormalState">Normal state <c>y</c> (0 or 1).</param>
public sealed record ComtradeDigitalChannel(int Number, string Id, int NormalState);

/// <summary>One sample-rate section (IEEE C37.111-2013 clause 7.4.6, <c>samp,endsamp</c>).</summary>
/// <param name="RateHz">Sample rate, hertz (0 when the file has no stated rate, <c>nrates = 0</c>).</param>
/// <param name="FirstSample">1-based number of the section's first sample.</param>
/// <param name="LastSample">1-based number of the section's last sample (<c>endsamp</c>).</param>
public sealed record ComtradeRateSection(double RateHz, long FirstSample, long LastSample)
{
    /// <summary>1-based line of the <c>samp,endsamp</c> line in the cfg (for messages); 0 when not read from a file.</summary>
    public long Line { get; init; }

    /// <summary>Samples in the section.</summary>
    public long SampleCount => LastSample - FirstSample + 1;

    /// <summary>Duration, seconds (0 without a rate).</summary>
    public double DurationS => RateHz > 0 ? SampleCount / RateHz : 0;
}

/// <summary>A parsed COMTRADE configuration (.cfg, or the CFG section of a .cff).</summary>
public sealed record ComtradeConfig
{
    /// <summary>Station name (line 1).</summary>
    public required string StationName { get; init; }

    /// <summary>Recording device identification (line 1).</summary>
    public required string DeviceId { get; init; }

    /// <summary>Revision year: 1991 (no year on line 1), 1999 or 2013.</summary>
    public required int RevisionYear { get; init; }

    /// <summary>Analog channels in file order.</summary>
    public required IReadOnlyList<ComtradeAnalogChannel> Analog { get; init; }

    /// <summary>Digital channels in file order.</summary>
    public required IReadOnlyList<ComtradeDigitalChannel> Digital { get; init; }

    /// <summary>Nominal line frequency, hertz.</summary>
    public required double LineFrequencyHz { get; init; }

    /// <summary>Sample-rate sections; one section with rate 0 when the cfg says <c>nrates = 0</c>.</summary>
    public required IReadOnlyList<ComtradeRateSection> RateSections { get; init; }

    /// <summary>True when the cfg gives no rate (<c>nrates = 0</c>): the timestamps carry the timing.</summary>
    public bool TimestampsOnly => RateSections.Count == 1 && RateSections[0].RateHz == 0;

    /// <summary>Time of the first sample in the file, as written (null when the date is not a calendar date).</summary>
    public DateTimeOffset? StartTime { get; init; }

    /// <summary>Trigger time, as written (null when the date is not a calendar date).</summary>
    public DateTimeOffset? TriggerTime { get; init; }

    /// <summary>True when the cfg states the offset from UTC of its time stamps (2013 <c>time_code</c>).</summary>
    public bool TimeZoneStated { get; init; }

    /// <summary>Data file type.</summary>
    public required ComtradeDataFileType FileType { get; init; }

    /// <summary>Multiplier for the data file's time stamps (<c>timemult</c>; 1 before 1999).</summary>
    public double TimeMultiplier { get; init; } = 1;

    /// <summary>Seconds per unit of a data-file time stamp before <see cref="TimeMultiplier"/>:
    /// 1 µs, or 1 ns when a 2013 cfg writes its date/time stamps to nanoseconds.</summary>
    public double TimestampBaseS { get; init; } = 1e-6;

    /// <summary>Total samples per channel in the data file (the last section's <c>endsamp</c>).</summary>
    public long TotalSamples => RateSections[^1].LastSample;

    /// <summary>Digital status words (16 channels each) per binary sample.</summary>
    public int DigitalWords => (Digital.Count + 15) / 16;

    /// <summary>Bytes per sample in a binary data file: number and time stamp (4 bytes each), analog values, status words.</summary>
    public int BinaryFrameBytes => 8 + (Analog.Count * AnalogValueBytes) + (2 * DigitalWords);

    /// <summary>Bytes of one analog value in the binary forms (2 for BINARY, 4 otherwise).</summary>
    public int AnalogValueBytes => FileType == ComtradeDataFileType.Binary ? 2 : 4;
}
