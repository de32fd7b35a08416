using CsCheck;

namespace WaveCheck.Cli.Tests;

/// <summary>Wrapping on words and tables that keep words whole. Properties over generated texts (CsCheck, fixed
/// seeds): what wrapping must preserve is common practice, no source — no line over the width, every word whole,
/// nothing lost or reordered.</summary>
public sealed class WordWrapTests
{
    private static readonly Gen<string> Word = Gen.Char["abcdefghijklmnopqrstuvwxyzΔ()'"].Array[1, 14].Select(c => new string(c));

    private static readonly Gen<string> Text = Word.Array[0, 40].Select(words => string.Join(' ', words));

    [Fact]
    public void Lines_keep_every_word_whole_within_the_width_and_lose_nothing() =>
        Gen.Select(Text, Gen.Int[20, 100], Gen.Int[0, 6]).Sample((text, width, indent) =>
        {
            var label = new string('>', indent);
            var lines = WordWrap.Lines(text, width, label);
            Assert.All(lines, l => Assert.True(l.Length <= width, $"'{l}' is longer than {width}"));
            var rejoined = string.Join(' ', lines.Select((l, i) => i == 0 ? l[Math.Min(l.Length, label.Length)..] : l).Select(l => l.Trim()))
                .Trim();
            Assert.Equal(text, rejoined);
        }, seed: "0000Wrap1Seed");

    [Fact]
    public void The_prefix_counts_against_the_width()
    {
        // The verdict's wrap once ignored its "VERDICT  " prefix and ran past the width.
        var lines = WordWrap.Lines("Type F required: a motor-frequency tone at 12 Hz, 6.96 mA", 30, "VERDICT   ");
        Assert.Equal(["VERDICT   Type F required: a", "          motor-frequency tone", "          at 12 Hz, 6.96 mA"], lines);
    }

    [Fact]
    public void A_lone_symbol_stays_with_its_word()
    {
        // "✔" at one line's end and "adequate" at the next start would say nothing; likewise "=" and "→".
        Assert.Equal(["installed", "✔ adequate"], WordWrap.Lines("installed ✔ adequate", 12));
        Assert.Equal(["device A", "→ B, then", "= unchanged"], WordWrap.Lines("device A → B, then = unchanged", 12));
        // A symbol with nothing after it, or inside a word, is left alone.
        Assert.Equal(["value", "-"], WordWrap.Lines("value -", 6));
        Assert.Equal(10, WordWrap.LongestWord("a ✔ adequate"));
        Assert.Equal(["B+ needed"], WordWrap.Lines("B+ needed", 20));
    }

    [Fact]
    public void A_table_keeps_a_symbol_with_its_word_in_a_narrow_column()
    {
        // compare's outcome column at a width where the columns get no more than their longest words (8 + 8 and the
        // borders: 23): "✔ remedied" is one word of 10, so the symbol never ends a line without its word.
        var table = new TextTable(null, new("circuit"), new("outcome"));
        table.AddRow("C3 charging point, yard bay 1", "✔ remedied");
        var lines = table.Render(23, unicode: false).Select(l => string.Concat(l.Select(s => s.Text))).ToList();
        Assert.Contains(lines, l => l.Contains("✔ remedied", StringComparison.Ordinal));
        Assert.DoesNotContain(lines, l => l.TrimEnd(' ', '|').EndsWith('✔'));
    }

    [Fact]
    public void A_figure_stays_with_its_unit()
    {
        // "6.96 mA" must not end one line with "6.96" and start the next with "mA".
        var lines = WordWrap.Lines("tone at 12 Hz, 6.96 mA now", 18);
        Assert.Equal(["tone at 12 Hz,", "6.96 mA now"], lines);
    }

    [Fact]
    public void A_word_longer_than_a_line_is_cut_after_a_path_separator()
    {
        var lines = WordWrap.Lines("/srv/logs/site/c1-panel-saw-drive.wav", 20);
        Assert.All(lines, l => Assert.True(l.Length <= 20, l));
        Assert.Equal("/srv/logs/site/c1-panel-saw-drive.wav", string.Concat(lines));
        Assert.EndsWith("/", lines[0], StringComparison.Ordinal);
    }

    [Fact]
    public void Table_rows_keep_their_words_and_the_width() =>
        Gen.Select(Text.Array[1, 5], Gen.Int[20, 120], Gen.Bool).Sample((cells, width, unicode) =>
        {
            var table = new TextTable(null, [.. cells.Select((_, i) => new TextTable.Column("h" + i))]);
            table.AddRow([.. cells.Select(c => new TextTable.Cell(c))]);
            var lines = table.Render(width, unicode).Select(l => string.Concat(l.Select(s => s.Text))).ToList();
            Assert.All(lines, l => Assert.True(l.Length <= width, $"'{l}' is longer than {width}"));

            // Every word of every cell appears whole in the printed table, as often as in the cells.
            var printed = lines.SelectMany(l => l.Split([' ', '|', '│', ';', ':'], StringSplitOptions.RemoveEmptyEntries)).ToList();
            foreach (var word in cells.SelectMany(c => c.Split(' ', StringSplitOptions.RemoveEmptyEntries)).Distinct())
            {
                var expected = cells.Sum(c => c.Split(' ').Count(w => w == word));
                Assert.True(printed.Count(w => w == word) >= expected, $"'{word}' cut or lost at {width}:\n{string.Join('\n', lines)}");
            }
        }, seed: "0000Table1Seed");

    [Fact]
    public void A_table_too_wide_for_its_words_is_stacked()
    {
        var table = new TextTable("Margins", new("check"), new("finding"));
        table.AddRow("nuisance tripping", "risk possible: margin 2.62 mA");
        var lines = table.Render(20, unicode: false).Select(l => string.Concat(l.Select(s => s.Text))).ToList();
        Assert.Equal(["Margins", "nuisance tripping", "    finding: risk", "    possible: margin", "    2.62 mA"], lines);
    }

    [Theory]
    [InlineData("smooth DC or multi-phase rectified current", 20, "smooth DC or...")]
    [InlineData("as AC", 20, "as AC")]
    [InlineData("unbreakable", 5, "...")]
    public void A_type_line_is_shortened_at_a_word(string text, int room, string expected) =>
        Assert.Equal(expected, VerdictPrinter.Shorten(text, room, "..."));
}
