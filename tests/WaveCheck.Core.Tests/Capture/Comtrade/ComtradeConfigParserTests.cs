using WaveCheck.Core.Capture;
using WaveCheck.Core.Capture.Comtrade;

namespace WaveCheck.Core.Tests.Capture.Comtrade;

/// <summary>
/// Each cfg line of C37.111-2013 clause 7.4 (1999: 6.4; field order from memory) broken in turn, and the error's
/// line, field and wording checked. The good cfg is the feeder record of <see cref="ComtradeCaptureSourceTests"/>:
/// line 1 identity, 2 counts, 3-7 analog, 8-9 digital, 10 lf, 11 nrates, 12 rate, 13 start, 14 trigger, 15 ft,
/// 16 timemult, 17 time code, 18 time quality.
/// </summary>
public sealed class ComtradeConfigParserTests
{
    private static List<string> GoodLines() => ComtradeCaptureSourceTests.Feeder(ComtradeDataFileType.Binary).CfgLines();

    private static ComtradeConfig Parse(List<string> lines, List<CaptureWarning>? warnings = null) =>
        ComtradeConfigParser.Parse("relay.cfg", lines, 1, warnings ?? []);

    [Fact]
    public void The_good_cfg_parses_field_by_field()
    {
        var config = Parse(GoodLines());
        Assert.Equal("Harbour Clinic Substation", config.StationName);
        Assert.Equal("FDR-3 recorder", config.DeviceId);
        Assert.Equal(2013, config.RevisionYear);
        Assert.Equal(5, config.Analog.Count);
        Assert.Equal(2, config.Digital.Count);
        Assert.Equal("kA", config.Analog[2].Unit);
        Assert.Equal(0.05, config.Analog[1].B);
        Assert.Equal('S', config.Analog[3].PrimaryOrSecondary);
        Assert.Equal(400, config.Analog[3].Primary);
        Assert.Equal(50, config.LineFrequencyHz);
        Assert.Equal(new ComtradeRateSection(4000, 1, 800) { Line = 12 }, Assert.Single(config.RateSections));
        Assert.Equal(ComtradeDataFileType.Binary, config.FileType);
        // Binary frame, 2013 clause 8.4 (from memory): 4 + 4 + 5 × 2 + one status word of 2 bytes.
        Assert.Equal(20, config.BinaryFrameBytes);
        Assert.True(config.TimeZoneStated);
    }

    [Fact]
    public void The_message_reads_file_line_field_and_problem()
    {
        var lines = GoodLines();
        lines[3] = lines[3].Replace(lines[3].Split(',')[5], "x1", StringComparison.Ordinal);
        var error = Assert.Throws<CaptureFormatException>(() => Parse(lines));
        Assert.Equal("relay.cfg:4:6: analog channel 2: multiplier 'x1' is not a number", error.Message);
    }

    public static TheoryData<int, int, string, int, int?, string> Broken => new()
    {
        // line, field to replace (0: whole line), new text, expected line, expected column, expected wording
        { 1, 3, "2001", 1, 3, "revision year '2001' is not 1991, 1999 or 2013" },
        { 2, 1, "8", 2, 1, "total channel count 8 is not 5A + 2D" },
        { 2, 2, "5X", 2, 2, "analog channel count '5X' is not a number followed by A" },
        { 2, 3, "two", 2, 3, "digital channel count 'two' is not a number followed by D" },
        { 2, 0, "7,5A", 2, null, "channel counts: expected 3 fields (TT,##A,##D), found 2" },
        { 3, 1, "one", 3, 1, "analog channel 1: channel number 'one' is not a whole number" },
        { 4, 7, "-", 4, 7, "analog channel 2: offset '-' is not a number" },
        { 5, 8, "late", 5, 8, "analog channel 3: skew 'late' is not a number" },
        { 6, 9, "low", 6, 9, "analog channel 4: minimum 'low' is not a number" },
        { 6, 10, "high", 6, 10, "analog channel 4: maximum 'high' is not a number" },
        { 7, 11, "four hundred", 7, 11, "analog channel 5: primary factor 'four hundred' is not a number" },
        { 7, 12, "1A", 7, 12, "analog channel 5: secondary factor '1A' is not a number" },
        { 7, 13, "Q", 7, 13, "analog channel 5: primary/secondary flag 'Q' is not P or S" },
        { 3, 0, "1,IL1,A,Feeder 3,A,0.1,0,0,-32767,32767", 3, null, "analog channel 1: expected 13 fields" },
        { 8, 5, "2", 8, 5, "digital channel 1: normal state '2' is not 0 or 1" },
        { 9, 0, "2,Status 2", 9, null, "digital channel 2: expected 5 fields (Dn,ch_id,ph,ccbm,y), found 2" },
        { 10, 1, "fifty", 10, 1, "line frequency 'fifty' is not a number" },
        { 11, 1, "two", 11, 1, "number of sample rates 'two' is not a whole number" },
        { 11, 1, "-1", 11, 1, "number of sample rates -1 is outside 0 to 1000" },
        { 12, 1, "0", 12, 1, "sample rate 1: rate 0 Hz is outside 1 Hz to 10 MHz" },
        { 12, 2, "0", 12, 2, "sample rate 1: last sample number 0 does not follow 0" },
        { 12, 0, "4000", 12, null, "sample rate 1: expected 2 fields (samp,endsamp), found 1" },
        { 13, 1, "2026-12-01", 13, 1, "start date '2026-12-01' is not dd/mm/yyyy" },
        { 14, 2, "08:15", 14, 2, "trigger time '08:15' is not hh:mm:ss.ssssss" },
        { 14, 2, "08:15:30.1234567890", 14, 2, "trigger time '08:15:30.1234567890' is not hh:mm:ss.ssssss" },
        { 15, 1, "HEX", 15, 1, "data file type 'HEX' is not ASCII, BINARY, BINARY32 or FLOAT32" },
        { 16, 1, "fast", 16, 1, "time stamp multiplier 'fast' is not a number" },
        { 16, 1, "0", 16, 1, "time stamp multiplier 0 is outside 1E-12 to 1E+09" },
        { 17, 1, "zulu", 17, 1, "time code 'zulu' is not an offset from UTC" },
        { 17, 2, "+5h75", 17, 2, "local code '+5h75' is not an offset from UTC" },
    };

    [Theory]
    [MemberData(nameof(Broken))]
    public void Each_malformed_line_gets_its_own_message(int line, int field, string text, int expectedLine,
        int? expectedColumn, string wording)
    {
        var lines = GoodLines();
        if (field == 0)
        {
            lines[line - 1] = text;
        }
        else
        {
            var fields = lines[line - 1].Split(',');
            fields[field - 1] = text;
            lines[line - 1] = string.Join(',', fields);
        }

        var error = Assert.Throws<CaptureFormatException>(() => Parse(lines));
        Assert.Equal(expectedLine, error.Line);
        Assert.Equal(expectedColumn, error.Column);
        Assert.Contains(wording, error.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void A_cfg_that_ends_early_names_what_was_expected_and_where()
    {
        var lines = GoodLines()[..12];
        var error = Assert.Throws<CaptureFormatException>(() => Parse(lines));
        Assert.Equal(13, error.Line);
        Assert.Contains("expected start date and time", error.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void A_date_that_is_no_calendar_date_is_a_warning_not_an_error()
    {
        var lines = GoodLines();
        lines[12] = "00/00/0000,00:00:00.000000";
        var warnings = new List<CaptureWarning>();
        var config = Parse(lines, warnings);
        Assert.Null(config.StartTime);
        Assert.NotNull(config.TriggerTime);
        Assert.Contains("line 13", Assert.Single(warnings, w => w.Code == "bad-timestamp").Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Nanosecond_stamps_of_2013_make_the_data_stamps_count_nanoseconds()
    {
        // 2013 clause 7.4.7, from memory: the time stamp unit follows the resolution of the cfg's date/time stamps.
        var lines = GoodLines();
        lines[12] = "01/12/2026,08:15:30.125000001";
        lines[16] = "-5h30,x";
        var config = Parse(lines);
        Assert.Equal(1e-9, config.TimestampBaseS);
        Assert.Equal(new TimeSpan(-5, -30, 0), config.StartTime!.Value.Offset);
    }
}
