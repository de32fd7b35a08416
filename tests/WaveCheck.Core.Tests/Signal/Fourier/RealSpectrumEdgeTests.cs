using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class RealSpectrumEdgeTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(0)]
    public void RejectsTooShortWindowsWithTheRange(int length)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new RealSpectrum(length));
        Assert.Equal("length", ex.ParamName);
        Assert.Contains("window length must be at least 2 samples", ex.Message);
    }

    [Theory]
    [InlineData(9, 10)]
    [InlineData(10, 9)]
    [InlineData(11, 11)]
    public void PairRejectsEitherWindowOfTheWrongLength(int firstLength, int secondLength)
    {
        var spectrum = new RealSpectrum(10);
        var ex = Assert.Throws<ArgumentException>(() =>
            spectrum.PowerPair(new double[firstLength], new double[secondLength], new double[6], new double[6]));
        Assert.Equal("first", ex.ParamName);
        Assert.Contains($"expected 10 samples, got {firstLength} and {secondLength}", ex.Message);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(9)]
    [InlineData(10)]
    [InlineData(1001)]
    public void PairGivesEachWindowsToneAtItsBin(int length)
    {
        // Closed form: A·cos(2π·m·j/n + φ) has mean square A²/2 in bin m (0 < m < n/2), A² at the Nyquist bin
        // m = n/2 with φ = 0, and nothing elsewhere; a constant c has c² in bin 0. First window: 0.3 + 1.2·cos at bin
        // m1; second: −0.8 + 0.5·sin at bin m2 (or the Nyquist cosine where it exists).
        var spectrum = new RealSpectrum(length);
        var bins = spectrum.BinCount;
        var m1 = Math.Max(1, (bins - 1) / 2);
        var nyquist = length % 2 == 0;
        var m2 = nyquist ? length / 2 : bins - 1;
        var a = new double[length];
        var b = new double[length];
        for (var j = 0; j < length; j++)
        {
            a[j] = 0.3 + (1.2 * Math.Cos(2 * Math.PI * ((long)m1 * j % length) / length));
            b[j] = -0.8 + (nyquist ? 0.5 * Math.Cos(Math.PI * j) : 0.5 * Math.Sin(2 * Math.PI * ((long)m2 * j % length) / length));
        }

        var pa = new double[bins];
        var pb = new double[bins];
        spectrum.PowerPair(a, b, pa, pb);
        for (var k = 0; k < bins; k++)
        {
            var expectedA = k == 0 ? 0.09 : 0.0;
            expectedA += k == m1 ? (m1 == length / 2.0 ? 1.44 : 0.72) : 0.0;
            var expectedB = k == 0 ? 0.64 : k == m2 ? (nyquist ? 0.25 : 0.125) : 0.0;
            // 1e-12 absolute on mean squares of order 1: double rounding.
            Assert.Equal(expectedA, pa[k], 1e-12);
            Assert.Equal(expectedB, pb[k], 1e-12);
        }
    }

    [Fact]
    public void PairReusesItsPlanAndScratchAcrossCalls()
    {
        // Reference: the single-window Power (checked against the plain DFT in RealSpectrumTests), on two pairs
        // through one plan; the second pair allocates nothing (the plan and its buffers are built once and reused).
        const int length = 1001;
        var spectrum = new RealSpectrum(length);
        var (a1, b1, _) = ReferenceDft.Random(length, 3);
        var (a2, b2, _) = ReferenceDft.Random(length, 4);
        var (pa, pb) = (new double[spectrum.BinCount], new double[spectrum.BinCount]);
        spectrum.PowerPair(a1, b1, pa, pb);
        var before = GC.GetAllocatedBytesForCurrentThread();
        spectrum.PowerPair(a2, b2, pa, pb);
        var allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        // Under 1 KiB: far below one 8·1001-byte buffer, let alone a new transform plan.
        Assert.True(allocated < 1024, $"allocated {allocated} bytes");
        var (sa, sb) = (new double[spectrum.BinCount], new double[spectrum.BinCount]);
        spectrum.Power(a2, sa);
        spectrum.Power(b2, sb);
        for (var k = 0; k < spectrum.BinCount; k++)
        {
            Assert.Equal(sa[k], pa[k], 1e-13);
            Assert.Equal(sb[k], pb[k], 1e-13);
        }
    }

    [Theory]
    [InlineData(16)]
    [InlineData(64)]
    [InlineData(1024)]
    public void ConstantWindowHasOnlyTheMeanSquareAndNoNegativeBin(int length)
    {
        // Closed form: a constant c has c² in bin 0 and 0 in every other bin; a mean square is never negative,
        // however small the rounding left in a bin (the Nyquist bin's imaginary part is ~1e-16·n here).
        var spectrum = new RealSpectrum(length);
        var power = new double[spectrum.BinCount];
        spectrum.Power(Enumerable.Repeat(1.5, length).ToArray(), power);
        Assert.Equal(2.25, power[0], 1e-15);
        for (var k = 1; k < power.Length; k++)
        {
            Assert.Equal(0.0, power[k], 1e-28);
            Assert.True(power[k] >= 0, $"bin {k}: {power[k]}");
        }
    }

    [Theory]
    [InlineData(7)]
    [InlineData(9)]
    [InlineData(11)]
    [InlineData(13)]
    [InlineData(21)]
    [InlineData(101)]
    [InlineData(1001)]
    public void ZeroMeanWindowHasAnEmptyAndNonNegativeDcBin(int length)
    {
        // Closed form: cos(2π·j/n) and sin(2π·2j/n) have mean 0, so bin 0 holds 0; on these odd lengths (the
        // chirp-z path) bin 0 keeps rounding in both its real and imaginary parts, and its mean square must still be
        // |X_0|²/n² ≥ 0.
        var spectrum = new RealSpectrum(length);
        var power = new double[spectrum.BinCount];
        foreach (var cycles in new[] { 1, 2 })
        {
            var x = new double[length];
            for (var j = 0; j < length; j++)
            {
                x[j] = cycles == 1 ? Math.Cos(2 * Math.PI * j / length) : Math.Sin(2 * Math.PI * 2 * j / length);
            }

            spectrum.Power(x, power);
            Assert.Equal(0.0, power[0], 1e-28);
            Assert.True(power[0] >= 0, $"bin 0: {power[0]}");
            // Closed form: the tone's own bin holds A²/2 = 0.5.
            Assert.Equal(0.5, power[cycles], 1e-12);
        }
    }
}
