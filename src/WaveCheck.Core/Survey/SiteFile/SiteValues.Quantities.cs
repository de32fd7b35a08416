using System.Globalization;
using System.Text.Json;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Survey;

/// <summary>Quantities with their units (<c>"30mA"</c>, <c>"1V"</c>, <c>"10kHz"</c>), by the one rule of
/// <see cref="Quantity"/>, and the bounds every reader holds them to.</summary>
internal sealed partial class SiteValues
{
    /// <summary>IΔn, checked here against the same range as <c>--rated</c> so that a bad value is blamed on this
    /// line of the site file, not on the capture and an option the user never typed.</summary>
    public double? RatedOf(SiteJsonNode value)
    {
        var rated = CurrentOf(value, "rated");
        if (rated is { } a)
        {
            try
            {
                new AssessmentOptions { RatedResidualCurrentA = a }.Validate();
            }
            catch (OptionValueException e)
            {
                throw Error(value, $"\"rated\": cannot use '{e.Text}': expected {e.Expected}");
            }
        }

        return rated;
    }

    /// <summary>A capture setting within the bounds every reader holds it to (<see cref="CaptureLimits"/>).</summary>
    public double? Bounded(SiteJsonNode value, string key, double? si) =>
        si is { } v && CaptureLimits.SettingProblem(key, v) is { } expected
            ? throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected {expected}")
            : si;

    /// <summary>A positive current, amperes.</summary>
    public double? CurrentOf(SiteJsonNode value, string key)
    {
        var amperes = QuantityOf(value, key, "A", Quantity.CurrentForm, static (k, t) => Quantity.ParseCurrentA(k, t));
        return amperes is null or > 0 ? amperes : throw Error(value, $"\"{key}\" must be a positive current (got {value.Text})");
    }

    /// <summary>A quantity with its unit, by the one rule of <see cref="Quantity"/>: a bare number (a JSON number or
    /// a string without a unit) is refused with the reading it most likely meant.</summary>
    public double? QuantityOf(SiteJsonNode value, string key, string unit, string expected, Func<string, string, double> parse)
    {
        switch (value.Kind)
        {
            case JsonTokenType.Null: return null;
            case JsonTokenType.Number:
                var suggestion = Quantity.Suggestion(value.Text!, unit);
                throw Error(value, $"\"{key}\": {value.Text} has no unit: expected {expected}; did you mean \"{suggestion}\"?");
            case JsonTokenType.String:
                var parsed = ParseOr(value, () => parse(key, value.Text!), () =>
                {
                    var hint = Quantity.Suggestion(value.Text!, unit) is { } s ? $"; did you mean \"{s}\"?" : string.Empty;
                    return $"\"{key}\": cannot use \"{value.Text}\": expected {expected}{hint}";
                });
                return parsed > 0 ? parsed : throw Error(value, $"\"{key}\" must be positive (got \"{value.Text}\"): expected {expected}");
            default:
                throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected {expected}");
        }
    }

    /// <summary>Circuit volts per stored unit of the voltage channels: volts at WAV full scale (<c>"500V"</c>) or a
    /// bare probe ratio (<c>100</c>), positive, at most <see cref="ImportOptions.MaxVoltageScale"/>.</summary>
    public double? VoltageScaleOf(SiteJsonNode value, string key)
    {
        const string Expected = "expected volts at WAV full scale or a probe ratio, such as \"500V\" or 100";
        double? scale = value.Kind switch
        {
            JsonTokenType.Null => null,
            JsonTokenType.Number => double.Parse(value.Text!, NumberStyles.Float, CultureInfo.InvariantCulture),
            JsonTokenType.String => ParseOr(value, () => Quantity.ParseVoltageScale(key, value.Text!), () => $"\"{key}\": cannot use \"{value.Text}\": {Expected}"),
            _ => throw Error(value, $"\"{key}\": cannot use {value.Describe()}: {Expected}"),
        };
        return scale is { } v && !(v > 0 && v <= ImportOptions.MaxVoltageScale)
            ? throw Error(value, $"\"voltageScale\": cannot use {value.Describe()}: expected a positive factor up to 1e6")
            : scale;
    }

    /// <summary><paramref name="parse"/>'s number; its <see cref="OptionValueException"/> becomes
    /// <paramref name="message"/> at <paramref name="value"/>.</summary>
    private double ParseOr(SiteJsonNode value, Func<double> parse, Func<string> message)
    {
        try
        {
            return parse();
        }
        catch (OptionValueException)
        {
            throw Error(value, message());
        }
    }
}
