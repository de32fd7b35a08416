using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class Radix2FftTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(4)]
    [InlineData(8)]
    [InlineData(16)]
    [InlineData(32)]
    [InlineData(256)]
    [InlineData(4096)]
    [InlineData(8192)]
    public void ForwardMatchesMathNet(int length)
    {
        // Reference: MathNet.Numerics Fourier.Forward with FourierOptions.Matlab (unscaled, e^{-i} convention). The
        // lengths reach every path: scalar stages, whole-vector stages, the paired radix-4 passes, odd and even stage
        // counts. 1e-9 absolute: sums of O(length) values of order 1 in double.
        var (re, im, data) = ReferenceDft.Random(length, length + 2);
        new Radix2Fft(length).Forward(re, im);
        ReferenceDft.MathNetForward(data);
        for (var i = 0; i < length; i++)
        {
            Assert.Equal(data[i].Real, re[i], 1e-9);
            Assert.Equal(data[i].Imaginary, im[i], 1e-9);
        }
    }

    [Theory]
    [InlineData(2)]
    [InlineData(4)]
    [InlineData(8)]
    [InlineData(64)]
    [InlineData(512)]
    [InlineData(2048)]
    public void BitReversedPairAppliesTheDftTwice(int length)
    {
        // Closed form: the DFT applied twice gives n·x[(−j) mod n]. ForwardToBitReversed leaves the spectrum in
        // bit-reversed order and ForwardFromBitReversed takes that order, so the pair is exactly that composition.
        var (re, im, _) = ReferenceDft.Random(length, length + 3);
        var (xr, xi) = ((double[])re.Clone(), (double[])im.Clone());
        var fft = new Radix2Fft(length);
        fft.ForwardToBitReversed(re, im);
        fft.ForwardFromBitReversed(re, im);
        for (var j = 0; j < length; j++)
        {
            var from = (length - j) % length;
            Assert.Equal(length * xr[from], re[j], 1e-9);
            Assert.Equal(length * xi[from], im[j], 1e-9);
        }
    }

    [Theory]
    [InlineData(0)]
    [InlineData(3)]
    [InlineData(10000)]
    public void RejectsLengthsThatAreNotPowersOfTwo(int length)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new Radix2Fft(length));
        Assert.Contains("power of two", ex.Message);
    }
}
