using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The measurement of one window: from its samples, spectrum, moments, start and tracked frequency to its figures
/// (<see cref="WindowResult"/>) and the group, band and range contents the capture's figures are built from
/// (<see cref="WindowFigures"/>). The figures depend on the window alone, never on the windows before it or on the
/// thread, so <see cref="WindowWorkers"/> runs it on any participant. Holds the waveform-shape scratch: not
/// thread-safe; one instance per thread.
/// </summary>
/// <remarks>
/// Smooth DC: of a pulsating-DC window the median of its rest (<see cref="WaveformShape"/>); of any other window the
/// DC of a fit that leaves a sub-mains motor frequency out (<see cref="SubMainsDc"/>). Harmonic and interharmonic
/// groups by IEC 61000-4-7 (<see cref="HarmonicGroups"/>) up to the highest order whose group lies within the
/// spectrum; bands and the ranges above 1 and 9 kHz by <see cref="FrequencyBands"/>.
/// </remarks>
internal sealed class WindowMeasurement
{
    /// <summary>A sample at or beyond this share of the full scale counts as clipped (engineering choice).</summary>
    public const double ClipShare = 0.999;

    private readonly double _fs;
    private readonly int _cycles;
    private readonly int _maxOrder;
    private readonly (double LowHz, double HighHz)[] _bands;
    private readonly double? _fullScaleA;
    private readonly WaveformShape _shape;
    private readonly LeakageWindowMeasurement? _leakage;

    /// <summary>Sets up the measurement of the windows of one capture.</summary>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="cycles">Mains cycles per window.</param>
    /// <param name="maxOrder">Highest harmonic order grouped.</param>
    /// <param name="bands">The bands (<see cref="FrequencyBands.For"/>), ascending.</param>
    /// <param name="restBandA">Width of the rest band of <see cref="WaveformShape"/>, amperes.</param>
    /// <param name="fullScaleA">The capture's full scale, amperes; null when unknown (no window counts as clipped).</param>
    /// <param name="leakage">The split against the voltage carried in the slots; null when the capture has none.</param>
    public WindowMeasurement(double sampleRateHz, int cycles, int maxOrder, (double LowHz, double HighHz)[] bands,
        double restBandA, double? fullScaleA, LeakageWindowMeasurement? leakage = null)
    {
        _leakage = leakage;
        _fs = sampleRateHz;
        _cycles = cycles;
        _maxOrder = maxOrder;
        _bands = bands;
        _fullScaleA = fullScaleA;
        _shape = new WaveformShape(restBandA);
    }

    /// <summary>Whether a window has a fundamental to refer THD to: above 1 nA and at least 0.1 % of its AC RMS.</summary>
    public static bool HasFundamental(double mainsRms, double acRms) => mainsRms > 1e-9 && mainsRms >= 1e-3 * acRms;

    /// <summary>Measures the window in <paramref name="slot"/> (its samples, spectrum, moments, start and frequency
    /// set) into its <see cref="WindowSlot.Figures"/>.</summary>
    /// <returns>The window's figures, as also kept in <see cref="WindowFigures.Result"/>.</returns>
    public WindowResult Measure(WindowSlot slot)
    {
        var w = slot.Window;
        var power = slot.Bins;
        var frequency = slot.FrequencyHz;
        var figures = slot.Figures;
        var n = w.Length;
        var startS = slot.Start / _fs;
        var (sum, squares, min, max) = slot.Moments;
        var mean = sum / n;
        var meanSquare = squares / n;
        var rms = Math.Sqrt(meanSquare);
        var ac = Math.Sqrt(Math.Max(0, meanSquare - (mean * mean)));
        var peak = Math.Max(Math.Abs(min), Math.Abs(max));
        var exact = _cycles * _fs / frequency;
        figures.PeakA = peak;
        figures.SyncErrorPercent = Math.Abs(n - exact) / exact * 100;

        var shape = _shape.Measure(w, _cycles, mean, min, max);
        if (!shape.PulsatingDc)
        {
            // The DC a bipolar window rides on, unbiased by a sub-mains motor frequency (see SubMainsDc).
            shape = shape with { SmoothDcA = SubMainsDc.Estimate(w, power, _cycles, mean, ac) };
        }

        var (g1, harmonicsPower) = Groups(power, figures);
        figures.HarmonicsTo1kHzA2 = null;
        figures.OneKHzGroupA2 = null;
        if (!shape.PulsatingDc)
        {
            HarmonicsTo1kHz(frequency, figures);
        }

        var resolution = _fs / n;
        var belowPower = HarmonicGroups.BelowFundamental(power, _cycles);
        var above1k = HarmonicGroups.Sum(power, FrequencyBands.FirstBinAbove(FrequencyBands.OneKHz, resolution, _cycles), power.Length - 1);
        var above9k = HarmonicGroups.Sum(power, FrequencyBands.FirstBinAbove(FrequencyBands.NineKHz, resolution, _cycles), power.Length - 1);
        figures.BandCount = 0;
        for (var b = 0; b < _bands.Length; b++)
        {
            var (from, to) = FrequencyBands.Bins(_bands[b].LowHz, _bands[b].HighHz, resolution);
            if (from >= power.Length)
            {
                // The bands ascend, so every later one starts beyond the spectrum as well.
                break;
            }

            figures.BandA2[b] = HarmonicGroups.Sum(power, from, to);
            figures.BandCount = b + 1;
        }

        figures.MainsA2 = g1;
        figures.BelowMainsA2 = belowPower;
        figures.HarmonicsA2 = harmonicsPower;
        figures.Above1kHzA2 = above1k;
        figures.Above9kHzA2 = above9k;
        var mainsRms = Math.Sqrt(g1);
        figures.Result = new WindowResult
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
            Clipped = _fullScaleA is { } fullScale && peak >= ClipShare * fullScale,
        };
        if (_leakage is not null)
        {
            slot.Leakage = _leakage.Measure(slot);
        }

        return figures.Result;
    }

    /// <summary>Harmonic groups 1.._maxOrder and interharmonic groups 0.._maxOrder − 1, each as far as it lies within
    /// the spectrum; returns group 1 and the sum of groups 2 and up.</summary>
    private (double Mains, double Harmonics) Groups(ReadOnlySpan<double> power, WindowFigures figures)
    {
        var harmonicsPower = 0.0;
        var g1 = 0.0;
        figures.HarmonicOrders = 0;
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

            figures.HarmonicGroupA2[order] = g;
            figures.HarmonicOrders = order;
        }

        figures.InterharmonicOrders = 0;
        for (var order = 0; order < _maxOrder; order++)
        {
            if ((_cycles * (order + 1)) - 1 >= power.Length)
            {
                break;
            }

            figures.InterharmonicGroupA2[order] = HarmonicGroups.InterharmonicGroup(power, _cycles, order);
            figures.InterharmonicOrders = order + 1;
        }

        return (g1, harmonicsPower);
    }

    /// <summary>
    /// Harmonic groups from order 2 up to 1 kHz (type B's range) of a window that is not pulsating DC: the evidence of
    /// AC at frequencies other than mains. The group holding 1 kHz is kept apart: type F's composite test current has
    /// a 1 kHz part (IEC 62423).
    /// </summary>
    private void HarmonicsTo1kHz(double frequencyHz, WindowFigures figures)
    {
        var below1k = 0.0;
        var oneKOrder = (int)Math.Round(FrequencyBands.OneKHz / frequencyHz);
        for (var order = 2; order <= Math.Min(oneKOrder, figures.HarmonicOrders); order++)
        {
            var g = figures.HarmonicGroupA2[order];
            if (order < oneKOrder)
            {
                below1k += g;
            }
            else
            {
                figures.OneKHzGroupA2 = g;
            }
        }

        figures.HarmonicsTo1kHzA2 = below1k;
    }
}
