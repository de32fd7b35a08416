using System.Diagnostics;
using System.Globalization;
using System.Runtime.CompilerServices;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class RealFftTests
{
    private static double[] Samples(int length)
    {
        var random = new Random(length);
        var x = new double[length];
        for (var i = 0; i < length; i++)
        {
            x[i] = random.NextDouble() - 0.3;
        }

        return x;
    }

    private static (double[] Re, double[] Im) Forward(double[] x)
    {
        var fft = new RealFft(x.Length);
        var re = new double[fft.BinCount];
        var im = new double[fft.BinCount];
        fft.Forward(x, re, im);
        return (re, im);
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(10)]
    [InlineData(17)]
    [InlineData(100)]
    [InlineData(1000)]
    [InlineData(1001)]
    [InlineData(10006)]
    public void BinsMatchPlainDft(int length)
    {
        // Reference: the plain O(n²) DFT X_k = Σ x_j e^{-2πi jk/n} (ReferenceDft.Bin); every bin up to 1 001 points,
        // every 13th above to keep the reference quick.
        var x = Samples(length);
        var (re, im) = Forward(x);
        var step = length > 1001 ? 13 : 1;
        for (var k = 0; k <= length / 2; k += step)
        {
            var reference = ReferenceDft.Bin(x, k);
            // 1e-9 absolute on sums of n values of order 1 (|X_k| up to ~0.3·n): double rounding of the O(n²)
            // reference's own sums and of O(n log n) butterflies, both ~1e-12 relative.
            Assert.Equal(reference.Real, re[k], 1e-9);
            Assert.Equal(reference.Imaginary, im[k], 1e-9);
        }
    }

    [Theory]
    [InlineData(10000)]
    [InlineData(10008)]
    [InlineData(8334)]
    [InlineData(9)]
    public void HalfLengthSplitMatchesComplexTransformOfTheRealData(int length)
    {
        // Reference: the complex DFT of the same data with a zero imaginary part (ComplexDft, itself checked against
        // the plain DFT and MathNet.Numerics in ComplexDftTests): the transform the split replaces.
        var x = Samples(length);
        var (re, im) = Forward(x);
        var fullRe = (double[])x.Clone();
        var fullIm = new double[length];
        new ComplexDft(length).Forward(fullRe, fullIm);
        for (var k = 0; k <= length / 2; k++)
        {
            // 1e-9 absolute on |X_k| up to ~3 000: two FFT paths of ~1e-15 relative rounding each.
            Assert.Equal(fullRe[k], re[k], 1e-9);
            Assert.Equal(fullIm[k], im[k], 1e-9);
        }
    }

    [Fact]
    public void CosineLandsInItsBinWithHalfTheAmplitudeTimesN()
    {
        // Closed form: x_j = A cos(2π m j / n) has X_m = A n / 2 and every other bin 0 (0 < m < n/2).
        const int n = 10_006;
        const int m = 1_234;
        const double a = 0.7;
        var x = new double[n];
        for (var j = 0; j < n; j++)
        {
            x[j] = a * Math.Cos(2 * Math.PI * ((long)m * j % n) / n);
        }

        var (re, im) = Forward(x);
        for (var k = 0; k <= n / 2; k++)
        {
            // 1e-8 absolute against A·n/2 = 3 502: double rounding.
            Assert.Equal(k == m ? a * n / 2 : 0.0, re[k], 1e-8);
            Assert.Equal(0.0, im[k], 1e-8);
        }
    }

    [Fact]
    public void RejectsWrongLengthsAndTooShortPlans()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new RealFft(1));
        var fft = new RealFft(8);
        Assert.Throws<ArgumentException>(() => fft.Forward(new double[7], new double[5], new double[5]));
        Assert.Throws<ArgumentException>(() => fft.Forward(new double[8], new double[4], new double[5]));
    }

    private static string ScriptPath() => ReferenceScripts.Path("rfft.py");

    [Theory]
    [InlineData(10000)]
    [InlineData(10006)]
    [InlineData(8333)]
    public void BinsMatchNumpyRfft(int length)
    {
        // Reference: numpy.fft.rfft via /usr/bin/python3 (script in tests/reference/), on the window lengths the analysis
        // meets at 50 kS/s (50 Hz, 49.97 Hz) and 60 Hz.
        var x = Samples(length);
        var file = Path.Combine(Path.GetTempPath(), $"wavecheck-rfft-{Environment.ProcessId}-{length}.txt");
        File.WriteAllLines(file, x.Select(v => v.ToString("R", CultureInfo.InvariantCulture)));
        try
        {
            var start = new ProcessStartInfo("/usr/bin/python3", [ScriptPath(), file])
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
            };
            using var process = Process.Start(start)!;
            var output = process.StandardOutput.ReadToEnd();
            var error = process.StandardError.ReadToEnd();
            process.WaitForExit();
            Assert.True(process.ExitCode == 0, error);
            var lines = output.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            var (re, im) = Forward(x);
            Assert.Equal(re.Length, lines.Length);
            for (var k = 0; k < lines.Length; k++)
            {
                var parts = lines[k].Split(' ');
                // 1e-9 absolute on |X_k| up to ~3 000: two double-precision FFTs (pocketfft and ours).
                Assert.Equal(double.Parse(parts[0], CultureInfo.InvariantCulture), re[k], 1e-9);
                Assert.Equal(double.Parse(parts[1], CultureInfo.InvariantCulture), im[k], 1e-9);
            }
        }
        finally
        {
            File.Delete(file);
        }
    }
}
