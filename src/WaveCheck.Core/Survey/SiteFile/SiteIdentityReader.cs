using System.Globalization;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Survey;

/// <summary>The identity keys of a site file (docs/report.md): who, where and with what, for the report's identity
/// block; at the top for the whole site, and a few a capture entry may state for itself.</summary>
internal static class SiteIdentityReader
{
    /// <summary>Keys naming who, where and with what (docs/report.md): the report's identity block.</summary>
    public static readonly string[] Keys =
        ["client", "address", "reportNumber", "operator", "instrument", "instrumentSerial", "clamp", "clampSerial", "calibrationDue", "date", "productTest"];

    /// <summary>Identity keys a capture entry may state for itself (its own report number, recording date, product test).</summary>
    public static readonly string[] CaptureKeys = ["reportNumber", "date", "productTest"];

    /// <summary>The identity keys of <paramref name="item"/> among <paramref name="keys"/>; text values trimmed,
    /// blank text as not given.</summary>
    public static ReportIdentity Read(SiteValues values, SiteJsonNode item, string[] keys)
    {
        var identity = ReportIdentity.Empty;
        foreach (var (key, _, value) in item.Members!)
        {
            if (Array.IndexOf(keys, key) < 0)
            {
                continue;
            }

            identity = key switch
            {
                "client" => identity with { Client = Text(values, value, key) },
                "address" => identity with { SiteAddress = Text(values, value, key) },
                "reportNumber" => identity with { ReportNumber = Text(values, value, key) },
                "operator" => identity with { Operator = Text(values, value, key) },
                "instrument" => identity with { Instrument = Text(values, value, key) },
                "instrumentSerial" => identity with { InstrumentSerial = Text(values, value, key) },
                "clamp" => identity with { Clamp = Text(values, value, key) },
                "clampSerial" => identity with { ClampSerial = Text(values, value, key) },
                "calibrationDue" => identity with { CalibrationDue = values.Parsed<DateOnly>(value, key, DateOf, "a date such as \"2027-03-31\" (year-month-day)") },
                "date" => identity with { StatedRecordedAt = values.Parsed<DateTimeOffset>(value, key, TimeOf, "a date or date and time such as \"2026-11-20\" or \"2026-11-20T09:14:00Z\"") },
                "productTest" => identity with { ProductTest = values.BoolOf(value, key) ?? false },
                _ => identity,
            };
        }

        return identity;
    }

    private static string? Text(SiteValues values, SiteJsonNode value, string key) =>
        values.OptionalString(value, key) is { } text && !string.IsNullOrWhiteSpace(text) ? text.Trim() : null;

    /// <summary>A calendar date, year-month-day.</summary>
    private static bool DateOf(string text, out DateOnly date) =>
        DateOnly.TryParseExact(text.Trim(), "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out date);

    /// <summary>A date, or a date and time (UTC unless it says otherwise); at least the ten characters of a date.</summary>
    private static bool TimeOf(string text, out DateTimeOffset time) =>
        DateTimeOffset.TryParse(text.Trim(), CultureInfo.InvariantCulture, DateTimeStyles.AssumeUniversal, out time) && text.Trim().Length >= 10;
}
