using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>Hinges treated as rigid connections: all of them, or one at a time.</summary>
internal sealed class HingeIgnoredFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var hinged = x.Model.Members.Where(m => m.Hinge != Hinge.None).ToList();
        if (hinged.Count == 0) yield break;
        StructureModel Without(Func<Member, bool> which) =>
            new(x.Model.Joints, x.Model.Members.Select(m => which(m) ? m with { Hinge = Hinge.None } : m).ToList(), x.Model.Axial, x.Model.RelativeStiffness);
        yield return new Hypothesis(CauseCode.HingeIgnored, 2, x.From(x.SolveAltered(Without(_ => true), x.Case)),
            $"The claims treat the hinge{(hinged.Count > 1 ? "s" : "")} of member{(hinged.Count > 1 ? "s" : "")} {string.Join(", ", hinged.Select(m => m.Id))} as rigid connections; a hinge carries no moment.")
        { Identity = "hinge-ignored|all" };
        if (hinged.Count > 1)
            foreach (var h in hinged)
                yield return new Hypothesis(CauseCode.HingeIgnored, 3, x.From(x.SolveAltered(Without(m => m.Id == h.Id), x.Case)),
                    $"The claims treat the hinge of member {h.Id} as a rigid connection; a hinge carries no moment.")
                { Identity = $"hinge-ignored|{h.Id}", Place = new MemberPlace(h.Id) };
    }
}
