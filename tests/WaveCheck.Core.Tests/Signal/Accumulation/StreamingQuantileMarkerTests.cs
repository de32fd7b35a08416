using System.Runtime.CompilerServices;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="StreamingQuantile"/>'s P² markers step by step, its switch from the exact answer to the estimate, and its
/// argument checks. The marker references come from the algorithm box of Jain and Chlamtac, "The P² algorithm for
/// dynamic calculation of quantiles and histograms without storing observations", CACM 28(10), 1985, transcribed
/// independently into Python 3 (double precision, the same order of operations) and printed with repr; the streams are
/// built from integer arithmetic so that both sides see the same doubles.
/// </summary>
public class StreamingQuantileMarkerTests
{
    [UnsafeAccessor(UnsafeAccessorKind.Field, Name = "_height")]
    private static extern ref double[] Heights(StreamingQuantile quantile);

    [UnsafeAccessor(UnsafeAccessorKind.Field, Name = "_position")]
    private static extern ref double[] Positions(StreamingQuantile quantile);

    private static StreamingQuantile Fed(double p, IEnumerable<double> values)
    {
        var quantile = new StreamingQuantile(p);
        foreach (var value in values)
        {
            quantile.Add(value);
        }

        return quantile;
    }

    private static void AssertMarkers(StreamingQuantile quantile, double[] heights, double[] positions)
    {
        // The transcription repeats the arithmetic in the same order, so the markers agree to rounding; 1e-12
        // relative leaves room for a different but equally rounded evaluation.
        var h = Heights(quantile);
        for (var i = 0; i < 5; i++)
        {
            Assert.Equal(heights[i], h[i], 1e-12 * Math.Max(1, Math.Abs(heights[i])));
        }

        Assert.Equal(positions, Positions(quantile));
    }

    [Fact]
    public void Markers_after_the_twenty_observations_of_the_papers_example()
    {
        // The 20 observations of the paper's worked example, median (p = 0.5): 14 marker moves (9 up, 5 down), two new
        // maxima, no linear fallback. Reference: the Python transcription (see the class comment).
        double[] values = [0.02, 0.5, 0.74, 3.39, 0.83, 22.37, 10.15, 15.43, 38.62, 15.92, 34.60, 10.28, 1.47, 0.40, 0.05, 11.39, 0.27, 0.42, 0.09, 11.37];
        var quantile = Fed(0.5, values);
        AssertMarkers(quantile, [0.02, 0.154192220568783, 4.2462394088036435, 17.55589096395503, 38.62], [1, 6, 10, 16, 20]);

        // While 4096 or fewer values have been seen the answer is the exact order statistic (numpy.percentile's linear
        // rule): the median of 20 values is the mean of the 10th and 11th smallest, (1.47 + 3.39) / 2.
        Assert.Equal((1.47 + 3.39) / 2, quantile.Value, 1e-12);
    }

    [Fact]
    public void Ties_at_the_lowest_marker_fall_in_the_cell_above_the_tie()
    {
        // The paper places x in cell k when q_k ≤ x < q_k+1: a value equal to several tied markers belongs above all of
        // them, so fewer positions move than if it were put in the first cell. Reference: the Python transcription.
        var quantile = Fed(0.5, [0, 0, 0, 1, 2, 0, 0, 0, 2, 2, 1, 0]);
        AssertMarkers(quantile, [0, 0.027777777777777776, 0.4965277777777778, 1.4020833333333333, 2], [1, 4, 7, 9, 12]);
    }

    [Fact]
    public void Integer_values_with_ties_exercise_the_linear_fallback()
    {
        // x_i = 7i mod 10 for i < 5000, p = 0.95: 611 of the 1313 marker moves take the linear formula because the
        // parabola leaves the neighbours' interval (ties make it do so). Reference: the Python transcription.
        var quantile = Fed(0.95, Enumerable.Range(0, 5000).Select(i => (double)(i * 7 % 10)));
        AssertMarkers(quantile, [0, 4.001895308532174, 8.999998576330967, 8.999999999986732, 9], [1, 2376, 4750, 4875, 5000]);
        Assert.Equal(8.999998576330967, quantile.Value, 1e-12);
    }

    private static IEnumerable<double> Scrambled() => Enumerable.Range(0, 6000).Select(i =>
        i % 89 == 0 ? -50.0 : i % 97 == 0 ? 50.0 : (i * 7919 % 10007) / 10007.0);

    [Theory]
    [InlineData(0.1, new[] { -50.0, -0.06207999665785147, 0.08865331644861117, 0.5460030508944154, 50.0 }, new[] { 1.0, 300, 600, 3301, 6000 })]
    [InlineData(0.9, new[] { -50.0, 0.44645385517652963, 0.9065058114769032, 0.9879908879235064, 50.0 }, new[] { 1.0, 2701, 5400, 5700, 6000 })]
    public void Scrambled_values_with_outliers_give_the_transcriptions_markers(double p, double[] heights, double[] positions)
    {
        // (7919 i mod 10007) / 10007 with ±50 every 89th/97th value, 6000 values: both directions of marker move and the
        // linear fallback (206 and 173 times). Past 4096 values the answer is the middle marker. Reference: the Python
        // transcription.
        var quantile = Fed(p, Scrambled());
        AssertMarkers(quantile, heights, positions);
        Assert.Equal(heights[2], quantile.Value, 1e-12);
    }

    [Fact]
    public void A_falling_stream_moves_the_lowest_marker()
    {
        // (7919 i mod 10007) / 10007 − i / 1000, p = 0.25: 212 new minima and 9159 downward moves. Reference: the
        // Python transcription.
        var quantile = Fed(0.25, Enumerable.Range(0, 6000).Select(i => ((i * 7919 % 10007) / 10007.0) - (i / 1000.0)));
        AssertMarkers(quantile, [-5.956803637453782, -5.068054017149506, -4.203667809303997, -2.3551741075866497, 0.9683053862296392],
            [1, 751, 1501, 3751, 6000]);
    }

    [Fact]
    public void The_answer_stays_exact_up_to_the_capacity_and_is_the_estimate_after_it()
    {
        // Exact: numpy.percentile(x, 95) with its default linear rule (numpy 1.24.2), here the closed form for
        // x = 0..n−1, whose p-quantile is p·(n − 1). At n = 4096 = ExactCapacity that still holds; one value more and
        // the middle P² marker answers, which for this stream is not the exact value (0.95·4096 = 3891.2).
        var quantile = Fed(0.95, Enumerable.Range(0, StreamingQuantile.ExactCapacity).Select(i => (double)i));
        Assert.Equal(0.95 * (StreamingQuantile.ExactCapacity - 1), quantile.Value, 1e-9);
        quantile.Add(StreamingQuantile.ExactCapacity);
        Assert.Equal(Heights(quantile)[2], quantile.Value);
        Assert.NotEqual(0.95 * StreamingQuantile.ExactCapacity, quantile.Value, 1e-9);
    }

    [Fact]
    public void NaN_is_not_counted()
    {
        // Documented behaviour: NaN is ignored (common practice, no source: a missing value carries no rank).
        var quantile = Fed(0.5, [1, 2, double.NaN, 3]);
        Assert.Equal(3, quantile.Count);
        Assert.Equal(2, quantile.Value);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(1.0)]
    [InlineData(-0.1)]
    [InlineData(double.NaN)]
    public void A_quantile_outside_the_open_interval_is_refused_with_the_reason(double p)
    {
        // The p-quantile is defined for 0 < p < 1 in the paper; the ends are the extremes, not quantiles to estimate.
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => new StreamingQuantile(p));
        Assert.Equal("p", e.ParamName);
        Assert.Contains("strictly between 0 and 1", e.Message);
    }
}
