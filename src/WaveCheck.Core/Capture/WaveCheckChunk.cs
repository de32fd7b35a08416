using System.Globalization;
using System.Text;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Our own RIFF chunk (<c>wvck</c>) in WAV files written by <see cref="CaptureWriter"/>: UTF-8
/// <c>fullScaleA=0.1;sensor=dc</c>, so that our own files calibrate themselves.
/// </summary>
internal static class WaveCheckChunk
{
    /// <summary>The chunk identifier.</summary>
    public const string Id = "wvck";

    /// <summary>Builds the chunk payload.</summary>
    public static byte[] Format(double fullScaleA, SensorCoupling sensor) =>
        Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
            $"fullScaleA={fullScaleA:R};sensor={sensor.ToString().ToLowerInvariant()}"));

    /// <summary>Reads a payload; null fields when absent or unreadable.</summary>
    public static (double? FullScaleA, SensorCoupling? Sensor) Parse(ReadOnlySpan<byte> payload)
    {
        double? fullScale = null;
        SensorCoupling? sensor = null;
        foreach (var pair in Encoding.UTF8.GetString(payload).TrimEnd('\0').Split(';', StringSplitOptions.TrimEntries))
        {
            var eq = pair.IndexOf('=', StringComparison.Ordinal);
            if (eq <= 0)
            {
                continue;
            }

            var key = pair[..eq];
            var value = pair[(eq + 1)..];
            if (key == "fullScaleA" && double.TryParse(value, NumberStyles.Float, CultureInfo.InvariantCulture, out var fs)
                && fs > 0 && double.IsFinite(fs))
            {
                fullScale = fs;
            }
            else if (key == "sensor" && Enum.TryParse<SensorCoupling>(value, ignoreCase: true, out var s))
            {
                sensor = s;
            }
        }

        return (fullScale, sensor);
    }
}
