using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Signal;

public class HalfCycleEpisodeDetectorTests
{
    private const double Fs = 10_000;
    private const double MainsHz = 50;
    private const int WindowSamples = 2_000; // 10 cycles of 50 Hz
    private const double HalfCycleS = 0.01;

    /// <summary>Feeds samples to a detector in windows of 10 cycles, as the analysis does, and closes it.</summary>
    private static HalfCycleEpisodesResult Detect(double[] samples, params double[] levelsA)
    {
        var detector = new HalfCycleEpisodeDetector(Fs, levelsA);
        for (var start = 0; start + WindowSamples <= samples.Length; start += WindowSamples)
        {
            detector.Add(samples.AsSpan(start, WindowSamples), start / Fs, 10);
        }

        detector.Close();
        return detector.Result();
    }

    private static double Burst(double t, double startS, double durationS, double rmsA, double phaseRad = 0) =>
        t >= startS && t < startS + durationS ? rmsA * Math.Sqrt(2) * Math.Sin((2 * Math.PI * MainsHz * t) + phaseRad) : 0;

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.7)]
    [InlineData(2.1)]
    public void A_half_cycle_of_a_sine_has_the_sine_s_rms_whatever_its_phase(double phaseRad)
    {
        // Closed form: the mean of sin² over half a period is 1/2 from any starting phase, so each half-cycle's RMS
        // is the sine's RMS (20 mA) within float rounding.
        var samples = Synth.Make(Fs, 1.0, t => 0.020 * Math.Sqrt(2) * Math.Sin((2 * Math.PI * MainsHz * t) + phaseRad));
        var e = Assert.Single(Detect(samples, 0.010).Episodes);
        Assert.All(e.EnvelopeRmsA, v => Assert.Equal(0.020, v, 1e-12));
        Assert.Equal(0.020, e.RmsA, 1e-12);
        Assert.Equal(0.0, e.MeanA, 1e-12);
        Assert.Equal(HalfCycleS, e.HalfCycleS, 1e-12);
    }

    [Fact]
    public void A_surge_s_duration_is_measured_within_two_half_cycles_wherever_it_starts()
    {
        // Engineering choice documented at Limits.ReplayTimeResolutionHalfCycles: each end of a surge may fall in a
        // half-cycle it only partly fills, so the count lies within two half-cycles of the true duration. Checked for
        // 200 start times and phases (fixed seed) and three levels from a fifth of the surge up to nearly all of it.
        var random = new Random(17);
        for (var i = 0; i < 200; i++)
        {
            var startS = 0.3 + (random.NextDouble() * 0.2);
            var durationS = 0.02 + (random.NextDouble() * 0.3);
            var phase = random.NextDouble() * 2 * Math.PI;
            var samples = Synth.Make(Fs, 1.0, t => Burst(t, startS, durationS, 0.050, phase));
            var r = Detect(samples, 0.010, 0.030, 0.049);
            var e = Assert.Single(r.Episodes);
            foreach (var run in e.LongestRunS)
            {
                Assert.InRange(run, durationS - (2 * HalfCycleS), durationS + (2 * HalfCycleS));
            }
        }
    }

    [Fact]
    public void A_half_wave_current_is_one_stretch_not_one_per_pulse()
    {
        // Half-wave rectified pulses of 100 mA peak for 0.3 s from 0.2 s: the half-cycles alternate between a pulse
        // and nothing, yet the stretch at 20 mA runs through the whole train (one half-cycle bridged) and
        // lasts 0.3 s within two half-cycles; one episode.
        var samples = Synth.Make(Fs, 1.0, t => t >= 0.2 && t < 0.5 ? Synth.PhaseCut(t - 0.2, MainsHz, 0.100, 0) : 0);
        var r = Detect(samples, 0.020);
        var e = Assert.Single(r.Episodes);
        Assert.InRange(e.LongestRunS[0], 0.3 - (2 * HalfCycleS), 0.3 + (2 * HalfCycleS));
        Assert.Equal(1, r.Found);
    }

    [Fact]
    public void Surges_apart_by_more_than_a_half_cycle_are_separate_episodes()
    {
        // Two bursts of 40 mA, 50 ms each, 30 ms apart (three half-cycles): two episodes, at their start times.
        var samples = Synth.Make(Fs, 1.0, t => Burst(t, 0.2, 0.05, 0.040) + Burst(t, 0.28, 0.05, 0.040));
        var r = Detect(samples, 0.020);
        Assert.Equal(2, r.Found);
        Assert.Equal([0.2, 0.28], r.Episodes.Select(e => Math.Round(e.StartS, 9)));
        Assert.All(r.Episodes, e => Assert.Equal(0.05, e.DurationS, 1e-9));
        Assert.Null(r.UnlistedMaxRunS);
    }

    [Fact]
    public void The_standing_leakage_is_the_rms_outside_the_episodes()
    {
        // 5 mA standing sine with a 60 mA burst from 0.3 to 0.4 s: outside the episode every half-cycle holds the
        // 5 mA sine (closed form: its RMS), whatever the burst.
        var samples = Synth.Make(Fs, 1.0, t => (0.005 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * MainsHz * t)) + Burst(t, 0.3, 0.1, 0.055));
        var r = Detect(samples, 0.020);
        Assert.Equal(1, r.Found);
        Assert.Equal(0.005, r.QuietRmsA!.Value, 1e-9);
    }

    [Fact]
    public void Episodes_beyond_the_list_are_counted_and_their_longest_stretch_kept()
    {
        // 250 bursts of 20 ms every 100 ms, the last one 60 ms long: 200 listed, 250 found, and the unlisted maximum
        // at the level holds the 60 ms of the last (bounded list, nothing lost for the replay).
        var samples = Synth.Make(Fs, 25.2, t =>
        {
            var k = (int)Math.Floor(t / 0.1);
            return k < 250 ? Burst(t, k * 0.1, k == 249 ? 0.06 : 0.02, 0.040) : 0;
        });
        var r = Detect(samples, 0.020);
        Assert.Equal(250, r.Found);
        Assert.Equal(HalfCycleEpisodeDetector.MaxEpisodes, r.Episodes.Count);
        Assert.Equal(0.06, Assert.Single(r.UnlistedMaxRunS!), 1e-9);
    }

    [Fact]
    public void A_long_episode_keeps_a_bounded_envelope_with_its_largest_half_cycle()
    {
        // 8 s above the level (800 half-cycles) with one 90 mA half-cycle at 5.0 s: the envelope holds at most 256
        // points of 4 half-cycles each (two halvings), and its largest point is the 90 mA half-cycle.
        var samples = Synth.Make(Fs, 8.0, t => 0.030 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * MainsHz * t) * (t >= 5.0 && t < 5.01 ? 3 : 1));
        var e = Assert.Single(Detect(samples, 0.010).Episodes);
        Assert.InRange(e.EnvelopeRmsA.Count, 1, HalfCycleEpisodeDetector.EnvelopeCapacity);
        Assert.Equal(4 * HalfCycleS, e.EnvelopeStepS, 1e-12);
        Assert.Equal(0.090, e.EnvelopeRmsA.Max(), 1e-9);
        Assert.Equal(0.090, e.MaxHalfCycleRmsA, 1e-9);
        Assert.Equal(8.0, e.DurationS, 1e-9);
    }

    [Fact]
    public void The_existing_events_are_unchanged_by_the_replay_levels()
    {
        // The events and warnings of the analysis serialise byte for byte the same with and without the half-cycle
        // levels, and without levels the analysis carries no episodes (its JSON as before).
        List<WaveformComponent> parts =
        [
            new SineComponent(0.004, 50),
            new SurgeComponent(0.060, 50, 2.3, 0.12),
            new SurgeComponent(0.2, 50, 3.105, 0.0003),
            new NoiseComponent(1e-4, 3),
        ];
        AnalysisResult Analyze(IReadOnlyList<double> levels)
        {
            using var source = new SynthCaptureSource(parts, Fs, 4.0);
            return Analyzer.Analyze(source, new AnalysisOptions { MainsHz = 50, AlarmA = 0.02, WorkerCount = 1, HalfCycleLevelsA = levels });
        }

        var plain = Analyze([]);
        var replayed = Analyze([0.015, 0.030]);
        Assert.NotEmpty(plain.Events);
        Assert.Equal(ResultJson.Serialize(plain.Events), ResultJson.Serialize(replayed.Events));
        Assert.Equal(ResultJson.Serialize(plain.Warnings), ResultJson.Serialize(replayed.Warnings));
        Assert.Null(plain.HalfCycleEpisodes);
        Assert.NotNull(replayed.HalfCycleEpisodes);
        Assert.Equal(ResultJson.Serialize(plain with { ToolVersion = "x" }),
            ResultJson.Serialize(replayed with { ToolVersion = "x", HalfCycleEpisodes = null }));
    }

    // ---- Closed forms on half-cycles built sample by sample (issue 18: mutation testing) ---------------------------

    /// <summary>A sine of 100 samples a half-cycle whose RMS is set half-cycle by half-cycle: half-cycle h holds
    /// (−1)^h·√2·rms[h]·sin(πm/100), m = 0..99, then zeros up to <paramref name="totalS"/>. Closed form: Σ sin²(πm/100)
    /// over m = 0..99 is exactly 50 (half the count), so each half-cycle's RMS is rms[h] within rounding.</summary>
    private static double[] Profile(double totalS, params double[] rmsA)
    {
        var samples = new double[(int)Math.Round(totalS * Fs)];
        for (var h = 0; h < rmsA.Length; h++)
        {
            for (var m = 0; m < 100; m++)
            {
                samples[(h * 100) + m] = (h % 2 == 0 ? 1 : -1) * rmsA[h] * Math.Sqrt(2) * Math.Sin(Math.PI * m / 100);
            }
        }

        return samples;
    }

    [Fact]
    public void A_half_wave_train_has_the_closed_form_figures_of_its_pulses_and_gaps()
    {
        // 15 half-wave pulses of 0.1 A peak, one every cycle (the second half-cycle empty), from 0.2 s: the episode runs
        // from the first pulse to the end of the last, 29 half-cycles (15 pulses, the 14 gaps between them bridged),
        // so 0.29 s at every level the pulses reach, and the gap after the last pulse is quiet. Closed forms (discrete
        // sums over m = 0..99): Σ sin(πm/100) = cot(π/200), Σ sin²(πm/100) = 50, so a pulse's half-cycle RMS is
        // Ipk/√2, the episode's mean 15·Ipk·cot(π/200)/2900 and its RMS Ipk·√(15·50/2900); the peak Ipk (m = 50).
        const double peakA = 0.1;
        var samples = new double[10_000];
        for (var c = 0; c < 15; c++)
        {
            for (var m = 0; m < 100; m++)
            {
                samples[2000 + (c * 200) + m] = peakA * Math.Sin(Math.PI * m / 100);
            }
        }

        var r = Detect(samples, 0.020, 0.070);
        var e = Assert.Single(r.Episodes);
        Assert.Equal(1, r.Found);
        Assert.Equal(0.2, e.StartS, 1e-12);
        Assert.Equal(0.29, e.DurationS, 1e-12);
        Assert.Equal([0.29, 0.29], e.LongestRunS, (a, b) => Math.Abs(a - b) < 1e-12);
        Assert.Equal(HalfCycleS, e.HalfCycleS, 1e-12);
        Assert.Equal(peakA, e.PeakA, 1e-15);
        Assert.Equal(peakA / Math.Sqrt(2), e.MaxHalfCycleRmsA, 1e-12);
        Assert.Equal(15 * peakA / Math.Tan(Math.PI / 200) / 2900, e.MeanA, 1e-12);
        Assert.Equal(peakA * Math.Sqrt(15 * 50.0 / 2900), e.RmsA, 1e-12);
        // The envelope: one point a half-cycle, pulse and gap in turn.
        Assert.Equal(29, e.EnvelopeRmsA.Count);
        Assert.Equal(HalfCycleS, e.EnvelopeStepS, 1e-12);
        for (var i = 0; i < 29; i++)
        {
            Assert.Equal(i % 2 == 0 ? peakA / Math.Sqrt(2) : 0, e.EnvelopeRmsA[i], 1e-12);
        }

        // Outside the episode nothing flows: the quiet RMS is 0, not absent (there are quiet half-cycles).
        Assert.Equal(0.0, r.QuietRmsA!.Value);
    }

    [Fact]
    public void A_negative_pulse_s_peak_is_its_magnitude()
    {
        // One half-cycle of −50 mA RMS (a sine's negative half): the peak is |−√2·0.05| = 70.7 mA (closed form, m = 50).
        var samples = Profile(1.0, 0, 0);
        for (var m = 0; m < 100; m++)
        {
            samples[3000 + m] = -0.05 * Math.Sqrt(2) * Math.Sin(Math.PI * m / 100);
        }

        var e = Assert.Single(Detect(samples, 0.020).Episodes);
        Assert.Equal(0.05 * Math.Sqrt(2), e.PeakA, 1e-15);
        Assert.Equal(0.3, e.StartS, 1e-12);
        Assert.Equal(HalfCycleS, e.DurationS, 1e-12);
    }

    [Fact]
    public void A_half_cycle_exactly_at_a_level_counts_as_reaching_it()
    {
        // DC of 2⁻⁶ A = 15.625 mA for 0.1 s (10 half-cycles): its squares, sums and square root are exact in binary, so
        // each half-cycle's RMS is 2⁻⁶ exactly, and "reaches" (at or above, IEC 61008-1's wording for the operating
        // current) counts it at both levels set there; 2⁻⁵ is never reached (run 0).
        const double levelA = 1.0 / 64;
        var samples = new double[10_000];
        Array.Fill(samples, levelA, 1000, 1000);
        var r = Detect(samples, levelA, levelA, 2 * levelA);
        var e = Assert.Single(r.Episodes);
        Assert.Equal([0.1, 0.1, 0.0], e.LongestRunS, (a, b) => Math.Abs(a - b) < 1e-12);
        Assert.Equal(levelA, e.MeanA, 1e-15);
        Assert.Equal(levelA, e.MaxHalfCycleRmsA);
    }

    [Fact]
    public void A_higher_level_s_longest_stretch_is_the_longer_of_two()
    {
        // Half-cycle RMS (mA): 10 × 0, then 5 × 80, 2 × 40, 8 × 80, 2 × 40, then 0. At 60 mA the two stretches of 80
        // are 50 and 80 ms apart by two half-cycles (more than the one bridged): the longest is 80 ms, not their sum
        // nor the first; at 20 mA the whole 170 ms is one stretch.
        List<double> rms = [.. Enumerable.Repeat(0.0, 10)];
        rms.AddRange(Enumerable.Repeat(0.080, 5));
        rms.AddRange(Enumerable.Repeat(0.040, 2));
        rms.AddRange(Enumerable.Repeat(0.080, 8));
        rms.AddRange(Enumerable.Repeat(0.040, 2));
        var e = Assert.Single(Detect(Profile(1.0, [.. rms]), 0.020, 0.060).Episodes);
        Assert.Equal([0.17, 0.08], e.LongestRunS, (a, b) => Math.Abs(a - b) < 1e-12);
        Assert.Equal(0.1, e.StartS, 1e-12);

        // Reversed order (the longer stretch first): still 80 ms.
        List<double> reversed = [.. Enumerable.Repeat(0.0, 10)];
        reversed.AddRange(Enumerable.Repeat(0.080, 8));
        reversed.AddRange(Enumerable.Repeat(0.040, 2));
        reversed.AddRange(Enumerable.Repeat(0.080, 5));
        var f = Assert.Single(Detect(Profile(1.0, [.. reversed]), 0.020, 0.060).Episodes);
        Assert.Equal([0.15, 0.08], f.LongestRunS, (a, b) => Math.Abs(a - b) < 1e-12);
    }

    [Fact]
    public void One_half_cycle_below_a_higher_level_is_bridged_there_too()
    {
        // Half-cycle RMS (mA): 4 × 80, 1 × 40, 4 × 80: at 60 mA a gap of one half-cycle is bridged (engineering choice,
        // BridgedHalfCycles = 1): one stretch of 90 ms, as at 20 mA.
        List<double> rms = [.. Enumerable.Repeat(0.0, 10)];
        rms.AddRange(Enumerable.Repeat(0.080, 4));
        rms.Add(0.040);
        rms.AddRange(Enumerable.Repeat(0.080, 4));
        var e = Assert.Single(Detect(Profile(1.0, [.. rms]), 0.020, 0.060).Episodes);
        Assert.Equal([0.09, 0.09], e.LongestRunS, (a, b) => Math.Abs(a - b) < 1e-12);
    }

    [Fact]
    public void A_capture_above_the_threshold_throughout_has_no_quiet_rms()
    {
        // Every half-cycle at 20 mA RMS against a 10 mA threshold: no half-cycle outside the episode, so no standing
        // figure (null, not 0/0).
        var samples = Synth.Make(Fs, 0.4, t => 0.020 * Math.Sqrt(2) * Math.Sin(2 * Math.PI * MainsHz * t));
        var r = Detect(samples, 0.010);
        Assert.Null(r.QuietRmsA);
        Assert.Equal(0.4, Assert.Single(r.Episodes).DurationS, 1e-12);
    }

    [Theory]
    [InlineData(800, 200)] // 128 points of 4, then 288 half-cycles in 72 points of 4
    [InlineData(802, 201)] // the same, and a last point of 2 half-cycles
    public void A_long_episode_s_envelope_has_the_closed_form_count_and_keeps_the_largest(int halfCycles, int points)
    {
        // Closed form of the halving: 256 points of one half-cycle fill the envelope, which halves to 128 points of 2;
        // 256 points again at 512 half-cycles, halved to 128 points of 4; the remaining N − 512 half-cycles add
        // ⌈(N − 512)/4⌉ points. A 90 mA half-cycle (30 mA elsewhere) is the last one: it stands in the last point,
        // whether that point is full or not.
        var rms = Enumerable.Repeat(0.030, halfCycles).ToArray();
        rms[^1] = 0.090;
        var e = Assert.Single(Detect(Profile(9.0, rms), 0.010).Episodes);
        Assert.Equal(points, e.EnvelopeRmsA.Count);
        Assert.Equal(4 * HalfCycleS, e.EnvelopeStepS, 1e-12);
        Assert.Equal(0.090, e.EnvelopeRmsA[^1], 1e-12);
        Assert.All(e.EnvelopeRmsA.Take(points - 1), v => Assert.Equal(0.030, v, 1e-12));
        Assert.Equal(halfCycles * HalfCycleS, e.DurationS, 1e-9);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    public void The_larger_of_each_pair_is_kept_when_the_envelope_halves(int position)
    {
        // 300 half-cycles at 30 mA with one of 90 mA at half-cycle 100 + position: at 256 the pair (100, 101) merges
        // into one point, which must hold the 90 mA whichever of the two it was.
        var rms = Enumerable.Repeat(0.030, 300).ToArray();
        rms[100 + position] = 0.090;
        var e = Assert.Single(Detect(Profile(4.0, rms), 0.010).Episodes);
        Assert.Equal(128 + 22, e.EnvelopeRmsA.Count);
        Assert.Equal(0.090, e.EnvelopeRmsA[50], 1e-12);
        Assert.Equal(0.090, e.EnvelopeRmsA.Max(), 1e-12);
    }

    [Fact]
    public void Half_cycles_of_a_window_too_short_to_hold_them_are_skipped()
    {
        // 10 samples for 10 cycles (20 half-cycles): boundaries ⌊h·10/20⌋ leave every other half-cycle empty; the empty
        // ones are skipped, the others hold one sample each. All at 50 mA: one episode of 10 samples, a half-cycle of
        // one sample period, the maximum 50 mA (not the NaN of an empty half-cycle).
        var detector = new HalfCycleEpisodeDetector(Fs, [0.010]);
        detector.Add(Enumerable.Repeat(0.050, 10).ToArray(), 0, 10);
        detector.Close();
        var e = Assert.Single(detector.Result().Episodes);
        Assert.Equal(0.050, e.MaxHalfCycleRmsA, 1e-15);
        Assert.Equal(1 / Fs, e.HalfCycleS, 1e-15);
        Assert.Equal(10 / Fs, e.DurationS, 1e-15);
        Assert.Equal(0.050, e.RmsA, 1e-15);
    }

    [Fact]
    public void Levels_must_be_given_finite_and_not_negative()
    {
        Assert.Throws<ArgumentException>(() => new HalfCycleEpisodeDetector(Fs, []));
        Assert.Throws<ArgumentOutOfRangeException>(() => new HalfCycleEpisodeDetector(Fs, [0.01, -0.001]));
        Assert.Throws<ArgumentOutOfRangeException>(() => new HalfCycleEpisodeDetector(Fs, [double.NaN]));
        Assert.Throws<ArgumentOutOfRangeException>(() => new HalfCycleEpisodeDetector(Fs, [0.01, double.PositiveInfinity]));
        // 0 A is a level (every half-cycle reaches it).
        var r = Detect(new double[4000], 0.0);
        Assert.Equal(0.4, Assert.Single(r.Episodes).DurationS, 1e-12);
    }
}
