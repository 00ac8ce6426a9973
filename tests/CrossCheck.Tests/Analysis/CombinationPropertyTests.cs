using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using CsCheck;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Properties of combinations and envelopes on random frames (linear elasticity, common practice): a combination analysed
/// as one case equals the factored sum of its cases (support movements once); the exact envelope is never beyond any single
/// arrangement, and one arrangement reaches each extreme.
/// </summary>
public class CombinationPropertyTests
{
    private static readonly Gen<FrameShape> Shapes = RandomFrames.Shapes(maxStoreys: 2);

    private static readonly SourceRef Here = new("test");

    private static Combination Combo(string name, bool patterned, params (string Case, double Factor)[] terms) =>
        new(name, terms.Select((t, i) => new CombinationTerm(t.Case, t.Factor, patterned && i == terms.Length - 1, patterned && i == terms.Length - 1 ? 0.25 : 0, Here)).ToList(), Here);

    [Fact]
    public void Superposition_OfCases_EqualsTheCombinedAnalysis()
    {
        Gen.Select(Shapes, Gen.Double[-2, 2], Gen.Double[-2, 2]).Sample(t =>
        {
            var (shape, f1, f2) = t;
            var b = RandomFrames.Build(shape, loadCases: 2);
            var model = b.Model;
            var cases = b.Cases;
            if (cases.Count < 2) return;
            var combo = Combo("C", false, ("1", f1), ("2", f2));
            var extended = CombinationAnalysis.Extend(new FrameSolver().Solve(model, cases), cases, [combo]);
            var combined = extended.Case("C");
            var parts = new FrameSolver().Solve(model, cases).Cases;
            double scale = Math.Max(1, Math.Max(combined.PeakMoment, parts.Max(p => p.PeakMoment) * (Math.Abs(f1) + Math.Abs(f2))));
            foreach (var m in model.Members)
                foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
                    Near.Equal(combined.EndMoment(m.Id, end), (f1 * parts[0].EndMoment(m.Id, end)) + (f2 * parts[1].EndMoment(m.Id, end)),
                        relative: 0, absolute: 1e-8 * scale, what: $"{m.Id} {end}");
            foreach (var (j, r) in combined.Reactions)
                Near.Equal(r.Ry, (f1 * parts[0].Reactions[j].Ry) + (f2 * parts[1].Reactions[j].Ry), relative: 0, absolute: 1e-8 * scale, what: $"Ry at {j}");
        }, iter: 40);
    }

    [Fact]
    public void SupportMovements_EnterACombinationOnce()
    {
        // Beam 4c of docs/REFERENCE-CHECKS.md (C settles 12 mm): a combination 1.35 × case of loads + 1.5 × a case with no member load
        // is 1.35 × loads + 1.5 × nothing + the settlement once, not 2.85 times.
        var b = ReferenceModels.Unequal(Restraint.Pinned, new SupportMovement(0, -0.012, 0)).JointMoment("B", 0, c: "Q");
        var model = b.Model;
        var cases = b.Cases;
        var combo = Combo("C", false, ("1", 1.35), ("Q", 1.5));
        var combined = CombinationAnalysis.Extend(new FrameSolver().Solve(model, cases), cases, [combo]).Case("C");
        var still = CombinationAnalysis.WithoutMovements(model);
        var loads = new FrameSolver().Solve(still, cases).Cases[0];
        var settlement = new FrameSolver().Solve(model, [new LoadCase("0", [])]).Cases[0];
        foreach (var m in model.Members)
            Near.Equal(combined.Members[m.Id].StartMoment, (1.35 * loads.Members[m.Id].StartMoment) + settlement.Members[m.Id].StartMoment, what: m.Id);
    }

    [Fact]
    public void Envelope_IsNeverBeyondAnySingleArrangement_AndOneArrangementReachesIt()
    {
        Gen.Select(Shapes, Gen.Int).Sample(t =>
        {
            var (shape, mask) = t;
            var b = RandomFrames.Build(shape, loadCases: 2);
            var cases = b.Cases;
            if (cases.Count < 2) return;
            var model = b.Model;
            var env = CombinationAnalysis.EnvelopeOf(model, cases, Combo("E", true, ("1", 1.2), ("2", 1.5)));
            var members = env.Patterned;
            // One arrangement chosen at random among the 2ⁿ, and the arrangements the envelope names.
            var chosen = members.Where((_, i) => ((mask >> (i % 30)) & 1) == 1).ToList();
            double scale = Math.Max(1, env.Fixed.PeakMoment + members.Sum(m => env.Contributions[m].PeakMoment));
            foreach (var m in model.Members)
                foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
                {
                    var (max, min) = env.Extremes(r => r.Members[m.Id].MomentAtEnd(end));
                    double some = env.Member(m.Id, chosen).MomentAtEnd(end);
                    some.ShouldBeLessThanOrEqualTo(max.Value + (1e-9 * scale));
                    some.ShouldBeGreaterThanOrEqualTo(min.Value - (1e-9 * scale));
                    Near.Equal(env.Member(m.Id, max.Loaded).MomentAtEnd(end), max.Value, relative: 0, absolute: 1e-9 * scale, what: "governing max");
                    Near.Equal(env.Member(m.Id, min.Loaded).MomentAtEnd(end), min.Value, relative: 0, absolute: 1e-9 * scale, what: "governing min");
                }
            foreach (var m in model.Members)
            {
                var top = env.SpanMaximum(m.Id);
                env.Member(m.Id, chosen).SpanMaximum.Moment.ShouldBeLessThanOrEqualTo(top.Value + (1e-7 * scale));
                Near.Equal(env.Member(m.Id, top.Loaded).SpanMaximum.Moment, top.Value, relative: 0, absolute: 1e-9 * scale, what: "governing span maximum");
            }
        }, iter: 30);
    }
}
