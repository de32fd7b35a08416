namespace WaveCheck.Rendering.Plots;

/// <summary>The plots drawn from one analysis.</summary>
public enum PlotKind
{
    /// <summary>Min/max envelope of the whole capture with DC level, device thresholds and events.</summary>
    Overview,

    /// <summary>A few mains cycles of the worst window overlaid.</summary>
    Cycles,

    /// <summary>RMS per frequency on a log axis with harmonic orders, tones and device-type ranges.</summary>
    Spectrum,

    /// <summary>Per-window figures over time; only for captures longer than a few seconds.</summary>
    Trend,
}
