using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Survey;

/// <summary>Builds the survey's <see cref="SurveyRow"/>s from what the survey ran.</summary>
public static class SurveyRows
{
    /// <summary>The row of a capture that was analysed and assessed.</summary>
    /// <param name="file">The capture (the job's path).</param>
    /// <param name="settings">The settings it was analysed with.</param>
    /// <param name="analysis">What the analysis measured.</param>
    /// <param name="assessment">The verdict.</param>
    /// <param name="reportPath">Its report relative to the survey's output folder; null when none.</param>
    public static SurveyRow From(string file, CaptureSettings settings, AnalysisResult analysis, AssessmentResult assessment,
        string? reportPath)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(analysis);
        ArgumentNullException.ThrowIfNull(assessment);
        // The protection in full (A+RDC-DD): at a charging point a plain A and an A with DC detection differ in verdict.
        var installed = assessment.InstalledProtection
            ?? ((assessment.InstalledType ?? settings.InstalledProtection?.Type) is { } type ? new InstalledProtection(type) : null);
        var worstRms = analysis.Windows.Statistics.TryGetValue("rmsA", out var rms) ? rms.Max : analysis.Summary.RmsA;
        return new SurveyRow
        {
            File = file,
            Circuit = settings.Circuit,
            State = settings.State,
            InstalledType = installed,
            AcceptedProtection = assessment.AcceptedProtection,
            RatedResidualCurrentA = assessment.RatedResidualCurrentA,
            RequiredType = assessment.RequiredType,
            MinimumType = assessment.MinimumType,
            Verdict = SurveyRow.VerdictOf(installed, assessment.InstalledAdequate),
            RmsA = analysis.Summary.RmsA,
            WorstWindowRmsA = worstRms,
            SmoothDcA = analysis.Components.SmoothDcMaxA,
            SmoothDcKnown = assessment.Blinding.Blinded is not null,
            Above1kHzRmsA = analysis.Components.Above1kHzRmsA,
            NuisanceRisk = assessment.NuisanceTrip.Risk,
            NuisanceMarginA = assessment.NuisanceTrip.MarginA,
            Blinded = assessment.Blinding.Blinded,
            Headline = assessment.Headline,
            ReportPath = reportPath,
            DurationS = analysis.Capture.DurationS,
            SampleRateHz = analysis.Capture.SampleRateHz,
            TripGeneral = Replayed(assessment, DeviceTiming.General),
            TripS = Replayed(assessment, DeviceTiming.S),
            TripAlert = assessment.TripReplay is { } replay ? replay.Alerts.Count > 0 : null,
        };
    }

    private static string? Replayed(AssessmentResult assessment, DeviceTiming timing) =>
        assessment.TripReplay?.Overall.FirstOrDefault(f => f.Device.Timing == timing
            && f.Device.RatedResidualCurrentA == assessment.TripReplay.RatedResidualCurrentA) is { } f
            ? TripReplayText.Finding(f.Finding)
            : null;

    /// <summary>The row of a capture that could not be analysed.</summary>
    /// <param name="file">The capture (the job's path).</param>
    /// <param name="settings">The settings it was to be analysed with.</param>
    /// <param name="message">What went wrong, for a person.</param>
    public static SurveyRow Failed(string file, CaptureSettings settings, string message)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return new SurveyRow
        {
            File = file,
            Circuit = settings.Circuit,
            State = settings.State,
            // As the assessment would have judged it, so a failed capture of a circuit names the same device as its
            // analysed captures.
            InstalledType = settings.JudgedProtection,
            RatedResidualCurrentA = settings.RatedResidualCurrentA,
            Verdict = SurveyVerdict.Error,
            Error = message,
        };
    }
}
