using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Finds whether a structure and one load case are mirror-symmetric about a vertical axis, and maps every
/// member end to its mirror image.
/// </summary>
internal sealed class SymmetryFinder
{
    private readonly Dictionary<string, (string Member, bool Reversed)> _members;
    private readonly StructureModel _model;

    private SymmetryFinder(StructureModel model, Dictionary<string, (string, bool)> members)
    {
        _model = model;
        _members = members;
    }

    /// <summary>The mirror image of a member end.</summary>
    public (string Member, MemberEnd End) Map(string member, MemberEnd end)
    {
        var (m2, reversed) = _members[member];
        return (m2, reversed ? (end == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start) : end);
    }

    /// <summary>The mirror mapping when structure and loads are symmetric, else null.</summary>
    public static SymmetryFinder? Find(StructureModel model, LoadCase loadCase)
    {
        if (model.Joints.Count < 2) return null;
        double minX = model.Joints.Min(j => j.X), maxX = model.Joints.Max(j => j.X);
        if (maxX - minX <= 0) return null;
        double axis = (minX + maxX) / 2;
        double tol = 1e-6 * Math.Max(1, maxX - minX);
        var joints = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var j in model.Joints)
        {
            var match = model.Joints.FirstOrDefault(k => Math.Abs(k.X - ((2 * axis) - j.X)) <= tol && Math.Abs(k.Y - j.Y) <= tol);
            if (match is null || match.Restraint != j.Restraint) return null;
            var mv = match.Movement;
            if (Math.Abs(mv.X + j.Movement.X) > 1e-12 || Math.Abs(mv.Y - j.Movement.Y) > 1e-12 || Math.Abs(mv.Rotation + j.Movement.Rotation) > 1e-12) return null;
            joints[j.Id] = match.Id;
        }
        var members = new Dictionary<string, (string, bool)>(StringComparer.Ordinal);
        foreach (var m in model.Members)
        {
            string s2 = joints[m.Start], e2 = joints[m.End];
            var other = model.Members.FirstOrDefault(k => (k.Start == s2 && k.End == e2) || (k.Start == e2 && k.End == s2));
            if (other is null || !Same(other.E * other.I, m.E * m.I) || (m.A is double a && !(other.A is double a2 && Same(a, a2)))) return null;
            bool reversed = other.Start == e2;
            var hinge = reversed ? Swap(m.Hinge) : m.Hinge;
            if (hinge != other.Hinge) return null;
            members[m.Id] = (other.Id, reversed);
        }
        var finder = new SymmetryFinder(model, members);
        // Loads: the mirror image of the load set must be the load set itself.
        var original = loadCase.Loads.Select(l => Key(model, l)).ToList();
        var mirrored = loadCase.Loads.Select(l => Key(model, finder.Mirror(l, joints))).ToList();
        if (original.Count == 0) return finder;
        var remaining = new List<double[]>(mirrored);
        foreach (var k in original)
        {
            int i = remaining.FindIndex(r => Close(r, k));
            if (i < 0) return null;
            remaining.RemoveAt(i);
        }
        return finder;
    }

    private Load Mirror(Load l, Dictionary<string, string> joints)
    {
        static LoadDirection Flip(LoadDirection d) => d == LoadDirection.Left ? LoadDirection.Right : d == LoadDirection.Right ? LoadDirection.Left : d;
        switch (l)
        {
            case JointForce f: return f with { Joint = joints[f.Joint], Direction = Flip(f.Direction) };
            case JointCouple c: return c with { Joint = joints[c.Joint], M = -c.M };
            case MemberLoad ml:
            {
                var (m2, rev) = _members[ml.Member];
                double L = _model.Length(_model.Member(ml.Member));
                return ml switch
                {
                    PointLoad p => p with { Member = m2, A = rev ? L - p.A : p.A, Direction = Flip(p.Direction) },
                    DistributedLoad d => rev
                        ? d with { Member = m2, A = L - d.B, B = L - d.A, WStart = d.WEnd, WEnd = d.WStart, Direction = Flip(d.Direction) }
                        : d with { Member = m2, Direction = Flip(d.Direction) },
                    MemberCouple c => c with { Member = m2, A = rev ? L - c.A : c.A, M = -c.M },
                    _ => ml,
                };
            }
            default: return l;
        }
    }

    /// <summary>A numeric fingerprint of a load: target, kind, direction, magnitudes, positions.</summary>
    private static double[] Key(StructureModel model, Load l)
    {
        double Id(string s) => s.GetHashCode(StringComparison.Ordinal);
        return l switch
        {
            JointForce f => [1, Id(f.Joint), (int)f.Direction, f.P],
            JointCouple c => [2, Id(c.Joint), c.M],
            PointLoad p => [3, Id(p.Member), (int)p.Direction, p.P, p.A],
            DistributedLoad d => [4, Id(d.Member), (int)d.Direction, d.WStart, d.WEnd, d.A, d.B],
            MemberCouple c => [5, Id(c.Member), c.M, c.A],
            _ => [0],
        };
    }

    private static bool Close(double[] a, double[] b) =>
        a.Length == b.Length && a.Zip(b).All(p => Math.Abs(p.First - p.Second) <= 1e-9 * Math.Max(1, Math.Abs(p.First)));

    private static bool Same(double a, double b) => Math.Abs(a - b) <= 1e-9 * Math.Max(Math.Abs(a), Math.Abs(b));

    private static Hinge Swap(Hinge h) => h switch
    {
        Hinge.Start => Hinge.End,
        Hinge.End => Hinge.Start,
        _ => h,
    };
}
