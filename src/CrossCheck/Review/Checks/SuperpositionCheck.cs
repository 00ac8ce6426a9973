using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// A combination's claims are the factored sum of the same submission's case claims, at every fixed point where every case
/// of the combination is claimed: end moments, reactions, displacements and end shears (never span maxima, which need not
/// fall at one place). The tolerance adds half a unit of the last printed digit times Σ|factor| to the agree band. Not run
/// when the model has support movements: each case's claims then hold the movements once, a combination's once in all.
/// </summary>
internal sealed class SuperpositionCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        if (x.Submission.Combination(x.Case.Id) is not { IsPatterned: false } combination || x.Model.HasSupportMovements) return;
        var terms = combination.Terms;
        double sumFactors = terms.Sum(t => Math.Abs(t.Factor));
        var claims = x.Submission.Claims;
        var units = x.Submission.Info.Units;

        // End moments, in the author's unit and convention as written.
        foreach (var (key, cl) in x.Claims)
        {
            var parts = terms.Select(t => claims.EndMoments.FirstOrDefault(c => c.Case == t.Case && c.End == key.End && c.Member == key.Member)).ToList();
            if (parts.Any(p => p is null)) continue;
            Add(flags, Compare(x, combination, x.Band, units.Moment, cl.AsWritten, Quoting.ClaimNumber(cl), cl.Source.Text,
                parts.Select((p, i) => (terms[i].Factor, p!.AsWritten, Quoting.ClaimNumber(p), p.Source.Text, p.Source)).ToList(),
                new MemberEndPlace(key.Member, cl.At, key.End), cl.Source, sumFactors, ValueKind.Moment) is { } f
                ? f with { Ends = [key] } : null);
        }

        // End shears.
        var shears = claims.Shears.Where(c => c.Case == combination.Name && c.End is not null).ToList();
        var shearBand = ClaimedMemberStatics.ShearBand(x, shears);
        foreach (var sh in shears)
        {
            var parts = terms.Select(t => claims.Shears.FirstOrDefault(c => c.Case == t.Case && c.Member == sh.Member && c.End == sh.End)).ToList();
            if (parts.Any(p => p is null)) continue;
            Add(flags, Compare(x, combination, shearBand, units.Force, sh.AsWritten, Quoting.Written(sh.Source, sh.AsWritten), sh.Source.Text,
                parts.Select((p, i) => (terms[i].Factor, p!.AsWritten, Quoting.Written(p.Source, p.AsWritten), p.Source.Text, p.Source)).ToList(),
                new MemberEndPlace(sh.Member, sh.At, sh.End), sh.Source, sumFactors, ValueKind.Force) is { } f
                ? f with { Sections = [new SectionKey(SectionKind.Shear, sh.Member, sh.End)] } : null);
        }

        // Reactions and displacements, component by component.
        Components(x, flags, combination, sumFactors, reaction: true);
        Components(x, flags, combination, sumFactors, reaction: false);
    }

    private static void Add(List<Flag> flags, Flag? f)
    {
        if (f is not null) flags.Add(f);
    }

    private static void Components(CheckContext x, List<Flag> flags, Combination combination, double sumFactors, bool reaction)
    {
        var claims = x.Submission.Claims;
        var own = reaction
            ? claims.Reactions.Where(r => r.Case == combination.Name).Select(r => (r.Joint, Values: Values(r), r.Source)).ToList()
            : claims.Displacements.Where(d => d.Case == combination.Name).Select(d => (d.Joint, Values: Values(d), d.Source)).ToList();
        if (own.Count == 0 || (!reaction && x.Model.RelativeStiffness)) return;
        foreach (var component in reaction ? new[] { "Rx", "Ry", "M" } : ["ux", "uy", "rotation"])
        {
            var unit = x.Quote.UnitOf(component, reaction);
            double peak = own.Select(o => Math.Abs(o.Values.GetValueOrDefault(component) ?? 0)).Max();
            double floor = reaction ? x.Options.AbsoluteTolerance * unit.ToSi : component == "rotation" ? 5e-6 : 0.05 * unit.ToSi;
            var band = ToleranceBand.For(x.Options, peak, floor);
            foreach (var (joint, values, source) in own)
            {
                if (values.GetValueOrDefault(component) is not double mine) continue;
                var parts = combination.Terms.Select(t => (t.Factor, Value: Lookup(claims, t.Case, joint, component, reaction))).ToList();
                if (parts.Any(p => p.Value is null)) continue;
                Add(flags, Compare(x, combination, band, unit, unit.FromSi(mine), Fmt(unit.FromSi(mine)), null,
                    parts.Select(p => (p.Factor, unit.FromSi(p.Value!.Value.Value), Fmt(unit.FromSi(p.Value!.Value.Value)), (string?)null, p.Value!.Value.Source)).ToList(),
                    new ComponentPlace(joint, component), source, sumFactors, reaction ? (component == "M" ? ValueKind.Moment : ValueKind.Force)
                        : component == "rotation" ? ValueKind.Rotation : ValueKind.Displacement));
            }
        }
    }

    private static Dictionary<string, double?> Values(ClaimedReaction r) => new() { ["Rx"] = r.Rx, ["Ry"] = r.Ry, ["M"] = r.M };

    private static Dictionary<string, double?> Values(ClaimedDisplacement d) => new() { ["ux"] = d.Ux, ["uy"] = d.Uy, ["rotation"] = d.Rotation };

    private static (double Value, SourceRef Source)? Lookup(Claims claims, string caseId, string joint, string component, bool reaction)
    {
        if (reaction)
            return claims.Reactions.FirstOrDefault(r => r.Case == caseId && r.Joint == joint) is { } r && Values(r)[component] is double v ? (v, r.Source) : null;
        return claims.Displacements.FirstOrDefault(d => d.Case == caseId && d.Joint == joint) is { } d && Values(d)[component] is double w ? (w, d.Source) : null;
    }

    private static string Fmt(double v) => Common.Fmt.Number(v, "0.0###");

    /// <summary>The flag for one point when the claim differs from the factored sum beyond the band widened by the printing; null otherwise.</summary>
    private static Flag? Compare(CheckContext x, Combination combination, ToleranceBand band, UnitChoice unit, double claimed, string claimedText,
        string? claimedPrinted, List<(double Factor, double Value, string Text, string? Printed, SourceRef Source)> parts, Place place, SourceRef source,
        double sumFactors, ValueKind kind)
    {
        double sum = parts.Sum(p => p.Factor * p.Value);
        double error = claimed - sum;
        double half = parts.Select(p => PrintedDigits.HalfUnit(p.Printed, p.Value)).Append(PrintedDigits.HalfUnit(claimedPrinted, claimed)).Max();
        var sev = band.Plus(unit.ToSiValue(half) * sumFactors).Grade(unit.ToSiValue(error));
        if (sev == Severity.Info) return null;
        string terms = string.Join(" + ", parts.Select(p => $"{Common.Fmt.Number(p.Factor, "0.###")} × {Bracket(p.Text)}"));
        string total = $"{Common.Fmt.Number(sum, "0.0##")} {unit.Symbol}";
        string own = $"{claimedText} {unit.Symbol}";
        return new Flag(FlagKind.Superposition, sev, place, unit.ToSiValue(error),
            ReviewMessages.NotSuperposed(combination.Name, place.Words, own, terms, total, $"{Common.Fmt.Number(Math.Abs(error), "0.0##")} {unit.Symbol}"),
            [source, .. parts.Select(p => p.Source)], kind)
        {
            Brief = ReviewMessages.NotSuperposedBrief(place.Words, own, total),
        };
    }

    private static string Bracket(string text) => text.StartsWith('-') || text.StartsWith('−') ? $"({text})" : text;
}

/// <summary>The rounding of a printed figure: half a unit of its last printed digit.</summary>
internal static class PrintedDigits
{
    /// <summary>
    /// Half a unit of the last digit of <paramref name="printed"/> (<c>12.35</c> → 0.005), or, when the text is not known, of
    /// the fewest decimals (up to four) that write <paramref name="value"/> exactly; in the figure's own unit.
    /// </summary>
    public static double HalfUnit(string? printed, double value)
    {
        int decimals;
        if (printed is { Length: > 0 } && printed.Any(char.IsAsciiDigit))
        {
            string t = printed.Trim();
            int point = t.LastIndexOfAny(['.', ',']);
            decimals = point < 0 ? 0 : t.Skip(point + 1).TakeWhile(char.IsAsciiDigit).Count();
        }
        else
        {
            decimals = Enumerable.Range(0, 5).FirstOrDefault(d => Math.Abs(Math.Round(value, d) - value) <= 1e-9 * Math.Max(1, Math.Abs(value)), 4);
        }
        return 0.5 * Math.Pow(10, -decimals);
    }
}
