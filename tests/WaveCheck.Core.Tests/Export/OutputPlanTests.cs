using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Tests.Capture;

namespace WaveCheck.Core.Tests.Results;

/// <summary>
/// The output guard on real files: every alias of an input is refused as an output, two outputs may not share a path.
/// The aliases are those POSIX path resolution allows (IEEE Std 1003.1, "Pathname Resolution"): relative paths,
/// <c>..</c>, symbolic links and hard links.
/// </summary>
[System.Runtime.Versioning.UnsupportedOSPlatform("windows")] // chmod, symbolic and hard links as on POSIX
public sealed class OutputPlanTests : IDisposable
{
    private readonly TempFolder _folder = new();
    private readonly string _capture;

    public OutputPlanTests()
    {
        Directory.CreateDirectory(_folder.File("d"));
        _capture = _folder.Write(Path.Combine("d", "x.wav"), "capture bytes");
    }

    public void Dispose() => _folder.Dispose();

    private static OutputPathException Refused(string input, params (string Path, string Option)[] outputs)
    {
        var plan = new OutputPlan();
        plan.AddCapture(input);
        foreach (var (path, option) in outputs)
        {
            plan.AddOutputFile(path, option);
        }

        return Assert.Throws<OutputPathException>(plan.Check);
    }

    private static void Allowed(string input, params (string Path, string Option)[] outputs)
    {
        var plan = new OutputPlan();
        plan.AddCapture(input);
        foreach (var (path, option) in outputs)
        {
            plan.AddOutputFile(path, option);
        }

        plan.Check();
    }

    [Fact]
    public void The_same_path_is_refused_naming_both_and_the_option()
    {
        var e = Refused(_capture, (_capture, "--json"));
        Assert.Equal($"--json {_capture} would replace the capture {_capture} (the same file): an output may never replace an input; choose another path", e.Message);
    }

    [Fact]
    public void Relative_and_dot_dot_spellings_are_refused()
    {
        var relative = Path.GetRelativePath(Environment.CurrentDirectory, _capture);
        Refused(_capture, (relative, "--report"));
        Refused(relative, (_capture, "--report"));
        var dotDot = Path.Combine(_folder.Path, "d", "..", "d", ".", "x.wav");
        var e = Refused(_capture, (dotDot, "--windows-csv"));
        Assert.Contains(dotDot, e.Message, StringComparison.Ordinal);
        Assert.Contains("--windows-csv", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_symbolic_link_on_either_side_is_refused()
    {
        var link = _folder.File("link.wav");
        File.CreateSymbolicLink(link, _capture);
        Refused(_capture, (link, "--json"));     // the output is a link to the input
        Refused(link, (_capture, "--json"));     // the input is given through a link
        var folderLink = _folder.File("dl");
        Directory.CreateSymbolicLink(folderLink, _folder.File("d"));
        Refused(_capture, (Path.Combine(folderLink, "x.wav"), "--json"));   // a link to the folder
    }

    [Fact]
    public void A_hard_link_is_refused()
    {
        var hard = _folder.File("hard.wav");
        HardLink.Create(_capture, hard);
        var e = Refused(_capture, (hard, "--report"));
        Assert.Contains(hard, e.Message, StringComparison.Ordinal);
        Assert.Contains(_capture, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_read_only_input_is_refused_as_an_output_and_kept()
    {
        File.SetUnixFileMode(_capture, UnixFileMode.UserRead | UnixFileMode.GroupRead | UnixFileMode.OtherRead);
        var e = Refused(_capture, (_capture, "--json"));
        Assert.Contains("would replace the capture", e.Message, StringComparison.Ordinal);
        Assert.Equal("capture bytes", File.ReadAllText(_capture));
    }

    [Fact]
    public void A_read_only_output_is_refused()
    {
        var target = _folder.Write("old.json", "{}");
        File.SetUnixFileMode(target, UnixFileMode.UserRead);
        var e = Refused(_capture, (target, "--json"));
        Assert.Equal($"--json {target} exists and is read-only: it is not replaced (make it writable, or choose another path)", e.Message);
    }

    [Fact]
    public void A_case_variant_is_refused_exactly_where_the_file_system_folds_case()
    {
        // Whether X.WAV reaches x.wav is the file system's answer (ext4: no; APFS, NTFS by default: yes); the guard
        // must agree with it either way.
        var variant = Path.Combine(_folder.Path, "d", "X.WAV");
        var folds = File.Exists(variant);
        Assert.Equal(folds, FileIdentity.FoldsCase(Path.Combine(_folder.Path, "d")));
        var plan = new OutputPlan();
        plan.AddCapture(_capture);
        plan.AddOutputFile(variant, "--json");
        if (folds)
        {
            Assert.Throws<OutputPathException>(plan.Check);
        }
        else
        {
            plan.Check();
        }
    }

    [Fact]
    public void Two_outputs_on_one_path_are_refused_naming_both()
    {
        var p = _folder.File("r.out");
        var e = Refused(_capture, (p, "--json"), (p, "--report"));
        Assert.Equal($"--json {p} and --report {p} are the same file: give each output its own path", e.Message);

        // Also when neither exists yet and one reaches the folder through a link.
        Directory.CreateDirectory(_folder.File("out"));
        Directory.CreateSymbolicLink(_folder.File("out-link"), _folder.File("out"));
        Refused(_capture, (_folder.File("out/new/a.json"), "--json"), (_folder.File("out-link/new/a.json"), "--report"));
    }

    [Fact]
    public void A_plot_file_and_another_output_on_it_are_refused()
    {
        var plots = _folder.File("plots");
        var plan = new OutputPlan();
        plan.AddCapture(_capture);
        plan.AddOutputFolder(plots, "--plots", ["overview.png", "spectrum.png"]);
        plan.AddOutputFile(Path.Combine(plots, "spectrum.png"), "--report");
        var e = Assert.Throws<OutputPathException>(plan.Check);
        Assert.Contains("--plots", e.Message, StringComparison.Ordinal);
        Assert.Contains("--report", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_file_where_another_output_needs_a_folder_is_refused()
    {
        var plan = new OutputPlan();
        plan.AddCapture(_capture);
        plan.AddOutputFile(_folder.File("out"), "--json");
        plan.AddOutputFolder(_folder.File("out"), "--plots", ["overview.png"]);
        Assert.Contains("file and a folder", Assert.Throws<OutputPathException>(plan.Check).Message, StringComparison.Ordinal);

        var second = new OutputPlan();
        second.AddOutputFile(_folder.File("a/b.json"), "--json");
        second.AddOutputFile(_folder.File("a/b.json/c.html"), "--report");
        Assert.Contains("file and a folder", Assert.Throws<OutputPathException>(second.Check).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_plots_folder_onto_an_input_is_refused()
    {
        // A capture is found by its content, so a WAV may be named overview.png.
        var plan = new OutputPlan();
        var odd = _folder.Write(Path.Combine("d", "overview.png"), "RIFF");
        plan.AddCapture(odd);
        plan.AddOutputFolder(_folder.File("d"), "--plots", ["overview.png"]);
        var e = Assert.Throws<OutputPathException>(plan.Check);
        Assert.Contains($"--plots {_folder.File("d")} (overview.png) would replace the capture {odd}", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_comtrade_data_file_counts_as_an_input()
    {
        // IEEE C37.111: a .cfg's samples are in the .dat of the same name beside it.
        var cfg = _folder.Write(Path.Combine("d", "rec.cfg"), "cfg");
        var dat = _folder.Write(Path.Combine("d", "REC.DAT"), "dat");
        var e = Refused(cfg, (dat, "--json"));
        Assert.Contains("the data of the capture", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Distinct_outputs_beside_the_input_are_allowed() =>
        Allowed(_capture, (_folder.File("d/x.json"), "--json"), (_folder.File("d/x.html"), "--report"),
            (_folder.File("new/w.csv"), "--windows-csv"));

    [Fact]
    public void The_outcome_says_what_was_and_was_not_written()
    {
        var plan = new OutputPlan();
        plan.AddOutputFile("a.json", "--json");
        plan.AddOutputFolder("p", "--plots", ["overview.png", "cycles.png"]);
        plan.AddOutputFile("r.html", "--report");
        Assert.Equal("nothing written (--json a.json, --plots p, --report r.html not written)", plan.Outcome());
        plan.MarkWritten("--json");
        Assert.Equal("wrote --json a.json; not written: --plots p, --report r.html", plan.Outcome());
        plan.MarkWritten("--plots");
        plan.MarkWritten("--report");
        Assert.Equal("every output written (--json a.json, --plots p, --report r.html)", plan.Outcome());
    }

    [Fact]
    public void A_survey_folder_holding_a_capture_named_like_an_output_is_refused()
    {
        var site = _folder.File("site");
        Directory.CreateDirectory(site);
        var capture = _folder.Write(Path.Combine("site", "survey.csv"), "time [s],I [mA]\n0,1\n");
        var plan = new OutputPlan();
        plan.AddCapture(capture);
        plan.AddReplacedFolder(site, "--output", ["survey.csv", "survey.json", "index.html", "reports"]);
        var e = Assert.Throws<OutputPathException>(plan.Check);
        Assert.Contains($"--output {site} holds the capture {capture}", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_survey_folder_holding_other_files_is_refused_and_one_holding_only_its_set_is_not()
    {
        var outFolder = _folder.File("survey");
        Directory.CreateDirectory(Path.Combine(outFolder, "reports"));
        File.WriteAllText(Path.Combine(outFolder, "survey.csv"), "old");
        File.WriteAllText(Path.Combine(outFolder, "reports", "c1.html"), "old");
        File.WriteAllText(Path.Combine(outFolder, AtomicFile.TempName()), "left by a killed run");
        var names = new[] { "survey.csv", "survey.json", "index.html", "reports" };
        var plan = new OutputPlan();
        plan.AddCapture(_capture);
        plan.AddReplacedFolder(outFolder, "--output", names);
        plan.Check();

        File.WriteAllText(Path.Combine(outFolder, "notes.txt"), "mine");
        var e = Assert.Throws<OutputPathException>(plan.Check);
        Assert.Contains("holds notes.txt, which is not one of its outputs", e.Message, StringComparison.Ordinal);
        File.Delete(Path.Combine(outFolder, "notes.txt"));

        // A capture inside the folder (here a hard link in reports/) is refused: the old set is deleted as a whole.
        HardLink.Create(_capture, Path.Combine(outFolder, "reports", "x.wav"));
        Assert.Contains("holds the capture", Assert.Throws<OutputPathException>(plan.Check).Message, StringComparison.Ordinal);
    }
}
