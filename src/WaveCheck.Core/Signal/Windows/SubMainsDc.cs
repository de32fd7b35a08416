namespace WaveCheck.Core.Signal;

/// <summary>
/// The DC level of a window that also carries a sub-mains AC component (a drive's 5 to 40 Hz motor current).
/// Stateless and thread-safe.
/// </summary>
/// <remarks>
/// <para>A 200 ms window holds a whole number of mains cycles but, in general, not of the motor frequency: 12 Hz gives
/// 2.4 cycles, whose mean is far from zero (up to Ipk·|sin(πβ)|/(πβ) for β cycles, 12 % of the peak at β = 2.4).
/// Taken as the window's DC, that reads as smooth DC that is not there, and decides type AC against type A.</para>
/// <para>The estimate fits <c>x_n ≈ c + a·cos ωn + b·sin ωn + p·cos ω₀n + q·sin ω₀n</c> by least squares, ω₀ the
/// mains fundamental and ω the strongest sub-mains component, found from the window's spectrum: its peak bin among
/// bins 1 to N−1 (N cycles per window, so below the fundamental), refined by the two-bin ratio of the rectangular
/// window (δ = r/(1 + r), Dirichlet kernel) towards each neighbour, the fit with the smaller residual kept. The fitted
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

        // Refine towards either neighbour and keep the fit that leaves the smaller residual: with two or three motor
        // cycles in a window, the DC and the tone's own negative-frequency image leak into bin 1, so "the larger
        // neighbour" can point the wrong way (an 11.1 Hz tone read as 9 Hz gave 1.2 mA of DC that is not there).
        var omegaMains = 2 * Math.PI * cyclesPerWindow / samplesA.Length;
        (double Constant, double Residual)? best = null;
        for (var side = -1; side <= 1; side += 2)
        {
            var neighbour = side > 0 ? binRmsA[peak + 1] : peak > 1 ? binRmsA[peak - 1] : 0;
            var ratio = neighbour / binRmsA[peak];
            var cycles = peak + (side * ratio / (1 + ratio));
            if (cycles < 1)
            {
                continue;
            }

            var fit = FitConstant(samplesA, 2 * Math.PI * cycles / samplesA.Length, omegaMains, meanA);
            if (fit is { } f && (best is null || f.Residual < best.Value.Residual))
            {
                best = f;
            }
        }

        return best?.Constant ?? meanA;
    }

    /// <summary>Least-squares constant of <c>c + a·cos ωn + b·sin ωn + p·cos ω₀n + q·sin ω₀n</c>, ω the sub-mains
    /// component and ω₀ the mains fundamental (whole cycles in the window), by the normal equations solved with
    /// partial pivoting (samples centred on their mean for conditioning).</summary>
    /// <remarks>The mains term is fitted too: over a window that does not hold whole cycles of ω, the mains component
    /// is not orthogonal to the sub-mains regressors, and a large one left out biases the constant (a 10.8 mA mains
    /// current beside an 11.1 Hz motor part read as 1.2 mA of DC that is not there, for one window position).</remarks>
    /// <returns>The constant, amperes, and the residual sum of squares of the fit (A²); null when the regressors are not
    /// independent over the window.</returns>
    internal static (double Constant, double Residual)? FitConstant(ReadOnlySpan<double> x, double omega, double omegaMains, double meanA)
    {
        const int K = 5;
        Span<double> gram = stackalloc double[K * K];
        Span<double> rhs = stackalloc double[K];
        Span<double> basis = stackalloc double[K];
        gram.Clear();
        rhs.Clear();
        var sumSquares = 0.0;
        var step1C = Math.Cos(omega);
        var step1S = Math.Sin(omega);
        var step0C = Math.Cos(omegaMains);
        var step0S = Math.Sin(omegaMains);
        for (var block = 0; block < x.Length; block += 1024)
        {
            // Rotating phasors, re-anchored every 1024 samples.
            var c1 = Math.Cos(omega * block);
            var s1 = Math.Sin(omega * block);
            var c0 = Math.Cos(omegaMains * block);
            var s0 = Math.Sin(omegaMains * block);
            var end = Math.Min(x.Length, block + 1024);
            for (var n = block; n < end; n++)
            {
                var v = x[n] - meanA;
                sumSquares += v * v;
                basis[0] = 1;
                basis[1] = c1;
                basis[2] = s1;
                basis[3] = c0;
                basis[4] = s0;
                for (var i = 0; i < K; i++)
                {
                    rhs[i] += v * basis[i];
                    for (var j = i; j < K; j++)
                    {
                        gram[(i * K) + j] += basis[i] * basis[j];
                    }
                }

                var t1 = (c1 * step1C) - (s1 * step1S);
                s1 = (c1 * step1S) + (s1 * step1C);
                c1 = t1;
                var t0 = (c0 * step0C) - (s0 * step0S);
                s0 = (c0 * step0S) + (s0 * step0C);
                c0 = t0;
            }
        }

        for (var i = 0; i < K; i++)
        {
            for (var j = 0; j < i; j++)
            {
                gram[(i * K) + j] = gram[(j * K) + i];
            }
        }

        Span<double> u = stackalloc double[K];
        Span<double> b = stackalloc double[K];
        rhs.CopyTo(b);
        if (!Solve(gram, b, K, x.Length, u))
        {
            return null;
        }

        // Residual of a least-squares fit: Σv² − uᵀ(Aᵀv).
        var explained = 0.0;
        for (var i = 0; i < K; i++)
        {
            explained += u[i] * rhs[i];
        }

        return (meanA + u[0], Math.Max(0, sumSquares - explained));
    }

    /// <summary>Solves <paramref name="a"/>·u = <paramref name="b"/> by Gaussian elimination with partial pivoting
    /// (<paramref name="a"/> and <paramref name="b"/> are overwritten); false when the system is singular (a pivot
    /// below 1e-9 of the sample count: the regressors are not independent over the window).</summary>
    internal static bool Solve(Span<double> a, Span<double> b, int k, int samples, Span<double> u)
    {
        var tiny = 1e-9 * samples;
        for (var col = 0; col < k; col++)
        {
            var pivot = col;
            for (var r = col + 1; r < k; r++)
            {
                if (Math.Abs(a[(r * k) + col]) > Math.Abs(a[(pivot * k) + col]))
                {
                    pivot = r;
                }
            }

            if (!(Math.Abs(a[(pivot * k) + col]) > tiny))
            {
                return false;
            }

            if (pivot != col)
            {
                for (var j = 0; j < k; j++)
                {
                    (a[(col * k) + j], a[(pivot * k) + j]) = (a[(pivot * k) + j], a[(col * k) + j]);
                }

                (b[col], b[pivot]) = (b[pivot], b[col]);
            }

            for (var r = col + 1; r < k; r++)
            {
                var f = a[(r * k) + col] / a[(col * k) + col];
                for (var j = col; j < k; j++)
                {
                    a[(r * k) + j] -= f * a[(col * k) + j];
                }

                b[r] -= f * b[col];
            }
        }

        for (var r = k - 1; r >= 0; r--)
        {
            var sum = b[r];
            for (var j = r + 1; j < k; j++)
            {
                sum -= a[(r * k) + j] * u[j];
            }

            u[r] = sum / a[(r * k) + r];
        }

        return true;
    }
}
