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

    /// <summary>Top of the y axis as a multiple of the highest bin: room above the highest peak for two rows of labels
    /// (range labels, then tone labels) on the log axis.</summary>
    public const double HeadroomFactor = 15;

    /// <summary>Font size of the range and tone labels, points.</summary>
    private const double LabelFontSize = 11;

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
        var yMax = Math.Max(peakMa * HeadroomFactor, floorMa * 1000);

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

        var rangeLabels = AddTypeRanges(model, mainsHz, xMin, xMax);
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
        var marks = AddToneMarks(model, analysis.Components.Tones, floorMa, xMin, xMax);

        // Labels last, on the laid-out plot: none overlaps another or a tone's marker, none runs past the plot area.
        var placer = new LabelPlacer(model, x, y);
        PlaceRangeLabels(placer, rangeLabels);
        PlaceToneLabels(placer, marks);
        return model;
    }

    private static List<(string Label, double LowHz, double HighHz, bool Narrow)> AddTypeRanges(PlotModel model, double mainsHz, double xMin, double xMax)
    {
        var labels = new List<(string, double, double, bool)>();
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

            // The mains band is a narrow stripe: its label goes beside it, not inside.
            labels.Add((range.Label, low, high, i == ranges.Count - 1));
        }

        // A legend entry that says what the shading means.
        model.Series.Add(new AreaSeries { Title = "shading: range a device type is specified for", Fill = OxyColor.FromAColor(140, PlotStyle.SkyBlue), Color = OxyColors.Transparent });
        return labels;
    }

    /// <summary>Each range's label near the top of its stretch: inside it from the left, else ending at its right
    /// edge, else beside it (the narrow mains band), moving down a row at a time until it fits.</summary>
    private static void PlaceRangeLabels(LabelPlacer placer, List<(string Label, double LowHz, double HighHz, bool Narrow)> labels)
    {
        foreach (var (label, lowHz, highHz, narrow) in labels)
        {
            var size = placer.Measure(label, LabelFontSize, new OxyThickness(2, 1, 2, 1));
            var left = placer.ToScreen(lowHz, 1).X;
            var right = Math.Min(placer.ToScreen(highHz, 1).X, placer.Area.Right);
            var xs = narrow
                ? new[] { right + 4, left - 4 - size.Width }
                : new[] { left + 4, right - 4 - size.Width, right + 4 };
            placer.Place(label, LabelFontSize, Rows(placer.Area.Top + 4, size.Height, 4).SelectMany(y => xs.Select(x => new ScreenPoint(x, y))),
                OxyColor.FromAColor(215, OxyColors.White));
        }
    }

    /// <summary>Each tone's label beside its marker: above right, above left, higher rows, level with it, below.</summary>
    private static void PlaceToneLabels(LabelPlacer placer, List<(ToneValue Tone, double YMa)> marks)
    {
        // Markers first: no label may cover another tone's marker.
        var points = marks.Select(m => placer.ToScreen(m.Tone.FrequencyHz, m.YMa)).ToList();
        foreach (var p in points)
        {
            placer.Reserve(p, 6);
        }

        for (var i = 0; i < marks.Count; i++)
        {
            var text = $"{ToneLabel(marks[i].Tone.FrequencyHz)}: {CurrentText.WithUnit(marks[i].Tone.RmsA)}";
            var size = placer.Measure(text, LabelFontSize, new OxyThickness(2, 1, 2, 1));
            var p = points[i];
            // Over its own marker first (centred, then shifted either way), a row higher at a time, then level with
            // it and below; never across another tone's line, where it would read as that tone's label.
            var candidates = new List<ScreenPoint>();
            double[] shares = [0.5, 0.6, 0.4, 0.7, 0.3, 0.8, 0.2, 0.9, 0.1, 1.0, 0.0];
            for (var row = 0; row < 4; row++)
            {
                var top = p.Y - 8 - size.Height - (row * (size.Height + 3));
                candidates.AddRange(shares.Select(f => new ScreenPoint(p.X - (f * size.Width), top)));
            }

            candidates.Add(new ScreenPoint(p.X + 9, p.Y - (size.Height / 2)));
            candidates.Add(new ScreenPoint(p.X - 9 - size.Width, p.Y - (size.Height / 2)));
            for (var row = 0; row < 8; row++)
            {
                var top = p.Y + 8 + (row * (size.Height + 3));
                candidates.AddRange(shares.Select(f => new ScreenPoint(p.X - (f * size.Width), top)));
            }

            var others = points.Where((_, j) => j != i).Select(o => o.X).ToList();
            candidates.RemoveAll(c => others.Any(x => x > c.X - 8 && x < c.X + size.Width + 8));
            placer.Place(text, LabelFontSize, candidates, OxyColor.FromAColor(210, OxyColors.White));
        }
    }

    private static IEnumerable<double> Rows(double top, double height, int count)
    {
        for (var row = 0; row < count; row++)
        {
            yield return top + (row * (height + 3));
        }
    }

    private static void AddHarmonicMarkers(PlotModel model, AnalysisResult analysis, double mainsHz, double xMin, double xMax, double floorMa, double yMax)
    {
        // Strongest orders first; a label closer than about 30 px (plot area ~90 % of the width) to one already placed is dropped so none overlap.
        var minimumRatio = Math.Pow(xMax / xMin, 30.0 / (0.9 * PlotStyle.WidthPx));
        var level = TableSignificance.LevelA(analysis);
        var significant = analysis.Harmonics.Where(h => h.Order is >= 1 and <= 50 && TableSignificance.Significant(h.RmsA, level))
            .Select(h => h.Order).ToHashSet();
        var labelled = new HashSet<int>();
        if (significant.Contains(1))
        {
            labelled.Add(1);
        }

        foreach (var harmonic in analysis.Harmonics.Where(h => h.Order > 1 && significant.Contains(h.Order)).OrderByDescending(h => h.RmsA))
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
            if (!significant.Contains(order))
            {
                continue;
            }

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

        if (significant.Count > 0)
        {
            model.Series.Add(new LineSeries { Title = "significant harmonic orders (Hn labelled where strongest)", Color = OxyColor.FromRgb(0x70, 0x70, 0x70), LineStyle = LineStyle.Dash });
        }
    }

    private static List<(ToneValue Tone, double YMa)> AddToneMarks(PlotModel model, IReadOnlyList<ToneValue> tones, double floorMa, double xMin, double xMax)
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
        var shown = new List<(ToneValue, double)>();
        foreach (var tone in tones)
        {
            if (shown.Count == MaxToneLabels)
            {
                break;
            }

            if (tone.FrequencyHz < xMin || tone.FrequencyHz > xMax)
            {
                continue;
            }

            var yMa = Math.Max(PlotStyle.AxisMilliamps(tone.RmsA), floorMa);
            marks.Points.Add(new ScatterPoint(tone.FrequencyHz, yMa));
            shown.Add((tone, yMa));
        }

        if (marks.Points.Count > 0)
        {
            model.Series.Add(marks);
        }

        return shown;
    }

    /// <summary>A tone's frequency for a label: <c>4.2 kHz</c>, <c>160 Hz</c>.</summary>
    internal static string ToneLabel(double hz) => hz >= 1000
        ? (hz / 1000).ToString("0.##", CultureInfo.InvariantCulture) + " kHz"
        : hz.ToString("0.#", CultureInfo.InvariantCulture) + " Hz";
}
