using System.Diagnostics;
using System.Globalization;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

public class SpectrumReferenceTests
{
    private static string ScriptPath() => ReferenceScripts.Path("periodogram.py");

    [Theory]
    [InlineData(10000)]
    [InlineData(10003)]
    [InlineData(8333)]
    public void PowerMatchesScipyPeriodogram(int length)
    {
        // Reference: scipy.signal.periodogram (boxcar, detrend=False, scaling='spectrum') via /usr/bin/python3,
        // script beside this file. Bin RMS within 0.1 % of full scale (the signal's 40 mA peak), the brief's bound.
        const double fs = 50_000;
        var random = new Random(length);
        var x = new double[length];
        for (var i = 0; i < length; i++)
        {
            var t = i / fs;
            x[i] = 0.004 + Synth.PhaseCut(t, 49.9, 0.03, 0.7) + (0.005 * Math.Sin(2 * Math.PI * 16_000 * t))
                + (0.001 * Synth.Gaussian(random));
        }

        var file = Path.Combine(Path.GetTempPath(), $"wavecheck-periodogram-{Environment.ProcessId}-{length}.txt");
        File.WriteAllLines(file, x.Select(v => v.ToString("R", CultureInfo.InvariantCulture)));
        try
        {
            var start = new ProcessStartInfo("/usr/bin/python3", [ScriptPath(), file, fs.ToString(CultureInfo.InvariantCulture)])
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

            var spectrum = new RealSpectrum(length);
            var power = new double[spectrum.BinCount];
            spectrum.Power(x, power);
            Assert.Equal(spectrum.BinCount, lines.Length);
            var fullScale = 0.04;
            for (var k = 0; k < lines.Length; k++)
            {
                var parts = lines[k].Split(' ');
                Assert.Equal(k * fs / length, double.Parse(parts[0], CultureInfo.InvariantCulture), 1e-6);
                var reference = double.Parse(parts[1], CultureInfo.InvariantCulture);
                Assert.Equal(Math.Sqrt(reference), Math.Sqrt(power[k]), 0.001 * fullScale);
                Assert.Equal(reference, power[k], 1e-12);
            }
        }
        finally
        {
            File.Delete(file);
        }
    }
}
