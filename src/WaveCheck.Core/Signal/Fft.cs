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

    /// <summary>
    /// Forward transform by decimation in frequency: input in natural order, output left in bit-reversed order
    /// (X_k at position <see cref="BitReversed"/>[k]). With <see cref="ForwardFromBitReversed"/> it lets a convolution
    /// skip both permutation passes: transform, multiply in the permuted order, transform back.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ForwardToBitReversed(Span<double> re, Span<double> im)
    {
        var n = Length;
        re = re[..n];
        im = im[..n];
        if (n == 2)
        {
            (re[0], re[1]) = (re[0] + re[1], re[0] - re[1]);
            (im[0], im[1]) = (im[0] + im[1], im[0] - im[1]);
            return;
        }

        var width = Vector<double>.Count;
        var half = n >> 1;
        // Whole-vector stages down to half size max(width, 4); two at a time, the odd one out first.
        var lowest = Math.Max(width, 4);
        if (Vector.IsHardwareAccelerated && half >= lowest)
        {
            var stages = BitOperations.Log2((uint)half) - BitOperations.Log2((uint)lowest) + 1;
            if (stages % 2 == 1)
            {
                DifStageVector(re, im, half, width);
                half >>= 1;
            }

            for (; half >= 2 * lowest; half >>= 2)
            {
                DifRadix4Pass(re, im, half >> 1, width);
            }
        }

        for (; half >= 4; half >>= 1)
        {
            var cr = _cos.AsSpan(half, half);
            var ci = _sin.AsSpan(half, half);
            for (var start = 0; start < n; start += 2 * half)
            {
                for (var j = 0; j < half; j++)
                {
                    var a = start + j;
                    var b = a + half;
                    var dr = re[a] - re[b];
                    var di = im[a] - im[b];
                    re[a] += re[b];
                    im[a] += im[b];
                    re[b] = (dr * cr[j]) - (di * ci[j]);
                    im[b] = (dr * ci[j]) + (di * cr[j]);
                }
            }
        }

        if (n >= 4)
        {
            LastTwoStages(re, im);
        }
    }

    /// <summary>One decimation-in-frequency stage of half size <paramref name="half"/> on whole vectors.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void DifStageVector(Span<double> re, Span<double> im, int half, int width)
    {
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
                var dr = vr[a] - vr[b];
                var di = vi[a] - vi[b];
                vr[a] += vr[b];
                vi[a] += vi[b];
                vr[b] = (dr * wr[j]) - (di * wi[j]);
                vi[b] = (dr * wi[j]) + (di * wr[j]);
            }
        }
    }

    /// <summary>The decimation-in-frequency stages of half sizes 2h and h in one pass, on whole vectors: the mirror
    /// of <see cref="Radix4Pass"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void DifRadix4Pass(Span<double> re, Span<double> im, int half, int width)
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

                // Stage of half size 2h: (x0, x2) with W_{4h}^j, (x1, x3) with W_{4h}^{j+h}.
                var a0r = vr[i0] + vr[i2];
                var a0i = vi[i0] + vi[i2];
                var d0r = vr[i0] - vr[i2];
                var d0i = vi[i0] - vi[i2];
                var a1r = vr[i1] + vr[i3];
                var a1i = vi[i1] + vi[i3];
                var d1r = vr[i1] - vr[i3];
                var d1i = vi[i1] - vi[i3];
                var cr = w2r[j];
                var ci = w2i[j];
                var er = w2r[j + h];
                var ei = w2i[j + h];
                var a2r = (d0r * cr) - (d0i * ci);
                var a2i = (d0r * ci) + (d0i * cr);
                var a3r = (d1r * er) - (d1i * ei);
                var a3i = (d1r * ei) + (d1i * er);

                // Stage of half size h: (a0, a1) and (a2, a3) with W_{2h}^j.
                var wr = w1r[j];
                var wi = w1i[j];
                vr[i0] = a0r + a1r;
                vi[i0] = a0i + a1i;
                var b1r = a0r - a1r;
                var b1i = a0i - a1i;
                vr[i1] = (b1r * wr) - (b1i * wi);
                vi[i1] = (b1r * wi) + (b1i * wr);
                vr[i2] = a2r + a3r;
                vi[i2] = a2i + a3i;
                var b3r = a2r - a3r;
                var b3i = a2i - a3i;
                vr[i3] = (b3r * wr) - (b3i * wi);
                vi[i3] = (b3r * wi) + (b3i * wr);
            }
        }
    }

    /// <summary>The decimation-in-frequency stages of half sizes 2 and 1 (twiddles 1 and −i): the mirror of
    /// <see cref="FirstTwoStages"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void LastTwoStages(Span<double> re, Span<double> im)
    {
        for (var i = 0; i + 3 < re.Length; i += 4)
        {
            double a0r = re[i] + re[i + 2], a0i = im[i] + im[i + 2];
            double a2r = re[i] - re[i + 2], a2i = im[i] - im[i + 2];
            double a1r = re[i + 1] + re[i + 3], a1i = im[i + 1] + im[i + 3];
            double dr = re[i + 1] - re[i + 3], di = im[i + 1] - im[i + 3];

            // a3 = −i·d = (di, −dr).
            re[i] = a0r + a1r;
            im[i] = a0i + a1i;
            re[i + 1] = a0r - a1r;
            im[i + 1] = a0i - a1i;
            re[i + 2] = a2r + di;
            im[i + 2] = a2i - dr;
            re[i + 3] = a2r - di;
            im[i + 3] = a2i + dr;
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
