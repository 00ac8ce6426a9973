using System.Globalization;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>Every claim off by a known factor between units (N·m for kN·m, kip·ft for kN·m, ...).</summary>
internal sealed class UnitScaleFamily : IHypothesisFamily
{
    /// <summary>Known factors between moment units (NIST SP 811, Appendix B, for the imperial factors).</summary>
    private static readonly (double Factor, string Meaning)[] UnitFactors =
    [
        (1000, "a factor of 1000 (N·m written as kN·m, or kN·mm as kN·m)"),
        (1e6, "a factor of 10⁶ (N·mm written as kN·m)"),
        (12, "a factor of 12 (kip·in written as kip·ft)"),
        (1.3558179483314, "the kip·ft to kN·m factor 1.3558 (kN·m given where kip·ft was declared, or the reverse)"),
        (4.4482216152605, "the kip to kN factor 4.448"),
        (3.28083989501312, "the metre to foot factor 3.281"),
        (9.80665, "g = 9.81 (kgf or tonne-force mixed with kN)"),
        (100, "a factor of 100 (cm mixed with m)"),
        (10, "a factor of 10"),
    ];

    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var r = x.Recomputed;
        double rr = r.Sum(v => v * v);
        if (rr <= 0) yield break;
        // One ratio is one number: with a single distinct moment (a symmetric pair, one loaded end) an odd conversion
        // factor is near it by chance. Then only a power of ten (a prefix slip) is evidence; an odd factor needs at
        // least two different moments scaled alike.
        var sizes = r.Select(Math.Abs).Where(v => v > x.Agree).Order().ToList();
        if (sizes.Count == 0) yield break;
        bool oneNumber = sizes[^1] - sizes[0] <= 0.01 * sizes[^1];
        double alpha = x.Claimed.Zip(r).Sum(t => t.First * t.Second) / rr;
        foreach (var (factor, meaning) in UnitFactors.Where(u => !oneNumber || u.Factor is 10 or 100 or 1000 or 1e6))
            foreach (var f in new[] { factor, 1 / factor })
                if (Math.Abs((alpha / f) - 1) < 0.03)
                    yield return new Hypothesis(CauseCode.UnitScale, 1, r.Select(v => v * f).ToArray(),
                        string.Create(CultureInfo.InvariantCulture,
                            $"Every claimed moment is {alpha:0.####} times the analysis: {meaning}. Check the moment unit of the claims against the unit declared ({x.Quote.MomentUnit.Symbol})."))
                    { Identity = string.Create(CultureInfo.InvariantCulture, $"unit-scale|{f:R}") };
    }
}
