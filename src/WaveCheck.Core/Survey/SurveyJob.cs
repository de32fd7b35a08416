using WaveCheck.Core.Model;
namespace WaveCheck.Core.Survey;

/// <summary>One capture of a survey to analyse.</summary>
/// <param name="File">Path of the capture to open; the row produced for it carries the same string.</param>
/// <param name="Settings">How to read and judge it.</param>
public sealed record SurveyJob(string File, CaptureSettings Settings);

/// <summary>What a survey keeps of one analysed capture: its row only, so the survey's memory grows with the number
/// of captures, not with their length. Reports and per-window tables are written by the job itself as it goes.</summary>
/// <param name="Row">The capture's summary row.</param>
public sealed record SurveyOutcome(SurveyRow Row);
