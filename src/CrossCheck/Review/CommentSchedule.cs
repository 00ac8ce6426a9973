using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Builds the schedule of comments the designer answers: one comment per mistake. Every finding that a diagnosed
/// mistake explains (the ends it reproduces and the checks that rest only on them) is one comment naming the mistake;
/// the same mistake found in several cases is one comment. Without a diagnosis, the findings that one wrong figure
/// explains (its own difference and the checks in which it is the only wrong figure) are one comment about that
/// figure. What is left is grouped by member (end moments) or stands alone (checks).
/// </summary>
internal static class CommentSchedule
{
    /// <summary>Most corrected figures a cause comment lists before "and N more".</summary>
    private const int MaxListedEnds = 6;

    internal sealed class Draft(string prefix, string caseId, Place? place)
    {
        public string Prefix { get; } = prefix;
        public List<string> Cases { get; } = [caseId];
        public Place? Place { get; } = place;
        public string Text { get; set; } = "";
        public List<Symptom> Symptoms { get; } = [];
        public List<SourceRef?> Sources { get; } = [];
        public CauseCode? Cause { get; init; }
        public string? Identity { get; init; }
        public Severity Severity { get; set; }
        public int Order { get; init; }
    }

    public static IReadOnlyList<ReviewComment> Build(Submission s, IReadOnlyList<CaseReview> cases)
    {
        var quote = new Quoting(s);
        var drafts = new List<Draft>();
        foreach (var c in cases) drafts.AddRange(ForCase(s, c, quote));
        drafts = MergeAcrossCases(drafts);
        var seen = new Dictionary<string, int>(StringComparer.Ordinal);
        var comments = new List<ReviewComment>();
        foreach (var d in drafts)
        {
            string id = Place.CommentId(d.Prefix, d.Cases[0], d.Place);
            int n = seen.TryGetValue(id, out var k) ? k + 1 : 1;
            seen[id] = n;
            if (n > 1) id = $"{id}-{n}";
            comments.Add(new ReviewComment(id, d.Severity, string.Join(", ", d.Cases), d.Place?.Words ?? "whole structure",
                d.Text, SourceRef.Span(d.Sources))
            {
                Symptoms = d.Symptoms,
                Cause = d.Cause,
                Cases = d.Cases,
            });
        }
        return comments;
    }

    private static List<Draft> ForCase(Submission s, CaseReview c, Quoting quote)
    {
        var drafts = new List<Draft>();
        // Ends in the order the model lists its members (start before end), as a designer reads them.
        var order = s.Model.Members.Select((m, i) => (m.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        c = c with { EndMoments = [.. c.EndMoments.OrderBy(e => order.GetValueOrDefault(e.Member, int.MaxValue)).ThenBy(e => e.End ?? MemberEnd.End)] };
        var wrong = c.EndMoments.Where(e => e.Status is EndStatus.Discrepant or EndStatus.Minor && e.Key is not null).ToList();
        var flags = c.Flags.Where(f => f.Severity != Severity.Info).ToList();
        var agreeing = c.EndMoments.Where(e => e.Status == EndStatus.Agree && e.Key is not null).Select(e => e.Key!.Value).ToHashSet();
        var agreeingSections = ReviewEngine.AgreeingSections(c);

        // 1. The diagnosed mistake and everything it explains.
        (string Identity, HashSet<EndKey> Ends)? endCause = null;
        if (c.Causes.FirstOrDefault() is { } cause && (cause.Reproduces || cause.Explained.Count > 0))
        {
            var explained = cause.Reproduces ? wrong.Select(e => e.Key!.Value).ToHashSet() : cause.Explained.ToHashSet();
            endCause = (cause.Identity, explained);
            var ends = wrong.Where(e => explained.Contains(e.Key!.Value)).ToList();
            var byCause = flags.Where(f => f.Ends.Count > 0 ? f.Ends.All(k => explained.Contains(k) || agreeing.Contains(k)) && f.Sections.All(agreeingSections.Contains)
                : f.Kind == FlagKind.DistributionTable && c.Audit?.First is { } cell && ExplainsTable(cause, cell.Step)).ToList();
            if (ends.Count > 0)
            {
                // An equally good alternative is worth naming only when it is a different mistake of method or model, not a
                // slip that reproduces any wrong figure by construction.
                var alternative = c.Causes.Skip(1).FirstOrDefault(x => x.Reproduces && cause.Reproduces && x.Kind.Term().Systematic);
                drafts.Add(CauseDraft(c, cause, ends, byCause, quote, alternative));
                wrong = wrong.Except(ends).ToList();
                flags = flags.Except(byCause).ToList();
            }
        }

        // 2. A wrong figure and the checks in which it is the only wrong figure.
        var remaining = wrong.ToDictionary(e => e.Key!.Value);
        var byFigure = new Dictionary<EndKey, List<Flag>>();
        foreach (var f in flags.Where(f => f.Ends.Count > 0).ToList())
        {
            var culprits = f.Ends.Where(remaining.ContainsKey).Distinct().ToList();
            if (culprits.Count != 1 || !f.Ends.All(k => remaining.ContainsKey(k) || agreeing.Contains(k)) || !f.Sections.All(agreeingSections.Contains)) continue;
            if (!byFigure.TryGetValue(culprits[0], out var list)) byFigure[culprits[0]] = list = [];
            list.Add(f);
            flags.Remove(f);
        }
        bool othersAgree = c.EndMoments.Count(e => e.Status is not EndStatus.Agree) == 1;
        foreach (var e in wrong.Where(e => byFigure.ContainsKey(e.Key!.Value)))
            drafts.Add(FigureDraft(c, e, byFigure[e.Key!.Value], quote, othersAgree));

        // 3. Other differing or missing ends, one comment per member.
        var rest = c.EndMoments.Where(e => (e.Status is EndStatus.Discrepant or EndStatus.Minor && !(e.Key is { } k && byFigure.ContainsKey(k)) && wrong.Contains(e))
                                           || e.Status == EndStatus.Missing);
        foreach (var g in rest.GroupBy(e => e.Member))
            drafts.Add(MemberDraft(c, g.Key, g.ToList(), quote));

        // Span moments, shears and envelopes: their causes, then the differing claims by member (SectionComments).
        drafts.AddRange(SectionComments.For(c, flags, quote, endCause));

        // 4. Checks that no mistake and no single figure explains.
        foreach (var f in flags)
        {
            var d = new Draft(f.Kind.Term().Prefix, c.Case, f.Place) { Severity = f.Severity, Order = 4 };
            d.Text = f.Message;
            d.Symptoms.Add(Symptom(c, f));
            d.Sources.AddRange(f.Sources);
            drafts.Add(d);
        }
        return drafts;
    }

    private static Draft CauseDraft(CaseReview c, Cause cause, List<EndMomentFinding> ends, List<Flag> flags, Quoting quote, Cause? alternative)
    {
        var term = cause.Kind.Term();
        var d = new Draft(term.Prefix, c.Case, cause.Place) { Cause = cause.Kind, Identity = cause.Identity.Length > 0 ? cause.Identity : null, Order = 1 };
        d.Symptoms.AddRange(ends.Select(e => Symptom(c, e, quote)));
        d.Symptoms.AddRange(flags.Select(f => Symptom(c, f)));
        d.Sources.AddRange(ends.Select(e => e.Source));
        d.Sources.AddRange(flags.SelectMany(f => f.Sources));
        d.Severity = Worst(ends, flags);
        var text = new List<string> { $"{Capital(term.Title)}. {cause.Message}" };
        if (alternative is not null) text.Add($"Another mistake gives the same claims, so it may be this instead: {alternative.Message}");
        if (cause.CorrectWorking.Length > 0) text.Add(cause.CorrectWorking);
        if (cause.Kind != CauseCode.CopyingSlip) text.Add(Corrected(ends, quote));
        text.Add(ends.Count == 1 && cause.Kind == CauseCode.CopyingSlip ? "" : "Please correct the working and revise the results that follow from it.");
        d.Text = string.Join(" ", text.Where(t => t.Length > 0));
        return d;
    }

    /// <summary>
    /// Whether a mistake explains the first wrong cell of the author's own table: a table worked consistently with a wrong
    /// method first departs from correct working at the step the mistake touches.
    /// </summary>
    private static bool ExplainsTable(Cause cause, WorkingStep first) => cause.Kind switch
    {
        CauseCode.DistributionArithmetic => true,
        CauseCode.StiffnessWithoutLength or CauseCode.FarEndFixity or CauseCode.HingeIgnored => cause.Reproduces && first == WorkingStep.DistributionFactor,
        CauseCode.FixedEndMoment or CauseCode.LoadMisplaced or CauseCode.SettlementIgnored => cause.Reproduces && first == WorkingStep.FixedEndMoment,
        CauseCode.CarryOver => cause.Reproduces && first == WorkingStep.CarryOver,
        _ => false,
    };

    /// <summary>"With the correct working the claims would be: BC at B −71.01 (claimed −69.1), ... (kN·m, clockwise on the member end)."</summary>
    private static string Corrected(List<EndMomentFinding> ends, Quoting quote)
    {
        var listed = ends.Take(MaxListedEnds)
            .Select(e => $"{e.Place.Short} {quote.EndNumber(e.Recomputed!.Value, e.End!.Value)} (claimed {Quoting.ClaimNumber(e.Claim!)})");
        string more = ends.Count > MaxListedEnds ? $" and {ends.Count - MaxListedEnds} more" : "";
        return $"The correct analysis gives {string.Join(", ", listed)}{more} ({quote.ConventionNote}).";
    }

    private static Draft FigureDraft(CaseReview c, EndMomentFinding e, List<Flag> flags, Quoting quote, bool othersAgree)
    {
        var d = new Draft("EM", c.Case, e.Place) { Order = 2 };
        d.Symptoms.Add(Symptom(c, e, quote));
        d.Symptoms.AddRange(flags.Select(f => Symptom(c, f)));
        d.Sources.Add(e.Source);
        d.Sources.AddRange(flags.SelectMany(f => f.Sources));
        d.Severity = Worst([e], flags);
        string also = string.Join("; ", flags.Select(f => f.Brief.Length > 0 ? f.Brief : f.Kind.Term().Title));
        d.Text = $"Member {e.Member} at {e.At}, case {c.Case}: {quote.Claim(e.Claim!)} is claimed; the analysis gives {quote.EndMoment(e.Recomputed!.Value, e.End!.Value)} " +
                 $"({quote.ConventionWords}). " +
                 (othersAgree ? "Every other figure of the case agrees with the analysis, so this one figure is wrong. " : "") +
                 $"The checks of the claims point to the same figure ({also}). Please check this figure and what was derived from it.";
        return d;
    }

    private static Draft MemberDraft(CaseReview c, string member, List<EndMomentFinding> ends, Quoting quote)
    {
        var d = new Draft("EM", c.Case, new MemberPlace(member)) { Order = 3 };
        d.Symptoms.AddRange(ends.Select(e => Symptom(c, e, quote)));
        d.Sources.AddRange(ends.Select(e => e.Source));
        d.Severity = Worst(ends, []);
        var parts = ends.Select(e => e.Status == EndStatus.Missing
            ? $"at {e.At} no moment is given, the analysis gives {quote.EndNumber(e.Recomputed!.Value, e.End!.Value)}"
            : $"at {e.At} {Quoting.ClaimNumber(e.Claim!)} is claimed, the analysis gives {quote.EndNumber(e.Recomputed!.Value, e.End!.Value)}");
        d.Text = $"Member {member}, case {c.Case}: {string.Join("; ", parts)} ({quote.ConventionNote}). Please check and revise.";
        return d;
    }

    /// <summary>The same diagnosed mistake in several cases is one comment.</summary>
    private static List<Draft> MergeAcrossCases(List<Draft> drafts)
    {
        var merged = new List<Draft>();
        var byIdentity = new Dictionary<string, Draft>(StringComparer.Ordinal);
        foreach (var d in drafts)
        {
            if (d.Identity is { } key && byIdentity.TryGetValue(key, out var first))
            {
                first.Symptoms.AddRange(d.Symptoms);
                first.Sources.AddRange(d.Sources);
                if (d.Severity > first.Severity) first.Severity = d.Severity;
                var others = d.Cases.Where(x => !first.Cases.Contains(x)).ToList();
                first.Cases.AddRange(others);
                if (others.Count > 0) first.Text += $" The same mistake gives the claims of case {string.Join(", ", others)}.";
                continue;
            }
            if (d.Identity is { } k) byIdentity[k] = d;
            merged.Add(d);
        }
        return merged;
    }

    internal static Severity Worst(IEnumerable<EndMomentFinding> ends, IEnumerable<Flag> flags)
    {
        var s = Severity.Info;
        foreach (var e in ends) s = (Severity)Math.Max((int)s, (int)(e.Status == EndStatus.Discrepant ? Severity.Major : Severity.Minor));
        foreach (var f in flags) s = (Severity)Math.Max((int)s, (int)f.Severity);
        return s;
    }

    private static Symptom Symptom(CaseReview c, EndMomentFinding e, Quoting quote)
    {
        var sev = e.Status == EndStatus.Discrepant ? Severity.Major : Severity.Minor;
        string text = e.Status == EndStatus.Missing || e.Claim is null
            ? ReviewMessages.EndMissingBrief(e.Place.Short, quote.EndMoment(e.Recomputed!.Value, e.End!.Value))
            : ReviewMessages.EndBrief(e.Place.Short, quote.Claim(e.Claim), quote.EndMoment(e.Recomputed!.Value, e.End!.Value));
        return new Symptom(FlagKind.EndMoment.Json(), c.Case, sev, e.Place, text, e.Source?.RowCompact ?? "");
    }

    internal static Symptom Symptom(CaseReview c, Flag f) =>
        new(f.Kind.Json(), c.Case, f.Severity, f.Place, f.Brief.Length > 0 ? f.Brief : f.Message, f.SourceText);

    internal static string Capital(string s) => s.Length == 0 ? s : char.ToUpperInvariant(s[0]) + s[1..];
}
