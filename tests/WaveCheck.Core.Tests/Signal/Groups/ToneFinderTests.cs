using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class ToneFinderTests
{
    [Theory]
    [InlineData(16_002.5)]
    [InlineData(7_301.0)]
    [InlineData(3_333.3)]
    public void OffBinToneIsInterpolated(double frequencyHz)
    {
        // Closed form (Dirichlet kernel of a rectangular window): a 1 mA rms tone between 5 Hz bins, next to a
        // 10 mA rms 50 Hz fundamental, is found within 0.2 Hz and 1 % of its RMS (the two-bin formulas neglect the
        // negative-frequency image, about 1/(2k) of the bin's value).
        const double fs = 50_000;
        var samples = Synth.Make(fs, 2, t => (0.01 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * t))
            + (0.001 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * frequencyHz * t)));
        var result = Analyzer.Analyze(new MemoryCaptureSource(samples, fs), new AnalysisOptions());
        var tone = Assert.Single(result.Components.Tones);
        Assert.Equal(frequencyHz, tone.FrequencyHz, 0.2);
        Assert.Equal(0.001, tone.RmsA, 0.01 * 0.001);
    }

    [Fact]
    public void HarmonicsAreNotTones()
    {
        // IEC 61000-4-7 subgroups: content on harmonic bins of orders 1..50 is harmonic, not a tone.
        const double fs = 50_000;
        var samples = Synth.Make(fs, 1, t => (0.01 * Math.Sin(2 * Math.PI * 50 * t)) + (0.003 * Math.Sin(2 * Math.PI * 250 * t)));
        var result = Analyzer.Analyze(new MemoryCaptureSource(samples, fs), new AnalysisOptions());
        Assert.Empty(result.Components.Tones);
    }

    // ---- Closed forms on spectra built from the rectangular window's kernel ---------------------------------------
    // ToneFinder reads an averaged spectrum of bin RMS values. For a tone of RMS R at β bins, the rectangular
    // window's Dirichlet kernel (large-N form, negative-frequency image left out) gives bin k the RMS
    // R·|sin π(k − β)/(π(k − β))|. For such a spectrum the two-bin ratio r of the peak and its larger neighbour is
    // δ/(1 − δ) exactly, so δ = r/(1 + r) and the scalloping correction πδ/sin(πδ) return β and R exactly.

    private const double ResolutionHz = 5; // 10 cycles of 50 Hz per window (IEC 61000-4-7)
    private const int Cycles = 10;
    private const int MaxOrder = 50;
    private const int Bins = 2001;

    /// <summary>|sin πx/(πx)|: 1 at 0, exactly 0 at the other integers (where Math.Sin(π·n) leaves ~1e-16).</summary>
    private static double Kernel(double x) => Math.Abs(x) < 1e-12 ? 1
        : Math.Abs(x - Math.Round(x)) < 1e-12 ? 0
        : Math.Abs(Math.Sin(Math.PI * x) / (Math.PI * x));

    private static double[] Empty() => new double[Bins];

    /// <summary>Adds a kernel-shaped tone of RMS <paramref name="rmsA"/> at <paramref name="bins"/> (fractional) over
    /// ±8 bins around it (the kernel falls below 4 % of R beyond).</summary>
    private static double[] AddTone(double[] rms, double bins, double rmsA)
    {
        var centre = (int)Math.Round(bins);
        for (var k = Math.Max(0, centre - 8); k <= Math.Min(rms.Length - 1, centre + 8); k++)
        {
            rms[k] = Math.Sqrt((rms[k] * rms[k]) + Math.Pow(rmsA * Kernel(k - bins), 2));
        }

        return rms;
    }

    private static SpectrumResult Spectrum(double[] rms) =>
        new(ResolutionHz, Enumerable.Range(0, rms.Length).Select(k => k * ResolutionHz).ToArray(), rms);

    private static IReadOnlyList<ToneValue> Find(double[] rms, int count = 5, double acRmsA = 0.01, int maxOrder = MaxOrder) =>
        ToneFinder.Strongest(Spectrum(rms), Cycles, maxOrder, count, acRmsA);

    [Theory]
    [InlineData(1463.0)] // on a bin: its neighbours are the kernel's zeros
    [InlineData(1463.5)] // exactly between two bins: equal bins, δ = 1/2, scalloping 2/π (−3.9 dB)
    [InlineData(1463.1)]
    [InlineData(1463.25)]
    [InlineData(1463.4)]
    [InlineData(1462.7)] // peak on 1463, larger neighbour below
    [InlineData(1462.55)]
    public void A_tone_of_the_kernel_is_found_at_its_frequency_with_its_rms(double bins)
    {
        // Closed form (Dirichlet kernel of the rectangular window, see above): frequency β·5 Hz and RMS R, both
        // exact within rounding (1e-9 Hz, 1e-12 relative). Bin 1463 (7315 Hz) is 3 bins from the nearest harmonic,
        // outside every subgroup and off the comb.
        const double rmsA = 0.002;
        var tone = Assert.Single(Find(AddTone(Empty(), bins, rmsA)));
        Assert.Equal(bins * ResolutionHz, tone.FrequencyHz, 1e-9);
        Assert.Equal(rmsA, tone.RmsA, 1e-12 * rmsA);
    }

    [Fact]
    public void Between_two_bins_the_peak_bin_shows_2_over_pi_of_the_rms()
    {
        // Closed form: sin(π/2)/(π/2) = 2/π; so the peak bin alone would read 36 % low, and the three-bin root-sum-
        // square R·(2/π)·√(2 + 1/9) (bins at distance 1/2, 1/2, 3/2) still 7.5 % low: the correction must win.
        var rms = AddTone(Empty(), 1463.5, 0.002);
        Assert.Equal(0.002 * 2 / Math.PI, rms[1463], 1e-15);
        Assert.Equal(rms[1463], rms[1464], 1e-15);
        var tone = Assert.Single(Find(rms));
        Assert.Equal(0.002, tone.RmsA, 1e-15);
    }

    [Fact]
    public void A_tone_spread_over_three_bins_keeps_their_root_sum_square()
    {
        // A tone smeared by modulation or drift: bins 0.9, 1, 0.9 mA. The kernel correction assumes a pure tone
        // (δ = 0.9/1.9, about 1.49 mA); Parseval puts the power of the three bins at √(0.81 + 1 + 0.81) = 1.619 mA,
        // which is larger and is kept.
        var rms = Empty();
        rms[1462] = 0.0009;
        rms[1463] = 0.001;
        rms[1464] = 0.0009;
        var tone = Assert.Single(Find(rms));
        Assert.Equal(Math.Sqrt(0.0009 * 0.0009 * 2 + (0.001 * 0.001)), tone.RmsA, 1e-15);
        Assert.Equal((1463 + (0.9 / 1.9)) * ResolutionHz, tone.FrequencyHz, 1e-9);
    }

    [Fact]
    public void Bin_zero_holds_the_dc_and_is_no_neighbour()
    {
        // A 6.5 Hz motor tone (1.3 bins) on DC: bin 0 carries the DC as well as the kernel's tail, so it is larger than
        // bin 2 but says nothing about the tone. The refinement uses bin 2: δ = 0.3 exactly (closed form as above).
        var rms = AddTone(Empty(), 1.3, 0.002);
        rms[0] = 0.001;
        Assert.True(rms[0] > rms[2] && rms[0] < rms[1]);
        var tone = Assert.Single(Find(rms));
        Assert.Equal(6.5, tone.FrequencyHz, 1e-9);
        Assert.Equal(0.002, tone.RmsA, 1e-15);
    }

    [Fact]
    public void On_bin_2_the_larger_neighbour_below_is_bin_1()
    {
        // An 8.5 Hz motor tone (1.7 bins): peak on bin 2, bin 1 (distance 0.7) larger than bin 3 (distance 1.3), so
        // the refinement goes down by δ = 0.3 (closed form as above).
        var tone = Assert.Single(Find(AddTone(Empty(), 1.7, 0.002)));
        Assert.Equal(8.5, tone.FrequencyHz, 1e-9);
        Assert.Equal(0.002, tone.RmsA, 1e-15);
    }

    [Fact]
    public void No_spectrum_is_refused()
    {
        Assert.Throws<ArgumentNullException>(() => ToneFinder.Strongest(null!, Cycles, MaxOrder, 5, 0.01));
    }

    [Fact]
    public void Tones_come_strongest_first_and_at_most_count()
    {
        var rms = AddTone(AddTone(AddTone(Empty(), 733.0, 0.001), 1463.25, 0.003), 1877.5, 0.002);
        var all = Find(rms);
        Assert.Equal([0.003, 0.002, 0.001], all.Select(t => Math.Round(t.RmsA, 12)));
        var two = Find(rms, count: 2);
        Assert.Equal([1463.25 * ResolutionHz, 1877.5 * ResolutionHz], two.Select(t => Math.Round(t.FrequencyHz, 6)));
    }

    [Fact]
    public void The_reporting_threshold_is_half_a_percent_of_the_ac_rms_with_a_floor()
    {
        // MinShareOfAc = 0.5 % of the AC RMS, compared with the three-bin root-sum-square; equal counts as reached.
        // An on-bin tone has that sum equal to its bin (closed form: its neighbours are the kernel's zeros).
        const double toneA = 0.0005;
        var acRms = toneA / ToneFinder.MinShareOfAc;
        Assert.Equal(toneA, ToneFinder.MinShareOfAc * acRms);
        var rms = AddTone(Empty(), 1463, toneA);
        Assert.Single(Find(rms, acRmsA: acRms));
        Assert.Empty(Find(rms, acRmsA: acRms * (1 + 1e-12)));

        // With no AC at all the floor of 0.1 µA (1e-7 A) applies: 0.2 µA is a tone, 0.05 µA is not.
        Assert.Single(Find(AddTone(Empty(), 1463, 2e-7), acRmsA: 0));
        Assert.Empty(Find(AddTone(Empty(), 1463, 5e-8), acRmsA: 0));
    }

    [Fact]
    public void Harmonic_subgroups_are_not_tones_and_the_bins_beside_them_are()
    {
        // IEC 61000-4-7 subgroup of order n: bins 10n − 1 .. 10n + 1 (orders 1 to 50 here). A tone on bin 1462
        // (order 146, beyond the grouped orders, 2 bins off the harmonic) is a tone; one on bin 251 (order 25,
        // within its subgroup) is not; one on bin 248 (2 bins below order 25) is.
        Assert.Empty(Find(AddTone(Empty(), 251, 0.002)));
        Assert.Empty(Find(AddTone(Empty(), 499, 0.002)));
        Assert.Equal(248 * ResolutionHz, Assert.Single(Find(AddTone(Empty(), 248, 0.002))).FrequencyHz, 1e-9);
        Assert.Equal(1462 * ResolutionHz, Assert.Single(Find(AddTone(Empty(), 1462, 0.002))).FrequencyHz, 1e-9);
    }

    [Theory]
    [InlineData(600, 0.004, 590, 610, true)]   // exactly 4 × (CombContrast) both neighbours: stands out
    [InlineData(600, 0.0039, 590, 610, false)] // just under: part of the comb
    [InlineData(600, 0.0039, 589, -1, false)]  // only harmonic 59 (one bin below it) beside it: still the comb
    [InlineData(600, 0.0039, -1, 611, false)]  // only harmonic 61 (one bin above it)
    [InlineData(600, 0.0039, -1, 610, false)]
    [InlineData(601, 0.0039, 590, 610, false)] // one bin off the harmonic: still judged against the comb
    [InlineData(602, 0.0039, 590, 610, true)]  // two bins off: not on a harmonic, a tone
    public void A_peak_on_a_harmonic_above_the_grouped_orders_must_stand_above_its_neighbours(int bin, double peakA,
        int lowerBin, int upperBin, bool isTone)
    {
        // CombContrast = 4: a peak on (or one bin beside) harmonic n > H is a tone only if it is at least 4 × the
        // largest bin within ±1 of harmonics n − 1 and n + 1 (here 1 mA on the bins given; −1: none).
        var rms = Empty();
        foreach (var b in new[] { lowerBin, upperBin }.Where(b => b >= 0))
        {
            rms[b] = 0.001;
        }

        rms[bin] = peakA;
        var found = Find(rms).Where(t => Math.Abs(t.FrequencyHz - (bin * ResolutionHz)) < 1).ToList();
        Assert.Equal(isTone, found.Count == 1);
    }

    [Fact]
    public void A_smooth_harmonic_comb_beyond_the_grouped_orders_is_not_a_tone()
    {
        // A phase-cut edge's harmonics fall as 1/n (Fourier series of a step): orders 2 to 5 with only order 1 grouped,
        // and orders 51 to 120 with the usual 50; on or one bin beside each harmonic. None is a tone.
        var low = Empty();
        for (var n = 1; n <= 5; n++)
        {
            low[n * Cycles] = 0.01 / n;
        }

        Assert.Empty(Find(low, maxOrder: 1));

        foreach (var offset in new[] { 0, 1, -1 })
        {
            var high = Empty();
            for (var n = 51; n <= 120; n++)
            {
                high[(n * Cycles) + offset] = 0.01 / n;
            }

            Assert.Empty(Find(high));
        }
    }

    [Fact]
    public void A_peak_at_the_top_of_the_spectrum_is_judged_with_the_neighbours_that_exist()
    {
        // Harmonic 200 on bin 2000 is the last bin, never a peak (no bin above it); harmonic 199 on bin 1990 has its
        // order + 1 neighbours at bins 1999..2001, of which 2001 lies beyond the spectrum.
        var rms = Empty();
        rms[1990] = 0.002;
        rms[1980] = 0.0001;
        var tone = Assert.Single(Find(rms));
        Assert.Equal(1990 * ResolutionHz, tone.FrequencyHz, 1e-9);
    }
}

