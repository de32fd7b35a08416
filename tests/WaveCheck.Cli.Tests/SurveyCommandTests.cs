using System.Text.Json;

namespace WaveCheck.Cli.Tests;

/// <summary><c>wavecheck survey</c> and <c>wavecheck demo</c> end to end, and usage errors of every command.</summary>
public sealed class SurveyCommandTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public SurveyCommandTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private string FilePath(string name) => Path.Combine(_folder, name);

    private void Synth(string name, params string[] parts)
    {
        var (exit, _, error) = CliHarness.Run(["synth", .. parts, "-o", FilePath(name), "--duration", "1s"]);
        Assert.True(exit == 0, error);
    }

    [Fact]
    public void A_bad_capture_is_isolated_in_its_row_and_the_rest_are_judged()
    {
        // IEC 60364-5-53 §531.3.3: a dimmer's pulsating DC needs type A (AC not suitable); a sine needs type AC.
        Synth("a-dimmer.wav", "halfwave:peak=20mA,angle=90");
        Synth("b-sine.wav", "sine:rms=5mA");
        File.WriteAllText(FilePath("c-broken.csv"), "time [s],I [mA]\n0,1\n0.001,abc\n");
        var output = FilePath("out");
        var (exit, stdout, error) = CliHarness.Run("survey", _folder, "--device", "AC", "-o", output, "--parquet");
        Assert.True(exit == 0, error);
        Assert.Contains("c-broken.csv", stdout, StringComparison.Ordinal);

        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "survey.json")));
        var rows = doc.RootElement.GetProperty("rows").EnumerateArray().ToList();
        Assert.Equal(3, rows.Count);
        Assert.Equal("upgrade", rows[0].GetProperty("verdict").GetString());
        Assert.Equal("A", rows[0].GetProperty("requiredType").GetString());
        Assert.Equal("ok", rows[1].GetProperty("verdict").GetString());
        Assert.Equal("error", rows[2].GetProperty("verdict").GetString());
        Assert.Contains("abc", rows[2].GetProperty("error").GetString(), StringComparison.Ordinal);

        Assert.Equal(4, File.ReadAllLines(Path.Combine(output, "survey.csv")).Length);
        Assert.True(File.Exists(Path.Combine(output, "captures.parquet")));
        Assert.True(File.Exists(Path.Combine(output, "windows.parquet")));
        var index = File.ReadAllText(Path.Combine(output, "index.html"));
        Assert.Contains("reports/a-dimmer.html", index, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(output, "reports", "a-dimmer.html")));

        Assert.Equal(1, CliHarness.Run("survey", _folder, "--device", "AC", "-o", output, "--fail-on", "upgrade").Exit);
        Assert.Equal(1, CliHarness.Run("survey", _folder, "--device", "A", "-o", output, "--fail-on", "error").Exit);
    }

    [Fact]
    public void A_site_file_error_names_its_line_and_column()
    {
        var config = FilePath("site.json");
        File.WriteAllText(config, "{\n  \"site\": \"Harbour Clinic\",\n  \"captures\": [ { \"file\": \"x.wav\", \"device\": \"Q\" } ]\n}\n");
        var (exit, _, error) = CliHarness.Run("survey", "--config", config, "-o", FilePath("out"));
        Assert.Equal(2, exit);
        Assert.Contains("site.json:3:", error, StringComparison.Ordinal);
        Assert.Single(error.TrimEnd().Split('\n'));
    }

    [Fact]
    public void A_capture_error_from_a_site_file_names_the_site_files_key_not_a_flag()
    {
        Synth("c1.wav", "sine:rms=5mA");
        Synth("c2.wav", "sine:rms=5mA");
        var config = FilePath("site.json");
        File.WriteAllText(config, "{ \"captures\": [ { \"file\": \"c1.wav\", \"channel\": \"nosuch\" }, { \"file\": \"c2.wav\" } ] }\n");
        var output = FilePath("out");
        var (exit, _, error) = CliHarness.Run("survey", "--config", config, "-o", output);
        Assert.True(exit == 0, error);
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "survey.json")));
        var row = doc.RootElement.GetProperty("rows")[0];
        Assert.Equal("error", row.GetProperty("verdict").GetString());
        var message = row.GetProperty("error").GetString()!;
        Assert.Contains("the site file's \"channel\": no channel named 'nosuch'", message, StringComparison.Ordinal);
        Assert.DoesNotContain("--channel", message, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_flag_a_setting_maps_to_is_an_option_of_a_command()
    {
        // SettingFlags is the one table from Core's settings to this command line's flags: each must exist.
        var help = string.Join("\n", new[] { "analyze", "survey", "info", "synth" }.Select(c => CliHarness.Run(c, "--help").Out));
        Assert.All(SettingFlags.Settings, s => Assert.Contains(SettingFlags.Of(s) + " ", help, StringComparison.Ordinal));
        Assert.Equal("--mains", SettingFlags.Of(nameof(WaveCheck.Core.Signal.AnalysisOptions.MainsHz)));
        Assert.Equal("SomethingElse", SettingFlags.Of("SomethingElse"));
    }

    [Fact]
    public void Demo_runs_the_bundled_site()
    {
        // samples/README.md states what each demo circuit should show; the survey must agree with it.
        var output = FilePath("demo");
        var (exit, stdout, error) = CliHarness.Run("demo", "-o", output, "-q");
        Assert.True(exit == 0, error);
        Assert.Contains("Fernbrook Joinery", stdout, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(output, "survey.json")));
        var required = doc.RootElement.GetProperty("rows").EnumerateArray()
            .ToDictionary(r => Path.GetFileName(r.GetProperty("file").GetString()!), r => r.GetProperty("requiredType").GetString());
        Assert.Equal("B+", required["c1-panel-saw-drive.wav"]);
        Assert.Equal("F", required["c2-extractor-fan.wav"]);
        Assert.Equal("B", required["c3-ev-bay1.wav"]);
        Assert.Equal("B", required["c4-ev-bay2.wav"]);
        // Captured at 20 and 10 kS/s: whether B+ is needed is open, so the verdict is "at least" (null here).
        Assert.Null(required["c5-heat-pump.wav"]);
        Assert.Null(required["c6-office-dimmers.csv"]);
        var adequate = doc.RootElement.GetProperty("rows").EnumerateArray()
            .ToDictionary(r => Path.GetFileName(r.GetProperty("file").GetString()!), r => r);
        Assert.Equal("B", adequate["c5-heat-pump.wav"].GetProperty("minimumType").GetString());
        Assert.Equal("A", adequate["c6-office-dimmers.csv"].GetProperty("minimumType").GetString());
        Assert.Single(doc.RootElement.GetProperty("upstream").EnumerateArray());

        // samples/README.md: C2 has two captures, running (composite current, type F) and start-up (smooth DC, type
        // B); as one circuit it takes the stronger: type B, with both captures listed under it.
        Assert.Equal("F", required["c2-extractor-fan.wav"]);
        Assert.Equal("B", required["c2-extractor-fan-start.wav"]);
        var circuits = doc.RootElement.GetProperty("circuits").EnumerateArray().ToList();
        // C1 to C7 (samples/README.md); C2 has two captures.
        Assert.Equal(7, circuits.Count);
        var c2 = circuits.Single(c => c.GetProperty("circuit").GetString()!.StartsWith("C2 ", StringComparison.Ordinal));
        Assert.Equal("B", c2.GetProperty("requiredType").GetString());
        Assert.Equal("upgrade", c2.GetProperty("verdict").GetString());
        Assert.Equal(["running", "start-up"], c2.GetProperty("captures").EnumerateArray().Select(k => k.GetProperty("state").GetString()));
        Assert.Contains("start-up: c2-extractor-fan-start.wav", stdout, StringComparison.Ordinal);

        // The remedial schedule: every circuit but C3 (adequate, low risk) and the upstream device, safety first.
        var actions = File.ReadAllLines(Path.Combine(output, "actions.csv"));
        Assert.Equal("rank,priority,circuit,upstream,installedType,ratedResidualCurrentA,required,reason", actions[0]);
        Assert.Equal(8, actions.Length);
        Assert.DoesNotContain(actions, a => a.Contains("C3 charging point", StringComparison.Ordinal));
        Assert.All(actions.Skip(1).Take(6), a => Assert.Contains(",device-too-weak,", a, StringComparison.Ordinal));
        // C7's heater leak of 1.52 IΔn for 400 ms is past the 300 ms break time at IΔn (IEC 61008-1; samples/README.md):
        // a compliant device would have tripped, so the device is to be tested, after every device too weak.
        Assert.StartsWith("7,test-device,\"C7 spray booth", actions[7], StringComparison.Ordinal);
        var index = File.ReadAllText(Path.Combine(output, "index.html"));
        Assert.Contains("<h2>Remedial schedule</h2>", index, StringComparison.Ordinal);
        Assert.Contains("↳ start-up: <a href=\"reports/c2-extractor-fan-start.html\">", index, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(new[] { "analyze", "x.wav", "--devise", "A" }, "did you mean '--device'")]
    [InlineData(new[] { "anlyze" }, "did you mean 'analyze'")]
    [InlineData(new[] { "info" }, "wavecheck info")]
    [InlineData(new[] { "survey", "--parkett" }, "did you mean '--parquet'")]
    [InlineData(new[] { "survey", "x.wav", "--scale", "-100mA" }, "--scale: cannot use '-100mA': expected a positive current")]
    [InlineData(new[] { "survey", "x.wav", "--rated", "0mA" }, "--rated: cannot use '0mA': expected a positive current")]
    [InlineData(new[] { "survey", "x.wav", "--rated", "30" }, "--rated: cannot use '30': expected a current with its unit, such as 30mA, 0.3A or 300uA; did you mean 30mA?")]
    public void Usage_errors_give_one_line_and_exit_2(string[] args, string expected)
    {
        var (exit, _, error) = CliHarness.Run(args);
        Assert.Equal(2, exit);
        Assert.Contains(expected, error, StringComparison.Ordinal);
        Assert.Single(error.TrimEnd().Split('\n'));
    }

    [Fact]
    public void Version_is_printed()
    {
        var (exit, stdout, _) = CliHarness.Run("--version");
        Assert.Equal(0, exit);
        Assert.Matches(@"^\d+\.\d+\.\d+", stdout.Trim());
    }
}
