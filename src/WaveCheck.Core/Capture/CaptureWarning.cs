namespace WaveCheck.Core.Capture;

/// <summary>
/// Something recoverable found while reading or analysing: it travels into the result (JSON <c>warnings</c>,
/// the report's caution box) and is never fixed silently.
/// </summary>
/// <param name="Code">Stable machine-readable code, kebab-case (e.g. <c>clipping</c>, <c>time-gap</c>, <c>truncated</c>).</param>
/// <param name="Message">One sentence for a person, with the figures.</param>
/// <param name="TimeS">Where in the capture it applies, seconds from the start, if it is tied to a place.</param>
public sealed record CaptureWarning(string Code, string Message, double? TimeS = null);
