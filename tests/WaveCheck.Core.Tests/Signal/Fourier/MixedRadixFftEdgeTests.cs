using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class MixedRadixFftEdgeTests
{
    [Theory]
    [InlineData(7)]
    [InlineData(9)]
    [InlineData(15)]
    [InlineData(0)]
    [InlineData(-3)]
    public void RejectsLengthsThatAreNotQTimesAPowerOfTwo(int length)
    {
        // The documented range: 2^k, 3·2^k or 5·2^k; the message says so and the value given travels with it.
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new MixedRadixFft(length));
        Assert.Equal("length", ex.ParamName);
        Assert.Equal(length, ex.ActualValue);
        Assert.Contains("length must be 2^k, 3·2^k or 5·2^k", ex.Message);
    }

    [Theory]
    [InlineData(1, 1)]
    [InlineData(3, 3)]
    [InlineData(5, 5)]
    [InlineData(6, 6)]
    [InlineData(12, 12)]
    [InlineData(20, 20)]
    [InlineData(24, 24)]
    [InlineData(40, 40)]
    [InlineData(48, 48)]
    [InlineData(13, 16)]
    [InlineData(17, 20)]
    [InlineData(25, 32)]
    [InlineData(33, 40)]
    [InlineData(41, 48)]
    public void AtLeastKeepsASupportedLengthAndRoundsUpOthers(int least, int expected)
    {
        // Closed form: the smallest of 2^a, 3·2^b, 5·2^c at or above the least length (listed by hand: 13 → 16,
        // 17 → 20, 25 → 32, 33 → 40, 41 → 48); a supported length is its own answer.
        Assert.Equal(expected, MixedRadixFft.AtLeast(least));
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(5)]
    [InlineData(6)]
    [InlineData(10)]
    public void PermutedPairAppliesTheDftTwiceOnShortBlocks(int length)
    {
        // Closed form: the DFT applied twice gives n·x[(−j) mod n]. Blocks of 1 or 2 points are shorter than a
        // vector, so both halves of the pair take the plain q-point DFT with its twiddles (on the input for the
        // transposed half, on the output for the forward half).
        var (re, im, _) = ReferenceDft.Random(length, length + 40);
        var (xr, xi) = ((double[])re.Clone(), (double[])im.Clone());
        var fft = new MixedRadixFft(length);
        fft.ForwardToPermuted(re, im);
        fft.ForwardFromPermuted(re, im);
        for (var j = 0; j < length; j++)
        {
            var from = (length - j) % length;
            // 1e-12 absolute: a handful of products of order-1 values.
            Assert.Equal(length * xr[from], re[j], 1e-12);
            Assert.Equal(length * xi[from], im[j], 1e-12);
        }
    }

    [Theory]
    [InlineData(3072)]
    [InlineData(5120)]
    public void ForwardReusesItsScratchAcrossCalls(int length)
    {
        // Reference: MathNet.Numerics Fourier.Forward with FourierOptions.Matlab, on two data sets through one plan;
        // the second call allocates nothing (the plan keeps its reorder buffer: "built once per length and reused").
        var fft = new MixedRadixFft(length);
        var (re, im, data) = ReferenceDft.Random(length, 1);
        fft.Forward(re, im);
        var (re2, im2, data2) = ReferenceDft.Random(length, 2);
        var before = GC.GetAllocatedBytesForCurrentThread();
        fft.Forward(re2, im2);
        var allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        // Under 1 KiB: far below one 8·length-byte buffer.
        Assert.True(allocated < 1024, $"allocated {allocated} bytes");
        ReferenceDft.MathNetForward(data);
        ReferenceDft.MathNetForward(data2);
        for (var k = 0; k < length; k += 7)
        {
            // 1e-9 absolute: sums of O(length) values of order 1 in double.
            Assert.Equal(data[k].Real, re[k], 1e-9);
            Assert.Equal(data[k].Imaginary, im[k], 1e-9);
            Assert.Equal(data2[k].Real, re2[k], 1e-9);
            Assert.Equal(data2[k].Imaginary, im2[k], 1e-9);
        }
    }
}
