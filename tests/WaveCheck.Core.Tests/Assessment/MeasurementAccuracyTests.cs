using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Tests.Assessment;

/// <summary>
/// <see cref="MeasurementAccuracy"/> on exact binary fractions, so every boundary of the comparison is hit exactly:
/// accuracy 25 % + 62.5 mA and a figure of 0.5 A give the uncertainty 0.25·0.5 + 0.0625 = 0.1875 A, so the figure
/// spans 0.3125 to 0.6875 A (closed form, no rounding in binary).
/// </summary>
public class MeasurementAccuracyTests
{
    private static readonly MeasurementAccuracy Wide = new(0.25, 0.0625);

    [Theory]
    [InlineData(0.5, 0.1875)]
    [InlineData(-0.5, 0.1875)] // a signed figure (DC of either polarity): its magnitude counts
    [InlineData(0.0, 0.0625)]
    public void Uncertainty_is_a_share_of_the_reading_plus_an_offset(double valueA, double expectedA)
    {
        Assert.Equal(expectedA, Wide.UncertaintyA(valueA));
    }

    [Theory]
    [InlineData(0.5, 0.3125, LimitState.Above)]     // lower bound exactly on the limit: reaches it
    [InlineData(0.5, 0.3126, LimitState.AtLimit)]   // lower bound just under it
    [InlineData(0.5, 0.6875, LimitState.AtLimit)]   // upper bound exactly on the limit: could reach it
    [InlineData(0.5, 0.6876, LimitState.Below)]     // upper bound under it
    [InlineData(-0.5, 0.3125, LimitState.Above)]    // magnitude compared
    [InlineData(-0.5, 0.6876, LimitState.Below)]
    [InlineData(0.0, 0.0625, LimitState.AtLimit)]   // a zero figure is known only to the offset
    [InlineData(0.0, 0.0626, LimitState.Below)]
    public void A_figure_is_above_at_or_below_a_limit_by_its_bounds(double valueA, double limitA, LimitState expected)
    {
        Assert.Equal(expected, Wide.Compare(valueA, limitA));
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NegativeInfinity)]
    public void A_figure_that_is_not_a_number_is_at_the_limit(double valueA)
    {
        // Engineering choice, the safe side: a figure that could not be measured counts as reaching any limit.
        Assert.Equal(LimitState.AtLimit, Wide.Compare(valueA, 1));
        Assert.Equal(LimitState.AtLimit, MeasurementAccuracy.Default.Compare(valueA, 1e-9));
    }

    [Fact]
    public void The_default_is_two_percent_plus_a_tenth_of_a_milliampere()
    {
        // Engineering choice stated in docs/methods.md §2.4; 6 mA ± 0.22 mA against type A's 6 mA: at the limit.
        Assert.Equal(new MeasurementAccuracy(0.02, 0.0001), MeasurementAccuracy.Default);
        Assert.Equal("2%+0.1mA", MeasurementAccuracy.Default.ToString());
        Assert.Equal(LimitState.AtLimit, MeasurementAccuracy.Default.Compare(0.006, 0.006));
        Assert.Equal("25%+62.5mA", Wide.ToString());
    }

    [Theory]
    [InlineData("50%", 0.5, 0)]           // the largest share accepted
    [InlineData("0%", 0, 0)]
    [InlineData("100mA", 0, 0.1)]         // the largest offset accepted
    [InlineData("1% + 1%", 0.02, 0)]      // parts add up
    [InlineData("2 % + 0.1 mA", 0.02, 0.0001)] // spaces inside a part are dropped
    [InlineData("0.1mA+2%", 0.02, 0.0001)]
    public void Parse_accepts_the_ends_of_its_ranges(string text, double fraction, double offsetA)
    {
        var a = MeasurementAccuracy.Parse(text);
        Assert.Equal(fraction, a.ReadingFraction, 1e-15);
        Assert.Equal(offsetA, a.OffsetA, 1e-15);
    }

    [Theory]
    [InlineData("50.001%")]
    [InlineData("-1%")]
    [InlineData("100.1mA")]
    [InlineData("+2%")]
    [InlineData("2%+ +0.1mA")]
    [InlineData("x%")]
    [InlineData("2%+abc")]
    [InlineData("2%+0.5A")]
    [InlineData("0.25")]                  // a current without its unit: one rule for units (issue 14)
    public void Parse_rejects_what_lies_outside_with_the_option_and_the_text(string text)
    {
        var ex = Assert.Throws<OptionValueException>(() => MeasurementAccuracy.Parse(text, "--site-accuracy"));
        Assert.Equal($"--site-accuracy: cannot use '{text}': expected a share of the reading plus a current, such as 2%+0.1mA (0 to 50 % and 0 to 100 mA)", ex.Message);
        Assert.Equal("--site-accuracy", ex.Option);
    }

    [Fact]
    public void Parse_of_nothing_names_the_empty_text()
    {
        var ex = Assert.Throws<OptionValueException>(() => MeasurementAccuracy.Parse(null!));
        Assert.Equal("Accuracy", ex.Option);
        Assert.Equal(string.Empty, ex.Text);
    }

    [Theory]
    [InlineData("2%+0.1mA", 0.02, 0.0001)]
    [InlineData("0.5 % + 20 uA", 0.005, 0.00002)]
    [InlineData("3%", 0.03, 0)]
    [InlineData("0.2mA", 0, 0.0002)]
    public void Accuracy_parses_share_of_reading_and_offset(string text, double fraction, double offsetA)
    {
        // Closed form of the text: percent / 100, current in amperes.
        var a = MeasurementAccuracy.Parse(text);
        Assert.Equal(fraction, a.ReadingFraction, 1e-12);
        Assert.Equal(offsetA, a.OffsetA, 1e-12);
    }

    [Theory]
    [InlineData("")]
    [InlineData("two percent")]
    [InlineData("80%")]
    [InlineData("2%+")]
    [InlineData("1A")]
    public void Accuracy_rejects_what_it_cannot_use_with_the_option_name(string text)
    {
        var ex = Assert.Throws<OptionValueException>(() => MeasurementAccuracy.Parse(text));
        Assert.StartsWith("Accuracy", ex.Message, StringComparison.Ordinal);
    }
}
