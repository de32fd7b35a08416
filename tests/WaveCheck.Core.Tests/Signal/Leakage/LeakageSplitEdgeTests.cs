using System.Numerics;
using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// <see cref="LeakageSplit.Locate"/> at the edges the mutation run of 3 December found unchecked: which pair of
/// directions is taken (the tightest bracket, found by its angle), the tolerance on a coefficient just below 0, ties,
/// and directions too close to bracket anything. References are vector geometry: with unit directions d_a, d_b the
/// current I = x·d_a + y·d_b is solved in closed form.
/// </summary>
public class LeakageSplitEdgeTests
{
    private static Complex[] Balanced(double rmsV) =>
        [.. new[] { 0.0, -120.0, 120.0 }.Select(a => Complex.FromPolarCoordinates(rmsV, a * Math.PI / 180))];

    [Fact]
    public void A_current_between_L3_s_two_directions_is_split_between_them()
    {
        // Balanced voltages: L3's resistive direction at 120°, its capacitive one at 210°; the six directions lie at
        // 0°, 90°, 120°, 210°, 240°, 330°. A current of 2 mA at 135° lies in the 90° bracket (120°, 210°) and in wider
        // ones (e.g. 120° to 240°): the tightest is taken. Closed form (orthogonal d_a, d_b): x = |I|cos 15°,
        // y = |I|sin 15°.
        var i = Complex.FromPolarCoordinates(0.002, 135 * Math.PI / 180);
        var (first, second) = LeakageSplit.Locate(Balanced(230), i);
        Assert.Equal(new LeakageDirection(2, false, first.CurrentA), first);
        Assert.Equal(new LeakageDirection(2, true, second.CurrentA), second);
        Assert.Equal(0.002 * Math.Cos(15 * Math.PI / 180), first.CurrentA, 1e-15);
        Assert.Equal(0.002 * Math.Sin(15 * Math.PI / 180), second.CurrentA, 1e-15);
    }

    [Fact]
    public void A_tiny_quadrature_part_keeps_the_wide_bracket_it_lies_in()
    {
        // Balanced voltages, I = 1 mA + j·1 pA: 1e-9 rad above L1's resistive direction (0°), so inside (0°, 90°),
        // and outside the tighter (330°, 0°), where its coefficient on L2's capacitive direction would be
        // −1e-12/0.5 = −2 pA: far beyond the rounding tolerance of 1e-12·|I| = 1e-15 A. Closed form x = 1 mA,
        // y = 1 pA on (V1, jV1).
        var (first, second) = LeakageSplit.Locate(Balanced(230), new Complex(1e-3, 1e-12));
        Assert.Equal(new LeakageDirection(0, false, first.CurrentA), first);
        Assert.Equal(new LeakageDirection(0, true, second.CurrentA), second);
        Assert.Equal(1e-3, first.CurrentA, 1e-18);
        Assert.Equal(1e-12, second.CurrentA, 1e-18);
    }

    [Fact]
    public void Equal_currents_on_a_pair_list_the_lower_index_first()
    {
        // Balanced voltages, I = (1 + j) mA: exactly 1 mA on V1/|V1| = 1 and 1 mA on j (closed form, both exact in
        // binary). "The larger current first"; on a tie the order of the directions (resistive before capacitive).
        var (first, second) = LeakageSplit.Locate(Balanced(230), new Complex(1e-3, 1e-3));
        Assert.Equal(new LeakageDirection(0, false, 1e-3), first);
        Assert.Equal(new LeakageDirection(0, true, 1e-3), second);
    }

    [Fact]
    public void A_current_along_directions_that_coincide_is_not_split_between_them()
    {
        // One voltage on all three inputs (a single-phase supply, invented): the resistive directions coincide, as do
        // the capacitive ones. A current of 2 mA in phase with it is 2 mA along V/|V| (closed form), 0 along jV/|V|;
        // the coinciding pairs (determinant 0, coefficients 0/0) are skipped.
        var v = new Complex(230, 0);
        var (first, second) = LeakageSplit.Locate([v, v, v], new Complex(0.002, 0));
        Assert.Equal(new LeakageDirection(0, false, 0.002), first);
        Assert.Equal(new LeakageDirection(0, true, 0), second);
    }

    [Fact]
    public void Directions_a_determinant_of_1e_9_apart_still_bracket()
    {
        // Unit directions (1, 0) and (1, 1e-9) (L1, L2; invented, their determinant is exactly 1e-9, the limit below
        // which a pair counts as parallel) and L3 at 120°. I = 2 mA + j·1 pA lies between the first two: closed form
        // (Cramer) x = y = 1 mA, and that pair (span 0 in double) is the tightest.
        Complex[] v = [new Complex(1, 0), new Complex(1, 1e-9), Complex.FromPolarCoordinates(1, 2 * Math.PI / 3)];
        var (first, second) = LeakageSplit.Locate(v, new Complex(0.002, 1e-12));
        Assert.Equal((0, false), (first.Phase, first.Capacitive));
        Assert.Equal((1, false), (second.Phase, second.Capacitive));
        Assert.Equal(1e-3, first.CurrentA, 1e-9);
        Assert.Equal(1e-3, second.CurrentA, 1e-9);
    }

    [Theory]
    [InlineData(1.0, -1e-12, 0, false, 0, true)]
    [InlineData(-1e-12, 1.0, 0, true, 0, false)]
    public void A_coefficient_of_exactly_minus_the_tolerance_counts_and_the_first_tightest_pair_wins(
        double real, double imaginary, int firstPhase, bool firstCapacitive, int secondPhase, bool secondCapacitive)
    {
        // Unit voltages 1, −j, −1 (invented, to make the arithmetic exact): directions (1,0), (0,1), (0,−1), (1,0),
        // (−1,0), (0,−1). |I| = 1 in double, so the tolerance is exactly 1e-12 and I = (1, −1e-12) is
        // 1·d0 − 1e-12·d1: on the edge, accepted. Several 90° brackets hold I (d0 with d1, d2 or d5); on the tie the
        // first in index order (L1's pair) is kept. Likewise (−1e-12, 1) = −1e-12·d0 + 1·d1.
        Complex[] v = [Complex.One, -Complex.ImaginaryOne, -Complex.One];
        var (first, second) = LeakageSplit.Locate(v, new Complex(real, imaginary));
        Assert.Equal(new LeakageDirection(firstPhase, firstCapacitive, 1.0), first);
        Assert.Equal(new LeakageDirection(secondPhase, secondCapacitive, 0.0), second);
    }
}
