using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// The numbering every stage of the frame solver shares: three DOF per joint (x, y, anticlockwise rotation) in the
/// order of the model's joints, and one <see cref="MemberElement"/> per member in the order of the model's members.
/// </summary>
internal sealed class FrameLayout
{
    public static readonly string[] DirectionNames = ["x", "y", "rotation"];

    private double _size;

    /// <exception cref="StructureException">A member refers to a missing joint, has zero length, or lacks the area elastic axial behaviour needs.</exception>
    public FrameLayout(StructureModel model)
    {
        Model = model;
        JointIndex = model.Joints.Select((j, i) => (j.Id, i)).ToDictionary(t => t.Id, t => t.i, StringComparer.Ordinal);
        DofCount = 3 * model.Joints.Count;
        Elements = model.Members.Select(BuildElement).ToArray();
        ElementIndex = Elements.Select((e, i) => (e.Member.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
    }

    public StructureModel Model { get; }
    public Dictionary<string, int> JointIndex { get; }
    public MemberElement[] Elements { get; }
    public Dictionary<string, int> ElementIndex { get; }

    /// <summary>Number of joint DOF (3 per joint), before constraints.</summary>
    public int DofCount { get; }

    /// <summary>The mean member length (m; 1 without members): the length that makes translations comparable with rotations.</summary>
    public double ReferenceLength => Elements.Length > 0 ? Elements.Average(e => e.Length) : 1;

    private MemberElement BuildElement(Member m)
    {
        if (!JointIndex.TryGetValue(m.Start, out int s) || !JointIndex.TryGetValue(m.End, out int e))
            throw new StructureException($"Member {m.Id} refers to a joint that does not exist.");
        var a = Model.Joint(m.Start);
        var b = Model.Joint(m.End);
        double dx = b.X - a.X, dy = b.Y - a.Y;
        double L = Math.Sqrt((dx * dx) + (dy * dy));
        if (!(L > 0)) throw new StructureException($"Member {m.Id} has zero length.");
        double ea = Model.Axial == AxialBehaviour.Elastic
            ? m.E * (m.A ?? throw new StructureException($"Member {m.Id} has no area A, needed for elastic axial behaviour."))
            : 0;
        var k = ElementMatrices.LocalStiffness(m.E * m.I, ea, L);
        var released = ElementMatrices.Released(m.Hinge);
        var (kc, _) = ElementMatrices.Condense(k, new double[6], released);
        return new MemberElement(m, s, e, L, dx / L, dy / L, k, released, ElementMatrices.ToGlobal(kc, dx / L, dy / L), Model.Axial == AxialBehaviour.Elastic);
    }

    /// <summary>Every joint is the end of some member.</summary>
    /// <exception cref="StructureException">A joint no member reaches.</exception>
    public void CheckConnectivity()
    {
        var touched = new HashSet<string>(StringComparer.Ordinal);
        foreach (var m in Model.Members) { touched.Add(m.Start); touched.Add(m.End); }
        foreach (var j in Model.Joints)
            if (!touched.Contains(j.Id))
                throw new StructureException($"Joint {j.Id} is not connected to any member.", j.Id, null);
    }

    /// <summary>The larger of the joints' bounding-box diagonal and the longest member (m); lever arm of the moment scale.</summary>
    public double StructureSize()
    {
        if (_size > 0) return _size;
        double w = Model.Joints.Max(j => j.X) - Model.Joints.Min(j => j.X), h = Model.Joints.Max(j => j.Y) - Model.Joints.Min(j => j.Y);
        _size = Math.Max(Math.Sqrt((w * w) + (h * h)), Elements.Select(e => e.Length).DefaultIfEmpty(1).Max());
        if (!(_size > 0)) _size = 1;
        return _size;
    }
}
