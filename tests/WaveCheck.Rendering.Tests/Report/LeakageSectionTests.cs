using System.Text.RegularExpressions;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Rendering.Tests.Report;

/// <summary>The report's leakage section: present only with a voltage channel, with its finding, figures and two
/// plots (structure, not pixels).</summary>
public sealed class LeakageSectionTests
{
    private static readonly ReportContext Context = new("invented car park", "bay 3", null, DateTimeOffset.UnixEpoch, "0.1.0-test");

    private static Evaluation Evaluate(SupplyVoltage? supply, params WaveformComponent[] parts)
    {
        using var source = new SynthCaptureSource(parts, 20_000, 3, supply: supply);
        return Evaluation.Run(source, new AnalysisOptions(), new AssessmentOptions());
    }

    private static string Section(string html)
    {
        var start = html.IndexOf("<section id=\"leakage-split\">", StringComparison.Ordinal);
        Assert.True(start >= 0, "no leakage section");
        var section = html[start..];
        return section[..(section.IndexOf("</section>", StringComparison.Ordinal) + 10)];
    }

    [Fact]
    public void SinglePhaseSectionStatesTheFindingTheFiguresAndDrawsTwoPlots()
    {
        var supply = new SupplyVoltage(230, 50, [(5, 0.03, 0)]);
        var e = Evaluate(supply, new RcLeakageComponent(supply, 0, 120e3, 40e-9));
        var section = Section(ReportWriter.Render(e.Analysis, e.Assessment, Context));

        Assert.Contains("<p class=\"alert\">POSSIBLE INSULATION FAULT", section, StringComparison.Ordinal);
        Assert.Contains("leakage resistance R = V / I_R", section, StringComparison.Ordinal);
        Assert.Contains("R-C fit over harmonic orders 1, 5", section, StringComparison.Ordinal);
        Assert.Equal(2, Regex.Count(section, "<svg\\b"));
        Assert.Contains("id=\"leakage-phasors\"", section, StringComparison.Ordinal);
        Assert.Contains("id=\"leakage-trend\"", section, StringComparison.Ordinal);
        Assert.Contains("I residual", section, StringComparison.Ordinal);
        // Each plot's ids are prefixed apart from the other plots' (unique ids in one document).
        Assert.Contains("p-leak-phasor-", section, StringComparison.Ordinal);
        Assert.Contains("p-leak-trend-", section, StringComparison.Ordinal);
    }

    [Fact]
    public void ThreePhaseSectionNamesTheDominantPhaseAndTheAssumption()
    {
        var supply = new SupplyVoltage(230, 50, [], Phases: 3);
        var e = Evaluate(supply, new RcLeakageComponent(supply, 1, 90e3, 0));
        var section = Section(ReportWriter.Render(e.Analysis, e.Assessment, Context));

        Assert.Contains("Where the asymmetry lies", section, StringComparison.Ordinal);
        Assert.Matches("<tr class=\"dominant\"><td>L2</td><td>resistive \\(dominant\\)</td>", section);
        Assert.Contains("Assumption: balanced capacitances", section, StringComparison.Ordinal);
    }

    [Fact]
    public void NoVoltageNoSection()
    {
        var e = Evaluate(null, new SineComponent(0.003, 50));
        Assert.DoesNotContain("leakage-split", ReportWriter.Render(e.Analysis, e.Assessment, Context), StringComparison.Ordinal);
    }
}
