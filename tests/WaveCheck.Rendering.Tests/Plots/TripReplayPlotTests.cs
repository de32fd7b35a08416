using OxyPlot.Series;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Core.Synthesis;
using WaveCheck.Rendering.Plots;
using WaveCheck.Rendering.Report;

namespace WaveCheck.Rendering.Tests.Plots;

/// <summary>The trip-replay plot and report section on a replay made by the analysis (an invented circuit: 3 mA standing
/// leakage, one 2.2 IΔn surge of 200 ms that a compliant general-type device must break, one short one it need not).</summary>
public class TripReplayPlotTests
{
    private static Evaluation Replayed()
    {
        List<WaveformComponent> parts =
        [
            new SineComponent(0.003, 50),
            new SurgeComponent(0.063, 50, 2.5, 0.200),
            new SurgeComponent(0.020, 50, 3.5, 0.040),
        ];
        using var source = new SynthCaptureSource(parts, 10_000, 4.0);
        return Evaluation.Run(source, new AnalysisOptions { MainsHz = 50, WorkerCount = 1 }, new AssessmentOptions { RatedResidualCurrentA = 0.030 });
    }

    [Fact]
    public void The_step_lines_are_the_standards_time_limits_and_each_surge_is_a_profile()
    {
        // Break times 300 / 150 / 40 ms (general) and 500 / 200 / 150 ms (S), non-actuating 130 / 60 / 50 ms
        // (IEC 61008-1 / IEC 61009-1, std, REFERENCE.md): the corners of the step lines lie at these times.
        var replay = Replayed().Assessment.TripReplay!;
        var model = TripReplayPlot.Build(replay);
        var lines = model.Series.OfType<LineSeries>().ToList();
        var general = lines.Single(s => s.Title == "general type: break times");
        Assert.Equal([0.3, 0.15, 0.04], general.Points.Select(p => p.X).Where(x => x < TripReplayPlot.MaxDurationS).Distinct());
        var s = lines.Single(l => l.Title == "type S: break times");
        Assert.Equal([0.5, 0.2, 0.15], s.Points.Select(p => p.X).Where(x => x < TripReplayPlot.MaxDurationS).Distinct());
        var hold = lines.Single(l => l.Title == "type S: non-actuating times");
        Assert.Equal([0.13, 0.06, 0.05], hold.Points.Select(p => p.X).Distinct());
        Assert.Equal(4 + replay.Episodes.Count, lines.Count);
        Assert.Equal(2, replay.Episodes.Count);
        Assert.Contains(lines, l => l.Title == "surge where a compliant device would have tripped");
    }

    [Fact]
    public void The_report_section_leads_with_the_test_the_device_alert_and_embeds_the_plot()
    {
        var evaluation = Replayed();
        var html = ReportWriter.Render(evaluation.Analysis, evaluation.Assessment,
            new ReportContext("Invented car park", "C7 barrier", null, DateTimeOffset.UnixEpoch, "test"));
        var start = html.IndexOf("<section id=\"trip-replay\">", StringComparison.Ordinal);
        Assert.True(start > 0);
        var section = html[start..html.IndexOf("</section>", start, StringComparison.Ordinal)];
        var alert = section.IndexOf("class=\"alert\"", StringComparison.Ordinal);
        Assert.True(alert > 0 && alert < section.IndexOf("<table", StringComparison.Ordinal));
        Assert.Contains("a compliant device would have tripped here: if it did not, test the device", section, StringComparison.Ordinal);
        Assert.Contains("<svg", section, StringComparison.Ordinal);
        Assert.Contains("type S: non-actuating times", section, StringComparison.Ordinal);
        Assert.Contains("What to do", section, StringComparison.Ordinal);

        // The same alert stands right after the verdict box, before the first section: a reader who stops at "adequate"
        // (the type suits the circuit) still learns that the device itself is to be tested.
        var verdictEnd = html.IndexOf("<p class=\"muted\">Rated residual operating current assessed", StringComparison.Ordinal);
        var early = html.IndexOf("Test the device:", verdictEnd, StringComparison.Ordinal);
        Assert.True(verdictEnd > 0 && early > verdictEnd && early < start);
    }

    [Fact]
    public void No_replay_no_section()
    {
        var evaluation = Replayed();
        var html = ReportWriter.Render(evaluation.Analysis, evaluation.Assessment with { TripReplay = null },
            new ReportContext(null, null, null, DateTimeOffset.UnixEpoch, "test"));
        Assert.DoesNotContain("id=\"trip-replay\"", html, StringComparison.Ordinal);
        Assert.DoesNotContain("Test the device:", html, StringComparison.Ordinal);
        Assert.False(TripReplayPlot.Applies(evaluation.Assessment with { TripReplay = null }));
    }
}
