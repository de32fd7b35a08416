using System.Globalization;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// Replays the capture's half-cycle episodes against the time limits of residual-current devices: for the installed
/// rating and the next two ratings in use, general type and time-delayed type S, whether a compliant device will not
/// trip, may trip or will trip, and where a compliant device would have had to trip. Stateless.
/// </summary>
/// <remarks>
/// <para>Rules (docs/methods.md, "Trip replay"). A general-type device will not trip when no half-cycle reaches
/// 0.5 IΔn (<see cref="Limits.NonOperatingFraction"/>), will trip when the current stays at or above k·IΔn for longer
/// than its break time at k (<see cref="Limits.GeneralBreakTimes"/>), and may trip otherwise. A type S device will
/// trip past its break times (<see cref="Limits.TimeDelayedBreakTimes"/>) and will not trip when the time above
/// 0.5 IΔn is shorter than its non-actuating time at IΔn, above IΔn shorter than the one at 2 IΔn, and above 2 IΔn
/// shorter than the one at 5 IΔn (<see cref="Limits.TimeDelayedNonActuatingTimes"/>; engineering choice: a device is no
/// faster at a smaller current, so the non-actuating time of the next higher multiple holds below it). For type B
/// (installed, given by <c>--device</c>) and an episode of practically smooth DC the DC break times apply
/// (<see cref="Limits.DcBreakTimes"/>).</para>
/// <para>Uncertainty: a current is compared through the <see cref="MeasurementAccuracy"/> (a half-cycle within its
/// uncertainty of a level counts as possibly at or above it), a duration within
/// <see cref="Limits.ReplayTimeResolutionHalfCycles"/> half-cycles of a time limit is at the limit; either is resolved
/// to the safe side: counted as reaching a must-trip limit, never as riding through.</para>
/// <para>The replay's words for a person (summary, recommendations, notes on method) are
/// <see cref="TripReplayAdvice"/>'s; the time limits themselves are <see cref="Limits"/>'.</para>
/// </remarks>
public static class TripReplayAssessor
{
    /// <summary>Multiples of IΔn at which stretches are measured: the non-operating current, the break-time currents of
    /// AC (1, 2, 5) and of smooth DC (2, 4, 10).</summary>
    public static IReadOnlyList<double> Multiples { get; } = [Limits.NonOperatingFraction, 1, 2, 4, 5, 10];

    private const int Possibly = 0;
    private const int Nominal = 1;
    private const int Surely = 2;
    private const int Variants = 3;

    /// <summary>The installed rating and the next two in use above it (<see cref="Limits.RatingsInUseA"/>), amperes.</summary>
    /// <param name="installedA">The installed IΔn, amperes.</param>
    public static IReadOnlyList<double> RatingsFor(double installedA)
    {
        var ratings = new List<double> { installedA };
        foreach (var r in Limits.RatingsInUseA)
        {
            if (r > installedA * 1.0001 && ratings.Count < 3)
            {
                ratings.Add(r);
            }
        }

        return ratings;
    }

    /// <summary>The levels of half-cycle RMS the analysis measures stretches at, amperes: for each rating and multiple,
    /// the current that is possibly at or above k·IΔn (not below it by more than the uncertainty), k·IΔn itself, and
    /// the current that is surely at or above it.</summary>
    /// <param name="options">The device assessed and the accuracy.</param>
    public static IReadOnlyList<double> LevelsFor(AssessmentOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var accuracy = options.Accuracy ?? MeasurementAccuracy.Default;
        var levels = new List<double>();
        foreach (var rated in RatingsFor(options.RatedResidualCurrentA))
        {
            foreach (var k in Multiples)
            {
                var limit = k * rated;
                // MeasurementAccuracy.Compare: below when v + u(v) < L, above when v − u(v) ≥ L, u(v) = f·v + o.
                levels.Add(Math.Max(0, (limit - accuracy.OffsetA) / (1 + accuracy.ReadingFraction)));
                levels.Add(limit);
                levels.Add((limit + accuracy.OffsetA) / (1 - accuracy.ReadingFraction));
            }
        }

        return levels;
    }

    /// <summary>Replays the analysis's episodes; null when the analysis recorded none, or at other levels than this
    /// device's (it was made for another rating or accuracy).</summary>
    /// <param name="analysis">The analysis with its <see cref="AnalysisResult.HalfCycleEpisodes"/>.</param>
    /// <param name="options">The device assessed.</param>
    public static TripReplayResult? Replay(AnalysisResult analysis, AssessmentOptions options)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        ArgumentNullException.ThrowIfNull(options);
        if (analysis.HalfCycleEpisodes is not { } recorded || !recorded.LevelsA.SequenceEqual(LevelsFor(options)))
        {
            return null;
        }

        var rated = options.RatedResidualCurrentA;
        var ratings = RatingsFor(rated).ToList();
        var devices = Devices(ratings, options.InstalledTiming);
        var dcTable = options.InstalledType is DeviceType.B or DeviceType.BPlus;
        var halfCycleS = 1 / (2 * analysis.Mains.FrequencyHz);
        // The standing leakage the surges ride on: the RMS outside the episodes (all of it when the whole capture is one).
        var standingA = recorded.QuietRmsA ?? analysis.Summary.RmsA;

        var episodes = new List<ReplayedEpisode>();
        var overall = new DeviceFinding?[devices.Count];
        var alerts = new List<string>();
        var installedAlertDevice = options.InstalledTiming ?? DeviceTiming.General;
        foreach (var e in recorded.Episodes)
        {
            var dc = Math.Abs(e.MeanA) >= Limits.DcDominatedMeanShare * e.RmsA && e.RmsA > 0;
            var findings = devices.Select(d => Judge(d, Runs(e.LongestRunS, ratings.IndexOf(d.RatedResidualCurrentA)), e.HalfCycleS, dc && dcTable)).ToArray();
            Worsen(overall, findings);
            var installed = Runs(e.LongestRunS, 0);
            var replayed = new ReplayedEpisode
            {
                StartS = e.StartS,
                AboveHalfRatedS = installed.Run(Limits.NonOperatingFraction, Nominal),
                AboveRatedS = installed.Run(1, Nominal),
                MaxHalfCycleRmsMultiple = e.MaxHalfCycleRmsA / rated,
                PeakMultiple = e.PeakA / rated,
                RmsMultiple = e.RmsA / rated,
                HalfCycleS = e.HalfCycleS,
                DcDominated = dc,
                RelatedEvents = Related(analysis.Events, e),
                Profile = [.. Multiples.Select(k => new MagnitudeDuration(k, installed.Run(k, Nominal)))],
                Findings = findings,
            };
            episodes.Add(replayed);
            var alarm = findings.First(f => f.Device.Installed && f.Device.Timing == installedAlertDevice);
            if (alarm.MustTripReached)
            {
                alerts.Add(Text($"at {e.StartS:0.###} s ({Describe(replayed, rated)}): a compliant device would have tripped here: if it did not, test the device ({alarm.Reason})"));
            }
        }

        if (recorded.UnlistedMaxRunS is { } unlisted)
        {
            // The unlisted episodes' longest stretches per level, judged like one episode against the AC tables.
            var findings = devices.Select(d => Judge(d, Runs(unlisted, ratings.IndexOf(d.RatedResidualCurrentA)), halfCycleS, false)).ToArray();
            Worsen(overall, findings);
            var alarm = findings.First(f => f.Device.Installed && f.Device.Timing == installedAlertDevice);
            if (alarm.MustTripReached)
            {
                alerts.Add(Text($"in the {recorded.Found - recorded.Episodes.Count} episodes not listed: a compliant device would have tripped: if it did not, test the device ({alarm.Reason})"));
            }
        }

        var whole = overall.Select((f, i) => f ?? new DeviceFinding(devices[i], TripFinding.WillNotTrip,
            Text($"{TripReplayText.Device(devices[i])}: no half-cycle reached its non-operating current of 0.5 IΔn"), false)).ToArray();
        return new TripReplayResult
        {
            RatedResidualCurrentA = rated,
            InstalledTiming = options.InstalledTiming,
            Devices = devices,
            EpisodesFound = recorded.Found,
            Episodes = episodes,
            Overall = whole,
            Alerts = alerts,
            Summary = TripReplayAdvice.Summary(recorded.Found, episodes, whole, alerts, rated, options.InstalledTiming),
            Recommendations = TripReplayAdvice.Recommend(episodes, whole, alerts, rated, standingA, options),
            Notes = TripReplayAdvice.Notes(options.Accuracy ?? MeasurementAccuracy.Default, dcTable),
            GeneralBreakTimes = Points(Limits.GeneralBreakTimes),
            TimeDelayedBreakTimes = Points(Limits.TimeDelayedBreakTimes),
            TimeDelayedNonActuatingTimes = Points(Limits.TimeDelayedNonActuatingTimes),
            NonOperatingMultiple = Limits.NonOperatingFraction,
        };
    }

    /// <summary>Where a duration stands against a time limit, counting the half-cycle resolution
    /// (<see cref="Limits.ReplayTimeResolutionHalfCycles"/>): below when even the longest true duration is shorter,
    /// above when even the shortest is longer, at the limit otherwise. A level never reached is below.</summary>
    /// <param name="durationS">Measured duration, seconds.</param>
    /// <param name="limitS">Time limit, seconds.</param>
    /// <param name="halfCycleS">Length of a half-cycle, seconds.</param>
    public static LimitState CompareTime(double durationS, double limitS, double halfCycleS)
    {
        if (durationS <= 0)
        {
            return LimitState.Below;
        }

        // Times are sums of sample periods: equality within a nanosecond is equality (at the limit), not float noise.
        const double Rounding = 1e-9;
        var resolution = Limits.ReplayTimeResolutionHalfCycles * halfCycleS;
        if (durationS - resolution > limitS + Rounding)
        {
            return LimitState.Above;
        }

        return durationS + resolution < limitS - Rounding ? LimitState.Below : LimitState.AtLimit;
    }

    private static IReadOnlyList<ReplayedDevice> Devices(IReadOnlyList<double> ratings, DeviceTiming? installed)
    {
        var list = new List<ReplayedDevice>();
        foreach (var r in ratings)
        {
            var isInstalledRating = list.Count == 0;
            DeviceTiming[] order = installed == DeviceTiming.S ? [DeviceTiming.S, DeviceTiming.General] : [DeviceTiming.General, DeviceTiming.S];
            foreach (var t in order)
            {
                list.Add(new ReplayedDevice(r, t, isInstalledRating && (installed is null || installed == t)));
            }
        }

        return list;
    }

    private static DeviceFinding Judge(ReplayedDevice device, RunTable runs, double halfCycleS, bool dcBreakTimes)
    {
        var breakTimes = device.Timing == DeviceTiming.S ? Limits.TimeDelayedBreakTimes
            : dcBreakTimes ? Limits.DcBreakTimes : Limits.GeneralBreakTimes;
        string? surely = null;
        string? possibly = null;
        foreach (var (k, t) in breakTimes)
        {
            if (surely is null && CompareTime(runs.Run(k, Surely), t, halfCycleS) == LimitState.Above)
            {
                surely = Text($"{TripReplayText.Device(device)}: at or above {k:0.#} IΔn for {Ms(runs.Run(k, Surely))}, longer than its break time of {Ms(t)}");
            }

            if (possibly is null && CompareTime(runs.Run(k, Possibly), t, halfCycleS) != LimitState.Below)
            {
                possibly = Text($"{TripReplayText.Device(device)}: at {k:0.#} IΔn for {Ms(runs.Run(k, Possibly))} within the measurement's uncertainty of its break time of {Ms(t)}; counted as reached (engineering choice: the safe side)");
            }
        }

        if (surely is not null)
        {
            return new DeviceFinding(device, TripFinding.WillTrip, surely, true);
        }

        var half = runs.Run(Limits.NonOperatingFraction, Possibly);
        if (half <= 0)
        {
            return new DeviceFinding(device, TripFinding.WillNotTrip,
                Text($"{TripReplayText.Device(device)}: no half-cycle reached its non-operating current of 0.5 IΔn"), false);
        }

        if (device.Timing == DeviceTiming.S)
        {
            var (na1, na2, na5) = (Limits.TimeDelayedNonActuatingTimes[0].TimeS, Limits.TimeDelayedNonActuatingTimes[1].TimeS,
                Limits.TimeDelayedNonActuatingTimes[2].TimeS);
            var rides = CompareTime(half, na1, halfCycleS) == LimitState.Below
                && CompareTime(runs.Run(1, Possibly), na2, halfCycleS) == LimitState.Below
                && CompareTime(runs.Run(2, Possibly), na5, halfCycleS) == LimitState.Below;
            if (rides && possibly is null)
            {
                return new DeviceFinding(device, TripFinding.WillNotTrip, Text(
                    $"{TripReplayText.Device(device)}: above 0.5 IΔn for {Ms(half)} (non-actuating {Ms(na1)}), above IΔn for {Ms(runs.Run(1, Possibly))} ({Ms(na2)}), above 2 IΔn for {Ms(runs.Run(2, Possibly))} ({Ms(na5)}): shorter than its non-actuating times"),
                    false);
            }
        }

        return new DeviceFinding(device, TripFinding.MayTrip, possibly ?? Text(
            $"{TripReplayText.Device(device)}: above 0.5 IΔn for {Ms(half)}, above IΔn for {Ms(runs.Run(1, Possibly))}: within the range where the standard lets it trip or hold"),
            possibly is not null);
    }

    private static void Worsen(DeviceFinding?[] overall, DeviceFinding[] findings)
    {
        for (var i = 0; i < overall.Length; i++)
        {
            if (overall[i] is null)
            {
                overall[i] = findings[i];
                continue;
            }

            var was = overall[i]!;
            var worse = findings[i].Finding > was.Finding
                || (findings[i].Finding == was.Finding && findings[i].MustTripReached && !was.MustTripReached);
            overall[i] = worse ? findings[i] with { MustTripReached = findings[i].MustTripReached || was.MustTripReached }
                : was with { MustTripReached = was.MustTripReached || findings[i].MustTripReached };
        }
    }

    private static RunTable Runs(IReadOnlyList<double> runsS, int ratingIndex) => new(runsS, ratingIndex);

    private static IReadOnlyList<string> Related(IReadOnlyList<EventRecord> events, HalfCycleEpisode e)
    {
        var related = new List<string>();
        var end = e.StartS + e.DurationS;
        foreach (var ev in events)
        {
            if (ev.StartS <= end && ev.StartS + ev.DurationS >= e.StartS)
            {
                related.Add(Text($"{ev.Kind} at {ev.StartS:0.###} s: {ev.Message}"));
            }
        }

        return related;
    }

    private static IReadOnlyList<TimeLimitPoint> Points(IReadOnlyList<(double Multiple, double TimeS)> table) =>
        [.. table.Select(p => new TimeLimitPoint(p.Multiple, p.TimeS))];

    /// <summary>An episode in words: its highest half-cycle RMS and its time above IΔn.</summary>
    internal static string Describe(ReplayedEpisode e, double rated) =>
        Text($"{e.MaxHalfCycleRmsMultiple:0.##} IΔn = {CurrentText.WithUnit(e.MaxHalfCycleRmsMultiple * rated)} highest half-cycle RMS, above IΔn for {Ms(e.AboveRatedS)}");

    /// <summary>A duration in whole milliseconds: <c>150 ms</c>.</summary>
    internal static string Ms(double seconds) => Text($"{seconds * 1000:0} ms");

    /// <summary>Text with numbers written the invariant way.</summary>
    internal static string Text(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    /// <summary>The stretches of one rating, looked up by multiple and variant.</summary>
    private readonly struct RunTable(IReadOnlyList<double> runsS, int ratingIndex)
    {
        public double Run(double multiple, int variant)
        {
            var k = -1;
            for (var i = 0; i < Multiples.Count; i++)
            {
                if (Multiples[i] == multiple)
                {
                    k = i;
                }
            }

            return runsS[(((ratingIndex * Multiples.Count) + k) * Variants) + variant];
        }
    }
}
