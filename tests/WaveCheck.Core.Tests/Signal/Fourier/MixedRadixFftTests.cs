using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class MixedRadixFftTests
{
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
        var (re, im, data) = ReferenceDft.Random(length, length);

        Assert.True(MixedRadixFft.Supports(length));
        new MixedRadixFft(length).Forward(re, im);
        ReferenceDft.MathNetForward(data);
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
}
