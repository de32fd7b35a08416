using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering.Plots;

/// <summary>Per-window residual RMS, smooth DC and content above 1 kHz over time, with the device's thresholds.</summary>
public static class TrendPlot
{
    /// <summary>Shortest capture that gets a trend plot, seconds (engineering choice: below this the trend holds too few windows to show a change).</summary>
    public const double MinimumDurationS = 5;

    /// <summary>True when the capture is long enough and has at least two trend rows.</summary>
    public static bool Applies(AnalysisResult analysis)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        return analysis.Capture.DurationS > MinimumDurationS && analysis.Trend.Count >= 2;
    }

    /// <summary>Builds the trend plot (also when <see cref="Applies"/> is false: then it may be nearly empty).</summary>
    /// <param name="analysis">Reads <see cref="AnalysisResult.Trend"/>.</param>
    /// <param name="assessment">Adds 0.5 IΔn, 0.3 IΔn and the chosen type's smooth-DC tolerance; null omits them.</param>
    public static PlotModel Build(AnalysisResult analysis, AssessmentResult? assessment)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        var model = PlotStyle.NewModel("Trend over the capture (one point per window)",
            analysis.Trend.Count < analysis.Windows.Count ? "decimated: the worst value of each group of windows is kept" : null);
        var x = PlotStyle.Linear(AxisPosition.Bottom, "time", "s");
        x.Minimum = 0;
        x.Maximum = Math.Max(analysis.Capture.DurationS, 1e-3);
        model.Axes.Add(x);
        var y = PlotStyle.Linear(AxisPosition.Left, "residual current", "mA");
        model.Axes.Add(y);

        var rms = Series("residual RMS", PlotStyle.Blue, LineStyle.Solid, MarkerType.None);
        var dc = Series("smooth DC", PlotStyle.Black, LineStyle.Dash, MarkerType.None);
        var above = Series("above 1 kHz (RMS)", PlotStyle.Orange, LineStyle.Dot, MarkerType.None);
        foreach (var row in analysis.Trend)
        {
            var t = row.StartS + (row.DurationS / 2);
            rms.Points.Add(new DataPoint(t, PlotStyle.AxisMilliamps(row.RmsA)));
            dc.Points.Add(new DataPoint(t, PlotStyle.AxisMilliamps(row.SmoothDcA)));
            above.Points.Add(new DataPoint(t, PlotStyle.AxisMilliamps(row.Above1kHzRmsA)));
        }

        model.Series.Add(rms);
        model.Series.Add(dc);
        model.Series.Add(above);

        DeviceLines.Add(model, assessment, mirrored: false);
        if (assessment?.Blinding.ToleranceA is double toleranceA)
        {
            DeviceLines.Line(model, toleranceA, $"type {assessment.Blinding.DeviceType.ToTradeName()} smooth-DC tolerance {CurrentText.WithUnit(toleranceA)}",
                PlotStyle.BluishGreen, LineStyle.LongDash, mirrored: false);
        }

        TriggerMarker.Add(model, analysis.Capture);
        AxisFit.Fit(model, y, 0.08);
        return model;
    }

    private static LineSeries Series(string title, OxyColor colour, LineStyle style, MarkerType marker) => new()
    {
        Title = title,
        Color = colour,
        LineStyle = style,
        StrokeThickness = 1.8,
        MarkerType = marker,
    };
}
