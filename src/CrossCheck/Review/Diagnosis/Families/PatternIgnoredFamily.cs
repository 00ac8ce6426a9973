namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>Pattern loading ignored: the envelope claims are the moments with every member carrying the variable load.</summary>
internal sealed class PatternIgnoredFamily : ISectionFamily
{
    public IEnumerable<Hypothesis> Propose(SectionContext x)
    {
        if (x.Kind != SectionKind.Envelope || x.Combination is not { } c || x.Claims.Any(k => k.AllLoaded is null)) yield break;
        string cases = string.Join(", ", c.Terms.Where(t => t.Patterned).Select(t => t.Case));
        yield return new Hypothesis(CauseCode.PatternIgnored, 1, x.Claims.Select(k => k.AllLoaded!.Value).ToArray(),
            $"The envelope claims of combination {c.Name} are the moments with every span carrying {cases}: the arrangement of the variable load was not considered.")
        {
            Identity = "pattern-ignored",
            CorrectWorking = "Arrange the variable load for the worst effect at each section — e.g. EN 1992-1-1 clause 5.1.3 (alternate spans loaded for span " +
                             "moments, adjacent spans for support moments) or ACI 318 clause 6.4.3 — or take the exact envelope; the memo's envelope table names the " +
                             "arrangement that governs each extreme.",
        };
    }
}
