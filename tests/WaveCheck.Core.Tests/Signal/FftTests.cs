using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class FftTests
{
    // Reference: the plain O(n²) DFT X_k = Σ x_j e^{-2πi jk/n}, summed directly, for one bin.
    private static Complex NaiveDft(double[] x, int k)
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

    // Every binStep-th bin of the power spectrum of seeded random data against the plain DFT.
    private static void AssertPowerMatchesPlainDft(int length, int binStep)
    {
        var random = new Random(length);
        var x = new double[length];
        for (var i = 0; i < length; i++)
        {
            x[i] = random.NextDouble() - 0.3;
        }

        var spectrum = new RealSpectrum(length);
        var power = new double[spectrum.BinCount];
        spectrum.Power(x, power);
        for (var k = 0; k < spectrum.BinCount; k += binStep)
        {
            var reference = NaiveDft(x, k);
            var weight = k == 0 || (length % 2 == 0 && k == length / 2) ? 1.0 : 2.0;
            var expected = weight * reference.Magnitude * reference.Magnitude / ((double)length * length);
            // 1e-12 of the window's mean square: double rounding of O(n log n) butterflies.
            Assert.Equal(expected, power[k], 1e-12);
        }
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(16)]
    [InlineData(17)]
    [InlineData(100)]
    [InlineData(999)]
    [InlineData(1000)]
    [InlineData(1001)]
    public void PowerMatchesPlainDft(int length) => AssertPowerMatchesPlainDft(length, 1);

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(5)]
    [InlineData(6)]
    [InlineData(10)]
    [InlineData(12)]
    [InlineData(20)]
    [InlineData(40)]
    [InlineData(96)]
    [InlineData(160)]
    [InlineData(3072)]
    [InlineData(10240)]
    public void MixedRadixMatchesMathNet(int length)
    {
        // Reference: MathNet.Numerics Fourier.Forward with FourierOptions.Matlab (unscaled, e^{-i} convention), which
        // uses its own Bluestein path for these lengths. 1e-9 absolute: sums of O(length) values of order 1 in double.
        var random = new Random(length);
        var re = new double[length];
        var im = new double[length];
        var data = new Complex[length];
        for (var i = 0; i < length; i++)
        {
            re[i] = random.NextDouble() - 0.5;
            im[i] = random.NextDouble() - 0.5;
            data[i] = new Complex(re[i], im[i]);
        }

        Assert.True(MixedRadixFft.Supports(length));
        new MixedRadixFft(length).Forward(re, im);
        MathNet.Numerics.IntegralTransforms.Fourier.Forward(data, MathNet.Numerics.IntegralTransforms.FourierOptions.Matlab);
        for (var i = 0; i < length; i++)
        {
            Assert.Equal(data[i].Real, re[i], 1e-9);
            Assert.Equal(data[i].Imaginary, im[i], 1e-9);
        }
    }

    [Theory]
    [InlineData(8)]
    [InlineData(16)]
    [InlineData(64)]
    [InlineData(1024)]
    [InlineData(12)]
    [InlineData(24)]
    [InlineData(96)]
    [InlineData(3072)]
    [InlineData(20)]
    [InlineData(40)]
    [InlineData(10240)]
    [InlineData(20480)]
    public void PermutedPairAppliesTheDftTwice(int length)
    {
        // Closed form: the DFT applied twice gives n·x[(−j) mod n]. ForwardToPermuted then ForwardFromPermuted is
        // exactly that composition, whatever order the spectrum is kept in between (the convolution path's pair).
        var random = new Random(length + 1);
        var re = new double[length];
        var im = new double[length];
        for (var i = 0; i < length; i++)
        {
            re[i] = random.NextDouble() - 0.5;
            im[i] = random.NextDouble() - 0.5;
        }

        var (xr, xi) = ((double[])re.Clone(), (double[])im.Clone());
        var fft = new MixedRadixFft(length);
        fft.ForwardToPermuted(re, im);
        fft.ForwardFromPermuted(re, im);
        for (var j = 0; j < length; j++)
        {
            var from = (length - j) % length;
            Assert.Equal(length * xr[from], re[j], 1e-9);
            Assert.Equal(length * xi[from], im[j], 1e-9);
        }
    }

    [Theory]
    [InlineData(9999, 10240)]
    [InlineData(10005, 10240)]
    [InlineData(10241, 12288)]
    [InlineData(20013, 20480)]
    [InlineData(4097, 5120)]
    [InlineData(8, 8)]
    public void BluesteinLengthIsTheSmallestSupported(int least, int expected)
    {
        // Closed form: the smallest of 2^a, 3·2^b, 5·2^c at or above the least length (checked by hand).
        Assert.Equal(expected, MixedRadixFft.AtLeast(least));
    }

    [Theory]
    [InlineData(10000)]
    [InlineData(10008)]
    [InlineData(12000)]
    [InlineData(8333)]
    [InlineData(10007)]
    [InlineData(10006)]
    public void WindowLengthsMatchPlainDft(int length) =>
        // The window lengths the analysis meets at 50 kS/s (10 000 ± a few, 10 006 at 49.97 Hz), 60 Hz (8 333) and a
        // prime (10 007); every 7th bin keeps the O(n²) reference quick.
        AssertPowerMatchesPlainDft(length, 7);

    [Theory]
    [InlineData(10000)]
    [InlineData(10001)]
    [InlineData(8192)]
    [InlineData(10006)]
    [InlineData(10007)]
    [InlineData(12000)]
    [InlineData(8333)]
    public void BinsSumToMeanSquare(int length)
    {
        // Parseval: Σ_k C_k² over the one-sided spectrum equals the window's mean square.
        var random = new Random(7);
        var x = new double[length];
        var meanSquare = 0.0;
        for (var i = 0; i < length; i++)
        {
            x[i] = random.NextDouble() * 2 - 0.5;
            meanSquare += x[i] * x[i] / length;
        }

        var spectrum = new RealSpectrum(length);
        var power = new double[spectrum.BinCount];
        spectrum.Power(x, power);
        var total = 0.0;
        foreach (var p in power)
        {
            total += p;
        }

        Assert.Equal(meanSquare, total, 1e-10 * meanSquare);
    }

    [Fact]
    public void RadixTwoMatchesMathNet()
    {
        // Reference: MathNet.Numerics Fourier.Forward with FourierOptions.Matlab (unscaled, e^{-i} convention).
        var random = new Random(3);
        var re = new double[64];
        var im = new double[64];
        var data = new Complex[64];
        for (var i = 0; i < 64; i++)
        {
            re[i] = random.NextDouble();
            im[i] = random.NextDouble();
            data[i] = new Complex(re[i], im[i]);
        }

        new ComplexDft(64).Forward(re, im);
        MathNet.Numerics.IntegralTransforms.Fourier.Forward(data, MathNet.Numerics.IntegralTransforms.FourierOptions.Matlab);
        for (var i = 0; i < 64; i++)
        {
            Assert.Equal(data[i].Real, re[i], 1e-10);
            Assert.Equal(data[i].Imaginary, im[i], 1e-10);
        }
    }

    [Theory]
    [InlineData(1001)]
    [InlineData(1000)]
    public void PairOfWindowsMatchesTwoSingleTransforms(int length)
    {
        // Reference: the plain DFT of each window (via PowerMatchesPlainDft's checked single-window path).
        var random = new Random(11);
        var a = new double[length];
        var b = new double[length];
        for (var i = 0; i < length; i++)
        {
            a[i] = random.NextDouble();
            b[i] = random.NextDouble() - 0.5;
        }

        var spectrum = new RealSpectrum(length);
        var pa = new double[spectrum.BinCount];
        var pb = new double[spectrum.BinCount];
        var sa = new double[spectrum.BinCount];
        var sb = new double[spectrum.BinCount];
        spectrum.PowerPair(a, b, pa, pb);
        spectrum.Power(a, sa);
        spectrum.Power(b, sb);
        for (var k = 0; k < spectrum.BinCount; k++)
        {
            Assert.Equal(sa[k], pa[k], 1e-13);
            Assert.Equal(sb[k], pb[k], 1e-13);
        }
    }

    [Fact]
    public void RejectsWrongLength()
    {
        var spectrum = new RealSpectrum(10);
        var ex = Assert.Throws<ArgumentException>(() => spectrum.Power(new double[9], new double[6]));
        Assert.Contains("expected 10 samples, got 9", ex.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => new RealSpectrum(1));
    }
}
