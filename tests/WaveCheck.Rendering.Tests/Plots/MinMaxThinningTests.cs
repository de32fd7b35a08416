using OxyPlot;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Tests.Plots;

public sealed class MinMaxThinningTests
{
    [Fact]
    public void Long_lines_are_thinned_and_keep_every_extreme()
    {
        // 100 000 points of a sine with one spike: the spike and both sine extremes must survive (property check).
        var source = Enumerable.Range(0, 100_000).Select(i => new DataPoint(i, i == 61_234 ? 50 : Math.Sin(i / 5000.0))).ToList();
        var kept = new List<DataPoint>();

        MinMaxThinning.Add(source, kept, 1000, logX: false);

        Assert.InRange(kept.Count, 1000, 2000);
        Assert.Contains(new DataPoint(61_234, 50), kept);
        Assert.Equal(source.Min(p => p.Y), kept.Min(p => p.Y));
        Assert.Equal(source.Max(p => p.Y), kept.Max(p => p.Y));
        Assert.True(kept.Zip(kept.Skip(1)).All(p => p.First.X < p.Second.X), "x stays ascending");
    }

    [Fact]
    public void Short_lines_pass_unchanged()
    {
        var source = Enumerable.Range(1, 300).Select(i => new DataPoint(i, i % 7)).ToList();
        var kept = new List<DataPoint>();

        MinMaxThinning.Add(source, kept, 1000, logX: true);

        Assert.Equal(source, kept);
    }
}
