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
}
