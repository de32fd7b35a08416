using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

public class BoundedLineReaderTests
{
    private static List<string> ReadAll(string text)
    {
        var reader = new BoundedLineReader(new StringReader(text), "t.csv");
        var lines = new List<string>();
        while (reader.TryRead(out var line))
        {
            lines.Add(line);
        }

        return lines;
    }

    [Theory]
    [InlineData("a\nb\n")]
    [InlineData("a\r\nb\r\n")]
    [InlineData("a\rb")]
    [InlineData("a\nb")]
    public void Lines_end_where_TextReader_ReadLine_ends_them(string text)
    {
        // Reference: TextReader.ReadLine (\n, \r, \r\n); the CSV reader skips its header with one and parses on with
        // the other, so they must agree line for line.
        var expected = new List<string>();
        using var reference = new StringReader(text);
        while (reference.ReadLine() is { } line)
        {
            expected.Add(line);
        }

        Assert.Equal(expected, ReadAll(text));
    }

    [Fact]
    public void A_line_at_the_limit_is_read_and_one_longer_is_refused_with_its_number()
    {
        var limit = CaptureLimits.MaxLineLength;
        Assert.Equal(limit, ReadAll("a\n" + new string('x', limit) + "\n")[1].Length);
        var ex = Assert.Throws<CaptureFormatException>(() => ReadAll("a\nb\n" + new string('x', limit + 1) + "\n"));
        Assert.Equal(3, ex.Line);
    }

    [Fact]
    public void The_reader_is_left_just_after_the_last_line_returned()
    {
        using var text = new StringReader("h1\r\nh2\r\n1,2\r\n");
        var reader = new BoundedLineReader(text, "t.csv");
        Assert.True(reader.TryRead(out _));
        Assert.True(reader.TryRead(out _));
        Assert.Equal("1,2", text.ReadLine());
    }
}
