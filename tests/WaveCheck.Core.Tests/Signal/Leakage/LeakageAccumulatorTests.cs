using System.Numerics;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="LeakageAccumulator"/> fed window splits built directly (as <see cref="LeakageWindowMeasurement"/> hands
/// them on), checked against the definitions of the figures in docs/methods.md §I.7 and LeakageSplitResult's doc
/// comments: means, maxima and 95th percentiles over windows (numpy 1.24 percentile, linear), the resistance from the
/// mean conductance, the least resistance and its time, the mean phasors, the three-phase location, the trend.
/// </summary>
public class LeakageAccumulatorTests
{
    private const double MainsHz = 50;

    private static readonly string[] Single = ["U1"];
    private static readonly string[] Three = ["L1", "L2", "L3"];

    private static WindowLeakage SinglePhase(double startS, double resistiveA = 1e-3, double capacitiveA = 2e-3,
        double conductanceS = 1e-6, double capacitanceF = 20e-9, double voltageRmsV = 230, double frequencyHz = MainsHz) => new()
        {
            Valid = true,
            StartS = startS,
            FrequencyHz = frequencyHz,
            VoltageRmsV = voltageRmsV,
            ResistiveA = resistiveA,
            CapacitiveA = capacitiveA,
            ConductanceS = conductanceS,
            CapacitanceF = capacitanceF,
            CurrentReferredA = new Complex(resistiveA, capacitiveA),
            Fit = new RcFit(conductanceS, capacitanceF, 0, 1),
            FitOrderMask = 1 << 1,
        };

    /// <summary>A three-phase window on voltages of 230 V, L2 and L3 at −120° and +120° from L1 (balanced).</summary>
    private static WindowLeakage ThreePhase(double startS, LeakageDirection first, LeakageDirection second,
        double v1 = 230, double v2 = 230, double v3 = 230) => new()
        {
            Valid = true,
            StartS = startS,
            FrequencyHz = MainsHz,
            VoltageRmsV = (v1 + v2 + v3) / 3,
            ResistiveA = (first.Capacitive ? 0 : first.CurrentA) + (second.Capacitive ? 0 : second.CurrentA),
            CapacitiveA = (first.Capacitive ? first.CurrentA : 0) + (second.Capacitive ? second.CurrentA : 0),
            Voltage2V = Complex.FromPolarCoordinates(v2, -2 * Math.PI / 3),
            Voltage3V = Complex.FromPolarCoordinates(v3, 2 * Math.PI / 3),
            First = first,
            Second = second,
        };

    private static LeakageSplitResult Fold(IReadOnlyList<string> names, params WindowLeakage[] windows)
    {
        var accumulator = new LeakageAccumulator(names);
        foreach (var w in windows)
        {
            accumulator.Add(w);
        }

        return accumulator.Result();
    }

    [Fact]
    public void Signed_figures_keep_mean_the_largest_magnitude_with_its_sign_and_time_and_its_95th_percentile()
    {
        // LeakageSplitResult: I_R, I_C and C are signed; MetricStatistics of a signed metric: max = the value of
        // largest magnitude (with its sign), P95 over magnitudes carrying that sign. Reference: numpy 1.24,
        // mean and percentile(|x|, 95): I_R (1, 3, 2, −4) mA → mean 0.5 mA, P95 3.85 mA; I_C (−5, 1, 2, 3) mA → mean
        // 0.25 mA, P95 4.7 mA; C (2, −7, 1, 4) nF → mean 0, P95 6.55 nF.
        var split = Fold(Single,
            SinglePhase(0.0, 1e-3, -5e-3, capacitanceF: 2e-9),
            SinglePhase(0.2, 3e-3, 1e-3, capacitanceF: -7e-9),
            SinglePhase(0.4, 2e-3, 2e-3, capacitanceF: 1e-9),
            SinglePhase(0.6, -4e-3, 3e-3, capacitanceF: 4e-9));

        Assert.Equal(0.0005, split.ResistiveA.Mean, 1e-18);
        Assert.Equal(-0.00385, split.ResistiveA.P95, 1e-17);
        Assert.Equal(-4e-3, split.ResistiveA.Max);
        Assert.Equal(0.6, split.ResistiveA.TimeOfMaxS);
        Assert.Equal(0.00025, split.CapacitiveA.Mean, 1e-18);
        Assert.Equal(-0.0047, split.CapacitiveA.P95, 1e-17);
        Assert.Equal(-5e-3, split.CapacitiveA.Max);
        Assert.Equal(0.0, split.CapacitiveA.TimeOfMaxS);
        Assert.Equal(0.0, split.CapacitanceF.Mean, 1e-24);
        Assert.Equal(-6.55e-9, split.CapacitanceF.P95, 1e-23);
        Assert.Equal(-7e-9, split.CapacitanceF.Max);
        Assert.Equal(0.2, split.CapacitanceF.TimeOfMaxS);
    }

    [Fact]
    public void Voltage_frequency_and_resistance_are_means_over_windows_and_the_least_resistance_is_the_first_largest_conductance()
    {
        // LeakageSplitResult: VoltageRmsV and FrequencyHz are means over windows (closed form: (230 + 240)/2... over
        // four windows); R = 1 / mean G (docs/methods.md §I.7, REFERENCE.md "Insulation": R = U / I_R); the least R
        // is 1 / the largest window G, at that window's start; of two equal G the first (its window is where R was
        // first reached; common practice, no source).
        var split = Fold(Single,
            SinglePhase(0.0, conductanceS: 1e-6, voltageRmsV: 230, frequencyHz: 49.9),
            SinglePhase(0.2, conductanceS: 4e-6, voltageRmsV: 240, frequencyHz: 50.1),
            SinglePhase(0.4, conductanceS: 4e-6, voltageRmsV: 220, frequencyHz: 50.0),
            SinglePhase(0.6, conductanceS: 3e-6, voltageRmsV: 230, frequencyHz: 50.0));

        Assert.Equal(4, split.Windows);
        Assert.Equal(230, split.VoltageRmsV, 1e-12);
        Assert.Equal(50, split.FrequencyHz, 1e-12);
        Assert.Equal(1 / 3e-6, split.ResistanceOhm!.Value, 1e-6);
        Assert.Equal(1 / 4e-6, split.LeastResistanceOhm!.Value, 1e-6);
        Assert.Equal(0.2, split.LeastResistanceTimeS);
        Assert.Equal(20, split.MinimumVoltageV);
        Assert.Equal("single-phase", split.Kind);
        Assert.Equal(Single, split.VoltageChannels);
    }

    [Theory]
    [InlineData(0.0, -1e-6)] // no window with a positive G: no least R; the mean is negative: no R
    [InlineData(-1e-6, 0.0)]
    [InlineData(-2e-6, -1e-6)]
    public void Without_a_positive_conductance_there_is_no_resistance(double g1, double g2)
    {
        // LeakageSplitResult: ResistanceOhm null when the resistive part is not positive, LeastResistanceOhm null
        // when no window has a positive resistive part (and then no time).
        var split = Fold(Single, SinglePhase(0, conductanceS: g1), SinglePhase(0.2, conductanceS: g2));

        Assert.Null(split.ResistanceOhm);
        Assert.Null(split.LeastResistanceOhm);
        Assert.Null(split.LeastResistanceTimeS);
    }

    [Fact]
    public void A_mean_conductance_of_exactly_zero_gives_no_resistance()
    {
        // ±1 µS: mean exactly 0 (closed form), "null when the resistive part is not positive"; the positive window
        // still gives the least R = 1 MΩ at its start.
        var split = Fold(Single, SinglePhase(0, conductanceS: -1e-6), SinglePhase(0.2, conductanceS: 1e-6));

        Assert.Null(split.ResistanceOhm);
        Assert.Equal(1e6, split.LeastResistanceOhm!.Value, 1e-6);
        Assert.Equal(0.2, split.LeastResistanceTimeS);
    }

    [Fact]
    public void Single_phase_phasors_are_the_mean_current_and_its_two_parts()
    {
        // Mean of (1 + 2j) mA and (3 + 0j) mA = (2 + 1j) mA (closed form): |I| = √5 mA at atan2(1, 2) = 26.565...°,
        // I_R = 2 mA at 0°, I_C = 1 mA at 90° (leading); U at the mean voltage, 0° (the reference). LeakageSplitResult
        // "Mean phasors over windows, angles referred to the first voltage"; the voltage named after its channel.
        var split = Fold(Single, SinglePhase(0, 1e-3, 2e-3, voltageRmsV: 228), SinglePhase(0.2, 3e-3, 0, voltageRmsV: 232));

        Assert.Equal(4, split.Phasors.Count);
        Assert.Equal(new PhasorValue("U U1", "V", 230, 0), split.Phasors[0]);
        Assert.Equal(("I residual", "A"), (split.Phasors[1].Name, split.Phasors[1].Unit));
        Assert.Equal(Math.Sqrt(5) * 1e-3, split.Phasors[1].Rms, 1e-17);
        Assert.Equal(Math.Atan2(1, 2) * 180 / Math.PI, split.Phasors[1].AngleDeg, 1e-12);
        Assert.Equal(("I_R", "A", 0.0), (split.Phasors[2].Name, split.Phasors[2].Unit, split.Phasors[2].AngleDeg));
        Assert.Equal(2e-3, split.Phasors[2].Rms, 1e-18);
        Assert.Equal(("I_C", "A", 90.0), (split.Phasors[3].Name, split.Phasors[3].Unit, split.Phasors[3].AngleDeg));
        Assert.Equal(1e-3, split.Phasors[3].Rms, 1e-18);
    }

    [Fact]
    public void Three_phase_phasors_are_the_mean_phase_voltages_and_current()
    {
        // Windows with |V1|, |V2|, |V3| = (231, 229, 230) and (233, 227, 230) V, L2 at −120°, L3 at +120° (balanced
        // angles). U L1 = mean |V1| = 232 V at 0° (recovered from the mean of the three, 3·U − |U2| − |U3|);
        // U L2 = mean phasor = 228 V at −120°; U L3 = 230 V at +120°; I residual: the mean of (0 + 2j) and (0 + 4j) mA
        // = 3 mA at +90° (closed forms). No I_R / I_C in three-phase.
        var a = ThreePhase(0, new(0, true, 2e-3), new(0, false, 0), 231, 229, 230) with { CurrentReferredA = new Complex(0, 2e-3) };
        var b = ThreePhase(0.2, new(0, true, 4e-3), new(0, false, 0), 233, 227, 230) with { CurrentReferredA = new Complex(0, 4e-3) };
        var split = Fold(Three, a, b);

        Assert.Equal("three-phase", split.Kind);
        Assert.Equal(["U L1", "U L2", "U L3", "I residual"], split.Phasors.Select(p => p.Name));
        Assert.Equal(["V", "V", "V", "A"], split.Phasors.Select(p => p.Unit));
        double[] rms = [232, 228, 230, 3e-3];
        double[] angles = [0, -120, 120, 90];
        for (var k = 0; k < 4; k++)
        {
            Assert.Equal(rms[k], split.Phasors[k].Rms, rms[k] * 1e-14);
            Assert.Equal(angles[k], split.Phasors[k].AngleDeg, 1e-9);
        }
    }

    [Fact]
    public void The_fit_is_the_mean_over_fitted_windows_with_the_residual_of_those_fitted_on_two_orders_or_more()
    {
        // docs/methods.md §I.7 "harmonic fit" and "model test"; RcFitResult: R = 1 / mean G, C = mean C, the residual's
        // statistics over windows fitted on two or more orders (WindowsTested), the orders used in any window,
        // ascending. Closed forms: G (2, 4, 3, 3) µS → mean 3 µS; C (10, 20, 30, 20) nF → 20 nF; residual (0.1, 0.3)
        // → mean 0.2, P95 0.29 (numpy 1.24), max 0.3 at 0.4 s; orders 1, 3, 5 (order 1 in three windows of four).
        // A window with nothing fitted (LeakageSplit.Fit's NaN, 0 orders) is left out.
        var windows = new[]
        {
            SinglePhase(0.0) with { Fit = new RcFit(2e-6, 10e-9, 0, 1), FitOrderMask = 0b10 },
            SinglePhase(0.2) with { Fit = new RcFit(4e-6, 20e-9, 0.1, 2), FitOrderMask = 0b1010 },
            SinglePhase(0.4) with { Fit = new RcFit(3e-6, 30e-9, 0.3, 3), FitOrderMask = 0b100010 },
            SinglePhase(0.6) with { Fit = new RcFit(3e-6, 20e-9, 0, 1), FitOrderMask = 0b10 },
            SinglePhase(0.8) with { Fit = new RcFit(double.NaN, double.NaN, double.NaN, 0), FitOrderMask = 0 },
        };
        var fit = Fold(Single, windows).Fit!;

        Assert.Equal(1 / 3e-6, fit.ResistanceOhm!.Value, 1e-6);
        Assert.Equal(20e-9, fit.CapacitanceF, 1e-22);
        Assert.Equal(2, fit.WindowsTested);
        Assert.Equal(0.2, fit.Residual.Mean, 1e-15);
        Assert.Equal(0.29, fit.Residual.P95, 1e-15);
        Assert.Equal(0.3, fit.Residual.Max);
        Assert.Equal(0.4, fit.Residual.TimeOfMaxS);
        Assert.Equal([1, 3, 5], fit.Orders);
        Assert.Null(fit.ResidualLimit);
        Assert.Null(fit.SimpleRc);
    }

    [Fact]
    public void No_fit_without_fitted_windows_and_none_for_three_phase()
    {
        // LeakageSplitResult.Fit: "null for three-phase"; and nothing to fit when no window was split.
        var invalid = new WindowLeakage { StartS = 0, FrequencyHz = MainsHz, VoltageRmsV = 3 };
        Assert.Null(Fold(Single, invalid).Fit);
        Assert.Null(Fold(Three, ThreePhase(0, new(0, false, 1e-3), new(0, true, 0))).Fit);
        Assert.Null(Fold(Single, SinglePhase(0)).Location);
    }

    [Fact]
    public void Without_a_window_split_the_figures_are_empty_and_the_note_says_why()
    {
        // docs/methods.md §I.7 "windows left out": below 20 V counted, not split. No window split: mean voltage and
        // frequency undefined (NaN), no phasors, no R, no trend, and one note naming the 20 V minimum.
        var invalid = new WindowLeakage { StartS = 0, FrequencyHz = MainsHz, VoltageRmsV = 3 };
        var split = Fold(Single, invalid, invalid with { StartS = 0.2 });

        Assert.Equal(0, split.Windows);
        Assert.Equal(2, split.WindowsWithoutVoltage);
        Assert.True(double.IsNaN(split.VoltageRmsV));
        Assert.True(double.IsNaN(split.FrequencyHz));
        Assert.True(double.IsNaN(split.ResistiveA.Mean));
        Assert.Empty(split.Phasors);
        Assert.Empty(split.Trend);
        Assert.Null(split.ResistanceOhm);
        Assert.Null(split.LeastResistanceOhm);
        Assert.Null(split.Location);
        var note = Assert.Single(split.Notes);
        Assert.StartsWith("No window had a voltage fundamental of at least 20 V on every voltage channel", note);
    }

    [Fact]
    public void Three_phase_without_a_window_split_has_no_location_and_states_its_assumption()
    {
        var invalid = new WindowLeakage { StartS = 0, FrequencyHz = MainsHz, VoltageRmsV = 3 };
        var split = Fold(Three, invalid);

        Assert.Null(split.Location);
        Assert.Empty(split.Phasors);
        Assert.Equal(2, split.Notes.Count);
        Assert.StartsWith("No window had", split.Notes[0]);
        Assert.Equal("Assumption: " + LeakageAccumulator.ThreePhaseAssumption + ".", split.Notes[1]);
    }

    [Fact]
    public void Windows_left_out_beside_split_ones_are_counted_in_a_note()
    {
        var invalid = new WindowLeakage { StartS = 0.2, FrequencyHz = MainsHz, VoltageRmsV = 3 };
        var split = Fold(Single, SinglePhase(0), invalid, SinglePhase(0.4));

        Assert.Equal(2, split.Windows);
        Assert.Equal(1, split.WindowsWithoutVoltage);
        Assert.Equal(["1 window(s) had a voltage below 20 V and were not split (supply interrupted, or the voltage channel lost)."],
            split.Notes);
    }

    [Fact]
    public void A_plain_single_phase_split_has_no_note()
    {
        // Positive I_R and I_C, every window split: nothing to point out (docs/methods.md §I.7: notes are for a
        // negative in-phase part, a lagging quadrature part, windows left out; the three-phase assumption).
        Assert.Empty(Fold(Single, SinglePhase(0), SinglePhase(0.2)).Notes);
    }

    [Fact]
    public void Negative_parts_are_pointed_out()
    {
        // docs/methods.md §I.7: a negative in-phase part (reversed clamp or voltage) and a lagging quadrature part
        // (inductive) are pointed out in notes.
        var split = Fold(Single, SinglePhase(0, -1e-3, -2e-3), SinglePhase(0.2, -1e-3, -2e-3));

        Assert.Equal(2, split.Notes.Count);
        Assert.StartsWith("The part in phase with the voltage is negative", split.Notes[0]);
        Assert.StartsWith("The quadrature part lags the voltage (inductive): not a capacitive leakage", split.Notes[1]);
    }

    [Fact]
    public void The_location_gives_each_direction_s_mean_max_and_equivalent_and_the_dominant_one_s_share()
    {
        // docs/methods.md §I.7 "three-phase location" and PhaseLocationResult: the mean current per direction over
        // windows (0 where a direction is not one of the two nearest), its largest window value, R = |V_k|/mean for
        // a resistive direction with a positive mean, C = mean/(2π f |V_k|) for a capacitive one; the dominant
        // direction has the largest mean; its share is the windows in which it carried the larger part (a window
        // with no current carries none). Four windows (mA): L1R 2 + L1C 1; L1R 4 + L2C 1; nothing; L3C 3 + L1R 1.
        // Closed forms: means L1R 7/4, L1C 1/4, L2R 0, L2C 1/4, L3R 0, L3C 3/4; max 4, 1, 0, 1, 0, 3; share 2/4.
        var split = Fold(Three,
            ThreePhase(0.0, new(0, false, 2e-3), new(0, true, 1e-3)),
            ThreePhase(0.2, new(0, false, 4e-3), new(1, true, 1e-3)),
            ThreePhase(0.4, new(0, false, 0), new(0, true, 0)),
            ThreePhase(0.6, new(2, true, 3e-3), new(0, false, 1e-3)));
        var location = split.Location!;
        var omegaV = 2 * Math.PI * MainsHz * 230;

        Assert.Equal(["L1", "L1", "L2", "L2", "L3", "L3"], location.Directions.Select(d => d.Phase));
        Assert.Equal(["resistive", "capacitive", "resistive", "capacitive", "resistive", "capacitive"],
            location.Directions.Select(d => d.Kind));
        double[] means = [1.75e-3, 0.25e-3, 0, 0.25e-3, 0, 0.75e-3];
        double[] maxima = [4e-3, 1e-3, 0, 1e-3, 0, 3e-3];
        for (var d = 0; d < 6; d++)
        {
            Assert.Equal(means[d], location.Directions[d].MeanA, 1e-18);
            Assert.Equal(maxima[d], location.Directions[d].MaxA);
        }

        Assert.Equal(230 / 1.75e-3, location.Directions[0].ResistanceOhm!.Value, 1e-6);
        Assert.Null(location.Directions[0].CapacitanceF);
        Assert.Null(location.Directions[2].ResistanceOhm); // mean 0: no resistance
        Assert.Null(location.Directions[4].ResistanceOhm);
        Assert.Null(location.Directions[2].CapacitanceF);
        foreach (var d in new[] { 1, 3, 5 })
        {
            Assert.Null(location.Directions[d].ResistanceOhm);
            Assert.Equal(means[d] / omegaV, location.Directions[d].CapacitanceF!.Value, 1e-22);
        }

        Assert.Equal(("L1", "resistive"), (location.DominantPhase, location.DominantKind));
        Assert.Equal(0.5, location.DominantShare);
        Assert.Equal(LeakageAccumulator.ThreePhaseAssumption, location.Assumption);
        Assert.Equal(["Assumption: " + LeakageAccumulator.ThreePhaseAssumption + "."], split.Notes);
    }

    [Fact]
    public void A_dominant_direction_on_the_capacitive_side_of_L3_is_named_so()
    {
        // One window, 3 mA on L3's capacitive direction and 1 mA on L2's resistive: dominant L3 capacitive, share 1.
        var location = Fold(Three, ThreePhase(0, new(2, true, 3e-3), new(1, false, 1e-3))).Location!;

        Assert.Equal(("L3", "capacitive", 1.0), (location.DominantPhase, location.DominantKind, location.DominantShare));
    }

    [Theory]
    [InlineData(1e-3)] // equal means on L1's two directions (LeakageSplit.Locate's (1 + j) mA)
    [InlineData(0.0)] // no current at all: every mean 0
    public void Of_equal_means_the_first_direction_is_dominant(double currentA)
    {
        // Ties go to the first direction in the listed order (L1 resistive first), as Locate lists the lower index
        // first of equal currents; common practice, no source.
        var location = Fold(Three, ThreePhase(0, new(0, false, currentA), new(0, true, currentA))).Location!;

        Assert.Equal(("L1", "resistive"), (location.DominantPhase, location.DominantKind));
    }

    [Fact]
    public void The_trend_lists_each_window_while_it_fits()
    {
        // LeakageSplitResult.Trend: I_R and I_C of windows in time order, with each window's start (closed form: the
        // values fed, unchanged, below MaxTrendPoints windows).
        var split = Fold(Single, SinglePhase(1.0, 1e-3, 5e-3), SinglePhase(1.2, 2e-3, -6e-3), SinglePhase(1.4, -3e-3, 7e-3));

        Assert.Equal([new(1.0, 1e-3, 5e-3), new(1.2, 2e-3, -6e-3), new LeakageTrendPoint(1.4, -3e-3, 7e-3)], split.Trend);
    }

    [Fact]
    public void A_full_trend_averages_neighbours_in_pairs_and_keeps_the_last_window_alone()
    {
        // 515 windows, window k starting at 0.2·k s with I_R = k/1024 A, I_C = −k/2048 A (exact in binary).
        // LeakageSplitResult.Trend: "averaged in pairs when there are more windows than fit" (MaxTrendPoints = 512):
        // point j is the mean of windows 2j and 2j + 1 (closed form I_R = (2j + 0.5)/1024, I_C = −(2j + 0.5)/2048),
        // starting at window 2j's start, for j = 0..256; the odd last window (514) stands alone at the end.
        const int count = 515;
        var accumulator = new LeakageAccumulator(Single);
        for (var k = 0; k < count; k++)
        {
            accumulator.Add(SinglePhase(0.2 * k, k / 1024.0, -k / 2048.0));
        }

        var trend = accumulator.Result().Trend;

        Assert.Equal(258, trend.Count);
        for (var j = 0; j < 257; j++)
        {
            Assert.Equal(new LeakageTrendPoint(0.2 * (2 * j), ((2 * j) + 0.5) / 1024, -((2 * j) + 0.5) / 2048), trend[j]);
        }

        Assert.Equal(new LeakageTrendPoint(0.2 * 514, 514 / 1024.0, -514 / 2048.0), trend[257]);
    }

    [Fact]
    public void A_trend_of_exactly_the_most_points_is_halved()
    {
        // 512 windows fill the trend: halved to 256 pair means (closed form as above), none pending.
        var accumulator = new LeakageAccumulator(Single);
        for (var k = 0; k < LeakageAccumulator.MaxTrendPoints; k++)
        {
            accumulator.Add(SinglePhase(0.2 * k, k / 1024.0, -k / 2048.0));
        }

        var trend = accumulator.Result().Trend;

        Assert.Equal(256, trend.Count);
        Assert.Equal(new LeakageTrendPoint(0.2 * 510, 510.5 / 1024, -510.5 / 2048), trend[255]);
    }

    [Fact]
    public void A_part_whose_mean_is_exactly_zero_is_not_called_negative()
    {
        // docs/methods.md §I.7: a *negative* in-phase part and a *lagging* quadrature part are pointed out; a mean of
        // exactly 0 (windows of +1 and −1 mA, +2 and −2 mA: closed form 0) is neither.
        var split = Fold(Single, SinglePhase(0, 1e-3, 2e-3), SinglePhase(0.2, -1e-3, -2e-3));

        Assert.Equal(0, split.ResistiveA.Mean);
        Assert.Equal(0, split.CapacitiveA.Mean);
        Assert.Empty(split.Notes);
    }

    [Fact]
    public void The_fit_lists_the_thirteenth_order_and_has_no_resistance_at_zero_conductance()
    {
        // RcFitResult: the orders used in any window, up to LeakageWindowMeasurement.MaxFitOrder = 13 (docs/methods.md
        // §I.7); R = 1/mean G, none when the mean conductance is exactly 0 (closed form: 1/0 is not a resistance).
        var windows = new[]
        {
            SinglePhase(0.0) with { Fit = new RcFit(0, 10e-9, 0.1, 2), FitOrderMask = (1 << 1) | (1 << 13) },
            SinglePhase(0.2) with { Fit = new RcFit(0, 30e-9, 0.3, 2), FitOrderMask = (1 << 1) | (1 << 13) },
        };
        var fit = Fold(Single, windows).Fit!;

        Assert.Equal([1, 13], fit.Orders);
        Assert.Null(fit.ResistanceOhm);
        Assert.Equal(20e-9, fit.CapacitanceF, 1e-22);
    }

    [Fact]
    public void The_dominant_direction_is_the_largest_mean_wherever_it_lies()
    {
        // PhaseLocationResult: the dominant direction has the largest mean over windows. Two windows (mA): L2 R 3 + L1 R
        // 1 each. Closed forms: means L1 R 1, L2 R 3; dominant L2 resistive, the larger part in both windows (share 1).
        var split = Fold(Three,
            ThreePhase(0.0, new(1, false, 3e-3), new(0, false, 1e-3)),
            ThreePhase(0.2, new(1, false, 3e-3), new(0, false, 1e-3)));
        var location = split.Location!;

        Assert.Equal(1e-3, location.Directions[0].MeanA, 1e-18);
        Assert.Equal(3e-3, location.Directions[2].MeanA, 1e-18);
        Assert.Equal(("L2", "resistive", 1.0), (location.DominantPhase, location.DominantKind, location.DominantShare));
    }

    [Fact]
    public void Windows_pending_after_two_halvings_make_one_last_point_of_their_mean()
    {
        // LeakageSplitResult.Trend (MaxTrendPoints = 512): 1024 windows halve the trend twice, so a point then holds
        // four windows; the two windows after them (1024 and 1025) are pending and make one last point of their mean,
        // starting at window 1024's start. Window k: I_R = k/1024 A, I_C = −k/2048 A; closed form: I_R = 1024.5/1024,
        // I_C = −1024.5/2048 (exact in binary).
        var accumulator = new LeakageAccumulator(Single);
        for (var k = 0; k < 1026; k++)
        {
            accumulator.Add(SinglePhase(0.2 * k, k / 1024.0, -k / 2048.0));
        }

        var trend = accumulator.Result().Trend;

        Assert.Equal(257, trend.Count);
        Assert.Equal(new LeakageTrendPoint(0.2 * 1024, 1024.5 / 1024, -1024.5 / 2048), trend[256]);
        Assert.Equal(new LeakageTrendPoint(0, 1.5 / 1024, -1.5 / 2048), trend[0]);
    }
}
