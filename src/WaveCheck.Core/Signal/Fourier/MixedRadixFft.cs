using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// Complex FFT of a length M = q·p, p = 2^k, q in {1, 3, 5}, seen as q blocks of p values. One Cooley–Tukey step
/// does q-point DFTs across the blocks (hard-coded butterflies, vectorised over the p positions) with the twiddles
/// W_M^{n1·k2}, and a <see cref="Radix2Fft"/> within each block. Decimation in frequency leaves the spectrum
/// permuted (X[q·k1 + k2] in block k2 at bit-reversed position k1) and the transposed algorithm takes that order
/// back, so a convolution (Bluestein's, in <see cref="ComplexDft"/>) needs no permutation pass at all. Lets that
/// convolution use the smallest such length at or above 2n − 1 (10 240 instead of 16 384 for n ≈ 5 000).
/// Immutable except for <see cref="Forward"/>'s scratch: that one call is not thread-safe.
/// </summary>
internal sealed class MixedRadixFft
{
    // sin(2π/3), cos(2π/5), cos(4π/5), sin(2π/5), sin(4π/5): the 3- and 5-point DFT constants.
    private static readonly double S3 = Math.Sqrt(3) / 2;
    private static readonly double C51 = Math.Cos(2 * Math.PI / 5);
    private static readonly double C52 = Math.Cos(4 * Math.PI / 5);
    private static readonly double S51 = Math.Sin(2 * Math.PI / 5);
    private static readonly double S52 = Math.Sin(4 * Math.PI / 5);

    private readonly Radix2Fft _fft;
    private readonly int _q;
    private readonly int _p;
    private readonly double[] _twiddleRe = [];
    private readonly double[] _twiddleIm = [];
    private double[] _workRe = [];
    private double[] _workIm = [];

    /// <summary>Builds the plan for <paramref name="length"/> points, q·2^k with q in {1, 3, 5}.</summary>
    public MixedRadixFft(int length)
    {
        if (!Supports(length))
        {
            throw new ArgumentOutOfRangeException(nameof(length), length, "length must be 2^k, 3·2^k or 5·2^k");
        }

        Length = length;
        _q = BitOperations.IsPow2(length) ? 1 : length % 3 == 0 ? 3 : 5;
        _p = length / _q;
        _fft = new Radix2Fft(_p);
        if (_q == 1)
        {
            return;
        }

        // W_M^{k2·n1}, entry [k2·p + n1]; angles reduced mod M to stay exact.
        _twiddleRe = new double[length];
        _twiddleIm = new double[length];
        for (var k2 = 0; k2 < _q; k2++)
        {
            for (var n1 = 0; n1 < _p; n1++)
            {
                var angle = -2.0 * Math.PI * ((long)k2 * n1 % length) / length;
                _twiddleRe[(k2 * _p) + n1] = Math.Cos(angle);
                _twiddleIm[(k2 * _p) + n1] = Math.Sin(angle);
            }
        }
    }

    /// <summary>Number of points.</summary>
    public int Length { get; }

    /// <summary>Whether <paramref name="length"/> is 2^k, 3·2^k or 5·2^k.</summary>
    public static bool Supports(int length) =>
        length >= 1 && (BitOperations.IsPow2(length) || (length % 3 == 0 && BitOperations.IsPow2(length / 3)) ||
            (length % 5 == 0 && BitOperations.IsPow2(length / 5)));

    /// <summary>Smallest supported length at or above <paramref name="least"/>.</summary>
    public static int AtLeast(int least)
    {
        var best = (int)BitOperations.RoundUpToPowerOf2((uint)least);
        foreach (var q in (ReadOnlySpan<int>)[3, 5])
        {
            var candidate = q * (int)BitOperations.RoundUpToPowerOf2((uint)((least + q - 1) / q));
            best = Math.Min(best, candidate);
        }

        return best;
    }

    /// <summary>Forward transform X_k = Σ x_j e^{-2πi jk/n}, in place, unscaled, in natural order.</summary>
    public void Forward(Span<double> re, Span<double> im)
    {
        if (_q == 1)
        {
            _fft.Forward(re, im);
            return;
        }

        ForwardToPermuted(re, im);
        var (q, p, n) = (_q, _p, Length);
        if (_workRe.Length < n)
        {
            _workRe = new double[n];
            _workIm = new double[n];
        }

        re[..n].CopyTo(_workRe);
        im[..n].CopyTo(_workIm);
        var reverse = _fft.BitReversed;
        for (var k2 = 0; k2 < q; k2++)
        {
            for (var k1 = 0; k1 < p; k1++)
            {
                re[(q * k1) + k2] = _workRe[(k2 * p) + reverse[k1]];
                im[(q * k1) + k2] = _workIm[(k2 * p) + reverse[k1]];
            }
        }
    }

    /// <summary>Forward transform of natural-order input, in place, unscaled, the result permuted: X[q·k1 + k2] in
    /// block k2 (values k2·p to k2·p + p − 1) at position <see cref="Radix2Fft.BitReversed"/>[k1].</summary>
    public void ForwardToPermuted(Span<double> re, Span<double> im)
    {
        if (_q > 1)
        {
            AcrossBlocks(re, im, twiddleAfter: true);
        }

        for (var b = 0; b < _q; b++)
        {
            _fft.ForwardToBitReversed(re.Slice(b * _p, _p), im.Slice(b * _p, _p));
        }
    }

    /// <summary>Forward transform of input in the order <see cref="ForwardToPermuted"/> leaves, in place, unscaled,
    /// the result in natural order.</summary>
    public void ForwardFromPermuted(Span<double> re, Span<double> im)
    {
        for (var b = 0; b < _q; b++)
        {
            _fft.ForwardFromBitReversed(re.Slice(b * _p, _p), im.Slice(b * _p, _p));
        }

        if (_q > 1)
        {
            AcrossBlocks(re, im, twiddleAfter: false);
        }
    }

    /// <summary>At every position n1 of the blocks: the q-point DFT of the values there, the twiddle W_M^{k·n1} on
    /// output k (decimation in frequency) or on input k (its transpose).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void AcrossBlocks(Span<double> re, Span<double> im, bool twiddleAfter)
    {
        var p = _p;
        var width = Vector<double>.Count;
        var n1 = 0;
        if (Vector.IsHardwareAccelerated && p >= width)
        {
            var vr = MemoryMarshal.Cast<double, Vector<double>>(re[..Length]);
            var vi = MemoryMarshal.Cast<double, Vector<double>>(im[..Length]);
            var tr = MemoryMarshal.Cast<double, Vector<double>>(_twiddleRe);
            var ti = MemoryMarshal.Cast<double, Vector<double>>(_twiddleIm);
            if (_q == 3)
            {
                Across3(vr, vi, tr, ti, p / width, twiddleAfter);
            }
            else
            {
                Across5(vr, vi, tr, ti, p / width, twiddleAfter);
            }

            n1 = p;
        }

        // Scalar remainder (blocks shorter than a vector): the plain q-point DFT.
        Span<double> xr = stackalloc double[5];
        Span<double> xi = stackalloc double[5];
        for (; n1 < p; n1++)
        {
            for (var k = 0; k < _q; k++)
            {
                var at = (k * p) + n1;
                (xr[k], xi[k]) = twiddleAfter ? (re[at], im[at]) : Rotate(re[at], im[at], _twiddleRe[at], _twiddleIm[at]);
            }

            for (var k = 0; k < _q; k++)
            {
                double sr = 0, si = 0;
                for (var j = 0; j < _q; j++)
                {
                    var angle = -2.0 * Math.PI * (j * k % _q) / _q;
                    (var r, var i) = Rotate(xr[j], xi[j], Math.Cos(angle), Math.Sin(angle));
                    sr += r;
                    si += i;
                }

                var at = (k * p) + n1;
                (re[at], im[at]) = twiddleAfter ? Rotate(sr, si, _twiddleRe[at], _twiddleIm[at]) : (sr, si);
            }
        }
    }

    private static (double Re, double Im) Rotate(double r, double i, double cr, double ci) =>
        ((r * cr) - (i * ci), (r * ci) + (i * cr));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Rotate(ref Vector<double> r, ref Vector<double> i, Vector<double> cr, Vector<double> ci)
    {
        var t = (r * cr) - (i * ci);
        i = (r * ci) + (i * cr);
        r = t;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Across3(Span<Vector<double>> vr, Span<Vector<double>> vi, ReadOnlySpan<Vector<double>> tr,
        ReadOnlySpan<Vector<double>> ti, int h, bool twiddleAfter)
    {
        var s = new Vector<double>(S3);
        var half = new Vector<double>(0.5);
        for (var j = 0; j < h; j++)
        {
            int i0 = j, i1 = j + h, i2 = j + (2 * h);
            var x0r = vr[i0];
            var x0i = vi[i0];
            var x1r = vr[i1];
            var x1i = vi[i1];
            var x2r = vr[i2];
            var x2i = vi[i2];
            if (!twiddleAfter)
            {
                Rotate(ref x1r, ref x1i, tr[i1], ti[i1]);
                Rotate(ref x2r, ref x2i, tr[i2], ti[i2]);
            }

            // X0 = x0 + t, X1 = a − i·b, X2 = a + i·b with t = x1 + x2, a = x0 − t/2, b = sin(2π/3)·(x1 − x2).
            var tr0 = x1r + x2r;
            var ti0 = x1i + x2i;
            var ar = x0r - (half * tr0);
            var ai = x0i - (half * ti0);
            var br = s * (x1r - x2r);
            var bi = s * (x1i - x2i);
            var y0r = x0r + tr0;
            var y0i = x0i + ti0;
            var y1r = ar + bi;
            var y1i = ai - br;
            var y2r = ar - bi;
            var y2i = ai + br;
            if (twiddleAfter)
            {
                Rotate(ref y1r, ref y1i, tr[i1], ti[i1]);
                Rotate(ref y2r, ref y2i, tr[i2], ti[i2]);
            }

            (vr[i0], vi[i0], vr[i1], vi[i1], vr[i2], vi[i2]) = (y0r, y0i, y1r, y1i, y2r, y2i);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Across5(Span<Vector<double>> vr, Span<Vector<double>> vi, ReadOnlySpan<Vector<double>> tr,
        ReadOnlySpan<Vector<double>> ti, int h, bool twiddleAfter)
    {
        var c1 = new Vector<double>(C51);
        var c2 = new Vector<double>(C52);
        var s1 = new Vector<double>(S51);
        var s2 = new Vector<double>(S52);
        for (var j = 0; j < h; j++)
        {
            int i0 = j, i1 = j + h, i2 = j + (2 * h), i3 = j + (3 * h), i4 = j + (4 * h);
            var x0r = vr[i0];
            var x0i = vi[i0];
            var x1r = vr[i1];
            var x1i = vi[i1];
            var x2r = vr[i2];
            var x2i = vi[i2];
            var x3r = vr[i3];
            var x3i = vi[i3];
            var x4r = vr[i4];
            var x4i = vi[i4];
            if (!twiddleAfter)
            {
                Rotate(ref x1r, ref x1i, tr[i1], ti[i1]);
                Rotate(ref x2r, ref x2i, tr[i2], ti[i2]);
                Rotate(ref x3r, ref x3i, tr[i3], ti[i3]);
                Rotate(ref x4r, ref x4i, tr[i4], ti[i4]);
            }

            // With t1 = x1 + x4, t2 = x2 + x3, t3 = x1 − x4, t4 = x2 − x3:
            // X0 = x0 + t1 + t2; X1,4 = a1 ∓ i·b1; X2,3 = a2 ∓ i·b2, where
            // a1 = x0 + c1·t1 + c2·t2, a2 = x0 + c2·t1 + c1·t2, b1 = s1·t3 + s2·t4, b2 = s2·t3 − s1·t4.
            var t1r = x1r + x4r;
            var t1i = x1i + x4i;
            var t2r = x2r + x3r;
            var t2i = x2i + x3i;
            var t3r = x1r - x4r;
            var t3i = x1i - x4i;
            var t4r = x2r - x3r;
            var t4i = x2i - x3i;
            var a1r = x0r + (c1 * t1r) + (c2 * t2r);
            var a1i = x0i + (c1 * t1i) + (c2 * t2i);
            var a2r = x0r + (c2 * t1r) + (c1 * t2r);
            var a2i = x0i + (c2 * t1i) + (c1 * t2i);
            var b1r = (s1 * t3r) + (s2 * t4r);
            var b1i = (s1 * t3i) + (s2 * t4i);
            var b2r = (s2 * t3r) - (s1 * t4r);
            var b2i = (s2 * t3i) - (s1 * t4i);
            var y0r = x0r + t1r + t2r;
            var y0i = x0i + t1i + t2i;
            var y1r = a1r + b1i;
            var y1i = a1i - b1r;
            var y4r = a1r - b1i;
            var y4i = a1i + b1r;
            var y2r = a2r + b2i;
            var y2i = a2i - b2r;
            var y3r = a2r - b2i;
            var y3i = a2i + b2r;
            if (twiddleAfter)
            {
                Rotate(ref y1r, ref y1i, tr[i1], ti[i1]);
                Rotate(ref y2r, ref y2i, tr[i2], ti[i2]);
                Rotate(ref y3r, ref y3i, tr[i3], ti[i3]);
                Rotate(ref y4r, ref y4i, tr[i4], ti[i4]);
            }

            (vr[i0], vi[i0], vr[i1], vi[i1], vr[i2], vi[i2]) = (y0r, y0i, y1r, y1i, y2r, y2i);
            (vr[i3], vi[i3], vr[i4], vi[i4]) = (y3r, y3i, y4r, y4i);
        }
    }
}
