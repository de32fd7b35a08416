using System.Globalization;

namespace WaveCheck.Core.Text;

/// <summary>How a resistance or a capacitance of the leakage split is written for a person.</summary>
public static class ImpedanceText
{
    /// <summary>A resistance for a person: kΩ or MΩ.</summary>
    /// <param name="ohms">Resistance, ohms.</param>
    public static string Resistance(double ohms) => ohms >= 1e6
        ? string.Create(CultureInfo.InvariantCulture, $"{ohms / 1e6:0.##} MΩ")
        : string.Create(CultureInfo.InvariantCulture, $"{ohms / 1e3:0.#} kΩ");

    /// <summary>A capacitance for a person: nF (µF above 10 µF).</summary>
    /// <param name="farads">Capacitance, farads.</param>
    public static string Capacitance(double farads) => Math.Abs(farads) >= 1e-5
        ? string.Create(CultureInfo.InvariantCulture, $"{farads * 1e6:0.##} µF")
        : string.Create(CultureInfo.InvariantCulture, $"{farads * 1e9:0.#} nF");
}
