using System.Diagnostics;
using System.Runtime.InteropServices;
using WaveCheck.Core;
using WaveCheck.Core.Export;

namespace WaveCheck.Rendering.Report;

/// <summary>
/// Prints a report's HTML to PDF with a Chromium-family browser installed on this machine (Chromium, Google Chrome or
/// Microsoft Edge), headless, with a fresh profile and no network. The report's own CSS sets the paper, margins,
/// running header and page numbers, so the browser's header and footer are switched off. The PDF is written through
/// <see cref="AtomicFile"/>: whole or not at all. Safe to use from several threads (each call its own temp folder).
/// </summary>
public static class PdfPrinter
{
    /// <summary>Environment variable that names a browser executable to use before any other.</summary>
    public const string BrowserVariable = "WAVECHECK_BROWSER";

    /// <summary>Longest wait for the browser, seconds (engineering choice: a report prints in a few seconds; a hung
    /// browser must not hang a survey).</summary>
    public const int TimeoutS = 120;

    /// <summary>What to install when no browser is found: the one line the user sees.</summary>
    public const string InstallHint =
        "no Chromium, Google Chrome or Microsoft Edge found to print the PDF: install one (Debian/Ubuntu: apt-get install chromium) or name it in WAVECHECK_BROWSER";

    private static readonly string[] Names =
        ["chromium", "chromium-browser", "google-chrome", "google-chrome-stable", "microsoft-edge", "microsoft-edge-stable", "msedge", "chrome"];

    private static readonly string[] FixedPaths =
    [
        "/usr/bin/chromium", "/usr/bin/chromium-browser", "/snap/bin/chromium", "/usr/bin/google-chrome",
        "/Applications/Google Chrome.app/Contents/MacOS/Google Chrome", "/Applications/Chromium.app/Contents/MacOS/Chromium",
        "/Applications/Microsoft Edge.app/Contents/MacOS/Microsoft Edge",
        @"C:\Program Files\Google\Chrome\Application\chrome.exe", @"C:\Program Files (x86)\Microsoft\Edge\Application\msedge.exe",
        @"C:\Program Files\Microsoft\Edge\Application\msedge.exe",
    ];

    /// <summary>The browser this machine would print with: <see cref="BrowserVariable"/> if it names a file, else the
    /// first of the known names on PATH, else a known install path; null when none is found.</summary>
    public static string? FindBrowser()
    {
        var named = Environment.GetEnvironmentVariable(BrowserVariable);
        if (!string.IsNullOrWhiteSpace(named))
        {
            return File.Exists(named) ? Path.GetFullPath(named) : null;
        }

        var path = Environment.GetEnvironmentVariable("PATH") ?? string.Empty;
        var suffixes = OperatingSystem.IsWindows() ? new[] { ".exe", string.Empty } : [string.Empty];
        foreach (var name in Names)
        {
            foreach (var folder in path.Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries))
            {
                foreach (var suffix in suffixes)
                {
                    var candidate = Path.Combine(folder, name + suffix);
                    if (File.Exists(candidate))
                    {
                        return candidate;
                    }
                }
            }
        }

        return FixedPaths.FirstOrDefault(File.Exists);
    }

    /// <summary>Prints <paramref name="html"/> to <paramref name="pdfPath"/>.</summary>
    /// <param name="html">A self-contained report (no network resources).</param>
    /// <param name="pdfPath">Target file; written whole or not at all.</param>
    /// <param name="cancellationToken">Stops the browser and writes nothing.</param>
    /// <returns>The browser used (its path), to be named to the user.</returns>
    /// <exception cref="UserInputException">No browser found (<see cref="InstallHint"/>), or the browser failed.</exception>
    public static string Print(string html, string pdfPath, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(html);
        ArgumentException.ThrowIfNullOrEmpty(pdfPath);
        var browser = FindBrowser() ?? throw new UserInputException($"--pdf {pdfPath}: {InstallHint}");
        var work = Directory.CreateTempSubdirectory("wavecheck-pdf-");
        try
        {
            var page = Path.Combine(work.FullName, "report.html");
            var printed = Path.Combine(work.FullName, "report.pdf");
            File.WriteAllText(page, html);
            Run(browser, work.FullName, page, printed, cancellationToken);
            if (!File.Exists(printed) || new FileInfo(printed).Length == 0)
            {
                throw new UserInputException($"--pdf {pdfPath}: {Path.GetFileName(browser)} wrote no PDF");
            }

            AtomicFile.Write(pdfPath, stream =>
            {
                using var source = File.OpenRead(printed);
                source.CopyTo(stream);
            }, cancellationToken);
            return browser;
        }
        finally
        {
            try
            {
                work.Delete(recursive: true);
            }
            catch (IOException)
            {
                // A browser helper may hold a file a moment longer; the system's temp cleaning takes it.
            }
            catch (UnauthorizedAccessException)
            {
                // As above.
            }
        }
    }

    private static void Run(string browser, string work, string page, string printed, CancellationToken cancellationToken)
    {
        var start = new ProcessStartInfo(browser)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (var argument in new[]
                 {
                     "--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-extensions",
                     "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-quic",
                     "--no-pdf-header-footer", "--print-to-pdf-no-header",
                     "--user-data-dir=" + Path.Combine(work, "profile"),
                     "--print-to-pdf=" + printed,
                     new Uri(page).AbsoluteUri,
                 })
        {
            start.ArgumentList.Add(argument);
        }

        using var process = Process.Start(start) ?? throw new UserInputException($"{browser} did not start");
        var stdout = process.StandardOutput.ReadToEndAsync(cancellationToken);
        var stderr = process.StandardError.ReadToEndAsync(cancellationToken);
        using var deadline = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        deadline.CancelAfter(TimeSpan.FromSeconds(TimeoutS));
        try
        {
            process.WaitForExitAsync(deadline.Token).GetAwaiter().GetResult();
        }
        catch (OperationCanceledException)
        {
            process.Kill(entireProcessTree: true);
            cancellationToken.ThrowIfCancellationRequested();
            throw new UserInputException($"{Path.GetFileName(browser)} did not print the PDF within {TimeoutS} s");
        }

        if (process.ExitCode != 0)
        {
            var last = (stderr.IsCompletedSuccessfully ? stderr.Result : string.Empty)
                .Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).LastOrDefault() ?? "no message";
            throw new UserInputException($"{Path.GetFileName(browser)} failed to print the PDF (exit {process.ExitCode}): {last}");
        }

        _ = stdout;
    }
}
