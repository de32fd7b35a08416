namespace WaveCheck.Core.Model;

/// <summary>
/// The verdict on a capture: which device type it demands, how each type fares, margins for the installed device.
/// Serialised under <c>assessment</c> in the analysis JSON.
/// </summary>
public sealed record AssessmentResult
{
    /// <summary>The non-operating limit applied, as a multiple of IΔn in words (<c>0.5 IΔn</c>), for labels.</summary>
    public string NonOperatingLimitText() => FractionText(NuisanceTrip.NonOperatingLimitA);

    /// <summary>The leakage budget applied (<c>--leakage-budget</c>), as a multiple of IΔn in words (<c>0.3 IΔn</c>).</summary>
    public string LeakageBudgetText() => FractionText(NuisanceTrip.LeakageBudgetA);

    private string FractionText(double amperes) => string.Create(System.Globalization.CultureInfo.InvariantCulture,
        $"{(RatedResidualCurrentA > 0 ? amperes / RatedResidualCurrentA : 0):0.##} IΔn");

    /// <summary>Least capable type that covers the waveform (JSON: the trade name <c>AC</c>, <c>A</c>, <c>F</c>,
    /// <c>B</c>, <c>B+</c>); null when it cannot be determined from this capture.</summary>
    public required DeviceType? RequiredType { get; init; }

    /// <summary>Lowest type that may be required once what the capture could not show is measured (e.g. with a DC-coupled sensor).
    /// Equals <see cref="RequiredType"/> when everything was determinable.</summary>
    public required DeviceType MinimumType { get; init; }

    /// <summary>The one-line deciding reason, for the top of the output.</summary>
    public required string Headline { get; init; }

    /// <summary>Rated residual operating current IΔn of the device assessed, amperes.</summary>
    public required double RatedResidualCurrentA { get; init; }

    /// <summary>Installed type as given (<see cref="Assessment.AssessmentOptions.InstalledType"/>); null when not given.</summary>
    public DeviceType? InstalledType { get; init; }

    /// <summary>Installed protection in full: the type and any DC fault detection beside it (<c>A+RDC-DD</c>, or
    /// <c>A + charger DC detection</c>); null when no device was given.</summary>
    public InstalledProtection? InstalledProtection { get; init; }

    /// <summary>What protects the circuit, in words: the required type and the alternatives the standards accept
    /// (type A with 6 mA DC detection in place of type B where only DC classes ask for B); null when open.</summary>
    public string? AcceptedProtection { get; init; }

    /// <summary>Every class of residual current considered, with its figure, threshold and presence: the evidence
    /// the required type rests on.</summary>
    public IReadOnlyList<ClassResult> Classes { get; init; } = [];

    /// <summary>Measurement uncertainty applied to every comparison with a limit (e.g. <c>2%+0.1mA</c>).</summary>
    public string Accuracy { get; init; } = "";

    /// <summary>Installed type adequate (true), not adequate (false), not determinable (null); null also when none given.</summary>
    public bool? InstalledAdequate { get; init; }

    /// <summary>Rules judged by (JSON <c>iec</c> or <c>na</c>).</summary>
    public required Regime Regime { get; init; }

    /// <summary>A verdict for every type AC, A, F, B, B+.</summary>
    public required IReadOnlyList<TypeVerdict> Types { get; init; }

    /// <summary>Nuisance-tripping margin for the installed (or required) type.</summary>
    public required NuisanceTripResult NuisanceTrip { get; init; }

    /// <summary>Smooth-DC blinding of the installed (or required) type.</summary>
    public required BlindingResult Blinding { get; init; }

    /// <summary>EV charging point guidance (IEC 60364-7-722, IEC 62955 RDC-DD).</summary>
    public required EvChargingResult EvCharging { get; init; }

    /// <summary>UL 943 GFCI figures, filled when <see cref="Regime"/> is <c>na</c>.</summary>
    public GfciResult? Gfci { get; init; }

    /// <summary>Touch-current figures compared with common limits; null when not computed.</summary>
    public TouchCurrentAssessment? TouchCurrent { get; init; }

    /// <summary>Cautions that go with every verdict (verify on site, local codes, maker's data, licensed people),
    /// then the capture's own limitations with what to measure instead.</summary>
    public required IReadOnlyList<string> Cautions { get; init; }

    /// <summary>Every threshold used, with its value and source, as applied (after user overrides).</summary>
    public required IReadOnlyList<ThresholdUse> Thresholds { get; init; }

    /// <summary>What devices of this rating and the alternatives would do with the capture's surges (JSON
    /// <c>tripReplay</c>); null when the analysis recorded no half-cycle episodes.</summary>
    public TripReplayResult? TripReplay { get; init; }
}

/// <summary>One class of residual current as judged in a capture.</summary>
/// <param name="Class">The class (JSON <c>pulsatingDc</c>, <c>smoothDc</c>, ...).</param>
/// <param name="Name">In words.</param>
/// <param name="Presence">JSON <c>absent</c>, <c>at limit</c> (within the uncertainty: counted as present), <c>present</c>, <c>open</c> (the capture cannot show it).</param>
/// <param name="FigureA">The measured figure compared, amperes; null for a rule that applies regardless of figures.</param>
/// <param name="ThresholdA">The threshold it was compared with, amperes; null likewise.</param>
/// <param name="LeastType">Least type specified to detect the class (JSON: the trade name).</param>
/// <param name="CoveredByDcDetection">A 6 mA DC detection device beside type A or stronger covers it in place of type B.</param>
/// <param name="Text">The finding with its figure, limit and source.</param>
public sealed record ClassResult(ResidualCurrentClass Class, string Name, ClassPresence Presence,
    double? FigureA, double? ThresholdA, DeviceType LeastType, bool CoveredByDcDetection, string Text);

/// <summary>One type's verdict.</summary>
/// <param name="Type">The type (JSON: the trade name).</param>
/// <param name="Suitable">True suitable, false not suitable, null cannot be determined.</param>
/// <param name="Reasons">Each quotes the measured figure, the limit and its source. For a type not suitable or open:
/// first any rule that applies whatever the figures (a charging point's own RCD of at least type A), then the finding
/// of each class in <see cref="Classes"/>, in that order.</param>
public sealed record TypeVerdict(DeviceType Type, bool? Suitable, IReadOnlyList<string> Reasons)
{
    /// <summary>The classes of residual current the verdict rests on (JSON <c>classes</c>, e.g. <c>pulsatingDc</c>):
    /// for a type not suitable, those present that it is not specified for; open, those the capture cannot show that it
    /// may not detect; suitable, those present that it detects, mains-frequency AC aside.</summary>
    public IReadOnlyList<ResidualCurrentClass> Classes { get; init; } = [];
}

/// <summary>A threshold as applied.</summary>
/// <param name="Name">Its name in docs/methods.md (e.g. <c>dcSignificanceA</c>).</param>
/// <param name="Value">Value in SI units.</param>
/// <param name="Unit">SI unit of <paramref name="Value"/> (<c>A</c>, <c>Hz</c>, <c>1</c>).</param>
/// <param name="Source">Standard and clause, or "engineering choice: ...", and "(overridden)" when the user changed it.</param>
public sealed record ThresholdUse(string Name, double Value, string Unit, string Source);

/// <summary>Nuisance tripping: standing residual current against the non-operating limit and the leakage budget.</summary>
/// <param name="Risk">Low, possible or likely (JSON <c>low</c>, <c>possible</c>, <c>likely</c>).</param>
/// <param name="DeviceType">Type the margin is computed for.</param>
/// <param name="StandingA">Standing residual current, unweighted (each range's worst window, in quadrature), amperes: compared with the guaranteed non-operating current 0.5 IΔn, which holds in every frequency range.</param>
/// <param name="NonOperatingLimitA">0.5 IΔn, amperes.</param>
/// <param name="MarginA">Limit minus standing current, amperes (negative: above the limit).</param>
/// <param name="MarginPercent">Margin as a share of the limit, per cent.</param>
/// <param name="LeakageBudgetA">0.3 IΔn, amperes.</param>
/// <param name="WithinLeakageBudget">Standing current within 0.3 IΔn.</param>
/// <param name="Contributions">Per frequency range: measured RMS, the type's tripping factor, weighted RMS.</param>
/// <param name="Explanation">For a person.</param>
/// <param name="TypicalStandingA">Second figure: the standing current as a typical device of the type responds to it (each range weighted by its tripping factor), amperes.</param>
public sealed record NuisanceTripResult(RiskLevel Risk, DeviceType DeviceType, double StandingA, double NonOperatingLimitA,
    double MarginA, double MarginPercent, double LeakageBudgetA, bool WithinLeakageBudget,
    IReadOnlyList<FrequencyContribution> Contributions, string Explanation, double TypicalStandingA = 0);

/// <summary>A frequency range's share of the standing residual current.</summary>
/// <param name="Label">E.g. <c>DC</c>, <c>below mains</c>, <c>mains</c>, <c>harmonics to 1 kHz</c>, <c>1-20 kHz</c>.</param>
/// <param name="LowHz">Lower edge, hertz.</param>
/// <param name="HighHz">Upper edge, hertz.</param>
/// <param name="RmsA">Measured RMS in the range (worst window), amperes.</param>
/// <param name="TripFactor">Multiple of the mains-frequency tripping current at which the type trips in this range (1 at mains; greater: less sensitive; infinity: does not respond).</param>
/// <param name="WeightedRmsA">RmsA / TripFactor, amperes.</param>
public sealed record FrequencyContribution(string Label, double LowHz, double HighHz, double RmsA, double TripFactor,
    double WeightedRmsA);

/// <summary>Smooth DC beyond what a type tolerates: the device may not trip on a real fault.</summary>
/// <param name="DeviceType">Type assessed.</param>
/// <param name="SmoothDcA">Worst-window smooth DC magnitude, amperes.</param>
/// <param name="ToleranceA">What the type is specified to work with (6 mA A, 10 mA F; B: max of 0.4 IΔn and 10 mA), amperes; null for AC (none).</param>
/// <param name="Blinded">True: the DC exceeds the tolerance; null: DC not determinable with this sensor.</param>
/// <param name="Explanation">For a person.</param>
public sealed record BlindingResult(DeviceType DeviceType, double SmoothDcA, double? ToleranceA, bool? Blinded, string Explanation);

/// <summary>EV charging point guidance.</summary>
/// <param name="RdcDdThresholdA">6 mA smooth DC (IEC 62955), amperes.</param>
/// <param name="SmoothDcA">Worst-window smooth DC magnitude, amperes.</param>
/// <param name="DcAboveRdcDdThreshold">True above 6 mA; null when DC not determinable.</param>
/// <param name="Recommendation">The choice per IEC 60364-7-722: type A + RDC-DD, or type B.</param>
public sealed record EvChargingResult(double RdcDdThresholdA, double SmoothDcA, bool? DcAboveRdcDdThreshold, string Recommendation);

/// <summary>UL 943 figures.</summary>
/// <param name="StandingRmsA">Standing residual RMS (worst window), amperes.</param>
/// <param name="ClassATripsAlone">Standing current alone reaches the Class A must-trip level (6 mA): true; below the must-not-trip level (4 mA): false; between: null (may trip).</param>
/// <param name="ClassATripTimeS">T = (20/I)^1.43 s at the standing level (I in mA, 6 to 264 mA); null below 6 mA.</param>
/// <param name="SpecialPurposeTripsAlone">Against the special-purpose (UL 943C, classes C/D/E) 20 mA level; null between 15 and 20 mA.</param>
/// <param name="SpecialPurposeTripTimeS">Same formula at the standing level for ≥ 20 mA; null below.</param>
/// <param name="Notes">For a person (e.g. UL 943 states no DC sensitivity requirement).</param>
public sealed record GfciResult(double StandingRmsA, bool? ClassATripsAlone, double? ClassATripTimeS,
    bool? SpecialPurposeTripsAlone, double? SpecialPurposeTripTimeS, IReadOnlyList<string> Notes);

/// <summary>Touch-current readings with common limits for comparison.</summary>
/// <param name="Readings">The IEC 60990 readings.</param>
/// <param name="Comparisons">Each: limit name, limit value, reading compared, within.</param>
public sealed record TouchCurrentAssessment(TouchCurrentResult Readings, IReadOnlyList<LimitComparison> Comparisons);

/// <summary>A reading against a published limit.</summary>
/// <param name="Limit">E.g. <c>IEC 62368-1 ES1, 0.707 mA peak</c>.</param>
/// <param name="LimitA">Limit, amperes.</param>
/// <param name="Reading">Which reading (<c>perception peak</c>, <c>DC</c>, ...).</param>
/// <param name="ValueA">Reading, amperes.</param>
/// <param name="Within">Reading at or below the limit.</param>
/// <param name="Source">Where the limit comes from, with its status (std / from memory).</param>
public sealed record LimitComparison(string Limit, double LimitA, string Reading, double ValueA, bool Within, string Source);
