using WaveCheck.Core.Capture;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Assessment;

/// <summary>A class of residual current as found in a capture, with the figure and threshold that decided it.</summary>
internal sealed record ClassFinding(ResidualCurrentClass Class, ClassPresence Presence, double? FigureA, double? ThresholdA,
    string Text)
{
    public ClassResult ToResult() => new(
        Class,
        Class.Describe(),
        Presence,
        FigureA,
        ThresholdA,
        Class.LeastType(),
        Class.CoveredByDcDetection(),
        Text);
}

/// <summary>
/// Reads a capture's figures for each <see cref="ResidualCurrentClass"/>. The evidence of each class adds up when
/// content is added (the DC term, the sub-mains and non-mains spectral content, the content above 1 kHz) and is
/// compared with a threshold that depends only on the device and the user's overrides, so a component added to a
/// waveform can only add classes. The one shape test, pulsating DC, can only be lost by adding content, and a window
/// that loses it keeps its DC, which then counts as DC that is not pulsating (type B). Stateless.
/// </summary>
internal static class ClassDetector
{
    public static List<ClassFinding> Detect(MeasuredFigures m, AppliedThresholds th, AssessmentOptions options,
        bool pulsatingSeen, bool dcKnown, SensorCoupling coupling, bool hfCovered)
    {
        var acc = th.Accuracy;
        ClassPresence Presence(double figureA, double thresholdA) => acc.Compare(figureA, thresholdA) switch
        {
            LimitState.Above => ClassPresence.Present,
            LimitState.AtLimit => ClassPresence.AtLimit,
            _ => ClassPresence.Absent,
        };

        string Note(ClassPresence p, double figureA) => p == ClassPresence.AtLimit
            ? $" [at the limit: within the measurement uncertainty ±{Ma(acc.UncertaintyA(figureA))} ({acc}); counted as present, the safe side (engineering choice)]"
            : string.Empty;

        var list = new List<ClassFinding>();

        var mains = Presence(m.MainsA, Limits.SignificanceFloorA);
        list.Add(new(ResidualCurrentClass.MainsAc, mains == ClassPresence.Absent ? ClassPresence.Absent : ClassPresence.Present,
            m.MainsA, Limits.SignificanceFloorA, $"mains-frequency component {Ma(m.MainsA)} (worst window): every type detects it (IEC 61008-1)"));

        // Pulsating DC: IEC 61008-1's definition, at rest for 150° in one piece every cycle (WaveformShape).
        var pulseMean = m.PulsatingPulseMeanA > 0 ? m.PulsatingPulseMeanA : m.PulsatingMeanA;
        var pulsating = pulsatingSeen ? Presence(pulseMean, th.DcA) : ClassPresence.Absent;
        var angle = m.DelayAngleDeg is { } a ? $", current-delay angle {a:0}°" : "";
        list.Add(new(ResidualCurrentClass.PulsatingDc, pulsating, pulseMean, th.DcA, pulsatingSeen
            ? $"pulsating DC: pulses with a mean of {Ma(pulseMean)} above their floor in {m.PulsatingShare * 100:0.#} % of windows{angle}, at rest for at least {Signal.WaveformShape.MinRestDeg:0}° of every cycle (IEC 61008-1 definition, from memory); type AC does not detect it (IEC 60364-5-53 §531.3.3){Note(pulsating, pulseMean)}"
            : $"no window rests at a floor for {Signal.WaveformShape.MinRestDeg:0}° of every cycle: no pulsating DC (IEC 61008-1 definition, from memory)"));

        list.Add(SmoothDc(m, th, dcKnown, coupling, pulsatingSeen, Presence, Note));

        var motorA = Math.Max(Math.Max(m.BelowMainsA, m.MotorTone?.RmsA ?? 0), m.NonPulsating1kGroupA);
        var motor = Presence(motorA, th.BelowMainsA);
        var motorWhat = m.NonPulsating1kGroupA >= Math.Max(m.BelowMainsA, m.MotorTone?.RmsA ?? 0)
            ? $"content in the harmonic group at 1 kHz {Ma(m.NonPulsating1kGroupA)} (the switching part of type F's composite test current; engineering choice: credited to type F)"
            : m.MotorTone is { } mt && mt.RmsA >= m.BelowMainsA
                ? $"a motor-frequency tone at {mt.FrequencyHz:0.#} Hz, {Ma(mt.RmsA)}"
                : $"content below mains frequency {Ma(m.BelowMainsA)}";
        list.Add(new(ResidualCurrentClass.Composite, motor, motorA, th.BelowMainsA,
            $"{motorWhat} (threshold {Ma(th.BelowMainsA)}, engineering choice){(motor == ClassPresence.Absent ? "" : ": a frequency converter's composite current, which types AC and A are not specified for; type F adds it (IEC 62423)")}{Note(motor, motorA)}"));

        var other = m.OtherTone?.RmsA ?? 0;
        var nonMainsA = Math.Sqrt((m.NonPulsatingHarmonicsTo1kA * m.NonPulsatingHarmonicsTo1kA) + (other * other));
        var nonMains = Presence(nonMainsA, th.HarmonicA);
        var strongest = StrongestOrder(m);
        var nonMainsWhat = m.OtherTone is { } ot && ot.RmsA > m.NonPulsatingHarmonicsTo1kA
            ? $"a tone at {ot.FrequencyHz:0.#} Hz"
            : strongest is { } s ? $"harmonics, strongest at {s.FrequencyHz:0} Hz ({Ma(s.RmsA)})" : "harmonic content";
        list.Add(new(ResidualCurrentClass.NonMainsAc, nonMains, nonMainsA, th.HarmonicA,
            $"AC at frequencies other than mains up to 1 kHz {Ma(nonMainsA)}: {nonMainsWhat}, outside any pulsating DC's own harmonics (threshold {Ma(th.HarmonicA)}, engineering choice){(nonMains == ClassPresence.Absent ? "" : "; sinusoidal AC up to 1 kHz is specified for type B (IEC 62423); types AC, A and F only at rated frequency or in type F's composite test current")}{Note(nonMains, nonMainsA)}"));

        list.Add(HighFrequency(m, th, hfCovered, Presence, Note));

        if (options.EvChargingPoint)
        {
            list.Add(options.ChargerDcDetection
                ? new(ResidualCurrentClass.ChargingPointDcFault, ClassPresence.Absent, null, null,
                    $"charging point whose equipment provides 6 mA DC fault detection itself, as declared ({Setting.Ref(nameof(AssessmentOptions.ChargerDcDetection))}): check the maker's declaration (IEC 60364-7-722)")
                : new(ResidualCurrentClass.ChargingPointDcFault, ClassPresence.Present, null, null,
                    $"charging point: IEC 60364-7-722 asks for protection against DC fault current whatever DC is measured today (here {Ma(m.SmoothDcA)}): type B, or type A with a device that detects {Ma(th.RdcDdA)} DC (RDC-DD, IEC 62955), unless the charging equipment provides that detection itself (declare it with {Setting.Ref(nameof(AssessmentOptions.ChargerDcDetection))})"));
        }

        if (m.ClippedShare > 0)
        {
            list.Add(new(ResidualCurrentClass.Clipping, ClassPresence.Open, null, null,
                $"{m.ClippedShare * 100:0.#} % of windows have samples at full scale: the waveform beyond the clipping level is unknown, so no stronger type can be ruled out than the one the rest demands; record again with a larger range"));
        }

        return list;
    }

    private static ClassFinding SmoothDc(MeasuredFigures m, AppliedThresholds th, bool dcKnown, SensorCoupling coupling,
        bool pulsatingSeen, Func<double, double, ClassPresence> presence, Func<ClassPresence, double, string> note)
    {
        var dc = Ma(m.SmoothDcA);
        if (!dcKnown)
        {
            var why = coupling == SensorCoupling.Ac
                ? m.Coupling == SensorCoupling.Ac ? "the sensor is AC-coupled" : "the capture bears the signature of an AC-coupled sensor"
                : "the sensor coupling is not stated and no DC was seen";
            return new(ResidualCurrentClass.SmoothDc, ClassPresence.Open, m.SmoothDcA, th.DcA,
                $"smooth DC cannot be determined: {why}; any DC seen ({dc}) is not a measurement of it, and only type B detects smooth DC (IEC 62423)");
        }

        var p = presence(m.SmoothDcA, th.DcA);
        if (p == ClassPresence.Absent)
        {
            return new(ResidualCurrentClass.SmoothDc, p, m.SmoothDcA, th.DcA,
                $"smooth DC {dc} below the {Ma(th.DcA)} significance (engineering choice)");
        }

        var kind = pulsatingSeen && m.PulsatingFlag
            ? $"smooth DC {dc} under the pulses (their floor)"
            : RippleText(m) is { } ripple
                ? $"DC {dc} that never rests at zero, with ripple {ripple}: rectified current from two or more phases (not pulsating DC, IEC 61008-1)"
                : $"DC {dc} that does not rest at zero for {Signal.WaveformShape.MinRestDeg:0}° each cycle (not pulsating DC, IEC 61008-1): smooth DC, or rectified current with other current on top, which types A and F are not specified for";
        var tolerance = th.Accuracy.Compare(m.SmoothDcA, th.TypeADcA) == LimitState.Below
            ? $"; an installed type A would still work with today's {dc} (it tolerates {Ma(th.TypeADcA)} superimposed, IEC 61008-1) but cannot detect a DC fault"
            : string.Empty;
        return new(ResidualCurrentClass.SmoothDc, p, m.SmoothDcA, th.DcA,
            $"{kind} (≥ {Ma(th.DcA)} significance, engineering choice): the circuit produces DC residual current, which only type B detects (IEC 62423; IEC 60364-5-53 §531.3.3){tolerance}{note(p, m.SmoothDcA)}");
    }

    private static ClassFinding HighFrequency(MeasuredFigures m, AppliedThresholds th, bool hfCovered,
        Func<double, double, ClassPresence> presence, Func<ClassPresence, double, string> note)
    {
        var hf = m.From1kTo20kA;
        var edge = 0.0;
        if (m.PulsatingFlag && m.DelayAngleDeg is { } alpha && alpha >= Limits.MinimumDelayAngleDeg)
        {
            var top = Math.Min(m.SampleRateHz / 2, Limits.BPlusUpperFrequencyHz);
            edge = PhaseControlledSpectrum.ShareBetween(alpha, m.MainsHz, Limits.TypeBUpperFrequencyHz, top) * m.WindowRmsA;
        }

        var excess = Math.Sqrt(Math.Max(0, (hf * hf) - (edge * edge)));
        var p = presence(excess, th.HighFrequencyA);
        if (p == ClassPresence.Absent && !hfCovered)
        {
            return new(ResidualCurrentClass.HighFrequency, ClassPresence.Open, excess, th.HighFrequencyA,
                $"whether content between 1 and 20 kHz needs B+ cannot be determined: the sample rate {m.SampleRateHz / 1000:0.#} kS/s shows content only up to {m.SampleRateHz / 2000:0.#} kHz (B+ is defined to 20 kHz, DIN VDE 0664-400)");
        }

        var after = edge > 0 ? $" ({Ma(excess)} beyond the {Ma(edge)} a {m.DelayAngleDeg:0}° firing edge accounts for)" : "";
        return new(ResidualCurrentClass.HighFrequency, p, excess, th.HighFrequencyA, p == ClassPresence.Absent
            ? $"content {m.From1kRangeText} {Ma(hf)}{after} below {Ma(th.HighFrequencyA)} (engineering choice)"
            : $"content {m.From1kRangeText} {Ma(hf)}{after} (≥ {Ma(th.HighFrequencyA)}, engineering choice): type B's tripping is defined only up to 1 kHz (IEC 62423); B+ is defined up to 20 kHz (DIN VDE 0664-400){note(p, excess)}");
    }

    /// <summary>The strongest ripple order of a multi-phase rectifier (2, 3 or 6 × mains, closed forms of the two-,
    /// three- and six-pulse rectifier) when it exceeds the mains component: text, else null.</summary>
    private static string? RippleText(MeasuredFigures m)
    {
        (double FrequencyHz, double RmsA)? best = null;
        foreach (var (f, a) in m.HarmonicsTo1k)
        {
            var order = (int)Math.Round(f / m.MainsHz);
            if (order is 2 or 3 or 6 && (best is null || a > best.Value.RmsA))
            {
                best = (f, a);
            }
        }

        return best is { } b && b.RmsA > m.MainsA && b.RmsA >= Limits.SignificanceFloorA / 10
            ? $"at {b.FrequencyHz:0} Hz ({Ma(b.RmsA)}) above the mains component ({Ma(m.MainsA)})"
            : null;
    }

    private static (double FrequencyHz, double RmsA)? StrongestOrder(MeasuredFigures m)
    {
        (double, double)? best = null;
        foreach (var h in m.HarmonicsTo1k)
        {
            if (best is null || h.RmsA > best.Value.Item2)
            {
                best = h;
            }
        }

        return best;
    }

    private static string Ma(double amperes) => CurrentText.WithUnit(amperes);
}
