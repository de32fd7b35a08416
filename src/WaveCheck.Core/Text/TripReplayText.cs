using WaveCheck.Core.Model;

namespace WaveCheck.Core.Text;

/// <summary>How the trip replay's devices and findings are written for a person.</summary>
public static class TripReplayText
{
    /// <summary>A finding in words: <c>will not trip</c>, <c>may trip</c>, <c>will trip</c>.</summary>
    /// <param name="finding">The finding.</param>
    public static string Finding(TripFinding finding) => finding switch
    {
        TripFinding.WillNotTrip => "will not trip",
        TripFinding.MayTrip => "may trip",
        _ => "will trip",
    };

    /// <summary>The device in words: <c>general type 30 mA</c>, <c>type S 100 mA</c>.</summary>
    /// <param name="device">The device replayed.</param>
    public static string Device(ReplayedDevice device)
    {
        ArgumentNullException.ThrowIfNull(device);
        return (device.Timing == DeviceTiming.S ? "type S " : "general type ") + CurrentText.WithUnit(device.RatedResidualCurrentA);
    }
}
