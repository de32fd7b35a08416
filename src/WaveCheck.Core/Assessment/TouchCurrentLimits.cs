using WaveCheck.Core.Model;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// IEC 60990 touch-current readings against common equipment-standard limits, each with its status.
/// Informational: which limit applies depends on the equipment's own standard. Stateless and thread-safe.
/// </summary>
/// <remarks>
/// Peak limits are compared with the perception/reaction-weighted peak (IEC 60990 Fig. 4, U2/500 Ω), RMS limits with
/// the perception/reaction-weighted RMS, DC limits with the mean of the unweighted reading (Fig. 3). IEC 60601-1
/// measures with its own device (R1 10 kΩ, R2 1 kΩ, C1 0.015 µF), not computed here: its comparison uses the
/// perception-weighted RMS as an approximation and says so.
/// </remarks>
public static class TouchCurrentLimits
{
    private const string PerceptionPeak = "perception peak";
    private const string PerceptionRms = "perception RMS";
    private const string Dc = "DC";

    private static readonly (string Limit, double LimitA, string Reading, string Source)[] Table =
    [
        ("IEC 62368-1 ES1, 0.5 mA rms", 0.0005, PerceptionRms, "IEC 62368-1 ES1 (from memory)"),
        ("IEC 62368-1 ES1, 0.707 mA peak", 0.000707, PerceptionPeak, "IEC 62368-1 ES1 (from memory)"),
        ("IEC 62368-1 ES1, 2 mA DC", 0.002, Dc, "IEC 62368-1 ES1 (from memory)"),
        ("IEC 62368-1 ES2, 5 mA rms", 0.005, PerceptionRms, "IEC 62368-1 ES2 (from memory)"),
        ("IEC 62368-1 ES2, 25 mA DC", 0.025, Dc, "IEC 62368-1 ES2 (from memory)"),
        ("IEC 60950-1, 0.25 mA (parts not earthed)", 0.00025, PerceptionRms, "IEC 60950-1 (std)"),
        ("IEC 60950-1, 0.75 mA (hand-held)", 0.00075, PerceptionRms, "IEC 60950-1 (std)"),
        ("IEC 60950-1, 3.5 mA (other equipment)", 0.0035, PerceptionRms, "IEC 60950-1 (std)"),
        ("IEC 61010-1 normal, 0.5 mA rms", 0.0005, PerceptionRms, "IEC 61010-1 (from memory)"),
        ("IEC 61010-1 normal, 0.7 mA peak", 0.0007, PerceptionPeak, "IEC 61010-1 (from memory)"),
        ("IEC 61010-1 normal, 2 mA DC", 0.002, Dc, "IEC 61010-1 (from memory)"),
        ("IEC 61010-1 single fault, 3.5 mA rms", 0.0035, PerceptionRms, "IEC 61010-1 (from memory)"),
        ("IEC 61010-1 single fault, 5 mA peak", 0.005, PerceptionPeak, "IEC 61010-1 (from memory)"),
        ("IEC 61010-1 single fault, 15 mA DC", 0.015, Dc, "IEC 61010-1 (from memory)"),
        ("IEC 60601-1 touch current, normal, 100 µA", 0.0001, PerceptionRms, "IEC 60601-1 (std; measured there with its own device, approximated here)"),
        ("IEC 60601-1 touch current, single fault, 500 µA", 0.0005, PerceptionRms, "IEC 60601-1 (std; measured there with its own device, approximated here)"),
    ];

    /// <summary>Compares the readings with every limit in the table.</summary>
    /// <param name="readings">IEC 60990 readings, amperes.</param>
    public static TouchCurrentAssessment Compare(TouchCurrentResult readings)
    {
        ArgumentNullException.ThrowIfNull(readings);
        var list = new List<LimitComparison>(Table.Length);
        foreach (var (limit, limitA, reading, source) in Table)
        {
            var value = reading switch
            {
                PerceptionPeak => readings.PerceptionPeakA,
                PerceptionRms => readings.PerceptionRmsA,
                _ => Math.Abs(readings.DcA),
            };
            list.Add(new LimitComparison(limit, limitA, reading, value, value <= limitA, source));
        }

        return new TouchCurrentAssessment(readings, list);
    }
}
