namespace WaveCheck.Core.Model;

/// <summary>A circuit's figures as one result file states them (a survey's circuit, or one analysed capture). SI units.</summary>
public sealed record CircuitFigures
{
    /// <summary>The circuit's name; the capture's file name for an analysis file.</summary>
    public required string Circuit { get; init; }

    /// <summary>File names of its captures (no folder), for matching and for people.</summary>
    public required IReadOnlyList<string> Files { get; init; }

    /// <summary>Installed protection as stated; null when not given.</summary>
    public InstalledProtection? InstalledType { get; init; }

    /// <summary>IΔn, amperes.</summary>
    public double? RatedResidualCurrentA { get; init; }

    /// <summary>Required type; null when undecided.</summary>
    public DeviceType? RequiredType { get; init; }

    /// <summary>Minimum type; null when unknown.</summary>
    public DeviceType? MinimumType { get; init; }

    /// <summary>Verdict on the installed device.</summary>
    public required SurveyVerdict Verdict { get; init; }

    /// <summary>Largest window RMS (the standing residual current at its worst), amperes.</summary>
    public double? WorstWindowRmsA { get; init; }

    /// <summary>Smooth DC of the worst window, amperes; signed.</summary>
    public double? SmoothDcA { get; init; }

    /// <summary>RMS above 1 kHz, amperes.</summary>
    public double? Above1kHzRmsA { get; init; }

    /// <summary>Nuisance-tripping risk.</summary>
    public RiskLevel? NuisanceRisk { get; init; }

    /// <summary>Nuisance margin: 0.5 IΔn minus the standing current, amperes (negative: above the limit).</summary>
    public double? NuisanceMarginA { get; init; }
}

/// <summary>How the two sides of a circuit were paired.</summary>
public enum RetestMatch
{
    /// <summary>By the circuit's name.</summary>
    Circuit,

    /// <summary>By a capture's file name.</summary>
    File,

    /// <summary>The only circuit on each side (two analysis files).</summary>
    Single,

    /// <summary>Found on one side only.</summary>
    Unmatched,
}

/// <summary>What a retest shows for one circuit.</summary>
public enum RetestOutcome
{
    /// <summary>Was not adequate, now is.</summary>
    Remedied,

    /// <summary>The verdict or the demand improved (e.g. from cannot-tell to ok, or a weaker type required).</summary>
    Better,

    /// <summary>Verdict and required type unchanged.</summary>
    Unchanged,

    /// <summary>The verdict got worse or a stronger type is now required.</summary>
    Worse,

    /// <summary>Only in the earlier result.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("not-retested")]
    NotRetested,

    /// <summary>Only in the later result.</summary>
    New,
}

/// <summary>One circuit before and after.</summary>
/// <param name="Circuit">Its name (the later side's where both have one).</param>
/// <param name="Match">How the sides were paired.</param>
/// <param name="Before">The earlier figures; null when only in the later result.</param>
/// <param name="After">The later figures; null when only in the earlier result.</param>
/// <param name="Outcome">The retest's outcome.</param>
/// <param name="Changes">What changed, one short sentence each, with the figures (mA on screen).</param>
public sealed record CircuitChange(string Circuit, RetestMatch Match, CircuitFigures? Before, CircuitFigures? After,
    RetestOutcome Outcome, IReadOnlyList<string> Changes);

/// <summary>The comparison of two results of one site (schema <c>wavecheck.retest/1</c>).</summary>
public sealed record RetestComparison
{
    /// <summary>Schema identifier.</summary>
    public string Schema { get; init; } = "wavecheck.retest/1";

    /// <summary>The earlier result as named.</summary>
    public required string BeforePath { get; init; }

    /// <summary>The later result as named.</summary>
    public required string AfterPath { get; init; }

    /// <summary>Site name of the later result (or the earlier); null for analysis files.</summary>
    public string? Site { get; init; }

    /// <summary>One entry per circuit, in the later result's order, then circuits only in the earlier one.</summary>
    public required IReadOnlyList<CircuitChange> Circuits { get; init; }
}
