namespace WaveCheck.Core.Model;

/// <summary>
/// One capture's line in the site summary (CSV, JSON, Parquet, HTML index): what was installed, what the waveform
/// demands, the verdict and the figures behind it. SI units; null where a figure does not exist (a capture that failed).
/// </summary>
public sealed record SurveyRow
{
    /// <summary>The capture (the job's path).</summary>
    public required string File { get; init; }

    /// <summary>Circuit name; null when not given. Captures with the same name are one circuit (<see cref="CircuitVerdict"/>).</summary>
    public string? Circuit { get; init; }

    /// <summary>What the circuit was doing during the capture (<c>start-up</c>, <c>charging, final phase</c>); null when not given.</summary>
    public string? State { get; init; }

    /// <summary>Installed device type (<c>AC</c>, <c>A</c>, <c>F</c>, <c>B</c>, <c>B+</c>), with its DC detection where one
    /// is declared (JSON <c>A+RDC-DD</c>); null when not given.</summary>
    public InstalledProtection? InstalledType { get; init; }

    /// <summary>Rated residual operating current IΔn the circuit was judged against, amperes.</summary>
    public required double RatedResidualCurrentA { get; init; }

    /// <summary>Least capable type that covers the waveform; null when it cannot be determined or on error.</summary>
    public DeviceType? RequiredType { get; init; }

    /// <summary>The protection the standards accept, in words (the required type and its alternatives, e.g. type A
    /// with a 6 mA DC detection device at a charging point); null when open or on error.</summary>
    public string? AcceptedProtection { get; init; }

    /// <summary>Lowest type that may be required once what the capture could not show is measured; null on error.</summary>
    public DeviceType? MinimumType { get; init; }

    /// <summary>Ok, upgrade, cannot tell or error (JSON <c>ok</c>, <c>upgrade</c>, <c>cannot-tell</c>, <c>error</c>);
    /// see <see cref="VerdictOf"/>.</summary>
    public required SurveyVerdict Verdict { get; init; }

    /// <summary>Whole-capture true RMS, amperes.</summary>
    public double? RmsA { get; init; }

    /// <summary>Largest window RMS (the standing residual current at its worst), amperes; the whole-capture RMS when
    /// the analysis has no window statistics.</summary>
    public double? WorstWindowRmsA { get; init; }

    /// <summary>Smooth DC of the worst window (largest magnitude), amperes; signed.</summary>
    public double? SmoothDcA { get; init; }

    /// <summary>True when the sensor and analysis could determine the smooth DC (the assessment's blinding check is
    /// decided); false when <see cref="SmoothDcA"/> may understate it (an AC-coupled or unstated sensor).</summary>
    public bool? SmoothDcKnown { get; init; }

    /// <summary>RMS of content above 1 kHz over the capture, amperes.</summary>
    public double? Above1kHzRmsA { get; init; }

    /// <summary>Nuisance-tripping risk for the installed (or required) type: <c>low</c>, <c>possible</c>, <c>likely</c>.</summary>
    public RiskLevel? NuisanceRisk { get; init; }

    /// <summary>0.5 IΔn minus the weighted standing current, amperes (negative: above the non-operating limit).</summary>
    public double? NuisanceMarginA { get; init; }

    /// <summary>Smooth DC beyond the assessed type's tolerance: true, false, or null when not determinable.</summary>
    public bool? Blinded { get; init; }

    /// <summary>The assessment's one-line deciding reason.</summary>
    public string? Headline { get; init; }

    /// <summary>Why the capture could not be analysed; null when it was.</summary>
    public string? Error { get; init; }

    /// <summary>The capture's report, relative to the survey's output folder; null when none was written.</summary>
    public string? ReportPath { get; init; }

    /// <summary>Duration of the capture, seconds.</summary>
    public double? DurationS { get; init; }

    /// <summary>Sample rate, hertz.</summary>
    public double? SampleRateHz { get; init; }

    /// <summary>Trip replay over the capture, general type of the installed rating: <c>will not trip</c>, <c>may
    /// trip</c>, <c>will trip</c>; null when not replayed.</summary>
    public string? TripGeneral { get; init; }

    /// <summary>Trip replay over the capture, type S of the installed rating; null when not replayed.</summary>
    public string? TripS { get; init; }

    /// <summary>A compliant device would have tripped on a surge of the capture (test the device if it did not); null
    /// when not replayed.</summary>
    public bool? TripAlert { get; init; }

    /// <summary>The verdict rule.</summary>
    /// <remarks>
    /// <c>ok</c> when an installed type is given and the assessment finds it adequate; <c>upgrade</c> when one is given
    /// and found not adequate; <c>cannot-tell</c> in every other case: no installed type given (there is nothing to
    /// judge), or the assessment could not decide (its <see cref="AssessmentResult.InstalledAdequate"/> is null, e.g. an
    /// AC-coupled sensor cannot rule out smooth DC). Engineering choice: a survey never reads "ok" for a circuit
    /// whose device is unknown, even when the waveform would be covered by any type.
    /// </remarks>
    /// <param name="installedType">Installed type as given; null when not given.</param>
    /// <param name="installedAdequate">The assessment's finding.</param>
    public static SurveyVerdict VerdictOf(InstalledProtection? installedType, bool? installedAdequate) =>
        installedType is null ? SurveyVerdict.CannotTell : installedAdequate switch
        {
            true => SurveyVerdict.Ok,
            false => SurveyVerdict.Upgrade,
            null => SurveyVerdict.CannotTell,
        };

}
