using System.Runtime.CompilerServices;
using System.Numerics;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// In-place radix-2 complex FFT of a power-of-two length on split real/imaginary arrays, with the twiddle factors and
/// bit-reversal table built once. Immutable after construction, so one instance may be shared between threads.
/// </summary>
internal sealed class Radix2Fft
{
    // Twiddles of every stage side by side: stage of half-size h uses entries h..2h−1, e^{−iπ j/h}.
    private readonly double[] _cos;
    private readonly double[] _sin;
    private readonly int[] _reverse;

    /// <summary>Builds the plan for <paramref name="length"/> points (a power of two, at least 1).</summary>
    public Radix2Fft(int length)
    {
        if (length < 1 || !BitOperations.IsPow2(length))
        {
            throw new ArgumentOutOfRangeException(nameof(length), length, "FFT length must be a power of two");
        }

        Length = length;
        _cos = new double[Math.Max(2, length)];
        _sin = new double[Math.Max(2, length)];
        for (var h = 1; h < length; h <<= 1)
        {
            for (var j = 0; j < h; j++)
            {
                var angle = -Math.PI * j / h;
                _cos[h + j] = Math.Cos(angle);
                _sin[h + j] = Math.Sin(angle);
            }
        }

        _reverse = new int[length];
        var bits = BitOperations.Log2((uint)length);
        for (var i = 0; i < length; i++)
        {
            _reverse[i] = bits == 0 ? 0 : (int)(ReverseBits((uint)i) >> (32 - bits));
        }
    }

    /// <summary>Number of points.</summary>
    public int Length { get; }

    /// <summary>Forward transform X_k = Σ x_j e^{-2πi jk/n}, in place, unscaled.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Forward(Span<double> re, Span<double> im)
    {
        var n = Length;
        for (var i = 0; i < n; i++)
        {
            var j = _reverse[i];
            if (j > i)
            {
                (re[i], re[j]) = (re[j], re[i]);
                (im[i], im[j]) = (im[j], im[i]);
            }
        }

        ForwardFromBitReversed(re, im);
    }

    /// <summary>Bit-reversal permutation: entry i is the index whose bits reversed give i.</summary>
    public ReadOnlySpan<int> BitReversed => _reverse;

    /// <summary><see cref="Forward"/> of values already placed in bit-reversed order (x_j at
    /// <see cref="BitReversed"/>[j]), so a caller that gathers its input anyway saves the permutation pass.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ForwardFromBitReversed(Span<double> re, Span<double> im)
    {
        var n = Length;
        re = re[..n];
        im = im[..n];
        var width = Vector<double>.Count;
        var vectorised = Vector.IsHardwareAccelerated && n >= 2 * width;
        var first = 1;
        if (n >= 4)
        {
            FirstTwoStages(re, im);
            first = 4;
        }

        for (var half = first; half < n; half <<= 1)
        {
            var size = half << 1;
            if (vectorised && half >= width && size < n)
            {
                Radix4Pass(re, im, half, width);
                half <<= 1;
                continue;
            }

            if (vectorised && half >= width)
            {
                // Split arrays make a butterfly stage a plain element-wise loop over whole vectors.
                var vr = MemoryMarshal.Cast<double, Vector<double>>(re);
                var vi = MemoryMarshal.Cast<double, Vector<double>>(im);
                var wr = MemoryMarshal.Cast<double, Vector<double>>(_cos.AsSpan(half, half));
                var wi = MemoryMarshal.Cast<double, Vector<double>>(_sin.AsSpan(half, half));
                var h = half / width;
                for (var start = 0; start < vr.Length; start += 2 * h)
                {
                    for (var j = 0; j < h; j++)
                    {
                        var a = start + j;
                        var b = a + h;
                        var br = vr[b];
                        var bi = vi[b];
                        var tr = (br * wr[j]) - (bi * wi[j]);
                        var ti = (br * wi[j]) + (bi * wr[j]);
                        var ar = vr[a];
                        var ai = vi[a];
                        vr[b] = ar - tr;
                        vi[b] = ai - ti;
                        vr[a] = ar + tr;
                        vi[a] = ai + ti;
                    }
                }

                continue;
            }

            var cr = _cos.AsSpan(half, half);
            var ci = _sin.AsSpan(half, half);
            for (var start = 0; start < n; start += size)
            {
                for (var j = 0; j < half; j++)
                {
                    var a = start + j;
                    var b = a + half;
                    var tr = (re[b] * cr[j]) - (im[b] * ci[j]);
                    var ti = (re[b] * ci[j]) + (im[b] * cr[j]);
                    re[b] = re[a] - tr;
                    im[b] = im[a] - ti;
                    re[a] += tr;
                    im[a] += ti;
                }
            }
        }
    }

    /// <summary>The stages of half sizes 1 and 2 as one radix-4 pass (twiddles 1 and −i, so no multiplications).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void FirstTwoStages(Span<double> re, Span<double> im)
    {
        for (var i = 0; i + 3 < re.Length; i += 4)
        {
            double b0r = re[i] + re[i + 1], b0i = im[i] + im[i + 1];
            double b1r = re[i] - re[i + 1], b1i = im[i] - im[i + 1];
            double b2r = re[i + 2] + re[i + 3], b2i = im[i + 2] + im[i + 3];
            double b3r = re[i + 2] - re[i + 3], b3i = im[i + 2] - im[i + 3];
            re[i] = b0r + b2r;
            im[i] = b0i + b2i;
            re[i + 2] = b0r - b2r;
            im[i + 2] = b0i - b2i;

            // −i·b3 = (b3i, −b3r).
            re[i + 1] = b1r + b3i;
            im[i + 1] = b1i - b3r;
            re[i + 3] = b1r - b3i;
            im[i + 3] = b1i + b3r;
        }
    }

    /// <summary>Two radix-2 stages (half sizes h and 2h) in one pass over memory, on whole vectors.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Radix4Pass(Span<double> re, Span<double> im, int half, int width)
    {
        var vr = MemoryMarshal.Cast<double, Vector<double>>(re);
        var vi = MemoryMarshal.Cast<double, Vector<double>>(im);
        var w1r = MemoryMarshal.Cast<double, Vector<double>>(_cos.AsSpan(half, half));
        var w1i = MemoryMarshal.Cast<double, Vector<double>>(_sin.AsSpan(half, half));
        var w2r = MemoryMarshal.Cast<double, Vector<double>>(_cos.AsSpan(2 * half, 2 * half));
        var w2i = MemoryMarshal.Cast<double, Vector<double>>(_sin.AsSpan(2 * half, 2 * half));
        var h = half / width;
        for (var start = 0; start < vr.Length; start += 4 * h)
        {
            for (var j = 0; j < h; j++)
            {
                int i0 = start + j, i1 = i0 + h, i2 = i1 + h, i3 = i2 + h;
                var ar = w1r[j];
                var ai = w1i[j];

                // First stage: (x0, x1) and (x2, x3) with W_{2h}^j.
                var t1r = (vr[i1] * ar) - (vi[i1] * ai);
                var t1i = (vr[i1] * ai) + (vi[i1] * ar);
                var t3r = (vr[i3] * ar) - (vi[i3] * ai);
                var t3i = (vr[i3] * ai) + (vi[i3] * ar);
                var b0r = vr[i0] + t1r;
                var b0i = vi[i0] + t1i;
                var b1r = vr[i0] - t1r;
                var b1i = vi[i0] - t1i;
                var b2r = vr[i2] + t3r;
                var b2i = vi[i2] + t3i;
                var b3r = vr[i2] - t3r;
                var b3i = vi[i2] - t3i;

                // Second stage: (b0, b2) with W_{4h}^j and (b1, b3) with W_{4h}^{j+h}.
                var cr = w2r[j];
                var ci = w2i[j];
                var dr = w2r[j + h];
                var di = w2i[j + h];
                var u2r = (b2r * cr) - (b2i * ci);
                var u2i = (b2r * ci) + (b2i * cr);
                var u3r = (b3r * dr) - (b3i * di);
                var u3i = (b3r * di) + (b3i * dr);
                vr[i0] = b0r + u2r;
                vi[i0] = b0i + u2i;
                vr[i2] = b0r - u2r;
                vi[i2] = b0i - u2i;
                vr[i1] = b1r + u3r;
                vi[i1] = b1i + u3i;
                vr[i3] = b1r - u3r;
                vi[i3] = b1i - u3i;
            }
        }
    }

    private static uint ReverseBits(uint v)
    {
        v = ((v >> 1) & 0x55555555u) | ((v & 0x55555555u) << 1);
        v = ((v >> 2) & 0x33333333u) | ((v & 0x33333333u) << 2);
        v = ((v >> 4) & 0x0F0F0F0Fu) | ((v & 0x0F0F0F0Fu) << 4);
        v = ((v >> 8) & 0x00FF00FFu) | ((v & 0x00FF00FFu) << 8);
        return (v >> 16) | (v << 16);
    }
}

/// <summary>
/// Complex FFT of a length q·2^k with q in {1, 3, 5}: one Cooley–Tukey step splits it into q power-of-two FFTs of the
/// decimated sequences (<see cref="Radix2Fft"/>, vectorised), then twiddles and q-point DFTs across them, vectorised
/// over the 2^k columns. Lets Bluestein's convolution use the smallest such length at or above 2n − 1 (10 240 instead
/// of 16 384 for n ≈ 5 000). Holds scratch: not thread-safe.
/// </summary>
internal sealed class MixedRadixFft
{
    private readonly Radix2Fft _fft;
    private readonly int _q;
    private readonly double[] _twiddleRe = [];
    private readonly double[] _twiddleIm = [];
    private readonly double[] _rootRe = [];
    private readonly double[] _rootIm = [];
    private readonly double[] _workRe = [];
    private readonly double[] _workIm = [];

    /// <summary>Builds the plan for <paramref name="length"/> points, q·2^k with q in {1, 3, 5}.</summary>
    public MixedRadixFft(int length)
    {
        if (!Supports(length))
        {
            throw new ArgumentOutOfRangeException(nameof(length), length, "length must be 2^k, 3·2^k or 5·2^k");
        }

        Length = length;
        _q = length % 3 == 0 ? 3 : length % 5 == 0 ? 5 : 1;
        var p = length / _q;
        _fft = new Radix2Fft(p);
        if (_q == 1)
        {
            return;
        }

        // W_M^{n1·k2} for the column twiddles and W_q^{j} for the q-point DFTs; angles reduced mod M to stay exact.
        _twiddleRe = new double[length];
        _twiddleIm = new double[length];
        for (var n1 = 0; n1 < _q; n1++)
        {
            for (var k2 = 0; k2 < p; k2++)
            {
                var angle = -2.0 * Math.PI * ((long)n1 * k2 % length) / length;
                _twiddleRe[(n1 * p) + k2] = Math.Cos(angle);
                _twiddleIm[(n1 * p) + k2] = Math.Sin(angle);
            }
        }

        // The q-point DFT matrix, entry [k1·q + n1] = W_q^{n1·k1}.
        _rootRe = new double[_q * _q];
        _rootIm = new double[_q * _q];
        for (var k1 = 0; k1 < _q; k1++)
        {
            for (var n1 = 0; n1 < _q; n1++)
            {
                var j = n1 * k1 % _q;
                _rootRe[(k1 * _q) + n1] = Math.Cos(-2.0 * Math.PI * j / _q);
                _rootIm[(k1 * _q) + n1] = Math.Sin(-2.0 * Math.PI * j / _q);
            }
        }

        _workRe = new double[length];
        _workIm = new double[length];
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

    /// <summary>Forward transform X_k = Σ x_j e^{-2πi jk/n}, in place, unscaled.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Forward(Span<double> re, Span<double> im)
    {
        if (_q == 1)
        {
            _fft.Forward(re, im);
            return;
        }

        var q = _q;
        var p = Length / q;
        var wr = _workRe;
        var wi = _workIm;

        // x[q·n2 + n1] → column n1 in bit-reversed order, then a 2^k FFT per column.
        var reverse = _fft.BitReversed;
        for (var n1 = 0; n1 < q; n1++)
        {
            var cr = wr.AsSpan(n1 * p, p);
            var ci = wi.AsSpan(n1 * p, p);
            for (var n2 = 0; n2 < p; n2++)
            {
                var to = reverse[n2];
                cr[to] = re[(q * n2) + n1];
                ci[to] = im[(q * n2) + n1];
            }

            _fft.ForwardFromBitReversed(cr, ci);
        }

        // X[k2 + p·k1] = Σ_n1 W_q^{n1·k1} · W_M^{n1·k2} · C_n1[k2].
        var width = Vector<double>.Count;
        var k2 = 0;
        if (Vector.IsHardwareAccelerated && p >= width)
        {
            var vwr = MemoryMarshal.Cast<double, Vector<double>>(wr);
            var vwi = MemoryMarshal.Cast<double, Vector<double>>(wi);
            var vtr = MemoryMarshal.Cast<double, Vector<double>>(_twiddleRe);
            var vti = MemoryMarshal.Cast<double, Vector<double>>(_twiddleIm);
            var vre = MemoryMarshal.Cast<double, Vector<double>>(re);
            var vim = MemoryMarshal.Cast<double, Vector<double>>(im);
            var columns = p / width;
            Span<Vector<double>> tr = stackalloc Vector<double>[5];
            Span<Vector<double>> ti = stackalloc Vector<double>[5];
            for (var c = 0; c < columns; c++)
            {
                tr[0] = vwr[c];
                ti[0] = vwi[c];
                for (var n1 = 1; n1 < q; n1++)
                {
                    var at = (n1 * columns) + c;
                    tr[n1] = (vwr[at] * vtr[at]) - (vwi[at] * vti[at]);
                    ti[n1] = (vwr[at] * vti[at]) + (vwi[at] * vtr[at]);
                }

                for (var k1 = 0; k1 < q; k1++)
                {
                    var sr = tr[0];
                    var si = ti[0];
                    for (var n1 = 1; n1 < q; n1++)
                    {
                        var j = (k1 * q) + n1;
                        sr += (tr[n1] * _rootRe[j]) - (ti[n1] * _rootIm[j]);
                        si += (tr[n1] * _rootIm[j]) + (ti[n1] * _rootRe[j]);
                    }

                    vre[(k1 * columns) + c] = sr;
                    vim[(k1 * columns) + c] = si;
                }
            }

            k2 = columns * width;
        }

        Span<double> sr1 = stackalloc double[5];
        Span<double> si1 = stackalloc double[5];
        for (; k2 < p; k2++)
        {
            sr1[0] = wr[k2];
            si1[0] = wi[k2];
            for (var n1 = 1; n1 < q; n1++)
            {
                var at = (n1 * p) + k2;
                sr1[n1] = (wr[at] * _twiddleRe[at]) - (wi[at] * _twiddleIm[at]);
                si1[n1] = (wr[at] * _twiddleIm[at]) + (wi[at] * _twiddleRe[at]);
            }

            for (var k1 = 0; k1 < q; k1++)
            {
                var sr = sr1[0];
                var si = si1[0];
                for (var n1 = 1; n1 < q; n1++)
                {
                    var j = (k1 * q) + n1;
                    sr += (sr1[n1] * _rootRe[j]) - (si1[n1] * _rootIm[j]);
                    si += (sr1[n1] * _rootIm[j]) + (si1[n1] * _rootRe[j]);
                }

                re[(k1 * p) + k2] = sr;
                im[(k1 * p) + k2] = si;
            }
        }
    }
}

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

        _fft.Forward(_kernelRe, _kernelIm);
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
        for (var j = 0; j < n; j++)
        {
            wr[j] = (re[j] * cr[j]) - (im[j] * ci[j]);
            wi[j] = (re[j] * ci[j]) + (im[j] * cr[j]);
        }

        Array.Clear(wr, n, wr.Length - n);
        Array.Clear(wi, n, wi.Length - n);
        _fft.Forward(wr, wi);
        var kr = _kernelRe!;
        var ki = _kernelIm!;
        // Inverse transform as conj(F(conj w)): the conjugations folded into the product and the last loop.
        MultiplyConjugateInPlace(wr, wi, kr, ki);
        _fft.Forward(wr, wi);
        var scale = 1.0 / wr.Length;
        for (var k = 0; k < n; k++)
        {
            var r = wr[k] * scale;
            var m = -wi[k] * scale;
            re[k] = (r * cr[k]) - (m * ci[k]);
            im[k] = (r * ci[k]) + (m * cr[k]);
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
