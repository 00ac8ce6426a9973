namespace CrossCheck.Model;

/// <summary>
/// A member-end moment the author claims. <see cref="Moment"/> is in N·m in the internal clockwise
/// member-end convention, whatever convention the submission used; <see cref="AsWritten"/> keeps the
/// number as printed (in the submission's unit and convention).
/// </summary>
/// <param name="Case">Load case id.</param>
/// <param name="Member">Member id as written (may name a member the model does not have).</param>
/// <param name="At">The end as written: a joint id, or <c>start</c>/<c>end</c>.</param>
/// <param name="End">The resolved end, or null when the model has no such end (an unmatched claim).</param>
/// <param name="Moment">Clockwise member-end moment in N·m.</param>
/// <param name="AsWritten">The value as written, in the submission's moment unit and sign convention.</param>
/// <param name="Source">Where the claim was read.</param>
public sealed record ClaimedEndMoment(string Case, string Member, string At, MemberEnd? End, double Moment, double AsWritten, SourceRef Source);

/// <summary>Claimed support reactions (N, N·m; Rx right, Ry up, M clockwise positive). Null components were not given.</summary>
public sealed record ClaimedReaction(string Case, string Joint, double? Rx, double? Ry, double? M, SourceRef Source);

/// <summary>Claimed joint displacements (m, rad; ux right, uy up, rotation clockwise positive).</summary>
public sealed record ClaimedDisplacement(string Case, string Joint, double? Ux, double? Uy, double? Rotation, SourceRef Source);

/// <summary>
/// A claimed largest span moment (the <c>span-moments</c> table): the largest internal bending moment of the member, ends
/// included, sagging positive (tension on the underside, or on the right looking from start to end) whatever the
/// submission's end-moment convention; for a member that never sags, its least hogging moment.
/// </summary>
/// <param name="Case">Load case or derived combination.</param>
/// <param name="Member">Member id as written.</param>
/// <param name="Moment">The claimed moment in N·m, sagging positive.</param>
/// <param name="AsWritten">The value in the submission's moment unit.</param>
/// <param name="X">Where the author puts it, metres from the member's start; null when not given.</param>
/// <param name="Source">The claim's cell.</param>
public sealed record ClaimedSpanMoment(string Case, string Member, double Moment, double AsWritten, double? X, SourceRef Source);

/// <summary>
/// A claimed member-end shear (the <c>shears</c> table), beam convention: V = dM/dx along the member from start to end (a
/// simply supported span under a downward load has +wL/2 at its start and −wL/2 at its end). N.
/// </summary>
/// <param name="End">The resolved end, or null when the model has no such end (an unmatched claim).</param>
public sealed record ClaimedShear(string Case, string Member, string At, MemberEnd? End, double V, double AsWritten, SourceRef Source);

/// <summary>
/// A claimed envelope row (the <c>envelopes</c> table) of a combination with a patterned case: the largest and least
/// end moment at a member end, in the submission's own sign convention, or the largest span moment (sagging positive).
/// </summary>
/// <param name="Combination">The combination (one with a patterned case).</param>
/// <param name="Member">Member id as written.</param>
/// <param name="At">As written: a joint id, <c>start</c>, <c>end</c> or <c>span</c>.</param>
/// <param name="End">The resolved end; null for a span row or an end the model does not have.</param>
/// <param name="IsSpan">True for the largest span moment (<c>at</c> = <c>span</c>).</param>
/// <param name="Max">The claimed maximum in N·m (submission's convention at an end, sagging positive in the span); null when not given.</param>
/// <param name="Min">The claimed minimum in N·m; null when not given (always null for a span row).</param>
/// <param name="Source">The claim's row.</param>
public sealed record ClaimedEnvelope(string Combination, string Member, string At, MemberEnd? End, bool IsSpan, double? Max, double? Min, SourceRef Source)
{
    /// <summary>The <c>max</c> cell as read (its text is the figure as written).</summary>
    public SourceRef? MaxSource { get; init; }

    /// <summary>The <c>min</c> cell as read.</summary>
    public SourceRef? MinSource { get; init; }

    /// <summary>The claimed maximum in the submission's moment unit.</summary>
    public double? MaxAsWritten { get; init; }

    /// <summary>The claimed minimum in the submission's moment unit.</summary>
    public double? MinAsWritten { get; init; }
}

/// <summary>Everything the author claims.</summary>
public sealed record Claims(
    IReadOnlyList<ClaimedEndMoment> EndMoments,
    IReadOnlyList<ClaimedReaction> Reactions,
    IReadOnlyList<ClaimedDisplacement> Displacements)
{
    public static Claims None { get; } = new([], [], []);

    /// <summary>Claimed largest span moments.</summary>
    public IReadOnlyList<ClaimedSpanMoment> SpanMoments { get; init; } = [];

    /// <summary>Claimed member-end shears.</summary>
    public IReadOnlyList<ClaimedShear> Shears { get; init; } = [];

    /// <summary>Claimed envelope rows of combinations with a patterned case.</summary>
    public IReadOnlyList<ClaimedEnvelope> Envelopes { get; init; } = [];
}
