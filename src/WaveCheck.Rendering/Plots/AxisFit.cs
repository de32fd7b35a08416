using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace WaveCheck.Rendering.Plots;

/// <summary>Sets a value axis range that covers the drawn data and the horizontal reference lines (OxyPlot's
/// automatic range ignores annotations, so a threshold above the data would fall off the plot). Layout only.</summary>
internal static class AxisFit
{
    /// <summary>Fits <paramref name="axis"/> to every line/area point and horizontal line, always including zero.</summary>
    /// <param name="model">The model with its series and annotations added.</param>
    /// <param name="axis">The vertical axis.</param>
    /// <param name="headroomShare">Extra room above the highest value as a share of the span, for labels.</param>
    /// <returns>The span drawn, in axis units.</returns>
    public static double Fit(PlotModel model, Axis axis, double headroomShare)
    {
        var low = 0.0;
        var high = 0.0;
        foreach (var series in model.Series)
        {
            if (series is AreaSeries area)
            {
                Extend(area.Points2, ref low, ref high);
            }

            if (series is LineSeries line)
            {
                Extend(line.Points, ref low, ref high);
            }
        }

        foreach (var annotation in model.Annotations)
        {
            if (annotation is LineAnnotation { Type: LineAnnotationType.Horizontal } line && !string.IsNullOrEmpty(line.Text))
            {
                low = Math.Min(low, line.Y);
                high = Math.Max(high, line.Y);
            }
        }

        var span = high - low > 0 ? high - low : 1;
        axis.Minimum = low - (0.05 * span);
        axis.Maximum = high + (headroomShare * span);
        return span;
    }

    private static void Extend(List<DataPoint> points, ref double low, ref double high)
    {
        foreach (var point in points)
        {
            if (double.IsFinite(point.Y))
            {
                low = Math.Min(low, point.Y);
                high = Math.Max(high, point.Y);
            }
        }
    }
}
