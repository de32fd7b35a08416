namespace WaveCheck.Cli.Tests;

/// <summary>Runs <c>wavecheck</c> in-process with stdout and stderr captured. Each run prints only to the writers of
/// its own <see cref="Terminal"/>, so tests that run the CLI run in parallel.</summary>
internal static class CliHarness
{
    /// <summary>As when output is piped: plain text, 80 columns.</summary>
    public static (int Exit, string Out, string Error) Run(params string[] args) =>
        Run(width: Terminal.DefaultWidth, isTerminal: false, colour: false, args);

    /// <summary>On a terminal of the given facts.</summary>
    public static (int Exit, string Out, string Error) Run(int width, bool isTerminal, bool colour, params string[] args)
    {
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        var exit = WaveCheckCommand.Run(args, new Terminal(stdout, stderr, width, colour, isTerminal));
        return (exit, stdout.ToString(), stderr.ToString());
    }
}
