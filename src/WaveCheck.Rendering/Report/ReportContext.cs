namespace WaveCheck.Rendering.Report;

/// <summary>What the report states besides the results: the user's own words and when and by what it was made.</summary>
/// <param name="Site">Where the capture was taken, as the user wrote it; null or empty: not given.</param>
/// <param name="Circuit">Which circuit, as the user wrote it; null or empty: not given.</param>
/// <param name="Note">Free note from the user; null or empty: none.</param>
/// <param name="GeneratedAt">When the report was made.</param>
/// <param name="ToolVersion">Version of the tool that made the report.</param>
public sealed record ReportContext(string? Site, string? Circuit, string? Note, DateTimeOffset GeneratedAt, string ToolVersion);
