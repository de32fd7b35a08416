using System.Diagnostics;
using System.Globalization;
using System.Numerics;
using System.Runtime.CompilerServices;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>The phasor arithmetic of the leakage split, against closed forms (I = V(1/R + jωC): Ohm's law and the
/// capacitor's admittance, REFERENCE.md "Insulation") and numpy.</summary>
public class LeakageSplitTests
{
    private static string ScriptPath([CallerFilePath] string here = "") =>
        Path.Combine(Path.GetDirectoryName(here)!, "Reference", "leakage_reference.py");

    private static double[] Numpy(string mode, IEnumerable<string> lines, double argument)
    {
        var file = Path.Combine(Path.GetTempPath(), $"wavecheck-leakage-{Environment.ProcessId}-{Guid.NewGuid():N}.txt");
        File.WriteAllLines(file, lines);
        try
        {
            var start = new ProcessStartInfo("/usr/bin/python3", [ScriptPath(), mode, file, argument.ToString("R", CultureInfo.InvariantCulture)])
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
            };
            using var process = Process.Start(start)!;
            var output = process.StandardOutput.ReadToEnd();
            var error = process.StandardError.ReadToEnd();
            process.WaitForExit();
            Assert.True(process.ExitCode == 0, error);
            return [.. output.Trim().Split(' ').Select(p => double.Parse(p, CultureInfo.InvariantCulture))];
        }
        finally
        {
            File.Delete(file);
        }
    }

    private static string R(double x) => x.ToString("R", CultureInfo.InvariantCulture);

    [Theory]
    [InlineData(1000, 10)]
    [InlineData(4166, 36)]   // 60 Hz at 25 kS/s: 12 cycles in 4166 samples, bin 3·12
    [InlineData(999, 70)]
    public void BinPhasorMatchesNumpyFft(int length, int bin)
    {
        var random = new Random(7);
        var x = new double[length];
        for (var i = 0; i < length; i++)
        {
            x[i] = random.NextDouble() - 0.3;
        }

        var phasor = LeakageSplit.BinPhasor(x, bin);
        var reference = Numpy("bin", x.Select(R), bin);
        // numpy.fft.fft scaled by √2/L; double rounding over up to 4166 terms: 1e-12 of the sum's scale.
        Assert.Equal(reference[0], phasor.Real, 1e-12);
        Assert.Equal(reference[1], phasor.Imaginary, 1e-12);
    }

    [Fact]
    public void BinPhasorOfASineIsItsRmsAndPhase()
    {
        // Closed form: √2·A·sin(ωt + φ) sampled over whole cycles gives the bin A·e^{j(φ − 90°)} (sin = cos shifted).
        const int length = 2000;
        const double rms = 3.0, phi = 0.7;
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = (rms * Math.Sqrt(2) * Math.Sin((2 * Math.PI * 10 * n / length) + phi)) + 5.0; // plus DC: in no bin
        }

        var phasor = LeakageSplit.BinPhasor(x, 10);
        Assert.Equal(rms, phasor.Magnitude, 1e-10);
        Assert.Equal(phi - (Math.PI / 2), phasor.Phase, 1e-10);
    }

    [Theory]
    [InlineData(100, 50, "1..49")]
    [InlineData(99, 50, "1..49")] // odd L: bin 49 is accepted (2·49 < 99), so the message must say so
    [InlineData(3, 2, "1..1")]
    public void BinOutsideTheSpectrumIsRefusedWithTheRange(int length, int bin, string range)
    {
        // The range the message gives is the one BinPhasorAcceptsExactlyTheBinsBelowHalfTheWindow accepts: 2·bin < L.
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => LeakageSplit.BinPhasor(new double[length], bin));
        Assert.Contains(range + " ", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(50.0, 500e3, 100e-9, 30.0)]
    [InlineData(60.0, 1.2e6, 22e-9, -75.0)]
    [InlineData(50.0, 80e3, 0.0, 0.0)]
    public void SplitOfAnRcLeakageGivesRAndC(double frequencyHz, double resistanceOhm, double capacitanceF, double angleDeg)
    {
        // Closed form: I = V (1/R + jωC), at any voltage angle.
        var v = Complex.FromPolarCoordinates(230, angleDeg * Math.PI / 180);
        var i = v * new Complex(1 / resistanceOhm, 2 * Math.PI * frequencyHz * capacitanceF);
        var split = LeakageSplit.Split(v, i, frequencyHz);
        Assert.Equal(230 / resistanceOhm, split.ResistiveA, 1e-12);
        Assert.Equal(230 * 2 * Math.PI * frequencyHz * capacitanceF, split.CapacitiveA, 1e-12);
        Assert.Equal(resistanceOhm, split.ResistanceOhm, resistanceOhm * 1e-9);
        Assert.Equal(capacitanceF, split.CapacitanceF, 1e-18);
    }

    [Fact]
    public void FitRecoversGAndCExactlyAndMatchesNumpyLeastSquares()
    {
        // Closed form: an R ∥ C leakage draws I_n = V_n (G + jnωC) at every order: the fit is exact, residual 0.
        const double g = 1 / 250e3, c = 68e-9, f = 50;
        int[] orders = [1, 3, 5, 7];
        Complex[] v = [Complex.FromPolarCoordinates(230, 0.1), Complex.FromPolarCoordinates(6.9, 1.2),
            Complex.FromPolarCoordinates(9.2, -2.0), Complex.FromPolarCoordinates(4.6, 0.5)];
        var i = v.Select((vn, k) => vn * new Complex(g, orders[k] * 2 * Math.PI * f * c)).ToArray();
        var fit = LeakageSplit.Fit(v, i, orders, f);
        Assert.Equal(g, fit.ConductanceS, g * 1e-9);
        Assert.Equal(c, fit.CapacitanceF, c * 1e-9);
        Assert.True(fit.Residual < 1e-9, $"residual {fit.Residual}");
        Assert.Equal(4, fit.Orders);

        // A current that is not R-C: numpy.linalg.lstsq on the same stacked real system gives the same G, C, residual.
        i[1] += new Complex(0.002, -0.001);
        i[2] += new Complex(-0.0005, 0.0015);
        var misfit = LeakageSplit.Fit(v, i, orders, f);
        var reference = Numpy("fit", orders.Select((n, k) => $"{n} {R(v[k].Real)} {R(v[k].Imaginary)} {R(i[k].Real)} {R(i[k].Imaginary)}"), f);
        Assert.Equal(reference[0], misfit.ConductanceS, Math.Abs(reference[0]) * 1e-9);
        Assert.Equal(reference[1], misfit.CapacitanceF, Math.Abs(reference[1]) * 1e-9);
        Assert.Equal(reference[2], misfit.Residual, 1e-9);
        Assert.True(misfit.Residual > 0.1, $"residual {misfit.Residual}");
    }

    private static Complex[] Balanced(double rmsV) =>
        [.. new[] { 0.0, -120.0, 120.0 }.Select(a => Complex.FromPolarCoordinates(rmsV, a * Math.PI / 180))];

    [Theory]
    [InlineData(0, 200e3, 0.0)]     // resistive on L1
    [InlineData(1, 150e3, 0.0)]     // resistive on L2
    [InlineData(2, null, 40e-9)]    // capacitive on L3
    [InlineData(1, 300e3, 30e-9)]   // both on L2: the two nearest directions are L2's own
    public void LocateFindsTheAsymmetricPhaseAndItsComponents(int phase, double? resistanceOhm, double extraCapacitanceF)
    {
        // Closed form: balanced 100 nF on every phase cancels (Σ V_k = 0); the residual is the extra path's current
        // V_p (1/R + jωΔC) on the one phase.
        const double f = 50, w = 2 * Math.PI * f;
        var v = Balanced(230);
        var i = Complex.Zero;
        for (var k = 0; k < 3; k++)
        {
            i += v[k] * new Complex(0, w * 100e-9);
        }

        i += v[phase] * new Complex(resistanceOhm is { } r ? 1 / r : 0, w * extraCapacitanceF);
        var (first, second) = LeakageSplit.Locate(v, i);
        var expectedR = resistanceOhm is { } rr ? 230 / rr : 0;
        var expectedC = 230 * w * extraCapacitanceF;
        foreach (var d in new[] { first, second }.Where(d => d.CurrentA > 1e-9))
        {
            Assert.Equal(phase, d.Phase);
            Assert.Equal(d.Capacitive ? expectedC : expectedR, d.CurrentA, 1e-9);
        }

        Assert.Equal(phase, first.Phase);
        Assert.Equal(expectedC > expectedR, first.Capacitive);
    }

    [Fact]
    public void LocateShowsAMissingCapacitanceAsLeakageBetweenTheOtherTwoPhases()
    {
        // Closed form: 20 nF less on L1 than on L2 and L3 leaves −jωΔC·V1, at −90° from V1, which the nearest pair of
        // directions brackets: resistive L2 at −120° and capacitive L2 at −30°; the two rebuild the phasor exactly.
        const double w = 2 * Math.PI * 50;
        var v = Balanced(230);
        var i = v[0] * new Complex(0, -w * 20e-9);
        var (first, second) = LeakageSplit.Locate(v, i);
        var rebuilt = (Direction(v, first) * first.CurrentA) + (Direction(v, second) * second.CurrentA);
        Assert.Equal(i.Real, rebuilt.Real, 1e-12);
        Assert.Equal(i.Imaginary, rebuilt.Imaginary, 1e-12);
        Assert.True(first.CurrentA >= 0 && second.CurrentA >= 0);
        Assert.Equal(1, first.Phase);
        Assert.Equal(1, second.Phase);
    }

    private static Complex Direction(Complex[] v, LeakageDirection d)
    {
        var unit = v[d.Phase] / v[d.Phase].Magnitude;
        return d.Capacitive ? unit * Complex.ImaginaryOne : unit;
    }

    // ---- Edges and guards (issue 18: mutation testing) -------------------------------------------------------------

    [Theory]
    [InlineData(100, 1, true)]
    [InlineData(100, 49, true)]   // the last bin below L/2
    [InlineData(100, 50, false)]  // L/2: the Nyquist bin, not a phasor of the formula
    [InlineData(100, 0, false)]   // DC
    [InlineData(99, 49, true)]    // odd L: 2·49 < 99
    [InlineData(99, 50, false)]
    [InlineData(3, 1, true)]      // the shortest window with a bin: 2·1 < 3
    [InlineData(2, 1, false)]
    public void BinPhasorAcceptsExactlyTheBinsBelowHalfTheWindow(int length, int bin, bool accepted)
    {
        // The DFT's bins 1 to below L/2 are each one frequency's pair with its mirror (common practice, no source): a
        // sine of exactly that bin's cycles, 2 A RMS at phase 0, gives the closed-form phasor 2·e^{−j90°} (−2j).
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = 2 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * bin * n / length);
        }

        if (!accepted)
        {
            Assert.Throws<ArgumentOutOfRangeException>(() => LeakageSplit.BinPhasor(x, bin));
            return;
        }

        var p = LeakageSplit.BinPhasor(x, bin);
        Assert.Equal(0, p.Real, 1e-12);
        Assert.Equal(-2, p.Imaginary, 1e-12);
    }

    [Fact]
    public void ConductanceIsTheResistivePartOverTheVoltage()
    {
        // Ohm's law (REFERENCE.md "Insulation"): 230 V across 460 kΩ draws 0.5 mA in phase; G = 1/R.
        var split = LeakageSplit.Split(new Complex(0, 230), new Complex(0, 230 / 460e3), 50);
        Assert.Equal(1 / 460e3, split.ConductanceS, 1e-18);
        Assert.Equal(460e3, split.ResistanceOhm, 1e-3);
        Assert.Equal(230, split.VoltageRmsV, 1e-12);
        Assert.Equal(50, split.FrequencyHz);
        // No resistive part: R is infinite (V/0), as documented.
        Assert.True(double.IsPositiveInfinity(LeakageSplit.Split(new Complex(230, 0), new Complex(0, 1e-3), 50).ResistanceOhm));
    }

    [Fact]
    public void DirectionIndicesRunFromZeroToFive()
    {
        // 2·phase, plus 1 when capacitive: L1 resistive 0, L1 capacitive 1, ..., L3 capacitive 5.
        var indices = new[] { 0, 1, 2 }.SelectMany(p => new[] { false, true }.Select(c => new LeakageDirection(p, c, 0).Index));
        Assert.Equal([0, 1, 2, 3, 4, 5], indices);
    }

    [Theory]
    [InlineData(2, 2, 3)]
    [InlineData(2, 3, 2)]
    [InlineData(3, 2, 2)]
    public void FitRefusesCountsThatDoNotMatch(int voltages, int currents, int orders)
    {
        var e = Assert.Throws<ArgumentException>(() => LeakageSplit.Fit(new Complex[voltages], new Complex[currents], new int[orders], 50));
        Assert.Contains("one voltage and one current per order", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void FitOfNothingIsNotANumberAndOfNoCurrentIsZero()
    {
        // No order, or no voltage at any order: nothing to fit (NaN everywhere, 0 orders).
        var empty = LeakageSplit.Fit([], [], [], 50);
        Assert.True(double.IsNaN(empty.ConductanceS) && double.IsNaN(empty.CapacitanceF) && double.IsNaN(empty.Residual));
        Assert.Equal(0, empty.Orders);
        var dead = LeakageSplit.Fit([Complex.Zero], [new Complex(0.001, 0)], [1], 50);
        Assert.True(double.IsNaN(dead.Residual));
        Assert.Equal(0, dead.Orders);
        // Voltage but no current: G = C = 0 exactly and a perfect fit (residual 0, not 0/0).
        var none = LeakageSplit.Fit([new Complex(230, 0), new Complex(0, 10)], [Complex.Zero, Complex.Zero], [1, 3], 50);
        Assert.Equal(0.0, none.ConductanceS);
        Assert.Equal(0.0, none.CapacitanceF);
        Assert.Equal(0.0, none.Residual);
        Assert.Equal(2, none.Orders);
    }

    [Fact]
    public void FitResidualOfAPureMisfitIsOne()
    {
        // Closed form: with the same voltage at orders 1 and 3 and currents +1 mA and −1 mA in phase with it, the
        // decoupled normal equations give G = ΣRe(I_n V_n*)/Σ|V_n|² = 0 and C = 0 (no quadrature part), so nothing of
        // the current is explained: residual √(Σ|I_n|²/Σ|I_n|²) = 1.
        var v = new Complex(230, 0);
        var fit = LeakageSplit.Fit([v, v], [new Complex(1e-3, 0), new Complex(-1e-3, 0)], [1, 3], 50);
        Assert.Equal(0.0, fit.ConductanceS, 1e-18);
        Assert.Equal(0.0, fit.CapacitanceF, 1e-18);
        Assert.Equal(1.0, fit.Residual, 1e-12);
    }

    [Fact]
    public void LocateRefusesAnythingButThreeVoltages()
    {
        var e = Assert.Throws<ArgumentException>(() => LeakageSplit.Locate([new Complex(230, 0), new Complex(-115, -199)], new Complex(1e-3, 0)));
        Assert.Contains("three phase voltages", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void LocateOfNoCurrentIsZeroAlongL1()
    {
        var (first, second) = LeakageSplit.Locate(Balanced(230), Complex.Zero);
        Assert.Equal(new LeakageDirection(0, false, 0), first);
        Assert.Equal(new LeakageDirection(0, true, 0), second);
    }

    [Theory]
    [InlineData(0, false)]
    [InlineData(1, true)]
    [InlineData(2, false)]
    public void A_current_exactly_along_one_direction_is_all_there(int phase, bool capacitive)
    {
        // Closed form: I = 2 mA along one direction (V_p/|V_p|, or j times it). Two bracketing pairs hold it with the
        // other coefficient 0 (within rounding, the 1e-12 tolerance); the tighter one is taken, and the whole current
        // is on the direction itself: 2 mA first, 0 second.
        var v = Balanced(230);
        var unit = v[phase] / 230;
        var i = 0.002 * (capacitive ? unit * Complex.ImaginaryOne : unit);
        var (first, second) = LeakageSplit.Locate(v, i);
        Assert.Equal(phase, first.Phase);
        Assert.Equal(capacitive, first.Capacitive);
        Assert.Equal(0.002, first.CurrentA, 1e-15);
        Assert.Equal(0.0, second.CurrentA, 1e-15);
    }

    [Fact]
    public void LocateSkipsParallelDirections()
    {
        // L2 in phase with L1 (a wiring fault, invented): L1's and L2's directions coincide (determinant 0, span 0) and
        // cannot bracket anything; a current at 45° between V1 (0°) and jV1 (90°) is split between them by the closed
        // form x = y = |I|/√2, not taken by the coinciding pair with 0/0 coefficients.
        Complex[] v = [new Complex(230, 0), new Complex(230, 0), Complex.FromPolarCoordinates(230, 2 * Math.PI / 3)];
        var i = Complex.FromPolarCoordinates(0.002, Math.PI / 4);
        var (first, second) = LeakageSplit.Locate(v, i);
        Assert.True(double.IsFinite(first.CurrentA) && double.IsFinite(second.CurrentA));
        var rebuilt = (Direction(v, first) * first.CurrentA) + (Direction(v, second) * second.CurrentA);
        Assert.Equal(i.Real, rebuilt.Real, 1e-15);
        Assert.Equal(i.Imaginary, rebuilt.Imaginary, 1e-15);
        Assert.Equal(0.002 / Math.Sqrt(2), first.CurrentA, 1e-15);
        Assert.Equal(0.002 / Math.Sqrt(2), second.CurrentA, 1e-15);
    }
}
