using Spectre.Console;

namespace WaveCheck.Cli;

/// <summary>Spectre consoles over a run's <see cref="Terminal"/>, one per run: the facts come from the terminal, never
/// from the process (no environment or console detection here), and control characters in what is printed are made
/// visible (<see cref="TerminalText"/>).</summary>
internal static class ConsoleOutput
{
    public static IAnsiConsole Create(Terminal terminal)
    {
        ArgumentNullException.ThrowIfNull(terminal);
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Ansi = terminal.IsTerminal ? AnsiSupport.Yes : AnsiSupport.No,
            ColorSystem = terminal.Colour ? ColorSystemSupport.Standard : ColorSystemSupport.NoColors,
            Interactive = InteractionSupport.No,
            Out = new AnsiConsoleOutput(terminal.Out),
            Enrichment = new ProfileEnrichment { UseDefaultEnrichers = false },
            EnvironmentVariables = [],
        });
        console.Profile.Width = terminal.Width;
        console.Profile.Capabilities.Unicode = true;

        // Everything printed here may carry names and text from the files read.
        console.Pipeline.Attach(TerminalText.Hook);
        return console;
    }

    /// <summary>A console on stderr for progress bars, or null when progress must not be shown (not a terminal, quiet).</summary>
    public static IAnsiConsole? CreateProgress(Terminal terminal, bool quiet)
    {
        ArgumentNullException.ThrowIfNull(terminal);
        if (quiet || !terminal.ErrorIsTerminal)
        {
            return null;
        }

        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Ansi = AnsiSupport.Yes,
            ColorSystem = terminal.Colour ? ColorSystemSupport.Standard : ColorSystemSupport.NoColors,
            Interactive = InteractionSupport.Yes,
            Out = new AnsiConsoleOutput(terminal.Error),
            Enrichment = new ProfileEnrichment { UseDefaultEnrichers = false },
            EnvironmentVariables = [],
        });
        console.Profile.Width = terminal.Width;
        return console;
    }
}
