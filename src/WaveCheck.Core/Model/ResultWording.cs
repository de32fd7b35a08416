using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Model;

/// <summary>
/// A result's texts with the settings they name written in a front end's words: the CLI's flags, a site file's
/// keys, or, for Core alone, the settings' property names.
/// </summary>
/// <remarks>
/// Core knows no command line: a warning, caution, class finding, reason or threshold source that tells the user
/// which setting to change marks it with <see cref="Setting.Ref"/> (<c>choose another with ⟦Channel⟧</c>), as
/// <see cref="UserInputException"/> does. Each front end words the whole result once, before any output (JSON,
/// terminal, report), with its own naming (<see cref="Setting.Render"/>); Core's own writers
/// (<see cref="Export.ResultJson"/>) word any text still marked by the property name. A text without marks is kept
/// as it is, the same instance.
/// </remarks>
public static class ResultWording
{
    /// <summary>The result with every marked setting in its texts written as <paramref name="settingName"/> gives it.</summary>
    /// <param name="result">A result from Core.</param>
    /// <param name="settingName">From a property name (<c>SumChannels</c>) to the user's word for it (<c>--sum</c>).</param>
    public static AnalysisResult InWords(this AnalysisResult result, Func<string, string> settingName)
    {
        ArgumentNullException.ThrowIfNull(result);
        ArgumentNullException.ThrowIfNull(settingName);
        return result with
        {
            Capture = result.Capture.InWords(settingName),
            Warnings = [.. result.Warnings.Select(w => w.InWords(settingName))],
            LeakageSplit = result.LeakageSplit is { } split
                ? split with
                {
                    Notes = Words(split.Notes, settingName),
                    Insulation = split.Insulation is { } finding
                        ? finding with { Message = Words(finding.Message, settingName), Summary = Words(finding.Summary, settingName) }
                        : null,
                }
                : null,
            Assessment = result.Assessment?.InWords(settingName),
        };
    }

    /// <summary>The capture's description with its calibration and voltage sources worded.</summary>
    /// <param name="info">As read.</param>
    /// <param name="settingName">As for <see cref="InWords(AnalysisResult, Func{string, string})"/>.</param>
    public static CaptureInfo InWords(this CaptureInfo info, Func<string, string> settingName)
    {
        ArgumentNullException.ThrowIfNull(info);
        ArgumentNullException.ThrowIfNull(settingName);
        return info with
        {
            Calibration = info.Calibration with { Source = Words(info.Calibration.Source, settingName) },
            Voltage = info.Voltage is { } voltage ? voltage with { Source = Words(voltage.Source, settingName) } : null,
        };
    }

    /// <summary>The warning with its message worded.</summary>
    /// <param name="warning">As found.</param>
    /// <param name="settingName">As for <see cref="InWords(AnalysisResult, Func{string, string})"/>.</param>
    public static CaptureWarning InWords(this CaptureWarning warning, Func<string, string> settingName)
    {
        ArgumentNullException.ThrowIfNull(warning);
        ArgumentNullException.ThrowIfNull(settingName);
        return warning with { Message = Words(warning.Message, settingName) };
    }

    /// <summary>The verdict with its headline, findings, reasons, cautions, threshold sources and trip replay worded.</summary>
    /// <param name="assessment">As judged.</param>
    /// <param name="settingName">As for <see cref="InWords(AnalysisResult, Func{string, string})"/>.</param>
    public static AssessmentResult InWords(this AssessmentResult assessment, Func<string, string> settingName)
    {
        ArgumentNullException.ThrowIfNull(assessment);
        ArgumentNullException.ThrowIfNull(settingName);
        return assessment with
        {
            Headline = Words(assessment.Headline, settingName),
            AcceptedProtection = assessment.AcceptedProtection is { } accepted ? Words(accepted, settingName) : null,
            Classes = [.. assessment.Classes.Select(c => c with { Text = Words(c.Text, settingName) })],
            Types = [.. assessment.Types.Select(t => t with { Reasons = Words(t.Reasons, settingName) })],
            NuisanceTrip = assessment.NuisanceTrip with { Explanation = Words(assessment.NuisanceTrip.Explanation, settingName) },
            Blinding = assessment.Blinding with { Explanation = Words(assessment.Blinding.Explanation, settingName) },
            EvCharging = assessment.EvCharging with { Recommendation = Words(assessment.EvCharging.Recommendation, settingName) },
            Gfci = assessment.Gfci is { } gfci ? gfci with { Notes = Words(gfci.Notes, settingName) } : null,
            Cautions = Words(assessment.Cautions, settingName),
            Thresholds = [.. assessment.Thresholds.Select(t => t with { Source = Words(t.Source, settingName) })],
            TripReplay = assessment.TripReplay is { } replay
                ? replay with
                {
                    Alerts = Words(replay.Alerts, settingName),
                    Summary = Words(replay.Summary, settingName),
                    Recommendations = Words(replay.Recommendations, settingName),
                    Notes = Words(replay.Notes, settingName),
                }
                : null,
        };
    }

    private static string Words(string text, Func<string, string> settingName) => Setting.Render(text, settingName);

    private static IReadOnlyList<string> Words(IReadOnlyList<string> texts, Func<string, string> settingName) =>
        [.. texts.Select(t => Setting.Render(t, settingName))];
}
