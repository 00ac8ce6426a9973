using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>The two end moments of one member exchanged.</summary>
internal sealed class EndsSwappedFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var r = x.Recomputed;
        foreach (var m in x.Keys.Select(k => k.Member).Distinct())
        {
            int a = x.IndexOf(new EndKey(m, MemberEnd.Start)), b = x.IndexOf(new EndKey(m, MemberEnd.End));
            if (a < 0 || b < 0) continue;
            // A change at the member's two ends only: scored there before it is formed.
            if (!x.Evidence.MayFit([a, b], [r[b], r[a]])) continue;
            var p = (double[])r.Clone();
            (p[a], p[b]) = (r[b], r[a]);
            var member = x.Model.Member(m);
            yield return new Hypothesis(CauseCode.EndsSwapped, 2, p,
                $"The two end moments of member {m} are exchanged: the value for {member.Start} is the one the analysis gives at {member.End}, and the reverse.")
            { Identity = $"ends-swapped|{m}", Place = new MemberPlace(m) };
        }
    }
}
