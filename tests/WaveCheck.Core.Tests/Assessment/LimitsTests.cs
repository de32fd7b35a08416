using WaveCheck.Core.Assessment;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The limits the verdicts use, each against the value in the project's reference table (REFERENCE.md), with the row's
/// source and status named; and the check that a typed rating is one in use.
/// </summary>
public class LimitsTests
{
    [Fact]
    public void Device_type_and_installation_limits_are_the_standards_values()
    {
        // REFERENCE "Tripping ranges and times": non-operating current 0.5 IΔn (IEC 61008-1 / IEC 61009-1 Table 1, std).
        Assert.Equal(0.5, Limits.NonOperatingFraction);
        // REFERENCE "Installation rules": leakage budget 0.3 IΔn (IEC 60364-5-53:2015 §531.3.2, std).
        Assert.Equal(0.3, Limits.LeakageBudgetFraction);
        // Nuisance-risk boundaries are those two limits (engineering choice, Limits).
        Assert.Equal(Limits.NonOperatingFraction, Limits.LikelyRiskFraction);
        Assert.Equal(Limits.LeakageBudgetFraction, Limits.PossibleRiskFraction);
        // REFERENCE "Device types": A works with 6 mA smooth DC (IEC 61008-1, std), F with 10 mA (IEC 62423, std),
        // B with max(0.4 IΔn, 10 mA) (IEC 62423, std).
        Assert.Equal(0.006, Limits.TypeASmoothDcToleranceA);
        Assert.Equal(0.010, Limits.TypeFSmoothDcToleranceA);
        Assert.Equal(0.4, Limits.TypeBSmoothDcToleranceFraction);
        Assert.Equal(0.010, Limits.TypeBSmoothDcToleranceMinA);
        // REFERENCE "Installation rules": RDC-DD disconnects at smooth DC ≥ 6 mA (IEC 62955, std).
        Assert.Equal(0.006, Limits.RdcDdThresholdA);
        // REFERENCE "Tripping ranges": B at other frequencies 2.4 / 6 / 14 IΔn at 150 Hz / 400 Hz / 1 kHz
        // (IEC 62423 §5.3, mem); B smooth DC up to 2 IΔn (std); A half-wave up to 1.4 IΔn (IEC 61008-1, std).
        Assert.Equal(2.4, Limits.FrequencyFactor150Hz);
        Assert.Equal(6.0, Limits.FrequencyFactor400Hz);
        Assert.Equal(14.0, Limits.FrequencyFactor1kHz);
        Assert.Equal(2.0, Limits.TypeBSmoothDcFactor);
        Assert.Equal(1.4, Limits.PulsatingDcFactor);
        // REFERENCE "Device types": B+ 420 mA up to 20 kHz (DIN VDE 0664-400; 420 mA mem, 20 kHz std); B to 1 kHz (IEC 62423, std).
        Assert.Equal(0.420, Limits.BPlusUpperLimitA);
        Assert.Equal(20_000, Limits.BPlusUpperFrequencyHz);
        Assert.Equal(1_000, Limits.TypeBUpperFrequencyHz);
        // Nyquist for 20 kHz (closed form: fs ≥ 2 f).
        Assert.Equal(40_000, Limits.BPlusMinimumSampleRateHz);
        // REFERENCE "Installation rules" / IEC 60364-4-41 §415.1: additional protection by IΔn ≤ 30 mA (std).
        Assert.Equal(0.030, Limits.AdditionalProtectionMaxA);
        Assert.Equal(0.030, Limits.DefaultRatedResidualCurrentA);
    }

    [Fact]
    public void Type_b_smooth_dc_tolerance_is_the_higher_of_its_two_terms()
    {
        // IEC 62423 type B: "0.4 IΔn or 10 mA, whichever is higher" (REFERENCE "Device types", std); the terms meet at 25 mA.
        Assert.Equal(0.010, Limits.TypeBSmoothDcToleranceA(0.010));
        Assert.Equal(0.010, Limits.TypeBSmoothDcToleranceA(0.025), 1e-15);
        Assert.Equal(0.012, Limits.TypeBSmoothDcToleranceA(0.030), 1e-15);
        Assert.Equal(0.200, Limits.TypeBSmoothDcToleranceA(0.500), 1e-15);
    }

    [Fact]
    public void Break_and_non_actuating_times_are_the_standards_tables()
    {
        // REFERENCE "Tripping ranges and times" (std): general 300 / 150 / 40 ms at 1 / 2 / 5 IΔn; S break 500 / 200 /
        // 150 ms, non-actuating 130 / 60 / 50 ms (IEC 61008-1 / IEC 61009-1); smooth DC 300 / 150 / 40 ms at
        // 2 / 4 / 10 IΔn (IEC 62423).
        Assert.Equal([(1.0, 0.300), (2.0, 0.150), (5.0, 0.040)], Limits.GeneralBreakTimes);
        Assert.Equal([(1.0, 0.500), (2.0, 0.200), (5.0, 0.150)], Limits.TimeDelayedBreakTimes);
        Assert.Equal([(1.0, 0.130), (2.0, 0.060), (5.0, 0.050)], Limits.TimeDelayedNonActuatingTimes);
        Assert.Equal([(2.0, 0.300), (4.0, 0.150), (10.0, 0.040)], Limits.DcBreakTimes);
    }

    [Fact]
    public void Gfci_limits_are_ul_943s()
    {
        // REFERENCE "North American GFCIs" (std): Class A trips at ≥ 6 mA, not below 4 mA; T = (20 / I)^1.43 s for
        // 6 to 264 mA (UL 943); special purpose 15 to 20 mA (UL 943C).
        Assert.Equal(0.006, Limits.GfciClassAMustTripA);
        Assert.Equal(0.004, Limits.GfciClassAMustNotTripA);
        Assert.Equal(0.020, Limits.GfciTripTimeReferenceA);
        Assert.Equal(1.43, Limits.GfciTripTimeExponent);
        Assert.Equal(0.264, Limits.GfciTripTimeMaxA);
        Assert.Equal(0.015, Limits.GfciSpecialPurposeLowA);
        Assert.Equal(0.020, Limits.GfciSpecialPurposeTripA);
    }

    [Fact]
    public void Ratings_in_use_are_the_reference_list()
    {
        // REFERENCE "rated IΔn values in use": 10, 30, 100, 300, 500 mA, 1 A for some (practice); 6 mA from memory.
        Assert.Equal([0.006, 0.010, 0.030, 0.100, 0.300, 0.500, 1.0], Limits.RatedResidualCurrentsInUseA);
        Assert.Equal([0.010, 0.030, 0.100, 0.300, 0.500], Limits.RatingsInUseA);
    }

    [Theory]
    // Each rating in use, and each within 0.1 % (a value typed in another unit and rounded: 0.02999 A, 30.02 mA).
    [InlineData(0.006, true)]
    [InlineData(0.010, true)]
    [InlineData(0.030, true)]
    [InlineData(0.100, true)]
    [InlineData(0.300, true)]
    [InlineData(0.500, true)]
    [InlineData(1.0, true)]
    [InlineData(0.02999, true)]
    [InlineData(0.03002, true)]
    [InlineData(0.9995, true)]
    // Off the list: between two ratings, 0.2 % off one, a unit slip of a thousand either way.
    [InlineData(0.050, false)]
    [InlineData(0.025, false)]
    [InlineData(0.03006, false)]
    [InlineData(0.02994, false)]
    [InlineData(0.9979, false)]
    [InlineData(0.000030, false)]
    [InlineData(30.0, false)]
    [InlineData(0.0, false)]
    public void A_rating_is_in_use_within_a_tenth_of_a_percent(double ratedA, bool inUse)
    {
        Assert.Equal(inUse, Limits.IsRatingInUse(ratedA));
    }
}
