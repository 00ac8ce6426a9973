using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// A member's forces by statics from the claimed end moments of the case and the member's own loads (no analysis): what
/// the span-moment and shear checks compare the claims with. An end needs a claim unless statics fixes its moment: a
/// hinge (zero), or a single member at a joint free to rotate (the couple applied there).
/// </summary>
internal static class ClaimedMemberStatics
{
    /// <summary>The member result by statics, the claimed ends it rests on and their rows; null when an end moment is neither claimed nor known.</summary>
    public static (MemberResult Result, List<EndKey> Ends, List<SourceRef> Sources)? Of(CheckContext x, Member m)
    {
        var ends = new List<EndKey>();
        var sources = new List<SourceRef>();
        var moments = new double[2];
        foreach (var e in new[] { MemberEnd.Start, MemberEnd.End })
        {
            var key = new EndKey(m.Id, e);
            if (x.Claims.TryGetValue(key, out var cl))
            {
                moments[(int)e] = cl.Moment;
                ends.Add(key);
                sources.Add(cl.Source);
                continue;
            }
            string joint = m.JointAt(e);
            var j = x.Model.Joint(joint);
            if (m.IsReleased(e)) moments[(int)e] = 0;
            else if (!j.Restraint.HasFlag(Restraint.Rotation) && x.Model.MembersAt(joint).Count() == 1) moments[(int)e] = x.AppliedCouple(joint);
            else return null;
        }
        var (cos, sin, length) = x.Statics.Geometry(m);
        var result = MemberStatics.FromEndMoments(m, length, cos, sin, moments[0], moments[1], x.Statics.Actions(x.Case.Id, m.Id));
        return (result, ends, sources);
    }

    /// <summary>The force bands of the case's claimed shears: the reviewer's tolerances on the largest claimed shear.</summary>
    public static ToleranceBand ShearBand(CheckContext x, IEnumerable<ClaimedShear> claims) =>
        ToleranceBand.For(x.Options, claims.Select(c => Math.Abs(c.V)).DefaultIfEmpty(0).Max(), x.Options.AbsoluteTolerance * x.Submission.Info.Units.Force.ToSi);
}
