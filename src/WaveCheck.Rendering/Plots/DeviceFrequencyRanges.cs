namespace WaveCheck.Rendering.Plots;

/// <summary>A frequency range over which device types are specified, for shading behind the spectrum.</summary>
/// <param name="Label">Which types, e.g. <c>AC, A: mains</c>.</param>
/// <param name="LowHz">Lower edge, hertz (0: from DC).</param>
/// <param name="HighHz">Upper edge, hertz.</param>
public sealed record DeviceFrequencyRange(string Label, double LowHz, double HighHz);

/// <summary>The frequency ranges each device type is specified for, as drawn on the spectrum.</summary>
/// <remarks>
/// AC and A: rated (mains) frequency, IEC 61008-1 / IEC 61009-1 (A adds pulsating DC, which is not a frequency range);
/// F: composite current with components up to 1 kHz, IEC 62423; B: smooth DC and AC up to 1 kHz, IEC 62423 §5.3;
/// B+: tripping defined up to 20 kHz, DIN VDE 0664-400. The mains band is drawn ±10 % wide (engineering choice: a
/// single frequency would be invisible on a log axis).
/// </remarks>
public static class DeviceFrequencyRanges
{
    /// <summary>Half-width of the drawn mains band as a share of the mains frequency.</summary>
    public const double MainsBandShare = 0.10;

    /// <summary>Upper edge of types F and B, hertz (IEC 62423).</summary>
    public const double TypeFbUpperHz = 1_000;

    /// <summary>Upper edge of type B+, hertz (DIN VDE 0664-400).</summary>
    public const double TypeBPlusUpperHz = 20_000;

    /// <summary>The nested ranges, widest last.</summary>
    /// <param name="mainsHz">Mains frequency, hertz.</param>
    public static IReadOnlyList<DeviceFrequencyRange> For(double mainsHz) =>
    [
        new("AC, A: mains", mainsHz * (1 - MainsBandShare), mainsHz * (1 + MainsBandShare)),
        new("F, B: to 1 kHz", 0, TypeFbUpperHz),
        new("B+: to 20 kHz", 0, TypeBPlusUpperHz),
    ];
}
