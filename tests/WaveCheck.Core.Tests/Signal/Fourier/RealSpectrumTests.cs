using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class RealSpectrumTests
{
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
            var reference = ReferenceDft.Bin(x, k);
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
