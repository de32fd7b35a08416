using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The streaming analysis of one capture: <see cref="Push(CaptureBlock)"/> consecutive blocks of residual current, then
/// <see cref="Complete"/> for the <see cref="AnalysisResult"/>. Memory does not grow with the capture's length:
/// window figures feed running statistics, percentiles a bounded estimator, the trend table and the envelope merge
/// pairs when full, the spectrum is accumulated per bin. Not thread-safe; one instance per capture.
/// </summary>
/// <remarks>
/// <para>The pipeline, each step in a type of its own: the first <see cref="DetectionS"/> seconds are held to find the
/// mains frequency (<see cref="MainsTracker"/>); then the capture is cut into contiguous windows of N mains cycles
/// (<see cref="WindowCycles"/>; IEC 61000-4-7: 10 at 50 Hz, 12 at 60 Hz; other nominal frequencies the count nearest
/// 200 ms), each round(N·fs/f) samples long with f the frequency tracked in the window before, rectangular
/// (<see cref="WindowCutter"/>). Batches of windows are measured on worker threads (<see cref="WindowWorkers"/>,
/// <see cref="WindowMeasurement"/>) while the reading thread reads on, then folded in time order into the capture's
/// figures (<see cref="CaptureAccumulator"/>) and its events (<see cref="EventDetector"/>). A trailing part shorter
/// than a window is not analysed as a window (a warning says so); it is in the whole-capture summary and the
/// envelope.</para>
/// <para>Edge cases: a capture shorter than one window, or sampled too slowly to hold the mains frequency, is refused
/// (<see cref="CaptureFormatException"/>); the readers refuse NaN and infinite samples, so none reach the figures.</para>
/// </remarks>
public sealed class CaptureAnalysis
{
    /// <summary>Seconds held at the start to find the mains frequency.</summary>
    public const double DetectionS = 2.0;

    /// <summary>Most transient events listed (a warning counts the rest).</summary>
    public const int MaxTransients = EventDetector.MaxTransients;

    /// <summary>A sample at or beyond this share of the full scale counts as clipped (engineering choice).</summary>
    public const double ClipShare = WindowMeasurement.ClipShare;

    // Windows measured per batch (engineering choice: 8 windows, 1.6 s at 50 Hz, about 1 MB of slots; with the
    // sinks' job at most 9 jobs, so no more than 9 threads are ever used).
    private const int BatchWindows = 8;

    // Batches of slots: one being cut, up to two queued at the workers (the newer queued before the caller waits for
    // the older, so a worker never waits for the caller's folding and reading).
    private const int BatchSets = 3;

    private readonly CaptureInfo _info;
    private readonly AnalysisOptions _options;
    private readonly double _fs;
    private readonly EnvelopeBuilder _envelope;

    private double[] _detectBuffer;
    private int _detectCount;
    private long _count;
    private MainsTracker? _tracker;
    private WindowCutter? _cutter;
    private WindowWorkers? _workers;
    private CaptureAccumulator? _figures;
    private EventDetector? _events;
    private HalfCycleEpisodeDetector? _episodes;
    private int _cycles;
    private readonly Stack<WindowSlot[]> _spare = new();
    private readonly Queue<(WindowSlot[] Slots, int Count, WindowWorkers.Ticket Ticket)> _inFlight = new();
    private readonly VoltageInput? _voltage;
    private double[][] _voltageDetect = [];
    private double[][] _voltageBlock = [];
    private LeakageAccumulator? _leakage;

    /// <summary>Starts an analysis.</summary>
    /// <param name="info">The capture (sample rate, sensor, full scale, expected length).</param>
    /// <param name="options">Settings; checked here.</param>
    /// <exception cref="OptionValueException">An option is out of range.</exception>
    public CaptureAnalysis(CaptureInfo info, AnalysisOptions options)
    {
        ArgumentNullException.ThrowIfNull(info);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        _info = info;
        _options = options;
        _fs = info.SampleRateHz;
        var least = MinimumSampleRateHz(options.MainsHz);
        if (!(_fs > least && _fs <= CaptureLimits.MaxSampleRateHz))
        {
            // A window of N cycles needs the fundamental below the Nyquist frequency; the upper bound keeps the
            // windows' buffers (16 windows of 200 ms) within memory for any caller, not only the file readers.
            throw new CaptureFormatException(info.FilePath, _fs <= least
                ? string.Create(CultureInfo.InvariantCulture,
                    $"sample rate {_fs:G6} Hz is too low to analyse: the mains frequency (up to {least / 2:0.##} Hz) must lie below half the sample rate, so more than {least:0.##} Hz is needed")
                : CaptureLimits.RateProblem(_fs)!);
        }

        _envelope = new EnvelopeBuilder(_fs, info.SampleCount);
        _detectBuffer = new double[(int)Math.Clamp(Math.Round(DetectionS * _fs), 16, 1 << 22)];
        _voltage = info.Voltage;
        if (_voltage is not null)
        {
            _voltageDetect = [.. _voltage.Channels.Select(_ => new double[_detectBuffer.Length])];
            _leakage = new LeakageAccumulator(_voltage.ThreePhase ? ["L1", "L2", "L3"] : _voltage.Names);
        }
    }

    /// <summary>Samples pushed so far.</summary>
    public long SampleCount => _count;

    /// <summary>Complete windows analysed so far.</summary>
    public int WindowCount => _figures?.WindowCount ?? 0;

    /// <summary>Takes the next consecutive samples of the residual current, amperes.</summary>
    /// <exception cref="InvalidOperationException">The capture carries a voltage channel: push its blocks instead.</exception>
    public void Push(ReadOnlySpan<double> samplesA)
    {
        if (_voltage is not null)
        {
            throw new InvalidOperationException("a capture with a voltage channel is pushed block by block (Push(CaptureBlock)), so the voltage travels with the current");
        }

        Push(samplesA, null, 0);
    }

    /// <summary>Takes the next block of the capture: its residual current and, when the capture has voltage channels
    /// (<see cref="CaptureInfo.Voltage"/>), their volts, carried alongside into the same windows.</summary>
    public void Push(CaptureBlock block)
    {
        ArgumentNullException.ThrowIfNull(block);
        if (_voltage is null)
        {
            Push(block.ResidualA, null, 0);
            return;
        }

        if (_voltageBlock.Length == 0 || _voltageBlock[0].Length < block.Length)
        {
            _voltageBlock = [.. _voltage.Channels.Select(_ => new double[Math.Max(block.Capacity, block.Length)])];
        }

        for (var p = 0; p < _voltageBlock.Length; p++)
        {
            _voltage.Form(block, p, _voltageBlock[p]);
        }

        Push(block.ResidualA, _voltageBlock, 0);
    }

    private void Push(ReadOnlySpan<double> samplesA, double[][]? volts, int voltsOffset)
    {
        if (samplesA.IsEmpty)
        {
            return;
        }

        // The whole-capture sums come from the windows' moments and the tail's (every sample ends in one of them).
        _count += samplesA.Length;
        _envelope.Push(samplesA);

        if (_cutter is not null)
        {
            FeedWindows(samplesA, volts, voltsOffset);
            return;
        }

        var take = Math.Min(samplesA.Length, _detectBuffer.Length - _detectCount);
        samplesA[..take].CopyTo(_detectBuffer.AsSpan(_detectCount));
        if (volts is not null)
        {
            for (var p = 0; p < volts.Length; p++)
            {
                volts[p].AsSpan(voltsOffset, take).CopyTo(_voltageDetect[p].AsSpan(_detectCount));
            }
        }

        _detectCount += take;
        if (_detectCount == _detectBuffer.Length)
        {
            StartWindows();
            FeedWindows(samplesA[take..], volts, voltsOffset + take);
        }
    }

    /// <summary>Finishes the analysis and returns everything measured.</summary>
    /// <param name="finalInfo">The capture's description after the last read (one-pass formats finalise counts then);
    /// null to keep the one given at the start.</param>
    /// <param name="sourceWarnings">The reader's warnings, listed first.</param>
    public AnalysisResult Complete(CaptureInfo? finalInfo = null, IEnumerable<CaptureWarning>? sourceWarnings = null)
    {
        if (_cutter is null)
        {
            StartWindows();
        }

        var (tracker, cutter, figures, events) = (_tracker!, _cutter!, _figures!, _events!);
        var tail = cutter.Partial;
        Dispatch();
        while (_inFlight.Count > 0)
        {
            FoldOldest();
        }
        if (figures.WindowCount == 0)
        {
            // A verdict from no window at all would read as "type AC sufficient" on a capture that says nothing.
            throw new CaptureFormatException(_info.FilePath, string.Create(CultureInfo.InvariantCulture,
                $"the capture holds {_count} sample{(_count == 1 ? "" : "s")} ({_count / _fs:0.######} s at {_fs:G6} Hz): too short to analyse; one window needs {cutter.Length} samples ({cutter.Length / _fs:0.###} s, {WindowCycles.For(tracker.NominalHz)} cycles of {tracker.NominalHz:0.##} Hz)"));
        }

        figures.AddSamples(SampleMath.Moments(tail), tail.Length);
        foreach (var sink in _options.Sinks)
        {
            // The samples after the last whole window (the sinks had every window's in the batches).
            sink.Push(tail);
        }

        events.Close();
        _episodes?.Close();
        var warnings = new List<CaptureWarning>();
        if (sourceWarnings is not null)
        {
            warnings.AddRange(sourceWarnings);
        }

        if (tracker.Warning is { } fallback)
        {
            warnings.Add(fallback);
        }

        warnings.AddRange(events.Warnings);
        AddFinalWarnings(warnings, figures.MeanA);
        events.AddCountWarnings(warnings);
        if (cutter.Filled > 0)
        {
            warnings.Add(new CaptureWarning("partial-window", string.Create(CultureInfo.InvariantCulture,
                $"the last {cutter.Filled / _fs:0.###} s ({cutter.Filled} samples) after the last complete window are not analysed as a window; they are in the summary and the envelope"),
                cutter.Start / _fs));
        }

        var meanHz = figures.MeanFrequencyHz(tracker.FrequencyHz);
        var (minHz, maxHz) = figures.FrequencyRange(meanHz);
        var spectrum = figures.Spectrum(meanHz);
        var summary = figures.Summary();
        return new AnalysisResult
        {
            ToolVersion = typeof(CaptureAnalysis).Assembly.GetName().Version?.ToString(3) ?? "0.0.0",
            Capture = finalInfo ?? _info,
            Mains = tracker.Result(meanHz, minHz, maxHz),
            Summary = summary,
            Components = figures.Components(spectrum, summary, _options.ToneCount),
            Harmonics = figures.Harmonics(meanHz),
            Interharmonics = figures.Interharmonics(meanHz),
            Bands = figures.Bands(),
            Windows = figures.Windows(tracker.NominalHz),
            Events = [.. events.Events],
            Warnings = warnings,
            Spectrum = spectrum,
            Envelope = _envelope.Result(),
            WorstWindow = figures.WorstWindow(),
            Trend = figures.Trend(),
            LeakageSplit = _leakage?.Result(),
            HalfCycleEpisodes = _episodes?.Result(),
        };
    }

    /// <summary>The sample rate the analysis needs more than: twice the highest mains frequency it may find (60 Hz when
    /// it detects 50 or 60 Hz, else the one given), so that the fundamental lies below the Nyquist frequency.</summary>
    /// <param name="mainsHz">The nominal mains frequency given, hertz; null when it is detected.</param>
    public static double MinimumSampleRateHz(double? mainsHz) => 2 * (mainsHz ?? 60.0);

    /// <summary>Cycles per window for a nominal frequency: 10 at 50 Hz, 12 at 60 Hz, else the count nearest 200 ms
    /// (<see cref="WindowCycles.For"/>).</summary>
    public static int CyclesFor(double nominalHz) => WindowCycles.For(nominalHz);

    private void StartWindows()
    {
        var head = _detectBuffer.AsSpan(0, _detectCount);
        var tracker = MainsTracker.Start(head, _fs, _options, _info.FilePath);
        var nominal = tracker.NominalHz;
        var cycles = WindowCycles.For(nominal);
        var maxOrder = _options.MaxHarmonicOrder;
        var bands = FrequencyBands.For(_fs, _options.HighBandUpperHz);
        var maxLength = WindowCutter.CapacityFor(_fs, cycles, nominal);
        WindowSlot[] NewBatch()
        {
            var batch = new WindowSlot[BatchWindows];
            for (var i = 0; i < batch.Length; i++)
            {
                batch[i] = new WindowSlot(maxLength, maxOrder, bands.Length, _voltage?.Channels.Count ?? 0);
            }

            return batch;
        }

        _tracker = tracker;
        _cutter = new WindowCutter(_fs, cycles, nominal, tracker.FrequencyHz, NewBatch());
        for (var i = 1; i < BatchSets; i++)
        {
            _spare.Push(NewBatch());
        }
        var leakage = _voltage is null ? null : new LeakageWindowMeasurement(_fs, cycles, _voltage.Channels.Count);
        _workers = new WindowWorkers(Math.Min(_options.WorkerCount, BatchWindows + 1),
            () => new WindowMeasurement(_fs, cycles, maxOrder, bands, _options.RestBandA, _info.FullScaleA, leakage));
        _figures = new CaptureAccumulator(_fs, cycles, nominal, maxOrder, bands, maxLength, _options.HighBandUpperHz);
        _events = new EventDetector(_fs, _options, _info.FullScaleA);
        _episodes = _options.HalfCycleLevelsA.Count > 0 ? new HalfCycleEpisodeDetector(_fs, _options.HalfCycleLevelsA) : null;
        _cycles = cycles;
        FeedWindows(head, _voltage is null ? null : _voltageDetect, 0);
        _detectBuffer = [];
        _voltageDetect = [];
    }

    /// <summary>
    /// Cuts the samples into windows. A whole window is summed and tracked at once (the frequency sizes the next
    /// window) and queued; a full batch goes to the workers while the batch before is folded into the figures here.
    /// </summary>
    /// <param name="samplesA">Residual current, amperes.</param>
    /// <param name="volts">The voltages carried alongside (per channel, volts), or null without a voltage channel.</param>
    /// <param name="voltsOffset">Where in <paramref name="volts"/> the voltage of <c>samplesA[0]</c> is.</param>
    private void FeedWindows(ReadOnlySpan<double> samplesA, double[][]? volts, int voltsOffset)
    {
        var cutter = _cutter!;
        while (!samplesA.IsEmpty)
        {
            var slotFilling = cutter.Filling;
            var at = cutter.Filled;
            var take = cutter.Fill(samplesA);
            if (volts is not null)
            {
                for (var p = 0; p < volts.Length; p++)
                {
                    volts[p].AsSpan(voltsOffset, take).CopyTo(slotFilling.Volts[p].AsSpan(at));
                }

                voltsOffset += take;
            }

            samplesA = samplesA[take..];
            if (!cutter.IsFull)
            {
                continue;
            }

            var slot = cutter.Seal();
            slot.Moments = SampleMath.Moments(slot.Window);
            _figures!.AddSamples(slot.Moments, slot.Length);
            slot.FrequencyHz = _tracker!.Track(slot.Window, slot.Start, slot.MeanA, slot.AcRmsA);
            cutter.Advance(cutter.LengthFor(slot.FrequencyHz));
            if (cutter.BatchFull)
            {
                Dispatch();
            }
        }
    }

    private void Dispatch()
    {
        // The new batch is queued before the oldest is waited for and folded in, so the workers never wait for the
        // folding; its slots then go back to the cutter.
        var (slots, count) = _cutter!.TakeBatch(_spare.Pop());
        _inFlight.Enqueue((slots, count, _workers!.Start(slots.AsSpan(0, count), _options.Sinks)));
        if (_spare.Count == 0)
        {
            FoldOldest();
        }
    }

    private void FoldOldest()
    {
        var (slots, count, ticket) = _inFlight.Dequeue();
        _workers!.Wait(ticket);
        Fold(slots, count);
        _spare.Push(slots);
    }

    private void Fold(WindowSlot[] slots, int count)
    {
        for (var i = 0; i < count; i++)
        {
            var slot = slots[i];
            _figures!.Add(slot);
            _events!.Add(slot.Window, slot.Figures.Result, slot.Figures.PeakA);
            _leakage?.Add(slot.Leakage);
            _episodes?.Add(slot.Window, slot.Start / _fs, _cycles);
            _options.WindowCompleted?.Invoke(slot.Figures.Result);
        }
    }

    private void AddFinalWarnings(List<CaptureWarning> warnings, double meanA)
    {
        var nyquist = _fs / 2;
        if (nyquist < _options.HighBandUpperHz)
        {
            warnings.Add(new CaptureWarning("band-limit", string.Create(CultureInfo.InvariantCulture,
                $"nothing above {nyquist:0.#} Hz is seen (sample rate {_fs:0.#} S/s): switching frequencies and their harmonics above it are missing")));
        }

        if (_info.SensorCoupling == SensorCoupling.Ac)
        {
            warnings.Add(new CaptureWarning("dc-blind", string.Create(CultureInfo.InvariantCulture,
                $"the sensor is declared AC-coupled: smooth DC cannot be seen, so the DC figures (mean {CurrentText.WithUnit(meanA)}) are not measurements of it")));
        }
        else if (_info.SensorCoupling == SensorCoupling.Unknown)
        {
            warnings.Add(new CaptureWarning("dc-unknown", string.Create(CultureInfo.InvariantCulture,
                $"sensor coupling not stated: an AC-coupled sensor hides smooth DC (mean measured {CurrentText.WithUnit(meanA)}); state {Setting.Ref(nameof(ImportOptions.Sensor))} dc or ac")));
        }
    }
}
