using System.Globalization;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// A few mains cycles of the worst window overlaid on one period (x in degrees of the mains period), with the smooth DC
/// floor, the window's peaks and, for a phase-controlled half-wave, the current-delay angle.
/// </summary>
/// <remarks>0° is the start of the stored excerpt, not a voltage zero crossing: the capture holds no voltage.</remarks>
public static class CyclesPlot
{
    /// <summary>Most cycles overlaid.</summary>
    public const int MaxCycles = 4;

    // Bluish green is kept for the peak lines, black for the DC floor.
    private static readonly OxyColor[] CycleColours = [PlotStyle.Blue, PlotStyle.Vermillion, PlotStyle.SkyBlue, PlotStyle.ReddishPurple];

    /// <summary>Builds the cycles plot.</summary>
    /// <param name="analysis">Reads <see cref="AnalysisResult.WorstWindow"/>, <see cref="AnalysisResult.Mains"/>, <see cref="AnalysisResult.Components"/>, and the worst window's own figures (<see cref="WaveformExcerpt.Figures"/>) for its peaks.</param>
    /// <param name="assessment">Adds the 0.5 IΔn line; null omits it.</param>
    public static PlotModel Build(AnalysisResult analysis, AssessmentResult? assessment)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        var excerpt = analysis.WorstWindow;
        var mainsHz = analysis.Mains.FrequencyHz > 0 ? analysis.Mains.FrequencyHz : analysis.Mains.NominalHz;
        var rateHz = excerpt.SampleRateHz;
        var samples = excerpt.SamplesA;
        var usable = mainsHz > 0 && rateHz > 0 && samples.Count > 1;
        var samplesPerCycle = usable ? rateHz / mainsHz : 0;
        var cycles = usable ? Math.Min(MaxCycles, (int)Math.Floor(samples.Count / samplesPerCycle)) : 0;
        if (usable && cycles == 0)
        {
            cycles = 1; // shorter than a period: draw what there is
        }

        var periodMs = mainsHz > 0 ? 1000 / mainsHz : 0;
        var subtitle = string.Create(CultureInfo.InvariantCulture,
            $"{excerpt.Reason}, from t = {excerpt.StartS:0.###} s; {cycles} cycle(s) of {mainsHz:0.00} Hz ({periodMs:0.00} ms); 0° = start of excerpt");
        var model = PlotStyle.NewModel("Mains cycles of the worst window", subtitle);
        var x = PlotStyle.Linear(AxisPosition.Bottom, "phase within the mains period", "°");
        x.Minimum = 0;
        x.Maximum = 360;
        x.MajorStep = 45;
        x.MinorStep = 15;
        model.Axes.Add(x);
        var y = PlotStyle.Linear(AxisPosition.Left, "residual current", "mA");
        model.Axes.Add(y);

        for (var c = 0; c < cycles; c++)
        {
            var series = new LineSeries
            {
                Title = $"cycle {c + 1}",
                Color = CycleColours[c % CycleColours.Length],
                // Solid, told apart by colour and width: dashes on a wiggly line become thousands of SVG shapes, and
                // overlaid cycles that differ are what the eye should catch anyway.
                LineStyle = LineStyle.Solid,
                StrokeThickness = 2.2 - (0.45 * c),
            };
            var first = (int)Math.Floor(c * samplesPerCycle);
            var last = Math.Min(samples.Count - 1, (int)Math.Ceiling((c + 1) * samplesPerCycle));
            var points = new List<DataPoint>(last - first + 1);
            for (var i = first; i <= last; i++)
            {
                var degrees = ((i / samplesPerCycle) - c) * 360.0;
                points.Add(new DataPoint(degrees, PlotStyle.AxisMilliamps(samples[i])));
            }

            // A fast recorder gives tens of thousands of samples per cycle: keep each pixel column's extremes.
            MinMaxThinning.Add(points, series.Points, PlotStyle.WidthPx, logX: false);

            model.Series.Add(series);
        }

        var floorA = analysis.Components.SmoothDcMaxA;
        model.Series.Add(Level($"smooth DC floor {CurrentText.WithUnit(floorA)}", floorA, PlotStyle.Black, LineStyle.Dash));
        var (positiveA, negativeA, source) = Peaks(analysis);
        model.Series.Add(Level($"peaks: highest {CurrentText.WithUnit(positiveA)}, lowest {CurrentText.WithUnit(negativeA)} ({source})", positiveA, PlotStyle.BluishGreen, LineStyle.LongDash));
        var negative = Level(null, negativeA, PlotStyle.BluishGreen, LineStyle.LongDash);
        model.Series.Add(negative);

        if (assessment is { RatedResidualCurrentA: > 0 })
        {
            DeviceLines.NonOperating(model, assessment, mirrored: false);
        }

        var span = AxisFit.Fit(model, y, 0.2);

        var angle = analysis.Components.CurrentDelayAngleDeg;
        if (angle is double alpha)
        {
            model.Annotations.Add(new TextAnnotation
            {
                Text = string.Create(CultureInfo.InvariantCulture, $"phase-controlled half-wave: current-delay angle α = {alpha:0}°"),
                TextPosition = new DataPoint(6, y.Maximum - (0.03 * span)),
                FontSize = 13,
                FontWeight = FontWeights.Bold,
                Background = OxyColor.FromAColor(220, OxyColors.White),
                Stroke = PlotStyle.Black,
                StrokeThickness = 0.8,
                TextHorizontalAlignment = HorizontalAlignment.Left,
                TextVerticalAlignment = VerticalAlignment.Top,
                Layer = AnnotationLayer.AboveSeries,
            });
        }

        if (!usable)
        {
            model.Subtitle += " — no samples to draw";
        }

        return model;
    }

    private static LineSeries Level(string? title, double valueA, OxyColor colour, LineStyle style)
    {
        var series = new LineSeries { Title = title, Color = colour, LineStyle = style, StrokeThickness = 1.4 };
        series.Points.Add(new DataPoint(0, PlotStyle.AxisMilliamps(valueA)));
        series.Points.Add(new DataPoint(360, PlotStyle.AxisMilliamps(valueA)));
        return series;
    }

    /// <summary>The peaks of the window drawn, as measured; the whole capture's when the excerpt carries no figures
    /// (a merged row of the decimated trend table is not this window's, so it is never used).</summary>
    private static (double PositiveA, double NegativeA, string Source) Peaks(AnalysisResult analysis) =>
        analysis.WorstWindow.Figures is { } window
            ? (window.PeakPositiveA, window.PeakNegativeA, "this window")
            : (analysis.Summary.PeakPositiveA, analysis.Summary.PeakNegativeA, "whole capture");
}
