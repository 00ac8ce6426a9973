using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// Verification of every recovered case by equilibrium (the numerical sanity layer, thresholds in
/// <see cref="NumericalLimits"/>): an analysis whose forces do not balance the loads is never returned.
/// </summary>
internal static class EquilibriumCheck
{
    /// <summary>
    /// Joint and global equilibrium of the recovered forces. At every joint direction that no support or hold
    /// restrains, the member end forces must balance the joint loads; over the whole structure, the loads (taken
    /// from the submission's load records, not from the fixed-end actions) and the reactions must balance.
    /// Both are measured as fractions of the applied loads.
    /// </summary>
    /// <param name="frame">Members and DOF numbering.</param>
    /// <param name="loadCase">The case.</param>
    /// <param name="recovered">The recovered forces of the case.</param>
    /// <param name="held">DOF held by the analysis (not checked).</param>
    /// <param name="braced">A braced analysis: its reactions alone do not balance the loads, so the global check is skipped.</param>
    public static CaseEquilibrium Balance(FrameLayout frame, LoadCase loadCase, RecoveredCase recovered, HashSet<int> held, bool braced)
    {
        var model = frame.Model;
        var outOfBalance = recovered.OutOfBalance;
        double size = frame.StructureSize();
        double x0 = model.Joints.Average(j => j.X), y0 = model.Joints.Average(j => j.Y);
        double loadForce = 0, loadMoment = 0, fx = 0, fy = 0, m = 0;
        // A force P in a direction, acting at (x, y) from the centroid of the joints; a couple (clockwise positive).
        void Force(double x, double y, double p, LoadDirection direction)
        {
            var (gx, gy) = direction.Vector();
            fx += p * gx; fy += p * gy; m += (x * p * gy) - (y * p * gx);
            loadForce += Math.Abs(p);
        }
        void Couple(double c)
        {
            m -= c;
            loadMoment += Math.Abs(c);
        }
        foreach (var load in loadCase.Loads)
        {
            switch (load)
            {
                case JointForce p:
                {
                    var j = model.Joint(p.Joint);
                    Force(j.X - x0, j.Y - y0, p.P, p.Direction);
                    break;
                }
                case JointCouple c:
                    Couple(c.M);
                    break;
                case MemberLoad ml:
                {
                    var e = frame.Elements[frame.ElementIndex[ml.Member]];
                    var start = model.Joint(e.Member.Start);
                    switch (ml)
                    {
                        case PointLoad p:
                            Force(start.X + (e.Cos * p.A) - x0, start.Y + (e.Sin * p.A) - y0, p.P, p.Direction);
                            break;
                        case DistributedLoad w:
                        {
                            var (gx, gy) = w.Direction.Vector();
                            double t = w.B - w.A;
                            double total = (w.WStart + w.WEnd) / 2 * t;
                            double first = (w.A * total) + (w.WStart * t * t / 2) + ((w.WEnd - w.WStart) * t * t / 3); // ∫ w(s)·s ds
                            double mx = ((start.X - x0) * total) + (e.Cos * first), my = ((start.Y - y0) * total) + (e.Sin * first);
                            fx += total * gx; fy += total * gy; m += (mx * gy) - (my * gx);
                            loadForce += (Math.Abs(w.WStart) + Math.Abs(w.WEnd)) / 2 * t;
                            break;
                        }
                        case MemberCouple c:
                            Couple(c.M);
                            break;
                        case LockedEndMoments locked:
                            // Self-equilibrated: no resultant, but it sets the scale of the case.
                            loadMoment += Math.Abs(locked.StartMoment) + Math.Abs(locked.EndMoment);
                            break;
                    }
                    break;
                }
            }
        }
        foreach (var (id, r) in recovered.Reactions)
        {
            var j = model.Joint(id);
            fx += r.Rx; fy += r.Ry; m += ((j.X - x0) * r.Ry) - ((j.Y - y0) * r.Rx) - r.M;
        }
        double forceScale = Math.Max(loadForce, loadMoment / size);
        if (!(forceScale > 0))
        {
            // Support movements only: the reactions they cause set the scale.
            foreach (var r in recovered.Reactions.Values) forceScale = Math.Max(forceScale, Math.Max(Math.Max(Math.Abs(r.Rx), Math.Abs(r.Ry)), Math.Abs(r.M) / size));
            foreach (var f in recovered.EndForces) forceScale = Math.Max(forceScale, Math.Max(Math.Abs(f[2]), Math.Abs(f[5])) / size);
        }
        if (!(forceScale > 0)) return new CaseEquilibrium(loadCase.Id, 0, null, null, 0);
        double momentScale = forceScale * size;

        double worst = 0;
        int worstDof = -1;
        for (int j = 0; j < model.Joints.Count; j++)
        {
            var restraint = model.Joints[j].Restraint;
            for (int dir = 0; dir < 3; dir++)
            {
                int dof = (3 * j) + dir;
                var flag = dir switch { 0 => Restraint.X, 1 => Restraint.Y, _ => Restraint.Rotation };
                if (restraint.HasFlag(flag) || held.Contains(dof)) continue;
                double r = Math.Abs(outOfBalance[dof]) / (dir == 2 ? momentScale : forceScale);
                if (!(r <= worst)) { worst = r; worstDof = dof; }
            }
        }
        // A braced analysis holds the structure against sway with external restraints: its reactions alone do not balance the loads.
        double global = braced ? 0 : Math.Max(Math.Max(Math.Abs(fx), Math.Abs(fy)) / forceScale, Math.Abs(m) / momentScale);
        if (double.IsNaN(global)) global = double.PositiveInfinity;
        return new CaseEquilibrium(loadCase.Id, worst, worstDof < 0 ? null : model.Joints[worstDof / 3].Id,
            worstDof < 0 ? null : FrameLayout.DirectionNames[worstDof % 3], global);
    }

    /// <summary>
    /// The verdict of the numerical sanity layer: results whose forces are out of balance beyond
    /// <see cref="NumericalLimits.EquilibriumResidual"/> are not returned at all, since the claims must not be judged
    /// against them; an ill-conditioned matrix is noted with its condition number and the stiffest contrast.
    /// </summary>
    /// <exception cref="StructureException">A case fails the equilibrium check.</exception>
    public static void Verify(NumericalReport report, List<string> notes)
    {
        var worst = report.WorstCase;
        string contrast = report.Contrast is { } k && k.Ratio >= NumericalLimits.StiffnessContrast
            ? $" Member {k.Stiffer} is {NumericalReport.Scientific(k.Ratio)} times stiffer ({k.Measure}) than member {k.Softer}, which meets it at joint {k.Joint}."
            : "";
        if (worst is not null && !report.Trusted)
        {
            string where = worst.Joint >= worst.Global && worst.AtJoint is not null
                ? $"at joint {worst.AtJoint} ({worst.Direction}) the recovered member forces leave {NumericalReport.Scientific(worst.Joint)} of the applied load unbalanced"
                : $"the recovered forces of the whole structure leave {NumericalReport.Scientific(worst.Global)} of the applied load unbalanced";
            throw new StructureException(
                $"The independent analysis failed its own equilibrium check: in case {worst.Case}, {where} " +
                $"(the limit is {NumericalReport.Scientific(NumericalLimits.EquilibriumResidual)}; condition number of the stiffness matrix about " +
                $"{NumericalReport.Scientific(report.ConditionEstimate)}).{contrast} Its results cannot be trusted, so the claims were not judged against them. " +
                "Check E, I and A (and their units) for typing errors.", worst.AtJoint, worst.Direction);
        }
        if (report.IllConditioned)
            notes.Add(report.Describe());
    }
}
