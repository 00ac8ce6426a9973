namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// The ranking rule of the diagnosis (docs/REVIEW-JSON.md, "Cause codes"), for claims of any one kind: a hypothesis must
/// remove at least half of the squared differences and either reproduce every claim within the agree band or remove 90 %
/// and leave nothing beyond the minor band; within the agree band first, a systematic mistake before a slip, then the
/// simplest, then the one that explains most; one entry per code, at most three; confidence 0.95 shared between equally
/// good explanations, else 0.7 (or 0.5) × the share explained.
/// </summary>
internal static class HypothesisRanking
{
    public sealed record Ranked(Hypothesis H, double Explains, double Worst, double Confidence, bool Reproduces);

    public static List<Ranked> Rank(IEnumerable<Hypothesis> hypotheses, double[] claimed, double[] recomputed, double agree, double minor)
    {
        double before = SquaredDistance(claimed, recomputed);
        if (!(before > 0)) return [];
        var fits = hypotheses
            .Select(h => (H: h, Explains: Math.Clamp(1 - (SquaredDistance(claimed, h.Predicted) / before), 0, 1), Worst: LargestDistance(claimed, h.Predicted)))
            .Where(f => f.Explains >= 0.5 && (f.Worst <= agree || (f.Explains >= 0.9 && f.Worst <= minor)))
            .OrderBy(f => f.Worst <= agree ? 0 : f.Worst <= minor ? 1 : 2)
            .ThenBy(f => f.H.Code.Term().Systematic ? 0 : 1)
            .ThenBy(f => f.Worst <= agree ? f.H.Simplicity : 0)
            .ThenByDescending(f => Math.Round(f.Explains, 4))
            .ThenBy(f => f.H.Simplicity)
            .ToList();
        if (fits.Count > 0 && fits[0].Worst <= agree) fits = fits.Where(f => f.Worst <= minor).ToList();
        var best = fits.GroupBy(f => f.H.Code).Select(g => g.First()).Take(3).ToList();
        int full = best.Count(f => f.Worst <= agree && f.H.ConfidenceCap >= 1);
        return best.Select(f =>
        {
            double confidence = f.Worst <= agree ? 0.95 / Math.Max(1, full) : f.Worst <= minor ? 0.7 * f.Explains : 0.5 * f.Explains;
            return new Ranked(f.H, f.Explains, f.Worst, Math.Min(confidence, f.H.ConfidenceCap), f.Worst <= agree);
        }).ToList();
    }

    private static double SquaredDistance(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += (a[i] - b[i]) * (a[i] - b[i]);
        return s;
    }

    private static double LargestDistance(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s = Math.Max(s, Math.Abs(a[i] - b[i]));
        return s;
    }
}
