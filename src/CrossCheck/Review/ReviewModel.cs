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

    /// <summary>How the diagnosis searches: where the evidence is (the default), or every hypothesis (to check the first against).</summary>
    public DiagnosisSearch Search { get; init; } = DiagnosisSearch.Focused;
}

/// <summary>How far the diagnosis searches (see <c>Review.Diagnosis.Evidence</c>).</summary>
public enum DiagnosisSearch
{
    /// <summary>The hypotheses the differences can support: candidates ranked by the differences of the claims they touch, within stated bounds.</summary>
    Focused,

    /// <summary>Every hypothesis of every family, formed and scored.</summary>
    Exhaustive,
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
    /// <summary>A combination's claims are not the factored sum of the same submission's case claims.</summary>
    Superposition,
    /// <summary>A claimed span moment does not follow by statics from the claimed end moments and the member's loads.</summary>
    SpanStatics,
    /// <summary>A claimed end shear does not follow by statics from the claimed end moments and the member's loads.</summary>
    ShearStatics,
    /// <summary>An envelope claim short of an arrangement's value (the author's own figures, or the exact envelope).</summary>
    Envelope,
    /// <summary>The elastic critical load factor is below 10: first-order results need second-order treatment.</summary>
    SecondOrder,
    /// <summary>A note on a claimed span moment against the analysis (where the maximum is).</summary>
    SpanMoment,
}

/// <summary>What a flag's value measures, so it can be shown in the submission's units.</summary>
public enum ValueKind
{
    Moment,
    Force,
    Displacement,
    Rotation,
    /// <summary>A plain number (the elastic critical load factor).</summary>
    Factor,
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

    /// <summary>The claim as read (the figure as written, its source); null for a missing end.</summary>
    public ClaimedEndMoment? Claim { get; init; }

    /// <summary>Where the end is.</summary>
    public MemberEndPlace Place => new(Member, At, End);

    /// <summary>The end as the review keys it, when the model has it.</summary>
    public EndKey? Key => End is MemberEnd e ? new EndKey(Member, e) : null;
}

/// <summary>One component of a claimed reaction or displacement next to the recomputed value (SI).</summary>
public sealed record QuantityFinding(string Case, string Joint, string Component, double Claimed, double Recomputed, EndStatus Status, SourceRef Source)
{
    public double Difference => Claimed - Recomputed;

    public ComponentPlace Place => new(Joint, Component);
}

/// <summary>A member end as the review keys it: member id and which end.</summary>
public readonly record struct EndKey(string Member, MemberEnd End);

/// <summary>
/// A finding of the checks: what kind, how serious, where, the value (N·m for moments, N for forces, rad for
/// rotations), a sentence for the author, the rows it rests on and the claimed member ends it was computed from (so
/// that a diagnosed mistake or a single wrong figure can be seen to explain it).
/// </summary>
public sealed record Flag(FlagKind Kind, Severity Severity, Place Place, double? Value, string Message, IReadOnlyList<SourceRef> Sources,
    ValueKind Unit = ValueKind.Moment)
{
    /// <summary>The claimed member ends the check used; empty for checks of other claims (reactions, the working table).</summary>
    public IReadOnlyList<EndKey> Ends { get; init; } = [];

    /// <summary>The span-moment, shear or envelope claims the finding rests on.</summary>
    public IReadOnlyList<SectionKey> Sections { get; init; } = [];

    /// <summary>The finding in a few words for a list of symptoms under a comment ("joint C out of balance by 27.0 kN·m").</summary>
    public string Brief { get; init; } = "";

    /// <summary>The place in words: "joint C".</summary>
    public string Where => Place.Words;

    public string SourceText => SourceRef.Span(Sources);
}

/// <summary>The mistakes the diagnosis tests (docs/REVIEW-JSON.md, "causes"); words in <see cref="ReviewTerms"/>.</summary>
public enum CauseCode
{
    SwayOmitted,
    StiffnessWithoutLength,
    FarEndFixity,
    FixedEndMoment,
    CarryOver,
    StoppedEarly,
    SignConvention,
    EndsSwapped,
    UnitScale,
    LoadMisplaced,
    HingeIgnored,
    SettlementIgnored,
    DistributionArithmetic,
    CopyingSlip,
    CombinationFactor,
    CombinationCaseMissing,
    PatternIgnored,
    MidspanNotMaximum,
    FreeMoment,
    ShearWithoutMoment,
}

/// <summary>A likely cause of the discrepancies of a case (filled by the diagnosis stage).</summary>
/// <param name="Kind">Which mistake.</param>
/// <param name="Confidence">0–1: how sure the diagnosis is that this is the mistake.</param>
/// <param name="Explains">0–1: the share of the discrepancy this cause accounts for.</param>
/// <param name="Message">A sentence an author can act on, quoting the author's figures as written.</param>
/// <param name="Evidence">Supporting detail for the memo.</param>
public sealed record Cause(CauseCode Kind, double Confidence, double Explains, string Message, string Evidence = "")
{
    /// <summary>The contract code: <c>sway-omitted</c>.</summary>
    public string Code => Kind.Json();

    /// <summary>
    /// What identifies this one mistake, so that the same mistake found in several cases is one comment
    /// (<c>fixed-end-moment|BC|point-central</c>); the code alone when the mistake has no particulars.
    /// </summary>
    public string Identity { get; init; } = "";

    /// <summary>What the correct working gives, in the trade's words ("with Pab²/L² the fixed-end moments of BC are ...").</summary>
    public string CorrectWorking { get; init; } = "";

    /// <summary>Where the mistake is, when it is at one member or joint (for the comment id).</summary>
    public Place? Place { get; init; }

    /// <summary>True when redoing the analysis with this mistake reproduces every compared claim within the agreement band.</summary>
    public bool Reproduces { get; init; }

    /// <summary>The claimed ends this cause accounts for (within the agreement band of its prediction).</summary>
    public IReadOnlyList<EndKey> Explained { get; init; } = [];

    /// <summary>Which claims the cause was found from: <c>end-moments</c>, <c>span-moments</c>, <c>shears</c> or <c>envelope</c>.</summary>
    public string Claims { get; init; } = "end-moments";

    /// <summary>The span-moment, shear or envelope claims this cause accounts for.</summary>
    public IReadOnlyList<SectionKey> ExplainedSections { get; init; } = [];
}

/// <summary>The review of one load case.</summary>
public sealed record CaseReview(
    string Case,
    double PeakMoment,
    ToleranceBand Band,
    IReadOnlyList<EndMomentFinding> EndMoments,
    IReadOnlyList<QuantityFinding> Reactions,
    IReadOnlyList<QuantityFinding> Displacements,
    IReadOnlyList<Flag> Flags,
    IReadOnlyList<Cause> Causes)
{
    public int Count(EndStatus s) => EndMoments.Count(e => e.Status == s);

    /// <summary>Largest difference that agrees (N·m).</summary>
    public double AgreeTolerance => Band.Agree;

    /// <summary>Largest difference that is minor (N·m).</summary>
    public double MinorTolerance => Band.Minor;

    /// <summary>The audit of the author's working table for this case, when one was submitted.</summary>
    public Diagnosis.WorkingAudit? Audit { get; init; }

    /// <summary>The combination this entry stands for; null for a load case.</summary>
    public Combination? Combination { get; init; }

    /// <summary>Claimed span moments next to the recomputed ones.</summary>
    public IReadOnlyList<SpanMomentFinding> SpanMoments { get; init; } = [];

    /// <summary>Claimed end shears next to the recomputed ones.</summary>
    public IReadOnlyList<ShearFinding> Shears { get; init; } = [];

    /// <summary>Claimed envelope bounds next to the exact envelope (combinations with a patterned case).</summary>
    public IReadOnlyList<EnvelopeFinding> Envelope { get; init; } = [];

    /// <summary>The bands of the shears (N): the reviewer's tolerances on the case's largest end shear.</summary>
    public ToleranceBand ShearBand { get; init; }

    /// <summary>Likely causes of differing span-moment, shear and envelope claims, best first per kind of claim.</summary>
    public IReadOnlyList<Cause> SectionCauses { get; init; } = [];

    /// <summary>The elastic critical load factor under this case's first-order axial forces; null when none was computed.</summary>
    public double? AlphaCr { get; init; }

    /// <summary>Every cause of the case: those of the end moments, then those of the other claims.</summary>
    public IEnumerable<Cause> AllCauses => Causes.Concat(SectionCauses);
}

/// <summary>One finding listed under a comment: what it is, where, and the sentence and sources behind it.</summary>
/// <param name="Kind">Contract word: <c>end-moment</c> for a compared end, else the flag kind (<c>joint-equilibrium</c>, ...).</param>
/// <param name="Case">Load case.</param>
/// <param name="Severity">Its own severity.</param>
/// <param name="Place">Where it is.</param>
/// <param name="Text">What it is, quoting the author's figures as written.</param>
/// <param name="Source">The rows it rests on (compact form).</param>
public sealed record Symptom(string Kind, string Case, Severity Severity, Place Place, string Text, string Source);

/// <summary>
/// A comment for the schedule: one per mistake. A diagnosed mistake's comment holds every finding it explains; without a
/// diagnosis, the findings that one wrong figure explains are one comment about that figure.
/// </summary>
/// <param name="Id">Stable id the designer answers against (<c>EQ-DL-C</c>, <c>FEM-LL-BC</c>).</param>
/// <param name="Severity">The worst of its symptoms.</param>
/// <param name="Case">The load case (cases joined by ", " when one mistake is in several).</param>
/// <param name="Where">The place in words.</param>
/// <param name="Text">The comment, quoting the author's figures as written.</param>
/// <param name="Source">The rows it rests on (compact form).</param>
public sealed record ReviewComment(string Id, Severity Severity, string Case, string Where, string Text, string Source)
{
    /// <summary>The findings this comment stands for, each with its own place and source.</summary>
    public IReadOnlyList<Symptom> Symptoms { get; init; } = [];

    /// <summary>The diagnosed mistake the comment is about, if any.</summary>
    public CauseCode? Cause { get; init; }

    /// <summary>The load cases the comment concerns.</summary>
    public IReadOnlyList<string> Cases { get; init; } = [];
}

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

    /// <summary>What the diagnosis did (for measurements; not serialised).</summary>
    internal DiagnosisWork DiagnosisWork { get; init; } = new(0, 0, 0);

    public IEnumerable<EndMomentFinding> AllEndMoments => Cases.SelectMany(c => c.EndMoments);
    public IEnumerable<Flag> AllFlags => Cases.SelectMany(c => c.Flags);
}

/// <summary>What a review's diagnosis did: hypotheses scored against the claims, linear solves and factorisations (new assemblies included).</summary>
internal sealed record DiagnosisWork(int Tried, int Solves, int Factorisations);
