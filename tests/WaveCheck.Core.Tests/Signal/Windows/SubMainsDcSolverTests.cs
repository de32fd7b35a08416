using WaveCheck.Core.Signal;

namespace WaveCheck.Core.Tests.Signal;

/// <summary>
/// The small linear solver under the sub-mains least-squares fit (Gaussian elimination with partial pivoting), on
/// systems whose solution is known in closed form: b is built as A·x for a chosen x, so the solver must give x back.
/// Aimed at the mutants the fit's own tests leave alive (docs/testing.md): the fit's normal equations are diagonally
/// dominant, so row exchanges and the singularity guard are never taken there.
/// </summary>
public class SubMainsDcSolverTests
{
    private static double[] Times(double[] a, double[] x, int k)
    {
        var b = new double[k];
        for (var r = 0; r < k; r++)
        {
            for (var j = 0; j < k; j++)
            {
                b[r] += a[(r * k) + j] * x[j];
            }
        }

        return b;
    }

    [Fact]
    public void A_zero_on_the_diagonal_is_solved_by_exchanging_rows()
    {
        // A permutation-like matrix: without a row exchange the first pivot is 0 and elimination divides by zero.
        // Closed form: x = (1, -2, 3), b = A·x.
        double[] a = [0, 2, 1, 1, 0, 0, 0, 1, 3];
        double[] x = [1, -2, 3];
        var b = Times(a, x, 3);
        var u = new double[3];
        Assert.True(SubMainsDc.Solve(a.ToArray(), b, 3, 1, u));
        Assert.Equal(x, u, (p, q) => Math.Abs(p - q) < 1e-12);
    }

    [Fact]
    public void The_largest_pivot_is_taken_so_a_tiny_leading_entry_costs_no_accuracy()
    {
        // [[1e-17, 1], [1, 1]]: eliminating on the 1e-17 pivot loses x[0] entirely in double precision
        // (1 - 1e17 rounds to -1e17); partial pivoting takes the 1 below and recovers x = (1, 1) (a textbook example
        // of why pivoting matters, e.g. Golub and Van Loan, Matrix Computations, §3.4; from memory).
        double[] a = [1e-17, 1, 1, 1];
        double[] x = [1, 1];
        var b = Times(a, x, 2);
        var u = new double[2];
        Assert.True(SubMainsDc.Solve(a.ToArray(), b, 2, 1, u));
        Assert.Equal(1, u[0], 1e-12);
        Assert.Equal(1, u[1], 1e-12);
    }

    [Fact]
    public void A_row_exchange_moves_the_right_hand_side_with_its_row()
    {
        // Four unknowns, the largest entry of every column below the diagonal: every step exchanges rows.
        double[] a =
        [
            1, 2, 0, 1,
            4, 1, 2, 0,
            2, 8, 1, 3,
            3, 0, 9, 2,
        ];
        double[] x = [0.5, -1.25, 2, 4];
        var b = Times(a, x, 4);
        var u = new double[4];
        Assert.True(SubMainsDc.Solve(a.ToArray(), b, 4, 1, u));
        Assert.Equal(x, u, (p, q) => Math.Abs(p - q) < 1e-12);
    }

    [Theory]
    // Rank-deficient: the second row is twice the first (no unique solution).
    [InlineData(new[] { 1.0, 2, 2, 4 }, 1)]
    // A pivot of 1e-6 against a window of 10 000 samples: below the guard of 1e-9 per sample (1e-5), so the regressors
    // count as dependent over the window.
    [InlineData(new[] { 1e-6, 0, 0, 1.0 }, 10_000)]
    public void A_singular_system_is_refused(double[] a, int samples)
    {
        var u = new double[2];
        Assert.False(SubMainsDc.Solve(a.ToArray(), [1, 1], 2, samples, u));
    }

    [Fact]
    public void A_pivot_above_the_guard_is_accepted()
    {
        // The same 1e-6 pivot over 100 samples: the guard is 1e-7, so the system is solved: x = (1, 1) from b = A·x.
        double[] a = [1e-6, 0, 0, 1];
        var u = new double[2];
        Assert.True(SubMainsDc.Solve(a.ToArray(), Times(a, [1, 1], 2), 2, 100, u));
        Assert.Equal(1, u[0], 1e-9);
        Assert.Equal(1, u[1], 1e-12);
    }

    [Fact]
    public void A_pivot_exactly_at_the_guard_is_refused()
    {
        // The guard needs a pivot above 1e-9 per sample (engineering threshold of the fit: at or below it the
        // regressors count as dependent and the plain mean is kept, the side that invents no DC). A pivot of exactly
        // 1e-9 × 1000 is refused; the same system over 999 samples (guard just below the pivot) is solved: x = (1, 1).
        var pivot = 1e-9 * 1000;
        double[] a = [pivot, 0, 0, 1];
        var u = new double[2];
        Assert.False(SubMainsDc.Solve(a.ToArray(), Times(a, [1, 1], 2), 2, 1000, u));
        Assert.True(SubMainsDc.Solve(a.ToArray(), Times(a, [1, 1], 2), 2, 999, u));
        Assert.Equal(1, u[0], 1e-9);
    }
}
