using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>The claimed reactions must balance the loads of the case: ΣFx = ΣFy = ΣM = 0 for the whole structure (statics).</summary>
internal sealed class ReactionBalanceCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        var claimed = x.Submission.Claims.Reactions.Where(r => r.Case == x.Case.Id).ToList();
        if (claimed.Count == 0) return;
        double fx = 0, fy = 0, mo = 0, scale = 0;
        var sources = new List<SourceRef>();
        foreach (var j in x.Model.Joints.Where(j => j.IsSupport))
        {
            var r = claimed.FirstOrDefault(c => c.Joint == j.Id);
            bool needX = j.Restraint.HasFlag(Restraint.X), needY = j.Restraint.HasFlag(Restraint.Y), needM = j.Restraint.HasFlag(Restraint.Rotation);
            if (r is null || (needY && r.Ry is null) || (needX && r.Rx is null && !IsHorizontalIdle(x.Case)) || (needM && r.M is null)) return; // incomplete: no check
            double rx = r.Rx ?? 0, ry = r.Ry ?? 0, rm = r.M ?? 0;
            fx += rx; fy += ry; mo += (j.X * ry) - (j.Y * rx) - rm;
            scale += Math.Abs(rx) + Math.Abs(ry);
            sources.Add(r.Source);
        }
        foreach (var load in x.Case.Loads)
        {
            var (lx, ly, lm) = x.Statics.Resultant(load, 0, 0);
            fx += lx; fy += ly; mo += lm;
            scale += Math.Abs(lx) + Math.Abs(ly);
        }
        var forces = ToleranceBand.For(x.Options, scale / 2, x.Options.AbsoluteTolerance * x.Submission.Info.Units.Force.ToSi);
        foreach (var (name, value) in new[] { ("horizontal", fx), ("vertical", fy) })
        {
            var sev = forces.Grade(value);
            if (sev == Severity.Info) continue;
            flags.Add(new Flag(FlagKind.Reaction, sev, new OverallPlace($"{name} equilibrium"), value,
                ReviewMessages.ReactionsUnbalanced(name, x.Quote.Force(value)), sources, ValueKind.Force)
            {
                Brief = ReviewMessages.ReactionsUnbalancedBrief(name, x.Quote.Force(value)),
            });
        }
        double size = x.Model.Joints.Max(j => Math.Abs(j.X) + Math.Abs(j.Y)) + 1;
        var moments = new ToleranceBand(Math.Max(x.Band.Agree, forces.Agree * size), Math.Max(x.Band.Minor, forces.Minor * size));
        var msev = moments.Grade(mo);
        if (msev != Severity.Info)
            flags.Add(new Flag(FlagKind.Reaction, msev, new OverallPlace("moment equilibrium"), mo, ReviewMessages.ReactionsOutOfMomentBalance(x.Quote.Moment(mo)), sources)
            {
                Brief = ReviewMessages.ReactionsUnbalancedBrief("moment", x.Quote.Moment(mo)),
            });
    }

    private static bool IsHorizontalIdle(LoadCase c) => c.Loads.All(l => l switch
    {
        JointForce f => f.Direction is LoadDirection.Up or LoadDirection.Down,
        MemberLoad ml => ml.Shape() switch
        {
            ConcentratedForce p => p.Direction is LoadDirection.Up or LoadDirection.Down,
            LinearlyVaryingLoad d => d.Direction is LoadDirection.Up or LoadDirection.Down,
            _ => true,
        },
        _ => true,
    });
}
