using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;
using WaveCheck.Core.Model;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// The two plots of a leakage split: the mean phasors (voltages and the residual current with its resistive and
/// capacitive parts, each kind scaled to its own longest arrow, since volts and milliamperes share no axis) and
/// the trend of I_R and I_C over the capture. Reads only the result model; stateless.
/// </summary>
public static class LeakagePlot
{
    /// <summary>Builds the phasor diagram.</summary>
    public static PlotModel Phasors(LeakageSplitResult split)
    {
        ArgumentNullException.ThrowIfNull(split);
        var model = PlotStyle.NewModel("Phasors at the fundamental (mean over windows)",
            "voltages scaled to the longest voltage, currents to the residual current; angles referred to the first voltage");
        // Equal scales on both axes, so an angle is drawn as it is.
        model.PlotType = PlotType.Cartesian;
        var x = PlotStyle.Linear(AxisPosition.Bottom, "in phase with the first voltage", null);
        var y = PlotStyle.Linear(AxisPosition.Left, "leading by 90°", null);
        foreach (var axis in new[] { x, y })
        {
            axis.Minimum = -1.25;
            axis.Maximum = 1.25;
            axis.IsZoomEnabled = false;
        }

        model.Axes.Add(x);
        model.Axes.Add(y);
        var longestV = split.Phasors.Where(p => p.Unit == "V").Select(p => Math.Abs(p.Rms)).DefaultIfEmpty(1).Max();
        var longestA = split.Phasors.Where(p => p.Unit == "A").Select(p => Math.Abs(p.Rms)).DefaultIfEmpty(1).Max();
        foreach (var p in split.Phasors)
        {
            var scale = p.Unit == "V" ? longestV : longestA;
            var length = scale > 0 ? p.Rms / scale : 0;
            var angle = p.AngleDeg * Math.PI / 180;
            var end = new DataPoint(length * Math.Cos(angle), length * Math.Sin(angle));
            var colour = p.Unit == "V" ? PlotStyle.Black : p.Name == "I residual" ? PlotStyle.Vermillion : PlotStyle.Blue;
            var series = new LineSeries
            {
                Title = Label(p),
                Color = colour,
                StrokeThickness = p.Name == "I residual" ? 2.4 : 1.6,
                LineStyle = p.Unit == "V" ? LineStyle.Solid : p.Name == "I residual" ? LineStyle.Solid : LineStyle.Dash,
                MarkerType = MarkerType.Circle,
                MarkerSize = 0,
            };
            series.Points.Add(new DataPoint(0, 0));
            series.Points.Add(end);
            model.Series.Add(series);
            model.Annotations.Add(new PointAnnotation { X = end.X, Y = end.Y, Fill = colour, Size = 3.5, Shape = MarkerType.Circle });
            model.Annotations.Add(new TextAnnotation
            {
                Text = p.Name,
                TextPosition = new DataPoint(end.X * 1.08, end.Y * 1.08),
                TextColor = colour,
                Stroke = OxyColors.Transparent,
                TextHorizontalAlignment = end.X >= 0 ? HorizontalAlignment.Left : HorizontalAlignment.Right,
            });
        }

        return model;
    }

    /// <summary>Builds the trend of the resistive and capacitive parts over the capture.</summary>
    public static PlotModel Trend(LeakageSplitResult split)
    {
        ArgumentNullException.ThrowIfNull(split);
        var model = PlotStyle.NewModel("Resistive and capacitive leakage over the capture",
            split.Trend.Count < split.Windows ? "windows averaged in pairs to fit" : "one point per window");
        var x = PlotStyle.Linear(AxisPosition.Bottom, "time", "s");
        x.Minimum = 0;
        model.Axes.Add(x);
        var y = PlotStyle.Linear(AxisPosition.Left, "current at the fundamental", "mA");
        model.Axes.Add(y);
        var resistive = new LineSeries { Title = "resistive I_R", Color = PlotStyle.Vermillion, StrokeThickness = 1.8 };
        var capacitive = new LineSeries { Title = "capacitive I_C", Color = PlotStyle.Blue, StrokeThickness = 1.8, LineStyle = LineStyle.Dash };
        foreach (var p in split.Trend)
        {
            resistive.Points.Add(new DataPoint(p.StartS, PlotStyle.AxisMilliamps(p.ResistiveA)));
            capacitive.Points.Add(new DataPoint(p.StartS, PlotStyle.AxisMilliamps(p.CapacitiveA)));
        }

        model.Series.Add(resistive);
        model.Series.Add(capacitive);
        if (split.Insulation is { } insulation && double.IsFinite(insulation.ResistiveLimitA))
        {
            DeviceLines.Line(model, insulation.ResistiveLimitA,
                $"I_R of {insulation.MinimumOhm / 1e6:0.##} MΩ at {split.VoltageRmsV:0} V", PlotStyle.Black, LineStyle.Dot, mirrored: false);
        }

        AxisFit.Fit(model, y, 0.08);
        return model;
    }

    private static string Label(PhasorValue p) => p.Unit == "V"
        ? FormattableString.Invariant($"{p.Name}: {p.Rms:0} V")
        : FormattableString.Invariant($"{p.Name}: {p.Rms * 1000:0.###} mA at {p.AngleDeg:0}°");
}
