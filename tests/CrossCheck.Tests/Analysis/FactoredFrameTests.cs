using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using CsCheck;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// One factorisation reused: loads superposed, the adjoint, and the low-rank updates (a hinge removed, a support's rotation
/// held or released, the braced structure) must give what a new analysis of the changed structure gives — the handbook
/// values on single spans, and the full solver's answer (1e-9 of the peak) on random frames. The updates rest on the
/// Sherman–Morrison–Woodbury identity and on Schur complements (Golub &amp; Van Loan, Matrix Computations, §2.1.4; from memory).
/// </summary>
public class FactoredFrameTests
{
    private const double W = 18, L = 6;

    private static EndRef[] Ends(StructureModel model) =>
        model.Members.SelectMany((m, i) => new[] { new EndRef(i, MemberEnd.Start), new EndRef(i, MemberEnd.End) }).ToArray();

    private static double[] Full(StructureModel model, LoadCase c, bool hold = false)
    {
        var r = new FrameSolver().Solve(model, [c], hold).Cases[0];
        return model.Members.SelectMany(m => new[] { r.EndMoment(m.Id, MemberEnd.Start), r.EndMoment(m.Id, MemberEnd.End) }).ToArray();
    }

    private static void Same(double[] actual, double[] expected, string what)
    {
        double scale = Math.Max(1, expected.Max(Math.Abs));
        for (int i = 0; i < expected.Length; i++) Near.Equal(actual[i], expected[i], relative: 0, absolute: 1e-9 * scale, what: $"{what}, end {i}");
    }

    private static FrameBuilder Span(Restraint a, Restraint b, Hinge hinge = Hinge.None) => new FrameBuilder()
        .Joint("A", 0, 0, a).Joint("B", L, 0, b).Member("AB", "A", "B", 200e6, 2.5e-4, hinge: hinge).Udl("AB", W);

    [Fact]
    public void HingeRemoved_ProppedCantileverBecomesFixedEnded()
    {
        // A fixed-fixed span hinged at B is a propped cantilever: wL²/8 at A. Without the hinge: wL²/12 at both ends
        // (Roark's Formulas for Stress and Strain, Table 8.1 cases 2e and 2c; from memory).
        var b = Span(Restraint.Fixed, Restraint.Fixed, Hinge.End);
        var f = FactoredFrame.TryBuild(b.Model)!;
        Full(b.Model, b.Cases[0])[0].ShouldBe(-W * L * L / 8, 1e-9);
        var m = FrameUpdates.WithoutHinges(f, 0, b.Cases[0], Ends(b.Model))!;
        Near.Equal(m[0], -W * L * L / 12, what: "M_AB");
        Near.Equal(m[1], W * L * L / 12, what: "M_BA");
    }

    [Fact]
    public void RotationHeldAndReleased_TurnOneEndConditionIntoTheOther()
    {
        // Fixed-pinned: wL²/8 at the fixed end; fixed-fixed: wL²/12 at both (Roark Table 8.1 cases 2c and 2e; from memory).
        var propped = Span(Restraint.Fixed, Restraint.Pinned);
        var held = FrameUpdates.WithRotationHeld(FactoredFrame.TryBuild(propped.Model)!, 1, propped.Cases[0], Ends(propped.Model))!;
        Near.Equal(held[0], -W * L * L / 12, what: "held, M_AB");
        Near.Equal(held[1], W * L * L / 12, what: "held, M_BA");
        var fixedEnded = Span(Restraint.Fixed, Restraint.Fixed);
        var released = FrameUpdates.WithRotationReleased(FactoredFrame.TryBuild(fixedEnded.Model)!, 1, fixedEnded.Cases[0], Ends(fixedEnded.Model))!;
        Near.Equal(released[0], -W * L * L / 8, what: "released, M_AB");
        Near.Equal(released[1], 0, absolute: 1e-9, what: "released, M_BA");
    }

    [Fact]
    public void ReleasingTheOnlyRotationalRestraint_IsLeftToTheFullSolver()
    {
        // A cantilever pinned at its root is a mechanism: the update gives way, and the full solver refuses it.
        var cantilever = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", L, 0).Member("AB", "A", "B", 200e6, 2.5e-4).Udl("AB", W);
        FrameUpdates.WithRotationReleased(FactoredFrame.TryBuild(cantilever.Model)!, 0, cantilever.Cases[0], Ends(cantilever.Model)).ShouldBeNull();
    }

    [Fact]
    public void RandomFrames_UpdatesGiveTheFullSolversAnswer()
    {
        int hinges = 0, held = 0, released = 0, braced = 0;
        Gen.Select(Gen.Int[1, 4], Gen.Int[1, 4], Gen.Bool, Gen.Int).Sample((bays, storeys, pinnedBases, variant) =>
        {
            var b = RandomFrames.Build(new FrameShape(bays, storeys, !pinnedBases, Elastic: false, Hinges: true, variant));
            var model = b.Model;
            var c = b.Cases[0];
            var f = FactoredFrame.TryBuild(model);
            if (f is null) return; // a frame the full solver must look at twice: not what the updates are for
            var ends = Ends(model);
            var direct = FactoredFrame.TryBuild(model)!;
            var local = direct.Local(c);
            Same(direct.Moments(direct.Expand(direct.SolveCase(c, local), movements: true), local, ends), Full(model, c), "the case itself");
            for (int i = 0; i < model.Members.Count; i++)
            {
                if (model.Members[i].Hinge == Hinge.None) continue;
                var without = new StructureModel(model.Joints, model.Members.Select((m, k) => k == i ? m with { Hinge = Hinge.None } : m).ToList(), model.Axial, false);
                if (FrameUpdates.WithoutHinges(f, i, c, ends) is not { } m) continue;
                Same(m, Full(without, c), $"hinges of {model.Members[i].Id} removed");
                Interlocked.Increment(ref hinges);
            }
            for (int j = 0; j < model.Joints.Count; j++)
            {
                var joint = model.Joints[j];
                if (!joint.IsSupport) continue;
                bool holds = joint.Restraint.HasFlag(Restraint.Rotation);
                var changed = holds ? joint.Restraint & ~Restraint.Rotation : joint.Restraint | Restraint.Rotation;
                var other = new StructureModel(model.Joints.Select(k => k.Id == joint.Id ? k with { Restraint = changed } : k).ToList(), model.Members, model.Axial, false);
                var m = holds ? FrameUpdates.WithRotationReleased(f, j, c, ends) : FrameUpdates.WithRotationHeld(f, j, c, ends);
                if (m is null) continue;
                Same(m, Full(other, c), $"support {joint.Id} {(holds ? "released" : "held")}");
                Interlocked.Increment(ref holds ? ref released : ref held);
            }
            if (FrameUpdates.Brace(f) is not { } b2) return;
            Same(b2.Moments(c, ends), Full(model, c, hold: true), "braced");
            Interlocked.Increment(ref braced);
        }, iter: 40);
        // Every kind of update was compared, not given way on.
        hinges.ShouldBeGreaterThan(20);
        held.ShouldBeGreaterThan(10);
        released.ShouldBeGreaterThan(20);
        braced.ShouldBeGreaterThan(20);
    }

    [Fact]
    public void RandomFrames_LoadEffectsSuperposeAndTheAdjointGivesTheirOverlap()
    {
        Gen.Select(Gen.Int[1, 4], Gen.Int[1, 4], Gen.Bool, Gen.Int).Sample((bays, storeys, hinges, variant) =>
        {
            var b = RandomFrames.Build(new FrameShape(bays, storeys, true, Elastic: variant % 3 == 0, hinges, variant));
            var model = b.Model;
            var c = b.Cases[0];
            var f = FactoredFrame.TryBuild(model);
            if (f is null) return;
            var ends = Ends(model);
            var whole = Full(model, c);
            var sum = new double[whole.Length];
            foreach (var load in c.Loads)
            {
                var effect = f.LoadEffect([load], ends);
                for (int i = 0; i < sum.Length; i++) sum[i] += effect[i];
            }
            Same(sum, whole, "the loads one at a time");
            var rnd = new Random(variant);
            var weights = whole.Select(_ => rnd.NextDouble() - 0.5).ToArray();
            var adjoint = f.AdjointOf(ends, weights);
            foreach (var load in c.Loads)
            {
                var effect = f.LoadEffect([load], ends);
                double direct = effect.Zip(weights, (m, w) => m * w).Sum();
                Near.Equal(adjoint.Of(load), direct, relative: 1e-9, absolute: 1e-9 * Math.Max(1, effect.Max(Math.Abs)), what: "Σ w·M");
            }
        }, iter: 40);
    }
}
