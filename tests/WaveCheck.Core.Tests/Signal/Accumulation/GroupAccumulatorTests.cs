using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>Per-index mean square and largest value over windows, against the closed form of an RMS over equal windows.</summary>
public class GroupAccumulatorTests
{
    [Fact]
    public void IndicesNoWindowSawAreNaN()
    {
        // Documented: NaN where no window could see it, for the RMS and the maximum alike.
        var acc = new GroupAccumulator(3);
        acc.Add(1, 4);
        Assert.True(double.IsNaN(acc.Rms(0)) && double.IsNaN(acc.Max(0)));
        Assert.True(double.IsNaN(acc.Rms(2)) && double.IsNaN(acc.Max(2)));
        Assert.Equal(2, acc.Rms(1));
    }

    [Fact]
    public void OneWindowGivesItsOwnRms()
    {
        // Closed form: one window of mean square m has RMS and maximum √m; also for m = 0 (seen, so 0, not NaN).
        var acc = new GroupAccumulator(2);
        acc.Add(0, 6.25);
        acc.Add(1, 0);
        Assert.Equal(2.5, acc.Rms(0));
        Assert.Equal(2.5, acc.Max(0));
        Assert.Equal(0, acc.Rms(1));
        Assert.Equal(0, acc.Max(1));
    }

    [Theory]
    [InlineData(new[] { 1.0, 4, 9, 16 })]
    [InlineData(new[] { 16.0, 9, 4, 1 })]
    [InlineData(new[] { 4.0, 16, 1, 9 })]
    public void RmsOverWindowsIsTheRootOfTheMeanOfMeanSquares(double[] meanSquares)
    {
        // Closed form: equal windows of RMS 1, 2, 3, 4 A hold the energy of one record of RMS √((1+4+9+16)/4) = √7.5 A;
        // the largest window reads 4 A whatever the order. Exact for these small integers up to one sqrt rounding.
        var acc = new GroupAccumulator(5);
        foreach (var m in meanSquares)
        {
            acc.Add(4, m);
        }

        Assert.Equal(Math.Sqrt(7.5), acc.Rms(4), 1e-15);
        Assert.Equal(4, acc.Max(4));
    }

    [Fact]
    public void IndicesAccumulateIndependently()
    {
        // Closed form per index: index 0 gets 9 and 1 (RMS √5, max 3), the last index 2 gets 0.25 (RMS 0.5).
        var acc = new GroupAccumulator(3);
        acc.Add(0, 9);
        acc.Add(2, 0.25);
        acc.Add(0, 1);
        Assert.Equal(Math.Sqrt(5), acc.Rms(0), 1e-15);
        Assert.Equal(3, acc.Max(0));
        Assert.Equal(0.5, acc.Rms(2));
        Assert.Equal(0.5, acc.Max(2));
        Assert.True(double.IsNaN(acc.Rms(1)));
    }

    [Fact]
    public void IndicesOutsideTheSizeAreRejected()
    {
        // Boundary: valid indices are 0 .. size − 1 (array semantics).
        var acc = new GroupAccumulator(2);
        Assert.Throws<IndexOutOfRangeException>(() => acc.Add(2, 1));
        Assert.Throws<IndexOutOfRangeException>(() => acc.Add(-1, 1));
        Assert.Throws<IndexOutOfRangeException>(() => acc.Rms(2));
        Assert.Throws<IndexOutOfRangeException>(() => acc.Max(2));
    }
}
