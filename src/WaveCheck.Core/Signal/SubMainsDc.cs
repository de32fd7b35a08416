namespace WaveCheck.Core.Signal;

/// <summary>
/// The DC level of a window that also carries a sub-mains AC component (a drive's 5 to 40 Hz motor current).
/// Stateless and thread-safe.
/// </summary>
/// <remarks>
/// <para>A 200 ms window holds a whole number of mains cycles but, in general, not of the motor frequency: 12 Hz gives
/// 2.4 cycles, whose mean is far from zero (up to Ipk·|sin(πβ)|/(πβ) for β cycles, 12 % of the peak at β = 2.4).
/// Taken as the window's DC, that reads as smooth DC that is not there, and decides type AC against type A.</para>
/// <para>The estimate fits <c>x_n ≈ c + a·cos ωn + b·sin ωn</c> by least squares, ω the strongest sub-mains
/// component, found from the window's spectrum: its peak bin among bins 1 to N−1 (N cycles per window, so below the
/// fundamental), refined by the two-bin ratio of the rectangular window (δ = r/(1 + r), Dirichlet kernel). The fitted
/// constant c is the DC; when the sub-mains peak is weak (below <see cref="MinShareOfAc"/> of the window's AC RMS) or
/// too close to DC to separate (under one cycle per window), the plain mean is kept.</para>
/// </remarks>
public static class SubMainsDc
{
    /// <summary>Least sub-mains peak, as a share of the window's AC RMS, worth fitting (engineering choice: 5 %).</summary>
    public const double MinShareOfAc = 0.05;

    /// <summary>DC of a window, amperes.</summary>
    /// <param name="samplesA">The window's samples, amperes.</param>
    /// <param name="binPowerA2">The window's spectrum, mean square per bin (bin 0 = DC), square amperes.</param>
    /// <param name="cyclesPerWindow">Mains cycles in the window (bins below this are sub-mains).</param>
    /// <param name="meanA">The window's plain mean, amperes.</param>
    /// <param name="acRmsA">The window's AC RMS, amperes.</param>
    public static double Estimate(ReadOnlySpan<double> samplesA, ReadOnlySpan<double> binPowerA2, int cyclesPerWindow,
        double meanA, double acRmsA)
    {
        var top = Math.Min(cyclesPerWindow - 1, binPowerA2.Length - 2);
        if (top < 1)
        {
            return meanA;
        }

        // RMS of the bins that matter: 0 to the fundamental's bin (few, so no buffer is worth it).
        Span<double> binRmsA = stackalloc double[top + 2];
        for (var k = 0; k < binRmsA.Length; k++)
        {
            binRmsA[k] = Math.Sqrt(Math.Max(0, binPowerA2[k]));
        }

        var peak = 0;
        for (var k = 1; k <= top; k++)
        {
            if (peak == 0 || binRmsA[k] > binRmsA[peak])
            {
                peak = k;
            }
        }

        if (peak == 0 || !(binRmsA[peak] >= MinShareOfAc * acRmsA) || !(binRmsA[peak] > 0))
        {
            return meanA;
        }

        // Refine towards the larger neighbour; bin 0 holds the DC itself and is not a neighbour to trust.
        var below = peak > 1 ? binRmsA[peak - 1] : 0;
        var above = binRmsA[peak + 1];
        var side = above >= below ? 1 : -1;
        var ratio = (side > 0 ? above : below) / binRmsA[peak];
        var cycles = peak + (side * ratio / (1 + ratio));
        if (cycles < 1)
        {
            return meanA;
        }

        return FitConstant(samplesA, 2 * Math.PI * cycles / samplesA.Length, meanA);
    }

    /// <summary>Least-squares constant of <c>c + a·cos ωn + b·sin ωn</c>, by the normal equations (samples centred on
    /// their mean for conditioning).</summary>
    internal static double FitConstant(ReadOnlySpan<double> x, double omega, double meanA)
    {
        // Sums over n of 1, c, s, c², s², cs, (x−m), (x−m)c, (x−m)s with a rotating phasor, re-anchored every 1024 samples.
        double sc = 0, ss = 0, scc = 0, sss = 0, scs = 0, sx = 0, sxc = 0, sxs = 0;
        var stepC = Math.Cos(omega);
        var stepS = Math.Sin(omega);
        for (var block = 0; block < x.Length; block += 1024)
        {
            var c = Math.Cos(omega * block);
            var s = Math.Sin(omega * block);
            var end = Math.Min(x.Length, block + 1024);
            for (var n = block; n < end; n++)
            {
                var v = x[n] - meanA;
                sc += c;
                ss += s;
                scc += c * c;
                sss += s * s;
                scs += c * s;
                sx += v;
                sxc += v * c;
                sxs += v * s;
                var t = (c * stepC) - (s * stepS);
                s = (c * stepS) + (s * stepC);
                c = t;
            }
        }

        double n0 = x.Length;
        // Solve [[n, Σc, Σs], [Σc, Σc², Σcs], [Σs, Σcs, Σs²]] · [c0, a, b] = [Σv, Σvc, Σvs] for c0 by Cramer's rule.
        var det = Det3(n0, sc, ss, sc, scc, scs, ss, scs, sss);
        if (!(Math.Abs(det) > 1e-9 * n0 * n0 * n0))
        {
            return meanA;
        }

        var c0 = Det3(sx, sc, ss, sxc, scc, scs, sxs, scs, sss) / det;
        return meanA + c0;
    }

    private static double Det3(double a, double b, double c, double d, double e, double f, double g, double h, double i) =>
        (a * ((e * i) - (f * h))) - (b * ((d * i) - (f * g))) + (c * ((d * h) - (e * g)));
}
