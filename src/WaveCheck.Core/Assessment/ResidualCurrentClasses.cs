using WaveCheck.Core.Model;
namespace WaveCheck.Core.Assessment;

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
