using System.Diagnostics;

namespace WaveCheck.Rendering.Tests.Report;

/// <summary>Runs headless Chromium on a file with a fresh profile and a hard timeout.</summary>
internal static class Chromium
{
    public const string ExecutablePath = "/usr/bin/chromium";

    private static readonly TimeSpan Timeout = TimeSpan.FromSeconds(90);

    public sealed record Output(int ExitCode, string Stdout, string Stderr);

    /// <summary>Lines of Chromium's log that report page console output ("CONSOLE"), an uncaught error or a blocked resource ("Refused to").</summary>
    public static IReadOnlyList<string> ConsoleProblems(string stderr) =>
        stderr.Split('\n').Where(l => l.Contains("Uncaught", StringComparison.Ordinal)
            || l.Contains(":CONSOLE", StringComparison.Ordinal) || l.Contains("Refused to", StringComparison.Ordinal)).ToList();

    /// <summary>Runs Chromium headless on <paramref name="file"/> with <paramref name="extra"/> arguments; fails the test when Chromium is missing.</summary>
    public static Output Run(string file, params string[] extra)
    {
        if (!File.Exists(ExecutablePath))
        {
            Assert.Fail($"Chromium not found at {ExecutablePath}: the report tests need it (install the 'chromium' package; CI does).");
        }

        var profile = Path.Combine(Path.GetTempPath(), "wavecheck-chromium-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(profile);
        try
        {
            var start = new ProcessStartInfo(ExecutablePath)
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
                UseShellExecute = false,
            };
            foreach (var argument in new[]
                     {
                         "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                         "--disable-background-networking", "--disable-component-update", "--disable-sync",
                         "--user-data-dir=" + profile,
                     })
            {
                start.ArgumentList.Add(argument);
            }

            foreach (var argument in extra)
            {
                start.ArgumentList.Add(argument);
            }

            start.ArgumentList.Add(new Uri(Path.GetFullPath(file)).AbsoluteUri);
            using var process = Process.Start(start) ?? throw new InvalidOperationException("Chromium did not start");
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            if (!process.WaitForExit(Timeout))
            {
                process.Kill(entireProcessTree: true);
                Assert.Fail($"Chromium did not finish within {Timeout.TotalSeconds} s on {file}");
            }

            process.WaitForExit();
            return new Output(process.ExitCode, stdout.Result, stderr.Result);
        }
        finally
        {
            try
            {
                Directory.Delete(profile, recursive: true);
            }
            catch (IOException)
            {
                // A helper process may still hold a file for a moment; the temp folder is cleaned by the system.
            }
        }
    }
}
