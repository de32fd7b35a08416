using System.Text.Json;

namespace WaveCheck.Cli.Tests;

/// <summary><c>wavecheck compare</c> end to end: two analyses, two surveys, and every kind of bad input (one stderr
/// line, exit 2). The waveforms are the standards' test currents synthesised by <c>wavecheck synth</c>.</summary>
public sealed class CompareCommandTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public CompareCommandTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private string FilePath(string name) => Path.Combine(_folder, name);

    private string Synth(string name, params string[] parts)
    {
        var path = FilePath(name);
        var (exit, _, error) = CliHarness.Run(["synth", .. parts, "-o", path, "--duration", "1s"]);
        Assert.True(exit == 0, error);
        return path;
    }

    [Fact]
    public void Two_analyses_of_a_charging_point_show_the_remedy()
    {
        // IEC 60364-7-722 / REFERENCE.md "tolerance is not fitness": 9 mA smooth DC at a charging point needs type B;
        // a type A is not adequate before, the type B fitted after is. The capture is the same, so no figure changes.
        var capture = Synth("bay2.wav", "dc:level=9mA", "sine:rms=2mA");
        var before = FilePath("before.json");
        var after = FilePath("after.json");
        Assert.Equal(0, CliHarness.Run("analyze", capture, "--sensor", "dc", "--ev", "--device", "A", "--json", before).Exit);
        Assert.Equal(0, CliHarness.Run("analyze", capture, "--sensor", "dc", "--ev", "--device", "B", "--json", after).Exit);

        var html = FilePath("retest.html");
        var json = FilePath("retest.json");
        var (exit, stdout, error) = CliHarness.Run("compare", before, after, "--html", html, "--json", json);
        Assert.True(exit == 0, error);
        Assert.Contains("✔ remedied", stdout, StringComparison.Ordinal);
        Assert.Contains("installed device A → B", stdout, StringComparison.Ordinal);
        Assert.Contains("1 circuits: 1 remedied.", stdout, StringComparison.Ordinal);

        var page = File.ReadAllText(html);
        Assert.Contains("<td><strong>✔ remedied</strong></td>", page, StringComparison.Ordinal);
        Assert.Contains("upgrade → ok", page, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal("wavecheck.retest/1", doc.RootElement.GetProperty("schema").GetString());
        var circuit = doc.RootElement.GetProperty("circuits")[0];
        Assert.Equal("remedied", circuit.GetProperty("outcome").GetString());
        Assert.Equal("B", circuit.GetProperty("after").GetProperty("requiredType").GetString());
    }

    [Fact]
    public void Two_surveys_pair_circuits_by_name_and_show_a_state_that_got_worse()
    {
        // IEC 60364-5-53 §531.3.3: pulsating DC needs type A; smooth DC added in the later survey needs type B.
        var folder1 = Path.Combine(_folder, "visit1");
        var folder2 = Path.Combine(_folder, "visit2");
        Directory.CreateDirectory(folder1);
        Directory.CreateDirectory(folder2);
        File.Move(Synth("dimmer.wav", "halfwave:peak=20mA,angle=90"), Path.Combine(folder1, "dimmer.wav"));
        File.Move(Synth("dimmer2.wav", "halfwave:peak=20mA,angle=90", "dc:level=4mA"), Path.Combine(folder2, "dimmer.wav"));
        const string Site = """{ "site": "Invented clinic", "defaults": { "sensor": "dc", "device": "A" }, "captures": [ { "file": "dimmer.wav", "circuit": "C6 lights" } ] }""";
        File.WriteAllText(Path.Combine(folder1, "site.json"), Site);
        File.WriteAllText(Path.Combine(folder2, "site.json"), Site);
        var out1 = FilePath("s1");
        var out2 = FilePath("s2");
        Assert.Equal(0, CliHarness.Run("survey", "--config", Path.Combine(folder1, "site.json"), "-o", out1, "-q").Exit);
        Assert.Equal(0, CliHarness.Run("survey", "--config", Path.Combine(folder2, "site.json"), "-o", out2, "-q").Exit);

        var (exit, stdout, error) = CliHarness.Run("compare", out1, Path.Combine(out2, "survey.json"));
        Assert.True(exit == 0, error);
        Assert.Contains("Retest: Invented clinic", stdout, StringComparison.Ordinal);
        Assert.Contains("✖ worse", stdout, StringComparison.Ordinal);
        Assert.Contains("required type A → B", stdout, StringComparison.Ordinal);
    }

    public static TheoryData<string, string> BadInputs => new()
    {
        { "{\"a\": 1}", "not a WaveCheck result (no \"schema\")" },
        { "{\"schema\": \"wavecheck.survey/7\"}", "schema \"wavecheck.survey/7\" is not one this version reads" },
        { "{\"schema\": \"wavecheck.survey/1\", \"rows\": 5}", "not a survey this version reads at $.rows" },
        { "{\"schema\": \"wavecheck.analysis/1\"}", "no \"capture\" object" },
        { "{\"schema\": \"wavecheck.analysis/1\", \"capture\": {\"filePath\": \"x.wav\"}, \"summary\": {\"rmsA\": \"high\"}, \"components\": {}}", "summary.rmsA is not a number" },
        { "time,I\n0,1\n", ":1: not JSON" },
        { "", ":1: not JSON" },
    };

    [Theory]
    [MemberData(nameof(BadInputs))]
    public void Bad_input_is_one_line_on_stderr_and_exit_2(string content, string words)
    {
        var bad = FilePath("bad.json");
        File.WriteAllText(bad, content);
        var good = FilePath("good.json");
        Assert.Equal(0, CliHarness.Run("analyze", Synth("s.wav", "sine:rms=5mA"), "--json", good).Exit);

        var (exit, stdout, error) = CliHarness.Run("compare", bad, good);
        Assert.Equal(2, exit);
        Assert.Empty(stdout);
        Assert.Single(error.TrimEnd().Split('\n'));
        Assert.Contains(bad, error, StringComparison.Ordinal);
        Assert.Contains(words, error, StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_side_a_folder_without_a_survey_and_mixed_kinds_are_refused()
    {
        var good = FilePath("good.json");
        Assert.Equal(0, CliHarness.Run("analyze", Synth("s.wav", "sine:rms=5mA"), "--json", good).Exit);
        var (exit, _, error) = CliHarness.Run("compare", FilePath("missing.json"), good);
        Assert.Equal(2, exit);
        Assert.Contains("no such file or folder", error, StringComparison.Ordinal);

        var empty = Directory.CreateDirectory(FilePath("empty")).FullName;
        (exit, _, error) = CliHarness.Run("compare", empty, good);
        Assert.Equal(2, exit);
        Assert.Contains("no survey.json in this folder", error, StringComparison.Ordinal);

        var survey = FilePath("survey-out");
        Assert.Equal(0, CliHarness.Run("survey", FilePath("s.wav"), "-o", survey, "-q").Exit);
        (exit, _, error) = CliHarness.Run("compare", good, survey);
        Assert.Equal(2, exit);
        Assert.Contains("compare two analyses or two surveys", error, StringComparison.Ordinal);

        // The page may not replace a compared file.
        (exit, _, error) = CliHarness.Run("compare", good, good, "--html", good);
        Assert.Equal(2, exit);
        Assert.Single(error.TrimEnd().Split('\n'));
    }
}
