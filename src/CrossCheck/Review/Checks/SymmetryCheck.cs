namespace CrossCheck.Review.Checks;

/// <summary>
/// A symmetric structure under symmetric load has mirror-image moments, equal and opposite in the clockwise member-end
/// convention (common practice, docs/REFERENCE-CHECKS.md "Further facts of the trade").
/// </summary>
internal sealed class SymmetryCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        var mirror = SymmetryFinder.Find(x.Model, x.Case);
        if (mirror is null) return;
        var done = new HashSet<EndKey>();
        foreach (var (key, cl) in x.Claims)
        {
            var (m2, e2) = mirror.Map(key.Member, key.End);
            var otherKey = new EndKey(m2, e2);
            if (done.Contains(key) || !x.Claims.TryGetValue(otherKey, out var other)) continue;
            done.Add(otherKey);
            done.Add(key);
            if (otherKey == key) continue;
            double error = cl.Moment + other.Moment; // mirror images have opposite clockwise moments
            var sev = x.Band.Grade(error);
            if (sev == Severity.Info) continue;
            var place = new MirrorPlace(new MemberEndPlace(key.Member, x.Model.Member(key.Member).JointAt(key.End), key.End),
                new MemberEndPlace(m2, x.Model.Member(m2).JointAt(e2), e2));
            flags.Add(new Flag(FlagKind.Symmetry, sev, place, error,
                ReviewMessages.NotMirrored(x.Case.Id, place.First.Short, x.Quote.Claim(cl), place.Second.Short, x.Quote.Claim(other), x.Quote.Convention),
                [cl.Source, other.Source])
            {
                Ends = [key, otherKey],
                Brief = ReviewMessages.NotMirroredBrief(place.Words, x.Quote.Moment(Math.Abs(error))),
            });
        }
    }
}
