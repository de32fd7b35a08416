using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.SkiaSharp;
using SkiaSharp;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// Places text labels on a laid-out plot so that none overlaps another, covers a marked point, or runs past the plot
/// area: each label tries its candidate boxes in order and takes the first that is free; a label with no free box is
/// left out (the caller says where its figure is also given). The model is laid out once, at the size it is exported
/// at, so screen positions are those of the final picture. Not thread-safe; one instance per plot.
/// </summary>
internal sealed class LabelPlacer
{
    /// <summary>Space kept between two labels and between a label and the plot's edge, pixels.</summary>
    public const double GapPx = 3;

    private readonly PlotModel _model;
    private readonly Axis _x;
    private readonly Axis _y;
    private readonly SkiaRenderContext _measure = new() { RenderTarget = RenderTarget.VectorGraphic, UseTextShaping = false };
    private readonly List<OxyRect> _taken = [];

    /// <summary>Lays <paramref name="model"/> out at <see cref="PlotStyle.WidthPx"/> × <see cref="PlotStyle.HeightPx"/>.</summary>
    public LabelPlacer(PlotModel model, Axis x, Axis y)
    {
        _model = model;
        _x = x;
        _y = y;
        using var recorder = new SKPictureRecorder();
        using var canvas = recorder.BeginRecording(new SKRect(0, 0, PlotStyle.WidthPx, PlotStyle.HeightPx));
        using var layout = new SkiaRenderContext { RenderTarget = RenderTarget.VectorGraphic, SkCanvas = canvas, UseTextShaping = false };
        ((IPlotModel)model).Update(true);
        ((IPlotModel)model).Render(layout, new OxyRect(0, 0, PlotStyle.WidthPx, PlotStyle.HeightPx));
        Area = model.PlotArea;
    }

    /// <summary>The plot area in screen pixels.</summary>
    public OxyRect Area { get; }

    /// <summary>Screen position of a data point.</summary>
    public ScreenPoint ToScreen(double x, double y) => new(_x.Transform(x), _y.Transform(y));

    /// <summary>Keeps a marker's box free of labels.</summary>
    public void Reserve(ScreenPoint centre, double radiusPx) =>
        _taken.Add(new OxyRect(centre.X - radiusPx, centre.Y - radiusPx, 2 * radiusPx, 2 * radiusPx));

    /// <summary>Size of a label's box: the text as the renderer measures it plus <paramref name="padding"/>.</summary>
    public OxySize Measure(string text, double fontSize, OxyThickness padding)
    {
        var size = _measure.MeasureText(text, PlotStyle.FontFamily, fontSize, FontWeights.Normal);
        return new OxySize(size.Width + padding.Left + padding.Right, size.Height + padding.Top + padding.Bottom);
    }

    /// <summary>Adds <paramref name="text"/> at the first of <paramref name="topLefts"/> (screen positions of the box's
    /// top-left corner) where it fits; returns whether it was placed.</summary>
    public bool Place(string text, double fontSize, IEnumerable<ScreenPoint> topLefts, OxyColor background)
    {
        var padding = new OxyThickness(2, 1, 2, 1);
        var size = Measure(text, fontSize, padding);
        foreach (var corner in topLefts)
        {
            var box = new OxyRect(corner.X, corner.Y, size.Width, size.Height);
            if (!Inside(box) || _taken.Any(t => Overlap(t, box)))
            {
                continue;
            }

            _taken.Add(box);
            _model.Annotations.Add(new TextAnnotation
            {
                Text = text,
                TextPosition = new DataPoint(_x.InverseTransform(box.Left), _y.InverseTransform(box.Top)),
                TextHorizontalAlignment = HorizontalAlignment.Left,
                TextVerticalAlignment = VerticalAlignment.Top,
                FontSize = fontSize,
                Padding = padding,
                Stroke = OxyColors.Transparent,
                Background = background,
                TextColor = PlotStyle.Black,
                Layer = AnnotationLayer.AboveSeries,
            });
            return true;
        }

        return false;
    }

    /// <summary>Whether two boxes, each grown by half the gap, overlap.</summary>
    internal static bool Overlap(OxyRect a, OxyRect b) =>
        a.Left < b.Right + GapPx && b.Left < a.Right + GapPx && a.Top < b.Bottom + GapPx && b.Top < a.Bottom + GapPx;

    private bool Inside(OxyRect box) =>
        box.Left >= Area.Left + 1 && box.Right <= Area.Right - 1 && box.Top >= Area.Top + 1 && box.Bottom <= Area.Bottom - 1;
}
