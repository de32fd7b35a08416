using WaveCheck.Core.Model;
namespace WaveCheck.Core.Assessment;

/// <summary>
/// The classes of residual current the device-type standards distinguish (IEC 60364-5-53:2015 §531.3.3, IEC 61008-1,
/// IEC 62423, IEC 60364-7-722). Each is detected by the types from <see cref="ResidualCurrentClasses.LeastType"/> up;
/// the required type is the least type that detects every class a capture shows.
/// </summary>
public enum ResidualCurrentClass
{
    /// <summary>Sinusoidal AC at mains frequency: every type.</summary>
    MainsAc,

    /// <summary>Pulsating DC (rests at zero for at least 150° each cycle, IEC 61008-1): type A and up.</summary>
    PulsatingDc,

    /// <summary>Composite current of a single-phase frequency converter: a motor frequency (sub-mains content, or a
    /// non-harmonic tone up to twice mains), or content in the harmonic group at 1 kHz, the switching part of
    /// IEC 62423's composite test current (type F).</summary>
    Composite,

    /// <summary>AC at frequencies other than mains up to 1 kHz, outside a pulsating DC's own harmonics: type B
    /// ("sinusoidal AC up to 1 kHz", IEC 62423).</summary>
    NonMainsAc,

    /// <summary>Smooth DC, or DC that is not pulsating DC (rectified current from two or more phases, which never rests
    /// at zero): type B (IEC 62423). A 6 mA DC detection device covers it at a charging point (IEC 62955).</summary>
    SmoothDc,

    /// <summary>Content between 1 and 20 kHz: type B's tripping is defined only to 1 kHz; B+ to 20 kHz (DIN VDE 0664-400).</summary>
    HighFrequency,

    /// <summary>A charging point's possible DC fault current, whatever the capture shows (IEC 60364-7-722): type B, or
    /// type A with 6 mA DC detection.</summary>
    ChargingPointDcFault,

    /// <summary>Samples at full scale: the shape and the spectrum above the clipping level are unknown, so nothing
    /// stronger than what was seen can be ruled out (open up to B+).</summary>
    Clipping,
}

/// <summary>Presence of a class in a capture (JSON <c>absent</c>, <c>at limit</c>, <c>present</c>, <c>open</c>).</summary>
public enum ClassPresence
{
    /// <summary>Not seen: its figure is below the threshold by more than the measurement uncertainty.</summary>
    Absent,

    /// <summary>Its figure is within the measurement uncertainty of the threshold: counted as present (safe side).</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("at limit")]
    AtLimit,

    /// <summary>Seen: its figure reaches the threshold beyond the uncertainty, or a rule states it regardless of figures.</summary>
    Present,

    /// <summary>The capture cannot show it (an AC-coupled sensor and DC; a sample rate below 40 kS/s and 1-20 kHz; clipping).</summary>
    Open,
}

/// <summary>Facts about each <see cref="ResidualCurrentClass"/>.</summary>
public static class ResidualCurrentClasses
{
    /// <summary>The least type specified to detect the class (IEC 60364-5-53:2015 §531.3.3; IEC 62423; DIN VDE 0664-400).</summary>
    public static DeviceType LeastType(this ResidualCurrentClass c) => c switch
    {
        ResidualCurrentClass.MainsAc => DeviceType.AC,
        ResidualCurrentClass.PulsatingDc => DeviceType.A,
        ResidualCurrentClass.Composite => DeviceType.F,
        ResidualCurrentClass.NonMainsAc => DeviceType.B,
        ResidualCurrentClass.SmoothDc => DeviceType.B,
        ResidualCurrentClass.ChargingPointDcFault => DeviceType.B,
        ResidualCurrentClass.HighFrequency => DeviceType.BPlus,
        ResidualCurrentClass.Clipping => DeviceType.BPlus,
        _ => throw new ArgumentOutOfRangeException(nameof(c), c, "unknown class"),
    };

    /// <summary>True when a 6 mA DC detection device (RDC-DD, IEC 62955, or the charger's own) beside a type A or
    /// stronger device covers the class in place of type B.</summary>
    /// <remarks>IEC 60364-7-722 (type A with an RDC-DD in place of type B at a charging point), std. Outside charging
    /// points the same reasoning is applied (engineering choice: the DC detection disconnects before the DC exceeds
    /// type A's 6 mA tolerance).</remarks>
    public static bool CoveredByDcDetection(this ResidualCurrentClass c) =>
        c is ResidualCurrentClass.SmoothDc or ResidualCurrentClass.ChargingPointDcFault;

    /// <summary>Name in words, for tables and JSON.</summary>
    public static string Describe(this ResidualCurrentClass c) => c switch
    {
        ResidualCurrentClass.MainsAc => "sinusoidal AC at mains frequency",
        ResidualCurrentClass.PulsatingDc => "pulsating DC",
        ResidualCurrentClass.Composite => "composite current (motor frequency, 1 kHz)",
        ResidualCurrentClass.NonMainsAc => "AC at other frequencies up to 1 kHz",
        ResidualCurrentClass.SmoothDc => "smooth DC or multi-phase rectified current",
        ResidualCurrentClass.HighFrequency => "content 1-20 kHz",
        ResidualCurrentClass.ChargingPointDcFault => "charging point DC fault current",
        ResidualCurrentClass.Clipping => "clipped samples",
        _ => throw new ArgumentOutOfRangeException(nameof(c), c, "unknown class"),
    };
}
