using CrossCheck.Model;

namespace CrossCheck.Tests.Support;

/// <summary>
/// Builds structures in code for solver tests. Units are whatever the test uses consistently
/// (the reference cases use kN and m, so E is in kN/m² and moments come out in kN·m).
/// </summary>
public sealed class FrameBuilder
{
    private static readonly SourceRef Here = new("test");
    private readonly List<Joint> _joints = [];
    private readonly List<Member> _members = [];
    private readonly List<Load> _loads = [];
    private AxialBehaviour _axial = AxialBehaviour.Rigid;

    public FrameBuilder Joint(string id, double x, double y, Restraint restraint = Restraint.Free, SupportMovement movement = default)
    {
        _joints.Add(new Joint(id, x, y, restraint, movement, Here));
        return this;
    }

    public FrameBuilder Member(string id, string start, string end, double e = 1, double i = 1, double? a = null, Hinge hinge = Hinge.None)
    {
        _members.Add(new Member(id, start, end, e, i, a, hinge, Here));
        return this;
    }

    public FrameBuilder Elastic() { _axial = AxialBehaviour.Elastic; return this; }

    /// <summary>A continuous beam on y = 0: joints J0..Jn at the cumulative span ends, spans S1..Sn.</summary>
    public static FrameBuilder Beam(double[] spans, Restraint[] supports, double e = 1, double[]? i = null)
    {
        var b = new FrameBuilder();
        double x = 0;
        for (int k = 0; k <= spans.Length; k++)
        {
            b.Joint("J" + k, x, 0, supports[k]);
            if (k < spans.Length) x += spans[k];
        }
        for (int k = 0; k < spans.Length; k++) b.Member("S" + (k + 1), "J" + k, "J" + (k + 1), e, i?[k] ?? 1);
        return b;
    }

    public FrameBuilder Udl(string member, double w, LoadDirection dir = LoadDirection.Down, string c = "1", double a = 0, double? b = null) =>
        Add(new DistributedLoad(c, member, w, w, a, b ?? Length(member), dir, Here));

    public FrameBuilder Linear(string member, double w1, double w2, double a = 0, double? b = null, LoadDirection dir = LoadDirection.Down, string c = "1") =>
        Add(new DistributedLoad(c, member, w1, w2, a, b ?? Length(member), dir, Here));

    public FrameBuilder Point(string member, double p, double a, LoadDirection dir = LoadDirection.Down, string c = "1") =>
        Add(new PointLoad(c, member, p, a, dir, Here));

    public FrameBuilder Couple(string member, double m, double a, string c = "1") => Add(new MemberCouple(c, member, m, a, Here));

    public FrameBuilder Force(string joint, double p, LoadDirection dir, string c = "1") => Add(new JointForce(c, joint, p, dir, Here));

    public FrameBuilder JointMoment(string joint, double m, string c = "1") => Add(new JointCouple(c, joint, m, Here));

    private FrameBuilder Add(Load l) { _loads.Add(l); return this; }

    public double Length(string member)
    {
        var m = _members.First(x => x.Id == member);
        var a = _joints.First(j => j.Id == m.Start);
        var b = _joints.First(j => j.Id == m.End);
        return Math.Sqrt(((b.X - a.X) * (b.X - a.X)) + ((b.Y - a.Y) * (b.Y - a.Y)));
    }

    public StructureModel Model => new(_joints.ToList(), _members.ToList(), _axial, relativeStiffness: false);

    public IReadOnlyList<LoadCase> Cases
    {
        get
        {
            var ids = _loads.Select(l => l.Case).Distinct().ToList();
            if (ids.Count == 0) ids.Add("1");
            return ids.Select(id => new LoadCase(id, _loads.Where(l => l.Case == id).ToList())).ToList();
        }
    }

    public CrossCheck.Analysis.AnalysisResult Solve(CrossCheck.Analysis.ILinearSolver? solver = null) =>
        new CrossCheck.Analysis.FrameSolver(solver).Solve(Model, Cases);
}
