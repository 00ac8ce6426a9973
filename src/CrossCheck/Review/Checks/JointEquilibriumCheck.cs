using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// At a joint free to rotate, the claimed member-end moments must sum to the couple applied there (clockwise
/// member-end convention; common practice, docs/REFERENCE-CHECKS.md "Further facts of the trade").
/// </summary>
internal sealed class JointEquilibriumCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        foreach (var j in x.Model.Joints)
        {
            if (j.Restraint.HasFlag(Restraint.Rotation)) continue;
            var ends = x.Model.MembersAt(j.Id).Select(m => (Member: m, End: m.EndAt(j.Id)!.Value)).ToList();
            if (ends.Count < 2) continue; // single members: see released ends
            double sum = 0;
            var used = new List<ClaimedEndMoment>();
            bool complete = true;
            foreach (var (m, e) in ends)
            {
                if (x.Claims.TryGetValue(new EndKey(m.Id, e), out var cl)) { sum += cl.Moment; used.Add(cl); }
                else if (!m.IsReleased(e)) { complete = false; break; }
            }
            if (!complete || used.Count == 0) continue;
            double applied = x.AppliedCouple(j.Id);
            double error = sum - applied;
            var sev = x.Band.Grade(error);
            if (sev == Severity.Info) continue;
            string figures = string.Join(", ", used.Select(c => $"{c.Member} {Quoting.ClaimNumber(c)}"));
            flags.Add(new Flag(FlagKind.JointEquilibrium, sev, new JointPlace(j.Id), error,
                ReviewMessages.JointOutOfBalance(j.Id, figures, x.Quote.ConventionNote, x.Quote.Moment(error), applied == 0 ? null : x.Quote.Moment(applied)),
                used.Select(c => c.Source).ToList())
            {
                Ends = used.Select(c => new EndKey(c.Member, c.End!.Value)).ToList(),
                Brief = ReviewMessages.JointOutOfBalanceBrief(j.Id, x.Quote.Moment(error)),
            });
        }
    }
}
