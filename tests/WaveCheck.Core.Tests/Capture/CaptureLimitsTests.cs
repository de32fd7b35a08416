using CsCheck;
using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

public class CaptureLimitsTests
{
    /// <summary>The obviously-correct scan the vectorised one must agree with.</summary>
    private static int SlowIndexOfInvalid(double[] values)
    {
        for (var i = 0; i < values.Length; i++)
        {
            if (double.IsNaN(values[i]) || double.IsInfinity(values[i]) || Math.Abs(values[i]) > CaptureLimits.MaxSampleMagnitude)
            {
                return i;
            }
        }

        return -1;
    }

    [Fact]
    public void The_vectorised_finite_check_finds_the_same_first_bad_sample_as_a_plain_loop()
    {
        // Fast path against a slow one (CONVENTIONS: tests). Bad values planted at random places among finite ones,
        // lengths that are and are not whole vectors.
        double[] bad = [double.NaN, double.PositiveInfinity, double.NegativeInfinity, 1.0000001e12, -2e12, double.MaxValue];
        var gen = Gen.Select(Gen.Int[0, 300], Gen.Int[0, 3], Gen.Int[0, 1000], Gen.Int[0, bad.Length - 1], Gen.Int[0, 1000])
            .Select((length, planted, seed, kind, at) =>
            {
                var random = new Random(seed);
                var values = new double[length];
                for (var i = 0; i < length; i++)
                {
                    values[i] = (random.NextDouble() - 0.5) * 2e12; // up to the bound, inclusive side
                }

                for (var p = 0; p < planted && length > 0; p++)
                {
                    values[(at + (p * 37)) % length] = bad[(kind + p) % bad.Length];
                }

                return values;
            });
        gen.Sample(values => Assert.Equal(SlowIndexOfInvalid(values), CaptureLimits.IndexOfInvalid(values)),
            seed: "000000000vwFf", iter: 2000);
    }

    [Fact]
    public void The_bound_itself_is_accepted_and_the_next_double_is_not()
    {
        var limit = CaptureLimits.MaxSampleMagnitude;
        Assert.Equal(-1, CaptureLimits.IndexOfInvalid([limit, -limit, 0, 1e-300]));
        Assert.Equal(1, CaptureLimits.IndexOfInvalid([0, Math.BitIncrement(limit)]));
    }

    [Theory]
    [InlineData(1.0, true)]
    [InlineData(10_000_000.0, true)]
    [InlineData(0.999, false)]
    [InlineData(10_000_001.0, false)]
    [InlineData(double.NaN, false)]
    [InlineData(double.PositiveInfinity, false)]
    public void Sample_rates_are_held_to_1_Hz_to_10_MHz(double rateHz, bool accepted) =>
        Assert.Equal(accepted, CaptureLimits.RateProblem(rateHz) is null);

    [Theory]
    [InlineData(0.0, false)]
    [InlineData(1e-12, true)]
    [InlineData(-1e9, true)]
    [InlineData(1e308, false)]
    [InlineData(double.NaN, false)]
    public void Scale_factors_must_be_finite_non_zero_and_bounded(double factor, bool accepted) =>
        Assert.Equal(accepted, CaptureLimits.ScaleProblem("multiplier", factor, "A") is null);

    [Fact]
    public void Shown_text_keeps_a_message_on_one_line()
    {
        Assert.Equal("a\\nb\\r\\tc\\x1B[2J", ShownText.Of("a\nb\r\tc\u001b[2J"));
        Assert.Equal(new string('x', 60) + "...", ShownText.Of(new string('x', 100)));
        var ex = new CaptureFormatException("odd\nname.csv", "cell 'x\ny' is bad", 3, 2);
        Assert.DoesNotContain('\n', ex.Message);
        Assert.Equal("odd\\nname.csv:3:2: cell 'x\\ny' is bad", ex.Message);
    }
}
