using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using static WaveCheck.Core.Tests.Assessment.TripReplayAssessorConstructedTests;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// The trip replay's words for a person (TripReplayAdvice): one test per rule of the recommendations, each pinning
/// which condition gives which recommendation, in order and word for word (the wording is the product), plus the
/// summary line and the notes on method. Constructed episodes as in <see cref="TripReplayAssessorConstructedTests"/>:
/// a rectangular surge of half-cycle RMS I lasting T. Limits (REFERENCE.md "Tripping ranges and times", std):
/// general type break times 300 / 150 / 40 ms at 1 / 2 / 5 IΔn (IEC 61008-1 / IEC 61009-1); type S non-actuating
/// 130 / 60 / 50 ms; non-operating current 0.5 IΔn; leakage budget 0.3 IΔn (IEC 60364-5-53 §531.3.2, REFERENCE
/// "Installation rules", std); additional protection by IΔn ≤ 30 mA (IEC 60364-4-41 §415.1, std). Ratings in use
/// 10, 30, 100, 300, 500 mA (REFERENCE, practice). Uncertainty 2 % + 0.1 mA and 20 ms at 50 Hz (engineering choice,
/// Limits).
/// </summary>
public class TripReplayAdviceTests
{
    private const string TestTheDevice = "A compliant device would have tripped at the times listed. If the installed device did not, test it with an RCD tester (trip time at IΔn and at 5 IΔn, and the test button) before anything else: a device that does not break within its time gives no protection, and no change of device type or rating is a remedy for that.";
    private const string NothingReached = "No half-cycle of this capture reached half the rated residual current: a healthy device of this rating does not trip on it. If the device trips, the cause was not recorded here: capture longer (over the time of day the trips happen), on the circuit upstream, or test the device.";
    private const string TooLongForS = "These surges last too long, or rise too high, for a time-delayed (S) device to ride through them. Reduce them at their source: split the loads that switch on together over more devices (one RCBO per load), stagger their switching on, and ask the equipment's maker about its switch-on leakage (filter capacitors charging).";
    private const string Confirm = "The replay applies the standards' limits to the recorded current: a real device trips somewhere within them, and its maker's data may be narrower. Confirm with an RCD tester, and have any change of device made by a qualified person in line with the local wiring rules.";

    private static readonly AssessmentOptions Thirty = new() { RatedResidualCurrentA = 0.030 };

    private static string RidesSButAdditionalProtection(string rated) =>
        $"These surges are short enough to ride through a time-delayed (S) device but not through a general-type one. A device of {rated} that gives additional protection (IEC 60364-4-41 §415.1) stays a general type: if it is this device that trips, reduce the surge at its source (split the loads that switch on together over more devices, one RCBO per load; stagger their switching on); if it is an upstream device, that one can be a time-delayed (S) device of a higher rating (100 or 300 mA), so that the surges at switch-on ride through it while each final circuit keeps its instantaneous 30 mA protection (selectivity: S upstream, general downstream).";

    private static string RidesSUpstream(string rated) =>
        $"These surges ride through a time-delayed (S) device of {rated}: as an upstream device it can be an S type, so that the surges at switch-on ride through it while each final circuit keeps its own instantaneous 30 mA device for additional protection (selectivity: S upstream, general downstream).";

    private static string HigherRating(string rated) =>
        $"A general-type device of {rated} would not trip on these surges, but a higher rating is no remedy where the circuit needs additional protection (30 mA for socket outlets and final circuits, IEC 60364-4-41 §415.1): raise a rating only where the installation rules allow it.";

    private static string StandingLeakage(string standing, string multiple, string budget) =>
        $"The standing leakage (RMS outside the surges) of {standing} ({multiple} IΔn) already uses up the leakage budget of {budget} (IEC 60364-5-53 §531.3.2): every surge adds to it. Split the circuits over more devices so that each carries at most 0.3 IΔn of standing leakage; the surges then have the rest of the gap to 0.5 IΔn.";

    [Fact]
    public void No_half_cycle_at_half_the_rating_capture_longer_or_test()
    {
        // No episode at 0.5 IΔn: below the non-operating current no healthy device trips (IEC 61008-1).
        Assert.Equal([NothingReached, Confirm], Replay(Thirty, [], found: 0).Recommendations);
    }

    [Fact]
    public void A_reached_must_trip_limit_asks_for_a_test_of_the_device_and_nothing_else()
    {
        // 5.5 IΔn for 100 ms: 100 − 20 > 40 ms at 5 IΔn, a general-type device must have tripped. It is the alert's
        // business, not a nuisance: no ride-through, surge or rating advice.
        var r = Replay(Thirty, [Episode(Thirty, 5.5 * 0.030, 0.100)]);
        Assert.Equal([TestTheDevice, Confirm], r.Recommendations);
    }

    [Fact]
    public void Surges_an_s_device_rides_at_30_mA_keep_the_general_type()
    {
        // 0.8 IΔn for 105 ms: 105 + 20 < 130 ms above 0.5 IΔn, nothing above IΔn: a type S device rides through, a
        // general type may trip. At 30 mA (additional protection) the device stays general; 24 mA is below 0.5 × 100 mA.
        var r = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.105)]);
        Assert.Equal([RidesSButAdditionalProtection("30.0 mA"), HigherRating("100 mA"), Confirm], r.Recommendations);
    }

    [Fact]
    public void Surges_an_s_device_rides_above_30_mA_an_upstream_s_device()
    {
        // The same surge at 100 mA (no additional protection): an S device of that rating upstream; 80 mA is below
        // 0.5 × 300 mA.
        var o = new AssessmentOptions { RatedResidualCurrentA = 0.100 };
        var r = Replay(o, [Episode(o, 0.8 * 0.100, 0.105)]);
        Assert.Equal([RidesSUpstream("100 mA"), HigherRating("300 mA"), Confirm], r.Recommendations);
    }

    [Fact]
    public void Additional_protection_up_to_30_mA_within_the_rating_tolerance()
    {
        // 30 mA within 0.01 % (the edge included, as TripReplayAssessor.RatingsFor takes it as the same rating) gives
        // additional protection (IEC 60364-4-41 §415.1: IΔn not above 30 mA); 30.1 mA does not.
        var edge = new AssessmentOptions { RatedResidualCurrentA = Limits.AdditionalProtectionMaxA * 1.0001 };
        var atEdge = Replay(edge, [Episode(edge, 0.8 * edge.RatedResidualCurrentA, 0.105)]);
        Assert.Equal([RidesSButAdditionalProtection("30.0 mA"), HigherRating("100 mA"), Confirm], atEdge.Recommendations);
        var above = new AssessmentOptions { RatedResidualCurrentA = 0.0301 };
        var beyond = Replay(above, [Episode(above, 0.8 * 0.0301, 0.105)]);
        Assert.Equal([RidesSUpstream("30.1 mA"), HigherRating("100 mA"), Confirm], beyond.Recommendations);
    }

    [Fact]
    public void Surges_too_long_for_an_s_device_are_reduced_at_their_source()
    {
        // 0.8 IΔn for 200 ms: 200 − 20 ≥ 130 ms above 0.5 IΔn, an S device does not ride through either.
        var r = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.200)]);
        Assert.Equal([TooLongForS, HigherRating("100 mA"), Confirm], r.Recommendations);
    }

    [Fact]
    public void An_s_device_is_offered_only_when_it_rides_every_surge()
    {
        // One surge an S device rides (0.8 IΔn, 105 ms) and one it does not (0.8 IΔn, 200 ms): not the S advice.
        var r = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.105), Episode(Thirty, 0.8 * 0.030, 0.200, startS: 2)]);
        Assert.Equal([TooLongForS, HigherRating("100 mA"), Confirm], r.Recommendations);
    }

    [Fact]
    public void The_higher_rating_named_is_the_first_that_no_surge_reaches()
    {
        // 2.2 IΔn = 66 mA for 100 ms on 30 mA: inside the general type's 150 ms at 2 IΔn (100 + 20 < 150), a nuisance;
        // an S device does not ride it (100 ms above IΔn against 60 ms). 66 mA reaches 0.5 × 100 mA but not
        // 0.5 × 300 mA: 300 mA is the rating named.
        var alone = Replay(Thirty, [Episode(Thirty, 2.2 * 0.030, 0.100)]);
        Assert.Equal([TooLongForS, HigherRating("300 mA"), Confirm], alone.Recommendations);
        // With a smaller surge (24 mA, below 0.5 × 100 mA) beside it: 100 mA rides one but not both, still 300 mA.
        var pair = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.105), Episode(Thirty, 2.2 * 0.030, 0.100, startS: 2)]);
        Assert.Equal([TooLongForS, HigherRating("300 mA"), Confirm], pair.Recommendations);
    }

    [Fact]
    public void Standing_leakage_over_the_budget_is_named_with_its_figures()
    {
        // 10 mA standing on 30 mA = 0.33 IΔn, over the 0.3 IΔn = 9 mA budget (IEC 60364-5-53 §531.3.2).
        var r = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.105)], quietA: 0.010);
        Assert.Equal(
            [RidesSButAdditionalProtection("30.0 mA"), StandingLeakage("10.0 mA", "0.33", "9.00 mA"), HigherRating("100 mA"), Confirm],
            r.Recommendations);
    }

    [Fact]
    public void The_budget_is_compared_through_the_users_accuracy()
    {
        // 8.5 mA against the 9 mA budget: with 2 % + 0.1 mA its upper bound is 8.77 mA, below; with the user's
        // 5 % + 0.2 mA it is 9.125 mA, at the limit, so named (the safe side; MeasurementAccuracy.Compare).
        var plain = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.105)], quietA: 0.0085);
        Assert.Equal([RidesSButAdditionalProtection("30.0 mA"), HigherRating("100 mA"), Confirm], plain.Recommendations);
        var loose = Thirty with { Accuracy = new MeasurementAccuracy(0.05, 0.0002) };
        var r = Replay(loose, [Episode(loose, 0.8 * 0.030, 0.105)], quietA: 0.0085);
        Assert.Equal(
            [RidesSButAdditionalProtection("30.0 mA"), StandingLeakage("8.50 mA", "0.28", "9.00 mA"), HigherRating("100 mA"), Confirm],
            r.Recommendations);
    }

    [Fact]
    public void Episodes_only_beyond_the_list_are_not_called_nothing()
    {
        // Three episodes found, none listed (a result built by a caller: the analysis lists the first 200), their
        // longest stretches 0.8 IΔn for 105 ms. An installed type S rides them, a general-type device of the rating
        // may trip: the advice must not say that no half-cycle reached 0.5 IΔn, and the summary reads without a
        // listed episode.
        var s = Thirty with { InstalledTiming = DeviceTiming.S };
        var r = Replay(s, [], found: 3, unlisted: Runs(s, 0.8 * 0.030, 0.105));
        Assert.Equal([Confirm], r.Recommendations);
        Assert.StartsWith("Trip replay (IΔn 30.0 mA, installed type S): 3 episodes at or above 0.5 IΔn", r.Summary, StringComparison.Ordinal);
        Assert.EndsWith("general type: may trip; type S: will not trip", r.Summary, StringComparison.Ordinal);
    }

    [Fact]
    public void The_summary_names_the_findings_at_the_installed_rating()
    {
        // 0.8 IΔn for 200 ms: a 30 mA type S device may trip (200 − 20 ≥ 130 ms), a 100 mA one will not (24 mA is
        // below 0.5 IΔn): the summary names the installed rating's.
        var r = Replay(Thirty, [Episode(Thirty, 0.8 * 0.030, 0.200)]);
        Assert.Equal(TripFinding.WillNotTrip, Of(r, 0.100, DeviceTiming.S).Finding);
        Assert.Equal("Trip replay (IΔn 30.0 mA): 1 episode at or above 0.5 IΔn, longest 200 ms, highest 0.8 IΔn (half-cycle RMS); general type: may trip; type S: may trip", r.Summary);
    }

    [Fact]
    public void The_notes_state_the_method_word_for_word()
    {
        // The times quoted are REFERENCE.md's (std): general 300 / 150 / 40 ms at 1 / 2 / 5 IΔn (IEC 61008-1 /
        // IEC 61009-1); S break 500 / 200 / 150 ms, non-actuating 130 / 60 / 50 ms; DC 300 / 150 / 40 ms at
        // 2 / 4 / 10 IΔn (IEC 62423).
        string[] common =
        [
            "Magnitude: RMS over each half-cycle of the tracked mains frequency, the mean included; durations: the longest stretch of half-cycles at or above a multiple of IΔn, gaps of one half-cycle bridged (engineering choice: a half-wave current leaves every other half-cycle low).",
            "General type (IEC 61008-1 / IEC 61009-1): break times 300 / 150 / 40 ms at 1 / 2 / 5 IΔn; no half-cycle at 0.5 IΔn or above: will not trip (non-operating current).",
            "Type S: break times 500 / 200 / 150 ms and non-actuating times 130 / 60 / 50 ms at 1 / 2 / 5 IΔn; rides through when the time above 0.5 IΔn, above IΔn and above 2 IΔn is shorter than the non-actuating time at 1, 2 and 5 IΔn (engineering choice: a device is no faster at a smaller current).",
            "Uncertainty: currents within the measurement accuracy (2%+0.1mA) of a multiple of IΔn, and durations within 2 half-cycles of a time limit, are at the limit; resolved to the safe side (engineering choice): counted as reaching a must-trip time, never as riding through.",
            "Very short impulses (microseconds, lightning or switching surges) are not judged by these times but by the devices' surge-current withstand; the replay does not cover them.",
        ];
        Assert.Equal(
            [.. common, "The AC break times are applied to every episode; for a type B device (⟦InstalledType⟧ B) an episode of smooth DC is replayed against the DC break times of IEC 62423."],
            Replay(Thirty, [], found: 0).Notes);
        var b = Thirty with { InstalledType = DeviceType.B };
        Assert.Equal(
            [.. common, "Type B: an episode of practically smooth DC (mean at least 0.9 of its RMS) is replayed against the DC break times 300 / 150 / 40 ms at 2 / 4 / 10 IΔn (IEC 62423)."],
            Replay(b, [], found: 0).Notes);
    }
}
