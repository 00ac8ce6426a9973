using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Compares the claims of one case with the independent analysis: every claimed end moment, reaction and displacement
/// gets a status against the case's tolerance bands (docs/REVIEW-JSON.md, "status").
/// </summary>
internal static class Comparison
{
    /// <summary>The findings of one case, with the flags the comparison itself raises (unmatched claims, differing reactions).</summary>
    public static CaseReview Compare(Submission s, CaseResult? result, string caseId, ReviewOptions o)
    {
        var quote = new Quoting(s);
        var mu = s.Info.Units.Moment;
        double peak = result?.PeakMoment ?? 0;
        var band = ToleranceBand.For(o, peak, o.AbsoluteTolerance * mu.ToSi);
        var findings = new List<EndMomentFinding>();
        var flags = new List<Flag>();
        var claimed = s.Claims.EndMoments.Where(c => c.Case == caseId).ToList();
        foreach (var c in claimed)
        {
            if (c.End is not MemberEnd end || result is null || !result.Members.ContainsKey(c.Member))
            {
                findings.Add(new EndMomentFinding(caseId, c.Member, c.At, c.End, c.Moment, null, EndStatus.Unmatched, c.Source) { Claim = c });
                string message = result is null ? ReviewMessages.ClaimForCaseWithoutLoads(caseId)
                    : s.Model.TryGetMember(c.Member, out var m) ? ReviewMessages.NoSuchEnd(c.Member, c.At, m.Start, m.End)
                    : ReviewMessages.NoSuchMember(c.Member);
                flags.Add(new Flag(FlagKind.EndMoment, Severity.Minor, new MemberEndPlace(c.Member, c.At), c.Moment, message, [c.Source]) { Brief = message });
                continue;
            }
            double r = result.EndMoment(c.Member, end);
            findings.Add(new EndMomentFinding(caseId, c.Member, s.Model.Member(c.Member).JointAt(end), end, c.Moment, r, band.Status(c.Moment - r), c.Source) { Claim = c });
        }
        // Ends are missing from a case whose end moments the author claims; in a submission of end moments alone (no combinations, span
        // moments, shears or envelopes) also from a case the author left out altogether.
        bool endMomentsOnly = s.Combinations.Count == 0 && s.Claims.SpanMoments.Count == 0 && s.Claims.Shears.Count == 0 && s.Claims.Envelopes.Count == 0;
        bool endsExpected = claimed.Count > 0 || endMomentsOnly;
        if (result is not null && endsExpected)
        {
            var have = claimed.Where(c => c.End is not null).Select(c => new EndKey(c.Member, c.End!.Value)).ToHashSet();
            foreach (var m in s.Model.Members)
                foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
                {
                    if (have.Contains(new EndKey(m.Id, end))) continue;
                    double r = result.EndMoment(m.Id, end);
                    if (band.Agrees(r)) continue;
                    findings.Add(new EndMomentFinding(caseId, m.Id, m.JointAt(end), end, null, r, EndStatus.Missing, null));
                }
        }
        var ordered = findings.OrderByDescending(f => Rank(f.Status)).ThenByDescending(f => Math.Abs(f.Difference ?? f.Recomputed ?? 0)).ToList();
        var reactions = result is null ? [] : Reactions(s, result, caseId, o);
        var displacements = result is null ? [] : Displacements(s, result, caseId, o, flags);
        foreach (var (q, reaction) in reactions.Select(q => (q, true)).Concat(displacements.Select(q => (q, false))))
        {
            if (q.Status is not (EndStatus.Minor or EndStatus.Discrepant)) continue;
            string claimedText = quote.Component(q.Component, q.Claimed, reaction), recomputed = quote.Component(q.Component, q.Recomputed, reaction);
            var kind = reaction ? (q.Component == "M" ? ValueKind.Moment : ValueKind.Force) : (q.Component == "rotation" ? ValueKind.Rotation : ValueKind.Displacement);
            flags.Add(new Flag(reaction ? FlagKind.Reaction : FlagKind.Displacement, q.Status == EndStatus.Minor ? Severity.Minor : Severity.Major, q.Place,
                q.Difference, ReviewMessages.QuantityDiffers(reaction, q.Component, q.Joint, claimedText, recomputed), [q.Source], kind)
            {
                Brief = ReviewMessages.QuantityBrief(q.Component, q.Joint, claimedText, recomputed),
            });
        }
        return new CaseReview(caseId, peak, band, ordered, reactions, displacements, flags, []);
    }

    /// <summary>Order of statuses in a case's table: the worst first.</summary>
    public static int Rank(EndStatus s) => s switch
    {
        EndStatus.Discrepant => 4,
        EndStatus.Unmatched => 3,
        EndStatus.Missing => 2,
        EndStatus.Minor => 1,
        EndStatus.Agree => 0,
        _ => throw new ArgumentOutOfRangeException(nameof(s), s, null),
    };

    private static List<QuantityFinding> Reactions(Submission s, CaseResult result, string caseId, ReviewOptions o)
    {
        var list = new List<QuantityFinding>();
        var claims = s.Claims.Reactions.Where(r => r.Case == caseId).ToList();
        if (claims.Count == 0) return list;
        double peakF = result.Reactions.Values.Select(r => Math.Max(Math.Abs(r.Rx), Math.Abs(r.Ry))).DefaultIfEmpty(0).Max();
        double peakM = Math.Max(result.PeakMoment, result.Reactions.Values.Select(r => Math.Abs(r.M)).DefaultIfEmpty(0).Max());
        var forces = ToleranceBand.For(o, peakF, o.AbsoluteTolerance * s.Info.Units.Force.ToSi);
        var moments = ToleranceBand.For(o, peakM, o.AbsoluteTolerance * s.Info.Units.Moment.ToSi);
        foreach (var c in claims)
        {
            var rec = result.Reactions.TryGetValue(c.Joint, out var r) ? r : new Reaction(0, 0, 0);
            Components(list, caseId, c.Joint, c.Source, [("Rx", c.Rx, rec.Rx, forces), ("Ry", c.Ry, rec.Ry, forces), ("M", c.M, rec.M, moments)]);
        }
        return list;
    }

    private static List<QuantityFinding> Displacements(Submission s, CaseResult result, string caseId, ReviewOptions o, List<Flag> flags)
    {
        var list = new List<QuantityFinding>();
        var claims = s.Claims.Displacements.Where(d => d.Case == caseId).ToList();
        if (claims.Count == 0) return list;
        if (s.Model.RelativeStiffness)
        {
            flags.Add(new Flag(FlagKind.Displacement, Severity.Info, new OverallPlace("displacements"), null, ReviewMessages.DisplacementsNeedAbsoluteStiffness,
                claims.Select(c => c.Source).ToList()) { Brief = ReviewMessages.DisplacementsNeedAbsoluteStiffness });
            return list;
        }
        double peakU = result.Displacements.Values.Select(d => Math.Max(Math.Abs(d.Ux), Math.Abs(d.Uy))).DefaultIfEmpty(0).Max();
        double peakR = result.Displacements.Values.Select(d => Math.Abs(d.Rotation)).DefaultIfEmpty(0).Max();
        // Half the last digit of a value printed to 0.1 of the displacement unit; rotations to 5e-6 rad (common practice).
        var translations = ToleranceBand.For(o, peakU, 0.05 * s.Info.Units.Displacement.ToSi);
        var rotations = ToleranceBand.For(o, peakR, 5e-6);
        foreach (var c in claims)
        {
            if (!result.Displacements.TryGetValue(c.Joint, out var d)) continue;
            Components(list, caseId, c.Joint, c.Source, [("ux", c.Ux, d.Ux, translations), ("uy", c.Uy, d.Uy, translations), ("rotation", c.Rotation, d.Rotation, rotations)]);
        }
        return list;
    }

    /// <summary>One finding per claimed component of a reaction or displacement row (components not claimed are skipped).</summary>
    private static void Components(List<QuantityFinding> list, string caseId, string joint, SourceRef source,
        (string Component, double? Claimed, double Recomputed, ToleranceBand Band)[] components)
    {
        foreach (var (component, claimed, recomputed, band) in components)
            if (claimed is double v) list.Add(new QuantityFinding(caseId, joint, component, v, recomputed, band.Status(v - recomputed), source));
    }
}
