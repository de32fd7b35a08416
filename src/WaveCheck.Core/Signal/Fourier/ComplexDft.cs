using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Complex DFT of any length: <see cref="MixedRadixFft"/> when the length is 2^k, 3·2^k or 5·2^k, otherwise
/// Bluestein's chirp-z algorithm (the DFT as a convolution with a chirp, done by the smallest such FFT of at least
/// 2n − 1 points). Holds scratch buffers: not thread-safe.
/// </summary>
internal sealed class ComplexDft
{
    private readonly MixedRadixFft _fft;
    private readonly double[]? _chirpRe;
    private readonly double[]? _chirpIm;
    private readonly double[]? _kernelRe;
    private readonly double[]? _kernelIm;
    private readonly double[]? _workRe;
    private readonly double[]? _workIm;

    /// <summary>Builds the plan for <paramref name="length"/> points (at least 1).</summary>
    public ComplexDft(int length)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(length, 1);
        Length = length;
        if (MixedRadixFft.Supports(length))
        {
            _fft = new MixedRadixFft(length);
            return;
        }

        var m = MixedRadixFft.AtLeast((2 * length) - 1);
        _fft = new MixedRadixFft(m);
        _chirpRe = new double[length];
        _chirpIm = new double[length];
        for (var j = 0; j < length; j++)
        {
            // e^{-iπ j²/n}; j² reduced mod 2n keeps the angle small and exact.
            var q = (long)j * j % (2L * length);
            var angle = -Math.PI * q / length;
            _chirpRe[j] = Math.Cos(angle);
            _chirpIm[j] = Math.Sin(angle);
        }

        _kernelRe = new double[m];
        _kernelIm = new double[m];
        _kernelRe[0] = 1;
        for (var j = 1; j < length; j++)
        {
            // b_j = conj(chirp_j) = e^{+iπ j²/n}, placed at j and at m - j (negative lags).
            _kernelRe[j] = _kernelRe[m - j] = _chirpRe[j];
            _kernelIm[j] = _kernelIm[m - j] = -_chirpIm[j];
        }

        // Kept in the permuted order the forward transform leaves (see MixedRadixFft), as the products are formed.
        _fft.ForwardToPermuted(_kernelRe, _kernelIm);
        _workRe = new double[m];
        _workIm = new double[m];
    }

    /// <summary>Number of points.</summary>
    public int Length { get; }

    /// <summary>Forward DFT X_k = Σ x_j e^{-2πi jk/n}, in place on the first <see cref="Length"/> values, unscaled.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Forward(Span<double> re, Span<double> im)
    {
        if (_chirpRe is null)
        {
            _fft.Forward(re, im);
            return;
        }

        var n = Length;
        var wr = _workRe!;
        var wi = _workIm!;
        var cr = _chirpRe;
        var ci = _chirpIm!;
        Multiply(re[..n], im[..n], cr, ci, wr, wi);
        Array.Clear(wr, n, wr.Length - n);
        Array.Clear(wi, n, wi.Length - n);
        _fft.ForwardToPermuted(wr, wi);
        // Inverse transform as conj(F(conj w)): the conjugations folded into the product and the last loop.
        MultiplyConjugateInPlace(wr, wi, _kernelRe!, _kernelIm!);
        _fft.ForwardFromPermuted(wr, wi);
        var scale = 1.0 / wr.Length;
        var k = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var vs = new Vector<double>(scale);
            var vwr = MemoryMarshal.Cast<double, Vector<double>>(wr.AsSpan(0, n));
            var vwi = MemoryMarshal.Cast<double, Vector<double>>(wi.AsSpan(0, n));
            var vcr = MemoryMarshal.Cast<double, Vector<double>>(cr.AsSpan(0, n));
            var vci = MemoryMarshal.Cast<double, Vector<double>>(ci.AsSpan(0, n));
            var vre = MemoryMarshal.Cast<double, Vector<double>>(re[..n]);
            var vim = MemoryMarshal.Cast<double, Vector<double>>(im[..n]);
            for (var v = 0; v < vwr.Length; v++)
            {
                var r = vwr[v] * vs;
                var m = -vwi[v] * vs;
                vre[v] = (r * vcr[v]) - (m * vci[v]);
                vim[v] = (r * vci[v]) + (m * vcr[v]);
            }

            k = vwr.Length * Vector<double>.Count;
        }

        for (; k < n; k++)
        {
            var r = wr[k] * scale;
            var m = -wi[k] * scale;
            re[k] = (r * cr[k]) - (m * ci[k]);
            im[k] = (r * ci[k]) + (m * cr[k]);
        }
    }

    /// <summary>(or + i·oi) = (ar + i·ai)·(br + i·bi), element-wise over whole vectors, then the tail.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Multiply(ReadOnlySpan<double> ar, ReadOnlySpan<double> ai, ReadOnlySpan<double> br,
        ReadOnlySpan<double> bi, Span<double> or, Span<double> oi)
    {
        var n = ar.Length;
        var k = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var va = MemoryMarshal.Cast<double, Vector<double>>(ar);
            var vai = MemoryMarshal.Cast<double, Vector<double>>(ai);
            var vbr = MemoryMarshal.Cast<double, Vector<double>>(br[..n]);
            var vbi = MemoryMarshal.Cast<double, Vector<double>>(bi[..n]);
            var vor = MemoryMarshal.Cast<double, Vector<double>>(or[..n]);
            var voi = MemoryMarshal.Cast<double, Vector<double>>(oi[..n]);
            for (var v = 0; v < va.Length; v++)
            {
                vor[v] = (va[v] * vbr[v]) - (vai[v] * vbi[v]);
                voi[v] = (va[v] * vbi[v]) + (vai[v] * vbr[v]);
            }

            k = va.Length * Vector<double>.Count;
        }

        for (; k < n; k++)
        {
            or[k] = (ar[k] * br[k]) - (ai[k] * bi[k]);
            oi[k] = (ar[k] * bi[k]) + (ai[k] * br[k]);
        }
    }

    /// <summary>(ar + i·ai) = conj((ar + i·ai)·(br + i·bi)), element-wise over whole vectors, then the tail.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void MultiplyConjugateInPlace(Span<double> ar, Span<double> ai, ReadOnlySpan<double> br, ReadOnlySpan<double> bi)
    {
        var k = 0;
        if (Vector.IsHardwareAccelerated)
        {
            var vr = MemoryMarshal.Cast<double, Vector<double>>(ar);
            var vai = MemoryMarshal.Cast<double, Vector<double>>(ai);
            var vbr = MemoryMarshal.Cast<double, Vector<double>>(br);
            var vbi = MemoryMarshal.Cast<double, Vector<double>>(bi);
            for (var v = 0; v < vr.Length; v++)
            {
                var r = (vr[v] * vbr[v]) - (vai[v] * vbi[v]);
                vai[v] = -((vr[v] * vbi[v]) + (vai[v] * vbr[v]));
                vr[v] = r;
            }

            k = vr.Length * Vector<double>.Count;
        }

        for (; k < ar.Length; k++)
        {
            var r = (ar[k] * br[k]) - (ai[k] * bi[k]);
            ai[k] = -((ar[k] * bi[k]) + (ai[k] * br[k]));
            ar[k] = r;
        }
    }
}
