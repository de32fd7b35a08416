using System.Globalization;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Report;

/// <summary>
/// Writes the HTML report: one self-contained file (inline CSS and SVG plots, no scripts, no network resources) that
/// opens offline and prints to A4 or Letter. Reads only the result model; every user-supplied or file-derived string is
/// HTML-escaped. Stateless; safe to use from several threads.
/// </summary>
public static class ReportWriter
{
    /// <summary>Standards the analysis and assessment rest on, as named in the methods section.</summary>
    public static readonly IReadOnlyList<(string Standard, string Use)> Standards =
    [
        ("IEC 61000-4-7", "harmonic and interharmonic groups, synchronised 10/12-cycle windows"),
        ("IEC 60990", "touch current measured through weighted networks"),
        ("IEC 61008-1", "RCCBs: types AC and A, non-operating current 0.5 IΔn, smooth DC tolerance of type A"),
        ("IEC 61009-1", "RCBOs: types AC and A, as IEC 61008-1"),
        ("IEC 62423", "types F and B: composite current to 1 kHz, smooth DC, tripping at other frequencies"),
        ("IEC 62955", "RDC-DD: 6 mA smooth DC detection for EV charging"),
        ("IEC 60364-5-53", "selection of the RCD type by the residual current the equipment can produce"),
        ("IEC 60364-7-722", "EV charging points: type A with RDC-DD, or type B"),
        ("UL 943", "GFCI (North America): Class A trip levels and inverse-time trip curve"),
        ("DIN VDE 0664-400", "national designation B+: type B with tripping defined up to 20 kHz"),
    ];

    /// <summary>Cautions stated with every report, whatever the assessment adds.</summary>
    public static IReadOnlyList<string> StandingCautions => Core.Assessment.StandingCautions.All;

    /// <summary>Most event rows listed.</summary>
    public const int MaxEventRows = 200;

    /// <summary>Writes the report to <paramref name="path"/>, whole or not at all.</summary>
    /// <param name="path">Target <c>.html</c> file; its folder is created if missing.</param>
    /// <param name="analysis">The analysis.</param>
    /// <param name="assessment">The verdict; null writes an analysis-only report.</param>
    /// <param name="context">Site, circuit, note, time and version.</param>
    public static void Write(string path, AnalysisResult analysis, AssessmentResult? assessment, ReportContext context) =>
        AtomicFile.WriteText(path, Render(analysis, assessment, context));

    /// <summary>The report as HTML text.</summary>
    /// <param name="analysis">The analysis.</param>
    /// <param name="assessment">The verdict; null renders an analysis-only report.</param>
    /// <param name="context">Site, circuit, note, time and version.</param>
    public static string Render(AnalysisResult analysis, AssessmentResult? assessment, ReportContext context)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        ArgumentNullException.ThrowIfNull(context);
        var html = new HtmlWriter();
        var fileName = Path.GetFileName(analysis.Capture.FilePath);
        var identity = context.EffectiveIdentity;
        html.Raw("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        html.Raw("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        html.Raw("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; img-src data:\">\n");
        html.Raw("<title>").Text($"Residual-current report: {fileName}").Raw("</title>\n<style>\n").Raw(ReportStyle.Css(context.Paper, RunningHeader(identity))).Raw("\n</style>\n</head>\n<body>\n");

        Header(html, analysis, context, identity);
        if (assessment is null)
        {
            html.Raw("<section id=\"verdict\"><div class=\"verdict\"><p class=\"outcome cannot-tell\">? Cannot tell: not assessed</p><p class=\"required\">No device assessment</p>");
            html.Raw("<p class=\"headline\">This report shows the analysis only; no RCD type was assessed.</p></div></section>\n");
        }
        else
        {
            Verdict(html, assessment);
            ClassTable(html, assessment);
            TypeTable(html, assessment);
            DeviceMargins(html, analysis, assessment, identity.ProductTest);
            TripReplaySection.Write(html, assessment);
        }

        Plots(html, analysis, assessment);
        LeakageSection.Write(html, analysis);
        Figures(html, analysis);
        Limitations(html, analysis);
        Cautions(html, assessment);
        SignOff(html, identity);
        Methods(html, analysis, context);
        if (assessment is not null)
        {
            Thresholds(html, assessment);
        }

        html.Raw("<footer>").Text($"Made by WaveCheck {context.ToolVersion} on {Timestamp(context.GeneratedAt)}. ")
            .Text("A tool's reading of a recording: it supports a qualified person's decision and does not replace it.").Raw("</footer>\n");
        html.Raw("</body>\n</html>\n");
        return html.ToString();
    }

    /// <summary>Words and a symbol for a type's verdict, never colour alone.</summary>
    public static string SuitabilityText(bool? suitable) => suitable switch
    {
        true => "✔ suitable",
        false => "✘ not suitable",
        null => "? cannot be determined",
    };

    /// <summary>The verdict box's outcome at a glance: its CSS class and its words with a symbol (never colour alone).</summary>
    internal static (string CssClass, string Text) Outcome(AssessmentResult a) => (a.InstalledType, a.InstalledAdequate) switch
    {
        (not null, true) => ("adequate", "✔ Adequate: the installed device suits this circuit"),
        (not null, false) => ("not-adequate", "✘ Not adequate: the installed device does not suit this circuit"),
        (not null, null) => ("cannot-tell", "? Cannot tell whether the installed device suits this circuit"),
        _ => ("cannot-tell", "? Cannot tell: no installed device was stated (--device)"),
    };

    /// <summary>Words and a symbol for the installed device's adequacy.</summary>
    public static string AdequacyText(bool? adequate) => adequate switch
    {
        true => "✔ adequate",
        false => "✘ not adequate",
        null => "? cannot be determined",
    };

    /// <summary>The line at the top of every printed page: site, circuit, report number.</summary>
    internal static string RunningHeader(ReportIdentity identity) =>
        $"{identity.Site ?? "site not given"} · {identity.Circuit ?? "circuit not given"} · report {identity.ReportNumber ?? "no number given"}";

    private static void Header(HtmlWriter html, AnalysisResult analysis, ReportContext context, ReportIdentity identity)
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
    private static string? Joined(string? name, string? serial) => (name, serial) switch
    {
        (null, null) => null,
        (_, null) => $"{name}, serial number not given",
        (null, _) => $"serial {serial} (model not given)",
        _ => $"{name}, serial {serial}",
    };

    /// <summary>A row of the identity block; a missing value is a blank line to fill by hand.</summary>
    private static void IdentityRow(HtmlWriter html, string name, string? value)
    {
        html.Raw("<tr><th scope=\"row\">").Text(name).Raw("</th><td>");
        Filled(html, value);
        html.Raw("</td></tr>\n");
    }

    private static void Filled(HtmlWriter html, string? value)
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
    private static void SignOff(HtmlWriter html, ReportIdentity identity)
    {
        html.Raw("<section id=\"signoff\" class=\"signoff-block\">\n<h2>Sign-off</h2>\n<p>")
            .Text("The undersigned confirm that the capture named above was recorded on the circuit named above and that this report was reviewed.")
            .Raw("</p>\n<table class=\"signoff\">\n<thead><tr><th></th><th>Name</th><th>Signature</th><th>Date</th></tr></thead>\n<tbody>\n");
        html.Raw("<tr><th scope=\"row\">Tested by</th><td>").Text(identity.Operator ?? string.Empty).Raw("</td><td></td><td></td></tr>\n");
        html.Raw("<tr><th scope=\"row\">Approved by</th><td></td><td></td><td></td></tr>\n");
        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    private static void Verdict(HtmlWriter html, AssessmentResult a)
    {
        html.Raw("<section id=\"verdict\">\n<h2>Verdict</h2>\n<div class=\"verdict\">\n");
        var (outcomeClass, outcomeText) = Outcome(a);
        html.Raw("<p class=\"outcome ").Raw(outcomeClass).Raw("\">").Text(outcomeText).Raw("</p>\n<p class=\"required\">");
        if (a.RequiredType is { } required)
        {
            html.Text($"Required RCD type: {required.ToTradeName()}");
        }
        else
        {
            html.Text($"Required RCD type: cannot be determined from this capture (at least type {a.MinimumType.ToTradeName()})");
        }

        html.Raw("</p>\n<p class=\"headline\">").Text(a.Headline).Raw("</p>\n");
        if (a.AcceptedProtection is { } accepted && accepted != $"type {a.RequiredType?.ToTradeName()}")
        {
            html.Raw("<p>").Text($"Accepted protection: {accepted}.").Raw("</p>\n");
        }
        if (a.InstalledType is { } installed)
        {
            html.Raw("<p><strong>").Text($"Installed {a.InstalledProtection?.ToTradeName() ?? "type " + installed.ToTradeName()}: {AdequacyText(a.InstalledAdequate)}").Raw("</strong></p>\n");
        }

        html.Raw("<p class=\"muted\">").Text($"Rated residual operating current assessed: IΔn = {CurrentText.WithUnit(a.RatedResidualCurrentA)}; rules: {RegimeText(a.Regime)}.").Raw("</p>\n");
        html.Raw("</div>\n");
        if (a.TripReplay is { Alerts.Count: > 0 } replay)
        {
            // Beside the verdict, not only in the replay's section: an adequate type does not make a silent device safe.
            html.Raw("<div class=\"alert\">").Text($"Test the device: {replay.Alerts.Count} recorded event(s) reached a current and duration at which a compliant device of this rating must trip (see the trip replay below). If the installed device did not trip, test it with an RCD tester before relying on it.").Raw("</div>\n");
        }

        if (a.Blinding.Blinded == true)
        {
            html.Raw("<div class=\"alert\">").Text($"Blinding: the smooth DC of {CurrentText.WithUnit(a.Blinding.SmoothDcA)} exceeds what a type {a.Blinding.DeviceType.ToTradeName()} device is specified to work with ({Current(a.Blinding.ToleranceA)}). It may fail to trip on a real earth fault.").Raw("</div>\n");
        }

        html.Raw("</section>\n");
    }

    /// <summary>The classes of residual current the verdict rests on: figure, threshold, presence, least type.</summary>
    private static void ClassTable(HtmlWriter html, AssessmentResult a)
    {
        if (a.Classes.Count == 0)
        {
            return;
        }

        html.Raw("<section id=\"classes\">\n<h2>Classes of residual current</h2>\n<p>").Text(
            $"The required type is the least type that detects every class present. Each figure is compared with its threshold allowing for the measurement uncertainty ({a.Accuracy}); a figure within it counts as present (the safe side).")
            .Raw("</p>\n<table class=\"wide\">\n<thead><tr><th>Class</th><th>Found</th><th class=\"num\">Figure</th><th class=\"num\">Threshold</th><th>Least type</th><th>Evidence</th></tr></thead>\n<tbody>\n");
        foreach (var c in a.Classes)
        {
            html.Raw("<tr><td>").Text(c.Name).Raw("</td><td>").Text(VerdictText.Of(c.Presence)).Raw("</td><td class=\"num\">")
                .Text(c.FigureA is { } f ? CurrentText.WithUnit(f) : "rule").Raw("</td><td class=\"num\">")
                .Text(c.ThresholdA is { } t ? CurrentText.WithUnit(t) : "–").Raw("</td><td>")
                .Text(c.CoveredByDcDetection ? $"{c.LeastType.ToTradeName()} (or A + 6 mA DC detection)" : c.LeastType.ToTradeName()).Raw("</td><td>")
                .Text(c.Text).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    private static void TypeTable(HtmlWriter html, AssessmentResult a)
    {
        html.Raw("<section id=\"types\">\n<h2>Each device type</h2>\n<table class=\"wide\">\n<thead><tr><th>Type</th><th>Verdict</th><th>Evidence</th></tr></thead>\n<tbody>\n");
        foreach (var type in a.Types)
        {
            html.Raw("<tr><td><strong>").Text(type.Type.ToTradeName()).Raw("</strong></td><td class=\"verdict-cell\">").Text(SuitabilityText(type.Suitable)).Raw("</td><td>");
            List(html, type.Reasons, "reasons");
            html.Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    private static void DeviceMargins(HtmlWriter html, AnalysisResult analysis, AssessmentResult a, bool productTest)
    {
        var trip = a.NuisanceTrip;
        html.Raw("<section id=\"device\">\n<h2>").Text($"Margins for a type {trip.DeviceType.ToTradeName()} device, IΔn {CurrentText.WithUnit(a.RatedResidualCurrentA)}").Raw("</h2>\n");
        html.Raw("<h3>Nuisance tripping</h3>\n<table><tbody>\n");
        Row(html, "Risk", RiskText(trip.Risk));
        Row(html, "Standing residual current (each frequency range's worst window, combined; unweighted)", CurrentText.WithUnit(trip.StandingA));
        Row(html, "As a typical device responds (frequency-weighted, second figure)", CurrentText.WithUnit(trip.TypicalStandingA));
        Row(html, $"Non-operating limit {a.NonOperatingLimitText()}", CurrentText.WithUnit(trip.NonOperatingLimitA));
        Row(html, "Margin to the limit", $"{CurrentText.WithUnit(trip.MarginA)} ({Percent(trip.MarginPercent)} of the limit){(trip.MarginA < 0 ? " — above the limit" : string.Empty)}");
        Row(html, $"Leakage budget {a.LeakageBudgetText()}", $"{CurrentText.WithUnit(trip.LeakageBudgetA)}: {(trip.WithinLeakageBudget ? "✔ within" : "✘ exceeded")}");
        html.Raw("</tbody></table>\n<p>").Text(trip.Explanation).Raw("</p>\n");
        if (trip.Contributions.Count > 0)
        {
            html.Raw("<table>\n<thead><tr><th>Frequency range</th><th class=\"num\">From</th><th class=\"num\">To</th><th class=\"num\">RMS</th><th class=\"num\">Trip factor</th><th class=\"num\">Weighted RMS</th></tr></thead>\n<tbody>\n");
            foreach (var c in trip.Contributions)
            {
                html.Raw("<tr><td>").Text(c.Label).Raw("</td>");
                Num(html, Hertz(c.LowHz));
                Num(html, Hertz(c.HighHz));
                Num(html, CurrentText.WithUnit(c.RmsA));
                Num(html, double.IsPositiveInfinity(c.TripFactor) ? "does not respond" : Number(c.TripFactor, "0.##"));
                Num(html, CurrentText.WithUnit(c.WeightedRmsA));
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        var blinding = a.Blinding;
        html.Raw("<h3>Smooth-DC blinding</h3>\n<table><tbody>\n");
        Row(html, "Smooth DC (worst window)", CurrentText.WithUnit(blinding.SmoothDcA));
        Row(html, $"Type {blinding.DeviceType.ToTradeName()} tolerance", blinding.ToleranceA is double t ? CurrentText.WithUnit(t) : "none specified");
        Row(html, "Blinded", blinding.Blinded switch { true => "✘ yes: may not trip on a fault", false => "✔ no", null => "? cannot be determined with this sensor" });
        html.Raw("</tbody></table>\n<p>").Text(blinding.Explanation).Raw("</p>\n");

        var ev = a.EvCharging;
        html.Raw("<h3>EV charging points</h3>\n<table><tbody>\n");
        Row(html, "Smooth DC (worst window)", CurrentText.WithUnit(ev.SmoothDcA));
        Row(html, "RDC-DD threshold (IEC 62955)", CurrentText.WithUnit(ev.RdcDdThresholdA));
        Row(html, "DC above the threshold", ev.DcAboveRdcDdThreshold switch { true => "✘ yes", false => "✔ no", null => "? cannot be determined" });
        Row(html, "Recommendation", ev.Recommendation);
        html.Raw("</tbody></table>\n");

        if (a.Gfci is { } gfci)
        {
            html.Raw("<h3>GFCI (UL 943)</h3>\n<table><tbody>\n");
            Row(html, $"Standing residual current ({FigureLabels.WorstWindowRms})", CurrentText.WithUnit(gfci.StandingRmsA));
            Row(html, "Class A (6 mA) trips on the standing current alone", TripsText(gfci.ClassATripsAlone));
            Row(html, "Class A trip time at that level", gfci.ClassATripTimeS is double ta ? Seconds(ta) : "not applicable (below 6 mA)");
            Row(html, "Special-purpose (20 mA) trips on it alone", TripsText(gfci.SpecialPurposeTripsAlone));
            Row(html, "Special-purpose trip time", gfci.SpecialPurposeTripTimeS is double ts ? Seconds(ts) : "not applicable (below 20 mA)");
            html.Raw("</tbody></table>\n");
            List(html, gfci.Notes, null);
        }

        if (!productTest)
        {
            if (a.TouchCurrent is not null || analysis.TouchCurrent is not null)
            {
                html.Raw("<p class=\"muted\">").Text("Touch-current readings (IEC 60990) are in the analysis JSON; their limits belong to product (equipment) tests and are compared only when one is asked for (--product-test, or \"productTest\": true in the site file).").Raw("</p>\n");
            }
        }
        else if (a.TouchCurrent is { } touch)
        {
            html.Raw("<h3>Touch current (IEC 60990)</h3>\n");
            TouchReadings(html, touch.Readings);
            if (touch.Comparisons.Count > 0)
            {
                html.Raw("<table class=\"wide\">\n<thead><tr><th>Limit</th><th>Reading</th><th class=\"num\">Reading value</th><th class=\"num\">Limit value</th><th>Within</th><th>Source</th></tr></thead>\n<tbody>\n");
                foreach (var c in touch.Comparisons)
                {
                    html.Raw("<tr><td>").Text(c.Limit).Raw("</td><td>").Text(c.Reading).Raw("</td>");
                    Num(html, CurrentText.WithUnit(c.ValueA));
                    Num(html, CurrentText.WithUnit(c.LimitA));
                    html.Raw("<td class=\"verdict-cell\">").Text(c.Within ? "✔ within" : "✘ above").Raw("</td><td>").Text(FigureLabels.ForClient(c.Source)).Raw("</td></tr>\n");
                }

                html.Raw("</tbody>\n</table>\n");
            }
        }
        else if (analysis.TouchCurrent is { } readings)
        {
            html.Raw("<h3>Touch current (IEC 60990)</h3>\n");
            TouchReadings(html, readings);
        }

        html.Raw("</section>\n");
    }

    private static void TouchReadings(HtmlWriter html, TouchCurrentResult r)
    {
        html.Raw("<table>\n<thead><tr><th>Network</th><th class=\"num\">Peak</th><th class=\"num\">RMS</th></tr></thead>\n<tbody>\n");
        TouchRow(html, "unweighted", r.UnweightedPeakA, r.UnweightedRmsA);
        TouchRow(html, "perception/reaction", r.PerceptionPeakA, r.PerceptionRmsA);
        TouchRow(html, "let-go", r.LetGoPeakA, r.LetGoRmsA);
        html.Raw("<tr><td>DC (mean, unweighted)</td>");
        Num(html, CurrentText.WithUnit(r.DcA));
        Num(html, string.Empty);
        html.Raw("</tr>\n</tbody>\n</table>\n");
    }

    private static void TouchRow(HtmlWriter html, string network, double peakA, double rmsA)
    {
        html.Raw("<tr><td>").Text(network).Raw("</td>");
        Num(html, CurrentText.WithUnit(peakA));
        Num(html, CurrentText.WithUnit(rmsA));
        html.Raw("</tr>\n");
    }

    private static void Plots(HtmlWriter html, AnalysisResult analysis, AssessmentResult? assessment)
    {
        html.Raw("<section id=\"plots\">\n<h2>Plots</h2>\n");
        var index = 0;
        foreach (var kind in PlotRenderer.Applicable(analysis))
        {
            var (title, caption) = PlotCaption(kind, assessment);
            var svg = PlotRenderer.RenderSvg(kind, analysis, assessment);
            html.Raw("<figure id=\"plot-").Raw(kind.ToString().ToLowerInvariant()).Raw("\">\n");
            html.Raw(InlineSvg.Prepare(svg, $"p{index}-", title));
            html.Raw("\n<figcaption>").Text(caption).Raw("</figcaption>\n</figure>\n");
            index++;
        }

        html.Raw("</section>\n");
    }

    private static (string Title, string Caption) PlotCaption(PlotKind kind, AssessmentResult? assessment)
    {
        var lines = assessment is null ? string.Empty : $" Dashed and dotted lines: {assessment.NonOperatingLimitText()} (non-operating limit) and {assessment.LeakageBudgetText()} (leakage budget).";
        return kind switch
        {
            PlotKind.Overview => ("Residual current over the whole capture",
                "The band spans the smallest and largest sample in each time bucket, so no peak is lost. Black dashed: the DC level." + lines + " Vertical lines: events."),
            PlotKind.Cycles => ("Mains cycles of the worst window",
                "Consecutive mains cycles of the window with the highest RMS drawn over one period. 0° is the start of the excerpt, not a voltage zero crossing."),
            PlotKind.Spectrum => ("Spectrum",
                "RMS per frequency bin on logarithmic axes; DC is stated above the plot. Shading shows which device types are specified for each frequency range; content in the unshaded part lies outside every type's range."),
            PlotKind.Trend => ("Trend", "One point per window (decimated, worst value kept, for long captures)." + lines),
            _ => (kind.ToString(), string.Empty),
        };
    }

    private static void Figures(HtmlWriter html, AnalysisResult analysis)
    {
        var s = analysis.Summary;
        var c = analysis.Components;
        html.Raw("<section id=\"figures\">\n<h2>Measured figures</h2>\n<h3>Whole capture</h3>\n<table><tbody>\n");
        Row(html, Capitalised(FigureLabels.WholeCaptureRms), CurrentText.WithUnit(s.RmsA));
        if (analysis.Windows.Statistics.TryGetValue("rmsA", out var rmsStats))
        {
            Row(html, Capitalised(FigureLabels.WorstWindowRms), $"{CurrentText.WithUnit(rmsStats.Max)} (at {Seconds(rmsStats.TimeOfMaxS)})");
            Row(html, $"RMS, {FigureLabels.Percentile95}", CurrentText.WithUnit(rmsStats.P95));
        }

        Row(html, "DC (mean)", CurrentText.WithUnit(s.DcA));
        Row(html, "AC RMS (mean removed)", CurrentText.WithUnit(s.AcRmsA));
        Row(html, "Peak (largest absolute sample)", CurrentText.WithUnit(s.PeakA));
        Row(html, "Highest / lowest sample", $"{CurrentText.WithUnit(s.PeakPositiveA)} / {CurrentText.WithUnit(s.PeakNegativeA)}");
        Row(html, "Crest factor", double.IsFinite(s.CrestFactor) ? Number(s.CrestFactor, "0.00") : "not defined (no current)");
        html.Raw("</tbody></table>\n<h3>Components</h3>\n<table><tbody>\n");
        Row(html, "Smooth DC (whole capture / worst window)", $"{CurrentText.WithUnit(c.SmoothDcA)} / {CurrentText.WithUnit(c.SmoothDcMaxA)}");
        Row(html, "Pulsating DC", $"{(c.PulsatingDc ? "yes" : "no")} ({Percent(c.PulsatingDcShare * 100)} of windows)");
        Row(html, "Current-delay angle", c.CurrentDelayAngleDeg is double alpha ? Number(alpha, "0") + "°" : "not a phase-controlled half-wave");
        Row(html, "Mains frequency (harmonic group 1)", CurrentText.WithUnit(c.MainsRmsA));
        Row(html, "Below mains frequency", CurrentText.WithUnit(c.BelowMainsRmsA));
        Row(html, "Harmonics 2 to 50", CurrentText.WithUnit(c.HarmonicsRmsA));
        Row(html, "Above 1 kHz", CurrentText.WithUnit(c.Above1kHzRmsA));
        Row(html, "Above 9 kHz", CurrentText.WithUnit(c.Above9kHzRmsA));
        Row(html, "THD", c.ThdPercent is double thd ? Percent(thd) : "no fundamental");
        html.Raw("</tbody></table>\n");
        if (c.Tones.Count > 0)
        {
            html.Raw("<h3>Strongest tones that are not mains harmonics</h3>\n<table>\n<thead><tr><th class=\"num\">Frequency</th><th class=\"num\">RMS</th></tr></thead>\n<tbody>\n");
            foreach (var tone in c.Tones)
            {
                html.Raw("<tr>");
                Num(html, Hertz(tone.FrequencyHz));
                Num(html, CurrentText.WithUnit(tone.RmsA));
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        Harmonics(html, analysis);
        Bands(html, analysis);
        Events(html, analysis.Events);
        Statistics(html, analysis.Windows);
        html.Raw("</section>\n");
    }

    private static void Harmonics(HtmlWriter html, AnalysisResult analysis)
    {
        var level = TableSignificance.LevelA(analysis);
        var shown = analysis.Harmonics.Where(h => h.Order is >= 1 and <= 50 && TableSignificance.Significant(h.RmsA, level)).ToList();
        var fundamental = analysis.Harmonics.FirstOrDefault(h => h.Order == 1)?.RmsA ?? 0;
        html.Raw("<h3>Harmonic groups (IEC 61000-4-7)</h3>\n");
        if (shown.Count == 0)
        {
            html.Raw("<p>").Text($"No harmonic group at or above {CurrentText.WithUnit(level)}.").Raw("</p>\n");
        }
        else
        {
            html.Raw("<table>\n<thead><tr><th class=\"num\">Order</th><th class=\"num\">Frequency</th><th class=\"num\">Whole-capture RMS</th><th class=\"num\">Worst window</th><th class=\"num\">Of fundamental</th></tr></thead>\n<tbody>\n");
            foreach (var h in shown)
            {
                html.Raw("<tr>");
                Num(html, h.Order.ToString(CultureInfo.InvariantCulture));
                Num(html, Hertz(h.FrequencyHz));
                Num(html, CurrentText.WithUnit(h.RmsA));
                Num(html, CurrentText.WithUnit(h.MaxA));
                Num(html, fundamental > 0 ? Percent(100 * h.RmsA / fundamental) : "–");
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        html.Raw("<p class=\"muted\">").Text(FloorNote(analysis.Harmonics.Count - shown.Count, "harmonic groups", level)).Raw("</p>\n");
    }

    private static void Bands(HtmlWriter html, AnalysisResult analysis)
    {
        var bands = analysis.Bands;
        var level = TableSignificance.LevelA(analysis);
        var shown = bands.Where(b => TableSignificance.Significant(b.RmsA, level)).ToList();
        html.Raw("<h3>Frequency bands above 2 kHz</h3>\n");
        if (shown.Count == 0)
        {
            html.Raw("<p>").Text($"No band at or above {CurrentText.WithUnit(level)}.").Raw("</p>\n");
        }
        else
        {
            html.Raw("<table>\n<thead><tr><th class=\"num\">From</th><th class=\"num\">To</th><th class=\"num\">Whole-capture RMS</th><th class=\"num\">Worst window</th></tr></thead>\n<tbody>\n");
            foreach (var b in shown)
            {
                html.Raw("<tr>");
                Num(html, Hertz(b.LowHz));
                Num(html, Hertz(b.HighHz));
                Num(html, CurrentText.WithUnit(b.RmsA));
                Num(html, CurrentText.WithUnit(b.MaxA));
                html.Raw("</tr>\n");
            }

            html.Raw("</tbody>\n</table>\n");
        }

        html.Raw("<p class=\"muted\">").Text(FloorNote(bands.Count - shown.Count, "bands", level)).Raw("</p>\n");
    }

    private static void Events(HtmlWriter html, IReadOnlyList<EventRecord> events)
    {
        html.Raw("<h3>Events</h3>\n");
        if (events.Count == 0)
        {
            html.Raw("<p>No alarms or transients.</p>\n");
            return;
        }

        html.Raw("<table class=\"wide\">\n<thead><tr><th>Kind</th><th class=\"num\">Start</th><th class=\"num\">Duration</th><th class=\"num\">Value</th><th>Description</th></tr></thead>\n<tbody>\n");
        foreach (var e in events.Take(MaxEventRows))
        {
            html.Raw("<tr><td>").Text(e.Kind).Raw("</td>");
            Num(html, Seconds(e.StartS));
            Num(html, Seconds(e.DurationS));
            Num(html, CurrentText.WithUnit(e.ValueA));
            html.Raw("<td>").Text(e.Message).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n");
        if (events.Count > MaxEventRows)
        {
            html.Raw("<p class=\"muted\">").Text($"First {MaxEventRows} of {events.Count} events listed; the analysis JSON holds them all.").Raw("</p>\n");
        }
    }

    private static void Statistics(HtmlWriter html, WindowsResult windows)
    {
        html.Raw("<h3>Statistics over windows</h3>\n<p>")
            .Text($"{windows.Count} windows of {windows.CyclesPerWindow} mains cycles ({Seconds(windows.LengthS)}); largest synchronisation error {Percent(windows.MaxSyncErrorPercent)}.")
            .Raw("</p>\n");
        if (windows.Statistics.Count == 0)
        {
            return;
        }

        html.Raw("<table>\n<thead><tr><th>Figure per window</th><th class=\"num\">Mean of windows</th><th class=\"num\">95th percentile</th><th class=\"num\">Worst window</th><th class=\"num\">At</th></tr></thead>\n<tbody>\n");
        foreach (var (name, stat) in windows.Statistics.OrderBy(p => FigureLabels.MetricRank(p.Key)).ThenBy(p => p.Key, StringComparer.Ordinal))
        {
            if (!double.IsFinite(stat.Mean) && !double.IsFinite(stat.Max))
            {
                continue; // a figure no window had (no delay angle, no THD): nothing to list
            }

            html.Raw("<tr><td>").Text(FigureLabels.Metric(name)).Raw("</td>");
            Num(html, MetricValue(name, stat.Mean));
            Num(html, MetricValue(name, stat.P95));
            Num(html, MetricValue(name, stat.Max));
            Num(html, Seconds(stat.TimeOfMaxS));
            html.Raw("</tr>\n");
        }

        html.Raw("</tbody>\n</table>\n");
    }

    private static void Limitations(HtmlWriter html, AnalysisResult analysis)
    {
        var capture = analysis.Capture;
        html.Raw("<section id=\"limits\">\n<h2>What this capture could not show</h2>\n<ul>\n");
        html.Raw("<li>").Text($"Nothing above {Hertz(capture.NyquistHz)} (half the sample rate) is seen.").Raw("</li>\n");
        if (capture.SensorCoupling == SensorCoupling.Ac)
        {
            html.Raw("<li><strong>").Text("The sensor is AC-coupled: smooth DC is invisible to it, so the DC figures and anything decided by them are incomplete. Measure again with a DC-coupled sensor (fluxgate or Hall-effect).").Raw("</strong></li>\n");
        }
        else if (capture.SensorCoupling == SensorCoupling.Unknown)
        {
            html.Raw("<li>").Text("The sensor coupling was not stated: if the sensor is a plain current transformer, smooth DC was not recorded.").Raw("</li>\n");
        }

        if (capture.FullScaleA is double fullScale)
        {
            html.Raw("<li>").Text($"The recorder clips at {CurrentText.WithUnit(fullScale)}.").Raw("</li>\n");
        }

        var clipped = analysis.Trend.Count(w => w.Clipped);
        if (clipped > 0)
        {
            html.Raw("<li><strong>").Text($"{clipped} of the {analysis.Trend.Count} windows in the trend contain clipped samples: peaks and RMS there are too low, and the spectrum holds products of the clipping.").Raw("</strong></li>\n");
        }

        foreach (var warning in analysis.Warnings)
        {
            html.Raw("<li>").Text(warning.Message);
            if (warning.TimeS is double t)
            {
                html.Text($" (at {Seconds(t)})");
            }

            html.Raw("</li>\n");
        }

        html.Raw("</ul>\n</section>\n");
    }

    private static void Cautions(HtmlWriter html, AssessmentResult? assessment)
    {
        html.Raw("<section id=\"cautions\">\n<h2>Cautions</h2>\n");
        // An assessment carries the standing cautions in its own words (verify on site, local codes, maker's data,
        // licensed people) plus the capture's limitations; printing both lists said each thing twice.
        var all = assessment is { Cautions.Count: > 0 } ? assessment.Cautions : StandingCautions;
        List(html, all, null);
        html.Raw("</section>\n");
    }

    private static void Methods(HtmlWriter html, AnalysisResult analysis, ReportContext context)
    {
        html.Raw("<section id=\"methods\">\n<h2>Methods</h2>\n<p>")
            .Text($"Mains frequency: {analysis.Mains.Method}. The capture is cut into synchronised windows of {analysis.Windows.CyclesPerWindow} mains cycles; spectra, harmonic groups and bands are computed per window and combined as the RMS over windows. Analysis by WaveCheck {analysis.ToolVersion}; report by WaveCheck {context.ToolVersion}.")
            .Raw("</p>\n<table>\n<thead><tr><th>Standard</th><th>Used for</th></tr></thead>\n<tbody>\n");
        foreach (var (standard, use) in Standards)
        {
            html.Raw("<tr><td>").Text(standard).Raw("</td><td>").Text(use).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    private static void Thresholds(HtmlWriter html, AssessmentResult a)
    {
        html.Raw("<section id=\"thresholds\">\n<h2>Appendix: thresholds applied</h2>\n<p>")
            .Text($"Status of each value: \"std\" is the standard's value as reproduced in public sources; values marked {FigureLabels.ToConfirm} were taken from memory of the standard and not checked against its text; \"engineering choice\" and \"practice\" are this tool's or the trade's choices, not a standard's.")
            .Raw("</p>\n<table class=\"wide\">\n<thead><tr><th>Threshold</th><th class=\"num\">Value</th><th>Source</th><th>Status</th></tr></thead>\n<tbody>\n");
        foreach (var t in a.Thresholds)
        {
            html.Raw("<tr><td>").Text(FigureLabels.Threshold(t.Name)).Raw("</td>");
            Num(html, t.Unit == "A" ? CurrentText.WithUnit(t.Value) : t.Unit == "1" ? Number(t.Value, "0.####") : t.Unit == "deg" ? Number(t.Value, "0.#") + "°" : $"{Number(t.Value, "0.####")} {t.Unit}");
            html.Raw("<td>").Text(FigureLabels.ForClient(t.Source)).Raw("</td><td>").Text(Status(t.Source)).Raw("</td></tr>\n");
        }

        html.Raw("</tbody>\n</table>\n</section>\n");
    }

    /// <summary>The status of a limit from its source text (docs/references.md): from memory, standard, engineering
    /// choice or practice; "overridden" when the user set it.</summary>
    internal static string Status(string source)
    {
        var status = FigureLabels.FromMemory(source) ? "from memory: to confirm against the standard"
            : source.Contains("engineering choice", StringComparison.OrdinalIgnoreCase) ? "engineering choice"
            : source.Contains("practice", StringComparison.OrdinalIgnoreCase) ? "practice of the trade"
            : source.Contains("(std)", StringComparison.Ordinal) ? "standard"
            : "as stated";
        return source.Contains("(overridden)", StringComparison.Ordinal) ? status + "; overridden by the user" : status;
    }

    private static void Fact(HtmlWriter html, string name, string value) =>
        html.Raw("<dt>").Text(name).Raw("</dt><dd>").Text(value).Raw("</dd>\n");

    private static void Row(HtmlWriter html, string name, string value) =>
        html.Raw("<tr><th scope=\"row\">").Text(name).Raw("</th><td>").Text(value).Raw("</td></tr>\n");

    private static void Num(HtmlWriter html, string value) => html.Raw("<td class=\"num\">").Text(value).Raw("</td>");

    private static void List(HtmlWriter html, IReadOnlyList<string> items, string? cssClass)
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

    private static string FloorNote(int left, string what, double levelA) => left > 0
        ? $"Listed: {what} {TableSignificance.Rule}, here from {CurrentText.WithUnit(levelA)}; {left} below it are left out. The analysis JSON and the per-window CSV hold them all."
        : $"All {what} listed.";

    private static string Capitalised(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];

    private static string MetricValue(string name, double value) =>
        name.EndsWith('A') ? CurrentText.WithUnit(value)
        : name.EndsWith("Hz", StringComparison.Ordinal) ? Hertz(value)
        : name.EndsWith("Percent", StringComparison.Ordinal) ? Percent(value)
        : name.EndsWith("Deg", StringComparison.Ordinal) ? Number(value, "0") + "°"
        : Number(value, "0.###");

    private static string Given(string? text) => string.IsNullOrWhiteSpace(text) ? "not given" : text;

    private static string Current(double? amperes) => amperes is double a ? CurrentText.WithUnit(a) : "none specified";

    /// <summary>A number for a person: "–" for a value that is not one (never "NaN"), no sign on a zero.</summary>
    private static string Number(double value, string format)
    {
        if (!double.IsFinite(value))
        {
            return "–";
        }

        var text = value.ToString(format, CultureInfo.InvariantCulture);
        return text.StartsWith('-') && text.AsSpan(1).Trim("0.").IsEmpty ? text[1..] : text;
    }

    private static string Percent(double value) => Number(value, Math.Abs(value) >= 10 ? "0.0" : "0.00") + " %";

    private static string Hertz(double hz) => hz >= 1000 ? Number(hz / 1000, "0.###") + " kHz" : Number(hz, hz >= 100 ? "0" : "0.##") + " Hz";

    private static string Seconds(double s) => s >= 1 || s == 0 ? Number(s, "0.###") + " s" : Number(s * 1000, "0.###") + " ms";

    private static string Timestamp(DateTimeOffset t) => t.ToString("yyyy-MM-dd HH:mm:ss zzz", CultureInfo.InvariantCulture);

    private static string CouplingText(SensorCoupling coupling) => coupling switch
    {
        SensorCoupling.Dc => "DC-coupled: sees smooth DC",
        SensorCoupling.Ac => "AC-coupled: blind to smooth DC",
        _ => "not stated",
    };

    private static string RegimeText(Regime regime) => regime switch
    {
        Regime.Iec => "IEC (RCD types AC, A, F, B, B+)",
        _ => "North America (UL 943 GFCI figures added)",
    };

    private static string RiskText(RiskLevel risk) => risk switch
    {
        RiskLevel.Low => "low",
        RiskLevel.Possible => "⚠ possible",
        RiskLevel.Likely => "✘ likely",
        _ => "incomplete",
    };

    private static string TripsText(bool? trips) => trips switch
    {
        true => "✘ yes, trips",
        false => "✔ no",
        null => "? may trip (between the must-not-trip and must-trip levels)",
    };
}
