using System.Globalization;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using static WaveCheck.Rendering.Report.ReportFormat;

namespace WaveCheck.Rendering.Report;

/// <summary>The report's identity block (who, where, what was recorded with which instrument, the capture's facts)
/// and its sign-off block at the end.</summary>
internal static class IdentitySection
{
    internal static void Header(HtmlWriter html, AnalysisResult analysis, ReportContext context, ReportIdentity identity)
    {
        var capture = analysis.Capture;
        html.Raw("<header>\n<h1>Residual-current assessment</h1>\n<p class=\"doc-no\"><strong>Report number:</strong> ");
        Filled(html, identity.ReportNumber);
        html.Raw(" &nbsp; <strong>Capture digest:</strong> ").Text(identity.CaptureDigest ?? "not computed").Raw("</p>\n");
        html.Raw("<table class=\"identity\"><tbody>\n");
        IdentityRow(html, "Client", identity.Client);
        IdentityRow(html, "Site", identity.Site);
        IdentityRow(html, "Site address", identity.SiteAddress);
        IdentityRow(html, "Circuit", identity.Circuit);
        html.Raw("<tr><th scope=\"row\">Recorded</th><td>");
        if (capture.StartTime is DateTimeOffset start)
        {
            html.Text(Timestamp(start)).Raw(" <span class=\"from\">(from the capture file)</span>");
        }
        else if (identity.StatedRecordedAt is DateTimeOffset stated)
        {
            // A date stated without a time reads as a date, not as midnight UTC.
            var text = stated.TimeOfDay == TimeSpan.Zero && stated.Offset == TimeSpan.Zero
                ? stated.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture)
                : Timestamp(stated);
            html.Text(text).Raw(" <span class=\"from\">(as stated by the user; the file does not say)</span>");
        }
        else
        {
            html.Raw("<span class=\"blank\" aria-label=\"to be filled in\"></span> <span class=\"from\">(the file does not say)</span>");
        }

        html.Raw("</td></tr>\n");
        IdentityRow(html, "Operator", identity.Operator);
        IdentityRow(html, "Instrument", Joined(identity.Instrument, identity.InstrumentSerial));
        IdentityRow(html, "Clamp / sensor", Joined(identity.Clamp, identity.ClampSerial));
        html.Raw("<tr><th scope=\"row\">Calibration due</th><td>");
        if (identity.CalibrationDue is DateOnly due)
        {
            html.Text(due.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture));
            var when = capture.StartTime ?? identity.StatedRecordedAt ?? context.GeneratedAt;
            if (due < DateOnly.FromDateTime(when.Date))
            {
                html.Raw(" <strong>").Text("✘ past due on the day of the recording: the figures rest on an instrument out of calibration").Raw("</strong>");
            }
        }
        else
        {
            html.Raw("<span class=\"blank\" aria-label=\"to be filled in\"></span>");
        }

        html.Raw("</td></tr>\n");
        IdentityRow(html, "Capture file", Path.GetFileName(capture.FilePath));
        IdentityRow(html, "Capture digest", identity.CaptureDigest is { } digest
            ? $"{digest} (first {CaptureDigest.ShortLength} hex digits of the SHA-256 of {string.Join(" + ", identity.DigestFiles)})"
            : null);
        html.Raw("</tbody></table>\n<dl class=\"facts\">\n");
        Fact(html, "Format", $"{capture.Format}: {capture.Encoding}");
        Fact(html, "Residual current", capture.ResidualSource);
        Fact(html, "Calibration", capture.Calibration.Source);
        Fact(html, "Sample rate", Hertz(capture.SampleRateHz) + (capture.MeasuredSampleRateHz is double m ? $" (measured {Hertz(m)})" : string.Empty));
        Fact(html, "Duration", $"{Seconds(capture.DurationS)} ({capture.SampleCount.ToString(CultureInfo.InvariantCulture)} samples{(capture.SampleCountExact ? string.Empty : ", estimated")})");
        Fact(html, "Sensor coupling", CouplingText(capture.SensorCoupling));
        Fact(html, "Mains", $"{Hertz(analysis.Mains.FrequencyHz)} ({analysis.Mains.Source}; {Hertz(analysis.Mains.MinHz)} to {Hertz(analysis.Mains.MaxHz)})");
        Fact(html, "Report made", $"{Timestamp(context.GeneratedAt)}, WaveCheck {context.ToolVersion}");
        html.Raw("</dl>\n");
        if (!string.IsNullOrWhiteSpace(context.Note))
        {
            html.Raw("<p><strong>Note:</strong> ").Text(context.Note).Raw("</p>\n");
        }

        html.Raw("</header>\n");
    }

    /// <summary>Name and serial number together; null when neither is given.</summary>
    internal static string? Joined(string? name, string? serial) => (name, serial) switch
    {
        (null, null) => null,
        (_, null) => $"{name}, serial number not given",
        (null, _) => $"serial {serial} (model not given)",
        _ => $"{name}, serial {serial}",
    };

    /// <summary>A row of the identity block; a missing value is a blank line to fill by hand.</summary>
    internal static void IdentityRow(HtmlWriter html, string name, string? value)
    {
        html.Raw("<tr><th scope=\"row\">").Text(name).Raw("</th><td>");
        Filled(html, value);
        html.Raw("</td></tr>\n");
    }

    internal static void Filled(HtmlWriter html, string? value)
    {
        if (string.IsNullOrWhiteSpace(value))
        {
            html.Raw("<span class=\"blank\" aria-label=\"to be filled in\"></span>");
        }
        else
        {
            html.Text(value);
        }
    }

    /// <summary>Who tested and who approved: names, signatures and dates to fill in by hand (the operator's name
    /// printed when given).</summary>
    internal static void SignOff(HtmlWriter html, ReportIdentity identity)
    {
        html.Raw("<section id=\"signoff\" class=\"signoff-block\">\n<h2>Sign-off</h2>\n<p>")
            .Text("The undersigned confirm that the capture named above was recorded on the circuit named above and that this report was reviewed.")
            .Raw("</p>\n<table class=\"signoff\">\n<thead><tr><th></th><th>Name</th><th>Signature</th><th>Date</th></tr></thead>\n<tbody>\n");
        html.Raw("<tr><th scope=\"row\">Tested by</th><td>").Text(identity.Operator ?? string.Empty).Raw("</td><td></td><td></td></tr>\n");
        html.Raw("<tr><th scope=\"row\">Approved by</th><td></td><td></td><td></td></tr>\n");
        html.Raw("</tbody>\n</table>\n</section>\n");
    }
}
