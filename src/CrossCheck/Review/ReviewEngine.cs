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
        analysis = CombinationAnalysis.Extend(analysis, submission.Cases, submission.Combinations);
        // A combination without a patterned case is a load case to the checks and the diagnosis: its factored loads under its name.
        var s = submission.Combinations.Count == 0 ? submission : submission with { Cases = submission.CasesWithCombinations() };
        var checks = new ClaimChecks(s, options);
        var conditioning = ConditioningFlag(submission, analysis);
        // One diagnoser for the whole review: the cases share its factorisation of the structure.
        var diagnoser = new Diagnosis.Diagnoser(s, analysis, options);
        var cases = new List<CaseReview>();
        var ids = CaseIds(s, analysis);
        var alphas = CriticalLoadFactors(s, analysis, ids, cancel);
        foreach (var id in ids)
        {
            cancel.ThrowIfCancellationRequested();
            var review = Compare(s, analysis, id, options);
            review = review with { Flags = [.. review.Flags, .. Confirmed(checks.Run(id, cancel), review)] };
            foreach (var table in submission.WorkingTables.Where(t => t.Case == id))
            {
                var audit = Diagnosis.WorkingTableAudit.Audit(submission, table, options.AbsoluteTolerance * submission.Info.Units.Moment.ToSi);
                review = review with { Audit = audit, Flags = [.. review.Flags, Diagnosis.WorkingTableAudit.ToFlag(audit, submission, review.AgreeTolerance)] };
            }
            var result = analysis.Cases.FirstOrDefault(c => c.Case == id);
            if (options.Diagnose && result is not null && review.EndMoments.Any(e => e.Status is EndStatus.Discrepant or EndStatus.Minor))
                review = review with { Causes = diagnoser.Diagnose(review, cancel) };
            cancel.ThrowIfCancellationRequested();
            if (options.Diagnose && Diagnosis.SectionDiagnoser.HasDifferences(review))
                review = review with { SectionCauses = new Diagnosis.SectionDiagnoser(s, analysis, options).Diagnose(review) };
            cancel.ThrowIfCancellationRequested();
            if (alphas.TryGetValue(id, out var alpha)) review = WithSwaySensitivity(review, alpha);
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

    /// <summary>The cases reviewed, in order: the load cases, the combinations as declared, then any case only the claims name.</summary>
    private static List<string> CaseIds(Submission s, AnalysisResult analysis)
    {
        var ids = s.Cases.Select(c => c.Id).Where(id => s.Combination(id) is null).ToList();
        ids.AddRange(s.Combinations.Select(c => c.Name));
        foreach (var id in analysis.Cases.Select(c => c.Case)
                     .Concat(s.Claims.EndMoments.Select(c => c.Case)).Concat(s.Claims.SpanMoments.Select(c => c.Case)).Concat(s.Claims.Shears.Select(c => c.Case)))
            if (!ids.Contains(id)) ids.Add(id);
        return ids;
    }

    /// <summary>A case's claims against the analysis: end moments, reactions, displacements, span moments and shears; or a patterned combination's envelope.</summary>
    private static CaseReview Compare(Submission s, AnalysisResult analysis, string id, ReviewOptions options)
    {
        if (analysis.Envelope(id) is { } envelope) return EnvelopeComparison.Review(s, envelope, envelope.Combination, options);
        var result = analysis.Cases.FirstOrDefault(c => c.Case == id);
        var review = Comparison.Compare(s, result, id, options);
        return SectionComparison.Add(s, result, review, options) with { Combination = s.Combination(id) };
    }

    /// <summary>
    /// The elastic critical load factor of every case and combination with vertical load, computed side by side (each is
    /// an eigenproblem of its own, the costliest part of a large frame's review).
    /// </summary>
    private static Dictionary<string, double?> CriticalLoadFactors(Submission s, AnalysisResult analysis, List<string> ids, CancellationToken cancel) =>
        ids.Where(id => SwaySensitivity.HasVerticalLoad(s, id)).ToList().AsParallel().AsOrdered().WithCancellation(cancel)
            .Select(id => (Id: id, Alpha: analysis.Cases.FirstOrDefault(c => c.Case == id) is { } result ? SwaySensitivity.Of(s.Model, result)
                : analysis.Envelope(id) is { } envelope ? SwaySensitivity.Of(s.Model, envelope) : null))
            .ToDictionary(x => x.Id, x => x.Alpha, StringComparer.Ordinal);

    /// <summary>The case with its critical load factor and, below 10, its <c>second-order</c> flag.</summary>
    private static CaseReview WithSwaySensitivity(CaseReview review, double? alpha) =>
        SwaySensitivity.Flag(review.Case, alpha) is { } flag
            ? review with { AlphaCr = alpha, Flags = [.. review.Flags, flag] }
            : review with { AlphaCr = alpha };

    /// <summary>
    /// A check that rests only on claims the independent analysis confirms (every one agrees) has felt the spread of an
    /// error elsewhere, not an error of its own: it is kept for the record as info and raises no comment.
    /// </summary>
    private static IEnumerable<Flag> Confirmed(IEnumerable<Flag> flags, CaseReview compared)
    {
        var agreeing = compared.EndMoments.Where(e => e.Status == EndStatus.Agree && e.Key is not null).Select(e => e.Key!.Value).ToHashSet();
        var sections = AgreeingSections(compared);
        return flags.Select(f => f.Severity != Severity.Info && f.Ends.Count + f.Sections.Count > 0 && f.Ends.All(agreeing.Contains) && f.Sections.All(sections.Contains)
            ? f with { Severity = Severity.Info } : f);
    }

    /// <summary>The span-moment, shear and envelope claims of a case that the analysis confirms.</summary>
    internal static HashSet<SectionKey> AgreeingSections(CaseReview c) =>
        c.SpanMoments.Where(x => x.Status == EndStatus.Agree).Select(x => x.Key)
            .Concat(c.Shears.Where(x => x.Status == EndStatus.Agree).Select(x => x.Key))
            .Concat(c.Envelope.Where(x => x.Status == EndStatus.Agree || x.Side == EnvelopeSide.Safe).Select(x => x.Key)).ToHashSet();

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
    /// The verdict rule (docs/REVIEW-JSON.md, "verdict"): <c>revise</c> when any claim is discrepant (an envelope claim only
    /// on the unsafe side) or any flag is major; <c>concur</c> when every claim agrees (an envelope claim may lie on the safe
    /// side) and no flag is above info; otherwise <c>concur-with-comments</c>.
    /// </summary>
    public static Verdict VerdictOf(IEnumerable<CaseReview> cases)
    {
        var list = cases.ToList();
        if (list.Any(c => c.EndMoments.Any(e => e.Status == EndStatus.Discrepant) || c.Flags.Any(f => f.Severity == Severity.Major)
                          || c.Reactions.Concat(c.Displacements).Any(q => q.Status == EndStatus.Discrepant)
                          || c.SpanMoments.Any(x => x.Status == EndStatus.Discrepant) || c.Shears.Any(x => x.Status == EndStatus.Discrepant)
                          || c.Envelope.Any(x => x.Status == EndStatus.Discrepant && x.Side == EnvelopeSide.Unsafe)))
            return Verdict.Revise;
        if (list.All(c => c.EndMoments.All(e => e.Status == EndStatus.Agree) && c.Flags.All(f => f.Severity == Severity.Info)
                          && c.Reactions.Concat(c.Displacements).All(q => q.Status == EndStatus.Agree)
                          && c.SpanMoments.All(x => x.Status == EndStatus.Agree) && c.Shears.All(x => x.Status == EndStatus.Agree)
                          && c.Envelope.All(x => x.Status == EndStatus.Agree || x.Side == EnvelopeSide.Safe)))
            return Verdict.Concur;
        return Verdict.ConcurWithComments;
    }

    /// <summary>A stable, readable comment id: kind, case and place, e.g. <c>EQ-DL-C</c>.</summary>
    public static string Id(string prefix, string caseId, Place? place) => Place.CommentId(prefix, caseId, place);
}
