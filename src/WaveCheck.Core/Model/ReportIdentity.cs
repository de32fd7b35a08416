namespace WaveCheck.Core.Model;

/// <summary>
/// Who, where, with what and under which number a capture was taken and reported: what a signed report states besides
/// the measurement. Every field a person gives is optional (null: not given, printed as a blank field to fill); the
/// content digest is computed from the capture file. Serialised as the analysis JSON's <c>identity</c> object.
/// </summary>
public sealed record ReportIdentity
{
    /// <summary>An identity with nothing stated.</summary>
    public static ReportIdentity Empty { get; } = new();

    /// <summary>Report number, as the user's firm numbers its reports.</summary>
    public string? ReportNumber { get; init; }

    /// <summary>For whom the test was made (the client).</summary>
    public string? Client { get; init; }

    /// <summary>Name of the site, e.g. "Unit 4, Fernbrook estate".</summary>
    public string? Site { get; init; }

    /// <summary>Postal address of the site.</summary>
    public string? SiteAddress { get; init; }

    /// <summary>The circuit measured, e.g. "C2 extractor fan".</summary>
    public string? Circuit { get; init; }

    /// <summary>Who made the recording.</summary>
    public string? Operator { get; init; }

    /// <summary>Recorder or meter used (make and model as the user writes them).</summary>
    public string? Instrument { get; init; }

    /// <summary>Serial number of the recorder.</summary>
    public string? InstrumentSerial { get; init; }

    /// <summary>Current clamp or sensor used.</summary>
    public string? Clamp { get; init; }

    /// <summary>Serial number of the clamp.</summary>
    public string? ClampSerial { get; init; }

    /// <summary>Date by which the instrument's (or clamp's) calibration is due, as on its certificate.</summary>
    public DateOnly? CalibrationDue { get; init; }

    /// <summary>When the capture was recorded as the user states it; used only where the file states no start time.</summary>
    public DateTimeOffset? StatedRecordedAt { get; init; }

    /// <summary>Whether this is a product (equipment) test: only then are touch-current limits of the product standards
    /// compared with the readings in the report.</summary>
    public bool ProductTest { get; init; }

    /// <summary>The capture's content digest: the first <see cref="Capture.CaptureDigest.ShortLength"/> hex digits of its
    /// SHA-256; null when not computed.</summary>
    public string? CaptureDigest { get; init; }

    /// <summary>The full SHA-256 (64 lower-case hex digits) the short digest is taken from; null when not computed.</summary>
    public string? CaptureSha256 { get; init; }

    /// <summary>File names hashed, in order (a COMTRADE .cfg and its .dat; one file otherwise).</summary>
    public IReadOnlyList<string> DigestFiles { get; init; } = [];

    /// <summary>This identity with each null field taken from <paramref name="fallback"/> (this one's values win).</summary>
    public ReportIdentity Over(ReportIdentity fallback)
    {
        ArgumentNullException.ThrowIfNull(fallback);
        return new ReportIdentity
        {
            ReportNumber = ReportNumber ?? fallback.ReportNumber,
            Client = Client ?? fallback.Client,
            Site = Site ?? fallback.Site,
            SiteAddress = SiteAddress ?? fallback.SiteAddress,
            Circuit = Circuit ?? fallback.Circuit,
            Operator = Operator ?? fallback.Operator,
            Instrument = Instrument ?? fallback.Instrument,
            InstrumentSerial = InstrumentSerial ?? fallback.InstrumentSerial,
            Clamp = Clamp ?? fallback.Clamp,
            ClampSerial = ClampSerial ?? fallback.ClampSerial,
            CalibrationDue = CalibrationDue ?? fallback.CalibrationDue,
            StatedRecordedAt = StatedRecordedAt ?? fallback.StatedRecordedAt,
            ProductTest = ProductTest || fallback.ProductTest,
            CaptureDigest = CaptureDigest ?? fallback.CaptureDigest,
            CaptureSha256 = CaptureSha256 ?? fallback.CaptureSha256,
            DigestFiles = DigestFiles.Count > 0 ? DigestFiles : fallback.DigestFiles,
        };
    }
}
