using WaveCheck.Core.Model;

namespace WaveCheck.Rendering.Report;

/// <summary>What the report states besides the results: the user's own words and when and by what it was made.</summary>
/// <param name="Site">Where the capture was taken, as the user wrote it; null or empty: not given.</param>
/// <param name="Circuit">Which circuit, as the user wrote it; null or empty: not given.</param>
/// <param name="Note">Free note from the user; null or empty: none.</param>
/// <param name="GeneratedAt">When the report was made.</param>
/// <param name="ToolVersion">Version of the tool that made the report.</param>
public sealed record ReportContext(string? Site, string? Circuit, string? Note, DateTimeOffset GeneratedAt, string ToolVersion)
{
    /// <summary>Report number, client, address, operator, instruments and the capture's digest (docs/report.md); its
    /// <see cref="ReportIdentity.Site"/> and <see cref="ReportIdentity.Circuit"/> give way to <see cref="Site"/> and
    /// <see cref="Circuit"/> when those are given.</summary>
    public ReportIdentity Identity { get; init; } = ReportIdentity.Empty;

    /// <summary>Paper the print layout is made for.</summary>
    public PaperSize Paper { get; init; } = PaperSize.A4;

    /// <summary>The identity with the context's site and circuit.</summary>
    public ReportIdentity EffectiveIdentity => Identity with
    {
        Site = string.IsNullOrWhiteSpace(Site) ? Identity.Site : Site.Trim(),
        Circuit = string.IsNullOrWhiteSpace(Circuit) ? Identity.Circuit : Circuit.Trim(),
    };
}

/// <summary>Paper size of the print layout (CSS <c>@page size</c>).</summary>
public enum PaperSize
{
    /// <summary>ISO A4, 210 × 297 mm.</summary>
    A4,

    /// <summary>US Letter, 8.5 × 11 in.</summary>
    Letter,
}
