using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>Tolerances and sign-off details of a review.</summary>
/// <param name="AbsoluteTolerance">Agreement floor in the submission's moment unit (hand moment distribution is usually carried to about 0.1 kN·m).</param>
/// <param name="RelativeTolerance">Agreement band as a fraction of the case's peak moment.</param>
/// <param name="MinorRelativeTolerance">Beyond agreement but within this fraction of the peak: a minor difference.</param>
/// <param name="Reviewer">Name of the checking engineer, for the memo.</param>
/// <param name="Date">Date of the review.</param>
/// <param name="Diagnose">Look for the likely causes of discrepancies.</param>
/// <param name="ShowWorking">Add a reference moment-distribution working table to the memo.</param>
public sealed record ReviewOptions(
    double AbsoluteTolerance = 0.1,
    double RelativeTolerance = 0.01,
    double MinorRelativeTolerance = 0.05,
    string? Reviewer = null,
    DateOnly? Date = null,
    bool Diagnose = true,
    bool ShowWorking = false)
{
    public static ReviewOptions Default { get; } = new();
}

/// <summary>Status of one claimed (or expected) member-end moment.</summary>
public enum EndStatus
{
    Agree,
    Minor,
    Discrepant,
    /// <summary>The recomputed moment is not zero but the author claims nothing for that end.</summary>
    Missing,
    /// <summary>The author claims a moment for an end the model does not have.</summary>
    Unmatched,
}

public enum Severity
{
    Info,
    Minor,
    Major,
}

public enum FlagKind
{
    EndMoment,
    JointEquilibrium,
    ReleasedEnd,
    StoreyShear,
    Reaction,
    Displacement,
    Symmetry,
    Compatibility,
    /// <summary>The author's moment-distribution working table.</summary>
    DistributionTable,
    /// <summary>The model's stiffnesses are so different that the analysis is ill-conditioned (a typing or unit error?).</summary>
    Conditioning,
}

/// <summary>What a flag's value measures, so it can be shown in the submission's units.</summary>
public enum ValueKind
{
    Moment,
    Force,
    Displacement,
    Rotation,
}

public enum Verdict
{
    Concur,
    ConcurWithComments,
    Revise,
}

/// <summary>A claimed member-end moment next to the recomputed one. Moments in N·m, clockwise member-end convention.</summary>
public sealed record EndMomentFinding(
    string Case,
    string Member,
    string At,
    MemberEnd? End,
    double? Claimed,
    double? Recomputed,
    EndStatus Status,
    SourceRef? Source)
{
    public double? Difference => Claimed is double c && Recomputed is double r ? c - r : null;
}

/// <summary>One component of a claimed reaction or displacement next to the recomputed value (SI).</summary>
public sealed record QuantityFinding(string Case, string Joint, string Component, double Claimed, double Recomputed, EndStatus Status, SourceRef Source)
{
    public double Difference => Claimed - Recomputed;
}

/// <summary>
/// A finding of the checks: what kind, how serious, where, the value (N·m for moments, N for forces, rad for
/// rotations), a sentence for the author, and the rows it rests on.
/// </summary>
public sealed record Flag(FlagKind Kind, Severity Severity, string Where, double? Value, string Message, IReadOnlyList<SourceRef> Sources,
    ValueKind Unit = ValueKind.Moment)
{
    public string SourceText => SourceRef.Span(Sources);
}

/// <summary>A likely cause of the discrepancies of a case (filled by the diagnosis stage).</summary>
/// <param name="Code">Contract code such as <c>sway-omitted</c>.</param>
/// <param name="Confidence">0–1: how sure the diagnosis is that this is the mistake.</param>
/// <param name="Explains">0–1: the share of the discrepancy this cause accounts for.</param>
/// <param name="Message">A sentence an author can act on.</param>
/// <param name="Evidence">Supporting detail for the memo.</param>
public sealed record Cause(string Code, double Confidence, double Explains, string Message, string Evidence = "");

/// <summary>The review of one load case.</summary>
public sealed record CaseReview(
    string Case,
    double PeakMoment,
    double AgreeTolerance,
    double MinorTolerance,
    IReadOnlyList<EndMomentFinding> EndMoments,
    IReadOnlyList<QuantityFinding> Reactions,
    IReadOnlyList<QuantityFinding> Displacements,
    IReadOnlyList<Flag> Flags,
    IReadOnlyList<Cause> Causes)
{
    public int Count(EndStatus s) => EndMoments.Count(e => e.Status == s);

    /// <summary>The audit of the author's working table for this case, when one was submitted.</summary>
    public Diagnosis.WorkingAudit? Audit { get; init; }
}

/// <summary>A comment for the schedule: a stable id the designer can answer against.</summary>
public sealed record ReviewComment(string Id, Severity Severity, string Case, string Where, string Text, string Source);

/// <summary>Everything a review found.</summary>
public sealed record ReviewResult(
    Submission Submission,
    ReviewOptions Options,
    Verdict Verdict,
    IReadOnlyList<CaseReview> Cases,
    IReadOnlyList<ReviewComment> Comments,
    IReadOnlyList<string> Notes,
    IReadOnlyList<string> InputWarnings)
{
    /// <summary>
    /// The independent analysis the review rests on (for diagrams and working tables); null when a review is built
    /// without one. Not part of the JSON contract.
    /// </summary>
    public AnalysisResult? Analysis { get; init; }

    /// <summary>CrossCheck's own moment distribution for the memo's appendix, when it was asked for (<see cref="ReviewOptions.ShowWorking"/>).</summary>
    public ReferenceWorking? Working { get; init; }

    public IEnumerable<EndMomentFinding> AllEndMoments => Cases.SelectMany(c => c.EndMoments);
    public IEnumerable<Flag> AllFlags => Cases.SelectMany(c => c.Flags);
}

public static class ReviewWords
{
    public static string Json(this EndStatus s) => s.ToString().ToLowerInvariant();

    public static string Json(this Severity s) => s.ToString().ToLowerInvariant();

    public static string Json(this FlagKind k) => k switch
    {
        FlagKind.EndMoment => "end-moment",
        FlagKind.JointEquilibrium => "joint-equilibrium",
        FlagKind.ReleasedEnd => "released-end",
        FlagKind.StoreyShear => "storey-shear",
        FlagKind.Reaction => "reaction",
        FlagKind.Displacement => "displacement",
        FlagKind.Symmetry => "symmetry",
        FlagKind.DistributionTable => "distribution-table",
        FlagKind.Conditioning => "conditioning",
        _ => "compatibility",
    };

    public static string Json(this Verdict v) => v switch
    {
        Verdict.Concur => "concur",
        Verdict.ConcurWithComments => "concur-with-comments",
        _ => "revise",
    };

    /// <summary>The verdict in words for a memo heading.</summary>
    public static string Words(this Verdict v) => v switch
    {
        Verdict.Concur => "Concur",
        Verdict.ConcurWithComments => "Concur with comments",
        _ => "Revise and resubmit",
    };
}
