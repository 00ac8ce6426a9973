using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// Statics of single loads in global axes: the resultant force of a load and its moment about a point. Member loads
/// are taken through their <see cref="MemberLoad.Shape"/>, so a new load kind that one shape describes needs nothing here.
/// </summary>
public static class LoadResultants
{
    /// <summary>Resultant of a load in global axes (N) and its anticlockwise moment about (x0, y0) (N·m).</summary>
    public static (double Fx, double Fy, double Moment) Of(StructureModel model, Load load, double x0, double y0)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(load);
        (double, double, double) Force(double x, double y, double fx, double fy) => (fx, fy, ((x - x0) * fy) - ((y - y0) * fx));
        switch (load)
        {
            case JointForce f:
            {
                var j = model.Joint(f.Joint);
                var (ux, uy) = f.Direction.Vector();
                return Force(j.X, j.Y, f.P * ux, f.P * uy);
            }
            case JointCouple c: return (0, 0, -c.M);
            case MemberLoad ml:
                switch (ml.Shape())
                {
                    case ConcentratedCouple c: return (0, 0, -c.M);
                    case ConcentratedForce p:
                    {
                        var (x, y) = PointOn(model, ml.Member, p.A);
                        var (ux, uy) = p.Direction.Vector();
                        return Force(x, y, p.P * ux, p.P * uy);
                    }
                    case LinearlyVaryingLoad d:
                    {
                        double len = d.B - d.A;
                        if (d.WStart + d.WEnd == 0) return (0, 0, 0);
                        double total = (d.WStart + d.WEnd) / 2 * len;
                        double centroid = d.A + (len * (d.WStart + (2 * d.WEnd)) / (3 * (d.WStart + d.WEnd)));
                        var (x, y) = PointOn(model, ml.Member, centroid);
                        var (ux, uy) = d.Direction.Vector();
                        return Force(x, y, total * ux, total * uy);
                    }
                    default: throw new NotSupportedException($"No statics for a member load shaped as {ml.Shape().GetType().Name}.");
                }
            default: throw new NotSupportedException($"No statics for a {load.GetType().Name}.");
        }
    }

    /// <summary>The point at distance <paramref name="a"/> from the start of a member, in global axes (m).</summary>
    public static (double X, double Y) PointOn(StructureModel model, string member, double a)
    {
        ArgumentNullException.ThrowIfNull(model);
        var m = model.Member(member);
        var s = model.Joint(m.Start);
        var e = model.Joint(m.End);
        double L = model.Length(m);
        return (s.X + ((e.X - s.X) * a / L), s.Y + ((e.Y - s.Y) * a / L));
    }

    /// <summary>
    /// The overhang a member forms, if any: a member whose one end is a free tip (a joint with no support and this member
    /// alone) and whose other end is not. Its end moments are statical: zero at the tip, and at the root the moment of the
    /// overhang's own loads and of the loads on its tip (common practice).
    /// </summary>
    public static MemberEnd? OverhangTip(StructureModel model, Member m)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(m);
        bool Tip(MemberEnd end)
        {
            var j = model.Joint(m.JointAt(end));
            return j.Restraint == Restraint.Free && model.MembersAt(j.Id).Count() == 1 && !m.IsReleased(end == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start);
        }
        bool start = Tip(MemberEnd.Start), end = Tip(MemberEnd.End);
        return start == end ? null : start ? MemberEnd.Start : MemberEnd.End;
    }

    /// <summary>The clockwise end moment at an overhang's root from statics: the moment of its loads and its tip's loads about the root.</summary>
    public static double OverhangRootMoment(StructureModel model, Member m, MemberEnd tip, LoadCase loadCase)
    {
        ArgumentNullException.ThrowIfNull(loadCase);
        var root = model.Joint(m.JointAt(tip == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start));
        string tipJoint = m.JointAt(tip);
        return loadCase.Loads.Where(l => l is MemberLoad ml && ml.Member == m.Id || l is JointLoad jl && jl.Joint == tipJoint)
            .Sum(l => Of(model, l, root.X, root.Y).Moment);
    }
}
