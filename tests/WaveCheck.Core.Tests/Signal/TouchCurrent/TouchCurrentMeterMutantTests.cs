using System.Diagnostics;
using System.Globalization;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// The streaming touch-current meter against outside references where the earlier tests left mutants alive: the
/// start-up samples reaching both filters, the unweighted peak taking the larger excursion, exact zeros in the input,
/// each against closed forms or scipy state-space models of the IEC 60990 Fig. 4/5 circuits.
/// </summary>
public class TouchCurrentMeterMutantTests
{
    private const double Fs = 100_000;

    // 5 ms of settling at 100 kS/s (TouchCurrentMeter.SettlingS, documented): the first 500 samples feed only the filters.
    private const int Settle = 500;

    private const double PeakA = 0.001;

    private static double[] Sine(double peakA, double f, int n, double offsetA = 0)
    {
        var x = new double[n];
        for (var i = 0; i < n; i++)
        {
            x[i] = offsetA + (peakA * Math.Sin(2 * Math.PI * f * i / Fs));
        }

        return x;
    }

    private static double[] HalfWave(int n)
    {
        // Half-wave rectified 50 Hz: exact zeros over every negative half-cycle.
        var x = Sine(PeakA, 50, n);
        for (var i = 0; i < n; i++)
        {
            x[i] = Math.Max(x[i], 0);
        }

        return x;
    }

    /// <summary>The waveforms checked against scipy, by name.</summary>
    private static readonly Dictionary<string, double[]> Waveforms = new()
    {
        // Starts at zero phase: at sample 500 (5 ms) the 50 Hz sine is at its crest, so a filter starting at rest there
        // would lag far behind one that saw the settling samples. 10 ms kept.
        ["sine50FromZero"] = Sine(PeakA, 50, Settle + 1000),
        // 1 kHz, the let-go network's region of weighting; 2 ms kept.
        ["sine1kFromZero"] = Sine(PeakA, 1000, Settle + 200),
        // Pulsating DC from a rectifier load; 5 whole cycles kept.
        ["halfWave50"] = HalfWave(Settle + 10_000),
        // Sine with a DC offset of each sign: the peak comes from the crest, then from the trough.
        ["sinePlusDc"] = Sine(PeakA, 50, Settle + 2000, 0.0004),
        ["sineMinusDc"] = Sine(PeakA, 50, Settle + 2000, -0.0004),
    };

    public static TheoryData<string> WaveformNames => new(Waveforms.Keys);

    private static readonly Lazy<Dictionary<string, TouchCurrentResult>> ScipyReadings = new(RunScipy);

    private static TouchCurrentResult Measure(double[] x)
    {
        var meter = new TouchCurrentMeter(Fs);
        meter.Push(x);
        return meter.Result;
    }

    private static void AssertRelative(double expected, double actual, double relative, string what) =>
        Assert.True(Math.Abs(expected - actual) <= relative * Math.Abs(expected),
            $"{what}: expected {expected:R}, got {actual:R}");

    [Theory]
    [MemberData(nameof(WaveformNames))]
    public void ReadingsMatchTheCircuitModelsRunFromRest(string name)
    {
        // scipy 1.10 (tests/reference/touch_meter_reference.py): state-space models written from the Fig. 4/5
        // circuits (R1 = 10 kΩ, C1 = 22 nF; R1 = 10 kΩ, C1 = 6.2 nF, R2 = 20 kΩ, C2 = 9.1 nF; RB = 500 Ω),
        // cont2discrete bilinear, dlsim over the whole record from rest, first 500 samples dropped.
        // 1e-9 relative: two realisations of the same rational function differ by rounding only (~1e-13 seen).
        var expected = ScipyReadings.Value[name];
        var r = Measure(Waveforms[name]);
        AssertRelative(expected.UnweightedRmsA, r.UnweightedRmsA, 1e-9, "unweighted RMS");
        AssertRelative(expected.UnweightedPeakA, r.UnweightedPeakA, 1e-9, "unweighted peak");
        AssertRelative(expected.PerceptionPeakA, r.PerceptionPeakA, 1e-9, "perception peak");
        AssertRelative(expected.PerceptionRmsA, r.PerceptionRmsA, 1e-9, "perception RMS");
        AssertRelative(expected.LetGoPeakA, r.LetGoPeakA, 1e-9, "let-go peak");
        AssertRelative(expected.LetGoRmsA, r.LetGoRmsA, 1e-9, "let-go RMS");
        Assert.Equal(expected.DcA, r.DcA, 1e-15); // mean of the kept samples; 1e-15 A absolute, rounding
    }

    [Fact]
    public void DirectCurrentReadsTheSameThroughEveryNetwork()
    {
        // IEC 60990 Fig. 3/4/5, closed form: at DC the capacitors carry nothing, all of I flows through RB and every
        // output voltage is 500 Ω x I, so each reading is I. 5 ms + 0.5 ms: the readings are taken right after the
        // settling cut, where a filter that had not seen the settling samples would still be rising (perception
        // time constant C1 (R1 + RB) = 0.23 ms). 1e-6 relative: the let-go start-up term left after 5 ms is ~5e-8.
        const double dcA = 0.002;
        var x = new double[Settle + 50];
        Array.Fill(x, dcA);
        var r = Measure(x);
        foreach (var (what, value) in new[]
                 {
                     ("unweighted RMS", r.UnweightedRmsA), ("unweighted peak", r.UnweightedPeakA),
                     ("perception RMS", r.PerceptionRmsA), ("perception peak", r.PerceptionPeakA),
                     ("let-go RMS", r.LetGoRmsA), ("let-go peak", r.LetGoPeakA), ("DC", r.DcA),
                 })
        {
            AssertRelative(dcA, value, 1e-6, what);
        }
    }

    [Fact]
    public void SilenceReadsZeroNotNaN()
    {
        // Closed form: linear networks at rest, zero in, zero out; every figure is exactly 0 (and finite: no 0/0).
        var r = Measure(new double[Settle + 100]);
        Assert.Equal(new TouchCurrentResult(0, 0, 0, 0, 0, 0, 0), r);
    }

    [Theory]
    [InlineData(0.0004)]
    [InlineData(-0.0004)]
    public void UnweightedPeakIsTheLargerExcursion(double offsetA)
    {
        // Closed form for A sin + D over one whole cycle sampled at 2000 points (crest at i = 500 and trough at
        // i = 1500 after the cut are sampled exactly): peak A + |D|, RMS sqrt(A²/2 + D²), DC D. Fig. 3 gain RB/500 = 1.
        // 1e-12: rounding of sums over 2000 samples.
        var r = Measure(Sine(PeakA, 50, Settle + 2000, offsetA));
        AssertRelative(PeakA + Math.Abs(offsetA), r.UnweightedPeakA, 1e-12, "unweighted peak");
        AssertRelative(Math.Sqrt((PeakA * PeakA / 2) + (offsetA * offsetA)), r.UnweightedRmsA, 1e-12, "unweighted RMS");
        AssertRelative(offsetA, r.DcA, 1e-12, "DC");
    }

    [Fact]
    public void HalfWaveRectifiedSineReadsItsClosedForms()
    {
        // Closed form for a half-wave rectified sine of peak A over whole cycles: RMS A/2, DC A/π, peak A. Sampled at
        // M = 1000 points per half-cycle the sums are exact for the RMS (Σ sin²(πk/M) = M/2) and cot(π/2M)/(2M) A for
        // the DC, 8e-7 below A/π: 1e-6 relative. All weighted readings finite and below the unweighted ones (the
        // networks are low-pass with DC gain 1, IEC 60990 Fig. 4/5).
        var r = Measure(HalfWave(Settle + 10_000));
        AssertRelative(PeakA / 2, r.UnweightedRmsA, 1e-9, "unweighted RMS");
        AssertRelative(PeakA, r.UnweightedPeakA, 1e-12, "unweighted peak");
        AssertRelative(PeakA / Math.PI, r.DcA, 1e-6, "DC");
        Assert.InRange(r.PerceptionRmsA, PeakA / Math.PI, r.UnweightedRmsA);
        Assert.InRange(r.LetGoRmsA, PeakA / Math.PI, r.PerceptionRmsA);
    }

    private static Dictionary<string, TouchCurrentResult> RunScipy()
    {
        var inv = CultureInfo.InvariantCulture;
        var dir = Path.Combine(Path.GetTempPath(), $"wavecheck-touchmeter-{Environment.ProcessId}-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        try
        {
            var names = Waveforms.Keys.ToArray();
            var psi = new ProcessStartInfo("/usr/bin/python3")
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
            };
            psi.ArgumentList.Add(ReferenceScripts.Path("touch_meter_reference.py"));
            psi.ArgumentList.Add(Fs.ToString("R", inv));
            psi.ArgumentList.Add(Settle.ToString(inv));
            foreach (var name in names)
            {
                var file = Path.Combine(dir, name + ".txt");
                File.WriteAllLines(file, Waveforms[name].Select(v => v.ToString("R", inv)));
                psi.ArgumentList.Add(file);
            }

            using var p = Process.Start(psi)!;
            var stdout = p.StandardOutput.ReadToEnd();
            var stderr = p.StandardError.ReadToEnd();
            p.WaitForExit();
            Assert.True(p.ExitCode == 0, "scipy reference failed: " + stderr);
            var lines = stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            Assert.Equal(names.Length, lines.Length);
            var result = new Dictionary<string, TouchCurrentResult>();
            for (var i = 0; i < names.Length; i++)
            {
                var v = lines[i].Split(' ').Select(t => double.Parse(t, inv)).ToArray();
                result[names[i]] = new TouchCurrentResult(v[0], v[1], v[2], v[3], v[4], v[5], v[6]);
            }

            return result;
        }
        finally
        {
            Directory.Delete(dir, true);
        }
    }
}
