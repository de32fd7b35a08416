using System.Text.Json;

namespace WaveCheck.Cli.Tests;

/// <summary><c>wavecheck analyze</c> end to end on files written by <c>wavecheck synth</c>.</summary>
public sealed class AnalyzeCommandTests : CliTestFolder
{
    [Fact]
    public void Json_carries_the_contract_and_the_verdict()
    {
        // Worked example of the analysis issue: 30 mA peak half-wave on 8 mA smooth DC has a mean of
        // 8 + 30/π = 17.55 mA (closed form) and a smooth DC of 8 mA. Type F tolerates 10 mA smooth DC and type A
        // only 6 mA (IEC 62423), but a circuit that produces smooth DC needs type B (REFERENCE.md, "tolerance is not
        // fitness"); the installed type A is blinded.
        var wav = Synth("hw.wav", "halfwave:peak=30mA", "dc:level=8mA");
        var json = FilePath("hw.json");
        var (exit, output, error) = CliHarness.Run("analyze", wav, "--json", json, "--device", "A");
        Assert.True(exit == 0, error);
        Assert.StartsWith("VERDICT", output.TrimStart(), StringComparison.Ordinal);

        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var root = doc.RootElement;
        Assert.Equal("wavecheck.analysis/1", root.GetProperty("schema").GetString());
        Assert.Equal(50_000, root.GetProperty("capture").GetProperty("sampleRateHz").GetDouble());
        Assert.Equal("detected", root.GetProperty("mains").GetProperty("source").GetString());
        Assert.Equal(50.0, root.GetProperty("mains").GetProperty("frequencyHz").GetDouble(), 0.01);
        var summary = root.GetProperty("summary");
        Assert.Equal(0.008 + 0.030 / Math.PI, summary.GetProperty("dcA").GetDouble(), 0.0002);
        foreach (var name in new[] { "rmsA", "acRmsA", "peakA", "peakPositiveA", "peakNegativeA", "crestFactor" })
        {
            Assert.True(summary.TryGetProperty(name, out _), name);
        }

        var components = root.GetProperty("components");
        Assert.Equal(0.008, components.GetProperty("smoothDcA").GetDouble(), 0.0002);
        Assert.True(components.GetProperty("pulsatingDc").GetBoolean());
        Assert.Equal(50, root.GetProperty("harmonics").GetArrayLength());
        Assert.True(root.GetProperty("bands").GetArrayLength() > 0);
        Assert.Equal(5, root.GetProperty("windows").GetProperty("count").GetInt32());

        var assessment = root.GetProperty("assessment");
        Assert.Equal("B", assessment.GetProperty("requiredType").GetString());
        Assert.Equal("B", assessment.GetProperty("minimumType").GetString());
        Assert.Contains(assessment.GetProperty("classes").EnumerateArray(),
            c => c.GetProperty("class").GetString() == "smoothDc" && c.GetProperty("presence").GetString() == "present");
        Assert.Equal(0.030, assessment.GetProperty("ratedResidualCurrentA").GetDouble());
        Assert.Equal(5, assessment.GetProperty("types").GetArrayLength());
        Assert.True(assessment.GetProperty("blinding").GetProperty("blinded").GetBoolean());
        Assert.True(assessment.GetProperty("cautions").GetArrayLength() >= 3);
    }

    [Fact]
    public void Charging_point_protection_is_declared_with_its_dc_detection()
    {
        // IEC 60364-7-722 (REFERENCE.md): type B, or type A with a 6 mA DC detection device (IEC 62955). A plain
        // type A fails --fail-on upgrade; A+RDC-DD passes; --charger-dc-detection only makes sense with --ev.
        var wav = Synth("ev.wav", "sine:rms=3mA", "dc:level=2.5mA");
        Assert.Equal(1, CliHarness.Run("analyze", wav, "--ev", "--device", "A", "--fail-on", "upgrade", "-q").Exit);
        var json = FilePath("ev.json");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--ev", "--device", "A+RDC-DD", "--fail-on", "upgrade", "--json", json, "-q");
        Assert.True(exit == 0, error);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal("A+RDC-DD", doc.RootElement.GetProperty("assessment").GetProperty("installedProtection").GetString());
        var misuse = CliHarness.Run("analyze", wav, "--charger-dc-detection");
        Assert.Equal(2, misuse.Exit);
        Assert.Contains("--charger-dc-detection", misuse.Error, StringComparison.Ordinal);
    }

    [Fact]
    public void Verdict_words_on_screen_are_the_trade_words_of_the_json()
    {
        // 10 mA standing on a 30 mA device is 0.33 IΔn, above the 0.3 IΔn "possible" boundary (engineering choice,
        // IEC 60364-5-53 §531.3.2 budget): the terminal says "risk possible", the word of the JSON, not an enum name.
        var wav = Synth("words.wav", "sine:rms=10mA");
        var (exit, output, error) = CliHarness.Run("analyze", wav);
        Assert.True(exit == 0, error);
        Assert.Contains("risk possible:", output, StringComparison.Ordinal);
        Assert.DoesNotContain("risk Possible", output, StringComparison.Ordinal);
    }

    [Fact]
    public void A_mains_frequency_the_capture_contradicts_is_refused_in_one_line()
    {
        // A 60 Hz capture declared 50 Hz: exit 2, one line naming the file and the frequency found (IEC 61000-4-7
        // windows would be the wrong length); --mains-as-given keeps the declaration.
        var wav = Synth("sixty.wav", "sine:rms=10mA", "--mains", "60Hz");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--mains", "50Hz");
        Assert.Equal(2, exit);
        Assert.Contains("sixty.wav: mains given as 50 Hz", error, StringComparison.Ordinal);
        Assert.Single(error.Trim().Split('\n'));
        Assert.Equal(0, CliHarness.Run("analyze", wav, "--mains", "50Hz", "--mains-as-given", "-q").Exit);
    }

    [Theory]
    [InlineData("2 percent")]
    [InlineData("80%")]
    public void Accuracy_that_cannot_be_used_is_refused_with_the_option(string text)
    {
        var wav = Synth("acc.wav", "sine:rms=10mA");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--accuracy", text);
        Assert.Equal(2, exit);
        Assert.Contains("--accuracy", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Fail_on_upgrade_turns_an_inadequate_device_into_exit_code_1()
    {
        // IEC 60364-5-53 §531.3.3: type AC does not detect pulsating DC; a dimmer's half-wave needs type A.
        var wav = Synth("dimmer.wav", "halfwave:peak=20mA,angle=90");
        Assert.Equal(1, CliHarness.Run("analyze", wav, "--device", "AC", "--fail-on", "upgrade").Exit);
        Assert.Equal(0, CliHarness.Run("analyze", wav, "--device", "A", "--fail-on", "upgrade").Exit);
        Assert.Equal(0, CliHarness.Run("analyze", wav, "--device", "AC").Exit);
    }

    [Fact]
    public void Alarm_events_are_found_and_can_fail_the_run()
    {
        // A 20 mA rms sine exceeds a 15 mA alarm in every window (closed form: RMS of a sine is peak/√2).
        var wav = Synth("sine.wav", "sine:rms=20mA");
        var json = FilePath("sine.json");
        Assert.Equal(1, CliHarness.Run("analyze", wav, "--alarm", "15mA", "--fail-on", "alarm", "--json", json).Exit);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Contains(doc.RootElement.GetProperty("events").EnumerateArray(), e => e.GetProperty("kind").GetString() == "alarm");
    }

    [Fact]
    public void Report_plots_and_window_csv_are_written()
    {
        var wav = Synth("fan.wav", "composite:rms=20mA");
        var report = FilePath("out/fan.html");
        var plots = FilePath("out/plots");
        var csv = FilePath("out/windows.csv");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--report", report, "--plots", plots, "--plot-format", "svg",
            "--windows-csv", csv, "--site", "<script>alert(1)</script>");
        Assert.True(exit == 0, error);
        var html = File.ReadAllText(report);
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script>alert(1)", html, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(plots, "spectrum.svg")));
        // One header row and one row per 10-cycle window: 1 s at 50 Hz is 5 windows (IEC 61000-4-7 200 ms windows).
        Assert.Equal(6, File.ReadAllLines(csv).Length);
        Assert.Empty(Directory.GetFiles(Path.GetDirectoryName(report)!, "*.tmp"));
    }

    [Theory]
    [InlineData("--rated", "thirty", "--rated")]
    [InlineData("--device", "Q", "--device")]
    [InlineData("--regime", "eu", "--regime")]
    [InlineData("--fail-on", "sometimes", "--fail-on")]
    [InlineData("--dc-threshold", "big", "--dc-threshold")]
    [InlineData("--plot-format", "gif", "--plot-format")]
    public void Bad_options_give_one_line_and_exit_2(string option, string value, string named)
    {
        var wav = Synth("s.wav", "sine:rms=5mA");
        var (exit, _, error) = CliHarness.Run("analyze", wav, option, value);
        Assert.Equal(2, exit);
        Assert.Contains(named, error, StringComparison.Ordinal);
        Assert.Single(error.TrimEnd().Split('\n'));
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_file_gives_one_line_and_exit_2()
    {
        var (exit, _, error) = CliHarness.Run("analyze", FilePath("nope.wav"));
        Assert.Equal(2, exit);
        Assert.Contains("nope.wav: no such file", error, StringComparison.Ordinal);
    }
}
