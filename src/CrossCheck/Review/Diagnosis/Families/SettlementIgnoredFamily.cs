namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>The support movements left out of the analysis.</summary>
internal sealed class SettlementIgnoredFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        if (!x.Model.HasSupportMovements) yield break;
        var moving = x.Model.Joints.Where(j => !j.Movement.IsZero).Select(j => j.Id).ToList();
        // The case on the structure without its movements: the same stiffness, so the shared factor solves it.
        yield return new Hypothesis(CauseCode.SettlementIgnored, 2, x.LoadEffect(x.Case.Loads),
            $"The claims leave out the support movement{(moving.Count > 1 ? "s" : "")} at {string.Join(", ", moving)}.")
        {
            CorrectWorking = "Settlement moments are 6EIΔ/L² at fixed ends (3EIΔ/L² with the far end pinned) and need the absolute E and I.",
        };
    }
}
