using System.Runtime.CompilerServices;
using System.Text.RegularExpressions;
using WaveCheck.Core;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Cli.Tests;

/// <summary>
/// Core marks the settings its texts name (<see cref="Setting.Ref"/>); the CLI words them with its flags
/// (<see cref="SettingFlags"/>), a site-file survey with the site file's keys, Core alone with property names.
/// </summary>
public sealed class SettingFlagsTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public SettingFlagsTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void A_core_warning_gives_the_flag_in_the_cli_and_no_flag_by_property_names()
    {
        var warning = Evaluation.ImplausibleResidual(2.0, "L1");

        var cli = warning.InWords(SettingFlags.Of).Message;
        var neutral = warning.InWords(Setting.PropertyName).Message;

        Assert.Contains("add every live conductor's channel with --sum, before trusting any verdict", cli, StringComparison.Ordinal);
        Assert.Contains("add every live conductor's channel with SumChannels, before trusting any verdict", neutral, StringComparison.Ordinal);
        Assert.DoesNotContain("--", neutral, StringComparison.Ordinal);
        Assert.Contains("add every live conductor's channel with the site file's \"sum\", before",
            warning.InWords(SettingFlags.ForSurvey(fromSiteFile: true, new HashSet<string>())).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_setting_core_names_in_a_text_has_a_flag()
    {
        // Read from Core's source: each Setting.Ref(nameof(Options.Property)) and each synthesizer setting.
        var core = Path.GetFullPath(Path.Combine(Path.GetDirectoryName(ThisFile())!, "..", "..", "src", "WaveCheck.Core"));
        var named = Directory.EnumerateFiles(core, "*.cs", SearchOption.AllDirectories)
            .SelectMany(f => Regex.Matches(File.ReadAllText(f), @"Setting\.Ref\(nameof\((?:[A-Za-z]+\.)*(?<p>[A-Za-z0-9]+)\)\)").Select(m => m.Groups["p"].Value))
            .Concat([WaveCheck.Core.Synthesis.SynthesisSettings.Supply, WaveCheck.Core.Synthesis.SynthesisSettings.Parts])
            .ToHashSet(StringComparer.Ordinal);

        Assert.True(named.Count >= 15, $"only {named.Count} settings found in Core's texts");
        Assert.Contains(nameof(ImportOptions.SumChannels), named);
        Assert.All(named, p => Assert.Contains(p, SettingFlags.Settings));
    }

    [Fact]
    public void An_analysis_names_flags_and_a_site_file_survey_names_its_keys()
    {
        // A charging point declared to detect DC itself: its class finding names the setting that declared it.
        var capture = Path.Combine(_folder, "bay.wav");
        Assert.Equal(0, CliHarness.Run("synth", "sine:rms=5mA", "-o", capture, "--duration", "1s", "--sensor", "dc").Exit);
        var json = Path.Combine(_folder, "bay.json");
        var (exit, _, error) = CliHarness.Run("analyze", capture, "--ev", "--charger-dc-detection", "--json", json);
        Assert.True(exit == 0, error);
        var analysis = File.ReadAllText(json);
        Assert.Contains("as declared (--charger-dc-detection)", analysis, StringComparison.Ordinal);
        Assert.DoesNotContain("⟦", analysis, StringComparison.Ordinal);

        File.WriteAllText(Path.Combine(_folder, "site.json"),
            """{ "site": "invented car park", "captures": [ { "file": "bay.wav", "circuit": "bay 1", "ev": true, "chargerDcDetection": true } ] }""");
        var output = Path.Combine(_folder, "survey");
        (exit, _, error) = CliHarness.Run("survey", "--config", Path.Combine(_folder, "site.json"), "-o", output, "-q");
        Assert.True(exit == 0, error);
        var report = System.Net.WebUtility.HtmlDecode(File.ReadAllText(Path.Combine(output, "reports", "bay.html")));
        Assert.Contains("as declared (the site file's \"chargerDcDetection\")", report, StringComparison.Ordinal);
        Assert.DoesNotContain("--charger-dc-detection", report, StringComparison.Ordinal);
        Assert.DoesNotContain("⟦", report, StringComparison.Ordinal);
    }

    private static string ThisFile([CallerFilePath] string path = "") => path;
}
