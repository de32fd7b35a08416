using WaveCheck.Core.Model;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// The per-figure window statistics: every figure under its published name, the signed figures treated as signed,
/// figures a window lacks left out, each against hand-computed means, numpy-style percentiles and maxima.
/// </summary>
public class WindowMetricsTests
{
    // The names as they appear in WindowsResult.Statistics (the JSON output), with the getter that fills a window with
    // a value; signed per MetricAccumulator's remarks: DC, smooth DC and the negative peak keep their sign.
    private static readonly (string Name, bool Signed, Func<WindowResult, double, WindowResult> Set)[] Figures =
    [
        ("frequencyHz", false, (w, v) => w with { FrequencyHz = v }),
        ("rmsA", false, (w, v) => w with { RmsA = v }),
        ("dcA", true, (w, v) => w with { DcA = v }),
        ("acRmsA", false, (w, v) => w with { AcRmsA = v }),
        ("peakPositiveA", false, (w, v) => w with { PeakPositiveA = v }),
        ("peakNegativeA", true, (w, v) => w with { PeakNegativeA = v }),
        ("crestFactor", false, (w, v) => w with { CrestFactor = v }),
        ("smoothDcA", true, (w, v) => w with { SmoothDcA = v }),
        ("currentDelayAngleDeg", false, (w, v) => w with { CurrentDelayAngleDeg = v }),
        ("mainsRmsA", false, (w, v) => w with { MainsRmsA = v }),
        ("belowMainsRmsA", false, (w, v) => w with { BelowMainsRmsA = v }),
        ("harmonicsRmsA", false, (w, v) => w with { HarmonicsRmsA = v }),
        ("above1kHzRmsA", false, (w, v) => w with { Above1kHzRmsA = v }),
        ("above9kHzRmsA", false, (w, v) => w with { Above9kHzRmsA = v }),
        ("thdPercent", false, (w, v) => w with { ThdPercent = v }),
    ];

    public static TheoryData<int> FigureIndices()
    {
        var data = new TheoryData<int>();
        for (var i = 0; i < Figures.Length; i++)
        {
            data.Add(i);
        }

        return data;
    }

    // Every figure distinct (1, 2, 3, ...) so that a figure read from the wrong field is seen.
    private static WindowResult Distinct(double startS, double scale)
    {
        var w = Blank(startS);
        for (var i = 0; i < Figures.Length; i++)
        {
            w = Figures[i].Set(w, scale * (i + 1));
        }

        return w;
    }

    // Every figure zero (frequency, delay angle and THD included, so that none is left out as missing).
    private static WindowResult Blank(double startS) =>
        WindowSlots.Result(startS, 0) with { FrequencyHz = 0, CurrentDelayAngleDeg = 0, ThdPercent = 0 };

    [Fact]
    public void NoWindowsGiveEveryFigureAllNaN()
    {
        // Documented edge case (MetricAccumulator): all NaN when nothing was added; every name is still present.
        var result = new WindowMetrics().Result();
        Assert.Equal(Figures.Select(f => f.Name).Order(StringComparer.Ordinal), result.Keys.Order(StringComparer.Ordinal));
        Assert.All(result.Values, s => Assert.Equal(new MetricStatistics(double.NaN, double.NaN, double.NaN, double.NaN), s));
    }

    [Fact]
    public void EachFigureIsReportedUnderItsOwnName()
    {
        // Closed form: two windows holding i+1 and 3(i+1) in figure i give mean 2(i+1), max 3(i+1) at the second
        // window's start, and the 95th percentile of two values by linear interpolation (numpy.percentile default):
        // v1 + 0.95 (v2 − v1) = 2.9 (i+1). 1e-12 relative: one rounding per operation.
        var metrics = new WindowMetrics();
        metrics.Add(Distinct(0.0, 1));
        metrics.Add(Distinct(0.2, 3));
        var result = metrics.Result();
        Assert.Equal(Figures.Length, result.Count);
        for (var i = 0; i < Figures.Length; i++)
        {
            var s = result[Figures[i].Name];
            var v = i + 1.0;
            Assert.True(Math.Abs(s.Mean - (2 * v)) <= 1e-12 * v, $"{Figures[i].Name} mean {s.Mean}");
            Assert.True(Math.Abs(s.P95 - (2.9 * v)) <= 1e-12 * v, $"{Figures[i].Name} p95 {s.P95}");
            Assert.Equal(3 * v, s.Max);
            Assert.Equal(0.2, s.TimeOfMaxS);
        }
    }

    [Theory]
    [MemberData(nameof(FigureIndices))]
    public void SignedFiguresKeepTheLargestMagnitudeWithItsSign(int index)
    {
        // Windows reading −3 (at 0 s) then 2 (at 0.2 s) in one figure. Mean −0.5 either way. Signed (MetricAccumulator
        // remarks): max is the value of largest magnitude, −3 at 0 s, and the 95th percentile is that of the
        // magnitudes {2, 3}, 2 + 0.95 = 2.95, given the max's sign: −2.95. Unsigned: max 2 at 0.2 s and the 95th
        // percentile of {−3, 2}, −3 + 0.95 x 5 = 1.75 (numpy.percentile, linear). 1e-12 absolute: rounding.
        var (name, signed, set) = Figures[index];
        var metrics = new WindowMetrics();
        metrics.Add(set(Blank(0.0), -3));
        metrics.Add(set(Blank(0.2), 2));
        var s = metrics.Result()[name];
        Assert.Equal(-0.5, s.Mean, 1e-12);
        Assert.Equal(signed ? -2.95 : 1.75, s.P95, 1e-12);
        Assert.Equal(signed ? -3 : 2, s.Max);
        Assert.Equal(signed ? 0.0 : 0.2, s.TimeOfMaxS);
    }

    [Fact]
    public void FiguresAWindowLacksAreLeftOut()
    {
        // Documented: no delay angle or THD in a window (null) leaves that window out of those figures only.
        // Angles 30° (0 s), none (0.2 s), 90° (0.4 s): mean 60, max 90 at 0.4 s, p95 30 + 0.95 x 60 = 87 (numpy
        // linear percentile of the two present values). The other figures see all three windows.
        var metrics = new WindowMetrics();
        metrics.Add(Blank(0.0) with { CurrentDelayAngleDeg = 30, ThdPercent = 12, RmsA = 1 });
        metrics.Add(Blank(0.2) with { CurrentDelayAngleDeg = null, ThdPercent = null, RmsA = 4 });
        metrics.Add(Blank(0.4) with { CurrentDelayAngleDeg = 90, ThdPercent = 6, RmsA = 1 });
        var result = metrics.Result();
        Assert.Equal(new MetricStatistics(60, 87, 90, 0.4), Round(result["currentDelayAngleDeg"]));
        Assert.Equal(new MetricStatistics(9, 11.7, 12, 0.0), Round(result["thdPercent"]));
        Assert.Equal(new MetricStatistics(2, 3.7, 4, 0.2), Round(result["rmsA"])); // mean 6/3, p95 of {1,1,4}: 1 + 0.9 x 3

        // A window with neither: both stay all NaN while the others have values.
        var none = new WindowMetrics();
        none.Add(Blank(0.0) with { CurrentDelayAngleDeg = null, ThdPercent = null, RmsA = 1 });
        var r = none.Result();
        Assert.Equal(new MetricStatistics(double.NaN, double.NaN, double.NaN, double.NaN), r["currentDelayAngleDeg"]);
        Assert.Equal(new MetricStatistics(double.NaN, double.NaN, double.NaN, double.NaN), r["thdPercent"]);
        Assert.Equal(new MetricStatistics(1, 1, 1, 0), r["rmsA"]);
    }

    // Rounds to 1e-12 so that hand values compare as records (one or two roundings in the percentile interpolation).
    private static MetricStatistics Round(MetricStatistics s) =>
        new(Math.Round(s.Mean, 12), Math.Round(s.P95, 12), Math.Round(s.Max, 12), Math.Round(s.TimeOfMaxS, 12));
}
