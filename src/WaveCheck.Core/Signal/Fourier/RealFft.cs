using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace WaveCheck.Core.Signal;

/// <summary>
/// DFT of a real sequence of fixed length, the non-negative-frequency bins X_0 … X_{⌊n/2⌋} (unscaled, e^{−i}
/// convention: what numpy.fft.rfft returns). Built once per length and reused; holds scratch: not thread-safe.
/// </summary>
/// <remarks>
/// <para>An even length n = 2h is transformed as one complex sequence of half the length, z_m = x_{2m} + i·x_{2m+1},
/// and split: with Z the h-point DFT of z, E_k = (Z_k + conj Z_{h−k})/2 and O_k = (Z_k − conj Z_{h−k})/2i are the
/// DFTs of the even and the odd samples, and X_k = E_k + e^{−2πik/n}·O_k (the real-input FFT of the textbooks, e.g.
/// Press et al., Numerical Recipes, §12.3). That halves the work of a complex transform of the real data. An odd
/// length goes through the full complex DFT with a zero imaginary part (no half-length split exists).</para>
/// <para>Precision: double throughout. float32 would meet the accuracy the analysis needs (a rounding error of about
/// 2⁻²⁴·log₂n ≈ 1e-6 of the window's RMS, far below the 0.1 % of full scale of the harmonic-group checks), but it
/// changes the last digits of every figure in the JSON, which must stay byte-identical across speed work; and the
/// transform is not where the time goes (bench/README.md).</para>
/// </remarks>
public sealed class RealFft
{
    private readonly ComplexDft _dft;
    private readonly double[] _re;
    private readonly double[] _im;
    private readonly double[]? _twiddleRe;
    private readonly double[]? _twiddleIm;

    /// <summary>Builds the plan for sequences of <paramref name="length"/> samples.</summary>
    /// <param name="length">Samples, at least 2.</param>
    /// <exception cref="ArgumentOutOfRangeException">The length is below 2.</exception>
    public RealFft(int length)
    {
        if (length < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(length), length, "transform length must be at least 2 samples");
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

    /// <summary>Samples per sequence.</summary>
    public int Length { get; }

    /// <summary>Number of bins written, <c>Length / 2 + 1</c> (bin k at k·fs/Length hertz).</summary>
    public int BinCount => (Length / 2) + 1;

    /// <summary>Writes X_k = Σ x_j e^{−2πi jk/n} for k = 0 … <see cref="BinCount"/> − 1, unscaled.</summary>
    /// <param name="samples">Exactly <see cref="Length"/> samples.</param>
    /// <param name="re">At least <see cref="BinCount"/> values, overwritten with the real parts.</param>
    /// <param name="im">At least <see cref="BinCount"/> values, overwritten with the imaginary parts.</param>
    /// <exception cref="ArgumentException">A span has the wrong length.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Forward(ReadOnlySpan<double> samples, Span<double> re, Span<double> im)
    {
        if (samples.Length != Length)
        {
            throw new ArgumentException($"expected {Length} samples, got {samples.Length}", nameof(samples));
        }

        var bins = BinCount;
        if (re.Length < bins || im.Length < bins)
        {
            throw new ArgumentException($"expected room for {bins} bins, got {re.Length} and {im.Length}", nameof(re));
        }

        if (_twiddleRe is null)
        {
            samples.CopyTo(_re);
            Array.Clear(_im);
            _dft.Forward(_re, _im);
            _re.AsSpan(0, bins).CopyTo(re);
            _im.AsSpan(0, bins).CopyTo(im);
            return;
        }

        var h = Length / 2;
        for (var m = 0; m < h; m++)
        {
            _re[m] = samples[2 * m];
            _im[m] = samples[(2 * m) + 1];
        }

        _dft.Forward(_re, _im);
        Split(re, im);
    }

    /// <summary>The split step X_k = E_k + e^{−2πik/n}·O_k for k = 0 … h, from the half-length transform in
    /// <c>_re</c>/<c>_im</c>. Bins 1 … h − 1 four at a time where 256-bit vectors run in hardware (Z_{h−k} read as a
    /// reversed vector); every bin gets the same operations in the same order either way, so the figures are the same
    /// bits as the scalar loop's.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Split(Span<double> re, Span<double> im)
    {
        var h = Length / 2;
        var tr = _twiddleRe!;
        var ti = _twiddleIm!;
        SplitBin(0, 0, 0, re, im);
        var k = 1;
        if (Vector256.IsHardwareAccelerated)
        {
            var half = Vector256.Create(0.5);
            var minusHalf = Vector256.Create(-0.5);
            var reverse = Vector256.Create(3L, 2, 1, 0);
            // Lanes k … k + 3 against h − k − 3 … h − k, all within 1 … h − 1.
            for (; k + 3 <= h - 1; k += 4)
            {
                var ra = Vector256.Create(_re.AsSpan(k, 4));
                var ia = Vector256.Create(_im.AsSpan(k, 4));
                var rb = Vector256.Shuffle(Vector256.Create(_re.AsSpan(h - k - 3, 4)), reverse);
                var ib = Vector256.Shuffle(Vector256.Create(_im.AsSpan(h - k - 3, 4)), reverse);
                var er = half * (ra + rb);
                var ei = half * (ia - ib);
                var or = half * (ia + ib);
                var oi = minusHalf * (ra - rb);
                var wr = Vector256.Create(tr.AsSpan(k, 4));
                var wi = Vector256.Create(ti.AsSpan(k, 4));
                (er + ((wr * or) - (wi * oi))).CopyTo(re.Slice(k, 4));
                (ei + ((wr * oi) + (wi * or))).CopyTo(im.Slice(k, 4));
            }
        }

        for (; k < h; k++)
        {
            SplitBin(k, k, h - k, re, im);
        }

        // Z index h mod h = 0 for the last bin.
        SplitBin(h, 0, 0, re, im);
    }

    /// <summary>One bin of the split step: Z_a and Z_b are Z_k and Z_{h−k} (indices mod h).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void SplitBin(int k, int a, int b, Span<double> re, Span<double> im)
    {
        var tr = _twiddleRe!;
        var ti = _twiddleIm!;
        var er = 0.5 * (_re[a] + _re[b]);
        var ei = 0.5 * (_im[a] - _im[b]);
        var or = 0.5 * (_im[a] + _im[b]);
        var oi = -0.5 * (_re[a] - _re[b]);
        re[k] = er + ((tr[k] * or) - (ti[k] * oi));
        im[k] = ei + ((tr[k] * oi) + (ti[k] * or));
    }
}
