using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Every sentence the review writes for the author, in one place (as <c>Import/Messages</c> does for input errors).
/// Figures arrive already quoted (<see cref="Quoting"/>): the author's as written, CrossCheck's in the author's units and
/// convention. A check states what it found, not why: an explanation ("sidesway ignored") belongs to a cause, and is
/// written only when the diagnosis shows that cause fits.
/// </summary>
internal static partial class ReviewMessages
{
    // ---- comparison ---------------------------------------------------------------------------------

    public static string ClaimForCaseWithoutLoads(string caseId) => $"A moment is claimed for case {caseId}, which has no loads in the submission.";

    public static string NoSuchEnd(string member, string at, string start, string end) =>
        $"Member {member} has no end at '{at}': the claim cannot be matched (its ends are {start} and {end}).";

    public static string NoSuchMember(string member) => $"The submission's model has no member '{member}': the claim cannot be matched.";

    public static string QuantityDiffers(bool reaction, string component, string joint, string claimed, string recomputed) =>
        $"The claimed {(reaction ? "reaction" : "displacement")} {component} at joint {joint} is {claimed}; the independent analysis gives {recomputed}.";

    public static string QuantityBrief(string component, string joint, string claimed, string recomputed) =>
        $"joint {joint} {component}: {claimed} claimed, {recomputed} by analysis";

    public static string DisplacementsNeedAbsoluteStiffness =>
        "Displacements are claimed, but the submission gives relative stiffness only (no E), so they cannot be checked.";

    public static string EndBrief(string place, string claimed, string recomputed) => $"{place}: {claimed} claimed, {recomputed} by analysis";

    public static string EndMissingBrief(string place, string recomputed) => $"{place}: no moment given, {recomputed} by analysis";

    // ---- checks of the claims -----------------------------------------------------------------------

    public static string JointOutOfBalance(string joint, string figures, string convention, string error, string? applied) =>
        $"The claimed end moments at joint {joint} ({figures}; {convention}) leave the joint out of balance by {error}: " +
        (applied is null ? "with no couple applied there, they must sum to zero." : $"they must balance the couple of {applied} applied there.");

    public static string JointOutOfBalanceBrief(string joint, string error) => $"joint {joint} out of balance by {error}";

    public static string HingeCarriesMoment(string member, string at, string claimed) =>
        $"Member {member} is hinged at {at}, so its moment there must be zero; the claim is {claimed}.";

    public static string ReleasedJoint(string joint, bool free, string member, string should, string claimed) =>
        $"Joint {joint} is {(free ? "a free end" : "a pinned or roller support with a single member")}, so member {member} must have " +
        $"{(should == "zero" ? "zero moment" : "the applied couple " + should)} there; the claim is {claimed}.";

    public static string OverhangRoot(string member, string root, string statical, string claimed) =>
        $"Member {member} is an overhang (cantilever) from {root}: statics alone give {statical} at {root} from its own loads, but the claim is {claimed}.";

    public static string ReleasedBrief(string member, string at, string claimed, string should) => $"{member} at {at}: {claimed} claimed, statics give {should}";

    public static string StoreyShear(string storey, string carried, string needed, string residual) =>
        $"Across {storey} the column shears implied by the claimed end moments add up to {carried}, but the horizontal load above " +
        $"needs {needed}: {residual} of lateral load is not carried by the columns.";

    public static string StoreyShearBrief(string storey, string residual) => $"{storey}: {residual} of lateral load not carried by the columns";

    public static string Incompatible(string place, string claimed, string implied) =>
        $"The claim for {place}, {claimed}, does not fit the joint rotations that the other claimed moments imply through the slope-deflection " +
        $"equations (with the submission's E, I, L and fixed-end moments), which give {implied} there.";

    public static string IncompatibleBrief(string place, string error) => $"{place} does not fit the rotations the other claims imply (out by {error})";

    public static string ReactionsUnbalanced(string direction, string residual) =>
        $"The claimed reactions do not balance the loads {direction}ly: the sum of reactions and loads is {residual} instead of zero.";

    public static string ReactionsOutOfMomentBalance(string residual) =>
        $"The claimed reactions and the loads are out of moment balance by {residual} (about the origin).";

    public static string ReactionsUnbalancedBrief(string direction, string residual) => $"reactions out of {direction} balance by {residual}";

    public static string NotMirrored(string caseId, string first, string firstClaim, string second, string secondClaim, SignConvention convention) =>
        $"Structure and loads of case {caseId} are symmetric, so the moment of {first} ({firstClaim}) should be the mirror image of {second} " +
        $"({secondClaim}): equal in size, with the sense reversed{(convention == SignConvention.Clockwise ? " (opposite signs in the clockwise convention)" : "")}.";

    public static string NotMirroredBrief(string pair, string error) => $"{pair} not mirror images (out by {error})";

    // ---- the analysis itself ---------------------------------------------------------------------------

    public static string Conditioning(string describe, bool everyCase) =>
        $"{describe} Please confirm the section properties.{(everyCase ? " This applies to every load case." : "")}";
}
