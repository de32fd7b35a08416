namespace WaveCheck.Cli.Tests;

/// <summary>
/// No command may replace a file it reads, by any alias the file system allows (IEEE Std 1003.1, "Pathname
/// Resolution": relative paths, <c>..</c>, symbolic links, hard links), nor write two outputs to one path, nor
/// replace a read-only file. Each refusal is one stderr line naming both paths and the option, exit code 2.
/// </summary>
[System.Runtime.Versioning.UnsupportedOSPlatform("windows")] // chmod, symbolic and hard links as on POSIX
public sealed class OutputSafetyTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));
    private readonly string _capture;
    private readonly byte[] _bytes;

    public OutputSafetyTests()
    {
        Directory.CreateDirectory(Path.Combine(_folder, "d"));
        _capture = Path.Combine(_folder, "d", "x.wav");
        var (exit, _, error) = CliHarness.Run("synth", "sine:rms=5mA", "-o", _capture, "--duration", "1s");
        Assert.True(exit == 0, error);
        _bytes = File.ReadAllBytes(_capture);
    }

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private string FilePath(string name) => Path.Combine(_folder, name);

    /// <summary>Runs, expects exit 2 and one stderr line holding every fragment; the capture must be unchanged.</summary>
    private string Refused(string[] args, params string[] fragments)
    {
        var (exit, _, error) = CliHarness.Run(args);
        Assert.True(exit == 2, $"exit {exit}: {error}");
        var line = Assert.Single(error.TrimEnd().Split('\n'));
        foreach (var fragment in fragments)
        {
            Assert.Contains(fragment, line, StringComparison.Ordinal);
        }

        Assert.Equal(_bytes, File.ReadAllBytes(_capture));
        Assert.Empty(Directory.GetFiles(_folder, ".wc-*", SearchOption.AllDirectories));
        return line;
    }

    public static TheoryData<string> FileOptions => ["--json", "--report", "--windows-csv"];

    [Theory]
    [MemberData(nameof(FileOptions))]
    public void An_output_on_the_capture_itself_is_refused(string option) =>
        Refused(["analyze", _capture, option, _capture, "-q"], option, "would replace the capture", _capture);

    [Theory]
    [MemberData(nameof(FileOptions))]
    public void A_relative_dot_dot_alias_is_refused(string option)
    {
        // ./../d/x.wav seen from the folder d itself, written relative to the current folder.
        var alias = Path.Combine(Path.GetRelativePath(Environment.CurrentDirectory, Path.Combine(_folder, "d")), ".", "..", "d", "x.wav");
        Refused(["analyze", _capture, option, alias, "-q"], option, alias, _capture);
    }

    [Theory]
    [MemberData(nameof(FileOptions))]
    public void A_symbolic_link_on_either_side_is_refused(string option)
    {
        var link = FilePath("link.wav");
        File.CreateSymbolicLink(link, _capture);
        Refused(["analyze", _capture, option, link, "-q"], option, link, _capture);
        Refused(["analyze", link, option, _capture, "-q"], option, link, _capture);
    }

    [Theory]
    [MemberData(nameof(FileOptions))]
    public void A_hard_link_is_refused(string option)
    {
        var hard = FilePath("hard.wav");
        HardLink.Create(_capture, hard);
        Refused(["analyze", _capture, option, hard, "-q"], option, hard, _capture);
    }

    [Fact]
    public void A_plots_folder_holding_the_capture_under_a_plot_name_is_refused()
    {
        // Captures are recognised by content, so a WAV may be called spectrum.png.
        var odd = Path.Combine(_folder, "d", "spectrum.png");
        File.Copy(_capture, odd);
        var (exit, _, error) = CliHarness.Run("analyze", odd, "--plots", Path.Combine(_folder, "d"), "-q");
        Assert.Equal(2, exit);
        Assert.Contains("--plots", error, StringComparison.Ordinal);
        Assert.Equal(_bytes, File.ReadAllBytes(odd));
    }

    [Fact]
    public void Info_json_on_the_capture_is_refused() =>
        Refused(["info", _capture, "--json", _capture], "--json", _capture);

    [Fact]
    public void Two_outputs_on_one_path_are_refused_naming_both()
    {
        var p = FilePath("r.out");
        var line = Refused(["analyze", _capture, "--json", p, "--report", p, "-q"]);
        Assert.Equal($"wavecheck: --json {p} and --report {p} are the same file: give each output its own path", line);
        Assert.False(File.Exists(p));
    }

    [Fact]
    public void A_read_only_capture_is_not_replaced()
    {
        // The rename that makes writes atomic ignores the target's mode: a chmod 444 capture was once replaced.
        File.SetUnixFileMode(_capture, UnixFileMode.UserRead | UnixFileMode.GroupRead | UnixFileMode.OtherRead);
        Refused(["analyze", _capture, "--json", _capture, "-q"], "would replace the capture");
    }

    [Fact]
    public void A_read_only_target_is_refused_for_every_command()
    {
        var target = FilePath("kept.csv");
        File.WriteAllText(target, "old");
        File.SetUnixFileMode(target, UnixFileMode.UserRead);
        Refused(["analyze", _capture, "--windows-csv", target, "-q"], "--windows-csv", target, "read-only");
        Refused(["synth", "sine:rms=5mA", "-o", target], "--output", target, "read-only");
        Assert.Equal("old", File.ReadAllText(target));
    }

    [Fact]
    public void A_path_through_a_file_says_the_parent_is_not_a_folder()
    {
        var afile = FilePath("afile");
        File.WriteAllText(afile, "x");
        var line = Refused(["analyze", _capture, "--json", Path.Combine(afile, "x.json"), "-q"]);
        Assert.Equal($"wavecheck: --json {Path.Combine(afile, "x.json")}: {afile} is a file, not a folder", line);
    }

    [Fact]
    public void A_240_character_output_name_is_written()
    {
        var json = FilePath(new string('r', 235) + ".json");
        var (exit, _, error) = CliHarness.Run("analyze", _capture, "--json", json, "-q");
        Assert.True(exit == 0, error);
        Assert.True(File.Exists(json));
        Assert.Empty(Directory.GetFiles(_folder, ".wc-*"));
    }

    [Fact]
    public void Survey_into_its_own_capture_folder_never_overwrites_a_capture_named_like_an_output()
    {
        var site = Path.Combine(_folder, "d");
        var named = Path.Combine(site, "survey.csv");
        File.WriteAllText(named, "time [s],I [mA]\n0,1\n0.001,2\n");
        var before = File.ReadAllText(named);
        Refused(["survey", site, "-o", site, "-q"], $"--output {site} holds the capture", site);
        Assert.Equal(before, File.ReadAllText(named));
        Assert.Equal(["survey.csv", "x.wav"], Directory.GetFileSystemEntries(site).Select(Path.GetFileName).Order());
    }

    [Fact]
    public void Survey_writes_text_cells_that_start_like_formulas_with_a_leading_quote()
    {
        // OWASP "CSV Injection": a circuit (here taken from the file name) beginning with @ must not run as a formula.
        var logs = FilePath("logs");
        Directory.CreateDirectory(logs);
        File.Copy(_capture, Path.Combine(logs, "@SUM(A1).wav"));
        var output = FilePath("out");
        var (exit, _, error) = CliHarness.Run("survey", logs, "-o", output, "-q");
        Assert.True(exit == 0, error);
        var lines = File.ReadAllLines(Path.Combine(output, "survey.csv"));
        Assert.StartsWith("'", lines[1].Split(',')[1], StringComparison.Ordinal);
        Assert.Contains(",'@SUM(A1),", lines[1], StringComparison.Ordinal);
    }

    [Fact]
    public void A_survey_rerun_leaves_no_staging_folder_and_only_the_new_set()
    {
        var logs = FilePath("logs");
        Directory.CreateDirectory(logs);
        File.Copy(_capture, Path.Combine(logs, "a.wav"));
        File.Copy(_capture, Path.Combine(logs, "b.wav"));
        var output = FilePath("out");
        Assert.Equal(0, CliHarness.Run("survey", logs, "-o", output, "-q").Exit);
        File.Delete(Path.Combine(logs, "a.wav"));
        Assert.Equal(0, CliHarness.Run("survey", logs, "-o", output, "-q").Exit);
        Assert.Equal(["b.html"], Directory.GetFiles(Path.Combine(output, "reports")).Select(Path.GetFileName));
        Assert.Empty(Directory.GetFileSystemEntries(_folder, ".wc-*", SearchOption.AllDirectories));
    }
}
