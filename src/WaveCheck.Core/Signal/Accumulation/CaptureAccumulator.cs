using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Folds measured windows, in time order, into the figures of the whole capture: the summary from every sample's
/// moments, the harmonic groups, bands and ranges as the RMS over windows of their mean squares (IEC 61000-4-7
/// aggregation) with the largest window value, the averaged spectrum, the window statistics, the trend table and the
/// worst window. Memory does not grow with the capture's length. Not thread-safe; one instance per capture.
/// </summary>
internal sealed class CaptureAccumulator
{
    private readonly double _fs;
    private readonly int _cycles;
    private readonly int _maxOrder;
    private readonly (double LowHz, double HighHz)[] _bands;
    private readonly GroupAccumulator _harmonic;
    private readonly GroupAccumulator _inter;
    private readonly GroupAccumulator _band;
    private readonly double[] _spectrumSum;
    private readonly int[] _spectrumCount;
    private readonly WindowMetrics _metrics = new();
    private readonly TrendTable _trend;
    private readonly double[] _worst;

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
    private double _mainsSum;
    private double _belowSum;
    private double _harmonicsSum;
    private double _above1kSum;
    private double _above9kSum;
    private double _smoothDcSum;
    private double _smoothDcMax;
    private int _pulsating;
    private double _pulsatingMeanMax;
    private double _bipolarHarmonicsMaxPower;
    private double _oneKGroupMaxPower;
    private int _clippedWindows;
    private double _angleSum;
    private int _angleCount;
    private int _worstLength;
    private double _worstRms = -1;
    private long _worstStart;
    private WindowResult? _worstWindow;

    /// <summary>Sets up the figures of one capture.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="cycles">Mains cycles per window.</param>
    /// <param name="nominalHz">Nominal mains frequency, hertz.</param>
    /// <param name="maxOrder">Highest harmonic order grouped.</param>
    /// <param name="bands">The bands measured (<see cref="FrequencyBands.For"/>).</param>
    /// <param name="maxLength">Longest window, samples.</param>
    /// <param name="highBandUpperHz">Highest frequency of interest, hertz: the averaged spectrum ends there or at
    /// the Nyquist frequency.</param>
    public CaptureAccumulator(double sampleRateHz, int cycles, double nominalHz, int maxOrder,
        (double LowHz, double HighHz)[] bands, int maxLength, double highBandUpperHz)
    {
        _fs = sampleRateHz;
        _cycles = cycles;
        _maxOrder = maxOrder;
        _bands = bands;
        _harmonic = new GroupAccumulator(maxOrder + 1);
        _inter = new GroupAccumulator(maxOrder);
        _band = new GroupAccumulator(bands.Length);
        var resolution = nominalHz / cycles;
        var upper = Math.Min(sampleRateHz / 2, highBandUpperHz);
        var bins = Math.Min((int)Math.Floor(upper / resolution) + 1, (maxLength / 2) + 1);
        _spectrumSum = new double[bins];
        _spectrumCount = new int[bins];
        _trend = new TrendTable(nominalHz);
        _worst = new double[maxLength];
    }

    /// <summary>Windows folded in so far.</summary>
    public int WindowCount => _windows;

    /// <summary>Mean of all samples so far, amperes (0 before any).</summary>
    public double MeanA => _count > 0 ? _sum / _count : 0;

    /// <summary>Adds samples to the whole-capture summary by their moments (every sample once: each window's, then
    /// the tail's after the last window).</summary>
    /// <param name="moments">Sum, sum of squares, least and greatest sample (<see cref="SampleMath.Moments(ReadOnlySpan{double})"/>).</param>
    /// <param name="count">Samples they cover.</param>
    public void AddSamples((double Sum, double Squares, double Min, double Max) moments, int count)
    {
        _count += count;
        _sum += moments.Sum;
        _sumSquares += moments.Squares;
        _min = Math.Min(_min, moments.Min);
        _max = Math.Max(_max, moments.Max);
    }

    /// <summary>Folds in the next measured window (its samples' moments already added).</summary>
    public void Add(WindowSlot slot)
    {
        var f = slot.Figures;
        var window = f.Result;
        _maxSyncError = Math.Max(_maxSyncError, f.SyncErrorPercent);
        for (var order = 1; order <= f.HarmonicOrders; order++)
        {
            _harmonic.Add(order, f.HarmonicGroupA2[order]);
        }

        for (var order = 0; order < f.InterharmonicOrders; order++)
        {
            _inter.Add(order, f.InterharmonicGroupA2[order]);
        }

        if (f.OneKHzGroupA2 is { } oneK)
        {
            _oneKGroupMaxPower = Math.Max(_oneKGroupMaxPower, oneK);
        }

        if (f.HarmonicsTo1kHzA2 is { } bipolar)
        {
            _bipolarHarmonicsMaxPower = Math.Max(_bipolarHarmonicsMaxPower, bipolar);
        }

        for (var b = 0; b < f.BandCount; b++)
        {
            _band.Add(b, f.BandA2[b]);
        }

        var power = slot.Bins;
        var bins = Math.Min(_spectrumSum.Length, power.Length);
        for (var k = 0; k < bins; k++)
        {
            _spectrumSum[k] += power[k];
            _spectrumCount[k]++;
        }

        _windows++;
        _frequencySum += window.FrequencyHz;
        _frequencyMin = Math.Min(_frequencyMin, window.FrequencyHz);
        _frequencyMax = Math.Max(_frequencyMax, window.FrequencyHz);
        _mainsSum += f.MainsA2;
        _belowSum += f.BelowMainsA2;
        _harmonicsSum += f.HarmonicsA2;
        _above1kSum += f.Above1kHzA2;
        _above9kSum += f.Above9kHzA2;
        _smoothDcSum += window.SmoothDcA;
        if (Math.Abs(window.SmoothDcA) > Math.Abs(_smoothDcMax))
        {
            _smoothDcMax = window.SmoothDcA;
        }

        if (window.PulsatingDc)
        {
            _pulsating++;
            _pulsatingMeanMax = Math.Max(_pulsatingMeanMax, Math.Abs(window.DcA - window.SmoothDcA));
        }

        if (window.Clipped)
        {
            _clippedWindows++;
        }

        if (window.CurrentDelayAngleDeg is { } angle)
        {
            _angleSum += angle;
            _angleCount++;
        }

        _metrics.Add(window);
        _trend.Add(window);
        if (window.RmsA > _worstRms)
        {
            _worstRms = window.RmsA;
            _worstStart = slot.Start;
            _worstLength = slot.Length;
            _worstWindow = window;
            slot.Window.CopyTo(_worst);
        }
    }

    /// <summary>Mean frequency over the windows, hertz; <paramref name="fallbackHz"/> when there was none.</summary>
    public double MeanFrequencyHz(double fallbackHz) => _windows > 0 ? _frequencySum / _windows : fallbackHz;

    /// <summary>Lowest and highest window frequency, hertz; the mean when there was no window.</summary>
    public (double MinHz, double MaxHz) FrequencyRange(double meanHz) =>
        (_windows > 0 ? _frequencyMin : meanHz, _windows > 0 ? _frequencyMax : meanHz);

    /// <summary>The windows' figures: count, length and the statistics of each figure.</summary>
    /// <param name="nominalHz">Nominal mains frequency, hertz.</param>
    public WindowsResult Windows(double nominalHz) => new()
    {
        Count = _windows,
        CyclesPerWindow = _cycles,
        LengthS = _cycles / nominalHz,
        MaxSyncErrorPercent = _maxSyncError,
        Statistics = _metrics.Result(),
    };

    /// <summary>Harmonic groups 1 to the highest order, at multiples of <paramref name="meanHz"/>.</summary>
    public HarmonicValue[] Harmonics(double meanHz)
    {
        var harmonics = new HarmonicValue[_maxOrder];
        for (var n = 1; n <= _maxOrder; n++)
        {
            harmonics[n - 1] = new HarmonicValue(n, n * meanHz, _harmonic.Rms(n), _harmonic.Max(n));
        }

        return harmonics;
    }

    /// <summary>Interharmonic groups 0 to the highest order − 1, between multiples of <paramref name="meanHz"/>.</summary>
    public HarmonicValue[] Interharmonics(double meanHz)
    {
        var interharmonics = new HarmonicValue[_maxOrder];
        for (var n = 0; n < _maxOrder; n++)
        {
            interharmonics[n] = new HarmonicValue(n, (n + 0.5) * meanHz, _inter.Rms(n), _inter.Max(n));
        }

        return interharmonics;
    }

    /// <summary>The bands.</summary>
    public BandValue[] Bands()
    {
        var bands = new BandValue[_bands.Length];
        for (var b = 0; b < bands.Length; b++)
        {
            bands[b] = new BandValue(_bands[b].LowHz, _bands[b].HighHz, _band.Rms(b), _band.Max(b));
        }

        return bands;
    }

    /// <summary>The spectrum averaged over windows (RMS per bin): each bin over the windows that reached it (windows of
    /// different lengths reach different bins), up to the first bin no window reached.</summary>
    public SpectrumResult Spectrum(double meanHz)
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

    /// <summary>RMS, DC, AC RMS, peaks and crest factor of every sample.</summary>
    public SummaryResult Summary()
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

    /// <summary>The components the verdict weighs: smooth and pulsating DC, the ranges, THD and the strongest tones.</summary>
    /// <param name="spectrum">The averaged spectrum (<see cref="Spectrum"/>).</param>
    /// <param name="summary">The summary (<see cref="Summary"/>).</param>
    /// <param name="toneCount">Number of strongest non-harmonic tones to report.</param>
    public ComponentsResult Components(SpectrumResult spectrum, SummaryResult summary, int toneCount)
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
            ThdPercent = _windows > 0 && WindowMeasurement.HasFundamental(mainsRms, summary.AcRmsA) ? harmonicsRms / mainsRms * 100 : null,
            Tones = ToneFinder.Strongest(spectrum, _cycles, _maxOrder, toneCount, summary.AcRmsA),
            NonPulsatingHarmonicsTo1kMaxA = Math.Sqrt(_bipolarHarmonicsMaxPower),
            NonPulsating1kGroupMaxA = Math.Sqrt(_oneKGroupMaxPower),
            ClippedWindowShare = _windows > 0 ? _clippedWindows / (double)_windows : 0,
            PulsatingMeanMaxA = _pulsatingMeanMax,
        };
    }

    /// <summary>The samples of the window with the highest RMS, with its figures as measured (before any merging of
    /// the trend table).</summary>
    public WaveformExcerpt WorstWindow() =>
        new(_worstStart / _fs, _fs, _worst.AsSpan(0, _worstLength).ToArray(), "window with the highest RMS", _worstWindow);

    /// <summary>The trend table (windows merged pairwise when full).</summary>
    public IReadOnlyList<WindowResult> Trend() => _trend.Result();
}
