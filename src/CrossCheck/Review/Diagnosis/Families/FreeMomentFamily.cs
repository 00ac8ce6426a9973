namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// Continuity ignored in the span moment: the largest moment of the member as if it were simply supported (wL²/8 under a
/// uniform load), its end moments left out.
/// </summary>
internal sealed class FreeMomentFamily : ISectionFamily
{
    public IEnumerable<Hypothesis> Propose(SectionContext x)
    {
        if (x.Kind == SectionKind.Shear) yield break;
        var loads = x.Kind == SectionKind.Envelope && x.Combination is { } c ? c.AllLoaded(x.S.Cases) : x.S.Case(x.Review.Case);
        if (loads is null) yield break;
        var statics = new ClaimStatics(x.S with { Cases = [loads] });
        var predicted = new double[x.Claims.Count];
        for (int i = 0; i < x.Claims.Count; i++)
        {
            var k = x.Claims[i].Key;
            if (k.End is not null) { predicted[i] = x.Claims[i].Recomputed; continue; }
            var m = x.Model.Member(k.Member);
            predicted[i] = x.Free(m, statics.Actions(loads.Id, m.Id)).SpanMaximum.Moment;
        }
        yield return new Hypothesis(CauseCode.FreeMoment, 1, predicted,
            "The span moments claimed are those of simply supported spans (wL²/8 under a uniform load): the hogging end moments of the continuous member were " +
            "not taken off.")
        {
            Identity = "free-moment",
            CorrectWorking = "The span moment is the free moment less the end moments' line: M(x) = M_free(x) + M_start·(1 − x/L) + M_end·x/L in the sagging convention, at its largest where the shear is zero.",
        };
    }
}
