using Spectre.Console;

namespace WaveCheck.Cli;

/// <summary>The console the commands print to: plain text (no ANSI, no colour) when NO_COLOR is set or output is not a
/// terminal; control characters in what is printed are made visible (<see cref="TerminalText"/>).</summary>
internal static class ConsoleOutput
{
    /// <summary>True when output should carry no ANSI codes.</summary>
    public static bool Plain =>
        !string.IsNullOrEmpty(Environment.GetEnvironmentVariable("NO_COLOR")) || Console.IsOutputRedirected;

    public static IAnsiConsole Create()
    {
        var output = new AnsiConsoleOutput(Console.Out);
        var plain = Plain || !output.IsTerminal;
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Ansi = plain ? AnsiSupport.No : AnsiSupport.Detect,
            ColorSystem = plain ? ColorSystemSupport.NoColors : ColorSystemSupport.Detect,
            Interactive = InteractionSupport.No,
            Out = output,
        });
        if (plain)
        {
            console.Profile.Width = 160;
        }

        // Everything printed here may carry names and text from the files read.
        console.Pipeline.Attach(TerminalText.Hook);
        return console;
    }

    /// <summary>A console on stderr for progress bars, or null when progress must not be shown (redirected, quiet).</summary>
    public static IAnsiConsole? CreateProgress(bool quiet)
    {
        if (quiet || Console.IsErrorRedirected || !string.IsNullOrEmpty(Environment.GetEnvironmentVariable("NO_COLOR")))
        {
            return null;
        }

        var output = new AnsiConsoleOutput(Console.Error);
        return output.IsTerminal
            ? AnsiConsole.Create(new AnsiConsoleSettings { Out = output, Interactive = InteractionSupport.Yes })
            : null;
    }
}
