namespace WaveCheck.Core.Capture;

/// <summary>
/// How stored values become amperes for the residual-current channel: <c>amperes = stored × ScaleA + OffsetA</c>.
/// </summary>
/// <param name="ScaleA">Amperes per stored unit (for WAV: amperes at full scale 1.0).</param>
/// <param name="OffsetA">Amperes added after scaling (a sensor's zero offset, COMTRADE's b).</param>
/// <param name="Source">How the scale was obtained, for the user to check
/// (e.g. <c>--scale 0.1 A</c>, <c>range 1 V / sensitivity 10 mV/mA</c>, <c>column unit mA</c>, <c>file metadata</c>).</param>
public sealed record Calibration(double ScaleA, double OffsetA, string Source)
{
    /// <summary>Identity calibration for values already in amperes.</summary>
    public static Calibration Amperes(string source) => new(1.0, 0.0, source);
}
