using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;
using WaveCheck.Core.Tests.Capture;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>A survey's output folder: replaced as one set, never over a capture, left whole when interrupted.</summary>
public sealed class SiteSurveyOutputTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>A 1 s, 5 mA RMS 50 Hz sine at 10 kS/s, a capture any survey can judge.</summary>
    private string Capture(string relative)
    {
        var path = _folder.File(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        CaptureWriter.WriteWav(path, [Signals.Sine(10_000, 10_000, 50, 0.005 * Math.Sqrt(2))], 10_000, 0.01,
            WavSampleFormat.Float32, SensorCoupling.Dc);
        return path;
    }

    private static SurveyJob Job(string file) => new(file, new CaptureSettings { Circuit = Path.GetFileNameWithoutExtension(file) });

    private static SiteSurveyOptions Options(string output, Action<SurveyJob, Evaluation, string>? report = null) => new()
    {
        OutputDirectory = output,
        MaxParallel = 1,
        WriteReport = report ?? ((job, _, path) => AtomicFile.WriteText(path, "report of " + job.Settings.Circuit)),
        WriteIndex = (document, path) => AtomicFile.WriteText(path, $"index of {document.Rows.Count}"),
    };

    /// <summary>Every file under <paramref name="folder"/>, relative, with its content.</summary>
    private static Dictionary<string, string> Snapshot(string folder) =>
        Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories)
            .ToDictionary(f => Path.GetRelativePath(folder, f), File.ReadAllText);

    private string[] WorkFolders() =>
        [.. Directory.EnumerateFileSystemEntries(_folder.Path, ".wc-*", SearchOption.AllDirectories)];

    [Fact]
    public void A_survey_replaces_its_folder_as_one_set()
    {
        var a = Capture("caps/a.wav");
        var b = Capture("caps/b.wav");
        var output = _folder.File("out");
        SiteSurvey.Run([Job(a), Job(b)], [], Options(output));
        Assert.Equal(["actions.csv", "index.html", "reports/a.html", "reports/b.html", "survey.csv", "survey.json"], Snapshot(output).Keys.Order());

        // The second run has only b: a's report from the first run must not survive beside the new index.
        SiteSurvey.Run([Job(b)], [], Options(output));
        var second = Snapshot(output);
        Assert.Equal(["actions.csv", "index.html", "reports/b.html", "survey.csv", "survey.json"], second.Keys.Order());
        Assert.Equal("index of 1", second["index.html"]);
        Assert.Empty(WorkFolders());
    }

    [Fact]
    public void An_interrupted_survey_leaves_the_old_set_intact_and_no_staging_folder()
    {
        var captures = Enumerable.Range(0, 4).Select(i => Capture($"caps/c{i}.wav")).ToList();
        var output = _folder.File("out");
        SiteSurvey.Run([.. captures.Select(Job)], [], Options(output));
        var before = Snapshot(output);

        // Interrupted after the second report of the rerun is written into the staging folder.
        using var cancel = new CancellationTokenSource();
        var reports = 0;
        var options = Options(output, (job, _, path) =>
        {
            AtomicFile.WriteText(path, "NEW report of " + job.Settings.Circuit);
            Assert.DoesNotContain(Path.GetFullPath(output), Path.GetFullPath(path), StringComparison.Ordinal);
            if (Interlocked.Increment(ref reports) == 2)
            {
                cancel.Cancel();
            }
        });
        Assert.ThrowsAny<OperationCanceledException>(() => SiteSurvey.Run([.. captures.Select(Job)], [], options, cancellationToken: cancel.Token));

        Assert.Equal(2, reports);
        Assert.Equal(before, Snapshot(output));
        Assert.Empty(WorkFolders());
    }

    [Fact]
    public void A_capture_named_like_an_output_in_the_output_folder_is_never_overwritten()
    {
        var site = _folder.File("site");
        var capture = Capture("site/survey.csv.wav");
        File.Move(capture, Path.Combine(site, "survey.csv"));
        capture = Path.Combine(site, "survey.csv");
        var bytes = File.ReadAllBytes(capture);
        var e = Assert.Throws<OutputPathException>(() => SiteSurvey.Run([Job(capture)], [], Options(site) with { OutputOption = "-o" }));
        Assert.Contains($"-o {site} holds the capture {capture}", e.Message, StringComparison.Ordinal);
        Assert.Equal(bytes, File.ReadAllBytes(capture));
        Assert.Equal(["survey.csv"], Directory.GetFileSystemEntries(site).Select(Path.GetFileName));
        Assert.Empty(WorkFolders());
    }

    [Fact]
    public void The_site_file_may_not_lie_in_the_output_folder()
    {
        var capture = Capture("caps/a.wav");
        var output = _folder.File("out");
        Directory.CreateDirectory(output);
        var site = _folder.Write("out/index.html", "{}");
        var e = Assert.Throws<OutputPathException>(() => SiteSurvey.Run([Job(capture)], [], Options(output) with { SiteFile = site }));
        Assert.Contains("the site file", e.Message, StringComparison.Ordinal);
        Assert.Equal("{}", File.ReadAllText(site));
    }

    [Fact]
    public void A_report_that_cannot_be_written_stops_the_survey_and_is_named_as_the_user_would_see_it()
    {
        // A seek before the start of the file fails in the file system layer, standing in for a full disk.
        var a = Capture("caps/a.wav");
        var output = _folder.File("out");
        var options = Options(output, (_, _, path) => AtomicFile.Write(path, s => s.Seek(-1, SeekOrigin.Begin)));
        var e = Assert.Throws<OutputWriteException>(() => SiteSurvey.Run([Job(a)], [], options));
        Assert.Equal(Path.Join(output, "reports", "a.html"), e.TargetPath);
        Assert.DoesNotContain(".wc-", e.Message, StringComparison.Ordinal);
        Assert.False(Directory.Exists(output));
        Assert.Empty(WorkFolders());
    }

    [Fact]
    public void A_symbolic_link_to_the_output_folder_is_kept_and_its_folder_replaced()
    {
        var a = Capture("caps/a.wav");
        var real = _folder.File("real-out");
        SiteSurvey.Run([Job(a)], [], Options(real));
        var link = _folder.File("out-link");
        Directory.CreateSymbolicLink(link, real);
        SiteSurvey.Run([Job(a)], [], Options(link) with { WriteIndex = (_, path) => AtomicFile.WriteText(path, "second") });
        Assert.NotNull(new DirectoryInfo(link).LinkTarget);
        Assert.Equal("second", File.ReadAllText(Path.Combine(real, "index.html")));
        Assert.Empty(WorkFolders());
    }
}
