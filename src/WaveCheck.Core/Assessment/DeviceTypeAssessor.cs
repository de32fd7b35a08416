using WaveCheck.Core.Capture;
using WaveCheck.Core.Results;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// Decides which residual-current device type a captured residual current demands, how each type fares, and the
/// margins of the installed (or required) device. Judges the worst windows of the whole capture, never averages.
/// </summary>
/// <remarks>
/// <para>Rules (IEC 60364-5-53:2015 §531.3.3, IEC 61008-1, IEC 62423; thresholds in <see cref="Limits"/>):
/// AC: sinusoidal at mains frequency only; A: adds pulsating DC with smooth DC ≤ 6 mA; F: adds composite current
/// of single-phase converters (sub-mains motor frequency, mains, switching content to 1 kHz) with smooth DC ≤ 10 mA;
/// B: adds smooth DC of either polarity, multi-phase rectified current and AC up to 1 kHz; B+: B with tripping
/// defined to 20 kHz, needed when content between 1 and 20 kHz is significant.</para>
/// <para>A capture that cannot show something (an AC-coupled sensor and DC; a sample rate below 40 kS/s and the
/// 1 to 20 kHz range) leaves the verdicts that depend on it open (null) and says what to measure instead.</para>
/// Stateless and thread-safe.
/// </remarks>
public static class DeviceTypeAssessor
{
    private static readonly DeviceType[] AllTypes = [DeviceType.AC, DeviceType.A, DeviceType.F, DeviceType.B, DeviceType.BPlus];

    /// <summary>Assesses one analysed capture.</summary>
    /// <param name="analysis">What the analysis measured.</param>
    /// <param name="options">Device, regime and threshold overrides.</param>
    /// <returns>The verdict, with every threshold applied and the cautions that go with it.</returns>
    /// <exception cref="OptionValueException">An option is out of range.</exception>
    public static AssessmentResult Assess(AnalysisResult analysis, AssessmentOptions options)
    {
        ArgumentNullException.ThrowIfNull(analysis);
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();

        var m = MeasuredFigures.From(analysis);
        var th = new AppliedThresholds(options, m);
        var pulsating = m.PulsatingFlag || m.PulsatingShare >= th.PulsatingShare;
        var dcSeen = m.SmoothDcA >= th.DcA;
        var dcKnown = m.Coupling == SensorCoupling.Dc || (m.Coupling == SensorCoupling.Unknown && (dcSeen || pulsating));
        var hfCovered = m.SampleRateHz >= Limits.BPlusMinimumSampleRateHz;

        var findings = Findings(m, th, pulsating, dcKnown, options.EvChargingPoint, out var hfSeen);
        var verdicts = new List<TypeVerdict>(AllTypes.Length);
        foreach (var t in AllTypes)
        {
            verdicts.Add(Verdict(t, findings, m, th, pulsating, hfCovered, hfSeen));
        }

        var (required, minimum) = Decide(verdicts);
        var assessed = options.InstalledType ?? required ?? minimum;
        var blinding = Margins.Blinding(assessed, m, th, dcKnown);
        var evCharging = Margins.EvCharging(m, th, dcKnown, options.EvChargingPoint);
        var result = new AssessmentResult
        {
            RequiredType = required?.ToTradeName(),
            MinimumType = minimum.ToTradeName(),
            Headline = Headline(required, minimum, findings, m, hfCovered),
            RatedResidualCurrentA = th.RatedA,
            InstalledType = options.InstalledType?.ToTradeName(),
            InstalledAdequate = options.InstalledType is { } it ? verdicts[(int)it].Suitable : null,
            Regime = options.Regime.ToText(),
            Types = verdicts,
            NuisanceTrip = Margins.NuisanceTrip(assessed, m, th, pulsating),
            Blinding = blinding,
            EvCharging = evCharging,
            Gfci = options.Regime == Regime.Na ? Gfci.Assess(m.WindowRmsA) : null,
            TouchCurrent = analysis.TouchCurrent is { } tc ? TouchCurrentLimits.Compare(tc) : null,
            Cautions = Cautions(analysis, m, th, dcKnown, hfCovered, blinding, options.EvChargingPoint ? evCharging : null),
            Thresholds = th.Uses,
        };
        return result;
    }

    /// <summary>A measured fact that rules out (definite) or may rule out (open) every type up to <paramref name="Exceeds"/>.</summary>
    private sealed record Finding(DeviceType Exceeds, string Text, bool Definite);

    /// <summary>
    /// RMS of the harmonic at 6 × mains, amperes, when it stands out as a six-pulse bridge's ripple: at least
    /// <see cref="Limits.MultiPhaseRippleContrast"/> times every other harmonic from order 2 to 7 (a six-pulse
    /// bridge has only orders 6k, closed form); null otherwise or when the spectrum does not reach it.
    /// </summary>
    private static double? SixPulseRippleA(MeasuredFigures m)
    {
        double? sixth = null;
        var others = 0.0;
        foreach (var (frequencyHz, rmsA) in m.HarmonicsTo1k)
        {
            var order = (int)Math.Round(frequencyHz / m.MainsHz);
            if (order == 6)
            {
                sixth = rmsA;
            }
            else if (order is >= 2 and <= 7)
            {
                others = Math.Max(others, rmsA);
            }
        }

        return sixth is { } r && r >= Limits.MultiPhaseRippleContrast * others ? r : null;
    }

    private static List<Finding> Findings(MeasuredFigures m, AppliedThresholds th, bool pulsating, bool dcKnown,
        bool evChargingPoint, out bool hfSeen)
    {
        var f = new List<Finding>();
        var dc = Ma(m.SmoothDcA);
        if (m.SmoothDcA >= th.DcA)
        {
            f.Add(new(DeviceType.AC, $"smooth DC {dc} is present (≥ {Ma(th.DcA)} significance, engineering choice); type AC is specified for sinusoidal AC only (IEC 61008-1)", true));
        }

        if (m.SmoothDcA > th.TypeADcA)
        {
            f.Add(new(DeviceType.A, $"smooth DC {dc} exceeds the {Ma(th.TypeADcA)} that type A tolerates (IEC 61008-1 / IEC 61009-1)", true));
        }

        if (m.SmoothDcA > th.TypeFDcA)
        {
            f.Add(new(DeviceType.F, $"smooth DC {dc} exceeds the {Ma(th.TypeFDcA)} that type F tolerates (IEC 62423)", true));
        }

        // IEC 60364-7-722: a charging point has its own RCD of at least type A, whatever the capture shows.
        if (evChargingPoint)
        {
            f.Add(new(DeviceType.AC, "charging point: IEC 60364-7-722 asks for its own RCD of at least type A", true));
        }

        // IEC 60364-7-722: a charging point's device is type B, or type A with an RDC-DD, once smooth DC of 6 mA or
        // more cannot be ruled out; type F is not among the choices, so DC within F's tolerance does not make F enough.
        if (evChargingPoint && m.SmoothDcA >= th.RdcDdA && m.SmoothDcA <= th.TypeFDcA)
        {
            f.Add(new(DeviceType.F, $"charging point with smooth DC {dc} ≥ {Ma(th.RdcDdA)}: IEC 60364-7-722 asks for type B, or type A with an RDC-DD (IEC 62955), which would disconnect at this DC; type F is not one of its choices", true));
        }

        // A three-phase bridge leaves smooth DC with ripple at 6 × mains (closed form: 4.0 % of the mean, RMS) and no
        // own fundamental; a fault on it gives smooth DC, which only type B detects (IEC 60364-5-53 guidance).
        if (!pulsating && dcKnown && m.SmoothDcA >= th.DcA && SixPulseRippleA(m) is { } ripple &&
            ripple >= Math.Max(Limits.MultiPhaseRippleFloorA, Limits.MultiPhaseRippleShareOfDc * m.SmoothDcA))
        {
            f.Add(new(DeviceType.F, $"ripple {Ma(ripple)} at 6 × mains ({6 * m.MainsHz:0} Hz) on smooth DC {dc} (≥ {Limits.MultiPhaseRippleShareOfDc * 100:0} % of it, engineering choice): rectified current from a three-phase bridge, which type B adds (IEC 62423)", true));
        }

        if (pulsating)
        {
            var angle = m.DelayAngleDeg is { } a ? $", current-delay angle {a:0}°" : "";
            f.Add(new(DeviceType.AC, $"pulsating DC in {m.PulsatingShare * 100:0} % of windows{angle}; type AC does not detect pulsating DC (IEC 60364-5-53 §531.3.3)", true));
        }

        if (!dcKnown)
        {
            var why = m.Coupling == SensorCoupling.Ac ? "the sensor is AC-coupled" : "the sensor coupling is not stated and no DC was seen";
            f.Add(new(DeviceType.F, $"smooth and pulsating DC cannot be determined: {why}; any DC seen ({dc}) is a lower bound, and types AC, A and F tolerate only {Ma(th.DcA)} (significance), {Ma(th.TypeADcA)} and {Ma(th.TypeFDcA)}", false));
        }

        var composite = false;
        if (m.BelowMainsA >= th.BelowMainsA)
        {
            composite = true;
            f.Add(new(DeviceType.A, $"sub-mains content {Ma(m.BelowMainsA)} (≥ {Ma(th.BelowMainsA)}, engineering choice) marks a frequency converter's composite current; type A covers mains frequency and pulsating DC only, type F adds composite current (IEC 62423)", true));
        }

        if (m.StrongestNonHarmonicTone is { } tone && tone.RmsA >= th.BelowMainsA)
        {
            composite = true;
            f.Add(new(DeviceType.A, $"non-harmonic tone at {tone.FrequencyHz:0.#} Hz, {Ma(tone.RmsA)} (≥ {Ma(th.BelowMainsA)}, engineering choice) marks a converter's composite current, which type F adds (IEC 62423)", true));
        }

        // Harmonics of pulsating DC are its own (any delay angle); only bipolar or smooth-DC currents are judged on them.
        if (!pulsating && m.HarmonicsTo1kA >= th.HarmonicA)
        {
            var share = m.MainsA > 0 ? $"{m.HarmonicsTo1kA / m.MainsA * 100:0} % of" : "above";
            if (dcKnown && m.SmoothDcA >= th.DcA && m.HarmonicsTo1kA > Limits.MultiPhaseRippleRatio * m.MainsA)
            {
                f.Add(new(DeviceType.F, $"ripple {Ma(m.HarmonicsTo1kA)} at mains harmonics on smooth DC {dc}, mains component only {Ma(m.MainsA)}: rectified current from two or more phases, which type B adds (IEC 62423)", true));
            }
            else if (!composite && m.HarmonicsTo1kA > Limits.NonMainsDominanceRatio * m.MainsA)
            {
                f.Add(new(DeviceType.F, $"AC content to 1 kHz {Ma(m.HarmonicsTo1kA)} exceeds the mains component {Ma(m.MainsA)}: residual current at frequencies other than mains, which type B adds (sinusoidal AC up to 1 kHz, IEC 62423)", true));
            }
            else if (!composite)
            {
                f.Add(new(DeviceType.A, $"harmonic content to 1 kHz {Ma(m.HarmonicsTo1kA)} is {share} the mains component {Ma(m.MainsA)} (≥ {Ma(th.HarmonicA)}, engineering choice): composite current beyond the mains frequency types AC and A are specified for; type F covers it (IEC 62423)", true));
            }
        }

        var hf = m.From1kTo20kA;
        var edge = 0.0;
        if (pulsating && m.DelayAngleDeg is { } alpha && alpha >= Limits.MinimumDelayAngleDeg)
        {
            var top = Math.Min(m.SampleRateHz / 2, Limits.BPlusUpperFrequencyHz);
            edge = PhaseControlledSpectrum.ShareBetween(alpha, m.MainsHz, Limits.TypeBUpperFrequencyHz, top) * m.WindowRmsA;
        }

        var excess = Math.Sqrt(Math.Max(0, (hf * hf) - (edge * edge)));
        hfSeen = excess >= th.HighFrequencyA;
        if (hfSeen)
        {
            var after = edge > 0 ? $" ({Ma(excess)} beyond the {Ma(edge)} a {m.DelayAngleDeg:0}° firing edge accounts for)" : "";
            f.Add(new(DeviceType.B, $"content {m.From1kRangeText} {Ma(hf)}{after} (≥ {Ma(th.HighFrequencyA)}, engineering choice): type B's tripping is defined only up to 1 kHz (IEC 62423); B+ is defined up to 20 kHz (DIN VDE 0664-400)", true));
        }

        return f;
    }

    private static TypeVerdict Verdict(DeviceType t, List<Finding> findings, MeasuredFigures m, AppliedThresholds th,
        bool pulsating, bool hfCovered, bool hfSeen)
    {
        var against = findings.Where(x => x.Definite && x.Exceeds >= t).ToList();
        if (against.Count > 0)
        {
            var own = against.Where(x => x.Exceeds == t).ToList();
            return new TypeVerdict(t.ToTradeName(), false, (own.Count > 0 ? own : against).Select(x => x.Text).ToList());
        }

        var open = findings.Where(x => !x.Definite && x.Exceeds >= t).Select(x => x.Text).ToList();
        if (t == DeviceType.BPlus && !hfCovered && !hfSeen)
        {
            open.Add($"whether content between 1 and 20 kHz needs B+ cannot be determined: the sample rate {m.SampleRateHz / 1000:0.#} kS/s shows content only up to {m.SampleRateHz / 2000:0.#} kHz (B+ is defined to 20 kHz, DIN VDE 0664-400)");
        }

        if (open.Count > 0)
        {
            return new TypeVerdict(t.ToTradeName(), null, open);
        }

        var reasons = new List<string>();
        var dc = Ma(m.SmoothDcA);
        switch (t)
        {
            case DeviceType.AC:
                reasons.Add($"sinusoidal at mains frequency: mains component {Ma(m.MainsA)}, smooth DC {dc} below the {Ma(th.DcA)} significance, no pulsating DC, sub-mains content {Ma(m.BelowMainsA)} below {Ma(th.BelowMainsA)} (IEC 61008-1)");
                break;
            case DeviceType.A:
                reasons.Add($"covers {(pulsating ? "the pulsating DC seen" : "sinusoidal AC and pulsating DC")}; smooth DC {dc} within the {Ma(th.TypeADcA)} type A works with (IEC 61008-1 / IEC 61009-1)");
                break;
            case DeviceType.F:
                reasons.Add($"covers composite current of single-phase frequency converters (IEC 62423); smooth DC {dc} within the {Ma(th.TypeFDcA)} type F works with (IEC 62423)");
                break;
            case DeviceType.B:
                reasons.Add($"covers smooth DC of either polarity, multi-phase rectified current and AC up to 1 kHz (IEC 62423); content {m.From1kRangeText} {Ma(m.From1kTo20kA)} below {Ma(th.HighFrequencyA)}");
                break;
            default:
                reasons.Add($"type B with tripping defined up to 20 kHz (DIN VDE 0664-400): covers the content {m.From1kRangeText} ({Ma(m.From1kTo20kA)})");
                break;
        }

        if (t >= DeviceType.B && m.SmoothDcA > th.TypeBDcA)
        {
            reasons.Add($"smooth DC {dc} exceeds the {Ma(th.TypeBDcA)} (max of {Limits.TypeBSmoothDcToleranceFraction:0.#} IΔn and {Ma(Limits.TypeBSmoothDcToleranceMinA)}) with which type B's tripping on superimposed currents is specified (IEC 62423): see blinding");
        }

        return new TypeVerdict(t.ToTradeName(), true, reasons);
    }

    /// <summary>Required: least suitable type with every lesser type ruled out; minimum: least type not ruled out.</summary>
    private static (DeviceType? Required, DeviceType Minimum) Decide(List<TypeVerdict> verdicts)
    {
        DeviceType? minimum = null;
        foreach (var t in AllTypes)
        {
            var v = verdicts[(int)t].Suitable;
            if (v == false)
            {
                continue;
            }

            minimum ??= t;
            if (v == true)
            {
                return (minimum == t ? t : null, minimum.Value);
            }
        }

        return (null, minimum ?? DeviceType.BPlus);
    }

    private static string Headline(DeviceType? required, DeviceType minimum, List<Finding> findings, MeasuredFigures m,
        bool hfCovered)
    {
        // Below 40 kS/s content up to 20 kHz is partly unseen: a decided type below B+ carries that in its headline.
        var bPlusOpen = !hfCovered
            ? $"; whether B+ is needed is open (this capture shows content only up to {m.From1kTopHz / 1000:0.#} kHz)"
            : string.Empty;
        if (required == DeviceType.AC)
        {
            return $"Type AC sufficient: sinusoidal residual current at mains frequency only (worst window {Ma(m.WindowRmsA)}), no significant DC; check that type AC is permitted locally{bPlusOpen}";
        }

        if (required is { } r)
        {
            var deciding = findings.FirstOrDefault(x => x.Definite && x.Exceeds == r - 1)
                ?? findings.First(x => x.Definite && x.Exceeds < r);
            return $"Type {r.ToTradeName()} required: {deciding.Text}{(r < DeviceType.BPlus ? bPlusOpen : string.Empty)}";
        }

        var reason = findings.FirstOrDefault(x => !x.Definite)?.Text
            ?? "content between 1 and 20 kHz not covered by the sample rate";
        return $"Required type cannot be determined from this capture ({reason}); at least type {minimum.ToTradeName()}";
    }

    private static List<string> Cautions(AnalysisResult analysis, MeasuredFigures m, AppliedThresholds th, bool dcKnown,
        bool hfCovered, BlindingResult blinding, EvChargingResult? declaredChargingPoint)
    {
        var c = new List<string>();
        if (blinding.Blinded == true)
        {
            c.Add(blinding.Explanation);
        }

        if (declaredChargingPoint is { } ev)
        {
            // The headline names one type; a charging point's choice (type A only with an RDC-DD) must stand beside it.
            c.Add(ev.Recommendation);
        }

        c.AddRange(StandingCautions.All);
        c.Add("Type AC is not permitted in some countries, and some codes allow it only for fixed equipment with no DC component.");
        c.Add($"The verdict covers only the operating states in this capture ({analysis.Capture.DurationS:0.#} s); start-up, other speeds or charging phases may demand more: capture each.");
        if (!dcKnown)
        {
            c.Add(m.Coupling == SensorCoupling.Ac
                ? "The sensor is AC-coupled (current transformer or Rogowski coil): smooth DC is invisible to it and pulsating DC is distorted, so the verdicts on types AC, A and F are open. Measure again with a DC-coupled clamp (fluxgate or Hall-effect)."
                : "The sensor coupling is not stated and the capture shows no DC: if the sensor is AC-coupled, DC is invisible. State the coupling, or measure again with a DC-coupled clamp (fluxgate or Hall-effect).");
        }
        else if (m.Coupling == SensorCoupling.Unknown)
        {
            c.Add($"The sensor coupling is not stated; it is taken as DC-coupled because the capture shows DC (smooth DC {Ma(m.SmoothDcA)}). State the coupling to confirm.");
        }

        if (!hfCovered)
        {
            c.Add($"The sample rate {m.SampleRateHz / 1000:0.#} kS/s shows content only up to {m.SampleRateHz / 2000:0.#} kHz: whether B+ is needed (content to 20 kHz) is open. Record at {Limits.RecommendedSampleRateHz / 1000:0} kS/s or more.");
        }

        if (m.Above20kA >= th.HighFrequencyA)
        {
            c.Add($"Content above 20 kHz ({Ma(m.Above20kA)}): no RCD type's tripping is defined there; ask the equipment's maker about its leakage and the device to use.");
        }

        if (analysis.Mains.Source == "fallback")
        {
            c.Add($"Too little mains-frequency content to track the mains: the nominal {analysis.Mains.NominalHz:0} Hz was assumed.");
        }

        foreach (var w in analysis.Warnings)
        {
            c.Add("Capture: " + w.Message);
        }

        return c;
    }

    private static string Ma(double amperes) => CurrentText.WithUnit(amperes);
}
