using System.Globalization;
using System.Text;
using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;
using static CrossCheck.Tests.Support.HandMethods;

namespace CrossCheck.Tests.Review.Diagnosis;

/// <summary>
/// The twin of <see cref="DiagnosisQualityTests"/> for the causes found in combinations, envelopes, span moments and shears:
/// every cause planted in reference cases by an independent route — the three-moment and slope-deflection equations
/// (<see cref="HandMethods"/>), span statics by hand (<see cref="HandSpan"/>), every arrangement of a patterned load
/// enumerated by hand, and the portal formulas of docs/REFERENCE-CHECKS.md group 5 — never the product's solver. Per cause:
/// how often it is ranked first and found; on the correct claims of the same structures and on random single slips, how
/// many false causes. The table is printed (run with <c>--logger "console;verbosity=detailed"</c>). kN and m.
/// </summary>
public class SectionDiagnosisQualityTests(ITestOutputHelper output)
{
    private const double L = 6, G = 18, Q = 12, GammaG = 1.35, GammaQ = 1.5;
    private const MemberEnd S = MemberEnd.Start, En = MemberEnd.End;
    private static readonly SourceRef Here = new("planted.csv");

    /// <summary>A submission with a planted mistake: <c>Make(true)</c> holds the mistake, <c>Make(false)</c> the correct claims by the same hand route.</summary>
    public sealed record PlantedSection(string Code, string Name, string Case, Func<bool, Submission> Make)
    {
        public override string ToString() => $"{Code}: {Name}";
    }

    // ---- building submissions -----------------------------------------------------------------------------

    private static FrameBuilder Beam(int n, double g = G, double q = Q)
    {
        var b = FrameBuilder.Beam(Enumerable.Repeat(L, n).ToArray(), Enumerable.Range(0, n + 1).Select(i => i == 0 ? Restraint.Pinned : Restraint.Roller).ToArray(),
            200e6, Enumerable.Repeat(2.5e-4, n).ToArray());
        for (int k = 1; k <= n; k++) b.Udl("S" + k, g, c: "G").Udl("S" + k, q, c: "Q");
        return b;
    }

    private static Combination Combo(string name, params (string Case, double Factor, bool Patterned)[] terms) =>
        new(name, terms.Select(t => new CombinationTerm(t.Case, t.Factor, t.Patterned, 0, Here)).ToList(), Here);

    private static string Text(double v) => v.ToString("0.00", CultureInfo.InvariantCulture);

    private static double Written(double v) => Math.Round(v, 2);

    private static Submission Make(FrameBuilder b, Combination[] combos, Claims claims)
    {
        var units = new DisplayUnits(new UnitChoice("kN", 1), new UnitChoice("m", 1), new UnitChoice("kN·m", 1), new UnitChoice("m", 1));
        return new Submission("planted.csv", SubmissionInfo.Empty with { Units = units }, b.Model, b.Cases, claims) { Combinations = combos };
    }

    private static ClaimedEndMoment End(string c, string member, MemberEnd end, double v) =>
        new(c, member, end == S ? "start" : "end", end, Written(v), Written(v), Here with { Text = Text(v) });

    private static ClaimedSpanMoment Span(string c, string member, double v) => new(c, member, Written(v), Written(v), null, Here with { Text = Text(v) });

    private static ClaimedShear Shear(string c, string member, MemberEnd end, double v) =>
        new(c, member, end == S ? "start" : "end", end, Written(v), Written(v), Here with { Text = Text(v) });

    private static ClaimedEnvelope EnvEnd(string c, string member, MemberEnd end, double max, double min) =>
        new(c, member, end == S ? "start" : "end", end, false, Written(max), Written(min), Here)
        {
            MaxSource = Here with { Text = Text(max) }, MinSource = Here with { Text = Text(min) }, MaxAsWritten = Written(max), MinAsWritten = Written(min),
        };

    private static ClaimedEnvelope EnvSpan(string c, string member, double max) =>
        new(c, member, "span", null, true, Written(max), null, Here) { MaxSource = Here with { Text = Text(max) }, MaxAsWritten = Written(max) };

    // ---- hand methods for n equal spans under uniform loads --------------------------------------------------

    /// <summary>End moments (clockwise) of n equal pin/roller-supported spans under uniform loads w per span: slope-deflection by hand.</summary>
    private static (double S, double E)[] Moments(double[] w) =>
        SlopeDeflection(Enumerable.Repeat(1.0, w.Length).ToArray(), new bool[w.Length + 1], w.Select(x => Udl(x, L)).ToArray());

    /// <summary>
    /// Every quantity of a combination g·G + q·Q over every arrangement of Q span by span (2ⁿ arrangements enumerated by hand):
    /// the largest and least end moments (clockwise) and the largest span moment of each span.
    /// </summary>
    private static Dictionary<string, (double Max, double Min)> HandEnvelope(int n, double g, double q, Func<double[], (double S, double E)[], int, double>? span = null)
    {
        span ??= (w, m, i) => HandSpan.Maximum(w[i], L, m[i].S, m[i].E);
        var result = new Dictionary<string, (double Max, double Min)>(StringComparer.Ordinal);
        void Take(string key, double v) =>
            result[key] = result.TryGetValue(key, out var x) ? (Math.Max(x.Max, v), Math.Min(x.Min, v)) : (v, v);
        for (int mask = 0; mask < 1 << n; mask++)
        {
            var w = Enumerable.Range(0, n).Select(i => g + ((mask >> i & 1) == 1 ? q : 0)).ToArray();
            var m = Moments(w);
            for (int i = 0; i < n; i++)
            {
                Take($"S{i + 1}@start", m[i].S);
                Take($"S{i + 1}@end", m[i].E);
                Take($"S{i + 1}@span", span(w, m, i));
            }
        }
        return result;
    }

    /// <summary>The envelope claims of combination <paramref name="c"/> of n spans: interior ends (max, min) and span maxima, from <paramref name="env"/>.</summary>
    private static List<ClaimedEnvelope> EnvelopeRows(string c, int n, Dictionary<string, (double Max, double Min)> env)
    {
        var rows = new List<ClaimedEnvelope>();
        for (int i = 1; i <= n; i++)
        {
            if (i > 1) rows.Add(EnvEnd(c, "S" + i, S, env[$"S{i}@start"].Max, env[$"S{i}@start"].Min));
            if (i < n) rows.Add(EnvEnd(c, "S" + i, En, env[$"S{i}@end"].Max, env[$"S{i}@end"].Min));
            rows.Add(EnvSpan(c, "S" + i, env[$"S{i}@span"].Max));
        }
        return rows;
    }

    private static Submission Envelope(int n, Func<bool, Dictionary<string, (double Max, double Min)>> claimed, bool mistake) =>
        Make(Beam(n), [Combo("ENV", ("G", GammaG, false), ("Q", GammaQ, true))], Claims.None with { Envelopes = EnvelopeRows("ENV", n, claimed(mistake)) });

    /// <summary>Span moments of case <paramref name="c"/> (uniform load w on every span of n), the maxima or, by slip, another hand value.</summary>
    private static Submission Spans(int n, string c, Combination[] combos, double w, Func<double, double, double, double>? slip, bool mistake, double wClaimed = double.NaN)
    {
        double wc = double.IsNaN(wClaimed) ? w : wClaimed;
        var m = Moments(Enumerable.Repeat(wc, n).ToArray());
        var claims = Enumerable.Range(0, n).Select(i => Span(c, "S" + (i + 1),
            mistake && slip is not null ? slip(wc, m[i].S, m[i].E) : HandSpan.Maximum(mistake ? wc : w, L, Moments(Enumerable.Repeat(mistake ? wc : w, n).ToArray())[i].S,
                Moments(Enumerable.Repeat(mistake ? wc : w, n).ToArray())[i].E))).ToList();
        return Make(Beam(n), combos, Claims.None with { SpanMoments = claims });
    }

    /// <summary>End shears of case <paramref name="c"/> on n spans under w; by slip the simple-beam shears ±wL/2.</summary>
    private static Submission Shears(FrameBuilder b, int n, string c, Combination[] combos, double w, bool free, double wClaimed = double.NaN)
    {
        double wc = double.IsNaN(wClaimed) ? w : wClaimed;
        var m = Moments(Enumerable.Repeat(wc, n).ToArray());
        var claims = new List<ClaimedShear>();
        for (int i = 0; i < n; i++)
        {
            var (m1, m2) = free ? (0.0, 0.0) : m[i];
            claims.Add(Shear(c, "S" + (i + 1), S, HandSpan.StartShear(wc, L, m1, m2)));
            claims.Add(Shear(c, "S" + (i + 1), En, HandSpan.EndShear(wc, L, m1, m2)));
        }
        return Make(b, combos, Claims.None with { Shears = claims });
    }

    /// <summary>End moments of case <paramref name="c"/> on n spans under uniform load w on every span.</summary>
    private static Submission Ends(int n, string c, Combination[] combos, double w)
    {
        var m = Moments(Enumerable.Repeat(w, n).ToArray());
        var claims = Enumerable.Range(0, n).SelectMany(i => new[] { End(c, "S" + (i + 1), S, m[i].S), End(c, "S" + (i + 1), En, m[i].E) }).ToList();
        return Make(Beam(n), combos, new Claims(claims, [], []));
    }

    // Portal 5.1 / 5.3 of docs/REFERENCE-CHECKS.md (k = 0.5, fixed feet, h = 4, L = 6): Kleinlogel-type formulas re-derived by slope-deflection
    // (from memory), checked in ReferencePortalFrameTests. G: UDL 18 kN/m on BC; W: 30 kN at B.
    private static double[] PortalG()
    {
        double m = G * 36 / (6 * 2.5);
        return [m / 2, m, -m, m, -m, -m / 2];
    }

    private static double[] PortalW()
    {
        const double k = 0.5, h = 4, hLoad = 30;
        double foot = -hLoad * h * ((3 * k) + 1) / (2 * ((6 * k) + 1)), knee = 3 * k * hLoad * h / (2 * ((6 * k) + 1));
        return [foot, -knee, knee, knee, -knee, foot];
    }

    private static Submission Portal(string c, Combination combo, double g, double w)
    {
        var b = ReferenceModels.Portal(0.5, Restraint.Fixed).Udl("BC", G, c: "G").Force("B", 30, LoadDirection.Right, c: "W");
        var pg = PortalG();
        var pw = PortalW();
        var v = pg.Select((x, i) => (g * x) + (w * pw[i])).ToArray();
        (string, MemberEnd)[] ends = [("AB", S), ("AB", En), ("BC", S), ("BC", En), ("DC", En), ("DC", S)];
        var claims = ends.Select((e, i) => End(c, e.Item1, e.Item2, v[i])).ToList();
        return Make(b, [combo], new Claims(claims, [], []));
    }

    private static readonly Combination Uls = Combo("ULS", ("G", GammaG, false), ("Q", GammaQ, false));
    private static readonly Combination UlsW = Combo("ULS-W", ("G", 1.0, false), ("W", 1.5, false));
    private const double WUls = (GammaG * G) + (GammaQ * Q);

    public static TheoryData<PlantedSection> All => new(
    [
        // pattern-ignored: the envelope written with every span loaded (the all-loaded arrangement, by hand).
        new("pattern-ignored", "2 spans, 1.35G + 1.5Q patterned", "ENV", m => Envelope(2, x => x ? HandEnvelope(2, WUls, 0) : HandEnvelope(2, GammaG * G, GammaQ * Q), m)),
        new("pattern-ignored", "3 spans, 1.35G + 1.5Q patterned", "ENV", m => Envelope(3, x => x ? HandEnvelope(3, WUls, 0) : HandEnvelope(3, GammaG * G, GammaQ * Q), m)),
        new("pattern-ignored", "4 spans, 1.35G + 1.5Q patterned", "ENV", m => Envelope(4, x => x ? HandEnvelope(4, WUls, 0) : HandEnvelope(4, GammaG * G, GammaQ * Q), m)),

        // midspan-not-maximum: span moments taken at L/2 ((m1 − m2)/2 + wL²/8).
        new("midspan-not-maximum", "2 spans, dead load", "G", m => Spans(2, "G", [], G, (w, m1, m2) => HandSpan.Midspan(w, L, m1, m2), m)),
        new("midspan-not-maximum", "4 spans, dead load", "G", m => Spans(4, "G", [], G, (w, m1, m2) => HandSpan.Midspan(w, L, m1, m2), m)),
        new("midspan-not-maximum", "3 spans, derived 1.35G + 1.5Q", "ULS", m => Spans(3, "ULS", [Uls], WUls, (w, m1, m2) => HandSpan.Midspan(w, L, m1, m2), m)),
        new("midspan-not-maximum", "2 spans, envelope span rows at mid-span", "ENV", m => Envelope(2, x => x
            ? HandEnvelope(2, GammaG * G, GammaQ * Q, (w, mm, i) => HandSpan.Midspan(w[i], L, mm[i].S, mm[i].E))
            : HandEnvelope(2, GammaG * G, GammaQ * Q), m)),

        // free-moment: wL²/8 of a simple span.
        new("free-moment", "2 spans, dead load", "G", m => Spans(2, "G", [], G, (w, _, _) => w * L * L / 8, m)),
        new("free-moment", "3 spans, derived 1.35G + 1.5Q", "ULS", m => Spans(3, "ULS", [Uls], WUls, (w, _, _) => w * L * L / 8, m)),
        new("free-moment", "4 spans, dead load", "G", m => Spans(4, "G", [], G, (w, _, _) => w * L * L / 8, m)),

        // shear-without-moment: ±wL/2 at both ends.
        new("shear-without-moment", "2 spans, dead load", "G", m => Shears(Beam(2), 2, "G", [], G, m)),
        new("shear-without-moment", "3 spans, derived 1.35G + 1.5Q", "ULS", m => Shears(Beam(3), 3, "ULS", [Uls], WUls, m)),
        new("shear-without-moment", "4 spans, dead load", "G", m => Shears(Beam(4), 4, "G", [], G, m)),

        // combination-factor: one case's factor wrong (end moments, span moments, shears, envelope, a portal).
        new("combination-factor", "3 spans, end moments with Q at 1.35", "ULS", m => Ends(3, "ULS", [Uls], m ? (GammaG * G) + (1.35 * Q) : WUls)),
        new("combination-factor", "3 spans, span moments with G at 1.5", "ULS", m => Spans(3, "ULS", [Uls], WUls, null, m, m ? (1.5 * G) + (GammaQ * Q) : WUls)),
        new("combination-factor", "2 spans, shears with Q at 1.35", "ULS", m => Shears(Beam(2), 2, "ULS", [Uls], WUls, false, m ? (GammaG * G) + (1.35 * Q) : WUls)),
        new("combination-factor", "2 spans, envelope with Q at 1.35", "ENV", m => Envelope(2, x => HandEnvelope(2, GammaG * G, x ? 1.35 * Q : GammaQ * Q), m)),
        new("combination-factor", "portal 5.1 + 5.3, W at 1.35", "ULS-W", m => Portal("ULS-W", UlsW, 1.0, m ? 1.35 : 1.5)),

        // combination-case-missing: one case left out.
        new("combination-case-missing", "3 spans, end moments without Q", "ULS", m => Ends(3, "ULS", [Uls], m ? GammaG * G : WUls)),
        new("combination-case-missing", "2 spans, span moments without Q", "ULS", m => Spans(2, "ULS", [Uls], WUls, null, m, m ? GammaG * G : WUls)),
        new("combination-case-missing", "portal 5.1 + 5.3 without G", "ULS-W", m => Portal("ULS-W", UlsW, m ? 0 : 1.0, 1.5)),
        new("combination-case-missing", "2 spans, envelope without G", "ENV", m => Envelope(2, x => HandEnvelope(2, x ? 0 : GammaG * G, GammaQ * Q), m)),
    ]);

    private static ReviewResult Review(Submission s) => ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases));

    private static CaseReview CaseOf(ReviewResult r, string id) => r.Cases.Single(c => c.Case == id);

    [Theory]
    [MemberData(nameof(All))]
    public void PlantedMistake_RanksFirst(PlantedSection planted)
    {
        var c = CaseOf(Review(planted.Make(true)), planted.Case);
        var causes = c.AllCauses.ToList();
        output.WriteLine(string.Join("\n", causes.Select(x => $"{x.Code} ({x.Claims}) {x.Confidence} {x.Explains}: {x.Message}")));
        // The first cause of the kind of claims planted.
        causes.ShouldNotBeEmpty();
        causes.OrderByDescending(x => x.Reproduces).First().Code.ShouldBe(planted.Code);
    }

    [Theory]
    [MemberData(nameof(All))]
    public void CorrectClaims_AgreeAndGiveNoCause(PlantedSection planted)
    {
        var r = Review(planted.Make(false));
        var c = CaseOf(r, planted.Case);
        c.AllCauses.ShouldBeEmpty();
        // The hand route (slope-deflection, span statics, every arrangement enumerated) and the product agree on every figure.
        c.SpanMoments.ShouldAllBe(x => x.Status == EndStatus.Agree);
        c.Shears.ShouldAllBe(x => x.Status == EndStatus.Agree);
        c.Envelope.ShouldAllBe(x => x.Status == EndStatus.Agree);
        c.EndMoments.Where(e => e.Claimed is not null).ShouldAllBe(e => e.Status == EndStatus.Agree);
        r.Verdict.ShouldBe(Verdict.Concur, string.Join("\n", r.Comments.Select(x => x.Text)));
        (c.SpanMoments.Count + c.Shears.Count + c.Envelope.Count + c.EndMoments.Count(e => e.Claimed is not null)).ShouldBeGreaterThan(0, planted.Name);
    }

    [Fact]
    public void PerCause_RankedFirstAndFound_AndNoFalseCauses()
    {
        var rows = new SortedDictionary<string, (int Planted, int First, int Found)>(StringComparer.Ordinal);
        int correct = 0, correctFalse = 0, slips = 0, slipFalse = 0;
        var falseCodes = new SortedDictionary<string, int>(StringComparer.Ordinal);
        var rnd = new Random(20261205);
        foreach (var planted in ((IEnumerable<object[]>)All).Select(d => (PlantedSection)d[0]))
        {
            var causes = CaseOf(Review(planted.Make(true)), planted.Case).AllCauses.OrderByDescending(x => x.Reproduces).ToList();
            var (n, first, found) = rows.GetValueOrDefault(planted.Code);
            rows[planted.Code] = (n + 1, first + (causes.FirstOrDefault()?.Code == planted.Code ? 1 : 0), found + (causes.Any(x => x.Code == planted.Code) ? 1 : 0));

            var right = planted.Make(false);
            correct++;
            correctFalse += CaseOf(Review(right), planted.Case).AllCauses.Count();
            // Random single slips: one claim off by 5–60 % of the largest claim of its kind, written to two decimals.
            foreach (var slipped in Slips(right, rnd))
            {
                slips++;
                var found2 = CaseOf(Review(slipped), planted.Case).AllCauses.ToList();
                if (found2.Count == 0) continue;
                slipFalse++;
                foreach (var x in found2) falseCodes[x.Code] = falseCodes.GetValueOrDefault(x.Code) + 1;
                output.WriteLine($"false cause on {planted.Name}: {string.Join(", ", found2.Select(x => x.Code))}");
            }
        }
        var table = new StringBuilder("cause                        planted ranked first  found\n");
        foreach (var (code, (n, first, found)) in rows)
            table.Append(CultureInfo.InvariantCulture, $"{code,-28} {n,6}  {first,12}  {found,5}\n");
        table.Append(CultureInfo.InvariantCulture, $"correct submissions: {correct}, false causes: {correctFalse}\n");
        table.Append(CultureInfo.InvariantCulture, $"random single slips: {slips}, with a false cause: {slipFalse} ({string.Join(", ", falseCodes.Select(kv => $"{kv.Key} {kv.Value}"))})\n");
        output.WriteLine(table.ToString());

        rows.Values.ShouldAllBe(r => r.First == r.Planted, table.ToString());
        correctFalse.ShouldBe(0, table.ToString());
        slips.ShouldBeGreaterThan(60);
        slipFalse.ShouldBe(0, table.ToString());
    }

    /// <summary>Every claim of a correct submission changed on its own by 5–60 % of the largest claim of its kind.</summary>
    private static IEnumerable<Submission> Slips(Submission s, Random rnd)
    {
        var c = s.Claims;
        double Off(double peak) => peak * (0.05 + (0.55 * rnd.NextDouble())) * (rnd.Next(2) == 0 ? -1 : 1);
        double peakM = c.EndMoments.Select(x => Math.Abs(x.Moment)).Concat(c.SpanMoments.Select(x => Math.Abs(x.Moment)))
            .Concat(c.Envelopes.SelectMany(x => new[] { x.Max ?? 0, x.Min ?? 0 }).Select(Math.Abs)).DefaultIfEmpty(0).Max();
        double peakV = c.Shears.Select(x => Math.Abs(x.V)).DefaultIfEmpty(0).Max();
        for (int i = 0; i < c.EndMoments.Count; i++)
        {
            if (Math.Abs(c.EndMoments[i].Moment) < 1e-9) continue;
            double v = Written(c.EndMoments[i].Moment + Off(peakM));
            yield return s with { Claims = c with { EndMoments = [.. c.EndMoments.Select((x, k) => k == i ? x with { Moment = v, AsWritten = v, Source = Here with { Text = Text(v) } } : x)] } };
        }
        for (int i = 0; i < c.SpanMoments.Count; i++)
        {
            double v = Written(c.SpanMoments[i].Moment + Off(peakM));
            yield return s with { Claims = c with { SpanMoments = [.. c.SpanMoments.Select((x, k) => k == i ? x with { Moment = v, AsWritten = v, Source = Here with { Text = Text(v) } } : x)] } };
        }
        for (int i = 0; i < c.Shears.Count; i++)
        {
            double v = Written(c.Shears[i].V + Off(peakV));
            yield return s with { Claims = c with { Shears = [.. c.Shears.Select((x, k) => k == i ? x with { V = v, AsWritten = v, Source = Here with { Text = Text(v) } } : x)] } };
        }
        for (int i = 0; i < c.Envelopes.Count; i++)
        {
            double v = Written((c.Envelopes[i].Max ?? 0) + Off(peakM));
            yield return s with { Claims = c with { Envelopes = [.. c.Envelopes.Select((x, k) => k == i ? x with { Max = v, MaxAsWritten = v, MaxSource = Here with { Text = Text(v) } } : x)] } };
        }
    }
}
