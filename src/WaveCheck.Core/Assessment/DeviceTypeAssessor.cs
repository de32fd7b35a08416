using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Assessment;

/// <summary>
/// Decides which residual-current device type a captured residual current demands, how each type fares, and the
/// margins of the installed (or required) device. Judges the worst windows of the whole capture, never averages.
/// </summary>
/// <remarks>
/// <para>The capture is read for the <see cref="ResidualCurrentClass">classes of residual current</see> the standards
/// distinguish (IEC 60364-5-53:2015 §531.3.3, IEC 61008-1, IEC 62423, IEC 60364-7-722); the required type is the
/// least type that detects every class present. Each class has its own evidence and a threshold that depends only on
/// the device (IΔn) and the user's overrides, never on the capture's other content, so adding a component to a
/// waveform or scaling it up never lowers the required type (tested as a property). Every comparison accounts for the
/// measurement uncertainty (<see cref="MeasurementAccuracy"/>); a figure within it of a threshold is "at the limit"
/// and counted as present: the safe side.</para>
/// <para>What the capture cannot show (DC with an AC-coupled sensor, 1 to 20 kHz below 40 kS/s, anything beyond full
/// scale) makes the classes it hides open: the verdict is then "at least" the type the seen classes demand.</para>
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
        var th = new AppliedThresholds(options);
        var acSignature = LooksAcCoupled(m, th);
        var coupling = acSignature ? SensorCoupling.Ac : m.Coupling;
        // Any pulsating window counts by default (threshold 0); a user's share must be exceeded.
        var pulsatingSeen = m.PulsatingShare > th.PulsatingShare;
        var dcSeen = th.Accuracy.Compare(m.SmoothDcA, th.DcA) != LimitState.Below;
        var dcKnown = coupling == SensorCoupling.Dc ||
            (coupling == SensorCoupling.Unknown && (dcSeen || pulsatingSeen));
        var hfCovered = m.SampleRateHz >= Limits.BPlusMinimumSampleRateHz;

        var classes = ClassDetector.Detect(m, th, options, pulsatingSeen, dcKnown, coupling, hfCovered);
        var present = classes.Where(c => c.Presence is ClassPresence.Present or ClassPresence.AtLimit).ToList();
        var open = classes.Where(c => c.Presence == ClassPresence.Open).ToList();
        var level = present.Count == 0 ? DeviceType.AC : present.Max(c => c.Class.LeastType());
        if (options.EvChargingPoint && level < DeviceType.A)
        {
            level = DeviceType.A;
        }

        var openTop = open.Count == 0 ? DeviceType.AC : open.Max(c => c.Class.LeastType());
        DeviceType? required = openTop > level ? null : level;

        var verdicts = new List<TypeVerdict>(AllTypes.Length);
        foreach (var t in AllTypes)
        {
            verdicts.Add(Verdict(t, present, open, m, th, options.EvChargingPoint));
        }

        var assessed = options.InstalledType ?? required ?? level;
        var dcDetection = options.InstalledRdcDd ? DcDetection.RdcDd
            : options.ChargerDcDetection && options.EvChargingPoint ? DcDetection.Charger : DcDetection.None;
        var blinding = Margins.Blinding(assessed, m, th, dcKnown);
        var dcReachesRdcDd = th.Accuracy.Compare(m.SmoothDcA, th.RdcDdA) != LimitState.Below;
        var evCharging = Margins.EvCharging(m, th, dcKnown, options.EvChargingPoint, dcDetection);
        var pulsatingForWeights = pulsatingSeen && m.PulsatingFlag;
        return new AssessmentResult
        {
            RequiredType = required,
            MinimumType = level,
            Headline = Headline(required, level, present, open, m, options.EvChargingPoint, dcReachesRdcDd),
            RatedResidualCurrentA = th.RatedA,
            InstalledType = options.InstalledType,
            InstalledProtection = options.InstalledType is { } it ? new InstalledProtection(it, dcDetection) : null,
            InstalledAdequate = options.InstalledType is { } installed
                ? Adequate(installed, dcDetection, present, open, options.EvChargingPoint, dcReachesRdcDd)
                : null,
            AcceptedProtection = required is { } r ? Accepted(r, DcAlternative(r, present, dcReachesRdcDd), options.EvChargingPoint) : null,
            Classes = [.. classes.Select(c => c.ToResult())],
            Accuracy = th.Accuracy.ToString(),
            Regime = options.Regime,
            Types = verdicts,
            NuisanceTrip = Margins.NuisanceTrip(assessed, m, th, pulsatingForWeights),
            Blinding = blinding,
            EvCharging = evCharging,
            Gfci = options.Regime == Regime.Na ? Gfci.Assess(m.WindowRmsA) : null,
            TouchCurrent = analysis.TouchCurrent is { } tc ? TouchCurrentLimits.Compare(tc) : null,
            Cautions = Cautions(analysis, m, th, dcKnown, coupling, acSignature, hfCovered, blinding,
                options.EvChargingPoint ? evCharging : null),
            Thresholds = th.Uses,
        };
    }

    /// <summary>
    /// The signature of an AC-coupled sensor with the coupling not stated: pulsating windows on a floor far from zero
    /// while the capture's mean is zero within its uncertainty and <see cref="Limits.AcCouplingMeanFraction"/> of the
    /// RMS. A DC-coupled capture of pulsating DC has a mean of about a third of its peak.
    /// </summary>
    private static bool LooksAcCoupled(MeasuredFigures m, AppliedThresholds th) =>
        m.Coupling == SensorCoupling.Unknown && m.PulsatingShare > 0 &&
        th.Accuracy.Compare(m.SmoothDcA, th.DcA) == LimitState.Above &&
        Math.Abs(m.CaptureMeanA) <= Math.Max(th.Accuracy.UncertaintyA(m.CaptureMeanA), Limits.AcCouplingMeanFraction * m.WindowRmsA);

    /// <summary>Adequacy of an installed protection: every class present detected by the type, or (DC classes) by DC
    /// detection beside a type A or stronger; an open class it does not cover leaves it undetermined.</summary>
    private static bool? Adequate(DeviceType type, DcDetection dc, List<ClassFinding> present, List<ClassFinding> open,
        bool evChargingPoint, bool dcReachesRdcDd)
    {
        // DC detection stands in for type B only while the standing DC stays below its 6 mA: at or above it the
        // detection disconnects the circuit, and a type A or F beside it is beyond its DC tolerance.
        if (dc != DcDetection.None && type < DeviceType.B && dcReachesRdcDd)
        {
            dc = DcDetection.None;
        }

        bool Covers(ClassFinding c) => c.Class.LeastType() <= type ||
            (dc != DcDetection.None && c.Class.CoveredByDcDetection() && type >= DeviceType.A);

        if ((evChargingPoint && type < DeviceType.A) || present.Any(c => !Covers(c)))
        {
            return false;
        }

        return open.All(Covers) ? true : null;
    }

    /// <summary>The required type and, where only DC classes ask for type B, the alternative of a weaker type with 6 mA
    /// DC detection (IEC 60364-7-722, IEC 62955).</summary>
    private static string Accepted(DeviceType required, DeviceType? weaker, bool evChargingPoint)
    {
        if (weaker is null)
        {
            return $"type {required.ToTradeName()}";
        }

        var where = evChargingPoint ? "IEC 60364-7-722" : "as IEC 60364-7-722 allows at charging points; engineering choice elsewhere";
        return $"type B, or type {weaker.Value.ToTradeName()} with 6 mA DC fault detection (an RDC-DD, IEC 62955{(evChargingPoint ? ", or the charger's own, declared by its maker" : "")}; {where})";
    }

    /// <summary>The type that, with 6 mA DC fault detection beside it, may stand in for a required type B: the least
    /// type (at least A) covering every class that DC detection does not; null when none may (B not required, a class
    /// only B covers, or standing DC already at the detection's 6 mA).</summary>
    private static DeviceType? DcAlternative(DeviceType required, List<ClassFinding> present, bool dcReachesRdcDd)
    {
        if (required != DeviceType.B || dcReachesRdcDd)
        {
            return null;
        }

        var withoutDc = present.Where(c => !c.Class.CoveredByDcDetection()).Select(c => c.Class.LeastType())
            .DefaultIfEmpty(DeviceType.AC).Max();
        return withoutDc >= DeviceType.B ? null : (DeviceType)Math.Max((int)withoutDc, (int)DeviceType.A);
    }

    private static TypeVerdict Verdict(DeviceType t, List<ClassFinding> present, List<ClassFinding> open,
        MeasuredFigures m, AppliedThresholds th, bool evChargingPoint)
    {
        var beyond = present.Where(c => c.Class.LeastType() > t).ToList();
        var against = beyond.Select(c => c.Text).ToList();
        if (evChargingPoint && t < DeviceType.A)
        {
            against.Insert(0, "charging point: IEC 60364-7-722 asks for its own RCD of at least type A");
        }

        if (against.Count > 0)
        {
            return new TypeVerdict(t, false, against) { Classes = [.. beyond.Select(c => c.Class)] };
        }

        var unknown = open.Where(c => c.Class.LeastType() > t).ToList();
        if (unknown.Count > 0)
        {
            return new TypeVerdict(t, null, [.. unknown.Select(c => c.Text)]) { Classes = [.. unknown.Select(c => c.Class)] };
        }

        var reasons = new List<string>();
        var detected = present.Where(c => c.Class != ResidualCurrentClass.MainsAc).Select(c => c.Class).ToList();
        var covered = detected.Select(c => c.Describe()).ToList();
        reasons.Add(covered.Count == 0
            ? $"detects the sinusoidal mains-frequency current seen (worst window {Ma(m.WindowRmsA)}); no other class of residual current present (IEC 60364-5-53 §531.3.3)"
            : $"detects every class of residual current present: {string.Join(", ", covered)} (IEC 60364-5-53 §531.3.3, IEC 62423)");
        if (t >= DeviceType.B && th.Accuracy.Compare(m.SmoothDcA, th.TypeBDcA) != LimitState.Below)
        {
            reasons.Add($"smooth DC {Ma(m.SmoothDcA)} reaches the {Ma(th.TypeBDcA)} (max of {Limits.TypeBSmoothDcToleranceFraction:0.#} IΔn and {Ma(Limits.TypeBSmoothDcToleranceMinA)}) with which type B's tripping on superimposed currents is specified (IEC 62423): see blinding");
        }

        return new TypeVerdict(t, true, reasons) { Classes = detected };
    }

    private static string Headline(DeviceType? required, DeviceType level, List<ClassFinding> present,
        List<ClassFinding> open, MeasuredFigures m, bool evChargingPoint, bool dcReachesRdcDd)
    {
        // Below 40 kS/s the 1-20 kHz class is open unless content there was seen, so the verdict already says it (an
        // "at least" with its reason, or B+): the headline needs no separate B+ remark.
        if (required is { } r)
        {
            if (r == DeviceType.AC)
            {
                return $"Type AC sufficient: sinusoidal residual current at mains frequency only (worst window {Ma(m.WindowRmsA)}), no other class of residual current present; check that type AC is permitted locally";
            }

            var deciding = present.Where(c => c.Class.LeastType() == r).Select(c => c.Text).FirstOrDefault()
                ?? (evChargingPoint ? "charging point: IEC 60364-7-722 asks for its own RCD of at least type A" : "");
            // The same alternative as acceptedProtection: a type F converter with DC needs F, not A, beside the detection.
            var alternative = DcAlternative(r, present, dcReachesRdcDd) is { } weaker
                ? $" (or type {weaker.ToTradeName()} with 6 mA DC fault detection, IEC 62955)"
                : string.Empty;
            return $"Type {r.ToTradeName()}{alternative} required: {deciding}";
        }

        var reason = open.Where(c => c.Class.LeastType() > level).Select(c => c.Text).First();
        return $"Required type cannot be determined from this capture: at least type {level.ToTradeName()}; {reason}";
    }

    private static List<string> Cautions(AnalysisResult analysis, MeasuredFigures m, AppliedThresholds th, bool dcKnown,
        SensorCoupling coupling, bool acSignature, bool hfCovered, BlindingResult blinding, EvChargingResult? declaredChargingPoint)
    {
        var c = new List<string>();
        if (!Limits.IsRatingInUse(th.RatedA))
        {
            c.Add(RatingCaution(th.RatedA));
        }

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
        if (acSignature)
        {
            c.Add($"The sensor coupling is not stated, and the capture bears the signature of an AC-coupled sensor: one-sided pulses on a floor of {Ma(m.SmoothDcA)} while the mean of the whole capture is {Ma(m.CaptureMeanA)}. It is treated as AC-coupled (engineering choice): DC verdicts are open. Measure again with a DC-coupled clamp, or state {Setting.Ref(nameof(ImportOptions.Sensor))} dc if the clamp is DC-coupled.");
        }
        else if (!dcKnown)
        {
            c.Add(coupling == SensorCoupling.Ac
                ? "The sensor is AC-coupled (current transformer or Rogowski coil): smooth DC is invisible to it and pulsating DC is distorted, so the verdicts on types AC, A and F are open. Measure again with a DC-coupled clamp (fluxgate or Hall-effect)."
                : "The sensor coupling is not stated and the capture shows no DC: if the sensor is AC-coupled, DC is invisible. State the coupling, or measure again with a DC-coupled clamp (fluxgate or Hall-effect).");
        }
        else if (coupling == SensorCoupling.Unknown)
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

    /// <summary>The caution for an IΔn off the list of ratings in use (<see cref="Limits.RatedResidualCurrentsInUseA"/>).</summary>
    /// <param name="ratedA">IΔn, amperes.</param>
    public static string RatingCaution(double ratedA) =>
        $"IΔn {Ma(ratedA)} is not a rating in use ({string.Join(", ", Limits.RatedResidualCurrentsInUseA.Select(Quantity.CurrentAsTyped))}): check the device's marking and the unit of the value given; every margin here is a share of it.";
}
