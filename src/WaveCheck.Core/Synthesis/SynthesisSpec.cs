using System.Globalization;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Synthesis;

/// <summary>
/// Reads the component descriptions a user types for the synthesizer, <c>kind[:key=value,key=value]</c>, e.g.
/// <c>halfwave:peak=30mA,angle=90</c>, <c>dc:level=8mA</c>, <c>composite:rms=20mA,motor=10Hz</c>.
/// </summary>
/// <remarks>
/// Kinds: <c>sine</c> (rms or peak, freq, phase), <c>halfwave</c> (peak, angle, polarity=pos|neg), <c>dc</c> (level),
/// <c>sixpulse</c> (mean), <c>rectified</c> (mean, pulses = 2, 3 or 6), <c>switching</c> (rms, freq, motor), <c>composite</c> (rms, motor, switch: the
/// single-phase converter's residual current as motor-frequency, mains and switching-frequency sines of equal RMS,
/// after the 10 Hz + 50 Hz + 1 kHz make-up of the IEC 62423 type F test current; the equal split is this tool's
/// choice, not the standard's coefficients), <c>noise</c> (rms, seed), <c>surge</c> (rms, freq, start, duration, decay: a sine switched on
/// at <c>start</c> for <c>duration</c>, its amplitude decaying with time constant <c>decay</c>; 0 or absent for none).
/// </remarks>
public static class SynthesisSpec
{
    /// <summary>Kinds understood, for help texts.</summary>
    public static IReadOnlyList<string> Kinds { get; } = ["sine", "halfwave", "dc", "sixpulse", "rectified", "switching", "composite", "noise", "surge"];

    /// <summary>Parses one component description.</summary>
    /// <param name="text">The description.</param>
    /// <param name="mainsHz">Mains frequency used where a component does not state one, hertz.</param>
    /// <returns>One or more components (a preset such as <c>composite</c> expands to several).</returns>
    /// <exception cref="OptionValueException">Unknown kind or key, or a value that cannot be parsed.</exception>
    public static IReadOnlyList<WaveformComponent> Parse(string text, double mainsHz)
    {
        ArgumentNullException.ThrowIfNull(text);
        var colon = text.IndexOf(':', StringComparison.Ordinal);
        var kind = (colon < 0 ? text : text[..colon]).Trim().ToLowerInvariant();
        var values = ParseValues(colon < 0 ? string.Empty : text[(colon + 1)..], kind);

        IReadOnlyList<WaveformComponent> result = kind switch
        {
            "sine" => [new SineComponent(RmsOrPeak(text, values, 0.030), Frequency(text, values, "freq", mainsHz),
                Number(text, values, "phase", 0))],
            "halfwave" => [new HalfWaveComponent(Current(text, values, "peak", 0.030), Frequency(text, values, "freq", mainsHz),
                Number(text, values, "angle", 0), Polarity(text, values))],
            "dc" => [new SmoothDcComponent(Current(text, values, "level", 0.006))],
            "sixpulse" => [new SixPulseComponent(Current(text, values, "mean", 0.030), Frequency(text, values, "freq", mainsHz))],
            "rectified" => [new RectifiedComponent(Current(text, values, "mean", 0.030), Frequency(text, values, "freq", mainsHz),
                Pulses(text, values))],
            "switching" => [new SwitchingComponent(Current(text, values, "rms", 0.005), Frequency(text, values, "freq", 16_000),
                Frequency(text, values, "motor", 0))],
            "composite" => Composite(text, values, mainsHz),
            "noise" => [new NoiseComponent(Current(text, values, "rms", 0.0001), (int)Number(text, values, "seed", 1))],
            "surge" => [new SurgeComponent(Current(text, values, "rms", 0.030), Frequency(text, values, "freq", mainsHz),
                Seconds(text, values, "start", 0), Seconds(text, values, "duration", 0.1), Seconds(text, values, "decay", 0))],
            _ => throw new OptionValueException(SynthesisSettings.PartsRef, text, $"a kind among {string.Join(", ", Kinds)}"),
        };

        foreach (var key in values.Keys)
        {
            if (!Used.Contains((kind, key)))
            {
                throw new OptionValueException(SynthesisSettings.PartsRef, text, $"keys of '{kind}': {string.Join(", ", Used.Where(u => u.Kind == kind).Select(u => u.Key))}");
            }
        }

        return result;
    }

    private static readonly HashSet<(string Kind, string Key)> Used =
    [
        ("sine", "rms"), ("sine", "peak"), ("sine", "freq"), ("sine", "phase"),
        ("halfwave", "peak"), ("halfwave", "freq"), ("halfwave", "angle"), ("halfwave", "polarity"),
        ("dc", "level"), ("sixpulse", "mean"), ("sixpulse", "freq"),
        ("rectified", "mean"), ("rectified", "freq"), ("rectified", "pulses"),
        ("switching", "rms"), ("switching", "freq"), ("switching", "motor"),
        ("composite", "rms"), ("composite", "motor"), ("composite", "switch"),
        ("noise", "rms"), ("noise", "seed"),
        ("surge", "rms"), ("surge", "freq"), ("surge", "start"), ("surge", "duration"), ("surge", "decay"),
    ];

    private static IReadOnlyList<WaveformComponent> Composite(string text, Dictionary<string, string> values, double mainsHz)
    {
        var each = Current(text, values, "rms", 0.020) / Math.Sqrt(3);
        return
        [
            new SineComponent(each, Frequency(text, values, "motor", 10)),
            new SineComponent(each, mainsHz),
            new SineComponent(each, Frequency(text, values, "switch", 1000)),
        ];
    }

    private static int Pulses(string text, Dictionary<string, string> values)
    {
        var pulses = Number(text, values, "pulses", 6);
        return pulses is 2 or 3 or 6 ? (int)pulses : throw new OptionValueException(SynthesisSettings.PartsRef, text, "pulses=2, 3 or 6");
    }

    private static Dictionary<string, string> ParseValues(string list, string kind)
    {
        var values = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        foreach (var part in list.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            var eq = part.IndexOf('=', StringComparison.Ordinal);
            if (eq < 0)
            {
                // A lone value is the kind's main parameter: dc:8mA, sine:30mA.
                values[MainKey(kind)] = part;
                continue;
            }

            values[part[..eq].Trim().ToLowerInvariant()] = part[(eq + 1)..].Trim();
        }

        return values;
    }

    private static string MainKey(string kind) => kind switch
    {
        "sine" => "rms",
        "halfwave" => "peak",
        "dc" => "level",
        "sixpulse" => "mean",
        _ => "rms",
    };

    private static double RmsOrPeak(string text, Dictionary<string, string> values, double defaultRmsA) =>
        values.ContainsKey("peak") ? Current(text, values, "peak", 0) / Math.Sqrt(2) : Current(text, values, "rms", defaultRmsA);

    private static double Current(string text, Dictionary<string, string> values, string key, double fallback) =>
        values.TryGetValue(key, out var v) ? Quantity.ParseCurrentA($"{SynthesisSettings.PartsRef} {text}: {key}", v) : fallback;

    private static double Frequency(string text, Dictionary<string, string> values, string key, double fallback) =>
        values.TryGetValue(key, out var v) ? Quantity.ParseFrequencyHz($"{SynthesisSettings.PartsRef} {text}: {key}", v) : fallback;

    private static double Seconds(string text, Dictionary<string, string> values, string key, double fallback)
    {
        if (!values.TryGetValue(key, out var v))
        {
            return fallback;
        }

        var trimmed = v.Trim();
        var (number, scale) = trimmed.EndsWith("ms", StringComparison.OrdinalIgnoreCase) ? (trimmed[..^2], 1e-3)
            : trimmed.EndsWith('s') || trimmed.EndsWith('S') ? (trimmed[..^1], 1.0)
            : (trimmed, 1.0);
        return double.TryParse(number, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) && value >= 0 && double.IsFinite(value)
            ? value * scale
            : throw new OptionValueException($"{SynthesisSettings.PartsRef} {text}: {key}", v, "a time of 0 or more, such as 2s or 120ms");
    }

    private static double Number(string text, Dictionary<string, string> values, string key, double fallback)
    {
        if (!values.TryGetValue(key, out var v))
        {
            return fallback;
        }

        return double.TryParse(v.TrimEnd('°'), NumberStyles.Float, CultureInfo.InvariantCulture, out var number)
            ? number
            : throw new OptionValueException($"{SynthesisSettings.PartsRef} {text}: {key}", v, "a number");
    }

    private static bool Polarity(string text, Dictionary<string, string> values)
    {
        if (!values.TryGetValue("polarity", out var v))
        {
            return false;
        }

        return v.ToLowerInvariant() switch
        {
            "pos" or "positive" or "+" => false,
            "neg" or "negative" or "-" => true,
            _ => throw new OptionValueException($"{SynthesisSettings.PartsRef} {text}: polarity", v, "pos or neg"),
        };
    }
}
