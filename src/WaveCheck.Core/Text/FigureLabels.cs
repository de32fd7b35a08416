using System.Text;

namespace WaveCheck.Core.Text;

/// <summary>
/// The words every output uses for a figure, so that one quantity carries one label in the terminal, the report, the
/// index and the CSV, and no code identifier (<c>above1kHzRmsA</c>) reaches a table meant for a person.
/// </summary>
public static class FigureLabels
{
    /// <summary>The RMS of every sample of the capture.</summary>
    public const string WholeCaptureRms = "whole-capture RMS";

    /// <summary>The highest RMS of any one 10/12-cycle window.</summary>
    public const string WorstWindowRms = "worst-window RMS";

    /// <summary>The value 95 % of the windows stay at or below.</summary>
    public const string Percentile95 = "95th percentile of windows";

    /// <summary>The mean over the windows.</summary>
    public const string WindowMean = "mean of windows";

    /// <summary>What a limit "from memory" is marked with in a report meant for a client.</summary>
    public const string ToConfirm = "(value to confirm against the standard)";

    /// <summary>Per-window figures in the order a report lists them, with their words.</summary>
    private static readonly (string Name, string Label)[] MetricOrder =
    [
        ("rmsA", "RMS"),
        ("acRmsA", "AC RMS (mean removed)"),
        ("dcA", "DC (mean)"),
        ("smoothDcA", "smooth DC"),
        ("peakPositiveA", "highest sample"),
        ("peakNegativeA", "lowest sample"),
        ("crestFactor", "crest factor"),
        ("mainsRmsA", "at mains frequency (harmonic group 1)"),
        ("belowMainsRmsA", "below mains frequency"),
        ("harmonicsRmsA", "harmonics 2 to 50"),
        ("thdPercent", "THD"),
        ("above1kHzRmsA", "above 1 kHz"),
        ("above9kHzRmsA", "above 9 kHz"),
        ("currentDelayAngleDeg", "current-delay angle"),
        ("frequencyHz", "mains frequency"),
    ];

    private static readonly Dictionary<string, string> Metrics = MetricOrder.ToDictionary(m => m.Name, m => m.Label, StringComparer.Ordinal);

    /// <summary>Where a per-window figure stands in a report's list (unlisted names last).</summary>
    public static int MetricRank(string name)
    {
        var index = Array.FindIndex(MetricOrder, m => m.Name == name);
        return index < 0 ? MetricOrder.Length : index;
    }

    private static readonly Dictionary<string, string> Thresholds = new(StringComparer.Ordinal)
    {
        ["ratedResidualCurrentA"] = "rated residual operating current IΔn",
        ["accuracyReadingFraction"] = "measurement uncertainty, share of reading",
        ["accuracyOffsetA"] = "measurement uncertainty, fixed part",
        ["dcSignificanceA"] = "smooth DC counted as present from",
        ["belowMainsSignificanceA"] = "motor-frequency content counted from",
        ["harmonicSignificanceA"] = "AC at other frequencies (to 1 kHz) counted from",
        ["highFrequencySignificanceA"] = "content 1 to 20 kHz counted from",
        ["pulsatingShareThreshold"] = "share of windows for pulsating DC",
        ["typeASmoothDcToleranceA"] = "type A smooth-DC tolerance",
        ["typeFSmoothDcToleranceA"] = "type F smooth-DC tolerance",
        ["typeBSmoothDcToleranceA"] = "type B smooth-DC tolerance",
        ["rdcDdThresholdA"] = "RDC-DD trip threshold",
        ["leakageBudgetFraction"] = "leakage budget, share of IΔn",
        ["possibleRiskFraction"] = "nuisance risk 'possible' from, share of IΔn",
        ["likelyRiskFraction"] = "nuisance risk 'likely' from, share of IΔn",
        ["nonOperatingFraction"] = "non-operating current, share of IΔn",
        ["frequencyFactor150Hz"] = "type B upper trip factor at 150 Hz",
        ["frequencyFactor400Hz"] = "type B upper trip factor at 400 Hz",
        ["frequencyFactor1kHz"] = "type B upper trip factor at 1 kHz",
        ["bPlusUpperLimitA"] = "B+ upper trip limit to 20 kHz",
        ["typeBSmoothDcFactor"] = "type B smooth-DC upper trip factor",
        ["pulsatingDcFactor"] = "pulsating-DC upper trip factor",
        ["minimumRestDeg"] = "pulsating DC: least interval at rest per cycle",
        ["motorFrequencyTopMultiple"] = "motor frequencies up to, multiple of mains",
    };

    /// <summary>A per-window figure's name in words (<c>above1kHzRmsA</c> → <c>above 1 kHz</c>).</summary>
    public static string Metric(string name) => Metrics.TryGetValue(name, out var label) ? label : Words(name);

    /// <summary>A threshold's name in words (<c>typeASmoothDcToleranceA</c> → <c>type A smooth-DC tolerance</c>).</summary>
    public static string Threshold(string name) => Thresholds.TryGetValue(name, out var label) ? label : Words(name);

    /// <summary>A source text for a client's report: "from memory" becomes <see cref="ToConfirm"/>, and
    /// a threshold's code name inside the text becomes its words.</summary>
    public static string ForClient(string source)
    {
        ArgumentNullException.ThrowIfNull(source);
        var text = source.Replace("(from memory)", ToConfirm, StringComparison.OrdinalIgnoreCase)
            .Replace("from memory", ToConfirm.Trim('(', ')'), StringComparison.OrdinalIgnoreCase);
        foreach (var (name, label) in Thresholds)
        {
            text = text.Replace(name, $"'{label}'", StringComparison.Ordinal);
        }

        return text;
    }

    /// <summary>Whether a source text says its value is from memory.</summary>
    public static bool FromMemory(string source) => source.Contains("from memory", StringComparison.OrdinalIgnoreCase);

    /// <summary>A camelCase name in words, with a trailing unit letter dropped: the fallback for a name not listed.</summary>
    internal static string Words(string name)
    {
        var trimmed = name.EndsWith("Hz", StringComparison.Ordinal) || name.EndsWith("Deg", StringComparison.Ordinal) || name.EndsWith("Percent", StringComparison.Ordinal)
            ? name
            : name.Length > 1 && name[^1] == 'A' && char.IsLower(name[^2]) ? name[..^1] : name;
        var text = new StringBuilder(trimmed.Length + 8);
        for (var i = 0; i < trimmed.Length; i++)
        {
            var c = trimmed[i];
            if (char.IsUpper(c) && i > 0)
            {
                text.Append(' ');
            }

            text.Append(char.ToLowerInvariant(c));
        }

        return text.ToString();
    }
}
