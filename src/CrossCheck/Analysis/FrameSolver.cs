using System.Diagnostics.CodeAnalysis;
using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// Independent linear-elastic stiffness analysis of plane frames and continuous beams
/// (three DOF per joint, prismatic Euler–Bernoulli members, small displacements).
/// </summary>
/// <remarks>
/// Four stages, each in a file of its own: assembly (<see cref="FrameLayout"/>, <see cref="StiffnessAssembly"/>,
/// <see cref="LoadAssembly"/>), constraints (<see cref="FrameConstraints"/> over <see cref="ConstraintSet"/>),
/// solution (<see cref="FrameSolution"/> through <see cref="ILinearSolver"/>, with <see cref="MechanismSearch"/>) and
/// recovery (<see cref="FrameRecovery"/>, verified by <see cref="EquilibriumCheck"/>).
/// Supports, prescribed movements and axially rigid members are constraints eliminated exactly; end hinges are
/// condensed out of the member stiffness. A structure that cannot stand is refused whatever its loads: a loose part
/// naming its members, a mechanism naming the joints and directions that are free (a beam on rollers only is refused
/// even under vertical load alone).
/// </remarks>
public sealed class FrameSolver
{
    private readonly ILinearSolver _linear;

    public FrameSolver(ILinearSolver? linear = null) => _linear = linear ?? AutoSolver.Instance;

    /// <summary>Analyses every load case.</summary>
    /// <param name="model">The structure.</param>
    /// <param name="cases">Load cases to analyse.</param>
    /// <param name="holdTranslations">Hold every joint translation the supports and rigid members leave free: a braced
    /// (no-sway) analysis, as an author who ignored sidesway would have made.</param>
    /// <exception cref="StructureException">The structure is a mechanism or otherwise cannot be analysed.</exception>
    public AnalysisResult Solve(StructureModel model, IReadOnlyList<LoadCase> cases, bool holdTranslations = false)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(cases);
        var frame = new FrameLayout(model);
        frame.CheckConnectivity();
        MechanismSearch.RefuseLooseParts(frame);
        var perCase = cases.Select(c => (Case: c, Local: LoadAssembly.LocalActions(frame, c))).ToList();
        var solution = FrameSolution.Solve(frame, perCase, _linear, holdTranslations);
        var notes = new List<string>();
        var results = new List<CaseResult>();
        var balance = new List<CaseEquilibrium>();
        for (int c = 0; c < perCase.Count; c++)
        {
            var d = solution.Displacements(c);
            var recovered = FrameRecovery.Recover(frame, perCase[c].Case, perCase[c].Local, d, solution.Constraints.Set, _linear);
            results.Add(recovered.Result);
            balance.Add(EquilibriumCheck.Balance(frame, perCase[c].Case, recovered, solution.Constraints.Held, holdTranslations));
        }
        var report = new NumericalReport(solution.ConditionNumber, StiffnessContrast.Of(model), balance)
        {
            SmallestPivotRatio = solution.Factor.MinPivotRatio,
        };
        EquilibriumCheck.Verify(report, notes);
        return new AnalysisResult(model, results, notes, solution.ConditionNumber) { Numerics = report };
    }

    /// <summary>Analyses every load case, returning false with the reason instead of throwing.</summary>
    public bool TrySolve(StructureModel model, IReadOnlyList<LoadCase> cases, [NotNullWhen(true)] out AnalysisResult? result,
        [NotNullWhen(false)] out StructureException? problem)
    {
        try
        {
            result = Solve(model, cases);
            problem = null;
            return true;
        }
        catch (StructureException ex)
        {
            result = null;
            problem = ex;
            return false;
        }
    }
}
