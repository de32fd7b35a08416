using System.Runtime.ExceptionServices;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Survey;

/// <summary>
/// Runs the captures of a survey in parallel, one job per capture, and collects their rows in input order. A capture
/// that cannot be read becomes its own error row; the others go on.
/// </summary>
public static class SurveyRunner
{
    /// <summary>Runs every job through <paramref name="run"/>, at most <paramref name="maxParallel"/> at a time.</summary>
    /// <remarks>
    /// Memory is bounded by the number of jobs running at once (each streams its capture) plus one small row per
    /// capture. A <see cref="UserInputException"/>, <see cref="IOException"/> or <see cref="UnauthorizedAccessException"/>
    /// from a job becomes that job's error row with the exception's message; any other exception also becomes an
    /// error row, its message prefixed <c>internal error:</c>. Cancellation stops the survey with
    /// <see cref="OperationCanceledException"/>; a failure to write an output (<see cref="OutputWriteException"/>,
    /// <see cref="OutputPathException"/>) stops it with that exception, unwrapped. <paramref name="run"/> is called from several threads at once.
    /// </remarks>
    /// <param name="jobs">The captures, in the order the rows are wanted.</param>
    /// <param name="run">Analyses, assesses and reports one capture.</param>
    /// <param name="progress">Told (done, total) after each job; may be called from any thread.</param>
    /// <param name="maxParallel">Jobs at once; null: <see cref="Environment.ProcessorCount"/>.</param>
    /// <param name="cancellationToken">Stops the survey.</param>
    /// <param name="settingName">How an error row names a setting marked in a message (<see cref="Setting.Ref"/>);
    /// null: by its property name.</param>
    /// <returns>One outcome per job, in the order of <paramref name="jobs"/>.</returns>
    public static IReadOnlyList<SurveyOutcome> Run(IReadOnlyList<SurveyJob> jobs,
        Func<SurveyJob, CancellationToken, SurveyOutcome> run, IProgress<(int Done, int Total)>? progress = null,
        int? maxParallel = null, CancellationToken cancellationToken = default, Func<string, string>? settingName = null)
    {
        ArgumentNullException.ThrowIfNull(jobs);
        ArgumentNullException.ThrowIfNull(run);
        if (maxParallel is < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(maxParallel), maxParallel, "at least 1 job at a time");
        }

        var outcomes = new SurveyOutcome[jobs.Count];
        var done = 0;
        var options = new ParallelOptions
        {
            MaxDegreeOfParallelism = maxParallel ?? Environment.ProcessorCount,
            CancellationToken = cancellationToken,
        };
        try
        {
            Parallel.For(0, jobs.Count, options, i =>
            {
                outcomes[i] = RunOne(jobs[i], run, settingName ?? Setting.PropertyName, cancellationToken);
                progress?.Report((Interlocked.Increment(ref done), jobs.Count));
            });
        }
        catch (AggregateException e)
        {
            // One job's output failure or a cancellation stops the survey: rethrow it as itself, not wrapped.
            var inner = e.Flatten().InnerExceptions;
            var first = inner.FirstOrDefault(x => x is OutputWriteException or OutputPathException)
                ?? (inner.All(x => x is OperationCanceledException) ? inner[0] : null);
            if (first is not null)
            {
                ExceptionDispatchInfo.Capture(first).Throw();
            }

            throw;
        }

        return outcomes;
    }

    private static SurveyOutcome RunOne(SurveyJob job, Func<SurveyJob, CancellationToken, SurveyOutcome> run,
        Func<string, string> settingName, CancellationToken cancellationToken)
    {
        try
        {
            return run(job, cancellationToken)
                ?? throw new InvalidOperationException($"the survey job for {job.File} returned no outcome");
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            throw;
        }
        catch (Exception e) when (e is OutputWriteException or OutputPathException)
        {
            // Writing an output failed (a full disk, a folder made read-only): not this capture's fault, and every
            // other capture would fail the same way, so the survey stops and says so.
            throw;
        }
        catch (Exception e) when (e is UserInputException or IOException or UnauthorizedAccessException)
        {
            // A CaptureFormatException's message already names the file; others get it in front.
            var text = e is UserInputException input ? input.MessageWith(settingName) : e.Message;
            var message = e is CaptureFormatException || text.Contains(job.File, StringComparison.Ordinal)
                ? text
                : $"{job.File}: {text}";
            return new SurveyOutcome(SurveyRows.Failed(job.File, job.Settings, message));
        }
        catch (Exception e)
        {
            return new SurveyOutcome(SurveyRows.Failed(job.File, job.Settings, $"internal error: {e.GetType().Name}: {e.Message}"));
        }
    }
}
