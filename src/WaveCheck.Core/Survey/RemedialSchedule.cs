using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Survey;

/// <summary>
/// The remedial schedule of a survey: one row per circuit (and per upstream device) that needs action, ordered by
/// <see cref="ActionPriority"/>: safety first (a device too weak or blinded, then a device that should have tripped on a
/// recorded event), then what the survey could not show,
/// then nuisance tripping, then the leakage budget; within a priority, in the order of the survey.
/// </summary>
public static class RemedialSchedule
{
    /// <summary>The schedule.</summary>
    /// <param name="circuits">The survey's circuit verdicts.</param>
    /// <param name="upstream">The upstream checks.</param>
    public static IReadOnlyList<RemedialAction> From(IReadOnlyList<CircuitVerdict> circuits, IReadOnlyList<UpstreamResult> upstream)
    {
        ArgumentNullException.ThrowIfNull(circuits);
        ArgumentNullException.ThrowIfNull(upstream);
        var found = new List<(ActionPriority Priority, RemedialAction Action)>();
        foreach (var circuit in circuits)
        {
            if (ForCircuit(circuit) is { } action)
            {
                found.Add((action.Priority, action));
            }
        }

        foreach (var device in upstream)
        {
            if (ForUpstream(device, circuits) is { } action)
            {
                found.Add((action.Priority, action));
            }
        }

        // OrderBy is stable: within a priority the survey's order is kept.
        return [.. found.OrderBy(f => f.Priority).Select((f, i) => f.Action with { Rank = i + 1 })];
    }

    /// <summary>The schedule row of one circuit; null when it needs no action.</summary>
    public static RemedialAction? ForCircuit(CircuitVerdict circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        var reasons = new List<(ActionPriority Priority, string Text)>();
        if (circuit.Verdict == SurveyVerdict.Upgrade)
        {
            reasons.Add((ActionPriority.DeviceTooWeak, $"installed {circuit.InstalledType?.ToTradeName() ?? "device"} not adequate: {circuit.Reason}"));
        }

        if (circuit.Blinded == true)
        {
            reasons.Add((ActionPriority.DeviceTooWeak,
                $"smooth DC {Amps(circuit.SmoothDcA)} (worst window) beyond what the installed device tolerates: it may not trip on a real fault"));
        }

        if (circuit.TripAlert == true)
        {
            // Safety before nuisance: a device that did not trip where a compliant one must may be faulty.
            reasons.Add((ActionPriority.TestDevice,
                "a compliant device would have tripped on an event in a capture (trip replay): if the installed device did not, test it with an RCD tester before relying on it"));
        }

        if (circuit.Verdict is SurveyVerdict.CannotTell or SurveyVerdict.Error)
        {
            reasons.Add((ActionPriority.NotShown, circuit.InstalledType is null
                ? "no installed device stated: state it (site file \"device\") to have the circuit judged"
                : $"adequacy not shown: {circuit.Reason}"));
        }

        var budget = Limits.LeakageBudgetFraction * circuit.RatedResidualCurrentA;
        var limit = Limits.NonOperatingFraction * circuit.RatedResidualCurrentA;
        switch (circuit.NuisanceRisk)
        {
            case RiskLevel.Likely:
                reasons.Add((ActionPriority.NuisanceTripping,
                    $"nuisance tripping likely: standing residual current at or above 0.5 IΔn = {CurrentText.WithUnit(limit)} "
                    + $"(worst-window RMS {Amps(circuit.WorstWindowRmsA)}, margin {Amps(circuit.NuisanceMarginA)}): share the load among more devices or reduce the leakage"));
                break;
            case RiskLevel.Possible:
                reasons.Add((ActionPriority.LeakageBudget,
                    $"standing residual current above the leakage budget 0.3 IΔn = {CurrentText.WithUnit(budget)} "
                    + $"(worst-window RMS {Amps(circuit.WorstWindowRmsA)}, IEC 60364-5-53 §531.3.2)"));
                break;
        }

        if (reasons.Count == 0)
        {
            return null;
        }

        return new RemedialAction(0, reasons.Min(r => r.Priority), circuit.Circuit, false, circuit.InstalledType,
            circuit.RatedResidualCurrentA, RequiredText(circuit), Join(reasons));
    }

    /// <summary>The schedule row of one upstream device; null when it needs no action.</summary>
    public static RemedialAction? ForUpstream(UpstreamResult device, IReadOnlyList<CircuitVerdict> circuits)
    {
        ArgumentNullException.ThrowIfNull(device);
        ArgumentNullException.ThrowIfNull(circuits);
        var reasons = new List<(ActionPriority Priority, string Text)>();
        if (device.TypeMismatch == true)
        {
            reasons.Add((ActionPriority.DeviceTooWeak, device.TypeExplanation));
        }

        if (device.DcBlinded == true)
        {
            reasons.Add((ActionPriority.DeviceTooWeak, device.DcExplanation));
        }

        if (device.TypeMismatch is null)
        {
            reasons.Add((ActionPriority.NotShown, device.TypeExplanation));
        }

        if (device.DcBlinded is null)
        {
            reasons.Add((ActionPriority.NotShown, device.DcExplanation));
        }

        if (device.LeakageRisk == RiskLevel.Incomplete)
        {
            reasons.Add((ActionPriority.NotShown, device.LeakageExplanation));
        }

        if (device.LeakageRisk == RiskLevel.Likely)
        {
            reasons.Add((ActionPriority.NuisanceTripping, device.LeakageExplanation));
        }
        else if (device.LeakageRisk == RiskLevel.Possible)
        {
            reasons.Add((ActionPriority.LeakageBudget, device.LeakageExplanation));
        }

        if (reasons.Count == 0)
        {
            return null;
        }

        // What the members need: the strongest type any of their circuits requires (or at least requires).
        var members = new HashSet<string>(device.Members, StringComparer.Ordinal);
        DeviceType? needed = circuits.Where(c => c.Captures.Any(k => members.Contains(k.File)))
            .Select(c => c.RequiredType ?? c.MinimumType).Where(t => t is not null).DefaultIfEmpty(null).Max();
        var required = needed is { } n && n > device.DeviceType ? $"at least type {n.ToTradeName()} (the strongest its circuits need)"
            : "no change of type";
        return new RemedialAction(0, reasons.Min(r => r.Priority), device.Name, true, new InstalledProtection(device.DeviceType),
            device.RatedResidualCurrentA, required, Join(reasons));
    }

    /// <summary>What the circuit requires, in words.</summary>
    public static string RequiredText(CircuitVerdict circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        return circuit.RequiredType is { } r ? circuit.AcceptedProtection ?? $"type {r.ToTradeName()}"
            : circuit.MinimumType is { } m ? $"at least type {m.ToTradeName()} (not shown in full)"
            : "not known";
    }

    private static string Join(List<(ActionPriority Priority, string Text)> reasons) =>
        string.Join(" Also: ", reasons.OrderBy(r => r.Priority).Select(r => r.Text.TrimEnd('.') + "."));

    private static string Amps(double? amperes) => amperes is { } a ? CurrentText.WithUnit(a) : "unknown";
}
