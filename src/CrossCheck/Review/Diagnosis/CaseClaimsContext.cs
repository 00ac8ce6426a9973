using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// What the diagnosis of one case shares whatever kind of claim it explains (<see cref="DiagnosisContext"/> for end moments,
/// <see cref="SectionContext"/> for span moments, shears and envelopes): the submission, the analysis, the case's review, the
/// claims compared as two parallel arrays, and the quoting in the author's units.
/// </summary>
internal abstract class CaseClaimsContext(Submission submission, AnalysisResult analysis, CaseReview review, double[] claimed, double[] recomputed)
{
    public Submission S { get; } = submission;
    public StructureModel Model => S.Model;
    public AnalysisResult Analysis { get; } = analysis;
    public CaseReview Review { get; } = review;

    /// <summary>The author's figures of the compared claims, in order.</summary>
    public double[] Claimed { get; } = claimed;

    /// <summary>The analysis of the same claims, in the same order.</summary>
    public double[] Recomputed { get; } = recomputed;

    public Quoting Quote { get; } = new Quoting(submission);
}
