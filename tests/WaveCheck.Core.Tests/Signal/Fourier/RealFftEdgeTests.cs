using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class RealFftEdgeTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(0)]
    public void RejectsTooShortPlansWithTheRange(int length)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new RealFft(length));
        Assert.Equal("length", ex.ParamName);
        Assert.Contains("transform length must be at least 2 samples", ex.Message);
    }

    [Fact]
    public void RejectsWrongSampleCountWithBothCounts()
    {
        var fft = new RealFft(8);
        var ex = Assert.Throws<ArgumentException>(() => fft.Forward(new double[7], new double[5], new double[5]));
        Assert.Equal("samples", ex.ParamName);
        Assert.Contains("expected 8 samples, got 7", ex.Message);
    }

    [Theory]
    [InlineData(4, 5)]
    [InlineData(5, 4)]
    [InlineData(4, 4)]
    public void RejectsOutputsShorterThanTheBins(int reLength, int imLength)
    {
        // Either output span below BinCount = 5 is refused, the message giving the room needed and both lengths.
        var fft = new RealFft(8);
        var ex = Assert.Throws<ArgumentException>(() => fft.Forward(new double[8], new double[reLength], new double[imLength]));
        Assert.Equal("re", ex.ParamName);
        Assert.Contains($"expected room for 5 bins, got {reLength} and {imLength}", ex.Message);
    }

    [Theory]
    [InlineData(8)]
    [InlineData(9)]
    public void LongerOutputsTakeTheBinsAndKeepTheRest(int length)
    {
        // "At least BinCount values": spans longer than that are accepted; only the first BinCount are written.
        // Closed form: x = δ_0 gives X_k = 1 for every k.
        var fft = new RealFft(length);
        var x = new double[length];
        x[0] = 1;
        var re = Enumerable.Repeat(-7.0, fft.BinCount + 2).ToArray();
        var im = Enumerable.Repeat(-7.0, fft.BinCount + 3).ToArray();
        fft.Forward(x, re, im);
        for (var k = 0; k < fft.BinCount; k++)
        {
            Assert.Equal(1.0, re[k], 1e-15);
            Assert.Equal(0.0, im[k], 1e-15);
        }

        Assert.All(re[fft.BinCount..], v => Assert.Equal(-7.0, v));
        Assert.All(im[fft.BinCount..], v => Assert.Equal(-7.0, v));
    }

    [Fact]
    public void LengthTwoAndThreeMatchTheirClosedForms()
    {
        // Closed form: n = 2 gives X_0 = a + b, X_1 = a − b; n = 3 gives X_0 = a + b + c and
        // X_1 = a − (b + c)/2 − i·(√3/2)(b − c).
        var (re, im) = (new double[2], new double[2]);
        new RealFft(2).Forward([0.75, -2.5], re, im);
        Assert.Equal(-1.75, re[0], 1e-15);
        Assert.Equal(3.25, re[1], 1e-15);
        Assert.Equal(0.0, im[0], 1e-15);
        Assert.Equal(0.0, im[1], 1e-15);

        new RealFft(3).Forward([0.75, -2.5, 1.25], re, im);
        Assert.Equal(-0.5, re[0], 1e-15);
        Assert.Equal(0.75 - (0.5 * (-2.5 + 1.25)), re[1], 1e-15);
        Assert.Equal(0.0, im[0], 1e-15);
        Assert.Equal(-Math.Sqrt(3) / 2 * (-2.5 - 1.25), im[1], 1e-15);
    }

    [Fact]
    public void SmallEvenAndOddLengthsMatchNumpy()
    {
        // Reference: numpy 1.24.2, numpy.fft.rfft([0.5, -1.25, 2.0, 0.75, -0.5, 1.5]) and of the same list with -2.25
        // appended (printed with repr). 1e-14 absolute on bins of order 1.
        double[] x6 = [0.5, -1.25, 2.0, 0.75, -0.5, 1.5];
        double[,] rfft6 =
        {
            { 3.0, 0.0 },
            { -0.8749999999999998, 0.21650635094610982 },
            { 0.3749999999999998, 4.546633369868303 },
            { 1.0, 0.0 },
        };
        double[] x7 = [0.5, -1.25, 2.0, 0.75, -0.5, 1.5, -2.25];
        double[,] rfft7 =
        {
            { 0.75, 0.0 },
            { -2.6862797923282726, -1.8116501124558892 },
            { -1.7186953183466833, 0.2193033104619928 },
            { 5.779975110674956, -1.2616278881108227 },
        };
        foreach (var (x, expected) in new[] { (x6, rfft6), (x7, rfft7) })
        {
            var fft = new RealFft(x.Length);
            var re = new double[fft.BinCount];
            var im = new double[fft.BinCount];
            fft.Forward(x, re, im);
            Assert.Equal(expected.GetLength(0), fft.BinCount);
            for (var k = 0; k < fft.BinCount; k++)
            {
                Assert.Equal(expected[k, 0], re[k], 1e-14);
                Assert.Equal(expected[k, 1], im[k], 1e-14);
            }
        }
    }

    [Theory]
    [InlineData(16, 3)]
    [InlineData(10, 3)]
    [InlineData(15, 4)]
    public void CosineBetweenBinsGivesTheDirichletSum(int length, int cycles)
    {
        // Closed form: x_j = cos(2π·f·j/n) with f = cycles + 0.5 (between bins) has
        // X_k = ½·Σ_j (e^{2πi(f−k)j/n} + e^{−2πi(f+k)j/n}), each a geometric sum (1 − r^n)/(1 − r). The reused plan
        // also transforms a shifted copy: x_{j−s} has X_k·e^{−2πiks/n} (time shift), checked on the same bins.
        var f = cycles + 0.5;
        var x = new double[length];
        for (var j = 0; j < length; j++)
        {
            x[j] = Math.Cos(2 * Math.PI * f * j / length);
        }

        var fft = new RealFft(length);
        var re = new double[fft.BinCount];
        var im = new double[fft.BinCount];
        fft.Forward(x, re, im);
        for (var k = 0; k < fft.BinCount; k++)
        {
            var expected = 0.5 * (Geometric(2 * Math.PI * (f - k) / length, length) + Geometric(-2 * Math.PI * (f + k) / length, length));
            // 1e-12 absolute on bins up to n/2 in size.
            Assert.Equal(expected.Real, re[k], 1e-12);
            Assert.Equal(expected.Imaginary, im[k], 1e-12);
        }

        const int shift = 3;
        var shifted = new double[length];
        for (var j = 0; j < length; j++)
        {
            shifted[j] = x[(j - shift + length) % length];
        }

        var sr = new double[fft.BinCount];
        var si = new double[fft.BinCount];
        fft.Forward(shifted, sr, si);
        for (var k = 0; k < fft.BinCount; k++)
        {
            var rotated = new Complex(re[k], im[k]) * Complex.FromPolarCoordinates(1, -2 * Math.PI * k * shift / length);
            Assert.Equal(rotated.Real, sr[k], 1e-12);
            Assert.Equal(rotated.Imaginary, si[k], 1e-12);
        }
    }

    // Σ_{j<n} e^{iθj} = (1 − e^{iθn}) / (1 − e^{iθ}); θ is never a multiple of 2π here (f is between bins).
    private static Complex Geometric(double theta, int n) =>
        (1 - Complex.FromPolarCoordinates(1, theta * n)) / (1 - Complex.FromPolarCoordinates(1, theta));
}
