using WaveCheck.Core.Model;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// The thresholds of one assessment after the user's overrides, with the list that records them
/// (<see cref="AssessmentResult.Thresholds"/>). Significance thresholds scale with the capture's own figures.
/// </summary>
internal sealed class AppliedThresholds
{
    private const string Overridden = " (overridden)";
    private readonly List<ThresholdUse> _uses = [];

    public AppliedThresholds(AssessmentOptions o)
    {
        RatedA = o.RatedResidualCurrentA;
        Add("ratedResidualCurrentA", RatedA, "A", $"IΔn of the device assessed ({Setting.Ref(nameof(AssessmentOptions.RatedResidualCurrentA))}; default 30 mA, practice)");

        Accuracy = o.Accuracy ?? MeasurementAccuracy.Default;
        _uses.Add(new ThresholdUse("accuracyReadingFraction", Accuracy.ReadingFraction, "1",
            $"measurement uncertainty, share of the reading: every limit below is compared with it (engineering choice: 2 % + 0.1 mA default, {Setting.Ref(nameof(AssessmentOptions.Accuracy))})" + (o.Accuracy is null ? "" : Overridden)));
        _uses.Add(new ThresholdUse("accuracyOffsetA", Accuracy.OffsetA, "A",
            "measurement uncertainty, fixed part (see accuracyReadingFraction)" + (o.Accuracy is null ? "" : Overridden)));
        DcA = Value("dcSignificanceA", o.DcThresholdA, Limits.DcSignificanceA, "A",
            "engineering choice: smooth DC at or above it is present (type B); a fixed level so added content never hides it");
        BelowMainsA = Significance("belowMainsSignificanceA", o.BelowMainsThresholdA, Limits.MotorFrequencySignificanceFraction,
            "engineering choice: a motor-frequency part (type F's composite current)");
        HarmonicA = Significance("harmonicSignificanceA", o.HarmonicThresholdA, Limits.HarmonicSignificanceFraction,
            "engineering choice: AC at other frequencies up to 1 kHz (type B); a leakage within the 0.3 IΔn budget with normal supply distortion stays below");
        HighFrequencyA = Significance("highFrequencySignificanceA", o.HighFrequencyThresholdA,
            Limits.HighFrequencySignificanceFraction, "engineering choice: content 1-20 kHz (B+), after a firing edge's own share");

        PulsatingShare = Value("pulsatingShareThreshold", o.PulsatingShareThreshold, Limits.PulsatingShareThreshold, "1",
            "engineering choice: share of windows judged pulsating DC (0: any window)");
        TypeADcA = Value("typeASmoothDcToleranceA", o.TypeASmoothDcToleranceA, Limits.TypeASmoothDcToleranceA, "A",
            "IEC 61008-1 / IEC 61009-1 type A, 6 mA smooth DC (std)");
        TypeFDcA = Value("typeFSmoothDcToleranceA", o.TypeFSmoothDcToleranceA, Limits.TypeFSmoothDcToleranceA, "A",
            "IEC 62423 type F, 10 mA smooth DC (std)");
        TypeBDcA = Limits.TypeBSmoothDcToleranceA(RatedA);
        Add("typeBSmoothDcToleranceA", TypeBDcA, "A", "IEC 62423 type B, max(0.4 IΔn, 10 mA) (std)");
        RdcDdA = Value("rdcDdThresholdA", o.RdcDdThresholdA, Limits.RdcDdThresholdA, "A", "IEC 62955 RDC-DD, 6 mA smooth DC (std)");
        LeakageBudgetFraction = Value("leakageBudgetFraction", o.LeakageBudgetFraction, Limits.LeakageBudgetFraction, "1",
            "IEC 60364-5-53:2015 §531.3.2, 0.3 IΔn (std)");
        PossibleFraction = Value("possibleRiskFraction", o.PossibleRiskFraction, Limits.PossibleRiskFraction, "1",
            "engineering choice: nuisance risk 'possible' from the 0.3 IΔn leakage budget");
        LikelyFraction = Value("likelyRiskFraction", o.LikelyRiskFraction, Limits.LikelyRiskFraction, "1",
            "engineering choice: nuisance risk 'likely' from the 0.5 IΔn non-operating limit (IEC 61008-1)");
        Add("nonOperatingFraction", Limits.NonOperatingFraction, "1", "IEC 61008-1 / IEC 61009-1 Table 1, 0.5 IΔn (std)");
        Factors = new TripFactors(
            Value("frequencyFactor150Hz", o.FrequencyFactor150Hz, Limits.FrequencyFactor150Hz, "1", "IEC 62423 §5.3 upper limit 2.4 IΔn at 150 Hz (from memory)"),
            Value("frequencyFactor400Hz", o.FrequencyFactor400Hz, Limits.FrequencyFactor400Hz, "1", "IEC 62423 §5.3 upper limit 6 IΔn at 400 Hz (from memory)"),
            Value("frequencyFactor1kHz", o.FrequencyFactor1kHz, Limits.FrequencyFactor1kHz, "1", "IEC 62423 §5.3 upper limit 14 IΔn at 1 kHz (from memory)"),
            Value("bPlusUpperLimitA", o.BPlusUpperLimitA, Limits.BPlusUpperLimitA, "A", "DIN VDE 0664-400 B+ upper limit 420 mA to 20 kHz (from memory)"));
        Add("typeBSmoothDcFactor", Limits.TypeBSmoothDcFactor, "1", "IEC 62423 type B smooth DC upper limit 2 IΔn (std)");
        Add("pulsatingDcFactor", Limits.PulsatingDcFactor, "1", "IEC 61008-1 pulsating DC upper limit 1.4 IΔn (std)");
        Add("minimumRestDeg", Signal.WaveformShape.MinRestDeg, "deg",
            "IEC 61008-1 pulsating DC: at rest for a single interval of at least 150° each cycle (from memory)");
        Add("motorFrequencyTopMultiple", Limits.MotorFrequencyTopMultiple, "1",
            "practice: tones up to 2 × mains are motor frequencies (type F), above it AC at another frequency (type B)");
    }

    public double RatedA { get; }
    public double DcA { get; }
    public double BelowMainsA { get; }
    public double HarmonicA { get; }
    public double HighFrequencyA { get; }
    public double PulsatingShare { get; }
    public double TypeADcA { get; }
    public double TypeFDcA { get; }
    public double TypeBDcA { get; }
    public double RdcDdA { get; }
    public double LeakageBudgetFraction { get; }
    public double PossibleFraction { get; }
    public double LikelyFraction { get; }

    /// <summary>Uncertainty every comparison with a limit accounts for.</summary>
    public MeasurementAccuracy Accuracy { get; }

    /// <summary>Frequency factors and the B+ limit as applied (defaults or overrides).</summary>
    public TripFactors Factors { get; }

    public IReadOnlyList<ThresholdUse> Uses => _uses;

    /// <summary>Smooth-DC tolerance of a type; null for AC (none: any significant DC).</summary>
    public double? DcTolerance(DeviceType type) => type switch
    {
        DeviceType.AC => null,
        DeviceType.A => TypeADcA,
        DeviceType.F => TypeFDcA,
        _ => TypeBDcA,
    };

    private double Significance(string name, double? given, double fractionOfRated, string why)
    {
        if (given is { } g)
        {
            Add(name, g, "A", why + Overridden);
            return g;
        }

        var value = Math.Max(Limits.SignificanceFloorA, fractionOfRated * RatedA);
        Add(name, value, "A", $"{why}; max(1 mA, {fractionOfRated:0.##} IΔn)");
        return value;
    }

    private double Value(string name, double? given, double fallback, string unit, string source)
    {
        var value = given ?? fallback;
        Add(name, value, unit, given is null ? source : source + Overridden);
        return value;
    }

    private void Add(string name, double value, string unit, string source) => _uses.Add(new ThresholdUse(name, value, unit, source));
}
