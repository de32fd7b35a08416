using WaveCheck.Core.Capture;

namespace WaveCheck.Core.Tests.Capture;

/// <summary>The one rule for typed quantities (issue 14): the unit is part of the value; a bare number is refused
/// with the reading it most likely meant. SI prefixes as defined by the SI brochure (BIPM): m = 1e-3, u/µ = 1e-6,
/// k = 1e3.</summary>
public sealed class QuantityTests
{
    [Theory]
    [InlineData("30mA", 0.030)]
    [InlineData("0.03A", 0.030)]
    [InlineData("0.03 A", 0.030)]
    [InlineData(" 30 mA ", 0.030)]
    [InlineData("300uA", 300e-6)]
    [InlineData("300µA", 300e-6)]
    [InlineData("1e-2A", 0.010)]
    [InlineData("-5mA", -0.005)]
    public void A_current_with_its_unit_is_read_in_amperes(string text, double amperes) =>
        Assert.Equal(amperes, Quantity.ParseCurrentA("--rated", text), 1e-15);

    [Theory]
    [InlineData("30", "30mA")]       // 1 or more: a residual current of whole amperes is rare, of milliamperes common
    [InlineData("300", "300mA")]
    [InlineData("0.03", "0.03A")]    // below 1: a fraction of an ampere
    [InlineData("0", "0A")]
    public void A_bare_current_is_refused_with_a_suggestion(string text, string suggestion)
    {
        var e = Assert.Throws<OptionValueException>(() => Quantity.ParseCurrentA("--rated", text));
        Assert.Equal($"--rated: cannot use '{text}': expected {Quantity.CurrentForm}; did you mean {suggestion}?", e.Message);
        Assert.DoesNotContain('\n', e.Message);
    }

    [Fact]
    public void Voltages_frequencies_and_sensitivities_follow_the_same_rule()
    {
        Assert.Equal(0.5, Quantity.ParseVoltageV("--range", "500mV"), 1e-15);
        Assert.Equal(20_000, Quantity.ParseFrequencyHz("--rate", "20 kHz"), 1e-9);
        Assert.Equal(10, Quantity.ParseSensitivityVPerA("--sensitivity", "10 mV/mA"), 1e-12);   // 10 mV/mA = 10 V/A
        Assert.Equal(0.1, Quantity.ParseSensitivityVPerA("--sensitivity", "100mV/A"), 1e-15);

        Assert.EndsWith("did you mean 1V?", Assert.Throws<OptionValueException>(() => Quantity.ParseVoltageV("--range", "1")).Message);
        Assert.EndsWith("did you mean 50Hz?", Assert.Throws<OptionValueException>(() => Quantity.ParseFrequencyHz("--mains", "50")).Message);
        Assert.EndsWith("did you mean 10 mV/mA?", Assert.Throws<OptionValueException>(() => Quantity.ParseSensitivityVPerA("--sensitivity", "10")).Message);
        // A current where a frequency is expected is no frequency, and gets no suggestion.
        Assert.Equal($"--rate: cannot use '10mA': expected {Quantity.FrequencyForm}",
            Assert.Throws<OptionValueException>(() => Quantity.ParseFrequencyHz("--rate", "10mA")).Message);
    }

    [Fact]
    public void A_bare_duration_stays_seconds()
    {
        // Durations are not among the quantities whose unit was read two ways; 10min = 600 s, 1h = 3600 s.
        Assert.Equal(2, Quantity.ParseDurationS("--duration", "2"), 1e-15);
        Assert.Equal(600, Quantity.ParseDurationS("--duration", "10min"), 1e-12);
        Assert.Equal(0.5, Quantity.ParseDurationS("--duration", "500ms"), 1e-15);
    }

    [Theory]
    [InlineData(0.03, "30mA")]
    [InlineData(1.0, "1A")]
    [InlineData(0.0001, "0.1mA")]
    [InlineData(0.42, "420mA")]
    public void A_current_is_written_back_as_it_is_typed_and_reads_back_the_same(double amperes, string text)
    {
        Assert.Equal(text, Quantity.CurrentAsTyped(amperes));
        Assert.Equal(amperes, Quantity.ParseCurrentA("x", text), 1e-15);   // round trip
    }

    [Theory]
    [InlineData(50.0, "50Hz")]
    [InlineData(50_000.0, "50kHz")]
    public void A_frequency_is_written_back_as_it_is_typed(double hertz, string text)
    {
        Assert.Equal(text, Quantity.FrequencyAsTyped(hertz));
        Assert.Equal(hertz, Quantity.ParseFrequencyHz("x", text), 1e-9);
    }
}
