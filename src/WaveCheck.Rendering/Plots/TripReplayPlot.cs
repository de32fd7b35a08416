using System.Globalization;
using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// The capture's surges on magnitude (multiples of IΔn, half-cycle RMS) against duration, both logarithmic, with the
/// time limits of the general type and of type S as step lines: each episode is drawn as its profile (how long it
/// stayed at or above each multiple), so a profile that crosses a break-time line reached a must-trip limit, and one
/// that stays left of the type S non-actuating line rides through a time-delayed device.
/// </summary>
public static class TripReplayPlot
{
    /// <summary>Shortest duration on the axis, seconds (half a half-cycle at 60 Hz, below any stretch measured).</summary>
    public const double MinDurationS = 0.004;

    /// <summary>Longest duration on the axis, seconds (four times the longest break time: longer stretches sit at the edge).</summary>
    public const double MaxDurationS = 2.0;

    /// <summary>True when the assessment carries a replay.</summary>
    public static bool Applies(AssessmentResult? assessment) => assessment?.TripReplay is not null;

    /// <summary>Builds the plot.</summary>
    /// <param name="replay">The replay.</param>
    public static PlotModel Build(TripReplayResult replay)
    {
        ArgumentNullException.ThrowIfNull(replay);
        var rated = CurrentText.WithUnit(replay.RatedResidualCurrentA);
        var model = PlotStyle.NewModel(string.Create(CultureInfo.InvariantCulture, $"Surges against the device time limits (IΔn {rated})"),
            replay.Episodes.Count < replay.EpisodesFound
                ? string.Create(CultureInfo.InvariantCulture, $"the first {replay.Episodes.Count} of {replay.EpisodesFound} episodes drawn")
                : null);
        var highest = replay.Episodes.Count > 0 ? replay.Episodes.Max(e => e.MaxHalfCycleRmsMultiple) : 1;
        var top = Math.Max(10, highest * 1.3);
        var x = PlotStyle.Log(AxisPosition.Bottom, "duration at or above the level", "s");
        x.Minimum = MinDurationS;
        x.Maximum = MaxDurationS;
        model.Axes.Add(x);
        var y = PlotStyle.Log(AxisPosition.Left, "half-cycle RMS", "× IΔn");
        y.Minimum = 0.3;
        y.Maximum = top;
        model.Axes.Add(y);

        model.Series.Add(Step("non-operating 0.5 IΔn", PlotStyle.ReddishPurple, LineStyle.DashDot,
            [(MinDurationS, replay.NonOperatingMultiple), (MaxDurationS, replay.NonOperatingMultiple)]));
        model.Series.Add(Step("general type: break times", PlotStyle.Black, LineStyle.Solid, MustTrip(replay.GeneralBreakTimes, top)));
        model.Series.Add(Step("type S: break times", PlotStyle.Orange, LineStyle.Dash, MustTrip(replay.TimeDelayedBreakTimes, top)));
        model.Series.Add(Step("type S: non-actuating times", PlotStyle.BluishGreen, LineStyle.Dot,
            NonActuating(replay.TimeDelayedNonActuatingTimes, replay.NonOperatingMultiple, top)));

        var shownAlert = false;
        var shownOther = false;
        foreach (var e in replay.Episodes)
        {
            var alert = e.Findings.Any(f => f.Device.Installed && f.MustTripReached);
            var series = new LineSeries
            {
                Color = alert ? PlotStyle.Vermillion : PlotStyle.Blue,
                StrokeThickness = 1.4,
                MarkerType = alert ? MarkerType.Diamond : MarkerType.Circle,
                MarkerSize = 3.5,
                MarkerFill = alert ? PlotStyle.Vermillion : PlotStyle.Blue,
            };
            if (alert && !shownAlert)
            {
                series.Title = "surge where a compliant device would have tripped";
                shownAlert = true;
            }
            else if (!alert && !shownOther)
            {
                series.Title = "surge (profile: longest stretch at or above each level)";
                shownOther = true;
            }

            foreach (var p in e.Profile)
            {
                if (p.DurationS > 0)
                {
                    series.Points.Add(new DataPoint(Clamp(p.DurationS), p.Multiple));
                }
            }

            // The top of the profile: the highest half-cycle lasted at least one half-cycle.
            series.Points.Add(new DataPoint(Clamp(e.HalfCycleS), Math.Max(e.MaxHalfCycleRmsMultiple, 0.3)));
            model.Series.Add(series);
        }

        return model;
    }

    /// <summary>Writes the plot as a standalone SVG document.</summary>
    public static string RenderSvg(TripReplayResult replay)
    {
        using var buffer = new MemoryStream();
        PlotRenderer.Export(Build(replay), PlotFormat.Svg, buffer);
        return System.Text.Encoding.UTF8.GetString(buffer.ToArray());
    }

    private static double Clamp(double seconds) => Math.Clamp(seconds, MinDurationS, MaxDurationS);

    // A must-trip boundary: right of the time at each multiple (and above it) a compliant device has broken.
    private static List<(double TimeS, double Multiple)> MustTrip(IReadOnlyList<TimeLimitPoint> table, double top)
    {
        var points = new List<(double, double)> { (MaxDurationS, table[0].Multiple) };
        for (var i = 0; i < table.Count; i++)
        {
            var upper = i + 1 < table.Count ? table[i + 1].Multiple : top;
            points.Add((table[i].TimeS, table[i].Multiple));
            points.Add((table[i].TimeS, upper));
        }

        return points;
    }

    // The non-actuating boundary: left of it a compliant type S device holds. Below IΔn the time at IΔn holds, between
    // two multiples the one of the higher (a device is no faster at a smaller current).
    private static List<(double TimeS, double Multiple)> NonActuating(IReadOnlyList<TimeLimitPoint> table, double from, double top)
    {
        var points = new List<(double, double)>();
        var lower = from;
        foreach (var p in table)
        {
            points.Add((p.TimeS, lower));
            points.Add((p.TimeS, p.Multiple));
            lower = p.Multiple;
        }

        points.Add((table[^1].TimeS, top));
        return points;
    }

    private static LineSeries Step(string title, OxyColor colour, LineStyle style, List<(double TimeS, double Multiple)> points)
    {
        var series = new LineSeries { Title = title, Color = colour, LineStyle = style, StrokeThickness = 2, MarkerType = MarkerType.None };
        foreach (var (t, m) in points)
        {
            series.Points.Add(new DataPoint(t, m));
        }

        return series;
    }
}
