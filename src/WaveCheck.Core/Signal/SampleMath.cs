using System.Numerics;
using System.Runtime.CompilerServices;

namespace WaveCheck.Core.Signal;

/// <summary>Vectorised reductions over blocks of samples (sum, sum of squares, extremes). Stateless.</summary>
public static class SampleMath
{
    /// <summary>Smallest and largest value; (+∞, −∞) for an empty span.</summary>
    public static (double Min, double Max) MinMax(ReadOnlySpan<double> values)
    {
        var (_, _, min, max) = Moments(values, false);
        return (min, max);
    }

    /// <summary>Sum, sum of squares, smallest and largest value in one pass.</summary>
    public static (double Sum, double SumSquares, double Min, double Max) Moments(ReadOnlySpan<double> values) =>
        Moments(values, true);

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static (double Sum, double SumSquares, double Min, double Max) Moments(ReadOnlySpan<double> values,
        bool sums)
    {
        double sum = 0, squares = 0;
        var min = double.PositiveInfinity;
        var max = double.NegativeInfinity;
        var i = 0;
        var width = Vector<double>.Count;
        if (Vector.IsHardwareAccelerated && values.Length >= 2 * width)
        {
            var vSum = Vector<double>.Zero;
            var vSquares = Vector<double>.Zero;
            var vMin = new Vector<double>(double.PositiveInfinity);
            var vMax = new Vector<double>(double.NegativeInfinity);
            for (; i <= values.Length - width; i += width)
            {
                var v = new Vector<double>(values.Slice(i, width));
                if (sums)
                {
                    vSum += v;
                    vSquares += v * v;
                }

                vMin = Vector.Min(vMin, v);
                vMax = Vector.Max(vMax, v);
            }

            for (var j = 0; j < width; j++)
            {
                sum += vSum[j];
                squares += vSquares[j];
                min = Math.Min(min, vMin[j]);
                max = Math.Max(max, vMax[j]);
            }
        }

        for (; i < values.Length; i++)
        {
            var v = values[i];
            sum += v;
            squares += v * v;
            min = Math.Min(min, v);
            max = Math.Max(max, v);
        }

        return (sum, squares, min, max);
    }
}
