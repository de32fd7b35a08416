using System.CommandLine;
using WaveCheck.Cli.Commands;
using WaveCheck.Core;

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

    /// <summary>Parses and runs; returns the process exit code (0 ok, 1 finding asked to fail on, 2 bad input or usage,
    /// 130 interrupted by SIGINT, 143 by SIGTERM).</summary>
    /// <param name="args">The command line.</param>
    /// <param name="terminal">Where to print; <see cref="Terminal.FromProcess"/> for the process's console.</param>
    public static int Run(string[] args, Terminal terminal)
    {
        ArgumentNullException.ThrowIfNull(terminal);
        var root = Build();
        var parse = root.Parse(args);
        var invocation = new TerminalInvocation(terminal);
        if (!AsksForHelp(args) && UnknownOption(parse, args) is { } unknown)
        {
            terminal.Error.WriteLine(TerminalText.Clean(UsageLine(parse, unknown)));
            return CliRun.BadInput;
        }

        if (parse.Errors.Count > 0 && !AsksForHelp(args))
        {
            if (args.Length == 0)
            {
                root.Parse(["--help"]).Invoke(invocation);
                return CliRun.BadInput;
            }

            terminal.Error.WriteLine(TerminalText.Clean(UsageLine(parse)));
            return CliRun.BadInput;
        }

        return parse.Invoke(invocation);
    }

    private static bool AsksForHelp(string[] args) => args.Any(a => a is "--help" or "-h" or "-?");

    /// <summary>A token that looks like an option but is none of the command's, even where an argument would swallow it.</summary>
    private static string? UnknownOption(ParseResult parse, string[] args)
    {
        var command = parse.CommandResult.Command;
        var known = command.Options.SelectMany(o => o.Aliases.Append(o.Name)).ToHashSet(StringComparer.Ordinal);
        foreach (var arg in args)
        {
            if (arg == "--")
            {
                break;
            }

            var name = arg.Split('=', 2)[0];
            if (name.StartsWith("--", StringComparison.Ordinal) && !known.Contains(name) && name != "--version")
            {
                return name;
            }
        }

        return null;
    }

    /// <summary>One line for a usage error: the first problem, the nearest option or command where one was mistyped, and where help is.</summary>
    internal static string UsageLine(ParseResult parse, string? unknownOption = null)
    {
        var command = parse.CommandResult.Command;
        var path = command is RootCommand ? "wavecheck" : $"wavecheck {command.Name}";
        var unmatched = unknownOption ?? parse.UnmatchedTokens.FirstOrDefault();
        if (unmatched is not null)
        {
            var candidates = unmatched.StartsWith('-')
                ? command.Options.SelectMany(o => o.Aliases.Append(o.Name))
                : command.Subcommands.Select(c => c.Name);
            var nearest = NearestName.Find(unmatched, candidates);
            var hint = nearest is null ? "" : $"; did you mean '{nearest}'?";
            return $"{path}: unknown option or argument '{unmatched}'{hint} (see '{path} --help')";
        }

        return $"{path}: {parse.Errors[0].Message} (see '{path} --help')";
    }
}
