using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Results;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The streaming analysis of one capture: <see cref="Push"/> consecutive blocks of residual current, then
/// <see cref="Complete"/> for the <see cref="AnalysisResult"/>. Memory does not grow with the capture's length:
/// window figures feed running statistics, percentiles a bounded estimator, the trend table and the envelope merge
/// pairs when full, the spectrum is accumulated per bin. Not thread-safe; one instance per capture.
/// </summary>
/// <remarks>
/// <para>The first <see cref="DetectionS"/> seconds are held to find the mains frequency (<see cref="MainsFrequency"/>);
/// then the capture is cut into contiguous windows of N mains cycles (IEC 61000-4-7: 10 at 50 Hz, 12 at 60 Hz; other
/// nominal frequencies the count nearest 200 ms), each round(N·fs/f) samples long with f the frequency tracked in the
/// window before, rectangular. A trailing part shorter than a window is not analysed as a window (a warning says
/// so); it is in the whole-capture summary and the envelope.</para>
/// <para>Edge cases: a capture shorter than one window, or sampled too slowly to hold the mains frequency, is refused
/// (<see cref="CaptureFormatException"/>); the readers refuse NaN and infinite samples, so none reach the figures.</para>
/// </remarks>
public sealed class CaptureAnalysis
{
    /// <summary>Seconds held at the start to find the mains frequency.</summary>
    public const double DetectionS = 2.0;

    /// <summary>Most transient events listed (a warning counts the rest).</summary>
    public const int MaxTransients = 1000;

    /// <summary>A sample at or beyond this share of the full scale counts as clipped (engineering choice).</summary>
    public const double ClipShare = 0.999;

    // Windows measured per batch (engineering choice: 8 windows, 1.6 s at 50 Hz, about 1 MB of slots; with the
    // sinks' job at most 9 jobs, so no more than 9 threads are ever used).
    private const int BatchWindows = 8;

    private readonly CaptureInfo _info;
    private readonly AnalysisOptions _options;
    private readonly double _fs;
    private readonly EnvelopeBuilder _envelope;
    private readonly List<EventRecord> _events = [];
    private readonly List<CaptureWarning> _warnings = [];
    private readonly (string Name, bool Signed, Func<WindowResult, double> Get, MetricAccumulator Stats)[] _metrics;

    private double[] _detectBuffer;
    private int _detectCount;
    private bool _detected;
    private MainsDetection _mains;
    private bool _tracking;
    private double _trackedHz;
    private int _cycles;
    private int _maxOrder;

    private WindowWorkers? _workers;
    private WindowSlot[] _filling = [];
    private WindowSlot[] _flying = [];
    private int _fillCount;
    private int _flyCount;
    private int _windowFill;
    private int _windowLength;
    private long _windowStart;

    private long _count;
    private double _sum;
    private double _sumSquares;
    private double _min = double.PositiveInfinity;
    private double _max = double.NegativeInfinity;

    private int _windows;
    private double _frequencySum;
    private double _frequencyMin = double.PositiveInfinity;
    private double _frequencyMax = double.NegativeInfinity;
    private double _maxSyncError;
    private GroupAccumulator _harmonic = new(0);
    private GroupAccumulator _inter = new(0);
    private (double LowHz, double HighHz)[] _bands = [];
    private GroupAccumulator _band = new(0);
    private double[] _spectrumSum = [];
    private int[] _spectrumCount = [];
    private double _mainsSum;
    private double _belowSum;
    private double _harmonicsSum;
    private double _above1kSum;
    private (double Re, double Im, double Centre)? _previousPhasor;
    private readonly PhasorKernel?[] _phasorKernels = new PhasorKernel?[4];
    private int _phasorNext;
    private double _above9kSum;
    private double _smoothDcSum;
    private double _smoothDcMax;
    private int _pulsating;
    private double _bipolarHarmonicsMaxPower;
    private double _pulsatingMeanMax;
    private double _oneKGroupMaxPower;
    private int _clippedWindows;
    private double _angleSum;
    private int _angleCount;
    private TrendTable? _trend;
    private double[] _worst = [];
    private int _worstLength;
    private double _worstRms = -1;
    private long _worstStart;
    private (double StartS, double EndS, double MaxA)? _alarm;
    private int _transients;
    private (double StartS, double EndS)? _clipStretch;
    private int _clipStretches;

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
        _metrics =
        [
            ("frequencyHz", false, w => w.FrequencyHz, new MetricAccumulator(false)),
            ("rmsA", false, w => w.RmsA, new MetricAccumulator(false)),
            ("dcA", true, w => w.DcA, new MetricAccumulator(true)),
            ("acRmsA", false, w => w.AcRmsA, new MetricAccumulator(false)),
            ("peakPositiveA", false, w => w.PeakPositiveA, new MetricAccumulator(false)),
            ("peakNegativeA", true, w => w.PeakNegativeA, new MetricAccumulator(true)),
            ("crestFactor", false, w => w.CrestFactor, new MetricAccumulator(false)),
            ("smoothDcA", true, w => w.SmoothDcA, new MetricAccumulator(true)),
            ("currentDelayAngleDeg", false, w => w.CurrentDelayAngleDeg ?? double.NaN, new MetricAccumulator(false)),
            ("mainsRmsA", false, w => w.MainsRmsA, new MetricAccumulator(false)),
            ("belowMainsRmsA", false, w => w.BelowMainsRmsA, new MetricAccumulator(false)),
            ("harmonicsRmsA", false, w => w.HarmonicsRmsA, new MetricAccumulator(false)),
            ("above1kHzRmsA", false, w => w.Above1kHzRmsA, new MetricAccumulator(false)),
            ("above9kHzRmsA", false, w => w.Above9kHzRmsA, new MetricAccumulator(false)),
            ("thdPercent", false, w => w.ThdPercent ?? double.NaN, new MetricAccumulator(false)),
        ];
    }

    /// <summary>Samples pushed so far.</summary>
    public long SampleCount => _count;

    /// <summary>Complete windows analysed so far.</summary>
    public int WindowCount => _windows;

    /// <summary>Takes the next consecutive samples of the residual current, amperes.</summary>
    public void Push(ReadOnlySpan<double> samplesA)
    {
        if (samplesA.IsEmpty)
        {
            return;
        }

        // The whole-capture sums come from the windows' moments and the tail's (every sample ends in one of them).
        _count += samplesA.Length;
        _envelope.Push(samplesA);

        if (_detected)
        {
            FeedWindows(samplesA);
            return;
        }

        var take = Math.Min(samplesA.Length, _detectBuffer.Length - _detectCount);
        samplesA[..take].CopyTo(_detectBuffer.AsSpan(_detectCount));
        _detectCount += take;
        if (_detectCount == _detectBuffer.Length)
        {
            StartWindows();
            FeedWindows(samplesA[take..]);
        }
    }

    /// <summary>Finishes the analysis and returns everything measured.</summary>
    /// <param name="finalInfo">The capture's description after the last read (one-pass formats finalise counts then);
    /// null to keep the one given at the start.</param>
    /// <param name="sourceWarnings">The reader's warnings, listed first.</param>
    public AnalysisResult Complete(CaptureInfo? finalInfo = null, IEnumerable<CaptureWarning>? sourceWarnings = null)
    {
        if (!_detected)
        {
            StartWindows();
        }

        var partial = _filling[_fillCount];
        Dispatch();
        _workers!.Wait();
        Fold(_flying, _flyCount);
        _flyCount = 0;
        if (_windows == 0)
        {
            // A verdict from no window at all would read as "type AC sufficient" on a capture that says nothing.
            throw new CaptureFormatException(_info.FilePath, string.Create(CultureInfo.InvariantCulture,
                $"the capture holds {_count} sample{(_count == 1 ? "" : "s")} ({_count / _fs:0.######} s at {_fs:G6} Hz): too short to analyse; one window needs {_windowLength} samples ({_windowLength / _fs:0.###} s, {_cycles} cycles of {_mains.NominalHz:0.##} Hz)"));
        }

        var tail = partial.Samples.AsSpan(0, _windowFill);
        AddToSummary(SampleMath.Moments(tail));
        foreach (var sink in _options.Sinks)
        {
            // The samples after the last whole window (the sinks had every window's in the batches).
            sink.Push(tail);
        }

        CloseAlarm();
        CloseClipStretch();
        var warnings = new List<CaptureWarning>();
        if (sourceWarnings is not null)
        {
            warnings.AddRange(sourceWarnings);
        }

        warnings.AddRange(_warnings);
        AddFinalWarnings(warnings);
        var meanHz = _windows > 0 ? _frequencySum / _windows : _trackedHz;
        var harmonics = new HarmonicValue[_maxOrder];
        for (var n = 1; n <= _maxOrder; n++)
        {
            harmonics[n - 1] = new HarmonicValue(n, n * meanHz, _harmonic.Rms(n), _harmonic.Max(n));
        }

        var interharmonics = new HarmonicValue[_maxOrder];
        for (var n = 0; n < _maxOrder; n++)
        {
            interharmonics[n] = new HarmonicValue(n, (n + 0.5) * meanHz, _inter.Rms(n), _inter.Max(n));
        }

        var bands = new BandValue[_bands.Length];
        for (var b = 0; b < bands.Length; b++)
        {
            bands[b] = new BandValue(_bands[b].LowHz, _bands[b].HighHz, _band.Rms(b), _band.Max(b));
        }

        var spectrum = BuildSpectrum(meanHz);
        var summary = BuildSummary();
        var components = BuildComponents(harmonics, spectrum, summary);
        var statistics = new Dictionary<string, MetricStatistics>(_metrics.Length);
        foreach (var metric in _metrics)
        {
            statistics[metric.Name] = metric.Stats.Result();
        }

        _events.Sort((a, b) => a.StartS.CompareTo(b.StartS));
        var nominal = _mains.NominalHz;
        return new AnalysisResult
        {
            ToolVersion = typeof(CaptureAnalysis).Assembly.GetName().Version?.ToString(3) ?? "0.0.0",
            Capture = finalInfo ?? _info,
            Mains = BuildMains(meanHz),
            Summary = summary,
            Components = components,
            Harmonics = harmonics,
            Interharmonics = interharmonics,
            Bands = bands,
            Windows = new WindowsResult
            {
                Count = _windows,
                CyclesPerWindow = _cycles,
                LengthS = _cycles / nominal,
                MaxSyncErrorPercent = _maxSyncError,
                Statistics = statistics,
            },
            Events = [.. _events],
            Warnings = warnings,
            Spectrum = spectrum,
            Envelope = _envelope.Result(),
            WorstWindow = new WaveformExcerpt(_worstStart / _fs, _fs, _worst.AsSpan(0, _worstLength).ToArray(),
                "window with the highest RMS"),
            Trend = _trend!.Result(),
        };
    }

    /// <summary>The sample rate the analysis needs more than: twice the highest mains frequency it may find (60 Hz when
    /// it detects 50 or 60 Hz, else the one given), so that the fundamental lies below the Nyquist frequency.</summary>
    /// <param name="mainsHz">The nominal mains frequency given, hertz; null when it is detected.</param>
    public static double MinimumSampleRateHz(double? mainsHz) => 2 * (mainsHz ?? 60.0);

    /// <summary>Cycles per window for a nominal frequency: 10 at 50 Hz, 12 at 60 Hz, else the count nearest 200 ms.</summary>
    public static int CyclesFor(double nominalHz) =>
        nominalHz == 50 ? 10 : nominalHz == 60 ? 12 : Math.Max(2, (int)Math.Round(0.2 * nominalHz));

    private void StartWindows()
    {
        _detected = true;
        var head = _detectBuffer.AsSpan(0, _detectCount);
        _mains = MainsFrequency.Detect(head, _fs, _options.MainsHz);
        if (_options.MainsHz is { } given && !_options.KeepGivenMains &&
            MainsFrequency.Contradicts(head, _fs, given, _mains) is { } seenHz)
        {
            throw new UserInputException(string.Create(CultureInfo.InvariantCulture,
                $"{Path.GetFileName(_info.FilePath)}: mains given as {given:0.##} Hz, but the capture's mains content in its first {head.Length / _fs:0.#} s is at {seenHz:0.##} Hz; give --mains {Math.Round(seenHz / 10) * 10:0} or auto, or --mains-as-given to keep {given:0.##} Hz"));
        }

        _tracking = _mains.Found;
        _trackedHz = _mains.FrequencyHz;
        if (!_mains.Found)
        {
            _warnings.Add(new CaptureWarning("mains-fallback", string.Create(CultureInfo.InvariantCulture,
                $"too little mains content to find the mains frequency: windows sized for {_mains.NominalHz:0.##} Hz, frequency not tracked")));
        }

        var nominal = _mains.NominalHz;
        _cycles = CyclesFor(nominal);
        var maxLength = (int)Math.Ceiling(_cycles * _fs / (nominal * (1 - MainsFrequency.TrackingRange))) + 2;
        _filling = new WindowSlot[BatchWindows];
        _flying = new WindowSlot[BatchWindows];
        for (var i = 0; i < BatchWindows; i++)
        {
            _filling[i] = new WindowSlot(maxLength);
            _flying[i] = new WindowSlot(maxLength);
        }

        _workers = new WindowWorkers(Math.Min(_options.WorkerCount, BatchWindows + 1), _cycles, _options.RestBandA);
        _worst = new double[maxLength];
        _windowLength = NextLength();
        _trend = new TrendTable(nominal);
        _maxOrder = _options.MaxHarmonicOrder;
        _harmonic = new GroupAccumulator(_maxOrder + 1);
        _inter = new GroupAccumulator(_maxOrder);
        _bands = BuildBands();
        _band = new GroupAccumulator(_bands.Length);
        var resolution = nominal / _cycles;
        var upper = Math.Min(_fs / 2, _options.HighBandUpperHz);
        var bins = Math.Min((int)Math.Floor(upper / resolution) + 1, (maxLength / 2) + 1);
        _spectrumSum = new double[bins];
        _spectrumCount = new int[bins];
        FeedWindows(head);
        _detectBuffer = [];
    }

    private (double LowHz, double HighHz)[] BuildBands()
    {
        var nyquist = _fs / 2;
        var bands = new List<(double, double)>();
        for (var centre = 2100.0; centre <= 8900; centre += 200)
        {
            if (centre - 100 < nyquist)
            {
                bands.Add((centre - 100, Math.Min(centre + 100, nyquist)));
            }
        }

        var top = Math.Min(nyquist, _options.HighBandUpperHz);
        for (var low = 9000.0; low < top; low += 2000)
        {
            bands.Add((low, Math.Min(low + 2000, top)));
        }

        return [.. bands];
    }

    private int NextLength() => (int)Math.Round(_cycles * _fs / _trackedHz);

    private void FeedWindows(ReadOnlySpan<double> samplesA)
    {
        while (!samplesA.IsEmpty)
        {
            var take = Math.Min(samplesA.Length, _windowLength - _windowFill);
            samplesA[..take].CopyTo(_filling[_fillCount].Samples.AsSpan(_windowFill));
            _windowFill += take;
            samplesA = samplesA[take..];
            if (_windowFill == _windowLength)
            {
                CompleteWindow();
                _windowStart += _windowLength;
                _windowFill = 0;
                _windowLength = NextLength();
            }
        }
    }

    /// <summary>
    /// Tracks the frequency at once (it sizes the next window) and queues the window; a full batch goes to the
    /// workers for spectra and shape while the batch before is folded into the figures here, in time order.
    /// </summary>
    private void CompleteWindow()
    {
        var slot = _filling[_fillCount];
        slot.Length = _windowLength;
        slot.Start = _windowStart;
        slot.Moments = SampleMath.Moments(slot.Window);
        AddToSummary(slot.Moments);
        slot.FrequencyHz = TrackFrequency(slot);
        _fillCount++;
        if (_fillCount == _filling.Length)
        {
            Dispatch();
        }
    }

    private void AddToSummary((double Sum, double Squares, double Min, double Max) moments)
    {
        _sum += moments.Sum;
        _sumSquares += moments.Squares;
        _min = Math.Min(_min, moments.Min);
        _max = Math.Max(_max, moments.Max);
    }

    private void Dispatch()
    {
        // The new batch goes out before the finished one is folded in, so the workers never wait for the folding.
        _workers!.Wait();
        var (done, doneCount) = (_flying, _flyCount);
        (_flying, _flyCount) = (_filling, _fillCount);
        _workers.Start(_flying.AsSpan(0, _flyCount), _options.Sinks);
        Fold(done, doneCount);
        (_filling, _fillCount) = (done, 0);
    }

    private void Fold(WindowSlot[] slots, int count)
    {
        for (var i = 0; i < count; i++)
        {
            AnalyzeWindow(slots[i]);
        }
    }

    private double TrackFrequency(WindowSlot slot)
    {
        if (!_tracking)
        {
            return _trackedHz;
        }

        var w = slot.Window;
        var (sum, squares, _, _) = slot.Moments;
        var mean = sum / w.Length;
        var ac = Math.Sqrt(Math.Max(0, (squares / w.Length) - (mean * mean)));
        var nominal = _mains.NominalHz;
        // Window lengths move by a sample or two as the frequency drifts: the last few kernels are kept.
        PhasorKernel? kernel = null;
        foreach (var k in _phasorKernels)
        {
            if (k?.Length == w.Length)
            {
                kernel = k;
            }
        }

        if (kernel is null)
        {
            kernel = new PhasorKernel(w.Length, _fs, nominal);
            _phasorKernels[_phasorNext] = kernel;
            _phasorNext = (_phasorNext + 1) % _phasorKernels.Length;
        }

        var (re, im, fundamental) = kernel.Phasor(w, slot.Start, mean);
        var centre = slot.Start + ((w.Length - 1) / 2.0);
        var strong = fundamental >= MainsFrequency.MinFundamentalA && fundamental >= MainsFrequency.MinFundamentalShare * ac;
        if (strong && _previousPhasor is { } previous)
        {
            // arg(p_k · conj p_{k−1}) = 2π (f − f_nominal) Δt, unambiguous for |f − f_nominal| < 1/(2Δt) = 2.5 Hz.
            var dr = (re * previous.Re) + (im * previous.Im);
            var di = (im * previous.Re) - (re * previous.Im);
            var dt = (centre - previous.Centre) / _fs;
            var hz = nominal + (Math.Atan2(di, dr) / (2 * Math.PI * dt));
            if (Math.Abs(hz - nominal) <= MainsFrequency.TrackingRange * nominal)
            {
                _trackedHz = hz;
            }
        }

        _previousPhasor = strong ? (re, im, centre) : null;
        return _trackedHz;
    }

    private void AnalyzeWindow(WindowSlot slot)
    {
        var w = slot.Window;
        var power = slot.Bins;
        var start = slot.Start;
        var frequency = slot.FrequencyHz;
        var n = w.Length;
        var startS = start / _fs;
        var (sum, squares, min, max) = slot.Moments;
        var mean = sum / n;
        var meanSquare = squares / n;
        var rms = Math.Sqrt(meanSquare);
        var ac = Math.Sqrt(Math.Max(0, meanSquare - (mean * mean)));
        var peak = Math.Max(Math.Abs(min), Math.Abs(max));
        var exact = _cycles * _fs / frequency;
        _maxSyncError = Math.Max(_maxSyncError, Math.Abs(n - exact) / exact * 100);

        var shape = slot.Shape;
        var resolution = _fs / n;

        var harmonicsPower = 0.0;
        var g1 = 0.0;
        for (var order = 1; order <= _maxOrder; order++)
        {
            if ((_cycles * order) + (_cycles / 2) >= power.Length)
            {
                break;
            }

            var g = HarmonicGroups.Group(power, _cycles, order);
            if (order == 1)
            {
                g1 = g;
            }
            else
            {
                harmonicsPower += g;
            }

            _harmonic.Add(order, g);
        }

        for (var order = 0; order < _maxOrder; order++)
        {
            if ((_cycles * (order + 1)) - 1 >= power.Length)
            {
                break;
            }

            _inter.Add(order, HarmonicGroups.InterharmonicGroup(power, _cycles, order));
        }

        // Harmonic groups from order 2 up to 1 kHz (type B's range) of a window that is not pulsating DC: the evidence of
        // AC at frequencies other than mains. A half-wave's own harmonics are not counted (they are its shape).
        if (!shape.PulsatingDc)
        {
            // The group holding 1 kHz is kept apart: type F's composite test current has a 1 kHz part (IEC 62423).
            var harmonicsPowerBelow1k = 0.0;
            var oneKOrder = (int)Math.Round(1000 / frequency);
            for (var order = 2; order <= Math.Min(oneKOrder, _maxOrder); order++)
            {
                if ((_cycles * order) + (_cycles / 2) >= power.Length)
                {
                    break;
                }

                var g = HarmonicGroups.Group(power, _cycles, order);
                if (order < oneKOrder)
                {
                    harmonicsPowerBelow1k += g;
                }
                else
                {
                    _oneKGroupMaxPower = Math.Max(_oneKGroupMaxPower, g);
                }
            }

            _bipolarHarmonicsMaxPower = Math.Max(_bipolarHarmonicsMaxPower, harmonicsPowerBelow1k);
        }

        var belowPower = HarmonicGroups.BelowFundamental(power, _cycles);
        // "Above 1 kHz" starts after the harmonic group centred on 1 kHz (half a group, N/2 bins, beyond the bin nearest
        // 1 kHz): a 1 kHz component, the top of type B's range and of type F's composite test current, leaks into
        // its neighbours whenever the window is a few hundredths of a hertz off synchronisation, and IEC 61000-4-7
        // counts those bins to its group. Likewise for 9 kHz.
        var above1k = HarmonicGroups.Sum(power, (int)Math.Round(1000 / resolution) + (_cycles / 2) + 1, power.Length - 1);
        var above9k = HarmonicGroups.Sum(power, (int)Math.Round(9000 / resolution) + (_cycles / 2) + 1, power.Length - 1);
        for (var b = 0; b < _bands.Length; b++)
        {
            var (low, high) = _bands[b];
            var from = (int)Math.Round(low / resolution) + 1;
            var to = (int)Math.Round(high / resolution);
            if (from >= power.Length)
            {
                continue;
            }

            _band.Add(b, HarmonicGroups.Sum(power, from, to));
        }

        var bins = Math.Min(_spectrumSum.Length, power.Length);
        for (var k = 0; k < bins; k++)
        {
            _spectrumSum[k] += power[k];
            _spectrumCount[k]++;
        }

        var mainsRms = Math.Sqrt(g1);
        var window = new WindowResult
        {
            StartS = startS,
            DurationS = n / _fs,
            FrequencyHz = frequency,
            RmsA = rms,
            DcA = mean,
            AcRmsA = ac,
            PeakPositiveA = max,
            PeakNegativeA = min,
            CrestFactor = rms > 0 ? peak / rms : 0,
            SmoothDcA = shape.SmoothDcA,
            PulsatingDc = shape.PulsatingDc,
            CurrentDelayAngleDeg = shape.CurrentDelayAngleDeg,
            MainsRmsA = mainsRms,
            BelowMainsRmsA = Math.Sqrt(belowPower),
            HarmonicsRmsA = Math.Sqrt(harmonicsPower),
            Above1kHzRmsA = Math.Sqrt(above1k),
            Above9kHzRmsA = Math.Sqrt(above9k),
            ThdPercent = HasFundamental(mainsRms, ac) ? Math.Sqrt(harmonicsPower) / mainsRms * 100 : null,
            Clipped = _info.FullScaleA is { } fullScale && peak >= ClipShare * fullScale,
        };

        _windows++;
        _frequencySum += frequency;
        _frequencyMin = Math.Min(_frequencyMin, frequency);
        _frequencyMax = Math.Max(_frequencyMax, frequency);
        _mainsSum += g1;
        _belowSum += belowPower;
        _harmonicsSum += harmonicsPower;
        _above1kSum += above1k;
        _above9kSum += above9k;
        _smoothDcSum += shape.SmoothDcA;
        if (Math.Abs(shape.SmoothDcA) > Math.Abs(_smoothDcMax))
        {
            _smoothDcMax = shape.SmoothDcA;
        }

        if (shape.PulsatingDc)
        {
            _pulsating++;
            _pulsatingMeanMax = Math.Max(_pulsatingMeanMax, Math.Abs(mean - shape.SmoothDcA));
        }

        if (window.Clipped)
        {
            _clippedWindows++;
        }

        if (shape.CurrentDelayAngleDeg is { } angle)
        {
            _angleSum += angle;
            _angleCount++;
        }

        foreach (var metric in _metrics)
        {
            metric.Stats.Add(metric.Get(window), startS);
        }

        _trend!.Add(window);
        if (rms > _worstRms)
        {
            _worstRms = rms;
            _worstStart = start;
            _worstLength = n;
            w.CopyTo(_worst);
        }

        RecordEvents(w, window, peak);
        _options.WindowCompleted?.Invoke(window);
    }

    private static bool HasFundamental(double mainsRms, double acRms) => mainsRms > 1e-9 && mainsRms >= 1e-3 * acRms;

    private void RecordEvents(ReadOnlySpan<double> w, WindowResult window, double peak)
    {
        var endS = window.StartS + window.DurationS;
        if (_options.AlarmA is { } alarm && window.RmsA > alarm)
        {
            _alarm = _alarm is { } open
                ? (open.StartS, endS, Math.Max(open.MaxA, window.RmsA))
                : (window.StartS, endS, window.RmsA);
        }
        else
        {
            CloseAlarm();
        }

        if (window.Clipped)
        {
            _clipStretch = _clipStretch is { } open ? (open.StartS, endS) : (window.StartS, endS);
        }
        else
        {
            CloseClipStretch();
        }

        if (peak > _options.TransientFactor * window.RmsA && peak > _options.TransientFloorA)
        {
            _transients++;
            if (_transients <= MaxTransients)
            {
                var at = 0;
                for (var i = 1; i < w.Length; i++)
                {
                    if (Math.Abs(w[i]) > Math.Abs(w[at]))
                    {
                        at = i;
                    }
                }

                var value = w[at];
                _events.Add(new EventRecord("transient", window.StartS + (at / _fs), 1 / _fs, value,
                    string.Create(CultureInfo.InvariantCulture,
                        $"peak {CurrentText.WithUnit(value)}, {peak / window.RmsA:0.0} times the window RMS of {CurrentText.WithUnit(window.RmsA)}")));
            }
        }
    }

    private void CloseAlarm()
    {
        if (_alarm is not { } open)
        {
            return;
        }

        _alarm = null;
        _events.Add(new EventRecord("alarm", open.StartS, open.EndS - open.StartS, open.MaxA,
            string.Create(CultureInfo.InvariantCulture,
                $"window RMS above {CurrentText.WithUnit(_options.AlarmA!.Value)} for {open.EndS - open.StartS:0.###} s, highest {CurrentText.WithUnit(open.MaxA)}")));
    }

    private void CloseClipStretch()
    {
        if (_clipStretch is not { } open)
        {
            return;
        }

        _clipStretch = null;
        _clipStretches++;
        if (_clipStretches <= 20)
        {
            _warnings.Add(new CaptureWarning("clipping", string.Create(CultureInfo.InvariantCulture,
                $"samples at full scale (±{CurrentText.WithUnit(_info.FullScaleA ?? 0)}) from {open.StartS:0.###} s to {open.EndS:0.###} s: peaks and RMS there are lower bounds"),
                open.StartS));
        }
    }

    private void AddFinalWarnings(List<CaptureWarning> warnings)
    {
        var nyquist = _fs / 2;
        if (nyquist < _options.HighBandUpperHz)
        {
            warnings.Add(new CaptureWarning("band-limit", string.Create(CultureInfo.InvariantCulture,
                $"nothing above {nyquist:0.#} Hz is seen (sample rate {_fs:0.#} S/s): switching frequencies and their harmonics above it are missing")));
        }

        var dc = _count > 0 ? _sum / _count : 0;
        if (_info.SensorCoupling == SensorCoupling.Ac)
        {
            warnings.Add(new CaptureWarning("dc-blind", string.Create(CultureInfo.InvariantCulture,
                $"the sensor is declared AC-coupled: smooth DC cannot be seen, so the DC figures (mean {CurrentText.WithUnit(dc)}) are not measurements of it")));
        }
        else if (_info.SensorCoupling == SensorCoupling.Unknown)
        {
            warnings.Add(new CaptureWarning("dc-unknown", string.Create(CultureInfo.InvariantCulture,
                $"sensor coupling not stated: an AC-coupled sensor hides smooth DC (mean measured {CurrentText.WithUnit(dc)}); state --sensor dc or ac")));
        }

        if (_clipStretches > 20)
        {
            warnings.Add(new CaptureWarning("clipping", $"{_clipStretches - 20} more clipped stretches not listed"));
        }

        if (_transients > MaxTransients)
        {
            warnings.Add(new CaptureWarning("transients-truncated",
                $"{_transients} transients found; the first {MaxTransients} are listed"));
        }

        if (_windowFill > 0)
        {
            warnings.Add(new CaptureWarning("partial-window", string.Create(CultureInfo.InvariantCulture,
                $"the last {_windowFill / _fs:0.###} s ({_windowFill} samples) after the last complete window are not analysed as a window; they are in the summary and the envelope"),
                _windowStart / _fs));
        }
    }

    private MainsResult BuildMains(double meanHz)
    {
        var nominal = _mains.NominalHz;
        var min = _windows > 0 ? _frequencyMin : meanHz;
        var max = _windows > 0 ? _frequencyMax : meanHz;
        var source = !_mains.Found ? "fallback" : _options.MainsHz is null ? "detected" : "given";
        var method = _mains.Found
            ? string.Create(CultureInfo.InvariantCulture,
                $"{(_options.MainsHz is null ? "50/60 Hz chosen by the strongest" : "given nominal; found by the")} Hann-interpolated spectral peak of the first {_detectCount / _fs:0.##} s; tracked by the phase advance of the Hann-weighted fundamental between consecutive whole windows")
            : string.Create(CultureInfo.InvariantCulture,
                $"too little mains content: nominal {nominal:0.##} Hz used, not tracked");
        return new MainsResult(meanHz, nominal, source, min, max, method);
    }

    private SummaryResult BuildSummary()
    {
        if (_count == 0)
        {
            return new SummaryResult(0, 0, 0, 0, 0, 0, 0);
        }

        var mean = _sum / _count;
        var meanSquare = _sumSquares / _count;
        var rms = Math.Sqrt(meanSquare);
        var peak = Math.Max(Math.Abs(_min), Math.Abs(_max));
        return new SummaryResult(rms, mean, Math.Sqrt(Math.Max(0, meanSquare - (mean * mean))), peak, _max, _min,
            rms > 0 ? peak / rms : 0);
    }

    private ComponentsResult BuildComponents(HarmonicValue[] harmonics, SpectrumResult spectrum, SummaryResult summary)
    {
        var count = Math.Max(_windows, 1);
        var mainsRms = Math.Sqrt(_mainsSum / count);
        var harmonicsRms = Math.Sqrt(_harmonicsSum / count);
        return new ComponentsResult
        {
            SmoothDcA = _windows > 0 ? _smoothDcSum / _windows : summary.DcA,
            SmoothDcMaxA = _windows > 0 ? _smoothDcMax : summary.DcA,
            PulsatingDc = _windows > 0 && _pulsating * 2 > _windows,
            PulsatingDcShare = _windows > 0 ? _pulsating / (double)_windows : 0,
            CurrentDelayAngleDeg = _windows > 0 && _angleCount * 2 >= _windows ? _angleSum / _angleCount : null,
            MainsRmsA = mainsRms,
            BelowMainsRmsA = Math.Sqrt(_belowSum / count),
            HarmonicsRmsA = harmonicsRms,
            Above1kHzRmsA = Math.Sqrt(_above1kSum / count),
            Above9kHzRmsA = Math.Sqrt(_above9kSum / count),
            ThdPercent = _windows > 0 && HasFundamental(mainsRms, summary.AcRmsA) ? harmonicsRms / mainsRms * 100 : null,
            Tones = ToneFinder.Strongest(spectrum, _cycles, harmonics.Length, _options.ToneCount, summary.AcRmsA),
            NonPulsatingHarmonicsTo1kMaxA = Math.Sqrt(_bipolarHarmonicsMaxPower),
            NonPulsating1kGroupMaxA = Math.Sqrt(_oneKGroupMaxPower),
            ClippedWindowShare = _windows > 0 ? _clippedWindows / (double)_windows : 0,
            PulsatingMeanMaxA = _pulsatingMeanMax,
        };
    }

    private SpectrumResult BuildSpectrum(double meanHz)
    {
        var resolution = meanHz / _cycles;
        var bins = 0;
        while (bins < _spectrumCount.Length && _spectrumCount[bins] > 0)
        {
            bins++;
        }

        var frequencies = new double[bins];
        var rms = new double[bins];
        for (var k = 0; k < bins; k++)
        {
            frequencies[k] = k * resolution;
            rms[k] = Math.Sqrt(_spectrumSum[k] / _spectrumCount[k]);
        }

        return new SpectrumResult(resolution, frequencies, rms);
    }

    /// <summary>Per-index mean square and largest value over windows, for groups and bands.</summary>
    private sealed class GroupAccumulator(int size)
    {
        private readonly double[] _sum = new double[size];
        private readonly double[] _max = new double[size];
        private readonly int[] _count = new int[size];

        public void Add(int index, double meanSquare)
        {
            _sum[index] += meanSquare;
            _max[index] = Math.Max(_max[index], meanSquare);
            _count[index]++;
        }

        /// <summary>Square root of the mean over windows; NaN where no window could see it.</summary>
        public double Rms(int index) => _count[index] > 0 ? Math.Sqrt(_sum[index] / _count[index]) : double.NaN;

        public double Max(int index) => _count[index] > 0 ? Math.Sqrt(_max[index]) : double.NaN;
    }
}
