using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// The worst-window figures a verdict rests on, taken from an <see cref="AnalysisResult"/>: window-statistics maxima
/// where the analysis has them, the whole-capture component values otherwise. Magnitudes, amperes.
/// </summary>
/// <remarks>
/// Figures of different kinds may come from different windows; combining them (in quadrature, for the nuisance
/// weighting) bounds any single window from above, the conservative side for every use here.
/// </remarks>
internal sealed record MeasuredFigures
{
    public required double MainsHz { get; init; }
    public required double SampleRateHz { get; init; }
    public required SensorCoupling Coupling { get; init; }
    public required double WindowRmsA { get; init; }
    public required double SmoothDcA { get; init; }
    public required double DcMeanA { get; init; }
    public required bool PulsatingFlag { get; init; }
    public required double PulsatingShare { get; init; }
    public required double? DelayAngleDeg { get; init; }
    public required double MainsA { get; init; }
    public required double BelowMainsA { get; init; }
    public required IReadOnlyList<(double FrequencyHz, double RmsA)> HarmonicsTo1k { get; init; }
    public required double HarmonicsTo1kA { get; init; }
    public required double Above1kA { get; init; }
    public required double Above20kA { get; init; }

    /// <summary>Strongest non-harmonic tone up to <see cref="Limits.MotorFrequencyTopMultiple"/> × mains: a motor frequency.</summary>
    public ToneValue? MotorTone { get; init; }

    /// <summary>Strongest non-harmonic tone above that and up to 1 kHz: AC at another frequency.</summary>
    public ToneValue? OtherTone { get; init; }

    /// <summary>Harmonic groups 2 to 1 kHz of the worst window that is not pulsating DC, amperes.</summary>
    public double NonPulsatingHarmonicsTo1kA { get; init; }

    /// <summary>Harmonic group at 1 kHz of the worst window that is not pulsating DC, amperes.</summary>
    public double NonPulsating1kGroupA { get; init; }

    /// <summary>Mean of the whole capture, amperes, signed.</summary>
    public double CaptureMeanA { get; init; }

    /// <summary>Share of windows with samples at full scale.</summary>
    public double ClippedShare { get; init; }

    /// <summary>Largest pulse mean above the floor among pulsating windows, amperes.</summary>
    public double PulsatingPulseMeanA { get; init; }

    /// <summary>Content 1 kHz to 20 kHz: above 1 kHz less above 20 kHz, in quadrature.</summary>
    public double From1kTo20kA => Math.Sqrt(Math.Max(0, (Above1kA * Above1kA) - (Above20kA * Above20kA)));

    /// <summary>Top of the 1-20 kHz range as this capture sees it: 20 kHz, or the Nyquist frequency below it.</summary>
    public double From1kTopHz => Math.Min(SampleRateHz / 2, Limits.BPlusUpperFrequencyHz);

    /// <summary>The 1-20 kHz range in words, cut at the Nyquist frequency ("1-10 kHz" at 20 kS/s).</summary>
    public string From1kRangeText => $"1-{From1kTopHz / 1000:0.#} kHz";

    /// <summary>Mean of the pulsating part on top of the smooth floor (worst window mean less the floor), amperes.</summary>
    public double PulsatingMeanA => Math.Max(0, DcMeanA - SmoothDcA);

    public static MeasuredFigures From(AnalysisResult analysis)
    {
        var stats = analysis.Windows.Statistics;
        var c = analysis.Components;
        double Worst(string key, double fallback) =>
            stats.TryGetValue(key, out var s) && double.IsFinite(s.Max) ? Math.Max(Math.Abs(s.Max), Math.Abs(fallback)) : Math.Abs(fallback);

        var mainsHz = analysis.Mains.FrequencyHz > 0 ? analysis.Mains.FrequencyHz : analysis.Mains.NominalHz;
        var harmonics = new List<(double, double)>();
        double sumSq = 0;
        double mains = c.MainsRmsA;
        foreach (var h in analysis.Harmonics)
        {
            var f = h.FrequencyHz > 0 ? h.FrequencyHz : h.Order * mainsHz;
            var value = Math.Max(h.MaxA, h.RmsA);
            if (h.Order == 1)
            {
                mains = Math.Max(mains, value);
            }
            else if (h.Order >= 2 && f <= Limits.TypeBUpperFrequencyHz + 1e-6)
            {
                harmonics.Add((f, value));
                sumSq += value * value;
            }
        }

        double above20kSq = 0;
        foreach (var b in analysis.Bands)
        {
            if (0.5 * (b.LowHz + b.HighHz) > Limits.BPlusUpperFrequencyHz)
            {
                above20kSq += b.MaxA * b.MaxA;
            }
        }

        ToneValue? motor = null, other = null;
        foreach (var t in c.Tones)
        {
            if (t.FrequencyHz < 1 || t.FrequencyHz > Limits.TypeBUpperFrequencyHz || IsHarmonic(t.FrequencyHz, mainsHz))
            {
                continue;
            }

            if (t.FrequencyHz <= Limits.MotorFrequencyTopMultiple * mainsHz)
            {
                motor = motor is null || t.RmsA > motor.RmsA ? t : motor;
            }
            else
            {
                other = other is null || t.RmsA > other.RmsA ? t : other;
            }
        }

        var above1k = Worst("above1kHzRmsA", c.Above1kHzRmsA);
        return new MeasuredFigures
        {
            MainsHz = mainsHz,
            SampleRateHz = analysis.Capture.SampleRateHz,
            Coupling = analysis.Capture.SensorCoupling,
            WindowRmsA = Worst("rmsA", analysis.Summary.RmsA),
            SmoothDcA = Math.Abs(c.SmoothDcMaxA),
            DcMeanA = Worst("dcA", analysis.Summary.DcA),
            PulsatingFlag = c.PulsatingDc,
            PulsatingShare = c.PulsatingDcShare,
            DelayAngleDeg = c.CurrentDelayAngleDeg,
            MainsA = Worst("mainsRmsA", mains),
            BelowMainsA = Worst("belowMainsRmsA", c.BelowMainsRmsA),
            HarmonicsTo1k = harmonics,
            HarmonicsTo1kA = Math.Sqrt(sumSq),
            Above1kA = above1k,
            Above20kA = Math.Min(Math.Sqrt(above20kSq), above1k),
            MotorTone = motor,
            OtherTone = other,
            NonPulsatingHarmonicsTo1kA = c.NonPulsatingHarmonicsTo1kMaxA,
            NonPulsating1kGroupA = c.NonPulsating1kGroupMaxA,
            CaptureMeanA = analysis.Summary.DcA,
            ClippedShare = c.ClippedWindowShare,
            PulsatingPulseMeanA = c.PulsatingMeanMaxA,
        };
    }

    private static bool IsHarmonic(double frequencyHz, double mainsHz)
    {
        var order = Math.Round(frequencyHz / mainsHz);
        return order >= 1 && Math.Abs(frequencyHz - (order * mainsHz)) <= Limits.HarmonicToneToleranceFraction * mainsHz;
    }
}
