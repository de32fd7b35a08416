using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class HarmonicGroupsTests
{
    private const double Fs = 10_000;

    private static double[] PowerOf(double[] window)
    {
        var spectrum = new RealSpectrum(window.Length);
        var power = new double[spectrum.BinCount];
        spectrum.Power(window, power);
        return power;
    }

    // 10 cycles of 50 Hz at 10 kS/s: 2000 samples, 5 Hz bins.
    private static double[] Window(Func<double, double> valueAt) => Synth.Make(Fs, 0.2, valueAt);

    [Theory]
    [InlineData(1)]
    [InlineData(3)]
    [InlineData(7)]
    [InlineData(50)]
    public void PureHarmonicLandsInItsGroup(int order)
    {
        // IEC 61000-4-7: a synchronised harmonic of order h falls on bin 10h; its group holds all of it.
        var rms = 0.01;
        var power = PowerOf(Window(t => rms * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * order * t + 0.3)));
        for (var n = 1; n <= 50; n++)
        {
            var expected = n == order ? rms * rms : 0;
            Assert.Equal(expected, HarmonicGroups.Group(power, 10, n), 1e-12 * rms * rms * 1e3);
        }

        Assert.Equal(rms * rms, HarmonicGroups.Subgroup(power, 10, order), 1e-15);
    }

    [Fact]
    public void InterharmonicLandsInInterharmonicGroup()
    {
        // IEC 61000-4-7: a tone at 165 Hz (bin 33, between orders 3 and 4) lies in interharmonic group 3 and in its
        // centred subgroup (bins 32..38), in no harmonic subgroup; harmonic groups tile the spectrum, so group 3
        // (bins 26..34) holds it too.
        var rms = 0.004;
        var power = PowerOf(Window(t => rms * Math.Sqrt(2) * Math.Cos(2 * Math.PI * 165 * t)));
        Assert.Equal(rms * rms, HarmonicGroups.InterharmonicGroup(power, 10, 3), 1e-15);
        Assert.Equal(rms * rms, HarmonicGroups.InterharmonicSubgroup(power, 10, 3), 1e-15);
        Assert.Equal(rms * rms, HarmonicGroups.Group(power, 10, 3), 1e-15);
        for (var n = 1; n <= 10; n++)
        {
            Assert.Equal(0, HarmonicGroups.Subgroup(power, 10, n), 1e-15);
            Assert.Equal(0, n == 3 ? 0 : HarmonicGroups.Group(power, 10, n), 1e-15);
        }
    }

    [Fact]
    public void ToneHalfwayBetweenOrdersSplitsByTheHalfWeight()
    {
        // IEC 61000-4-7 group definition: bin k+5 counts half in group n and half in group n+1, and fully in
        // interharmonic group n. A tone on 125 Hz (bin 25) therefore gives half its square to groups 2 and 3 each.
        var rms = 0.002;
        var power = PowerOf(Window(t => rms * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 125 * t)));
        Assert.Equal(0.5 * rms * rms, HarmonicGroups.Group(power, 10, 2), 1e-15);
        Assert.Equal(0.5 * rms * rms, HarmonicGroups.Group(power, 10, 3), 1e-15);
        Assert.Equal(rms * rms, HarmonicGroups.InterharmonicGroup(power, 10, 2), 1e-15);
        Assert.Equal(0, HarmonicGroups.InterharmonicSubgroup(power, 10, 2) - (rms * rms), 1e-15);
    }

    [Fact]
    public void ToneFiveHertzOffAHarmonicStaysInTheGroupButNotTheSubgroupEdge()
    {
        // IEC 61000-4-7: 155 Hz is bin 31 = 10·3 + 1: in group 3 (full weight), in subgroup 3 (k−1..k+1),
        // and in interharmonic group 3 (k+1..k+9).
        var rms = 0.003;
        var power = PowerOf(Window(t => rms * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 155 * t)));
        Assert.Equal(rms * rms, HarmonicGroups.Group(power, 10, 3), 1e-15);
        Assert.Equal(rms * rms, HarmonicGroups.Subgroup(power, 10, 3), 1e-15);
        Assert.Equal(rms * rms, HarmonicGroups.InterharmonicGroup(power, 10, 3), 1e-15);
        Assert.Equal(0, HarmonicGroups.InterharmonicSubgroup(power, 10, 3), 1e-15);
    }

    [Theory]
    [InlineData(10)]
    [InlineData(12)]
    [InlineData(7)]
    public void GroupsTileTheSpectrum(int cycles)
    {
        // Parseval: DC² + below-fundamental + Σ harmonic groups + what lies above the last group = window mean square.
        // (IEC interharmonic groups overlap the half-weighted harmonic edges, so they are checked with subgroups.)
        var random = new Random(cycles);
        var x = new double[cycles * 200];
        var meanSquare = 0.0;
        for (var i = 0; i < x.Length; i++)
        {
            x[i] = random.NextDouble() - 0.2;
            meanSquare += x[i] * x[i] / x.Length;
        }

        var power = PowerOf(x);
        var maxOrder = 99;
        var total = power[0] + HarmonicGroups.BelowFundamental(power, cycles);
        for (var n = 1; n <= maxOrder; n++)
        {
            total += HarmonicGroups.Group(power, cycles, n);
        }

        var edge = (cycles * maxOrder) + (cycles / 2);
        total += cycles % 2 == 0 ? (0.5 * power[edge]) + HarmonicGroups.Sum(power, edge + 1, power.Length - 1)
            : HarmonicGroups.Sum(power, edge + 1, power.Length - 1);
        Assert.Equal(meanSquare, total, 1e-10 * meanSquare);

        // Subgroups and centred interharmonic subgroups with bins 1 and N−1 around them tile it as well.
        var tiled = power[0] + power[1];
        for (var n = 0; n < maxOrder; n++)
        {
            tiled += HarmonicGroups.InterharmonicSubgroup(power, cycles, n) + HarmonicGroups.Subgroup(power, cycles, n + 1);
        }

        tiled += HarmonicGroups.Sum(power, (cycles * maxOrder) + 2, power.Length - 1);
        Assert.Equal(meanSquare, tiled, 1e-10 * meanSquare);
    }

    [Fact]
    public void SubgroupMembership()
    {
        // IEC 61000-4-7 subgroup: bins 10n−1..10n+1.
        Assert.True(HarmonicGroups.InHarmonicSubgroup(9, 10, 50));
        Assert.True(HarmonicGroups.InHarmonicSubgroup(501, 10, 50));
        Assert.False(HarmonicGroups.InHarmonicSubgroup(12, 10, 50));
        Assert.False(HarmonicGroups.InHarmonicSubgroup(2, 10, 50));
        Assert.False(HarmonicGroups.InHarmonicSubgroup(3200, 10, 50));
    }
}
