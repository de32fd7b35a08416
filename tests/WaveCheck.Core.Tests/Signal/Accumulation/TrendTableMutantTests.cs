using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="TrendTable"/>: how rows merge (each metric's worst value, docs/methods.md I: "decimated to at most 2000
/// rows keeping the worst value") and how many windows a row covers once the table has been decimated.
/// </summary>
public class TrendTableMutantTests
{
    private const double WindowS = 0.2;

    private static WindowResult Window(int i) => WindowSlots.Result(i * WindowS, 0.001);

    private static WindowResult Row(double rmsA, double acRmsA, double peakPositiveA, double peakNegativeA,
        double crestFactor, double mainsRmsA, double belowMainsRmsA, double harmonicsRmsA, double above1kHzRmsA,
        double above9kHzRmsA) => WindowSlots.Result(0, rmsA) with
        {
            AcRmsA = acRmsA,
            PeakPositiveA = peakPositiveA,
            PeakNegativeA = peakNegativeA,
            CrestFactor = crestFactor,
            MainsRmsA = mainsRmsA,
            BelowMainsRmsA = belowMainsRmsA,
            HarmonicsRmsA = harmonicsRmsA,
            Above1kHzRmsA = above1kHzRmsA,
            Above9kHzRmsA = above9kHzRmsA,
        };

    [Fact]
    public void AMergedRowKeepsTheLargestOfEachMagnitude()
    {
        // Closed form: the worst of two rows is the larger magnitude of each figure, the lower negative peak. Each
        // figure's larger value sits once in a and once in b so that neither "always a" nor "always b" passes.
        var table = new TrendTable(50);
        var a = Row(0.002, 0.009, 0.004, -0.001, 3.0, 0.001, 0.007, 0.001, 0.006, 0.001);
        var b = Row(0.001, 0.008, 0.005, -0.006, 1.5, 0.003, 0.002, 0.005, 0.001, 0.004);
        foreach (var (first, second) in new[] { (a, b), (b, a) })
        {
            var w = table.Worst(first, second);
            Assert.Equal(0.002, w.RmsA);
            Assert.Equal(0.009, w.AcRmsA);
            Assert.Equal(0.005, w.PeakPositiveA);
            Assert.Equal(-0.006, w.PeakNegativeA);
            Assert.Equal(3.0, w.CrestFactor);
            Assert.Equal(0.003, w.MainsRmsA);
            Assert.Equal(0.007, w.BelowMainsRmsA);
            Assert.Equal(0.005, w.HarmonicsRmsA);
            Assert.Equal(0.006, w.Above1kHzRmsA);
            Assert.Equal(0.004, w.Above9kHzRmsA);
        }
    }

    [Fact]
    public void AMergedRowIsPulsatingOrClippedWhenEitherRowIs()
    {
        // Closed form: "worst" of a flag is its logical or.
        var table = new TrendTable(50);
        var plain = WindowSlots.Result(0, 0.001);
        var pulsating = WindowSlots.Result(0.2, 0.001, pulsating: true);
        var clipped = WindowSlots.Result(0.2, 0.001, clipped: true);
        Assert.True(table.Worst(plain, pulsating).PulsatingDc);
        Assert.True(table.Worst(pulsating, plain).PulsatingDc);
        Assert.True(table.Worst(plain, clipped).Clipped);
        Assert.True(table.Worst(clipped, plain).Clipped);
        Assert.False(table.Worst(plain, plain).PulsatingDc || table.Worst(plain, plain).Clipped);
    }

    [Theory]
    // Signed figures keep the value of larger magnitude with its sign; of equal magnitudes the first, as numpy's
    // argmax (numpy 1.24: np.argmax(np.abs([0.004, -0.004])) = 0).
    [InlineData(0.003, -0.005, -0.005)]
    [InlineData(-0.005, 0.002, -0.005)]
    [InlineData(0.004, -0.004, 0.004)]
    public void ASignedFigureKeepsTheLargerMagnitudeWithItsSign(double aA, double bA, double expectedA)
    {
        var table = new TrendTable(50);
        var w = table.Worst(WindowSlots.Result(0, 0.001, dcA: aA, smoothDcA: aA),
            WindowSlots.Result(0.2, 0.001, dcA: bA, smoothDcA: bA));
        Assert.Equal(expectedA, w.DcA);
        Assert.Equal(expectedA, w.SmoothDcA);
    }

    [Theory]
    // The frequency furthest from nominal (50 Hz); of two equally far, the first (numpy 1.24:
    // np.argmax(np.abs(np.array([49.8, 50.2]) - 50)) = 0).
    [InlineData(49.8, 50.2, 49.8)]
    [InlineData(50.1, 49.7, 49.7)]
    [InlineData(50.4, 49.9, 50.4)]
    public void TheFrequencyIsTheOneFurthestFromNominal(double aHz, double bHz, double expectedHz)
    {
        var table = new TrendTable(50);
        var w = table.Worst(WindowSlots.Result(0, 0.001, frequencyHz: aHz), WindowSlots.Result(0.2, 0.001, frequencyHz: bHz));
        Assert.Equal(expectedHz, w.FrequencyHz);
    }

    [Theory]
    // Optional figures (delay angle, THD): the larger where both rows have one, else the one there is, else none.
    [InlineData(null, 12.0, 12.0)]
    [InlineData(15.0, null, 15.0)]
    [InlineData(20.0, 35.0, 35.0)]
    [InlineData(35.0, 20.0, 35.0)]
    [InlineData(null, null, null)]
    public void AnOptionalFigureIsTheLargerOfThosePresent(double? a, double? b, double? expected)
    {
        var table = new TrendTable(50);
        var w = table.Worst(WindowSlots.Result(0, 0.001) with { CurrentDelayAngleDeg = a, ThdPercent = a },
            WindowSlots.Result(0.2, 0.001) with { CurrentDelayAngleDeg = b, ThdPercent = b });
        Assert.Equal(expected, w.CurrentDelayAngleDeg);
        Assert.Equal(expected, w.ThdPercent);
    }

    [Fact]
    public void AfterTheFirstDecimationEachRowCoversTwoWindows()
    {
        // Closed form: 2000 rows of one window are full; the 2001st window halves them into 1000 rows of two, and
        // from then on rows of two windows: 2004 windows make 1002 rows of 0.4 s, back to back.
        var table = new TrendTable(50);
        for (var i = 0; i < 2004; i++)
        {
            table.Add(Window(i));
        }

        var rows = table.Result();
        Assert.Equal(1002, rows.Count);
        for (var r = 0; r < rows.Count; r++)
        {
            Assert.Equal(2 * r * WindowS, rows[r].StartS, 1e-9);
            Assert.Equal(2 * WindowS, rows[r].DurationS, 1e-9);
        }
    }

    [Fact]
    public void APartlyFilledLastRowIsReported()
    {
        // Closed form: 2001 windows are 1000 rows of two and a last row holding only window 2000 (0.2 s from 400 s).
        var table = new TrendTable(50);
        for (var i = 0; i < 2001; i++)
        {
            table.Add(Window(i));
        }

        var rows = table.Result();
        Assert.Equal(1001, rows.Count);
        Assert.Equal(2000 * WindowS, rows[^1].StartS, 1e-9);
        Assert.Equal(WindowS, rows[^1].DurationS, 1e-9);
        Assert.Equal(2 * WindowS, rows[^2].DurationS, 1e-9);
    }
}
