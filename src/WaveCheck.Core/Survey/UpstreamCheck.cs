using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Survey;

/// <summary>
/// Checks an upstream device against the circuits behind it: the sum of their standing residual currents against its
/// leakage budget and non-operating limit, the sum of their smooth DC against what its type tolerates, and whether any
/// circuit needs a more capable type than it is. Pure functions over the members' rows.
/// </summary>
public static class UpstreamCheck
{
    /// <summary>Leakage budget as a share of IΔn: <see cref="Limits.LeakageBudgetFraction"/> (IEC 60364-5-53:2015 §531.3.2).</summary>
    public const double LeakageBudgetFactor = Limits.LeakageBudgetFraction;

    /// <summary>Rated residual non-operating current as a share of IΔn: <see cref="Limits.NonOperatingFraction"/> (IEC 61008-1).</summary>
    public const double NonOperatingFactor = Limits.NonOperatingFraction;

    /// <summary>Smooth DC counted as significant for a type AC device: 1 mA. Engineering choice: type AC has no DC
    /// tolerance in its standard; 1 mA (<see cref="Limits.SignificanceFloorA"/>) is above the offset a good DC-coupled
    /// sensor leaves and far below the 6 mA a type A device is built for, so anything above it is treated as impairing
    /// a type AC device.</summary>
    public const double TypeAcDcToleranceA = Limits.SignificanceFloorA;

    /// <summary>Smooth DC an upstream device of a type tolerates, amperes.</summary>
    /// <param name="type">The upstream device's type.</param>
    /// <param name="ratedResidualCurrentA">Its IΔn, amperes.</param>
    public static double DcToleranceA(DeviceType type, double ratedResidualCurrentA) => type switch
    {
        DeviceType.AC => TypeAcDcToleranceA,
        DeviceType.A => Limits.TypeASmoothDcToleranceA,
        DeviceType.F => Limits.TypeFSmoothDcToleranceA,
        _ => Limits.TypeBSmoothDcToleranceA(ratedResidualCurrentA),
    };

    /// <summary>Checks every upstream group against the rows of the survey.</summary>
    /// <param name="groups">The upstream devices.</param>
    /// <param name="rows">All rows of the survey; members are found by <see cref="SurveyRow.File"/>.</param>
    public static IReadOnlyList<UpstreamResult> EvaluateAll(IReadOnlyList<UpstreamGroup> groups, IReadOnlyList<SurveyRow> rows)
    {
        ArgumentNullException.ThrowIfNull(groups);
        ArgumentNullException.ThrowIfNull(rows);
        var byFile = new Dictionary<string, SurveyRow>(StringComparer.Ordinal);
        foreach (var row in rows)
        {
            byFile.TryAdd(row.File, row);
        }

        var results = new List<UpstreamResult>(groups.Count);
        foreach (var group in groups)
        {
            var members = new List<SurveyRow>(group.Members.Count);
            foreach (var file in group.Members)
            {
                // A member with no row at all (not run) counts as failed, so the check says it is incomplete.
                members.Add(byFile.TryGetValue(file, out var row)
                    ? row
                    : SurveyRows.Failed(file, new CaptureSettings(), "not analysed in this survey"));
            }

            results.Add(Evaluate(group, members));
        }

        return results;
    }

    /// <summary>Checks one upstream device against its members' rows.</summary>
    /// <remarks>
    /// Standing current: arithmetic sum of the members' worst-window RMS, each circuit counted once at its worst
    /// capture (captures with the same circuit name are states of one circuit, not circuits side by side). The currents add as vectors and their worst
    /// windows need not coincide, so the arithmetic sum is the safe upper bound (practice). It is compared with
    /// 0.3 IΔn (IEC 60364-5-53 §531.3.2: within, low risk) and 0.5 IΔn (IEC 61008-1 non-operating current: above it the
    /// device may trip without a fault, likely). Between: possible.
    /// Smooth DC: arithmetic sum of the members' worst-window magnitudes against <see cref="DcToleranceA"/>; an
    /// AC-coupled or unstated sensor on any member leaves a sum within tolerance undecided.
    /// Type: a member that needs a more capable type than the upstream device can put residual current through it
    /// that it does not detect or that blinds it (practice, after IEC 60364-5-53 §531.3.3 guidance on types).
    /// Members that failed to analyse are left out of the sums, and the result says so (<see cref="UpstreamResult.Complete"/>).
    /// </remarks>
    /// <param name="group">The upstream device.</param>
    /// <param name="members">Its members' rows (failed rows included).</param>
    public static UpstreamResult Evaluate(UpstreamGroup group, IReadOnlyList<SurveyRow> members)
    {
        ArgumentNullException.ThrowIfNull(group);
        ArgumentNullException.ThrowIfNull(members);
        var rated = group.RatedResidualCurrentA;
        var type = group.Device;
        var failed = new List<string>();
        var dcUnknown = new List<string>();
        var needMore = new List<(string Name, DeviceType Type)>();
        var typeUnknown = new List<string>();
        double standing = 0, dc = 0;
        // Captures of one circuit are its operating states, recorded one after another: the circuit adds its worst
        // state to the sum, not every state (which would count one circuit's current several times).
        var circuitStanding = new Dictionary<string, (double StandingA, double DcA)>(StringComparer.OrdinalIgnoreCase);
        foreach (var row in members)
        {
            if (row.Verdict == SurveyVerdict.Error)
            {
                failed.Add(row.File);
                continue;
            }

            var key = CircuitVerdicts.KeyOf(row);
            var (worst, worstDc) = circuitStanding.GetValueOrDefault(key);
            circuitStanding[key] = (Math.Max(worst, row.WorstWindowRmsA ?? row.RmsA ?? 0), Math.Max(worstDc, Math.Abs(row.SmoothDcA ?? 0)));
            if (row.SmoothDcKnown != true)
            {
                dcUnknown.Add(Path.GetFileName(row.File));
            }

            var needed = row.RequiredType ?? row.MinimumType;
            if (needed > type)
            {
                // One entry per circuit, at the strongest type any of its captures needs.
                var at = needMore.FindIndex(n => n.Name == Name(row));
                if (at < 0)
                {
                    needMore.Add((Name(row), needed.Value));
                }
                else if (needed > needMore[at].Type)
                {
                    needMore[at] = (Name(row), needed.Value);
                }
            }
            else if (row.RequiredType is null)
            {
                typeUnknown.Add(Name(row));
            }
        }

        foreach (var (circuitStandingA, circuitDcA) in circuitStanding.Values)
        {
            standing += circuitStandingA;
            dc += circuitDcA;
        }

        var complete = failed.Count == 0;
        var budget = LeakageBudgetFactor * rated;
        var limit = NonOperatingFactor * rated;
        // At the boundary counts as reached, as in the capture's own nuisance margin (Margins.NuisanceTrip).
        var within = standing < budget;
        var leakageRisk = standing >= limit ? RiskLevel.Likely : !within ? RiskLevel.Possible : complete ? RiskLevel.Low : RiskLevel.Incomplete;
        var tolerance = DcToleranceA(type, rated);
        bool? blinded = dc > tolerance ? true : complete && dcUnknown.Count == 0 ? false : null;
        bool? mismatch = needMore.Count > 0 ? true : complete && typeUnknown.Count == 0 ? false : null;

        var missing = complete ? string.Empty
            : $" {failed.Count} of {members.Count} circuits {(failed.Count == 1 ? "was" : "were")} not analysed and not counted ({string.Join(", ", failed.Select(Path.GetFileName))}).";
        var deviceText = $"type {type.ToTradeName()} {CurrentText.WithUnit(rated)}";
        var leakageText = leakageRisk switch
        {
            RiskLevel.Likely => $"Standing residual current of the circuits adds up to {CurrentText.WithUnit(standing)}, above 0.5 IΔn = {CurrentText.WithUnit(limit)} of the {deviceText} device: it may trip without a fault.",
            RiskLevel.Possible => $"Standing residual current of the circuits adds up to {CurrentText.WithUnit(standing)}, above the 0.3 IΔn budget of {CurrentText.WithUnit(budget)} (IEC 60364-5-53 §531.3.2) though below 0.5 IΔn = {CurrentText.WithUnit(limit)}.",
            _ => $"Standing residual current of the circuits adds up to {CurrentText.WithUnit(standing)} at most (arithmetic sum of worst windows), within the 0.3 IΔn budget of {CurrentText.WithUnit(budget)}, margin {CurrentText.WithUnit(budget - standing)}.",
        } + missing;
        var dcText = blinded switch
        {
            true => $"Smooth DC of the circuits adds up to {CurrentText.WithUnit(dc)}, above the {CurrentText.WithUnit(tolerance)} a {deviceText} device tolerates: it may not trip on a real fault.",
            false => $"Smooth DC of the circuits adds up to {CurrentText.WithUnit(dc)}, within the {CurrentText.WithUnit(tolerance)} a {deviceText} device tolerates.",
            null => $"Smooth DC of the counted circuits adds up to {CurrentText.WithUnit(dc)} against a tolerance of {CurrentText.WithUnit(tolerance)}, but "
                + (dcUnknown.Count > 0 ? $"the sensor could not show DC on {string.Join(", ", dcUnknown)}: measure it with a DC-coupled sensor." : "not every circuit was analysed."),
        } + (blinded is not null ? missing : string.Empty);
        var typeText = mismatch switch
        {
            true => $"{string.Join("; ", needMore.Select(n => $"{n.Name} needs type {n.Type.ToTradeName()}"))}: residual current from such a circuit passes through the {deviceText} device, which may not detect it or may be blinded by it (practice).",
            false => $"No circuit needs a more capable type than the {deviceText} device.",
            null => $"No counted circuit is known to need more than type {type.ToTradeName()}, but "
                + (typeUnknown.Count > 0 ? $"the required type is undetermined for {string.Join(", ", typeUnknown.Distinct())}." : "not every circuit was analysed."),
        } + (mismatch is not null ? missing : string.Empty);

        return new UpstreamResult
        {
            Name = group.Name,
            DeviceType = type,
            RatedResidualCurrentA = rated,
            Members = group.Members,
            Complete = complete,
            FailedMembers = failed,
            StandingSumA = standing,
            LeakageBudgetA = budget,
            LeakageMarginA = budget - standing,
            WithinLeakageBudget = within,
            NonOperatingLimitA = limit,
            NonOperatingMarginA = limit - standing,
            LeakageRisk = leakageRisk,
            LeakageExplanation = leakageText,
            SmoothDcSumA = dc,
            DcToleranceA = tolerance,
            DcBlinded = blinded,
            DcRisk = blinded switch { true => DcCheck.Blinded, false => DcCheck.None, null => DcCheck.CannotTell },
            DcExplanation = dcText,
            TypeMismatch = mismatch,
            TypeRisk = mismatch switch { true => TypeCheck.Mismatch, false => TypeCheck.Ok, null => TypeCheck.CannotTell },
            TypeExplanation = typeText,
        };
    }


    private static string Name(SurveyRow row) => row.Circuit ?? Path.GetFileName(row.File);
}
