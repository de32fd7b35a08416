using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class ComplexDftTests
{
    [Fact]
    public void PowerOfTwoLengthMatchesMathNet()
    {
        // Reference: MathNet.Numerics Fourier.Forward with FourierOptions.Matlab (unscaled, e^{-i} convention).
        var (re, im, data) = ReferenceDft.Random(64, 3, offset: 0);

        new ComplexDft(64).Forward(re, im);
        ReferenceDft.MathNetForward(data);
        for (var i = 0; i < 64; i++)
        {
            Assert.Equal(data[i].Real, re[i], 1e-10);
            Assert.Equal(data[i].Imaginary, im[i], 1e-10);
        }
    }

    [Theory]
    [InlineData(7)]
    [InlineData(17)]
    [InlineData(999)]
    [InlineData(1001)]
    [InlineData(5003)]
    [InlineData(10007)]
    public void BluesteinLengthsMatchMathNet(int length)
    {
        // Reference: MathNet.Numerics Fourier.Forward with FourierOptions.Matlab (unscaled, e^{-i} convention), for
        // lengths that are not q·2^k and so go through the chirp-z convolution (10 007 is prime, 5 003 the odd half of
        // a 10 006-sample window). 1e-9 absolute: sums of O(length) values of order 1 in double.
        var (re, im, data) = ReferenceDft.Random(length, length + 5);
        var dft = new ComplexDft(length);
        Assert.False(MixedRadixFft.Supports(length));
        dft.Forward(re, im);
        ReferenceDft.MathNetForward(data);
        for (var i = 0; i < length; i++)
        {
            Assert.Equal(data[i].Real, re[i], 1e-9);
            Assert.Equal(data[i].Imaginary, im[i], 1e-9);
        }

        // The plan is reused: a second transform of other data on the same instance matches as well.
        var (re2, im2, data2) = ReferenceDft.Random(length, length + 6);
        dft.Forward(re2, im2);
        ReferenceDft.MathNetForward(data2);
        for (var i = 0; i < length; i += 13)
        {
            Assert.Equal(data2[i].Real, re2[i], 1e-9);
            Assert.Equal(data2[i].Imaginary, im2[i], 1e-9);
        }
    }
}
