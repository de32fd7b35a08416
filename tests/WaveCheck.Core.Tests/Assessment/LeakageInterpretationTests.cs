using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The insulation finding and the R-C fit's verdict on constructed splits. Expected currents by Ohm's law
/// (REFERENCE.md "Insulation": I_R = U / R, so the current a 1 MΩ minimum draws at 230 V is 0.23 mA); the minimum
/// 1 MΩ is IEC 60364-6 as REFERENCE.md states it (from memory); the uncertainty is the default accuracy (2 % of
/// reading + 0.1 mA, MeasurementAccuracy.Default, engineering choice) plus the share |I| sin δ of the whole current
/// that a phase error δ = 2° (Limits.LeakagePhaseUncertaintyDeg, engineering choice) turns into the in-phase part
/// (phasor geometry: rotating I by δ moves its projection by at most |I| sin δ to first order). Whole currents are
/// chosen as Pythagorean triples so that |I| = √(I_R² + I_C²) is exact.
/// </summary>
public class LeakageInterpretationTests
{
    private const string Test = "to be confirmed with an insulation resistance tester, the circuit isolated and its loads disconnected, by a qualified person";
    private const string Note = "(a leakage at operating voltage with loads connected is not the insulation test of IEC 60364-6; heating elements, surge protective devices and filter resistors also draw resistive current)";
    private const string ShortTest = "to be confirmed with an insulation resistance tester, the circuit isolated, by a qualified person";

    // sin 2° (the default phase uncertainty), by the library's sine: the product and the test share it.
    private static readonly double Sin2Deg = Math.Sin(2 * Math.PI / 180);

    private static MetricStatistics Stat(double value) => new(value, value, value, 0);

    private static LeakageSplitResult Split(double voltageV, double? leastOhm, double resistiveMaxA, double capacitiveMaxA,
        int windows = 5, RcFitResult? fit = null, IReadOnlyList<string>? notes = null) => new()
        {
            Kind = "single-phase",
            VoltageChannels = ["U1"],
            Windows = windows,
            WindowsWithoutVoltage = 0,
            MinimumVoltageV = 10,
            VoltageRmsV = voltageV,
            FrequencyHz = 50,
            ResistiveA = Stat(resistiveMaxA),
            CapacitiveA = Stat(capacitiveMaxA),
            ResistanceOhm = leastOhm,
            LeastResistanceOhm = leastOhm,
            CapacitanceF = Stat(capacitiveMaxA / (2 * Math.PI * 50 * voltageV)),
            Fit = fit,
            Phasors = [],
            Trend = [],
            Notes = notes ?? [],
        };

    private static RcFitResult Fit(double residualP95, int windowsTested) =>
        new(1e6, 1e-8, new MetricStatistics(residualP95 / 2, residualP95, residualP95, 0), windowsTested, [1, 3, 5], null, null);

    [Fact]
    public void A_resistance_well_below_the_minimum_is_a_possible_insulation_fault()
    {
        // 230 V across 230 kΩ: I_R = 1 mA (Ohm's law); the minimum's current 230 V / 1 MΩ = 0.23 mA.
        // Whole current √(1² + 0.75²) = 1.25 mA (3-4-5); uncertainty 0.02 × 1 mA + 0.1 mA + 1.25 mA × sin 2° = 0.1636 mA,
        // so 1 − 0.1636 mA is still above 0.23 mA.
        var split = LeakageInterpretation.Interpret(Split(230, 230e3, 1e-3, 0.75e-3), MeasurementAccuracy.Default);
        var f = split.Insulation!;
        Assert.Equal(InsulationState.BelowMinimum, f.State);
        Assert.Equal(230e3, f.ResistanceOhm);
        Assert.Equal(1e6, f.MinimumOhm);
        Assert.Equal(0.23e-3, f.ResistiveLimitA, 15);
        Assert.Equal((0.02 * 1e-3) + 1e-4 + (1.25e-3 * Sin2Deg), f.UncertaintyA, 15);
        // The finding's wording is the product (what a person reads and does).
        Assert.Equal("POSSIBLE INSULATION FAULT: the resistive leakage (1.00 mA at 230 V, the worst window) means a leakage "
            + "resistance of 230 kΩ, below the 1 MΩ minimum insulation resistance of IEC 60364-6 (from memory) even counting "
            + $"±0.164 mA; {Test} {Note}.", f.Message);
        Assert.Equal($"POSSIBLE INSULATION FAULT: leakage resistance 230 kΩ (worst window), below the 1 MΩ minimum of IEC 60364-6 (from memory); {ShortTest}.",
            f.Summary);
        Assert.Equal(f.Message, split.Notes[^1]);
    }

    [Fact]
    public void A_resistance_well_above_the_minimum_is_no_sign_of_a_fault()
    {
        // 230 V across 2.3 MΩ: I_R = 0.1 mA (Ohm's law). Whole current √(0.1² + 0.24²) = 0.26 mA (5-12-13);
        // uncertainty 0.02 × 0.1 + 0.1 + 0.26 × sin 2° = 0.1111 mA; 0.1 + 0.1111 = 0.2111 mA < 0.23 mA.
        var f = LeakageInterpretation.Interpret(Split(230, 2.3e6, 0.1e-3, 0.24e-3), MeasurementAccuracy.Default).Insulation!;
        Assert.Equal(InsulationState.AboveMinimum, f.State);
        Assert.Equal(2.3e6, f.ResistanceOhm);
        Assert.Equal(0.23e-3, f.ResistiveLimitA, 15);
        Assert.Equal((0.02 * 0.1e-3) + 1e-4 + (0.26e-3 * Sin2Deg), f.UncertaintyA, 15);
        Assert.Equal("Insulation: the resistive leakage (0.100 mA at 230 V) stays below the 0.230 mA a 1 MΩ insulation "
            + "resistance would draw, even counting ±0.111 mA: no sign of an insulation fault in this capture.", f.Message);
        Assert.Equal(f.Message, f.Summary);
    }

    [Fact]
    public void A_resistance_at_the_minimum_within_the_uncertainty_is_resolved_to_the_safe_side()
    {
        // 230 V across exactly 1 MΩ: I_R = 0.23 mA, the minimum's own current. Whole current 0.23 mA (no capacitive
        // part); uncertainty 0.02 × 0.23 + 0.1 + 0.23 × sin 2° = 0.1126 mA either side.
        var f = LeakageInterpretation.Interpret(Split(230, 1e6, 0.23e-3, 0), MeasurementAccuracy.Default).Insulation!;
        Assert.Equal(InsulationState.AtLimit, f.State);
        Assert.Equal((0.02 * 0.23e-3) + 1e-4 + (0.23e-3 * Sin2Deg), f.UncertaintyA, 15);
        Assert.Equal("Insulation cannot be ruled out: the resistive leakage (0.230 mA at 230 V, leakage resistance 1 MΩ) is "
            + "within its uncertainty (±0.113 mA: the clamp's accuracy and a 2° phase error on the whole current) of the "
            + "0.230 mA a 1 MΩ insulation resistance would draw; resolved to the safe side: a possible insulation fault, "
            + $"{Test} {Note}.", f.Message);
        Assert.Equal($"POSSIBLE INSULATION FAULT (at the limit, safe side): leakage resistance 1 MΩ against the 1 MΩ minimum of IEC 60364-6 (from memory); {ShortTest}.",
            f.Summary);
    }

    [Fact]
    public void Without_a_resistive_part_a_large_capacitive_current_alone_can_leave_the_finding_at_the_limit()
    {
        // No positive resistive part: I_R counted as 0. A 5 mA capacitive current with a 2° phase error can hide
        // 5 mA × sin 2° = 0.1745 mA of resistive current, + 0.1 mA offset = 0.2745 mA ≥ 0.23 mA: not ruled out.
        var f = LeakageInterpretation.Interpret(Split(230, null, 0, 5e-3), MeasurementAccuracy.Default).Insulation!;
        Assert.Equal(InsulationState.AtLimit, f.State);
        Assert.Null(f.ResistanceOhm);
        Assert.Equal(1e-4 + (5e-3 * Sin2Deg), f.UncertaintyA, 15);
        Assert.StartsWith("Insulation cannot be ruled out: the resistive leakage (0.000 mA at 230 V, leakage resistance no resistive part)",
            f.Message, StringComparison.Ordinal);
        Assert.Contains("leakage resistance no resistive part against the 1 MΩ minimum", f.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void Exactly_at_the_minimum_with_a_perfect_measurement_counts_as_below_it()
    {
        // No uncertainty (0 % + 0 mA, no phase error): I_R = U / R equals U / R_min exactly when R = R_min, and the
        // rule reads "the lower bound reaches the limit" as a fault, like MeasurementAccuracy.Compare's "above".
        var perfect = new MeasurementAccuracy(0, 0);
        var f = LeakageInterpretation.Interpret(Split(230, 1e6, 0.23e-3, 0), perfect, phaseUncertaintyDeg: 0).Insulation!;
        Assert.Equal(0, f.UncertaintyA);
        Assert.Equal(InsulationState.BelowMinimum, f.State);
    }

    [Fact]
    public void An_upper_bound_exactly_at_the_limit_is_not_ruled_out()
    {
        // 100 V: the minimum's current 100 V / 1 MΩ = 0.1 mA; R = 2 MΩ draws 0.05 mA (Ohm's law). A fixed
        // uncertainty of exactly 0.05 mA brings the upper bound to 0.1 mA, the limit itself (halving is exact in
        // binary, so the sum is exact): that is "cannot be ruled out", not "above the minimum".
        var offsetA = 100.0 / 2e6;
        var f = LeakageInterpretation.Interpret(Split(100, 2e6, offsetA, 0), new MeasurementAccuracy(0, offsetA),
            phaseUncertaintyDeg: 0).Insulation!;
        Assert.Equal(100.0 / 1e6, f.ResistiveLimitA);
        Assert.Equal(InsulationState.AtLimit, f.State);
    }

    [Fact]
    public void The_minimum_is_a_parameter()
    {
        // 0.5 MΩ, IEC 60364-6's SELV/PELV minimum as REFERENCE.md states it (from memory): 230 V / 0.5 MΩ = 0.46 mA.
        var f = LeakageInterpretation.Interpret(Split(230, 2.3e6, 0.1e-3, 0.24e-3), MeasurementAccuracy.Default, minimumOhm: 0.5e6)
            .Insulation!;
        Assert.Equal(0.46e-3, f.ResistiveLimitA, 15);
        Assert.Equal(0.5e6, f.MinimumOhm);
    }

    [Theory]
    [InlineData(0, 230.0)] // no window split
    [InlineData(5, 0.0)] // windows, but no voltage
    [InlineData(5, double.NaN)]
    public void Without_windows_or_voltage_there_is_no_finding(int windows, double voltageV)
    {
        var split = LeakageInterpretation.Interpret(Split(voltageV, 230e3, 1e-3, 0, windows), MeasurementAccuracy.Default);
        var f = split.Insulation!;
        Assert.Equal(InsulationState.NotResolved, f.State);
        Assert.Null(f.ResistanceOhm);
        Assert.True(double.IsNaN(f.ResistiveLimitA));
        Assert.True(double.IsNaN(f.UncertaintyA));
        Assert.Equal("No insulation finding: no window had a usable voltage.", f.Message);
        Assert.Equal(new[] { "No insulation finding: no window had a usable voltage." }, split.Notes);
    }

    [Fact]
    public void The_fit_is_judged_against_its_limit_and_says_so()
    {
        // Limit 20 % (Limits.LeakageFitResidualLimit, engineering choice). 12.5 % at the 95th percentile: simple R-C.
        var within = LeakageInterpretation.Interpret(Split(230, 2.3e6, 0.1e-3, 0.24e-3, fit: Fit(0.125, 4), notes: ["earlier"]),
            MeasurementAccuracy.Default);
        Assert.True(within.Fit!.SimpleRc);
        Assert.Equal(0.2, within.Fit.ResidualLimit);
        Assert.Equal(3, within.Notes.Count); // the split's own note, the fit's, the insulation finding's, in that order
        Assert.Equal("earlier", within.Notes[0]);
        Assert.Equal("The harmonic currents follow the voltage's harmonics as an R ∥ C leakage would (fit residual 12.5 % at "
            + "the 95th percentile, limit 20 %, engineering choice).", within.Notes[1]);
        Assert.Equal(within.Insulation!.Message, within.Notes[2]);

        // 35 %: not a simple R-C leakage.
        var beyond = LeakageInterpretation.Interpret(Split(230, 2.3e6, 0.1e-3, 0.24e-3, fit: Fit(0.35, 4)), MeasurementAccuracy.Default);
        Assert.False(beyond.Fit!.SimpleRc);
        Assert.Equal("Not a simple R-C leakage: the harmonic currents do not follow I_n = V_n (G + jnωC) (fit residual 35 % at "
            + "the 95th percentile, above the 20 % limit, engineering choice). Part of the residual current comes from a "
            + "load's own leakage (a rectifier, a converter), so R and C are equivalent figures at the fundamental, not "
            + "components.", beyond.Notes[0]);
    }

    [Fact]
    public void A_residual_exactly_at_the_limit_is_still_a_simple_leakage()
    {
        // "Above the limit" is strict: 20 % against 20 %.
        var split = LeakageInterpretation.Interpret(Split(230, 2.3e6, 0.1e-3, 0.24e-3, fit: Fit(0.2, 4)), MeasurementAccuracy.Default,
            residualLimit: 0.2);
        Assert.True(split.Fit!.SimpleRc);
    }

    [Fact]
    public void A_fit_no_window_tested_leaves_the_model_untested()
    {
        // A sine voltage: one order per window, an exact fit that tests nothing (WindowsTested = 0).
        var split = LeakageInterpretation.Interpret(Split(230, 2.3e6, 0.1e-3, 0.24e-3, fit: Fit(0.9, 0)), MeasurementAccuracy.Default);
        Assert.Null(split.Fit!.SimpleRc);
        Assert.Equal(0.2, split.Fit.ResidualLimit);
        Assert.Equal("The voltage carries no significant harmonic with a current beside it: R and C come from the fundamental "
            + "alone, and the R-C model is not tested.", split.Notes[0]);
    }

    [Fact]
    public void Without_a_fit_only_the_insulation_finding_is_added()
    {
        // Three-phase splits carry no fit.
        var split = LeakageInterpretation.Interpret(Split(230, 2.3e6, 0.1e-3, 0.24e-3), MeasurementAccuracy.Default);
        Assert.Null(split.Fit);
        Assert.Equal(new[] { split.Insulation!.Message }, split.Notes);
    }

    [Fact]
    public void Missing_arguments_are_refused()
    {
        Assert.Equal("split", Assert.Throws<ArgumentNullException>(() => LeakageInterpretation.Interpret(null!, MeasurementAccuracy.Default)).ParamName);
        Assert.Equal("accuracy", Assert.Throws<ArgumentNullException>(() => LeakageInterpretation.Interpret(Split(230, 1e6, 0.23e-3, 0), null!)).ParamName);
    }
}
