using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Statics of single members taken from the claimed end moments and the member's own loads: end shears,
/// shear along the member, fixed-end moments. No stiffness analysis is involved.
/// </summary>
internal sealed class ClaimStatics
{
    private readonly StructureModel _model;
    private readonly Dictionary<(string Case, string Member), LocalAction[]> _actions = [];

    public ClaimStatics(Submission submission)
    {
        _model = submission.Model;
        foreach (var c in submission.Cases)
            foreach (var g in c.MemberLoads.GroupBy(l => l.Member))
            {
                if (!_model.TryGetMember(g.Key, out var m)) continue;
                var (cos, sin, _) = Geometry(m);
                _actions[(c.Id, g.Key)] = g.Select(l => LocalLoads.Resolve(l, cos, sin)).ToArray();
            }
    }

    public (double Cos, double Sin, double Length) Geometry(Member m)
    {
        var a = _model.Joint(m.Start);
        var b = _model.Joint(m.End);
        double dx = b.X - a.X, dy = b.Y - a.Y, L = Math.Sqrt((dx * dx) + (dy * dy));
        return (dx / L, dy / L, L);
    }

    internal LocalAction[] Actions(string caseId, string member) => _actions.GetValueOrDefault((caseId, member)) ?? [];

    /// <summary>Clamped-end moments of the member's loads, clockwise (start, end).</summary>
    public (double Start, double End) FixedEndMoments(string caseId, Member m)
    {
        var actions = Actions(caseId, m.Id);
        if (actions.Length == 0) return (0, 0);
        var f = FixedEndActions.Compute(actions, Geometry(m).Length);
        return (-f[2], -f[5]);
    }

    /// <summary>Transverse force of the start joint on the member (local y) from clockwise end moments m1, m2.</summary>
    public double StartShear(string caseId, Member m, double m1, double m2)
    {
        double L = Geometry(m).Length;
        double sumQy = 0, sumQyX = 0, sumC = 0;
        foreach (var a in Actions(caseId, m.Id))
        {
            switch (a)
            {
                case LocalPoint p: sumQy += p.Qy; sumQyX += p.Qy * p.A; break;
                case LocalDistributed d:
                {
                    var (force, momentAboutL) = d.TransverseLeftOf(L);
                    sumQy += force;
                    sumQyX += (force * L) - momentAboutL; // ∫q·s ds = L·∫q − ∫q(L − s)
                    break;
                }
                case LocalCouple c: sumC += c.C; break;
            }
        }
        // ΣM about the start (anticlockwise): −m1 − m2 + V2·L + Σ Qy·x + ΣC = 0; ΣFy: V1 + V2 + ΣQy = 0.
        double v2 = (m1 + m2 - sumQyX - sumC) / L;
        return -sumQy - v2;
    }

    /// <summary>Transverse load (local y) on the member left of <paramref name="s"/>.</summary>
    public double TransverseLoadBefore(string caseId, Member m, double s)
    {
        double sum = 0;
        foreach (var a in Actions(caseId, m.Id))
        {
            switch (a)
            {
                case LocalPoint p when p.A < s: sum += p.Qy; break;
                case LocalDistributed d: sum += d.TransverseLeftOf(s).Force; break;
            }
        }
        return sum;
    }

    /// <summary>Resultant of a load in global axes and its anticlockwise moment about (x0, y0).</summary>
    public (double Fx, double Fy, double Moment) Resultant(Load load, double x0, double y0) => LoadResultants.Of(_model, load, x0, y0);

    public (double X, double Y) PointOn(string member, double a) => LoadResultants.PointOn(_model, member, a);

    /// <summary>Global x-component of the member loads on the part of a member above the height <paramref name="yCut"/>.</summary>
    public double HorizontalLoadAbove(string caseId, Member m, double yCut)
    {
        var (cos, sin, _) = Geometry(m);
        var start = _model.Joint(m.Start);
        double sum = 0;
        foreach (var a in Actions(caseId, m.Id))
        {
            // Global x of a local (qx, qy): c·qx − s·qy.
            switch (a)
            {
                case LocalPoint p:
                {
                    double y = start.Y + (sin * p.A);
                    if (y > yCut) sum += (cos * p.Qx) - (sin * p.Qy);
                    break;
                }
                case LocalDistributed d:
                {
                    // Integrate over the part of [A, B] above the cut (the member is straight, y linear in s).
                    double s0 = d.A, s1 = d.B;
                    if (Math.Abs(sin) > 1e-12)
                    {
                        double sCut = (yCut - start.Y) / sin;
                        if (sin > 0) s0 = Math.Max(s0, sCut); else s1 = Math.Min(s1, sCut);
                    }
                    else if (start.Y <= yCut)
                    {
                        continue;
                    }
                    if (s1 <= s0) continue;
                    double q0x = d.QxAt(s0), q1x = d.QxAt(s1), q0y = d.QyAt(s0), q1y = d.QyAt(s1);
                    double len = s1 - s0;
                    sum += (cos * (q0x + q1x) / 2 * len) - (sin * (q0y + q1y) / 2 * len);
                    break;
                }
            }
        }
        return sum;
    }
}
