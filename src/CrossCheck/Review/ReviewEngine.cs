using System.Text.RegularExpressions;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Reviews a submission: compares every claim with the independent analysis, runs the checks of the claimed
/// numbers on their own, gives the verdict and builds the schedule of comments.
/// </summary>
public static partial class ReviewEngine
{
    /// <param name="submission">The submission as imported.</param>
    /// <param name="analysis">The independent analysis of the same submission.</param>
    /// <param name="options">Tolerances and sign-off details.</param>
    /// <param name="inputWarnings">Warnings from the import, repeated in the memo.</param>
    public static ReviewResult Review(Submission submission, AnalysisResult analysis, ReviewOptions? options = null, IEnumerable<string>? inputWarnings = null)
    {
        ArgumentNullException.ThrowIfNull(submission);
        ArgumentNullException.ThrowIfNull(analysis);
        options ??= ReviewOptions.Default;
        var checks = new ClaimChecks(submission, options);
        var conditioning = ConditioningFlag(submission, analysis);
        var cases = new List<CaseReview>();
        var caseIds = analysis.Cases.Select(c => c.Case).ToList();
        foreach (var id in submission.Claims.EndMoments.Select(c => c.Case).Distinct())
            if (!caseIds.Contains(id)) caseIds.Add(id);
        foreach (var id in caseIds)
        {
            var result = analysis.Cases.FirstOrDefault(c => c.Case == id);
            var review = ReviewCase(submission, result, id, options);
            review = review with { Flags = [.. review.Flags, .. checks.Run(id)] };
            foreach (var table in submission.WorkingTables.Where(t => t.Case == id))
            {
                var audit = Diagnosis.WorkingTableAudit.Audit(submission, table, options.AbsoluteTolerance * submission.Info.Units.Moment.ToSi);
                review = review with { Audit = audit, Flags = [.. review.Flags, Diagnosis.WorkingTableAudit.ToFlag(audit, submission, review.AgreeTolerance)] };
            }
            if (options.Diagnose && result is not null && review.EndMoments.Any(e => e.Status is EndStatus.Discrepant or EndStatus.Minor))
                review = review with { Causes = new Diagnosis.Diagnoser(submission, analysis, options).Diagnose(review) };
            if (conditioning is not null && result is not null)
            {
                review = review with { Flags = [.. review.Flags, conditioning] };
                conditioning = null;
            }
            cases.Add(review with { Flags = [.. review.Flags.OrderByDescending(f => f.Severity)] });
        }
        var verdict = VerdictOf(cases);
        var comments = Comments(submission, cases);
        return new ReviewResult(submission, options, verdict, cases, comments, analysis.Notes, inputWarnings?.ToList() ?? []) { Analysis = analysis };
    }

    /// <summary>
    /// The numerical sanity layer's finding for the reviewer: members whose stiffnesses differ by a factor of a million
    /// or more, or an ill-conditioned matrix. The results passed the equilibrium check (an analysis that fails it is
    /// never returned), but such a contrast is usually a typing or unit slip in E, I or A, so the author is asked to
    /// confirm. One flag for the model, on the first case reviewed.
    /// </summary>
    private static Flag? ConditioningFlag(Submission s, AnalysisResult analysis)
    {
        var n = analysis.Numerics;
        if (!n.IllConditioned) return null;
        var sources = new List<SourceRef>();
        string where = "stiffness matrix";
        if (n.Contrast is { } k && k.Ratio >= NumericalLimits.StiffnessContrast)
        {
            where = $"member {k.Stiffer}";
            foreach (var id in new[] { k.Stiffer, k.Softer })
                if (s.Model.TryGetMember(id, out var m)) sources.Add(m.Source);
        }
        string all = s.Cases.Count > 1 ? " This applies to every load case." : "";
        return new Flag(FlagKind.Conditioning, Severity.Minor, where, null, $"{n.Describe()} Please confirm the section properties.{all}", sources);
    }

    /// <summary>Per docs/REVIEW-JSON.md: concur when every end agrees and no flag is above info; revise on any discrepant end or major flag.</summary>
    public static Verdict VerdictOf(IEnumerable<CaseReview> cases)
    {
        var list = cases.ToList();
        if (list.Any(c => c.EndMoments.Any(e => e.Status == EndStatus.Discrepant) || c.Flags.Any(f => f.Severity == Severity.Major)
                          || c.Reactions.Concat(c.Displacements).Any(q => q.Status == EndStatus.Discrepant)))
            return Verdict.Revise;
        if (list.All(c => c.EndMoments.All(e => e.Status == EndStatus.Agree) && c.Flags.All(f => f.Severity == Severity.Info)
                          && c.Reactions.Concat(c.Displacements).All(q => q.Status == EndStatus.Agree)))
            return Verdict.Concur;
        return Verdict.ConcurWithComments;
    }

    private static CaseReview ReviewCase(Submission s, CaseResult? result, string caseId, ReviewOptions o)
    {
        var mu = s.Info.Units.Moment;
        double peak = result?.PeakMoment ?? 0;
        double agree = Math.Max(o.AbsoluteTolerance * mu.ToSi, o.RelativeTolerance * peak);
        double minor = Math.Max(o.AbsoluteTolerance * mu.ToSi, o.MinorRelativeTolerance * peak);
        EndStatus Status(double diff) => Math.Abs(diff) <= agree ? EndStatus.Agree : Math.Abs(diff) <= minor ? EndStatus.Minor : EndStatus.Discrepant;

        var findings = new List<EndMomentFinding>();
        var flags = new List<Flag>();
        var claimed = s.Claims.EndMoments.Where(c => c.Case == caseId).ToList();
        foreach (var c in claimed)
        {
            if (c.End is not MemberEnd end || result is null || !result.Members.ContainsKey(c.Member))
            {
                findings.Add(new EndMomentFinding(caseId, c.Member, c.At, c.End, c.Moment, null, EndStatus.Unmatched, c.Source));
                flags.Add(new Flag(FlagKind.EndMoment, Severity.Minor, $"member {c.Member} at {c.At}", c.Moment,
                    result is null
                        ? $"A moment is claimed for case {caseId}, which has no loads in the submission."
                        : s.Model.TryGetMember(c.Member, out _)
                            ? $"Member {c.Member} has no end at '{c.At}': the claim cannot be matched (its ends are {s.Model.Member(c.Member).Start} and {s.Model.Member(c.Member).End})."
                            : $"The submission's model has no member '{c.Member}': the claim cannot be matched.",
                    [c.Source]));
                continue;
            }
            double r = result.EndMoment(c.Member, end);
            findings.Add(new EndMomentFinding(caseId, c.Member, s.Model.Member(c.Member).JointAt(end), end, c.Moment, r, Status(c.Moment - r), c.Source));
        }
        if (result is not null)
        {
            var have = claimed.Where(c => c.End is not null).Select(c => (c.Member, c.End!.Value)).ToHashSet();
            foreach (var m in s.Model.Members)
                foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
                {
                    if (have.Contains((m.Id, end))) continue;
                    double r = result.EndMoment(m.Id, end);
                    if (Math.Abs(r) <= agree) continue;
                    findings.Add(new EndMomentFinding(caseId, m.Id, m.JointAt(end), end, null, r, EndStatus.Missing, null));
                }
        }
        var ordered = findings.OrderByDescending(f => Rank(f.Status)).ThenByDescending(f => Math.Abs(f.Difference ?? f.Recomputed ?? 0)).ToList();
        var reactions = result is null ? [] : CompareReactions(s, result, caseId, o);
        var displacements = result is null ? [] : CompareDisplacements(s, result, caseId, o, flags);
        foreach (var q in reactions.Concat(displacements).Where(q => q.Status is EndStatus.Minor or EndStatus.Discrepant))
        {
            bool isReaction = reactions.Contains(q);
            var unit = isReaction ? (q.Component == "M" ? mu : s.Info.Units.Force) : (q.Component == "rotation" ? new UnitChoice("rad", 1) : s.Info.Units.Displacement);
            flags.Add(new Flag(isReaction ? FlagKind.Reaction : FlagKind.Displacement, q.Status == EndStatus.Minor ? Severity.Minor : Severity.Major,
                $"joint {q.Joint} {q.Component}", q.Difference,
                $"The claimed {(isReaction ? "reaction" : "displacement")} {q.Component} at joint {q.Joint} is {Fmt.Number(unit.FromSi(q.Claimed), "0.0###")} {unit.Symbol}; " +
                $"the independent analysis gives {Fmt.Number(unit.FromSi(q.Recomputed), "0.0###")} {unit.Symbol}.",
                [q.Source], isReaction ? (q.Component == "M" ? ValueKind.Moment : ValueKind.Force) : (q.Component == "rotation" ? ValueKind.Rotation : ValueKind.Displacement)));
        }
        return new CaseReview(caseId, peak, agree, minor, ordered, reactions, displacements, flags, []);
    }

    private static int Rank(EndStatus s) => s switch
    {
        EndStatus.Discrepant => 4,
        EndStatus.Unmatched => 3,
        EndStatus.Missing => 2,
        EndStatus.Minor => 1,
        _ => 0,
    };

    private static List<QuantityFinding> CompareReactions(Submission s, CaseResult result, string caseId, ReviewOptions o)
    {
        var list = new List<QuantityFinding>();
        var claims = s.Claims.Reactions.Where(r => r.Case == caseId).ToList();
        if (claims.Count == 0) return list;
        double peakF = result.Reactions.Values.Select(r => Math.Max(Math.Abs(r.Rx), Math.Abs(r.Ry))).DefaultIfEmpty(0).Max();
        double peakM = Math.Max(result.PeakMoment, result.Reactions.Values.Select(r => Math.Abs(r.M)).DefaultIfEmpty(0).Max());
        foreach (var c in claims)
        {
            var rec = result.Reactions.TryGetValue(c.Joint, out var r) ? r : new Reaction(0, 0, 0);
            void Add(string comp, double? claimed, double recomputed, double unit, double peak)
            {
                if (claimed is not double v) return;
                double agree = Math.Max(o.AbsoluteTolerance * unit, o.RelativeTolerance * peak);
                double minor = Math.Max(o.AbsoluteTolerance * unit, o.MinorRelativeTolerance * peak);
                double d = Math.Abs(v - recomputed);
                list.Add(new QuantityFinding(caseId, c.Joint, comp, v, recomputed, d <= agree ? EndStatus.Agree : d <= minor ? EndStatus.Minor : EndStatus.Discrepant, c.Source));
            }
            Add("Rx", c.Rx, rec.Rx, s.Info.Units.Force.ToSi, peakF);
            Add("Ry", c.Ry, rec.Ry, s.Info.Units.Force.ToSi, peakF);
            Add("M", c.M, rec.M, s.Info.Units.Moment.ToSi, peakM);
        }
        return list;
    }

    private static List<QuantityFinding> CompareDisplacements(Submission s, CaseResult result, string caseId, ReviewOptions o, List<Flag> flags)
    {
        var list = new List<QuantityFinding>();
        var claims = s.Claims.Displacements.Where(d => d.Case == caseId).ToList();
        if (claims.Count == 0) return list;
        if (s.Model.RelativeStiffness)
        {
            flags.Add(new Flag(FlagKind.Displacement, Severity.Info, "displacements", null,
                "Displacements are claimed, but the submission gives relative stiffness only (no E), so they cannot be checked.", claims.Select(c => c.Source).ToList()));
            return list;
        }
        double peakU = result.Displacements.Values.Select(d => Math.Max(Math.Abs(d.Ux), Math.Abs(d.Uy))).DefaultIfEmpty(0).Max();
        double peakR = result.Displacements.Values.Select(d => Math.Abs(d.Rotation)).DefaultIfEmpty(0).Max();
        foreach (var c in claims)
        {
            if (!result.Displacements.TryGetValue(c.Joint, out var d)) continue;
            void Add(string comp, double? claimed, double recomputed, double peak, double floor)
            {
                if (claimed is not double v) return;
                double agree = Math.Max(floor, o.RelativeTolerance * peak);
                double minor = Math.Max(floor, o.MinorRelativeTolerance * peak);
                double diff = Math.Abs(v - recomputed);
                list.Add(new QuantityFinding(caseId, c.Joint, comp, v, recomputed, diff <= agree ? EndStatus.Agree : diff <= minor ? EndStatus.Minor : EndStatus.Discrepant, c.Source));
            }
            double uFloor = 0.05 * s.Info.Units.Displacement.ToSi; // half the last digit of a value printed to 0.1
            Add("ux", c.Ux, d.Ux, peakU, uFloor);
            Add("uy", c.Uy, d.Uy, peakU, uFloor);
            Add("rotation", c.Rotation, d.Rotation, peakR, 5e-6);
        }
        return list;
    }

    private static List<ReviewComment> Comments(Submission s, List<CaseReview> cases)
    {
        var comments = new List<ReviewComment>();
        var mu = s.Info.Units.Moment;
        string M(double? v) => v is double x ? Fmt.Number(mu.FromSi(x), "0.0#") : "—";
        foreach (var c in cases)
        {
            foreach (var g in c.EndMoments.Where(e => e.Status is not EndStatus.Agree and not EndStatus.Unmatched).GroupBy(e => e.Member))
            {
                var worst = g.Max(e => Rank(e.Status));
                var sev = worst >= 4 ? Severity.Major : Severity.Minor;
                var parts = g.Select(e => e.Status == EndStatus.Missing
                    ? $"at {e.At} no moment is given, the analysis gives {M(e.Recomputed)}"
                    : $"at {e.At} {M(e.Claimed)} is claimed, the analysis gives {M(e.Recomputed)}");
                comments.Add(new ReviewComment(Id("EM", c.Case, g.Key), sev, c.Case, $"member {g.Key}",
                    $"Member {g.Key}, case {c.Case}: {string.Join("; ", parts)} ({mu.Symbol}, clockwise on the member end). Please check and revise.",
                    SourceRef.Span(g.Select(e => e.Source))));
            }
            foreach (var f in c.Flags.Where(f => f.Severity != Severity.Info))
                comments.Add(new ReviewComment(Id(Prefix(f.Kind), c.Case, f.Where), f.Severity, c.Case, f.Where, f.Message, f.SourceText));
        }
        // Ids must be unique even if two findings share a place.
        var seen = new Dictionary<string, int>();
        return comments.Select(cm =>
        {
            int n = seen.TryGetValue(cm.Id, out var k) ? k + 1 : 1;
            seen[cm.Id] = n;
            return n == 1 ? cm : cm with { Id = $"{cm.Id}-{n}" };
        }).ToList();
    }

    private static string Prefix(FlagKind k) => k switch
    {
        FlagKind.EndMoment => "EX",
        FlagKind.JointEquilibrium => "EQ",
        FlagKind.ReleasedEnd => "RL",
        FlagKind.StoreyShear => "SW",
        FlagKind.Reaction => "RX",
        FlagKind.Displacement => "DX",
        FlagKind.Symmetry => "SY",
        FlagKind.DistributionTable => "MD",
        FlagKind.Conditioning => "ST",
        _ => "CP",
    };

    /// <summary>A stable, readable comment id: kind, case and place, e.g. <c>EQ-DL-C</c>.</summary>
    public static string Id(string prefix, string caseId, string where)
    {
        string place = where.StartsWith("joint ", StringComparison.Ordinal) ? where[6..]
            : where.StartsWith("member ", StringComparison.Ordinal) ? where[7..] : where;
        return $"{prefix}-{Clean(caseId)}-{Clean(place)}";
    }

    private static string Clean(string s)
    {
        var c = NotIdChar().Replace(s.Trim(), "_").Trim('_');
        return c.Length == 0 ? "x" : c.Length > 40 ? c[..40] : c;
    }

    [GeneratedRegex(@"[^A-Za-z0-9+.]+")]
    private static partial Regex NotIdChar();
}
