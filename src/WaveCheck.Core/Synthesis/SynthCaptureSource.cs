using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Synthesis;

/// <summary>
/// A synthesized capture: the sum of <see cref="WaveformComponent"/>s, optionally clipped, streamed in blocks like a
/// file so a waveform of any length costs one block of memory.
/// </summary>
public sealed class SynthCaptureSource : ICaptureSource
{
    private readonly IReadOnlyList<WaveformComponent> _components;
    private readonly double? _clipA;
    private long _position;

    /// <summary>Creates the source.</summary>
    /// <param name="components">Parts to add up.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="durationS">Duration, seconds.</param>
    /// <param name="sensor">Sensor coupling to declare (a synthesized waveform is exact: DC by default).</param>
    /// <param name="clipA">Clip the sum symmetrically at ± this many amperes (a recorder's full scale); null for none.</param>
    /// <param name="description">Text for the file-path field.</param>
    public SynthCaptureSource(IReadOnlyList<WaveformComponent> components, double sampleRateHz, double durationS,
        SensorCoupling sensor = SensorCoupling.Dc, double? clipA = null, string description = "synthetic")
    {
        ArgumentNullException.ThrowIfNull(components);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(sampleRateHz);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(durationS);
        _components = components;
        _clipA = clipA;
        var count = (long)Math.Round(durationS * sampleRateHz);
        Info = new CaptureInfo
        {
            FilePath = description,
            Format = "synthetic",
            Encoding = string.Join(" + ", components.Select(c => c.Describe())),
            Channels = [new ChannelInfo(0, "I", "A", ChannelQuantity.Current, 1.0, clipA)],
            ResidualSource = "I",
            ResidualChannels = [0],
            SampleRateHz = sampleRateHz,
            SampleCount = count,
            Calibration = Calibration.Amperes("synthesized in amperes"),
            SensorCoupling = sensor,
            FullScaleA = clipA,
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
        var count = (int)Math.Min(block.Capacity, Info.SampleCount - _position);
        block.StartSample = _position;
        block.Length = Math.Max(count, 0);
        if (count <= 0)
        {
            return false;
        }

        var residual = block.ResidualBuffer[..count];
        residual.Clear();
        foreach (var component in _components)
        {
            component.AddTo(_position, Info.SampleRateHz, residual);
        }

        if (_clipA is { } clip)
        {
            for (var i = 0; i < residual.Length; i++)
            {
                residual[i] = Math.Clamp(residual[i], -clip, clip);
            }
        }

        residual.CopyTo(block.ChannelBuffer(0));
        _position += count;
        return true;
    }

    /// <inheritdoc />
    public void Dispose()
    {
    }
}
