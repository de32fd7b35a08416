using System.Numerics;
using System.Runtime.CompilerServices;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class ComplexDftEdgeTests
{
    // The element-wise conj(a·b) the chirp-z convolution forms; private, reached here because its scalar tail only
    // runs for lengths that are not a multiple of the vector width, which the convolution's own lengths (q·2^k ≥ 16)
    // never are on hardware with SIMD (on hardware without, the tail does all the work).
    [UnsafeAccessor(UnsafeAccessorKind.StaticMethod, Name = "MultiplyConjugateInPlace")]
    private static extern void MultiplyConjugateInPlace(ComplexDft? owner, Span<double> ar, Span<double> ai,
        ReadOnlySpan<double> br, ReadOnlySpan<double> bi);

    [Theory]
    [InlineData(0)]
    [InlineData(-5)]
    public void RejectsLengthBelowOne(int length)
    {
        // The documented range: at least 1 point; the exception names the argument and carries the value given.
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new ComplexDft(length));
        Assert.Equal("length", ex.ParamName);
        Assert.Equal(length, ex.ActualValue);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(4)]
    [InlineData(8)]
    [InlineData(12)]
    [InlineData(20)]
    [InlineData(64)]
    [InlineData(96)]
    [InlineData(160)]
    public void SupportedLengthsGiveTheImpulseSpectrumExactly(int length)
    {
        // Closed form: the DFT of a unit impulse at j = 0 is 1 in every bin. A direct q·2^k FFT only adds zeros and
        // multiplies by W^0 = 1 on the way, so the figures are exact; a chirp-z convolution would leave rounding of
        // ~1e-16 (its chirps are not exact), so this also pins that these lengths take the direct transform.
        var re = new double[length];
        var im = new double[length];
        re[0] = 1;
        new ComplexDft(length).Forward(re, im);
        for (var k = 0; k < length; k++)
        {
            Assert.Equal(1.0, re[k], 0.0);
            Assert.Equal(0.0, im[k], 0.0);
        }
    }

    [Theory]
    [InlineData(1, 0)]
    [InlineData(2, 1)]
    [InlineData(7, 3)]
    [InlineData(9, 8)]
    [InlineData(13, 5)]
    [InlineData(25, 24)]
    [InlineData(101, 50)]
    public void ShiftedImpulseGivesThePhaseRamp(int length, int at)
    {
        // Closed form: x = δ_{j0} gives X_k = e^{−2πi·j0·k/n}; primes and odd lengths go through the chirp-z path.
        var re = new double[length];
        var im = new double[length];
        re[at] = 1;
        new ComplexDft(length).Forward(re, im);
        for (var k = 0; k < length; k++)
        {
            var angle = -2 * Math.PI * ((long)at * k % length) / length;
            // 1e-12 absolute on unit-magnitude bins: double rounding of the convolution's FFTs.
            Assert.Equal(Math.Cos(angle), re[k], 1e-12);
            Assert.Equal(Math.Sin(angle), im[k], 1e-12);
        }
    }

    [Theory]
    [InlineData(7)]
    [InlineData(11)]
    [InlineData(18)]
    [InlineData(27)]
    [InlineData(1001)]
    public void RealInputHasConjugateSymmetryAndParsevalHolds(int length)
    {
        // Closed forms: for real x, X[n−k] = conj X[k]; Parseval Σ|X_k|² = n·Σ x_j². Reused plan: two data sets.
        var dft = new ComplexDft(length);
        for (var seed = 0; seed < 2; seed++)
        {
            var random = new Random(length + seed);
            var re = new double[length];
            var im = new double[length];
            var energy = 0.0;
            for (var j = 0; j < length; j++)
            {
                re[j] = random.NextDouble() - 0.5;
                energy += re[j] * re[j];
            }

            dft.Forward(re, im);
            var spectral = 0.0;
            for (var k = 0; k < length; k++)
            {
                var mirror = (length - k) % length;
                // 1e-9 absolute: sums of n values of order 1 in double.
                Assert.Equal(re[k], re[mirror], 1e-9);
                Assert.Equal(-im[k], im[mirror], 1e-9);
                spectral += (re[k] * re[k]) + (im[k] * im[k]);
            }

            Assert.Equal(length * energy, spectral, 1e-10 * length * energy);
        }
    }

    [Theory]
    [InlineData(7)]
    [InlineData(15)]
    public void TransformIsLinear(int length)
    {
        // Closed form: DFT(a·x + b·y) = a·DFT(x) + b·DFT(y), here with complex data on a chirp-z length.
        var (xr, xi, _) = ReferenceDft.Random(length, 1);
        var (yr, yi, _) = ReferenceDft.Random(length, 2);
        var sr = new double[length];
        var si = new double[length];
        for (var j = 0; j < length; j++)
        {
            sr[j] = (2 * xr[j]) - (3 * yr[j]);
            si[j] = (2 * xi[j]) - (3 * yi[j]);
        }

        var dft = new ComplexDft(length);
        dft.Forward(xr, xi);
        dft.Forward(yr, yi);
        dft.Forward(sr, si);
        for (var k = 0; k < length; k++)
        {
            Assert.Equal((2 * xr[k]) - (3 * yr[k]), sr[k], 1e-12);
            Assert.Equal((2 * xi[k]) - (3 * yi[k]), si[k], 1e-12);
        }
    }

    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    [InlineData(9)]
    [InlineData(11)]
    public void ConjugateProductCoversTheTailBeyondWholeVectors(int length)
    {
        // Reference: System.Numerics.Complex, conj(a·b) per element. Small integers keep every product exact, so the
        // figures must agree to the bit, the vector part and the scalar tail alike.
        var ar = new double[length];
        var ai = new double[length];
        var br = new double[length];
        var bi = new double[length];
        var expected = new Complex[length];
        for (var k = 0; k < length; k++)
        {
            (ar[k], ai[k], br[k], bi[k]) = (k + 1, 2 - k, 3 - (2 * k), k + 4);
            expected[k] = Complex.Conjugate(new Complex(ar[k], ai[k]) * new Complex(br[k], bi[k]));
        }

        MultiplyConjugateInPlace(null, ar, ai, br, bi);
        for (var k = 0; k < length; k++)
        {
            Assert.Equal(expected[k].Real, ar[k], 0.0);
            Assert.Equal(expected[k].Imaginary, ai[k], 0.0);
        }
    }
}
