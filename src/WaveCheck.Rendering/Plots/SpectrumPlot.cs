using System.Globalization;
using OxyPlot;
using OxyPlot.Annotations;
using OxyPlot.Axes;
using OxyPlot.Series;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Rendering.Plots;

/// <summary>
/// RMS per frequency bin on log-log axes from below mains to Nyquist, with harmonic orders marked, the strongest
/// tones labelled, and the frequency ranges of the device types shaded behind the data.
/// </summary>
public static class SpectrumPlot
{
    /// <summary>Most tones labelled.</summary>
    public const int MaxToneLabels = 5;

    /// <summary>Most harmonic orders labelled (the strongest, plus order 1).</summary>
    public const int MaxHarmonicLabels = 6;

    /// <summary>Lowest value drawn as a share of the highest bin (engineering choice: 100 dB of range shows a
    /// drive's switching tones under a mains-dominated spectrum without drawing the noise floor of a 24-bit recorder).</summary>
    public const double FloorShare = 1e-5;

    /// <summary>Lowest drawn value, milliamperes (1 µA: below any residual current of interest).</summary>
    public const double AbsoluteFloorMa = 1e-3;

    /// <summary>Builds the spectrum. Non-finite bins are left as gaps and do not set the axis range.</summary>
    /// <param name="analysis">Reads <see cref="AnalysisResult.Spectrum"/>, <see cref="AnalysisResult.Harmonics"/>, <see cref="ComponentsResult.Tones"/>, <see cref="AnalysisResult.Mains"/>.</param>
    /// <param name="assessment">Unused beyond the title today; accepted for a uniform signature.</param>
    public static PlotModel Build(AnalysisResult analysis, AssessmentResult? assessment)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        var spectrum = analysis.Spectrum;
        var mainsHz = analysis.Mains.FrequencyHz > 0 ? analysis.Mains.FrequencyHz : Math.Max(analysis.Mains.NominalHz, 50);
        var count = Math.Min(spectrum.FrequenciesHz.Count, spectrum.RmsA.Count);
        var nyquistHz = analysis.Capture.NyquistHz > 0
            ? analysis.Capture.NyquistHz
            : count > 0 ? spectrum.FrequenciesHz[count - 1] : mainsHz * 100;
        var firstHz = count > 1 && spectrum.FrequenciesHz[1] > 0 ? spectrum.FrequenciesHz[1] : mainsHz / 10;
        var xMin = Math.Min(firstHz, mainsHz / 2);
        var xMax = Math.Max(nyquistHz, xMin * 10);

        var peakMa = 0.0;
        for (var i = 1; i < count; i++)
        {
            var valueMa = PlotStyle.AxisMilliamps(spectrum.RmsA[i]);
            if (double.IsFinite(valueMa))
            {
                peakMa = Math.Max(peakMa, valueMa);
            }
        }

        var floorMa = Math.Max(peakMa * FloorShare, AbsoluteFloorMa);
        var yMax = Math.Max(peakMa * 4, floorMa * 1000);

        var dcA = count > 0 ? spectrum.RmsA[0] : 0;
        var subtitle = string.Create(CultureInfo.InvariantCulture,
            $"bin width {spectrum.ResolutionHz:0.###} Hz; DC (0 Hz, not on the log axis): {CurrentText.WithUnit(dcA)}; smooth DC {CurrentText.WithUnit(analysis.Components.SmoothDcA)}");
        var model = PlotStyle.NewModel("Spectrum of the residual current (RMS per bin)", subtitle);
        var x = PlotStyle.Log(AxisPosition.Bottom, "frequency", "Hz");
        x.Minimum = xMin;
        x.Maximum = xMax;
        x.StringFormat = "0.#####";
        model.Axes.Add(x);
        var y = PlotStyle.Log(AxisPosition.Left, "RMS", "mA");
        y.Minimum = floorMa;
        y.Maximum = yMax;
        y.StringFormat = "0.#####";
        model.Axes.Add(y);

        AddTypeRanges(model, mainsHz, xMin, xMax, yMax);
        AddHarmonicMarkers(model, analysis, mainsHz, xMin, xMax, floorMa, yMax);

        var line = new LineSeries
        {
            Title = "RMS per bin",
            Color = PlotStyle.Blue,
            StrokeThickness = 1.2,
        };
        var bins = new List<DataPoint>(Math.Max(count - 1, 0));
        for (var i = 1; i < count; i++)
        {
            bins.Add(new DataPoint(spectrum.FrequenciesHz[i], Math.Max(PlotStyle.AxisMilliamps(spectrum.RmsA[i]), floorMa)));
        }

        // Tens of thousands of bins at high sample rates: keep each pixel column's extremes, not every bin.
        MinMaxThinning.Add(bins, line.Points, PlotStyle.WidthPx, logX: true);

        model.Series.Add(line);
        AddTones(model, analysis.Components.Tones, floorMa, xMin, xMax);
        return model;
    }

    private static void AddTypeRanges(PlotModel model, double mainsHz, double xMin, double xMax, double yMax)
    {
        // Fills differ in hue and in lightness so they stay apart in greyscale; the uncovered stretch is hatched-free white.
        var fills = new[]
        {
            OxyColor.FromAColor(55, PlotStyle.SkyBlue),
            OxyColor.FromAColor(40, PlotStyle.BluishGreen),
            OxyColors.Transparent,
            OxyColor.FromAColor(90, PlotStyle.Orange),
        };
        var ranges = DeviceFrequencyRanges.For(mainsHz);
        for (var i = 0; i < ranges.Count; i++)
        {
            var range = ranges[i];
            var low = Math.Max(range.LowHz, xMin);
            var high = Math.Min(range.HighHz, xMax);
            if (low >= high)
            {
                continue;
            }

            model.Annotations.Add(new RectangleAnnotation
            {
                MinimumX = low,
                MaximumX = high,
                Fill = fills[i],
                Layer = AnnotationLayer.BelowSeries,
            });

            var isMains = i == ranges.Count - 1;
            model.Annotations.Add(new TextAnnotation
            {
                Text = range.Label,
                TextPosition = new DataPoint(isMains ? high : low, yMax),
                TextHorizontalAlignment = HorizontalAlignment.Left,
                TextVerticalAlignment = VerticalAlignment.Top,
                Offset = new ScreenVector(3, isMains ? 20 : 3),
                FontSize = 11,
                Padding = new OxyThickness(2, 1, 2, 1),
                Stroke = OxyColors.Transparent,
                Background = OxyColor.FromAColor(215, OxyColors.White),
                TextColor = PlotStyle.Black,
                Layer = AnnotationLayer.AboveSeries,
            });
        }

        // A legend entry that says what the shading means.
        model.Series.Add(new AreaSeries { Title = "shading: range a device type is specified for", Fill = OxyColor.FromAColor(140, PlotStyle.SkyBlue), Color = OxyColors.Transparent });
    }

    private static void AddHarmonicMarkers(PlotModel model, AnalysisResult analysis, double mainsHz, double xMin, double xMax, double floorMa, double yMax)
    {
        // Strongest orders first; a label closer than about 30 px (plot area ~90 % of the width) to one already placed is dropped so none overlap.
        var minimumRatio = Math.Pow(xMax / xMin, 30.0 / (0.9 * PlotStyle.WidthPx));
        var labelled = new HashSet<int> { 1 };
        foreach (var harmonic in analysis.Harmonics.Where(h => h.Order > 1 && h.RmsA > 0).OrderByDescending(h => h.RmsA))
        {
            if (labelled.Count == MaxHarmonicLabels)
            {
                break;
            }

            if (labelled.All(o => Math.Max(o, harmonic.Order) / (double)Math.Min(o, harmonic.Order) >= minimumRatio))
            {
                labelled.Add(harmonic.Order);
            }
        }

        for (var order = 1; order <= 50 && order * mainsHz <= xMax; order++)
        {
            var label = labelled.Contains(order);
            model.Annotations.Add(new LineAnnotation
            {
                Type = LineAnnotationType.Vertical,
                X = order * mainsHz,
                Color = label ? OxyColor.FromRgb(0x70, 0x70, 0x70) : OxyColor.FromRgb(0xC8, 0xC8, 0xC8),
                LineStyle = label ? LineStyle.Dash : LineStyle.Solid,
                StrokeThickness = label ? 1 : 0.6,
                MinimumY = floorMa,
                MaximumY = yMax,
                Text = label ? $"H{order}" : null,
                TextOrientation = AnnotationTextOrientation.Horizontal,
                TextHorizontalAlignment = HorizontalAlignment.Center,
                TextVerticalAlignment = VerticalAlignment.Bottom,
                TextLinePosition = 0.0,
                TextPadding = 2,
                FontSize = 11,
                TextColor = PlotStyle.Black,
                Layer = AnnotationLayer.BelowSeries,
            });
        }

        model.Series.Add(new LineSeries { Title = "harmonic orders (Hn labelled where strongest)", Color = OxyColor.FromRgb(0x70, 0x70, 0x70), LineStyle = LineStyle.Dash });
    }

    private static void AddTones(PlotModel model, IReadOnlyList<ToneValue> tones, double floorMa, double xMin, double xMax)
    {
        var marks = new ScatterSeries
        {
            Title = "strongest non-harmonic tones",
            MarkerType = MarkerType.Diamond,
            MarkerSize = 5,
            MarkerFill = PlotStyle.Vermillion,
            MarkerStroke = PlotStyle.Black,
            MarkerStrokeThickness = 0.8,
        };
        var shown = 0;
        foreach (var tone in tones)
        {
            if (shown == MaxToneLabels)
            {
                break;
            }

            if (tone.FrequencyHz < xMin || tone.FrequencyHz > xMax)
            {
                continue;
            }

            var yMa = Math.Max(PlotStyle.AxisMilliamps(tone.RmsA), floorMa);
            marks.Points.Add(new ScatterPoint(tone.FrequencyHz, yMa));
            model.Annotations.Add(new TextAnnotation
            {
                Text = $"{ToneLabel(tone.FrequencyHz)}: {CurrentText.WithUnit(tone.RmsA)}",
                TextPosition = new DataPoint(tone.FrequencyHz, yMa),
                TextHorizontalAlignment = tone.FrequencyHz > xMax / 8 ? HorizontalAlignment.Right : HorizontalAlignment.Left,
                TextVerticalAlignment = VerticalAlignment.Bottom,
                Offset = new ScreenVector(0, -6 - (14 * (shown % 2))),
                FontSize = 11,
                Stroke = OxyColors.Transparent,
                Background = OxyColor.FromAColor(210, OxyColors.White),
                TextColor = PlotStyle.Black,
                Layer = AnnotationLayer.AboveSeries,
            });
            shown++;
        }

        if (marks.Points.Count > 0)
        {
            model.Series.Add(marks);
        }
    }

    /// <summary>A tone's frequency for a label: <c>4.2 kHz</c>, <c>160 Hz</c>.</summary>
    internal static string ToneLabel(double hz) => hz >= 1000
        ? (hz / 1000).ToString("0.##", CultureInfo.InvariantCulture) + " kHz"
        : hz.ToString("0.#", CultureInfo.InvariantCulture) + " Hz";
}
