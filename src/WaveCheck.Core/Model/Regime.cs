namespace WaveCheck.Core.Model;

/// <summary>Which family of protective devices the verdict addresses.</summary>
public enum Regime
{
    /// <summary>IEC residual-current devices (types AC, A, F, B, B+); JSON/CLI text <c>iec</c>.</summary>
    Iec,

    /// <summary>North America: UL 943 GFCIs in addition to the IEC type verdicts; text <c>na</c>.</summary>
    Na,
}

/// <summary>Text forms of <see cref="Regime"/>.</summary>
public static class RegimeNames
{
    /// <summary><c>iec</c> or <c>na</c>.</summary>
    public static string ToText(this Regime regime) => regime == Regime.Na ? "na" : "iec";

    /// <summary>Parses <c>iec</c> or <c>na</c> (case-insensitive).</summary>
    /// <returns>False when the text is neither.</returns>
    public static bool TryParse(string? text, out Regime regime)
    {
        switch (text?.Trim().ToUpperInvariant())
        {
            case "IEC": regime = Regime.Iec; return true;
            case "NA": regime = Regime.Na; return true;
            default: regime = Regime.Iec; return false;
        }
    }
}
