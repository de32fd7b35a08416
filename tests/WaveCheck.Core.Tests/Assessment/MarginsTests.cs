using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>Nuisance-trip margins against hand calculations (IEC 61008-1 0.5 IΔn; IEC 60364-5-53 §531.3.2 0.3 IΔn).</summary>
public class MarginsTests
{
    private static Core.Model.NuisanceTripResult Nuisance(AnalysisBuilder b, DeviceType type, double ratedA = 0.030) =>
        DeviceTypeAssessor.Assess(b.Build(), new AssessmentOptions { InstalledType = type, RatedResidualCurrentA = ratedA }).NuisanceTrip;

    [Fact]
    public void TwelveMilliampsOnThirtyLeavesThreeMilliampsOrTwentyPercent()
    {
        // Hand calculation: 0.5 IΔn = 15 mA (IEC 61008-1); margin 15 - 12 = 3 mA = 20 % of 15 mA;
        // 0.3 IΔn = 9 mA (IEC 60364-5-53 §531.3.2) exceeded; 9 <= 12 < 15 -> "possible" (engineering choice).
        var n = Nuisance(new AnalysisBuilder().Sine(0.012), DeviceType.A);
        Assert.Equal(0.012, n.StandingA, 12);
        Assert.Equal(0.015, n.NonOperatingLimitA, 12);
        Assert.Equal(0.003, n.MarginA, 12);
        Assert.Equal(20.0, n.MarginPercent, 9);
        Assert.Equal(0.009, n.LeakageBudgetA, 12);
        Assert.False(n.WithinLeakageBudget);
        Assert.Equal(RiskLevel.Possible, n.Risk);
    }

    [Theory]
    // Boundaries on 30 mA: likely from 15 mA, possible from 9 mA (engineering choice, Limits).
    [InlineData(0.016, "likely", -0.001)]
    [InlineData(0.015, "likely", 0.0)]
    [InlineData(0.005, "low", 0.010)]
    public void RiskFollowsTheDocumentedBoundaries(double standingA, string risk, double marginA)
    {
        var n = Nuisance(new AnalysisBuilder().Sine(standingA), DeviceType.AC);
        Assert.Equal(risk, VerdictText.Of(n.Risk));
        Assert.Equal(marginA, n.MarginA, 12);
    }

    [Fact]
    public void TypeBWeightsThirdHarmonicByItsUpperTrippingLimit()
    {
        // IEC 62423 §5.3 (from memory): 2.4 IΔn at 150 Hz -> 12 mA counts as 12 / 2.4 = 5 mA for type B;
        // type A: factor 1 (conservative choice) -> 12 mA.
        var b = new AnalysisBuilder().Harmonic(3, 0.012);
        Assert.Equal(0.005, Nuisance(b, DeviceType.B).TypicalStandingA, 12);
        Assert.Equal(0.012, Nuisance(b, DeviceType.A).TypicalStandingA, 12);
        // The primary figure is unweighted for every type: 0.5 IΔn is guaranteed in every range (IEC 62423).
        Assert.Equal(0.012, Nuisance(b, DeviceType.B).StandingA, 12);
        var h = Nuisance(b, DeviceType.B).Contributions.Single(c => c.Label == "harmonics to 1 kHz");
        Assert.Equal(2.4, h.TripFactor, 9);
    }

    [Fact]
    public void SmoothDcCountsAtHalfForTypeBAndNotAtAllForTypeA()
    {
        // IEC 62423: type B smooth DC trips by 2 IΔn -> 20 mA counts as 10 mA. Type A does not respond to smooth DC
        // (it is blinded instead), so its weighted standing current is the 5 mA sine alone.
        var b = new AnalysisBuilder().SmoothDc(0.020).Sine(0.005);
        var nb = Nuisance(b, DeviceType.B);
        Assert.Equal(Math.Sqrt((0.010 * 0.010) + (0.005 * 0.005)), nb.TypicalStandingA, 12); // quadrature (Parseval)
        Assert.Equal(0.005, Nuisance(b, DeviceType.A).TypicalStandingA, 12);
        Assert.True(double.IsPositiveInfinity(Nuisance(b, DeviceType.A).Contributions[0].TripFactor));
        // Primary, unweighted: sqrt(20² + 5²) mA for either type (Parseval), against 0.5 IΔn (IEC 61008-1, IEC 62423).
        Assert.Equal(Math.Sqrt((0.020 * 0.020) + (0.005 * 0.005)), nb.StandingA, 12);
        Assert.Equal(nb.StandingA, Nuisance(b, DeviceType.A).StandingA, 12);
        Assert.Equal(RiskLevel.Likely, nb.Risk);
    }

    [Fact]
    public void HighFrequencyLeakageCountsInFullForTypeAButByFourteenForTypeB()
    {
        // Type B: 1 kHz factor 14 held above 1 kHz (IEC 62423, from memory; no further credit).
        // B+ at 100 mA: 420 mA / 100 mA = 4.2 (DIN VDE 0664-400, from memory), the lower (more sensitive) one.
        var b = new AnalysisBuilder().HighFrequency(16_000, 0.014);
        Assert.Equal(0.014, Nuisance(b, DeviceType.A).TypicalStandingA, 12);
        Assert.Equal(0.001, Nuisance(b, DeviceType.B).TypicalStandingA, 12);
        Assert.Equal(0.014 / 4.2, Nuisance(b, DeviceType.BPlus, 0.100).TypicalStandingA, 12);
    }

    [Fact]
    public void OverriddenBoundariesChangeTheRisk()
    {
        var b = new AnalysisBuilder().Sine(0.010);
        Assert.Equal(RiskLevel.Possible, Nuisance(b, DeviceType.A).Risk);
        var r = DeviceTypeAssessor.Assess(b.Build(), new AssessmentOptions { PossibleRiskFraction = 0.4 });
        Assert.Equal(RiskLevel.Low, r.NuisanceTrip.Risk);
        var budget = DeviceTypeAssessor.Assess(b.Build(), new AssessmentOptions { LeakageBudgetFraction = 0.4 });
        Assert.True(budget.NuisanceTrip.WithinLeakageBudget);
    }

    [Fact]
    public void RequiredTypeIsAssessedWhenNoneInstalled()
    {
        var r = DeviceTypeAssessor.Assess(new AnalysisBuilder().HalfWave(0.020, 0).SmoothDc(0.014).Build(), new AssessmentOptions());
        Assert.Equal(DeviceType.B, r.NuisanceTrip.DeviceType);
        Assert.Equal(DeviceType.B, r.Blinding.DeviceType);
        Assert.True(r.Blinding.Blinded); // 14 mA > max(0.4 x 30, 10) = 12 mA (IEC 62423)
    }

    [Fact]
    public void FromMemoryFrequencyFactorsCanBeOverriddenAndChangeTheMargin()
    {
        // REFERENCE.md: the IEC 62423 factors (2.4 at 150 Hz) are from memory, so a user may put their own. Hand
        // calculation: 12 mA at 150 Hz on type B counts as 12/2.4 = 5.0 mA by default, 12/1.2 = 10.0 mA with 1.2.
        var b = new AnalysisBuilder().Sine(0.0005).Harmonic(3, 0.012);
        var byDefault = DeviceTypeAssessor.Assess(b.Build(), new AssessmentOptions { InstalledType = DeviceType.B });
        var overridden = DeviceTypeAssessor.Assess(b.Build(), new AssessmentOptions
        {
            InstalledType = DeviceType.B,
            FrequencyFactor150Hz = 1.2,
        });
        var harmonicsDefault = byDefault.NuisanceTrip.Contributions.Single(c => c.Label == "harmonics to 1 kHz");
        var harmonicsOverridden = overridden.NuisanceTrip.Contributions.Single(c => c.Label == "harmonics to 1 kHz");
        Assert.Equal(0.005, harmonicsDefault.WeightedRmsA, 1e-6);
        Assert.Equal(0.010, harmonicsOverridden.WeightedRmsA, 1e-6);
        Assert.Contains(overridden.Thresholds, t => t.Name == "frequencyFactor150Hz" && t.Value == 1.2 && t.Source.Contains("overridden", StringComparison.Ordinal));
    }

    [Fact]
    public void FrequencyFactorsOutOfOrderAreRefused()
    {
        var ex = Assert.Throws<OptionValueException>(() => new AssessmentOptions { FrequencyFactor150Hz = 8 }.Validate());
        Assert.Contains("FrequencyFactor150Hz", ex.Message, StringComparison.Ordinal);
    }

    private static Core.Model.AssessmentResult Assess(AnalysisBuilder b, DeviceType? type = null, bool ev = false,
        bool rdcDd = false) =>
        DeviceTypeAssessor.Assess(b.Build(), new AssessmentOptions { InstalledType = type, EvChargingPoint = ev, InstalledRdcDd = rdcDd });

    private static string Ma(double a) => Core.Text.CurrentText.WithUnit(a);

    [Fact]
    public void Each_frequency_range_is_listed_with_its_bounds_and_factor()
    {
        // Ranges of docs/methods.md II.3 at 50 Hz and 50 kS/s: below mains 1 to 37.5 Hz (0.75 f), mains 37.5 to 75 Hz
        // (1.5 f), harmonics to 1 kHz, 1 kHz up to min(20 kHz, fs/2), above 20 kHz up to fs/2 = 25 kHz.
        var n = Assess(new AnalysisBuilder().Sine(0.003).SmoothDc(0.002).BelowMains(0.001).Harmonic(3, 0.0012)
            .HighFrequency(16_000, 0.0008).HighFrequency(22_000, 0.0006), DeviceType.F).NuisanceTrip;
        Assert.Equal(["smooth DC", "DC above the floor", "below mains", "mains", "harmonics to 1 kHz", "1-20 kHz", "above 20 kHz"],
            n.Contributions.Select(c => c.Label));
        Assert.Equal([0, 0, 1, 37.5, 75, 1000, 20_000], n.Contributions.Select(c => c.LowHz));
        Assert.Equal([0, 0, 37.5, 75, 1000, 20_000, 25_000], n.Contributions.Select(c => c.HighHz));
        Assert.Equal(0.002, n.Contributions[0].RmsA, 12);
        Assert.Equal(0.001, n.Contributions[2].RmsA, 12);
        Assert.Equal(0.003, n.Contributions[3].RmsA, 12);
        // Type F: smooth DC not responded to (∞), 14 above 1 kHz (IEC 62423, from memory), k(150 Hz) = 2.4.
        Assert.True(double.IsPositiveInfinity(n.Contributions[0].TripFactor));
        Assert.Equal(0, n.Contributions[0].WeightedRmsA);
        Assert.Equal(2.4, n.Contributions[4].TripFactor, 9);
        Assert.Equal(14, n.Contributions[5].TripFactor, 9);
        Assert.Equal(0.0008 / 14, n.Contributions[5].WeightedRmsA, 12);
        // Content above 20 kHz: the builder's 22 kHz band (Parseval: 1-20 kHz is √(above1k² − above20k²)).
        Assert.Equal(0.0006, n.Contributions[6].RmsA, 12);
        Assert.Equal(0.0008, n.Contributions[5].RmsA, 12);
        // The primary figure: every range unweighted, in quadrature.
        Assert.Equal(Math.Sqrt(Math.Pow(0.003, 2) + Math.Pow(0.002, 2) + Math.Pow(0.001, 2) + Math.Pow(0.0012, 2)
            + Math.Pow(0.0008, 2) + Math.Pow(0.0006, 2)), n.StandingA, 12);

        // Below 40 kS/s the ranges end at Nyquist: 1-15 kHz at 30 kS/s, and "above 20 kHz" is empty (20 to 20 kHz).
        var slow = DeviceTypeAssessor.Assess(new AnalysisBuilder().SampleRate(30_000).Sine(0.003).Build(), new AssessmentOptions()).NuisanceTrip;
        Assert.Equal("1-15 kHz", slow.Contributions[5].Label);
        Assert.Equal(15_000, slow.Contributions[5].HighHz);
        Assert.Equal(20_000, slow.Contributions[6].HighHz);
        // No harmonics: factor 1 (nothing to weight), weighted 0.
        Assert.Equal(1.0, slow.Contributions[4].TripFactor);
        Assert.Equal(0, slow.Contributions[4].WeightedRmsA);
    }

    [Fact]
    public void Pulsating_dc_above_the_floor_is_weighted_by_the_pulsating_factor()
    {
        // Half-wave, 20 mA peak: mean Ipk/π above the floor (closed form); type A's pulsating-DC upper limit 1.4 IΔn
        // (IEC 61008-1), so it counts as (Ipk/π)/1.4 for a typical device.
        var n = Assess(new AnalysisBuilder().HalfWave(0.020, 0), DeviceType.A).NuisanceTrip;
        var p = n.Contributions[1];
        Assert.Equal("pulsating DC (mean above the floor)", p.Label);
        Assert.Equal(0.020 / Math.PI, p.RmsA, 1e-9);
        Assert.Equal(1.4, p.TripFactor, 12);
        Assert.Equal(0.020 / Math.PI / 1.4, p.WeightedRmsA, 1e-9);
    }

    [Theory]
    [InlineData(0.008, true, "kept")]
    [InlineData(0.0087, true, "kept")]                      // 8.7 + 0.274 = 8.974 mA stays under 9 mA
    [InlineData(0.0088, false, "exceeded or at its limit")] // 8.8 + 0.276 = 9.076 mA reaches 9 mA: at the limit
    [InlineData(0.010, false, "exceeded or at its limit")]
    public void The_leakage_budget_is_kept_only_clear_of_its_uncertainty(double standingA, bool kept, string word)
    {
        // 0.3 IΔn = 9 mA on 30 mA (IEC 60364-5-53 §531.3.2), figure ± (2 % + 0.1 mA).
        var n = Nuisance(new AnalysisBuilder().Sine(standingA), DeviceType.A);
        Assert.Equal(kept, n.WithinLeakageBudget);
        Assert.Contains($"leakage budget 0.3 IΔn = {Ma(0.009)} (IEC 60364-5-53 §531.3.2) {word}.", n.Explanation, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.0088, "possible")] // 8.8 ± 0.276 mA reaches 9 mA within its uncertainty
    [InlineData(0.0087, "low")]      // 8.7 + 0.274 = 8.974 mA < 9 mA
    [InlineData(0.0147, "likely")]   // 14.7 + 0.394 mA reaches 15 mA
    [InlineData(0.0146, "possible")] // 14.6 + 0.392 = 14.992 mA does not
    public void Risk_counts_a_limit_within_the_uncertainty_as_reached(double standingA, string risk)
    {
        Assert.Equal(risk, VerdictText.Of(Nuisance(new AnalysisBuilder().Sine(standingA), DeviceType.A).Risk));
    }

    [Fact]
    public void The_nuisance_explanation_gives_margin_budget_risk_and_the_typical_figure()
    {
        var n = Nuisance(new AnalysisBuilder().Sine(0.012), DeviceType.A);
        Assert.Equal($"Standing residual current {Ma(0.012)} (each frequency range's worst window, unweighted) against the non-operating current 0.5 IΔn = {Ma(0.015)}, "
            + $"which a compliant device guarantees in every frequency range (IEC 61008-1, IEC 62423): margin {Ma(0.003)} (20 %); "
            + $"leakage budget 0.3 IΔn = {Ma(0.009)} (IEC 60364-5-53 §531.3.2) exceeded or at its limit. "
            + "Risk possible: likely from 0.5 IΔn, possible from 0.3 IΔn (engineering choice), each within the measurement uncertainty (2%+0.1mA) counted as reached. "
            + $"A typical type A device responds as to {Ma(0.012)} (each range weighted by the type's tripping factor, second figure).", n.Explanation);
    }

    [Theory]
    [InlineData(DeviceType.AC, 0.0008, false, "Smooth DC 0.800 mA within any significant smooth DC (≥ 1.00 mA) (type AC is specified for sinusoidal AC only (IEC 61008-1)): no blinding expected.")]
    [InlineData(DeviceType.AC, 0.002, true, "WARNING: the type AC device MAY NOT TRIP ON A REAL FAULT: smooth DC 2.00 mA exceeds any significant smooth DC (≥ 1.00 mA) (type AC is specified for sinusoidal AC only (IEC 61008-1)). Smooth DC pre-magnetises the device's core and can leave it unable to detect a fault current (IEC 62955 Note 2; practice).")]
    [InlineData(DeviceType.A, 0.005, false, "Smooth DC 5.00 mA within the 6.00 mA a type A device works with (IEC 61008-1 / IEC 61009-1): no blinding expected.")]
    [InlineData(DeviceType.F, 0.011, true, "WARNING: the type F device MAY NOT TRIP ON A REAL FAULT: smooth DC 11.0 mA exceeds the 10.0 mA a type F device works with (IEC 62423). Smooth DC pre-magnetises the device's core and can leave it unable to detect a fault current (IEC 62955 Note 2; practice).")]
    [InlineData(DeviceType.B, 0.013, true, "WARNING: the type B device MAY NOT TRIP ON A REAL FAULT: smooth DC 13.0 mA exceeds the 12.0 mA a type B device works with (IEC 62423). IEC 62423 specifies type B's tripping on an AC or pulsating fault current added to smooth DC only up to that level; beyond it tripping on such a fault is not specified (the DC alone trips a compliant device somewhere between 0.5 and 2 IΔn).")]
    public void Blinding_is_explained_per_type_with_its_tolerance_and_source(DeviceType type, double dcA, bool blinded, string text)
    {
        // Tolerances: AC none (any DC ≥ 1 mA), A 6 mA (IEC 61008-1), F 10 mA, B max(0.4 IΔn, 10 mA) = 12 mA on
        // 30 mA (IEC 62423).
        var b = Assess(new AnalysisBuilder().Sine(0.003).SmoothDc(dcA), type).Blinding;
        Assert.Equal(blinded, b.Blinded);
        Assert.Equal(text, b.Explanation);
    }

    [Fact]
    public void Blinding_is_open_when_dc_cannot_be_measured()
    {
        var b = Assess(new AnalysisBuilder().Coupling(Core.Capture.SensorCoupling.Ac).Sine(0.003).SmoothDc(0.008), DeviceType.A).Blinding;
        Assert.Null(b.Blinded);
        Assert.Equal($"Smooth DC cannot be determined with this sensor (seen: {Ma(0.008)}); whether it exceeds the {Ma(0.006)} a type A device works with is open. Measure with a DC-coupled clamp.", b.Explanation);
    }

    [Fact]
    public void The_charging_point_guidance_follows_the_6_ma_of_a_dc_detection_device()
    {
        const string Lead = "EV charging point (IEC 60364-7-722): its own RCD, at least type A, and protection against DC fault current whatever DC is measured: ";
        // Well above 6 mA: fit type B.
        var high = Assess(new AnalysisBuilder().Sine(0.003).SmoothDc(0.008), DeviceType.A, ev: true, rdcDd: true).EvCharging;
        Assert.True(high.DcAboveRdcDdThreshold);
        Assert.Equal(Lead + $"smooth DC {Ma(0.008)} reaches the {Ma(0.006)} at which a DC detection device disconnects (IEC 62955): fit type B; type A with an RDC-DD would disconnect the charger. The DC detection declared with the installed device will disconnect at this standing DC.", high.Recommendation);
        // 5.9 mA ± 0.218 mA: within the uncertainty of 6 mA, said so.
        var near = Assess(new AnalysisBuilder().Sine(0.003).SmoothDc(0.0059), ev: true).EvCharging;
        Assert.True(near.DcAboveRdcDdThreshold);
        Assert.Contains($"smooth DC {Ma(0.0059)} reaches (within the measurement uncertainty) the {Ma(0.006)}", near.Recommendation, StringComparison.Ordinal);
        Assert.DoesNotContain("declared with the installed device", near.Recommendation, StringComparison.Ordinal);
        // Below: type B or A with an RDC-DD.
        var low = Assess(new AnalysisBuilder().Sine(0.003).SmoothDc(0.002), ev: true, rdcDd: true).EvCharging;
        Assert.False(low.DcAboveRdcDdThreshold);
        Assert.Equal(Lead + $"type B, or type A with a {Ma(0.006)} DC detection device (RDC-DD, IEC 62955), unless the charging equipment provides that detection itself (its maker's declaration); smooth DC today {Ma(0.002)}, below {Ma(0.006)}.", low.Recommendation);
        // Not declared a charging point; DC not measurable.
        var open = Assess(new AnalysisBuilder().Coupling(Core.Capture.SensorCoupling.Ac).Sine(0.003)).EvCharging;
        Assert.Null(open.DcAboveRdcDdThreshold);
        Assert.Equal("Not declared an EV charging point; if it is one (IEC 60364-7-722): DC cannot be determined with this sensor: type B, or type A with an RDC-DD (IEC 62955).", open.Recommendation);
    }
}

