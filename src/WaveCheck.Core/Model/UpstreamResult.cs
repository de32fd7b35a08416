namespace WaveCheck.Core.Model;

/// <summary>An upstream device checked against the circuits behind it (see <c>UpstreamCheck.Evaluate</c>).
/// SI units.</summary>
public sealed record UpstreamResult
{
    /// <summary>The upstream device's name.</summary>
    public required string Name { get; init; }

    /// <summary>Its type (JSON: the trade name).</summary>
    public required DeviceType DeviceType { get; init; }

    /// <summary>Its IΔn, amperes.</summary>
    public required double RatedResidualCurrentA { get; init; }

    /// <summary>The members' capture paths.</summary>
    public required IReadOnlyList<string> Members { get; init; }

    /// <summary>True when every member was analysed; false: the sums leave out <see cref="FailedMembers"/>.</summary>
    public required bool Complete { get; init; }

    /// <summary>Members that could not be analysed.</summary>
    public required IReadOnlyList<string> FailedMembers { get; init; }

    /// <summary>Arithmetic sum of the analysed members' worst-window RMS, amperes.</summary>
    public required double StandingSumA { get; init; }

    /// <summary>0.3 IΔn, amperes (IEC 60364-5-53 §531.3.2).</summary>
    public required double LeakageBudgetA { get; init; }

    /// <summary>Budget minus the standing sum, amperes (negative: over budget).</summary>
    public required double LeakageMarginA { get; init; }

    /// <summary>Standing sum within the budget.</summary>
    public required bool WithinLeakageBudget { get; init; }

    /// <summary>0.5 IΔn, amperes (IEC 61008-1 non-operating current).</summary>
    public required double NonOperatingLimitA { get; init; }

    /// <summary>Non-operating limit minus the standing sum, amperes.</summary>
    public required double NonOperatingMarginA { get; init; }

    /// <summary><c>low</c> (within budget), <c>possible</c> (over budget, under 0.5 IΔn), <c>likely</c> (over 0.5 IΔn),
    /// <c>incomplete</c> (within budget on the members counted, but some failed).</summary>
    public required RiskLevel LeakageRisk { get; init; }

    /// <summary>One line for a person.</summary>
    public required string LeakageExplanation { get; init; }

    /// <summary>Arithmetic sum of the analysed members' worst-window smooth-DC magnitudes, amperes.</summary>
    public required double SmoothDcSumA { get; init; }

    /// <summary>Smooth DC the upstream type tolerates, amperes (<c>UpstreamCheck.DcToleranceA</c>).</summary>
    public required double DcToleranceA { get; init; }

    /// <summary>True: the DC sum exceeds the tolerance; null: cannot tell (a member's DC unknown, or a member failed).</summary>
    public bool? DcBlinded { get; init; }

    /// <summary><c>none</c>, <c>blinded</c> or <c>cannot-tell</c>.</summary>
    public required DcCheck DcRisk { get; init; }

    /// <summary>One line for a person.</summary>
    public required string DcExplanation { get; init; }

    /// <summary>True: a member needs a more capable type than the upstream device; null: cannot tell.</summary>
    public bool? TypeMismatch { get; init; }

    /// <summary><c>ok</c>, <c>mismatch</c> or <c>cannot-tell</c>.</summary>
    public required TypeCheck TypeRisk { get; init; }

    /// <summary>One line for a person.</summary>
    public required string TypeExplanation { get; init; }
}
