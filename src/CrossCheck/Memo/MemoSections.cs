using CrossCheck.Common;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo;

/// <summary>A load combination as the memo lists it.</summary>
public sealed record MemoCombination(string Name, string Words, bool Patterned, IReadOnlyList<MemoTerm> Terms);

/// <summary>One case of a combination: its factor, whether patterned, its unloaded factor, where it was read.</summary>
public sealed record MemoTerm(string Case, string Factor, string Pattern, string Unloaded, string Source);

/// <summary>A claimed span moment next to the recomputed one (sagging positive, in the submission's units).</summary>
public sealed record MemoSpanRow(string Member, string Claimed, string ClaimedX, string Recomputed, string RecomputedX, string Difference, string Status, string Source);

/// <summary>A claimed end shear next to the recomputed one (beam convention, in the submission's force unit).</summary>
public sealed record MemoShearRow(string Member, string At, string Claimed, string Recomputed, string Difference, string Status, string Source);

/// <summary>One bound of a claimed envelope row next to the exact envelope, with the arrangement that governs it.</summary>
public sealed record MemoEnvelopeRow(string Member, string At, string Bound, string Claimed, string Recomputed, string Difference, string Status, string Side,
    string Governing, string AllLoaded, string Source);

/// <summary>Builds the memo's rows for combinations, span moments, shears and envelopes (every number formatted here).</summary>
internal static class MemoSections
{
    /// <summary>
    /// The likely causes, best first. The same mistake found from several kinds of claim (same code and identity: a wrong
    /// factor seen in the end moments, span moments and shears of one combination) is one entry that names them all.
    /// </summary>
    public static List<MemoCause> Causes(CaseReview c) =>
        c.AllCauses.GroupBy(x => x.Identity.Length > 0 ? $"{x.Code}|{x.Identity}" : $"{x.Code}|{x.Claims}|{x.Message}").Select(g =>
        {
            var x = g.First();
            var tables = g.Select(k => k.Claims).Distinct().ToList();
            return new MemoCause(x.Code, Fmt.Number(x.Confidence * 100, "0") + " %", Fmt.Number(x.Explains * 100, "0") + " %", x.Message, x.Evidence)
            {
                Title = x.Kind.Term().Title,
                FoundFrom = tables is ["end-moments"] ? "" : Words(tables.Select(t => t.Replace('-', ' ')).ToList()),
            };
        }).ToList();

    /// <summary>"a", "a and b", "a, b and c".</summary>
    private static string Words(List<string> items) => items.Count <= 1 ? string.Concat(items) : $"{string.Join(", ", items[..^1])} and {items[^1]}";

    public static MemoCombination Combination(Combination c, DisplayUnits u)
    {
        _ = u;
        return new MemoCombination(c.Name, c.Words, c.IsPatterned, c.Terms.Select(t => new MemoTerm(t.Case, Fmt.Number(t.Factor, "0.###"),
            t.Patterned ? "spans" : "no", t.Patterned ? Fmt.Number(t.FactorUnloaded, "0.###") : "—", t.Source.Citation)).ToList());
    }

    /// <summary>"Load case G", "Combination ULS-2 = 1 G + 1.5 W", "Combination ULS-1 (envelope) = 1.35 G + 1.5 Q (...)".</summary>
    public static string Heading(CaseReview c) => c.Combination is { } k
        ? $"Combination {c.Case}{(k.IsPatterned ? " (envelope)" : "")} = {k.Words}"
        : $"Load case {c.Case}";

    public static List<MemoSpanRow> Spans(CaseReview c, DisplayUnits u, Func<string, int> order)
    {
        string M(double si) => Fmt.Number(u.Moment.FromSi(si), "0.00");
        string X(double? si) => si is double v ? Fmt.Number(u.Length.FromSi(v), "0.00") : "—";
        return c.SpanMoments.OrderBy(f => order(f.Member)).Select(f => new MemoSpanRow(f.Member, Quoting.Written(f.Claim.Source, f.Claim.AsWritten), X(f.ClaimedX),
            f.Recomputed is double r ? M(r) : "—", X(f.RecomputedX), f.Difference is double d ? Fmt.Number(u.Moment.FromSi(d), "+0.00;-0.00;0.00") : "—",
            f.Status.Json(), f.Claim.Source.Citation)).ToList();
    }

    public static List<MemoShearRow> Shears(CaseReview c, DisplayUnits u, Func<string, int> order)
    {
        string F(double si) => Fmt.Number(u.Force.FromSi(si), "0.00");
        return c.Shears.OrderBy(f => order(f.Member)).ThenBy(f => f.End ?? MemberEnd.End).Select(f => new MemoShearRow(f.Member, f.At,
            Quoting.Written(f.Claim.Source, f.Claim.AsWritten), f.Recomputed is double r ? F(r) : "—",
            f.Difference is double d ? Fmt.Number(u.Force.FromSi(d), "+0.00;-0.00;0.00") : "—", f.Status.Json(), f.Claim.Source.Citation)).ToList();
    }

    public static List<MemoEnvelopeRow> Envelope(CaseReview c, DisplayUnits u, Func<string, int> order)
    {
        string M(double si) => Fmt.Number(u.Moment.FromSi(si), "0.00");
        return c.Envelope.OrderBy(f => order(f.Member)).ThenBy(f => f.IsSpan ? 2 : (int)(f.End ?? MemberEnd.End)).ThenBy(f => f.Bound == "max" ? 0 : 1)
            .Select(f => new MemoEnvelopeRow(f.Member, f.IsSpan ? "span" : f.At, f.Bound, f.AsWritten, f.Recomputed is double r ? M(r) : "—",
                f.Difference is double d ? Fmt.Number(u.Moment.FromSi(d), "+0.00;-0.00;0.00") : "—", f.Status.Json(),
                f.Side switch { EnvelopeSide.Unsafe => "unsafe side", EnvelopeSide.Safe => "conservative", _ => "" },
                f.Recomputed is null ? "" : f.Arrangement + (f.X is double x ? $", at {Fmt.Number(u.Length.FromSi(x), "0.00")} {u.Length.Symbol}" : ""),
                f.AllLoaded is double a ? M(a) : "—", f.Source.Citation)).ToList();
    }

    /// <summary>"α_cr = 7.42: sway effects ×1.16 (second-order treatment needed below 10)"; empty when not computed.</summary>
    public static string Alpha(CaseReview c) => c.AlphaCr is not double a ? ""
        : a >= 10 ? $"Elastic critical load factor α_cr = {SwaySensitivity.Words(a)}: at least 10, so first-order analysis is enough (EN 1993-1-1 clause 5.2.1(3))."
        : a >= 3 ? $"Elastic critical load factor α_cr = {SwaySensitivity.Words(a)}: below 10, second-order effects need treatment; amplifying the sway effects by 1/(1 − 1/α_cr) = {Fmt.Number(1 / (1 - (1 / a)), "0.00")} is allowed (EN 1993-1-1 clause 5.2.2(5)B)."
        : $"Elastic critical load factor α_cr = {SwaySensitivity.Words(a)}: below 3, a second-order analysis is needed (EN 1993-1-1 clause 5.2.2).";
}
