using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>Relative stiffness taken as I (or E·I) instead of I/L: the same as members with I·L in place of I.</summary>
internal sealed class StiffnessWithoutLengthFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var lengths = x.Model.Members.Select(x.Model.Length).ToList();
        if (lengths.Max() - lengths.Min() <= 1e-9 * lengths.Max()) yield break;
        var members = x.Model.Members.Select(m => m with { I = m.I * x.Model.Length(m) }).ToList();
        var altered = new StructureModel(x.Model.Joints, members, x.Model.Axial, x.Model.RelativeStiffness);
        yield return new Hypothesis(CauseCode.StiffnessWithoutLength, 3, x.SolveAltered(altered),
            "The claims follow from member stiffnesses taken as I (or E·I) without dividing by the length.")
        {
            CorrectWorking = "Distribution factors must use K = EI/L (4EI/L, or 3EI/L with the far end pinned).",
        };
    }
}
