using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// The comments about span-moment, shear and envelope claims, built as the end moments' are (<see cref="CommentSchedule"/>):
/// a diagnosed mistake's comment holds every such claim it explains and the checks that rest only on them; the other
/// differing claims are one comment per member and table, with the checks that rest only on them. An envelope claim on
/// the unsafe side is its <c>envelope</c> flag; one on the safe side is a note, not a comment.
/// </summary>
internal static class SectionComments
{
    /// <param name="Words">The claim and the analysis for a member's comment ("82.9 kN·m, the analysis 88.14 kN·m at 2.63 m from its start").</param>
    /// <param name="Corrected">The analysis's figure with the claim for a cause's comment ("AB span 88.14 kN·m (claimed 82.9)").</param>
    private sealed record Item(SectionKey Key, Symptom Symptom, Severity Severity, SourceRef Source, string Words, string Corrected, Flag? Flag);

    /// <summary>The drafts of one case; the flags they take up are removed from <paramref name="flags"/>.</summary>
    /// <param name="endCause">The identity of the mistake the end moments' comment names and the ends it explains: a check that rests on
    /// those ends and on claims of this table that the same mistake explains belongs to the same comment.</param>
    public static List<CommentSchedule.Draft> For(CaseReview c, List<Flag> flags, Quoting quote, (string Identity, HashSet<EndKey> Ends)? endCause = null)
    {
        var drafts = new List<CommentSchedule.Draft>();
        var items = Items(c, flags, quote);
        if (items.Count == 0 && flags.All(f => f.Sections.Count == 0)) return drafts;
        var agreeingEnds = c.EndMoments.Where(e => e.Status == EndStatus.Agree && e.Key is not null).Select(e => e.Key!.Value).ToHashSet();
        var agreeing = ReviewEngine.AgreeingSections(c);
        List<Flag> Resting(ICollection<SectionKey> keys, string? identity = null) =>
            flags.Where(f => f.Sections.Count > 0 && f.Sections.All(k => keys.Contains(k) || agreeing.Contains(k))
                             && f.Ends.All(k => agreeingEnds.Contains(k) || (endCause is { } ec && ec.Identity == identity && ec.Ends.Contains(k)))).ToList();

        // 1. A diagnosed mistake and every claim of its kind it explains.
        foreach (var cause in c.SectionCauses.GroupBy(x => x.Claims).Select(g => g.First()).Where(x => x.Reproduces || x.ExplainedSections.Count > 0))
        {
            var kind = KindOf(cause.Claims);
            var explained = (cause.Reproduces ? items.Where(i => i.Key.Kind == kind).Select(i => i.Key) : cause.ExplainedSections).ToHashSet();
            var mine = items.Where(i => explained.Contains(i.Key)).ToList();
            if (mine.Count == 0) continue;
            var byCause = Resting(explained, cause.Identity).Where(f => mine.All(i => i.Flag != f)).ToList();
            var term = cause.Kind.Term();
            var d = new CommentSchedule.Draft(term.Prefix, c.Case, cause.Place)
            {
                Cause = cause.Kind,
                Identity = cause.Identity.Length > 0 ? cause.Identity : null,
                Order = 1,
                Severity = Worst(mine, byCause),
            };
            d.Symptoms.AddRange(mine.Select(i => i.Symptom));
            d.Symptoms.AddRange(byCause.Select(f => CommentSchedule.Symptom(c, f)));
            d.Sources.AddRange(mine.Select(i => i.Source));
            d.Sources.AddRange(byCause.SelectMany(f => f.Sources));
            d.Text = string.Join(" ", new[]
            {
                $"{CommentSchedule.Capital(term.Title)}. {cause.Message}", cause.CorrectWorking,
                $"The correct analysis gives {string.Join(", ", mine.Take(6).Select(i => i.Corrected))}{(mine.Count > 6 ? $" and {mine.Count - 6} more" : "")}.",
                "Please correct the working and revise the results that follow from it.",
            }.Where(t => t.Length > 0));
            drafts.Add(d);
            items = items.Except(mine).ToList();
            flags.RemoveAll(f => byCause.Contains(f) || mine.Any(i => i.Flag == f));
        }

        // 2. The other differing claims, one comment per member and table, with the checks that rest only on them.
        foreach (var g in items.GroupBy(i => (i.Key.Kind, i.Key.Member)))
        {
            var keys = g.Select(i => i.Key).ToHashSet();
            var resting = Resting(keys).Where(f => g.All(i => i.Flag != f)).ToList();
            var d = new CommentSchedule.Draft(Prefix(g.Key.Kind), c.Case, new MemberPlace(g.Key.Member)) { Order = 3, Severity = Worst([.. g], resting) };
            d.Symptoms.AddRange(g.Select(i => i.Symptom));
            d.Symptoms.AddRange(resting.Select(f => CommentSchedule.Symptom(c, f)));
            d.Sources.AddRange(g.Select(i => i.Source));
            d.Sources.AddRange(resting.SelectMany(f => f.Sources));
            string what = g.Key.Kind switch
            {
                SectionKind.SpanMoment => $"the largest span moment is claimed as {string.Join("; ", g.Select(i => i.Words))} (sagging positive)",
                SectionKind.Shear => $"the end shears are claimed as {string.Join("; ", g.Select(i => i.Words))} (beam convention, V = dM/dx from start to end)",
                _ => string.Join(" ", g.Select(i => i.Flag!.Message)),
            };
            string also = resting.Count == 0 ? "" : $" The checks of the claims point to the same figures ({string.Join("; ", resting.Select(f => f.Brief.Length > 0 ? f.Brief : f.Kind.Term().Title))}).";
            d.Text = g.Key.Kind == SectionKind.Envelope
                ? $"Member {g.Key.Member}, combination {c.Case}: {what}{also} Please revise the envelope."
                : $"Member {g.Key.Member}, case {c.Case}: {what}.{also} Please check and revise.";
            drafts.Add(d);
            flags.RemoveAll(f => resting.Contains(f) || g.Any(i => i.Flag == f));
        }
        return drafts;
    }

    /// <summary>The differing claims of the case: span moments and shears minor or discrepant, envelope bounds on the unsafe side (their flags).</summary>
    private static List<Item> Items(CaseReview c, List<Flag> flags, Quoting quote)
    {
        var items = new List<Item>();
        foreach (var f in c.SpanMoments.Where(x => x.Status is EndStatus.Minor or EndStatus.Discrepant))
        {
            var sev = f.Status == EndStatus.Discrepant ? Severity.Major : Severity.Minor;
            string claimed = quote.Claim(f.Claim), recomputed = $"{quote.SpanMoment(f.Recomputed!.Value)} at {quote.Length(f.RecomputedX ?? 0)}";
            var symptom = new Symptom("span-moment", c.Case, sev, f.Place, ReviewMessages.SpanBrief(f.Member, claimed, recomputed), f.Claim.Source.RowCompact);
            items.Add(new Item(f.Key, symptom, sev, f.Claim.Source, $"{claimed}, the analysis {recomputed} from its start",
                $"{f.Member} span {quote.SpanMoment(f.Recomputed.Value)} (claimed {Quoting.Written(f.Claim.Source, f.Claim.AsWritten)})", null));
        }
        foreach (var f in c.Shears.Where(x => x.Status is EndStatus.Minor or EndStatus.Discrepant))
        {
            var sev = f.Status == EndStatus.Discrepant ? Severity.Major : Severity.Minor;
            string claimed = quote.Claim(f.Claim), recomputed = quote.Force(f.Recomputed!.Value);
            var symptom = new Symptom("shear", c.Case, sev, f.Place, ReviewMessages.ShearBrief(f.Place.Short, claimed, recomputed), f.Claim.Source.RowCompact);
            items.Add(new Item(f.Key, symptom, sev, f.Claim.Source, $"at {f.At} {claimed}, the analysis {recomputed}",
                $"{f.Place.Short} {recomputed} (claimed {Quoting.Written(f.Claim.Source, f.Claim.AsWritten)})", null));
        }
        foreach (var flag in flags.Where(x => x.Kind == FlagKind.Envelope && x.Sections.Count == 1))
        {
            var key = flag.Sections[0];
            if (c.Envelope.FirstOrDefault(e => e.Key == key && e.Side == EnvelopeSide.Unsafe) is not { } f) continue;
            string bound = f.Bound == "max" ? "maximum" : "minimum";
            items.Add(new Item(key, CommentSchedule.Symptom(c, flag), flag.Severity, f.Source, flag.Message,
                $"{(f.IsSpan ? $"{f.Member} span" : ((MemberEndPlace)f.Place).Short)} {bound} {quote.SpanMoment(f.Recomputed!.Value)} (claimed {f.AsWritten})", flag));
        }
        return items;
    }

    private static SectionKind KindOf(string claims) => claims switch
    {
        "span-moments" => SectionKind.SpanMoment,
        "shears" => SectionKind.Shear,
        _ => SectionKind.Envelope,
    };

    /// <summary>The comment-id prefix of a comment about differing claims of a table without a diagnosed cause.</summary>
    private static string Prefix(SectionKind kind) => kind switch
    {
        SectionKind.SpanMoment => "SP",
        SectionKind.Shear => "SV",
        _ => "EN",
    };

    private static Severity Worst(IEnumerable<Item> items, IEnumerable<Flag> flags) =>
        items.Select(i => i.Severity).Concat(flags.Select(f => f.Severity)).DefaultIfEmpty(Severity.Info).Max();
}
