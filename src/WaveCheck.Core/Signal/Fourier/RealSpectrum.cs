using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace WaveCheck.Core.Signal;

/// <summary>
/// One-sided power spectrum of a real window of fixed length, built once per length and reused: the mean-square
/// value of each bin, so that the bins sum to the window's mean square (Parseval). Holds scratch: not thread-safe.
/// </summary>
/// <remarks>
/// One window's bins come from <see cref="RealFft"/> (an even length as a half-length complex transform and a split
/// step); two windows of the same odd length share one complex transform (<see cref="PowerPair"/>).
/// </remarks>
public sealed class RealSpectrum
{
    private readonly RealFft _fft;
    private readonly double[] _binRe;
    private readonly double[] _binIm;
    private ComplexDft? _pairDft;
    private double[]? _pairRe;
    private double[]? _pairIm;

    /// <summary>Builds the plan for windows of <paramref name="length"/> samples.</summary>
    /// <param name="length">Samples per window, at least 2.</param>
    public RealSpectrum(int length)
    {
        if (length < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(length), length, "window length must be at least 2 samples");
        }

        Length = length;
        _fft = new RealFft(length);
        _binRe = new double[_fft.BinCount];
        _binIm = new double[_fft.BinCount];
    }

    /// <summary>Samples per window.</summary>
    public int Length { get; }

    /// <summary>Number of one-sided bins, <c>Length / 2 + 1</c> (bin k at k·fs/Length hertz).</summary>
    public int BinCount => (Length / 2) + 1;

    /// <summary>
    /// Power spectra of two windows of this length at once, as one complex transform of a + i·b split by symmetry
    /// (A_k = (Z_k + conj Z_{n−k})/2, B_k = (Z_k − conj Z_{n−k})/2i); the same figures as two <see cref="Power"/> calls.
    /// </summary>
    /// <param name="first">Exactly <see cref="Length"/> samples.</param>
    /// <param name="second">Exactly <see cref="Length"/> samples.</param>
    /// <param name="firstPower">At least <see cref="BinCount"/> values, overwritten.</param>
    /// <param name="secondPower">At least <see cref="BinCount"/> values, overwritten.</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void PowerPair(ReadOnlySpan<double> first, ReadOnlySpan<double> second, Span<double> firstPower,
        Span<double> secondPower)
    {
        if (first.Length != Length || second.Length != Length)
        {
            throw new ArgumentException($"expected {Length} samples, got {first.Length} and {second.Length}", nameof(first));
        }

        var n = Length;
        var re = new Span<double>(_pairRe ??= new double[n]);
        var im = new Span<double>(_pairIm ??= new double[n]);
        _pairDft ??= new ComplexDft(n);
        first.CopyTo(re);
        second.CopyTo(im);
        _pairDft.Forward(re, im);
        var norm = 1.0 / ((double)n * n);
        for (var k = 0; k < BinCount; k++)
        {
            var m = k == 0 ? 0 : n - k;
            var ar = 0.5 * (re[k] + re[m]);
            var ai = 0.5 * (im[k] - im[m]);
            var br = 0.5 * (im[k] + im[m]);
            var bi = -0.5 * (re[k] - re[m]);
            var weight = k == 0 || (n % 2 == 0 && k == n / 2) ? norm : 2 * norm;
            firstPower[k] = ((ar * ar) + (ai * ai)) * weight;
            secondPower[k] = ((br * br) + (bi * bi)) * weight;
        }
    }

    /// <summary>Writes each bin's mean square C_k² (A²): bin 0 the squared mean, others twice |X_k|²/n² except Nyquist.</summary>
    /// <param name="samples">Exactly <see cref="Length"/> samples.</param>
    /// <param name="power">At least <see cref="BinCount"/> values, overwritten.</param>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Power(ReadOnlySpan<double> samples, Span<double> power)
    {
        if (samples.Length != Length)
        {
            throw new ArgumentException($"expected {Length} samples, got {samples.Length}", nameof(samples));
        }

        var bins = BinCount;
        var even = Length % 2 == 0;
        var norm = 1.0 / ((double)Length * Length);
        _fft.Forward(samples, _binRe, _binIm);
        var k = 0;
        if (Vector256.IsHardwareAccelerated)
        {
            // The same operations per bin as below, four bins at a time; bin 0 and the Nyquist bin put right after.
            var vNorm = Vector256.Create(norm);
            var two = Vector256.Create(2.0);
            for (; k + 4 <= bins; k += 4)
            {
                var r = Vector256.Create(_binRe.AsSpan(k, 4));
                var i = Vector256.Create(_binIm.AsSpan(k, 4));
                (two * (((r * r) + (i * i)) * vNorm)).CopyTo(power.Slice(k, 4));
            }
        }

        for (; k < bins; k++)
        {
            power[k] = 2 * (((_binRe[k] * _binRe[k]) + (_binIm[k] * _binIm[k])) * norm);
        }

        // Bin 0 and (even length) the Nyquist bin have no mirror: their mean square is |X_k|²/n², not twice it.
        power[0] = ((_binRe[0] * _binRe[0]) + (_binIm[0] * _binIm[0])) * norm;
        if (even)
        {
            power[bins - 1] = ((_binRe[bins - 1] * _binRe[bins - 1]) + (_binIm[bins - 1] * _binIm[bins - 1])) * norm;
        }
    }
}
