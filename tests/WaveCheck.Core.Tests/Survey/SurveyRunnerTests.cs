using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

public class SurveyRunnerTests
{
    private static SurveyJob Job(string file) => new(file, new CaptureSettings { Circuit = "circuit " + file });

    private static SurveyOutcome Ok(SurveyJob job) => new(new ResultBuilder().Row(job.File, job.Settings.Circuit));

    [Fact]
    public void A_failing_job_becomes_its_own_error_row_and_the_others_complete()
    {
        var jobs = new[] { Job("a.wav"), Job("bad.wav"), Job("io.wav"), Job("bug.wav"), Job("e.wav") };
        var outcomes = SurveyRunner.Run(jobs, (job, _) => job.File switch
        {
            "bad.wav" => throw new CaptureFormatException("bad.wav", "not a WAV file: no RIFF header", byteOffset: 0),
            "io.wav" => throw new FileNotFoundException("file not found"),
            "bug.wav" => throw new InvalidOperationException("window buffer overrun"),
            _ => Ok(job),
        }, maxParallel: 2);

        Assert.Equal(["a.wav", "bad.wav", "io.wav", "bug.wav", "e.wav"], outcomes.Select(o => o.Row.File));
        Assert.Equal([SurveyVerdict.Ok, SurveyVerdict.Error, SurveyVerdict.Error, SurveyVerdict.Error, SurveyVerdict.Ok], outcomes.Select(o => o.Row.Verdict));
        Assert.Equal("bad.wav: byte 0: not a WAV file: no RIFF header", outcomes[1].Row.Error);
        Assert.Equal("io.wav: file not found", outcomes[2].Row.Error);
        Assert.StartsWith("internal error:", outcomes[3].Row.Error, StringComparison.Ordinal);
        Assert.Contains("window buffer overrun", outcomes[3].Row.Error, StringComparison.Ordinal);
        Assert.Equal("circuit bad.wav", outcomes[1].Row.Circuit);
    }

    [Fact]
    public void An_output_failure_stops_the_survey_as_itself_not_as_error_rows()
    {
        // A full disk is not the captures' fault: it must not become "none of the captures could be read".
        var jobs = new[] { Job("a.wav"), Job("b.wav"), Job("c.wav"), Job("d.wav") };
        var e = Assert.Throws<OutputWriteException>(() => SurveyRunner.Run(jobs, (job, _) => job.File == "c.wav"
            ? throw new OutputWriteException("out/reports/c.html", "No space left on device")
            : Ok(job), maxParallel: 2));
        Assert.Equal("cannot write out/reports/c.html: No space left on device", e.Message);
    }

    [Fact]
    public void Parallel_run_keeps_input_order_and_reports_progress()
    {
        // Jobs finish in reverse order of their index (earlier jobs sleep longer), so completion order differs from input
        // order. Each job waits (up to 5 s from the survey's start, no longer) until a second job is running, so a
        // parallel runner shows an overlap however the threads are scheduled, and a serial one fails in about 5 s.
        var jobs = Enumerable.Range(0, 12).Select(i => Job($"c{i:00}.wav")).ToArray();
        var running = 0;
        var peak = 0;
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var spans = new (TimeSpan Start, TimeSpan End)[jobs.Length];
        var reports = new List<(int Done, int Total)>();
        var progress = new SynchronousProgress(p => { lock (reports) { reports.Add(p); } });
        var outcomes = SurveyRunner.Run(jobs, (job, _) =>
        {
            var index = int.Parse(job.File.AsSpan(1, 2), System.Globalization.CultureInfo.InvariantCulture);
            spans[index].Start = clock.Elapsed;
            var now = Interlocked.Increment(ref running);
            InterlockedMax(ref peak, now);
            SpinWait.SpinUntil(() => Volatile.Read(ref peak) >= 2 || clock.Elapsed > TimeSpan.FromSeconds(5));
            Thread.Sleep(5 * (12 - index));
            Interlocked.Decrement(ref running);
            spans[index].End = clock.Elapsed;
            return Ok(job);
        }, progress, maxParallel: 3);

        Assert.Equal(jobs.Select(j => j.File), outcomes.Select(o => o.Row.File));
        // At least two jobs at once (the survey ran in parallel), never more than the three allowed.
        Assert.InRange(peak, 2, 3);
        Assert.Contains(Enumerable.Range(0, 12), i => Enumerable.Range(0, 12).Any(j =>
            j != i && spans[i].Start < spans[j].End && spans[j].Start < spans[i].End));
        Assert.Equal(12, reports.Count);
        Assert.Equal(Enumerable.Range(1, 12), reports.Select(r => r.Done).Order());
        Assert.All(reports, r => Assert.Equal(12, r.Total));
    }

    [Fact]
    public void Cancellation_stops_the_survey_instead_of_making_error_rows()
    {
        using var cancel = new CancellationTokenSource();
        var jobs = Enumerable.Range(0, 4).Select(i => Job($"c{i}.wav")).ToArray();
        Assert.ThrowsAny<OperationCanceledException>(() => SurveyRunner.Run(jobs, (job, token) =>
        {
            cancel.Cancel();
            token.ThrowIfCancellationRequested();
            return Ok(job);
        }, maxParallel: 1, cancellationToken: cancel.Token));
    }

    private static void InterlockedMax(ref int target, int value)
    {
        int seen;
        while ((seen = Volatile.Read(ref target)) < value && Interlocked.CompareExchange(ref target, value, seen) != seen)
        {
        }
    }

    /// <summary>Reports on the calling thread (System.Progress would post to the thread pool and race the asserts).</summary>
    private sealed class SynchronousProgress(Action<(int Done, int Total)> report) : IProgress<(int Done, int Total)>
    {
        public void Report((int Done, int Total) value) => report(value);
    }
}
