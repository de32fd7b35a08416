using Spectre.Console;

namespace WaveCheck.Cli;

/// <summary>Runs long work with a progress bar on stderr when it is a terminal; silently otherwise.</summary>
internal static class ProgressDisplay
{
    public static T Run<T>(Terminal terminal, bool quiet, string description, Func<IProgress<double>?, T> work)
    {
        var console = ConsoleOutput.CreateProgress(terminal, quiet);
        if (console is null)
        {
            return work(null);
        }

        T result = default!;
        console.Progress()
            .AutoClear(true)
            .Columns(new TaskDescriptionColumn(), new ProgressBarColumn(), new PercentageColumn(), new RemainingTimeColumn())
            .Start(context =>
            {
                var task = context.AddTask(Markup.Escape(TerminalText.Clean(description)), maxValue: 1.0);
                result = work(new ImmediateProgress(share => task.Value = share));
                task.Value = 1.0;
            });
        return result;
    }
}

/// <summary>Reports on the calling thread, in order (unlike <see cref="Progress{T}"/>, which posts to the thread pool).</summary>
internal sealed class ImmediateProgress(Action<double> report) : IProgress<double>
{
    public void Report(double value) => report(value);
}
