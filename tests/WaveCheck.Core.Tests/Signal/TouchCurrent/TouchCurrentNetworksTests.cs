using System.Diagnostics;
using System.Globalization;
using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// IEC 60990 networks: the analog transfer functions against closed-form circuit impedances and scipy, the bilinear
/// sections against the analog networks, and the standard's equivalences.
/// </summary>
public class TouchCurrentNetworksTests
{
    private static readonly double[] FrequenciesHz = [50, 1000, 10_000];

    public static TheoryData<string> Networks => new() { "unweighted", "perception", "letgo" };

    private static AnalogTransferFunction Network(string name) => name switch
    {
        "unweighted" => TouchCurrentNetworks.Unweighted(),
        "perception" => TouchCurrentNetworks.Perception(),
        _ => TouchCurrentNetworks.LetGo(),
    };

    /// <summary>
    /// Closed form: reading/I from the element impedances at one frequency (current I into the terminals; the
    /// series RS ∥ CS carries I and shapes nothing), evaluated directly with complex impedances, no polynomials.
    /// </summary>
    private static Complex CircuitResponse(string name, double f)
    {
        var s = new Complex(0, 2 * Math.PI * f);
        Complex Cap(double c) => 1 / (s * c);
        Complex Par(Complex a, Complex b) => a * b / (a + b);
        const double rb = 500;
        switch (name)
        {
            case "unweighted":
                return rb / 500.0; // U1 = I RB
            case "perception":
                {
                    var branch = 10e3 + Cap(0.022e-6);
                    var vt = Par(rb, branch);
                    return vt * Cap(0.022e-6) / branch / 500.0; // U2 across C1
                }

            default:
                {
                    var zb = 20e3 + Cap(9.1e-9);
                    var zp = Par(Cap(6.2e-9), zb);
                    var zl = 10e3 + zp;
                    var vt = Par(rb, zl);
                    var v1 = vt * zp / zl;
                    return v1 * Cap(9.1e-9) / zb / 500.0; // U3 across C2
                }
        }
    }

    private static void AssertClose(Complex expected, Complex actual, double relative, string what) =>
        Assert.True((expected - actual).Magnitude <= relative * expected.Magnitude,
            $"{what}: expected {expected}, got {actual} (|diff| {(expected - actual).Magnitude:E3}, allowed {relative * expected.Magnitude:E3})");

    [Theory]
    [MemberData(nameof(Networks))]
    public void AnalogTransferFunctionMatchesTheCircuit(string name)
    {
        // Closed-form impedances; double rounding only: 1e-12 relative.
        foreach (var f in FrequenciesHz)
        {
            AssertClose(CircuitResponse(name, f), Network(name).Response(f), 1e-12, $"{name} at {f} Hz");
        }
    }

    [Fact]
    public void AnalogAndDigitalMatchScipy()
    {
        // scipy.signal.freqs / bilinear_zpk + freqz_zpk on transfer functions built by impedance algebra in the
        // script (touch_networks_reference.py). 1e-8 relative: unreduced polynomials with coefficients spanning
        // ~1e-25..1 lose some digits in scipy's evaluation.
        var rows = RunScipy(FrequenciesHz, [50_000]);
        Assert.Equal(3 * 3 * 2, rows.Count);
        foreach (var (name, kind, f, fs, h) in rows)
        {
            var mine = kind == "analog" ? Network(name).Response(f) : TouchCurrentNetworks.Discretise(Network(name), fs).Response(f);
            AssertClose(h, mine, 1e-8, $"{name} {kind} at {f} Hz");
        }
    }

    [Theory]
    [MemberData(nameof(Networks))]
    public void DigitalResponseIsTheAnalogAtTheWarpedFrequency(string name)
    {
        // Bilinear transform without prewarping, exact identity: H_d(f) = H_a((fs/pi) tan(pi f / fs)). 1e-10 relative.
        const double fs = 50_000;
        var digital = TouchCurrentNetworks.Discretise(Network(name), fs);
        foreach (var f in FrequenciesHz)
        {
            var warped = fs / Math.PI * Math.Tan(Math.PI * f / fs);
            AssertClose(Network(name).Response(warped), digital.Response(f), 1e-10, $"{name} at {f} Hz");
        }
    }

    [Theory]
    [InlineData("perception", 1, 50_000)]
    [InlineData("letgo", 2, 50_000)]
    [InlineData("perception", 1, 200_000)]
    [InlineData("letgo", 2, 200_000)]
    public void DigitalResponseIsWithinTheWarpingBound(string name, int order, double fs)
    {
        // Tolerance: the warping moves f to f_a = (fs/pi) tan(pi f/fs); an all-pole network of order N changes by
        // at most N x (f_a/f - 1) in relative terms over that step (|d ln H / d ln f| <= N), plus rounding.
        // At 50 kS/s: 0.0003 % at 50 Hz, 0.13 % at 1 kHz, 15.6 % at 10 kHz; at 200 kS/s: 0.83 % at 10 kHz.
        var digital = TouchCurrentNetworks.Discretise(Network(name), fs);
        foreach (var f in FrequenciesHz)
        {
            var stretch = (fs / Math.PI * Math.Tan(Math.PI * f / fs) / f) - 1;
            var tolerance = (order * stretch) + 1e-10;
            var analog = CircuitResponse(name, f);
            var ratio = digital.Response(f).Magnitude / analog.Magnitude;
            Assert.True(Math.Abs(ratio - 1) <= tolerance, $"{name} at {f} Hz, {fs} S/s: |H_d|/|H_a| = {ratio}, allowed ±{tolerance:E3}");
        }
    }

    [Fact]
    public void PerceptionPoleIsWhereTheComponentsPutIt()
    {
        // Closed form (current drive): pole at 1/(2 pi C1 (R1 + RB)) = 1/(2 pi 0.022 uF 10.5 kOhm) = 689.0 Hz,
        // where |H| = 1/sqrt(2).
        var fp = 1 / (2 * Math.PI * 0.022e-6 * 10_500);
        Assert.Equal(689.0, fp, 0);
        Assert.Equal(1 / Math.Sqrt(2), TouchCurrentNetworks.Perception().Response(fp).Magnitude, 12);
    }

    [Fact]
    public void UnweightedDcEquivalenceOfTheStandard()
    {
        // IEC 60990: U1 = 1.0 V corresponds to 2.0 mA DC (U1 / 500 Ohm).
        var meter = new TouchCurrentMeter(50_000);
        meter.Push(Enumerable.Repeat(0.002, 50_000).ToArray());
        Assert.Equal(1.0, meter.Result.DcA * TouchCurrentNetworks.ReadingOhm, 9); // summation rounding over 50 000 samples
        Assert.Equal(1.0, meter.Result.UnweightedPeakA * TouchCurrentNetworks.ReadingOhm, 12);
    }

    [Theory]
    [InlineData(50.0)]
    [InlineData(60.0)]
    public void PerceptionPeakEquivalenceOfTheStandard(double mainsHz)
    {
        // IEC 60990: U2 = 0.35 V peak corresponds to 0.7 mA peak at 50/60 Hz. Under current drive the network
        // reads |H2| = 1/sqrt(1 + (2 pi f C1 (R1+RB))^2) = 0.9974 at 50 Hz, 0.9962 at 60 Hz: within 0.5 %.
        const double fs = 50_000;
        var meter = new TouchCurrentMeter(fs);
        var x = new double[(int)fs];
        for (var i = 0; i < x.Length; i++)
        {
            x[i] = 0.0007 * Math.Sin(2 * Math.PI * mainsHz * i / fs);
        }

        meter.Push(x);
        Assert.Equal(0.35, meter.Result.PerceptionPeakA * TouchCurrentNetworks.ReadingOhm, 0.35 * 0.005);
    }

    [Fact]
    public void DiscretiseRejectsBadRatesAndOrders()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => TouchCurrentNetworks.Discretise(TouchCurrentNetworks.Perception(), 0));
        Assert.Throws<ArgumentException>(() => TouchCurrentNetworks.Discretise(new AnalogTransferFunction([1.0], [1.0, 1, 1, 1]), 1000));
    }

    private static List<(string Name, string Kind, double F, double Fs, Complex H)> RunScipy(double[] freqs, double[] rates)
    {
        var script = ReferenceScripts.Path("touch_networks_reference.py");
        var inv = CultureInfo.InvariantCulture;
        var psi = new ProcessStartInfo("/usr/bin/python3")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        psi.ArgumentList.Add(script);
        psi.ArgumentList.Add(string.Join(',', freqs.Select(f => f.ToString("R", inv))));
        psi.ArgumentList.Add(string.Join(',', rates.Select(f => f.ToString("R", inv))));
        using var p = Process.Start(psi)!;
        var stdout = p.StandardOutput.ReadToEnd();
        var stderr = p.StandardError.ReadToEnd();
        p.WaitForExit();
        Assert.True(p.ExitCode == 0, "scipy reference failed: " + stderr);
        var rows = new List<(string, string, double, double, Complex)>();
        foreach (var line in stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries))
        {
            var t = line.Split(' ');
            rows.Add((t[0], t[1], double.Parse(t[2], inv), double.Parse(t[3], inv),
                new Complex(double.Parse(t[4], inv), double.Parse(t[5], inv))));
        }

        return rows;
    }
}
