using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The trip replay on synthesized surges of known amplitude and duration, measured by the whole analysis, at each
/// limit of the standards: just inside, just outside, and at the limit where the uncertainty rule decides. The
/// sample rates put exactly 100 samples in a half-cycle (10 kS/s at 50 Hz, 12 kS/s at 60 Hz) and the surges start on
/// a half-cycle boundary and run in phase with a standing 3 mA sine, so a surge of total RMS I lasting T is measured
/// as T exactly at every level below I.
/// Limits (REFERENCE.md, "Tripping ranges and times"): general type 300 / 150 / 40 ms at 1 / 2 / 5 IΔn
/// (IEC 61008-1 / IEC 61009-1, std); type S break 500 / 200 / 150 ms, non-actuating 130 / 60 / 50 ms (std); smooth DC
/// 300 / 150 / 40 ms at 2 / 4 / 10 IΔn (IEC 62423, std); non-operating 0.5 IΔn (IEC 61008-1 Table 1, std).
/// Uncertainty: the default 2 % + 0.1 mA of <see cref="MeasurementAccuracy"/>, and two half-cycles for a duration
/// (<see cref="Limits.ReplayTimeResolutionHalfCycles"/>: 20 ms at 50 Hz, 16.7 ms at 60 Hz).
/// </summary>
public class TripReplayAssessorTests
{
    private const double Rated = 0.030;
    private const double StandingA = 0.003;
    private const double SurgeStartS = 2.5;

    private static TripReplayResult Replay(double mainsHz, double totalRmsA, double durationS, AssessmentOptions? options = null)
    {
        // Standing sine 3 mA plus a surge in phase with it: the total RMS during the surge is the sum.
        List<WaveformComponent> parts =
        [
            new SineComponent(StandingA, mainsHz),
            new SurgeComponent(totalRmsA - StandingA, mainsHz, SurgeStartS, durationS),
        ];
        return Run(parts, mainsHz, options);
    }

    private static TripReplayResult Run(List<WaveformComponent> parts, double mainsHz, AssessmentOptions? options = null)
    {
        using var source = new SynthCaptureSource(parts, 200 * mainsHz, 4.0);
        var evaluation = Evaluation.Run(source, new AnalysisOptions { MainsHz = mainsHz, WorkerCount = 1 },
            options ?? new AssessmentOptions { RatedResidualCurrentA = Rated });
        return evaluation.Assessment.TripReplay ?? throw new InvalidOperationException("no replay");
    }

    private static DeviceFinding Installed(TripReplayResult r, DeviceTiming timing) =>
        r.Overall.Single(f => f.Device.RatedResidualCurrentA == Rated && f.Device.Timing == timing);

    [Theory]
    [InlineData(50)]
    [InlineData(60)]
    public void Durations_and_multiples_of_a_rectangular_surge_are_measured_exactly(double mainsHz)
    {
        // 2 IΔn (60 mA) for 100 ms: 0.1 s above 0.5 IΔn and above IΔn, half-cycle RMS 2 IΔn, peak 2√2 IΔn
        // (closed form of a sine), all within 0.1 % (float arithmetic only).
        var r = Replay(mainsHz, 2 * Rated, 0.100);
        var e = Assert.Single(r.Episodes);
        Assert.Equal(0.100, e.AboveHalfRatedS, 1e-9);
        Assert.Equal(0.100, e.AboveRatedS, 1e-9);
        Assert.Equal(2.0, e.MaxHalfCycleRmsMultiple, 0.002);
        Assert.Equal(2 * Math.Sqrt(2), e.PeakMultiple, 0.003);
        Assert.Equal(SurgeStartS, e.StartS, 1e-9);
        Assert.Equal(1 / (2 * mainsHz), e.HalfCycleS, 1e-9);
        Assert.False(e.DcDominated);
    }

    [Theory]
    [InlineData(50, 0.100, TripFinding.MayTrip, false)] // 100 + 20 < 150 ms: inside
    [InlineData(50, 0.150, TripFinding.MayTrip, true)] // within 2 half-cycles of 150 ms: at the limit, counted as reached
    [InlineData(50, 0.200, TripFinding.WillTrip, true)] // 200 − 20 > 150 ms: outside
    [InlineData(60, 0.100, TripFinding.MayTrip, false)]
    [InlineData(60, 0.150, TripFinding.MayTrip, true)]
    [InlineData(60, 0.200, TripFinding.WillTrip, true)]
    public void General_type_at_twice_the_rating_against_its_150_ms_break_time(double mainsHz, double durationS,
        TripFinding expected, bool mustTrip)
    {
        // IEC 61008-1 / IEC 61009-1 break time of the general type at 2 IΔn: 150 ms (std). 2.2 IΔn keeps the current
        // clear of the 2 IΔn level by more than its 2 % + 0.1 mA uncertainty, so only the time decides.
        var r = Replay(mainsHz, 2.2 * Rated, durationS);
        var general = Installed(r, DeviceTiming.General);
        Assert.Equal(expected, general.Finding);
        Assert.Equal(mustTrip, general.MustTripReached);
        Assert.Equal(mustTrip, r.Alerts.Count == 1);
        if (mustTrip)
        {
            Assert.Contains("a compliant device would have tripped here: if it did not, test the device", r.Alerts[0]);
        }
    }

    [Theory]
    [InlineData(50, 0.010, TripFinding.MayTrip, false)] // 10 + 20 < 40 ms
    [InlineData(50, 0.030, TripFinding.MayTrip, true)] // at the limit
    [InlineData(50, 0.080, TripFinding.WillTrip, true)] // 80 − 20 > 40 ms
    [InlineData(60, 1 / 120.0, TripFinding.MayTrip, false)] // one half-cycle: 8.3 + 16.7 < 40 ms
    [InlineData(60, 5 / 120.0, TripFinding.MayTrip, true)] // 41.7 ms: at the limit
    [InlineData(60, 8 / 120.0, TripFinding.WillTrip, true)] // 66.7 − 16.7 > 40 ms
    public void General_type_at_five_times_the_rating_against_its_40_ms_break_time(double mainsHz, double durationS,
        TripFinding expected, bool mustTrip)
    {
        // IEC 61008-1 / IEC 61009-1: 40 ms at 5 IΔn (std); 5.5 IΔn keeps the current clear of 5 IΔn's uncertainty.
        var general = Installed(Replay(mainsHz, 5.5 * Rated, durationS), DeviceTiming.General);
        Assert.Equal(expected, general.Finding);
        Assert.Equal(mustTrip, general.MustTripReached);
    }

    [Theory]
    [InlineData(50, 0.90, TripFinding.MayTrip, false)] // 27 mA + 2 % + 0.1 mA < 30 mA: below IΔn, in the tripping range
    [InlineData(50, 1.00, TripFinding.MayTrip, true)] // 30 mA: within the uncertainty of IΔn, 400 ms > 300 ms: at the limit
    [InlineData(50, 1.10, TripFinding.WillTrip, true)] // 33 mA − 2 % − 0.1 mA > 30 mA for 400 ms > 300 + 20 ms
    [InlineData(60, 0.90, TripFinding.MayTrip, false)]
    [InlineData(60, 1.00, TripFinding.MayTrip, true)]
    [InlineData(60, 1.10, TripFinding.WillTrip, true)]
    public void General_type_at_the_rating_itself_the_current_uncertainty_decides(double mainsHz, double multiple,
        TripFinding expected, bool mustTrip)
    {
        // IEC 61008-1 / IEC 61009-1: 300 ms at IΔn (std); the surge lasts 400 ms, so only the current decides.
        var general = Installed(Replay(mainsHz, multiple * Rated, 0.400), DeviceTiming.General);
        Assert.Equal(expected, general.Finding);
        Assert.Equal(mustTrip, general.MustTripReached);
    }

    [Theory]
    [InlineData(50, 0.45, TripFinding.WillNotTrip)] // 13.5 mA + uncertainty < 15 mA: below the non-operating current
    [InlineData(50, 0.50, TripFinding.MayTrip)] // 15 mA: at the limit, counted as possibly tripping
    [InlineData(50, 0.55, TripFinding.MayTrip)]
    [InlineData(60, 0.45, TripFinding.WillNotTrip)]
    [InlineData(60, 0.50, TripFinding.MayTrip)]
    [InlineData(60, 0.55, TripFinding.MayTrip)]
    public void Below_half_the_rating_no_general_device_trips(double mainsHz, double multiple, TripFinding expected)
    {
        // IEC 61008-1 Table 1 (std): rated non-operating current 0.5 IΔn. The surge lasts 1 s.
        var r = Replay(mainsHz, multiple * Rated, 1.0);
        Assert.Equal(expected, Installed(r, DeviceTiming.General).Finding);
        Assert.Equal(expected == TripFinding.WillNotTrip ? 0 : 1, r.EpisodesFound);
        Assert.Empty(r.Alerts);
    }

    [Theory]
    [InlineData(50, 0.80, 0.100, TripFinding.WillNotTrip)] // 100 + 20 < 130 ms non-actuating at IΔn: rides through
    [InlineData(50, 0.80, 0.120, TripFinding.MayTrip)] // 120 + 20 > 130 ms: at the limit, no ride-through promised
    [InlineData(50, 2.20, 0.020, TripFinding.WillNotTrip)] // 20 + 20 < 50 ms (above 2 IΔn) and < 60 ms (above IΔn)
    [InlineData(50, 2.20, 0.040, TripFinding.MayTrip)] // 40 + 20 = 60 ms: not below 50 ms
    [InlineData(60, 0.80, 0.100, TripFinding.WillNotTrip)] // 100 + 16.7 < 130 ms
    [InlineData(60, 0.80, 14 / 120.0, TripFinding.MayTrip)] // 116.7 + 16.7 > 130 ms
    [InlineData(60, 2.20, 3 / 120.0, TripFinding.WillNotTrip)] // 25 + 16.7 < 50 ms
    [InlineData(60, 2.20, 5 / 120.0, TripFinding.MayTrip)] // 41.7 + 16.7 > 50 ms
    public void Type_s_rides_through_surges_shorter_than_its_non_actuating_times(double mainsHz, double multiple,
        double durationS, TripFinding expected)
    {
        // IEC 61008-1 / IEC 61009-1 type S non-actuating times 130 / 60 / 50 ms at 1 / 2 / 5 IΔn (std); the general
        // type of the same rating may trip on every one of these (its non-operating current is reached).
        var r = Replay(mainsHz, multiple * Rated, durationS);
        Assert.Equal(expected, Installed(r, DeviceTiming.S).Finding);
        Assert.Equal(TripFinding.MayTrip, Installed(r, DeviceTiming.General).Finding);
    }

    [Theory]
    [InlineData(50, 0.150, TripFinding.MayTrip, false)] // 150 + 20 < 200 ms
    [InlineData(50, 0.200, TripFinding.MayTrip, true)] // at the limit
    [InlineData(50, 0.250, TripFinding.WillTrip, true)] // 250 − 20 > 200 ms
    [InlineData(60, 0.150, TripFinding.MayTrip, false)]
    [InlineData(60, 0.200, TripFinding.MayTrip, true)]
    [InlineData(60, 0.250, TripFinding.WillTrip, true)]
    public void Type_s_at_twice_the_rating_against_its_200_ms_break_time(double mainsHz, double durationS,
        TripFinding expected, bool mustTrip)
    {
        // IEC 61008-1 / IEC 61009-1 type S break time at 2 IΔn: 200 ms (std).
        var s = Installed(Replay(mainsHz, 2.2 * Rated, durationS, new AssessmentOptions { RatedResidualCurrentA = Rated, InstalledTiming = DeviceTiming.S }),
            DeviceTiming.S);
        Assert.Equal(expected, s.Finding);
        Assert.Equal(mustTrip, s.MustTripReached);
    }

    [Fact]
    public void An_installed_type_s_device_is_alerted_on_its_own_break_times_not_the_general_ones()
    {
        // 2.2 IΔn for 170 ms: at the general type's 150 ms (std) within the 20 ms resolution, inside type S's 200 ms
        // (std) by more than it: the "would have tripped" alert follows the installed device's timing.
        var general = Replay(50, 2.2 * Rated, 0.170);
        var s = Replay(50, 2.2 * Rated, 0.170, new AssessmentOptions { RatedResidualCurrentA = Rated, InstalledTiming = DeviceTiming.S });
        Assert.Single(general.Alerts);
        Assert.Empty(s.Alerts);
        Assert.True(s.Devices[0] is { Timing: DeviceTiming.S, Installed: true });
    }

    [Theory]
    [InlineData(50)]
    [InlineData(60)]
    public void Type_b_replays_smooth_dc_against_the_dc_break_times(double mainsHz)
    {
        // A DC step: a "surge" at 0 Hz with phase 90° is √2·RMS·sin 90° = √2·RMS, constant (closed form). 3 IΔn of
        // smooth DC for 200 ms: against IEC 62423's 300 ms at 2 IΔn (std) a type B device may trip; against the AC
        // table's 150 ms at 2 IΔn (what a type A is replayed with) it will trip.
        List<WaveformComponent> parts =
        [
            new SineComponent(StandingA, mainsHz),
            new SurgeComponent(3 * Rated / Math.Sqrt(2), 0, SurgeStartS, 0.200, PhaseDeg: 90),
        ];
        var b = Run(parts, mainsHz, new AssessmentOptions { RatedResidualCurrentA = Rated, InstalledType = DeviceType.B });
        var a = Run(parts, mainsHz, new AssessmentOptions { RatedResidualCurrentA = Rated, InstalledType = DeviceType.A });
        Assert.True(Assert.Single(b.Episodes).DcDominated);
        Assert.Equal(TripFinding.MayTrip, Installed(b, DeviceTiming.General).Finding);
        Assert.Equal(TripFinding.WillTrip, Installed(a, DeviceTiming.General).Finding);
    }

    [Fact]
    public void The_alternatives_are_the_next_two_ratings_in_use_each_in_both_timings()
    {
        // Rated values in use 10, 30, 100, 300, 500 mA (REFERENCE.md, practice). A 2.2 IΔn = 66 mA surge for 100 ms
        // reaches 0.5 × 100 mA but not 0.5 × 300 mA.
        var r = Replay(50, 2.2 * Rated, 0.100);
        Assert.Equal([0.030, 0.030, 0.100, 0.100, 0.300, 0.300], r.Devices.Select(d => d.RatedResidualCurrentA));
        Assert.Equal(2, r.Devices.Count(d => d.Installed));
        Assert.Equal(TripFinding.MayTrip, r.Overall.Single(f => f.Device is { RatedResidualCurrentA: 0.100, Timing: DeviceTiming.General }).Finding);
        Assert.Equal(TripFinding.WillNotTrip, r.Overall.Single(f => f.Device is { RatedResidualCurrentA: 0.300, Timing: DeviceTiming.General }).Finding);
        Assert.Equal([0.010, 0.030, 0.100], TripReplayAssessor.RatingsFor(0.010));
        Assert.Equal([0.500], TripReplayAssessor.RatingsFor(0.500));
    }

    [Fact]
    public void Surges_an_s_device_rides_through_are_recommended_upstream_with_the_30_ma_kept()
    {
        // 2.2 IΔn for 20 ms at 50 Hz: the general 30 mA may trip, type S rides through (non-actuating times, std):
        // the recommendation keeps the 30 mA general-type device for additional protection (IEC 60364-4-41 §415.1).
        var r = Replay(50, 2.2 * Rated, 0.020);
        Assert.Contains(r.Recommendations, t => t.Contains("time-delayed (S)", StringComparison.Ordinal)
            && t.Contains("instantaneous 30 mA protection", StringComparison.Ordinal));
        Assert.Contains("type S: will not trip", r.Summary, StringComparison.Ordinal);
        Assert.Contains(r.Recommendations, t => t.Contains("qualified person", StringComparison.Ordinal));
    }

    [Fact]
    public void A_quiet_capture_replays_to_no_episode_and_says_so()
    {
        // 3 mA standing only: 0.1 IΔn, below the non-operating 0.5 IΔn (IEC 61008-1 Table 1, std).
        var r = Run([new SineComponent(StandingA, 50)], 50);
        Assert.Equal(0, r.EpisodesFound);
        Assert.All(r.Overall, f => Assert.Equal(TripFinding.WillNotTrip, f.Finding));
        Assert.Contains("no half-cycle reached 0.5 IΔn", r.Summary, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.010, 0.150, 0.005, LimitState.Below)] // 10 + 10 < 150 ms
    [InlineData(0.140, 0.150, 0.005, LimitState.AtLimit)] // 140 + 10 = 150 ms: not below
    [InlineData(0.160, 0.150, 0.005, LimitState.AtLimit)] // 160 − 10 = 150 ms: not above
    [InlineData(0.161, 0.150, 0.005, LimitState.Above)]
    [InlineData(0, 0.010, 0.010, LimitState.Below)] // a level never reached
    public void Durations_compare_within_two_half_cycles(double durationS, double limitS, double halfCycleS, LimitState expected)
    {
        // Engineering choice (Limits.ReplayTimeResolutionHalfCycles): a true duration lies within two half-cycles of
        // the count, so only a duration clear of the limit by more than that is below or above it.
        Assert.Equal(expected, TripReplayAssessor.CompareTime(durationS, limitS, halfCycleS));
    }
}
