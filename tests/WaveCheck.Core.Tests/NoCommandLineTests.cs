using System.Runtime.CompilerServices;
using System.Text;
using System.Text.RegularExpressions;

namespace WaveCheck.Core.Tests;

/// <summary>
/// Core knows no command line: no text it writes names a CLI flag. A setting a message names is marked with
/// <see cref="Setting.Ref"/> and worded by each front end (DEVELOPERS.md, "Errors"); this test reads Core's source and
/// fails on any string literal (outside comments) that holds a flag: two dashes and a letter.
/// </summary>
public class NoCommandLineTests
{
    private static readonly Regex Flag = new("--[A-Za-z]", RegexOptions.CultureInvariant);

    [Fact]
    public void No_string_literal_in_core_names_a_command_line_flag()
    {
        var core = Path.Combine(RepositoryRoot(), "src", "WaveCheck.Core");
        var files = Directory.EnumerateFiles(core, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                        && !f.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .ToList();
        var literals = files.SelectMany(f => CSharpStringLiterals.Of(File.ReadAllText(f))
            .Select(l => (File: Path.GetRelativePath(core, f), l.Line, l.Text))).ToList();

        // The scan must have read Core's texts, or the check below would pass on nothing.
        Assert.True(files.Count > 100, $"only {files.Count} source files found under {core}");
        Assert.True(literals.Count > 1000, $"only {literals.Count} string literals found in Core");
        Assert.Contains(literals, l => l.Text.Contains("is used as the residual current", StringComparison.Ordinal));
        var flags = literals.Where(l => Flag.IsMatch(l.Text)).Select(l => $"{l.File}:{l.Line}: {l.Text}").ToList();
        Assert.True(flags.Count == 0, "Core names command-line flags (mark the setting with Setting.Ref instead):\n" + string.Join("\n", flags));
    }

    [Fact]
    public void The_scan_finds_flags_in_every_kind_of_string_literal_and_none_in_comments()
    {
        // Every form of C# string literal (C# language reference, "String literals", "String interpolation",
        // "Raw string literals"), with comments and a character literal holding a quote in between.
        const string code = """"
            // --comment-line
            /* --comment-block "not a string" */
            /// <summary>--doc</summary>
            var c = '"'; var d = '\'';
            var a = "--plain";
            var b = $"--interpolated {(x ? "--nested" : "no")} {y:0.#} {{--braces}}";
            var v = @"--verbatim ""quoted""";
            var w = $@"--both {z}";
            var r = """--raw""";
            var u = "---"u8;
            """";
        var literals = CSharpStringLiterals.Of(code);
        var texts = literals.Select(l => l.Text).ToList();

        Assert.Equal(["--plain", "--interpolated ", "--nested", "no", " ", " {{--braces}}", "--verbatim \"\"quoted\"\"", "--both ", "--raw", "---"],
            texts);
        Assert.Equal(7, texts.Count(t => Flag.IsMatch(t)));
        Assert.Equal(5, literals.Single(l => l.Text == "--plain").Line);
    }

    private static string RepositoryRoot([CallerFilePath] string here = "") =>
        Path.GetFullPath(Path.Combine(Path.GetDirectoryName(here)!, "..", ".."));
}

/// <summary>The string literals of C# source, outside comments: the text between the quotes (escapes kept as written,
/// an interpolated string's parts outside its holes), and the line it starts on. Literals inside holes are their own.</summary>
internal static class CSharpStringLiterals
{
    public static List<(int Line, string Text)> Of(string code)
    {
        var found = new List<(int Line, string Text)>();
        var i = 0;
        Code(code, ref i, found, untilBrace: false);
        return found;
    }

    /// <summary>Reads code from <paramref name="i"/>; with <paramref name="untilBrace"/>, up to the brace that closes an
    /// interpolation hole (left at it).</summary>
    private static void Code(string s, ref int i, List<(int, string)> found, bool untilBrace)
    {
        var depth = 0;
        while (i < s.Length)
        {
            var ch = s[i];
            if (ch == '/' && At(s, i + 1, '/'))
            {
                while (i < s.Length && s[i] != '\n')
                {
                    i++;
                }
            }
            else if (ch == '/' && At(s, i + 1, '*'))
            {
                var end = s.IndexOf("*/", i + 2, StringComparison.Ordinal);
                i = end < 0 ? s.Length : end + 2;
            }
            else if (ch == '\'')
            {
                i++;
                while (i < s.Length && s[i] != '\'')
                {
                    i += s[i] == '\\' ? 2 : 1;
                }

                i++;
            }
            else if (ch is '"' or '$' or '@' && StringStart(s, i) is { } start)
            {
                Literal(s, ref i, start, found);
            }
            else if (ch == '{')
            {
                depth++;
                i++;
            }
            else if (ch == '}')
            {
                if (untilBrace && depth == 0)
                {
                    return;
                }

                depth--;
                i++;
            }
            else
            {
                i++;
            }
        }
    }

    /// <summary>The prefix of a string literal starting at <paramref name="i"/>: count of <c>$</c>, verbatim or not,
    /// and the index of its first quote; null when no literal starts there.</summary>
    private static (int Dollars, bool Verbatim, int Quote)? StringStart(string s, int i)
    {
        var dollars = 0;
        var verbatim = false;
        var j = i;
        while (j < s.Length && s[j] is '$' or '@')
        {
            dollars += s[j] == '$' ? 1 : 0;
            verbatim |= s[j] == '@';
            j++;
        }

        return At(s, j, '"') ? (dollars, verbatim, j) : null;
    }

    private static void Literal(string s, ref int i, (int Dollars, bool Verbatim, int Quote) start, List<(int, string)> found)
    {
        var line = 1 + s.AsSpan(0, i).Count('\n');
        var j = start.Quote;
        var quotes = 0;
        while (At(s, j + quotes, '"'))
        {
            quotes++;
        }

        if (quotes >= 3)
        {
            // Raw: as many quotes close it; holes open with as many braces as there are dollars.
            var close = new string('"', quotes);
            var end = s.IndexOf(close, j + quotes, StringComparison.Ordinal);
            end = end < 0 ? s.Length : end;
            found.Add((line, s[(j + quotes)..end]));
            i = Math.Min(s.Length, end + quotes);
            return;
        }

        var text = new StringBuilder();
        var index = found.Count;
        found.Add((line, ""));
        j++;
        while (j < s.Length)
        {
            var ch = s[j];
            if (ch == '"')
            {
                if (start.Verbatim && At(s, j + 1, '"'))
                {
                    text.Append("\"\"");
                    j += 2;
                    continue;
                }

                j++;
                break;
            }

            if (ch == '\\' && !start.Verbatim)
            {
                text.Append(s, j, Math.Min(2, s.Length - j));
                j += 2;
                continue;
            }

            if (start.Dollars > 0 && ch == '{')
            {
                if (At(s, j + 1, '{'))
                {
                    text.Append("{{");
                    j += 2;
                    continue;
                }

                // A hole: its code (and any literal in it) is read as code; the literal's text goes on after it.
                found[index] = (line, text.ToString());
                text.Clear();
                j++;
                Code(s, ref j, found, untilBrace: true);
                j++;
                index = found.Count;
                found.Add((line, ""));
                continue;
            }

            text.Append(ch);
            j++;
        }

        found[index] = (line, text.ToString());
        if (found[index].Item2.Length == 0 && start.Dollars > 0)
        {
            found.RemoveAt(index);
        }

        i = j;
        while (i < s.Length && char.IsLetterOrDigit(s[i]))
        {
            i++;   // a suffix such as u8
        }
    }

    private static bool At(string s, int i, char ch) => i < s.Length && s[i] == ch;
}
