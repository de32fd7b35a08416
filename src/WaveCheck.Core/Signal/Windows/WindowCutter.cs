namespace WaveCheck.Core.Signal;

/// <summary>
/// Cuts the stream of samples into contiguous windows of N mains cycles, each round(N·fs/f) samples long with f the
/// frequency tracked before it (IEC 61000-4-7 synchronised windows), copied into the slots of a batch. The caller
/// fills (<see cref="Fill"/>), and when a window <see cref="IsFull"/> takes its slot (<see cref="Seal"/>) and gives
/// the length of the next (<see cref="Advance"/>); a full batch is exchanged for an empty one (<see cref="TakeBatch"/>). Slots are sized
/// once for the longest window the tracking range allows. Not thread-safe.
/// </summary>
internal sealed class WindowCutter
{
    private readonly double _fs;
    private readonly int _cycles;
    private WindowSlot[] _batch;
    private int _count;
    private int _fill;

    /// <summary>Sets up the cutting of one capture.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="cycles">Mains cycles per window.</param>
    /// <param name="nominalHz">Nominal mains frequency, hertz (the slots hold a window at the lowest tracked frequency).</param>
    /// <param name="firstFrequencyHz">Frequency that sizes the first window, hertz.</param>
    /// <param name="batch">Empty slots for the first batch, each at least <see cref="CapacityFor"/> samples long.</param>
    public WindowCutter(double sampleRateHz, int cycles, double nominalHz, double firstFrequencyHz, WindowSlot[] batch)
    {
        _fs = sampleRateHz;
        _cycles = cycles;
        MaxLength = CapacityFor(sampleRateHz, cycles, nominalHz);
        _batch = batch;
        Length = LengthFor(firstFrequencyHz);
    }

    /// <summary>Samples a slot must hold: the longest window within the tracking range, plus two for rounding.</summary>
    public static int CapacityFor(double sampleRateHz, int cycles, double nominalHz) =>
        (int)Math.Ceiling(cycles * sampleRateHz / (nominalHz * (1 - MainsFrequency.TrackingRange))) + 2;

    /// <summary>The longest window, samples.</summary>
    public int MaxLength { get; }

    /// <summary>Length of the window being filled, samples.</summary>
    public int Length { get; private set; }

    /// <summary>Index in the capture of the first sample of the window being filled.</summary>
    public long Start { get; private set; }

    /// <summary>Samples in the window being filled so far.</summary>
    public int Filled => _fill;

    /// <summary>The samples of the window being filled so far (after the last whole window: the capture's tail).</summary>
    public ReadOnlySpan<double> Partial => _batch[_count].Samples.AsSpan(0, _fill);

    /// <summary>The slot of the window being filled (its first <see cref="Filled"/> samples are set).</summary>
    public WindowSlot Filling => _batch[_count];

    /// <summary>Whether the window being filled is complete (call <see cref="Advance"/> next).</summary>
    public bool IsFull => _fill == Length;

    /// <summary>The slot of the full window, its <see cref="WindowSlot.Length"/> and <see cref="WindowSlot.Start"/>
    /// set (call when <see cref="IsFull"/>, before <see cref="Advance"/>).</summary>
    public WindowSlot Seal()
    {
        var slot = _batch[_count];
        slot.Length = Length;
        slot.Start = Start;
        return slot;
    }

    /// <summary>Whole windows waiting in the batch.</summary>
    public int BatchCount => _count;

    /// <summary>Whether every slot of the batch holds a whole window.</summary>
    public bool BatchFull => _count == _batch.Length;

    /// <summary>Length of a window of N cycles at <paramref name="frequencyHz"/>, samples: round(N·fs/f).</summary>
    public int LengthFor(double frequencyHz) => (int)Math.Round(_cycles * _fs / frequencyHz);

    /// <summary>Copies samples into the window being filled until it is full.</summary>
    /// <returns>How many samples were taken.</returns>
    public int Fill(ReadOnlySpan<double> samplesA)
    {
        var take = Math.Min(samplesA.Length, Length - _fill);
        samplesA[..take].CopyTo(_batch[_count].Samples.AsSpan(_fill));
        _fill += take;
        return take;
    }

    /// <summary>Closes the full window into the batch and starts the next, <paramref name="nextLength"/> samples long.</summary>
    public void Advance(int nextLength)
    {
        _count++;
        Start += Length;
        _fill = 0;
        Length = nextLength;
    }

    /// <summary>Hands over the batch's slots and takes <paramref name="empty"/> for the next batch.</summary>
    /// <returns>The slots and how many of them hold whole windows.</returns>
    public (WindowSlot[] Slots, int Count) TakeBatch(WindowSlot[] empty)
    {
        var taken = (_batch, _count);
        (_batch, _count) = (empty, 0);
        return taken;
    }
}
