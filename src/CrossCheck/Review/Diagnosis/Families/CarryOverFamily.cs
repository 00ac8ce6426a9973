using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// A moment distribution carried out with a wrong carry-over factor (0, −½ or 1 instead of +½), plain or modified stiffness.
/// A mistake of method: tried only when the differences spread as one would (<see cref="Evidence.MethodMistakePlausible"/>).
/// </summary>
internal sealed class CarryOverFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        if (x.Model.Axial != AxialBehaviour.Rigid || !x.Evidence.MethodMistakePlausible) yield break;
        foreach (var (cof, text) in new[] { (0.0, "carried nothing over (carry-over factor 0)"), (-0.5, "carried over with the wrong sign (−½ instead of +½)"), (1.0, "carried over the full balance (factor 1 instead of ½)") })
        {
            foreach (bool modified in new[] { true, false })
            {
                var md = MomentDistribution.Answer(x.Model, x.Case, new DistributionOptions(ModifiedStiffness: modified, CarryOverFactor: cof, Cycles: 200, FinalBalance: false));
                if (!md.Converged) continue;
                yield return new Hypothesis(CauseCode.CarryOver, 3, x.From(md.Moments),
                    $"The claims are those of a moment distribution that {text} to far ends that are fixed or continuous.")
                {
                    CorrectWorking = "The carry-over factor of a prismatic member is +½ (0 to a pinned end).",
                    Identity = $"carry-over|{cof}",
                };
            }
        }
    }
}
