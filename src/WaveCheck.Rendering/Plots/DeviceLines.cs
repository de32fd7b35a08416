using OxyPlot;
using OxyPlot.Annotations;
using WaveCheck.Core.Results;

namespace WaveCheck.Rendering.Plots;

/// <summary>Horizontal reference lines of the assessed device drawn on current axes (0.5 IΔn and 0.3 IΔn).</summary>
internal static class DeviceLines
{
    /// <summary>Text that labels the non-operating limit line.</summary>
    public const string NonOperatingLabel = "0.5 IΔn";

    /// <summary>Text that labels the leakage budget line.</summary>
    public const string LeakageBudgetLabel = "0.3 IΔn";

    /// <summary>Adds the 0.5 IΔn and 0.3 IΔn lines (mA axis) when an assessment is given; <paramref name="mirrored"/> also draws them below zero.</summary>
    public static void Add(PlotModel model, AssessmentResult? assessment, bool mirrored)
    {
        if (assessment is null || !(assessment.RatedResidualCurrentA > 0))
        {
            return;
        }

        var ratedA = assessment.RatedResidualCurrentA;
        Line(model, 0.5 * ratedA, $"{NonOperatingLabel} = {CurrentText.WithUnit(0.5 * ratedA)}", PlotStyle.Vermillion, LineStyle.Dash, mirrored);
        Line(model, 0.3 * ratedA, $"{LeakageBudgetLabel} = {CurrentText.WithUnit(0.3 * ratedA)}", PlotStyle.ReddishPurple, LineStyle.Dot, mirrored);
    }

    /// <summary>One labelled horizontal line at <paramref name="valueA"/> amperes.</summary>
    public static void Line(PlotModel model, double valueA, string text, OxyColor colour, LineStyle style, bool mirrored)
    {
        model.Annotations.Add(new LineAnnotation
        {
            Type = LineAnnotationType.Horizontal,
            Y = PlotStyle.AxisMilliamps(valueA),
            Color = colour,
            LineStyle = style,
            StrokeThickness = 1.5,
            Text = text,
            TextColor = colour.ChangeSaturation(1.0).ChangeIntensity(0.75),
            FontSize = 12,
            TextHorizontalAlignment = HorizontalAlignment.Right,
            TextVerticalAlignment = VerticalAlignment.Bottom,
            Layer = AnnotationLayer.AboveSeries,
        });
        if (mirrored)
        {
            model.Annotations.Add(new LineAnnotation
            {
                Type = LineAnnotationType.Horizontal,
                Y = -PlotStyle.AxisMilliamps(valueA),
                Color = colour,
                LineStyle = style,
                StrokeThickness = 1.5,
                Layer = AnnotationLayer.AboveSeries,
            });
        }
    }
}
