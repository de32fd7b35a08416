using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Assessment;

/// <summary>Margins of one device type against the standing residual current: nuisance tripping, DC blinding, EV guidance.</summary>
internal static class Margins
{
    /// <summary>
    /// Standing current weighted range by range with <see cref="TripWeighting"/>, combined in quadrature (orthogonal
    /// components, Parseval), against 0.5 IΔn (IEC 61008-1) and the 0.3 IΔn leakage budget (IEC 60364-5-53 §531.3.2).
    /// </summary>
    public static NuisanceTripResult NuisanceTrip(DeviceType type, MeasuredFigures m, AppliedThresholds th, bool pulsating)
    {
        var rated = th.RatedA;
        var parts = new List<FrequencyContribution>();
        void Add(string label, double lowHz, double highHz, double rmsA, double factor)
        {
            var weighted = double.IsPositiveInfinity(factor) ? 0 : rmsA / factor;
            parts.Add(new FrequencyContribution(label, lowHz, highHz, rmsA, factor, weighted));
        }

        Add("smooth DC", 0, 0, m.SmoothDcA, TripWeighting.SmoothDcFactor(type));
        Add(pulsating ? "pulsating DC (mean above the floor)" : "DC above the floor", 0, 0, m.PulsatingMeanA,
            pulsating ? TripWeighting.PulsatingDcFactor(type) : TripWeighting.SmoothDcFactor(type));
        Add("below mains", 1, m.MainsHz * 0.75, m.BelowMainsA, 1.0);
        Add("mains", m.MainsHz * 0.75, m.MainsHz * 1.5, m.MainsA, 1.0);

        double weightedSq = 0;
        foreach (var (f, a) in m.HarmonicsTo1k)
        {
            var w = a / TripWeighting.AcFactor(type, f, m.MainsHz, rated, th.Factors);
            weightedSq += w * w;
        }

        var harmonicsWeighted = Math.Sqrt(weightedSq);
        parts.Add(new FrequencyContribution("harmonics to 1 kHz", m.MainsHz * 1.5, Limits.TypeBUpperFrequencyHz,
            m.HarmonicsTo1kA, harmonicsWeighted > 0 ? m.HarmonicsTo1kA / harmonicsWeighted : 1.0, harmonicsWeighted));
        var hfFactor = TripWeighting.HighFrequencyFactor(type, rated, th.Factors);
        Add(m.From1kRangeText, Limits.TypeBUpperFrequencyHz, m.From1kTopHz, m.From1kTo20kA, hfFactor);
        Add("above 20 kHz", Limits.BPlusUpperFrequencyHz, Math.Max(Limits.BPlusUpperFrequencyHz, m.SampleRateHz / 2), m.Above20kA, hfFactor);

        double standingSq = 0, rawSq = 0;
        foreach (var p in parts)
        {
            standingSq += p.WeightedRmsA * p.WeightedRmsA;
            rawSq += p.RmsA * p.RmsA;
        }

        // The primary figure is unweighted: 0.5 IΔn is the non-operating current a compliant device guarantees in every
        // frequency range (IEC 61008-1, IEC 62423 lower limits); the weighted figure models a typical device only.
        var standing = Math.Sqrt(rawSq);
        var typical = Math.Sqrt(standingSq);
        var limit = Limits.NonOperatingFraction * rated;
        var margin = limit - standing;
        var budget = th.LeakageBudgetFraction * rated;
        var acc = th.Accuracy;
        var likely = acc.Compare(standing, th.LikelyFraction * rated) != LimitState.Below;
        var possible = acc.Compare(standing, th.PossibleFraction * rated) != LimitState.Below;
        var risk = likely ? RiskLevel.Likely : possible ? RiskLevel.Possible : RiskLevel.Low;
        var withinBudget = acc.Compare(standing, budget) == LimitState.Below;
        var name = type.ToTradeName();
        var explanation =
            $"Standing residual current {Ma(standing)} (each frequency range's worst window, unweighted) against the non-operating current 0.5 IΔn = {Ma(limit)}, "
            + $"which a compliant device guarantees in every frequency range (IEC 61008-1, IEC 62423): margin {Ma(margin)} ({margin / limit * 100:0} %); "
            + $"leakage budget {th.LeakageBudgetFraction:0.##} IΔn = {Ma(budget)} (IEC 60364-5-53 §531.3.2) {(withinBudget ? "kept" : "exceeded or at its limit")}. "
            + $"Risk {VerdictText.Of(risk)}: likely from {th.LikelyFraction:0.##} IΔn, possible from {th.PossibleFraction:0.##} IΔn (engineering choice), each within the measurement uncertainty ({acc}) counted as reached. "
            + $"A typical type {name} device responds as to {Ma(typical)} (each range weighted by the type's tripping factor, second figure).";
        return new NuisanceTripResult(risk, type, standing, limit, margin, margin / limit * 100, budget, withinBudget,
            parts, explanation, typical);
    }

    /// <summary>Smooth DC against the type's tolerance: beyond it the device may not trip on a real fault.</summary>
    public static BlindingResult Blinding(DeviceType type, MeasuredFigures m, AppliedThresholds th, bool dcKnown)
    {
        var tolerance = th.DcTolerance(type);
        var effective = tolerance ?? th.DcA;
        // Within the measurement uncertainty of the tolerance counts as beyond it: the safe side.
        var over = th.Accuracy.Compare(m.SmoothDcA, effective) != LimitState.Below;
        // With DC not determinable, the figure seen (an AC-coupled sensor's floor) is no measurement of DC: open.
        bool? blinded = dcKnown ? over : null;
        var name = type.ToTradeName();
        var source = type switch
        {
            DeviceType.AC => "type AC is specified for sinusoidal AC only (IEC 61008-1)",
            DeviceType.A => "IEC 61008-1 / IEC 61009-1",
            _ => "IEC 62423",
        };
        var limitText = tolerance is null ? $"any significant smooth DC (≥ {Ma(effective)})" : $"the {Ma(effective)} a type {name} device works with";
        // Types AC, A and F are blinded: DC pre-magnetises the core. Type B detects smooth DC itself; beyond its
        // range IEC 62423 simply does not specify its tripping on a fault current added to the DC.
        var mechanism = type >= DeviceType.B
            ? $"IEC 62423 specifies type {name}'s tripping on an AC or pulsating fault current added to smooth DC only up to that level; beyond it tripping on such a fault is not specified (the DC alone trips a compliant device somewhere between {Limits.NonOperatingFraction:0.#} and {Limits.TypeBSmoothDcFactor:0.#} IΔn)."
            : "Smooth DC pre-magnetises the device's core and can leave it unable to detect a fault current (IEC 62955 Note 2; practice).";
        string explanation = blinded switch
        {
            true => $"WARNING: the type {name} device MAY NOT TRIP ON A REAL FAULT: smooth DC {Ma(m.SmoothDcA)} exceeds {limitText} ({source}). "
                + mechanism,
            false => $"Smooth DC {Ma(m.SmoothDcA)} within {limitText} ({source}): no blinding expected.",
            null => $"Smooth DC cannot be determined with this sensor (seen: {Ma(m.SmoothDcA)}); whether it exceeds {limitText} is open. Measure with a DC-coupled clamp.",
        };
        return new BlindingResult(type, m.SmoothDcA, tolerance, blinded, explanation);
    }

    /// <summary>The 6 mA DC criterion (IEC 62955) and the protection it implies per IEC 60364-7-722.</summary>
    public static EvChargingResult EvCharging(MeasuredFigures m, AppliedThresholds th, bool dcKnown, bool evPoint,
        DcDetection installed)
    {
        var state = th.Accuracy.Compare(m.SmoothDcA, th.RdcDdA);
        bool? above = state != LimitState.Below ? true : dcKnown ? false : null;
        var lead = evPoint ? "EV charging point (IEC 60364-7-722): its own RCD, at least type A, and protection against DC fault current whatever DC is measured: " : "Not declared an EV charging point; if it is one (IEC 60364-7-722): ";
        var rec = above switch
        {
            true => $"smooth DC {Ma(m.SmoothDcA)} reaches{(state == LimitState.AtLimit ? " (within the measurement uncertainty)" : "")} the {Ma(th.RdcDdA)} at which a DC detection device disconnects (IEC 62955): fit type B; type A with an RDC-DD would disconnect the charger.",
            false => $"type B, or type A with a {Ma(th.RdcDdA)} DC detection device (RDC-DD, IEC 62955), unless the charging equipment provides that detection itself (its maker's declaration); smooth DC today {Ma(m.SmoothDcA)}, below {Ma(th.RdcDdA)}.",
            null => $"DC cannot be determined with this sensor: type B, or type A with an RDC-DD (IEC 62955).",
        };
        if (installed != DcDetection.None && above == true)
        {
            rec += " The DC detection declared with the installed device will disconnect at this standing DC.";
        }

        return new EvChargingResult(th.RdcDdA, m.SmoothDcA, above, lead + rec);
    }

    private static string Ma(double amperes) => CurrentText.WithUnit(amperes);
}
