using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Double;

namespace CrossCheck.Analysis;

/// <summary>
/// Dense Cholesky (MathNet.Numerics) on a Jacobi-scaled copy of the matrix: fine for the frames
/// of a calculation package (up to a few hundred joints).
/// </summary>
public sealed class DenseCholeskySolver : ILinearSolver
{
    /// <summary>Pivots smaller than this fraction of their diagonal entry are treated as zero.</summary>
    public const double SingularPivotRatio = 1e-11;

    public static DenseCholeskySolver Instance { get; } = new();

    public ILinearFactor Factor(SparseSymmetricMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int n = matrix.Size;
        var scale = new double[n];
        for (int i = 0; i < n; i++)
        {
            double d = matrix.Diagonal(i);
            if (!(d > 0)) throw new SingularMatrixException($"Zero or negative stiffness on unknown {i}.", i);
            scale[i] = 1 / Math.Sqrt(d);
        }
        var a = DenseMatrix.Create(n, n, 0);
        for (int i = 0; i < n; i++)
            foreach (var (j, v) in matrix.LowerRow(i))
            {
                double s = v * scale[i] * scale[j];
                a[i, j] = s;
                a[j, i] = s;
            }
        MathNet.Numerics.LinearAlgebra.Factorization.Cholesky<double> chol;
        try
        {
            chol = a.Cholesky();
        }
        catch (ArgumentException ex)
        {
            throw new SingularMatrixException("The stiffness matrix is not positive definite.", ex);
        }
        var l = chol.Factor;
        double minRatio = double.PositiveInfinity;
        int worst = -1;
        for (int i = 0; i < n; i++)
        {
            double r = l[i, i] * l[i, i]; // scaled diagonal is 1
            if (r < minRatio) { minRatio = r; worst = i; }
        }
        if (n > 0 && !(minRatio > SingularPivotRatio))
            throw new SingularMatrixException("The stiffness matrix is singular.", worst);
        return new Factorised(chol, scale, n == 0 ? 1 : minRatio);
    }

    private sealed class Factorised(MathNet.Numerics.LinearAlgebra.Factorization.Cholesky<double> chol, double[] scale, double minRatio) : ILinearFactor
    {
        public int Size => scale.Length;
        public double MinPivotRatio => minRatio;

        public double[] Solve(double[] rhs)
        {
            int n = scale.Length;
            if (n == 0) return [];
            var b = Vector<double>.Build.Dense(n, i => rhs[i] * scale[i]);
            var x = chol.Solve(b);
            var result = new double[n];
            for (int i = 0; i < n; i++) result[i] = x[i] * scale[i];
            return result;
        }
    }
}
