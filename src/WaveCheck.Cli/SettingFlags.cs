using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Survey;
using WaveCheck.Core.Synthesis;

namespace WaveCheck.Cli;

/// <summary>
/// The one place where Core's settings meet this command line's flags: Core's messages name a setting by its
/// property (<see cref="Setting.Ref"/>), and the terminal shows the flag that sets it.
/// </summary>
internal static class SettingFlags
{
    private static readonly Dictionary<string, string> Flags = new(StringComparer.Ordinal)
    {
        [nameof(ImportOptions.ScaleA)] = "--scale",
        [nameof(ImportOptions.SensitivityVPerA)] = "--sensitivity",
        [nameof(ImportOptions.RangeV)] = "--range",
        [nameof(ImportOptions.RateHz)] = "--rate",
        [nameof(ImportOptions.Channel)] = "--channel",
        [nameof(ImportOptions.SumChannels)] = "--sum",
        [nameof(ImportOptions.Sensor)] = "--sensor",
        [nameof(ImportOptions.VoltageChannels)] = "--voltage",
        [nameof(ImportOptions.VoltageScale)] = "--voltage-scale",
        [nameof(AnalysisOptions.MainsHz)] = "--mains",
        [nameof(AnalysisOptions.KeepGivenMains)] = "--mains-as-given",
        [nameof(AnalysisOptions.RestBandA)] = "--rest-band",
        [nameof(AnalysisOptions.AlarmA)] = "--alarm",
        [nameof(AssessmentOptions.RatedResidualCurrentA)] = "--rated",
        [nameof(AssessmentOptions.InstalledType)] = "--device",
        [nameof(AssessmentOptions.Regime)] = "--regime",
        [nameof(AssessmentOptions.EvChargingPoint)] = "--ev",
        [nameof(AssessmentOptions.ChargerDcDetection)] = "--charger-dc-detection",
        [nameof(AssessmentOptions.Accuracy)] = "--accuracy",
        [nameof(AssessmentOptions.DcThresholdA)] = "--dc-threshold",
        [nameof(AssessmentOptions.BelowMainsThresholdA)] = "--below-mains-threshold",
        [nameof(AssessmentOptions.HarmonicThresholdA)] = "--harmonic-threshold",
        [nameof(AssessmentOptions.HighFrequencyThresholdA)] = "--hf-threshold",
        [nameof(AssessmentOptions.TypeASmoothDcToleranceA)] = "--type-a-dc",
        [nameof(AssessmentOptions.TypeFSmoothDcToleranceA)] = "--type-f-dc",
        [nameof(AssessmentOptions.RdcDdThresholdA)] = "--rdc-dd",
        [nameof(AssessmentOptions.PulsatingShareThreshold)] = "--pulsating-share",
        [nameof(AssessmentOptions.LeakageBudgetFraction)] = "--leakage-budget",
        [nameof(AssessmentOptions.PossibleRiskFraction)] = "--risk-possible",
        [nameof(AssessmentOptions.LikelyRiskFraction)] = "--risk-likely",
        [nameof(AssessmentOptions.BPlusUpperLimitA)] = "--bplus-limit",
        [nameof(AssessmentOptions.FrequencyFactor150Hz)] = "--frequency-factors",
        [nameof(AssessmentOptions.FrequencyFactor400Hz)] = "--frequency-factors",
        [nameof(AssessmentOptions.FrequencyFactor1kHz)] = "--frequency-factors",
        [SynthesisSettings.Supply] = "--supply",
        [SynthesisSettings.Parts] = "synth",
    };

    /// <summary>The flag that sets a setting; the property name itself for one the command line has no flag for.</summary>
    public static string Of(string property) => Flags.GetValueOrDefault(property, property);

    /// <summary>Every setting that has a flag, for tests.</summary>
    public static IReadOnlyCollection<string> Settings => Flags.Keys;

    /// <summary>A survey's naming: a setting given on the command line by its flag, any other by its site-file key
    /// when the captures come from a site file, else by its flag.</summary>
    /// <param name="fromSiteFile">The captures and their settings come from a site file.</param>
    /// <param name="onCommandLine">Properties set on the command line, which override the site file's.</param>
    public static Func<string, string> ForSurvey(bool fromSiteFile, IReadOnlySet<string> onCommandLine) =>
        property => fromSiteFile && !onCommandLine.Contains(property) && SiteConfigReader.KeyText(property) is { } key
            ? key
            : Of(property);
}
