using System.Globalization;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// Accuracy of the measuring chain (clamp, logger, calibration) as a share of the reading plus a fixed part, the way
/// instrument makers state it: a figure x is known to ±(<see cref="ReadingFraction"/>·|x| + <see cref="OffsetA"/>).
/// Every comparison of a figure with a verdict limit goes through <see cref="Compare"/>, so a figure within its
/// uncertainty of a limit is "at the limit" in every rule alike, never decided by rounding. Immutable.
/// </summary>
/// <param name="ReadingFraction">Share of the reading, 0 to 0.5 (0.02 for 2 %).</param>
/// <param name="OffsetA">Fixed part, amperes, 0 to 0.1 A.</param>
public sealed record MeasurementAccuracy(double ReadingFraction, double OffsetA)
{
    /// <summary>Default accuracy: 2 % of reading + 0.1 mA.</summary>
    /// <remarks>Engineering choice (common practice, no source): of the order of a DC-capable leakage clamp's stated
    /// accuracy on its lowest range. State the instrument's own figure with <c>--accuracy</c>; a larger uncertainty
    /// only ever moves verdicts to the safe side.</remarks>
    public static MeasurementAccuracy Default { get; } = new(0.02, 0.0001);

    /// <summary>Uncertainty of a figure, amperes.</summary>
    /// <param name="valueA">The figure, amperes.</param>
    public double UncertaintyA(double valueA) => (ReadingFraction * Math.Abs(valueA)) + OffsetA;

    /// <summary>Where <paramref name="valueA"/> stands against <paramref name="limitA"/>: above when even its lower
    /// bound reaches the limit, below when even its upper bound stays under it, at the limit otherwise.</summary>
    /// <param name="valueA">Measured figure, amperes (magnitude).</param>
    /// <param name="limitA">Limit, amperes.</param>
    public LimitState Compare(double valueA, double limitA)
    {
        if (!double.IsFinite(valueA))
        {
            return LimitState.AtLimit;
        }

        var u = UncertaintyA(valueA);
        var v = Math.Abs(valueA);
        if (v - u >= limitA)
        {
            return LimitState.Above;
        }

        return v + u < limitA ? LimitState.Below : LimitState.AtLimit;
    }

    /// <summary>Text form, e.g. <c>2%+0.1mA</c>.</summary>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture,
        $"{ReadingFraction * 100:0.###}%+{OffsetA * 1000:0.###}mA");

    /// <summary>Parses <c>2%+0.1mA</c>, <c>2 % + 0.1 mA</c>, <c>0.5%</c> or <c>0.2mA</c>.</summary>
    /// <exception cref="OptionValueException">The text is not of that form or out of range.</exception>
    public static MeasurementAccuracy Parse(string text, string? option = null)
    {
        const string Expected = "a share of the reading plus a current, such as 2%+0.1mA (0 to 50 % and 0 to 100 mA)";
        option ??= Setting.Ref(nameof(AssessmentOptions.Accuracy));
        var fraction = 0.0;
        var offset = 0.0;
        var any = false;
        foreach (var raw in (text ?? string.Empty).Split('+'))
        {
            var part = raw.Trim().Replace(" ", string.Empty, StringComparison.Ordinal);
            if (part.Length == 0)
            {
                throw new OptionValueException(option, text ?? string.Empty, Expected);
            }

            if (part.EndsWith('%'))
            {
                if (!double.TryParse(part[..^1], NumberStyles.Float, CultureInfo.InvariantCulture, out var percent))
                {
                    throw new OptionValueException(option, text!, Expected);
                }

                fraction += percent / 100;
            }
            else
            {
                try
                {
                    offset += Capture.Quantity.ParseCurrentA(option, part);
                }
                catch (UserInputException)
                {
                    throw new OptionValueException(option, text!, Expected);
                }
            }

            any = true;
        }

        if (!any || !(fraction >= 0 && fraction <= 0.5) || !(offset >= 0 && offset <= 0.1))
        {
            throw new OptionValueException(option, text ?? string.Empty, Expected);
        }

        return new MeasurementAccuracy(fraction, offset);
    }
}
