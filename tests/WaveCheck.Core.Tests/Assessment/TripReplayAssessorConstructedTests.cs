using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The trip replay on constructed episodes: a rectangular surge of half-cycle RMS I lasting T is what an ideal
/// detector reports as T at every level up to I and 0 above it, so the rules are checked against the standards' tables
/// without the analysis in between (fast, and exact at each limit). Limits (REFERENCE.md, "Tripping ranges and
/// times", std): general type break times 300 / 150 / 40 ms at 1 / 2 / 5 IΔn (IEC 61008-1 / IEC 61009-1); type S
/// break 500 / 200 / 150 ms, non-actuating 130 / 60 / 50 ms; smooth DC 300 / 150 / 40 ms at 2 / 4 / 10 IΔn (IEC 62423);
/// non-operating current 0.5 IΔn. Ratings in use 10, 30, 100, 300, 500 mA (REFERENCE.md, practice). Uncertainty: the
/// default 2 % + 0.1 mA, and two half-cycles (20 ms at 50 Hz) for a duration (engineering choice, Limits).
/// </summary>
public class TripReplayAssessorConstructedTests
{
    private static readonly AssessmentOptions Thirty = new() { RatedResidualCurrentA = 0.030 };

    internal static HalfCycleEpisode Episode(AssessmentOptions o, double rmsA, double durationS, double meanA = 0, double startS = 1.0) => new()
    {
        StartS = startS,
        DurationS = durationS,
        HalfCycleS = 0.01,
        PeakA = rmsA * Math.Sqrt(2),
        MaxHalfCycleRmsA = rmsA,
        RmsA = rmsA,
        MeanA = meanA,
        LongestRunS = Runs(o, rmsA, durationS),
        EnvelopeStepS = 0.01,
        EnvelopeRmsA = [rmsA],
    };

    internal static double[] Runs(AssessmentOptions o, double rmsA, double durationS) =>
        [.. TripReplayAssessor.LevelsFor(o).Select(l => rmsA >= l ? durationS : 0)];

    internal static TripReplayResult Replay(AssessmentOptions o, IReadOnlyList<HalfCycleEpisode> episodes, int? found = null,
        IReadOnlyList<double>? unlisted = null, double? quietA = 0.003, IReadOnlyList<EventRecord>? events = null) =>
        TripReplayAssessor.Replay(Analysis(o, episodes, found, unlisted, quietA, events), o)
        ?? throw new InvalidOperationException("no replay");

    private static AnalysisResult Analysis(AssessmentOptions o, IReadOnlyList<HalfCycleEpisode> episodes, int? found = null,
        IReadOnlyList<double>? unlisted = null, double? quietA = 0.003, IReadOnlyList<EventRecord>? events = null)
    {
        var levels = TripReplayAssessor.LevelsFor(o);
        return new AnalysisBuilder().Sine(0.003).Build() with
        {
            Events = events ?? [],
            HalfCycleEpisodes = new HalfCycleEpisodesResult
            {
                LevelsA = levels,
                ThresholdA = levels.Min(),
                BridgedHalfCycles = 1,
                Found = found ?? episodes.Count,
                Episodes = episodes,
                UnlistedMaxRunS = unlisted,
                QuietRmsA = quietA,
            },
        };
    }

    internal static DeviceFinding Of(TripReplayResult r, double ratedA, DeviceTiming timing) =>
        r.Overall.Single(f => f.Device.RatedResidualCurrentA == ratedA && f.Device.Timing == timing);

    [Fact]
    public void Levels_are_the_closed_form_bounds_of_the_uncertainty()
    {
        // MeasurementAccuracy: a reading v is below L when v + u(v) < L and surely at or above when v − u(v) ≥ L,
        // u(v) = f·v + o; solved for v: (L − o)/(1 + f) and (L + o)/(1 − f). At 0.5 × 30 mA with 2 % + 0.1 mA.
        var levels = TripReplayAssessor.LevelsFor(Thirty);
        Assert.Equal(3 * 6 * 3, levels.Count); // 3 ratings × 6 multiples × 3 variants
        Assert.Equal(0.0149 / 1.02, levels[0], 1e-15);
        Assert.Equal(0.015, levels[1], 1e-15);
        Assert.Equal(0.0151 / 0.98, levels[2], 1e-15);
        // 10 IΔn of the third rating (300 mA): the last triple.
        Assert.Equal(2.9999 / 1.02, levels[^3], 1e-12);
        Assert.Equal(3.0001 / 0.98, levels[^1], 1e-12);
        // The user's accuracy replaces the default: 5 % + 0.2 mA.
        var mine = TripReplayAssessor.LevelsFor(Thirty with { Accuracy = new MeasurementAccuracy(0.05, 0.0002) });
        Assert.Equal(0.0148 / 1.05, mine[0], 1e-15);
        Assert.Equal(0.0152 / 0.95, mine[2], 1e-15);
        // A level below the offset cannot be told from nothing: 0, not negative (0.5 × 0.1 mA − 0.1 mA < 0).
        Assert.Equal(0.0, TripReplayAssessor.LevelsFor(new AssessmentOptions { RatedResidualCurrentA = 0.0001 })[0]);
    }

    [Theory]
    [InlineData(0.030, new[] { 0.030, 0.100, 0.300 })]
    [InlineData(0.050, new[] { 0.050, 0.100, 0.300 })] // not itself in use: the next two above it
    [InlineData(0.0300001, new[] { 0.0300001, 0.100, 0.300 })] // 30 mA within 0.01 %: the same rating, not the next
    [InlineData(0.300, new[] { 0.300, 0.500 })]
    [InlineData(0.001, new[] { 0.001, 0.010, 0.030 })]
    public void The_alternatives_are_the_next_two_ratings_in_use(double installedA, double[] expected)
    {
        Assert.Equal(expected, TripReplayAssessor.RatingsFor(installedA));
    }

    [Fact]
    public void No_replay_without_episodes_or_at_another_device_s_levels()
    {
        var plain = new AnalysisBuilder().Sine(0.003).Build();
        Assert.Null(TripReplayAssessor.Replay(plain, Thirty));
        var other = Analysis(new AssessmentOptions { RatedResidualCurrentA = 0.100 }, []);
        Assert.Null(TripReplayAssessor.Replay(other, Thirty));
        Assert.NotNull(TripReplayAssessor.Replay(Analysis(Thirty, []), Thirty));
    }

    [Theory]
    // General type at 5 IΔn (40 ms) with 5.5 IΔn: clear of the 5 IΔn level by more than the 2 % + 0.1 mA.
    [InlineData(5.5, 0.061, TripFinding.WillTrip, true)] // 61 − 20 > 40 ms
    [InlineData(5.5, 0.060, TripFinding.MayTrip, true)] // 60 − 20 = 40 ms: at the limit, counted as reached
    [InlineData(5.5, 0.019, TripFinding.MayTrip, false)] // 19 + 20 < 40 ms
    // At 2 IΔn (150 ms) with 2.2 IΔn.
    [InlineData(2.2, 0.171, TripFinding.WillTrip, true)]
    [InlineData(2.2, 0.131, TripFinding.MayTrip, true)] // 131 + 20 = 151 ms: not below 150 ms, at the limit
    [InlineData(2.2, 0.129, TripFinding.MayTrip, false)] // 129 + 20 < 150 ms
    // At 1 IΔn (300 ms) with 1.1 IΔn.
    [InlineData(1.1, 0.321, TripFinding.WillTrip, true)]
    [InlineData(1.1, 0.300, TripFinding.MayTrip, true)]
    [InlineData(1.1, 0.270, TripFinding.MayTrip, false)]
    // Below 0.5 IΔn (less its uncertainty) for any time: will not trip (non-operating current).
    [InlineData(0.45, 5.0, TripFinding.WillNotTrip, false)]
    public void General_type_against_the_break_times(double multiple, double durationS, TripFinding expected, bool mustTrip)
    {
        var r = Replay(Thirty, [Episode(Thirty, multiple * 0.030, durationS)]);
        var g = Of(r, 0.030, DeviceTiming.General);
        Assert.Equal(expected, g.Finding);
        Assert.Equal(mustTrip, g.MustTripReached);
        Assert.Equal(mustTrip ? 1 : 0, r.Alerts.Count);
    }

    [Theory]
    // Type S: breaks by 500 / 200 / 150 ms; rides through when above 0.5 IΔn for under 130 ms, above IΔn under
    // 60 ms and above 2 IΔn under 50 ms (non-actuating times at 1, 2, 5 IΔn, the next higher one below each).
    [InlineData(5.5, 0.171, TripFinding.WillTrip, true)] // 171 − 20 > 150 ms
    [InlineData(5.5, 0.150, TripFinding.MayTrip, true)] // at the 150 ms limit
    [InlineData(2.2, 0.025, TripFinding.WillNotTrip, false)] // 25 + 20 < 50 ms above 2 IΔn: rides through
    [InlineData(2.2, 0.035, TripFinding.MayTrip, false)] // 35 + 20 ≥ 50 ms
    [InlineData(1.1, 0.035, TripFinding.WillNotTrip, false)] // 35 + 20 < 60 ms above IΔn
    [InlineData(1.1, 0.045, TripFinding.MayTrip, false)] // 45 + 20 ≥ 60 ms
    [InlineData(0.8, 0.105, TripFinding.WillNotTrip, false)] // 105 + 20 < 130 ms above 0.5 IΔn
    [InlineData(0.8, 0.115, TripFinding.MayTrip, false)] // 115 + 20 ≥ 130 ms
    public void Type_s_against_its_break_and_non_actuating_times(double multiple, double durationS, TripFinding expected, bool mustTrip)
    {
        var r = Replay(Thirty, [Episode(Thirty, multiple * 0.030, durationS)]);
        var s = Of(r, 0.030, DeviceTiming.S);
        Assert.Equal(expected, s.Finding);
        Assert.Equal(mustTrip, s.MustTripReached);
        if (expected == TripFinding.WillNotTrip)
        {
            Assert.Contains("shorter than its non-actuating times", s.Reason, StringComparison.Ordinal);
        }
    }

    [Theory]
    // 2.2 IΔn of smooth DC for 200 ms: against the DC table (IEC 62423: 300 ms at 2 IΔn) inside, against the AC
    // table (150 ms at 2 IΔn) outside. The DC table is used for a type B or B+ device and an episode whose mean is at
    // least 0.9 of its RMS (Limits.DcDominatedMeanShare), of either sign.
    [InlineData(DeviceType.B, 1.0, TripFinding.MayTrip)]
    [InlineData(DeviceType.BPlus, -1.0, TripFinding.MayTrip)]
    [InlineData(DeviceType.B, 0.9, TripFinding.MayTrip)]
    [InlineData(DeviceType.B, 0.89, TripFinding.WillTrip)]
    [InlineData(DeviceType.A, 1.0, TripFinding.WillTrip)]
    [InlineData(DeviceType.F, 1.0, TripFinding.WillTrip)]
    public void Smooth_dc_is_replayed_against_the_dc_table_for_type_b(DeviceType installed, double meanShare, TripFinding expected)
    {
        var o = Thirty with { InstalledType = installed };
        var rms = 2.2 * 0.030;
        var r = Replay(o, [Episode(o, rms, 0.200, meanA: meanShare * rms)]);
        Assert.Equal(expected, Of(r, 0.030, DeviceTiming.General).Finding);
        Assert.Equal(Math.Abs(meanShare) >= 0.9, Assert.Single(r.Episodes).DcDominated);
        Assert.Equal(installed >= DeviceType.B, r.Notes[^1].StartsWith("Type B: an episode of practically smooth DC", StringComparison.Ordinal));
        // DC table at 4 IΔn (150 ms) for type B: 4.4 IΔn for 171 ms is outside.
        if (installed >= DeviceType.B && Math.Abs(meanShare) >= 0.9)
        {
            var high = 4.4 * 0.030;
            Assert.Equal(TripFinding.WillTrip, Of(Replay(o, [Episode(o, high, 0.171, meanA: high)]), 0.030, DeviceTiming.General).Finding);
            Assert.Equal(TripFinding.MayTrip, Of(Replay(o, [Episode(o, high, 0.120, meanA: high)]), 0.030, DeviceTiming.General).Finding);
        }
    }

    [Fact]
    public void The_worst_episode_decides_and_a_reached_limit_is_never_forgotten()
    {
        // Will trip (5.5 IΔn, 100 ms), may trip at a limit (1.1 IΔn, 300 ms: must-trip reached), may trip inside
        // (0.6 IΔn, 20 ms): the overall finding is the worst, and "must trip reached" stays once any episode reached it.
        var willTrip = Episode(Thirty, 5.5 * 0.030, 0.100, startS: 1);
        var atLimit = Episode(Thirty, 1.1 * 0.030, 0.300, startS: 2);
        var inside = Episode(Thirty, 0.6 * 0.030, 0.020, startS: 3);
        foreach (var order in new[] { new[] { willTrip, inside }, [inside, willTrip] })
        {
            var g = Of(Replay(Thirty, order), 0.030, DeviceTiming.General);
            Assert.Equal(TripFinding.WillTrip, g.Finding);
            Assert.True(g.MustTripReached);
            Assert.Contains("at or above 5 IΔn for 100 ms, longer than its break time of 40 ms", g.Reason, StringComparison.Ordinal);
        }

        foreach (var order in new[] { new[] { atLimit, inside }, [inside, atLimit] })
        {
            var g = Of(Replay(Thirty, order), 0.030, DeviceTiming.General);
            Assert.Equal(TripFinding.MayTrip, g.Finding);
            Assert.True(g.MustTripReached);
            Assert.Contains("within the measurement's uncertainty of its break time of 300 ms", g.Reason, StringComparison.Ordinal);
        }

        var only = Of(Replay(Thirty, [inside, inside]), 0.030, DeviceTiming.General);
        Assert.Equal(TripFinding.MayTrip, only.Finding);
        Assert.False(only.MustTripReached);
        // A higher rating no episode reaches: will not trip, with the non-operating reason.
        var hundred = Of(Replay(Thirty, [inside]), 0.100, DeviceTiming.General);
        Assert.Equal(TripFinding.WillNotTrip, hundred.Finding);
        Assert.Equal("general type 100 mA: no half-cycle reached its non-operating current of 0.5 IΔn", hundred.Reason);
    }

    [Fact]
    public void Among_equal_findings_the_earliest_episode_s_reason_stays()
    {
        // Two episodes with the same finding and the same must-trip state: the overall reason is the first one's (the
        // replay names the first time a limit was met, not the last). Break times: IEC 61008-1 general type, 300 ms
        // at IΔn and 150 ms at 2 IΔn (REFERENCE.md); 20 ms resolution (Limits.ReplayTimeResolutionHalfCycles).
        var atRated = Episode(Thirty, 1.1 * 0.030, 0.300, startS: 1); // at the 300 ms limit: may trip, must-trip reached
        var atDouble = Episode(Thirty, 2.2 * 0.030, 0.131, startS: 2); // at the 150 ms limit: the same finding
        var first = Of(Replay(Thirty, [atRated, atDouble]), 0.030, DeviceTiming.General);
        var second = Of(Replay(Thirty, [atDouble, atRated]), 0.030, DeviceTiming.General);
        Assert.Equal((TripFinding.MayTrip, true), (first.Finding, first.MustTripReached));
        Assert.Equal((TripFinding.MayTrip, true), (second.Finding, second.MustTripReached));
        Assert.Contains("at 1 IΔn for 300 ms", first.Reason, StringComparison.Ordinal);
        Assert.Contains("at 2 IΔn for 131 ms", second.Reason, StringComparison.Ordinal);

        // Two that stay inside the ranges (may trip, no limit reached): the first one's durations are named.
        var shortA = Episode(Thirty, 0.6 * 0.030, 0.020, startS: 1);
        var shortB = Episode(Thirty, 0.8 * 0.030, 0.050, startS: 2);
        var plain = Of(Replay(Thirty, [shortA, shortB]), 0.030, DeviceTiming.General);
        var plainReversed = Of(Replay(Thirty, [shortB, shortA]), 0.030, DeviceTiming.General);
        Assert.Equal((TripFinding.MayTrip, false), (plain.Finding, plain.MustTripReached));
        Assert.Contains("above 0.5 IΔn for 20 ms", plain.Reason, StringComparison.Ordinal);
        Assert.Contains("above 0.5 IΔn for 50 ms", plainReversed.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Episodes_beyond_the_list_are_judged_by_their_longest_stretches()
    {
        // One listed episode inside the limits, four more unlisted whose longest stretch at every level up to 5.5 IΔn
        // is 100 ms: at 5 IΔn 100 − 20 > 40 ms, so a compliant general-type 30 mA device would have tripped, and the
        // alert names the unlisted episodes. A type S device: 100 + 20 < 150 ms at 5 IΔn, but 100 ms above IΔn is not
        // below its 60 ms non-actuating time: may trip, no limit reached.
        var inside = Episode(Thirty, 0.6 * 0.030, 0.020);
        var r = Replay(Thirty, [inside], found: 5, unlisted: Runs(Thirty, 5.5 * 0.030, 0.100));
        var g = Of(r, 0.030, DeviceTiming.General);
        Assert.Equal(TripFinding.WillTrip, g.Finding);
        Assert.True(g.MustTripReached);
        var alert = Assert.Single(r.Alerts);
        Assert.StartsWith("in the 4 episodes not listed: a compliant device would have tripped", alert, StringComparison.Ordinal);
        var s = Of(r, 0.030, DeviceTiming.S);
        Assert.Equal(TripFinding.MayTrip, s.Finding);
        Assert.False(s.MustTripReached);
        Assert.Equal(5, r.EpisodesFound);
        // Unlisted stretches inside every limit: no alert.
        Assert.Empty(Replay(Thirty, [inside], found: 5, unlisted: Runs(Thirty, 0.6 * 0.030, 0.020)).Alerts);
    }

    [Fact]
    public void Events_touching_an_episode_are_related_to_it()
    {
        // Episode from 1.0 to 1.1 s: an event ending exactly at its start and one starting exactly at its end touch it;
        // events clear of it by a millisecond do not.
        EventRecord[] events =
        [
            new("surge", 0.9, 0.1, 0.05, "touches the start"),
            new("surge", 1.1, 0.05, 0.05, "touches the end"),
            new("surge", 0.8, 0.199, 0.05, "ends before"),
            new("surge", 1.101, 0.05, 0.05, "starts after"),
        ];
        var e = Assert.Single(Replay(Thirty, [Episode(Thirty, 0.6 * 0.030, 0.100, startS: 1.0)], events: events).Episodes);
        Assert.Equal(["surge at 0.9 s: touches the start", "surge at 1.1 s: touches the end"], e.RelatedEvents);
    }

    [Fact]
    public void The_summary_counts_and_names_the_findings()
    {
        var one = Replay(Thirty with { InstalledTiming = DeviceTiming.S }, [Episode(Thirty, 0.6 * 0.030, 0.020)]);
        Assert.Equal("Trip replay (IΔn 30.0 mA, installed type S): 1 episode at or above 0.5 IΔn, longest 20 ms, highest 0.6 IΔn (half-cycle RMS); general type: may trip; type S: will not trip", one.Summary);
        var two = Replay(Thirty with { InstalledTiming = DeviceTiming.General },
            [Episode(Thirty, 0.6 * 0.030, 0.020), Episode(Thirty, 5.5 * 0.030, 0.100, startS: 2)]);
        Assert.Equal("Trip replay (IΔn 30.0 mA, installed general type): 2 episodes at or above 0.5 IΔn, longest 100 ms, highest 5.5 IΔn (half-cycle RMS); general type: will trip; type S: may trip; 1 where a compliant device would have tripped: test the device if it did not", two.Summary);
        var none = Replay(Thirty, [], found: 0);
        Assert.Equal("Trip replay (IΔn 30.0 mA): no half-cycle reached 0.5 IΔn; no device of this rating trips on this capture", none.Summary);
        Assert.All(none.Overall, f => Assert.Equal(TripFinding.WillNotTrip, f.Finding));
    }

    [Fact]
    public void The_alert_names_time_current_and_reason()
    {
        var r = Replay(Thirty, [Episode(Thirty, 5.5 * 0.030, 0.100, startS: 2.25)]);
        Assert.Equal("at 2.25 s (5.5 IΔn = 165 mA highest half-cycle RMS, above IΔn for 100 ms): a compliant device would have tripped here: if it did not, test the device (general type 30.0 mA: at or above 5 IΔn for 100 ms, longer than its break time of 40 ms)", Assert.Single(r.Alerts));
        Assert.StartsWith("A compliant device would have tripped at the times listed.", r.Recommendations[0], StringComparison.Ordinal);
        // The alert follows the installed timing: an installed type S is alerted on its own 150 ms at 5 IΔn.
        Assert.Empty(Replay(Thirty with { InstalledTiming = DeviceTiming.S }, [Episode(Thirty, 5.5 * 0.030, 0.100)]).Alerts);
    }

    [Fact]
    public void The_recommendations_follow_what_the_surges_do()
    {
        const string Qualified = "have any change of device made by a qualified person";
        // Nothing reached: capture longer or test the device.
        var quiet = Replay(Thirty, [], found: 0);
        Assert.StartsWith("No half-cycle of this capture reached half the rated residual current", quiet.Recommendations[0], StringComparison.Ordinal);
        Assert.Contains(Qualified, quiet.Recommendations[^1], StringComparison.Ordinal);
        Assert.Equal(2, quiet.Recommendations.Count);

        // Short surges (0.8 IΔn, 105 ms) ride through a type S but not a general type; at 30 mA (additional protection,
        // IEC 60364-4-41 §415.1) the general type stays; a 100 mA general device would not trip on them.
        var shortSurge = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.105)], quietA: 0.005);
        Assert.Contains(shortSurge.Recommendations, t => t.StartsWith("These surges are short enough to ride through a time-delayed (S) device but not through a general-type one. A device of 30.0 mA that gives additional protection", StringComparison.Ordinal));
        Assert.Contains(shortSurge.Recommendations, t => t.StartsWith("A general-type device of 100 mA would not trip on these surges", StringComparison.Ordinal));
        Assert.DoesNotContain(shortSurge.Recommendations, t => t.Contains("standing leakage", StringComparison.Ordinal));

        // The same at 100 mA (not additional protection): an upstream S device of that rating.
        var o100 = new AssessmentOptions { RatedResidualCurrentA = 0.100 };
        var upstream = Replay(o100, [Episode(o100, 0.8 * 0.100, 0.105)], quietA: 0.005);
        Assert.Contains(upstream.Recommendations, t => t.StartsWith("These surges ride through a time-delayed (S) device of 100 mA", StringComparison.Ordinal));

        // Long surges (0.8 IΔn, 200 ms) ride through neither; a 100 mA device would not trip on 24 mA either.
        var longSurge = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.200)], quietA: 0.005);
        Assert.Contains(longSurge.Recommendations, t => t.StartsWith("These surges last too long, or rise too high", StringComparison.Ordinal));
        Assert.Contains(longSurge.Recommendations, t => t.StartsWith("A general-type device of 100 mA", StringComparison.Ordinal));

        // An installed type S that rides through: no remedy needed for it, so neither surge text.
        var sInstalled = Replay(Thirty with { InstalledTiming = DeviceTiming.S }, [Episode(Thirty, 0.8 * 0.030, 0.105)], quietA: 0.005);
        Assert.DoesNotContain(sInstalled.Recommendations, t => t.StartsWith("These surges", StringComparison.Ordinal));

        // A surge that reached a must-trip limit (5.5 IΔn, 100 ms) is the alert's business (test the device), not a
        // nuisance: no higher rating is offered for it.
        var big = Replay(Thirty, [Episode(Thirty, 5.5 * 0.030, 0.100)], quietA: 0.005);
        Assert.DoesNotContain(big.Recommendations, t => t.StartsWith("A general-type device of", StringComparison.Ordinal));
    }

    [Theory]
    // Leakage budget 0.3 IΔn = 9 mA at 30 mA (IEC 60364-5-53 §531.3.2, std), compared through the 2 % + 0.1 mA:
    // 10 mA is over it, 8.8 mA within its uncertainty (8.8 + 0.276 ≥ 9: not below), 8 mA clearly below.
    [InlineData(0.010, true)]
    [InlineData(0.0088, true)]
    [InlineData(0.008, false)]
    public void Standing_leakage_that_uses_up_the_budget_is_named(double quietA, bool named)
    {
        var r = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.105)], quietA: quietA);
        Assert.Equal(named, r.Recommendations.Any(t => t.StartsWith("The standing leakage (RMS outside the surges) of", StringComparison.Ordinal)));
        // Without episodes there is no surge to add to it: not named.
        Assert.DoesNotContain(Replay(Thirty, [], found: 0, quietA: quietA).Recommendations, t => t.Contains("standing leakage", StringComparison.Ordinal));
    }

    [Fact]
    public void The_user_s_budget_replaces_the_default()
    {
        // 50 % of 30 mA = 15 mA: 10 mA of standing leakage is then clearly within it.
        var r = Replay(Thirty with { LeakageBudgetFraction = 0.5 }, [Episode(Thirty, 0.8 * 0.030, 0.105)], quietA: 0.010);
        Assert.DoesNotContain(r.Recommendations, t => t.Contains("standing leakage", StringComparison.Ordinal));
    }

    [Fact]
    public void The_devices_tables_and_notes_are_reported()
    {
        var r = Replay(Thirty with { InstalledTiming = DeviceTiming.S }, []);
        Assert.Equal(new ReplayedDevice(0.030, DeviceTiming.S, true), r.Devices[0]);
        Assert.Equal(new ReplayedDevice(0.030, DeviceTiming.General, false), r.Devices[1]);
        Assert.Equal(6, r.Devices.Count);
        Assert.Equal(DeviceTiming.S, r.InstalledTiming);
        Assert.Equal(0.030, r.RatedResidualCurrentA);
        // IEC 61008-1 / IEC 61009-1 and IEC 62423 tables (std).
        Assert.Equal([new TimeLimitPoint(1, 0.3), new(2, 0.15), new(5, 0.04)], r.GeneralBreakTimes);
        Assert.Equal([new TimeLimitPoint(1, 0.5), new(2, 0.2), new(5, 0.15)], r.TimeDelayedBreakTimes);
        Assert.Equal([new TimeLimitPoint(1, 0.13), new(2, 0.06), new(5, 0.05)], r.TimeDelayedNonActuatingTimes);
        Assert.Equal(0.5, r.NonOperatingMultiple);
        Assert.Contains("accuracy (2%+0.1mA)", r.Notes[3], StringComparison.Ordinal);
        Assert.StartsWith("The AC break times are applied to every episode", r.Notes[^1], StringComparison.Ordinal);
        Assert.Equal(6, r.Notes.Count);
        // No timing given: both timings of the installed rating count as installed.
        Assert.Equal(2, Replay(Thirty, []).Devices.Count(d => d.Installed));
    }

    [Fact]
    public void Findings_and_devices_in_words()
    {
        Assert.Equal("will not trip", TripReplayText.Finding(TripFinding.WillNotTrip));
        Assert.Equal("may trip", TripReplayText.Finding(TripFinding.MayTrip));
        Assert.Equal("will trip", TripReplayText.Finding(TripFinding.WillTrip));
        Assert.Equal("type S 100 mA", TripReplayText.Device(new ReplayedDevice(0.100, DeviceTiming.S, false)));
        Assert.Equal("general type 30.0 mA", TripReplayText.Device(new ReplayedDevice(0.030, DeviceTiming.General, true)));
    }

    [Fact]
    public void An_episode_is_written_as_multiples_of_the_rated_current()
    {
        // 45 mA RMS on a 30 mA device is 1.5 IΔn; its peak √2 × 45 mA is 2.12 IΔn (definition of the multiple, common
        // practice, no source).
        var e = Assert.Single(Replay(Thirty, [Episode(Thirty, 0.045, 0.050)]).Episodes);
        Assert.Equal(1.5, e.RmsMultiple, 1e-12);
        Assert.Equal(1.5, e.MaxHalfCycleRmsMultiple, 1e-12);
        Assert.Equal(1.5 * Math.Sqrt(2), e.PeakMultiple, 1e-12);
    }

    [Theory]
    [InlineData(null, DeviceTiming.General)]
    [InlineData(DeviceTiming.General, DeviceTiming.General)]
    [InlineData(DeviceTiming.S, DeviceTiming.S)]
    public void Each_rating_lists_the_installed_timing_first(DeviceTiming? installed, DeviceTiming first)
    {
        // The order the report and the JSON list the devices in: per rating, the installed timing (general when none is
        // stated, the common case) before the other; 30, 100, 300 mA (ratings in use, REFERENCE.md, practice).
        var devices = Replay(Thirty with { InstalledTiming = installed }, []).Devices;
        Assert.Equal([0.030, 0.030, 0.100, 0.100, 0.300, 0.300], devices.Select(d => d.RatedResidualCurrentA));
        for (var i = 0; i < devices.Count; i += 2)
        {
            Assert.Equal(first, devices[i].Timing);
            Assert.NotEqual(first, devices[i + 1].Timing);
        }
    }

    [Fact]
    public void The_replay_refuses_missing_arguments()
    {
        // Argument checks (common practice, no source): a missing analysis or device is a programming error, not input.
        var analysis = Analysis(Thirty, []);
        Assert.Throws<ArgumentNullException>(() => TripReplayAssessor.LevelsFor(null!));
        Assert.Throws<ArgumentNullException>(() => TripReplayAssessor.Replay(null!, Thirty));
        Assert.Throws<ArgumentNullException>(() => TripReplayAssessor.Replay(analysis, null!));
    }

    [Fact]
    public void Devices_no_episode_reached_are_judged_will_not_trip_and_not_must_trip()
    {
        // No half-cycle at 0.5 IΔn: below the non-operating current, so no device of these ratings must trip
        // (IEC 61008-1 / IEC 61009-1, REFERENCE.md "Tripping ranges and times").
        var r = Replay(Thirty, [], found: 0);
        Assert.Equal(6, r.Overall.Count);
        Assert.All(r.Overall, f =>
        {
            Assert.Equal(TripFinding.WillNotTrip, f.Finding);
            Assert.False(f.MustTripReached);
        });
    }

    [Fact]
    public void An_episode_without_current_is_not_smooth_dc()
    {
        // The DC rule compares |mean| with 0.9 × RMS; with no current at all both are 0 and the episode is not DC
        // (it carries no current of any kind; closed form).
        var e = Assert.Single(Replay(Thirty, [Episode(Thirty, 0, 0.050)]).Episodes);
        Assert.False(e.DcDominated);
    }

    [Fact]
    public void The_notes_state_the_users_accuracy()
    {
        // The uncertainty rule applies the accuracy the user gave (5 % + 0.2 mA here), and the notes must say which.
        var mine = new MeasurementAccuracy(0.05, 0.0002);
        var r = Replay(Thirty with { Accuracy = mine }, [], found: 0);
        Assert.Contains(r.Notes, n => n.Contains($"({mine})", StringComparison.Ordinal));
        Assert.DoesNotContain(r.Notes, n => n.Contains($"({MeasurementAccuracy.Default})", StringComparison.Ordinal));
    }
}
