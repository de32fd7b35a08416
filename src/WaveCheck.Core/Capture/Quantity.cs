using System.Globalization;
using System.Text.RegularExpressions;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Parses quantities a person types (<c>30mA</c>, <c>0.3 A</c>, <c>10 mV/mA</c>, <c>1 V</c>, <c>50 kHz</c>) into SI values.
/// Accepts a decimal point (not a comma, to keep lists unambiguous), optional space before the unit, µ or u for micro.
/// </summary>
/// <remarks>
/// One rule for the command line, the site file and synthesizer parts: a current, voltage, frequency or sensitivity
/// carries its unit. A bare number is refused with the reading it most likely meant (<c>30</c>: "did you mean
/// 30mA?"), because the same number has meant milliamperes in one place and amperes in another, and a reading a
/// thousand times off is not always caught by a range check (0.03 taken as mA for an IΔn of 30 mA gives a device
/// a thousand times more sensitive and a verdict that still reads "adequate").
/// </remarks>
public static partial class Quantity
{
    [GeneratedRegex(@"^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*([^\s\d].*?)?\s*$")]
    private static partial Regex NumberAndUnit();

    private static readonly Dictionary<string, double> Prefix = new(StringComparer.Ordinal)
    {
        [""] = 1,
        ["k"] = 1e3,
        ["M"] = 1e6,
        ["m"] = 1e-3,
        ["u"] = 1e-6,
        ["µ"] = 1e-6,
        ["μ"] = 1e-6,
        ["n"] = 1e-9,
    };

    /// <summary>What a current is expected to look like, for messages.</summary>
    public const string CurrentForm = "a current with its unit, such as 30mA, 0.3A or 300uA";

    /// <summary>What a voltage is expected to look like, for messages.</summary>
    public const string VoltageForm = "a voltage with its unit, such as 1V or 500mV";

    /// <summary>What a frequency is expected to look like, for messages.</summary>
    public const string FrequencyForm = "a frequency with its unit, such as 50Hz or 20kHz";

    /// <summary>What a sensitivity is expected to look like, for messages.</summary>
    public const string SensitivityForm = "a sensitivity with its units, such as 10 mV/mA, 100mV/A or 1 V/A";

    /// <summary>Parses a current; the unit is required (a bare number is refused with a suggestion).</summary>
    /// <param name="option">Option name for the message.</param>
    /// <param name="text">E.g. <c>30mA</c>, <c>0.03A</c>, <c>0.03 A</c>, <c>300 uA</c>.</param>
    /// <returns>Amperes.</returns>
    /// <exception cref="OptionValueException">Not a current, or a number without a unit.</exception>
    public static double ParseCurrentA(string option, string text) => Parse(option, text, "A", CurrentForm);

    /// <summary>As <see cref="ParseCurrentA"/>, and the current must be above zero (a full scale, an IΔn).</summary>
    /// <param name="option">Option name for the message.</param>
    /// <param name="text">E.g. <c>30mA</c>.</param>
    /// <returns>Amperes.</returns>
    /// <exception cref="OptionValueException">Not a current, or not above zero.</exception>
    public static double ParsePositiveCurrentA(string option, string text)
    {
        var amperes = ParseCurrentA(option, text);
        return amperes > 0 ? amperes : throw new OptionValueException(option, text, "a positive current");
    }

    /// <summary>Parses a voltage (<c>1 V</c>, <c>500mV</c>); the unit is required.</summary>
    /// <returns>Volts.</returns>
    /// <exception cref="OptionValueException">Not a voltage, or a number without a unit.</exception>
    public static double ParseVoltageV(string option, string text) => Parse(option, text, "V", VoltageForm);

    /// <summary>Parses the scale of a voltage channel: volts at WAV full scale (<c>500V</c>) or the ratio of a probe or
    /// divider for a channel already in volts (<c>100</c>). Both multiply the stored value into circuit volts, so a
    /// bare number is a ratio (dimensionless, outside the rule that a voltage carries its unit) and a number with a
    /// unit must be a voltage.</summary>
    /// <returns>The factor: volts per stored unit.</returns>
    /// <exception cref="OptionValueException">Neither a plain number nor a voltage.</exception>
    public static double ParseVoltageScale(string option, string text)
    {
        var trimmed = (text ?? string.Empty).Trim();
        return double.TryParse(trimmed, NumberStyles.Float, CultureInfo.InvariantCulture, out var ratio) && double.IsFinite(ratio)
            ? ratio
            : Parse(option, trimmed, "V", "volts at WAV full scale (e.g. 500V) or a probe ratio (e.g. 100)");
    }

    /// <summary>Parses a frequency (<c>50Hz</c>, <c>20 kHz</c>); the unit is required.</summary>
    /// <returns>Hertz.</returns>
    /// <exception cref="OptionValueException">Not a frequency, or a number without a unit.</exception>
    public static double ParseFrequencyHz(string option, string text) => Parse(option, text, "Hz", FrequencyForm);

    /// <summary>Writes a current the way it is typed, so a default shown in help can be copied back:
    /// <c>0.03</c> → <c>30mA</c>, <c>1</c> → <c>1A</c>, <c>0.0001</c> → <c>0.1mA</c>.</summary>
    /// <param name="amperes">The current, amperes.</param>
    public static string CurrentAsTyped(double amperes) => Math.Abs(amperes) >= 1
        ? amperes.ToString("G6", CultureInfo.InvariantCulture) + "A"
        : (amperes * 1e3).ToString("G6", CultureInfo.InvariantCulture) + "mA";

    /// <summary>Writes a frequency the way it is typed: <c>50</c> → <c>50Hz</c>, <c>50000</c> → <c>50kHz</c>.</summary>
    /// <param name="hertz">The frequency, hertz.</param>
    public static string FrequencyAsTyped(double hertz) => Math.Abs(hertz) >= 1000
        ? (hertz / 1e3).ToString("G6", CultureInfo.InvariantCulture) + "kHz"
        : hertz.ToString("G6", CultureInfo.InvariantCulture) + "Hz";

    /// <summary>The reading a bare number most likely meant, written with its unit: <c>30</c> → <c>30mA</c>,
    /// <c>0.03</c> → <c>0.03A</c> for a current (a residual current of a whole ampere or more is rare, a fraction of
    /// an ampere common); <c>50</c> → <c>50Hz</c>; <c>1</c> → <c>1V</c>; <c>10</c> → <c>10 mV/mA</c>.</summary>
    /// <param name="number">The number as typed.</param>
    /// <param name="unit">The SI unit expected: <c>A</c>, <c>V</c>, <c>Hz</c> or <c>V/A</c>.</param>
    /// <returns>Null when <paramref name="number"/> is not a bare number.</returns>
    public static string? Suggestion(string number, string unit)
    {
        var text = (number ?? string.Empty).Trim();
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) || !double.IsFinite(value))
        {
            return null;
        }

        return unit switch
        {
            "A" => Math.Abs(value) >= 1 ? text + "mA" : text + "A",
            "V/A" => text + " mV/mA",
            _ => text + unit,
        };
    }

    /// <summary>The form expected, with the suggestion for a bare number: <c>a current with its unit ...; did you
    /// mean 30mA?</c>.</summary>
    /// <param name="number">The text that was typed.</param>
    /// <param name="unit">The SI unit expected.</param>
    /// <param name="expected">The form expected.</param>
    /// <returns>The form alone when the text is not a bare number.</returns>
    public static string ExpectedWithSuggestion(string number, string unit, string expected) =>
        Suggestion(number, unit) is { } suggestion ? $"{expected}; did you mean {suggestion}?" : expected;

    /// <summary>Parses a duration (<c>2s</c>, <c>500ms</c>, <c>10min</c>, <c>1h</c>); a bare number is seconds.</summary>
    /// <returns>Seconds.</returns>
    public static double ParseDurationS(string option, string text)
    {
        const string expected = "a duration such as 2s, 500ms, 10min or 1h";
        var trimmed = (text ?? string.Empty).Trim();
        foreach (var (suffix, factor) in new[] { ("min", 60.0), ("h", 3600.0) })
        {
            if (trimmed.EndsWith(suffix, StringComparison.OrdinalIgnoreCase) &&
                double.TryParse(trimmed[..^suffix.Length], NumberStyles.Float, CultureInfo.InvariantCulture, out var n) &&
                double.IsFinite(n))
            {
                return n * factor;
            }
        }

        // A bare number of seconds stays accepted: a duration is not one of the quantities whose unit has been
        // read two ways, and "2" for two seconds is how a person writes it.
        return double.TryParse(trimmed, NumberStyles.Float, CultureInfo.InvariantCulture, out var seconds) && double.IsFinite(seconds)
            ? seconds
            : Parse(option, trimmed, "s", expected);
    }

    /// <summary>Parses a clamp sensitivity (<c>10 mV/mA</c>, <c>0.1 V/A</c>, <c>100mV/A</c>); a bare number is V/A.</summary>
    /// <returns>Volts per ampere.</returns>
    public static double ParseSensitivityVPerA(string option, string text)
    {
        const string expected = SensitivityForm;
        var slash = (text ?? string.Empty).IndexOf('/', StringComparison.Ordinal);
        if (slash < 0)
        {
            throw new OptionValueException(option, text ?? string.Empty, ExpectedWithSuggestion(text ?? string.Empty, "V/A", expected));
        }

        var numerator = Parse(option, text![..slash], "V", expected, wholeText: text);
        var denominatorText = text[(slash + 1)..].Trim();
        var denominator = denominatorText.Length > 0 && char.IsDigit(denominatorText[0])
            ? Parse(option, denominatorText, "A", expected, wholeText: text)
            : Parse(option, "1" + denominatorText, "A", expected, wholeText: text);
        if (denominator <= 0)
        {
            throw new OptionValueException(option, text, expected);
        }

        return numerator / denominator;
    }

    private static double Parse(string option, string text, string unit, string expected, string? wholeText = null)
    {
        var match = NumberAndUnit().Match(text ?? string.Empty);
        if (!match.Success)
        {
            throw new OptionValueException(option, wholeText ?? text ?? string.Empty, expected);
        }

        var value = double.Parse(match.Groups[1].Value, NumberStyles.Float, CultureInfo.InvariantCulture);
        var suffix = match.Groups[2].Success ? match.Groups[2].Value.Trim() : string.Empty;
        if (suffix.Length == 0)
        {
            var shown = wholeText ?? text!;
            throw new OptionValueException(option, shown,
                wholeText is null ? ExpectedWithSuggestion(text!, unit, expected) : expected);
        }

        if (!suffix.EndsWith(unit, StringComparison.OrdinalIgnoreCase))
        {
            throw new OptionValueException(option, wholeText ?? text!, expected);
        }

        var prefix = suffix[..^unit.Length];
        if (!Prefix.TryGetValue(prefix, out var factor) &&
            !(prefix.Length == 1 && Prefix.TryGetValue(prefix.ToLowerInvariant(), out factor) && prefix != "M"))
        {
            throw new OptionValueException(option, wholeText ?? text!, expected);
        }

        var result = value * factor;
        if (!double.IsFinite(result))
        {
            throw new OptionValueException(option, wholeText ?? text!, expected);
        }

        return result;
    }
}
