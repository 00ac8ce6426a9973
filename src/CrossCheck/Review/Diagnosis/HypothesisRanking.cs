namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// The ranking rule of the diagnosis (docs/REVIEW-JSON.md, "Cause codes"), for claims of any kind: a hypothesis must
/// remove at least half of the squared differences and either reproduce every claim within the agree band or remove 90 %
/// and leave nothing beyond the minor band; within the agree band first, a systematic mistake before a slip, then the
/// simplest, then the one that explains most, then the order of the search; one entry per code, at most three;
/// confidence 0.95 shared between equally good explanations, else 0.7 (or 0.5) × the share explained.
/// </summary>
internal static class HypothesisRanking
{
    /// <summary>A hypothesis that passed, with where the search formed it (family, then overall order).</summary>
    public sealed record Fit(Hypothesis H, double Explains, double Worst, int Family, int Index);

    public sealed record Ranked(Hypothesis H, double Explains, double Worst, double Confidence, bool Reproduces);

    /// <summary>
    /// The hypothesis scored against the claims (<paramref name="before"/>: the squared differences of the analysis); null
    /// when it does not pass. Many variants are tried, so a partial fit to scattered errors is not evidence of anything.
    /// </summary>
    public static Fit? Score(Hypothesis h, double[] claimed, double before, double agree, double minor, int family, int index)
    {
        double explains = before > 0 ? Math.Clamp(1 - (SquaredDistance(claimed, h.Predicted) / before), 0, 1) : 0;
        double worst = LargestDistance(claimed, h.Predicted);
        return explains >= 0.5 && (worst <= agree || (explains >= 0.9 && worst <= minor)) ? new Fit(h, explains, worst, family, index) : null;
    }

    /// <summary>Scores and ranks hypotheses formed all at once (one family's search order).</summary>
    public static List<Ranked> Rank(IEnumerable<Hypothesis> hypotheses, double[] claimed, double[] recomputed, double agree, double minor)
    {
        double before = SquaredDistance(claimed, recomputed);
        if (!(before > 0)) return [];
        var fits = hypotheses.Select((h, i) => Score(h, claimed, before, agree, minor, 0, i)).OfType<Fit>().ToList();
        return Best(fits, agree, minor);
    }

    /// <summary>The best passing hypotheses, one per code, at most three, with their confidences.</summary>
    public static List<Ranked> Best(IEnumerable<Fit> passed, double agree, double minor)
    {
        // Within tolerance first; there a systematic mistake before a slip that can reproduce any wrong figure by
        // construction, then the simplest specific mistake; otherwise the one that explains most. Equally good hypotheses
        // keep the order of the whole search (family, then the family's own order), however they were tried.
        var fits = passed
            .OrderBy(f => f.Worst <= agree ? 0 : f.Worst <= minor ? 1 : 2)
            .ThenBy(f => f.H.Code.Term().Systematic ? 0 : 1)
            .ThenBy(f => f.Worst <= agree ? f.H.Simplicity : 0)
            .ThenByDescending(f => Math.Round(f.Explains, 4))
            .ThenBy(f => f.H.Simplicity)
            .ThenBy(f => f.Family)
            .ThenBy(f => f.H.Order)
            .ThenBy(f => f.Index)
            .ToList();
        // When a mistake reproduces the claims within tolerance, alternatives that do not come close are noise.
        if (fits.Count > 0 && fits[0].Worst <= agree) fits = fits.Where(f => f.Worst <= minor).ToList();
        var best = fits.GroupBy(f => f.H.Code).Select(g => g.First()).Take(3).ToList();
        int full = best.Count(f => f.Worst <= agree && f.H.ConfidenceCap >= 1);
        return best.Select(f =>
        {
            double confidence = f.Worst <= agree ? 0.95 / Math.Max(1, full) : f.Worst <= minor ? 0.7 * f.Explains : 0.5 * f.Explains;
            return new Ranked(f.H, f.Explains, f.Worst, Math.Min(confidence, f.H.ConfidenceCap), f.Worst <= agree);
        }).ToList();
    }

    public static double SquaredDistance(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += (a[i] - b[i]) * (a[i] - b[i]);
        return s;
    }

    public static double LargestDistance(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s = Math.Max(s, Math.Abs(a[i] - b[i]));
        return s;
    }
}
