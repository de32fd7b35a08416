using WaveCheck.Core.Results;

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

        var standing = Math.Sqrt(standingSq);
        var limit = Limits.NonOperatingFraction * rated;
        var margin = limit - standing;
        var budget = th.LeakageBudgetFraction * rated;
        var risk = standing >= th.LikelyFraction * rated ? "likely" : standing >= th.PossibleFraction * rated ? "possible" : "low";
        var name = type.ToTradeName();
        var explanation =
            $"Standing residual current as a type {name} device responds to it: {Ma(standing)} (unweighted {Ma(Math.Sqrt(rawSq))}; "
            + $"each range's worst window, weighted by the type's tripping factor). Against the non-operating limit 0.5 IΔn = {Ma(limit)} "
            + $"(IEC 61008-1): margin {Ma(margin)} ({margin / limit * 100:0} %); leakage budget {th.LeakageBudgetFraction:0.##} IΔn = {Ma(budget)} "
            + $"(IEC 60364-5-53 §531.3.2) {(standing <= budget ? "kept" : "exceeded")}. Risk {risk}: likely from {th.LikelyFraction:0.##} IΔn, "
            + $"possible from {th.PossibleFraction:0.##} IΔn (engineering choice). A device may trip from 0.5 IΔn at any frequency; the weighting models a typical one.";
        if (double.IsPositiveInfinity(TripWeighting.SmoothDcFactor(type)) && m.SmoothDcA > 0)
        {
            explanation += $" Smooth DC ({Ma(m.SmoothDcA)}) is not counted: a type {name} device does not respond to it (see blinding).";
        }
        return new NuisanceTripResult(risk, name, standing, limit, margin, margin / limit * 100, budget, standing <= budget,
            parts, explanation);
    }

    /// <summary>Smooth DC against the type's tolerance: beyond it the device may not trip on a real fault.</summary>
    public static BlindingResult Blinding(DeviceType type, MeasuredFigures m, AppliedThresholds th, bool dcKnown)
    {
        var tolerance = th.DcTolerance(type);
        var effective = tolerance ?? th.DcA;
        var over = tolerance is null ? m.SmoothDcA >= effective : m.SmoothDcA > effective;
        bool? blinded = over ? true : dcKnown ? false : null;
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
        return new BlindingResult(name, m.SmoothDcA, tolerance, blinded, explanation);
    }

    /// <summary>The 6 mA DC criterion (IEC 62955) and the device choice it implies per IEC 60364-7-722.</summary>
    public static EvChargingResult EvCharging(MeasuredFigures m, AppliedThresholds th, bool dcKnown, bool evPoint)
    {
        bool? above = m.SmoothDcA >= th.RdcDdA ? true : dcKnown ? false : null;
        var lead = evPoint ? "EV charging point (IEC 60364-7-722): its own RCD, at least type A; " : "Not declared an EV charging point; if it is one (IEC 60364-7-722): ";
        var rec = above switch
        {
            true => $"smooth DC {Ma(m.SmoothDcA)} reaches the {Ma(th.RdcDdA)} at which an RDC-DD disconnects (IEC 62955): fit type B (type A + RDC-DD would disconnect).",
            false => $"smooth DC {Ma(m.SmoothDcA)} stays below {Ma(th.RdcDdA)} (IEC 62955) in this capture, but a capture cannot rule out DC ≥ {Ma(th.RdcDdA)} in a fault: fit type A + RDC-DD (IEC 62955) or type B, unless the charger's maker declares its own {Ma(th.RdcDdA)} DC protection.",
            null => $"DC cannot be determined with this sensor: treat DC ≥ {Ma(th.RdcDdA)} as not ruled out: fit type A + RDC-DD (IEC 62955) or type B.",
        };
        return new EvChargingResult(th.RdcDdA, m.SmoothDcA, above, lead + rec);
    }

    private static string Ma(double amperes) => CurrentText.WithUnit(amperes);
}
