using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// The vectorised reductions against closed forms, at every length around the vector path's limits (one and two
/// vector widths, with and without a scalar tail) and with the extremes in every lane and in the tail.
/// </summary>
public class SampleMathTests
{
    // Lengths 0 .. 3 widths + 3: below, at and above 2 x width (where the vector path starts), whole multiples of the
    // width (no scalar tail) and every tail length. The width is the hardware's (2, 4 or 8 doubles).
    public static TheoryData<int> Lengths()
    {
        var data = new TheoryData<int>();
        for (var n = 0; n <= (3 * Vector<double>.Count) + 3; n++)
        {
            data.Add(n);
        }

        return data;
    }

    [Fact]
    public void EmptySpanGivesZeroSumsAndInfiniteExtremes()
    {
        // Documented edge case: (+∞, −∞) for an empty span; sums of nothing are 0 (closed form).
        Assert.Equal((0.0, 0.0, double.PositiveInfinity, double.NegativeInfinity), SampleMath.Moments([]));
        Assert.Equal((double.PositiveInfinity, double.NegativeInfinity), SampleMath.MinMax([]));
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void RampMomentsMatchTheirClosedForms(int n)
    {
        // Closed form for x_k = k + 1, k = 0 .. n−1: Σx = n(n+1)/2, Σx² = n(n+1)(2n+1)/6, min 1, max n; and the
        // mirror −x_k: Σ changes sign, Σx² does not, min −n, max −1. Small integers: every sum is exact in any
        // order, so equality is exact.
        var up = new double[n];
        var down = new double[n];
        for (var k = 0; k < n; k++)
        {
            up[k] = k + 1;
            down[k] = -(k + 1);
        }

        double sum = n * (n + 1) / 2, squares = n * (n + 1) * ((2 * n) + 1) / 6;
        double lo = n == 0 ? double.PositiveInfinity : 1, hi = n == 0 ? double.NegativeInfinity : n;
        Assert.Equal((sum, squares, lo, hi), SampleMath.Moments(up));
        Assert.Equal((lo, hi), SampleMath.MinMax(up));
        var (negLo, negHi) = n == 0 ? (lo, hi) : (-hi, -lo);
        Assert.Equal((-sum, squares, negLo, negHi), SampleMath.Moments(down));
        Assert.Equal((negLo, negHi), SampleMath.MinMax(down));
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void ExtremesAreFoundInEveryPosition(int n)
    {
        // Closed form: zeros with +5 at position p and −3 at position q ≠ p read min −3, max 5, Σ 2, Σx² 34,
        // wherever p and q fall (any vector lane, the scalar tail, the first or last sample).
        if (n < 2)
        {
            return;
        }

        for (var p = 0; p < n; p++)
        {
            var q = (p + 1 + (n / 2)) % n;
            if (q == p)
            {
                q = (p + 1) % n;
            }

            var x = new double[n];
            x[p] = 5;
            x[q] = -3;
            Assert.Equal((2.0, 34.0, -3.0, 5.0), SampleMath.Moments(x));
            Assert.Equal((-3.0, 5.0), SampleMath.MinMax(x));
        }
    }

    [Fact]
    public void SingleSampleIsBothExtremes()
    {
        // Closed form: one sample v gives Σ v, Σx² v², min = max = v.
        Assert.Equal((-2.5, 6.25, -2.5, -2.5), SampleMath.Moments([-2.5]));
        Assert.Equal((-2.5, -2.5), SampleMath.MinMax([-2.5]));
    }

    [Fact]
    public void SineOverWholeCyclesHasZeroSumAndHalfThePeakSquaredPerSample()
    {
        // Closed form for A sin(2πk/N), k = 0 .. N−1 (N = 1000, A = 2): Σ = 0, Σx² = N A²/2, max A (k = N/4),
        // min −A (k = 3N/4). 1e-12 absolute on the sums: rounding of 1000 terms of order 1.
        const int n = 1000;
        const double a = 2;
        var x = new double[n];
        for (var k = 0; k < n; k++)
        {
            x[k] = a * Math.Sin(2 * Math.PI * k / n);
        }

        var (sum, squares, min, max) = SampleMath.Moments(x);
        Assert.Equal(0, sum, 1e-12);
        Assert.Equal(n * a * a / 2, squares, 1e-12);
        Assert.Equal(-a, min, 1e-15);
        Assert.Equal(a, max, 1e-15);
        Assert.Equal((min, max), SampleMath.MinMax(x));
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void NaNAnywhereMakesEveryFigureNaN(int n)
    {
        // IEEE 754 propagation, which TouchCurrentMeter relies on ("NaN samples make the figures NaN"): one NaN in
        // any lane or in the tail makes the sums and both extremes NaN.
        for (var p = 0; p < n; p++)
        {
            var x = new double[n];
            Array.Fill(x, 1.5);
            x[p] = double.NaN;
            var (sum, squares, min, max) = SampleMath.Moments(x);
            Assert.True(double.IsNaN(sum) && double.IsNaN(squares) && double.IsNaN(min) && double.IsNaN(max), $"n {n}, NaN at {p}");
            var (onlyMin, onlyMax) = SampleMath.MinMax(x);
            Assert.True(double.IsNaN(onlyMin) && double.IsNaN(onlyMax), $"MinMax, n {n}, NaN at {p}");
        }
    }
}
