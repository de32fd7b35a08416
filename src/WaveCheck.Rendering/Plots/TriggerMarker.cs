using OxyPlot;
using OxyPlot.Annotations;
using WaveCheck.Core.Capture;

namespace WaveCheck.Rendering.Plots;

/// <summary>Marks a recorder's trigger (COMTRADE) on time-axis plots: the moment the relay or recorder fired.</summary>
internal static class TriggerMarker
{
    /// <summary>Adds a vertical "trigger" line where the capture states one within its duration.</summary>
    public static void Add(PlotModel model, CaptureInfo capture)
    {
        if (capture.TriggerOffsetS is not { } offset || offset < 0 || offset > capture.DurationS)
        {
            return;
        }

        model.Annotations.Add(new LineAnnotation
        {
            Type = LineAnnotationType.Vertical,
            X = offset,
            Color = PlotStyle.Black,
            LineStyle = LineStyle.Solid,
            StrokeThickness = 1.5,
            Text = $"trigger {offset.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture)} s",
            TextOrientation = AnnotationTextOrientation.Vertical,
            TextColor = PlotStyle.Black,
            FontSize = 11,
            TextHorizontalAlignment = HorizontalAlignment.Right,
        });
    }
}
