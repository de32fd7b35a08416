using System.Text;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>
/// Every site-file mistake the reader names, pinned word for word with its place: the seams of the reader (the JSON
/// walk, the settings, the channel lists, the quantities, the circuit and upstream checks) each get at least one
/// case, so a change to one part of the reader cannot alter what the user reads. The words are the reader's own
/// (docs/formats.md, site files: every mistake is reported with its line, column and what was expected; common
/// practice, no source).
/// </summary>
public class SiteFileErrorTests
{
    private static readonly string ConfigPath = Path.Combine(Path.GetTempPath(), "wavecheck-site", "site.json");

    private const string Channels = "expected one voltage channel, or three (L1, L2, L3), e.g. \"ch2\" or [\"U1\", \"U2\", \"U3\"]";
    private const string SumChannels = "expected two or more channel names, e.g. [\"L1\", \"L2\", \"L3\", \"N\"]";
    private const string ScaleWords = "expected volts at WAV full scale or a probe ratio, such as \"500V\" or 100";
    private const string OneDevice = ": the captures of one circuit share its device; correct the entry, or give the circuits different names";

    [Theory]
    // Channel lists: the voltage takes one or three names (or a 1-based number), the sum two or more names.
    [InlineData("""{ "captures": [ { "file": "a.wav", "voltage": 2.5 } ] }""", "2.5", "\"voltage\": cannot use the number 2.5: " + Channels)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "voltage": "U1, U2" } ] }""", "\"U1, U2\"", "\"voltage\": cannot use the text \"U1, U2\": " + Channels)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "voltage": ["U1", 7, "U3"] } ] }""", "7", "\"voltage\": cannot use the number 7: expected a file name in quotes")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "voltage": true } ] }""", "true", "\"voltage\": cannot use the value true: " + Channels)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "sum": 3 } ] }""", "3 }", "\"sum\": cannot use the number 3: " + SumChannels)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "sum": ["L1"] } ] }""", "[\"L1\"]", "\"sum\": cannot use a list: " + SumChannels)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "sum": ["L1", true] } ] }""", "true", "\"sum\": cannot use the value true: expected a file name in quotes")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "sum": {} } ] }""", "{}", "\"sum\": cannot use an object: " + SumChannels)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "channel": 0 } ] }""", "0 }", "\"channel\": cannot use the number 0: expected a channel name or a 1-based number")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "channel": 1.5 } ] }""", "1.5", "\"channel\": cannot use the number 1.5: expected a channel name or a 1-based number")]
    // Voltage scale: volts at full scale or a bare probe ratio, positive, at most 1e6.
    [InlineData("""{ "captures": [ { "file": "a.wav", "voltageScale": "abc" } ] }""", "\"abc\"", "\"voltageScale\": cannot use \"abc\": " + ScaleWords)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "voltageScale": 0 } ] }""", "0 }", "\"voltageScale\": cannot use the number 0: expected a positive factor up to 1e6")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "voltageScale": true } ] }""", "true", "\"voltageScale\": cannot use the value true: " + ScaleWords)]
    // Words and switches.
    [InlineData("""{ "captures": [ { "file": "a.wav", "regime": "uk" } ] }""", "\"uk\"", "\"regime\": cannot use \"uk\": expected \"iec\" or \"na\"")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "regime": 1 } ] }""", "1 }", "\"regime\": cannot use the number 1: expected text in quotes")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "sensor": 1 } ] }""", "1 }", "\"sensor\": cannot use the number 1: expected text in quotes")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "ev": "yes" } ] }""", "\"yes\"", "\"ev\": cannot use the text \"yes\": expected true or false")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "device": 5 } ] }""", "5 }", "unknown device type the number 5: expected \"AC\", \"A\", \"F\", \"B\" or \"B+\", optionally with +RDC-DD (\"A+RDC-DD\")")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "circuit": 5 } ] }""", "5 }", "\"circuit\": cannot use the number 5: expected text in quotes")]
    // Quantities.
    [InlineData("""{ "captures": [ { "file": "a.wav", "rated": "0mA" } ] }""", "\"0mA\"", "\"rated\" must be positive (got \"0mA\"): expected " + Quantity.CurrentForm)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "scale": "5000000kA" } ] }""", "\"5000000kA\"", "\"scale\": cannot use the text \"5000000kA\": expected a full-scale current from 1E-12 A to 1E+09 A")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "range": [] } ] }""", "[]", "\"range\": cannot use a list: expected " + Quantity.VoltageForm)]
    // The JSON walk.
    [InlineData("""{ "captures": [ { "file": "a.wav", "rated": 1e999 } ] }""", "1e999", "the number 1e999 is out of range")]
    [InlineData("""{ "captures": [ { "file": "a.wav", "circuit": "\ud800" } ] }""", "\"\\ud800\"", "the text holds an escape that is no character (a lone \\u surrogate)")]
    [InlineData("""{ "defaults": 1, "captures": [ { "file": "a.wav" } ] }""", "1,", "found the number 1: expected an object of settings such as { \"rated\": \"30mA\" }")]
    [InlineData("""{ "captures": {} }""", "{}", "found an object: expected a list of captures [ { \"file\": \"c1.wav\" }, ... ]")]
    [InlineData("""{ "captures": [ "a.wav" ] }""", "\"a.wav\"", "found the text \"a.wav\": expected a capture entry { \"file\": \"c1.wav\", ... }")]
    [InlineData("""{ "captures": [ { "file": 1 } ] }""", "1 }", "\"file\": cannot use the number 1: expected a file name in quotes")]
    // One circuit, one device: each setting the captures of a circuit must share.
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"circuit\": \"C3\" },\n { \"file\": \"b.wav\", \"circuit\": \"C3\", \"regime\": \"na\" } ] }",
        "{ \"file\": \"b.wav\"", "capture \"b.wav\" of circuit \"C3\" states \"regime\": \"na\", but \"a.wav\" (line 1) states \"regime\": \"iec\"" + OneDevice)]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"circuit\": \"C3\", \"ev\": true },\n { \"file\": \"b.wav\", \"circuit\": \"C3\" } ] }",
        "{ \"file\": \"b.wav\"", "capture \"b.wav\" of circuit \"C3\" states \"ev\": false, but \"a.wav\" (line 1) states \"ev\": true" + OneDevice)]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"circuit\": \"C3\" },\n { \"file\": \"b.wav\", \"circuit\": \"C3\", \"chargerDcDetection\": true } ] }",
        "{ \"file\": \"b.wav\"", "capture \"b.wav\" of circuit \"C3\" states \"chargerDcDetection\": true, but \"a.wav\" (line 1) states \"chargerDcDetection\": false" + OneDevice)]
    // Upstream devices.
    [InlineData("""{ "captures": [ { "file": "a.wav" } ], "upstream": [ { "name": "Q1", "device": null, "rated": "100mA", "circuits": [] } ] }""",
        "null", "\"device\" of an upstream device cannot be null: expected AC, A, F, B or B+")]
    [InlineData("""{ "captures": [ { "file": "a.wav" } ], "upstream": [ { "name": "Q1", "device": "A", "rated": null, "circuits": [] } ] }""",
        "null", "\"rated\" of an upstream device cannot be null: expected a current such as \"100mA\"")]
    [InlineData("""{ "captures": [ { "file": "a.wav" } ], "upstream": [ { "name": "Q1", "device": "A", "rated": "100mA", "circuits": "x" } ] }""",
        "\"x\"", "found the text \"x\": expected a list of capture files [\"c2.wav\", ...] as written under \"captures\"")]
    [InlineData("""{ "captures": [ { "file": "a.wav" } ], "upstream": [ { "device": "A", "rated": "100mA", "circuits": [] } ] }""",
        "{ \"device\"", "upstream entry without \"name\": expected e.g. \"name\": \"Q2 sub-board RCD\"")]
    [InlineData("""{ "captures": [ { "file": "a.wav" } ], "upstream": [ { "name": "Q1", "devise": "A" } ] }""",
        "\"devise\"", "unknown key \"devise\" in an upstream entry: did you mean \"device\"? expected one of \"name\", \"device\", \"rated\", \"circuits\"")]
    [InlineData("""{ "captures": [ { "file": "a.wav" } ], "upstream": [ { "name": "Q1", "device": "A", "rated": "100mA" } ] }""",
        "{ \"name\"", "upstream device \"Q1\" has no \"circuits\": expected a list of capture files")]
    public void Each_mistake_is_named_word_for_word_at_its_place(string text, string marker, string problem)
    {
        var e = Assert.Throws<CaptureFormatException>(() => Parse(text));

        Assert.Equal(problem, e.Problem);
        Assert.Equal(Place(text, marker), (e.Line, e.Column));
        Assert.Equal(ConfigPath, e.FilePath);
    }

    [Fact]
    public void Voltage_and_sum_read_their_lists_alike()
    {
        // Text with commas, a list, or for the voltage a 1-based number; names trimmed, empty pieces dropped.
        var jobs = Parse("""
            { "captures": [
                { "file": "a.wav", "voltage": " U1 , U2,,U3 ", "sum": "L1, N" },
                { "file": "b.wav", "voltage": 2, "sum": [" L1", "L2 ", "L3", "N"] } ] }
            """).Jobs();

        Assert.Equal(["U1", "U2", "U3"], jobs[0].Settings.Import.VoltageChannels);
        Assert.Equal(["L1", "N"], jobs[0].Settings.Import.SumChannels);
        Assert.Equal(["2"], jobs[1].Settings.Import.VoltageChannels);
        Assert.Equal(["L1", "L2", "L3", "N"], jobs[1].Settings.Import.SumChannels);
    }

    [Fact]
    public void Bytes_that_are_not_utf8_are_placed_by_line_column_and_offset()
    {
        var bytes = Encoding.UTF8.GetBytes("{\n  \"site\": \"Kü?\" }").ToArray();
        var at = Array.IndexOf(bytes, (byte)'?');
        bytes[at] = 0xFF;

        var e = Assert.Throws<CaptureFormatException>(() => SiteConfigReader.Parse(ConfigPath, bytes));

        // Line 2; the bad byte follows 13 characters ("  \"site\": \"Kü"), ü being one character of two bytes.
        Assert.Equal($"byte offset {at}: invalid UTF-8 (byte 0xFF): save the site file as UTF-8", e.Problem);
        Assert.Equal((2L, 14L), (e.Line, e.Column));
    }

    [Fact]
    public void Over_long_text_and_over_large_files_are_refused_with_their_limits()
    {
        var text = $$"""{ "captures": [ { "file": "a.wav", "circuit": "{{new string('x', SiteConfigReader.MaxTextBytes + 1)}}" } ] }""";
        var e = Assert.Throws<CaptureFormatException>(() => Parse(text));
        Assert.Equal($"a text of {SiteConfigReader.MaxTextBytes + 1} bytes: at most {SiteConfigReader.MaxTextBytes} bytes are read", e.Problem);
        Assert.Equal(Place(text, "\"xxx"), (e.Line, e.Column));

        var large = new byte[SiteConfigReader.MaxFileBytes + 1];
        Array.Fill(large, (byte)' ');
        var big = Assert.Throws<CaptureFormatException>(() => SiteConfigReader.Parse(ConfigPath, large));
        Assert.Equal($"the site file is {SiteConfigReader.MaxFileBytes + 1} bytes: at most {SiteConfigReader.MaxFileBytes} bytes (4 MiB) are read", big.Problem);
    }

    [Fact]
    public void Names_a_key_that_belongs_elsewhere_by_its_place()
    {
        // "file" is a capture key: at the top it is unknown, and the message lists what the top takes.
        var text = """{ "file": "a.wav", "captures": [ { "file": "a.wav" } ] }""";
        var e = Assert.Throws<CaptureFormatException>(() => Parse(text));
        Assert.StartsWith("unknown key \"file\" in the site object: ", e.Problem, StringComparison.Ordinal);
        Assert.EndsWith("expected one of \"site\", \"defaults\", \"captures\", \"upstream\", \"client\", \"address\", \"reportNumber\", \"operator\", \"instrument\", \"instrumentSerial\", \"clamp\", \"clampSerial\", \"calibrationDue\", \"date\", \"productTest\"", e.Problem, StringComparison.Ordinal);
        Assert.Equal((1L, 3L), (e.Line, e.Column));
    }

    private static SiteConfig Parse(string text) => SiteConfigReader.Parse(ConfigPath, Encoding.UTF8.GetBytes(text));

    /// <summary>1-based line and column (in characters) of the first occurrence of <paramref name="marker"/>.</summary>
    private static (long Line, long Column) Place(string text, string marker)
    {
        var at = text.IndexOf(marker, StringComparison.Ordinal);
        Assert.True(at >= 0, $"marker {marker} not in the text");
        var lines = text[..at].Split('\n');
        return (lines.Length, lines[^1].Length + 1);
    }
}
