namespace WaveCheck.Core.Model;

/// <summary>Findings a user may ask a run to fail on (CLI <c>--fail-on</c>: exit code 1).</summary>
[Flags]
public enum Finding
{
    /// <summary>None.</summary>
    None = 0,

    /// <summary>An installed device is not adequate for the residual current it protects against.</summary>
    Upgrade = 1,

    /// <summary>Nuisance tripping possible or likely (a capture's margin, or an upstream device's leakage sum).</summary>
    Nuisance = 2,

    /// <summary>A window's RMS above the alarm level (one capture).</summary>
    Alarm = 4,

    /// <summary>A capture of a survey could not be read.</summary>
    Error = 8,
}

/// <summary>The findings of a result, decided in one place for every command.</summary>
public static class Findings
{
    /// <summary>Findings of one analysed capture (its assessment included).</summary>
    public static Finding Of(AnalysisResult analysis)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        var found = Finding.None;
        if (analysis.Assessment is { } a)
        {
            found |= a.InstalledAdequate == false ? Finding.Upgrade : Finding.None;
            found |= IsNuisance(a.NuisanceTrip.Risk) ? Finding.Nuisance : Finding.None;
        }

        found |= analysis.Events.Any(e => e.Kind == "alarm") ? Finding.Alarm : Finding.None;
        return found;
    }

    /// <summary>Findings of a survey: any row's, and the upstream devices' leakage sums.</summary>
    public static Finding Of(SurveyDocument survey)
    {
        ArgumentNullException.ThrowIfNull(survey);
        var found = Finding.None;
        foreach (var row in survey.Rows)
        {
            found |= row.Verdict switch
            {
                SurveyVerdict.Upgrade => Finding.Upgrade,
                SurveyVerdict.Error => Finding.Error,
                _ => Finding.None,
            };
            found |= row.NuisanceRisk is { } risk && IsNuisance(risk) ? Finding.Nuisance : Finding.None;
        }

        found |= survey.Upstream.Any(u => IsNuisance(u.LeakageRisk)) ? Finding.Nuisance : Finding.None;
        return found;
    }

    private static bool IsNuisance(RiskLevel risk) => risk is RiskLevel.Possible or RiskLevel.Likely;
}
