using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The list of thresholds an assessment applied (<see cref="AssessmentResult.Thresholds"/>): each entry's name, value,
/// unit and source text is what a reader of the JSON and the report gets, so each is pinned word for word. Values are
/// checked against the project's reference table (REFERENCE.md), the source named beside each; "engineering choice"
/// entries against the reasoning in Limits. A user's setting replaces a default and is marked "(overridden)";
/// a value that cannot be set never carries the mark.
/// </summary>
public class AppliedThresholdsTests
{
    private const string Mark = " (overridden)";

    // Sources as written in the list: the standard and clause, or the engineering choice with its reasoning.
    private const string RatedSource = "IΔn of the device assessed (⟦RatedResidualCurrentA⟧; default 30 mA, practice)";
    private const string ReadingSource = "measurement uncertainty, share of the reading: every limit below is compared with it (engineering choice: 2 % + 0.1 mA default, ⟦Accuracy⟧)";
    private const string OffsetSource = "measurement uncertainty, fixed part (see accuracyReadingFraction)";
    private const string DcSource = "engineering choice: smooth DC at or above it is present (type B); a fixed level so added content never hides it";
    private const string BelowMainsWhy = "engineering choice: a motor-frequency part (type F's composite current)";
    private const string HarmonicWhy = "engineering choice: AC at other frequencies up to 1 kHz (type B); a leakage within the 0.3 IΔn budget with normal supply distortion stays below";
    private const string HighFrequencyWhy = "engineering choice: content 1-20 kHz (B+), after a firing edge's own share";
    private const string PulsatingSource = "engineering choice: share of windows judged pulsating DC (0: any window)";
    private const string TypeASource = "IEC 61008-1 / IEC 61009-1 type A, 6 mA smooth DC (std)";
    private const string TypeFSource = "IEC 62423 type F, 10 mA smooth DC (std)";
    private const string TypeBSource = "IEC 62423 type B, max(0.4 IΔn, 10 mA) (std)";
    private const string RdcDdSource = "IEC 62955 RDC-DD, 6 mA smooth DC (std)";
    private const string BudgetSource = "IEC 60364-5-53:2015 §531.3.2, 0.3 IΔn (std)";
    private const string PossibleSource = "engineering choice: nuisance risk 'possible' from the 0.3 IΔn leakage budget";
    private const string LikelySource = "engineering choice: nuisance risk 'likely' from the 0.5 IΔn non-operating limit (IEC 61008-1)";
    private const string NonOperatingSource = "IEC 61008-1 / IEC 61009-1 Table 1, 0.5 IΔn (std)";
    private const string F150Source = "IEC 62423 §5.3 upper limit 2.4 IΔn at 150 Hz (from memory)";
    private const string F400Source = "IEC 62423 §5.3 upper limit 6 IΔn at 400 Hz (from memory)";
    private const string F1kSource = "IEC 62423 §5.3 upper limit 14 IΔn at 1 kHz (from memory)";
    private const string BPlusSource = "DIN VDE 0664-400 B+ upper limit 420 mA to 20 kHz (from memory)";
    private const string TypeBFactorSource = "IEC 62423 type B smooth DC upper limit 2 IΔn (std)";
    private const string PulsatingFactorSource = "IEC 61008-1 pulsating DC upper limit 1.4 IΔn (std)";
    private const string RestSource = "IEC 61008-1 pulsating DC: at rest for a single interval of at least 150° each cycle (from memory)";
    private const string MotorTopSource = "practice: tones up to 2 × mains are motor frequencies (type F), above it AC at another frequency (type B)";

    /// <summary>The list for the default device, 30 mA, every value from the sources named.</summary>
    private static List<ThresholdUse> DefaultsAt30mA() =>
    [
        new("ratedResidualCurrentA", 0.030, "A", RatedSource), // 30 mA: the additional-protection rating (REFERENCE, ratings in use, practice)
        new("accuracyReadingFraction", 0.02, "1", ReadingSource), // 2 % of reading (engineering choice, MeasurementAccuracy.Default)
        new("accuracyOffsetA", 0.0001, "A", OffsetSource), // + 0.1 mA (engineering choice, MeasurementAccuracy.Default)
        new("dcSignificanceA", 0.001, "A", DcSource), // 1 mA fixed (engineering choice, Limits.DcSignificanceA)
        new("belowMainsSignificanceA", 0.0015, "A", BelowMainsWhy + "; max(1 mA, 0.05 IΔn)"), // max(1, 0.05 × 30) = 1.5 mA
        new("harmonicSignificanceA", 0.003, "A", HarmonicWhy + "; max(1 mA, 0.1 IΔn)"), // max(1, 0.1 × 30) = 3 mA
        new("highFrequencySignificanceA", 0.003, "A", HighFrequencyWhy + "; max(1 mA, 0.1 IΔn)"), // 3 mA likewise
        new("pulsatingShareThreshold", 0, "1", PulsatingSource), // any window (engineering choice)
        new("typeASmoothDcToleranceA", 0.006, "A", TypeASource), // IEC 61008-1 / IEC 61009-1 type A: 6 mA smooth DC (REFERENCE, std)
        new("typeFSmoothDcToleranceA", 0.010, "A", TypeFSource), // IEC 62423 type F: 10 mA smooth DC (REFERENCE, std)
        new("typeBSmoothDcToleranceA", 0.012, "A", TypeBSource), // IEC 62423 type B: max(0.4 × 30 mA, 10 mA) = 12 mA (REFERENCE, std)
        new("rdcDdThresholdA", 0.006, "A", RdcDdSource), // IEC 62955 RDC-DD: 6 mA smooth DC (REFERENCE, std)
        new("leakageBudgetFraction", 0.3, "1", BudgetSource), // IEC 60364-5-53:2015 §531.3.2: 0.3 IΔn (REFERENCE, std)
        new("possibleRiskFraction", 0.3, "1", PossibleSource), // the 0.3 IΔn budget (engineering choice)
        new("likelyRiskFraction", 0.5, "1", LikelySource), // the 0.5 IΔn non-operating current (engineering choice)
        new("nonOperatingFraction", 0.5, "1", NonOperatingSource), // IEC 61008-1 Table 1: non-operating 0.5 IΔn (REFERENCE, std)
        new("frequencyFactor150Hz", 2.4, "1", F150Source), // IEC 62423 §5.3: 2.4 IΔn at 150 Hz (REFERENCE, mem)
        new("frequencyFactor400Hz", 6, "1", F400Source), // IEC 62423 §5.3: 6 IΔn at 400 Hz (REFERENCE, mem)
        new("frequencyFactor1kHz", 14, "1", F1kSource), // IEC 62423 §5.3: 14 IΔn at 1 kHz (REFERENCE, mem)
        new("bPlusUpperLimitA", 0.420, "A", BPlusSource), // DIN VDE 0664-400: 420 mA up to 20 kHz (REFERENCE, mem)
        new("typeBSmoothDcFactor", 2, "1", TypeBFactorSource), // IEC 62423: B smooth DC 0.5 to 2 IΔn (REFERENCE, std)
        new("pulsatingDcFactor", 1.4, "1", PulsatingFactorSource), // IEC 61008-1: A half-wave up to 1.4 IΔn (REFERENCE, std)
        new("minimumRestDeg", 150, "deg", RestSource), // IEC 61008-1 pulsating DC: rest ≥ 150° a period (REFERENCE, mem)
        new("motorFrequencyTopMultiple", 2, "1", MotorTopSource), // motor frequencies 0 to ~100 Hz = 2 × 50 Hz (REFERENCE, practice)
    ];

    /// <summary>Same names, units and sources in the same order; values to a relative 1e-12 (products such as
    /// 0.4 × 0.030 need not be the decimal's nearest double).</summary>
    private static void AssertUses(IReadOnlyList<ThresholdUse> expected, IReadOnlyList<ThresholdUse> actual)
    {
        Assert.Equal(expected.Select(u => u.Name), actual.Select(u => u.Name));
        for (var i = 0; i < expected.Count; i++)
        {
            Assert.Equal(expected[i].Unit, actual[i].Unit);
            Assert.Equal(expected[i].Source, actual[i].Source);
            Assert.True(Math.Abs(expected[i].Value - actual[i].Value) <= 1e-12 * Math.Abs(expected[i].Value),
                $"{expected[i].Name}: expected {expected[i].Value}, got {actual[i].Value}");
        }
    }

    [Fact]
    public void The_defaults_are_listed_with_their_sources_and_no_override_mark()
    {
        var th = new AppliedThresholds(new AssessmentOptions());
        AssertUses(DefaultsAt30mA(), th.Uses);
        Assert.DoesNotContain(th.Uses, u => u.Source.Contains("overridden", StringComparison.Ordinal));
    }

    [Fact]
    public void The_list_is_what_the_assessment_reports()
    {
        // The same list travels into the result (DeviceTypeAssessor), for a plain 3 mA mains leakage.
        var r = DeviceTypeAssessor.Assess(new AnalysisBuilder().Sine(0.003).Build(), new AssessmentOptions());
        AssertUses(DefaultsAt30mA(), r.Thresholds);
    }

    [Fact]
    public void Each_user_setting_replaces_its_default_and_is_marked()
    {
        var o = new AssessmentOptions
        {
            RatedResidualCurrentA = 0.100,
            Accuracy = new MeasurementAccuracy(0.05, 0.0002),
            DcThresholdA = 0.002,
            BelowMainsThresholdA = 0.004,
            HarmonicThresholdA = 0.007,
            HighFrequencyThresholdA = 0.009,
            PulsatingShareThreshold = 0.25,
            TypeASmoothDcToleranceA = 0.005,
            TypeFSmoothDcToleranceA = 0.008,
            RdcDdThresholdA = 0.007,
            LeakageBudgetFraction = 0.25,
            PossibleRiskFraction = 0.2,
            LikelyRiskFraction = 0.4,
            FrequencyFactor150Hz = 2,
            FrequencyFactor400Hz = 5,
            FrequencyFactor1kHz = 10,
            BPlusUpperLimitA = 0.3,
        };
        o.Validate();
        var th = new AppliedThresholds(o);
        List<ThresholdUse> expected =
        [
            // The rating is the device assessed, not a replaced default: no mark.
            new("ratedResidualCurrentA", 0.100, "A", RatedSource),
            new("accuracyReadingFraction", 0.05, "1", ReadingSource + Mark),
            new("accuracyOffsetA", 0.0002, "A", OffsetSource + Mark),
            new("dcSignificanceA", 0.002, "A", DcSource + Mark),
            // A given significance threshold is a current: the rule max(1 mA, k IΔn) no longer applies and is not named.
            new("belowMainsSignificanceA", 0.004, "A", BelowMainsWhy + Mark),
            new("harmonicSignificanceA", 0.007, "A", HarmonicWhy + Mark),
            new("highFrequencySignificanceA", 0.009, "A", HighFrequencyWhy + Mark),
            new("pulsatingShareThreshold", 0.25, "1", PulsatingSource + Mark),
            new("typeASmoothDcToleranceA", 0.005, "A", TypeASource + Mark),
            new("typeFSmoothDcToleranceA", 0.008, "A", TypeFSource + Mark),
            // Type B's tolerance cannot be set: IEC 62423 max(0.4 × 100 mA, 10 mA) = 40 mA (REFERENCE, std).
            new("typeBSmoothDcToleranceA", 0.040, "A", TypeBSource),
            new("rdcDdThresholdA", 0.007, "A", RdcDdSource + Mark),
            new("leakageBudgetFraction", 0.25, "1", BudgetSource + Mark),
            new("possibleRiskFraction", 0.2, "1", PossibleSource + Mark),
            new("likelyRiskFraction", 0.4, "1", LikelySource + Mark),
            // Fixed by the standards: never overridden.
            new("nonOperatingFraction", 0.5, "1", NonOperatingSource),
            new("frequencyFactor150Hz", 2, "1", F150Source + Mark),
            new("frequencyFactor400Hz", 5, "1", F400Source + Mark),
            new("frequencyFactor1kHz", 10, "1", F1kSource + Mark),
            new("bPlusUpperLimitA", 0.3, "A", BPlusSource + Mark),
            new("typeBSmoothDcFactor", 2, "1", TypeBFactorSource),
            new("pulsatingDcFactor", 1.4, "1", PulsatingFactorSource),
            new("minimumRestDeg", 150, "deg", RestSource),
            new("motorFrequencyTopMultiple", 2, "1", MotorTopSource),
        ];
        AssertUses(expected, th.Uses);
        // The applied values are the ones listed.
        Assert.Equal(o.Accuracy, th.Accuracy);
        Assert.Equal((0.002, 0.004, 0.007, 0.009), (th.DcA, th.BelowMainsA, th.HarmonicA, th.HighFrequencyA));
        Assert.Equal(new TripFactors(2, 5, 10, 0.3), th.Factors);
    }

    [Fact]
    public void The_accuracy_alone_is_marked_when_only_it_is_given()
    {
        // The accuracy entries carry the mark by their own setting, the others stay defaults.
        var th = new AppliedThresholds(new AssessmentOptions { Accuracy = new MeasurementAccuracy(0.01, 0.00005) });
        var marked = th.Uses.Where(u => u.Source.EndsWith(Mark, StringComparison.Ordinal)).Select(u => u.Name);
        Assert.Equal(["accuracyReadingFraction", "accuracyOffsetA"], marked);
        Assert.Equal(0.01, th.Uses[1].Value);
        Assert.Equal(0.00005, th.Uses[2].Value);
    }

    [Theory]
    // Significance thresholds max(1 mA, k IΔn), k = 0.05 (motor frequency) and 0.1 (harmonic, 1-20 kHz), engineering
    // choice (Limits); the 1 mA floor holds below 20 mA and 10 mA. Type B's smooth-DC tolerance max(0.4 IΔn, 10 mA)
    // (IEC 62423, REFERENCE std): the 10 mA floor holds up to 25 mA.
    [InlineData(0.010, 0.001, 0.001, 0.010)]
    [InlineData(0.030, 0.0015, 0.003, 0.012)]
    [InlineData(0.100, 0.005, 0.010, 0.040)]
    [InlineData(0.300, 0.015, 0.030, 0.120)]
    public void Thresholds_that_scale_with_the_rating(double ratedA, double belowMainsA, double harmonicA, double typeBA)
    {
        var th = new AppliedThresholds(new AssessmentOptions { RatedResidualCurrentA = ratedA });
        double Listed(string name) => th.Uses.Single(u => u.Name == name).Value;
        Assert.Equal(belowMainsA, Listed("belowMainsSignificanceA"), 1e-15);
        Assert.Equal(harmonicA, Listed("harmonicSignificanceA"), 1e-15);
        Assert.Equal(harmonicA, Listed("highFrequencySignificanceA"), 1e-15);
        Assert.Equal(typeBA, Listed("typeBSmoothDcToleranceA"), 1e-15);
        Assert.Equal(ratedA, Listed("ratedResidualCurrentA"));
        Assert.Equal(belowMainsA, th.BelowMainsA, 1e-15);
        Assert.Equal(harmonicA, th.HarmonicA, 1e-15);
        Assert.Equal(harmonicA, th.HighFrequencyA, 1e-15);
        // The smooth DC each type tolerates (REFERENCE device types): AC none, A 6 mA, F 10 mA, B and B+ as above.
        Assert.Null(th.DcTolerance(DeviceType.AC));
        Assert.Equal(0.006, th.DcTolerance(DeviceType.A));
        Assert.Equal(0.010, th.DcTolerance(DeviceType.F));
        Assert.Equal(typeBA, th.DcTolerance(DeviceType.B)!.Value, 1e-15);
        Assert.Equal(typeBA, th.DcTolerance(DeviceType.BPlus)!.Value, 1e-15);
    }
}
