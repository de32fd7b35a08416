using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// <see cref="MeasuredFigures.From"/> on constructed analyses: which figure comes from the worst window and which from
/// the whole capture, magnitudes, the mains frequency used, the harmonics kept (orders 2 up to 1 kHz, IEC 62423's
/// type B range; REFERENCE "Device types", std), the content above 20 kHz (B+ range, DIN VDE 0664-400; REFERENCE,
/// std), and which tones count as a motor frequency or AC at another frequency. Expected values are closed forms of
/// the constructed inputs (Parseval: orthogonal parts add in quadrature; REFERENCE "Closed forms").
/// </summary>
public class MeasuredFiguresTests
{
    private const double Tol = 1e-12;

    private static AnalysisResult WithStatistics(AnalysisResult a, Dictionary<string, MetricStatistics> statistics) =>
        a with { Windows = a.Windows with { Statistics = statistics } };

    private static MetricStatistics Max(double v) => new(0, 0, v, 1.0);

    private static AnalysisResult WithTones(double mainsHz, params ToneValue[] tones)
    {
        var a = new AnalysisBuilder().Mains(mainsHz).Sine(0.002).Build();
        return a with { Components = a.Components with { Tones = tones } };
    }

    // ---- Worst window against whole capture --------------------------------------------------------------------

    [Fact]
    public void A_window_maximum_above_the_capture_value_is_the_figure_by_magnitude()
    {
        var a = WithStatistics(new AnalysisBuilder().Sine(0.004).SmoothDc(0.002).BelowMains(0.001).HighFrequency(5000, 0.0005).Build(), new()
        {
            ["rmsA"] = Max(0.009),
            ["dcA"] = Max(-0.007), // signed statistic: the largest magnitude, sign kept (MetricStatistics)
            ["mainsRmsA"] = Max(0.006),
            ["belowMainsRmsA"] = Max(0.003),
            ["above1kHzRmsA"] = Max(0.002),
        });
        var f = MeasuredFigures.From(a);
        Assert.Equal(0.009, f.WindowRmsA, Tol);
        Assert.Equal(0.007, f.DcMeanA, Tol);
        Assert.Equal(0.006, f.MainsA, Tol);
        Assert.Equal(0.003, f.BelowMainsA, Tol);
        Assert.Equal(0.002, f.Above1kA, Tol);
    }

    [Fact]
    public void A_capture_value_above_the_window_maximum_is_the_figure()
    {
        // Each window statistic a tenth of a milliampere: the capture values of the constructed waveform win.
        var built = new AnalysisBuilder().Sine(0.004).SmoothDc(-0.002).BelowMains(0.001).HighFrequency(5000, 0.0005).Build();
        var a = WithStatistics(built, new()
        {
            ["rmsA"] = Max(1e-4),
            ["dcA"] = Max(-1e-4),
            ["mainsRmsA"] = Max(1e-4),
            ["belowMainsRmsA"] = Max(1e-4),
            ["above1kHzRmsA"] = Max(1e-4),
        });
        var f = MeasuredFigures.From(a);
        // Parseval: RMS² = DC² + Σ AC parts² (REFERENCE "Closed forms").
        Assert.Equal(Math.Sqrt((0.002 * 0.002) + (0.004 * 0.004) + (0.001 * 0.001) + (0.0005 * 0.0005)), f.WindowRmsA, Tol);
        Assert.Equal(0.002, f.DcMeanA, Tol); // magnitude of a negative mean
        Assert.Equal(0.004, f.MainsA, Tol);
        Assert.Equal(0.001, f.BelowMainsA, Tol);
        Assert.Equal(0.0005, f.Above1kA, Tol);
        // The signed mean and the worst window's signed smooth DC, as magnitudes where the figure is one.
        Assert.Equal(-0.002, f.CaptureMeanA, Tol);
        Assert.Equal(0.002, f.SmoothDcA, Tol);
    }

    [Theory]
    [InlineData(false, 0.0)] // no windows: no statistics at all
    [InlineData(true, double.NaN)]
    [InlineData(true, double.PositiveInfinity)]
    [InlineData(true, double.NegativeInfinity)]
    public void Missing_or_non_finite_window_maxima_fall_back_to_the_capture_values(bool present, double windowMaxA)
    {
        var built = new AnalysisBuilder().Sine(0.004).SmoothDc(-0.003).BelowMains(0.001).HighFrequency(5000, 0.0005).Build();
        var statistics = new Dictionary<string, MetricStatistics>();
        if (present)
        {
            foreach (var key in new[] { "rmsA", "dcA", "mainsRmsA", "belowMainsRmsA", "above1kHzRmsA" })
            {
                statistics[key] = Max(windowMaxA);
            }
        }

        var f = MeasuredFigures.From(WithStatistics(built, statistics));
        Assert.Equal(Math.Sqrt((0.003 * 0.003) + (0.004 * 0.004) + (0.001 * 0.001) + (0.0005 * 0.0005)), f.WindowRmsA, Tol);
        Assert.Equal(0.003, f.DcMeanA, Tol);
        Assert.Equal(0.004, f.MainsA, Tol);
        Assert.Equal(0.001, f.BelowMainsA, Tol);
        Assert.Equal(0.0005, f.Above1kA, Tol);
    }

    // ---- Mains frequency and harmonics -------------------------------------------------------------------------

    [Theory]
    [InlineData(49.5, 50.0, 49.5)] // measured frequency used when there is one
    [InlineData(0.0, 60.0, 60.0)] // none measured: the nominal
    [InlineData(-1.0, 50.0, 50.0)]
    public void The_mains_frequency_is_the_measured_one_else_the_nominal(double measuredHz, double nominalHz, double expectedHz)
    {
        var a = new AnalysisBuilder().Sine(0.002).Build();
        a = a with { Mains = new MainsResult(measuredHz, nominalHz, "test", measuredHz, measuredHz, "test") };
        Assert.Equal(expectedHz, MeasuredFigures.From(a).MainsHz);
    }

    [Fact]
    public void Harmonics_from_order_two_to_one_kilohertz_are_kept_at_their_frequency_or_order_times_mains()
    {
        // Measured mains 49.5 Hz (nominal 50): a group reported without a frequency sits at order × 49.5 Hz.
        var a = new AnalysisBuilder().Sine(0.003).Build();
        a = a with
        {
            Mains = new MainsResult(49.5, 50, "detected", 49.4, 49.6, "test"),
            Harmonics =
            [
                new HarmonicValue(1, 49.5, 0.004, 0.005),
                new HarmonicValue(3, 0, 0.002, 0.002),
                new HarmonicValue(5, 251, 0.001, 0.0015),
                new HarmonicValue(20, 990, 0.0006, 0.0008),
                new HarmonicValue(21, 1039.5, 0.009, 0.009), // above 1 kHz: not type B's harmonic range (IEC 62423)
            ],
        };
        var f = MeasuredFigures.From(a);
        Assert.Equal([(3 * 49.5, 0.002), (251.0, 0.0015), (990.0, 0.0008)], f.HarmonicsTo1k);
        // Root-sum-square of the kept groups (Parseval), each at its larger of RMS and window maximum.
        Assert.Equal(Math.Sqrt((0.002 * 0.002) + (0.0015 * 0.0015) + (0.0008 * 0.0008)), f.HarmonicsTo1kA, Tol);
        // Group 1 (5 mA at its worst) is the mains figure: above the 3 mA of the components and their window maximum.
        Assert.Equal(0.005, f.MainsA, Tol);
    }

    [Fact]
    public void The_mains_figure_keeps_the_components_value_when_group_one_is_smaller()
    {
        var a = new AnalysisBuilder().Sine(0.003).Build();
        a = a with { Harmonics = [new HarmonicValue(1, 50, 0.001, 0.0015)] };
        Assert.Equal(0.003, MeasuredFigures.From(a).MainsA, Tol);
    }

    [Fact]
    public void A_harmonic_group_at_the_one_kilohertz_edge_is_kept_and_one_just_above_it_is_not()
    {
        // The edge is 1 kHz (IEC 62423) plus 1 µHz for rounding of order × mains.
        var edgeHz = Limits.TypeBUpperFrequencyHz + 1e-6;
        var a = new AnalysisBuilder().Sine(0.003).Build();
        a = a with
        {
            Harmonics = [new HarmonicValue(20, edgeHz, 0.001, 0.001), new HarmonicValue(21, Math.BitIncrement(edgeHz), 0.002, 0.002)],
        };
        var f = MeasuredFigures.From(a);
        Assert.Equal([(edgeHz, 0.001)], f.HarmonicsTo1k);
        Assert.Equal(0.001, f.HarmonicsTo1kA, Tol);
    }

    // ---- Above 20 kHz --------------------------------------------------------------------------------------------

    [Fact]
    public void Only_bands_centred_above_twenty_kilohertz_count_as_above_it()
    {
        // 2 kHz bands from 9 kHz (REFERENCE "Measurement methods"): 17-19, 19-21 (centred on 20 kHz, B+'s own range,
        // DIN VDE 0664-400) and 21-23 kHz.
        var a = new AnalysisBuilder().HighFrequency(18_000, 0.001).HighFrequency(20_000, 0.003).HighFrequency(22_000, 0.004).Build();
        a = a with
        {
            Bands = [new BandValue(17_000, 19_000, 0.001, 0.001), new BandValue(19_000, 21_000, 0.003, 0.003), new BandValue(21_000, 23_000, 0.004, 0.004)],
        };
        var f = MeasuredFigures.From(a);
        Assert.Equal(Math.Sqrt(26e-6), f.Above1kA, Tol); // 1² + 3² + 4² (mA², Parseval)
        Assert.Equal(0.004, f.Above20kA, Tol);
        Assert.Equal(Math.Sqrt(10e-6), f.From1kTo20kA, Tol); // 1² + 3²
    }

    [Fact]
    public void Above_twenty_kilohertz_never_exceeds_above_one_kilohertz()
    {
        // Band maxima come from different windows; the figure is bounded by the content above 1 kHz that holds it.
        var a = new AnalysisBuilder().HighFrequency(22_000, 0.004).Build();
        a = a with { Bands = [new BandValue(21_000, 23_000, 0.004, 0.006)] };
        var f = MeasuredFigures.From(a);
        Assert.Equal(0.004, f.Above20kA, Tol);
        Assert.Equal(0.0, f.From1kTo20kA, Tol);
    }

    // ---- Tones -----------------------------------------------------------------------------------------------------

    [Theory]
    // Mains 50 Hz. Below 1 Hz: not a tone the analysis resolves.
    [InlineData(50.0, 0.5)]
    [InlineData(50.0, 0.9999)]
    // At or within 5 % of mains of a harmonic (Limits.HarmonicToneToleranceFraction: 2.5 Hz at 50 Hz): that harmonic.
    [InlineData(50.0, 50.0)]
    [InlineData(50.0, 47.5)]
    [InlineData(50.0, 152.0)]
    [InlineData(50.0, 152.5)]
    [InlineData(50.0, 147.5)]
    [InlineData(50.0, 150.0)]
    [InlineData(50.0, 997.5)]
    // Above 1 kHz (type B's range ends there, IEC 62423), even when not a harmonic: 1010 Hz is 10 Hz from order 20.
    [InlineData(50.0, 1010.0)]
    [InlineData(60.0, 1000.0001)]
    public void Tones_below_1_Hz_above_1_kHz_or_at_a_harmonic_are_neither_motor_nor_other(double mainsHz, double toneHz)
    {
        var f = MeasuredFigures.From(WithTones(mainsHz, new ToneValue(toneHz, 0.004)));
        Assert.Null(f.MotorTone);
        Assert.Null(f.OtherTone);
    }

    [Theory]
    // Up to 2 × mains a motor frequency (Limits.MotorFrequencyTopMultiple; REFERENCE: drive output 0 to ~100 Hz).
    [InlineData(50.0, 1.0, true)]
    [InlineData(50.0, 10.0, true)]
    [InlineData(50.0, 47.4, true)] // 2.6 Hz from mains: outside the 2.5 Hz tolerance
    [InlineData(50.0, 97.0, true)] // 3 Hz below order 2
    // Above 2 × mains up to 1 kHz: AC at another frequency.
    [InlineData(50.0, 103.0, false)]
    [InlineData(50.0, 152.6, false)]
    [InlineData(50.0, 147.4, false)]
    [InlineData(60.0, 1000.0, false)] // 1 kHz is 20 Hz from order 17 at 60 Hz: kept, at the range's top
    public void Tones_off_the_harmonics_are_motor_up_to_twice_mains_and_other_above(double mainsHz, double toneHz, bool motor)
    {
        var tone = new ToneValue(toneHz, 0.004);
        var f = MeasuredFigures.From(WithTones(mainsHz, tone));
        Assert.Equal(motor ? tone : null, f.MotorTone);
        Assert.Equal(motor ? null : tone, f.OtherTone);
    }

    [Fact]
    public void The_strongest_tone_of_each_kind_is_kept_and_the_first_among_equals()
    {
        var f = MeasuredFigures.From(WithTones(50,
            new ToneValue(10, 0.002), new ToneValue(20, 0.003), new ToneValue(30, 0.001),
            new ToneValue(330, 0.002), new ToneValue(410, 0.005), new ToneValue(560, 0.001)));
        Assert.Equal(new ToneValue(20, 0.003), f.MotorTone);
        Assert.Equal(new ToneValue(410, 0.005), f.OtherTone);

        var ties = MeasuredFigures.From(WithTones(50,
            new ToneValue(10, 0.002), new ToneValue(20, 0.002), new ToneValue(330, 0.004), new ToneValue(410, 0.004)));
        Assert.Equal(new ToneValue(10, 0.002), ties.MotorTone);
        Assert.Equal(new ToneValue(330, 0.004), ties.OtherTone);
    }
}
