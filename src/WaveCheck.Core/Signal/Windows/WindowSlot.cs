namespace WaveCheck.Core.Signal;

/// <summary>
/// One analysis window on its way through <see cref="CaptureAnalysis"/>: its samples, where it starts and the
/// frequency tracked for it (set by the reading thread: <see cref="WindowCutter"/>, <see cref="MainsTracker"/>), then
/// its spectrum and figures (set by a worker: <see cref="WindowWorkers"/>, <see cref="WindowMeasurement"/>). Every
/// buffer is allocated once and reused for window after window.
/// </summary>
internal sealed class WindowSlot(int capacity, int maxOrder, int bandCount, int voltageChannels = 0)
{
    /// <summary>Sample buffer, filled from the start; <see cref="Length"/> values are the window.</summary>
    public double[] Samples { get; } = new double[capacity];

    /// <summary>The circuit voltages carried alongside the samples (one buffer per voltage channel, volts, the same
    /// <see cref="Length"/> values valid); empty when the capture has no voltage channel.</summary>
    public double[][] Volts { get; } = [.. Enumerable.Range(0, voltageChannels).Select(_ => new double[capacity])];

    /// <summary>The window's leakage split (<see cref="LeakageWindowMeasurement"/>), when it has voltages.</summary>
    public WindowLeakage Leakage { get; set; }

    /// <summary>Mean-square spectrum, <see cref="Length"/>/2 + 1 bins.</summary>
    public double[] Power { get; } = new double[(capacity / 2) + 1];

    /// <summary>Samples in the window.</summary>
    public int Length { get; set; }

    /// <summary>Index of the window's first sample in the capture.</summary>
    public long Start { get; set; }

    /// <summary>Mains frequency tracked for the window, hertz.</summary>
    public double FrequencyHz { get; set; }

    /// <summary>Sum, sum of squares, least and greatest sample of the window.</summary>
    public (double Sum, double Squares, double Min, double Max) Moments { get; set; }

    /// <summary>The window's mean, amperes.</summary>
    public double MeanA => Moments.Sum / Length;

    /// <summary>The window's AC RMS (mean removed), amperes.</summary>
    public double AcRmsA => Math.Sqrt(Math.Max(0, (Moments.Squares / Length) - (MeanA * MeanA)));

    /// <summary>What <see cref="WindowMeasurement"/> found in the window.</summary>
    public WindowFigures Figures { get; } = new(maxOrder, bandCount);

    /// <summary>The window's samples.</summary>
    public ReadOnlySpan<double> Window => Samples.AsSpan(0, Length);

    /// <summary>The window's spectrum.</summary>
    public ReadOnlySpan<double> Bins => Power.AsSpan(0, (Length / 2) + 1);
}
