using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// <see cref="AssessmentOptions.Validate"/>: every range edge of every setting (just inside, at, just outside: the
/// adjacent doubles, so a comparison that slips from strict to inclusive fails), the exact message naming the setting,
/// and the defaults against the standards' values (REFERENCE.md rows named beside each check).
/// </summary>
/// <remarks>
/// The ranges themselves are the product's documented choice (docs of <see cref="AssessmentOptions"/>: currents 0 to
/// 100 A, IΔn, the RDC-DD threshold and the B+ limit above 0; fractions above 0 and at most 1; frequency factors at
/// least 1, ascending, at most 1000); the order rules follow the type hierarchy of IEC 60364-5-53 §531.3.3 (A below F)
/// and the risk scale (possible below likely).
/// </remarks>
public class AssessmentOptionsTests
{
    private const string CurrentFromZero = "a current from 0 to 100 A, such as 6mA";
    private const string CurrentAboveZero = "a current above 0 and up to 100 A, such as 30mA";
    private const string FractionRange = "a fraction above 0 and at most 1, such as 0.3";

    private const string FactorsExpected =
        "three multiples of IΔn at 150 Hz, 400 Hz and 1 kHz, each at least the one before and at least 1, such as 2.4,6,14";

    private static readonly double AboveZero = Math.BitIncrement(0.0);
    private static readonly double BelowZero = Math.BitDecrement(0.0);

    /// <summary>One setting at a value, with the settings it is ordered against moved out of the way, so that only
    /// the setting's own range check can refuse it.</summary>
    private static AssessmentOptions With(string setting, double v) => setting switch
    {
        nameof(AssessmentOptions.RatedResidualCurrentA) => new() { RatedResidualCurrentA = v },
        nameof(AssessmentOptions.DcThresholdA) => new() { DcThresholdA = v },
        nameof(AssessmentOptions.BelowMainsThresholdA) => new() { BelowMainsThresholdA = v },
        nameof(AssessmentOptions.HarmonicThresholdA) => new() { HarmonicThresholdA = v },
        nameof(AssessmentOptions.HighFrequencyThresholdA) => new() { HighFrequencyThresholdA = v },
        // A's tolerance may not exceed F's: F at the top of the range leaves A's own range to decide.
        nameof(AssessmentOptions.TypeASmoothDcToleranceA) => new() { TypeASmoothDcToleranceA = v, TypeFSmoothDcToleranceA = 100 },
        nameof(AssessmentOptions.TypeFSmoothDcToleranceA) => new() { TypeFSmoothDcToleranceA = v, TypeASmoothDcToleranceA = 0 },
        nameof(AssessmentOptions.RdcDdThresholdA) => new() { RdcDdThresholdA = v },
        nameof(AssessmentOptions.PulsatingShareThreshold) => new() { PulsatingShareThreshold = v },
        nameof(AssessmentOptions.LeakageBudgetFraction) => new() { LeakageBudgetFraction = v },
        // "possible" may not exceed "likely": each paired with the other's extreme.
        nameof(AssessmentOptions.PossibleRiskFraction) => new() { PossibleRiskFraction = v, LikelyRiskFraction = 1 },
        nameof(AssessmentOptions.LikelyRiskFraction) => new() { LikelyRiskFraction = v, PossibleRiskFraction = AboveZero },
        nameof(AssessmentOptions.BPlusUpperLimitA) => new() { BPlusUpperLimitA = v },
        _ => throw new ArgumentOutOfRangeException(nameof(setting), setting, "not a numeric setting"),
    };

    private static readonly string[] CurrentsFromZero =
    [
        nameof(AssessmentOptions.DcThresholdA), nameof(AssessmentOptions.BelowMainsThresholdA),
        nameof(AssessmentOptions.HarmonicThresholdA), nameof(AssessmentOptions.HighFrequencyThresholdA),
        nameof(AssessmentOptions.TypeASmoothDcToleranceA), nameof(AssessmentOptions.TypeFSmoothDcToleranceA),
    ];

    private static readonly string[] CurrentsAboveZero =
    [
        nameof(AssessmentOptions.RatedResidualCurrentA), nameof(AssessmentOptions.RdcDdThresholdA),
        nameof(AssessmentOptions.BPlusUpperLimitA),
    ];

    private static readonly string[] Fractions =
    [
        nameof(AssessmentOptions.PulsatingShareThreshold), nameof(AssessmentOptions.LeakageBudgetFraction),
        nameof(AssessmentOptions.PossibleRiskFraction), nameof(AssessmentOptions.LikelyRiskFraction),
    ];

    public static TheoryData<string, double> Accepted()
    {
        var data = new TheoryData<string, double>();
        foreach (var s in CurrentsFromZero)
        {
            foreach (var v in new[] { 0.0, AboveZero, Math.BitDecrement(100.0), 100.0 })
            {
                data.Add(s, v);
            }
        }

        foreach (var s in CurrentsAboveZero)
        {
            foreach (var v in new[] { AboveZero, Math.BitDecrement(100.0), 100.0 })
            {
                data.Add(s, v);
            }
        }

        foreach (var s in Fractions)
        {
            foreach (var v in new[] { AboveZero, Math.BitDecrement(1.0), 1.0 })
            {
                data.Add(s, v);
            }
        }

        return data;
    }

    public static TheoryData<string, double, string> Refused()
    {
        var data = new TheoryData<string, double, string>();
        var notFinite = new[] { double.NaN, double.PositiveInfinity, double.NegativeInfinity };
        foreach (var s in CurrentsFromZero)
        {
            foreach (var v in notFinite.Concat([BelowZero, Math.BitIncrement(100.0)]))
            {
                data.Add(s, v, CurrentFromZero);
            }
        }

        foreach (var s in CurrentsAboveZero)
        {
            foreach (var v in notFinite.Concat([BelowZero, 0.0, Math.BitIncrement(100.0)]))
            {
                data.Add(s, v, CurrentAboveZero);
            }
        }

        foreach (var s in Fractions)
        {
            foreach (var v in notFinite.Concat([BelowZero, 0.0, Math.BitIncrement(1.0)]))
            {
                data.Add(s, v, FractionRange);
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(Accepted))]
    public void Each_setting_is_accepted_at_and_just_inside_its_range_edges(string setting, double value)
    {
        With(setting, value).Validate();
    }

    [Theory]
    [MemberData(nameof(Refused))]
    public void Each_setting_just_outside_its_range_is_refused_naming_that_setting_and_its_range(string setting, double value, string expected)
    {
        var e = Assert.Throws<OptionValueException>(() => With(setting, value).Validate());
        Assert.Equal(setting, e.Option);
        Assert.Equal(expected, e.Expected);
        Assert.Equal(new[] { setting }, e.Settings);
    }

    [Theory]
    // The value as given, six significant digits, invariant culture; currents with their unit.
    [InlineData(nameof(AssessmentOptions.DcThresholdA), -0.0015, "DcThresholdA: cannot use '-0.0015 A': expected " + CurrentFromZero)]
    [InlineData(nameof(AssessmentOptions.HarmonicThresholdA), 100.5, "HarmonicThresholdA: cannot use '100.5 A': expected " + CurrentFromZero)]
    [InlineData(nameof(AssessmentOptions.RdcDdThresholdA), 0.0, "RdcDdThresholdA: cannot use '0 A': expected " + CurrentAboveZero)]
    [InlineData(nameof(AssessmentOptions.BPlusUpperLimitA), 123.456789, "BPlusUpperLimitA: cannot use '123.457 A': expected " + CurrentAboveZero)]
    [InlineData(nameof(AssessmentOptions.PulsatingShareThreshold), 1.25, "PulsatingShareThreshold: cannot use '1.25': expected " + FractionRange)]
    [InlineData(nameof(AssessmentOptions.LikelyRiskFraction), 0.0, "LikelyRiskFraction: cannot use '0': expected " + FractionRange)]
    public void The_message_names_the_setting_the_value_given_and_the_range(string setting, double value, string message)
    {
        var e = Assert.Throws<OptionValueException>(() => With(setting, value).Validate());
        Assert.Equal(message, e.Message);
    }

    [Fact]
    public void Defaults_are_the_standards_values_and_pass_their_own_check()
    {
        var o = new AssessmentOptions();
        // IΔn 30 mA: the additional-protection rating (IEC 60364-4-41 §415.1; REFERENCE "rated IΔn values in use", practice).
        Assert.Equal(0.030, o.RatedResidualCurrentA);
        Assert.Equal(Regime.Iec, o.Regime);
        // Every threshold left unset: Limits' value applies (the record's documented contract).
        Assert.Null(o.DcThresholdA);
        Assert.Null(o.TypeASmoothDcToleranceA);
        Assert.Null(o.TypeFSmoothDcToleranceA);
        Assert.Null(o.PossibleRiskFraction);
        Assert.Null(o.LikelyRiskFraction);
        Assert.Null(o.FrequencyFactor150Hz);
        Assert.Null(o.BPlusUpperLimitA);
        o.Validate();

        // REFERENCE "Device types": A works with 6 mA smooth DC (IEC 61008-1), F with 10 mA (IEC 62423), std.
        Assert.Equal(0.006, Limits.TypeASmoothDcToleranceA);
        Assert.Equal(0.010, Limits.TypeFSmoothDcToleranceA);
        // REFERENCE "Installation rules": RDC-DD disconnects at 6 mA smooth DC (IEC 62955), std; leakage budget
        // 0.3 IΔn (IEC 60364-5-53 §531.3.2), std.
        Assert.Equal(0.006, Limits.RdcDdThresholdA);
        Assert.Equal(0.3, Limits.LeakageBudgetFraction);
        // REFERENCE "Tripping ranges": non-operating current 0.5 IΔn (IEC 61008-1 Table 1), std: the "likely" boundary;
        // the budget 0.3 IΔn the "possible" one (engineering choice, Limits).
        Assert.Equal(0.5, Limits.LikelyRiskFraction);
        Assert.Equal(0.3, Limits.PossibleRiskFraction);
        // REFERENCE "Tripping ranges": IEC 62423 §5.3 upper limits 2.4 / 6 / 14 IΔn at 150 Hz / 400 Hz / 1 kHz, from memory.
        Assert.Equal(2.4, Limits.FrequencyFactor150Hz);
        Assert.Equal(6.0, Limits.FrequencyFactor400Hz);
        Assert.Equal(14.0, Limits.FrequencyFactor1kHz);
        // REFERENCE "Device types": B+ upper limit 420 mA up to 20 kHz (DIN VDE 0664-400), from memory.
        Assert.Equal(0.420, Limits.BPlusUpperLimitA);
    }

    // ---- Frequency factors: at least 1, ascending, at most 1000 ------------------------------------------------

    [Theory]
    // Against the defaults 2.4 / 6 / 14 (IEC 62423 §5.3, from memory): each edge of the chain, equal neighbours allowed.
    [InlineData(1.0, null, null)] // lowest 150 Hz factor
    [InlineData(6.0, null, null)] // 150 Hz equal to the default 400 Hz factor
    [InlineData(null, 2.4, null)] // 400 Hz equal to the default 150 Hz factor
    [InlineData(null, 14.0, null)] // 400 Hz equal to the default 1 kHz factor
    [InlineData(null, null, 6.0)] // 1 kHz equal to the default 400 Hz factor
    [InlineData(null, null, 1000.0)] // highest 1 kHz factor
    [InlineData(1.0, 1.0, 1.0)] // a flat response
    public void Frequency_factors_at_their_edges_are_accepted(double? f150, double? f400, double? f1k)
    {
        new AssessmentOptions { FrequencyFactor150Hz = f150, FrequencyFactor400Hz = f400, FrequencyFactor1kHz = f1k }.Validate();
    }

    public static TheoryData<double?, double?, double?> FactorsRefused() => new()
    {
        { Math.BitDecrement(1.0), 1.0, 1.0 }, // 150 Hz below 1
        { Math.BitIncrement(6.0), null, null }, // 150 Hz above the default 400 Hz factor 6
        { null, Math.BitDecrement(2.4), null }, // 400 Hz below the default 150 Hz factor 2.4
        { null, Math.BitIncrement(14.0), null }, // 400 Hz above the default 1 kHz factor 14
        { null, null, Math.BitDecrement(6.0) }, // 1 kHz below the default 400 Hz factor 6
        { null, null, Math.BitIncrement(1000.0) }, // 1 kHz above 1000
        { double.NaN, null, null },
        { null, double.NaN, null },
        { null, null, double.PositiveInfinity },
    };

    [Theory]
    [MemberData(nameof(FactorsRefused))]
    public void Frequency_factors_just_outside_their_edges_are_refused_under_the_first_factors_name(double? f150, double? f400, double? f1k)
    {
        var e = Assert.Throws<OptionValueException>(() =>
            new AssessmentOptions { FrequencyFactor150Hz = f150, FrequencyFactor400Hz = f400, FrequencyFactor1kHz = f1k }.Validate());
        Assert.Equal("FrequencyFactor150Hz", e.Option);
        Assert.Equal(FactorsExpected, e.Expected);
    }

    [Fact]
    public void Refused_frequency_factors_are_shown_as_the_three_values_in_force()
    {
        // One given, the two others the defaults 2.4 and 6 (IEC 62423 §5.3, from memory).
        var e = Assert.Throws<OptionValueException>(() => new AssessmentOptions { FrequencyFactor1kHz = 1000.5 }.Validate());
        Assert.Equal("FrequencyFactor150Hz: cannot use '2.4,6,1000.5': expected " + FactorsExpected, e.Message);
    }

    // ---- Type A's tolerance no greater than type F's (IEC 60364-5-53 §531.3.3: types ordered by capability) -----

    [Theory]
    [InlineData(0.010, null)] // A given equal to F's default 10 mA (IEC 62423)
    [InlineData(null, 0.006)] // F given equal to A's default 6 mA (IEC 61008-1)
    [InlineData(0.004, 0.004)]
    public void Type_a_tolerance_equal_to_type_fs_is_accepted(double? typeAA, double? typeFA)
    {
        new AssessmentOptions { TypeASmoothDcToleranceA = typeAA, TypeFSmoothDcToleranceA = typeFA }.Validate();
    }

    [Fact]
    public void Type_a_tolerance_above_fs_default_is_refused_naming_both_values()
    {
        // Just above F's default 10 mA (IEC 62423).
        Assert.Equal("TypeASmoothDcToleranceA", Assert.Throws<OptionValueException>(() =>
            new AssessmentOptions { TypeASmoothDcToleranceA = Math.BitIncrement(0.010) }.Validate()).Option);

        var e = Assert.Throws<OptionValueException>(() => new AssessmentOptions { TypeASmoothDcToleranceA = 0.015 }.Validate());
        Assert.Equal(
            "TypeASmoothDcToleranceA: cannot use '0.015 A': expected a tolerance no greater than type F's 0.01 A (types are ordered by capability)",
            e.Message);
    }

    [Fact]
    public void Type_fs_tolerance_given_below_as_default_is_refused_under_as_name_with_fs_value_given()
    {
        // F given 5 mA, below A's default 6 mA (IEC 61008-1): the message shows the values in force, not the defaults.
        Assert.Throws<OptionValueException>(() => new AssessmentOptions { TypeFSmoothDcToleranceA = Math.BitDecrement(0.006) }.Validate());
        var e = Assert.Throws<OptionValueException>(() => new AssessmentOptions { TypeFSmoothDcToleranceA = 0.005 }.Validate());
        Assert.Equal(
            "TypeASmoothDcToleranceA: cannot use '0.006 A': expected a tolerance no greater than type F's 0.005 A (types are ordered by capability)",
            e.Message);

        var both = Assert.Throws<OptionValueException>(() =>
            new AssessmentOptions { TypeASmoothDcToleranceA = 0.0045, TypeFSmoothDcToleranceA = 0.004 }.Validate());
        Assert.Equal(
            "TypeASmoothDcToleranceA: cannot use '0.0045 A': expected a tolerance no greater than type F's 0.004 A (types are ordered by capability)",
            both.Message);
    }

    // ---- "possible" no greater than "likely" -------------------------------------------------------------------

    [Theory]
    [InlineData(0.5, null)] // possible equal to the default likely 0.5 (IEC 61008-1 non-operating 0.5 IΔn)
    [InlineData(null, 0.3)] // likely equal to the default possible 0.3 (IEC 60364-5-53 §531.3.2)
    [InlineData(0.4, 0.4)]
    public void Risk_boundaries_equal_to_each_other_are_accepted(double? possible, double? likely)
    {
        new AssessmentOptions { PossibleRiskFraction = possible, LikelyRiskFraction = likely }.Validate();
    }

    [Fact]
    public void Possible_above_likely_is_refused_under_the_possible_boundary_naming_likely_in_force()
    {
        Assert.Equal("PossibleRiskFraction", Assert.Throws<OptionValueException>(() =>
            new AssessmentOptions { PossibleRiskFraction = Math.BitIncrement(0.5) }.Validate()).Option);

        var e = Assert.Throws<OptionValueException>(() => new AssessmentOptions { PossibleRiskFraction = 0.6 }.Validate());
        Assert.Equal("PossibleRiskFraction: cannot use '0.6': expected a fraction of IΔn no greater than the 'likely' boundary 0.5", e.Message);

        var both = Assert.Throws<OptionValueException>(() =>
            new AssessmentOptions { PossibleRiskFraction = 0.4, LikelyRiskFraction = 0.35 }.Validate());
        Assert.Equal("PossibleRiskFraction: cannot use '0.4': expected a fraction of IΔn no greater than the 'likely' boundary 0.35", both.Message);
    }

    [Fact]
    public void Likely_given_below_the_default_possible_is_refused_under_the_likely_boundary()
    {
        // Only "likely" was given, so it is the one to name; the default "possible" is 0.3 (IEC 60364-5-53 §531.3.2).
        Assert.Equal("LikelyRiskFraction", Assert.Throws<OptionValueException>(() =>
            new AssessmentOptions { LikelyRiskFraction = Math.BitDecrement(0.3) }.Validate()).Option);

        var e = Assert.Throws<OptionValueException>(() => new AssessmentOptions { LikelyRiskFraction = 0.2 }.Validate());
        Assert.Equal("LikelyRiskFraction: cannot use '0.2': expected a fraction of IΔn no smaller than the 'possible' boundary 0.3", e.Message);
    }
}
