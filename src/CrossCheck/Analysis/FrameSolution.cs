using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// The solution stage: constraints applied, the reduced stiffness matrix factorised once through
/// <see cref="ILinearSolver"/> (which chooses the ordering and the factorisation), mechanisms told apart from
/// merely ill-conditioned stiffness, and the displacements of every case.
/// </summary>
internal sealed class FrameSolution
{
    /// <summary>Scaled pivots below this send the structure to the mechanism check.</summary>
    private const double SuspectPivotRatio = 1e-6;

    private FrameSolution(FrameConstraints constraints, ILinearFactor factor, List<double[]> reducedLoads, List<string> notes)
    {
        Constraints = constraints;
        Factor = factor;
        ReducedLoads = reducedLoads;
        Notes = notes;
    }

    public FrameConstraints Constraints { get; }

    /// <summary>The factorised reduced stiffness matrix.</summary>
    public ILinearFactor Factor { get; }

    /// <summary>Tᵀ(F − K·d0) of every case.</summary>
    public List<double[]> ReducedLoads { get; }

    /// <summary>What the solver had to assume (free movements it held).</summary>
    public List<string> Notes { get; }

    /// <summary>Joint displacements of case <paramref name="c"/>: d = T·q + d0.</summary>
    public double[] Displacements(int c) => Constraints.Transformation.Expand(Factor.Solve(ReducedLoads[c]));

    /// <exception cref="StructureException">The structure is a mechanism, or its stiffness matrix is numerically singular.</exception>
    public static FrameSolution Solve(FrameLayout frame, IReadOnlyList<(LoadCase Case, CaseLoads Local)> perCase, ILinearSolver linear, bool holdTranslations)
    {
        var model = frame.Model;
        var cases = perCase.Select(p => p.Case).ToList();
        var extra = new List<(int Dof, string Note)>();
        for (int attempt = 0; ; attempt++)
        {
            var constraints = FrameConstraints.Build(model, cases, holdTranslations, extra.Select(x => x.Dof));
            var t = constraints.Transformation;
            var k = StiffnessAssembly.Reduce(frame, t);
            var loads = perCase.Select(pc => LoadAssembly.ReducedLoad(frame, t, pc.Case, pc.Local)).ToList();
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
                var mode = MechanismSearch.Mode(linear, StiffnessAssembly.Reduce(frame, t, unit: true));
                if (mode is not null)
                {
                    if (attempt > 3 * model.Joints.Count) throw new StructureException("The structure could not be stabilised: it is a mechanism.", singular!);
                    extra.AddRange(MechanismSearch.FreeMovements(frame, mode.Value.Vector, mode.Value.Scale, t, loads, cases.Select(c => c.Id).ToList()));
                    continue;
                }
                if (singular is not null)
                    throw new StructureException(
                        "The stiffness matrix is numerically singular although the structure is not a mechanism: the member stiffnesses differ too much " +
                        "(by more than about 10¹² between neighbours) for double precision. Check E, I and A for typing errors.", singular);
            }
            return new FrameSolution(constraints, factor!, loads.Select(l => l.Reduced).ToList(), extra.Select(x => x.Note).ToList());
        }
    }
}
