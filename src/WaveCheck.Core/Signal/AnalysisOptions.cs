using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>Settings of an analysis. Every value in SI units.</summary>
public sealed record AnalysisOptions
{
    /// <summary>Nominal mains frequency, hertz; null to detect 50 or 60 Hz. The frequency is still tracked within ±5 %.</summary>
    public double? MainsHz { get; init; }

    /// <summary>Keep <see cref="MainsHz"/> even where the capture's own mains-band content says otherwise (CLI
    /// <c>--mains-as-given</c>). Off by default: a declared 50 Hz on a 60 Hz capture turns the mains current into a
    /// "non-harmonic tone" and misjudges the device type, so the analysis stops with an error instead.</summary>
    public bool KeepGivenMains { get; init; }

    /// <summary>Width of the band above its floor within which a window counts as at rest, amperes (CLI
    /// <c>--rest-band</c>): pulsating DC rests there for 150° each cycle (<see cref="WaveformShape"/>). Default 2 mA
    /// (engineering choice; IEC 61008-1's definition allows 6 mA, this is stricter).</summary>
    public double RestBandA { get; init; } = WaveformShape.DefaultRestBandA;

    /// <summary>Window RMS above which an alarm event is recorded, amperes; null for none.</summary>
    public double? AlarmA { get; init; }

    /// <summary>A window whose largest absolute sample exceeds this multiple of its RMS holds a transient.</summary>
    /// <remarks>Engineering choice: 6. A sine has a crest factor of 1.41, a half-wave 2, a 135° phase-controlled
    /// half-wave 4.7, and Gaussian noise exceeds 6 σ in a 10 000-sample window with a probability of about 2·10⁻⁵,
    /// so neither steady loads nor noise mark every window.</remarks>
    public double TransientFactor { get; init; } = 6.0;

    /// <summary>Least peak of a transient, amperes (engineering choice: 1 mA, a tenth of the smallest common IΔn).</summary>
    public double TransientFloorA { get; init; } = 1e-3;

    /// <summary>Levels of half-cycle RMS, amperes, for the trip replay: episodes at or above the lowest are recorded
    /// with how long they stayed at or above each (<see cref="Model.HalfCycleEpisodesResult"/>); empty for none.
    /// Set by <see cref="Evaluation.Run(Capture.ICaptureSource, AnalysisOptions, Assessment.AssessmentOptions, IProgress{double}?, CancellationToken)"/>
    /// from the device assessed.</summary>
    public IReadOnlyList<double> HalfCycleLevelsA { get; init; } = [];

    /// <summary>Highest harmonic order grouped (IEC 61000-4-7: 40 or 50).</summary>
    public int MaxHarmonicOrder { get; init; } = 50;

    /// <summary>Number of strongest non-harmonic tones reported.</summary>
    public int ToneCount { get; init; } = 5;

    /// <summary>Upper end of the 2 kHz bands above 9 kHz, hertz (IEC 61000-4-30 Annex C: 150 kHz).</summary>
    public double HighBandUpperHz { get; init; } = 150_000;

    /// <summary>Consumers that receive every sample on the same pass (e.g. the touch-current meter).</summary>
    public IReadOnlyList<ISampleSink> Sinks { get; init; } = [];

    /// <summary>Called with each window's figures as it completes, in time order (e.g. to stream a CSV).</summary>
    public Action<WindowResult>? WindowCompleted { get; init; }

    /// <summary>
    /// Threads sharing the work on windows (spectra, shapes, the sinks): the calling thread, which joins in while it
    /// waits for a batch, and <c>WorkerCount − 1</c> threads that work while it reads on; 1 does everything on the
    /// calling thread. The figures are the same for every value. Default: the processor count.
    /// </summary>
    public int WorkerCount { get; init; } = Environment.ProcessorCount;

    /// <summary>Checks the values.</summary>
    /// <exception cref="OptionValueException">A value is out of range.</exception>
    public void Validate()
    {
        if (MainsHz is { } mains && !(mains >= 1 && mains <= 1000))
        {
            throw new OptionValueException(Setting.Ref(nameof(MainsHz)), mains.ToString(System.Globalization.CultureInfo.InvariantCulture),
                "auto, 50, 60 or a frequency between 1 and 1000 Hz");
        }

        if (!(RestBandA > 0 && RestBandA <= 1))
        {
            throw new OptionValueException(Setting.Ref(nameof(RestBandA)), RestBandA.ToString(System.Globalization.CultureInfo.InvariantCulture) + " A",
                "a current above 0 and up to 1 A, such as 2mA");
        }

        if (AlarmA is { } alarm && !(alarm > 0))
        {
            throw new OptionValueException(Setting.Ref(nameof(AlarmA)), alarm.ToString(System.Globalization.CultureInfo.InvariantCulture),
                "a positive current such as 30mA");
        }

        if (!(TransientFactor > 1))
        {
            throw new ArgumentOutOfRangeException(nameof(TransientFactor), TransientFactor, "must be greater than 1");
        }

        if (HalfCycleLevelsA.Any(l => !(l >= 0 && double.IsFinite(l))))
        {
            throw new ArgumentOutOfRangeException(nameof(HalfCycleLevelsA), "levels must be finite and at least 0 A");
        }

        if (WorkerCount < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(WorkerCount), WorkerCount, "must be at least 1");
        }

        if (MaxHarmonicOrder < 1 || ToneCount < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(MaxHarmonicOrder), MaxHarmonicOrder,
                "harmonic order must be at least 1 and the tone count not negative");
        }
    }
}
