namespace CrossCheck.Review;

/// <summary>The sentences about combinations, envelopes, span moments, shears and sway sensitivity (figures already quoted).</summary>
internal static partial class ReviewMessages
{
    // ---- checks of the claims ------------------------------------------------------------------------

    public static string NotSuperposed(string combination, string place, string claimed, string terms, string sum, string error) =>
        $"Combination {combination} is the factored sum of its cases, but its claim for {place}, {claimed}, is not the sum of the cases' own claims " +
        $"there: {terms} = {sum} (out by {error}, beyond the rounding of the printed figures).";

    public static string NotSuperposedBrief(string place, string claimed, string sum) => $"{place}: {claimed} claimed, the cases' claims factored and added give {sum}";

    public static string SpanNotByStatics(string member, string caseId, string claimed, string statical, string where) =>
        $"The claimed span moment of member {member} in case {caseId} is {claimed}, but statics of the member from the claimed end moments and its loads " +
        $"give a largest moment of {statical} (at {where} from its start).";

    public static string SpanNotByStaticsBrief(string member, string claimed, string statical) =>
        $"{member} span moment: {claimed} claimed, statics of the claimed end moments give {statical}";

    public static string ShearNotByStatics(string place, string caseId, string claimed, string statical) =>
        $"The claimed shear of {place} in case {caseId} is {claimed}, but statics of the member from the claimed end moments and its loads give {statical} " +
        "(beam convention, V = dM/dx from start to end).";

    public static string ShearNotByStaticsBrief(string place, string claimed, string statical) => $"{place} shear: {claimed} claimed, statics of the claimed end moments give {statical}";

    public static string EnvelopeBelowOwnFigures(string combination, string bound, string place, string claimed, string arrangement, string terms, string value) =>
        $"The claimed {bound} of combination {combination} for {place} is {claimed}, but the author's own figures for its cases with {arrangement} give " +
        $"{value} there ({terms}): an envelope cannot lie {(bound == "minimum" ? "above" : "below")} one of its arrangements.";

    public static string EnvelopeBelowOwnFiguresBrief(string bound, string place, string claimed, string value, string arrangement) =>
        $"{place} {bound}: {claimed} claimed, the cases' own figures give {value} with {arrangement}";

    // ---- comparison with the analysis ------------------------------------------------------------------

    /// <param name="bound">"maximum", "minimum", or "largest span moment" for a span row.</param>
    /// <param name="at">For a span row, where the governing arrangement's maximum is, from the member's start.</param>
    public static string EnvelopeUnsafe(string combination, string bound, string place, string claimed, string arrangement, string value, string shortBy, string? at = null) =>
        $"The claimed {bound} of combination {combination} for {place} is {claimed}, but with {arrangement} the " +
        (bound switch { "minimum" => "moment there falls to", "maximum" => "moment there reaches", _ => "span moment reaches" }) +
        $" {value}{(at is null ? "" : $" at {at} from its start")}: the claim is on the unsafe side by {shortBy}.";

    public static string EnvelopeUnsafeBrief(string bound, string place, string claimed, string value, string arrangement) =>
        $"{place} {bound}: {claimed} claimed, {value} with {arrangement}";

    public static string EnvelopeConservative(string combination, string bound, string place, string claimed, string value, string by) =>
        $"The claimed {bound} of combination {combination} for {place} ({claimed}) lies beyond the true extreme ({value}): conservative by {by}.";

    public static string SpanLocation(string member, string caseId, string claimedAt, string at) =>
        $"The largest moment of member {member} in case {caseId} is at {at} from its start, not at {claimedAt} as claimed (the location is not graded).";

    public static string SpanBrief(string member, string claimed, string recomputed) => $"{member} span moment: {claimed} claimed, {recomputed} by analysis";

    public static string ShearBrief(string place, string claimed, string recomputed) => $"{place} shear: {claimed} claimed, {recomputed} by analysis";

    public static string EnvelopeBrief(string place, string bound, string claimed, string recomputed, string arrangement) =>
        $"{place} {bound}: {claimed} claimed, {recomputed} with {arrangement}";

    public static string SectionClaimUnmatched(string what, string member) =>
        $"The {what} claim names member '{member}' or an end of it that the model does not have: the claim cannot be matched.";

    // ---- sway sensitivity ------------------------------------------------------------------------------

    public static string SecondOrder(string caseId, string alpha, string? amplifier) =>
        $"Under the loads of case {caseId} the elastic critical load factor is α_cr = {alpha} (the lowest eigenvalue of K + α·K_G with the first-order axial " +
        "forces), below 10: first-order results need second-order treatment (EN 1993-1-1 clause 5.2.1(3)). " +
        (amplifier is null
            ? "Below 3 the sway effects cannot be amplified either (clause 5.2.2(5)B): a second-order analysis is needed."
            : $"For α_cr ≥ 3 the sway effects may be amplified by 1/(1 − 1/α_cr) = {amplifier} (clause 5.2.2(5)B).") +
        " A warning for the designer; the review is not a stability check.";

    public static string SecondOrderBrief(string caseId, string alpha) => $"case {caseId}: α_cr = {alpha}, below 10";
}
