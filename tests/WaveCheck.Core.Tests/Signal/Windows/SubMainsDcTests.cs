using MathNet.Numerics.IntegralTransforms;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class SubMainsDcTests
{
    // The fit now carries the mains fundamental (10 cycles per window) as a regressor and returns the residual too;
    // these closed-form cases have no mains part, so its coefficient is zero and the constant is as before.
    private static double Fit(double[] x, double omega, double meanA) =>
        SubMainsDc.FitConstant(x, omega, 2 * Math.PI * 10 / Math.Max(1, x.Length), meanA)?.Constant ?? meanA;

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

    // ---- Closed forms for the least-squares fit and the peak search ----------------------------------------------

    /// <summary>x_n = c + A·sin(2πβn/N + φ), n = 0..N−1: a tone of β cycles per window on a constant.</summary>
    private static double[] ToneOnDc(int length, double dcA, double peakA, double cycles, double phaseRad)
    {
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = dcA + (peakA * Math.Sin((2 * Math.PI * cycles * n / length) + phaseRad));
        }

        return x;
    }

    /// <summary>Closed form (geometric series, the Dirichlet kernel): (1/N)·Σ sin(ωn + φ) over n = 0..N−1
    /// = Im(e^{iφ}·(1 − e^{iωN}) / (1 − e^{iω})) / N.</summary>
    private static double MeanOfSine(int length, double cycles, double phaseRad)
    {
        var omega = 2 * Math.PI * cycles / length;
        var sum = System.Numerics.Complex.FromPolarCoordinates(1, phaseRad)
            * (1 - System.Numerics.Complex.FromPolarCoordinates(1, omega * length))
            / (1 - System.Numerics.Complex.FromPolarCoordinates(1, omega));
        return sum.Imaginary / length;
    }

    /// <summary>Large-N Dirichlet kernel of the rectangular window, sin(πx)/(πx): the magnitude of bin k for a tone
    /// x = k − β bins away, relative to an on-bin tone (the negative-frequency image left out).</summary>
    private static double Kernel(double x) => Math.Abs(x) < 1e-12 ? 1 : Math.Sin(Math.PI * x) / (Math.PI * x);

    /// <summary>A spectrum (mean square per bin, bin 0 = DC) made from the kernel: bin k holds (A²/2)·D(k − β)², bin 0
    /// the DC's c² as well. For it the two-bin ratio r of the peak and its larger neighbour is exactly δ/(1 − δ), so
    /// the refinement δ = r/(1 + r) returns β itself and the fit is exact.</summary>
    private static double[] KernelSpectrum(int bins, double dcA, double peakA, double cycles)
    {
        var power = new double[bins];
        for (var k = 0; k < bins; k++)
        {
            var d = Kernel(k - cycles);
            power[k] = peakA * peakA / 2 * d * d;
        }

        power[0] += dcA * dcA;
        return power;
    }

    public static TheoryData<double, double> CyclesAndPhases()
    {
        var data = new TheoryData<double, double>();
        foreach (var cycles in new[] { 1.3, 2.4, 3.75, 7.1 })
        {
            foreach (var phase in new[] { 0.0, 0.7, Math.PI / 2, 2.2, Math.PI, 4.4, 5.9 })
            {
                data.Add(cycles, phase);
            }
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(CyclesAndPhases))]
    public void The_fit_returns_the_constant_of_a_tone_on_dc_whatever_its_phase(double cycles, double phaseRad)
    {
        // Closed form: a signal that lies in the span of {1, cos ωn, sin ωn} is reproduced exactly by least squares
        // (the normal equations have its coefficients as their only solution), so the fitted constant is c for every
        // phase φ, while the plain mean is off by A·Im(e^{iφ}(1 − e^{iωN})/(1 − e^{iω}))/N (geometric series). The
        // bias changes sign with φ, so a sign slip in a sum, the determinant or Cramer's rule shows in some row.
        // 10 000 samples: the rotating phasor is re-anchored every 1024 samples, so ten blocks are crossed.
        const double dcA = 0.003, peakA = 0.01;
        var x = ToneOnDc(Window, dcA, peakA, cycles, phaseRad);
        var mean = x.Average();
        Assert.Equal(dcA + (peakA * MeanOfSine(Window, cycles, phaseRad)), mean, 1e-12);

        var omega = 2 * Math.PI * cycles / Window;
        // Tolerance 1e-10 A: rounding of 10⁴ sums of order 10⁴ (relative 1e-12 of the sums), far below any slip.
        Assert.Equal(dcA, Fit(x, omega, mean), 1e-10);
        // The mean passed in only centres the samples for conditioning: any value gives the same constant.
        Assert.Equal(dcA, Fit(x, omega, 0), 1e-10);
        Assert.Equal(dcA, Fit(x, omega, -0.02), 1e-10);
    }

    [Fact]
    public void The_fit_at_the_wrong_frequency_is_not_exact()
    {
        // Guards the test above against a fit that ignores ω: at 2.4 cycles fitted as 2.0, the 2.4-cycle tone is not in
        // the model's span and the constant is off (here by more than 0.1 mA on a 10 mA tone; closed form of the
        // mean bias at φ = 0: A·(1 − cos 2πβ)/(2πβ) ≈ 0.86 mA, which the 2-cycle fit only partly removes).
        var x = ToneOnDc(Window, 0.003, 0.01, 2.4, 0);
        Assert.True(Math.Abs(Fit(x, 2 * Math.PI * 2.0 / Window, x.Average()) - 0.003) > 1e-4);
    }

    [Fact]
    public void A_singular_fit_keeps_the_mean()
    {
        // ω = 0: cos ωn = 1 and sin ωn = 0 for every n, so the normal matrix has a column equal to the constant's and
        // a zero column: singular (a pivot of exactly 0 in the elimination), and the plain mean is returned, not 0/0
        // or a constant of noise. (The guard is now a pivot below 1e-9·N in Gaussian elimination with partial
        // pivoting, since the fit also carries the mains fundamental; the determinant thresholds of the 3 × 3 fit no
        // longer apply.)
        var x = ToneOnDc(Window, 0.003, 0.01, 2.4, 0.5);
        var mean = x.Average();
        Assert.Equal(mean, Fit(x, 0, mean));
        // An empty window: no sums at all (N = 0), the mean given is returned.
        Assert.Equal(0.001, Fit([], 0.1, 0.001));
        // One cycle per window is well conditioned: fitted, not the mean.
        var y = ToneOnDc(Window, 0.003, 0.01, 1.0, 0.5);
        Assert.Equal(0.003, Fit(y, 2 * Math.PI / Window, 0.0), 1e-10);
    }

    [Theory]
    [InlineData(2.4, 0.0, true)] // peak bin 2, larger neighbour above
    [InlineData(2.6, 1.1, true)] // peak bin 3, larger neighbour below
    [InlineData(2.5, 2.0, true)] // exactly between bins 2 and 3
    [InlineData(1.3, 4.0, true)] // peak bin 1: bin 0 holds the DC and must not be taken as its lower neighbour
    [InlineData(1.7, 0.3, true)] // peak bin 2 with bin 1 below
    [InlineData(7.6, 3.3, true)] // peak bin 8, refined downwards
    [InlineData(9.3, 5.0, false)] // peak on bin 9 = cycles − 1, the top of the search
    [InlineData(8.6, 2.5, false)] // peak on bin 9, refined downwards
    public void The_peak_and_its_refinement_find_the_tone_of_a_kernel_spectrum(double cycles, double phaseRad, bool mains)
    {
        // Closed form: for the spectrum of the large-N Dirichlet kernel (KernelSpectrum), the peak search over bins 1
        // to cycles − 1 and the two-bin refinement δ = r/(1 + r) return β exactly, so the fitted DC is c within
        // rounding. A 20 mA DC makes bin 0 the largest bin of all, and (where set) a 50 mA fundamental on bin 10
        // stands above every sub-mains bin: neither may be taken for the sub-mains peak. (With a tone on bin 9 a
        // mains component on bin 10 would be taken as its upper neighbour: a known limit, docs/testing.md.)
        const double dcA = 0.02, peakA = 0.01;
        var x = ToneOnDc(Window, dcA, peakA, cycles, phaseRad);
        var power = KernelSpectrum(40, dcA, peakA, cycles);
        if (mains)
        {
            power[10] += 0.05 * 0.05 / 2;
        }

        var mean = x.Average();
        var acRms = Math.Sqrt(x.Select(v => (v - mean) * (v - mean)).Average());
        Assert.Equal(dcA, SubMainsDc.Estimate(x, power, 10, mean, acRms), 1e-10);
    }

    [Fact]
    public void The_peak_search_stays_inside_a_short_spectrum()
    {
        // Only 5 bins given (0..4) for 10 cycles per window: the search ends at bin 3, the last with a neighbour above,
        // and still finds the 2.4-cycle tone exactly (closed form as above).
        var x = ToneOnDc(Window, 0.003, 0.01, 2.4, 0.9);
        var power = KernelSpectrum(5, 0.003, 0.01, 2.4);
        var mean = x.Average();
        Assert.Equal(0.003, SubMainsDc.Estimate(x, power, 10, mean, 0.007), 1e-10);
    }

    [Fact]
    public void Two_cycles_per_window_search_bin_1_and_one_cycle_searches_nothing()
    {
        // With 2 mains cycles per window bin 1 is the only sub-mains bin (searched); with 1 there is none, and the
        // mean is kept even though the window holds a tone of 1.3 cycles (closed-form bias A·Im(...)/N, nonzero).
        var x = ToneOnDc(Window, 0.003, 0.01, 1.3, 0.4);
        var power = KernelSpectrum(8, 0.003, 0.01, 1.3);
        var mean = x.Average();
        Assert.True(Math.Abs(mean - 0.003) > 1e-4, $"the mean must be biased for the test to mean anything: {mean}");
        Assert.Equal(0.003, SubMainsDc.Estimate(x, power, 2, mean, 0.007), 1e-10);
        Assert.Equal(mean, SubMainsDc.Estimate(x, power, 1, mean, 0.007));
    }

    [Fact]
    public void The_share_of_ac_decides_at_its_threshold()
    {
        // The peak bin's RMS against MinShareOfAc (5 %) of the AC RMS: at exactly the threshold it is fitted (≥), just
        // below it the mean is kept. acRms is chosen so that MinShareOfAc·acRms equals the peak bin's RMS exactly.
        var x = ToneOnDc(Window, 0.003, 0.01, 2.4, 0.9);
        var power = KernelSpectrum(20, 0.003, 0.01, 2.4);
        var mean = x.Average();
        var peakRms = Math.Sqrt(power[2]);
        var acRms = peakRms / SubMainsDc.MinShareOfAc;
        Assert.Equal(peakRms, SubMainsDc.MinShareOfAc * acRms);
        Assert.Equal(0.003, SubMainsDc.Estimate(x, power, 10, mean, acRms), 1e-10);
        Assert.Equal(mean, SubMainsDc.Estimate(x, power, 10, mean, acRms * (1 + 1e-9)));
    }

    [Fact]
    public void A_flat_window_keeps_its_mean()
    {
        // No AC at all: every bin above 0 is zero and the AC RMS is zero. The mean (the DC, closed form) is returned,
        // not the 0/0 of a refinement on empty bins.
        var x = Enumerable.Repeat(0.004, Window).ToArray();
        var power = new double[20];
        power[0] = 0.004 * 0.004;
        Assert.Equal(0.004, SubMainsDc.Estimate(x, power, 10, 0.004, 0));
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(1.5)]
    [InlineData(2.5)]
    [InlineData(3.0)]
    [InlineData(5.0)]
    [InlineData(5.7)]
    public void A_motor_tone_at_any_phase_on_a_real_spectrum_does_not_read_as_dc(double phaseRad)
    {
        // As the first test, at 13.7 Hz (2.74 cycles per 200 ms) and six phases, beside a 20 mA mains component, with
        // the spectrum from MathNet's FFT. Closed form of the plain mean's bias (geometric series above): 0.5 to
        // 0.8 mA at these phases, of either sign. The fit must recover the 2 mA within 0.1 mA (engineering
        // tolerance, as above: the two-bin refinement neglects the negative-frequency image and the fundamental's
        // leakage, which leaves up to 0.07 mA here).
        const double motorHz = 13.7, peakA = 0.0098;
        var (x, bins, mean, acRms) = Make(t => 0.002 + (peakA * Math.Sin((2 * Math.PI * motorHz * t) + phaseRad))
                                               + (0.02 * Math.Sin(2 * Math.PI * 50 * t)));
        Assert.True(Math.Abs(mean - 0.002) > 0.0005, $"the plain mean must be biased: {mean}");
        Assert.Equal(0.002 + (peakA * MeanOfSine(Window, motorHz * Window / RateHz, phaseRad)), mean, 1e-9);
        Assert.Equal(0.002, SubMainsDc.Estimate(x, bins, 10, mean, acRms), 0.0001);
    }

    // ---- The mains term of the five-term fit (issue 18: mutation testing) --------------------------------------------

    /// <summary>x_n = c + A·sin(2πβn/N + φ) + B·sin(2π·10·n/N + ψ): a tone of β cycles and a mains part of 10 cycles.</summary>
    private static double[] ToneAndMainsOnDc(double dcA, double peakA, double cycles, double phaseRad, double mainsPeakA, double mainsPhaseRad)
    {
        var x = ToneOnDc(Window, dcA, peakA, cycles, phaseRad);
        for (var n = 0; n < Window; n++)
        {
            x[n] += mainsPeakA * Math.Sin((2 * Math.PI * 10 * n / Window) + mainsPhaseRad);
        }

        return x;
    }

    [Theory]
    [InlineData(2.4, 0.0, 0.3)]
    [InlineData(2.4, 1.9, 2.0)]
    [InlineData(3.75, 4.4, 4.0)]
    [InlineData(7.1, 0.7, 5.5)]
    public void The_fit_returns_the_constant_beside_a_mains_part_at_any_phase(double cycles, double phaseRad, double mainsPhaseRad)
    {
        // Closed form: c + A·sin(ωn + φ) + B·sin(ω₀n + ψ) lies in the span of the five regressors, so least squares
        // reproduces it exactly and the constant is c, for every phase of either part. Over a window that does not hold
        // whole cycles of ω the mains part is not orthogonal to the tone's regressors, so a slip in the mains
        // regressors (their frequency, phasor rotation or re-anchoring every 1024 samples) leaves part of it in c.
        const double dcA = 0.003;
        var x = ToneAndMainsOnDc(dcA, 0.01, cycles, phaseRad, 0.05, mainsPhaseRad);
        var fit = SubMainsDc.FitConstant(x, 2 * Math.PI * cycles / Window, 2 * Math.PI * 10 / Window, x.Average());
        Assert.NotNull(fit);
        Assert.Equal(dcA, fit.Value.Constant, 1e-10);
        // Nothing is left over: the residual sum of squares is 0 within rounding (10⁴ squares of order 10⁻³ A²).
        Assert.InRange(fit.Value.Residual, 0, 1e-12);
    }

    [Fact]
    public void The_residual_is_the_energy_the_model_cannot_hold()
    {
        // Closed form: over a window of whole cycles, sines of different whole cycle counts are orthogonal to each
        // other and to the constant, and Σ sin² over whole cycles is N/2. With ω at 3 cycles and the mains at 10, a
        // 20-cycle part of peak D is orthogonal to every regressor, so the residual is exactly N·D²/2 and the constant
        // is untouched.
        const double dcA = 0.002, d = 0.004;
        var x = ToneAndMainsOnDc(dcA, 0.01, 3, 0.8, 0.03, 1.7);
        for (var n = 0; n < Window; n++)
        {
            x[n] += d * Math.Sin((2 * Math.PI * 20 * n / Window) + 0.4);
        }

        var fit = SubMainsDc.FitConstant(x, 2 * Math.PI * 3 / Window, 2 * Math.PI * 10 / Window, x.Average())!.Value;
        Assert.Equal(Window * d * d / 2, fit.Residual, 1e-12);
        Assert.Equal(dcA, fit.Constant, 1e-12);
    }

    [Theory]
    [InlineData(2.4, 0.0)]
    [InlineData(2.6, 1.1)]
    [InlineData(1.3, 4.0)]
    [InlineData(7.6, 3.3)]
    public void The_estimate_is_exact_beside_a_mains_part_in_the_samples(double cycles, double phaseRad)
    {
        // As the kernel-spectrum test above, with the 50 mA mains part in the samples too (bin 10 of the spectrum): the
        // peak search and refinement give β, the five-term fit at β and the window's own 10 cycles holds every part,
        // and the DC is c within rounding.
        const double dcA = 0.02, peakA = 0.01, mainsPeakA = 0.05;
        var x = ToneAndMainsOnDc(dcA, peakA, cycles, phaseRad, mainsPeakA, 2.5);
        var power = KernelSpectrum(40, dcA, peakA, cycles);
        power[10] += mainsPeakA * mainsPeakA / 2;
        var mean = x.Average();
        var acRms = Math.Sqrt(x.Select(v => (v - mean) * (v - mean)).Average());
        Assert.True(Math.Abs(mean - dcA) > 1e-4 || cycles == 7.6, $"the plain mean is biased: {mean}");
        Assert.Equal(dcA, SubMainsDc.Estimate(x, power, 10, mean, acRms), 1e-10);
    }

    [Fact]
    public void A_tone_of_one_whole_cycle_is_fitted_at_one_cycle()
    {
        // A tone of exactly 1 cycle (peak bin 1) beside a smaller one of exactly 2 cycles, on 20 mA DC. Closed form:
        // tones of whole cycles leak into no other bin, so the spectrum is exact: bin 0 = c², bin 1 = A²/2, bin 2 = A₂²/2.
        // Towards bin 0 the refinement takes no neighbour (bin 0 is the DC) and gives exactly 1 cycle; towards bin 2 it
        // gives 1 + r/(1 + r), r = A₂/A. At 1 cycle the model holds c and the 1-cycle tone exactly, and the 2-cycle tone
        // is orthogonal to every regressor (whole cycles), so that fit's constant is c and its residual the 2-cycle
        // tone's energy, smaller than the other fit's: the DC is c within rounding.
        const double dcA = 0.02, peakA = 0.01, secondA = 0.002;
        var x = ToneOnDc(Window, dcA, peakA, 1, 0.6);
        for (var n = 0; n < Window; n++)
        {
            x[n] += secondA * Math.Sin((2 * Math.PI * 2 * n / Window) + 1.3);
        }

        var power = new double[20];
        power[0] = dcA * dcA;
        power[1] = peakA * peakA / 2;
        power[2] = secondA * secondA / 2;
        var acRms = Math.Sqrt(power[1] + power[2]);
        var other = SubMainsDc.FitConstant(x, 2 * Math.PI * (1 + (0.2 / 1.2)) / Window, 2 * Math.PI * 10 / Window, x.Average());
        Assert.True(Math.Abs(other!.Value.Constant - dcA) > 1e-6, "the fit towards bin 2 must be off for the test to mean anything");
        Assert.Equal(dcA, SubMainsDc.Estimate(x, power, 10, x.Average(), acRms), 1e-10);
    }

    [Fact]
    public void A_singular_fit_is_reported_as_none()
    {
        // ω = 0 makes the cosine regressor equal to the constant and the sine regressor zero (closed form: cos 0 = 1,
        // sin 0 = 0): the normal matrix is singular, and the fit says so (null) rather than returning a constant.
        var x = ToneOnDc(Window, 0.003, 0.01, 2.4, 0.5);
        Assert.Null(SubMainsDc.FitConstant(x, 0, 2 * Math.PI * 10 / Window, x.Average()));
        // ω equal to the mains frequency: two pairs of equal regressors, singular as well.
        Assert.Null(SubMainsDc.FitConstant(x, 2 * Math.PI * 10 / Window, 2 * Math.PI * 10 / Window, x.Average()));
    }
}
