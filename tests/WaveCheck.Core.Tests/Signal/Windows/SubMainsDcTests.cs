using MathNet.Numerics.IntegralTransforms;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class SubMainsDcTests
{
    private const double RateHz = 50_000;
    private const int Window = 10_000; // 10 cycles at 50 Hz (IEC 61000-4-7 window)

    private static (double[] X, double[] Bins, double Mean, double AcRms) Make(Func<double, double> signal)
    {
        var x = new double[Window];
        for (var n = 0; n < Window; n++)
        {
            x[n] = signal(n / RateHz);
        }

        // Reference spectrum from MathNet.Numerics (a general-purpose library), scaled to mean square per bin.
        var complex = x.Select(v => new System.Numerics.Complex(v, 0)).ToArray();
        Fourier.Forward(complex, FourierOptions.NoScaling);
        var bins = new double[(Window / 2) + 1];
        bins[0] = Math.Pow(complex[0].Real / Window, 2);
        for (var k = 1; k < bins.Length; k++)
        {
            bins[k] = 2 * Math.Pow(complex[k].Magnitude / Window, 2);
        }

        var mean = x.Average();
        var acRms = Math.Sqrt(x.Select(v => (v - mean) * (v - mean)).Average());
        return (x, bins, mean, acRms);
    }

    [Theory]
    [InlineData(12.0, 0.0)]
    [InlineData(12.0, 0.003)]
    [InlineData(17.3, -0.002)]
    [InlineData(33.0, 0.001)]
    public void A_motor_frequency_that_does_not_fit_the_window_does_not_read_as_dc(double motorHz, double dcA)
    {
        // Closed form: the mean of β cycles of a sine is Ipk·(1 − cos 2πβ)/(2πβ) away from zero; at 12 Hz in 200 ms
        // (β = 2.4) and 9.8 mA peak that is 1.2 mA of false DC. The fit must recover the true DC within 0.1 mA
        // (engineering tolerance: a tenth of the 1 mA significance floor), beside a mains component.
        var (x, bins, mean, acRms) = Make(t => dcA + (0.0098 * Math.Sin(2 * Math.PI * motorHz * t))
                                               + (0.0098 * Math.Sin(2 * Math.PI * 50 * t)));
        if (motorHz == 12.0 && dcA == 0.0)
        {
            Assert.True(Math.Abs(mean) > 0.001, $"the plain mean is biased: {mean}");
        }

        Assert.Equal(dcA, SubMainsDc.Estimate(x, bins, 10, mean, acRms), 0.0001);
    }

    [Fact]
    public void Without_sub_mains_content_the_mean_is_kept()
    {
        // A sine of whole cycles on 4 mA DC: the plain mean is exact (closed form), so nothing is fitted.
        var (x, bins, mean, acRms) = Make(t => 0.004 + (0.02 * Math.Sin(2 * Math.PI * 50 * t)));
        Assert.Equal(mean, SubMainsDc.Estimate(x, bins, 10, mean, acRms));
        Assert.Equal(0.004, mean, 1e-12);
    }

    [Fact]
    public void A_whole_number_of_motor_cycles_changes_nothing()
    {
        // 10 Hz in 200 ms is two whole cycles: the mean is already the DC (closed form); the fit must agree.
        var (x, bins, mean, acRms) = Make(t => 0.002 + (0.01 * Math.Sin(2 * Math.PI * 10 * t)));
        Assert.Equal(0.002, SubMainsDc.Estimate(x, bins, 10, mean, acRms), 1e-6);
    }
}
