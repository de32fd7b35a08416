using System.Globalization;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Survey;

/// <summary>
/// Reads a site file: JSON written by a person, so comments and trailing commas are allowed, currents, voltages and
/// frequencies are written with their units (<c>"30mA"</c>, <c>"1V"</c>, <c>"10kHz"</c>; a bare number is refused
/// with the reading it most likely meant, as on the command line), and every mistake is reported with its 1-based line and
/// column and what was expected there.
/// </summary>
/// <remarks>
/// Layout:
/// <code>
/// { "site": "...", "defaults": { settings },
///   "captures": [ { "file": "c1.wav", "circuit": "...", settings }, ... ],
///   "upstream": [ { "name": "...", "device": "A", "rated": "100mA", "circuits": ["c2.wav", ...] }, ... ] }
/// </code>
/// A capture entry may say what the circuit was doing (<c>"state": "start-up"</c>); captures with the same
/// <c>circuit</c> name (trimmed, case ignored) are one circuit with one verdict, and must state the same device, IΔn,
/// regime and charging-point settings.
/// Settings keys: <c>rated</c>, <c>device</c> (a type, or a type with <c>+RDC-DD</c>), <c>sensor</c> (dc, ac, unknown),
/// <c>regime</c> (iec, na), <c>ev</c>, <c>chargerDcDetection</c> (the charging equipment detects 6 mA DC itself),
/// <c>scale</c>, <c>sensitivity</c>, <c>range</c>, <c>rate</c>, <c>channel</c>, <c>sum</c>; a null value means "not stated".
/// Identity keys (docs/report.md) at the top: <c>client</c>, <c>address</c>, <c>reportNumber</c>, <c>operator</c>,
/// <c>instrument</c>, <c>instrumentSerial</c>, <c>clamp</c>, <c>clampSerial</c>, <c>calibrationDue</c> (yyyy-mm-dd),
/// <c>date</c> (when recorded, where the file does not say), <c>productTest</c>; a capture entry may state its own
/// <c>reportNumber</c>, <c>date</c> and <c>productTest</c>.
/// Upstream <c>circuits</c> name captures by their <c>file</c> exactly as written in <c>captures</c>, or circuits by
/// their name; either way every capture of that circuit is behind the device.
/// The reader's parts (Survey/SiteFile/): <see cref="SiteJsonParser"/> walks the bytes into placed values,
/// <see cref="SiteFileInterpreter"/> turns them into the site model, <see cref="SiteSettingsReader"/> and
/// <see cref="SiteIdentityReader"/> read a capture's settings and the identity keys, <see cref="SiteValues"/> reads one
/// value and words its mistakes.
/// </remarks>
public static class SiteConfigReader
{
    /// <summary>Largest site file read, bytes: 4 MiB (engineering choice: some 20 000 capture entries; a larger file
    /// is no site file, and refusing it keeps the reader's memory bounded).</summary>
    public const int MaxFileBytes = 4 << 20;

    /// <summary>Longest text (a value or a key), UTF-8 bytes: 4096, the longest path Linux accepts.</summary>
    public const int MaxTextBytes = 4096;

    /// <summary>A setting (<see cref="Setting.Ref"/>) as a site file names it: <c>the site file's "channel"</c>; null for
    /// a setting the site file has no key for.</summary>
    /// <param name="property">The option property's name (<c>ImportOptions.Channel</c>: <c>Channel</c>).</param>
    public static string? KeyText(string property) => property switch
    {
        nameof(ImportOptions.ScaleA) => "scale",
        nameof(ImportOptions.SensitivityVPerA) => "sensitivity",
        nameof(ImportOptions.RangeV) => "range",
        nameof(ImportOptions.RateHz) => "rate",
        nameof(ImportOptions.Channel) => "channel",
        nameof(ImportOptions.SumChannels) => "sum",
        nameof(ImportOptions.Sensor) => "sensor",
        nameof(AssessmentOptions.RatedResidualCurrentA) => "rated",
        nameof(AssessmentOptions.InstalledType) => "device",
        nameof(AssessmentOptions.Regime) => "regime",
        nameof(AssessmentOptions.EvChargingPoint) => "ev",
        nameof(AssessmentOptions.ChargerDcDetection) => "chargerDcDetection",
        nameof(ImportOptions.VoltageChannels) => "voltage",
        nameof(ImportOptions.VoltageScale) => "voltageScale",
        _ => null,
    } is { } key ? $"the site file's \"{key}\"" : null;

    /// <summary>Reads and checks a site file.</summary>
    /// <param name="path">The site file; capture files are resolved against its folder.</param>
    /// <exception cref="CaptureFormatException">The file is not valid JSON, or a value cannot be used.</exception>
    /// <exception cref="IOException">The file cannot be read.</exception>
    public static SiteConfig Read(string path)
    {
        ArgumentException.ThrowIfNullOrEmpty(path);
        if (Directory.Exists(path))
        {
            throw new CaptureFormatException(path, "is a directory, not a site file");
        }

        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
        if (stream.Length > MaxFileBytes)
        {
            throw TooLarge(path, stream.Length);
        }

        var bytes = new byte[stream.Length];
        stream.ReadExactly(bytes);
        return Parse(path, bytes);
    }

    /// <summary>Parses site-file content already in memory.</summary>
    /// <param name="path">Name of the file for messages; capture files are resolved against its folder.</param>
    /// <param name="utf8">The file's bytes (UTF-8, a byte-order mark is skipped).</param>
    /// <exception cref="CaptureFormatException">The content is not valid JSON, or a value cannot be used.</exception>
    public static SiteConfig Parse(string path, ReadOnlySpan<byte> utf8)
    {
        if (utf8.StartsWith((ReadOnlySpan<byte>)[0xEF, 0xBB, 0xBF]))
        {
            utf8 = utf8[3..];
        }

        if (utf8.Length > MaxFileBytes)
        {
            throw TooLarge(path, utf8.Length);
        }

        SiteJsonParser.RequireUtf8(path, utf8);
        var tree = new SiteJsonParser(path, utf8).ParseDocument();
        return new SiteFileInterpreter(path).Read(tree);
    }

    private static CaptureFormatException TooLarge(string path, long bytes) =>
        new(path, string.Create(CultureInfo.InvariantCulture, $"the site file is {bytes} bytes: at most {MaxFileBytes} bytes (4 MiB) are read"));
}
