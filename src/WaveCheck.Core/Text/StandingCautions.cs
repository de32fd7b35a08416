namespace WaveCheck.Core.Text;

/// <summary>
/// The cautions that go with every verdict, report and survey, in one place: electrical work can kill, and a
/// recording is evidence for a competent person, not a licence to change an installation.
/// </summary>
public static class StandingCautions
{
    /// <summary>Each one sentence, in the order printed.</summary>
    public static IReadOnlyList<string> All { get; } =
    [
        "Verify on site with a suitable instrument (an RCD tester for the trip test, a DC-capable leakage clamp for the residual current) before relying on this verdict.",
        "Follow local codes and the device maker's data; where they differ from this tool, they decide.",
        "Have the work on the installation done by licensed or otherwise qualified people.",
    ];
}
