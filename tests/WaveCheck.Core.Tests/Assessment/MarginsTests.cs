using WaveCheck.Core.Results;
using WaveCheck.Core.Assessment;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>Nuisance-trip margins against hand calculations (IEC 61008-1 0.5 IΔn; IEC 60364-5-53 §531.3.2 0.3 IΔn).</summary>
public class MarginsTests
{
    private static Core.Results.NuisanceTripResult Nuisance(AnalysisBuilder b, DeviceType type, double ratedA = 0.030) =>
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
        Assert.Equal("B", r.NuisanceTrip.DeviceType);
        Assert.Equal("B", r.Blinding.DeviceType);
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
        Assert.Contains("--frequency-factors", ex.Message, StringComparison.Ordinal);
    }
}
