using OxyPlot;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// Thins a polyline for drawing without losing an extreme: the points are cut into equal buckets along a screen-linear
/// x (linear or log) and each bucket keeps its lowest and highest point, in x order. Layout only: values are not changed.
/// </summary>
internal static class MinMaxThinning
{
    /// <summary>Adds <paramref name="source"/> to <paramref name="target"/>, thinned to at most two points per bucket when it
    /// holds more than <paramref name="buckets"/> × 2 points.</summary>
    /// <param name="source">Points in ascending x.</param>
    /// <param name="target">Where the kept points go.</param>
    /// <param name="buckets">Buckets across the x range (about the plot width in pixels).</param>
    /// <param name="logX">True when the x axis is logarithmic (buckets equal in log x; x must be positive).</param>
    public static void Add(IReadOnlyList<DataPoint> source, List<DataPoint> target, int buckets, bool logX)
    {
        if (source.Count <= 2 * buckets)
        {
            target.AddRange(source);
            return;
        }

        var first = Scale(source[0].X, logX);
        var span = Scale(source[^1].X, logX) - first;
        if (!(span > 0))
        {
            target.AddRange(source);
            return;
        }

        var bucket = -1;
        DataPoint low = default, high = default;
        foreach (var point in source)
        {
            var index = Math.Min(buckets - 1, (int)((Scale(point.X, logX) - first) / span * buckets));
            if (index != bucket)
            {
                Flush(target, bucket, low, high);
                bucket = index;
                low = point;
                high = point;
                continue;
            }

            if (point.Y < low.Y)
            {
                low = point;
            }

            if (point.Y > high.Y)
            {
                high = point;
            }
        }

        Flush(target, bucket, low, high);
    }

    private static void Flush(List<DataPoint> target, int bucket, DataPoint low, DataPoint high)
    {
        if (bucket < 0)
        {
            return;
        }

        if (low.X == high.X && low.Y == high.Y)
        {
            target.Add(low);
        }
        else if (low.X <= high.X)
        {
            target.Add(low);
            target.Add(high);
        }
        else
        {
            target.Add(high);
            target.Add(low);
        }
    }

    private static double Scale(double x, bool logX) => logX ? Math.Log10(x) : x;
}
