using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering.Plots;

/// <summary>The whole capture as a min/max band per envelope bucket, so no peak is lost to decimation.</summary>
public static class OverviewPlot
{
    /// <summary>Most event markers drawn; the title says when more exist.</summary>
    public const int MaxEventMarkers = 40;

    /// <summary>Builds the overview.</summary>
    /// <param name="analysis">Reads <see cref="AnalysisResult.Envelope"/>, <see cref="SummaryResult.DcA"/> and <see cref="AnalysisResult.Events"/>.</param>
    /// <param name="assessment">Adds the 0.5 IΔn and 0.3 IΔn lines; null omits them.</param>
    public static PlotModel Build(AnalysisResult analysis, AssessmentResult? assessment)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        var envelope = analysis.Envelope;
        var events = analysis.Events;
        var subtitle = events.Count > MaxEventMarkers
            ? $"min/max per {FormatSeconds(envelope.BucketDurationS)} bucket; first {MaxEventMarkers} of {events.Count} events marked"
            : $"min/max per {FormatSeconds(envelope.BucketDurationS)} bucket";
        var model = PlotStyle.NewModel("Residual current over the whole capture", subtitle);
        var duration = analysis.Capture.DurationS;
        var count = Math.Min(envelope.MinA.Count, envelope.MaxA.Count);
        var xMax = duration > 0 ? duration : Math.Max(count * envelope.BucketDurationS, 1);
        model.Axes.Add(new LinearAxis { Position = AxisPosition.Bottom, Title = "time", Unit = "s", Minimum = 0, Maximum = xMax });
        model.Axes[0].MajorGridlineStyle = LineStyle.Solid;
        model.Axes[0].MajorGridlineColor = OxyColor.FromRgb(0xDD, 0xDD, 0xDD);
        var y = PlotStyle.Linear(AxisPosition.Left, "residual current", "mA");
        model.Axes.Add(y);

        var band = new AreaSeries
        {
            Title = "min/max envelope",
            Color = PlotStyle.Blue,
            Color2 = PlotStyle.Blue,
            Fill = OxyColor.FromAColor(140, PlotStyle.SkyBlue),
            StrokeThickness = 0.8,
            LineStyle = LineStyle.Solid,
        };

        // Each bucket spans [k·Δt, (k+1)·Δt]: both edges are drawn so a single-bucket spike keeps its full width.
        for (var k = 0; k < count; k++)
        {
            var t0 = k * envelope.BucketDurationS;
            var t1 = t0 + envelope.BucketDurationS;
            var max = PlotStyle.AxisMilliamps(envelope.MaxA[k]);
            var min = PlotStyle.AxisMilliamps(envelope.MinA[k]);
            band.Points.Add(new DataPoint(t0, max));
            band.Points.Add(new DataPoint(t1, max));
            band.Points2.Add(new DataPoint(t0, min));
            band.Points2.Add(new DataPoint(t1, min));
        }

        model.Series.Add(band);

        var dc = new LineSeries
        {
            Title = $"DC level {CurrentText.WithUnit(analysis.Summary.DcA)}",
            Color = PlotStyle.Black,
            LineStyle = LineStyle.Dash,
            StrokeThickness = 1.5,
        };
        dc.Points.Add(new DataPoint(0, PlotStyle.AxisMilliamps(analysis.Summary.DcA)));
        dc.Points.Add(new DataPoint(xMax, PlotStyle.AxisMilliamps(analysis.Summary.DcA)));
        model.Series.Add(dc);

        DeviceLines.Add(model, assessment, mirrored: true);
        AddEvents(model, events);
        TriggerMarker.Add(model, analysis.Capture);
        AxisFit.Fit(model, y, 0.08);
        return model;
    }

    private static void AddEvents(PlotModel model, IReadOnlyList<EventRecord> events)
    {
        var drawn = Math.Min(events.Count, MaxEventMarkers);
        for (var i = 0; i < drawn; i++)
        {
            var e = events[i];
            var transient = e.Kind == "transient";
            model.Annotations.Add(new LineAnnotation
            {
                Type = LineAnnotationType.Vertical,
                X = e.StartS,
                Color = transient ? PlotStyle.Orange : PlotStyle.BluishGreen,
                LineStyle = transient ? LineStyle.Dot : LineStyle.DashDot,
                StrokeThickness = 1.2,
                Text = i < 12 ? e.Kind : null,
                TextOrientation = AnnotationTextOrientation.Vertical,
                TextColor = PlotStyle.Black,
                FontSize = 11,
                TextHorizontalAlignment = HorizontalAlignment.Right,
                Layer = AnnotationLayer.BelowSeries,
            });
        }

        if (drawn > 0)
        {
            // A legend entry for the markers: annotations have none of their own.
            model.Series.Add(new LineSeries { Title = "event (alarm ─·, transient ···)", Color = PlotStyle.BluishGreen, LineStyle = LineStyle.DashDot });
        }
    }

    private static string FormatSeconds(double seconds) => seconds >= 1
        ? seconds.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture) + " s"
        : (seconds * 1000).ToString("0.###", System.Globalization.CultureInfo.InvariantCulture) + " ms";
}
