using System.Text;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>The identity keys of a site file (docs/report.md): read, merged per capture, and checked as strictly as
/// the other keys.</summary>
public class SiteIdentityTests
{
    private static readonly string ConfigPath = Path.Combine(Path.GetTempPath(), "wavecheck-site-identity", "site.json");

    private static SiteConfig Parse(string text) => SiteConfigReader.Parse(ConfigPath, Encoding.UTF8.GetBytes(text));

    [Fact]
    public void Identity_keys_are_read_and_a_capture_states_its_own_number()
    {
        var site = Parse("""
            { "site": "invented clinic", "client": "invented client", "address": "1 Sample Road",
              "reportNumber": "R-100", "operator": "A. Tester", "instrument": "recorder", "instrumentSerial": "S1",
              "clamp": "clamp", "clampSerial": "S2", "calibrationDue": "2027-03-31", "date": "2026-11-20", "productTest": false,
              "captures": [ { "file": "a.wav", "circuit": "C1" }, { "file": "b.wav", "circuit": "C2", "reportNumber": "R-101", "productTest": true } ] }
            """);

        var first = site.IdentityOf(site.Captures[0].Path, "C1");
        var second = site.IdentityOf(site.Captures[1].Path, "C2");

        Assert.Equal("invented client", first.Client);
        Assert.Equal("1 Sample Road", first.SiteAddress);
        Assert.Equal("invented clinic", first.Site);
        Assert.Equal("C1", first.Circuit);
        Assert.Equal("R-100", first.ReportNumber);
        Assert.Equal(new DateOnly(2027, 3, 31), first.CalibrationDue);
        Assert.Equal(new DateTimeOffset(2026, 11, 20, 0, 0, 0, TimeSpan.Zero), first.StatedRecordedAt);
        Assert.False(first.ProductTest);
        Assert.Equal("R-101", second.ReportNumber);
        Assert.True(second.ProductTest);
        Assert.Equal("A. Tester", second.Operator);
    }

    [Fact]
    public void A_site_file_without_identity_keys_gives_blank_fields()
    {
        var site = Parse("""{ "captures": [ { "file": "a.wav" } ] }""");

        var identity = site.IdentityOf(site.Captures[0].Path, null);

        Assert.Null(identity.ReportNumber);
        Assert.Null(identity.Client);
        Assert.Null(identity.CalibrationDue);
    }

    [Theory]
    [InlineData("""{ "datum": "2026-11-20", "captures": [ { "file": "a.wav" } ] }""", "unknown key \"datum\"", 1, 3)]
    [InlineData("""{ "calibrationDue": "31/03/2027", "captures": [ { "file": "a.wav" } ] }""", "expected a date such as \"2027-03-31\"", 1, 21)]
    [InlineData("""{ "date": "yesterday", "captures": [ { "file": "a.wav" } ] }""", "\"date\": cannot use \"yesterday\"", 1, 11)]
    [InlineData("""{ "captures": [ { "file": "a.wav", "client": "x" } ] }""", "unknown key \"client\" in a capture entry", 1, 36)]
    [InlineData("""{ "productTest": "yes", "captures": [ { "file": "a.wav" } ] }""", "expected true or false", 1, 18)]
    public void Bad_or_unknown_identity_keys_are_refused_with_their_place(string text, string message, long line, long column)
    {
        var e = Assert.Throws<CaptureFormatException>(() => Parse(text));

        Assert.Contains(message, e.Message, StringComparison.Ordinal);
        Assert.Equal(line, e.Line);
        Assert.Equal(column, e.Column);
    }
}
