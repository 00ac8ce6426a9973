namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// An arithmetic slip in the author's own moment-distribution table: the first cell that does not follow from the cells
/// before it, carried into the final moments (found by <see cref="WorkingTableAudit"/>). It reproduces any wrong table by
/// construction, so a systematic mistake that explains the same claims ranks before it.
/// </summary>
internal sealed class WorkingSlipFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        if (x.Review.Audit is not { First: { } first } audit) yield break;
        // If the slip were the only mistake, the claims would be the recomputed moments plus its knock-on.
        var knock = audit.KnockOns.ToDictionary(k => new EndKey(k.Member, k.End), k => k.KnockOn);
        var predicted = x.Keys.Select((k, i) => x.Recomputed[i] + knock.GetValueOrDefault(k)).ToArray();
        yield return new Hypothesis(CauseCode.DistributionArithmetic, 1, predicted,
            $"In the moment-distribution table, row '{first.Row}', column {first.Column} ({first.Source.Citation}) does not follow from the cells before it, and the error is carried into the final moments.")
        {
            Evidence = "Correct that cell and carry the distribution on from there.",
            Identity = $"distribution-arithmetic|{x.Case.Id}|{first.Row}|{first.Column}",
            Place = new WorkingCellPlace(x.Case.Id, first.Row, first.Column),
        };
    }
}
