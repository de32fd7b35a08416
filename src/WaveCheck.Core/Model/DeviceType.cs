namespace WaveCheck.Core.Model;

/// <summary>
/// Residual-current device types of the IEC 60755 family, in order of capability: each type detects
/// everything the types before it detect (IEC 60364-5-53:2015 §531.3.3).
/// </summary>
public enum DeviceType
{
    /// <summary>Type AC: sinusoidal AC residual current only.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("AC")]
    AC = 0,

    /// <summary>Type A: as AC, plus pulsating DC, with up to 6 mA smooth DC superimposed.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("A")]
    A = 1,

    /// <summary>Type F: as A, plus composite residual current of single-phase frequency converters; 10 mA smooth DC.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("F")]
    F = 2,

    /// <summary>Type B: as F, plus smooth DC, multi-phase rectified current, AC up to 1 kHz (IEC 62423).</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("B")]
    B = 3,

    /// <summary>Extended-frequency type B (national designation B+, DIN VDE 0664-400): tripping defined up to 20 kHz.</summary>
    [System.Text.Json.Serialization.JsonStringEnumMemberName("B+")]
    BPlus = 4,
}

/// <summary>Names of device types as the trade writes them.</summary>
public static class DeviceTypeNames
{
    /// <summary>The trade's name: <c>AC</c>, <c>A</c>, <c>F</c>, <c>B</c>, <c>B+</c>.</summary>
    public static string ToTradeName(this DeviceType type) => type switch
    {
        DeviceType.AC => "AC",
        DeviceType.A => "A",
        DeviceType.F => "F",
        DeviceType.B => "B",
        DeviceType.BPlus => "B+",
        _ => throw new ArgumentOutOfRangeException(nameof(type), type, "unknown device type"),
    };

    /// <summary>Parses <c>AC</c>, <c>A</c>, <c>F</c>, <c>B</c>, <c>B+</c> (case-insensitive; <c>Bplus</c> also accepted).</summary>
    /// <returns>False when the text is none of these.</returns>
    public static bool TryParse(string? text, out DeviceType type)
    {
        switch (text?.Trim().ToUpperInvariant())
        {
            case "AC": type = DeviceType.AC; return true;
            case "A": type = DeviceType.A; return true;
            case "F": type = DeviceType.F; return true;
            case "B": type = DeviceType.B; return true;
            case "B+" or "BPLUS" or "B-PLUS": type = DeviceType.BPlus; return true;
            default: type = DeviceType.AC; return false;
        }
    }

    /// <summary>Parses an installed protection: a type, optionally with an RDC-DD (IEC 62955) beside it, written
    /// <c>A+RDC-DD</c> (spaces allowed; <c>A+RDCDD</c> also accepted).</summary>
    /// <returns>False when the text is none of these.</returns>
    public static bool TryParseProtection(string? text, out DeviceType type, out bool rdcDd)
    {
        var compact = (text ?? string.Empty).Replace(" ", string.Empty, StringComparison.Ordinal).ToUpperInvariant();
        rdcDd = false;
        foreach (var suffix in new[] { "+RDC-DD", "+RDCDD" })
        {
            if (compact.EndsWith(suffix, StringComparison.Ordinal) && compact.Length > suffix.Length)
            {
                rdcDd = true;
                compact = compact[..^suffix.Length];
                break;
            }
        }

        return TryParse(compact, out type);
    }
}
