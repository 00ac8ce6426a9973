namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// End moments ignored in the shears: the end shears of a simply supported span (wL/2 under a uniform load), without the
/// shear from the difference of the end moments.
/// </summary>
internal sealed class ShearWithoutMomentFamily : ISectionFamily
{
    public IEnumerable<Hypothesis> Propose(SectionContext x)
    {
        if (x.Kind != SectionKind.Shear || x.S.Case(x.Review.Case) is not { } loads) yield break;
        var predicted = new double[x.Claims.Count];
        for (int i = 0; i < x.Claims.Count; i++)
        {
            var k = x.Claims[i].Key;
            var m = x.Model.Member(k.Member);
            predicted[i] = x.Free(m, x.Actions(loads.Id, m)).VAtEnd(k.End!.Value);
        }
        yield return new Hypothesis(CauseCode.ShearWithoutMoment, 1, predicted,
            "The shears claimed are those of simply supported spans (wL/2 under a uniform load): the shear from the difference of the end moments was left out.")
        {
            Identity = "shear-without-moment",
            CorrectWorking = "Add (M_start + M_end)/L (clockwise end moments) to the simple-beam shear at both ends: V = V_free − (M_start + M_end)/L in the beam convention.",
        };
    }
}
