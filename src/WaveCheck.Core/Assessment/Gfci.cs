using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// North American ground-fault circuit interrupters (UL 943 Class A; UL 943C special-purpose classes C, D, E) against
/// a standing residual current. Stateless and thread-safe.
/// </summary>
public static class Gfci
{
    /// <summary>UL 943 trip time T = (20 / I)^1.43 s, I in mA rms.</summary>
    /// <param name="currentA">Residual current, amperes RMS.</param>
    /// <returns>Seconds; null below the 6 mA Class A must-trip level (the formula's range is 6 to 264 mA).</returns>
    public static double? TripTimeS(double currentA)
    {
        if (!(currentA >= Limits.GfciClassAMustTripA))
        {
            return null;
        }

        return Math.Pow(Limits.GfciTripTimeReferenceA / currentA, Limits.GfciTripTimeExponent);
    }

    /// <summary>Judges a standing residual current against the UL 943 levels.</summary>
    /// <param name="standingRmsA">Worst-window RMS, amperes.</param>
    public static GfciResult Assess(double standingRmsA)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(standingRmsA);
        bool? classA = standingRmsA >= Limits.GfciClassAMustTripA ? true : standingRmsA < Limits.GfciClassAMustNotTripA ? false : null;
        bool? special = standingRmsA >= Limits.GfciSpecialPurposeTripA ? true : standingRmsA < Limits.GfciSpecialPurposeLowA ? false : null;
        var notes = new List<string>
        {
            $"Class A (UL 943): must trip at {Ma(Limits.GfciClassAMustTripA)} and above, must not trip below {Ma(Limits.GfciClassAMustNotTripA)}; standing {Ma(standingRmsA)}: "
                + classA switch { true => "trips on the standing current alone.", false => "below the must-not-trip level.", null => "between the two levels: may trip." },
            $"Special purpose (UL 943C classes C, D, E): trip threshold {Ma(Limits.GfciSpecialPurposeLowA)} to {Ma(Limits.GfciSpecialPurposeTripA)}; standing {Ma(standingRmsA)}: "
                + special switch { true => "trips on the standing current alone.", false => "below the threshold.", null => "inside the threshold band: may trip." },
            string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"Trip time T = ({Limits.GfciTripTimeReferenceA * 1000:0.##} / I)^{Limits.GfciTripTimeExponent:0.##} s, I in mA rms, stated for {Limits.GfciClassAMustTripA * 1000:0.##} to {Limits.GfciTripTimeMaxA * 1000:0.##} mA (UL 943)."),
            "UL 943 states no DC sensitivity requirement: a GFCI's response to smooth or pulsating DC is not specified; ask the maker.",
            "The standing current is the worst window's true RMS (DC included), the conservative reading.",
        };
        if (standingRmsA > Limits.GfciTripTimeMaxA)
        {
            notes.Add($"The standing current {Ma(standingRmsA)} is above the formula's {Ma(Limits.GfciTripTimeMaxA)} range; the time shown is the formula's value.");
        }

        return new GfciResult(standingRmsA, classA, TripTimeS(standingRmsA), special,
            standingRmsA >= Limits.GfciSpecialPurposeTripA ? TripTimeS(standingRmsA) : null, notes);
    }

    private static string Ma(double amperes) => CurrentText.WithUnit(amperes);
}
