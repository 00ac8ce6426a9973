using CrossCheck.Analysis;
using CrossCheck.Tests.Support;
using MathNet.Numerics.LinearAlgebra;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// The sparse least-squares fit behind the compatibility check must give the residuals and leverages of a fit by the
/// singular value decomposition (MathNet), rank-deficient systems included, and keep giving them as equations are set
/// aside one at a time (each against a fresh SVD fit of the equations left). Leverages are the diagonal of the hat matrix
/// A·A⁺ (Belsley, Kuh &amp; Welsch, Regression Diagnostics; from memory).
/// </summary>
public class SparseLeastSquaresTests
{
    /// <summary>Random equations over a chain of unknowns (each touches neighbours), some unknowns only in a fixed combination (rank deficiency), some equations with no unknown.</summary>
    private static List<SparseEquation> Equations(Random rnd, int unknowns, int count)
    {
        var rows = new List<SparseEquation>();
        for (int k = 0; k < count; k++)
        {
            if (rnd.Next(12) == 0) { rows.Add(new SparseEquation([], [], rnd.NextDouble() - 0.5)); continue; }
            int u = rnd.Next(unknowns);
            var cols = new SortedDictionary<int, double> { [u] = 1 + rnd.NextDouble() };
            if (u + 1 < unknowns && rnd.Next(3) > 0) cols[u + 1] = rnd.NextDouble() - 0.5;
            // The last two unknowns only ever appear as (x − y): one direction the equations cannot see.
            if (u >= unknowns - 2) { cols.Clear(); cols[unknowns - 2] = 1; cols[unknowns - 1] = -1; }
            rows.Add(new SparseEquation([.. cols.Keys], [.. cols.Values], (rnd.NextDouble() - 0.5) * 10));
        }
        return rows;
    }

    /// <summary>Residuals and leverages of the active equations by SVD (the check's former dense fit), and the rank.</summary>
    private static (double[] Residual, double[] Leverage, int Rank) Dense(List<SparseEquation> rows, List<int> active, int unknowns)
    {
        var a = Matrix<double>.Build.Dense(active.Count, unknowns);
        var b = Vector<double>.Build.Dense(active.Count);
        for (int k = 0; k < active.Count; k++)
        {
            var r = rows[active[k]];
            for (int i = 0; i < r.Unknowns.Length; i++) a[k, r.Unknowns[i]] = r.Coefficients[i];
            b[k] = r.Rhs;
        }
        var svd = a.Svd(true);
        double cut = Math.Max(svd.S.Count > 0 ? svd.S[0] : 0, 1e-300) * 1e-10;
        int rank = svd.S.Count(v => v > cut);
        var utb = svd.U.TransposeThisAndMultiply(b);
        var y = Vector<double>.Build.Dense(unknowns);
        for (int i = 0; i < svd.S.Count; i++) if (svd.S[i] > cut) y[i] = utb[i] / svd.S[i];
        var x = svd.VT.TransposeThisAndMultiply(y);
        var residual = ((a * x) - b).ToArray();
        var leverage = new double[active.Count];
        for (int k = 0; k < active.Count; k++) for (int i = 0; i < rank; i++) leverage[k] += svd.U[k, i] * svd.U[k, i];
        return (residual, leverage, rank);
    }

    [Theory]
    [InlineData(1, 8, 20)]
    [InlineData(2, 30, 60)]
    [InlineData(3, 60, 150)]
    [InlineData(4, 5, 40)]
    public void SameAsTheSvdFit_AsEquationsAreSetAside(int variant, int unknowns, int count)
    {
        var rnd = new Random(variant);
        var rows = Equations(rnd, unknowns, count);
        var fit = SparseLeastSquares.Fit(rows, unknowns);
        var active = Enumerable.Range(0, rows.Count).ToList();
        for (int step = 0; step < 12 && active.Count > 0; step++)
        {
            var (residual, leverage, rank) = Dense(rows, active, unknowns);
            fit.Rank.ShouldBe(rank, $"step {step}");
            double scale = Math.Max(1, residual.Max(Math.Abs));
            for (int k = 0; k < active.Count; k++)
            {
                Near.Equal(fit.Residual[active[k]], residual[k], relative: 0, absolute: 1e-9 * scale, what: $"step {step}, residual of {active[k]}");
                Near.Equal(fit.Leverage[active[k]], leverage[k], relative: 0, absolute: 1e-9, what: $"step {step}, leverage of {active[k]}");
            }
            // Set aside the equation with the largest deletion residual that something else checks.
            int worst = active.Where(k => fit.Leverage[k] < 1 - 1e-6).DefaultIfEmpty(-1)
                .MaxBy(k => k < 0 ? 0 : fit.Residual[k] * fit.Residual[k] / (1 - fit.Leverage[k]));
            if (worst < 0) break;
            fit.Remove(worst);
            active.Remove(worst);
        }
    }
}
