using Spectre.Console;

namespace WaveCheck.Cli;

/// <summary>
/// Prints lines laid out for one <see cref="Terminal"/>: every line wrapped on words to the terminal's width
/// (<see cref="WordWrap"/>), tables that keep their words whole (<see cref="TextTable"/>), styles only where the
/// terminal takes them. Written through a Spectre console made for the run, so control characters from files are made
/// visible (<see cref="TerminalText.Hook"/>).
/// </summary>
internal sealed class Screen
{
    private readonly IAnsiConsole _console;

    public Screen(Terminal terminal)
    {
        ArgumentNullException.ThrowIfNull(terminal);
        Terminal = terminal;
        _console = ConsoleOutput.Create(terminal);
    }

    public Terminal Terminal { get; }

    /// <summary>Columns available.</summary>
    public int Width => Terminal.Width;

    /// <summary>Plain text (piped): ASCII borders, words instead of symbols.</summary>
    public bool Plain => !Terminal.IsTerminal;

    /// <summary>An empty line.</summary>
    public void Blank() => _console.WriteLine();

    /// <summary>Text wrapped on words, the first line after <paramref name="label"/>, the others indented to match
    /// (or after <paramref name="indent"/>).</summary>
    public void Paragraph(string text, string label = "", string? indent = null, Style? style = null, Style? labelStyle = null)
    {
        // Cleaned before measuring: an escaped control character is wider than the character.
        text = TerminalText.CleanLines(text);
        label = TerminalText.Clean(label);
        indent ??= new string(' ', label.Length);
        var first = true;
        foreach (var line in WordWrap.Lines(text, Width, label, indent))
        {
            var head = first ? label : indent;
            first = false;
            var split = Math.Min(head.Length, line.Length);
            Write([(line[..split], labelStyle), (line[split..], style)]);
        }
    }

    /// <summary>A table: bordered where it fits with every word whole, else stacked as labelled lines.</summary>
    public void Table(TextTable table)
    {
        foreach (var line in table.Render(Width, unicode: !Plain))
        {
            Write(line);
        }
    }

    /// <summary>One line made of styled spans; the caller keeps it within <see cref="Width"/>.</summary>
    public void Write(IReadOnlyList<(string Text, Style? Style)> spans)
    {
        var paragraph = new Paragraph();
        foreach (var (text, style) in spans)
        {
            if (text.Length > 0)
            {
                paragraph.Append(text, style ?? Style.Plain);
            }
        }

        _console.Write(paragraph);
        _console.WriteLine();
    }
}
