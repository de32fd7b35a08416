using System.Globalization;
using System.Text;
using System.Text.Json;
using WaveCheck.Core.Capture;

namespace WaveCheck.Cli.Tests;

public sealed class InfoCommandTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public InfoCommandTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    private string FilePath(string name) => Path.Combine(_folder, name);

    private string Write(string name, string text)
    {
        var path = FilePath(name);
        File.WriteAllText(path, text);
        return path;
    }

    /// <summary>20 mA peak at 50 Hz, 10 kHz, 0.5 s, 16-bit PCM with 100 mA full scale.</summary>
    private string SineWav()
    {
        var x = new double[5000];
        for (var n = 0; n < x.Length; n++)
        {
            x[n] = 0.02 * Math.Sin(2 * Math.PI * 50 * n / 10_000.0);
        }

        var path = FilePath("sine.wav");
        CaptureWriter.WriteWav(path, [x], 10_000, 0.1, WavSampleFormat.Pcm16, SensorCoupling.Dc);
        return path;
    }

    [Fact]
    public void PrintsTheCaptureAsPlainTextWhenRedirected()
    {
        var (exit, stdout, stderr) = CliHarness.Run("info", SineWav());
        Assert.Equal(0, exit);
        Assert.Empty(stderr);
        Assert.DoesNotContain('\u001b', stdout); // no ANSI codes when the output is not a terminal
        Assert.Contains("PCM 16-bit, 1 channel", stdout);
        Assert.Contains("10000 Hz (stated by the file)", stdout);
        Assert.Contains("0.5 s", stdout);
        Assert.Contains("100 mA", stdout); // full scale from the file's own chunk
        Assert.Contains("dc", stdout);
        // closed form: the crest of a 20 mA sine at 200 samples a cycle lands on a sample; 16-bit LSB 0.003 mA.
        Assert.Contains("20.0", stdout);
        Assert.Contains("-20.0", stdout);
        Assert.Contains("[rate-low]", stdout); // 10 kHz cannot show the 20 kHz band (Nyquist 5 kHz)
    }

    [Fact]
    public void WritesTheInfoJson()
    {
        var json = FilePath("info.json");
        var (exit, _, stderr) = CliHarness.Run("info", SineWav(), "--json", json);
        Assert.Equal(0, exit);
        Assert.Empty(stderr);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var root = doc.RootElement;
        Assert.Equal("wavecheck.info/1", root.GetProperty("schema").GetString());
        var capture = root.GetProperty("capture");
        Assert.Equal("wav", capture.GetProperty("format").GetString());
        Assert.Equal(10_000, capture.GetProperty("sampleRateHz").GetDouble());
        Assert.Equal(5000, capture.GetProperty("sampleCount").GetInt64());
        Assert.Equal("dc", capture.GetProperty("sensorCoupling").GetString());
        var channels = root.GetProperty("channels");
        Assert.Equal(2, channels.GetArrayLength()); // ch1 and the residual
        // closed form: crest 0.02 A, stored as round(0.2·32768) codes: within one 16-bit LSB of 0.1 A (3.05e-6 A).
        Assert.Equal(0.02, channels[0].GetProperty("maxSi").GetDouble(), 3.1e-6);
        Assert.Contains(root.GetProperty("warnings").EnumerateArray(), w => w.GetProperty("code").GetString() == "rate-low");
    }

    [Fact]
    public void JsonToStdoutIsJsonOnly()
    {
        var (exit, stdout, _) = CliHarness.Run("info", SineWav(), "--json", "-");
        Assert.Equal(0, exit);
        using var doc = JsonDocument.Parse(stdout);
        Assert.Equal("wavecheck.info/1", doc.RootElement.GetProperty("schema").GetString());
    }

    [Fact]
    public void SumsChannelsOfACsv()
    {
        var text = new StringBuilder("time [s],L1 [A],N [A]\n");
        for (var n = 0; n < 100; n++)
        {
            // Kirchhoff: L1 + N = residual; L1 carries 5 A, N returns 5 A less 7 mA, so the residual is 7 mA throughout.
            text.Append(CultureInfo.InvariantCulture, $"{n / 1000.0:R},5,{-5 + 0.007:R}\n");
        }

        var path = Write("two-wire.csv", text.ToString());
        var (exit, stdout, stderr) = CliHarness.Run("info", path, "--sum", "L1,N", "--json", "-");
        Assert.Equal(0, exit);
        Assert.Empty(stderr);
        using var doc = JsonDocument.Parse(stdout);
        var residual = doc.RootElement.GetProperty("channels")[2];
        Assert.Equal("residual", residual.GetProperty("name").GetString());
        Assert.Equal(0.007, residual.GetProperty("meanSi").GetDouble(), 1e-12); // 5 − 4.993 in doubles: ulps of 5 A
        Assert.Equal("L1+N", doc.RootElement.GetProperty("capture").GetProperty("residualSource").GetString());
    }

    public static TheoryData<string, string[], string> BadInputs() => new()
    {
        // name, file content (null: special), extra args, what the line must name besides the file
        { "data.xyz", ["hello"], "unknown capture format" },
        { "cells.csv", ["time [s],I [mA]\n0,1\n0.001,2\n0.002,abc\n"], ":4:2: 'abc' is not a number" },
        { "unit.csv", ["time [s],I [furlong]\n0,1\n"], ":1:2: unknown unit 'furlong'" },
        { "chan.csv", ["time [s],I [mA]\n0,1\n0.001,2\n", "--channel", "L9"], ":1:1: --channel: no channel named 'L9'" },
        { "empty.csv", [""], "empty file" },
        { "header.csv", ["time [s],I [mA]\n"], ":2:1: the header is followed by no data rows" },
        { "fake.wav", ["not a riff file"], "byte 0: not a WAV file" },
        { "noscale.wav", ["<wav>"], "give --scale" },
        { "both.wav", ["<wav>", "--scale", "0.1A", "--sensitivity", "10 mV/mA"], "--scale: cannot use '0.1A'" },
        { "badscale.wav", ["<wav>", "--scale", "lots"], "--scale: cannot use 'lots'" },
    };

    [Theory]
    [MemberData(nameof(BadInputs))]
    public void BadInputGivesExitTwoAndOneLine(string name, string[] contentAndArgs, string expected)
    {
        var path = FilePath(name);
        if (contentAndArgs[0] == "<wav>")
        {
            // A plain WAV without our chunk: written with NAudio directly, as a logger would.
            using var writer = new NAudio.Wave.WaveFileWriter(path, new NAudio.Wave.WaveFormat(8000, 16, 1));
            writer.WriteSamples(new float[] { 0.1f, 0.2f }, 0, 2);
        }
        else
        {
            File.WriteAllText(path, contentAndArgs[0]);
        }

        AssertOneLineError(["info", path, .. contentAndArgs[1..]], expected, path);
    }

    [Fact]
    public void MissingFileAndDirectoryGiveExitTwoAndOneLine()
    {
        AssertOneLineError(["info", FilePath("absent.wav")], "no such file", FilePath("absent.wav"));
        AssertOneLineError(["info", _folder], "is a directory", _folder);
    }

    private static void AssertOneLineError(string[] args, string expected, string path)
    {
        var (exit, stdout, stderr) = CliHarness.Run(args);
        Assert.Equal(2, exit);
        var lines = stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Single(lines);
        Assert.DoesNotContain("   at ", stderr);
        // File errors come from the command ("wavecheck: "), unparseable values from the parser ("wavecheck info: ").
        Assert.Matches("^wavecheck( info)?: ", lines[0]);
        Assert.Contains(expected, lines[0]);
        if (!expected.StartsWith("--", StringComparison.Ordinal))
        {
            Assert.Contains(path, lines[0]);
        }

        Assert.Empty(stdout);
    }
}
