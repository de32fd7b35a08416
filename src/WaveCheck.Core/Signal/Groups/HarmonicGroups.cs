using System.Runtime.CompilerServices;
namespace WaveCheck.Core.Signal;

/// <summary>
/// IEC 61000-4-7 grouping of a synchronised window's bins (bin k of a window of N mains cycles lies at k/N times the
/// mains frequency, so harmonic n sits on bin N·n). All methods read the mean-square spectrum C_k² written by
/// <see cref="RealSpectrum.Power"/> and return mean squares (A²); take the square root for RMS. Stateless.
/// </summary>
/// <remarks>
/// IEC 61000-4-7 (as reproduced in REFERENCE.md, "mem"): harmonic group G_g,n² = ½C²(k−5) + ΣC²(k−4..k+4) + ½C²(k+5)
/// at 50 Hz with 10 cycles (k = 10n); generalised here to N cycles as full bins k−N/2+1..k+N/2−1 and half-weighted edge
/// bins k ± N/2 (for odd N the edges fall between bins and every bin k−(N−1)/2..k+(N−1)/2 counts fully, so groups
/// still tile the spectrum). Subgroup G_sg,n² = ΣC²(k−1..k+1). Interharmonic group n (between n and n+1):
/// ΣC²(k+1..k+N−1); centred subgroup ΣC²(k+2..k+N−2). Bins beyond the spectrum count as zero.
/// </remarks>
public static class HarmonicGroups
{
    /// <summary>Harmonic group G_g,n² of order <paramref name="order"/> (≥ 1), A².</summary>
    public static double Group(ReadOnlySpan<double> power, int cycles, int order)
    {
        var k = cycles * order;
        var half = cycles / 2;
        if (cycles % 2 == 0)
        {
            return Sum(power, k - half + 1, k + half - 1) + (0.5 * (Bin(power, k - half) + Bin(power, k + half)));
        }

        return Sum(power, k - half, k + half);
    }

    /// <summary>Harmonic subgroup G_sg,n² of order <paramref name="order"/> (≥ 1): bins k−1..k+1, A².</summary>
    public static double Subgroup(ReadOnlySpan<double> power, int cycles, int order)
    {
        var k = cycles * order;
        return Sum(power, k - 1, k + 1);
    }

    /// <summary>Interharmonic group between orders <paramref name="order"/> and order+1 (order ≥ 0): bins k+1..k+N−1, A².</summary>
    public static double InterharmonicGroup(ReadOnlySpan<double> power, int cycles, int order)
    {
        var k = cycles * order;
        return Sum(power, k + 1, k + cycles - 1);
    }

    /// <summary>Centred interharmonic subgroup between <paramref name="order"/> and order+1: bins k+2..k+N−2, A².</summary>
    public static double InterharmonicSubgroup(ReadOnlySpan<double> power, int cycles, int order)
    {
        var k = cycles * order;
        return Sum(power, k + 2, k + cycles - 2);
    }

    /// <summary>Content below the fundamental's group: bins 1..N/2−1 plus the half of bin N/2 not in group 1 (even N), A².</summary>
    public static double BelowFundamental(ReadOnlySpan<double> power, int cycles)
    {
        var half = cycles / 2;
        return cycles % 2 == 0
            ? Sum(power, 1, half - 1) + (0.5 * Bin(power, half))
            : Sum(power, 1, half);
    }

    /// <summary>True when bin <paramref name="bin"/> lies in the subgroup (k−1..k+1) of some order 1..<paramref name="maxOrder"/>.</summary>
    public static bool InHarmonicSubgroup(int bin, int cycles, int maxOrder)
    {
        var order = (int)Math.Round((double)bin / cycles);
        return order >= 1 && order <= maxOrder && Math.Abs(bin - (order * cycles)) <= 1;
    }

    /// <summary>Sum of bins <paramref name="from"/>..<paramref name="to"/> inclusive, clipped to the spectrum.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double Sum(ReadOnlySpan<double> power, int from, int to)
    {
        from = Math.Max(from, 0);
        to = Math.Min(to, power.Length - 1);
        var sum = 0.0;
        for (var k = from; k <= to; k++)
        {
            sum += power[k];
        }

        return sum;
    }

    private static double Bin(ReadOnlySpan<double> power, int k) => k >= 0 && k < power.Length ? power[k] : 0;
}
