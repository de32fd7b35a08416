using Sylvan.Data.Csv;
using WaveCheck.Core.Export;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Results;

public class SurveyCsvWriterTests
{
    [Fact]
    public void Circuit_with_comma_and_quote_is_quoted_per_rfc_4180()
    {
        // RFC 4180 §2.6-2.7: a field holding a comma or a quote is enclosed in quotes, inner quotes doubled.
        Assert.Equal("\"Saw, \"\"big\"\" one\"", SurveyCsvWriter.Quote("Saw, \"big\" one"));
        Assert.Equal("\"two\r\nlines\"", SurveyCsvWriter.Quote("two\r\nlines"));
        Assert.Equal("plain", SurveyCsvWriter.Quote("plain"));
    }

    [Fact]
    public void Written_table_reads_back_with_a_csv_library()
    {
        var rows = new[]
        {
            new ResultBuilder { RmsA = 0.0042, WorstWindowRmsA = 0.0051, SmoothDcMaxA = -0.0012 }.Row("c1.wav", "C1 saw, \"big\" one"),
            SurveyRows.Failed("c2.wav", new CaptureSettings { Circuit = "C2 fan" }, "c2.wav: not a WAV file"),
        };
        var folder = Directory.CreateTempSubdirectory("wavecheck-csv-").FullName;
        try
        {
            var path = Path.Combine(folder, "survey.csv");
            SurveyCsvWriter.Write(path, rows);
            var text = File.ReadAllText(path);
            Assert.Contains("\"C1 saw, \"\"big\"\" one\"", text, StringComparison.Ordinal);
            Assert.EndsWith("\r\n", text, StringComparison.Ordinal);     // RFC 4180 §2.1: CRLF line breaks

            // Reference: Sylvan.Data.Csv parses what we wrote back to the same fields.
            using var reader = CsvDataReader.Create(new StringReader(text));
            Assert.Equal(SurveyCsvWriter.Header, Enumerable.Range(0, reader.FieldCount).Select(reader.GetName));
            Assert.Contains("rmsA", SurveyCsvWriter.Header);
            Assert.Contains("ratedResidualCurrentA", SurveyCsvWriter.Header);
            Assert.Contains("durationS", SurveyCsvWriter.Header);

            Assert.True(reader.Read());
            Assert.Equal("C1 saw, \"big\" one", reader.GetString(reader.GetOrdinal("circuit")));
            Assert.Equal("0.0042", reader.GetString(reader.GetOrdinal("rmsA")));     // invariant culture, round-trip
            Assert.Equal("-0.0012", reader.GetString(reader.GetOrdinal("smoothDcA")));
            Assert.Equal("ok", reader.GetString(reader.GetOrdinal("verdict")));
            Assert.Equal("false", reader.GetString(reader.GetOrdinal("blinded")));
            Assert.Equal("10", reader.GetString(reader.GetOrdinal("durationS")));     // 500 000 / 50 000 Hz

            Assert.True(reader.Read());
            Assert.Equal("error", reader.GetString(reader.GetOrdinal("verdict")));
            Assert.Equal(string.Empty, reader.GetString(reader.GetOrdinal("rmsA")));   // null: empty field
            Assert.Equal("c2.wav: not a WAV file", reader.GetString(reader.GetOrdinal("error")));
            Assert.False(reader.Read());
            Assert.Single(Directory.GetFiles(folder));   // no temporary file left beside it
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Theory]
    [InlineData("=HYPERLINK(\"http://x.invalid\",\"open\")")]
    [InlineData("@SUM(A1:A9)")]
    [InlineData("+1+1")]
    [InlineData("-2+3")]
    [InlineData("\tC3 tab-led")]
    [InlineData("\rC4 CR-led")]
    public void Text_cells_a_spreadsheet_would_run_as_formulas_get_a_leading_quote(string circuit)
    {
        // OWASP "CSV Injection": cells beginning with = + - @ tab or CR are prefixed with a single quote.
        var rows = new[] { new ResultBuilder { RmsA = 0.0042, SmoothDcMaxA = -0.0012 }.Row("=cmd.wav", circuit) };
        var text = new StringWriter();
        SurveyCsvWriter.Write(text, rows);

        // Reference: Sylvan.Data.Csv reads the fields back; each text cell begins with the quote, then the text as given.
        using var reader = CsvDataReader.Create(new StringReader(text.ToString()));
        Assert.True(reader.Read());
        Assert.Equal("'" + circuit, reader.GetString(reader.GetOrdinal("circuit")));
        Assert.Equal("'=cmd.wav", reader.GetString(reader.GetOrdinal("file")));
        Assert.All(Enumerable.Range(0, reader.FieldCount), i =>
            Assert.False(reader.GetString(i) is { Length: > 0 } cell && SpreadsheetText.StartsFormula(cell[0]) && !IsNumber(cell),
                $"cell {reader.GetName(i)} = '{reader.GetString(i)}' starts like a formula"));

        // Numbers stay numbers: a negative figure is not text and keeps its sign.
        Assert.Equal("-0.0012", reader.GetString(reader.GetOrdinal("smoothDcA")));
    }

    [Theory]
    [InlineData("C1 saw", "C1 saw")]
    [InlineData("", "")]
    [InlineData("'=already", "'=already")]
    [InlineData("a=b", "a=b")]
    [InlineData("=", "'=")]
    public void Neutralise_prefixes_only_formula_starts(string cell, string expected) =>
        // OWASP "CSV Injection": only a leading = + - @ tab or CR is dangerous; anything else passes unchanged.
        Assert.Equal(expected, SpreadsheetText.Neutralise(cell));

    private static bool IsNumber(string cell) =>
        double.TryParse(cell, System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _);
}
