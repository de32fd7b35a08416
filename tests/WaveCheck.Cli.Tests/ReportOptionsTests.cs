using System.Diagnostics;
using System.Text.Json;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Cli.Tests;

/// <summary><c>analyze</c>'s identity, paper and PDF options end to end: the identity and the capture's digest in
/// the JSON, the PDF read back with poppler-utils, and one line for each bad value or a missing browser.</summary>
public sealed class ReportOptionsTests : CliTestFolder
{
    [Fact]
    public void Identity_goes_into_json_report_and_pdf_with_the_captures_sha256()
    {
        var wav = Synth("hw.wav", "halfwave:peak=30mA", "dc:level=8mA");
        var (json, html, pdf) = (FilePath("r.json"), FilePath("r.html"), FilePath("r.pdf"));

        var (exit, _, error) = CliHarness.Run("analyze", wav, "--device", "A", "--json", json, "--report", html, "--pdf", pdf,
            "--paper", "letter", "--report-number", "WS-2026-014", "--client", "invented client", "--operator", "A. Tester",
            "--instrument", "recorder", "--instrument-serial", "S-1", "--calibration-due", "2027-03-31", "--recorded", "2026-11-20T09:14:00Z");

        Assert.True(exit == 0, error);
        Assert.Contains("PDF printed with ", error, StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var identity = doc.RootElement.GetProperty("identity");
        Assert.Equal("WS-2026-014", identity.GetProperty("reportNumber").GetString());
        Assert.Equal("2027-03-31", identity.GetProperty("calibrationDue").GetString());
        Assert.False(identity.GetProperty("productTest").GetBoolean());

        // Reference: coreutils sha256sum (FIPS 180-4) on the same file.
        var sha = Run("/usr/bin/sha256sum", wav).Split(' ')[0];
        Assert.Equal(sha, identity.GetProperty("captureSha256").GetString());
        Assert.Equal(sha[..12], identity.GetProperty("captureDigest").GetString());

        Assert.Contains(sha[..12], File.ReadAllText(html), StringComparison.Ordinal);
        Assert.Contains("size: letter;", File.ReadAllText(html), StringComparison.Ordinal);
        var text = Run("/usr/bin/pdftotext", "-layout", pdf, "-");
        Assert.Contains("WS-2026-014", text, StringComparison.Ordinal);
        Assert.Contains("Not adequate", text, StringComparison.Ordinal);
        Assert.Contains("Required RCD type: B", text, StringComparison.Ordinal);
        Assert.Contains("612 x 792 pts", Run("/usr/bin/pdfinfo", pdf), StringComparison.Ordinal); // US Letter, 8.5 × 11 in
    }

    [Fact]
    public void Survey_prints_its_index_to_pdf_outside_the_output_folder()
    {
        // A sine is what type AC detects; IEC 61008-1's half-wave test current (pulsating DC) needs type A: with type AC
        // installed, C2 needs an upgrade and the index lists it in its remedial schedule.
        var c1 = Synth("c1.wav", "sine:rms=5mA");
        var c2 = Synth("c2.wav", "halfwave:peak=10mA");
        var output = FilePath("out");
        var pdf = FilePath("index.pdf");
        var (exit, _, error) = CliHarness.Run("survey", c1, c2, "--device", "AC", "--rated", "30mA", "--sensor", "dc",
            "-o", output, "--pdf", pdf, "-q");
        Assert.True(exit == 0, error);
        Assert.Contains("PDF printed with ", error, StringComparison.Ordinal);
        var text = Run("/usr/bin/pdftotext", "-layout", pdf, "-");
        Assert.Contains("Remedial schedule", text, StringComparison.Ordinal);
        Assert.Contains("c2", text, StringComparison.Ordinal);

        // Inside the output folder the PDF would be a stranger in a folder each survey replaces as a whole: refused
        // before any work, the folder as it was.
        var before = Directory.GetFileSystemEntries(output).Order(StringComparer.Ordinal).ToArray();
        var (refused, _, why) = CliHarness.Run("survey", c1, "-o", output, "--pdf", Path.Combine(output, "index.pdf"), "-q");
        Assert.Equal(2, refused);
        Assert.Contains("outside --output", why, StringComparison.Ordinal);
        Assert.Equal(before, Directory.GetFileSystemEntries(output).Order(StringComparer.Ordinal).ToArray());
    }

    [Theory]
    [InlineData("--calibration-due", "31.03.2027", "expected a date such as 2027-03-31")]
    [InlineData("--recorded", "yesterday", "expected a date or date and time")]
    [InlineData("--paper", "tabloid", "expected a4 or letter")]
    public void Bad_identity_and_paper_values_are_one_line_and_exit_2(string option, string value, string expected)
    {
        var wav = Synth("s.wav", "sine:rms=5mA");

        var (exit, output, error) = CliHarness.Run("analyze", wav, option, value);

        Assert.Equal(2, exit);
        Assert.Equal(string.Empty, output);
        var line = Assert.Single(error.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        Assert.Contains(option, line, StringComparison.Ordinal);
        Assert.Contains(expected, line, StringComparison.Ordinal);
    }

    [Fact]
    public void Pdf_without_a_browser_names_what_to_install_before_writing_anything()
    {
        var wav = Synth("s.wav", "sine:rms=5mA");
        var (html, pdf) = (FilePath("r.html"), FilePath("r.pdf"));
        var before = Environment.GetEnvironmentVariable(PdfPrinter.BrowserVariable);
        Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, FilePath("no-such-browser"));
        try
        {
            var (exit, _, error) = CliHarness.Run("analyze", wav, "--report", html, "--pdf", pdf);

            Assert.Equal(2, exit);
            var line = Assert.Single(error.Split('\n', StringSplitOptions.RemoveEmptyEntries));
            Assert.Contains("apt-get install chromium", line, StringComparison.Ordinal);
            Assert.False(File.Exists(pdf));
            Assert.False(File.Exists(html));
        }
        finally
        {
            Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, before);
        }
    }

    private static string Run(string tool, params string[] arguments)
    {
        Assert.True(File.Exists(tool), $"{tool} not found (coreutils; poppler-utils: tests/run-all.sh installs it)");
        var start = new ProcessStartInfo(tool) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }

        using var process = Process.Start(start)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        Assert.True(process.WaitForExit(60_000), $"{tool} did not finish");
        Assert.Equal(0, process.ExitCode);
        return stdout.Result;
    }
}
