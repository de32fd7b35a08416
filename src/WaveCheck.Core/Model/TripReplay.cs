namespace WaveCheck.Core.Model;

/// <summary>
/// The episodes in which the residual current's RMS over a half-cycle reached the lowest of a set of levels (JSON
/// <c>halfCycleEpisodes</c> in the analysis), measured for the trip replay (<see cref="TripReplayResult"/>).
/// Amperes and seconds.
/// </summary>
public sealed record HalfCycleEpisodesResult
{
    /// <summary>The levels, amperes; <see cref="HalfCycleEpisode.LongestRunS"/> and <see cref="UnlistedMaxRunS"/> follow this order.</summary>
    public required IReadOnlyList<double> LevelsA { get; init; }

    /// <summary>The lowest level: a half-cycle at or above it opens an episode, amperes.</summary>
    public required double ThresholdA { get; init; }

    /// <summary>Half-cycles below a level that a stretch at or above it bridges.</summary>
    public required int BridgedHalfCycles { get; init; }

    /// <summary>Episodes found, listed or not.</summary>
    public required int Found { get; init; }

    /// <summary>The first episodes, in time order (at most 200).</summary>
    public required IReadOnlyList<HalfCycleEpisode> Episodes { get; init; }

    /// <summary>Over the episodes not listed, the longest stretch at or above each level, seconds; null when every
    /// episode is listed.</summary>
    public IReadOnlyList<double>? UnlistedMaxRunS { get; init; }

    /// <summary>RMS of the half-cycles outside every episode (the standing leakage the surges ride on), amperes; null
    /// when every half-cycle was in an episode.</summary>
    public double? QuietRmsA { get; init; }
}

/// <summary>One episode: consecutive half-cycles whose RMS reached the threshold (gaps of one half-cycle bridged).</summary>
public sealed record HalfCycleEpisode
{
    /// <summary>Start of its first half-cycle at or above the threshold, seconds.</summary>
    public required double StartS { get; init; }

    /// <summary>From that start to the end of its last half-cycle at or above the threshold, seconds.</summary>
    public required double DurationS { get; init; }

    /// <summary>Mean length of its half-cycles, seconds (the time resolution of every duration).</summary>
    public required double HalfCycleS { get; init; }

    /// <summary>Largest absolute sample, amperes.</summary>
    public required double PeakA { get; init; }

    /// <summary>Largest half-cycle RMS, amperes.</summary>
    public required double MaxHalfCycleRmsA { get; init; }

    /// <summary>RMS over the whole episode, amperes.</summary>
    public required double RmsA { get; init; }

    /// <summary>Mean over the whole episode, amperes; signed.</summary>
    public required double MeanA { get; init; }

    /// <summary>Per level, the longest stretch of half-cycles at or above it, seconds; 0 when never reached.</summary>
    public required IReadOnlyList<double> LongestRunS { get; init; }

    /// <summary>Time each envelope point stands for, seconds (a half-cycle, doubled each time a long episode's
    /// envelope was halved).</summary>
    public required double EnvelopeStepS { get; init; }

    /// <summary>Half-cycle RMS from the start of the episode, amperes (the larger of merged points).</summary>
    public required IReadOnlyList<double> EnvelopeRmsA { get; init; }
}

/// <summary>What a device does with a residual-current episode, as its standard lets it.</summary>
public enum TripFinding
{
    /// <summary>Below what the standard lets the device trip on: a compliant device stays closed.</summary>
    WillNotTrip,

    /// <summary>Within the range where the standard lets it either trip or hold (or at a limit within the
    /// measurement's uncertainty).</summary>
    MayTrip,

    /// <summary>Beyond a must-trip limit: a compliant device breaks.</summary>
    WillTrip,
}

/// <summary>The kinds of time behaviour a residual-current device has (IEC 61008-1 / IEC 61009-1).</summary>
public enum DeviceTiming
{
    /// <summary>General type: no intended delay (break times 300/150/40 ms at 1/2/5 IΔn).</summary>
    General,

    /// <summary>Time-delayed type S (selective): break times 500/200/150 ms, non-actuating times 130/60/50 ms.</summary>
    S,
}

/// <summary>A device of one rating and timing, as replayed.</summary>
/// <param name="RatedResidualCurrentA">Its IΔn, amperes.</param>
/// <param name="Timing">General or S.</param>
/// <param name="Installed">The installed rating (the timing given, or both when it was not).</param>
public sealed record ReplayedDevice(double RatedResidualCurrentA, DeviceTiming Timing, bool Installed);

/// <summary>What one device does with one episode, or with the whole capture.</summary>
/// <param name="Device">The device.</param>
/// <param name="Finding">Will not trip, may trip, will trip.</param>
/// <param name="Reason">The deciding figures and limit, for a person.</param>
/// <param name="MustTripReached">The current reached a must-trip limit (break time) of this device, or came within
/// the uncertainty of one: a compliant device would have tripped.</param>
public sealed record DeviceFinding(ReplayedDevice Device, TripFinding Finding, string Reason, bool MustTripReached);

/// <summary>One episode replayed: its figures in multiples of the installed IΔn and the finding of each device.</summary>
public sealed record ReplayedEpisode
{
    /// <summary>Start, seconds.</summary>
    public required double StartS { get; init; }

    /// <summary>Longest stretch at or above 0.5 IΔn (installed rating), seconds.</summary>
    public required double AboveHalfRatedS { get; init; }

    /// <summary>Longest stretch at or above IΔn, seconds.</summary>
    public required double AboveRatedS { get; init; }

    /// <summary>Largest half-cycle RMS, multiples of IΔn.</summary>
    public required double MaxHalfCycleRmsMultiple { get; init; }

    /// <summary>Largest absolute sample, multiples of IΔn.</summary>
    public required double PeakMultiple { get; init; }

    /// <summary>RMS over the episode, multiples of IΔn.</summary>
    public required double RmsMultiple { get; init; }

    /// <summary>Length of a half-cycle, seconds: the resolution of every duration.</summary>
    public required double HalfCycleS { get; init; }

    /// <summary>Practically smooth DC (mean at least 0.9 of the RMS): for type B the DC break times apply.</summary>
    public required bool DcDominated { get; init; }

    /// <summary>Events of the analysis (alarms, transients) within the episode, for a person.</summary>
    public required IReadOnlyList<string> RelatedEvents { get; init; }

    /// <summary>Profile for the plot: for each multiple of IΔn replayed, the longest stretch at or above it, seconds.</summary>
    public required IReadOnlyList<MagnitudeDuration> Profile { get; init; }

    /// <summary>One finding per device replayed, installed first.</summary>
    public required IReadOnlyList<DeviceFinding> Findings { get; init; }
}

/// <summary>A point of an episode's profile: how long the current stayed at or above a multiple of IΔn.</summary>
/// <param name="Multiple">Multiple of the installed IΔn.</param>
/// <param name="DurationS">Longest stretch at or above it, seconds.</param>
public sealed record MagnitudeDuration(double Multiple, double DurationS);

/// <summary>A limit of a device kind for the plot and the tables: a multiple of IΔn and a time.</summary>
/// <param name="Multiple">Multiple of IΔn.</param>
/// <param name="TimeS">Time, seconds.</param>
public sealed record TimeLimitPoint(double Multiple, double TimeS);

/// <summary>
/// Trip replay (JSON <c>assessment.tripReplay</c>): what devices of the installed rating and the alternatives would do
/// with each half-cycle episode of the capture, against the standards' break and non-actuating times, and what to do.
/// </summary>
public sealed record TripReplayResult
{
    /// <summary>IΔn of the installed device, amperes; every multiple is of it.</summary>
    public required double RatedResidualCurrentA { get; init; }

    /// <summary>The installed device's timing as given; null when not given (both are replayed as installed).</summary>
    public DeviceTiming? InstalledTiming { get; init; }

    /// <summary>The devices replayed, installed first.</summary>
    public required IReadOnlyList<ReplayedDevice> Devices { get; init; }

    /// <summary>Episodes found (listed or not).</summary>
    public required int EpisodesFound { get; init; }

    /// <summary>The episodes listed, in time order.</summary>
    public required IReadOnlyList<ReplayedEpisode> Episodes { get; init; }

    /// <summary>Per device, the finding over the whole capture (the worst episode's, unlisted ones included).</summary>
    public required IReadOnlyList<DeviceFinding> Overall { get; init; }

    /// <summary>"A compliant device would have tripped here: if it did not, test the device", one per episode where
    /// the installed rating's must-trip limit was reached; empty when none.</summary>
    public required IReadOnlyList<string> Alerts { get; init; }

    /// <summary>One line for the terminal.</summary>
    public required string Summary { get; init; }

    /// <summary>What to do, in the trade's terms, with the safety reasoning.</summary>
    public required IReadOnlyList<string> Recommendations { get; init; }

    /// <summary>The rules of the replay, with the engineering choices stated.</summary>
    public required IReadOnlyList<string> Notes { get; init; }

    /// <summary>General type: the break times (must trip within), multiples of IΔn and seconds.</summary>
    public required IReadOnlyList<TimeLimitPoint> GeneralBreakTimes { get; init; }

    /// <summary>Type S: the break times.</summary>
    public required IReadOnlyList<TimeLimitPoint> TimeDelayedBreakTimes { get; init; }

    /// <summary>Type S: the non-actuating times (must not trip within).</summary>
    public required IReadOnlyList<TimeLimitPoint> TimeDelayedNonActuatingTimes { get; init; }

    /// <summary>The non-operating current as a multiple of IΔn (0.5).</summary>
    public required double NonOperatingMultiple { get; init; }
}
