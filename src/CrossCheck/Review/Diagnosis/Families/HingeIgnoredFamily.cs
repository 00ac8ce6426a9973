using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// Hinges treated as rigid connections: all of them (a new analysis of the whole structure), or one member's (a rank-one
/// or rank-two update of the shared factor), tried at the hinged members where the claims differ (see <see cref="Evidence"/>).
/// </summary>
internal sealed class HingeIgnoredFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var hinged = x.Model.Members.Where(m => m.Hinge != Hinge.None).ToList();
        if (hinged.Count == 0) yield break;
        var all = new StructureModel(x.Model.Joints, x.Model.Members.Select(m => m with { Hinge = Hinge.None }).ToList(), x.Model.Axial, x.Model.RelativeStiffness);
        yield return new Hypothesis(CauseCode.HingeIgnored, 2, x.SolveAltered(all),
            $"The claims treat the hinge{(hinged.Count > 1 ? "s" : "")} of member{(hinged.Count > 1 ? "s" : "")} {string.Join(", ", hinged.Select(m => m.Id))} as rigid connections; a hinge carries no moment.")
        { Identity = "hinge-ignored|all", Order = -1 };
        if (hinged.Count < 2) yield break;
        var order = hinged.Select((m, i) => (m.Id, i)).ToDictionary(t => t.Id, t => t.i, StringComparer.Ordinal);
        foreach (var h in x.Evidence.NearMembers(hinged))
        {
            double[] predicted;
            try { predicted = x.Solver.WithoutHinges(x.Case, h, x.Keys); }
            catch (StructureException) { continue; } // this variant cannot be analysed: it does not apply
            yield return new Hypothesis(CauseCode.HingeIgnored, 3, predicted,
                $"The claims treat the hinge of member {h.Id} as a rigid connection; a hinge carries no moment.")
            { Identity = $"hinge-ignored|{h.Id}", Place = new MemberPlace(h.Id), Order = order[h.Id] };
        }
    }
}
