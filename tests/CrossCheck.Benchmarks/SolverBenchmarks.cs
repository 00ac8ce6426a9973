using BenchmarkDotNet.Attributes;
using CrossCheck.Analysis;
using MathNet.Numerics.LinearAlgebra.Double;

namespace CrossCheck.Benchmarks;

/// <summary>
/// The reduced stiffness matrix of a 100-storey × 10-bay frame (3,333 joint DOF): with members axially elastic every
/// joint DOF but the supports' is an unknown (3,300); with members axially rigid (the usual hand-analysis assumption)
/// the joint rotations and one sway per storey are (1,200). Factorise and solve with MathNet's dense Cholesky (the
/// baseline) and with the skyline LDLᵀ. Target: skyline at least 50× faster.
/// </summary>
[MemoryDiagnoser]
public class SolverBenchmarks
{
    private SparseSymmetricMatrix _k = null!;
    private DenseMatrix _dense = null!;
    private double[] _rhs = null!;

    [Params(100)]
    public int Storeys { get; set; }

    [Params(true, false)]
    public bool AxiallyElastic { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var (model, cases) = FrameGenerator.Regular(Storeys, 10, AxiallyElastic);
        (_k, _rhs) = MatrixProbe.Reduced(model, cases[0]);
        int n = _k.Size;
        _dense = DenseMatrix.Create(n, n, 0);
        for (int i = 0; i < n; i++)
            foreach (var (j, v) in _k.LowerRow(i)) { _dense[i, j] = v; _dense[j, i] = v; }
    }

    [Benchmark(Baseline = true, Description = "MathNet dense Cholesky")]
    public double Dense() => _dense.Cholesky().Solve(MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(_rhs))[0];

    [Benchmark(Description = "CrossCheck skyline LDLᵀ")]
    public double Skyline() => SkylineSolver.Instance.Factor(_k).Solve(_rhs)[0];
}

/// <summary>Whole analyses of big frames (assembly, constraints, factorisation, recovery of every member).</summary>
public class LargeFrameBenchmarks
{
    private Model.StructureModel _model = null!;
    private IReadOnlyList<Model.LoadCase> _cases = null!;

    /// <summary>Joint DOF of the frame (3 per joint).</summary>
    [Params(10_000, 100_000)]
    public int Dof { get; set; }

    [GlobalSetup]
    public void Setup()
    {
        var (storeys, bays) = FrameGenerator.ForDof(Dof, 20);
        (_model, _cases) = FrameGenerator.Regular(storeys, bays);
    }

    [Benchmark(Description = "FrameSolver.Solve")]
    public int Solve() => new FrameSolver().Solve(_model, _cases).Cases[0].Members.Count;
}
