using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>Touch-current readings against the limit table (IEC 62368-1, IEC 60950-1, IEC 61010-1, IEC 60601-1).</summary>
public class TouchCurrentLimitsTests
{
    [Fact]
    public void PeakAndDcLimitsUseTheirReadings()
    {
        // 0.70 mA perception peak: within IEC 61010-1's 0.7 mA and IEC 62368-1's 0.707 mA; 0.71 mA within neither.
        var at = TouchCurrentLimits.Compare(new TouchCurrentResult(0.0004, 0.0007, 0.0007, 0.0004, 0.0007, 0.0004, 0.0025));
        LimitComparison Row(TouchCurrentAssessment a, string name) => a.Comparisons.Single(c => c.Limit == name);
        Assert.True(Row(at, "IEC 61010-1 normal, 0.7 mA peak").Within);
        Assert.True(Row(at, "IEC 62368-1 ES1, 0.707 mA peak").Within);
        Assert.False(Row(at, "IEC 62368-1 ES1, 2 mA DC").Within); // 2.5 mA DC
        Assert.Equal(0.0025, Row(at, "IEC 62368-1 ES1, 2 mA DC").ValueA);
        var over = TouchCurrentLimits.Compare(new TouchCurrentResult(0.0004, 0.00071, 0.00071, 0.0004, 0.00071, 0.0004, 0));
        Assert.False(Row(over, "IEC 61010-1 normal, 0.7 mA peak").Within);
        Assert.False(Row(over, "IEC 62368-1 ES1, 0.707 mA peak").Within);
        Assert.True(Row(over, "IEC 60950-1, 0.75 mA (hand-held)").Within); // 0.4 mA rms
        Assert.All(over.Comparisons, c => Assert.Matches(@"\((std|from memory)", c.Source));
    }

    [Fact]
    public void TheTableHoldsTheLimitsOfReferenceMd()
    {
        // REFERENCE.md "Touch current", common limits: IEC 60950-1 0.25 / 0.75 / 3.5 mA (std); IEC 62368-1 ES1
        // 0.5 mA rms, 0.707 mA peak, 2 mA DC, ES2 5 mA rms, 25 mA DC (from memory); IEC 61010-1 normal 0.5 mA rms,
        // 0.7 mA peak, 2 mA DC, single fault 3.5 / 5 / 15 mA (from memory); IEC 60601-1 touch current 100 µA normal,
        // 500 µA single fault (std). Each row's name states its value, and the value is compared with its own reading.
        var expected = new (string Limit, double LimitA, string Reading)[]
        {
            ("IEC 62368-1 ES1, 0.5 mA rms", 0.0005, "perception RMS"),
            ("IEC 62368-1 ES1, 0.707 mA peak", 0.000707, "perception peak"),
            ("IEC 62368-1 ES1, 2 mA DC", 0.002, "DC"),
            ("IEC 62368-1 ES2, 5 mA rms", 0.005, "perception RMS"),
            ("IEC 62368-1 ES2, 25 mA DC", 0.025, "DC"),
            ("IEC 60950-1, 0.25 mA (parts not earthed)", 0.00025, "perception RMS"),
            ("IEC 60950-1, 0.75 mA (hand-held)", 0.00075, "perception RMS"),
            ("IEC 60950-1, 3.5 mA (other equipment)", 0.0035, "perception RMS"),
            ("IEC 61010-1 normal, 0.5 mA rms", 0.0005, "perception RMS"),
            ("IEC 61010-1 normal, 0.7 mA peak", 0.0007, "perception peak"),
            ("IEC 61010-1 normal, 2 mA DC", 0.002, "DC"),
            ("IEC 61010-1 single fault, 3.5 mA rms", 0.0035, "perception RMS"),
            ("IEC 61010-1 single fault, 5 mA peak", 0.005, "perception peak"),
            ("IEC 61010-1 single fault, 15 mA DC", 0.015, "DC"),
            ("IEC 60601-1 touch current, normal, 100 µA", 0.0001, "perception RMS"),
            ("IEC 60601-1 touch current, single fault, 500 µA", 0.0005, "perception RMS"),
        };
        // Distinct readings, so each row's value shows which reading it took; the DC reading negative (its magnitude
        // is compared). 3 mA perception peak, 2 mA perception RMS, 2.5 mA DC.
        const double PeakA = 0.003, RmsA = 0.002, DcA = 0.0025;
        var a = TouchCurrentLimits.Compare(new TouchCurrentResult(0.009, 0.009, PeakA, RmsA, 0.009, 0.009, -DcA));
        Assert.Equal(expected.Select(e => e.Limit), a.Comparisons.Select(c => c.Limit));
        foreach (var (row, e) in a.Comparisons.Zip(expected))
        {
            Assert.Equal(e.LimitA, row.LimitA);
            Assert.Equal(e.Reading, row.Reading);
            var value = e.Reading switch { "perception peak" => PeakA, "perception RMS" => RmsA, _ => DcA };
            Assert.Equal(value, row.ValueA);
            Assert.Equal(value <= e.LimitA, row.Within);
            // The source names the row's standard and REFERENCE.md's status for it.
            var standard = e.Limit[..e.Limit.IndexOfAny([',', ' '], 4)];
            Assert.StartsWith(standard + " ", row.Source, StringComparison.Ordinal);
            var status = standard is "IEC 60950-1" or "IEC 60601-1" ? "(std" : "(from memory)";
            Assert.Contains(status, row.Source, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void NoReadingsIsRefused() =>
        Assert.Equal("readings", Assert.Throws<ArgumentNullException>(() => TouchCurrentLimits.Compare(null!)).ParamName);
}
