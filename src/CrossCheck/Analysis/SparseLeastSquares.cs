namespace CrossCheck.Analysis;

/// <summary>One equation of a sparse least-squares fit: Σ coefficient·x[unknown] ≈ rhs.</summary>
internal sealed record SparseEquation(int[] Unknowns, double[] Coefficients, double Rhs);

/// <summary>
/// Least squares over sparse equations, rank-revealing, with the residual and the leverage (the diagonal of the hat
/// matrix A·(AᵀA)⁺·Aᵀ) of every equation, and equations set aside one at a time. The normal matrix AᵀA is factorised once
/// (skyline LDLᵀ, a pivot that vanishes dropped, so its solves give a generalised inverse); the leverages come from its
/// selected inverse; setting an equation aside is a rank-one downdate of that inverse (Sherman–Morrison), which keeps
/// every residual and leverage current with one solve. The residuals and leverages do not depend on which generalised
/// inverse is used, so they equal those of a fit by the singular value decomposition.
/// </summary>
internal sealed class SparseLeastSquares
{
    /// <summary>Scaled pivots of AᵀA at or below this are taken as zero (exact rank deficiency shows as round-off, about 1e−16).</summary>
    private const double DropBelow = 1e-10;

    private readonly IReadOnlyList<SparseEquation> _rows;
    private readonly SkylineSolver.Factorised? _factor;
    private readonly bool[] _active;
    private readonly List<(double[] Z, double Scale)> _downdates = [];

    private SparseLeastSquares(IReadOnlyList<SparseEquation> rows, SkylineSolver.Factorised? factor, double[] residual, double[] leverage)
    {
        _rows = rows;
        _factor = factor;
        Residual = residual;
        Leverage = leverage;
        _active = Enumerable.Repeat(true, rows.Count).ToArray();
        ActiveCount = rows.Count;
    }

    /// <summary>A·x − b for every equation (set-aside ones included, at their last values).</summary>
    public double[] Residual { get; }

    /// <summary>The hat-matrix diagonal of every active equation: 1 when nothing else checks it.</summary>
    public double[] Leverage { get; }

    /// <summary>Numerical rank of A.</summary>
    public int Rank => _factor?.Rank ?? 0;

    public int ActiveCount { get; private set; }

    public bool IsActive(int row) => _active[row];

    /// <summary>The fit over every equation (each unknown used with a coefficient that is not zero, each at most once per equation).</summary>
    public static SparseLeastSquares Fit(IReadOnlyList<SparseEquation> rows, int unknowns)
    {
        // Without unknowns every equation stands alone: its residual is −b and nothing else checks it.
        if (unknowns == 0) return new SparseLeastSquares(rows, null, rows.Select(r => -r.Rhs).ToArray(), new double[rows.Count]);
        var normal = new SparseSymmetricMatrix(unknowns);
        var atb = new double[unknowns];
        foreach (var row in rows)
        {
            for (int a = 0; a < row.Unknowns.Length; a++)
            {
                atb[row.Unknowns[a]] += row.Coefficients[a] * row.Rhs;
                for (int b = 0; b <= a; b++) normal.Add(row.Unknowns[a], row.Unknowns[b], row.Coefficients[a] * row.Coefficients[b]);
            }
        }
        var factor = SkylineSolver.Decompose(normal, DropBelow);
        var x = factor.Solve(atb);
        var z = factor.SelectedInverse();
        var residual = new double[rows.Count];
        var leverage = new double[rows.Count];
        for (int k = 0; k < rows.Count; k++)
        {
            var row = rows[k];
            double ax = 0, h = 0;
            for (int a = 0; a < row.Unknowns.Length; a++)
            {
                ax += row.Coefficients[a] * x[row.Unknowns[a]];
                for (int b = 0; b < row.Unknowns.Length; b++)
                    h += row.Coefficients[a] * row.Coefficients[b] * factor.Inverse(z, row.Unknowns[a], row.Unknowns[b]);
            }
            residual[k] = ax - row.Rhs;
            leverage[k] = h;
        }
        return new SparseLeastSquares(rows, factor, residual, leverage);
    }

    /// <summary>
    /// Sets equation <paramref name="row"/> aside (its leverage must be below 1): with z = G·aₖ for the current generalised
    /// inverse G, every other equation's residual grows by (aⱼ·z)·rₖ/(1 − hₖ) and its leverage by (aⱼ·z)²/(1 − hₖ).
    /// </summary>
    public void Remove(int row)
    {
        if (!_active[row]) throw new InvalidOperationException("The equation is already set aside.");
        double h = Leverage[row], r = Residual[row];
        if (!(h < 1)) throw new InvalidOperationException("An equation nothing else checks cannot be set aside.");
        _active[row] = false;
        ActiveCount--;
        if (_factor is null) return;
        var a = _rows[row];
        var z = _factor.Solve(Dense(a));
        foreach (var (zt, scale) in _downdates)
        {
            double c = Dot(a, zt) * scale;
            for (int i = 0; i < z.Length; i++) z[i] += zt[i] * c;
        }
        _downdates.Add((z, 1 / (1 - h)));
        for (int j = 0; j < _rows.Count; j++)
        {
            if (!_active[j]) continue;
            double az = Dot(_rows[j], z);
            if (az == 0) continue;
            Residual[j] += az * r / (1 - h);
            Leverage[j] += az * az / (1 - h);
        }
    }

    private double[] Dense(SparseEquation row)
    {
        var d = new double[_factor!.Size];
        for (int a = 0; a < row.Unknowns.Length; a++) d[row.Unknowns[a]] += row.Coefficients[a];
        return d;
    }

    private static double Dot(SparseEquation row, double[] v)
    {
        double s = 0;
        for (int a = 0; a < row.Unknowns.Length; a++) s += row.Coefficients[a] * v[row.Unknowns[a]];
        return s;
    }
}
