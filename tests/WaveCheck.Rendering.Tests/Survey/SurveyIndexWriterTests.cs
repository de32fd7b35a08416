using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Rendering.Tests.Survey;

/// <summary>The survey index page, checked by its structure (common practice, no source: verdicts by word and symbol,
/// every string escaped, report links relative and percent-encoded).</summary>
public class SurveyIndexWriterTests
{
    private static SurveyRow Row(string file, SurveyVerdict verdict, DeviceType? required, DeviceType? minimum,
        RiskLevel? risk, string? report = null, string? error = null) => new()
        {
            File = file,
            Circuit = "C9 <yard> & \"bay\"",
            InstalledType = new InstalledProtection(DeviceType.A, DcDetection.RdcDd),
            RatedResidualCurrentA = 0.030,
            RequiredType = required,
            MinimumType = minimum,
            Verdict = verdict,
            WorstWindowRmsA = 0.004,
            SmoothDcA = 0.0025,
            SmoothDcKnown = true,
            NuisanceRisk = risk,
            NuisanceMarginA = 0.011,
            Headline = "Type B required: smooth DC",
            ReportPath = report,
            Error = error,
        };

    private static SurveyDocument Survey() => new()
    {
        Site = "Invented car park <level 2>",
        GeneratedAt = new DateTimeOffset(2026, 12, 2, 8, 0, 0, TimeSpan.Zero),
        Cautions = SurveyCautions.All,
        Rows =
        [
            Row("bays/bay 1#.wav", SurveyVerdict.Ok, DeviceType.B, DeviceType.B, RiskLevel.Low, "reports/bay 1#.html"),
            Row("bay2.wav", SurveyVerdict.Upgrade, null, DeviceType.A, RiskLevel.Possible),
            Row("bay3.wav", SurveyVerdict.CannotTell, null, null, null),
            Row("bay4.wav", SurveyVerdict.Error, null, null, null, error: "bay4.wav: line 3: '<x>' is not a number"),
        ],
        Upstream =
        [
            new UpstreamResult
            {
                Name = "Q1", DeviceType = DeviceType.A, RatedResidualCurrentA = 0.1, Members = ["bay2.wav"], Complete = false,
                FailedMembers = ["bay4.wav"], StandingSumA = 0.04, LeakageBudgetA = 0.03, LeakageMarginA = -0.01,
                WithinLeakageBudget = false, NonOperatingLimitA = 0.05, NonOperatingMarginA = 0.01,
                LeakageRisk = RiskLevel.Possible, LeakageExplanation = "over budget", SmoothDcSumA = 0.0025, DcToleranceA = 0.006,
                DcBlinded = null, DcRisk = DcCheck.CannotTell, DcExplanation = "dc", TypeMismatch = true,
                TypeRisk = TypeCheck.Mismatch, TypeExplanation = "type",
            },
        ],
    };

    [Fact]
    public void Verdicts_are_words_and_symbols_and_types_read_as_the_trade_writes_them()
    {
        var html = SurveyIndexWriter.Render(Survey());
        Assert.Contains("✔ OK", html, StringComparison.Ordinal);
        Assert.Contains("✖ upgrade", html, StringComparison.Ordinal);
        Assert.Contains("? cannot tell", html, StringComparison.Ordinal);
        Assert.Contains("⚠ error", html, StringComparison.Ordinal);
        Assert.Contains("<td>B</td>", html, StringComparison.Ordinal);
        Assert.Contains("at least A", html, StringComparison.Ordinal);
        Assert.Contains("possible, margin", html, StringComparison.Ordinal);
        Assert.Contains("class=\"v-cannot-tell\"", html, StringComparison.Ordinal);
        Assert.Contains("1 OK, 1 to upgrade, 1 cannot tell, 1 could not be analysed.", html, StringComparison.Ordinal);
        Assert.Contains("(type A, 100 mA, 1 circuits) — incomplete", html, StringComparison.Ordinal);
        Assert.Contains("✖ mismatch", html, StringComparison.Ordinal);
        Assert.Contains("? cannot-tell", html, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_string_is_escaped_and_links_are_relative_and_encoded()
    {
        var html = SurveyIndexWriter.Render(Survey());
        Assert.DoesNotContain("<yard>", html, StringComparison.Ordinal);
        Assert.Contains("C9 &lt;yard&gt; &amp; &quot;bay&quot;", html, StringComparison.Ordinal);
        Assert.Contains("Invented car park &lt;level 2&gt;", html, StringComparison.Ordinal);
        Assert.Contains("&#39;&lt;x&gt;&#39; is not a number", html, StringComparison.Ordinal);
        Assert.Contains("href=\"reports/bay%201%23.html\"", html, StringComparison.Ordinal);
        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
    }
}
