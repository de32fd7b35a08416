using System.Text;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

public class SiteConfigReaderTests
{
    private static readonly string Folder = Path.Combine(Path.GetTempPath(), "wavecheck-site");
    private static readonly string ConfigPath = Path.Combine(Folder, "site.json");

    private const string Good = """
        // Fernbrook Joinery (invented), surveyed on a Tuesday
        {
          "site": "Fernbrook Joinery, Unit 4",
          "defaults": { "rated": "30mA", "sensor": "dc", "regime": "iec" },
          "captures": [
            { "file": "c1-panel-saw-drive.wav", "circuit": "C1 panel saw drive", "device": "A", "rated": "300mA",
              "sensor": "dc", "ev": false, "scale": "100mA", "channel": null, "sum": null },
            { "file": "c2-extractor-fan.wav", "circuit": "C2 extractor fan", "device": "F", "rated": "0.03 A" },
            { "file": "sub/c5-heat-pump.csv", "circuit": "C5 heat pump", "sum": ["L1", "L2", "L3", "N"], "sensor": "ac" },
            { "file": "c6-charger.wav", "ev": true, "channel": 2, "device": "b+", "regime": "na" },
          ],
          "upstream": [
            { "name": "Q2 sub-board RCD", "device": "A", "rated": "100mA",
              "circuits": ["c2-extractor-fan.wav", "sub/c5-heat-pump.csv"] }
          ]
        }
        """;

    private static SiteConfig Parse(string text) => SiteConfigReader.Parse(ConfigPath, Encoding.UTF8.GetBytes(text));

    [Fact]
    public void Good_file_is_read_with_units_defaults_and_resolved_paths()
    {
        var site = Parse(Good);
        Assert.Equal("Fernbrook Joinery, Unit 4", site.Site);
        Assert.Equal(4, site.Captures.Count);
        Assert.Equal(Path.Combine(Folder, "c1-panel-saw-drive.wav"), site.Captures[0].Path);
        Assert.Equal(Path.GetFullPath(Path.Combine(Folder, "sub", "c5-heat-pump.csv")), site.Captures[2].Path);

        var jobs = site.Jobs();
        var c1 = jobs[0].Settings;
        Assert.Equal(0.3, c1.RatedResidualCurrentA, 15);      // "300mA" = 0.3 A (SI prefix m = 1e-3)
        Assert.Equal(new InstalledProtection(DeviceType.A), c1.InstalledProtection);
        Assert.Equal(SensorCoupling.Dc, c1.Import.Sensor);
        Assert.Equal(0.1, c1.Import.ScaleA!.Value, 15);       // "100mA" = 0.1 A
        Assert.False(c1.Ev);
        Assert.Equal("C1 panel saw drive", c1.Circuit);

        var c2 = jobs[1].Settings;
        Assert.Equal(0.03, c2.RatedResidualCurrentA, 15);     // "0.03 A": amperes, space before the unit allowed
        Assert.Equal(new InstalledProtection(DeviceType.F), c2.InstalledProtection);
        Assert.Equal(SensorCoupling.Dc, c2.Import.Sensor);    // from defaults

        var c5 = jobs[2].Settings;
        Assert.Equal(0.03, c5.RatedResidualCurrentA, 15);     // defaults "30mA"
        Assert.Equal(["L1", "L2", "L3", "N"], c5.Import.SumChannels!);
        Assert.Equal(SensorCoupling.Ac, c5.Import.Sensor);
        Assert.Null(c5.InstalledProtection);

        var c6 = jobs[3].Settings;
        Assert.True(c6.Ev);
        Assert.Equal("2", c6.Import.Channel);
        Assert.Equal(new InstalledProtection(DeviceType.BPlus), c6.InstalledProtection);
        Assert.Equal(Regime.Na, c6.Regime);

        var q2 = Assert.Single(site.Upstream);
        Assert.Equal("Q2 sub-board RCD", q2.Name);
        Assert.Equal(DeviceType.A, q2.Device);
        Assert.Equal(0.1, q2.RatedResidualCurrentA, 15);
        Assert.Equal([site.Captures[1].Path, site.Captures[2].Path], q2.Members);
    }

    [Fact]
    public void Command_line_overrides_win_over_the_entry_and_the_defaults()
    {
        var jobs = Parse(Good).Jobs(new CaptureSettingsPatch { RatedResidualCurrentA = 0.1, Channel = "1" });
        Assert.All(jobs, j => Assert.Equal(0.1, j.Settings.RatedResidualCurrentA));
        // A channel given on the command line replaces a sum from the entry (one residual source at a time).
        Assert.Equal("1", jobs[2].Settings.Import.Channel);
        Assert.Null(jobs[2].Settings.Import.SumChannels);
    }

    [Fact]
    public void Missing_site_name_falls_back_to_the_file_name() =>
        Assert.Equal("site", Parse("""{ "captures": [ { "file": "a.wav" } ] }""").Site);

    // Each bad case: the text, a marker where the error must point (its first occurrence), and words the message must hold.
    // The expected line and column are found from the marker by plain string search, independently of the reader.
    [Theory]
    [InlineData("{\n  \"site\": \"x\",\n  \"captures\": [\n    { \"file\": \"a.wav\", \"ratd\": \"30mA\" }\n  ]\n}",
        "\"ratd\"", "unknown key \"ratd\" in a capture entry: did you mean \"rated\"?")]
    [InlineData("{ \"sites\": \"x\", \"captures\": [ { \"file\": \"a.wav\" } ] }",
        "\"sites\"", "unknown key \"sites\" in the site object: did you mean \"site\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"zzzzzz\": 1 } ] }",
        "\"zzzzzz\"", "unknown key \"zzzzzz\" in a capture entry: expected one of \"file\", \"circuit\", \"state\", \"rated\"")]
    [InlineData("{ \"captures\": [\n { \"circuit\": \"Küche südlich\", \"file\": \"a.wav\", \"rated\": \"30 mAA\" } ] }",
        "\"30 mAA\"", "\"rated\": cannot use \"30 mAA\": expected a current with its unit, such as 30mA")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"rated\": \"-30mA\" } ] }",
        "\"-30mA\"", "\"rated\" must be positive (got \"-30mA\")")]
    // One rule for units (issue 14): a bare number is refused with the reading it most likely meant, whether a JSON
    // number or a string, for currents, voltages, frequencies and sensitivities alike.
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"rated\": 30 } ] }",
        "30", "\"rated\": 30 has no unit: expected a current with its unit, such as 30mA, 0.3A or 300uA; did you mean \"30mA\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"rated\": 0.03 } ] }",
        "0.03", "\"rated\": 0.03 has no unit: expected a current with its unit, such as 30mA, 0.3A or 300uA; did you mean \"0.03A\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\" } ],\n \"upstream\": [ { \"name\": \"Q1\", \"device\": \"A\", \"rated\": \"100\", \"circuits\": [] } ] }",
        "\"100\"", "\"rated\": cannot use \"100\": expected a current with its unit, such as 30mA, 0.3A or 300uA; did you mean \"100mA\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"scale\": 50 } ] }",
        "50", "\"scale\": 50 has no unit: expected a current with its unit, such as 30mA, 0.3A or 300uA; did you mean \"50mA\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.csv\", \"rate\": \"10000\" } ] }",
        "\"10000\"", "\"rate\": cannot use \"10000\": expected a frequency with its unit, such as 50Hz or 20kHz; did you mean \"10000Hz\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"range\": 1 } ] }",
        "1", "\"range\": 1 has no unit: expected a voltage with its unit, such as 1V or 500mV; did you mean \"1V\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"sensitivity\": 10 } ] }",
        "10", "\"sensitivity\": 10 has no unit: expected a sensitivity with its units, such as 10 mV/mA, 100mV/A or 1 V/A; did you mean \"10 mV/mA\"?")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"rated\": true } ] }",
        "true", "\"rated\": cannot use the value true: expected a current")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"device\": \"G\" } ] }",
        "\"G\"", "unknown device type \"G\": expected \"AC\", \"A\", \"F\", \"B\" or \"B+\"")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"sensor\": \"hall\" } ] }",
        "\"hall\"", "\"sensor\": cannot use \"hall\": expected \"dc\"")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\" },\n  { \"file\": \"a.wav\" } ] }",
        "\"a.wav\" } ]", "capture \"a.wav\" is listed twice (first at line 1)")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\" } ],\n \"upstream\": [ { \"name\": \"Q1\", \"device\": \"A\", \"rated\": \"100mA\", \"circuits\": [\"a.wav\", \"b.wav\"] } ] }",
        "\"b.wav\"", "upstream device \"Q1\" names \"b.wav\", which is neither a capture under \"captures\" nor a circuit's name: expected one of \"a.wav\"")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\" } ],\n \"upstream\": [ { \"name\": \"Q1\", \"device\": \"A\", \"rated\": \"100mA\", \"circuits\": [\"a.wav\", \"a.wav\"] } ] }",
        "\"a.wav\"] }", "upstream device \"Q1\" names \"a.wav\" twice")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\" } ], \"upstream\": [\n { \"name\": \"Q1\", \"device\": \"A\", \"rated\": \"0.1A\", \"circuits\": [] },\n { \"name\": \"q1\", \"device\": \"A\", \"rated\": \"0.1A\", \"circuits\": [] } ] }",
        "\"q1\"", "upstream device \"q1\" is listed twice (first at line 2)")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\" } ], \"upstream\": [\n { \"name\": \"Q1\", \"device\": \"A\", \"circuits\": [] } ] }",
        "{ \"name\"", "upstream device \"Q1\" has no \"rated\"")]
    [InlineData("{ \"site\": \"x\", \"site\": \"y\", \"captures\": [ { \"file\": \"a.wav\" } ] }",
        "\"site\": \"y\"", "duplicate key \"site\"")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"channel\": \"1\", \"sum\": \"L1,N\" } ] }",
        "\"L1,N\"", "both \"channel\" and \"sum\" given")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"sum\": \"L1\" } ] }",
        "\"L1\"", "expected two or more channel names")]
    [InlineData("{ \"captures\": [ { \"circuit\": \"x\" } ] }",
        "{ \"circuit\"", "capture entry without \"file\"")]
    [InlineData("{ \"site\": \"x\",\n  \"captures\": [] }",
        "[]", "the \"captures\" list is empty")]
    [InlineData("{ \"site\": \"x\" }",
        "{", "no \"captures\" list")]
    [InlineData("[ 1, 2 ]",
        "[", "found a list: expected the site object")]
    [InlineData("{ \"captures\": [ { \"file\": \"a.wav\", \"circuit\": \"C3 bay\", \"device\": \"A+RDC-DD\" },\n { \"file\": \"b.wav\", \"circuit\": \"c3 bay \", \"device\": \"A\" } ] }",
        "{ \"file\": \"b.wav\"", "capture \"b.wav\" of circuit \"c3 bay\" states \"device\": \"A\", but \"a.wav\" (line 1) states \"device\": \"A+RDC-DD\"")]
    [InlineData("{ \"defaults\": { \"rated\": \"30mA\" }, \"captures\": [ { \"file\": \"a.wav\", \"circuit\": \"C3\" },\n { \"file\": \"b.wav\", \"circuit\": \"C3\", \"rated\": \"100mA\" } ] }",
        "{ \"file\": \"b.wav\"", "states \"rated\": 100 mA, but \"a.wav\" (line 1) states \"rated\": 30.0 mA")]
    [InlineData("{ \"defaults\": { \"state\": \"x\" }, \"captures\": [ { \"file\": \"a.wav\" } ] }",
        "\"state\"", "unknown key \"state\" in defaults")]
    public void Bad_site_file_names_the_place_and_what_was_expected(string text, string marker, string words)
    {
        var e = Assert.Throws<CaptureFormatException>(() => Parse(text));
        var (line, column) = Place(text, marker);
        Assert.Equal(ConfigPath, e.FilePath);
        Assert.Equal(line, e.Line);
        Assert.Equal(column, e.Column);
        Assert.Contains(words, e.Problem, StringComparison.Ordinal);
        Assert.StartsWith($"{ConfigPath}:{line}:{column}: ", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Json_syntax_error_is_placed_one_based()
    {
        // A missing comma before "captures" on line 3. System.Text.Json reports the unexpected token at 0-based line 2,
        // byte 2 of the line (JsonException.LineNumber / BytePositionInLine); people count from 1: line 3, column 3.
        var text = "{\n  \"site\": \"x\"\n  \"captures\": []\n}";
        var e = Assert.Throws<CaptureFormatException>(() => Parse(text));
        Assert.Equal(3, e.Line);
        Assert.Equal(3, e.Column);
        Assert.Contains("not valid JSON", e.Problem, StringComparison.Ordinal);
        Assert.DoesNotContain("LineNumber", e.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void Captures_with_one_circuit_name_are_one_circuit_behind_an_upstream_device()
    {
        // Old site files stay valid: "state" is optional, and a circuit named once is a circuit of one capture.
        var site = Parse("""
            { "defaults": { "rated": "30mA", "device": "A" },
              "captures": [
                { "file": "c2-run.wav", "circuit": "C2 extractor", "state": "running" },
                { "file": "c2-start.wav", "circuit": "C2 Extractor ", "state": "start-up" },
                { "file": "c6.wav", "circuit": "C6 lights" } ],
              "upstream": [
                { "name": "Q2", "device": "A", "rated": "100mA", "circuits": ["c2-run.wav"] },
                { "name": "Q3", "device": "A", "rated": "100mA", "circuits": ["C6 lights"] } ] }
            """);
        var jobs = site.Jobs();
        Assert.Equal("running", jobs[0].Settings.State);
        Assert.Equal("start-up", jobs[1].Settings.State);
        Assert.Null(jobs[2].Settings.State);
        // Naming one capture of a circuit puts the whole circuit behind the device; a circuit may be named by its name.
        Assert.Equal([site.Captures[0].Path, site.Captures[1].Path], site.Upstream[0].Members);
        Assert.Equal([site.Captures[2].Path], site.Upstream[1].Members);
    }

    [Fact]
    public void Read_from_disk_resolves_against_the_file_folder()
    {
        var folder = Directory.CreateTempSubdirectory("wavecheck-site-").FullName;
        try
        {
            var path = Path.Combine(folder, "fernbrook.json");
            File.WriteAllText(path, "\uFEFF{ \"captures\": [ { \"file\": \"c1.wav\" } ] }", new UTF8Encoding(false));
            var site = SiteConfigReader.Read(path);
            Assert.Equal(Path.Combine(folder, "c1.wav"), site.Captures[0].Path);
            Assert.Equal("fernbrook", site.Site);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    /// <summary>1-based line and column (in characters) of the first occurrence of <paramref name="marker"/>.</summary>
    private static (long Line, long Column) Place(string text, string marker)
    {
        var at = text.IndexOf(marker, StringComparison.Ordinal);
        Assert.True(at >= 0, $"marker {marker} not in the text");
        var lines = text[..at].Split('\n');
        return (lines.Length, lines[^1].Length + 1);
    }
}
