using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>The support movements left out of the analysis.</summary>
internal sealed class SettlementIgnoredFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        if (!x.Model.HasSupportMovements) yield break;
        var still = new StructureModel(x.Model.Joints.Select(j => j with { Movement = default }).ToList(), x.Model.Members, x.Model.Axial, x.Model.RelativeStiffness);
        var moving = x.Model.Joints.Where(j => !j.Movement.IsZero).Select(j => j.Id).ToList();
        yield return new Hypothesis(CauseCode.SettlementIgnored, 2, x.From(x.SolveAltered(still, x.Case)),
            $"The claims leave out the support movement{(moving.Count > 1 ? "s" : "")} at {string.Join(", ", moving)}.")
        {
            CorrectWorking = "Settlement moments are 6EIΔ/L² at fixed ends (3EIΔ/L² with the far end pinned) and need the absolute E and I.",
        };
    }
}
