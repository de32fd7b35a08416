using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Results;

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

    /// <summary>Upstream devices checked against their circuits.</summary>
    public required IReadOnlyList<UpstreamResult> Upstream { get; init; }

    /// <summary>Cautions that go with every survey.</summary>
    public IReadOnlyList<string> Cautions { get; init; } = SurveyCautions.All;
}

/// <summary>Cautions printed with every survey summary, in every form.</summary>
public static class SurveyCautions
{
    /// <summary>The cautions, each one sentence.</summary>
    public static IReadOnlyList<string> All => Assessment.StandingCautions.All;
}

/// <summary>Writes <see cref="SurveyDocument"/>.</summary>
public static class SurveyJson
{
    /// <summary>Writes the survey JSON whole or not at all (<c>-</c>: stdout).</summary>
    /// <param name="path">Target file or <c>-</c>.</param>
    /// <param name="document">The survey.</param>
    public static void Write(string path, SurveyDocument document)
    {
        ArgumentNullException.ThrowIfNull(document);
        ResultJson.Write(path, document);
    }
}
