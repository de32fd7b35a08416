using System.Text.Json;

namespace WaveCheck.Cli.Tests;

public sealed class SynthCommandTests : CliTestFolder
{
    private static JsonElement Residual(JsonDocument info)
    {
        foreach (var channel in info.RootElement.GetProperty("channels").EnumerateArray())
        {
            if (channel.GetProperty("name").GetString() == "residual")
            {
                return channel;
            }
        }

        throw new InvalidOperationException("no residual row in the info JSON");
    }

    [Theory]
    [InlineData("pcm16")]
    [InlineData("pcm24")]
    [InlineData("float32")]
    public void Half_wave_on_dc_written_as_wav_reads_back_with_its_closed_form_mean(string format)
    {
        // Closed form (textbook rectifier analysis): a half-wave at delay angle 90° of 30 mA peak has mean
        // 30(1 + cos 90°)/(2π) = 4.775 mA; on 8 mA smooth DC the mean is 12.775 mA and the minimum 8 mA.
        // Tolerance: one sample of the conduction step per cycle (30 mA / 1000) plus the 16-bit LSB of a 50 mA full scale.
        var path = FilePath($"hw-{format}.wav");
        var (exit, _, error) = CliHarness.Run("synth", "halfwave:peak=30mA,angle=90", "dc:level=8mA", "-o", path, "--format", format);
        Assert.True(exit == 0, error);

        var jsonPath = FilePath($"hw-{format}.json");
        Assert.Equal(0, CliHarness.Run("info", path, "--json", jsonPath).Exit);
        using var info = JsonDocument.Parse(File.ReadAllText(jsonPath));
        var residual = Residual(info);
        Assert.Equal(0.008 + 0.030 / (2 * Math.PI), residual.GetProperty("meanSi").GetDouble(), 0.030 / 1000 + 0.05 / 32768);
        Assert.Equal(0.008, residual.GetProperty("minSi").GetDouble(), 0.05 / 32768 * 2);
        Assert.Equal("dc", info.RootElement.GetProperty("capture").GetProperty("sensorCoupling").GetString());
    }

    [Fact]
    public void Full_scale_below_the_peak_clips_and_info_says_so()
    {
        // A 30 mA rms sine peaks at 42.4 mA (closed form: peak = √2 · rms); a 20 mA full scale must clip it.
        var path = FilePath("clipped.wav");
        Assert.Equal(0, CliHarness.Run("synth", "sine:rms=30mA", "-o", path, "--full-scale", "20mA", "--format", "pcm16").Exit);
        var (exit, output, _) = CliHarness.Run("info", path);
        Assert.Equal(0, exit);
        Assert.Contains("clip", output, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Csv_output_has_a_time_column_and_reads_back()
    {
        var path = FilePath("sine.csv");
        Assert.Equal(0, CliHarness.Run("synth", "sine:rms=10mA", "-o", path, "--rate", "10kHz", "--duration", "200ms").Exit);
        var lines = File.ReadAllLines(path);
        Assert.StartsWith("time [s]", lines[0], StringComparison.Ordinal);
        Assert.Equal(2001, lines.Length);
        Assert.Equal(0, CliHarness.Run("info", path).Exit);
    }

    [Theory]
    [InlineData("triangle", "a kind among")]
    [InlineData("dc:level=lots", "a current")]
    public void Bad_parts_fail_with_one_line_and_exit_2(string part, string expected)
    {
        var (exit, _, error) = CliHarness.Run("synth", part, "-o", FilePath("x.wav"));
        Assert.Equal(2, exit);
        Assert.Contains(expected, error, StringComparison.Ordinal);
        Assert.Single(error.TrimEnd().Split('\n'));
        Assert.DoesNotContain("   at ", error, StringComparison.Ordinal);
        Assert.False(File.Exists(FilePath("x.wav")));
    }

    [Theory]
    [InlineData("x.mp3", "--output")]
    [InlineData("x.wav", "--rate")]
    public void Bad_options_fail_with_one_line_and_exit_2(string name, string option)
    {
        string[] args = option == "--rate"
            ? ["synth", "sine", "-o", FilePath(name), "--rate", "fast"]
            : ["synth", "sine", "-o", FilePath(name)];
        var (exit, _, error) = CliHarness.Run(args);
        Assert.Equal(2, exit);
        Assert.Contains(option, error, StringComparison.Ordinal);
    }

    [Fact]
    public void A_wav_too_large_for_its_32_bit_sizes_is_refused_before_writing()
    {
        // RIFF/WAVE (closed form): chunk sizes are 32-bit, so a float32 mono file holds at most about 2^32 / 4 =
        // 1.07e9 samples; 2.4e9 (8 h at 80 kS/s) must be refused at once, with one line and no file.
        var path = FilePath("huge.wav");
        var (exit, _, error) = CliHarness.Run(["synth", "sine", "-o", path, "--rate", "80kHz", "--duration", "8h", "--format", "float32"]);
        Assert.Equal(2, exit);
        Assert.Contains("--duration", error, StringComparison.Ordinal);
        Assert.Contains("4 GiB", error, StringComparison.Ordinal);
        Assert.Single(error.TrimEnd().Split('\n'));
        Assert.False(File.Exists(path));
    }
}
