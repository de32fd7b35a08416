using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

public class SurveyRowTests
{
    // The verdict rule as documented on SurveyRow.VerdictOf (engineering choice, no outside source): every combination.
    [Theory]
    [InlineData(DeviceType.A, true, "ok")]
    [InlineData(DeviceType.A, false, "upgrade")]
    [InlineData(DeviceType.A, null, "cannot-tell")]
    [InlineData(null, true, "cannot-tell")]
    [InlineData(null, false, "cannot-tell")]
    [InlineData(null, null, "cannot-tell")]
    public void Verdict_follows_the_rule(DeviceType? installed, bool? adequate, string expected) =>
        Assert.Equal(expected, VerdictText.Of(SurveyRow.VerdictOf(installed is { } type ? new InstalledProtection(type) : null, adequate)));

    [Fact]
    public void From_carries_the_figures_of_the_analysis_and_assessment()
    {
        var builder = new ResultBuilder
        {
            RmsA = 0.004,
            WorstWindowRmsA = 0.0062,
            SmoothDcMaxA = -0.0071,
            Above1kHzRmsA = 0.0013,
            SampleCount = 600_000,
            SampleRateHz = 50_000,
            RequiredType = DeviceType.B,
            MinimumType = DeviceType.B,
            InstalledType = DeviceType.A,
            InstalledAdequate = false,
            RatedResidualCurrentA = 0.3,
            Blinded = true,
            NuisanceRisk = RiskLevel.Possible,
            NuisanceMarginA = 0.0021,
            Headline = "smooth DC 7.1 mA: type B",
        };
        var settings = new CaptureSettings { Circuit = "C3 compressor", InstalledProtection = new InstalledProtection(DeviceType.A), RatedResidualCurrentA = 0.3 };
        var row = SurveyRows.From("c3.wav", settings, builder.Analysis(), builder.Assessment(), "c3/report.html");

        Assert.Equal("c3.wav", row.File);
        Assert.Equal("C3 compressor", row.Circuit);
        Assert.Equal(new InstalledProtection(DeviceType.A), row.InstalledType);
        Assert.Equal(0.3, row.RatedResidualCurrentA);
        Assert.Equal(DeviceType.B, row.RequiredType);
        Assert.Equal(SurveyVerdict.Upgrade, row.Verdict);
        Assert.Equal(0.004, row.RmsA);
        Assert.Equal(0.0062, row.WorstWindowRmsA);
        Assert.Equal(-0.0071, row.SmoothDcA);
        Assert.True(row.SmoothDcKnown);
        Assert.Equal(0.0013, row.Above1kHzRmsA);
        Assert.Equal(RiskLevel.Possible, row.NuisanceRisk);
        Assert.Equal(0.0021, row.NuisanceMarginA);
        Assert.True(row.Blinded);
        Assert.Equal("smooth DC 7.1 mA: type B", row.Headline);
        Assert.Null(row.Error);
        Assert.Equal("c3/report.html", row.ReportPath);
        // closed form: duration = samples / rate = 600 000 / 50 000 Hz = 12 s.
        Assert.Equal(12.0, row.DurationS!.Value, 12);
        Assert.Equal(50_000, row.SampleRateHz);
    }

    [Fact]
    public void Undetermined_blinding_marks_the_dc_as_unknown()
    {
        var row = new ResultBuilder { Blinded = null, InstalledAdequate = null }.Row("c4.wav");
        Assert.False(row.SmoothDcKnown);
        Assert.Equal(SurveyVerdict.CannotTell, row.Verdict);
    }

    [Fact]
    public void Failed_row_keeps_the_settings_and_the_message()
    {
        var settings = new CaptureSettings { Circuit = "C9", InstalledProtection = new InstalledProtection(DeviceType.F), RatedResidualCurrentA = 0.1 };
        var row = SurveyRows.Failed("c9.wav", settings, "c9.wav: not a WAV file");
        Assert.Equal(SurveyVerdict.Error, row.Verdict);
        Assert.Equal(new InstalledProtection(DeviceType.F), row.InstalledType);
        Assert.Equal(0.1, row.RatedResidualCurrentA);
        Assert.Equal("c9.wav: not a WAV file", row.Error);
        Assert.Null(row.RmsA);
        Assert.Null(row.RequiredType);
    }
}
