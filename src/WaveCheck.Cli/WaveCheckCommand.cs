using System.CommandLine;
using WaveCheck.Cli.Commands;

namespace WaveCheck.Cli;

/// <summary>The <c>wavecheck</c> root command: registers the sub-commands and runs one.</summary>
public static class WaveCheckCommand
{
    /// <summary>Builds the command tree.</summary>
    public static RootCommand Build()
    {
        var root = new RootCommand(
            "WaveCheck: analyse a recorded residual-current waveform and tell which RCD type (AC, A, F, B, B+) the circuit demands.");
        foreach (var command in CommandList.All())
        {
            root.Subcommands.Add(command);
        }

        return root;
    }

    /// <summary>Parses and runs; returns the process exit code (0 ok, 1 finding asked to fail on, 2 bad input or usage).</summary>
    public static int Run(string[] args)
    {
        var root = Build();
        var parse = root.Parse(args);
        return parse.Invoke(new InvocationConfiguration { EnableDefaultExceptionHandler = false });
    }
}
