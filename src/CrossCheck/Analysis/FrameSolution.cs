using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// The solution stage: constraints applied, the reduced stiffness matrix factorised once through
/// <see cref="ILinearSolver"/> (which chooses the ordering and the factorisation), mechanisms told apart from
/// merely ill-conditioned stiffness, the condition number estimated, and the displacements of every case.
/// </summary>
internal sealed class FrameSolution
{
    /// <summary>Scaled pivots below this send the structure to the mechanism check.</summary>
    private const double SuspectPivotRatio = 1e-6;

    private FrameSolution(FrameConstraints constraints, ILinearFactor factor, List<double[]> reducedLoads, double conditionNumber)
    {
        Constraints = constraints;
        Factor = factor;
        ReducedLoads = reducedLoads;
        ConditionNumber = conditionNumber;
    }

    public FrameConstraints Constraints { get; }

    /// <summary>The factorised reduced stiffness matrix.</summary>
    public ILinearFactor Factor { get; }

    /// <summary>Tᵀ(F − K·d0) of every case.</summary>
    public List<double[]> ReducedLoads { get; }

    /// <summary>Estimate of κ₁ of the reduced stiffness matrix (<see cref="ConditionEstimator.Stiffness"/>).</summary>
    public double ConditionNumber { get; }

    /// <summary>Joint displacements of case <paramref name="c"/>: d = T·q + d0.</summary>
    public double[] Displacements(int c) => Constraints.Transformation.Expand(Factor.Solve(ReducedLoads[c]));

    /// <summary>
    /// Factorises the reduced stiffness matrix. A mechanism is decided from the stiffness alone, never from the loads:
    /// a pivot that vanishes relative to its diagonal (the factorisations work on a Jacobi-scaled copy) sends the
    /// structure to <see cref="MechanismSearch"/>, which looks for a zero-energy mode of the unit-stiffness matrix.
    /// </summary>
    /// <exception cref="StructureException">The structure is a mechanism, or its stiffness matrix is numerically singular.</exception>
    public static FrameSolution Solve(FrameLayout frame, IReadOnlyList<(LoadCase Case, CaseLoads Local)> perCase, ILinearSolver linear, bool holdTranslations)
    {
        var constraints = FrameConstraints.Build(frame.Model, perCase.Select(p => p.Case).ToList(), holdTranslations);
        var t = constraints.Transformation;
        var k = StiffnessAssembly.Reduce(frame, t);
        ILinearFactor? factor = null;
        SingularMatrixException? singular = null;
        try
        {
            factor = linear.Factor(k);
        }
        catch (SingularMatrixException ex)
        {
            singular = ex;
        }
        // A tiny pivot may be a mechanism drowned in round-off or just very different stiffnesses: decide on
        // the unit-stiffness copy, whose only near-zero modes are mechanisms.
        if (singular is not null || factor!.MinPivotRatio < SuspectPivotRatio)
        {
            var modes = MechanismSearch.Modes(linear, StiffnessAssembly.Reduce(frame, t, unit: true));
            if (modes.Count > 0) throw MechanismSearch.Refusal(frame, t, modes, singular);
            if (singular is not null)
                throw new StructureException(
                    "The stiffness matrix is numerically singular although the structure is not a mechanism: the member stiffnesses differ too much " +
                    "(by more than about 10¹² between neighbours) for double precision. Check E, I and A for typing errors.", singular);
        }
        var loads = perCase.Select(pc => LoadAssembly.ReducedLoad(frame, t, pc.Case, pc.Local)).ToList();
        double condition = ConditionEstimator.Stiffness(k, factor!, t, frame.ReferenceLength);
        return new FrameSolution(constraints, factor!, loads, condition);
    }
}
