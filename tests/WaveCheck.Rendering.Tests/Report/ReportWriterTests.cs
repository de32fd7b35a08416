using System.Buffers.Binary;
using System.Text.RegularExpressions;
using WaveCheck.Core.Model;
using WaveCheck.Rendering.Plots;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Rendering.Tests.Report;

public sealed partial class ReportWriterTests : IDisposable
{
    private static readonly ReportContext Context = new("Unit 4, invented workshop", "Heat press, socket C2", "Recorded during a full production run.",
        new DateTimeOffset(2026, 3, 14, 9, 30, 0, TimeSpan.Zero), "0.1.0-test");

    private readonly OutputFolder output = new("report");

    public void Dispose() => output.Dispose();

    [GeneratedRegex(@"\bid=""([^""]+)""")]
    private static partial Regex IdAttribute();

    [GeneratedRegex(@"url\(#([^)]+)\)")]
    private static partial Regex UrlReference();

    [Fact]
    public void Report_opens_in_chromium_without_console_errors_and_screenshots_at_the_window_size()
    {
        var report = Write("report.html", ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(blinded: true), Context);
        var screenshot = Path.Combine(output.Path, "report.png");

        var run = Chromium.Run(report, "--enable-logging=stderr", "--v=0", "--screenshot=" + screenshot, "--window-size=1240,1754");

        Assert.True(run.ExitCode == 0, $"chromium exit {run.ExitCode}: {run.Stderr}");
        var bytes = File.ReadAllBytes(screenshot);

        // PNG specification (ISO/IEC 15948) §5.2 signature, IHDR width and height big-endian: the window size asked for.
        Assert.Equal(0x89, bytes[0]);
        Assert.Equal("PNG", System.Text.Encoding.ASCII.GetString(bytes, 1, 3));
        Assert.Equal(1240, BinaryPrimitives.ReadInt32BigEndian(bytes.AsSpan(16, 4)));
        Assert.Equal(1754, BinaryPrimitives.ReadInt32BigEndian(bytes.AsSpan(20, 4)));

        var problems = Chromium.ConsoleProblems(run.Stderr);
        Assert.True(problems.Count == 0, string.Join('\n', problems));
    }

    [Theory]

    // 390 CSS px: the viewport width of a common phone in portrait; 1240 px as the control that the measure sees a
    // page's width at all.
    [InlineData(390, false)]
    [InlineData(390, true)]
    public void Report_fits_a_phone_width_without_sideways_scrolling(int widthPx, bool control)
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(blinded: true), Context with
        {
            Identity = new ReportIdentity { ReportNumber = "R-1", Client = "invented client with a fairly long name, Ltd", CaptureDigest = "0123456789ab", DigestFiles = ["workshop-press.wav"] },
        });

        // Chromium will not make a window narrower than 500 px, so the report is laid out in a 390 px wide frame
        // (its media queries see the frame's width) and the host page reads its widths (file pages may read each
        // other with --allow-file-access-from-files). The report itself keeps its no-script policy.
        if (control)
        {
            html = html.Replace("</body>", "<div style=\"width:1000px;height:1px\"></div></body>", StringComparison.Ordinal);
        }

        var report = Path.Combine(output.Path, control ? "phone-control.html" : "phone.html");
        File.WriteAllText(report, html);
        var host = Path.Combine(output.Path, control ? "host-control.html" : "host.html");
        File.WriteAllText(host, $$"""
            <!DOCTYPE html><html><body style="margin:0"><iframe id="f" src="{{Path.GetFileName(report)}}" style="width:{{widthPx}}px;height:800px;border:0"></iframe>
            <script>document.getElementById('f').addEventListener('load', function () { var d = this.contentDocument.documentElement;
            document.body.setAttribute('data-scroll-width', d.scrollWidth); document.body.setAttribute('data-client-width', d.clientWidth); });</script></body></html>
            """);

        var dom = Chromium.Run(host, "--dump-dom", "--allow-file-access-from-files", "--window-size=800,900").Stdout;
        int Read(string name) => int.Parse(Regex.Match(dom, $"data-{name}=\"(\\d+)\"").Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture);
        var (scroll, client) = (Read("scroll-width"), Read("client-width"));

        Assert.InRange(client, widthPx - 20, widthPx); // the frame's width less a scroll bar
        if (control)
        {
            Assert.True(scroll >= 1000, $"the measure missed a 1000 px element: {scroll}");
        }
        else
        {
            Assert.True(scroll <= client, $"the report is {scroll} px wide in a {client} px wide view: it scrolls sideways");
        }
    }

    [Fact]
    public void Console_check_catches_a_page_that_logs_an_error()
    {
        // Control for the test above: a page with a failing script must be caught by the same check.
        var page = Path.Combine(output.Path, "broken.html");
        File.WriteAllText(page, "<!DOCTYPE html><html><body><p>x</p><script>console.error('boom'); notDefined();</script></body></html>");

        var run = Chromium.Run(page, "--enable-logging=stderr", "--v=0", "--dump-dom");

        Assert.Contains(Chromium.ConsoleProblems(run.Stderr), l => l.Contains("Uncaught", StringComparison.Ordinal));
    }

    [Fact]
    public void Dom_holds_the_verdict_the_type_table_and_one_svg_per_plot()
    {
        var analysis = ResultBuilder.Typical();
        var report = Write("dom.html", analysis, ResultBuilder.TypicalAssessment(), Context);

        var dom = Chromium.Run(report, "--dump-dom").Stdout;

        Assert.Contains("Required RCD type: A", dom, StringComparison.Ordinal);
        Assert.Contains("Pulsating DC from a phase-controlled half-wave", dom, StringComparison.Ordinal);
        Assert.Contains("✘ not suitable", dom, StringComparison.Ordinal);
        Assert.Contains("✔ suitable", dom, StringComparison.Ordinal);
        Assert.Contains("? cannot be determined", dom, StringComparison.Ordinal);
        Assert.Contains("Installed type AC: ✘ not adequate", dom, StringComparison.Ordinal);
        // The class table the verdict rests on: each class with its presence, figure and threshold.
        Assert.Contains("<section id=\"classes\">", dom, StringComparison.Ordinal);
        Assert.Contains("<td>at limit</td>", dom, StringComparison.Ordinal);
        Assert.Contains("B (or A + 6 mA DC detection)", dom, StringComparison.Ordinal);
        Assert.Contains("(2%+0.1mA)", dom, StringComparison.Ordinal);
        Assert.Equal(PlotRenderer.Applicable(analysis).Count, Regex.Count(dom, "<svg\\b"));
        foreach (var standard in new[] { "IEC 61000-4-7", "IEC 60990", "IEC 61008-1", "IEC 61009-1", "IEC 62423", "IEC 62955", "IEC 60364-5-53", "IEC 60364-7-722", "UL 943" })
        {
            Assert.Contains(standard, dom, StringComparison.Ordinal);
        }

        Assert.Contains("0.1.0-test", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", dom, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void Each_caution_is_said_once()
    {
        // With an assessment its cautions replace the report's standing ones: printing both said "verify on site" twice.
        var assessment = ResultBuilder.TypicalAssessment();
        var html = ReportWriter.Render(ResultBuilder.Typical(), assessment, Context);
        var section = html[html.IndexOf("id=\"cautions\"", StringComparison.Ordinal)..];
        section = section[..section.IndexOf("</section>", StringComparison.Ordinal)];
        var items = section.Split("<li>").Length - 1;
        Assert.Equal(assessment.Cautions.Count, items);

        var analysisOnly = ReportWriter.Render(ResultBuilder.Typical(), null, Context);
        Assert.Contains(System.Net.WebUtility.HtmlEncode(ReportWriter.StandingCautions[0]), analysisOnly, StringComparison.Ordinal);
    }

    [Fact]
    public void Blinding_is_stated_in_words_when_blinded()
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(blinded: true), Context);
        var notBlinded = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(blinded: false), Context);

        Assert.Contains("class=\"alert\">Blinding: the smooth DC of 8.40 mA exceeds", html, StringComparison.Ordinal);
        Assert.DoesNotContain("class=\"alert\"", notBlinded, StringComparison.Ordinal);
    }

    [Fact]
    public void User_text_is_escaped_and_no_script_element_reaches_the_document()
    {
        const string hostile = "<script>alert(1)</script>";
        var analysis = ResultBuilder.Typical(filePath: "/data/<img src=x onerror=alert(2)>.wav");
        analysis = analysis with { WorstWindow = analysis.WorstWindow with { Reason = "<script>alert(3)</script>" } };
        var report = Write("hostile.html", analysis, ResultBuilder.TypicalAssessment(), Context with { Site = hostile, Note = "a & b \"quoted\"" });

        var dom = Chromium.Run(report, "--dump-dom").Stdout;

        // The DOM serialiser escapes text nodes (HTML Living Standard, "serialising HTML fragments"): seen as text, not as an element.
        Assert.Contains("&lt;script&gt;alert(1)&lt;/script&gt;", dom, StringComparison.Ordinal);
        Assert.Contains("&lt;img src=x onerror=alert(2)&gt;", dom, StringComparison.Ordinal);
        Assert.Contains("&lt;script&gt;alert(3)&lt;/script&gt;", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", dom, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("<img", dom, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("a &amp; b \"quoted\"", dom, StringComparison.Ordinal);
    }

    [Fact]
    public void Analysis_only_report_renders_without_an_assessment()
    {
        var report = Write("analysis-only.html", ResultBuilder.Typical(), null, Context);

        var dom = Chromium.Run(report, "--dump-dom").Stdout;

        Assert.Contains("No device assessment", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("Thresholds applied", dom, StringComparison.Ordinal);
        Assert.DoesNotContain("IΔn =", dom, StringComparison.Ordinal);
        Assert.Contains("Verify on site", dom, StringComparison.Ordinal);
        Assert.Equal(4, Regex.Count(dom, "<svg\\b"));
    }

    [Fact]
    public void Flat_zero_capture_gives_a_report_with_every_plot()
    {
        var analysis = ResultBuilder.FlatZero();
        var html = ReportWriter.Render(analysis, ResultBuilder.TypicalAssessment(), Context);

        // One second: no trend plot, the other three are there.
        Assert.Equal(3, Regex.Count(html, "<svg\\b"));
        Assert.Contains("No alarms or transients.", html, StringComparison.Ordinal);
        // No fundamental: the table's level is the 0.1 mA floor alone (TableSignificance, engineering choice).
        Assert.Contains("No harmonic group at or above 0.100 mA.", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Limits_name_the_nyquist_frequency_an_ac_coupled_sensor_and_clipped_windows()
    {
        var analysis = ResultBuilder.Typical();
        analysis = analysis with
        {
            Capture = analysis.Capture with { SensorCoupling = WaveCheck.Core.Capture.SensorCoupling.Ac, FullScaleA = 0.1 },
            Trend = analysis.Trend.Select((w, i) => i < 3 ? w with { Clipped = true } : w).ToList(),
        };

        var html = ReportWriter.Render(analysis, null, Context);
        var limits = html[html.IndexOf("<section id=\"limits\">", StringComparison.Ordinal)..];

        // 25 kHz sampling: Nyquist 12.5 kHz (closed form fs/2).
        Assert.Contains("Nothing above 12.5 kHz", limits, StringComparison.Ordinal);
        Assert.Contains("The sensor is AC-coupled", limits, StringComparison.Ordinal);
        Assert.Contains("The recorder clips at 100 mA.", limits, StringComparison.Ordinal);
        Assert.Contains("3 of the 300 windows in the trend contain clipped samples", limits, StringComparison.Ordinal);
        Assert.Contains("<li>Content above 12.5 kHz (Nyquist) cannot be seen at 25 kHz sampling.</li>", limits, StringComparison.Ordinal);
        Assert.DoesNotContain("<code>", limits, StringComparison.Ordinal);
    }

    [Fact]
    public void Inline_svg_ids_are_unique_and_every_reference_resolves()
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(), Context);

        var ids = IdAttribute().Matches(html).Select(m => m.Groups[1].Value).ToList();
        Assert.NotEmpty(ids);
        Assert.Equal(ids.Count, ids.Distinct(StringComparer.Ordinal).Count());
        var references = UrlReference().Matches(html).Select(m => m.Groups[1].Value).ToList();
        Assert.NotEmpty(references);
        Assert.All(references, r => Assert.Contains(r, ids));
    }

    [Fact]
    public void Harmonic_table_keeps_only_non_negligible_orders()
    {
        var analysis = ResultBuilder.Typical();
        var harmonics = analysis.Harmonics.Select(h => h.Order == 37 ? h with { RmsA = 1e-9, MaxA = 1e-9 } : h).ToList();
        var html = ReportWriter.Render(analysis with { Harmonics = harmonics }, null, Context);

        // Order 2 is 0.005/2^1.3 A (well above the 0.1 mA level); order 37 was set to 1 nA; orders 21 to 50 lie
        // below 0.1 mA (5 mA / n^1.3 < 0.1 mA for n > 20.3, closed form): 30 groups left out.
        Assert.Contains("<td class=\"num\">2</td><td class=\"num\">100 Hz</td>", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<td class=\"num\">37</td>", html, StringComparison.Ordinal);
        Assert.Contains("30 below it are left out", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Write_is_atomic_and_creates_the_folder()
    {
        var path = Path.Combine(output.Path, "nested", "folder", "r.html");

        ReportWriter.Write(path, ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(), Context);

        Assert.True(File.Exists(path));
        Assert.Single(Directory.GetFiles(Path.GetDirectoryName(path)!));
        Assert.StartsWith("<!DOCTYPE html>", File.ReadAllText(path), StringComparison.Ordinal);
    }

    [Theory]

    // HTML Living Standard, "escaping a string" and the five predefined XML entities; WebUtility writes &#39; for the apostrophe.
    [InlineData("<", "&lt;")]
    [InlineData(">", "&gt;")]
    [InlineData("&", "&amp;")]
    [InlineData("\"", "&quot;")]
    [InlineData("'", "&#39;")]
    [InlineData("IΔn 30 mA", "IΔn 30 mA")]
    [InlineData(null, "")]
    public void Html_text_escapes_markup_characters(string? text, string expected) =>
        Assert.Equal(expected, HtmlText.Encode(text));

    private string Write(string name, AnalysisResult analysis, AssessmentResult? assessment, ReportContext context)
    {
        var path = Path.Combine(output.Path, name);
        ReportWriter.Write(path, analysis, assessment, context);
        return path;
    }
}
