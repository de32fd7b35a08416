using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class TrendTableTests
{
    private static WindowResult Row(int i, double rms) => new()
    {
        StartS = i * 0.2,
        DurationS = 0.2,
        FrequencyHz = 50 + (i == 4321 ? 0.3 : 0),
        RmsA = rms,
        DcA = 0,
        AcRmsA = rms,
        PeakPositiveA = rms,
        PeakNegativeA = -rms,
        CrestFactor = 1,
        SmoothDcA = 0,
        PulsatingDc = false,
        MainsRmsA = rms,
        BelowMainsRmsA = 0,
        HarmonicsRmsA = 0,
        Above1kHzRmsA = 0,
        Above9kHzRmsA = 0,
    };

    [Fact]
    public void DecimatesToAtMost2000RowsKeepingTheWorst()
    {
        var table = new TrendTable(50);
        for (var i = 0; i < 9000; i++)
        {
            table.Add(Row(i, i == 6001 ? 1.0 : 0.01));
        }

        var rows = table.Result();
        Assert.InRange(rows.Count, 1000, TrendTable.MaxRows);
        Assert.Equal(1.0, rows.Max(r => r.RmsA));
        Assert.Equal(50.3, rows.Max(r => r.FrequencyHz), 1e-9);
        Assert.Equal(0, rows[0].StartS);
        Assert.Equal(9000 * 0.2, rows[^1].StartS + rows[^1].DurationS, 1e-6);
        for (var i = 1; i < rows.Count; i++)
        {
            Assert.Equal(rows[i - 1].StartS + rows[i - 1].DurationS, rows[i].StartS, 1e-6);
        }
    }
}
