using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;
using WaveCheck.Core;
using WaveCheck.Core.Model;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Rendering.Tests.Report;

/// <summary>The report printed to PDF with the local Chromium, read back with poppler-utils (pdfinfo, pdftotext) as
/// an outside reader: it opens, its page count and size are those of the paper asked for, its text holds the verdict,
/// the report number and "page X of Y"; with no browser, one line says what to install. One class, so the tests
/// that set WAVECHECK_BROWSER never run beside the others.</summary>
public sealed class PdfPrinterTests : IDisposable
{
    private static readonly ReportContext Context = new("invented car park", "C4 charging point, bay 2", null,
        new DateTimeOffset(2026, 11, 21, 8, 0, 0, TimeSpan.Zero), "0.1.0-test")
    {
        Identity = new ReportIdentity { ReportNumber = "CP-2026-042", CaptureDigest = "0123456789ab", DigestFiles = ["bay2.wav"] },
    };

    private readonly OutputFolder output = new("pdf");

    public void Dispose() => output.Dispose();

    [Theory]

    // ISO 216 A4 is 210 × 297 mm = 595.28 × 841.89 pt; US Letter 8.5 × 11 in = 612 × 792 pt (1 pt = 1/72 in).
    [InlineData(PaperSize.A4, 595.28, 841.89)]
    [InlineData(PaperSize.Letter, 612.0, 792.0)]
    public void Report_prints_to_a_pdf_of_the_paper_asked_for_with_verdict_number_and_page_numbers(PaperSize paper, double widthPt, double heightPt)
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(), Context with { Paper = paper });
        var pdf = Path.Combine(output.Path, $"report-{paper}.pdf");

        var browser = PdfPrinter.Print(html, pdf);

        Assert.True(File.Exists(browser));
        Assert.Equal("%PDF-", System.Text.Encoding.ASCII.GetString(File.ReadAllBytes(pdf), 0, 5));
        var info = Poppler("pdfinfo", pdf);
        var pages = int.Parse(Regex.Match(info, @"Pages:\s+(\d+)").Groups[1].Value, CultureInfo.InvariantCulture);

        // A typical 60-second report (verdict, tables, four plots, appendix): 6 to 14 pages; the 50-row harmonic
        // table of noise that made such reports run to 12 pages and more is gone.
        Assert.InRange(pages, 6, 14);
        var size = Regex.Match(info, @"Page size:\s+([\d.]+) x ([\d.]+) pts");
        Assert.Equal(widthPt, double.Parse(size.Groups[1].Value, CultureInfo.InvariantCulture), 0);
        Assert.Equal(heightPt, double.Parse(size.Groups[2].Value, CultureInfo.InvariantCulture), 0);

        var text = Poppler("pdftotext", "-layout", pdf, "-");
        Assert.Contains("✘ Not adequate", text, StringComparison.Ordinal);
        Assert.Contains("Required RCD type: A", text, StringComparison.Ordinal);
        Assert.Contains("CP-2026-042", text, StringComparison.Ordinal);
        Assert.Contains($"page 1 of {pages}", text, StringComparison.Ordinal);
        Assert.Contains($"page {pages} of {pages}", text, StringComparison.Ordinal);

        // The running header on every page: one per page.
        Assert.Equal(pages, Regex.Count(text, "invented car park · C4 charging point, bay 2 · report CP-2026-042"));
        Assert.DoesNotContain(Directory.GetFiles(output.Path), f => !f.EndsWith(".pdf", StringComparison.Ordinal));
    }

    [Fact]
    public void No_browser_gives_one_line_naming_what_to_install_and_writes_nothing()
    {
        var pdf = Path.Combine(output.Path, "none.pdf");
        var before = Environment.GetEnvironmentVariable(PdfPrinter.BrowserVariable);
        Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, Path.Combine(output.Path, "no-such-browser"));
        try
        {
            Assert.Null(PdfPrinter.FindBrowser());
            var e = Assert.Throws<UserInputException>(() => PdfPrinter.Print("<html></html>", pdf));

            Assert.DoesNotContain('\n', e.Message);
            Assert.Contains("apt-get install chromium", e.Message, StringComparison.Ordinal);
            Assert.False(File.Exists(pdf));
        }
        finally
        {
            Environment.SetEnvironmentVariable(PdfPrinter.BrowserVariable, before);
        }
    }

    private static string Poppler(string tool, params string[] arguments)
    {
        var path = "/usr/bin/" + tool;
        if (!File.Exists(path))
        {
            Assert.Fail($"{tool} not found: the PDF tests read PDFs back with poppler-utils (apt-get install poppler-utils; tests/run-all.sh does).");
        }

        var start = new ProcessStartInfo(path) { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (var argument in arguments)
        {
            start.ArgumentList.Add(argument);
        }

        using var process = Process.Start(start)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        Assert.True(process.WaitForExit(60_000), $"{tool} did not finish");
        Assert.True(process.ExitCode == 0, $"{tool} exit {process.ExitCode}: {stderr.Result}");
        return stdout.Result;
    }
}
