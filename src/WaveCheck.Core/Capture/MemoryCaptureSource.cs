namespace WaveCheck.Core.Capture;

/// <summary>
/// A capture held in memory (one residual-current channel, amperes): for tests, the synthesizer and callers
/// that already have samples. Streams them in blocks like a file reader.
/// </summary>
public sealed class MemoryCaptureSource : ICaptureSource
{
    private readonly double[] _samplesA;
    private long _position;

    /// <summary>Creates a source over <paramref name="samplesA"/> (not copied).</summary>
    /// <param name="samplesA">Residual current, amperes.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="sensor">Declared sensor coupling.</param>
    /// <param name="name">Name shown as the file path.</param>
    /// <param name="fullScaleA">Clipping level, amperes, if any.</param>
    public MemoryCaptureSource(double[] samplesA, double sampleRateHz, SensorCoupling sensor = SensorCoupling.Dc,
        string name = "memory", double? fullScaleA = null)
    {
        ArgumentNullException.ThrowIfNull(samplesA);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(sampleRateHz);
        _samplesA = samplesA;
        Info = new CaptureInfo
        {
            FilePath = name,
            Format = "memory",
            Encoding = "float64",
            Channels = [new ChannelInfo(0, "I", "A", ChannelQuantity.Current, 1.0, fullScaleA)],
            ResidualSource = "I",
            ResidualChannels = [0],
            SampleRateHz = sampleRateHz,
            SampleCount = samplesA.LongLength,
            Calibration = Calibration.Amperes("values in amperes"),
            SensorCoupling = sensor,
            FullScaleA = fullScaleA,
        };
    }

    /// <inheritdoc />
    public CaptureInfo Info { get; }

    /// <inheritdoc />
    public IReadOnlyList<CaptureWarning> Warnings { get; } = [];

    /// <inheritdoc />
    public CaptureBlock CreateBlock(int capacity = 65536) => new(1, capacity, Info.SampleRateHz);

    /// <inheritdoc />
    public bool Read(CaptureBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        var count = (int)Math.Min(block.Capacity, _samplesA.LongLength - _position);
        block.StartSample = _position;
        block.Length = Math.Max(count, 0);
        if (count <= 0)
        {
            return false;
        }

        var source = _samplesA.AsSpan((int)_position, count);
        source.CopyTo(block.ChannelBuffer(0));
        source.CopyTo(block.ResidualBuffer);
        _position += count;
        return true;
    }

    /// <inheritdoc />
    public void Dispose()
    {
    }
}
