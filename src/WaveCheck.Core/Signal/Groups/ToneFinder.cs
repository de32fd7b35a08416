using WaveCheck.Core.Model;

namespace WaveCheck.Core.Signal;

/// <summary>
/// The strongest tones of an averaged spectrum that are not mains harmonics: local maxima outside every harmonic
/// subgroup (orders 1..H), each merged with its two neighbouring bins, with the frequency interpolated between bins.
/// Stateless.
/// </summary>
/// <remarks>
/// For a rectangular window a tone δ bins above bin k gives |X(k+1)|/|X(k)| = δ/(1 − δ), so δ = r/(1 + r) with
/// r the amplitude ratio of the larger neighbour (the classic two-bin interpolation; closed form of the Dirichlet
/// kernel for small δ·π/n), and the RMS is the peak bin corrected by πδ/sin(πδ) (or the RSS of the three bins if
/// larger). Tones weaker than <see cref="MinShareOfAc"/> of the capture's AC RMS are not reported.
/// </remarks>
public static class ToneFinder
{
    /// <summary>Least tone RMS as a share of the AC RMS (engineering choice: 0.5 %, above spectral leakage of noise).</summary>
    public const double MinShareOfAc = 0.005;

    /// <summary>
    /// How far a peak on a harmonic bin above order H must stand above the neighbouring harmonics to count as a tone
    /// of its own (engineering choice: 4, about 12 dB). A pulsating or distorted current continues its harmonic comb
    /// smoothly past order 50 (a phase-cut edge decays roughly as 1/n), while a drive's switching frequency, often a
    /// round multiple of 50 Hz, stands tens of dB above the harmonics beside it.
    /// </summary>
    public const double CombContrast = 4.0;

    /// <summary>Finds up to <paramref name="count"/> tones, strongest first.</summary>
    /// <param name="spectrum">Averaged spectrum (bin 0 at DC).</param>
    /// <param name="cycles">Mains cycles per window (harmonic n on bin cycles·n).</param>
    /// <param name="maxOrder">Highest harmonic order whose subgroup is excluded.</param>
    /// <param name="count">Most tones returned.</param>
    /// <param name="acRmsA">AC RMS of the capture, amperes, for the reporting threshold.</param>
    public static IReadOnlyList<ToneValue> Strongest(SpectrumResult spectrum, int cycles, int maxOrder, int count,
        double acRmsA)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        var rms = spectrum.RmsA;
        var found = new List<ToneValue>();
        var threshold = Math.Max(1e-7, MinShareOfAc * acRmsA);
        for (var k = 1; k < rms.Count - 1; k++)
        {
            var p = rms[k];
            if (HarmonicGroups.InHarmonicSubgroup(k, cycles, maxOrder) || !(p >= rms[k - 1]) || !(p > rms[k + 1]) ||
                IsPartOfHarmonicComb(rms, k, cycles))
            {
                continue;
            }

            var below = k - 1 >= 1 ? rms[k - 1] : 0;
            var above = rms[k + 1];
            var total = Math.Sqrt((below * below) + (p * p) + (above * above));
            if (total < threshold)
            {
                continue;
            }

            var side = above >= below ? 1 : -1;
            var r = (side > 0 ? above : below) / p;
            var delta = r / (1 + r);

            // Scalloping: a pure tone δ bins off bin k shows C_k = RMS·sin(πδ)/(πδ); undo that, and keep the
            // three-bin sum where it is larger (a tone spread by modulation or drift).
            var corrected = delta > 1e-9 ? p * Math.PI * delta / Math.Sin(Math.PI * delta) : p;
            found.Add(new ToneValue((k + (side * delta)) * spectrum.ResolutionHz, Math.Max(total, corrected)));
        }

        found.Sort((a, b) => b.RmsA.CompareTo(a.RmsA));
        return found.Count > count ? found.GetRange(0, count) : found;
    }

    /// <summary>True when bin <paramref name="k"/> lies on a harmonic (order beyond the grouped ones) whose neighbouring
    /// harmonics carry comparable energy: part of the comb, not a tone of its own.</summary>
    private static bool IsPartOfHarmonicComb(IReadOnlyList<double> rms, int k, int cycles)
    {
        var order = (int)Math.Round((double)k / cycles);
        if (order < 2 || Math.Abs(k - (order * cycles)) > 1)
        {
            return false;
        }

        var neighbour = 0.0;
        foreach (var n in (ReadOnlySpan<int>)[order - 1, order + 1])
        {
            for (var b = (n * cycles) - 1; b <= (n * cycles) + 1; b++)
            {
                if (b >= 0 && b < rms.Count)
                {
                    neighbour = Math.Max(neighbour, rms[b]);
                }
            }
        }

        return rms[k] < CombContrast * neighbour;
    }
}
