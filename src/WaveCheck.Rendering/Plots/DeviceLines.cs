using OxyPlot;
using OxyPlot.Annotations;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering.Plots;

/// <summary>Horizontal reference lines of the assessed device drawn on current axes: the non-operating limit and
/// the leakage budget as the assessment applied them (0.5 IΔn and 0.3 IΔn unless overridden).</summary>
internal static class DeviceLines
{
    /// <summary>Adds the non-operating limit and leakage-budget lines (mA axis) when an assessment is given;
    /// <paramref name="mirrored"/> also draws them below zero.</summary>
    public static void Add(PlotModel model, AssessmentResult? assessment, bool mirrored)
    {
        if (assessment is null || !(assessment.RatedResidualCurrentA > 0))
        {
            return;
        }

        NonOperating(model, assessment, mirrored);
        var budgetA = assessment.NuisanceTrip.LeakageBudgetA;
        Line(model, budgetA, $"{assessment.LeakageBudgetText()} = {CurrentText.WithUnit(budgetA)}", PlotStyle.ReddishPurple, LineStyle.Dot, mirrored);
    }

    /// <summary>The non-operating limit line alone.</summary>
    public static void NonOperating(PlotModel model, AssessmentResult assessment, bool mirrored)
    {
        var limitA = assessment.NuisanceTrip.NonOperatingLimitA;
        Line(model, limitA, $"{assessment.NonOperatingLimitText()} = {CurrentText.WithUnit(limitA)}", PlotStyle.Vermillion, LineStyle.Dash, mirrored);
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
