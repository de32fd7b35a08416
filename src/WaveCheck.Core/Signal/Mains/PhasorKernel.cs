using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The Hann-weighted fundamental phasor of windows of one length (<see cref="MainsFrequency.WindowPhasor"/>) as a dot
/// product with a precomputed kernel k_n = w_n·e^{−iωn}: Σ (x_n − mean)·w_n·e^{−iω(start+n)} =
/// e^{−iω·start}·(Σ x_n k_n − mean·Σ k_n). Two multiply-adds a sample on whole vectors instead of rotating phasors;
/// built once per window length. Immutable, so it may be shared between threads.
/// </summary>
public sealed class PhasorKernel
{
    private readonly double[] _re;
    private readonly double[] _im;
    private readonly double _sumRe;
    private readonly double _sumIm;
    private readonly double _cyclesPerSample;

    /// <summary>Builds the kernel for windows of <paramref name="length"/> samples.</summary>
    /// <param name="length">Samples per window, at least 2.</param>
    /// <param name="sampleRateHz">Sample rate, hertz.</param>
    /// <param name="referenceHz">Reference frequency (the nominal), hertz.</param>
    public PhasorKernel(int length, double sampleRateHz, double referenceHz)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(length, 2);
        Length = length;
        _cyclesPerSample = referenceHz / sampleRateHz;
        _re = new double[length];
        _im = new double[length];
        var step = 2 * Math.PI / (length - 1);
        for (var n = 0; n < length; n++)
        {
            // Hann weight ½ − ½cos(2πn/(L − 1)); the angle of e^{−iωn} reduced to one turn first.
            var weight = 0.5 - (0.5 * Math.Cos(step * n));
            var turns = _cyclesPerSample * n;
            var angle = -2 * Math.PI * (turns - Math.Floor(turns));
            _re[n] = weight * Math.Cos(angle);
            _im[n] = weight * Math.Sin(angle);
            _sumRe += _re[n];
            _sumIm += _im[n];
        }
    }

    /// <summary>Samples per window.</summary>
    public int Length { get; }

    /// <summary>
    /// The phasor of <paramref name="samplesA"/>, referred to the capture's sample clock: real and imaginary part
    /// (unnormalised, as <see cref="MainsFrequency.WindowPhasor"/>) and the component's RMS, amperes.
    /// </summary>
    /// <param name="samplesA">Exactly <see cref="Length"/> samples, amperes.</param>
    /// <param name="startSample">Index of the window's first sample in the capture.</param>
    /// <param name="meanA">The window's mean, removed first, amperes.</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public (double Re, double Im, double RmsA) Phasor(ReadOnlySpan<double> samplesA, long startSample, double meanA)
    {
        if (samplesA.Length != Length)
        {
            throw new ArgumentException($"expected {Length} samples, got {samplesA.Length}", nameof(samplesA));
        }

        double dotRe = 0, dotIm = 0;
        var i = 0;
        if (Vector.IsHardwareAccelerated && samplesA.Length >= Vector<double>.Count)
        {
            var x = MemoryMarshal.Cast<double, Vector<double>>(samplesA);
            var kr = MemoryMarshal.Cast<double, Vector<double>>(_re);
            var ki = MemoryMarshal.Cast<double, Vector<double>>(_im);
            Vector<double> r0 = Vector<double>.Zero, i0 = Vector<double>.Zero;
            Vector<double> r1 = Vector<double>.Zero, i1 = Vector<double>.Zero;
            var v = 0;
            for (; v + 1 < x.Length; v += 2)
            {
                r0 += x[v] * kr[v];
                i0 += x[v] * ki[v];
                r1 += x[v + 1] * kr[v + 1];
                i1 += x[v + 1] * ki[v + 1];
            }

            for (; v < x.Length; v++)
            {
                r0 += x[v] * kr[v];
                i0 += x[v] * ki[v];
            }

            dotRe = Vector.Sum(r0 + r1);
            dotIm = Vector.Sum(i0 + i1);
            i = x.Length * Vector<double>.Count;
        }

        for (; i < samplesA.Length; i++)
        {
            dotRe += samplesA[i] * _re[i];
            dotIm += samplesA[i] * _im[i];
        }

        var ar = dotRe - (meanA * _sumRe);
        var ai = dotIm - (meanA * _sumIm);
        var turns = _cyclesPerSample * startSample;
        var angle = -2 * Math.PI * (turns - Math.Floor(turns));
        var (sin, cos) = Math.SinCos(angle);
        var re = (ar * cos) - (ai * sin);
        var im = (ar * sin) + (ai * cos);
        var rms = Math.Sqrt((re * re) + (im * im)) * Math.Sqrt(2) / ((Length - 1) / 2.0);
        return (re, im, rms);
    }
}
