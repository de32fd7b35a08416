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
    private readonly SupplyVoltage? _supply;
    private long _position;

    /// <summary>Creates the source.</summary>
    /// <param name="components">Parts to add up.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="durationS">Duration, seconds.</param>
    /// <param name="sensor">Sensor coupling to declare (a synthesized waveform is exact: DC by default).</param>
    /// <param name="clipA">Clip the sum symmetrically at ± this many amperes (a recorder's full scale); null for none.</param>
    /// <param name="description">Text for the file-path field.</param>
    /// <param name="supply">The circuit voltage to carry beside the current (channel <c>U</c>, or <c>U1</c>, <c>U2</c>,
    /// <c>U3</c>); null for none.</param>
    public SynthCaptureSource(IReadOnlyList<WaveformComponent> components, double sampleRateHz, double durationS,
        SensorCoupling sensor = SensorCoupling.Dc, double? clipA = null, string description = "synthetic", SupplyVoltage? supply = null)
    {
        _supply = supply;
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
            Channels = [new ChannelInfo(0, "I", "A", ChannelQuantity.Current, 1.0, clipA), .. VoltageChannels(supply)],
            ResidualSource = "I",
            ResidualChannels = [0],
            SampleRateHz = sampleRateHz,
            SampleCount = count,
            Calibration = Calibration.Amperes("synthesized in amperes"),
            SensorCoupling = sensor,
            FullScaleA = clipA,
            Voltage = supply is null
                ? null
                : new VoltageInput([.. Enumerable.Range(1, supply.Phases)], [.. VoltageChannels(supply).Select(c => c.Name)],
                    [.. Enumerable.Repeat(1.0, supply.Phases)], "synthesized in volts: " + supply.Describe()),
        };
    }

    private static IEnumerable<ChannelInfo> VoltageChannels(SupplyVoltage? supply) => supply switch
    {
        null => [],
        { Phases: 1 } => [new ChannelInfo(1, "U", "V", ChannelQuantity.Voltage, 1.0, null)],
        _ => Enumerable.Range(1, supply.Phases).Select(p => new ChannelInfo(p, $"U{p}", "V", ChannelQuantity.Voltage, 1.0, null)),
    };

    /// <inheritdoc />
    public CaptureInfo Info { get; }

    /// <inheritdoc />
    public IReadOnlyList<CaptureWarning> Warnings { get; } = [];

    /// <inheritdoc />
    public CaptureBlock CreateBlock(int capacity = 65536) => new(Info.Channels.Count, capacity, Info.SampleRateHz);

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
        for (var p = 0; p < (_supply?.Phases ?? 0); p++)
        {
            _supply!.Write(p, _position, Info.SampleRateHz, block.ChannelBuffer(p + 1)[..count]);
        }

        _position += count;
        return true;
    }

    /// <inheritdoc />
    public void Dispose()
    {
    }
}
