using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>What starts a no-sway distribution: clamped-end moments of the loads and support movements, and couples applied at joints.</summary>
internal static class DistributionLoads
{
    /// <summary>Couples applied at each joint (clockwise).</summary>
    public static double[] AppliedCouples(DistributionFrame frame, LoadCase c)
    {
        var a = new double[frame.JointCount];
        foreach (var l in c.Loads.OfType<JointCouple>()) a[frame.JointIndex(l.Joint)] += l.M;
        return a;
    }

    /// <summary>Clamped-end moments of the loads plus the effect of prescribed support movements.</summary>
    public static double[] FixedEndMoments(DistributionFrame frame, LoadCase c)
    {
        var model = frame.Model;
        var kinematics = frame.Kinematics;
        var members = frame.Members;
        var fem = new double[frame.Columns.Count];
        var byMember = c.MemberLoads.GroupBy(l => l.Member).ToDictionary(g => g.Key, g => g.ToList());
        for (int mi = 0; mi < members.Count; mi++)
        {
            var m = members[mi];
            if (frame.OverhangTip[mi] is MemberEnd tip)
            {
                // An overhang's moments are statical: its root carries the moment of its own loads, its tip none.
                double root = LoadResultants.OverhangRootMoment(model, m, tip, c);
                fem[2 * mi] = tip == MemberEnd.End ? root : 0;
                fem[(2 * mi) + 1] = tip == MemberEnd.End ? 0 : root;
                continue;
            }
            var a = model.Joint(m.Start);
            var b = model.Joint(m.End);
            double L = frame.Length(m), cos = (b.X - a.X) / L, sin = (b.Y - a.Y) / L;
            if (byMember.TryGetValue(m.Id, out var loads))
            {
                var f = FixedEndActions.Compute(loads.Select(l => LocalLoads.Resolve(l, cos, sin)), L);
                fem[2 * mi] += -f[2];
                fem[(2 * mi) + 1] += -f[5];
            }
            // Support movements: slope-deflection with the prescribed parts of θ and ψ.
            double ei = m.E * m.I;
            double psi = kinematics.ChordRotation(m).Constant;
            double ta = kinematics.JointRotation(m.Start).Constant, tb = kinematics.JointRotation(m.End).Constant;
            fem[2 * mi] += 2 * ei / L * ((2 * ta) + tb - (3 * psi));
            fem[(2 * mi) + 1] += 2 * ei / L * (ta + (2 * tb) - (3 * psi));
        }
        return fem;
    }
}
