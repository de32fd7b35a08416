namespace WaveCheck.Core.Model;

/// <summary>The survey's JSON form (schema <c>wavecheck.survey/1</c>, camelCase, SI units).</summary>
public sealed record SurveyDocument
{
    /// <summary>Schema identifier.</summary>
    public string Schema { get; init; } = "wavecheck.survey/1";

    /// <summary>Site name.</summary>
    public required string Site { get; init; }

    /// <summary>When the survey was written.</summary>
    public required DateTimeOffset GeneratedAt { get; init; }

    /// <summary>One row per capture, in input order.</summary>
    public required IReadOnlyList<SurveyRow> Rows { get; init; }

    /// <summary>One verdict per circuit over its captures, in the order each circuit first appears in
    /// <see cref="Rows"/>; empty in surveys written before circuits were grouped.</summary>
    public IReadOnlyList<CircuitVerdict> Circuits { get; init; } = [];

    /// <summary>The remedial schedule: circuits and upstream devices that need action, most urgent first.</summary>
    public IReadOnlyList<RemedialAction> Actions { get; init; } = [];

    /// <summary>Upstream devices checked against their circuits.</summary>
    public required IReadOnlyList<UpstreamResult> Upstream { get; init; }

    /// <summary>Cautions that go with every survey.</summary>
    public required IReadOnlyList<string> Cautions { get; init; }
}
