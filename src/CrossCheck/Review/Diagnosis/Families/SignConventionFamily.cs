using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>Sign-convention mix-ups: every sign reversed, the end moments written in the other convention, or one member's signs reversed.</summary>
internal sealed class SignConventionFamily : IHypothesisFamily
{
    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var r = x.Recomputed;
        yield return new Hypothesis(CauseCode.SignConvention, 1, r.Select(v => -v).ToArray(),
            "Every claimed moment has the opposite sign to the analysis: the claims use the opposite sign convention (anticlockwise instead of clockwise, or hogging positive).")
        { Identity = "sign-convention|all" };
        var declared = x.S.Info.SignConvention;
        string stated = x.S.Info.SignConventionStated ? "declares" : "is taken (it states no convention) to use";
        yield return new Hypothesis(CauseCode.SignConvention, 2, x.Keys.Select((k, i) => k.End == MemberEnd.End ? -r[i] : r[i]).ToArray(),
            $"The claimed moments at the end of each member have the wrong sign, those at the start are right: the claims were written in the {declared.Other().Code()} convention while the submission {stated} {declared.Code()}. Set 'sign convention' in the info table to match the claims, or convert them.")
        { Identity = "sign-convention|ends" };
        // One member's signs: a change at its two ends only, so it is scored there before it is formed.
        foreach (var m in x.Keys.Select(k => k.Member).Distinct())
        {
            var changed = x.IndicesOf(m).ToArray();
            if (!x.Evidence.MayFit(changed, changed.Select(i => -r[i]).ToArray())) continue;
            yield return new Hypothesis(CauseCode.SignConvention, 3, x.Keys.Select((k, i) => k.Member == m ? -r[i] : r[i]).ToArray(),
                $"The moments of member {m} have the opposite sign; the rest agree. Check the sign convention used for member {m} (for a column, which end is its start).")
            { Identity = $"sign-convention|{m}", Place = new MemberPlace(m) };
        }
    }
}
