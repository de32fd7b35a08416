using System.Diagnostics;
using System.Globalization;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class MetricAccumulatorTests
{
    private static string ScriptPath() => ReferenceScripts.Path("metric_statistics.py");

    private static (double Mean, double P95, double Max, double TimeOfMaxS) Numpy(double[] values, double[] starts, bool signed)
    {
        var file = Path.Combine(Path.GetTempPath(), $"wavecheck-metric-{Environment.ProcessId}-{Guid.NewGuid():N}.txt");
        File.WriteAllLines(file, values.Select((v, i) => string.Create(CultureInfo.InvariantCulture,
            $"{(double.IsNaN(v) ? "nan" : v.ToString("R", CultureInfo.InvariantCulture))} {starts[i]:R}")));
        try
        {
            var start = new ProcessStartInfo("/usr/bin/python3", [ScriptPath(), file, signed ? "signed" : "unsigned"])
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
            };
            using var process = Process.Start(start)!;
            var output = process.StandardOutput.ReadToEnd();
            var error = process.StandardError.ReadToEnd();
            process.WaitForExit();
            Assert.True(process.ExitCode == 0, error);
            var parts = output.Trim().Split(' ').Select(p => double.Parse(p, CultureInfo.InvariantCulture)).ToArray();
            return (parts[0], parts[1], parts[2], parts[3]);
        }
        finally
        {
            File.Delete(file);
        }
    }

    private static MetricAccumulator Accumulate(double[] values, double[] starts, bool signed)
    {
        var acc = new MetricAccumulator(signed);
        for (var i = 0; i < values.Length; i++)
        {
            acc.Add(values[i], starts[i]);
        }

        return acc;
    }

    public static TheoryData<string, bool> Cases() => new()
    {
        { "positive", false },          // an RMS-like metric, some windows without a value (NaN)
        { "negative-largest", true },   // a signed DC whose largest magnitude is negative: P95 and max negative
        { "positive-largest", true },   // signed, mostly negative values but the largest magnitude positive
        { "ties", true },               // +x and −x of equal magnitude, and a repeated maximum: the first one counts
        { "ties", false },
    };

    private static (double[] Values, double[] Starts) Make(string kind)
    {
        var random = new Random(kind.Length * 7919);
        var n = 1000;
        var values = new double[n];
        var starts = new double[n];
        for (var i = 0; i < n; i++)
        {
            starts[i] = i * 0.2;
            values[i] = kind switch
            {
                "positive" => i % 97 == 5 ? double.NaN : 0.01 * random.NextDouble(),
                "negative-largest" => 0.004 * (random.NextDouble() - 0.3) - (i == 613 ? 0.02 : 0),
                "positive-largest" => -0.004 * random.NextDouble() + (i == 211 ? 0.02 : 0),
                _ => Math.Round(10 * (random.NextDouble() - 0.5)) / 1000,
            };
        }

        if (kind == "ties")
        {
            values[100] = 0.009;
            values[300] = -0.009;
            values[500] = 0.009;
        }

        return (values, starts);
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void Statistics_match_numpy(string kind, bool signed)
    {
        // Reference: numpy (nanmean, percentile with its default linear interpolation, argmax's first occurrence) via
        // the script beside this file. 1000 windows: within StreamingQuantile's exact range, so the 95th percentile
        // must agree to rounding (1e-12 relative); the mean likewise; the maximum and its time exactly.
        var (values, starts) = Make(kind);
        var result = Accumulate(values, starts, signed).Result();
        var reference = Numpy(values, starts, signed);
        Assert.Equal(reference.Mean, result.Mean, 1e-12 * Math.Abs(reference.Mean) + 1e-18);
        Assert.Equal(reference.P95, result.P95, 1e-12 * Math.Abs(reference.P95));
        Assert.Equal(reference.Max, result.Max);
        Assert.Equal(reference.TimeOfMaxS, result.TimeOfMaxS);
        if (kind == "negative-largest")
        {
            Assert.True(result.P95 < 0 && result.Max < 0, "a signed metric's P95 takes the sign of its maximum");
        }
    }

    [Fact]
    public void Closed_forms_on_one_to_a_hundred()
    {
        // Values 1..100 at starts 0.2·(i − 1): mean 50.5 (arithmetic series), 95th percentile 1 + 0.95·99 = 95.05
        // (linear interpolation between order statistics, rank p·(n − 1)), maximum 100 at 19.8 s.
        var acc = new MetricAccumulator(false);
        for (var i = 1; i <= 100; i++)
        {
            acc.Add(i, 0.2 * (i - 1));
        }

        var r = acc.Result();
        Assert.Equal(100, acc.Count);
        Assert.Equal(50.5, r.Mean, 1e-12);
        Assert.Equal(95.05, r.P95, 1e-12);
        Assert.Equal(100, r.Max);
        Assert.Equal(0.2 * 99, r.TimeOfMaxS, 1e-12);
    }

    [Fact]
    public void Signed_closed_forms_on_minus_one_to_minus_a_hundred()
    {
        // The same magnitudes, negative, signed: mean −50.5, P95 −95.05 (of the magnitudes, with the maximum's sign),
        // maximum −100 at 19.8 s. Unsigned, the maximum of −1..−100 is −1 (at 0 s) and the P95 −5.95 (rank 94.05 of the
        // ascending −100..−1).
        var signed = new MetricAccumulator(true);
        var plain = new MetricAccumulator(false);
        for (var i = 1; i <= 100; i++)
        {
            signed.Add(-i, 0.2 * (i - 1));
            plain.Add(-i, 0.2 * (i - 1));
        }

        Assert.Equal(new MetricStatistics(-50.5, -95.05, -100, 0.2 * 99), Round(signed.Result()));
        Assert.Equal(new MetricStatistics(-50.5, -5.95, -1, 0), Round(plain.Result()));
    }

    [Fact]
    public void Unsigned_takes_the_largest_value_and_signed_the_largest_magnitude()
    {
        // −5 then 3: unsigned, the largest value is 3 (at 0.2 s); signed, the largest magnitude is −5 (at 0 s).
        var plain = new MetricAccumulator(false);
        var signed = new MetricAccumulator(true);
        foreach (var acc in new[] { plain, signed })
        {
            acc.Add(-5, 0);
            acc.Add(3, 0.2);
        }

        Assert.Equal((3.0, 0.2), (plain.Result().Max, plain.Result().TimeOfMaxS));
        Assert.Equal((-5.0, 0.0), (signed.Result().Max, signed.Result().TimeOfMaxS));
    }

    [Fact]
    public void A_signed_metric_that_is_all_zero_has_no_sign_to_give()
    {
        // Every window 0: the maximum is 0, and the P95 stays +0, not −0 (which a writer would print as "-0").
        var acc = new MetricAccumulator(true);
        acc.Add(0, 0);
        acc.Add(0, 0.2);
        var r = acc.Result();
        Assert.Equal(0, r.Max);
        Assert.False(double.IsNegative(r.P95), $"P95 {r.P95:R}");
    }

    private static MetricStatistics Round(MetricStatistics s) =>
        new(Math.Round(s.Mean, 9), Math.Round(s.P95, 9), Math.Round(s.Max, 9), Math.Round(s.TimeOfMaxS, 9));

    [Fact]
    public void Nothing_added_gives_nan_and_nan_is_not_counted()
    {
        var acc = new MetricAccumulator(true);
        acc.Add(double.NaN, 0);
        Assert.Equal(0, acc.Count);
        var r = acc.Result();
        Assert.True(double.IsNaN(r.Mean) && double.IsNaN(r.P95) && double.IsNaN(r.Max) && double.IsNaN(r.TimeOfMaxS));
        acc.Add(-0.003, 1.5);
        acc.Add(double.NaN, 2.0);
        Assert.Equal(1, acc.Count);
        Assert.Equal(new MetricStatistics(-0.003, -0.003, -0.003, 1.5), acc.Result());
    }
}
