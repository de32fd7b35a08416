using System.Globalization;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="AnalysisOptions"/>: the documented defaults and every limit of <see cref="AnalysisOptions.Validate"/>
/// exactly at its edge and one step beyond it, with the setting and value named in the message.
/// </summary>
public class AnalysisOptionsTests
{
    [Fact]
    public void The_defaults_are_the_documented_ones()
    {
        var o = new AnalysisOptions();
        Assert.Null(o.MainsHz); // detect 50 or 60 Hz (doc comment)
        Assert.False(o.KeepGivenMains);
        Assert.Equal(0.002, o.RestBandA); // docs/methods.md I.4: W = 2 mA, engineering choice
        Assert.Null(o.AlarmA);
        Assert.Equal(6.0, o.TransientFactor); // docs/methods.md I.5: 6 × the window RMS
        Assert.Equal(1e-3, o.TransientFloorA); // docs/methods.md I.5: and 1 mA
        Assert.Empty(o.HalfCycleLevelsA);
        Assert.Equal(50, o.MaxHarmonicOrder); // IEC 61000-4-7: orders up to 50
        Assert.Equal(5, o.ToneCount);
        Assert.Equal(150_000, o.HighBandUpperHz); // IEC 61000-4-30 Annex C: 2 kHz bands up to 150 kHz
        Assert.Empty(o.Sinks);
        Assert.Null(o.WindowCompleted);
        Assert.Equal(Environment.ProcessorCount, o.WorkerCount);
        o.Validate();
    }

    public static TheoryData<AnalysisOptions> Accepted => new()
    {
        new AnalysisOptions { MainsHz = 1 },
        new AnalysisOptions { MainsHz = 1000 },
        new AnalysisOptions { MainsHz = 16.7 },
        new AnalysisOptions { RestBandA = 1 },
        new AnalysisOptions { RestBandA = double.Epsilon },
        new AnalysisOptions { AlarmA = double.Epsilon },
        new AnalysisOptions { TransientFactor = Math.BitIncrement(1.0) },
        new AnalysisOptions { HalfCycleLevelsA = [0, 0.03, 0.3] },
        new AnalysisOptions { WorkerCount = 1 },
        new AnalysisOptions { MaxHarmonicOrder = 1, ToneCount = 0 },
    };

    [Theory]
    [MemberData(nameof(Accepted))]
    public void Values_at_the_edge_of_each_range_are_accepted(AnalysisOptions options)
    {
        // The ranges of the doc comments and messages: mains 1 to 1000 Hz inclusive, rest band above 0 and up to 1 A,
        // alarm above 0, transient factor above 1, levels of at least 0 A, at least one worker, order at least 1 and
        // tone count not negative (common practice, no source: the edges themselves are inside the stated ranges).
        options.Validate();
    }

    [Theory]
    [InlineData(0.999)]
    [InlineData(1000.001)]
    [InlineData(double.NaN)]
    [InlineData(0.0)]
    public void A_mains_frequency_outside_1_to_1000_Hz_names_the_setting_and_the_value(double mainsHz)
    {
        var e = Assert.Throws<OptionValueException>(() => new AnalysisOptions { MainsHz = mainsHz }.Validate());
        Assert.Equal("MainsHz", e.Option);
        Assert.Equal(mainsHz.ToString(CultureInfo.InvariantCulture), e.Text);
        Assert.Equal("auto, 50, 60 or a frequency between 1 and 1000 Hz", e.Expected);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-0.002)]
    [InlineData(1.000001)]
    [InlineData(double.NaN)]
    public void A_rest_band_outside_0_to_1_A_names_the_setting_and_the_value(double restBandA)
    {
        var e = Assert.Throws<OptionValueException>(() => new AnalysisOptions { RestBandA = restBandA }.Validate());
        Assert.Equal("RestBandA", e.Option);
        Assert.Equal(restBandA.ToString(CultureInfo.InvariantCulture) + " A", e.Text);
        Assert.Equal("a current above 0 and up to 1 A, such as 2mA", e.Expected);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-0.03)]
    [InlineData(double.NaN)]
    public void An_alarm_current_that_is_not_positive_names_the_setting_and_the_value(double alarmA)
    {
        var e = Assert.Throws<OptionValueException>(() => new AnalysisOptions { AlarmA = alarmA }.Validate());
        Assert.Equal("AlarmA", e.Option);
        Assert.Equal(alarmA.ToString(CultureInfo.InvariantCulture), e.Text);
        Assert.Equal("a positive current such as 30mA", e.Expected);
    }

    [Theory]
    [InlineData(1.0)]
    [InlineData(0.5)]
    [InlineData(double.NaN)]
    public void A_transient_factor_of_1_or_less_is_refused(double factor)
    {
        // A peak can never exceed its RMS by a factor below 1 (the crest factor is at least 1; closed form).
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => new AnalysisOptions { TransientFactor = factor }.Validate());
        Assert.Equal("TransientFactor", e.ParamName);
        Assert.Contains("must be greater than 1", e.Message);
    }

    [Theory]
    [InlineData(-1e-300)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void A_trip_replay_level_below_0_or_not_finite_is_refused(double levelA)
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => new AnalysisOptions { HalfCycleLevelsA = [0.03, levelA] }.Validate());
        Assert.Equal("HalfCycleLevelsA", e.ParamName);
        Assert.Contains("levels must be finite and at least 0 A", e.Message);
    }

    [Fact]
    public void No_worker_is_refused()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => new AnalysisOptions { WorkerCount = 0 }.Validate());
        Assert.Equal("WorkerCount", e.ParamName);
        Assert.Contains("must be at least 1", e.Message);
    }

    [Theory]
    [InlineData(0, 5)]
    [InlineData(50, -1)]
    public void An_order_below_1_or_a_negative_tone_count_is_refused(int maxOrder, int toneCount)
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() =>
            new AnalysisOptions { MaxHarmonicOrder = maxOrder, ToneCount = toneCount }.Validate());
        Assert.Equal("MaxHarmonicOrder", e.ParamName);
        Assert.Contains("harmonic order must be at least 1 and the tone count not negative", e.Message);
    }
}
