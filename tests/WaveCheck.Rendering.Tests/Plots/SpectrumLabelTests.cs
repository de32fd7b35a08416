using System.Globalization;
using System.Text.RegularExpressions;
using WaveCheck.Core;
using WaveCheck.Core.Assessment;
using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;
using WaveCheck.Rendering.Plots;

namespace WaveCheck.Rendering.Tests.Plots;

/// <summary>The spectrum's labels on the demo's panel-saw capture (two switching tones, 8 and 16 kHz, whose labels
/// used to overlap): read back from the SVG as drawn (each glyph's position), none overlaps another, none runs off
/// the picture, and harmonic orders are marked only where significant.</summary>
public sealed partial class SpectrumLabelTests
{
    [GeneratedRegex(@"<text transform=""translate\(([-\d.]+) ([-\d.]+)\)"" font-size=""([\d.]+)""[^>]*\bx=""([^""]*)""[^>]*\by=""([^""]*)""[^>]*>([^<]*)</text>")]
    private static partial Regex TextElement();

    private static readonly Lazy<AnalysisResult> PanelSaw = new(() =>
    {
        var path = Sample("c1-panel-saw-drive.wav");
        var evaluation = Evaluation.Run(path, new ImportOptions(), new AnalysisOptions(), new AssessmentOptions());
        return evaluation.Analysis with { Assessment = evaluation.Assessment };
    });

    [Fact]
    public void Tone_and_range_labels_neither_overlap_nor_run_off_the_plot()
    {
        var analysis = PanelSaw.Value;
        Assert.Contains(analysis.Components.Tones, t => Math.Abs(t.FrequencyHz - 8000) < 10);
        Assert.Contains(analysis.Components.Tones, t => Math.Abs(t.FrequencyHz - 16000) < 10);

        var svg = PlotRenderer.RenderSvg(PlotKind.Spectrum, analysis, analysis.Assessment);
        var labels = Labels(svg).Where(l => l.Text.Contains("kHz:", StringComparison.Ordinal) || l.Text.Contains("Hz:", StringComparison.Ordinal)
            || l.Text.Contains("mains only", StringComparison.Ordinal) || l.Text.Contains("to 1 kHz", StringComparison.Ordinal)
            || l.Text.Contains("1-20 kHz", StringComparison.Ordinal) || l.Text.Contains("above 20 kHz", StringComparison.Ordinal)).ToList();

        // Both tones labelled, with the figures of the tones table.
        Assert.Contains(labels, l => l.Text.StartsWith("8 kHz: ", StringComparison.Ordinal));
        Assert.Contains(labels, l => l.Text.StartsWith("16 kHz: ", StringComparison.Ordinal));
        for (var i = 0; i < labels.Count; i++)
        {
            Assert.True(labels[i].Left >= 0 && labels[i].Right <= PlotStyle.WidthPx, $"'{labels[i].Text}' runs off: {labels[i]}");
            for (var j = i + 1; j < labels.Count; j++)
            {
                Assert.False(Overlap(labels[i], labels[j]), $"'{labels[i].Text}' overlaps '{labels[j].Text}'");
            }
        }
    }

    [Fact]
    public void Harmonic_markers_only_where_the_harmonic_is_significant()
    {
        var analysis = PanelSaw.Value;
        var level = TableSignificance.LevelA(analysis);
        var significant = analysis.Harmonics.Where(h => h.Order <= 50 && h.RmsA >= level).Select(h => $"H{h.Order}").ToHashSet();

        var svg = PlotRenderer.RenderSvg(PlotKind.Spectrum, analysis, analysis.Assessment);
        var marked = Labels(svg).Select(l => l.Text).Where(t => Regex.IsMatch(t, @"^H\d+$")).ToList();

        Assert.NotEmpty(marked);
        Assert.All(marked, m => Assert.Contains(m, significant));
    }

    [Fact]
    public void Overlap_check_catches_two_boxes_that_share_pixels()
    {
        // Control for the check above.
        var a = new Label("a", 10, 30, 0, 10);
        Assert.True(Overlap(a, new Label("b", 25, 40, 5, 15)));
        Assert.False(Overlap(a, new Label("c", 31, 40, 0, 10)));
    }

    private sealed record Label(string Text, double Left, double Right, double Top, double Bottom);

    private static bool Overlap(Label a, Label b) => a.Left < b.Right && b.Left < a.Right && a.Top < b.Bottom && b.Top < a.Bottom;

    /// <summary>Each text element's box: from its first glyph's x to its last glyph's x plus one advance (0.65 em, a
    /// generous DejaVu Sans average), from one em above the baseline to 0.25 em below.</summary>
    private static IEnumerable<Label> Labels(string svg)
    {
        foreach (Match m in TextElement().Matches(svg))
        {
            var tx = double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture);
            var ty = double.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture);
            var size = double.Parse(m.Groups[3].Value, CultureInfo.InvariantCulture);
            var xs = Numbers(m.Groups[4].Value);
            var ys = Numbers(m.Groups[5].Value);
            var text = System.Net.WebUtility.HtmlDecode(m.Groups[6].Value).Trim();
            if (xs.Count == 0 || ys.Count == 0)
            {
                continue;
            }

            yield return new Label(text, tx + xs[0], tx + xs[^1] + (0.65 * size), ty + ys[0] - size, ty + ys[0] + (0.25 * size));
        }
    }

    private static List<double> Numbers(string list) =>
        [.. list.Split([',', ' '], StringSplitOptions.RemoveEmptyEntries).Select(v => double.Parse(v, CultureInfo.InvariantCulture))];

    private static string Sample(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "samples", name);
            if (File.Exists(candidate))
            {
                return candidate;
            }
        }

        throw new FileNotFoundException($"samples/{name} not found above {AppContext.BaseDirectory}");
    }
}
