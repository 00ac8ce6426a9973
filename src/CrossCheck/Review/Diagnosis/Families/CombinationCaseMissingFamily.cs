using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>One case of a combination left out.</summary>
internal sealed class CombinationCaseMissingFamily : IHypothesisFamily, ISectionFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        if (x.S.Combination(x.Case.Id) is not { IsPatterned: false } c || c.Terms.Count < 2) yield break;
        foreach (var term in c.Terms)
            yield return Make(c, term, CombinationVariants.EndMoments(x, term, 0));
    }

    public IEnumerable<Hypothesis> Propose(SectionContext x)
    {
        if (x.Combination is not { } c || c.Terms.Count < 2) yield break;
        foreach (var term in c.Terms)
            if (CombinationVariants.Sections(x, term, 0) is { } predicted) yield return Make(c, term, predicted);
    }

    private static Hypothesis Make(Combination c, CombinationTerm term, double[] predicted) =>
        new(CauseCode.CombinationCaseMissing, 2, predicted,
            $"The claims of combination {c.Name} leave out case {term.Case} ({CombinationVariants.Number(term.Factor)} × {term.Case}, {term.Source.Citation}).")
        {
            Identity = $"combination-case-missing|{c.Name}|{term.Case}",
            CorrectWorking = $"Combination {c.Name} is {c.Words}.",
        };
}
