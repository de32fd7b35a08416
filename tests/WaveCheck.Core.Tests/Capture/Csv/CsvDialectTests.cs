using System.Globalization;
using System.Text;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>
/// The look-ahead splits its lines with the parser that reads the rows (Sylvan.Data.Csv, RFC 4180 quoting), so a file
/// is read the same way in its first lines and after them: a quoted cell may hold the delimiter, a quote inside a
/// cell is text, a comment line among the data is skipped, and a fault is told in the same words wherever it lies.
/// </summary>
public sealed class CsvDialectTests : IDisposable
{
    private readonly TempFolder _folder = new();

    public void Dispose() => _folder.Dispose();

    /// <summary>Rows of a 1 kHz capture: time, then a current of n mA (a closed form to check against).</summary>
    private static string Rows(int from, int to, Func<int, string>? row = null)
    {
        var text = new StringBuilder();
        for (var n = from; n < to; n++)
        {
            text.Append(row?.Invoke(n) ?? string.Create(CultureInfo.InvariantCulture, $"{n / 1000.0:R},{n}")).Append('\n');
        }

        return text.ToString();
    }

    [Fact]
    public void A_quoted_header_cell_may_hold_the_delimiter()
    {
        // RFC 4180 §2: a quoted field may contain the delimiter. Two cells, not three.
        var path = _folder.Write("quoted.csv", "\"time [s]\",\"I, leak [mA]\"\n" + Rows(0, 600, n => string.Create(CultureInfo.InvariantCulture, $"\"{n / 1000.0:R}\",\"{n}\"")));
        var dialect = CsvDialect.Detect(path);
        Assert.Equal(',', dialect.Delimiter);
        Assert.Equal(["time [s]", "I, leak [mA]"], dialect.Header);

        using var source = CaptureOpener.Open(path, new ImportOptions());
        Assert.Equal("I, leak", source.Info.ResidualSource);
        var residual = Signals.ReadAll(source).Residual;
        Assert.Equal(600, residual.Length);
        Assert.Equal(0.599, residual[599], 1e-15); // 599 mA on the last row
    }

    [Fact]
    public void A_quote_inside_a_cell_is_text_in_the_first_lines_as_after_them()
    {
        // RFC 4180 §2: only a field that starts with a quote is quoted; a quote elsewhere is a character of the cell.
        var row = (int n) => string.Create(CultureInfo.InvariantCulture, $"{n / 1000.0:R},{n},{(n % 100 == 7 ? "5\" clamp" : "ok")}");
        var path = _folder.Write("inch.csv", "time [s],I [mA],note\n" + Rows(0, 1000, row));
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Assert.Equal(1000, Signals.ReadAll(source).Residual.Length);
        Assert.Contains(source.Warnings, w => w.Code == "column-ignored");
    }

    [Fact]
    public void A_comment_line_among_the_first_rows_is_skipped_as_the_reader_skips_it()
    {
        var path = _folder.Write("marks.csv", "time [s],I [mA]\n" + Rows(0, 3) + "# clamp moved\n" + Rows(3, 600) + "# end of bay 2\n" + Rows(600, 900));
        var dialect = CsvDialect.Detect(path);
        Assert.Equal(398, dialect.DataRows); // the 400 lines looked at, less the header and the comment
        using var source = CaptureOpener.Open(path, new ImportOptions());
        var residual = Signals.ReadAll(source).Residual;
        Assert.Equal(900, residual.Length);
        Assert.Equal(0.003, residual[3], 1e-15); // row n = 3, after the comment line
        Assert.DoesNotContain(source.Warnings, w => w.Code.StartsWith("time-", StringComparison.Ordinal));
    }

    public static TheoryData<string, string, int> Faults => new()
    {
        { "unclosed", "\"0.5,1", 1 },
        { "after-quote", "\"0.5\"x,1", 1 },
        { "unclosed-second", "0.5,\"1", 2 },
        { "time-text", "t0.5,1", 1 },
    };

    [Theory]
    [MemberData(nameof(Faults))]
    public void A_fault_is_told_in_the_same_words_in_the_first_lines_and_after_them(string name, string bad, int column)
    {
        // Line 7 lies in the look-ahead (the first 400 lines), line 1002 only in the reading.
        var early = _folder.Write($"{name}-early.csv", "time [s],I [mA]\n" + Rows(0, 5) + bad + "\n" + Rows(6, 10));
        var late = _folder.Write($"{name}-late.csv", "time [s],I [mA]\n" + Rows(0, 1000) + bad + "\n" + Rows(1001, 1100));
        var first = Assert.Throws<CaptureFormatException>(() => ReadAll(early));
        var second = Assert.Throws<CaptureFormatException>(() => ReadAll(late));
        Assert.Equal((7L, (long)column), (first.Line!.Value, first.Column!.Value));
        Assert.Equal((1002L, (long)column), (second.Line!.Value, second.Column!.Value));
        Assert.Equal(first.Problem, second.Problem);
    }

    private static void ReadAll(string path)
    {
        using var source = CaptureOpener.Open(path, new ImportOptions());
        Signals.ReadAll(source);
    }
}
