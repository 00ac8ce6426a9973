namespace CrossCheck.Review.Checks;

/// <summary>
/// A claimed end shear must follow by statics from the claimed end moments and the member's loads: the simple-beam shear
/// plus (M_start + M_end)/L in the clockwise convention (beam convention V = dM/dx; common practice).
/// </summary>
internal sealed class ShearStaticsCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        var claims = x.Submission.Claims.Shears.Where(c => c.Case == x.Case.Id && c.End is not null).ToList();
        if (claims.Count == 0) return;
        var band = ClaimedMemberStatics.ShearBand(x, claims);
        foreach (var sc in claims)
        {
            if (!x.Model.TryGetMember(sc.Member, out var m) || ClaimedMemberStatics.Of(x, m) is not var (result, ends, sources)) continue;
            var end = sc.End!.Value;
            double statical = result.VAtEnd(end);
            double error = sc.V - statical;
            var sev = band.Grade(error);
            if (sev == Severity.Info) continue;
            var place = new MemberEndPlace(m.Id, m.JointAt(end), end);
            string claimed = x.Quote.Claim(sc), should = x.Quote.Force(statical);
            flags.Add(new Flag(FlagKind.ShearStatics, sev, place, error, ReviewMessages.ShearNotByStatics(place.Short, x.Case.Id, claimed, should), [sc.Source, .. sources], ValueKind.Force)
            {
                Ends = ends,
                Sections = [new SectionKey(SectionKind.Shear, m.Id, end)],
                Brief = ReviewMessages.ShearNotByStaticsBrief(place.Short, claimed, should),
            });
        }
    }
}
