using System.Globalization;
using System.Text.RegularExpressions;

namespace WaveCheck.Core.Capture;

/// <summary>
/// Parses quantities a person types (<c>30mA</c>, <c>0.3 A</c>, <c>10 mV/mA</c>, <c>1 V</c>, <c>50 kHz</c>) into SI values.
/// Accepts a decimal point (not a comma, to keep lists unambiguous), optional space before the unit, µ or u for micro.
/// </summary>
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

    /// <summary>Parses a current; a bare number is taken in <paramref name="bareUnit"/> (default amperes).</summary>
    /// <param name="option">Option name for the message.</param>
    /// <param name="text">E.g. <c>30mA</c>, <c>0.03</c>, <c>300 uA</c>.</param>
    /// <param name="bareUnit">Unit of a number without one: <c>A</c> or <c>mA</c>.</param>
    /// <returns>Amperes.</returns>
    /// <exception cref="OptionValueException">Not a current.</exception>
    public static double ParseCurrentA(string option, string text, string bareUnit = "A") =>
        Parse(option, text, "A", bareUnit, "a current such as 30mA, 0.3A or 300uA");

    /// <summary>As <see cref="ParseCurrentA"/>, and the current must be above zero (a full scale, an IΔn).</summary>
    /// <param name="option">Option name for the message.</param>
    /// <param name="text">E.g. <c>30mA</c>.</param>
    /// <param name="bareUnit">Unit of a number without one: <c>A</c> or <c>mA</c>.</param>
    /// <returns>Amperes.</returns>
    /// <exception cref="OptionValueException">Not a current, or not above zero.</exception>
    public static double ParsePositiveCurrentA(string option, string text, string bareUnit = "A")
    {
        var amperes = ParseCurrentA(option, text, bareUnit);
        return amperes > 0 ? amperes : throw new OptionValueException(option, text, "a positive current");
    }

    /// <summary>Parses a voltage (<c>1 V</c>, <c>500mV</c>); a bare number is volts.</summary>
    /// <returns>Volts.</returns>
    public static double ParseVoltageV(string option, string text) =>
        Parse(option, text, "V", "V", "a voltage such as 1V or 500mV");

    /// <summary>Parses a frequency (<c>50</c>, <c>50Hz</c>, <c>20 kHz</c>); a bare number is hertz.</summary>
    /// <returns>Hertz.</returns>
    public static double ParseFrequencyHz(string option, string text) =>
        Parse(option, text, "Hz", "Hz", "a frequency such as 50, 60Hz or 20kHz");

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

        return Parse(option, trimmed, "s", "s", expected);
    }

    /// <summary>Parses a clamp sensitivity (<c>10 mV/mA</c>, <c>0.1 V/A</c>, <c>100mV/A</c>); a bare number is V/A.</summary>
    /// <returns>Volts per ampere.</returns>
    public static double ParseSensitivityVPerA(string option, string text)
    {
        const string expected = "a sensitivity such as 10 mV/mA, 100mV/A or 1 V/A";
        var slash = text.IndexOf('/', StringComparison.Ordinal);
        if (slash < 0)
        {
            return Parse(option, text, "V", "V", expected);
        }

        var numerator = Parse(option, text[..slash], "V", "V", expected);
        var denominatorText = text[(slash + 1)..].Trim();
        var denominator = denominatorText.Length > 0 && char.IsDigit(denominatorText[0])
            ? Parse(option, denominatorText, "A", "A", expected)
            : Parse(option, "1" + denominatorText, "A", "A", expected);
        if (denominator <= 0)
        {
            throw new OptionValueException(option, text, expected);
        }

        return numerator / denominator;
    }

    private static double Parse(string option, string text, string unit, string bareUnit, string expected)
    {
        var match = NumberAndUnit().Match(text ?? string.Empty);
        if (!match.Success)
        {
            throw new OptionValueException(option, text ?? string.Empty, expected);
        }

        var value = double.Parse(match.Groups[1].Value, NumberStyles.Float, CultureInfo.InvariantCulture);
        var suffix = match.Groups[2].Success ? match.Groups[2].Value.Trim() : string.Empty;
        if (suffix.Length == 0)
        {
            suffix = bareUnit;
        }

        if (!suffix.EndsWith(unit, StringComparison.OrdinalIgnoreCase))
        {
            throw new OptionValueException(option, text!, expected);
        }

        var prefix = suffix[..^unit.Length];
        if (!Prefix.TryGetValue(prefix, out var factor) &&
            !(prefix.Length == 1 && Prefix.TryGetValue(prefix.ToLowerInvariant(), out factor) && prefix != "M"))
        {
            throw new OptionValueException(option, text!, expected);
        }

        var result = value * factor;
        if (!double.IsFinite(result))
        {
            throw new OptionValueException(option, text!, expected);
        }

        return result;
    }
}
