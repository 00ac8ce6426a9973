using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// A wrong fixed-end moment that a person recognises: the formula of another load shape or position (PL/8 for an
/// off-centre load, PL/4, wL²/8, a partial load taken as full, a triangle the wrong way round or taken as uniform), a
/// position measured from the wrong end, a magnitude with its decimal point moved, a sign, or the two ends' values
/// exchanged. Each variant fixes both fixed-end moments of the member from the load itself; nothing is fitted. The
/// effect on the claims is superposed from locked end moments solved on the structure without its support movements,
/// which the recomputed moments already hold, with the shared factor; a variant whose effect cannot overlap the
/// differences enough to explain them (<see cref="Evidence.MayExplain(double)"/>) is not formed.
/// </summary>
internal sealed class FixedEndMomentFamily : IHypothesisFamily
{
    private sealed record Slip(string Words, string Key, double Start, double End);

    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var loads = x.Case.MemberLoads.Where(l => x.Model.TryGetMember(l.Member, out _)).ToList();
        if (loads.Count == 0) yield break;
        // Influence of a unit locked-in end moment at a member's two ends on the compared claims: two solves with the
        // shared factor, made only for members with a slip worth scoring.
        var influence = new Dictionary<string, (double[] Start, double[] End)>(StringComparer.Ordinal);
        var src = new SourceRef("diagnosis");
        (double[] Start, double[] End) Influence(string m)
        {
            if (influence.TryGetValue(m, out var known)) return known;
            return influence[m] = (x.LoadEffect([new LockedEndMoments("u", m, 1, 0, src)]), x.LoadEffect([new LockedEndMoments("u", m, 0, 1, src)]));
        }
        double[] Shift(string m, double d1, double d2)
        {
            var (i1, i2) = Influence(m);
            var p = (double[])x.Recomputed.Clone();
            for (int i = 0; i < p.Length; i++) p[i] += (d1 * i1[i]) + (d2 * i2[i]);
            return p;
        }
        // The slip's change of the claims overlaps their differences by e·δ, which the adjoint gives without solving: for
        // locked-in end moments d1, d2 it is d1·g1 + d2·g2, with g the overlap of a unit locked-in moment at each end.
        var overlaps = new Dictionary<string, (double Start, double End)>(StringComparer.Ordinal);
        bool MayExplain(IEnumerable<(string Member, double D1, double D2)> changes)
        {
            if (x.Evidence.Adjoint is not { } adjoint) return true;
            double overlap = 0;
            foreach (var (m, d1, d2) in changes)
            {
                if (!overlaps.TryGetValue(m, out var g))
                    overlaps[m] = g = (adjoint.Of(new LockedEndMoments("u", m, 1, 0, src)), adjoint.Of(new LockedEndMoments("u", m, 0, 1, src)));
                overlap += (d1 * g.Start) + (d2 * g.End);
            }
            return x.Evidence.MayExplain(overlap);
        }
        var systematic = new Dictionary<string, List<(string Member, double D1, double D2)>>(StringComparer.Ordinal);
        foreach (var load in loads)
        {
            var m = x.Model.Member(load.Member);
            var (f1, f2) = x.FixedEndMoments(m, load);
            string what = x.Describe(load);
            foreach (var slip in Slips(x, m, load, f1, f2))
            {
                double d1 = slip.Start - f1, d2 = slip.End - f2;
                if (Math.Abs(d1) + Math.Abs(d2) <= 1e-9 * (Math.Abs(f1) + Math.Abs(f2) + 1e-300)) continue;
                if (!systematic.TryGetValue(slip.Key, out var list)) systematic[slip.Key] = list = [];
                list.Add((m.Id, d1, d2));
                if (!MayExplain([(m.Id, d1, d2)])) continue;
                yield return new Hypothesis(CauseCode.FixedEndMoment, 3, Shift(m.Id, d1, d2),
                    $"Member {m.Id}, {what}: the author appears to have {slip.Words}. The claims match fixed-end moments of {x.FemPair(m, slip.Start, slip.End)}.")
                {
                    CorrectWorking = $"With {Formula(load, x.Model.Length(m))} the fixed-end moments of member {m.Id} are {x.FemPair(m, f1, f2)}.",
                    Identity = $"fixed-end-moment|{m.Id}|{slip.Key}|{load.Source.Compact}",
                    Place = new MemberPlace(m.Id),
                };
            }
        }
        foreach (var (key, changes) in systematic.Where(kv => kv.Value.Count > 1 && kv.Key is "udl-8" or "point-central" or "point-pl4" or "linear-swapped"))
        {
            if (!MayExplain(changes)) continue;
            string text = key switch
            {
                "udl-8" => "used wL²/8 instead of wL²/12 for every uniform load",
                "point-central" => "used PL/8 for every off-centre point load, as if it were central",
                "point-pl4" => "used PL/4 instead of the fixed-end formula for every point load",
                _ => "swapped the ends of every linearly varying load",
            };
            // Every member's slip at once: one solve of all the locked-in differences together.
            var effect = x.LoadEffect(changes.Select(c => (Load)new LockedEndMoments("·", c.Member, c.D1, c.D2, src)).ToList());
            yield return new Hypothesis(CauseCode.FixedEndMoment, 3, x.Recomputed.Zip(effect, (a, b) => a + b).ToArray(),
                $"The author appears to have {text} (members {string.Join(", ", changes.Select(c => c.Member).Distinct())}).")
            { Identity = $"fixed-end-moment|all|{key}" };
        }
    }

    private static IEnumerable<Slip> Slips(DiagnosisContext x, Member m, MemberLoad load, double f1, double f2)
    {
        double L = x.Model.Length(m);
        switch (load)
        {
            case PointLoad p when Math.Abs(p.A - (L / 2)) > 1e-6 * L:
            {
                var (c1, c2) = x.FixedEndMoments(m, p with { A = L / 2 });
                yield return new("used the central-load value PL/8 for a point load that is not at mid-span", "point-central", c1, c2);
                yield return new("used PL/4 (the simply supported span moment) for the point load", "point-pl4", 2 * c1, 2 * c2);
                var (o1, o2) = x.FixedEndMoments(m, p with { A = L - p.A });
                yield return new("measured the point load's position from the wrong end", "point-flipped", o1, o2);
                yield return new("exchanged the two fixed-end moments (Pa²b/L² at the start, Pab²/L² at the end)", "exchanged", -f2, -f1);
                break;
            }
            case PointLoad:
                yield return new("used PL/4 (the simply supported span moment) instead of PL/8 for the central point load", "point-pl4", 2 * f1, 2 * f2);
                break;
            case DistributedLoad d when d.IsUniform && d.A <= 1e-9 * L && d.B >= L * (1 - 1e-9):
                yield return new("used wL²/8 (the simply supported span moment) instead of wL²/12 for the uniform load", "udl-8", 1.5 * f1, 1.5 * f2);
                break;
            case DistributedLoad d when d.IsUniform:
            {
                var (u1, u2) = x.FixedEndMoments(m, d with { A = 0, B = L });
                yield return new("taken the partial uniform load as acting over the whole member", "udl-full", u1, u2);
                break;
            }
            case DistributedLoad d:
            {
                var (s1, s2) = x.FixedEndMoments(m, d with { WStart = d.WEnd, WEnd = d.WStart });
                yield return new("swapped the ends of the linearly varying load (wL²/30 and wL²/20 exchanged)", "linear-swapped", s1, s2);
                double mean = (d.WStart + d.WEnd) / 2, peak = Math.Max(d.WStart, d.WEnd);
                var (a1, a2) = x.FixedEndMoments(m, d with { WStart = mean, WEnd = mean });
                yield return new("treated the linearly varying load as uniform at its average intensity", "linear-mean", a1, a2);
                var (p1, p2) = x.FixedEndMoments(m, d with { WStart = peak, WEnd = peak });
                yield return new("treated the linearly varying load as uniform at its peak intensity", "linear-peak", p1, p2);
                break;
            }
            case MemberCouple cp:
            {
                var (o1, o2) = x.FixedEndMoments(m, cp with { A = L - cp.A });
                yield return new("measured the couple's position from the wrong end", "couple-flipped", o1, o2);
                yield return new("taken the couple with the wrong sense", "couple-sign", -f1, -f2);
                yield break;
            }
        }
        yield return new("taken the load in the wrong direction (both fixed-end moments with the wrong sign)", "sign-both", -f1, -f2);
        yield return new("given the fixed-end moment at the start the wrong sign", "sign-start", -f1, f2);
        yield return new("given the fixed-end moment at the end the wrong sign", "sign-end", f1, -f2);
        yield return new("used a load magnitude with its decimal point moved (ten times too large)", "magnitude-x10", 10 * f1, 10 * f2);
        yield return new("used a load magnitude with its decimal point moved (a tenth of it)", "magnitude-div10", f1 / 10, f2 / 10);
    }

    /// <summary>The fixed-end formula of a load in the trade's words (Erochko FEM table; docs/REFERENCE-CHECKS.md group 1).</summary>
    private static string Formula(MemberLoad load, double L) => load switch
    {
        PointLoad p when Math.Abs(p.A - (L / 2)) <= 1e-6 * L => "PL/8",
        PointLoad => "Pab²/L² and Pa²b/L²",
        DistributedLoad d when d.IsUniform && d.A <= 1e-9 * L && d.B >= L * (1 - 1e-9) => "wL²/12",
        DistributedLoad d when d.IsUniform => "the fixed-end formula of a partial uniform load",
        DistributedLoad d when d.A <= 1e-9 * L && d.B >= L * (1 - 1e-9) && (d.WStart == 0 || d.WEnd == 0) => "wL²/30 and wL²/20",
        DistributedLoad => "the fixed-end formula of a linearly varying load",
        MemberCouple => "Mb(2a − b)/L² and Ma(2b − a)/L²",
        _ => "the fixed-end formula of the load",
    };
}
