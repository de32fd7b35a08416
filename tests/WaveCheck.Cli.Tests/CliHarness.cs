namespace WaveCheck.Cli.Tests;

/// <summary>Console redirection is process-wide: every test that runs the CLI in-process belongs here, one at a time.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class ConsoleCollection
{
    public const string Name = "console";
}

/// <summary>Runs <c>wavecheck</c> in-process with stdout and stderr captured.</summary>
internal static class CliHarness
{
    public static (int Exit, string Out, string Error) Run(params string[] args)
    {
        var oldOut = Console.Out;
        var oldError = Console.Error;
        using var stdout = new StringWriter();
        using var stderr = new StringWriter();
        Console.SetOut(stdout);
        Console.SetError(stderr);
        try
        {
            var exit = WaveCheckCommand.Run(args);
            return (exit, stdout.ToString(), stderr.ToString());
        }
        finally
        {
            Console.SetOut(oldOut);
            Console.SetError(oldError);
        }
    }
}
