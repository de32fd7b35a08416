using System.Globalization;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Synthesis;

/// <summary>
/// Reads the synthesizer's supply voltage (<c>--supply 230V,phases=3,h3=3%,h5=4%</c>) and its leakage parts
/// (<c>leak:r=500k,c=47nF,phase=2</c>: an R ∥ C path from a phase to earth, <see cref="RcLeakageComponent"/>).
/// </summary>
public static class SupplySpec
{
    /// <summary>Parses a supply description: an RMS voltage to earth, then <c>phases=1|3</c> and harmonics
    /// <c>hN=share%</c> (optionally <c>@degrees</c>).</summary>
    /// <param name="text">The description.</param>
    /// <param name="mainsHz">Mains frequency, hertz.</param>
    /// <exception cref="OptionValueException">A part that cannot be read.</exception>
    public static SupplyVoltage ParseSupply(string text, double mainsHz)
    {
        ArgumentNullException.ThrowIfNull(text);
        var parts = text.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
        if (parts.Length == 0)
        {
            throw new OptionValueException(SynthesisSettings.SupplyRef, text, "a voltage to earth such as 230V, then phases=3 or harmonics h5=4%");
        }

        var rms = Quantity.ParseVoltageV(SynthesisSettings.SupplyRef, parts[0]);
        if (!(rms > 0 && rms <= 100_000))
        {
            throw new OptionValueException(SynthesisSettings.SupplyRef, text, "a positive RMS voltage up to 100 kV first, e.g. 230V");
        }

        var phases = 1;
        var harmonics = new List<(int, double, double)>();
        foreach (var part in parts.Skip(1))
        {
            var eq = part.IndexOf('=', StringComparison.Ordinal);
            var key = eq < 0 ? part : part[..eq].Trim().ToLowerInvariant();
            var value = eq < 0 ? string.Empty : part[(eq + 1)..].Trim();
            if (key == "phases" && value is "1" or "3")
            {
                phases = value == "3" ? 3 : 1;
            }
            else if (key.StartsWith('h') && int.TryParse(key[1..], NumberStyles.None, CultureInfo.InvariantCulture, out var order)
                     && order is >= 2 and <= 50 && Share(value) is { } harmonic)
            {
                harmonics.Add((order, harmonic.Share, harmonic.PhaseDeg));
            }
            else
            {
                throw new OptionValueException(SynthesisSettings.SupplyRef, text, $"phases=1 or 3, or a harmonic such as h5=4% or h5=4%@30 (order 2 to 50), not '{part}'");
            }
        }

        return new SupplyVoltage(rms, mainsHz, harmonics, phases);
    }

    private static (double Share, double PhaseDeg)? Share(string value)
    {
        var at = value.IndexOf('@', StringComparison.Ordinal);
        var shareText = (at < 0 ? value : value[..at]).Trim().TrimEnd('%');
        var phase = 0.0;
        if (at >= 0 && !double.TryParse(value[(at + 1)..].TrimEnd('°'), NumberStyles.Float, CultureInfo.InvariantCulture, out phase))
        {
            return null;
        }

        return double.TryParse(shareText, NumberStyles.Float, CultureInfo.InvariantCulture, out var percent) && percent > 0 && percent <= 100
            ? (percent / 100, phase)
            : null;
    }

    /// <summary>Parses <c>leak:r=500k,c=47nF[,phase=1..3]</c> against the supply.</summary>
    /// <param name="text">The part.</param>
    /// <param name="supply">The supply (<c>--supply</c>); null when none was given.</param>
    /// <exception cref="OptionValueException">No supply, a key not understood, or a value that cannot be read.</exception>
    public static RcLeakageComponent ParseLeak(string text, SupplyVoltage? supply)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (supply is null)
        {
            throw new OptionValueException(SynthesisSettings.PartsRef, text, $"a leak part needs the supply it leaks from: give {SynthesisSettings.SupplyRef}, e.g. {SynthesisSettings.SupplyRef} 230V");
        }

        var colon = text.IndexOf(':', StringComparison.Ordinal);
        double? r = null;
        var c = 0.0;
        var phase = 1;
        foreach (var part in (colon < 0 ? string.Empty : text[(colon + 1)..]).Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
        {
            var eq = part.IndexOf('=', StringComparison.Ordinal);
            var key = eq < 0 ? string.Empty : part[..eq].Trim().ToLowerInvariant();
            var value = eq < 0 ? part : part[(eq + 1)..].Trim();
            switch (key)
            {
                case "r":
                    r = Scaled(text, value, ["Ω", "ohm", "R"], positive: true);
                    break;
                case "c":
                    c = Scaled(text, value, ["F"], positive: false);
                    break;
                case "phase" when int.TryParse(value.TrimStart('L', 'l'), NumberStyles.None, CultureInfo.InvariantCulture, out var p) && p >= 1 && p <= supply.Phases:
                    phase = p;
                    break;
                default:
                    throw new OptionValueException(SynthesisSettings.PartsRef, text,
                        $"keys of 'leak': r (e.g. 500k), c (e.g. 47nF), phase (1{(supply.Phases == 3 ? " to 3" : "")})");
            }
        }

        return new RcLeakageComponent(supply, phase - 1, r, c);
    }

    private static double Scaled(string text, string value, string[] units, bool positive)
    {
        var v = value.Trim();
        foreach (var unit in units)
        {
            if (v.EndsWith(unit, StringComparison.OrdinalIgnoreCase))
            {
                v = v[..^unit.Length].Trim();
                break;
            }
        }

        var factor = 1.0;
        if (v.Length > 0 && "pnuµmkM".Contains(v[^1], StringComparison.Ordinal))
        {
            factor = v[^1] switch
            {
                'p' => 1e-12,
                'n' => 1e-9,
                'u' or 'µ' => 1e-6,
                'm' => 1e-3,
                'k' => 1e3,
                _ => 1e6,
            };
            v = v[..^1];
        }

        return double.TryParse(v, NumberStyles.Float, CultureInfo.InvariantCulture, out var number) && double.IsFinite(number)
               && (positive ? number > 0 : number >= 0)
            ? number * factor
            : throw new OptionValueException(SynthesisSettings.PartsRef, text, positive ? "a resistance such as 500k or 1.2M" : "a capacitance such as 47nF or 0.1uF");
    }
}
