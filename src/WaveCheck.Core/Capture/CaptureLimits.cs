using System.Globalization;
using System.Numerics;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Capture;

/// <summary>
/// The bounds every reader holds a file (and the options describing it) to, checked before any allocation or loop
/// depends on a value read. docs/formats.md lists them for users. A value outside is refused with the field and the
/// place, as a <see cref="CaptureFormatException"/> or an <see cref="OptionValueException"/>.
/// </summary>
public static class CaptureLimits
{
    /// <summary>Lowest sample rate accepted from any source, hertz.</summary>
    /// <remarks>Engineering choice: a slow logger's 1 S/s trend export can still be shown by <c>info</c>; the analysis
    /// asks for more (<see cref="Signal.CaptureAnalysis.MinimumSampleRateHz(double?)"/>).</remarks>
    public const double MinSampleRateHz = 1;

    /// <summary>Highest sample rate accepted from any source, hertz (10 MS/s).</summary>
    /// <remarks>Engineering choice: 66 times the top of the highest band analysed (150 kHz, IEC 61000-4-30 Annex C)
    /// and above any residual-current logger's input bandwidth. The analysis holds 16 windows of 200 ms, about
    /// 50 MB per MS/s (measured: 0.5 GB at 10 MS/s); a faster recording is decimated before it is analysed.</remarks>
    public const double MaxSampleRateHz = 10_000_000;

    /// <summary>Most channels (WAV channels, CSV current and voltage columns, COMTRADE analog channels).</summary>
    /// <remarks>Engineering choice: 256 is several times what a multi-channel recorder has; each channel costs a
    /// block buffer of 0.5 MB.</remarks>
    public const int MaxChannels = 256;

    /// <summary>Most columns of a CSV header (including time, index and status columns).</summary>
    public const int MaxCsvColumns = 1024;

    /// <summary>Most digital (status) channels of a COMTRADE record; they are read past, two bytes per 16.</summary>
    public const int MaxDigitalChannels = 4096;

    /// <summary>Most samples per channel a capture may declare (2^40, 30 hours at 10 MS/s, 254 days at 50 kS/s).</summary>
    public const long MaxSampleCount = 1L << 40;

    /// <summary>Longest line (and so longest field) of a text file read, characters (CSV) or bytes (COMTRADE): 1 MiB.</summary>
    /// <remarks>Engineering choice: a data line holds a few hundred characters; a longer one is a file that is not
    /// a capture, and refusing it keeps the memory used by a reader bounded whatever the file holds.</remarks>
    public const int MaxLineLength = 1 << 20;

    /// <summary>Largest COMTRADE configuration (a .cfg, or the CFG section of a .cff), bytes: 16 MiB.</summary>
    public const int MaxConfigBytes = 16 << 20;

    /// <summary>Smallest magnitude of a factor from stored numbers to SI units (WAV full scale, COMTRADE multiplier,
    /// a sensitivity, an input range).</summary>
    public const double MinScaleFactor = 1e-12;

    /// <summary>Largest magnitude of a factor from stored numbers to SI units.</summary>
    public const double MaxScaleFactor = 1e9;

    /// <summary>Largest magnitude of a calibrated sample, SI units (A or V). Beyond it a value is no measurement, and
    /// its square summed over a long capture would no longer be a finite double.</summary>
    public const double MaxSampleMagnitude = 1e12;

    /// <summary>The problem with a sample rate, or null when it lies within the bounds.</summary>
    /// <param name="rateHz">The rate, hertz.</param>
    public static string? RateProblem(double rateHz) =>
        rateHz is >= MinSampleRateHz and <= MaxSampleRateHz
            ? null
            : $"sample rate {Hz(rateHz)} is outside {RateRange}";

    /// <summary>The accepted sample rates, for messages: <c>1 Hz to 10 MHz</c>.</summary>
    public static string RateRange => $"{Hz(MinSampleRateHz)} to {Hz(MaxSampleRateHz)}";

    /// <summary>A frequency for a message, with a prefix: <c>50 Hz</c>, <c>20 kHz</c>, <c>1E+15 Hz</c>.</summary>
    public static string Hz(double hz) => Math.Abs(hz) switch
    {
        >= 1e3 and < 1e6 => Text(hz / 1e3) + " kHz",
        >= 1e6 and < 1e9 => Text(hz / 1e6) + " MHz",
        _ => Text(hz) + " Hz",
    };

    /// <summary>The problem with a scale factor (its magnitude), or null when it is finite, non-zero and within the bounds.</summary>
    /// <param name="what">What the factor is, for the message, e.g. <c>full scale</c>.</param>
    /// <param name="value">The factor.</param>
    /// <param name="unit">Its unit for the message, e.g. <c>A</c>; may be empty.</param>
    public static string? ScaleProblem(string what, double value, string unit)
    {
        var magnitude = Math.Abs(value);
        if (magnitude is >= MinScaleFactor and <= MaxScaleFactor)
        {
            return null;
        }

        var u = unit.Length > 0 ? " " + unit : string.Empty;
        return value == 0
            ? $"{what} is 0{u}: it would make every value the same"
            : $"{what} {Text(value)}{u} is outside ±{Text(MinScaleFactor)} to ±{Text(MaxScaleFactor)}{u}";
    }

    /// <summary>What an import setting must be when its value is out of bounds, or null when it is fine.</summary>
    /// <param name="key">The setting without dashes: <c>scale</c> (A), <c>sensitivity</c> (V/A), <c>range</c> (V)
    /// or <c>rate</c> (Hz).</param>
    /// <param name="value">The value in SI units.</param>
    /// <returns>The form expected, e.g. <c>a current from 1E-12 A to 1E+09 A</c>.</returns>
    public static string? SettingProblem(string key, double value)
    {
        var (unit, noun) = key switch
        {
            "scale" => ("A", "a full-scale current"),
            "sensitivity" => ("V/A", "a sensitivity"),
            "range" => ("V", "an input range"),
            "rate" => ("Hz", "a sample rate"),
            _ => throw new ArgumentOutOfRangeException(nameof(key), key, "scale, sensitivity, range or rate"),
        };
        if (key == "rate")
        {
            return RateProblem(value) is null ? null : $"{noun} from {RateRange}";
        }

        return value > 0 && ScaleProblem(key, value, unit) is null
            ? null
            : $"{noun} from {Text(MinScaleFactor)} {unit} to {Text(MaxScaleFactor)} {unit}";
    }

    /// <summary>Index of the first value that is not finite or whose magnitude exceeds <see cref="MaxSampleMagnitude"/>;
    /// -1 when all are good. Vectorised: one compare per vector, so it costs little beside the decoding.</summary>
    /// <param name="values">Calibrated samples.</param>
    public static int IndexOfInvalid(ReadOnlySpan<double> values)
    {
        var i = 0;
        if (Vector.IsHardwareAccelerated && values.Length >= Vector<double>.Count)
        {
            var limit = new Vector<double>(MaxSampleMagnitude);
            var vectors = MemoryMarshal.Cast<double, Vector<double>>(values);
            for (var v = 0; v < vectors.Length; v++)
            {
                // NaN compares false, so a NaN lane fails the test like an infinity or a huge value.
                if (!Vector.LessThanOrEqualAll(Vector.Abs(vectors[v]), limit))
                {
                    i = v * Vector<double>.Count;
                    break;
                }

                i = (v + 1) * Vector<double>.Count;
            }
        }

        for (; i < values.Length; i++)
        {
            if (!(Math.Abs(values[i]) <= MaxSampleMagnitude))
            {
                return i;
            }
        }

        return -1;
    }

    /// <summary>What is wrong with one sample found by <see cref="IndexOfInvalid"/>, with its time.</summary>
    /// <param name="channel">Channel name.</param>
    /// <param name="value">The calibrated value.</param>
    /// <param name="timeS">Seconds from the start of the capture.</param>
    /// <param name="unit">SI unit of the channel (A or V).</param>
    public static string SampleProblem(string channel, double value, double timeS, string unit) =>
        double.IsFinite(value)
            ? string.Create(CultureInfo.InvariantCulture,
                $"channel '{channel}' at t = {timeS:0.######} s: {value:G6} {unit} after calibration is beyond ±{MaxSampleMagnitude:G3} {unit}, not a measured value")
            : string.Create(CultureInfo.InvariantCulture,
                $"channel '{channel}' at t = {timeS:0.######} s: the sample is {(double.IsNaN(value) ? "NaN (not a number)" : value > 0 ? "+infinity (after calibration)" : "-infinity (after calibration)")}; a capture must hold finite numbers");

    private static string Text(double value) => value.ToString("G6", CultureInfo.InvariantCulture);
}
