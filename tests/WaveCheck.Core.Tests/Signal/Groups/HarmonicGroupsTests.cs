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
    [Fact]
    public void Groups_sum_exactly_the_bins_the_standard_names_and_stop_at_the_spectrum_s_end()
    {
        // IEC 61000-4-7 group definitions (REFERENCE.md, "mem"; the class remarks), N = 10 cycles, k = 10·n: group
        // ½C²(k−5) + ΣC²(k−4..k+4) + ½C²(k+5), subgroup ΣC²(k−1..k+1), interharmonic group ΣC²(k+1..k+9), centred
        // interharmonic subgroup ΣC²(k+2..k+8). A spectrum with C²(i) = i + 1 makes every bin count differently, so the
        // sums are closed forms: Σ(i + 1) for i = a..b = (b − a + 1)(a + b + 2)/2.
        static double Arith(int a, int b) => (b - a + 1) * (a + b + 2) / 2.0;
        var power = Enumerable.Range(0, 60).Select(i => i + 1.0).ToArray();
        Assert.Equal(Arith(16, 24) + (0.5 * (16 + 26)), HarmonicGroups.Group(power, 10, 2));
        Assert.Equal(Arith(19, 21), HarmonicGroups.Subgroup(power, 10, 2));
        Assert.Equal(Arith(21, 29), HarmonicGroups.InterharmonicGroup(power, 10, 2));
        Assert.Equal(Arith(22, 28), HarmonicGroups.InterharmonicSubgroup(power, 10, 2));
        Assert.Equal(Arith(1, 4) + (0.5 * 6), HarmonicGroups.BelowFundamental(power, 10));
        // Odd N = 9: the group's edges fall between bins, k = 18: bins 14..22 fully.
        Assert.Equal(Arith(14, 22), HarmonicGroups.Group(power, 9, 2));

        // Bins beyond the spectrum count as zero (the class remarks): a spectrum of 25 bins (0..24) cut inside the
        // groups of order 2.
        var cut = power[..25];
        Assert.Equal(Arith(16, 24) + (0.5 * 16), HarmonicGroups.Group(cut, 10, 2)); // edge bin 25 absent
        Assert.Equal(Arith(21, 24), HarmonicGroups.InterharmonicGroup(cut, 10, 2));
        Assert.Equal(Arith(22, 24), HarmonicGroups.InterharmonicSubgroup(cut, 10, 2));
        Assert.Equal(0, HarmonicGroups.Sum(cut, 25, 40));
        Assert.Equal(Arith(0, 2), HarmonicGroups.Sum(cut, -3, 2));
    }
}
