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

/// <summary>Everything the author claims.</summary>
public sealed record Claims(
    IReadOnlyList<ClaimedEndMoment> EndMoments,
    IReadOnlyList<ClaimedReaction> Reactions,
    IReadOnlyList<ClaimedDisplacement> Displacements)
{
    public static Claims None { get; } = new([], [], []);
}
