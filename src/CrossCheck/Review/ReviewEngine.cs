using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review.Checks;

namespace CrossCheck.Review;

/// <summary>
/// Reviews a submission: compares every claim with the independent analysis, runs the checks of the claimed
/// numbers on their own, diagnoses the differences, gives the verdict and builds the schedule of comments.
/// </summary>
public static class ReviewEngine
{
    /// <param name="submission">The submission as imported.</param>
    /// <param name="analysis">The independent analysis of the same submission.</param>
    /// <param name="options">Tolerances and sign-off details.</param>
    /// <param name="inputWarnings">Warnings from the import, repeated in the memo.</param>
    /// <param name="cancel">Stops the review (checked between cases, checks and hypotheses): a time budget, or the user.</param>
    /// <exception cref="OperationCanceledException"><paramref name="cancel"/> was cancelled.</exception>
    public static ReviewResult Review(Submission submission, AnalysisResult analysis, ReviewOptions? options = null, IEnumerable<string>? inputWarnings = null,
        CancellationToken cancel = default)
    {
        ArgumentNullException.ThrowIfNull(submission);
        ArgumentNullException.ThrowIfNull(analysis);
        options ??= ReviewOptions.Default;
        var checks = new ClaimChecks(submission, options);
        var conditioning = ConditioningFlag(submission, analysis);
        // One diagnoser for the whole review: the cases share its factorisation of the structure.
        var diagnoser = new Diagnosis.Diagnoser(submission, analysis, options);
        var cases = new List<CaseReview>();
        var caseIds = analysis.Cases.Select(c => c.Case).ToList();
        foreach (var id in submission.Claims.EndMoments.Select(c => c.Case).Distinct())
            if (!caseIds.Contains(id)) caseIds.Add(id);
        foreach (var id in caseIds)
        {
            cancel.ThrowIfCancellationRequested();
            var result = analysis.Cases.FirstOrDefault(c => c.Case == id);
            var review = Comparison.Compare(submission, result, id, options);
            review = review with { Flags = [.. review.Flags, .. Confirmed(checks.Run(id, cancel), review)] };
            foreach (var table in submission.WorkingTables.Where(t => t.Case == id))
            {
                var audit = Diagnosis.WorkingTableAudit.Audit(submission, table, options.AbsoluteTolerance * submission.Info.Units.Moment.ToSi);
                review = review with { Audit = audit, Flags = [.. review.Flags, Diagnosis.WorkingTableAudit.ToFlag(audit, submission, review.AgreeTolerance)] };
            }
            if (options.Diagnose && result is not null && review.EndMoments.Any(e => e.Status is EndStatus.Discrepant or EndStatus.Minor))
                review = review with { Causes = diagnoser.Diagnose(review, cancel) };
            if (conditioning is not null && result is not null)
            {
                review = review with { Flags = [.. review.Flags, conditioning] };
                conditioning = null;
            }
            cases.Add(review with { Flags = [.. review.Flags.OrderByDescending(f => f.Severity)] });
        }
        var verdict = VerdictOf(cases);
        var comments = CommentSchedule.Build(submission, cases);
        return new ReviewResult(submission, options, verdict, cases, comments, analysis.Notes, inputWarnings?.ToList() ?? [])
        {
            Analysis = analysis,
            DiagnosisWork = new DiagnosisWork(diagnoser.Tried, diagnoser.Work.Solves, diagnoser.Work.Factorisations),
        };
    }

    /// <summary>
    /// A check that rests only on claims the independent analysis confirms (every one agrees) has felt the spread of an
    /// error elsewhere, not an error of its own: it is kept for the record as info and raises no comment.
    /// </summary>
    private static IEnumerable<Flag> Confirmed(IEnumerable<Flag> flags, CaseReview compared)
    {
        var agreeing = compared.EndMoments.Where(e => e.Status == EndStatus.Agree && e.Key is not null).Select(e => e.Key!.Value).ToHashSet();
        return flags.Select(f => f.Severity != Severity.Info && f.Ends.Count > 0 && f.Ends.All(agreeing.Contains) ? f with { Severity = Severity.Info } : f);
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
        Place where = new ModelPlace("stiffness matrix");
        if (n.Contrast is { } k && k.Ratio >= NumericalLimits.StiffnessContrast)
        {
            where = new ModelPlace("stiffness matrix", k.Stiffer);
            foreach (var id in new[] { k.Stiffer, k.Softer })
                if (s.Model.TryGetMember(id, out var m)) sources.Add(m.Source);
        }
        string message = ReviewMessages.Conditioning(n.Describe(), s.Cases.Count > 1);
        return new Flag(FlagKind.Conditioning, Severity.Minor, where, null, message, sources) { Brief = message };
    }

    /// <summary>
    /// The verdict rule (docs/REVIEW-JSON.md, "verdict"): <c>revise</c> when any claim is discrepant or any flag is
    /// major; <c>concur</c> when every claim agrees and no flag is above info; otherwise <c>concur-with-comments</c>.
    /// </summary>
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

    /// <summary>A stable, readable comment id: kind, case and place, e.g. <c>EQ-DL-C</c>.</summary>
    public static string Id(string prefix, string caseId, Place? place) => Place.CommentId(prefix, caseId, place);
}
