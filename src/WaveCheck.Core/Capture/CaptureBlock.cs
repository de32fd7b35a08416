namespace WaveCheck.Core.Capture;

/// <summary>
/// A block of consecutive samples of every channel, calibrated to SI units, plus the residual current in amperes.
/// Owned and reused by the <see cref="ICaptureSource"/> that fills it: copy what must outlive the next read.
/// Not thread-safe.
/// </summary>
public sealed class CaptureBlock
{
    private readonly double[][] _channels;
    private readonly double[] _residualA;

    /// <summary>Creates a block able to hold <paramref name="capacity"/> samples of <paramref name="channelCount"/> channels.</summary>
    /// <param name="channelCount">Channels in the file (at least 1).</param>
    /// <param name="capacity">Samples per channel per block (at least 1).</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    public CaptureBlock(int channelCount, int capacity, double sampleRateHz)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(channelCount, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(capacity, 1);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(sampleRateHz);
        _channels = new double[channelCount][];
        for (var c = 0; c < channelCount; c++)
        {
            _channels[c] = new double[capacity];
        }

        _residualA = new double[capacity];
        SampleRateHz = sampleRateHz;
    }

    /// <summary>Samples per channel the block can hold.</summary>
    public int Capacity => _residualA.Length;

    /// <summary>Number of channels.</summary>
    public int ChannelCount => _channels.Length;

    /// <summary>Valid samples per channel in this block.</summary>
    public int Length { get; set; }

    /// <summary>Index of the block's first sample from the start of the capture.</summary>
    public long StartSample { get; set; }

    /// <summary>Sample rate, hertz.</summary>
    public double SampleRateHz { get; }

    /// <summary>Time of the first sample, seconds from the start of the capture.</summary>
    public double StartS => StartSample / SampleRateHz;

    /// <summary>Residual current, amperes.</summary>
    public ReadOnlySpan<double> ResidualA => _residualA.AsSpan(0, Length);

    /// <summary>One channel's values in SI units (A or V, see <see cref="ChannelInfo.Quantity"/>).</summary>
    public ReadOnlySpan<double> Channel(int index) => _channels[index].AsSpan(0, Length);

    /// <summary>Writable buffer of a channel, full capacity, for readers.</summary>
    public Span<double> ChannelBuffer(int index) => _channels[index];

    /// <summary>Writable buffer of the residual current, full capacity, for readers.</summary>
    public Span<double> ResidualBuffer => _residualA;
}
