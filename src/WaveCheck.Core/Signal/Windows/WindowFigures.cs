using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Everything <see cref="WindowMeasurement"/> finds in one window: the figures a user sees (<see cref="Result"/>) and
/// the mean squares (A²) the capture's figures are built from. Its arrays are sized once for the analysis and reused
/// (one instance per <see cref="WindowSlot"/>); only the first <see cref="HarmonicOrders"/>,
/// <see cref="InterharmonicOrders"/> and <see cref="BandCount"/> entries belong to the current window.
/// </summary>
internal sealed class WindowFigures(int maxOrder, int bandCount)
{
    /// <summary>The window's figures.</summary>
    public WindowResult Result { get; set; } = null!;

    /// <summary>Largest absolute sample, amperes.</summary>
    public double PeakA { get; set; }

    /// <summary>How far the window's length is from a whole number of cycles of the tracked frequency, per cent.</summary>
    public double SyncErrorPercent { get; set; }

    /// <summary>Harmonic group G_g,n² by order n (entry 0 unused), A².</summary>
    public double[] HarmonicGroupA2 { get; } = new double[maxOrder + 1];

    /// <summary>Orders 1..this whose group lies within the spectrum.</summary>
    public int HarmonicOrders { get; set; }

    /// <summary>Interharmonic group between n and n + 1 by n, A².</summary>
    public double[] InterharmonicGroupA2 { get; } = new double[maxOrder];

    /// <summary>Interharmonic groups 0..this − 1 within the spectrum.</summary>
    public int InterharmonicOrders { get; set; }

    /// <summary>Content of each band of <see cref="FrequencyBands"/>, A².</summary>
    public double[] BandA2 { get; } = new double[bandCount];

    /// <summary>Bands 0..this − 1 that start within the spectrum (the rest lie above it).</summary>
    public int BandCount { get; set; }

    /// <summary>Harmonic group 1, A².</summary>
    public double MainsA2 { get; set; }

    /// <summary>Content below the fundamental's group, A².</summary>
    public double BelowMainsA2 { get; set; }

    /// <summary>Harmonic groups 2 up to the highest order, A².</summary>
    public double HarmonicsA2 { get; set; }

    /// <summary>Bins above the group centred on 1 kHz, A².</summary>
    public double Above1kHzA2 { get; set; }

    /// <summary>Bins above the group centred on 9 kHz, A².</summary>
    public double Above9kHzA2 { get; set; }

    /// <summary>Harmonic groups from order 2 up to the one below 1 kHz, of a window that is not pulsating DC (null for
    /// one that is: a half-wave's own harmonics are its shape, not AC at other frequencies), A².</summary>
    public double? HarmonicsTo1kHzA2 { get; set; }

    /// <summary>The harmonic group holding 1 kHz, of a window that is not pulsating DC; null when the window is, or
    /// the group lies beyond the spectrum or the highest order, A².</summary>
    public double? OneKHzGroupA2 { get; set; }
}
