using System.Runtime.CompilerServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// One-sided power spectrum of a real window of fixed length, built once per length and reused: the mean-square
/// value of each bin, so that the bins sum to the window's mean square (Parseval). Holds scratch: not thread-safe.
/// </summary>
/// <remarks>
/// An even length is transformed as a complex sequence of half the length (even samples real, odd imaginary) and
/// split afterwards, which halves the work; an odd length goes through the full complex DFT.
/// </remarks>
public sealed class RealSpectrum
{
    private readonly ComplexDft _dft;
    private readonly double[] _re;
    private readonly double[] _im;
    private readonly double[]? _twiddleRe;
    private readonly double[]? _twiddleIm;
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
        var even = length % 2 == 0;
        var inner = even ? length / 2 : length;
        _dft = new ComplexDft(inner);
        _re = new double[inner];
        _im = new double[inner];
        if (even)
        {
            var half = length / 2;
            _twiddleRe = new double[half + 1];
            _twiddleIm = new double[half + 1];
            for (var k = 0; k <= half; k++)
            {
                var angle = -2.0 * Math.PI * k / length;
                _twiddleRe[k] = Math.Cos(angle);
                _twiddleIm[k] = Math.Sin(angle);
            }
        }
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
        _pairDft ??= _twiddleRe is null ? _dft : new ComplexDft(n);
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

        var n = Length;
        var bins = BinCount;
        var norm = 1.0 / ((double)n * n);
        if (_twiddleRe is null)
        {
            samples.CopyTo(_re);
            Array.Clear(_im);
            _dft.Forward(_re, _im);
            power[0] = ((_re[0] * _re[0]) + (_im[0] * _im[0])) * norm;
            for (var k = 1; k < bins; k++)
            {
                power[k] = 2 * ((_re[k] * _re[k]) + (_im[k] * _im[k])) * norm;
            }

            return;
        }

        var h = n / 2;
        for (var m = 0; m < h; m++)
        {
            _re[m] = samples[2 * m];
            _im[m] = samples[(2 * m) + 1];
        }

        _dft.Forward(_re, _im);
        var tr = _twiddleRe;
        var ti = _twiddleIm!;
        for (var k = 0; k <= h; k++)
        {
            // Z index k mod h and (h − k) mod h, without a division per bin.
            var a = k == h ? 0 : k;
            var b = k == 0 ? 0 : h - k;
            // E = (Z_a + conj Z_b)/2, O = (Z_a - conj Z_b)/(2i), X = E + W^k O.
            var er = 0.5 * (_re[a] + _re[b]);
            var ei = 0.5 * (_im[a] - _im[b]);
            var or = 0.5 * (_im[a] + _im[b]);
            var oi = -0.5 * (_re[a] - _re[b]);
            var xr = er + ((tr[k] * or) - (ti[k] * oi));
            var xi = ei + ((tr[k] * oi) + (ti[k] * or));
            var p = ((xr * xr) + (xi * xi)) * norm;
            power[k] = k == 0 || k == h ? p : 2 * p;
        }
    }
}
