namespace WaveCheck.Core.Model;

/// <summary>A stretch of the frequency axis and the device types specified over it, for shading behind the spectrum.</summary>
/// <param name="Label">Which types, e.g. <c>F, B, B+: to 1 kHz</c>.</param>
/// <param name="LowHz">Lower edge, hertz (0: from DC).</param>
/// <param name="HighHz">Upper edge, hertz (infinity: to the end of the axis).</param>
/// <param name="Covered">False for the stretch no type is specified for.</param>
public sealed record DeviceFrequencyRange(string Label, double LowHz, double HighHz, bool Covered);

/// <summary>The frequency ranges the device types are specified for, cut into adjacent stretches for drawing: part of
/// the model so that the plots read the device types' coverage without reading the assessment.</summary>
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

    /// <summary>Upper edge of types F and B, hertz: 1000 Hz.</summary>
    /// <remarks>IEC 62423 (type B: sinusoidal AC up to 1 kHz; type F's composite test current includes a 1 kHz
    /// component), std. The assessment's <c>Limits.TypeBUpperFrequencyHz</c> is this value.</remarks>
    public const double TypeFbUpperHz = 1000;

    /// <summary>Upper edge of type B+, hertz: 20 000 Hz.</summary>
    /// <remarks>DIN VDE 0664-400 (B+ tripping defined up to 20 kHz), std. The assessment's
    /// <c>Limits.BPlusUpperFrequencyHz</c> is this value.</remarks>
    public const double TypeBPlusUpperHz = 20_000;

    /// <summary>The stretches in ascending frequency; the mains band lies on top of the first.</summary>
    /// <param name="mainsHz">Mains frequency, hertz.</param>
    public static IReadOnlyList<DeviceFrequencyRange> For(double mainsHz) =>
    [
        new("F, B, B+: to 1 kHz", 0, TypeFbUpperHz, true),
        new("B+ only: 1–20 kHz", TypeFbUpperHz, TypeBPlusUpperHz, true),
        new("no type: above 20 kHz", TypeBPlusUpperHz, double.PositiveInfinity, false),
        new("AC, A: mains only", mainsHz * (1 - MainsBandShare), mainsHz * (1 + MainsBandShare), true),
    ];
}
