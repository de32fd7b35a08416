using System.Numerics;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>The references the transforms are checked against: the plain O(n²) DFT and MathNet.Numerics.</summary>
internal static class ReferenceDft
{
    // Reference: the plain O(n²) DFT X_k = Σ x_j e^{-2πi jk/n}, summed directly, for one bin.
    public static Complex Bin(double[] x, int k)
    {
        var n = x.Length;
        var sum = Complex.Zero;
        for (var j = 0; j < n; j++)
        {
            var angle = -2 * Math.PI * ((long)j * k % n) / n;
            sum += x[j] * new Complex(Math.Cos(angle), Math.Sin(angle));
        }

        return sum;
    }

    /// <summary>Seeded random complex data as split arrays and as MathNet's complex array.</summary>
    public static (double[] Re, double[] Im, Complex[] Data) Random(int length, int seed, double offset = 0.5)
    {
        var random = new Random(seed);
        var re = new double[length];
        var im = new double[length];
        var data = new Complex[length];
        for (var i = 0; i < length; i++)
        {
            re[i] = random.NextDouble() - offset;
            im[i] = random.NextDouble() - offset;
            data[i] = new Complex(re[i], im[i]);
        }

        return (re, im, data);
    }

    /// <summary>MathNet.Numerics Fourier.Forward with FourierOptions.Matlab (unscaled, e^{-i} convention), in place.</summary>
    public static void MathNetForward(Complex[] data) =>
        MathNet.Numerics.IntegralTransforms.Fourier.Forward(data, MathNet.Numerics.IntegralTransforms.FourierOptions.Matlab);
}
