namespace WaveCheck.Core.Assessment;

/// <summary>
/// Closed-form Fourier series of the ideal phase-controlled half-wave i(θ) = sin θ for α &lt; θ &lt; π, 0 otherwise
/// (unit peak), used to tell a firing edge's own high-frequency content from a switching converter's.
/// </summary>
/// <remarks>
/// a_n = (1/π)∫_α^π sin θ cos nθ dθ, b_n = (1/π)∫_α^π sin θ sin nθ dθ; harmonic RMS √(a_n² + b_n²)/√2;
/// total RMS² = (1/2π)((π − α)/2 + sin 2α/4) (textbook rectifier analysis). A real load's edge is softer
/// (chokes, snubbers), so the ideal content is an upper bound. Stateless and thread-safe.
/// </remarks>
public static class PhaseControlledSpectrum
{
    /// <summary>RMS of harmonic order <paramref name="order"/> (≥ 1) for unit peak.</summary>
    /// <param name="delayAngleDeg">Current-delay angle α, degrees (0 to 180).</param>
    /// <param name="order">Harmonic order n ≥ 1.</param>
    public static double HarmonicRms(double delayAngleDeg, int order)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(order, 1);
        var a = delayAngleDeg * Math.PI / 180.0;
        double an, bn;
        if (order == 1)
        {
            // ∫ sin θ cos θ = sin²θ/2; ∫ sin²θ = θ/2 − sin 2θ/4.
            an = (0 - (Math.Sin(a) * Math.Sin(a) / 2)) / Math.PI;
            bn = ((Math.PI / 2) - ((a / 2) - (Math.Sin(2 * a) / 4))) / Math.PI;
        }
        else
        {
            double n = order;
            double Ic(double t) => -0.5 * ((Math.Cos((1 + n) * t) / (1 + n)) + (Math.Cos((1 - n) * t) / (1 - n)));
            double Is(double t) => 0.5 * ((Math.Sin((1 - n) * t) / (1 - n)) - (Math.Sin((1 + n) * t) / (1 + n)));
            an = (Ic(Math.PI) - Ic(a)) / Math.PI;
            bn = (Is(Math.PI) - Is(a)) / Math.PI;
        }

        return Math.Sqrt((an * an) + (bn * bn)) / Math.Sqrt(2);
    }

    /// <summary>Total RMS (DC included) for unit peak; 0 at α = 180° (no conduction).</summary>
    /// <param name="delayAngleDeg">Current-delay angle α, degrees (0 to 180).</param>
    public static double TotalRms(double delayAngleDeg)
    {
        var a = delayAngleDeg * Math.PI / 180.0;
        // At α = 180° the two terms cancel to a negative rounding error (−6e-17: sin 2π ≈ −2.4e-16): no conduction,
        // RMS 0, not the square root of a negative.
        return Math.Sqrt(Math.Max(0, (((Math.PI - a) / 2) + (Math.Sin(2 * a) / 4)) / (2 * Math.PI)));
    }

    /// <summary>
    /// RMS of the harmonics in (<paramref name="lowHz"/>, <paramref name="highHz"/>] as a share of the total RMS.
    /// </summary>
    /// <param name="delayAngleDeg">Current-delay angle α, degrees.</param>
    /// <param name="mainsHz">Mains frequency, hertz.</param>
    /// <param name="lowHz">Lower edge (exclusive), hertz.</param>
    /// <param name="highHz">Upper edge (inclusive), hertz.</param>
    public static double ShareBetween(double delayAngleDeg, double mainsHz, double lowHz, double highHz)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(mainsHz);
        var first = Math.Max(1, (int)Math.Floor(lowHz / mainsHz) + 1);
        var last = (int)Math.Floor(highHz / mainsHz);
        double sumSq = 0;
        for (var n = first; n <= last; n++)
        {
            var h = HarmonicRms(delayAngleDeg, n);
            sumSq += h * h;
        }

        var total = TotalRms(delayAngleDeg);
        return total > 0 ? Math.Sqrt(sumSq) / total : 0;
    }
}
