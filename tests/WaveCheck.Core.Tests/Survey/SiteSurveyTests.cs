using System.Text.Json;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Survey;
using WaveCheck.Core.Tests.Capture;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>The survey orchestration (<see cref="SiteSurvey"/>) on an invented workshop: real captures on disk, each
/// analysed, judged and reported, a bad one isolated, the upstream device checked, the summary files written.</summary>
public sealed class SiteSurveyTests : IDisposable
{
    private const double RateHz = 50_000;
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    private string Wav(string name, Func<double, double> currentA)
    {
        var path = _folder.File(name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        var samples = new double[(int)RateHz]; // 1 s
        for (var n = 0; n < samples.Length; n++)
        {
            samples[n] = currentA(n / RateHz);
        }

        CaptureWriter.WriteWav(path, [samples], RateHz, 0.1, WavSampleFormat.Float32, SensorCoupling.Dc);
        return path;
    }

    private static SurveyJob Job(string path, DeviceType installed, string circuit) =>
        new(path, new CaptureSettings { InstalledType = installed, Circuit = circuit, RatedResidualCurrentA = 0.030 });

    [Fact]
    public void A_workshop_survey_judges_each_capture_isolates_a_bad_one_and_writes_its_summary()
    {
        // Closed forms and IEC 60364-5-53 §531.3.3: a 5 mA rms sinusoid at 50 Hz is mains-frequency AC only (type AC
        // is enough, so an installed type A is "ok"); a half-wave rectified 20 mA-peak current rests at zero for 180°
        // of each cycle, pulsating DC (IEC 61008-1), which type AC does not detect ("upgrade", type A required).
        var saw = Wav("bench-saw.wav", t => 0.005 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * t));
        var dimmer = Wav("dimmer.wav", t => Math.Max(0, 0.02 * Math.Sin(2 * Math.PI * 50 * t)));
        var saw2 = Wav(Path.Combine("annex", "bench-saw.wav"), t => 0.002 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * t));
        var broken = _folder.Write("broken.csv", "time [s],I [mA]\n0,1\n0.001,abc\n");
        var jobs = new[]
        {
            Job(saw, DeviceType.A, "saw bench"),
            Job(dimmer, DeviceType.AC, "spray booth lights"),
            Job(broken, DeviceType.A, "compressor"),
            Job(saw2, DeviceType.A, "annex saw"),
        };
        var upstream = new[] { new UpstreamGroup("workshop board", DeviceType.A, 0.1, [saw, dimmer, broken]) };
        var output = _folder.File("out");
        var reports = new List<(string File, string Stem)>();
        var progress = new List<(int Done, int Total)>();

        var document = SiteSurvey.Run(jobs, upstream, new SiteSurveyOptions
        {
            OutputDirectory = output,
            Site = "Invented Joinery Workshop",
            Parquet = true,
            MaxParallel = 2,
            WriteReport = (job, _, stem) =>
            {
                lock (reports)
                {
                    reports.Add((job.File, stem));
                }

                return $"reports/{stem}.html";
            },
        }, new SynchronousProgress(p => { lock (progress) { progress.Add(p); } }));

        Assert.Equal("Invented Joinery Workshop", document.Site);
        Assert.Equal([saw, dimmer, broken, saw2], document.Rows.Select(r => r.File));
        Assert.Equal(["ok", "upgrade", "error", "ok"], document.Rows.Select(r => r.Verdict));
        Assert.Equal(["AC", "A", null, "AC"], document.Rows.Select(r => r.RequiredType));
        Assert.Equal(["saw bench", "spray booth lights", "compressor", "annex saw"], document.Rows.Select(r => r.Circuit));
        Assert.Contains("broken.csv", document.Rows[2].Error, StringComparison.Ordinal);
        Assert.Contains("abc", document.Rows[2].Error, StringComparison.Ordinal);
        // Worst-window RMS: 5 mA for the sinusoid; Ipk/2 = 10 mA for the half-wave (closed form); within 1 % (float32
        // WAV, window edges).
        Assert.Equal(0.005, document.Rows[0].WorstWindowRmsA!.Value, 0.00005);
        Assert.Equal(0.010, document.Rows[1].WorstWindowRmsA!.Value, 0.0001);
        // Smooth DC of a half-wave: its floor, zero (closed form); the sinusoid's mean, zero.
        Assert.Equal(0, document.Rows[0].SmoothDcA!.Value, 0.0001);

        // Reports: one per capture that was analysed, each with a stem unique in the survey (the second bench-saw
        // gets a suffix), the path returned kept in its row.
        Assert.Equal(3, reports.Count);
        Assert.Equal("bench-saw", reports.Single(r => r.File == saw).Stem);
        Assert.Equal("bench-saw-2", reports.Single(r => r.File == saw2).Stem);
        Assert.Equal("reports/bench-saw-2.html", document.Rows[3].ReportPath);
        Assert.Null(document.Rows[2].ReportPath);
        Assert.Equal(4, progress.Count);
        Assert.All(progress, p => Assert.Equal(4, p.Total));

        // Upstream: the arithmetic sum of the members' worst-window RMS (UpstreamCheck, practice), incomplete
        // because one member failed; the two analysed need no more than type A, but with a member unanalysed
        // whether the type fits stays open.
        var board = Assert.Single(document.Upstream);
        Assert.False(board.Complete);
        Assert.Equal([broken], board.FailedMembers);
        Assert.Equal(document.Rows[0].WorstWindowRmsA!.Value + document.Rows[1].WorstWindowRmsA!.Value, board.StandingSumA, 1e-12);
        Assert.Null(board.TypeMismatch);

        // The summary files: CSV with a header and a line per row, JSON with the same rows, both Parquet tables.
        Assert.Equal(5, File.ReadAllLines(Path.Combine(output, "survey.csv")).Length);
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "survey.json")));
        Assert.Equal(4, json.RootElement.GetProperty("rows").GetArrayLength());
        Assert.Equal("workshop board", json.RootElement.GetProperty("upstream")[0].GetProperty("name").GetString());
        Assert.True(new FileInfo(Path.Combine(output, "captures.parquet")).Length > 0);
        Assert.True(new FileInfo(Path.Combine(output, "windows.parquet")).Length > 0);
    }

    [Fact]
    public void Without_parquet_or_reports_only_the_summary_is_written_into_a_new_folder()
    {
        var saw = Wav("bench-saw.wav", t => 0.005 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * t));
        var output = _folder.File(Path.Combine("new", "deeper"));
        var document = SiteSurvey.Run([Job(saw, DeviceType.AC, "saw")], [], new SiteSurveyOptions { OutputDirectory = output });
        Assert.Equal("unnamed site", document.Site);
        Assert.Null(Assert.Single(document.Rows).ReportPath);
        Assert.Empty(document.Upstream);
        Assert.Equal(["survey.csv", "survey.json"], Directory.GetFiles(output).Select(Path.GetFileName).Order());
    }

    [Theory]
    [InlineData("na", true, true, Regime.Na, true)]
    [InlineData("iec", false, true, Regime.Iec, false)] // charger DC detection counts only at a charging point
    [InlineData("nonsense", true, false, Regime.Iec, false)] // an unknown regime falls back to IEC
    public void Survey_settings_become_assessment_options(string regime, bool ev, bool chargerDc, Regime expectedRegime,
        bool expectedChargerDc)
    {
        var options = SiteSurvey.ToAssessmentOptions(new CaptureSettings
        {
            RatedResidualCurrentA = 0.1,
            InstalledType = DeviceType.F,
            Regime = regime,
            Ev = ev,
            InstalledRdcDd = true,
            ChargerDcDetection = chargerDc,
        });
        Assert.Equal(0.1, options.RatedResidualCurrentA);
        Assert.Equal(DeviceType.F, options.InstalledType);
        Assert.Equal(expectedRegime, options.Regime);
        Assert.Equal(ev, options.EvChargingPoint);
        Assert.True(options.InstalledRdcDd);
        Assert.Equal(expectedChargerDc, options.ChargerDcDetection);
        Assert.Throws<ArgumentNullException>(() => SiteSurvey.ToAssessmentOptions(null!));
    }

    private sealed class SynchronousProgress(Action<(int Done, int Total)> report) : IProgress<(int Done, int Total)>
    {
        public void Report((int Done, int Total) value) => report(value);
    }
}
