using OxyPlot;
using OxyPlot.SkiaSharp;
using SkiaSharp;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// SVG export through the SkiaSharp SVG canvas that keeps every label as SVG text. OxyPlot.SkiaSharp 2.2.0 reuses one
/// paint for lines and text and does not clear a line's dash effect before drawing text; Skia's SVG device then writes
/// any text that follows a dashed line as glyph outlines, so the label is no longer text (not searchable, not checkable).
/// This exporter clears the effect before each text run.
/// </summary>
internal static class SvgPlotExporter
{
    /// <summary>Writes <paramref name="model"/> as SVG of the given size (user units = pixels at 96 dpi).</summary>
    public static void Export(PlotModel model, Stream stream, int width, int height)
    {
        using (var canvas = SKSvgCanvas.Create(new SKRect(0, 0, width, height), stream))
        {
            // The SVG canvas does its own text layout, so HarfBuzz shaping is off (as in OxyPlot's own SVG exporter).
            using var skia = new SkiaRenderContext { RenderTarget = RenderTarget.VectorGraphic, SkCanvas = canvas, UseTextShaping = false };
            ((IPlotModel)model).Update(true);
            ((IPlotModel)model).Render(new TextKeepingContext(skia), new OxyRect(0, 0, width, height));
        }
    }

    /// <summary>Passes every call to the Skia context; before text, draws an empty filled rectangle, which resets the
    /// shared paint's path effect (the context's fill set-up clears it) and leaves no mark.</summary>
    private sealed class TextKeepingContext(SkiaRenderContext inner) : IRenderContext
    {
        private static readonly OxyColor Reset = OxyColor.FromArgb(1, 0, 0, 0);

        public bool RendersToScreen => inner.RendersToScreen;

        public int ClipCount => inner.ClipCount;

        public void CleanUp() => inner.CleanUp();

        public void DrawEllipse(OxyRect extents, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
            inner.DrawEllipse(extents, fill, stroke, thickness, edgeRenderingMode);

        public void DrawEllipses(IList<OxyRect> extents, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
            inner.DrawEllipses(extents, fill, stroke, thickness, edgeRenderingMode);

        public void DrawImage(OxyImage source, double srcX, double srcY, double srcWidth, double srcHeight, double destX, double destY,
            double destWidth, double destHeight, double opacity, bool interpolate) =>
            inner.DrawImage(source, srcX, srcY, srcWidth, srcHeight, destX, destY, destWidth, destHeight, opacity, interpolate);

        public void DrawLine(IList<ScreenPoint> points, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray, LineJoin lineJoin) =>
            inner.DrawLine(points, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

        public void DrawLineSegments(IList<ScreenPoint> points, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray, LineJoin lineJoin) =>
            inner.DrawLineSegments(points, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

        public void DrawPolygon(IList<ScreenPoint> points, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray, LineJoin lineJoin) =>
            inner.DrawPolygon(points, fill, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

        public void DrawPolygons(IList<IList<ScreenPoint>> polygons, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode, double[]? dashArray, LineJoin lineJoin) =>
            inner.DrawPolygons(polygons, fill, stroke, thickness, edgeRenderingMode, dashArray, lineJoin);

        public void DrawRectangle(OxyRect rectangle, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
            inner.DrawRectangle(rectangle, fill, stroke, thickness, edgeRenderingMode);

        public void DrawRectangles(IList<OxyRect> rectangles, OxyColor fill, OxyColor stroke, double thickness, EdgeRenderingMode edgeRenderingMode) =>
            inner.DrawRectangles(rectangles, fill, stroke, thickness, edgeRenderingMode);

        public void DrawText(ScreenPoint p, string text, OxyColor fill, string? fontFamily, double fontSize, double fontWeight, double rotation,
            HorizontalAlignment horizontalAlignment, VerticalAlignment verticalAlignment, OxySize? maxSize)
        {
            inner.DrawRectangle(new OxyRect(0, 0, 0, 0), Reset, OxyColors.Undefined, 0, EdgeRenderingMode.Automatic);
            inner.DrawText(p, text, fill, fontFamily, fontSize, fontWeight, rotation, horizontalAlignment, verticalAlignment, maxSize);
        }

        public OxySize MeasureText(string text, string? fontFamily, double fontSize, double fontWeight) =>
            inner.MeasureText(text, fontFamily, fontSize, fontWeight);

        public void PopClip() => inner.PopClip();

        public void PushClip(OxyRect clippingRectangle) => inner.PushClip(clippingRectangle);

        public void SetToolTip(string text) => inner.SetToolTip(text);
    }
}
