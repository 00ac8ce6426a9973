using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using CsCheck;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Properties every linear-elastic frame solution must have (common practice; Maxwell–Betti reciprocity is in any
/// structural analysis text), checked on random regular frames.
/// </summary>
public class SolverPropertyTests
{
    private static readonly Gen<FrameShape> Shapes = RandomFrames.Shapes();

    private const int Iterations = 60;

    private static double Scale(CaseResult r) => Math.Max(1, r.PeakMoment);

    [Fact]
    public void JointsAndWholeFrame_AreInEquilibrium()
    {
        Shapes.Sample(shape =>
        {
            var b = RandomFrames.Build(shape);
            var model = b.Model;
            var r = b.Solve().Cases[0];
            double scale = Scale(r);
            var loads = b.Cases[0].Loads;
            // Free joints: clockwise member-end moments sum to the applied clockwise joint moment.
            foreach (var j in model.Joints.Where(j => !j.IsSupport))
            {
                double sum = 0;
                foreach (var m in model.MembersAt(j.Id))
                    sum += r.Members[m.Id].MomentAtEnd(m.EndAt(j.Id)!.Value);
                double applied = loads.OfType<JointCouple>().Where(l => l.Joint == j.Id).Sum(l => l.M);
                Near.Equal(sum, applied, relative: 0, absolute: 1e-8 * scale, what: $"ΣM at {j.Id}");
            }
            // Whole frame: reactions balance the loads (forces and moment about the origin).
            double fx = 0, fy = 0, mo = 0;
            foreach (var (id, re) in r.Reactions)
            {
                var j = model.Joint(id);
                fx += re.Rx; fy += re.Ry; mo += (j.X * re.Ry) - (j.Y * re.Rx) - re.M;
            }
            foreach (var load in loads) { var (a, bb, cc) = Resultant(model, load); fx += a; fy += bb; mo += cc; }
            double fscale = Math.Max(1, loads.Sum(l => Magnitude(model, l)));
            Near.Equal(fx, 0, relative: 0, absolute: 1e-8 * fscale, what: "ΣFx");
            Near.Equal(fy, 0, relative: 0, absolute: 1e-8 * fscale, what: "ΣFy");
            Near.Equal(mo, 0, relative: 0, absolute: 1e-8 * fscale * 50, what: "ΣM");
        }, iter: Iterations);
    }

    [Fact]
    public void HingedEnds_CarryNoMoment()
    {
        // A frame drawn with hinges may still get none (each beam's hinge is drawn from none/start/end/both), so count
        // the hinged frames actually checked: a run that checked none would pass without testing anything.
        int framesWithHinges = 0;
        Shapes.Where(s => s.Hinges).Sample(shape =>
        {
            var b = RandomFrames.Build(shape);
            var r = b.Solve().Cases[0];
            var hinged = b.Model.Members.Where(m => m.Hinge != Hinge.None).ToList();
            if (hinged.Count > 0) Interlocked.Increment(ref framesWithHinges);
            foreach (var m in hinged)
            {
                var mr = r.Members[m.Id];
                if (m.Hinge.HasFlag(Hinge.Start)) Near.Equal(mr.StartMoment, 0, relative: 0, absolute: 1e-9 * Scale(r), what: $"{m.Id} start");
                if (m.Hinge.HasFlag(Hinge.End)) Near.Equal(mr.EndMoment, 0, relative: 0, absolute: 1e-9 * Scale(r), what: $"{m.Id} end");
            }
        }, iter: Iterations);
        // Each frame has at least one beam, hinged with probability 3/4, so about 45 of 60 frames have a hinge; fewer
        // than a quarter would take a binomial tail of order 10⁻¹⁹.
        framesWithHinges.ShouldBeGreaterThanOrEqualTo(Iterations / 4);
    }

    [Fact]
    public void LoadCases_Superpose()
    {
        Shapes.Sample(shape =>
        {
            var b = RandomFrames.Build(shape, loadCases: 2);
            var cases = b.Cases;
            var both = new LoadCase("both", cases.SelectMany(c => c.Loads).ToList());
            var scaled = new LoadCase("scaled", cases[0].Loads.Select(l => Scale135(l)).ToList());
            var r = new FrameSolver().Solve(b.Model, [.. cases, both, scaled]);
            double scale = Math.Max(Scale(r.Case("1")), Scale(r.Case("2")));
            foreach (var m in b.Model.Members)
            {
                foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
                {
                    double sum = r.Case("1").EndMoment(m.Id, end) + (cases.Count > 1 ? r.Case("2").EndMoment(m.Id, end) : 0);
                    Near.Equal(r.Case("both").EndMoment(m.Id, end), sum, relative: 0, absolute: 1e-9 * scale);
                    Near.Equal(r.Case("scaled").EndMoment(m.Id, end), 1.35 * r.Case("1").EndMoment(m.Id, end), relative: 0, absolute: 1e-9 * scale);
                }
            }
        }, iter: Iterations);
    }

    [Fact]
    public void MaxwellBetti_DisplacementsAreReciprocal()
    {
        Gen.Select(Shapes, Gen.Int[0, 1000], Gen.Int[0, 1000]).Sample((shape, p, q) =>
        {
            var b = RandomFrames.Build(shape);
            var free = b.Model.Joints.Where(j => !j.IsSupport).ToList();
            var ji = free[p % free.Count];
            var jj = free[q % free.Count];
            // Unit horizontal force at i and unit couple at j: u_x(i | couple at j) = θ(j | force at i), with matching signs.
            var model = b.Model;
            var r = new FrameSolver().Solve(model,
            [
                new LoadCase("F", [new JointForce("F", ji.Id, 1, LoadDirection.Right, new SourceRef("t"))]),
                new LoadCase("M", [new JointCouple("M", jj.Id, 1, new SourceRef("t"))]),
            ]);
            double uxi = r.Case("M").Displacements[ji.Id].Ux;   // work of the unit force on the couple's displacements
            double thj = r.Case("F").Displacements[jj.Id].Rotation; // work of the unit (clockwise) couple on the force's
            Near.Equal(uxi, thj, relative: 1e-8, absolute: 1e-14);
        }, iter: Iterations);
    }

    [Fact]
    public void RigidRotationAndTranslation_LeaveEndMomentsUnchanged()
    {
        Gen.Select(Shapes, Gen.Int[0, 3], Gen.Double[-50, 50], Gen.Double[-50, 50]).Sample((shape, quarter, tx, ty) =>
        {
            var b = RandomFrames.Build(shape with { FixedBases = true });
            var model = b.Model;
            double c = Math.Round(Math.Cos(quarter * Math.PI / 2)), s = Math.Round(Math.Sin(quarter * Math.PI / 2));
            var joints = model.Joints.Select(j => j with { X = (c * j.X) - (s * j.Y) + tx, Y = (s * j.X) + (c * j.Y) + ty }).ToList();
            var moved = new StructureModel(joints, model.Members, model.Axial, false);
            var cases = b.Cases.Select(lc => new LoadCase(lc.Id, lc.Loads.Select(l => Rotate(l, quarter)).ToList())).ToList();
            var r0 = b.Solve().Cases[0];
            var r1 = new FrameSolver().Solve(moved, cases).Cases[0];
            foreach (var m in model.Members)
            {
                Near.Equal(r1.Members[m.Id].StartMoment, r0.Members[m.Id].StartMoment, relative: 0, absolute: 1e-8 * Scale(r0));
                Near.Equal(r1.Members[m.Id].EndMoment, r0.Members[m.Id].EndMoment, relative: 0, absolute: 1e-8 * Scale(r0));
            }
        }, iter: Iterations);
    }

    [Fact]
    public void ArbitraryRotation_UnderCouplesOnly_LeavesEndMomentsUnchanged()
    {
        Gen.Select(Shapes, Gen.Double[0, 2 * Math.PI]).Sample((shape, angle) =>
        {
            var b = RandomFrames.Build(shape with { FixedBases = true });
            var model = b.Model;
            var couples = new LoadCase("1", model.Members.Select((m, i) =>
                (Load)new MemberCouple("1", m.Id, 10 + i, model.Length(m) * 0.3, new SourceRef("t"))).ToList());
            double c = Math.Cos(angle), s = Math.Sin(angle);
            var moved = new StructureModel(model.Joints.Select(j => j with { X = (c * j.X) - (s * j.Y), Y = (s * j.X) + (c * j.Y) }).ToList(),
                model.Members, model.Axial, false);
            var r0 = new FrameSolver().Solve(model, [couples]).Cases[0];
            var r1 = new FrameSolver().Solve(moved, [couples]).Cases[0];
            foreach (var m in model.Members)
                Near.Equal(r1.Members[m.Id].StartMoment, r0.Members[m.Id].StartMoment, relative: 0, absolute: 1e-8 * Scale(r0));
        }, iter: Iterations);
    }

    [Fact]
    public void MirroredFrameAndLoads_GiveMirroredMoments()
    {
        Shapes.Sample(shape =>
        {
            var b = RandomFrames.Build(shape);
            var model = b.Model;
            var mirrored = new StructureModel(model.Joints.Select(j => j with { X = -j.X }).ToList(), model.Members, model.Axial, false);
            var cases = b.Cases.Select(lc => new LoadCase(lc.Id, lc.Loads.Select(Mirror).ToList())).ToList();
            var r0 = b.Solve().Cases[0];
            var r1 = new FrameSolver().Solve(mirrored, cases).Cases[0];
            // Mirroring reverses every clockwise moment (docs/REFERENCE-CHECKS.md 8.7, common knowledge).
            foreach (var m in model.Members)
            {
                Near.Equal(r1.Members[m.Id].StartMoment, -r0.Members[m.Id].StartMoment, relative: 0, absolute: 1e-8 * Scale(r0));
                Near.Equal(r1.Members[m.Id].EndMoment, -r0.Members[m.Id].EndMoment, relative: 0, absolute: 1e-8 * Scale(r0));
            }
        }, iter: Iterations);
    }

    private static Load Scale135(Load l) => l switch
    {
        PointLoad p => p with { P = 1.35 * p.P },
        DistributedLoad d => d with { WStart = 1.35 * d.WStart, WEnd = 1.35 * d.WEnd },
        MemberCouple c => c with { M = 1.35 * c.M },
        JointForce f => f with { P = 1.35 * f.P },
        JointCouple c => c with { M = 1.35 * c.M },
        _ => l,
    };

    private static LoadDirection Turn(LoadDirection d, int quarters)
    {
        // Anticlockwise quarter turns: right → up → left → down → right.
        LoadDirection[] ring = [LoadDirection.Right, LoadDirection.Up, LoadDirection.Left, LoadDirection.Down];
        return ring[(Array.IndexOf(ring, d) + quarters) % 4];
    }

    private static Load Rotate(Load l, int q) => l switch
    {
        PointLoad p => p with { Direction = Turn(p.Direction, q) },
        DistributedLoad d => d with { Direction = Turn(d.Direction, q) },
        JointForce f => f with { Direction = Turn(f.Direction, q) },
        _ => l,
    };

    private static LoadDirection Flip(LoadDirection d) =>
        d == LoadDirection.Left ? LoadDirection.Right : d == LoadDirection.Right ? LoadDirection.Left : d;

    private static Load Mirror(Load l) => l switch
    {
        PointLoad p => p with { Direction = Flip(p.Direction) },
        DistributedLoad d => d with { Direction = Flip(d.Direction) },
        JointForce f => f with { Direction = Flip(f.Direction) },
        MemberCouple c => c with { M = -c.M },
        JointCouple c => c with { M = -c.M },
        _ => l,
    };

    private static double Magnitude(StructureModel model, Load l) => l switch
    {
        PointLoad p => Math.Abs(p.P),
        DistributedLoad d => (Math.Abs(d.WStart) + Math.Abs(d.WEnd)) * (d.B - d.A),
        JointForce f => Math.Abs(f.P),
        MemberCouple c => Math.Abs(c.M),
        JointCouple c => Math.Abs(c.M),
        _ => 0,
    };

    /// <summary>A load's force components and its anticlockwise-positive moment about the origin.</summary>
    private static (double Fx, double Fy, double M) Resultant(StructureModel model, Load load)
    {
        static (double, double, double) Force(double x, double y, double px, double py) => (px, py, (x * py) - (y * px));
        switch (load)
        {
            case JointForce f:
            {
                var j = model.Joint(f.Joint); var (ux, uy) = f.Direction.Vector();
                return Force(j.X, j.Y, f.P * ux, f.P * uy);
            }
            case JointCouple c: return (0, 0, -c.M);
            case MemberCouple c: return (0, 0, -c.M);
            case PointLoad p:
            {
                var (x, y) = At(model, p.Member, p.A); var (ux, uy) = p.Direction.Vector();
                return Force(x, y, p.P * ux, p.P * uy);
            }
            case DistributedLoad d:
            {
                // Resultant of a linear load and its centroid along the member.
                double len = d.B - d.A, total = (d.WStart + d.WEnd) / 2 * len;
                if (d.WStart + d.WEnd == 0) return (0, 0, 0);
                double centroid = d.A + (len * (d.WStart + (2 * d.WEnd)) / (3 * (d.WStart + d.WEnd)));
                var (x, y) = At(model, d.Member, centroid); var (ux, uy) = d.Direction.Vector();
                return Force(x, y, total * ux, total * uy);
            }
            default: return (0, 0, 0);
        }
    }

    private static (double X, double Y) At(StructureModel model, string member, double a)
    {
        var m = model.Member(member);
        var s = model.Joint(m.Start); var e = model.Joint(m.End);
        double L = model.Length(m);
        return (s.X + ((e.X - s.X) * a / L), s.Y + ((e.Y - s.Y) * a / L));
    }
}
