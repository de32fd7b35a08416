using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;
using WaveCheck.Core.Tests.Capture;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>
/// The survey orchestration (<see cref="SiteSurvey"/>) run from Core: each capture judged as a single analysis would
/// judge it, a bad capture isolated in its row, rows in input order, report names unique, upstream sums, Parquet on
/// request. Output-folder safety is in <see cref="SiteSurveyOutputTests"/>.
/// </summary>
public sealed class SiteSurveyTests : IDisposable
{
    private const int RateHz = 50_000;
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>One second at 50 kS/s (content seen to 25 kHz, past the 20 kHz of B+, so the verdict can be told) of <paramref name="samples"/>, float32 with 100 mA full scale (no clipping), DC-coupled sensor.</summary>
    private string Capture(string relative, double[] samples)
    {
        var path = _folder.File(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        CaptureWriter.WriteWav(path, [samples], RateHz, 0.1, WavSampleFormat.Float32, SensorCoupling.Dc);
        return path;
    }

    /// <summary>A 50 Hz sine of <paramref name="rmsA"/> RMS.</summary>
    private static double[] Sine(double rmsA) => Signals.Sine(RateHz, RateHz, 50, rmsA * Math.Sqrt(2));

    /// <summary>Half-wave rectified 50 Hz sine of peak <paramref name="peakA"/>: the pulsating DC of IEC 61008-1
    /// (type A test current, conduction angle 180°).</summary>
    private static double[] HalfWave(double peakA) => [.. Signals.Sine(RateHz, RateHz, 50, peakA).Select(x => Math.Max(0, x))];

    private SiteSurveyOptions Options(int maxParallel = 1, bool parquet = false) => new()
    {
        OutputDirectory = _folder.File("out"),
        MaxParallel = maxParallel,
        Parquet = parquet,
        WriteReport = (job, evaluation, path) => AtomicFile.WriteText(path, $"{job.Settings.Circuit}: {evaluation.Assessment.RequiredType}"),
        WriteIndex = (document, path) => AtomicFile.WriteText(path, $"{document.Rows.Count} rows"),
    };

    private static SurveyJob Job(string file, string circuit, DeviceType? installed = null, double ratedA = 0.030) =>
        new(file, new CaptureSettings { Circuit = circuit, InstalledProtection = installed is { } type ? new InstalledProtection(type) : null, RatedResidualCurrentA = ratedA });

    [Fact]
    public void Each_capture_is_judged_as_its_waveform_demands()
    {
        // A sinusoidal residual current is what type AC detects; pulsating DC needs at least type A
        // (IEC 61008-1:2010 §4.1, IEC 60755:2017 §5.2; REFERENCE.md). 5 mA and 10 mA peak are well above the
        // 1 mA DC threshold and below the 0.5 IΔn non-operating limit of a 30 mA device.
        var sine = Capture("c1.wav", Sine(0.005));
        var pulsating = Capture("c2.wav", HalfWave(0.010));
        var document = SiteSurvey.Run([Job(sine, "C1 lights", DeviceType.AC), Job(pulsating, "C2 dimmer", DeviceType.AC)], [], Options());

        Assert.Equal(2, document.Rows.Count);
        var c1 = document.Rows[0];
        var c2 = document.Rows[1];
        Assert.Equal("C1 lights", c1.Circuit);
        Assert.Equal(DeviceType.AC, c1.RequiredType);
        Assert.Equal(SurveyVerdict.Ok, c1.Verdict);
        Assert.Equal("C2 dimmer", c2.Circuit);
        Assert.Equal(DeviceType.A, c2.RequiredType);
        Assert.Equal(SurveyVerdict.Upgrade, c2.Verdict);

        // RMS of a sine of RMS 5 mA over whole cycles (closed form); 0.5 % for float32 and windowing.
        Assert.Equal(0.005, c1.RmsA!.Value, 0.005 * 0.005);
        // RMS of a half-wave rectified sine is peak/2 (closed form).
        Assert.Equal(0.005, c2.RmsA!.Value, 0.005 * 0.005);
        Assert.Equal(1.0, c1.DurationS!.Value, 1e-9);
        Assert.Equal(RateHz, c1.SampleRateHz);
    }

    [Fact]
    public void A_bad_capture_is_isolated_in_its_row_and_the_others_are_judged()
    {
        var good = Capture("good.wav", Sine(0.005));
        var bad = _folder.File("bad.wav");
        File.WriteAllText(bad, "this is not a RIFF file");
        var document = SiteSurvey.Run([Job(bad, "C1 broken"), Job(good, "C2 fine", DeviceType.A)], [], Options());

        Assert.Equal(SurveyVerdict.Error, document.Rows[0].Verdict);
        Assert.Contains("bad.wav", document.Rows[0].Error, StringComparison.Ordinal);
        Assert.Null(document.Rows[0].RequiredType);
        Assert.Equal(SurveyVerdict.Ok, document.Rows[1].Verdict);
        Assert.Null(document.Rows[1].Error);
        Assert.Equal(Finding.Error, Findings.Of(document) & Finding.Error);
    }

    [Fact]
    public void Rows_keep_input_order_when_captures_run_side_by_side()
    {
        var jobs = Enumerable.Range(1, 6)
            .Select(i => Job(Capture($"c{i}.wav", Sine(0.001 * i)), $"C{i}"))
            .ToList();
        var document = SiteSurvey.Run(jobs, [], Options(maxParallel: 3));

        Assert.Equal(jobs.Select(j => j.Settings.Circuit), document.Rows.Select(r => r.Circuit));
        // Each row carries its own capture's figure: RMS i mA (closed form of a sine's RMS), 1 %.
        for (var i = 0; i < jobs.Count; i++)
        {
            Assert.Equal(0.001 * (i + 1), document.Rows[i].RmsA!.Value, 0.001 * (i + 1) * 0.01);
        }
    }

    [Fact]
    public void Captures_that_share_a_name_get_reports_of_their_own()
    {
        var a = Capture("north/bay.wav", Sine(0.002));
        var b = Capture("south/bay.wav", Sine(0.004));
        var document = SiteSurvey.Run([Job(a, "north"), Job(b, "south")], [], Options());

        Assert.Equal("reports/bay.html", document.Rows[0].ReportPath);
        Assert.Equal("reports/bay-2.html", document.Rows[1].ReportPath);
        var output = _folder.File("out");
        Assert.StartsWith("north:", File.ReadAllText(Path.Combine(output, "reports", "bay.html")), StringComparison.Ordinal);
        Assert.StartsWith("south:", File.ReadAllText(Path.Combine(output, "reports", "bay-2.html")), StringComparison.Ordinal);
        Assert.Equal("2 rows", File.ReadAllText(Path.Combine(output, "index.html")));
    }

    [Fact]
    public void An_upstream_device_is_checked_against_the_sum_of_its_circuits()
    {
        // Two circuits of 8 mA standing leakage behind a 30 mA device: 16 mA, over the 0.3 IΔn = 9 mA leakage budget
        // (IEC 60364-5-53:2015 §531.3.2) and over the 0.5 IΔn = 15 mA non-operating limit (IEC 61008-1:2010 Table 1),
        // so tripping is likely.
        var a = Capture("a.wav", Sine(0.008));
        var b = Capture("b.wav", Sine(0.008));
        var document = SiteSurvey.Run([Job(a, "C1"), Job(b, "C2")],
            [new UpstreamGroup("Q1 main", DeviceType.A, 0.030, [a, b])], Options());

        var upstream = Assert.Single(document.Upstream);
        Assert.True(upstream.Complete);
        Assert.Equal(0.016, upstream.StandingSumA, 0.016 * 0.01);
        Assert.Equal(0.009, upstream.LeakageBudgetA, 1e-12);
        Assert.Equal(0.015, upstream.NonOperatingLimitA, 1e-12);
        Assert.False(upstream.WithinLeakageBudget);
        Assert.Equal(RiskLevel.Likely, upstream.LeakageRisk);
        Assert.Equal(Finding.Nuisance, Findings.Of(document) & Finding.Nuisance);
    }

    [Fact]
    public void Parquet_tables_are_written_only_on_request()
    {
        var a = Capture("a.wav", Sine(0.003));
        SiteSurvey.Run([Job(a, "C1")], [], Options(parquet: false));
        var output = _folder.File("out");
        Assert.False(File.Exists(Path.Combine(output, "captures.parquet")));
        Assert.True(File.Exists(Path.Combine(output, "survey.csv")));
        Assert.True(File.Exists(Path.Combine(output, "survey.json")));

        SiteSurvey.Run([Job(a, "C1")], [], Options(parquet: true));
        Assert.True(new FileInfo(Path.Combine(output, "captures.parquet")).Length > 0);
        Assert.True(new FileInfo(Path.Combine(output, "windows.parquet")).Length > 0);
    }

    [Fact]
    public void Charger_dc_detection_counts_only_at_a_charging_point()
    {
        // IEC 62955 RDC-DD belongs to a charging point (IEC 60364-7-722:2018 §722.531.3.101); off a charging point
        // the setting is dropped rather than taken as protection the circuit does not have (safe side).
        var off = SiteSurvey.ToAssessmentOptions(new CaptureSettings { ChargerDcDetection = true, Ev = false, RatedResidualCurrentA = 0.1 });
        var on = SiteSurvey.ToAssessmentOptions(new CaptureSettings { ChargerDcDetection = true, Ev = true, Regime = Regime.Na });

        Assert.False(off.ChargerDcDetection);
        Assert.Equal(0.1, off.RatedResidualCurrentA);
        Assert.True(on.ChargerDcDetection);
        Assert.True(on.EvChargingPoint);
        Assert.Equal(Regime.Na, on.Regime);
    }
}
