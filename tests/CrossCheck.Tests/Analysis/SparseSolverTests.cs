using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using CsCheck;

namespace CrossCheck.Tests.Analysis;

/// <summary>The skyline solver must give the dense solver's answer (1e-9 relative) on the same frames, and fail the same way.</summary>
public class SparseSolverTests
{
    [Fact]
    public void RandomFrames_SameEndMomentsAsDense()
    {
        Gen.Select(Gen.Int[1, 6], Gen.Int[1, 8], Gen.Bool, Gen.Bool, Gen.Int).Sample((bays, storeys, elastic, hinges, variant) =>
        {
            var b = RandomFrames.Build(new FrameShape(bays, storeys, true, elastic, hinges, variant), loadCases: 2);
            var dense = b.Solve(DenseCholeskySolver.Instance);
            var sparse = b.Solve(SkylineSolver.Instance);
            foreach (var (d, s) in dense.Cases.Zip(sparse.Cases))
            {
                double scale = Math.Max(1, d.PeakMoment);
                foreach (var m in b.Model.Members)
                {
                    Near.Equal(s.Members[m.Id].StartMoment, d.Members[m.Id].StartMoment, relative: 0, absolute: 1e-9 * scale);
                    Near.Equal(s.Members[m.Id].EndMoment, d.Members[m.Id].EndMoment, relative: 0, absolute: 1e-9 * scale);
                }
            }
        }, iter: 40);
    }

    [Fact]
    public void LargeRegularFrame_SameAnswerAsDense()
    {
        // 40 storeys × 6 bays with rigid axial members: a few hundred unknowns, above the automatic switch.
        var b = Frames.Regular(40, 6);
        var dense = b.Solve(DenseCholeskySolver.Instance).Cases[0];
        var auto = b.Solve().Cases[0];
        double scale = dense.PeakMoment;
        foreach (var m in b.Model.Members)
            Near.Equal(auto.Members[m.Id].EndMoment, dense.Members[m.Id].EndMoment, relative: 0, absolute: 1e-9 * scale);
        foreach (var (id, r) in dense.Reactions)
            Near.Equal(auto.Reactions[id].Rx, r.Rx, relative: 0, absolute: 1e-8 * Math.Max(1, Math.Abs(r.Ry)));
    }

    [Fact]
    public void Mechanism_IsReportedByTheSparsePathToo()
    {
        var b = Frames.Regular(30, 12);
        // Release every column base and every beam end: the frame can fold.
        var model = b.Model;
        var loose = new StructureModel(model.Joints.Select(j => j.IsSupport ? j with { Restraint = Restraint.Pinned } : j).ToList(),
            model.Members.Select(m => m.Id.StartsWith('B') ? m with { Hinge = Hinge.Both } : m).ToList(), model.Axial, false);
        // Each column line, pinned at its foot and linked to the others by pin-ended beams, can rotate about its foot.
        foreach (ILinearSolver solver in new ILinearSolver[] { SkylineSolver.Instance, DenseCholeskySolver.Instance })
        {
            var ex = Should.Throw<StructureException>(() => new FrameSolver(solver).Solve(loose, b.Cases));
            ex.Message.ShouldContain("mechanism");
            ex.Direction.ShouldBe("x");
        }
    }
}

/// <summary>Regular frames for size tests: n storeys of 3.5 m, m bays of 6 m, fixed bases, gravity and wind.</summary>
public static class Frames
{
    public static FrameBuilder Regular(int storeys, int bays, bool elastic = false)
    {
        var b = new FrameBuilder();
        if (elastic) b.Elastic();
        for (int i = 0; i <= bays; i++)
            for (int j = 0; j <= storeys; j++)
                b.Joint($"J{i}_{j}", 6.0 * i, 3.5 * j, j == 0 ? Restraint.Fixed : Restraint.Free);
        for (int i = 0; i <= bays; i++)
            for (int j = 1; j <= storeys; j++)
                b.Member($"C{i}_{j}", $"J{i}_{j - 1}", $"J{i}_{j}", 200e6, 3e-4 + (1e-5 * (j % 7)), elastic ? 1e-2 : null);
        for (int i = 1; i <= bays; i++)
            for (int j = 1; j <= storeys; j++)
            {
                b.Member($"B{i}_{j}", $"J{i - 1}_{j}", $"J{i}_{j}", 200e6, 4e-4, elastic ? 8e-3 : null);
                b.Udl($"B{i}_{j}", 20 + (i % 3));
            }
        for (int j = 1; j <= storeys; j++) b.Force($"J0_{j}", 5 + (0.1 * j), LoadDirection.Right);
        return b;
    }
}
