using System.Text.Json;

namespace WaveCheck.Cli.Tests;

/// <summary>The trip replay through <c>wavecheck analyze</c>: the terminal line, the alert, the JSON and <c>--timing</c>.</summary>
public sealed class TripReplayCommandTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public TripReplayCommandTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private string Surge(string name, string duration)
    {
        var path = Path.Combine(_folder, name);
        var (exit, _, error) = CliHarness.Run(["synth", "sine:rms=3mA", $"surge:rms=63mA,start=2.5s,duration={duration}",
            "--duration", "4s", "--rate", "10kHz", "-o", path]);
        Assert.True(exit == 0, error);
        return path;
    }

    [Fact]
    public void A_surge_past_the_break_time_prints_the_replay_and_the_test_the_device_alert()
    {
        // 66 mA = 2.2 IΔn for 250 ms: past the general type's 150 ms at 2 IΔn (IEC 61008-1, std) by more than the
        // 20 ms resolution: the summary says "will trip" and the panel asks for the device to be tested.
        var wav = Surge("long.wav", "250ms");
        var json = Path.Combine(_folder, "long.json");
        var (exit, output, error) = CliHarness.Run("analyze", wav, "--sensor", "dc", "--mains", "50Hz", "--json", json);
        Assert.True(exit == 0, error);
        Assert.Contains("Trip replay (IΔn 30.0 mA): 1 episode at or above 0.5 IΔn", output, StringComparison.Ordinal);
        Assert.Contains("general type: will trip", output, StringComparison.Ordinal);
        Assert.Contains("TEST THE DEVICE", output, StringComparison.Ordinal);

        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var replay = doc.RootElement.GetProperty("assessment").GetProperty("tripReplay");
        Assert.Equal(1, replay.GetProperty("episodesFound").GetInt32());
        Assert.Equal(JsonValueKind.Null, replay.GetProperty("installedTiming").ValueKind);
        var episode = replay.GetProperty("episodes")[0];
        Assert.Equal(0.25, episode.GetProperty("aboveRatedS").GetDouble(), 1e-3);
        // Within 1 %: the tracked window is cut into half-cycles at whole samples, so at 100 samples a half-cycle may
        // hold one sample more or fewer than half a period, which moves the RMS of a sine by up to 1/(2·100) (closed
        // form: the mean of sin² over N ± 1 samples of a half-period).
        Assert.Equal(2.2, episode.GetProperty("maxHalfCycleRmsMultiple").GetDouble(), 0.022);
        Assert.Equal(1, doc.RootElement.GetProperty("halfCycleEpisodes").GetProperty("found").GetInt32());
    }

    [Fact]
    public void Timing_s_judges_the_alert_on_the_time_delayed_break_times()
    {
        // 2.2 IΔn for 170 ms: at the general type's 150 ms within the resolution, inside type S's 200 ms (std).
        var wav = Surge("mid.wav", "170ms");
        var json = Path.Combine(_folder, "mid.json");
        var (exit, output, error) = CliHarness.Run("analyze", wav, "--sensor", "dc", "--mains", "50Hz", "--timing", "s", "--json", json);
        Assert.True(exit == 0, error);
        Assert.DoesNotContain("TEST THE DEVICE", output, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.Equal("s", doc.RootElement.GetProperty("assessment").GetProperty("tripReplay").GetProperty("installedTiming").GetString());
    }

    [Fact]
    public void An_unknown_timing_is_one_line_naming_the_option()
    {
        var wav = Surge("bad.wav", "20ms");
        var (exit, _, error) = CliHarness.Run("analyze", wav, "--timing", "slow");
        Assert.Equal(2, exit);
        Assert.Contains("--timing", error, StringComparison.Ordinal);
        Assert.Contains("general or s", error, StringComparison.Ordinal);
        Assert.Single(error.Trim().Split('\n'));
    }
}
