using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary><see cref="TouchCurrentNetworks.Discretise"/>'s argument checks: which argument, and the messages.</summary>
public class TouchCurrentNetworksMutantTests
{
    [Fact]
    public void A_missing_network_is_refused_by_name()
    {
        // Common practice, no source: a null argument is an ArgumentNullException naming it, not a NullReferenceException.
        var e = Assert.Throws<ArgumentNullException>(() => TouchCurrentNetworks.Discretise(null!, 50_000));
        Assert.Equal("analog", e.ParamName);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-1000.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void A_rate_that_is_not_a_positive_finite_number_of_hertz_is_refused_with_the_value(double sampleRateHz)
    {
        // Conventions (Errors and bad input): the message states the expected range and the value received.
        var e = Assert.Throws<ArgumentOutOfRangeException>(() =>
            TouchCurrentNetworks.Discretise(TouchCurrentNetworks.Perception(), sampleRateHz));
        Assert.Equal("sampleRateHz", e.ParamName);
        Assert.Equal(sampleRateHz, e.ActualValue);
        Assert.Contains("sample rate must be a positive number of hertz", e.Message);
    }

    [Fact]
    public void A_third_order_network_is_refused_with_its_order()
    {
        // The bilinear sections are biquads (order at most 2); conventions: the message states the limit and the value.
        var cubic = new AnalogTransferFunction([1.0], [1.0, 1e-3, 1e-7, 1e-11]);
        var e = Assert.Throws<ArgumentException>(() => TouchCurrentNetworks.Discretise(cubic, 50_000));
        Assert.Equal("analog", e.ParamName);
        Assert.Contains("order must be at most 2 (got 3)", e.Message);
    }
}
