using System.Text.Json;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Survey;

/// <summary>
/// Reads one value of a site file and names its mistakes: every message carries the file, the value's 1-based line
/// and column, the key and what was expected there. This part holds the error text and the plain values (text,
/// switches, words); <c>SiteValues.Quantities.cs</c> the currents, voltages and frequencies, <c>SiteValues.Channels.cs</c>
/// the channel names.
/// </summary>
/// <param name="path">The site file as the user named it, for messages.</param>
internal sealed partial class SiteValues(string path)
{
    /// <summary>The site file as the user named it.</summary>
    public string Path { get; } = path;

    /// <summary>A mistake at <paramref name="at"/>.</summary>
    public CaptureFormatException Error(SiteJsonNode at, string problem) => new(Path, problem, at.Line, at.Column);

    /// <summary>An unknown key, with the known key closest to it when one is close.</summary>
    public CaptureFormatException UnknownKey(SiteJsonNode keyNode, string[] known, string where)
    {
        var nearest = NearestName.Find(keyNode.Text!, known);
        var hint = nearest is null ? string.Empty : $"did you mean \"{nearest}\"? ";
        return Error(keyNode, $"unknown key \"{keyNode.Text}\" in {where}: {hint}expected one of {Quote(known)}");
    }

    /// <summary>Names in quotes, comma-separated: <c>"a", "b"</c>.</summary>
    public static string Quote(IEnumerable<string> names) => string.Join(", ", names.Select(n => $"\"{n}\""));

    /// <summary>Refuses a value that is not of <paramref name="kind"/> (an object, a list).</summary>
    public void RequireKind(SiteJsonNode value, JsonTokenType kind, string expected)
    {
        if (value.Kind != kind)
        {
            throw Error(value, $"found {value.Describe()}: expected {expected}");
        }
    }

    /// <summary>Text in quotes; null for null.</summary>
    public string? OptionalString(SiteJsonNode value, string key) => value.Kind switch
    {
        JsonTokenType.Null => null,
        JsonTokenType.String => value.Text,
        _ => throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected text in quotes"),
    };

    /// <summary>Text in quotes that is not blank: a file, a name, a channel of a list.</summary>
    public string RequiredString(SiteJsonNode value, string key) =>
        value.Kind == JsonTokenType.String && !string.IsNullOrWhiteSpace(value.Text)
            ? value.Text!
            : throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected a file name in quotes");

    /// <summary>True, false, or null for null.</summary>
    public bool? BoolOf(SiteJsonNode value, string key) => value.Kind switch
    {
        JsonTokenType.Null => null,
        JsonTokenType.True => true,
        JsonTokenType.False => false,
        _ => throw Error(value, $"\"{key}\": cannot use {value.Describe()}: expected true or false"),
    };

    /// <summary>An installed protection: a type, optionally with an RDC-DD (<c>"A+RDC-DD"</c>); null for null.</summary>
    public InstalledProtection? DeviceOf(SiteJsonNode value)
    {
        if (value.Kind == JsonTokenType.Null)
        {
            return null;
        }

        if (value.Kind == JsonTokenType.String && DeviceTypeNames.TryParseProtection(value.Text, out var type, out var rdcDd))
        {
            return new InstalledProtection(type, rdcDd ? DcDetection.RdcDd : DcDetection.None);
        }

        var found = value.Kind == JsonTokenType.String ? $"\"{value.Text}\"" : value.Describe();
        throw Error(value, $"unknown device type {found}: expected \"AC\", \"A\", \"F\", \"B\" or \"B+\", optionally with +RDC-DD (\"A+RDC-DD\")");
    }

    /// <summary>Sensor coupling: <c>dc</c>, <c>ac</c> or <c>unknown</c>; null for null.</summary>
    public SensorCoupling? SensorOf(SiteJsonNode value) =>
        Parsed<SensorCoupling>(value, "sensor", static (string text, out SensorCoupling sensor) =>
        {
            (var known, sensor) = text.Trim().ToLowerInvariant() switch
            {
                "dc" => (true, SensorCoupling.Dc),
                "ac" => (true, SensorCoupling.Ac),
                "unknown" => (true, SensorCoupling.Unknown),
                _ => (false, default),
            };
            return known;
        }, "\"dc\" (sees DC), \"ac\" (blind to DC) or \"unknown\"");

    /// <summary>Rules to judge by: <c>iec</c> or <c>na</c>; null for null.</summary>
    public Regime? RegimeOf(SiteJsonNode value) =>
        Parsed<Regime>(value, "regime", RegimeNames.TryParse, "\"iec\" or \"na\"");

    /// <summary>A word or date in quotes read by <paramref name="tryParse"/>; null for null. The one rule for every
    /// such key: text that does not parse is refused as <c>"key": cannot use "text": expected ...</c>.</summary>
    /// <param name="value">The value.</param>
    /// <param name="key">Its key, for the message.</param>
    /// <param name="tryParse">Reads the text; false when it cannot.</param>
    /// <param name="expected">What the key takes, for the message.</param>
    public T? Parsed<T>(SiteJsonNode value, string key, TryParse<T> tryParse, string expected)
        where T : struct =>
        OptionalString(value, key) is not { } text ? null
        : tryParse(text, out var parsed) ? parsed
        : throw Error(value, $"\"{key}\": cannot use \"{text}\": expected {expected}");

    /// <summary>Reads <paramref name="text"/> into <paramref name="value"/>; false when it cannot.</summary>
    public delegate bool TryParse<T>(string text, out T value);
}
