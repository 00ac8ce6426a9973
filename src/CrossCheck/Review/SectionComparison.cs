using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Compares the span-moment and shear claims of a case (a load case or a derived combination) with the analysis: each gets
/// a status against the case's bands — the moment band of the case for span moments, the reviewer's tolerances on the
/// case's largest end shear for shears (docs/REVIEW-JSON.md, "Statuses").
/// </summary>
internal static class SectionComparison
{
    public static CaseReview Add(Submission s, CaseResult? result, CaseReview review, ReviewOptions o)
    {
        var quote = new Quoting(s);
        var flags = new List<Flag>();
        var spans = new List<SpanMomentFinding>();
        foreach (var c in s.Claims.SpanMoments.Where(c => c.Case == review.Case))
        {
            if (result is null || !result.Members.TryGetValue(c.Member, out var mr))
            {
                spans.Add(new SpanMomentFinding(review.Case, c.Member, c.Moment, null, c.X, null, EndStatus.Unmatched, c));
                flags.Add(Unmatched("span-moment", c.Member, c.Moment, c.Source, ValueKind.Moment));
                continue;
            }
            var (x, m) = mr.SpanMaximum;
            var finding = new SpanMomentFinding(review.Case, c.Member, c.Moment, m, c.X, x, review.Band.Status(c.Moment - m), c);
            if (c.X is double cx && Math.Abs(cx - x) > Math.Max(0.05 * mr.Length, 0.1) && Math.Abs(mr.MomentAt(Math.Clamp(cx, 0, mr.Length)) - m) > review.Band.Agree)
            {
                finding = finding with { LocationNote = x };
                string msg = ReviewMessages.SpanLocation(c.Member, review.Case, quote.Length(cx), quote.Length(x));
                flags.Add(new Flag(FlagKind.SpanMoment, Severity.Info, new MemberPlace(c.Member), null, msg, [c.Source]) { Brief = msg });
            }
            spans.Add(finding);
        }

        var claimedShears = s.Claims.Shears.Where(c => c.Case == review.Case).ToList();
        double peakV = result?.Members.Values.SelectMany(m => m.Stations.Select(st => Math.Abs(st.Shear)).Append(Math.Abs(m.StartV)).Append(Math.Abs(m.EndV))).DefaultIfEmpty(0).Max() ?? 0;
        var shearBand = ToleranceBand.For(o, peakV, o.AbsoluteTolerance * s.Info.Units.Force.ToSi);
        var shears = new List<ShearFinding>();
        foreach (var c in claimedShears)
        {
            if (result is null || c.End is not MemberEnd end || !result.Members.TryGetValue(c.Member, out var mr))
            {
                shears.Add(new ShearFinding(review.Case, c.Member, c.At, c.End, c.V, null, EndStatus.Unmatched, c));
                flags.Add(Unmatched("shear", c.Member, c.V, c.Source, ValueKind.Force));
                continue;
            }
            double v = mr.VAtEnd(end);
            shears.Add(new ShearFinding(review.Case, c.Member, s.Model.Member(c.Member).JointAt(end), end, c.V, v, shearBand.Status(c.V - v), c));
        }
        return review with
        {
            SpanMoments = spans,
            Shears = shears,
            ShearBand = shearBand,
            Flags = [.. review.Flags, .. flags],
        };
    }

    /// <summary>A claim that names a member or end the model does not have (an <c>end-moment</c> flag, as for end moments).</summary>
    public static Flag Unmatched(string what, string member, double value, SourceRef source, ValueKind kind)
    {
        string message = ReviewMessages.SectionClaimUnmatched(what, member);
        return new Flag(FlagKind.EndMoment, Severity.Minor, new MemberPlace(member), value, message, [source], kind) { Brief = message };
    }
}
