using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>Counterexamples the verdict properties found in the sub-mains DC estimate, kept as named cases.</summary>
public class SubMainsDcRegressionTests
{
    [Theory]
    [InlineData(0)]
    [InlineData(385)]
    [InlineData(3717)]
    public void Motor_frequency_beside_a_larger_mains_current_gives_no_dc_at_any_window_position(int shift)
    {
        // Closed form: 10.75 mA at 50 Hz plus 4.86 mA at 11.1 Hz has no DC. With 2.22 motor cycles per 200 ms window
        // the DC and the tone's negative-frequency image raise bin 1 above bin 3 for some window positions, and the
        // old "larger neighbour" refinement read the tone as about 9 Hz: 1.2 mA of DC that is not there, and type B
        // instead of F. Every window's estimate must stay within 0.15 mA (0.15 of the 1 mA DC significance).
        const double Fs = 50_000;
        var x = new double[50_000];
        for (var i = 0; i < x.Length; i++)
        {
            var t = (i + shift) / Fs;
            x[i] = (Math.Sqrt(2) * 0.010753 * Math.Sin(2 * Math.PI * 50 * t))
                + (Math.Sqrt(2) * 0.004862 * Math.Sin((2 * Math.PI * 11.1 * t) + (17 * Math.PI / 180)));
        }

        var plans = new SpectrumPlans();
        for (var w = 0; w < 5; w++)
        {
            var window = x.AsSpan(w * 10_000, 10_000);
            var power = new double[5_001];
            plans.For(window.Length).Power(window, power);
            var (sum, squares, _, _) = SampleMath.Moments(window);
            var mean = sum / window.Length;
            var ac = Math.Sqrt((squares / window.Length) - (mean * mean));
            Assert.InRange(SubMainsDc.Estimate(window, power, 10, mean, ac), -0.00015, 0.00015);
        }
    }
}
