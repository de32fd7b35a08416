using WaveCheck.Core.Export;
using WaveCheck.Core.Model;
using static WaveCheck.Rendering.Report.ReportFormat;

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
    public static IReadOnlyList<string> StandingCautions => Core.Text.StandingCautions.All;

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

        IdentitySection.Header(html, analysis, context, identity);
        if (assessment is null)
        {
            html.Raw("<section id=\"verdict\"><div class=\"verdict\"><p class=\"outcome cannot-tell\">? Cannot tell: not assessed</p><p class=\"required\">No device assessment</p>");
            html.Raw("<p class=\"headline\">This report shows the analysis only; no RCD type was assessed.</p></div></section>\n");
        }
        else
        {
            VerdictSection.Verdict(html, assessment);
            VerdictSection.ClassTable(html, assessment);
            VerdictSection.TypeTable(html, assessment);
            DeviceMarginsSection.DeviceMargins(html, analysis, assessment, identity.ProductTest);
            TripReplaySection.Write(html, assessment);
        }

        PlotsSection.Plots(html, analysis, assessment);
        LeakageSection.Write(html, analysis);
        FiguresSection.Figures(html, analysis);
        LimitationsSection.Limitations(html, analysis);
        LimitationsSection.Cautions(html, assessment);
        IdentitySection.SignOff(html, identity);
        MethodsSection.Methods(html, analysis, context);
        if (assessment is not null)
        {
            MethodsSection.Thresholds(html, assessment);
        }

        html.Raw("<footer>").Text($"Made by WaveCheck {context.ToolVersion} on {Timestamp(context.GeneratedAt)}. ")
            .Text("A tool's reading of a recording: it supports a qualified person's decision and does not replace it.").Raw("</footer>\n");
        html.Raw("</body>\n</html>\n");
        return html.ToString();
    }

    /// <summary>The line at the top of every printed page: site, circuit, report number.</summary>
    internal static string RunningHeader(ReportIdentity identity) =>
        $"{identity.Site ?? "site not given"} · {identity.Circuit ?? "circuit not given"} · report {identity.ReportNumber ?? "no number given"}";
}
