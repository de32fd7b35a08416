using System.Globalization;
using System.Text;
using System.Text.Json;

namespace WaveCheck.Cli.Tests;

/// <summary>The rules of issue 14 for the command line: one rule for units, no guessing which channel is the residual
/// current, typed options with their value names in help, and the <c>analyse</c> alias.</summary>
public sealed class OptionRulesTests : CliTestFolder
{
    private static string OneLine(string error)
    {
        var lines = error.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        return Assert.Single(lines);
    }

    [Theory]
    [InlineData("--rated", "30", "did you mean 30mA?")]
    [InlineData("--rated", "0.03", "did you mean 0.03A?")]
    [InlineData("--scale", "50", "did you mean 50mA?")]
    [InlineData("--alarm", "15", "did you mean 15mA?")]
    [InlineData("--dc-threshold", "2", "did you mean 2mA?")]
    [InlineData("--mains", "50", "did you mean 50Hz?")]
    [InlineData("--accuracy", "2%+0.1", "expected a share of the reading plus a current")]
    public void A_quantity_without_its_unit_is_refused_with_a_suggestion(string option, string value, string hint)
    {
        var wav = Synth("s.wav", "sine:rms=5mA");
        var (exit, output, error) = CliHarness.Run("analyze", wav, option, value);
        Assert.Equal(2, exit);
        var line = OneLine(error);
        Assert.Contains($"{option}: cannot use '{value}'", line, StringComparison.Ordinal);
        Assert.Contains(hint, line, StringComparison.Ordinal);
        Assert.Empty(output);
    }

    [Theory]
    [InlineData("30mA")]
    [InlineData("0.03A")]
    [InlineData("0.03 A")]
    [InlineData("30000uA")]
    public void A_current_with_its_unit_is_accepted_in_any_of_its_forms(string rated)
    {
        // SI prefixes (BIPM SI brochure): 30 mA = 0.03 A = 30 000 µA.
        var wav = Synth("s.wav", "sine:rms=5mA");
        var json = FilePath("s.json");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--rated", rated, "--json", json, "-q");
        Assert.True(exit == 0, error);
        Assert.DoesNotContain("not a rating in use", error, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal(0.030, doc.RootElement.GetProperty("assessment").GetProperty("ratedResidualCurrentA").GetDouble(), 1e-12);
    }

    [Fact]
    public void A_rating_off_the_ones_in_use_is_accepted_with_a_warning()
    {
        // REFERENCE.md "rated IΔn values in use": 10, 30, 100, 300, 500 mA, 1 A (practice); 25 mA is none of them.
        var wav = Synth("s.wav", "sine:rms=5mA");
        var json = FilePath("s.json");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--rated", "25mA", "--json", json, "-q");
        Assert.Equal(0, exit);
        var line = OneLine(error);
        Assert.StartsWith("wavecheck: warning: IΔn 25.0 mA is not a rating in use (6mA, 10mA, 30mA, 100mA, 300mA, 500mA, 1A)", line, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Contains(doc.RootElement.GetProperty("assessment").GetProperty("cautions").EnumerateArray(),
            c => c.GetString()!.Contains("not a rating in use", StringComparison.Ordinal));
    }

    [Fact]
    public void Synth_parts_follow_the_same_rule()
    {
        var path = FilePath("x.wav");
        var (exit, _, error) = CliHarness.Run("synth", "sine:rms=30", "-o", path);
        Assert.Equal(2, exit);
        Assert.Contains("did you mean 30mA?", OneLine(error), StringComparison.Ordinal);
        (exit, _, error) = CliHarness.Run("synth", "sine:rms=3mA", "--mains", "60", "-o", path);
        Assert.Equal(2, exit);
        Assert.Contains("--mains: cannot use '60'", OneLine(error), StringComparison.Ordinal);
        Assert.False(File.Exists(path));
    }

    /// <summary>Three phase currents of 10 A rms, 120° apart, and a neutral that carries their sum's opposite plus a
    /// 5 mA rms leakage: by Kirchhoff's current law the residual current L1 + L2 + L3 + N is exactly that 5 mA sine
    /// (closed form; the balanced phases cancel). Written at 10 kS/s for 1 s, six decimals (1 µA).</summary>
    private string ConductorCsv()
    {
        var text = new StringBuilder("time_s,L1_A,L2_A,L3_A,N_A\n");
        const double Peak = 10 * 1.4142135623730951;
        for (var n = 0; n < 10_000; n++)
        {
            var t = n / 10_000.0;
            var a = Peak * Math.Sin(2 * Math.PI * 50 * t);
            var b = Peak * Math.Sin((2 * Math.PI * 50 * t) - (2 * Math.PI / 3));
            var c = Peak * Math.Sin((2 * Math.PI * 50 * t) + (2 * Math.PI / 3));
            var leak = 0.005 * 1.4142135623730951 * Math.Sin(2 * Math.PI * 50 * t);
            var nValue = -(a + b + c) + leak;
            text.Append(CultureInfo.InvariantCulture, $"{t:0.######},{a:0.######},{b:0.######},{c:0.######},{nValue:0.######}\n");
        }

        var path = FilePath("conductors.csv");
        File.WriteAllText(path, text.ToString());
        return path;
    }

    [Fact]
    public void Conductor_currents_without_a_choice_are_refused_with_the_channels_and_both_ways_out()
    {
        var csv = ConductorCsv();
        var (exit, output, error) = CliHarness.Run("analyze", csv, "-q");
        Assert.Equal(2, exit);
        var line = OneLine(error);
        Assert.Contains("conductors.csv:1:1: 4 channels could carry the residual current (L1, L2, L3, N) and none is named as the residual current", line, StringComparison.Ordinal);
        Assert.Contains("--sum L1,L2,L3,N", line, StringComparison.Ordinal);
        Assert.Contains("--channel L1", line, StringComparison.Ordinal);
        Assert.Empty(output);

        // info only describes the file: it lists the channels and says an analysis needs a choice.
        (exit, output, error) = CliHarness.Run("info", csv, "--json", "-");
        Assert.True(exit == 0, error);
        Assert.Contains("an analysis needs --sum or --channel", output, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("L1_A,L2_A,L3_A,N_A")]   // the header exactly as written
    [InlineData("L1,L2,L3,N")]           // the parsed names
    [InlineData("l1_a,L2,3,N_A")]        // mixed, any case, and a number
    public void Sum_accepts_the_header_as_written_and_forms_the_residual_current(string sum)
    {
        var csv = ConductorCsv();
        var json = FilePath("sum.json");
        var (exit, _, error) = CliHarness.Run("analyze", csv, "--sum", sum, "--json", json, "-q");
        Assert.True(exit == 0, error);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal("L1+L2+L3+N", doc.RootElement.GetProperty("capture").GetProperty("residualSource").GetString());
        // Kirchhoff: 5 mA rms. Tolerance 0.05 mA: each of four cells is rounded to 1 µA (≤ 2 µA rms together) and
        // the 0.1 mA default accuracy is not involved; 1 % of reading is ample.
        Assert.Equal(0.005, doc.RootElement.GetProperty("summary").GetProperty("rmsA").GetDouble(), 0.00005);
        Assert.DoesNotContain(doc.RootElement.GetProperty("warnings").EnumerateArray(),
            w => w.GetProperty("code").GetString() == "implausible-residual");
    }

    [Fact]
    public void A_phase_current_chosen_as_the_residual_current_is_warned_about_at_the_top()
    {
        // Engineering choice (Limits.ImplausibleResidualMainsRmsA = 1 A): L1's 10 A at 50 Hz is a load current.
        var csv = ConductorCsv();
        var json = FilePath("l1.json");
        var (exit, output, error) = CliHarness.Run("analyze", csv, "--channel", "L1_A", "--json", json, "-q");
        Assert.True(exit == 0, error);
        Assert.StartsWith("WARNING: not a residual current? 'L1' carries 10000 mA at mains frequency", output.TrimStart(), StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal("implausible-residual", doc.RootElement.GetProperty("warnings")[0].GetProperty("code").GetString());
    }

    [Fact]
    public void Fail_on_upgrade_without_a_device_is_refused_with_the_reason()
    {
        var wav = Synth("s.wav", "halfwave:peak=30mA");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--fail-on", "upgrade", "-q");
        Assert.Equal(2, exit);
        Assert.Contains("--fail-on upgrade: judges the installed device, so it needs --device", OneLine(error), StringComparison.Ordinal);
        // With a device it runs, and a half-wave (pulsating DC, IEC 61008-1) fails type AC: exit 1.
        Assert.Equal(1, CliHarness.Run("analyze", wav, "--fail-on", "upgrade", "--device", "AC", "-q").Exit);
        Assert.Equal(0, CliHarness.Run("analyze", wav, "--fail-on", "alarm", "-q").Exit);   // needs no device

        var (surveyExit, _, surveyError) = CliHarness.Run("survey", wav, "--fail-on", "upgrade", "-o", FilePath("out"), "-q");
        Assert.Equal(2, surveyExit);
        Assert.Contains("needs --device", OneLine(surveyError), StringComparison.Ordinal);
        Assert.False(Directory.Exists(FilePath("out")));
    }

    [Fact]
    public void Analyse_is_an_alias_of_analyze()
    {
        var wav = Synth("s.wav", "halfwave:peak=30mA");
        var british = CliHarness.Run("analyse", wav, "--device", "AC", "--fail-on", "upgrade", "-q");
        var american = CliHarness.Run("analyze", wav, "--device", "AC", "--fail-on", "upgrade", "-q");
        Assert.Equal(1, british.Exit);
        Assert.Equal(american.Exit, british.Exit);
        Assert.Equal(american.Out, british.Out);
    }

    [Fact]
    public void Help_shows_value_names_and_defaults_from_the_code()
    {
        var (_, help, _) = CliHarness.Run("analyze", "--help");
        foreach (var name in new[] { "--rated <CURRENT>", "--report <FILE>", "--plots <DIR>", "--mains <auto|FREQUENCY>",
                     "--regime <iec|na>", "--sensor <dc|ac|unknown>", "--device <TYPE>", "--fail-on <upgrade,nuisance,alarm>" })
        {
            Assert.Contains(name, help, StringComparison.Ordinal);
        }

        // The defaults are written from the constants (Limits), not retyped: 30 mA IΔn, 6 mA type A tolerance.
        Assert.Contains($"(default {Core.Capture.Quantity.CurrentAsTyped(Core.Assessment.Limits.DefaultRatedResidualCurrentA)})", help, StringComparison.Ordinal);
        Assert.Contains("(default 6mA, IEC 61008-1)", help, StringComparison.Ordinal);

        var (_, survey, _) = CliHarness.Run("survey", "--help");
        Assert.DoesNotContain("not with --config", survey, StringComparison.Ordinal);
        var (_, info, _) = CliHarness.Run("info", "--help");
        Assert.Contains("COMTRADE", info, StringComparison.Ordinal);
        var (_, synth, _) = CliHarness.Run("synth", "--help");
        Assert.Contains("--rate <FREQUENCY>", synth, StringComparison.Ordinal);
        Assert.Contains("(default 50kHz)", synth, StringComparison.Ordinal);
    }
}
