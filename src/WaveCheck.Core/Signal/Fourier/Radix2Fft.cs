using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace WaveCheck.Core.Signal;

/// <summary>
/// In-place radix-2 complex FFT of a power-of-two length on split real/imaginary arrays, with the twiddle factors and
/// bit-reversal table built once. Immutable after construction, so one instance may be shared between threads.
/// </summary>
/// <remarks>One algorithm in both directions (decimation in time and in frequency), kept in one file because
/// Bluestein's convolution pairs them to skip the bit-reversal passes; the length is the vectorised radix-4 passes
/// of each.</remarks>
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
