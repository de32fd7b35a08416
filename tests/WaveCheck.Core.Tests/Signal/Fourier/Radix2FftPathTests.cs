using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// Radix2Fft at the sizes that select each of its paths (n = 1, 2, 4, the vector width and twice it, long
/// transforms beyond 2^16 points), in both directions of decimation, against closed forms and MathNet.
/// </summary>
public class Radix2FftPathTests
{
    // 1 and 2 have no butterfly stage after the first; 4 is the two fixed stages only; 8, 16, 32, 64 straddle the
    // vector width (Vector<double>.Count, 4 with AVX2) and the paired radix-4 passes with odd and even stage counts;
    // 2^17 needs bit-reversal indices above 16 bits.
    public static TheoryData<int> Lengths => new() { 1, 2, 4, 8, 16, 32, 64, 128, 1024, 1 << 17 };

    private static Complex Expi(double angle) => new(Math.Cos(angle), Math.Sin(angle));

    // Closed form: e^{-2πi k m / n}, with k·m reduced modulo n first so the angle stays small.
    private static Complex Ramp(int k, int m, int n) => Expi(-2 * Math.PI * ((long)k * m % n) / n);

    // The bit reversal of i in `bits` bits, by writing i in binary and reading it backwards (no source needed).
    private static int ReversedBits(int i, int bits)
    {
        if (bits == 0)
        {
            return 0;
        }

        var text = Convert.ToString(i, 2).PadLeft(bits, '0').ToCharArray();
        Array.Reverse(text);
        return Convert.ToInt32(new string(text), 2);
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void BitReversedIsTheReversalOfTheIndexBits(int length)
    {
        // Closed form: entry i is i with its log2(n) bits read backwards. At 2^17 the upper 16-bit half of the
        // index takes part, which no transform below 65 536 points reaches.
        var bits = BitOperations.Log2((uint)length);
        var table = new Radix2Fft(length).BitReversed;
        Assert.Equal(length, table.Length);
        for (var i = 0; i < length; i++)
        {
            Assert.Equal(ReversedBits(i, bits), table[i]);
        }
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void ImpulseGivesPhaseRamp(int length)
    {
        // Closed form: the DFT of δ[j − m] is X_k = e^{-2πi km/n}. Impulses at 0, 1, n/2 + 3 and n − 1 (at 2^17 the
        // last two sit above index 65 536). 1e-12 absolute: each output is one input times a chain of twiddles.
        var fft = new Radix2Fft(length);
        foreach (var m in new[] { 0, 1, (length / 2) + 3, length - 1 }.Where(m => m < length).Distinct())
        {
            var re = new double[length];
            var im = new double[length];
            re[m] = 1;
            fft.Forward(re, im);
            for (var k = 0; k < length; k++)
            {
                var expected = Ramp(k, m, length);
                Assert.Equal(expected.Real, re[k], 1e-12);
                Assert.Equal(expected.Imaginary, im[k], 1e-12);
            }
        }
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void ImpulseThroughDecimationInFrequencyGivesPhaseRampInBitReversedOrder(int length)
    {
        // Closed form as above; ForwardToBitReversed leaves X_k at position BitReversed[k] (its doc comment). The
        // index table used to read the result back is itself checked against the plain bit reversal above.
        var fft = new Radix2Fft(length);
        var bits = BitOperations.Log2((uint)length);
        foreach (var m in new[] { 0, 1, (length / 2) + 3, length - 1 }.Where(m => m < length).Distinct())
        {
            var re = new double[length];
            var im = new double[length];
            re[m] = 1;
            fft.ForwardToBitReversed(re, im);
            for (var k = 0; k < length; k++)
            {
                var expected = Ramp(k, m, length);
                var at = ReversedBits(k, bits);
                Assert.Equal(expected.Real, re[at], 1e-12);
                Assert.Equal(expected.Imaginary, im[at], 1e-12);
            }
        }
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void ComplexExponentialOnABinLandsInThatBinOnly(int length)
    {
        // Closed form: x_j = e^{2πi pj/n} has X_k = n·δ_{kp}. p = 1 and p = n/2 − 1 (the top of the lower half, where
        // the twiddles of the last stage are furthest from 1). Tolerance 1e-13·n·log2(2n): rounding of n log n
        // butterflies on values of order 1, scaled up by the sum of n terms.
        var fft = new Radix2Fft(length);
        var tolerance = 1e-13 * length * (BitOperations.Log2((uint)length) + 1);
        foreach (var p in new[] { 1, (length / 2) - 1 }.Where(p => p >= 0 && p < length).Distinct())
        {
            var re = new double[length];
            var im = new double[length];
            for (var j = 0; j < length; j++)
            {
                var x = Expi(2 * Math.PI * ((long)p * j % length) / length);
                (re[j], im[j]) = (x.Real, x.Imaginary);
            }

            fft.Forward(re, im);
            for (var k = 0; k < length; k++)
            {
                Assert.Equal(k == p ? length : 0.0, re[k], tolerance);
                Assert.Equal(0.0, im[k], tolerance);
            }
        }
    }

    [Theory]
    [InlineData(4)]
    [InlineData(8)]
    [InlineData(16)]
    [InlineData(64)]
    [InlineData(4096)]
    public void RealCosineGivesTwoBinsOfHalfTheLength(int length)
    {
        // Closed form: cos(2π pj/n) = (e^{iθ} + e^{-iθ})/2, so X_p = X_{n−p} = n/2 and every other bin is 0 (p < n/2).
        foreach (var p in new[] { 1, (length / 4) + 1 }.Where(p => p < length / 2).Distinct())
        {
            var re = new double[length];
            var im = new double[length];
            for (var j = 0; j < length; j++)
            {
                re[j] = Math.Cos(2 * Math.PI * ((long)p * j % length) / length);
            }

            new Radix2Fft(length).Forward(re, im);
            var tolerance = 1e-13 * length * BitOperations.Log2((uint)length);
            for (var k = 0; k < length; k++)
            {
                Assert.Equal(k == p || k == length - p ? length / 2.0 : 0.0, re[k], tolerance);
                Assert.Equal(0.0, im[k], tolerance);
            }
        }
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void ParsevalLinearityAndTimeShiftHoldOnRandomData(int length)
    {
        // Closed forms on seeded random data: Parseval Σ|X_k|² = n·Σ|x_j|²; linearity F(a·x + b·y) = a·F(x) + b·F(y);
        // time shift F(x[j − s])_k = e^{-2πi ks/n}·X_k. 1e-11·n: sums of n values of order 1 in double.
        var fft = new Radix2Fft(length);
        var (xr, xi, _) = ReferenceDft.Random(length, 11 + length);
        var (yr, yi, _) = ReferenceDft.Random(length, 12 + length);
        const double A = 0.75, B = -2.5;
        var zr = new double[length];
        var zi = new double[length];
        var sr = new double[length];
        var si = new double[length];
        var shift = length / 3;
        for (var j = 0; j < length; j++)
        {
            zr[j] = (A * xr[j]) + (B * yr[j]);
            zi[j] = (A * xi[j]) + (B * yi[j]);
            sr[(j + shift) % length] = xr[j];
            si[(j + shift) % length] = xi[j];
        }

        var energy = 0.0;
        for (var j = 0; j < length; j++)
        {
            energy += (xr[j] * xr[j]) + (xi[j] * xi[j]);
        }

        // The same plan for all four transforms: nothing a call leaves behind may change the next one.
        fft.Forward(xr, xi);
        fft.Forward(yr, yi);
        fft.Forward(zr, zi);
        fft.Forward(sr, si);
        var tolerance = 1e-11 * length;
        var spectral = 0.0;
        for (var k = 0; k < length; k++)
        {
            spectral += (xr[k] * xr[k]) + (xi[k] * xi[k]);
            Assert.Equal((A * xr[k]) + (B * yr[k]), zr[k], tolerance);
            Assert.Equal((A * xi[k]) + (B * yi[k]), zi[k], tolerance);
            var shifted = new Complex(xr[k], xi[k]) * Ramp(k, shift, length);
            Assert.Equal(shifted.Real, sr[k], tolerance);
            Assert.Equal(shifted.Imaginary, si[k], tolerance);
        }

        Assert.Equal(length * energy, spectral, 1e-12 * length * length * energy);
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void InverseByConjugationGivesTheInputBack(int length)
    {
        // Closed form: x = conj(F(conj X))/n, the inverse DFT through the forward one. Run through both decimations:
        // Forward one way, ForwardToBitReversed back (read out through the bit reversal). 1e-12: round trip of
        // values of order 1.
        var fft = new Radix2Fft(length);
        var bits = BitOperations.Log2((uint)length);
        var (re, im, _) = ReferenceDft.Random(length, 21 + length);
        var (xr, xi) = ((double[])re.Clone(), (double[])im.Clone());
        fft.Forward(re, im);
        for (var k = 0; k < length; k++)
        {
            im[k] = -im[k];
        }

        fft.ForwardToBitReversed(re, im);
        for (var j = 0; j < length; j++)
        {
            var at = ReversedBits(j, bits);
            Assert.Equal(xr[j], re[at] / length, 1e-12);
            Assert.Equal(xi[j], -im[at] / length, 1e-12);
        }
    }

    [Theory]
    [MemberData(nameof(Lengths))]
    public void BothDecimationsMatchMathNetOnOnePlanUsedTwice(int length)
    {
        // Reference: MathNet.Numerics Fourier.Forward with FourierOptions.Matlab (unscaled, e^{-i} convention). The
        // plan is used for a first transform of other data before each checked one. 1e-12·n: sums of n values of
        // order 1.
        var fft = new Radix2Fft(length);
        var bits = BitOperations.Log2((uint)length);
        var tolerance = 1e-12 * length;
        var (re, im, data) = ReferenceDft.Random(length, 31 + length);
        ReferenceDft.MathNetForward(data);

        var (wr, wi, _) = ReferenceDft.Random(length, 32 + length);
        fft.ForwardToBitReversed(wr, wi);
        var (dr, di) = ((double[])re.Clone(), (double[])im.Clone());
        fft.ForwardToBitReversed(dr, di);
        for (var k = 0; k < length; k++)
        {
            var at = ReversedBits(k, bits);
            Assert.Equal(data[k].Real, dr[at], tolerance);
            Assert.Equal(data[k].Imaginary, di[at], tolerance);
        }

        fft.Forward(wr, wi);
        fft.Forward(re, im);
        for (var k = 0; k < length; k++)
        {
            Assert.Equal(data[k].Real, re[k], tolerance);
            Assert.Equal(data[k].Imaginary, im[k], tolerance);
        }
    }
}
