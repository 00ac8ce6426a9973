using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Compares the envelope claims of a combination with a patterned case with the exact envelope: each bound gets a status
/// against the combination's own bands (its peak: the largest extreme at any member end or span). A claim beyond the agree
/// band on the unsafe side (a maximum below the true one, a minimum above it) is an <c>envelope</c> flag, minor or major
/// as the band grades it; on the safe side only an info note ("conservative by ...").
/// </summary>
internal static class EnvelopeComparison
{
    public static CaseReview Review(Submission s, Envelope envelope, Combination combination, ReviewOptions o)
    {
        var quote = new Quoting(s);
        var conv = s.Info.SignConvention;
        var rows = s.Claims.Envelopes.Where(e => e.Combination == combination.Name).ToList();
        var spanMembers = s.Model.Members.Count <= 60 ? s.Model.Members.Select(m => m.Id) : rows.Where(r => r.IsSpan).Select(r => r.Member);
        double peak = s.Model.Members.SelectMany(m => new[] { MemberEnd.Start, MemberEnd.End }.Select(e => envelope.Extremes(r => r.Members[m.Id].MomentAtEnd(e))))
            .SelectMany(x => new[] { Math.Abs(x.Max.Value), Math.Abs(x.Min.Value) })
            .Concat(spanMembers.Where(id => s.Model.TryGetMember(id, out _)).Select(id => Math.Abs(envelope.SpanMaximum(id).Value)))
            .DefaultIfEmpty(0).Max();
        var band = ToleranceBand.For(o, peak, o.AbsoluteTolerance * s.Info.Units.Moment.ToSi);
        var findings = new List<EnvelopeFinding>();
        var flags = new List<Flag>();
        foreach (var row in rows)
        {
            if (!s.Model.TryGetMember(row.Member, out var member) || (!row.IsSpan && row.End is null))
            {
                foreach (var (bound, value, cell) in Bounds(row))
                    findings.Add(new EnvelopeFinding(combination.Name, row.Member, row.At, row.End, row.IsSpan, bound, value, null, EndStatus.Unmatched, null, [], null,
                        cell ?? row.Source, Quoting.Written(cell, quote.MomentUnit.FromSi(value))));
                flags.Add(SectionComparison.Unmatched("envelope", row.Member, row.Max ?? row.Min ?? 0, row.Source, ValueKind.Moment));
                continue;
            }
            foreach (var (bound, claimed, cell) in Bounds(row))
            {
                EnvelopeExtreme truth;
                double allLoaded;
                if (row.IsSpan)
                {
                    truth = envelope.SpanMaximum(member.Id);
                    allLoaded = envelope.AllLoadedSpanMaximum(member.Id).Value;
                }
                else
                {
                    var end = row.End!.Value;
                    double Q(CaseResult r) => conv.FromClockwise(r.Members[member.Id].MomentAtEnd(end), end);
                    var (max, min) = envelope.Extremes(Q, end == MemberEnd.Start ? 0 : s.Model.Length(member));
                    truth = bound == "max" ? max : min;
                    allLoaded = envelope.AllLoadedValue(Q);
                }
                double diff = claimed - truth.Value;
                var status = band.Status(diff);
                EnvelopeSide? side = status == EndStatus.Agree ? null : (bound == "max" ? diff < 0 : diff > 0) ? EnvelopeSide.Unsafe : EnvelopeSide.Safe;
                string written = Quoting.Written(cell, quote.MomentUnit.FromSi(claimed));
                var finding = new EnvelopeFinding(combination.Name, row.Member, row.IsSpan ? "span" : member.JointAt(row.End!.Value), row.End, row.IsSpan, bound, claimed,
                    truth.Value, status, side, truth.Loaded, allLoaded, cell ?? row.Source, written)
                {
                    X = row.IsSpan ? truth.X : null,
                    Arrangement = Arrangement(truth.Loaded, envelope.Patterned.Count),
                };
                findings.Add(finding);
                if (side is { } sd) flags.Add(Flag(quote, band, combination, finding, sd));
            }
        }
        var caseReview = new CaseReview(combination.Name, peak, band, [], [], [], flags, []) { Combination = combination, Envelope = findings };
        return caseReview;
    }

    private static IEnumerable<(string Bound, double Value, SourceRef? Cell)> Bounds(ClaimedEnvelope row)
    {
        if (row.Max is double max) yield return ("max", max, row.MaxSource);
        if (row.Min is double min) yield return ("min", min, row.MinSource);
    }

    private static Flag Flag(Quoting quote, ToleranceBand band, Combination combination, EnvelopeFinding f, EnvelopeSide side)
    {
        string boundWords = f.IsSpan ? "largest span moment" : f.Bound == "max" ? "maximum" : "minimum";
        string claimed = $"{f.AsWritten} {quote.MomentUnit.Symbol}", value = quote.SpanMoment(f.Recomputed!.Value), by = quote.SpanMoment(Math.Abs(f.Difference!.Value));
        string arrangement = f.Arrangement;
        return side == EnvelopeSide.Unsafe
            ? new Flag(FlagKind.Envelope, band.Grade(f.Difference.Value), f.Place, f.Difference, ReviewMessages.EnvelopeUnsafe(combination.Name, boundWords, f.Place.Words, claimed, arrangement, value, by,
                f.X is double x ? quote.Length(x) : null), [f.Source])
            {
                Sections = [f.Key],
                Brief = ReviewMessages.EnvelopeUnsafeBrief(boundWords, f.Place.Words, claimed, value, arrangement),
            }
            : new Flag(FlagKind.Envelope, Severity.Info, f.Place, f.Difference, ReviewMessages.EnvelopeConservative(combination.Name, boundWords, f.Place.Words, claimed, value, by), [f.Source])
            {
                Sections = [f.Key],
                Brief = ReviewMessages.EnvelopeConservative(combination.Name, boundWords, f.Place.Words, claimed, value, by),
            };
    }

    /// <summary>"AB and CD loaded", "every span loaded", "no span loaded" — the arrangement in words.</summary>
    public static string Arrangement(IReadOnlyList<string> loaded, int patterned) => loaded.Count switch
    {
        0 => "no patterned member loaded",
        _ when loaded.Count == patterned => "every patterned member loaded",
        1 => $"{loaded[0]} loaded",
        _ => $"{string.Join(", ", loaded.Take(loaded.Count - 1))} and {loaded[^1]} loaded",
    };
}
