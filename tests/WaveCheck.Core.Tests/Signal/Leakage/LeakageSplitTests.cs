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

    [Fact]
    public void BinOutsideTheSpectrumIsRefusedWithTheRange()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => LeakageSplit.BinPhasor(new double[100], 50));
        Assert.Contains("1..49", e.Message, StringComparison.Ordinal);
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
}
