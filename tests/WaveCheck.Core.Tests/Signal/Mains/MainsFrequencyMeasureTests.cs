using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>The phase method (<see cref="MainsFrequency.MeasureWindow"/>) and the window phasor on short synthetic
/// windows: its refusals, the RMS of the component, the frequency from the phase advance, the sample tail.</summary>
public class MainsFrequencyMeasureTests
{
    private static double[] Sine(int length, double sampleRateHz, double frequencyHz, double peakA, double phaseRad,
        double dcA = 0)
    {
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = dcA + (peakA * Math.Sin((2 * Math.PI * frequencyHz * n / sampleRateHz) + phaseRad));
        }

        return x;
    }

    [Theory]
    [InlineData(150, 10, 1)] // stretch round(1·150/50) = 3 samples: fewer than 4
    [InlineData(1000, 20, 1)] // stretch 20 = the whole window: the two stretches coincide (offset 0)
    [InlineData(1000, 15, 1)] // stretch 20 longer than the window (offset −5)
    [InlineData(1000, 200, 0)] // no cycle asked for
    public void RefusesStretchesTooShortOrNotApart(double sampleRateHz, int length, int halfCycles)
    {
        // Contract of MeasureWindow (doc comment): null when the window is too short; a phase advance needs two
        // stretches of at least 4 samples at a positive offset (offset 0 would divide 0 by 0).
        var x = Sine(length, sampleRateHz, 50, 0.01, 0.7);
        var measured = MainsFrequency.MeasureWindow(x, sampleRateHz, 50, halfCycles, 0, out _);
        Assert.Null(measured);
    }

    [Theory]
    [InlineData(200, 8)] // stretch exactly 4 samples (one 50 Hz cycle at 200 Hz), offset 4
    [InlineData(1000, 40)] // one cycle (20 samples) per stretch, offset 20
    public void MeasuresWithTheShortestStretchesAllowed(double sampleRateHz, int length)
    {
        // Closed form: a 50 Hz sine repeats after a whole number of cycles, so the second stretch (one or more cycles
        // later) gives the same phasor and the phase advance is 0: exactly the reference, 50 Hz (to rounding).
        var x = Sine(length, sampleRateHz, 50, 0.01, 0.7);
        var measured = MainsFrequency.MeasureWindow(x, sampleRateHz, 50, 1, 0, out var rmsA);
        Assert.NotNull(measured);
        Assert.Equal(50, measured.Value, 1e-9);
        Assert.True(rmsA > 0);
    }

    [Theory]
    [InlineData(0.7)]
    [InlineData(2.3)]
    [InlineData(-1.9)]
    public void GivesTheRmsOfASineOverWholeCycles(double phaseRad)
    {
        // Closed form: a 10 mA peak sine has RMS 10/√2 = 7.0711 mA. Stretches of 5 whole cycles (100 samples at
        // 1 kHz); the Hann weights sum to (L − 1)/2. What is left is the negative-frequency image under the symmetric
        // Hann window, 4.8e-5 of the value (numpy 1.24, direct sum), hence the tolerance 1e-4 relative.
        var x = Sine(200, 1000, 50, 0.01, phaseRad);
        var measured = MainsFrequency.MeasureWindow(x, 1000, 50, 5, 0, out var rmsA);
        Assert.NotNull(measured);
        Assert.Equal(0.01 / Math.Sqrt(2), rmsA, 0.01 / Math.Sqrt(2) * 1e-4);
    }

    [Theory]
    [InlineData(50.3, 0.7, 0)]
    [InlineData(50.3, 0.7, 0.004)]
    [InlineData(49.2, -1.2, 0)]
    [InlineData(51.1, 2.9, 0.002)]
    public void ReadsTheFrequencyFromThePhaseAdvance(double frequencyHz, double phaseRad, double dcA)
    {
        // Closed form: a sine at f correlated at the reference 50 Hz turns by 2π(f − 50)·offset/fs between the two
        // stretches; 0.2 s at 1 kHz, stretches of 5 cycles, offset 100 samples: unambiguous within ±5 Hz. The sine's
        // frequency comes back within 5e-4 Hz (numpy 1.24, the same sums directly: the negative-frequency image pulls
        // by 4.7e-6 Hz at 50.3 Hz, 2.3e-4 Hz at 49.2 Hz); the DC is removed by the mean passed in.
        var x = Sine(200, 1000, frequencyHz, 0.01, phaseRad, dcA);
        var measured = MainsFrequency.MeasureWindow(x, 1000, 50, 5, dcA, out var rmsA);
        Assert.NotNull(measured);
        Assert.Equal(frequencyHz, measured.Value, 5e-4);
        Assert.Equal(0.01 / Math.Sqrt(2), rmsA, 0.01 / Math.Sqrt(2) * 0.01);
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void GivesNoFrequencyWhenOneStretchIsEmpty(bool emptyFirst)
    {
        // Closed form: exact zeros (with mean 0) correlate to exactly 0, so one of the two phasors has no phase and
        // no frequency can be read (null), though the other stretch carries a 10 mA sine.
        var x = Sine(200, 1000, 50, 0.01, 0.7);
        var zeros = emptyFirst ? x.AsSpan(0, 100) : x.AsSpan(100, 100);
        zeros.Clear();
        var measured = MainsFrequency.MeasureWindow(x, 1000, 50, 5, 0, out var rmsA);
        Assert.Null(measured);
        // The RMS is still the mean of the two stretches': half the sine's (tolerance as for whole cycles above).
        Assert.Equal(0.01 / Math.Sqrt(2) / 2, rmsA, 0.01 / Math.Sqrt(2) * 1e-4);
    }

    [Theory]
    [InlineData(10, 0.021304793231312538, -0.016229333548349264, 0.0084168290093771)]
    [InlineData(11, 0.02184515642545908, -0.02083013662148742, 0.008537472464014663)]
    public void WindowPhasorOfALengthNotAMultipleOfFourCountsItsLastSamples(int length, double re, double im,
        double rmsA)
    {
        // numpy 1.24, the definition summed directly: Σ (x_n − 0.002)·(½ − ½cos(2πn/(L − 1)))·e^{−iω(7 + n)},
        // ω = 2π·50/1000, x_n = 3 mA + 10 mA·sin(2π·50·(7 + n)/1000 + 0.4) + 2 mA·cos(2π·130·n/1000);
        // RMS = |sum|·√2/((L − 1)/2). L = 10 and 11 leave 2 and 3 samples after the groups of four.
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = 0.003 + (0.01 * Math.Sin((2 * Math.PI * 50 * (7 + n) / 1000) + 0.4))
                   + (0.002 * Math.Cos(2 * Math.PI * 130 * n / 1000));
        }

        var phasor = MainsFrequency.WindowPhasor(x, 1000, 50, 7, 0.002);
        Assert.Equal(re, phasor.Re, 1e-15);
        Assert.Equal(im, phasor.Im, 1e-15);
        Assert.Equal(rmsA, phasor.RmsA, 1e-15);
    }

    [Fact]
    public void WindowPhasorOfOneSampleHasNoComponent()
    {
        // Closed form: the Hann weight of a one-sample window is 0 (½ − ½cos 0), and its RMS is defined as 0, not the
        // 0/0 the formula would give.
        var phasor = MainsFrequency.WindowPhasor([0.01], 1000, 50, 3, 0);
        Assert.Equal(0, phasor.RmsA);
    }
}
