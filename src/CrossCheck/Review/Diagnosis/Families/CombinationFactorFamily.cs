using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>One case of a combination with a wrong factor (another recognisable partial factor, or another factor of the same combination).</summary>
internal sealed class CombinationFactorFamily : IHypothesisFamily, ISectionFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        if (x.S.Combination(x.Case.Id) is not { IsPatterned: false } c) yield break;
        foreach (var (term, f) in CombinationVariants.FactorSlips(c))
            yield return Make(c, term, f, CombinationVariants.EndMoments(x, term, f));
    }

    public IEnumerable<Hypothesis> Propose(SectionContext x)
    {
        if (x.Combination is not { } c) yield break;
        foreach (var (term, f) in CombinationVariants.FactorSlips(c))
            if (CombinationVariants.Sections(x, term, f) is { } predicted) yield return Make(c, term, f, predicted);
    }

    private static Hypothesis Make(Combination c, CombinationTerm term, double factor, double[] predicted) =>
        new(CauseCode.CombinationFactor, 3, predicted,
            $"The claims of combination {c.Name} are those of case {term.Case} taken at {CombinationVariants.Number(factor)} instead of the {CombinationVariants.Number(term.Factor)} " +
            $"the combinations table gives ({term.Source.Citation}).")
        {
            Identity = $"combination-factor|{c.Name}|{term.Case}|{CombinationVariants.Number(factor)}",
            CorrectWorking = $"Combination {c.Name} is {c.Words}.",
        };
}
