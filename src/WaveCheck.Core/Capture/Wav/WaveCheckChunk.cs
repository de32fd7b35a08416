using System.Globalization;
using System.Text;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Our own RIFF chunk (<c>wvck</c>) in WAV files written by <see cref="CaptureWriter"/>: UTF-8
/// <c>fullScaleA=0.1;sensor=dc</c>, so that our own files calibrate themselves.
/// </summary>
/// <remarks>Every field is checked: a calibration that cannot be read is refused with the file and the chunk, never
/// passed over (a verdict on a mis-scaled capture would be wrong). Keys other than these two are ignored, so a later
/// version may add some.</remarks>
internal static class WaveCheckChunk
{
    /// <summary>The chunk identifier.</summary>
    public const string Id = "wvck";

    /// <summary>Builds the chunk payload.</summary>
    public static byte[] Format(double fullScaleA, SensorCoupling sensor) =>
        Encoding.UTF8.GetBytes(string.Create(CultureInfo.InvariantCulture,
            $"fullScaleA={fullScaleA:R};sensor={sensor.ToString().ToLowerInvariant()}"));

    /// <summary>Reads a payload.</summary>
    /// <param name="path">The WAV file, for messages.</param>
    /// <param name="chunkOffset">Byte offset of the chunk's header in the file, for messages.</param>
    /// <param name="payload">The chunk's bytes.</param>
    /// <returns>The full scale in amperes, and the sensor coupling where stated.</returns>
    /// <exception cref="CaptureFormatException">Not UTF-8, a field that is not <c>key=value</c>, a key twice, a full
    /// scale that is not a number within <see cref="CaptureLimits"/>, an unknown sensor word, or no full scale.</exception>
    public static (double FullScaleA, SensorCoupling? Sensor) Parse(string path, long chunkOffset, ReadOnlySpan<byte> payload)
    {
        string text;
        try
        {
            text = new UTF8Encoding(false, throwOnInvalidBytes: true).GetString(payload);
        }
        catch (DecoderFallbackException e)
        {
            throw Error(path, chunkOffset, $"is not UTF-8 text (invalid byte at chunk offset {e.Index})");
        }

        double? fullScale = null;
        SensorCoupling? sensor = null;
        foreach (var pair in text.TrimEnd('\0').Split(';', StringSplitOptions.TrimEntries))
        {
            if (pair.Length == 0)
            {
                continue;
            }

            var eq = pair.IndexOf('=', StringComparison.Ordinal);
            if (eq <= 0)
            {
                throw Error(path, chunkOffset, $"field '{ShownText.Of(pair)}' is not key=value");
            }

            var key = pair[..eq].Trim();
            var value = pair[(eq + 1)..].Trim();
            switch (key)
            {
                case "fullScaleA":
                    if (fullScale is not null)
                    {
                        throw Error(path, chunkOffset, "states fullScaleA twice");
                    }

                    if (!double.TryParse(value, NumberStyles.Float, CultureInfo.InvariantCulture, out var fs))
                    {
                        throw Error(path, chunkOffset, $"fullScaleA '{ShownText.Of(value)}' is not a number");
                    }

                    if (!(fs > 0) || CaptureLimits.ScaleProblem("fullScaleA", fs, "A") is not null)
                    {
                        throw Error(path, chunkOffset, string.Create(CultureInfo.InvariantCulture,
                            $"fullScaleA {ShownText.Of(value)} A is outside {CaptureLimits.MinScaleFactor:G3} A to {CaptureLimits.MaxScaleFactor:G3} A"));
                    }

                    fullScale = fs;
                    break;
                case "sensor":
                    if (sensor is not null)
                    {
                        throw Error(path, chunkOffset, "states sensor twice");
                    }

                    // Names only: Enum.TryParse would also take any number ("99", "-1") as a coupling.
                    sensor = value.ToLowerInvariant() switch
                    {
                        "dc" => SensorCoupling.Dc,
                        "ac" => SensorCoupling.Ac,
                        "unknown" => SensorCoupling.Unknown,
                        _ => throw Error(path, chunkOffset, $"sensor '{ShownText.Of(value)}' is not dc, ac or unknown"),
                    };
                    break;
            }
        }

        return fullScale is { } scale
            ? (scale, sensor)
            : throw Error(path, chunkOffset, "states no fullScaleA: the file cannot calibrate itself");
    }

    private static CaptureFormatException Error(string path, long chunkOffset, string problem) =>
        new(path, $"calibration chunk 'wvck' {problem}", byteOffset: chunkOffset);
}
