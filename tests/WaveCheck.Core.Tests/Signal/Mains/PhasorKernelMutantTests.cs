using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="PhasorKernel"/> on short windows (every vector/tail split), on a pure cosine far into a capture, and its
/// argument checks.
/// </summary>
public class PhasorKernelMutantTests
{
    [Fact]
    public void Every_short_length_matches_the_direct_hann_weighted_sum()
    {
        // Reference: the definition in the doc comment, Σ (x_n − mean)·w_n·e^{−iω(start+n)} with w_n the symmetric Hann
        // ½ − ½cos(2πn/(L − 1)), summed directly in Complex (the slow, obviously-correct path). Lengths 2..40 cover a
        // whole number of vectors, an odd number of vectors (the unpaired vector) and a scalar tail, for any
        // Vector<double>.Count. Tolerance 1e-12 of the magnitude: rounding only.
        var random = new Random(5);
        for (var length = 2; length <= 40; length++)
        {
            var x = new double[length];
            for (var n = 0; n < length; n++)
            {
                x[n] = random.NextDouble() - 0.3;
            }

            const double fs = 1000, f = 50, mean = 0.1;
            const long start = 7;
            var expected = Complex.Zero;
            for (var n = 0; n < length; n++)
            {
                var w = 0.5 - (0.5 * Math.Cos(2 * Math.PI * n / (length - 1)));
                expected += (x[n] - mean) * w * Complex.FromPolarCoordinates(1, -2 * Math.PI * f * (start + n) / fs);
            }

            var (re, im, rmsA) = new PhasorKernel(length, fs, f).Phasor(x, start, mean);
            var tolerance = 1e-12 * Math.Max(1, expected.Magnitude);
            Assert.Equal(expected.Real, re, tolerance);
            Assert.Equal(expected.Imaginary, im, tolerance);
            Assert.Equal(expected.Magnitude * Math.Sqrt(2) / ((length - 1) / 2.0), rmsA, tolerance);
        }
    }

    [Fact]
    public void Pure_cosine_far_into_a_capture_keeps_its_phase_and_rms()
    {
        // Closed form: x_n = A·cos(2π·(start + n)/16 + φ) at 800 S/s is 50 Hz exactly (16 samples a cycle, a dyadic
        // 1/16 cycle per sample, so the test's angle is exact via (start + n) mod 16). Referred to the sample clock its
        // phasor has angle φ and RMS A/√2, whatever the start; start 2^53 − 1 needs the angle reduced to one turn
        // before it is scaled. Window 161 samples = 10 cycles; Hann leakage of the 100 Hz image is below 1e-3
        // (tolerance 2e-3 rad on the angle, 0.2 % on the RMS).
        const double amplitudeA = 0.02, phaseRad = 0.7;
        const int length = 161;
        const long start = (1L << 53) - 1;
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = amplitudeA * Math.Cos((2 * Math.PI * ((start + n) % 16) / 16) + phaseRad);
        }

        var (re, im, rmsA) = new PhasorKernel(length, 800, 50).Phasor(x, start, 0);
        Assert.Equal(phaseRad, Math.Atan2(im, re), 2e-3);
        Assert.Equal(amplitudeA / Math.Sqrt(2), rmsA, amplitudeA / Math.Sqrt(2) * 2e-3);
    }

    [Fact]
    public void A_reference_a_whole_number_of_sample_rates_above_aliases_onto_the_one_below()
    {
        // Closed form: e^{−i2π(m + c)n} = e^{−i2πcn} for integer m, so a kernel for 800·2^40 + 50 Hz at 800 S/s is the
        // 50 Hz kernel (c = 2^40 + 1/16 cycles a sample, exact in binary; c·n stays exact for n ≤ 160). Only the
        // reduction of c·n to one turn before scaling by 2π keeps each kernel angle exact: c·n is near 2^47 turns, where
        // one unit in the last place of 2π·c·n is a sizeable fraction of a radian. The cosine A·cos(2πn/16 + φ) over 10
        // whole cycles then has angle φ and RMS A/√2 (Hann leakage of the −50 Hz image is exactly zero over whole
        // cycles); tolerance 1e-9: rounding only.
        const double amplitudeA = 0.02, phaseRad = -1.1, fs = 800;
        const int length = 161;
        var x = new double[length];
        for (var n = 0; n < length; n++)
        {
            x[n] = amplitudeA * Math.Cos((2 * Math.PI * (n % 16) / 16) + phaseRad);
        }

        var aliased = new PhasorKernel(length, fs, (fs * Math.Pow(2, 40)) + 50).Phasor(x, 0, 0);
        var direct = new PhasorKernel(length, fs, 50).Phasor(x, 0, 0);
        Assert.Equal(phaseRad, Math.Atan2(aliased.Im, aliased.Re), 1e-9);
        Assert.Equal(amplitudeA / Math.Sqrt(2), aliased.RmsA, 1e-9 * amplitudeA);
        Assert.Equal(direct.Re, aliased.Re, 1e-12 * amplitudeA);
        Assert.Equal(direct.Im, aliased.Im, 1e-12 * amplitudeA);
    }

    [Fact]
    public void A_kernel_shorter_than_two_samples_is_refused()
    {
        // The Hann weight divides by L − 1 (common practice, no source): L = 1 would give NaN weights.
        Assert.Throws<ArgumentOutOfRangeException>(() => new PhasorKernel(1, 1000, 50));
    }

    [Fact]
    public void A_window_of_the_wrong_length_is_refused_with_both_lengths_in_the_message()
    {
        // Conventions: the message states the expected value and the value received (common practice, no source).
        var kernel = new PhasorKernel(8, 1000, 50);
        var e = Assert.Throws<ArgumentException>(() => kernel.Phasor(new double[7], 0, 0));
        Assert.Equal("samplesA", e.ParamName);
        Assert.Contains("expected 8 samples, got 7", e.Message);
    }
}
