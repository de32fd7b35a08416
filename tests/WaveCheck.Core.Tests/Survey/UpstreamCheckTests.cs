using WaveCheck.Core.Assessment;
using WaveCheck.Core.Model;
using WaveCheck.Core.Survey;
using WaveCheck.Core.Text;

namespace WaveCheck.Core.Tests.Survey;

public class UpstreamCheckTests
{
    // Sums of amperes built from mA figures: 1e-12 A is far below any rounding a person would see (CurrentText shows 0.001 mA).
    private const double Tolerance = 1e-12;

    private static SurveyRow Member(string file, double worstRmsA, double smoothDcA = 0, DeviceType? required = DeviceType.A,
        DeviceType minimum = DeviceType.A, bool dcKnown = true) =>
        new ResultBuilder
        {
            WorstWindowRmsA = worstRmsA,
            RmsA = worstRmsA / 2,
            SmoothDcMaxA = smoothDcA,
            RequiredType = required,
            MinimumType = minimum,
            Blinded = dcKnown ? false : null,
        }.Row(file, circuit: file.Replace(".wav", string.Empty, StringComparison.Ordinal));

    private static UpstreamGroup Group(DeviceType type, double ratedA, params string[] members) =>
        new("Q2 sub-board RCD", type, ratedA, members);

    [Fact]
    public void A_circuit_of_several_captures_counts_once_at_its_worst_state()
    {
        // IEC 60364-5-53 §531.3.2 budget 0.3 × 100 mA = 30 mA. Two captures of one circuit are its states one after
        // the other, not two circuits side by side: the sum takes the circuit's worst, 12 mA (not 12 + 7), plus
        // the other circuit's 4 mA = 16 mA; the DC likewise max(3, 1) = 3 mA plus 0.5 mA = 3.5 mA.
        var run = Member("c2-run.wav", 0.007, smoothDcA: 0.001) with { Circuit = "C2 extractor", State = "running" };
        var start = Member("c2-start.wav", 0.012, smoothDcA: -0.003) with { Circuit = "c2 extractor", State = "start-up" };
        var other = Member("c6.wav", 0.004, smoothDcA: 0.0005);
        var result = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c2-run.wav", "c2-start.wav", "c6.wav"), [run, start, other]);
        Assert.Equal(0.016, result.StandingSumA, Tolerance);
        Assert.Equal(0.0035, result.SmoothDcSumA, Tolerance);
    }

    [Fact]
    public void Within_budget_gives_the_margin()
    {
        // IEC 60364-5-53 §531.3.2: budget 0.3 × 100 mA = 30 mA. Arithmetic sum 4 + 9 + 12 = 25 mA: within, margin 5 mA.
        // IEC 61008-1 non-operating current 0.5 × 100 mA = 50 mA: margin 25 mA.
        var result = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav", "c3.wav"),
            [Member("c1.wav", 0.004), Member("c2.wav", 0.009), Member("c3.wav", 0.012)]);
        Assert.Equal(0.025, result.StandingSumA, Tolerance);
        Assert.Equal(0.030, result.LeakageBudgetA, Tolerance);
        Assert.Equal(0.005, result.LeakageMarginA, Tolerance);
        Assert.True(result.WithinLeakageBudget);
        Assert.Equal(0.050, result.NonOperatingLimitA, Tolerance);
        Assert.Equal(0.025, result.NonOperatingMarginA, Tolerance);
        Assert.Equal(RiskLevel.Low, result.LeakageRisk);
        Assert.True(result.Complete);
        Assert.Contains("25.0 mA", result.LeakageExplanation, StringComparison.Ordinal);
        Assert.Contains("margin 5.00 mA", result.LeakageExplanation, StringComparison.Ordinal);
    }

    [Fact]
    public void Over_budget_below_non_operating_limit_is_possible()
    {
        // 4 + 9 + 25 = 38 mA: above 0.3 × 100 = 30 mA, below 0.5 × 100 = 50 mA; margin 30 - 38 = -8 mA.
        var result = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav", "c3.wav"),
            [Member("c1.wav", 0.004), Member("c2.wav", 0.009), Member("c3.wav", 0.025)]);
        Assert.Equal(-0.008, result.LeakageMarginA, Tolerance);
        Assert.False(result.WithinLeakageBudget);
        Assert.Equal(RiskLevel.Possible, result.LeakageRisk);
    }

    [Fact]
    public void Above_non_operating_limit_is_likely()
    {
        // 20 + 20 + 15 = 55 mA > 0.5 × 100 mA = 50 mA (IEC 61008-1): margin to the limit -5 mA.
        var result = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav", "c3.wav"),
            [Member("c1.wav", 0.020), Member("c2.wav", 0.020), Member("c3.wav", 0.015)]);
        Assert.Equal(-0.005, result.NonOperatingMarginA, Tolerance);
        Assert.Equal(RiskLevel.Likely, result.LeakageRisk);
    }

    [Theory]
    // REFERENCE.md, device types: A 6 mA, F 10 mA, B max(0.4 IΔn, 10 mA); AC 1 mA is the documented engineering choice.
    [InlineData(DeviceType.AC, 0.030, 0.001)]
    [InlineData(DeviceType.A, 0.100, 0.006)]
    [InlineData(DeviceType.F, 0.030, 0.010)]
    [InlineData(DeviceType.B, 0.100, 0.040)]   // 0.4 × 100 mA = 40 mA > 10 mA
    [InlineData(DeviceType.B, 0.010, 0.010)]   // 0.4 × 10 mA = 4 mA < 10 mA floor
    [InlineData(DeviceType.BPlus, 0.300, 0.120)] // 0.4 × 300 mA = 120 mA
    public void Dc_tolerance_per_type(DeviceType type, double ratedA, double expectedA) =>
        Assert.Equal(expectedA, UpstreamCheck.DcToleranceA(type, ratedA), Tolerance);

    [Fact]
    public void Smooth_dc_magnitudes_add_against_the_type_tolerance()
    {
        // |2| + |-3| + |1.5| = 6.5 mA > 6 mA (type A): blinded. Magnitudes, not signed values (which would give 0.5 mA):
        // the circuits' DC need not cancel at the upstream device, so the sum of magnitudes is the safe upper bound.
        var members = new[] { Member("c1.wav", 0.001, 0.002), Member("c2.wav", 0.001, -0.003), Member("c3.wav", 0.001, 0.0015) };
        var a = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav", "c3.wav"), members);
        Assert.Equal(0.0065, a.SmoothDcSumA, Tolerance);
        Assert.True(a.DcBlinded);
        Assert.Equal(DcCheck.Blinded, a.DcRisk);

        // Same circuits behind a type F: 6.5 mA within 10 mA (IEC 62423).
        var f = UpstreamCheck.Evaluate(Group(DeviceType.F, 0.100, "c1.wav", "c2.wav", "c3.wav"), members);
        Assert.False(f.DcBlinded);
        Assert.Equal(DcCheck.None, f.DcRisk);
    }

    [Fact]
    public void Unknown_dc_on_a_member_leaves_a_sum_within_tolerance_undecided()
    {
        var members = new[] { Member("c1.wav", 0.001, 0.002), Member("c2.wav", 0.001, 0, dcKnown: false) };
        var within = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav"), members);
        Assert.Null(within.DcBlinded);
        Assert.Equal(DcCheck.CannotTell, within.DcRisk);
        Assert.Contains("c2.wav", within.DcExplanation, StringComparison.Ordinal);

        // Already over on what is known: 7 mA > 6 mA, blinded whatever the unknown member adds.
        var over = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav"),
            [Member("c1.wav", 0.001, 0.007), Member("c2.wav", 0.001, 0, dcKnown: false)]);
        Assert.True(over.DcBlinded);
    }

    [Fact]
    public void A_member_needing_a_more_capable_type_is_a_mismatch()
    {
        // A type B circuit behind a type A upstream device (practice: its smooth DC passes the upstream device).
        var result = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav"),
            [Member("c1.wav", 0.001, required: DeviceType.A), Member("c2.wav", 0.001, required: DeviceType.B, minimum: DeviceType.B)]);
        Assert.True(result.TypeMismatch);
        Assert.Equal(TypeCheck.Mismatch, result.TypeRisk);
        Assert.Contains("c2 needs type B", result.TypeExplanation, StringComparison.Ordinal);

        // Behind a type B device the same circuits are fine.
        var b = UpstreamCheck.Evaluate(Group(DeviceType.B, 0.100, "c1.wav", "c2.wav"),
            [Member("c1.wav", 0.001, required: DeviceType.A), Member("c2.wav", 0.001, required: DeviceType.B, minimum: DeviceType.B)]);
        Assert.False(b.TypeMismatch);
        Assert.Equal(TypeCheck.Ok, b.TypeRisk);
    }

    [Fact]
    public void Undetermined_required_type_uses_the_minimum_as_a_lower_bound()
    {
        // Minimum already B behind A: a mismatch whatever the rest shows.
        var surely = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav"), [Member("c1.wav", 0.001, required: null, minimum: DeviceType.B)]);
        Assert.True(surely.TypeMismatch);

        // Minimum A behind A, required unknown: cannot tell.
        var unsure = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav"), [Member("c1.wav", 0.001, required: null, minimum: DeviceType.A)]);
        Assert.Null(unsure.TypeMismatch);
        Assert.Equal(TypeCheck.CannotTell, unsure.TypeRisk);
    }

    [Fact]
    public void Failed_members_make_the_check_incomplete_and_are_named()
    {
        var failed = SurveyRows.Failed("c2.wav", new CaptureSettings(), "c2.wav: not a WAV file");
        var result = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav"), [Member("c1.wav", 0.004), failed]);
        Assert.False(result.Complete);
        Assert.Equal(["c2.wav"], result.FailedMembers);
        Assert.Equal(0.004, result.StandingSumA, Tolerance);   // only the analysed member counts
        Assert.Equal(RiskLevel.Incomplete, result.LeakageRisk);
        Assert.Null(result.DcBlinded);
        Assert.Null(result.TypeMismatch);
        Assert.Contains("1 of 2 circuits was not analysed and not counted (c2.wav)", result.LeakageExplanation, StringComparison.Ordinal);
        Assert.Contains("c2.wav", result.LeakageExplanation, StringComparison.Ordinal);

        // Over the non-operating limit on the analysed members alone (60 mA > 50 mA): likely, still marked incomplete.
        var over = UpstreamCheck.Evaluate(Group(DeviceType.A, 0.100, "c1.wav", "c2.wav"), [Member("c1.wav", 0.060), failed]);
        Assert.Equal(RiskLevel.Likely, over.LeakageRisk);
        Assert.False(over.Complete);
    }

    [Fact]
    public void EvaluateAll_finds_members_by_file_and_treats_missing_rows_as_failed()
    {
        var rows = new[] { Member("a.wav", 0.004), Member("b.wav", 0.009), Member("c.wav", 0.012) };
        var groups = new[]
        {
            new UpstreamGroup("Q1", DeviceType.A, 0.100, ["c.wav", "a.wav"]),
            new UpstreamGroup("Q2", DeviceType.A, 0.030, ["b.wav", "missing.wav"]),
        };
        var results = UpstreamCheck.EvaluateAll(groups, rows);
        Assert.Equal(0.016, results[0].StandingSumA, Tolerance);   // 12 + 4 mA
        Assert.True(results[0].Complete);
        Assert.Equal(["missing.wav"], results[1].FailedMembers);
    }
}
