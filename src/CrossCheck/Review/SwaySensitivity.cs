using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// The elastic critical load factor of a case or combination (<see cref="CriticalLoadFactor"/>) and, below 10, the
/// <c>second-order</c> flag: minor for 3 ≤ α_cr &lt; 10 (sway effects may be amplified by 1/(1 − 1/α_cr), EN 1993-1-1
/// clause 5.2.2(5)B), major below 3. A warning for the designer, never a stability check. Computed only for a case with
/// vertical load (a horizontal load alone gives the columns small axial forces and a meaningless factor) on a structure
/// with absolute stiffness (E given) in which some member is in compression.
/// </summary>
internal static class SwaySensitivity
{
    /// <summary>
    /// Whether the loads of a case — or of a combination with a patterned case, every member loaded — have a vertical
    /// component (EN 1993-1-1 clause 5.2.1: α_cr is the factor on the design loading that gives elastic instability).
    /// </summary>
    public static bool HasVerticalLoad(Submission s, string caseId)
    {
        if ((s.Case(caseId) ?? s.Combination(caseId)?.AllLoaded(s.Cases)) is not { } loads) return false;
        var statics = new ClaimStatics(s);
        return loads.Loads.Any(l => statics.Resultant(l, 0, 0) is var (fx, fy, _) && fy != 0 && Math.Abs(fy) > 1e-9 * Math.Abs(fx));
    }

    /// <summary>α_cr under the axial forces of a case; null when it is not computed (relative stiffness, no compression).</summary>
    public static double? Of(StructureModel model, Func<string, (double Start, double End)> axial)
    {
        if (model.RelativeStiffness) return null;
        try { return CriticalLoadFactor.Of(model, axial); }
        catch (StructureException) { return null; }
    }

    public static double? Of(StructureModel model, CaseResult result) => Of(model, m => (result.Members[m].StartAxial, result.Members[m].EndAxial));

    /// <summary>With every patterned member loaded: the heaviest arrangement's axial forces.</summary>
    public static double? Of(StructureModel model, Envelope envelope) => Of(model, m => envelope.AllLoaded(m).Axial);

    /// <summary>
    /// α_cr as written in the memo: "12.3", "7.42", and a factor too small for two decimals with three significant figures
    /// ("4.27E-05"), so that a column of almost no stiffness under load never reads as α_cr = 0.00.
    /// </summary>
    public static string Words(double a) =>
        a.ToString(a >= 10 ? "0.0" : a >= 0.1 ? "0.00" : "0.00E+00", CultureInfo.InvariantCulture);

    /// <summary>The flag for a factor below 10; null otherwise.</summary>
    public static Flag? Flag(string caseId, double? alpha)
    {
        if (alpha is not double a || a >= 10) return null;
        string words = Words(a);
        string? amplifier = a >= 3 ? (1 / (1 - (1 / a))).ToString("0.00", CultureInfo.InvariantCulture) : null;
        string message = ReviewMessages.SecondOrder(caseId, words, amplifier);
        return new Flag(FlagKind.SecondOrder, a < 3 ? Severity.Major : Severity.Minor, new ModelPlace("sway sensitivity"), a, message, [], ValueKind.Factor)
        {
            Brief = ReviewMessages.SecondOrderBrief(caseId, words),
        };
    }
}
