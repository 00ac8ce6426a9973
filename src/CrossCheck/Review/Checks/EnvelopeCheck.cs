using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// An envelope holds every arrangement of its patterned case, so its maximum cannot lie below — nor its minimum above — an
/// arrangement the author's own figures give: every span loaded (each case's claim times its factor) and, when no
/// patterned case has joint loads, every span unloaded (the patterned claims times their unloaded factor). At an end from
/// the cases' claimed end moments; in the span from statics of the member under the claimed end moments of every span
/// loaded. Not run when the model has support movements (each case's claims hold them once).
/// </summary>
internal sealed class EnvelopeCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        if (x.Submission.Combination(x.Case.Id) is not { IsPatterned: true } combination || x.Model.HasSupportMovements) return;
        var rows = x.Submission.Claims.Envelopes.Where(e => e.Combination == combination.Name && x.Model.TryGetMember(e.Member, out _)).ToList();
        if (rows.Count == 0) return;
        double peak = rows.SelectMany(r => new[] { r.Max, r.Min }).OfType<double>().Select(Math.Abs).DefaultIfEmpty(0).Max();
        var band = ToleranceBand.For(x.Options, peak, x.Options.AbsoluteTolerance * x.Submission.Info.Units.Moment.ToSi);
        bool noneLoadedKnown = combination.Terms.Where(t => t.Patterned).All(t => x.Submission.Case(t.Case)?.JointLoads.Any() != true);
        foreach (var row in rows)
        {
            var m = x.Model.Member(row.Member);
            var arrangements = new List<(string Words, Func<CombinationTerm, double> Factor)> { ("every span loaded", t => t.Factor) };
            if (noneLoadedKnown) arrangements.Add(("no span loaded", t => t.Patterned ? t.FactorUnloaded : t.Factor));
            foreach (var (words, factor) in arrangements)
            {
                var value = row.IsSpan ? SpanValue(x, combination, m, factor) : EndValue(x, combination, row, factor);
                if (value is not var (v, terms, sources)) continue;
                if (row.Max is double max) Check(x, flags, band, combination, row, "maximum", max, v, terms, words, sources, max - v < 0);
                if (row.Min is double min) Check(x, flags, band, combination, row, "minimum", min, v, terms, words, sources, min - v > 0);
            }
        }
    }

    private static void Check(CheckContext x, List<Flag> flags, ToleranceBand band, Combination combination, ClaimedEnvelope row, string bound, double claimed,
        double value, string terms, string arrangement, List<SourceRef> sources, bool shortOf)
    {
        if (!shortOf) return;
        double error = claimed - value;
        var sev = band.Grade(error);
        if (sev == Severity.Info) return;
        Place place = row.IsSpan ? new MemberPlace(row.Member) : new MemberEndPlace(row.Member, x.Model.Member(row.Member).JointAt(row.End!.Value), row.End);
        var cell = bound == "maximum" ? row.MaxSource : row.MinSource;
        string claimedText = $"{Quoting.Written(cell, x.Quote.MomentUnit.FromSi(claimed))} {x.Quote.MomentUnit.Symbol}";
        string valueText = x.Quote.SpanMoment(value);
        string words = row.IsSpan ? "largest span moment" : bound;
        flags.Add(new Flag(FlagKind.Envelope, sev, place, error,
            ReviewMessages.EnvelopeBelowOwnFigures(combination.Name, words, place.Words, claimedText, arrangement, terms, valueText), [row.Source, .. sources])
        {
            Sections = [new SectionKey(SectionKind.Envelope, row.Member, row.End, bound == "maximum" ? "max" : "min")],
            Brief = ReviewMessages.EnvelopeBelowOwnFiguresBrief(words, place.Words, claimedText, valueText, arrangement),
        });
    }

    /// <summary>The end moment (in the submission's convention) the cases' claims give for one arrangement, with its working.</summary>
    private static (double Value, string Terms, List<SourceRef> Sources)? EndValue(CheckContext x, Combination combination, ClaimedEnvelope row, Func<CombinationTerm, double> factor)
    {
        if (row.End is not MemberEnd end) return null;
        var parts = combination.Terms.Select(t => (Term: t, Claim: x.Submission.Claims.EndMoments.FirstOrDefault(c => c.Case == t.Case && c.Member == row.Member && c.End == end))).ToList();
        if (parts.Any(p => p.Claim is null)) return null;
        double value = parts.Sum(p => factor(p.Term) * x.Quote.Convention.FromClockwise(p.Claim!.Moment, end));
        string terms = string.Join(" + ", parts.Select(p => $"{Common.Fmt.Number(factor(p.Term), "0.###")} × {Signed(Quoting.ClaimNumber(p.Claim!))}"));
        return (value, terms, parts.Select(p => p.Claim!.Source).ToList());
    }

    /// <summary>The largest span moment statics gives for one arrangement from the cases' claimed end moments, factored and added.</summary>
    private static (double Value, string Terms, List<SourceRef> Sources)? SpanValue(CheckContext x, Combination combination, Member m, Func<CombinationTerm, double> factor)
    {
        var moments = new double[2];
        var sources = new List<SourceRef>();
        foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
            foreach (var t in combination.Terms)
            {
                if (x.Submission.Claims.EndMoments.FirstOrDefault(c => c.Case == t.Case && c.Member == m.Id && c.End == end) is { } cl)
                {
                    moments[(int)end] += factor(t) * cl.Moment;
                    sources.Add(cl.Source);
                }
                else if (!m.IsReleased(end)) return null;
            }
        var (cos, sin, length) = x.Statics.Geometry(m);
        var actions = combination.Terms.SelectMany(t => (x.Submission.Case(t.Case)?.MemberLoads ?? []).Where(l => l.Member == m.Id)
            .Select(l => factor(t) == 0 ? null : LocalLoads.Resolve((MemberLoad)l.Scaled(factor(t), combination.Name), cos, sin))).OfType<LocalAction>().ToArray();
        var (_, value) = MemberStatics.FromEndMoments(m, length, cos, sin, moments[0], moments[1], actions).SpanMaximum;
        return (value, "statics of the member under the factored claimed end moments", sources);
    }

    private static string Signed(string text) => text.StartsWith('-') || text.StartsWith('−') ? $"({text})" : text;
}
