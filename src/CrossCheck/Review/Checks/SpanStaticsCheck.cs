namespace CrossCheck.Review.Checks;

/// <summary>
/// A claimed span moment must be the largest moment that statics gives along the member from the claimed end moments and
/// the member's loads (M(x) = M_start + V_start·x − the moments of the loads left of x; common practice).
/// </summary>
internal sealed class SpanStaticsCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        foreach (var sc in x.Submission.Claims.SpanMoments.Where(c => c.Case == x.Case.Id))
        {
            if (!x.Model.TryGetMember(sc.Member, out var m) || ClaimedMemberStatics.Of(x, m) is not var (result, ends, sources)) continue;
            var (at, statical) = result.SpanMaximum;
            double error = sc.Moment - statical;
            var sev = x.Band.Grade(error);
            if (sev == Severity.Info) continue;
            string claimed = x.Quote.Claim(sc), should = x.Quote.SpanMoment(statical), where = x.Quote.Length(at);
            flags.Add(new Flag(FlagKind.SpanStatics, sev, new MemberPlace(m.Id), error,
                ReviewMessages.SpanNotByStatics(m.Id, x.Case.Id, claimed, should, where), [sc.Source, .. sources])
            {
                Ends = ends,
                Sections = [new SectionKey(SectionKind.SpanMoment, m.Id, null)],
                Brief = ReviewMessages.SpanNotByStaticsBrief(m.Id, claimed, should),
            });
        }
    }
}
