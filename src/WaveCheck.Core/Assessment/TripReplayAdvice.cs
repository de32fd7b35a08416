using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using static WaveCheck.Core.Assessment.TripReplayAssessor;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// The trip replay's words for a person (<see cref="TripReplayAssessor"/> finds, this says): the summary line, the
/// recommendations and the notes on method. Stateless.
/// </summary>
internal static class TripReplayAdvice
{
    /// <summary>The replay in one line: the episodes, the longest and highest, the finding for a general-type and a
    /// type S device of the installed rating, and the alerts.</summary>
    public static string Summary(int found, List<ReplayedEpisode> episodes, IReadOnlyList<DeviceFinding> overall,
        List<string> alerts, double rated, DeviceTiming? installed)
    {
        if (found == 0)
        {
            return Text($"Trip replay (IΔn {CurrentText.WithUnit(rated)}): no half-cycle reached 0.5 IΔn; no device of this rating trips on this capture");
        }

        var longest = episodes.Count > 0 ? episodes.Max(e => e.AboveHalfRatedS) : 0;
        var highest = episodes.Count > 0 ? episodes.Max(e => e.MaxHalfCycleRmsMultiple) : 0;
        var general = overall.First(f => f.Device.Timing == DeviceTiming.General && f.Device.RatedResidualCurrentA == rated);
        var s = overall.First(f => f.Device.Timing == DeviceTiming.S && f.Device.RatedResidualCurrentA == rated);
        var line = Text($"Trip replay (IΔn {CurrentText.WithUnit(rated)}{(installed is { } t ? ", installed " + (t == DeviceTiming.S ? "type S" : "general type") : string.Empty)}): {found} episode{(found == 1 ? "" : "s")} at or above 0.5 IΔn, longest {Ms(longest)}, highest {highest:0.##} IΔn (half-cycle RMS); general type: {TripReplayText.Finding(general.Finding)}; type S: {TripReplayText.Finding(s.Finding)}");
        return alerts.Count > 0 ? line + Text($"; {alerts.Count} where a compliant device would have tripped: test the device if it did not") : line;
    }

    /// <summary>What to do, most urgent first: test the device where a compliant one must have tripped; then how to
    /// keep the surges from tripping it (an S device upstream, smaller surges at their source, the standing leakage
    /// within its budget, a higher rating only where the rules allow); always: confirm with an RCD tester.</summary>
    public static IReadOnlyList<string> Recommend(List<ReplayedEpisode> episodes, IReadOnlyList<DeviceFinding> overall,
        List<string> alerts, double rated, double standingA, AssessmentOptions options)
    {
        var list = new List<string>();
        if (alerts.Count > 0)
        {
            list.Add("A compliant device would have tripped at the times listed. If the installed device did not, test it with an RCD tester (trip time at IΔn and at 5 IΔn, and the test button) before anything else: a device that does not break within its time gives no protection, and no change of device type or rating is a remedy for that.");
        }

        var general = overall.First(f => f.Device.Timing == DeviceTiming.General && f.Device.RatedResidualCurrentA == rated);
        var accuracy = options.Accuracy ?? MeasurementAccuracy.Default;
        // The surges a device may trip on without having to: the ones the remedies are for. An episode that reached a
        // must-trip limit is the alert's business (test the device), not a nuisance to ride through.
        var installedTiming = options.InstalledTiming ?? DeviceTiming.General;
        var nuisance = episodes.Where(e => Of(e, rated, installedTiming) is { MustTripReached: false, Finding: not TripFinding.WillNotTrip }).ToList();
        var sRides = nuisance.Count > 0 && nuisance.All(e => Of(e, rated, DeviceTiming.S).Finding == TripFinding.WillNotTrip);
        var budget = (options.LeakageBudgetFraction ?? Limits.LeakageBudgetFraction) * rated;
        if (episodes.Count == 0 && general.Finding == TripFinding.WillNotTrip)
        {
            list.Add("No half-cycle of this capture reached half the rated residual current: a healthy device of this rating does not trip on it. If the device trips, the cause was not recorded here: capture longer (over the time of day the trips happen), on the circuit upstream, or test the device.");
        }
        else if (sRides && installedTiming == DeviceTiming.General)
        {
            list.Add(rated <= Limits.AdditionalProtectionMaxA * 1.0001
                ? Text($"These surges are short enough to ride through a time-delayed (S) device but not through a general-type one. A device of {CurrentText.WithUnit(rated)} that gives additional protection (IEC 60364-4-41 §415.1) stays a general type: if it is this device that trips, reduce the surge at its source (split the loads that switch on together over more devices, one RCBO per load; stagger their switching on); if it is an upstream device, that one can be a time-delayed (S) device of a higher rating (100 or 300 mA), so that the surges at switch-on ride through it while each final circuit keeps its instantaneous 30 mA protection (selectivity: S upstream, general downstream).")
                : Text($"These surges ride through a time-delayed (S) device of {CurrentText.WithUnit(rated)}: as an upstream device it can be an S type, so that the surges at switch-on ride through it while each final circuit keeps its own instantaneous 30 mA device for additional protection (selectivity: S upstream, general downstream)."));
        }
        else if (nuisance.Count > 0)
        {
            list.Add("These surges last too long, or rise too high, for a time-delayed (S) device to ride through them. Reduce them at their source: split the loads that switch on together over more devices (one RCBO per load), stagger their switching on, and ask the equipment's maker about its switch-on leakage (filter capacitors charging).");
        }

        if (accuracy.Compare(standingA, budget) != LimitState.Below && episodes.Count > 0)
        {
            list.Add(Text($"The standing leakage (RMS outside the surges) of {CurrentText.WithUnit(standingA)} ({standingA / rated:0.##} IΔn) already uses up the leakage budget of {CurrentText.WithUnit(budget)} (IEC 60364-5-53 §531.3.2): every surge adds to it. Split the circuits over more devices so that each carries at most 0.3 IΔn of standing leakage; the surges then have the rest of the gap to 0.5 IΔn."));
        }

        var higher = nuisance.Count == 0 ? null : episodes[0].Findings.Select(f => f.Device)
            .FirstOrDefault(d => d.Timing == DeviceTiming.General && d.RatedResidualCurrentA > rated * 1.0001
                && nuisance.All(e => Of(e, d.RatedResidualCurrentA, DeviceTiming.General).Finding == TripFinding.WillNotTrip));
        if (higher is not null)
        {
            list.Add(Text($"A general-type device of {CurrentText.WithUnit(higher.RatedResidualCurrentA)} would not trip on these surges, but a higher rating is no remedy where the circuit needs additional protection (30 mA for socket outlets and final circuits, IEC 60364-4-41 §415.1): raise a rating only where the installation rules allow it."));
        }

        list.Add("The replay applies the standards' limits to the recorded current: a real device trips somewhere within them, and its maker's data may be narrower. Confirm with an RCD tester, and have any change of device made by a qualified person in line with the local wiring rules.");
        return list;
    }

    private static DeviceFinding Of(ReplayedEpisode e, double rated, DeviceTiming timing) =>
        e.Findings.First(f => f.Device.Timing == timing && f.Device.RatedResidualCurrentA == rated);

    /// <summary>How the replay measures and judges, for the report's notes.</summary>
    public static IReadOnlyList<string> Notes(MeasurementAccuracy accuracy, bool dcTable)
    {
        var notes = new List<string>
        {
            "Magnitude: RMS over each half-cycle of the tracked mains frequency, the mean included; durations: the longest stretch of half-cycles at or above a multiple of IΔn, gaps of one half-cycle bridged (engineering choice: a half-wave current leaves every other half-cycle low).",
            "General type (IEC 61008-1 / IEC 61009-1): break times 300 / 150 / 40 ms at 1 / 2 / 5 IΔn; no half-cycle at 0.5 IΔn or above: will not trip (non-operating current).",
            "Type S: break times 500 / 200 / 150 ms and non-actuating times 130 / 60 / 50 ms at 1 / 2 / 5 IΔn; rides through when the time above 0.5 IΔn, above IΔn and above 2 IΔn is shorter than the non-actuating time at 1, 2 and 5 IΔn (engineering choice: a device is no faster at a smaller current).",
            Text($"Uncertainty: currents within the measurement accuracy ({accuracy}) of a multiple of IΔn, and durations within {Limits.ReplayTimeResolutionHalfCycles} half-cycles of a time limit, are at the limit; resolved to the safe side (engineering choice): counted as reaching a must-trip time, never as riding through."),
            "Very short impulses (microseconds, lightning or switching surges) are not judged by these times but by the devices' surge-current withstand; the replay does not cover them.",
        };
        notes.Add(dcTable
            ? "Type B: an episode of practically smooth DC (mean at least 0.9 of its RMS) is replayed against the DC break times 300 / 150 / 40 ms at 2 / 4 / 10 IΔn (IEC 62423)."
            : $"The AC break times are applied to every episode; for a type B device ({Setting.Ref(nameof(AssessmentOptions.InstalledType))} B) an episode of smooth DC is replayed against the DC break times of IEC 62423.");
        return notes;
    }

    // Ahead of the namespace WaveCheck.Core.Text, which the bare name would otherwise find.
    private static string Text(FormattableString s) => TripReplayAssessor.Text(s);
}
