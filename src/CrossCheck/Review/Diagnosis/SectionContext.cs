using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>A span-moment, shear or envelope claim as the diagnosis compares it (N·m or N).</summary>
/// <param name="Key">Which claim.</param>
/// <param name="Claimed">The author's figure.</param>
/// <param name="Recomputed">The analysis.</param>
/// <param name="AllLoaded">For an envelope bound: its value with every patterned member loaded.</param>
internal sealed record SectionClaim(SectionKey Key, double Claimed, double Recomputed, double? AllLoaded = null);

/// <summary>
/// A family of mistakes in the claims of one kind other than end moments (span moments, shears, envelopes): each proposes
/// hypotheses whose <see cref="Hypothesis.Predicted"/> follows the order of <see cref="SectionContext.Claims"/>. To add
/// one, add a class and a line in <see cref="SectionDiagnoser"/>.
/// </summary>
internal interface ISectionFamily
{
    IEnumerable<Hypothesis> Propose(SectionContext x);
}

/// <summary>What every family of one case and one kind of claim may use.</summary>
internal sealed class SectionContext : CaseClaimsContext
{
    private readonly Dictionary<string, CaseResult> _alone = new(StringComparer.Ordinal);
    private ClaimStatics? _statics;

    public SectionContext(Submission submission, AnalysisResult analysis, CaseReview review, SectionKind kind, List<SectionClaim> claims, ToleranceBand band)
        : base(submission, analysis, review, claims.Select(c => c.Claimed).ToArray(), claims.Select(c => c.Recomputed).ToArray())
    {
        Kind = kind;
        Claims = claims;
        Band = band;
        Result = analysis.Cases.FirstOrDefault(c => c.Case == review.Case);
        Envelope = analysis.Envelope(review.Case);
        Combination = submission.Combination(review.Case);
    }

    public SectionKind Kind { get; }
    public List<SectionClaim> Claims { get; }
    public ToleranceBand Band { get; }

    /// <summary>The case's result (a load case or a derived combination); null for a patterned combination.</summary>
    public CaseResult? Result { get; }

    /// <summary>The envelope of a patterned combination; null otherwise.</summary>
    public Envelope? Envelope { get; }

    /// <summary>The combination the case stands for; null for a load case.</summary>
    public Combination? Combination { get; }

    /// <summary>
    /// A load case's response to its loads alone, on the structure without support movements (which the combination's own
    /// result holds once): what a factor changes.
    /// </summary>
    public CaseResult LoadsAlone(string caseId)
    {
        if (_alone.TryGetValue(caseId, out var r)) return r;
        var loadCase = S.Case(caseId) ?? throw new ArgumentException($"No load case {caseId}.", nameof(caseId));
        r = new FrameSolver().Solve(CombinationAnalysis.WithoutMovements(Model), [loadCase]).Cases[0];
        _alone[caseId] = r;
        return r;
    }

    /// <summary>The claims of a case whose members are the weighted sum of <paramref name="parts"/> (span moments or shears).</summary>
    public double[] FromParts(IReadOnlyList<(CaseResult Result, double Weight)> parts) => Claims.Select(c =>
    {
        var member = new SuperposedMember(parts.Select(p => (p.Result.Members[c.Key.Member], p.Weight)));
        return c.Key.Kind == SectionKind.Shear ? member.VAtEnd(c.Key.End!.Value) : member.SpanMaximum.Moment;
    }).ToArray();

    /// <summary>The envelope claims an envelope gives (in the submission's convention at ends, sagging positive in spans).</summary>
    public double[] FromEnvelope(Envelope envelope) => Claims.Select(c =>
    {
        if (c.Key.End is not MemberEnd end) return envelope.SpanMaximum(c.Key.Member).Value;
        var (max, min) = envelope.Extremes(r => S.Info.SignConvention.FromClockwise(r.Members[c.Key.Member].MomentAtEnd(end), end));
        return c.Key.Bound == "max" ? max.Value : min.Value;
    }).ToArray();

    /// <summary>The member's loads in this case resolved into local actions (for statics of the member alone).</summary>
    internal LocalAction[] Actions(string caseId, Member m) => Statics.Actions(caseId, m.Id);

    private ClaimStatics Statics => _statics ??= new ClaimStatics(S);

    /// <summary>The member with both end moments zero under <paramref name="actions"/>: the simply supported (free) member.</summary>
    internal MemberResult Free(Member m, LocalAction[] actions)
    {
        var (cos, sin, length) = Statics.Geometry(m);
        return MemberStatics.FromEndMoments(m, length, cos, sin, 0, 0, actions);
    }

    /// <summary>"members AB, BC" for the members of the claims a hypothesis changes.</summary>
    public string Members(IEnumerable<int> indices) =>
        string.Join(", ", indices.Select(i => Claims[i].Key.Member).Distinct());
}
