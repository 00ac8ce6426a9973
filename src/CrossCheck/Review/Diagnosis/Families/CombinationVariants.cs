using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// The claims of a combination recomputed with one case's factor changed (another factor, or 0 for a case left out): for
/// end moments and span moments and shears of a derived combination, the combination's result plus (f′ − f) times the
/// case's response to its loads alone; for an envelope, the same added to the fixed part, or — for the one patterned case
/// of a combination — every member's contribution scaled by (f′ − f_unloaded)/(f − f_unloaded).
/// </summary>
internal static class CombinationVariants
{
    /// <summary>
    /// Factors a designer may write by slip: EN 1990 Table A1.2(B) (γG = 1.35, 1.0 favourable, ξ·γG = 0.85 × 1.35 = 1.15,
    /// γQ = 1.5) with the ψ0 of Table A1.1 (0.7, 0.6, 0.5 → 1.05, 0.9, 0.75), and ASCE 7 clause 2.3 (1.4D, 1.2D + 1.6L,
    /// 0.5L, 0.9D) — from memory; plus the other factors of the same combination.
    /// </summary>
    private static readonly double[] Recognised = [1.0, 1.35, 1.5, 1.15, 1.05, 0.9, 0.75, 1.2, 1.6, 1.4, 0.5];

    /// <summary>For each case of the combination, every recognisable factor other than its own (0 excluded).</summary>
    public static IEnumerable<(CombinationTerm Term, double Factor)> FactorSlips(Combination c) =>
        c.Terms.SelectMany(t => Recognised.Concat(c.Terms.Select(o => o.Factor)).Where(f => f != 0 && Math.Abs(f - t.Factor) > 1e-9)
            .Distinct().Select(f => (t, f)));

    /// <summary>End moments of the combination with <paramref name="term"/> at <paramref name="factor"/> (a derived combination only).</summary>
    public static double[] EndMoments(DiagnosisContext x, CombinationTerm term, double factor)
    {
        var alone = x.LoadEffect(x.S.Case(term.Case)!.Loads);
        return x.Recomputed.Select((r, i) => r + ((factor - term.Factor) * alone[i])).ToArray();
    }

    /// <summary>Span-moment, shear or envelope claims of the combination with <paramref name="term"/> at <paramref name="factor"/>; null when the variant cannot be formed.</summary>
    public static double[]? Sections(SectionContext x, CombinationTerm term, double factor)
    {
        if (x.Kind != SectionKind.Envelope)
            return x.Result is null ? null : x.FromParts([(x.Result, 1), (x.LoadsAlone(term.Case), factor - term.Factor)]);
        if (x.Envelope is not { } envelope) return null;
        if (!term.Patterned) return x.FromEnvelope(envelope.Adjusted([(x.LoadsAlone(term.Case), factor - term.Factor)], 1));
        // The one patterned case, without joint loads (which sit in the fixed part at its factor): its contributions scale.
        var combination = x.Combination!;
        if (combination.Terms.Count(t => t.Patterned) != 1 || x.S.Case(term.Case)?.JointLoads.Any() != false || term.Factor == term.FactorUnloaded) return null;
        if (factor == 0 && term.FactorUnloaded != 0) return null;
        return x.FromEnvelope(envelope.Adjusted([], (factor - term.FactorUnloaded) / (term.Factor - term.FactorUnloaded)));
    }

    public static string Number(double v) => Common.Fmt.Number(v, "0.###");
}
