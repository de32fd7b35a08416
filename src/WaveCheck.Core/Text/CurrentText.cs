using System.Globalization;

namespace WaveCheck.Core.Text;

/// <summary>
/// The one place where amperes become text for a person: milliamperes on screen and in reports, with a precision
/// that suits residual currents (three significant figures, at least 0.001 mA resolution).
/// </summary>
public static class CurrentText
{
    /// <summary>Formats a current given in amperes as milliamperes without the unit, e.g. <c>12.3</c>.</summary>
    public static string Milliamps(double amperes)
    {
        if (double.IsNaN(amperes))
        {
            return "n/a";
        }

        var mA = amperes * 1000.0;
        var magnitude = Math.Abs(mA);
        var format = magnitude >= 100 ? "0" : magnitude >= 10 ? "0.0" : magnitude >= 1 ? "0.00" : "0.000";
        var text = mA.ToString(format, CultureInfo.InvariantCulture);
        // A tiny negative value rounds to "-0.000": a sign on zero says nothing and reads as a fault.
        return text.StartsWith('-') && text.AsSpan(1).Trim("0.").IsEmpty ? text[1..] : text;
    }

    /// <summary>Formats a current given in amperes with its unit, e.g. <c>12.3 mA</c>.</summary>
    public static string WithUnit(double amperes) => Milliamps(amperes) + " mA";
}
