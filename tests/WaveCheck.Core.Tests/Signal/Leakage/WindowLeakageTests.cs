using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="LeakageWindowMeasurement"/> on single windows built directly (a <see cref="WindowSlot"/> with its
/// voltages, as the window pipeline fills it): short synthetic cosines of whole cycles, checked against the closed
/// form I = V(1/R + jωC) (Ohm's law and the capacitor's admittance, REFERENCE.md "Insulation"), the geometry of the
/// three-phase location, and the bounds of docs/methods.md §I.7 (20 V; orders n ≤ 13 with |V_n| ≥ 1 % |V_1| and
/// |I_n| ≥ max(1 µA, 0.1 % |I_1|)).
/// </summary>
public class WindowLeakageTests
{
    private const double MainsHz = 50;
    private const double Deg = Math.PI / 180;

    /// <summary>Samples of Σ √2·rms·cos(2π·order·f·k/fs + angle): each (order, rms, angleDeg).</summary>
    private static double[] Cosines(int length, double rateHz, params (int Order, double Rms, double AngleDeg)[] parts)
    {
        var x = new double[length];
        foreach (var (order, rms, angle) in parts)
        {
            for (var k = 0; k < length; k++)
            {
                x[k] += Math.Sqrt(2) * rms * Math.Cos((2 * Math.PI * order * MainsHz * k / rateHz) + (angle * Deg));
            }
        }

        return x;
    }

    private static WindowSlot Slot(double[] current, long start, params double[][] volts)
    {
        var slot = new WindowSlot(current.Length, 1, 0, volts.Length) { Length = current.Length, Start = start };
        current.CopyTo(slot.Samples, 0);
        for (var p = 0; p < volts.Length; p++)
        {
            volts[p].CopyTo(slot.Volts[p], 0);
        }

        return slot;
    }

    /// <summary>The current R ∥ C draws from a voltage of the given parts: I_n = V_n (1/R + j n ω C), closed form.</summary>
    private static (int, double, double)[] Rc(double r, double c, params (int Order, double Rms, double AngleDeg)[] voltage) =>
        [.. voltage.Select(v =>
        {
            var i = Complex.FromPolarCoordinates(v.Rms, v.AngleDeg * Deg) * new Complex(1 / r, v.Order * 2 * Math.PI * MainsHz * c);
            return (v.Order, i.Magnitude, i.Phase / Deg);
        })];

    /// <summary>The first angle offset 0, 0.01°, 0.02°, ... at which <paramref name="hit"/> holds: builds inputs that
    /// land exactly on a threshold (the rounding of a phasor's magnitude moves with the phase; an amplitude moved by
    /// ulps can step over the value).</summary>
    private static double Landing(Func<double, bool> hit)
    {
        for (var k = 0; k < 36_000; k++)
        {
            if (hit(k * 0.01))
            {
                return k * 0.01;
            }
        }

        throw new InvalidOperationException("no phase lands on the threshold");
    }

    [Fact]
    public void A_single_phase_window_splits_its_current_into_the_parts_of_R_and_C()
    {
        // 2 cycles of 50 Hz at 3200 Hz (128 samples), starting at sample 6400 (2 s). V = 230 V at 30°, R = 100 kΩ,
        // C = 100 nF: closed form I_R = 230/1e5 = 2.3 mA, I_C = 2π·50·1e-7·230 = 7.2257 mA (REFERENCE.md
        // "Insulation"); G = 1/R, C. Tolerance 1e-12 relative: Goertzel's rounding over 128 samples.
        const double r = 100e3, c = 100e-9, rate = 3200;
        (int, double, double)[] v = [(1, 230, 30)];
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(Cosines(128, rate, Rc(r, c, v)), 6400, Cosines(128, rate, v)));

        var iC = 2 * Math.PI * MainsHz * c * 230;
        Assert.True(w.Valid);
        Assert.Equal(2.0, w.StartS, 1e-15);
        Assert.Equal(50.0, w.FrequencyHz, 1e-12);
        Assert.Equal(230, w.VoltageRmsV, 1e-10);
        Assert.Equal(2.3e-3, w.ResistiveA, 1e-14);
        Assert.Equal(iC, w.CapacitiveA, 1e-14);
        Assert.Equal(1 / r, w.ConductanceS, 1e-16);
        Assert.Equal(c, w.CapacitanceF, 1e-19);
        Assert.Equal(2.3e-3, w.CurrentReferredA.Real, 1e-14);
        Assert.Equal(iC, w.CurrentReferredA.Imaginary, 1e-14);
        Assert.Equal((1, 1 << 1), (w.Fit.Orders, w.FitOrderMask));
    }

    [Theory]
    [InlineData(3, 6)] // 2 × cycles = L: the fundamental's bin would be the Nyquist bin
    [InlineData(3, 5)]
    [InlineData(2, 4)]
    public void A_window_too_short_for_its_cycles_is_not_split(int cycles, int length)
    {
        // LeakageSplit.BinPhasor needs 2·bin < L; a window of 2·cycles samples or fewer has no fundamental bin below
        // Nyquist, so it is returned unsplit with its start and frequency (cycles·fs/L).
        const double rate = 1000;
        var volts = Enumerable.Repeat(300.0, length).ToArray();
        var w = new LeakageWindowMeasurement(rate, cycles, 1).Measure(Slot(new double[length], 500, volts));

        Assert.False(w.Valid);
        Assert.Equal(0.5, w.StartS, 1e-15);
        Assert.Equal(cycles * rate / length, w.FrequencyHz, 1e-12);
        Assert.Equal(0, w.VoltageRmsV);
    }

    [Fact]
    public void The_fit_takes_only_orders_whose_bin_lies_below_Nyquist()
    {
        // 2 cycles in 32 samples (fs = 800 Hz): bin 2n must stay below 16, so orders up to 7 (docs/methods.md §I.7
        // phasors: a harmonic's bin n·N). Voltage 230 V + 3 % 3rd + 5 % 7th; current through R = 200 kΩ ∥ C = 47 nF:
        // orders 1, 3, 7 are fitted and the fit returns R and C (closed form: the model holds exactly).
        const double r = 200e3, c = 47e-9, rate = 800;
        (int, double, double)[] v = [(1, 230, 0), (3, 6.9, 40), (7, 11.5, -70)];
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(Cosines(32, rate, Rc(r, c, v)), 0, Cosines(32, rate, v)));

        Assert.Equal((1 << 1) | (1 << 3) | (1 << 7), w.FitOrderMask);
        Assert.Equal(3, w.Fit.Orders);
        Assert.Equal(1 / r, w.Fit.ConductanceS, 1e-17);
        Assert.Equal(c, w.Fit.CapacitanceF, 1e-20);
        Assert.Equal(0, w.Fit.Residual, 1e-12);
    }

    [Fact]
    public void A_voltage_harmonic_without_its_current_is_not_fitted()
    {
        // docs/methods.md §I.7: an order is fitted where both |V_n| ≥ 1 % |V_1| and |I_n| ≥ max(1 µA, 0.1 % |I_1|).
        // A 5 % 3rd in the voltage with a current of the fundamental only (zero at order 3, to rounding ~1e-18 A),
        // and a 0.5 % 5th in the voltage with a 5th in the current: neither is fitted, the fit has the fundamental.
        const double rate = 3200;
        (int, double, double)[] v = [(1, 230, 0), (3, 11.5, 0), (5, 1.15, 0)];
        var current = Cosines(128, rate, (1, 3e-3, 60), (5, 1e-3, 10));
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(current, 0, Cosines(128, rate, v)));

        Assert.Equal(1 << 1, w.FitOrderMask);
        Assert.Equal(1, w.Fit.Orders);
    }

    [Fact]
    public void A_voltage_harmonic_of_exactly_1_percent_is_fitted()
    {
        // docs/methods.md §I.7: fitted where |V_n| ≥ 1 % |V_1| (at the limit: fitted). The 3rd (2.3 V) is turned in
        // steps of 0.01° until its phasor is exactly 0.01 × the fundamental's (magnitudes by LeakageSplit.BinPhasor,
        // checked against numpy.fft in LeakageSplitTests); the current through R ∥ C has the 3rd well above its floor.
        const double rate = 3200, r = 100e3, c = 100e-9;
        double[] Voltage(double angleDeg) => Cosines(128, rate, (1, 230, 0), (3, 2.3, angleDeg));
        var angle = Landing(a =>
        {
            var x = Voltage(a);
            return LeakageSplit.BinPhasor(x, 6).Magnitude == 0.01 * LeakageSplit.BinPhasor(x, 2).Magnitude;
        });
        var current = Cosines(128, rate, Rc(r, c, (1, 230, 0), (3, 2.3, angle)));
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(current, 0, Voltage(angle)));

        Assert.Equal((1 << 1) | (1 << 3), w.FitOrderMask);
    }

    [Fact]
    public void A_current_harmonic_of_exactly_its_floor_is_fitted()
    {
        // docs/methods.md §I.7: fitted where |I_n| ≥ max(1 µA, 0.1 % |I_1|) (at the limit: fitted). |I_1| = 5 mA, so
        // the floor is 5 µA; the current's 3rd (5 µA) is turned in steps of 0.01° until its phasor is exactly 0.001 × the
        // fundamental's (by LeakageSplit.BinPhasor). The voltage has a 5 % 3rd.
        const double rate = 3200;
        double[] Current(double angleDeg) => Cosines(128, rate, (1, 5e-3, 80), (3, 5e-6, angleDeg));
        var angle = Landing(a =>
        {
            var x = Current(a);
            return LeakageSplit.BinPhasor(x, 6).Magnitude == 0.001 * LeakageSplit.BinPhasor(x, 2).Magnitude;
        });
        var voltage = Cosines(128, rate, (1, 230, 0), (3, 11.5, 0));
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(Current(angle), 0, voltage));

        Assert.Equal((1 << 1) | (1 << 3), w.FitOrderMask);
    }

    [Fact]
    public void A_three_phase_window_locates_its_current_between_the_two_nearest_directions()
    {
        // L1 = 230 V at 30°, L2 = 220 V at −90°, L3 = 240 V at 150° (balanced angles, unequal magnitudes); 2 cycles
        // at 3200 Hz. The six directions lie at 30° (L1 R), 120° (L1 C), 270° (L2 R), 0° (L2 C), 150° (L3 R),
        // 240° (L3 C). A residual current of 5 mA at 250° lies between L3 C (240°) and L2 R (270°), 30° apart:
        // closed form (sine rule) x = |I| sin 20°/sin 30° on L3 C, y = |I| sin 10°/sin 30° on L2 R. Then
        // I_C = x, C = x/(2π f |V3|), I_R = y, G = y/|V2| (docs/methods.md §I.7 "three-phase location"); the current
        // and L2, L3 referred to L1's angle: 5 mA at 220°, 220 V at −120°, 240 V at +120°; the voltage: (230 + 220 +
        // 240)/3 = 230 V.
        const double rate = 3200;
        var volts = new[] { Cosines(128, rate, (1, 230, 30)), Cosines(128, rate, (1, 220, -90)), Cosines(128, rate, (1, 240, 150)) };
        var w = new LeakageWindowMeasurement(rate, 2, 3).Measure(Slot(Cosines(128, rate, (1, 5e-3, 250)), 320, volts));

        var x = 5e-3 * Math.Sin(20 * Deg) / Math.Sin(30 * Deg);
        var y = 5e-3 * Math.Sin(10 * Deg) / Math.Sin(30 * Deg);
        Assert.True(w.Valid);
        Assert.Equal(0.1, w.StartS, 1e-15);
        Assert.Equal(230, w.VoltageRmsV, 1e-10);
        Assert.Equal((2, true), (w.First.Phase, w.First.Capacitive));
        Assert.Equal((1, false), (w.Second.Phase, w.Second.Capacitive));
        Assert.Equal(x, w.CapacitiveA, 1e-14);
        Assert.Equal(x / (2 * Math.PI * MainsHz * 240), w.CapacitanceF, 1e-19);
        Assert.Equal(y, w.ResistiveA, 1e-14);
        Assert.Equal(y / 220, w.ConductanceS, 1e-17);
        AssertPhasor(Complex.FromPolarCoordinates(5e-3, 220 * Deg), w.CurrentReferredA, 1e-14);
        AssertPhasor(Complex.FromPolarCoordinates(220, -120 * Deg), w.Voltage2V, 1e-10);
        AssertPhasor(Complex.FromPolarCoordinates(240, 120 * Deg), w.Voltage3V, 1e-10);
    }

    [Fact]
    public void A_current_between_L1_s_capacitive_and_L3_s_resistive_direction_takes_each_phase_s_voltage()
    {
        // L1 = 230 V at 0°, L2 = 200 V at −120°, L3 = 250 V at 120°: directions L1 C at 90°, L3 R at 120°, 30° apart.
        // 4 mA at 100° lies between them: closed form (sine rule) x = |I| sin 20°/sin 30° on L1 C, y = |I| sin 10°/sin 30°
        // on L3 R; C = x/(2π f |V1|), G = y/|V3| (docs/methods.md §I.7 "three-phase location").
        const double rate = 3200;
        var volts = new[] { Cosines(128, rate, (1, 230, 0)), Cosines(128, rate, (1, 200, -120)), Cosines(128, rate, (1, 250, 120)) };
        var w = new LeakageWindowMeasurement(rate, 2, 3).Measure(Slot(Cosines(128, rate, (1, 4e-3, 100)), 0, volts));

        var x = 4e-3 * Math.Sin(20 * Deg) / Math.Sin(30 * Deg);
        var y = 4e-3 * Math.Sin(10 * Deg) / Math.Sin(30 * Deg);
        Assert.Equal(new LeakageDirection(0, true, w.First.CurrentA), w.First);
        Assert.Equal(new LeakageDirection(2, false, w.Second.CurrentA), w.Second);
        Assert.Equal(y, w.ResistiveA, 1e-14);
        Assert.Equal(y / 250, w.ConductanceS, 1e-17);
        Assert.Equal(x, w.CapacitiveA, 1e-14);
        Assert.Equal(x / (2 * Math.PI * MainsHz * 230), w.CapacitanceF, 1e-19);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public void A_three_phase_window_with_any_phase_below_20_V_is_not_split(int low)
    {
        // docs/methods.md §I.7 "windows left out": below 20 V on any phase, counted, not split; the voltage reported
        // is still the mean of the three (closed form (10 + 230 + 230)/3).
        const double rate = 3200;
        double[] angles = [0, -120, 120];
        var volts = Enumerable.Range(0, 3).Select(p => Cosines(128, rate, (1, p == low ? 10 : 230, angles[p]))).ToArray();
        var w = new LeakageWindowMeasurement(rate, 2, 3).Measure(Slot(Cosines(128, rate, (1, 1e-3, 45)), 0, volts));

        Assert.False(w.Valid);
        Assert.Equal(470.0 / 3, w.VoltageRmsV, 1e-10);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public void A_three_phase_window_with_a_phase_at_exactly_20_V_is_split(int low)
    {
        // docs/methods.md §I.7: split from 20 V up (below 20 V left out). The low phase (20 V) is turned in steps of
        // 0.01° until its phasor (LeakageSplit.BinPhasor) is exactly 20 V.
        const double rate = 3200;
        double[] angles = [0, -120, 120];
        var offset = Landing(a => LeakageSplit.BinPhasor(Cosines(128, rate, (1, 20, angles[low] + a)), 2).Magnitude == 20);
        var volts = Enumerable.Range(0, 3).Select(p => Cosines(128, rate, p == low ? (1, 20, angles[p] + offset) : (1, 230, angles[p]))).ToArray();
        var w = new LeakageWindowMeasurement(rate, 2, 3).Measure(Slot(Cosines(128, rate, (1, 1e-3, 45)), 0, volts));

        Assert.True(w.Valid);
        Assert.Equal(480.0 / 3, w.VoltageRmsV, 1e-10);
    }

    [Theory]
    [InlineData(10.0, false)]
    [InlineData(19.9, false)]
    public void A_single_phase_window_below_20_V_is_not_split_but_keeps_its_voltage(double volts, bool valid)
    {
        // docs/methods.md §I.7 "windows left out": below 20 V the window is counted, not split; its voltage is still
        // reported (closed form: the RMS of the cosine fed, to Goertzel's rounding).
        const double rate = 3200;
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(Cosines(128, rate, (1, 1e-3, 45)), 0, Cosines(128, rate, (1, volts, 0))));

        Assert.Equal(valid, w.Valid);
        Assert.Equal(volts, w.VoltageRmsV, 1e-12);
        Assert.Equal(0, w.ResistiveA);
        Assert.Equal(0, w.FitOrderMask);
    }

    [Fact]
    public void A_single_phase_window_at_exactly_20_V_is_split()
    {
        // docs/methods.md §I.7: split from 20 V up. The voltage (20 V) is turned in steps of 0.01° until its phasor
        // (LeakageSplit.BinPhasor) is exactly 20 V; the current through 100 kΩ is 0.2 mA in phase (closed form V/R).
        const double rate = 3200;
        var offset = Landing(a => LeakageSplit.BinPhasor(Cosines(128, rate, (1, 20, a)), 2).Magnitude == 20);
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(
            Slot(Cosines(128, rate, (1, 20 / 100e3, offset)), 0, Cosines(128, rate, (1, 20, offset))));

        Assert.True(w.Valid);
        Assert.Equal(20, w.VoltageRmsV);
        Assert.Equal(2e-4, w.ResistiveA, 1e-15);
    }

    [Fact]
    public void A_current_harmonic_above_1_uA_but_below_its_share_of_the_fundamental_is_not_fitted()
    {
        // docs/methods.md §I.7: the current floor is the larger of 1 µA and 0.1 % |I_1|. |I_1| = 5 mA makes it 5 µA, so
        // a 3 µA 3rd (above 1 µA) is not fitted although the voltage has a 5 % 3rd.
        const double rate = 3200;
        var current = Cosines(128, rate, (1, 5e-3, 80), (3, 3e-6, 10));
        var voltage = Cosines(128, rate, (1, 230, 0), (3, 11.5, 0));
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(current, 0, voltage));

        Assert.Equal(1 << 1, w.FitOrderMask);
    }

    [Fact]
    public void The_thirteenth_order_is_the_last_fitted()
    {
        // docs/methods.md §I.7: orders n ≤ 13. 2 cycles in 128 samples reach order 31 below Nyquist; a voltage with
        // 3 % of the 13th and of the 15th, through R = 100 kΩ ∥ C = 10 nF: order 13 is fitted, 15 is not, and the fit
        // returns R and C (closed form: the model holds exactly at every order).
        const double rate = 3200, r = 100e3, c = 10e-9;
        (int, double, double)[] v = [(1, 230, 0), (13, 6.9, 20), (15, 6.9, -40)];
        var w = new LeakageWindowMeasurement(rate, 2, 1).Measure(Slot(Cosines(128, rate, Rc(r, c, v)), 0, Cosines(128, rate, v)));

        Assert.Equal((1 << 1) | (1 << 13), w.FitOrderMask);
        Assert.Equal(2, w.Fit.Orders);
        Assert.Equal(1 / r, w.Fit.ConductanceS, 1e-16);
        Assert.Equal(c, w.Fit.CapacitanceF, 1e-19);
    }

    private static void AssertPhasor(Complex expected, Complex actual, double tolerance)
    {
        Assert.Equal(expected.Real, actual.Real, tolerance);
        Assert.Equal(expected.Imaginary, actual.Imaginary, tolerance);
    }
}
