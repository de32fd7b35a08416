using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class WindowPhasorTests
{
    [Theory]
    [InlineData(10_000, 0L)]
    [InlineData(10_006, 123_456_789L)]
    public void Precomputed_kernel_gives_the_same_phasor_as_three_correlations(int length, long start)
    {
        // Identity cos θn = ½(e^{iθn} + e^{−iθn}): the Hann-weighted correlation done as one dot product with a
        // precomputed kernel must equal the three plain correlations it expands into, to rounding (1e-9 of the
        // magnitude), also far into a capture (start 123 456 789, about 41 minutes at 50 kS/s).
        var random = new Random(11);
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = (0.01 * Math.Sin((2 * Math.PI * 50.02 * (start + n) / 50_000) + 0.3)) + (0.003 * Math.Sin(2 * Math.PI * 37 * n / 50_000))
                   + (1e-4 * (random.NextDouble() - 0.5));
        }

        var mean = x.Average();
        var a = MainsFrequency.WindowPhasor(x, 50_000, 50, start, mean);
        var b = new PhasorKernel(length, 50_000, 50).Phasor(x, start, mean);
        var magnitude = Math.Sqrt((a.Re * a.Re) + (a.Im * a.Im));
        Assert.Equal(a.Re, b.Re, magnitude * 1e-9);
        Assert.Equal(a.Im, b.Im, magnitude * 1e-9);
        Assert.Equal(a.RmsA, b.RmsA, a.RmsA * 1e-9);

        // And the RMS is that of the 50.02 Hz component, 10 mA peak (closed form peak/√2), within Hann leakage of the
        // 37 Hz tone (about 2 % of 3 mA) and the 0.02 Hz offset.
        Assert.Equal(0.01 / Math.Sqrt(2), b.RmsA, 0.0003);
    }
}
