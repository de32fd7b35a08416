using System.Diagnostics;
using System.Globalization;
using WaveCheck.Core.Signal;

namespace WaveCheck.AnalyzeBench;

/// <summary>Per-stage cost of one window (profile before optimising): run with the argument <c>stages</c>.</summary>
internal static class Stages
{
    public static void Run(double rate)
    {
        var n = (int)Math.Round(10 * rate / 49.95);
        var w = new double[n + 1];
        for (var i = 0; i < w.Length; i++)
        {
            var theta = 2 * Math.PI * 49.95 * i / rate % (2 * Math.PI);
            w[i] = 0.004 + (theta >= 1.2 && theta < Math.PI ? 0.03 * Math.Sin(theta) : 0);
        }

        var power = new double[(n / 2) + 2];
        var even = new RealSpectrum(n % 2 == 0 ? n : n + 1);
        var odd = new RealSpectrum(n % 2 == 0 ? n + 1 : n);
        var shape = new WaveformShape();
        foreach (var size in new[] { 256, 1024, 4096, 16384, 65536 })
        {
            var plan = new RealSpectrum(size);
            var input = new double[size];
            var output = new double[plan.BinCount];
            Time($"spectrum, {size} (radix-2)", () => plan.Power(input, output));
        }

        var fft = new RealSpectrum(16384);
        var pow2 = new double[16384];
        Time("spectrum, 16384 (radix-2)", () => fft.Power(pow2, power.Length >= 8193 ? power : new double[8193]));
        Console.WriteLine($"vector width {System.Numerics.Vector<double>.Count}, accelerated {System.Numerics.Vector.IsHardwareAccelerated}");
        Time("spectrum, even length", () => even.Power(w.AsSpan(0, even.Length), power));
        Time("spectrum, odd length", () => odd.Power(w.AsSpan(0, odd.Length), power));
        Time("moments", () => SampleMath.Moments(w.AsSpan(0, n)));
        var kernel = new PhasorKernel(n, rate, 50);
        Time("tracking phasor (kernel)", () => kernel.Phasor(w.AsSpan(0, n), 123_456, 0.01));
        Time("waveform shape", () => shape.Measure(w.AsSpan(0, n), 10, 0.01, 0.004, 0.034));
        var touch = new TouchCurrentMeter(rate);
        Time("touch current (3 networks)", () => touch.Push(w.AsSpan(0, n)));
    }

    private static void Time(string name, Action action)
    {
        for (var i = 0; i < 50; i++)
        {
            action();
        }

        // Best of 7 rounds of 100: other processes share the machine, and the least time is the stage's own.
        var best = double.PositiveInfinity;
        var bestCpu = double.PositiveInfinity;
        const int runs = 100;
        for (var round = 0; round < 7; round++)
        {
            var watch = Stopwatch.StartNew();
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            for (var i = 0; i < runs; i++)
            {
                action();
            }

            best = Math.Min(best, watch.Elapsed.TotalMilliseconds * 1000 / runs);
            bestCpu = Math.Min(bestCpu, (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalMilliseconds * 1000 / runs);
        }

        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{name,-28} {best,8:0.0} µs wall, {bestCpu,8:0.0} µs CPU per window (best of 7 rounds)"));
    }
}
