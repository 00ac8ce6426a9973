using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// Statics at released ends, which is exact: a hinged member end carries no moment; a single member at a joint free to
/// rotate (pin, roller, free end) carries the couple applied there; the root of an overhang carries the statical
/// cantilever moment of the overhang's own loads (common practice).
/// </summary>
internal sealed class ReleasedEndCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        Hinges(x, flags);
        SingleMemberJoints(x, flags);
        OverhangRoots(x, flags);
    }

    private static void Hinges(CheckContext x, List<Flag> flags)
    {
        foreach (var m in x.Model.Members)
            foreach (var e in new[] { MemberEnd.Start, MemberEnd.End })
            {
                if (!m.IsReleased(e) || !x.Claims.TryGetValue(new EndKey(m.Id, e), out var cl)) continue;
                var sev = x.Band.Grade(cl.Moment);
                if (sev == Severity.Info) continue;
                string at = m.JointAt(e);
                Add(x, flags, cl, sev, cl.Moment, ReviewMessages.HingeCarriesMoment(m.Id, at, x.Quote.Claim(cl)),
                    ReviewMessages.ReleasedBrief(m.Id, at, x.Quote.Claim(cl), "zero"));
            }
    }

    private static void SingleMemberJoints(CheckContext x, List<Flag> flags)
    {
        foreach (var j in x.Model.Joints)
        {
            if (j.Restraint.HasFlag(Restraint.Rotation)) continue;
            var members = x.Model.MembersAt(j.Id).ToList();
            if (members.Count != 1) continue;
            var m = members[0];
            var e = m.EndAt(j.Id)!.Value;
            if (m.IsReleased(e) || !x.Claims.TryGetValue(new EndKey(m.Id, e), out var cl)) continue;
            double applied = x.AppliedCouple(j.Id);
            double error = cl.Moment - applied;
            var sev = x.Band.Grade(error);
            if (sev == Severity.Info) continue;
            string should = applied == 0 ? "zero" : x.Quote.EndMoment(applied, e);
            Add(x, flags, cl, sev, error, ReviewMessages.ReleasedJoint(j.Id, j.Restraint == Restraint.Free, m.Id, should, x.Quote.Claim(cl)),
                ReviewMessages.ReleasedBrief(m.Id, j.Id, x.Quote.Claim(cl), should));
        }
    }

    private static void OverhangRoots(CheckContext x, List<Flag> flags)
    {
        foreach (var m in x.Model.Members)
        {
            foreach (var tipEnd in new[] { MemberEnd.Start, MemberEnd.End })
            {
                var tip = x.Model.Joint(m.JointAt(tipEnd));
                if (tip.Restraint != Restraint.Free || x.Model.MembersAt(tip.Id).Count() != 1) continue;
                var rootEnd = tipEnd == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;
                var root = x.Model.Joint(m.JointAt(rootEnd));
                if (x.Model.MembersAt(root.Id).Count() == 1 && root.Restraint == Restraint.Free) continue;
                if (m.IsReleased(rootEnd) || !x.Claims.TryGetValue(new EndKey(m.Id, rootEnd), out var cl)) continue;
                double statical = 0;
                foreach (var load in x.Case.Loads)
                {
                    bool onIt = load is MemberLoad ml && ml.Member == m.Id || load is JointLoad jl && jl.Joint == tip.Id;
                    if (onIt) statical += x.Statics.Resultant(load, root.X, root.Y).Moment;
                }
                double error = cl.Moment - statical;
                var sev = x.Band.Grade(error);
                if (sev == Severity.Info) continue;
                string should = x.Quote.EndMoment(statical, rootEnd);
                Add(x, flags, cl, sev, error, ReviewMessages.OverhangRoot(m.Id, root.Id, should, x.Quote.Claim(cl)),
                    ReviewMessages.ReleasedBrief(m.Id, root.Id, x.Quote.Claim(cl), should));
            }
        }
    }

    private static void Add(CheckContext x, List<Flag> flags, ClaimedEndMoment cl, Severity sev, double error, string message, string brief) =>
        flags.Add(new Flag(FlagKind.ReleasedEnd, sev, new MemberEndPlace(cl.Member, x.Model.Member(cl.Member).JointAt(cl.End!.Value), cl.End), error, message, [cl.Source])
        {
            Ends = [new EndKey(cl.Member, cl.End!.Value)],
            Brief = brief,
        });
}
