using System.Globalization;

namespace WaveCheck.Cli;

/// <summary>
/// Where one run prints and what its screen allows: the output and error writers, the width to lay text out in,
/// whether colour may be used, and whether each stream is a terminal. Every command prints through the terminal it
/// is given, never through <see cref="Console"/>, so runs in one process do not share a console.
/// </summary>
/// <remarks>
/// Rules (<see cref="Detect"/>): the width is <c>COLUMNS</c> when it holds a whole number, else the terminal's own
/// width, else <see cref="DefaultWidth"/> (so piped output has a stable width); it is kept within
/// <see cref="MinimumWidth"/> and <see cref="MaximumWidth"/>. Colour only on a terminal, and not when <c>NO_COLOR</c>
/// is set to anything but the empty string (no-color.org); <c>NO_COLOR</c> changes nothing else.
/// </remarks>
public sealed class Terminal
{
    /// <summary>Columns when neither <c>COLUMNS</c> nor a terminal says otherwise: the classic terminal width (common
    /// practice, no source).</summary>
    public const int DefaultWidth = 80;

    /// <summary>Narrowest layout: below it a label and a figure no longer fit beside each other (engineering choice).</summary>
    public const int MinimumWidth = 20;

    /// <summary>Widest layout, against a stray <c>COLUMNS</c> value (engineering choice).</summary>
    public const int MaximumWidth = 1000;

    /// <summary>A terminal with the given facts; <paramref name="width"/> is kept within the bounds.</summary>
    public Terminal(TextWriter output, TextWriter error, int width, bool colour, bool isTerminal, bool errorIsTerminal = false)
    {
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(error);
        Out = output;
        Error = error;
        Width = Math.Clamp(width, MinimumWidth, MaximumWidth);
        Colour = colour && isTerminal;
        IsTerminal = isTerminal;
        ErrorIsTerminal = errorIsTerminal;
    }

    /// <summary>Standard output of this run.</summary>
    public TextWriter Out { get; }

    /// <summary>Standard error of this run.</summary>
    public TextWriter Error { get; }

    /// <summary>Columns to lay text out in; no printed line is longer.</summary>
    public int Width { get; }

    /// <summary>Colour (and other ANSI styling) may be written to <see cref="Out"/>.</summary>
    public bool Colour { get; }

    /// <summary><see cref="Out"/> is a terminal: rounded borders and symbols; otherwise plain text with ASCII borders.</summary>
    public bool IsTerminal { get; }

    /// <summary><see cref="Error"/> is a terminal: a progress display may be drawn there.</summary>
    public bool ErrorIsTerminal { get; }

    /// <summary>Plain text at a fixed width, as when output is piped: for tests and for writers that are not a terminal.</summary>
    public static Terminal Piped(TextWriter output, TextWriter error, int width = DefaultWidth) =>
        new(output, error, width, colour: false, isTerminal: false);

    /// <summary>The process's own console, with the facts read from its environment.</summary>
    public static Terminal FromProcess() => Detect(Environment.GetEnvironmentVariable, Console.Out, Console.Error,
        !Console.IsOutputRedirected, !Console.IsErrorRedirected, WindowWidth);

    /// <summary>Applies the rules (see remarks of the type) to the given environment and streams.</summary>
    /// <param name="environment">Reads an environment variable; null when unset.</param>
    /// <param name="output">Standard output.</param>
    /// <param name="error">Standard error.</param>
    /// <param name="outputIsTerminal">Standard output is a terminal.</param>
    /// <param name="errorIsTerminal">Standard error is a terminal.</param>
    /// <param name="windowWidth">The terminal's width in columns, null when unknown.</param>
    public static Terminal Detect(Func<string, string?> environment, TextWriter output, TextWriter error,
        bool outputIsTerminal, bool errorIsTerminal, Func<int?> windowWidth)
    {
        ArgumentNullException.ThrowIfNull(environment);
        ArgumentNullException.ThrowIfNull(windowWidth);
        int width;
        if (environment("COLUMNS") is { } columns &&
            int.TryParse(columns.Trim(), NumberStyles.None, CultureInfo.InvariantCulture, out var given) && given > 0)
        {
            width = given;
        }
        else
        {
            width = outputIsTerminal && windowWidth() is { } window && window > 0 ? window : DefaultWidth;
        }

        var colour = outputIsTerminal && string.IsNullOrEmpty(environment("NO_COLOR"));
        return new Terminal(output, error, width, colour, outputIsTerminal, errorIsTerminal);
    }

    private static int? WindowWidth()
    {
        try
        {
            return Console.WindowWidth;
        }
        catch (IOException)
        {
            return null;
        }
        catch (PlatformNotSupportedException)
        {
            return null;
        }
    }
}
