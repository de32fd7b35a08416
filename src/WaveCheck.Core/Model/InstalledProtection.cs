using System.Text.Json;
using System.Text.Json.Serialization;

namespace WaveCheck.Core.Model;

/// <summary>DC fault-current detection beside the installed device.</summary>
public enum DcDetection
{
    /// <summary>None.</summary>
    None,

    /// <summary>An RDC-DD (IEC 62955) fitted with the device: written <c>A+RDC-DD</c>.</summary>
    RdcDd,

    /// <summary>The charging equipment provides the 6 mA DC detection itself (declared by the user from the maker's data).</summary>
    Charger,
}

/// <summary>
/// The protection installed on a circuit: its device type and the DC fault-current detection declared beside it. Read
/// once where the input is read (a site file, the command line) and carried typed from there; JSON writes the trade's
/// name (<see cref="ToTradeName"/>) and reads it back.
/// </summary>
/// <remarks>The IΔn travels beside it as its own figure (<c>ratedResidualCurrentA</c>): a rating is known and judged
/// against even where the type is not given.</remarks>
/// <param name="Type">The device type.</param>
/// <param name="DcDetection">DC detection beside it: an RDC-DD, the charging equipment's own, or none.</param>
[JsonConverter(typeof(InstalledProtectionJsonConverter))]
public readonly record struct InstalledProtection(DeviceType Type, DcDetection DcDetection = DcDetection.None)
{
    private const string RdcDdSuffix = "+RDC-DD";

    private const string ChargerSuffix = " + charger DC detection";

    /// <summary>The protection as the trade writes it: <c>A</c>, <c>A+RDC-DD</c>, <c>A + charger DC detection</c>.</summary>
    public string ToTradeName() => DcDetection switch
    {
        DcDetection.RdcDd => Type.ToTradeName() + RdcDdSuffix,
        DcDetection.Charger => Type.ToTradeName() + ChargerSuffix,
        _ => Type.ToTradeName(),
    };

    /// <summary>The trade's name (<see cref="ToTradeName"/>).</summary>
    public override string ToString() => ToTradeName();

    /// <summary>Reads a protection as <see cref="ToTradeName"/> writes it (case and spaces ignored; <c>A+RDCDD</c>
    /// also accepted).</summary>
    /// <returns>False when the text is none of these.</returns>
    public static bool TryParse(string? text, out InstalledProtection protection)
    {
        var compact = (text ?? string.Empty).Replace(" ", string.Empty, StringComparison.Ordinal);
        var charger = ChargerSuffix.Replace(" ", string.Empty, StringComparison.Ordinal);
        if (compact.Length > charger.Length && compact.EndsWith(charger, StringComparison.OrdinalIgnoreCase)
            && DeviceTypeNames.TryParse(compact[..^charger.Length], out var type))
        {
            protection = new InstalledProtection(type, DcDetection.Charger);
            return true;
        }

        var known = DeviceTypeNames.TryParseProtection(text, out type, out var rdcDd);
        protection = new InstalledProtection(type, rdcDd ? DcDetection.RdcDd : DcDetection.None);
        return known;
    }
}

/// <summary>Writes an <see cref="InstalledProtection"/> as its trade name, a JSON string, and reads it back.</summary>
internal sealed class InstalledProtectionJsonConverter : JsonConverter<InstalledProtection>
{
    public override InstalledProtection Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options) =>
        reader.TokenType == JsonTokenType.String && InstalledProtection.TryParse(reader.GetString(), out var protection)
            ? protection
            : throw new JsonException("expected an installed protection such as \"A\", \"A+RDC-DD\" or \"A + charger DC detection\"");

    public override void Write(Utf8JsonWriter writer, InstalledProtection value, JsonSerializerOptions options) =>
        writer.WriteStringValue(value.ToTradeName());
}
