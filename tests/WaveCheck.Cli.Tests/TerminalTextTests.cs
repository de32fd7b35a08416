namespace WaveCheck.Cli.Tests;

/// <summary>
/// Control characters from files and names never reach the terminal. The characters are those ECMA-48 defines as
/// C0 (0x00-0x1F) and C1 (0x80-0x9F) controls, with ESC (0x1B) starting every escape sequence and CSI (0x9B) a
/// one-character one; the bidirectional overrides are those of Unicode UAX #9.
/// </summary>
public sealed class TerminalTextTests : IDisposable
{
    private readonly string _folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));

    public TerminalTextTests() => Directory.CreateDirectory(_folder);

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Theory]
    [InlineData("plain name", "plain name")]
    [InlineData("\u001b]0;owned\u0007", "\\x1B]0;owned\\x07")]          // OSC: set the window title
    [InlineData("\u001b[2J\u001b[H", "\\x1B[2J\\x1B[H")]                // clear the screen, cursor home
    [InlineData("a\tb\r\nc", "a\\x09b\\x0D\\x0Ac")]
    [InlineData("\u009b31m", "\\x9B31m")]                               // C1 CSI
    [InlineData("\u0000\u007f", "\\x00\\x7F")]
    [InlineData("file\u202Egnp.exe", "file\\u202Egnp.exe")]            // right-to-left override
    [InlineData("Prüfstand Ωμ", "Prüfstand Ωμ")]                        // printable non-ASCII stays
    public void Clean_makes_every_control_character_visible(string text, string expected)
    {
        Assert.Equal(expected, TerminalText.Clean(text));
        Assert.DoesNotContain(TerminalText.Clean(text), TerminalText.IsControl);
    }

    [Fact]
    public void Clean_returns_clean_text_itself() =>
        Assert.Same("C2 extractor fan", TerminalText.Clean("C2 extractor fan"));

    [Fact]
    public void Names_and_cells_from_a_capture_print_without_control_characters()
    {
        // A CSV whose file name and channel name carry escape sequences (set the window title; ESC c resets the terminal).
        var name = Path.Combine(_folder, "log\u001b]0;owned\u0007.csv");
        File.WriteAllText(name, "time [s],I\u001bc\u0007 [mA]\n" + string.Concat(Enumerable.Range(0, 2000).Select(i =>
            FormattableString.Invariant($"{i * 0.0005},{5 * Math.Sin(2 * Math.PI * 50 * i * 0.0005)}\n"))));
        var (exit, stdout, error) = CliHarness.Run("info", name);
        Assert.True(exit == 0, error);
        Assert.DoesNotContain(stdout, c => TerminalText.IsControl(c) && c != '\n' && c != '\r');
        // The file name is longer than a line and may be cut at the width: look for it in the lines joined.
        Assert.Contains("\\x1B]0;owned\\x07", string.Concat(stdout.Split('\n').Select(l => l.Trim())), StringComparison.Ordinal);
        Assert.Contains("I\\x1Bc\\x07", stdout, StringComparison.Ordinal);
        // Measured as printed: the escapes are wider than the characters they stand for, and still fit the width.
        Assert.All(stdout.Split('\n'), l => Assert.True(l.TrimEnd('\r').Length <= Terminal.DefaultWidth, l));

        (exit, stdout, error) = CliHarness.Run("analyze", name, "-q");
        Assert.True(exit == 0, error);
        Assert.DoesNotContain(stdout, c => TerminalText.IsControl(c) && c != '\n' && c != '\r');

        // The same name in an error line on stderr.
        File.WriteAllText(name, "time [s],I [mA]\n0,1\n0.001,\u001b[31mred\n");
        (exit, _, error) = CliHarness.Run("analyze", name, "-q");
        Assert.Equal(2, exit);
        Assert.Single(error.TrimEnd().Split('\n'));
        Assert.DoesNotContain(error.TrimEnd(), TerminalText.IsControl);
        Assert.Contains("\\x1B", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Survey_names_print_without_control_characters()
    {
        var logs = Path.Combine(_folder, "logs");
        Directory.CreateDirectory(logs);
        var (exit, _, error) = CliHarness.Run("synth", "sine:rms=5mA", "-o", Path.Combine(logs, "c1\u001b[2J.wav"), "--duration", "1s");
        Assert.True(exit == 0, error);
        string stdout;
        (exit, stdout, error) = CliHarness.Run("survey", logs, "-o", Path.Combine(_folder, "out"), "-q");
        Assert.True(exit == 0, error);
        Assert.DoesNotContain(stdout, c => TerminalText.IsControl(c) && c != '\n' && c != '\r');
        Assert.Contains("c1\\x1B[2J", stdout, StringComparison.Ordinal);
    }
}
