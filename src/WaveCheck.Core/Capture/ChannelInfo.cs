namespace WaveCheck.Core.Capture;

/// <summary>What a channel measures.</summary>
public enum ChannelQuantity
{
    /// <summary>A current: values delivered in amperes.</summary>
    Current,

    /// <summary>A voltage: values delivered in volts (becomes a current only through a sensitivity).</summary>
    Voltage,

    /// <summary>A fraction of full scale with no calibration yet (WAV without a scale).</summary>
    Unscaled,
}

/// <summary>One recorded channel as read from the file.</summary>
/// <param name="Index">0-based position in the file (WAV channel, CSV column among data columns, COMTRADE channel).</param>
/// <param name="Name">The name the file gives it (CSV header text without the unit, <c>ch1</c> for WAV).</param>
/// <param name="SourceUnit">The unit as written in the file (<c>mA</c>, <c>A</c>, <c>mV</c>, <c>FS</c> for full scale).</param>
/// <param name="Quantity">What the delivered values are, after calibration.</param>
/// <param name="ScaleToSi">Factor from the stored value to the SI value delivered (A or V).</param>
/// <param name="FullScaleSi">The value (A or V) at which the recorder clips, where the format knows it; null otherwise.</param>
public sealed record ChannelInfo(int Index, string Name, string SourceUnit, ChannelQuantity Quantity, double ScaleToSi,
    double? FullScaleSi);
