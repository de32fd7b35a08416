namespace WaveCheck.Core.Model;

/// <summary>
/// One circuit's verdict over all its captures (start-up, charging phases, operating states): the strongest
/// requirement any of them shows, judged against the circuit's one installed device, with each capture listed.
/// SI units; built by <c>CircuitVerdicts.From</c> (docs/methods.md Part III, "one verdict per circuit").
/// </summary>
public sealed record CircuitVerdict
{
    /// <summary>The circuit's name; the capture's file name when the site file names no circuit.</summary>
    public required string Circuit { get; init; }

    /// <summary>Installed protection as the captures state it (<c>A</c>, <c>A+RDC-DD</c>); null when not given.</summary>
    public InstalledProtection? InstalledType { get; init; }

    /// <summary>IΔn of the circuit's device, amperes (the smallest stated by its captures).</summary>
    public required double RatedResidualCurrentA { get; init; }

    /// <summary>Least type that covers every capture: the strongest of the captures' required types; null when a
    /// capture could not decide its own (open, or failed) and no capture already needs the strongest type.</summary>
    public DeviceType? RequiredType { get; init; }

    /// <summary>Lowest type the circuit may need once what its captures could not show is measured: the strongest of
    /// the captures' required and minimum types; null when no capture could be analysed.</summary>
    public DeviceType? MinimumType { get; init; }

    /// <summary>The protection the standards accept in words, from the capture that decides
    /// <see cref="RequiredType"/>; the required type alone where captures that need the same type accept different
    /// alternatives (the narrower reading is the safe one).</summary>
    public string? AcceptedProtection { get; init; }

    /// <summary><c>upgrade</c> when any capture finds the device not adequate; otherwise <c>error</c> when every capture
    /// failed, <c>cannot-tell</c> when any capture failed or could not decide, <c>ok</c> when every capture is ok.</summary>
    public required SurveyVerdict Verdict { get; init; }

    /// <summary>Why, in one line: the deciding capture's finding, or what is missing.</summary>
    public required string Reason { get; init; }

    /// <summary>The capture the verdict rests on (the first to demand the most); null when none could be analysed.</summary>
    public string? DecidingFile { get; init; }

    /// <summary>Largest worst-window RMS over the captures, amperes.</summary>
    public double? WorstWindowRmsA { get; init; }

    /// <summary>Smooth DC of largest magnitude over the captures, amperes; signed.</summary>
    public double? SmoothDcA { get; init; }

    /// <summary>True when every analysed capture could show smooth DC; false when one could not.</summary>
    public bool? SmoothDcKnown { get; init; }

    /// <summary>Largest RMS above 1 kHz over the captures, amperes.</summary>
    public double? Above1kHzRmsA { get; init; }

    /// <summary>Worst nuisance-tripping risk over the captures.</summary>
    public RiskLevel? NuisanceRisk { get; init; }

    /// <summary>Smallest nuisance margin (0.5 IΔn minus the weighted standing current) over the captures, amperes.</summary>
    public double? NuisanceMarginA { get; init; }

    /// <summary>True when any capture blinds the device; null when none does but one cannot tell; false otherwise.</summary>
    public bool? Blinded { get; init; }

    /// <summary>True when a capture holds an event a compliant device of the installed rating must trip on (the trip
    /// replay's alert); false when none does; null when no capture was replayed.</summary>
    public bool? TripAlert { get; init; }

    /// <summary>The captures of the circuit, in the order of the survey.</summary>
    public required IReadOnlyList<CircuitCapture> Captures { get; init; }
}

/// <summary>A capture as listed under its circuit.</summary>
/// <param name="File">The capture (the survey row's <see cref="SurveyRow.File"/>).</param>
/// <param name="State">What the circuit was doing (<c>start-up</c>, <c>charging, final phase</c>); null when not given.</param>
/// <param name="Verdict">The capture's own verdict.</param>
/// <param name="RequiredType">The capture's own required type.</param>
/// <param name="MinimumType">The capture's own minimum type.</param>
/// <param name="WorstWindowRmsA">The capture's worst-window RMS, amperes.</param>
/// <param name="ReportPath">Its report relative to the survey folder; null when none.</param>
public sealed record CircuitCapture(string File, string? State, SurveyVerdict Verdict, DeviceType? RequiredType,
    DeviceType? MinimumType, double? WorstWindowRmsA, string? ReportPath);
