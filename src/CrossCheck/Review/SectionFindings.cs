using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>Which table a claim other than an end moment, reaction or displacement comes from.</summary>
public enum SectionKind
{
    /// <summary>A largest span moment (<c>span-moments</c>).</summary>
    SpanMoment,
    /// <summary>A member-end shear (<c>shears</c>).</summary>
    Shear,
    /// <summary>One bound of an envelope row (<c>envelopes</c>).</summary>
    Envelope,
}

/// <summary>
/// A claim of the span-moments, shears or envelopes table as the review keys it: which table, the member, the end
/// (null for a span moment or an envelope's span row) and, for an envelope, the bound (<c>max</c> or <c>min</c>).
/// </summary>
public readonly record struct SectionKey(SectionKind Kind, string Member, MemberEnd? End, string Bound = "");

/// <summary>Which side of the true envelope a differing envelope claim lies on.</summary>
public enum EnvelopeSide
{
    /// <summary>A maximum below the true maximum, or a minimum above the true minimum: the design would miss part of the effect.</summary>
    Unsafe,
    /// <summary>Beyond the true extreme: conservative, noted only.</summary>
    Safe,
}

/// <summary>
/// A claimed largest span moment next to the recomputed one (N·m, sagging positive), with where each puts it (m from the
/// member's start).
/// </summary>
public sealed record SpanMomentFinding(string Case, string Member, double Claimed, double? Recomputed, double? ClaimedX, double? RecomputedX,
    EndStatus Status, ClaimedSpanMoment Claim)
{
    public double? Difference => Recomputed is double r ? Claimed - r : null;

    public SectionKey Key => new(SectionKind.SpanMoment, Member, null);

    public Place Place => new MemberPlace(Member);

    /// <summary>
    /// When the claimed location misses the maximum by more than max(0.05 L, 0.1 m): where the maximum is (m); null otherwise.
    /// The location is never graded.
    /// </summary>
    public double? LocationNote { get; init; }
}

/// <summary>A claimed end shear next to the recomputed one (N, beam convention).</summary>
public sealed record ShearFinding(string Case, string Member, string At, MemberEnd? End, double Claimed, double? Recomputed, EndStatus Status, ClaimedShear Claim)
{
    public double? Difference => Recomputed is double r ? Claimed - r : null;

    public SectionKey Key => new(SectionKind.Shear, Member, End);

    public MemberEndPlace Place => new(Member, At, End);
}

/// <summary>
/// One bound of a claimed envelope row next to the exact envelope: in the submission's sign convention at an end, sagging
/// positive for a span row (N·m). <see cref="Governing"/> names the arrangement that gives the true extreme.
/// </summary>
/// <param name="Combination">The combination (one with a patterned case).</param>
/// <param name="Member">Member id as claimed.</param>
/// <param name="At">As written: a joint id, <c>start</c>, <c>end</c> or <c>span</c>.</param>
/// <param name="End">The resolved end; null for a span row or an end the model does not have.</param>
/// <param name="IsSpan">The largest span moment.</param>
/// <param name="Bound"><c>max</c> or <c>min</c>.</param>
/// <param name="Claimed">The author's figure (N·m).</param>
/// <param name="Recomputed">The true extreme (N·m); null when the claim cannot be matched.</param>
/// <param name="Status">Against the envelope's bands.</param>
/// <param name="Side">Which side of the true extreme a differing claim lies on; null when it agrees or cannot be matched.</param>
/// <param name="Governing">The patterned members loaded in the arrangement that gives the true extreme, in member order.</param>
/// <param name="AllLoaded">The value of the same bound with every patterned member loaded (N·m); null when the claim cannot be matched.</param>
/// <param name="Source">The claim's cell.</param>
/// <param name="AsWritten">The figure as printed.</param>
public sealed record EnvelopeFinding(string Combination, string Member, string At, MemberEnd? End, bool IsSpan, string Bound, double Claimed,
    double? Recomputed, EndStatus Status, EnvelopeSide? Side, IReadOnlyList<string> Governing, double? AllLoaded, SourceRef Source, string AsWritten)
{
    public double? Difference => Recomputed is double r ? Claimed - r : null;

    public SectionKey Key => new(SectionKind.Envelope, Member, End, Bound);

    public Place Place => IsSpan ? new MemberPlace(Member) : new MemberEndPlace(Member, At, End);

    /// <summary>Where the span maximum of the governing arrangement is (m from the start); null for an end.</summary>
    public double? X { get; init; }

    /// <summary>The governing arrangement in words: "AB and CD loaded", "every patterned member loaded".</summary>
    public string Arrangement { get; init; } = "";
}
