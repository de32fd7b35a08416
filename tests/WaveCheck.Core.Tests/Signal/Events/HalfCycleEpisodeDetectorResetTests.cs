using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="HalfCycleEpisodeDetector"/> when it is used again after an episode closes (each episode's figures its
/// own), when a capture ends inside an episode, and its argument checks. Bursts are 50 Hz sines at 10 kHz starting on a
/// half-cycle boundary: closed form, each half-cycle's RMS is the burst's RMS (mean of sin² over a half period = 1/2).
/// </summary>
public class HalfCycleEpisodeDetectorResetTests
{
    private const double Fs = 10_000;
    private const int WindowSamples = 2_000; // 10 cycles of 50 Hz

    private static double[] Bursts(int samples, params (int From, int To, double RmsA)[] bursts)
    {
        var x = new double[samples];
        foreach (var (from, to, rmsA) in bursts)
        {
            for (var k = from; k < to; k++)
            {
                x[k] = rmsA * Math.Sqrt(2) * Math.Sin(2 * Math.PI * 50 * k / Fs);
            }
        }

        return x;
    }

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

    [Fact]
    public void A_second_episode_has_only_its_own_figures()
    {
        // 0.3 s at 50 mA (0.1 to 0.4 s), then 0.05 s at 20 mA (0.6 to 0.65 s), levels 10 and 30 mA. The second
        // episode: 5 half-cycles of 20 mA (closed form), so its RMS is 20 mA, its envelope 5 points of 20 mA, its
        // longest stretch 0.05 s at 10 mA and none at 30 mA; nothing of the first or of the quiet half-cycles that
        // closed it.
        var r = Detect(Bursts(10_000, (1_000, 4_000, 0.050), (6_000, 6_500, 0.020)), 0.010, 0.030);
        Assert.Equal(2, r.Episodes.Count);
        var second = r.Episodes[1];
        Assert.Equal(0.6, second.StartS, 1e-12);
        Assert.Equal(0.05, second.DurationS, 1e-12);
        Assert.Equal(0.020, second.RmsA, 1e-12);
        Assert.Equal(0.020, second.MaxHalfCycleRmsA, 1e-12);
        Assert.Equal(5, second.EnvelopeRmsA.Count);
        Assert.All(second.EnvelopeRmsA, v => Assert.Equal(0.020, v, 1e-12));
        Assert.Equal(0.05, second.LongestRunS[0], 1e-12);
        Assert.Equal(0.0, second.LongestRunS[1]);
        Assert.Equal(0.3, r.Episodes[0].LongestRunS[1], 1e-12);
    }

    [Fact]
    public void An_episode_still_open_at_the_end_keeps_its_stretches()
    {
        // 50 mA from 0.5 s to the end (1.0 s): closed by Close(), its stretches at 10 and 30 mA are 0.5 s each.
        var r = Detect(Bursts(10_000, (5_000, 10_000, 0.050)), 0.010, 0.030);
        var e = Assert.Single(r.Episodes);
        Assert.Equal(0.5, e.DurationS, 1e-12);
        Assert.Equal(0.5, e.LongestRunS[0], 1e-12);
        Assert.Equal(0.5, e.LongestRunS[1], 1e-12);
    }

    [Fact]
    public void Missing_or_bad_levels_are_refused_with_what_is_expected()
    {
        // Constructor contract (levels: at least one, each finite and ≥ 0 A).
        Assert.Throws<ArgumentNullException>(() => new HalfCycleEpisodeDetector(Fs, null!));
        var none = Assert.Throws<ArgumentException>(() => new HalfCycleEpisodeDetector(Fs, []));
        Assert.Contains("at least one level", none.Message, StringComparison.Ordinal);
        var negative = Assert.Throws<ArgumentOutOfRangeException>(() => new HalfCycleEpisodeDetector(Fs, [-0.001]));
        Assert.Contains("finite and at least 0 A", negative.Message, StringComparison.Ordinal);
    }
}
