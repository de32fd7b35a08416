namespace WaveCheck.Core.Survey;

/// <summary>Cautions printed with every survey summary, in every form.</summary>
public static class SurveyCautions
{
    /// <summary>The cautions, each one sentence.</summary>
    public static IReadOnlyList<string> All => Text.StandingCautions.All;
}
