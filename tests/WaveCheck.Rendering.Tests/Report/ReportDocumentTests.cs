using System.Text.RegularExpressions;
using WaveCheck.Core.Model;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Rendering.Tests.Report;

/// <summary>The report as a document to sign and file: identity block with blanks to fill, outcome by word and
/// symbol, tables in words, significant rows only, touch-current limits only for product tests, print layout.</summary>
public sealed class ReportDocumentTests
{
    private static readonly ReportContext Bare = new(null, null, null, new DateTimeOffset(2026, 11, 21, 8, 0, 0, TimeSpan.Zero), "0.1.0-test");

    private static readonly ReportIdentity Full = new()
    {
        ReportNumber = "R-2026-007",
        Client = "invented client",
        Site = "invented clinic",
        SiteAddress = "1 Sample Road",
        Circuit = "C3 sterilizer",
        Operator = "A. Tester",
        Instrument = "recorder",
        InstrumentSerial = "S-11",
        Clamp = "DC clamp",
        ClampSerial = "S-22",
        CalibrationDue = new DateOnly(2027, 3, 31),
        CaptureDigest = "0123456789ab",
        CaptureSha256 = "0123456789ab" + new string('0', 52),
        DigestFiles = ["workshop-press.wav"],
    };

    [Fact]
    public void Missing_identity_items_are_blank_fields_to_fill()
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(), Bare);
        var header = html[html.IndexOf("<header>", StringComparison.Ordinal)..html.IndexOf("</header>", StringComparison.Ordinal)];

        // Report number, client, site, address, circuit, recorded, operator, instrument, clamp, calibration due and
        // the digest (not computed here): eleven blanks.
        Assert.Equal(11, Regex.Count(header, "class=\"blank\""));
        foreach (var field in new[] { "Client", "Site address", "Circuit", "Operator", "Instrument", "Clamp / sensor", "Calibration due", "Recorded" })
        {
            Assert.Contains($"<th scope=\"row\">{field}</th>", header, StringComparison.Ordinal);
        }

        Assert.Contains("<section id=\"signoff\"", html, StringComparison.Ordinal);
        Assert.Contains("Approved by", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Given_identity_items_fill_the_block_and_the_running_header()
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment(), Bare with { Identity = Full });
        var header = html[html.IndexOf("<header>", StringComparison.Ordinal)..html.IndexOf("</header>", StringComparison.Ordinal)];

        Assert.Equal(1, Regex.Count(header, "class=\"blank\"")); // only "Recorded": the builder's capture states no start
        Assert.Contains("R-2026-007", header, StringComparison.Ordinal);
        Assert.Contains("recorder, serial S-11", header, StringComparison.Ordinal);
        Assert.Contains("DC clamp, serial S-22", header, StringComparison.Ordinal);
        Assert.Contains("2027-03-31", header, StringComparison.Ordinal);
        Assert.Contains("0123456789ab (first 12 hex digits of the SHA-256 of workshop-press.wav)", header, StringComparison.Ordinal);
        Assert.Contains("@top-left { content: \"invented clinic · C3 sterilizer · report R-2026-007\"", html, StringComparison.Ordinal);
        Assert.Contains("<tr><th scope=\"row\">Tested by</th><td>A. Tester</td>", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Recording_time_comes_from_the_file_before_the_user()
    {
        var analysis = ResultBuilder.Typical();
        var stated = Bare with { Identity = new ReportIdentity { StatedRecordedAt = new DateTimeOffset(2026, 11, 20, 0, 0, 0, TimeSpan.Zero) } };
        var fromFile = analysis with { Capture = analysis.Capture with { StartTime = new DateTimeOffset(2026, 11, 19, 9, 14, 0, TimeSpan.Zero) } };

        Assert.Contains("2026-11-20 <span class=\"from\">(as stated by the user", ReportWriter.Render(analysis, null, stated), StringComparison.Ordinal);
        Assert.Contains("2026-11-19 09:14:00 +00:00 <span class=\"from\">(from the capture file)", ReportWriter.Render(fromFile, null, stated), StringComparison.Ordinal);
    }

    [Fact]
    public void Calibration_past_due_on_the_recording_day_is_flagged()
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), null, Bare with { Identity = new ReportIdentity { CalibrationDue = new DateOnly(2026, 1, 31) } });

        Assert.Contains("✘ past due on the day of the recording", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Running_header_text_cannot_break_out_of_the_style_sheet()
    {
        var hostile = Bare with { Identity = new ReportIdentity { Site = "x\"; } body { display: none } </style><script>alert(1)</script>" } };

        var html = ReportWriter.Render(ResultBuilder.Typical(), null, hostile);
        var style = html[html.IndexOf("<style>", StringComparison.Ordinal)..(html.IndexOf("</style>", StringComparison.Ordinal) + 8)];

        // CSS Syntax Level 3 §4.3.7: a backslash and hex digits (then one space) is an escaped code point.
        Assert.DoesNotContain("<script>", style, StringComparison.Ordinal);
        Assert.Contains("x\\22 \\3b  \\7d  body \\7b  display: none \\7d  \\3c /style\\3e ", style, StringComparison.Ordinal);
        Assert.Equal(1, Regex.Count(html, "</style>"));
    }

    [Theory]
    [InlineData(PaperSize.A4, "size: A4;")]
    [InlineData(PaperSize.Letter, "size: letter;")]
    public void Paper_sets_the_page_size(PaperSize paper, string rule)
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), null, Bare with { Paper = paper });

        Assert.Contains(rule, html, StringComparison.Ordinal);
        Assert.Contains("counter(page) \" of \" counter(pages)", html, StringComparison.Ordinal);
        Assert.Contains("break-inside: avoid", html, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(true, "✔ Adequate", "adequate")]
    [InlineData(false, "✘ Not adequate", "not-adequate")]
    [InlineData(null, "? Cannot tell", "cannot-tell")]
    public void Verdict_box_shows_the_outcome_by_word_and_symbol(bool? adequate, string words, string cssClass)
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment() with { InstalledAdequate = adequate }, Bare);

        Assert.Contains($"<p class=\"outcome {cssClass}\">{words}", html, StringComparison.Ordinal);
        // Each outcome's border differs in style as well as colour (solid, double, dashed).
        Assert.Matches($@"\.outcome\.{cssClass} \{{[^}}]*border-style: (solid|double|dashed)", html);
    }

    [Fact]
    public void No_installed_device_is_cannot_tell_and_says_why()
    {
        var html = ReportWriter.Render(ResultBuilder.Typical(), ResultBuilder.TypicalAssessment() with { InstalledType = null, InstalledAdequate = null }, Bare);

        Assert.Contains("? Cannot tell: no installed device was stated", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Harmonic_table_lists_orders_at_or_above_max_of_0_1_mA_and_1_percent_of_the_fundamental()
    {
        // The builder's harmonic n is 5 mA / n^1.3. Level max(0.1 mA, 1 % of 5 mA) = 0.1 mA; 5/n^1.3 >= 0.1 holds for
        // n <= 50^(1/1.3) = 20.3 (closed form): orders 1 to 20 listed, 21 to 50 (30 groups) left out.
        var html = ReportWriter.Render(ResultBuilder.Typical(), null, Bare);

        Assert.Contains("<td class=\"num\">20</td><td class=\"num\">1 kHz</td>", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<td class=\"num\">21</td><td class=\"num\">1.05 kHz</td>", html, StringComparison.Ordinal);
        Assert.Contains("here from 0.100 mA; 30 below it are left out", html, StringComparison.Ordinal);
        Assert.Contains(HtmlText.Encode(TableSignificance.Rule), html, StringComparison.Ordinal);
    }

    [Fact]
    public void Significance_level_follows_a_strong_fundamental()
    {
        // 1 % of a 50 mA fundamental is 0.5 mA, above the 0.1 mA floor.
        Assert.Equal(5e-4, TableSignificance.LevelA(0.05), 12);
        Assert.Equal(1e-4, TableSignificance.LevelA(0.002), 12);
        Assert.Equal(1e-4, TableSignificance.LevelA(double.NaN), 12);
    }

    [Fact]
    public void Touch_current_limits_appear_only_for_a_product_test()
    {
        var assessment = ResultBuilder.TypicalAssessment();
        var installation = ReportWriter.Render(ResultBuilder.Typical(), assessment, Bare);
        var product = ReportWriter.Render(ResultBuilder.Typical(), assessment, Bare with { Identity = new ReportIdentity { ProductTest = true } });

        Assert.DoesNotContain("IEC 62368-1 ES1", installation, StringComparison.Ordinal);
        Assert.Contains("compared only when one is asked for (--product-test", installation, StringComparison.Ordinal);
        Assert.Contains("IEC 62368-1 ES1, 0.707 mA peak", product, StringComparison.Ordinal);
    }

    [Fact]
    public void From_memory_limits_read_value_to_confirm_with_their_status_in_the_appendix()
    {
        var assessment = ResultBuilder.TypicalAssessment() with
        {
            Thresholds = [new ThresholdUse("frequencyFactor1kHz", 14, "1", "IEC 62423 §5.3 upper limit 14 IΔn at 1 kHz (from memory)")],
        };

        var html = ReportWriter.Render(ResultBuilder.Typical(), assessment, Bare);
        var appendix = html[html.IndexOf("<section id=\"thresholds\">", StringComparison.Ordinal)..];

        Assert.Contains("<td>type B upper trip factor at 1 kHz</td>", appendix, StringComparison.Ordinal);
        Assert.Contains("14 IΔn at 1 kHz (value to confirm against the standard)", appendix, StringComparison.Ordinal);
        Assert.Contains("<td>from memory: to confirm against the standard</td>", appendix, StringComparison.Ordinal);
    }

    [Fact]
    public void Tables_hold_no_code_identifiers_no_nan_and_no_signed_zero()
    {
        var analysis = ResultBuilder.Typical();
        var nanWindows = analysis.Windows with
        {
            Statistics = new Dictionary<string, MetricStatistics>(analysis.Windows.Statistics)
            {
                ["currentDelayAngleDeg"] = new MetricStatistics(double.NaN, double.NaN, double.NaN, 0),
                ["dcA"] = new MetricStatistics(-1e-9, -2e-9, -1e-10, 0.2),
            },
        };
        var html = ReportWriter.Render(analysis with { Windows = nanWindows, Summary = analysis.Summary with { DcA = -3e-9 } }, ResultBuilder.TypicalAssessment(), Bare);
        var body = html[html.IndexOf("<body>", StringComparison.Ordinal)..];
        var text = Regex.Replace(Regex.Replace(body, "<svg\\b.*?</svg>", string.Empty, RegexOptions.Singleline), "<[^>]+>", " ");

        Assert.DoesNotContain("NaN", text, StringComparison.Ordinal);
        Assert.DoesNotMatch(@"-0\.0+\b(?![1-9])", text);
        foreach (var code in new[] { "above1kHzRmsA", "currentDelayAngleDeg", "rmsA", "dcSignificanceA", "peakNegativeA" })
        {
            Assert.DoesNotContain(code, text, StringComparison.Ordinal);
        }

        Assert.Contains("worst-window RMS", text, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("whole-capture RMS", text, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("95th percentile", text, StringComparison.Ordinal);
    }
}
