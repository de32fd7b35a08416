using System.Diagnostics;
using System.Globalization;
using System.Numerics;
using MathNet.Numerics.IntegralTransforms;
using WaveCheck.Core.Signal;

namespace WaveCheck.AnalyzeBench;

/// <summary>
/// The hand-written FFT (<see cref="RealSpectrum"/>) against the library baseline, MathNet.Numerics' Fourier, on the
/// window lengths the analysis meets: 10 000 (50 Hz at 50 kS/s), 10 006 (49.97 Hz), 8 333 (60 Hz) and a power of two
/// for comparison. Each produces the same one-sided power spectrum (checked here, so the figures compare like with
/// like): ours from its plan built once, MathNet's complex <c>Fourier.Forward</c> and packed real
/// <c>Fourier.ForwardReal</c> as a caller would use them, a call per window. Run with the argument <c>fft</c>;
/// docs/fft.md records the figures.
/// </summary>
internal static class FourierBaseline
{
    public static void Run()
    {
        Console.WriteLine($"vector width {Vector<double>.Count}, accelerated {Vector.IsHardwareAccelerated}; best of 7 rounds of 50 calls, µs and bytes allocated per window");
        foreach (var n in new[] { 10_000, 10_006, 8_333, 8_192 })
        {
            var random = new Random(n);
            var x = new double[n];
            for (var i = 0; i < n; i++)
            {
                x[i] = random.NextDouble() - 0.5;
            }

            var bins = (n / 2) + 1;
            var plan = new RealSpectrum(n);
            var ours = new double[bins];
            var ourTime = Time(() => plan.Power(x, ours));

            var data = new Complex[n];
            var viaComplex = new double[bins];
            var complexTime = Time(() =>
            {
                for (var i = 0; i < n; i++)
                {
                    data[i] = new Complex(x[i], 0);
                }

                Fourier.Forward(data, FourierOptions.NoScaling);
                for (var k = 0; k < bins; k++)
                {
                    viaComplex[k] = Weight(k, n) * ((data[k].Real * data[k].Real) + (data[k].Imaginary * data[k].Imaginary));
                }
            });

            var packed = new double[n % 2 == 0 ? n + 2 : n + 1];
            var viaReal = new double[bins];
            var realTime = Time(() =>
            {
                x.CopyTo(packed, 0);
                Fourier.ForwardReal(packed, n, FourierOptions.NoScaling);
                for (var k = 0; k < bins; k++)
                {
                    viaReal[k] = Weight(k, n) * ((packed[2 * k] * packed[2 * k]) + (packed[(2 * k) + 1] * packed[(2 * k) + 1]));
                }
            });

            var difference = Math.Max(MaxDifference(ours, viaComplex), MaxDifference(ours, viaReal));
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"n {n,6}: ours {ourTime.Us,8:0.0} µs {ourTime.Bytes,8:0} B; MathNet Forward {complexTime.Us,8:0.0} µs {complexTime.Bytes,8:0} B ({complexTime.Us / ourTime.Us:0.0}×); MathNet ForwardReal {realTime.Us,8:0.0} µs {realTime.Bytes,8:0} B ({realTime.Us / ourTime.Us:0.0}×); largest bin difference {difference:0.0e0} of the mean square"));
        }
    }

    // Bin 0 and (even n) the Nyquist bin once, the others twice: the mean square per bin, as RealSpectrum.Power.
    private static double Weight(int k, int n) => (k == 0 || (n % 2 == 0 && k == n / 2) ? 1.0 : 2.0) / ((double)n * n);

    private static double MaxDifference(double[] a, double[] b)
    {
        var total = 0.0;
        var worst = 0.0;
        for (var k = 0; k < a.Length; k++)
        {
            total += a[k];
            worst = Math.Max(worst, Math.Abs(a[k] - b[k]));
        }

        return worst / total;
    }

    private static (double Us, double Bytes) Time(Action action)
    {
        for (var i = 0; i < 20; i++)
        {
            action();
        }

        // Best of 7 rounds: other processes share the machine, and the least time is the code's own.
        const int calls = 50;
        var best = double.PositiveInfinity;
        var bytes = double.PositiveInfinity;
        for (var round = 0; round < 7; round++)
        {
            var watch = new Stopwatch();
            var allocated = GC.GetAllocatedBytesForCurrentThread();
            watch.Start();
            for (var i = 0; i < calls; i++)
            {
                action();
            }

            best = Math.Min(best, watch.Elapsed.TotalMilliseconds * 1000 / calls);
            bytes = Math.Min(bytes, (GC.GetAllocatedBytesForCurrentThread() - allocated) / (double)calls);
        }

        return (best, bytes);
    }
}
