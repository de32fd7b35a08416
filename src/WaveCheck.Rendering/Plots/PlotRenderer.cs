using System.Text;
using OxyPlot;
using WaveCheck.Core.Export;
using WaveCheck.Core.Model;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// Draws the plots of an analysis to PNG or SVG files (headless, through SkiaSharp) or to SVG text for embedding.
/// Reads only the result model. Stateless; safe to use from several threads.
/// </summary>
public static class PlotRenderer
{
    /// <summary>Output resolution of PNG files, dots per inch (pixel sizes are given at this resolution).</summary>
    public const float Dpi = 96;

    /// <summary>The plots that apply to this analysis, in report order (the trend only for long captures).</summary>
    public static IReadOnlyList<PlotKind> Applicable(AnalysisResult analysis)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        return TrendPlot.Applies(analysis)
            ? [PlotKind.Overview, PlotKind.Cycles, PlotKind.Spectrum, PlotKind.Trend]
            : [PlotKind.Overview, PlotKind.Cycles, PlotKind.Spectrum];
    }

    /// <summary>Builds the OxyPlot model of one plot.</summary>
    public static PlotModel Build(PlotKind kind, AnalysisResult analysis, AssessmentResult? assessment) => kind switch
    {
        PlotKind.Overview => OverviewPlot.Build(analysis, assessment),
        PlotKind.Cycles => CyclesPlot.Build(analysis, assessment),
        PlotKind.Spectrum => SpectrumPlot.Build(analysis, assessment),
        PlotKind.Trend => TrendPlot.Build(analysis, assessment),
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown plot kind"),
    };

    /// <summary>File name (without folder) of a plot: <c>overview.png</c>, <c>spectrum.svg</c>, ...</summary>
    public static string FileName(PlotKind kind, PlotFormat format) => kind.ToString().ToLowerInvariant() + format.Extension();

    /// <summary>Writes every applicable plot into <paramref name="directory"/>, each whole or not at all.</summary>
    /// <param name="analysis">The analysis.</param>
    /// <param name="assessment">The verdict, for device thresholds; null draws without them.</param>
    /// <param name="directory">Target folder; created if missing.</param>
    /// <param name="format">PNG or SVG.</param>
    /// <returns>Full paths of the files written, in report order.</returns>
    public static IReadOnlyList<string> WriteAll(AnalysisResult analysis, AssessmentResult? assessment, string directory, PlotFormat format)
    {
        ArgumentException.ThrowIfNullOrEmpty(directory);
        var written = new List<string>();
        foreach (var kind in Applicable(analysis))
        {
            var path = Path.GetFullPath(Path.Combine(directory, FileName(kind, format)));
            Write(kind, analysis, assessment, path);
            written.Add(path);
        }

        return written;
    }

    /// <summary>Writes one plot; PNG or SVG chosen by the extension of <paramref name="path"/>.</summary>
    /// <exception cref="ArgumentException">The extension is neither <c>.png</c> nor <c>.svg</c>.</exception>
    public static void Write(PlotKind kind, AnalysisResult analysis, AssessmentResult? assessment, string path)
    {
        var format = PlotFormats.FromPath(path);
        var model = Build(kind, analysis, assessment);
        AtomicFile.Write(path, stream => Export(model, format, stream));
    }

    /// <summary>One plot as a standalone SVG document (UTF-8 text, <see cref="PlotStyle.WidthPx"/> × <see cref="PlotStyle.HeightPx"/>).</summary>
    public static string RenderSvg(PlotKind kind, AnalysisResult analysis, AssessmentResult? assessment)
    {
        using var buffer = new MemoryStream();
        Export(Build(kind, analysis, assessment), PlotFormat.Svg, buffer);
        return Encoding.UTF8.GetString(buffer.ToArray());
    }

    /// <summary>Writes a model in the given format to a stream.</summary>
    public static void Export(PlotModel model, PlotFormat format, Stream stream)
    {
        ArgumentNullException.ThrowIfNull(model);
        switch (format)
        {
            case PlotFormat.Png:
                new OxyPlot.SkiaSharp.PngExporter { Width = PlotStyle.WidthPx, Height = PlotStyle.HeightPx, Dpi = Dpi }.Export(model, stream);
                break;
            case PlotFormat.Svg:
                SvgPlotExporter.Export(model, stream, PlotStyle.WidthPx, PlotStyle.HeightPx);
                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(format), format, "unknown plot format");
        }
    }
}
