using System.Diagnostics;
using System.Runtime.InteropServices;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Cli.Tests;

/// <summary>A 20-minute capture, written once for the interruption tests (about 3 s of analysis on a shared 2-core VM).</summary>
public sealed class LongCapture : IDisposable
{
    public LongCapture()
    {
        Folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", "long-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path.Combine(Folder, "captures"));
        WavPath = Path.Combine(Folder, "captures", "long.wav");
        using var source = new SynthCaptureSource(SynthesisSpec.Parse("sine:rms=5mA", 50), 50_000, 1200);
        CaptureWriter.WriteWav(WavPath, source, 0.01, WavSampleFormat.Pcm16);
    }

    public string Folder { get; }

    public string WavPath { get; }

    public void Dispose() => Directory.Delete(Folder, recursive: true);
}

/// <summary>
/// Ctrl-C and SIGTERM sent to a real <c>wavecheck</c> process mid-run: it must stop, delete its temporary and staging
/// files, say what was not written and exit with 128 + the signal number (130, 143), as POSIX shells report a
/// process ended by a signal (IEEE Std 1003.1, Shell Command Language, "Exit Status for Commands").
/// </summary>
[System.Runtime.Versioning.UnsupportedOSPlatform("windows")] // POSIX signals
public sealed class InterruptionTests(LongCapture capture) : IClassFixture<LongCapture>, IDisposable
{
    private const int SigInt = 2;
    private const int SigTerm = 15;

    private readonly string _folder = CreateFolder();

    private static string CreateFolder()
    {
        var folder = Path.Combine(Path.GetTempPath(), "wavecheck-cli-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        return folder;
    }

    public void Dispose() => Directory.Delete(_folder, recursive: true);

    [Fact]
    public void Sigint_mid_survey_exits_130_and_leaves_the_old_set_and_no_staging_or_temporary_file()
    {
        // The old set: a survey of a short capture into the same folder.
        var output = Path.Combine(_folder, "out");
        var small = Path.Combine(_folder, "small");
        Directory.CreateDirectory(small);
        using (var source = new SynthCaptureSource(SynthesisSpec.Parse("sine:rms=5mA", 50), 10_000, 1))
        {
            CaptureWriter.WriteWav(Path.Combine(small, "c1.wav"), source, 0.01, WavSampleFormat.Float32);
        }

        var (first, _, firstError) = RunToEnd("survey", small, "-o", output, "-q");
        Assert.True(first == 0, firstError);
        var before = Snapshot(output);

        // Mid-run: the staging folder exists and the window table's temporary file in it is being written.
        using var child = Start("survey", Path.GetDirectoryName(capture.WavPath)!, "-o", output, "--parquet", "-q");
        WaitFor(child, () => Directory.GetFiles(_folder, ".wc-*.tmp", SearchOption.AllDirectories).Length > 0);
        Assert.Single(Directory.GetDirectories(_folder, ".wc-*.staging"));
        Assert.Equal(0, kill(child.Id, SigInt));
        var (exit, error) = Finish(child);

        Assert.True(exit == 130, $"exit {exit}: {error}");
        var line = Assert.Single(error.TrimEnd().Split('\n'));
        Assert.StartsWith("wavecheck: interrupted by SIGINT: nothing written", line, StringComparison.Ordinal);
        Assert.Empty(Directory.GetFileSystemEntries(_folder, ".wc-*", SearchOption.AllDirectories));
        Assert.Equal(before, Snapshot(output));
    }

    [Theory]
    [InlineData(SigInt, 130, "SIGINT")]
    [InlineData(SigTerm, 143, "SIGTERM")]
    public void A_signal_mid_analysis_exits_128_plus_it_and_leaves_no_output_and_no_temporary_file(int signal, int expected, string name)
    {
        var json = Path.Combine(_folder, "r.json");
        var csv = Path.Combine(_folder, "w.csv");
        using var child = Start("analyze", capture.WavPath, "--json", json, "--windows-csv", csv, "-q");
        WaitFor(child, () => Directory.GetFiles(_folder, ".wc-*.tmp").Length > 0);
        Assert.Equal(0, kill(child.Id, signal));
        var (exit, error) = Finish(child);

        Assert.True(exit == expected, $"exit {exit}: {error}");
        Assert.Equal($"wavecheck: interrupted by {name}: nothing written (--json {json}, --windows-csv {csv} not written)", error.TrimEnd());
        Assert.Empty(Directory.GetFileSystemEntries(_folder));
    }

    private static Dictionary<string, string> Snapshot(string folder) =>
        Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories)
            .ToDictionary(f => Path.GetRelativePath(folder, f), f => Convert.ToBase64String(File.ReadAllBytes(f)));

    /// <summary>Starts <c>wavecheck</c> as its own process. On Linux it goes through <c>env --default-signal=INT</c>,
    /// so that SIGINT is not ignored even when the test host was started in the background by a shell (which
    /// ignores SIGINT for background jobs, and the child would inherit that).</summary>
    private Process Start(params string[] args)
    {
        var dotnet = Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host ? host : "dotnet";
        var start = OperatingSystem.IsLinux()
            ? new ProcessStartInfo("/usr/bin/env") { ArgumentList = { "--default-signal=INT", dotnet } }
            : new ProcessStartInfo(dotnet);
        start.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "wavecheck.dll"));
        foreach (var arg in args)
        {
            start.ArgumentList.Add(arg);
        }

        start.WorkingDirectory = _folder;
        start.RedirectStandardOutput = true;
        start.RedirectStandardError = true;
        start.Environment["NO_COLOR"] = "1";
        return Process.Start(start) ?? throw new InvalidOperationException("wavecheck did not start");
    }

    private (int Exit, string Out, string Error) RunToEnd(params string[] args)
    {
        using var child = Start(args);
        var (exit, error) = Finish(child);
        return (exit, "", error);
    }

    private static void WaitFor(Process child, Func<bool> condition)
    {
        var deadline = Stopwatch.StartNew();
        while (!condition())
        {
            if (child.HasExited || deadline.Elapsed > TimeSpan.FromSeconds(60))
            {
                var error = child.HasExited ? child.StandardError.ReadToEnd() : "";
                if (!child.HasExited)
                {
                    child.Kill();
                }

                Assert.Fail($"the run did not reach the point to interrupt it (exited: {child.HasExited}) {error}");
            }

            Thread.Sleep(10);
        }
    }

    private static (int Exit, string Error) Finish(Process child)
    {
        var stdout = child.StandardOutput.ReadToEndAsync();
        var stderr = child.StandardError.ReadToEndAsync();
        if (!child.WaitForExit(TimeSpan.FromSeconds(120)))
        {
            child.Kill();
            Assert.Fail("wavecheck did not stop within 120 s");
        }

        _ = stdout.Result;
        return (child.ExitCode, stderr.Result);
    }

#pragma warning disable SYSLIB1054 // DllImport: the test project does not allow unsafe code either.
    [DllImport("libc", SetLastError = true)]
    private static extern int kill(int pid, int signal);
#pragma warning restore SYSLIB1054
}
