using System.Text.Json.Serialization;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Model;

/// <summary>
/// Everything the analysis measured over one capture. Serialised as the analysis JSON
/// (schema <c>wavecheck.analysis/1</c>, camelCase, SI units). Renderers read only this and <see cref="AssessmentResult"/>.
/// </summary>
public sealed record AnalysisResult
{
    /// <summary>Schema identifier of the JSON form.</summary>
    public string Schema { get; init; } = "wavecheck.analysis/1";

    /// <summary>Tool version that produced it.</summary>
    public required string ToolVersion { get; init; }

    /// <summary>The capture as read (final figures after the full pass).</summary>
    public required CaptureInfo Capture { get; init; }

    /// <summary>Mains frequency found or given.</summary>
    public required MainsResult Mains { get; init; }

    /// <summary>Whole-capture time-domain figures.</summary>
    public required SummaryResult Summary { get; init; }

    /// <summary>Whole-capture decomposition into the parts that decide the device type.</summary>
    public required ComponentsResult Components { get; init; }

    /// <summary>Harmonic groups of orders 1..50 (IEC 61000-4-7), RMS over the capture.</summary>
    public required IReadOnlyList<HarmonicValue> Harmonics { get; init; }

    /// <summary>Interharmonic groups 0..49 (between order n and n+1), RMS over the capture.</summary>
    public IReadOnlyList<HarmonicValue> Interharmonics { get; init; } = [];

    /// <summary>Frequency bands: 2-9 kHz in 200 Hz bands, 9 kHz up to Nyquist (or 150 kHz) in 2 kHz bands.</summary>
    public required IReadOnlyList<BandValue> Bands { get; init; }

    /// <summary>Windowing facts and per-metric statistics over windows.</summary>
    public required WindowsResult Windows { get; init; }

    /// <summary>Alarms and transients, in time order.</summary>
    public required IReadOnlyList<EventRecord> Events { get; init; }

    /// <summary>What the capture could not show, and anything recovered from.</summary>
    public required IReadOnlyList<CaptureWarning> Warnings { get; init; }

    /// <summary>Average spectrum over the capture, for plots.</summary>
    public required SpectrumResult Spectrum { get; init; }

    /// <summary>Min/max envelope of the whole capture, for the overview plot.</summary>
    public required EnvelopeResult Envelope { get; init; }

    /// <summary>The window with the highest RMS: its raw samples, for the cycles plot, and its figures as measured
    /// (<see cref="WaveformExcerpt.Figures"/>; JSON <c>worstWindow.figures</c>).</summary>
    public required WaveformExcerpt WorstWindow { get; init; }

    /// <summary>Per-window rows for trend plots; decimated (worst value kept) when the capture has more windows than fit.</summary>
    public required IReadOnlyList<WindowResult> Trend { get; init; }

    /// <summary>IEC 60990 weighted touch-current figures; null when not computed.</summary>
    public TouchCurrentResult? TouchCurrent { get; init; }

    /// <summary>The residual current split into resistive and capacitive leakage against the circuit voltage; null
    /// (and absent from the JSON) when the capture has no voltage channel.</summary>
    [JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)]
    public LeakageSplitResult? LeakageSplit { get; init; }

    /// <summary>Half-cycle RMS episodes for the trip replay (JSON <c>halfCycleEpisodes</c>); null when no levels were
    /// asked for (<see cref="Signal.AnalysisOptions.HalfCycleLevelsA"/>).</summary>
    public HalfCycleEpisodesResult? HalfCycleEpisodes { get; init; }

    /// <summary>The verdict on this capture (JSON <c>assessment</c>); null when only measured.</summary>
    public AssessmentResult? Assessment { get; init; }

    /// <summary>Report number, who and where, instruments and the capture's content digest (JSON <c>identity</c>);
    /// null when the run made no report identity.</summary>
    public ReportIdentity? Identity { get; init; }
}

/// <summary>Mains frequency.</summary>
/// <param name="FrequencyHz">Mean frequency over the capture, hertz.</param>
/// <param name="NominalHz">Nominal system frequency used to size windows (50, 60 or as given), hertz.</param>
/// <param name="Source"><c>detected</c>, <c>given</c> or <c>fallback</c> (too little mains content: nominal used).</param>
/// <param name="MinHz">Lowest tracked frequency, hertz.</param>
/// <param name="MaxHz">Highest tracked frequency, hertz.</param>
/// <param name="Method">How it was found, for a person.</param>
public sealed record MainsResult(double FrequencyHz, double NominalHz, string Source, double MinHz, double MaxHz, string Method);

/// <summary>Whole-capture time-domain figures, amperes.</summary>
public sealed record SummaryResult(double RmsA, double DcA, double AcRmsA, double PeakA, double PeakPositiveA,
    double PeakNegativeA, double CrestFactor);

/// <summary>A tone that is not a mains harmonic (a drive's motor or switching frequency).</summary>
public sealed record ToneValue(double FrequencyHz, double RmsA);

/// <summary>The parts of the residual current that decide the device type; worst-window values where named so.</summary>
public sealed record ComponentsResult
{
    /// <summary>Smooth DC (the floor on which pulsating or AC current rides), capture mean of window values, amperes; signed.</summary>
    public required double SmoothDcA { get; init; }

    /// <summary>Smooth DC of the worst window (largest magnitude), amperes; signed.</summary>
    public required double SmoothDcMaxA { get; init; }

    /// <summary>True when most windows are pulsating DC (unipolar, returning to near the floor each cycle).</summary>
    public required bool PulsatingDc { get; init; }

    /// <summary>Share of windows judged pulsating DC, 0..1.</summary>
    public double PulsatingDcShare { get; init; }

    /// <summary>Current-delay (firing) angle of a phase-controlled half-wave, degrees; null when not one.</summary>
    public double? CurrentDelayAngleDeg { get; init; }

    /// <summary>Fundamental (harmonic group 1) RMS, amperes.</summary>
    public required double MainsRmsA { get; init; }

    /// <summary>RMS of AC content below the mains frequency (above ~1 Hz), amperes.</summary>
    public required double BelowMainsRmsA { get; init; }

    /// <summary>RMS of harmonic groups 2..50, amperes.</summary>
    public required double HarmonicsRmsA { get; init; }

    /// <summary>RMS of all content above 1 kHz, amperes.</summary>
    public required double Above1kHzRmsA { get; init; }

    /// <summary>RMS of all content above 9 kHz, amperes.</summary>
    public required double Above9kHzRmsA { get; init; }

    /// <summary>Total harmonic distortion of the harmonic groups (orders 2..50 over 1), per cent; null with no fundamental.</summary>
    public double? ThdPercent { get; init; }

    /// <summary>Strongest non-harmonic tones, strongest first.</summary>
    public required IReadOnlyList<ToneValue> Tones { get; init; }

    /// <summary>Largest over the windows not judged pulsating DC of the harmonic groups from order 2 up to the one
    /// holding 1 kHz, that one excluded (root-sum-square), amperes: AC at frequencies other than mains, which only
    /// type B is specified for.</summary>
    public double NonPulsatingHarmonicsTo1kMaxA { get; init; }

    /// <summary>Largest over the windows not judged pulsating DC of the harmonic group holding 1 kHz (order 20 at
    /// 50 Hz, 17 at 60 Hz), amperes: the switching part of type F's composite test current (IEC 62423).</summary>
    public double NonPulsating1kGroupMaxA { get; init; }

    /// <summary>Largest over the windows judged pulsating DC of the mean above the floor (the pulses' own DC),
    /// amperes, magnitude.</summary>
    public double PulsatingMeanMaxA { get; init; }

    /// <summary>Share of windows with a sample at full scale, 0..1 (0 when the full scale is unknown).</summary>
    public double ClippedWindowShare { get; init; }
}

/// <summary>A harmonic (or interharmonic) group value.</summary>
/// <param name="Order">Harmonic order n (interharmonics: the order below).</param>
/// <param name="FrequencyHz">Centre frequency at the mean mains frequency, hertz.</param>
/// <param name="RmsA">RMS over the capture of the group value (square root of the mean of squares over windows), amperes.</param>
/// <param name="MaxA">Largest window value, amperes.</param>
public sealed record HarmonicValue(int Order, double FrequencyHz, double RmsA, double MaxA);

/// <summary>A frequency band's content.</summary>
/// <param name="LowHz">Lower edge, hertz.</param>
/// <param name="HighHz">Upper edge, hertz.</param>
/// <param name="RmsA">RMS over the capture, amperes.</param>
/// <param name="MaxA">Largest window value, amperes.</param>
public sealed record BandValue(double LowHz, double HighHz, double RmsA, double MaxA);

/// <summary>Mean, 95th percentile and maximum of one metric over windows.</summary>
/// <param name="Mean">Mean over windows.</param>
/// <param name="P95">95th percentile over windows.</param>
/// <param name="Max">Maximum over windows (for signed quantities: the largest magnitude, sign kept).</param>
/// <param name="TimeOfMaxS">Start of the window holding the maximum, seconds.</param>
public sealed record MetricStatistics(double Mean, double P95, double Max, double TimeOfMaxS);

/// <summary>Windowing facts and statistics over windows.</summary>
public sealed record WindowsResult
{
    /// <summary>Number of complete windows analysed.</summary>
    public required int Count { get; init; }

    /// <summary>Mains cycles per window (10 at 50 Hz, 12 at 60 Hz).</summary>
    public required int CyclesPerWindow { get; init; }

    /// <summary>Nominal window length, seconds.</summary>
    public required double LengthS { get; init; }

    /// <summary>Largest deviation of a window's length from an exact number of tracked cycles, per cent.</summary>
    public required double MaxSyncErrorPercent { get; init; }

    /// <summary>Statistics per metric, keyed by the <see cref="WindowResult"/> property name in camelCase (<c>rmsA</c>, <c>smoothDcA</c>, ...).</summary>
    public required IReadOnlyDictionary<string, MetricStatistics> Statistics { get; init; }
}

/// <summary>One synchronised window's figures (amperes, hertz, seconds).</summary>
public sealed record WindowResult
{
    /// <summary>Start, seconds from the start of the capture.</summary>
    public required double StartS { get; init; }

    /// <summary>Length, seconds.</summary>
    public required double DurationS { get; init; }

    /// <summary>Mains frequency tracked in this window, hertz.</summary>
    public required double FrequencyHz { get; init; }

    /// <summary>True RMS.</summary>
    public required double RmsA { get; init; }

    /// <summary>Mean.</summary>
    public required double DcA { get; init; }

    /// <summary>RMS with the mean removed.</summary>
    public required double AcRmsA { get; init; }

    /// <summary>Largest positive sample.</summary>
    public required double PeakPositiveA { get; init; }

    /// <summary>Most negative sample.</summary>
    public required double PeakNegativeA { get; init; }

    /// <summary>Largest absolute sample over RMS; 0 for a zero window.</summary>
    public required double CrestFactor { get; init; }

    /// <summary>Smooth DC floor; signed.</summary>
    public required double SmoothDcA { get; init; }

    /// <summary>Unipolar and returning to the floor each cycle.</summary>
    public required bool PulsatingDc { get; init; }

    /// <summary>Current-delay angle of a phase-controlled half-wave, degrees; null when not one.</summary>
    public double? CurrentDelayAngleDeg { get; init; }

    /// <summary>Harmonic group 1.</summary>
    public required double MainsRmsA { get; init; }

    /// <summary>AC content below mains frequency.</summary>
    public required double BelowMainsRmsA { get; init; }

    /// <summary>Harmonic groups 2..50 combined.</summary>
    public required double HarmonicsRmsA { get; init; }

    /// <summary>Content above 1 kHz.</summary>
    public required double Above1kHzRmsA { get; init; }

    /// <summary>Content above 9 kHz.</summary>
    public required double Above9kHzRmsA { get; init; }

    /// <summary>THD, per cent; null without a fundamental.</summary>
    public double? ThdPercent { get; init; }

    /// <summary>Window contains clipped samples.</summary>
    public bool Clipped { get; init; }
}

/// <summary>Something that happened at a time: an alarm threshold crossed, a transient.</summary>
/// <param name="Kind"><c>alarm</c> (window RMS above <c>--alarm</c>) or <c>transient</c> (peak far above the window RMS).</param>
/// <param name="StartS">Start, seconds.</param>
/// <param name="DurationS">Duration, seconds (a window's length for alarms, merged for consecutive windows).</param>
/// <param name="ValueA">The deciding value (RMS for alarms, peak for transients), amperes.</param>
/// <param name="Message">For a person, with the figures.</param>
public sealed record EventRecord(string Kind, double StartS, double DurationS, double ValueA, string Message);

/// <summary>Average amplitude spectrum: RMS per bin, square root of the mean over windows of the squared bin RMS.</summary>
/// <param name="ResolutionHz">Bin spacing, hertz (5 Hz at 50 Hz mains).</param>
/// <param name="FrequenciesHz">Bin centre frequencies, hertz, ascending from 0.</param>
/// <param name="RmsA">RMS per bin, amperes (bin 0: the DC magnitude).</param>
public sealed record SpectrumResult(double ResolutionHz, IReadOnlyList<double> FrequenciesHz, IReadOnlyList<double> RmsA);

/// <summary>Min/max envelope of the capture in equal buckets, so a long capture can be drawn without hiding a peak.</summary>
/// <param name="BucketDurationS">Length of one bucket, seconds.</param>
/// <param name="MinA">Smallest sample per bucket, amperes.</param>
/// <param name="MaxA">Largest sample per bucket, amperes.</param>
public sealed record EnvelopeResult(double BucketDurationS, IReadOnlyList<double> MinA, IReadOnlyList<double> MaxA);

/// <summary>A stretch of raw samples.</summary>
/// <param name="StartS">Time of the first sample, seconds.</param>
/// <param name="SampleRateHz">Sample rate, hertz.</param>
/// <param name="SamplesA">Samples, amperes.</param>
/// <param name="Reason">Why this stretch was kept (e.g. <c>window with the highest RMS</c>).</param>
/// <param name="Figures">When the stretch is one analysis window: that window's figures as measured (RMS, DC, peaks,
/// harmonic groups), never a merged row of the decimated <see cref="AnalysisResult.Trend"/>; null otherwise.</param>
public sealed record WaveformExcerpt(double StartS, double SampleRateHz, IReadOnlyList<double> SamplesA, string Reason,
    WindowResult? Figures = null);

/// <summary>IEC 60990 touch-current readings: the network's output voltage divided by 500 Ω.</summary>
/// <param name="UnweightedRmsA">Unweighted network (Fig. 3), RMS, amperes.</param>
/// <param name="UnweightedPeakA">Unweighted network, largest absolute value, amperes.</param>
/// <param name="PerceptionPeakA">Perception/reaction-weighted network (Fig. 4), peak, amperes.</param>
/// <param name="PerceptionRmsA">Perception/reaction-weighted, RMS, amperes.</param>
/// <param name="LetGoPeakA">Let-go-weighted network (Fig. 5), peak, amperes.</param>
/// <param name="LetGoRmsA">Let-go-weighted, RMS, amperes.</param>
/// <param name="DcA">Mean of the unweighted reading (DC touch current), amperes.</param>
public sealed record TouchCurrentResult(double UnweightedRmsA, double UnweightedPeakA, double PerceptionPeakA,
    double PerceptionRmsA, double LetGoPeakA, double LetGoRmsA, double DcA);
