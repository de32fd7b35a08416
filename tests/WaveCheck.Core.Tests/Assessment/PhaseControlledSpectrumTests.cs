using WaveCheck.Core.Assessment;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>Closed-form series of the phase-controlled half-wave against textbook forms and a plain DFT.</summary>
public class PhaseControlledSpectrumTests
{
    [Theory]
    [InlineData(2)]
    [InlineData(4)]
    [InlineData(10)]
    public void UncontrolledHalfWaveHasTheTextbookEvenHarmonics(int n)
    {
        // Textbook: even orders 2 Ipk / (pi (n^2 - 1)) peak; odd orders > 1 zero; fundamental Ipk/2 peak.
        Assert.Equal(2 / (Math.PI * ((n * n) - 1)) / Math.Sqrt(2), PhaseControlledSpectrum.HarmonicRms(0, n), 12);
        Assert.Equal(0, PhaseControlledSpectrum.HarmonicRms(0, n + 1), 12);
        Assert.Equal(0.5 / Math.Sqrt(2), PhaseControlledSpectrum.HarmonicRms(0, 1), 12);
        Assert.Equal(0.5, PhaseControlledSpectrum.TotalRms(0), 12); // Ipk/2
    }

    [Theory]
    [InlineData(90.0)]
    [InlineData(135.0)]
    public void ControlledHalfWaveMatchesAPlainDft(double alphaDeg)
    {
        // Plain DFT of 20 000 midpoint samples of one cycle; the error of the midpoint rule at the step is
        // O(1/N) of the step (5e-5 of the peak): 4 decimal places of a unit-peak wave.
        const int n = 20_000;
        var x = IdealHalfWave.Cycle(1, alphaDeg, n);
        var sumSq = x.Sum(v => v * v);
        Assert.Equal(Math.Sqrt(sumSq / n), PhaseControlledSpectrum.TotalRms(alphaDeg), 4);
        foreach (var k in new[] { 1, 2, 3, 7, 21, 40 })
        {
            var dft = IdealHalfWave.HarmonicRms(x, k);
            Assert.Equal(dft, PhaseControlledSpectrum.HarmonicRms(alphaDeg, k), 4);
        }
    }

    [Fact]
    public void ShareAboveOneKilohertzGrowsWithTheFiringStep()
    {
        var s0 = PhaseControlledSpectrum.ShareBetween(0, 50, 1000, 20_000);
        var s90 = PhaseControlledSpectrum.ShareBetween(90, 50, 1000, 20_000);
        Assert.True(s0 < 0.01, $"uncontrolled: smooth waveform, little above 1 kHz (got {s0})");
        Assert.True(s90 > 0.05, $"90°: a step of the full peak (got {s90})");
    }

    [Fact]
    public void TheBandIncludesItsUpperEdgeAndExcludesItsLowerOne()
    {
        // Uncontrolled half-wave (textbook, REFERENCE.md "Closed forms"): total RMS Ipk/2, fundamental Ipk/2 peak,
        // second harmonic 2 Ipk/(3π) peak. (50, 100] Hz at 50 Hz holds the second harmonic alone:
        // share (2/(3π))/√2 / (1/2) = 4/(3π√2).
        Assert.Equal(4 / (3 * Math.PI * Math.Sqrt(2)), PhaseControlledSpectrum.ShareBetween(0, 50, 50, 100), 12);
        // (0, 50] holds the fundamental alone: (1/2)/√2 / (1/2) = 1/√2.
        Assert.Equal(1 / Math.Sqrt(2), PhaseControlledSpectrum.ShareBetween(0, 50, 0, 50), 12);
        // (50, 99.9] holds nothing: the second harmonic lies above it.
        Assert.Equal(0, PhaseControlledSpectrum.ShareBetween(0, 50, 50, 99.9));
    }

    [Fact]
    public void AtFullDelayThereIsNoCurrentAndNoShare()
    {
        // α = 180°: the thyristor never conducts, i = 0 (closed form: RMS² = (1/2π)((π − α)/2 + sin 2α/4) = 0).
        // The series' harmonics there are rounding dust (sin π ≈ 1.2e-16); the share of nothing is 0, not a ratio
        // of two roundings.
        Assert.Equal(0, PhaseControlledSpectrum.TotalRms(180));
        Assert.Equal(0, PhaseControlledSpectrum.ShareBetween(180, 50, 1000, 20_000));
        Assert.Equal(0, PhaseControlledSpectrum.ShareBetween(180, 50, 0, 50));
    }

    [Fact]
    public void BadArgumentsAreRefused()
    {
        Assert.Equal("order", Assert.Throws<ArgumentOutOfRangeException>(() => PhaseControlledSpectrum.HarmonicRms(90, 0)).ParamName);
        // Zero and negative mains frequencies (edges chosen so that the loop would not run either way).
        Assert.Equal("mainsHz", Assert.Throws<ArgumentOutOfRangeException>(() => PhaseControlledSpectrum.ShareBetween(90, 0, 0, 0)).ParamName);
        Assert.Equal("mainsHz", Assert.Throws<ArgumentOutOfRangeException>(() => PhaseControlledSpectrum.ShareBetween(90, -50, 1000, 20_000)).ParamName);
    }
}
