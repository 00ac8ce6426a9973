using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Benchmarks;

/// <summary>Gets the reduced stiffness matrix the frame solver factorises, for solver-only benchmarks.</summary>
public static class MatrixProbe
{
    public static (SparseSymmetricMatrix K, double[] Rhs) Reduced(StructureModel model, LoadCase loadCase)
    {
        var capture = new Capture();
        new FrameSolver(capture).Solve(model, [loadCase]);
        var rhs = Enumerable.Range(0, capture.Matrix!.Size).Select(i => 1.0 + (i % 7)).ToArray();
        return (capture.Matrix, rhs);
    }

    private sealed class Capture : ILinearSolver
    {
        public SparseSymmetricMatrix? Matrix { get; private set; }

        public ILinearFactor Factor(SparseSymmetricMatrix matrix)
        {
            Matrix ??= matrix; // the first one is the stiffness matrix
            return SkylineSolver.Instance.Factor(matrix);
        }
    }
}
