using CsCheck;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;

namespace WaveCheck.Core.Tests.Survey;

/// <summary>
/// One verdict per circuit over its captures (docs/methods.md Part III). The rule rests on REFERENCE.md "required
/// type" (derived): the least type that detects every class of residual current the circuit can produce. A circuit
/// produces every class any of its operating states produces, so its required type is at least each capture's; and a
/// too-weak verdict is the one error the tool must never make (engineering choice: what cannot be shown is not
/// assumed absent).
/// </summary>
public class CircuitVerdictTests
{
    private static readonly int Iterations =
        int.TryParse(Environment.GetEnvironmentVariable("WAVECHECK_PROPERTY_ITERATIONS"), out var n) && n > 0 ? n * 10 : 2_000;

    private static SurveyRow Row(string file, SurveyVerdict verdict, DeviceType? required, DeviceType? minimum,
        string? state = null, string circuit = "C3 charging point", string? accepted = null, double worstA = 0.004,
        RiskLevel risk = RiskLevel.Low, double marginA = 0.010, bool? blinded = false) => new()
        {
            File = file,
            Circuit = circuit,
            State = state,
            InstalledType = new InstalledProtection(DeviceType.A),
            RatedResidualCurrentA = 0.030,
            RequiredType = verdict == SurveyVerdict.Error ? null : required,
            MinimumType = verdict == SurveyVerdict.Error ? null : minimum,
            AcceptedProtection = accepted,
            Verdict = verdict,
            WorstWindowRmsA = verdict == SurveyVerdict.Error ? null : worstA,
            RmsA = verdict == SurveyVerdict.Error ? null : worstA / 2,
            SmoothDcA = verdict == SurveyVerdict.Error ? null : 0.001,
            SmoothDcKnown = verdict == SurveyVerdict.Error ? null : true,
            NuisanceRisk = verdict == SurveyVerdict.Error ? null : risk,
            NuisanceMarginA = verdict == SurveyVerdict.Error ? null : marginA,
            Blinded = verdict == SurveyVerdict.Error ? null : blinded,
            Headline = verdict == SurveyVerdict.Error ? null : $"headline of {file}",
            Error = verdict == SurveyVerdict.Error ? $"{file}: not a capture" : null,
        };

    /// <summary>A capture result as the assessment can give it: decided (required = minimum), open (required
    /// unknown, a minimum known), or failed.</summary>
    private static readonly Gen<SurveyRow> CaptureGen =
        Gen.Select(Gen.Enum<SurveyVerdict>(), Gen.Enum<DeviceType>(), Gen.Bool, Gen.Int[0, 999]).Select(
            (verdict, type, open, id) => Row($"c{id}.wav", verdict, open ? null : type, type));

    private static int Demand(CircuitVerdict c) => (int?)(c.RequiredType ?? c.MinimumType) ?? -1;

    [Fact]
    public void A_circuit_never_requires_less_than_any_of_its_captures()
    {
        CaptureGen.Array[1, 6].Sample(
            captures =>
            {
                var circuit = CircuitVerdicts.Of(captures);
                foreach (var capture in captures.Where(c => c.Verdict != SurveyVerdict.Error))
                {
                    foreach (var own in new[] { capture.RequiredType, capture.MinimumType }.OfType<DeviceType>())
                    {
                        Assert.True(circuit.MinimumType >= own, $"circuit minimum {circuit.MinimumType} below {capture.File}'s {own}");
                        Assert.True(circuit.RequiredType is null || circuit.RequiredType >= own,
                            $"circuit requires {circuit.RequiredType}, below {capture.File}'s {own}");
                    }
                }

                // A decided type only when every capture decided its own, or nothing can be stronger (B+).
                var allDecided = captures.All(c => c.Verdict != SurveyVerdict.Error && c.RequiredType is not null);
                Assert.True(circuit.RequiredType is null || allDecided || circuit.RequiredType == DeviceType.BPlus,
                    $"circuit decided {circuit.RequiredType} though a capture is open or failed");
                Assert.True(circuit.Verdict != SurveyVerdict.Ok || captures.All(c => c.Verdict == SurveyVerdict.Ok),
                    "circuit ok although a capture is not");
                Assert.True(circuit.Verdict == SurveyVerdict.Upgrade || captures.All(c => c.Verdict != SurveyVerdict.Upgrade),
                    "a capture finds the device too weak, the circuit does not");
            },
            iter: Iterations, threads: 1, seed: "0000000001301",
            print: cs => string.Join("; ", cs.Select(c => $"{c.File} {c.Verdict} req {c.RequiredType} min {c.MinimumType}")));
    }

    [Fact]
    public void Adding_a_capture_or_reordering_never_lowers_the_circuit()
    {
        Gen.Select(CaptureGen.Array[1, 5], CaptureGen, Gen.Int).Sample(
            (captures, extra, seed) =>
            {
                var before = CircuitVerdicts.Of(captures);
                var after = CircuitVerdicts.Of([.. captures, extra]);
                Assert.True(Demand(after) >= Demand(before), $"adding {extra.File} lowered the demand");
                Assert.True(before.Verdict != SurveyVerdict.Upgrade || after.Verdict == SurveyVerdict.Upgrade, "adding a capture withdrew an upgrade");
                var shuffled = captures.OrderBy(_ => new Random(seed).Next()).ToArray();
                var reordered = CircuitVerdicts.Of(shuffled);
                Assert.Equal(before.RequiredType, reordered.RequiredType);
                Assert.Equal(before.MinimumType, reordered.MinimumType);
                Assert.Equal(before.Verdict, reordered.Verdict);
            },
            iter: Iterations, threads: 1, seed: "0000000001302");
    }

    [Fact]
    public void The_start_up_state_that_demands_more_decides_the_circuit()
    {
        // Running: composite current, type F (IEC 62423). Start-up: smooth DC, type B (REFERENCE.md "tolerance is not
        // fitness"). The circuit needs B; its reason names the state that demands it.
        var circuit = CircuitVerdicts.Of([
            Row("c2-run.wav", SurveyVerdict.Upgrade, DeviceType.F, DeviceType.F, state: "running"),
            Row("c2-start.wav", SurveyVerdict.Upgrade, DeviceType.B, DeviceType.B, state: "start-up", worstA: 0.016,
                risk: RiskLevel.Likely, marginA: -0.001),
        ]);
        Assert.Equal(DeviceType.B, circuit.RequiredType);
        Assert.Equal(SurveyVerdict.Upgrade, circuit.Verdict);
        Assert.Equal("c2-start.wav", circuit.DecidingFile);
        Assert.StartsWith("start-up (c2-start.wav): headline of c2-start.wav", circuit.Reason, StringComparison.Ordinal);
        Assert.Equal(0.016, circuit.WorstWindowRmsA);
        Assert.Equal(RiskLevel.Likely, circuit.NuisanceRisk);
        Assert.Equal(-0.001, circuit.NuisanceMarginA);
        Assert.Equal(["running", "start-up"], circuit.Captures.Select(c => c.State));
    }

    [Fact]
    public void A_failed_capture_makes_the_circuit_cannot_tell_unless_another_already_demands_more()
    {
        var ok = Row("a.wav", SurveyVerdict.Ok, DeviceType.A, DeviceType.A, state: "idle");
        var failed = Row("b.wav", SurveyVerdict.Error, null, null, state: "charging");
        var told = CircuitVerdicts.Of([ok, failed]);
        Assert.Equal(SurveyVerdict.CannotTell, told.Verdict);
        Assert.Null(told.RequiredType);
        Assert.Equal(DeviceType.A, told.MinimumType);
        Assert.Contains("1 of 2 captures could not be analysed (charging (b.wav))", told.Reason, StringComparison.Ordinal);

        var upgrade = CircuitVerdicts.Of([Row("c.wav", SurveyVerdict.Upgrade, DeviceType.B, DeviceType.B), failed]);
        Assert.Equal(SurveyVerdict.Upgrade, upgrade.Verdict);
        Assert.Null(upgrade.RequiredType);
        Assert.Equal(DeviceType.B, upgrade.MinimumType);

        var none = CircuitVerdicts.Of([failed, failed with { File = "d.wav" }]);
        Assert.Equal(SurveyVerdict.Error, none.Verdict);
        Assert.Null(none.MinimumType);
        Assert.StartsWith("none of the 2 captures could be analysed", none.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void B_plus_stays_decided_beside_an_open_capture_because_nothing_is_stronger()
    {
        var circuit = CircuitVerdicts.Of([
            Row("a.wav", SurveyVerdict.Ok, DeviceType.BPlus, DeviceType.BPlus),
            Row("b.wav", SurveyVerdict.CannotTell, null, DeviceType.A),
        ]);
        Assert.Equal(DeviceType.BPlus, circuit.RequiredType);
        Assert.Equal(SurveyVerdict.CannotTell, circuit.Verdict);
    }

    [Fact]
    public void Differing_alternatives_for_one_type_leave_the_type_alone()
    {
        // IEC 60364-7-722: at a charging point type A with 6 mA DC detection may stand in for B when only DC asks for
        // B; a state whose B comes from another class accepts no such alternative, so the circuit accepts B alone.
        const string WithRdcDd = "type B, or type A with 6 mA DC fault detection";
        var circuit = CircuitVerdicts.Of([
            Row("a.wav", SurveyVerdict.Ok, DeviceType.B, DeviceType.B, accepted: WithRdcDd),
            Row("b.wav", SurveyVerdict.Ok, DeviceType.B, DeviceType.B, accepted: "type B"),
        ]);
        Assert.Equal("type B", circuit.AcceptedProtection);
        var same = CircuitVerdicts.Of([
            Row("a.wav", SurveyVerdict.Ok, DeviceType.B, DeviceType.B, accepted: WithRdcDd),
            Row("b.wav", SurveyVerdict.Ok, DeviceType.A, DeviceType.A, accepted: "type A"),
        ]);
        Assert.Equal(WithRdcDd, same.AcceptedProtection);
    }

    [Fact]
    public void Captures_join_by_circuit_name_ignoring_case_and_spaces_and_unnamed_ones_stand_alone()
    {
        var circuits = CircuitVerdicts.From([
            Row("a.wav", SurveyVerdict.Ok, DeviceType.A, DeviceType.A, circuit: "C1 Saw"),
            Row("x.wav", SurveyVerdict.Ok, DeviceType.A, DeviceType.A) with { Circuit = null },
            Row("b.wav", SurveyVerdict.Upgrade, DeviceType.F, DeviceType.F, circuit: " c1 saw "),
            Row("y.wav", SurveyVerdict.Ok, DeviceType.A, DeviceType.A) with { Circuit = null },
        ]);
        Assert.Equal(["C1 Saw", "x.wav", "y.wav"], circuits.Select(c => c.Circuit));
        Assert.Equal(["a.wav", "b.wav"], circuits[0].Captures.Select(c => c.File));
        Assert.Equal(DeviceType.F, circuits[0].RequiredType);
    }
}
