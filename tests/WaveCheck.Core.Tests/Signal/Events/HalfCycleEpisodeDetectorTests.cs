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
}
