using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering.Report;

/// <summary>How the report writes a table cell, a definition and a figure for a person: numbers without "NaN" or a
/// signed zero, currents through <see cref="CurrentText"/>, verdict words with a symbol (never colour alone).</summary>
internal static class ReportFormat
{
    internal static void Fact(HtmlWriter html, string name, string value) =>
        html.Raw("<dt>").Text(name).Raw("</dt><dd>").Text(value).Raw("</dd>\n");

    internal static void Row(HtmlWriter html, string name, string value) =>
        html.Raw("<tr><th scope=\"row\">").Text(name).Raw("</th><td>").Text(value).Raw("</td></tr>\n");

    internal static void Num(HtmlWriter html, string value) => html.Raw("<td class=\"num\">").Text(value).Raw("</td>");

    internal static void List(HtmlWriter html, IReadOnlyList<string> items, string? cssClass)
    {
        if (items.Count == 0)
        {
            return;
        }

        html.Raw(cssClass is null ? "<ul>" : $"<ul class=\"{cssClass}\">");
        foreach (var item in items)
        {
            html.Raw("<li>").Text(item).Raw("</li>");
        }

        html.Raw("</ul>\n");
    }

    internal static string FloorNote(int left, string what, double levelA) => left > 0
        ? $"Listed: {what} {TableSignificance.Rule}, here from {CurrentText.WithUnit(levelA)}; {left} below it are left out. The analysis JSON and the per-window CSV hold them all."
        : $"All {what} listed.";

    internal static string Capitalised(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];

    internal static string MetricValue(string name, double value) =>
        name.EndsWith('A') ? CurrentText.WithUnit(value)
        : name.EndsWith("Hz", StringComparison.Ordinal) ? Hertz(value)
        : name.EndsWith("Percent", StringComparison.Ordinal) ? Percent(value)
        : name.EndsWith("Deg", StringComparison.Ordinal) ? Number(value, "0") + "°"
        : Number(value, "0.###");

    internal static string Current(double? amperes) => amperes is double a ? CurrentText.WithUnit(a) : "none specified";

    /// <summary>A number for a person: "–" for a value that is not one (never "NaN"), no sign on a zero.</summary>
    internal static string Number(double value, string format)
    {
        if (!double.IsFinite(value))
        {
            return "–";
        }

        var text = value.ToString(format, CultureInfo.InvariantCulture);
        return text.StartsWith('-') && text.AsSpan(1).Trim("0.").IsEmpty ? text[1..] : text;
    }

    internal static string Percent(double value) => Number(value, Math.Abs(value) >= 10 ? "0.0" : "0.00") + " %";

    internal static string Hertz(double hz) => hz >= 1000 ? Number(hz / 1000, "0.###") + " kHz" : Number(hz, hz >= 100 ? "0" : "0.##") + " Hz";

    internal static string Seconds(double s) => s >= 1 || s == 0 ? Number(s, "0.###") + " s" : Number(s * 1000, "0.###") + " ms";

    internal static string Timestamp(DateTimeOffset t) => t.ToString("yyyy-MM-dd HH:mm:ss zzz", CultureInfo.InvariantCulture);

    internal static string CouplingText(SensorCoupling coupling) => coupling switch
    {
        SensorCoupling.Dc => "DC-coupled: sees smooth DC",
        SensorCoupling.Ac => "AC-coupled: blind to smooth DC",
        _ => "not stated",
    };

    internal static string RegimeText(Regime regime) => regime switch
    {
        Regime.Iec => "IEC (RCD types AC, A, F, B, B+)",
        _ => "North America (UL 943 GFCI figures added)",
    };

    internal static string RiskText(RiskLevel risk) => risk switch
    {
        RiskLevel.Low => "low",
        RiskLevel.Possible => "⚠ possible",
        RiskLevel.Likely => "✘ likely",
        _ => "incomplete",
    };

    internal static string TripsText(bool? trips) => trips switch
    {
        true => "✘ yes, trips",
        false => "✔ no",
        null => "? may trip (between the must-not-trip and must-trip levels)",
    };
}
