namespace CrossCheck.Analysis;

/// <summary>
/// Factorises symmetric positive definite stiffness matrices. The frame solver only talks to this
/// interface, so a dense path for small frames and a sparse path for large ones can sit behind it.
/// </summary>
public interface ILinearSolver
{
    /// <summary>Factorises <paramref name="matrix"/>.</summary>
    /// <exception cref="SingularMatrixException">The matrix is singular or not positive definite.</exception>
    ILinearFactor Factor(SparseSymmetricMatrix matrix);
}

/// <summary>A factorised matrix that solves for any number of right-hand sides.</summary>
public interface ILinearFactor
{
    int Size { get; }

    /// <summary>Solves A·x = b.</summary>
    double[] Solve(double[] rhs);

    /// <summary>Smallest pivot divided by its diagonal entry: near zero means near singular.</summary>
    double MinPivotRatio { get; }
}

/// <summary>The matrix could not be factorised: it is singular (a mechanism) or not positive definite.</summary>
public sealed class SingularMatrixException : Exception
{
    public SingularMatrixException() { }
    public SingularMatrixException(string message) : base(message) { }
    public SingularMatrixException(string message, Exception inner) : base(message, inner) { }
    public SingularMatrixException(string message, int pivotIndex) : base(message) => PivotIndex = pivotIndex;

    /// <summary>Index of the failing pivot when the solver knows it, else −1.</summary>
    public int PivotIndex { get; } = -1;
}
