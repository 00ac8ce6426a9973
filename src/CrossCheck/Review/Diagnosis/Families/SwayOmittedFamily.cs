using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>Sidesway ignored: the claims are those of a braced (no-sway) analysis of a frame that can sway.</summary>
internal sealed class SwayOmittedFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        if (x.Model.Axial != AxialBehaviour.Rigid) yield break;
        if (!new Kinematics(x.Model).CanSway) yield break;
        var braced = x.Solver.Braced(x.Case, x.Keys);
        var sway = x.Review.Flags.Any(f => f.Kind == FlagKind.StoreyShear && f.Severity == Severity.Major)
            ? "The storey-shear check of the claims fails too: the columns do not carry the lateral load, which is what an analysis that ignores sidesway produces." : "";
        yield return new Hypothesis(CauseCode.SwayOmitted, 2, braced,
            "The claims are those of a braced (no-sway) analysis, but the frame can sway.")
        {
            Evidence = sway,
            CorrectWorking = "Add the sway correction (a sway case superposed through the storey shear equation) or analyse with the joints free to translate.",
        };
    }
}
