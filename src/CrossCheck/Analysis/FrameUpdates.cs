using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// Small changes of a factorised structure solved with its factor instead of a new assembly: a hinge removed (a rank-one
/// or rank-two change of the member's stiffness, Sherman–Morrison–Woodbury), a support's rotation fixed (a constraint
/// added: one solve) or released (an unknown added: a bordered system solved through its Schur complement), and the
/// braced structure (translations held: the principal submatrix). Each returns the clockwise end moments of one case at
/// the ends asked for, support movements included, or null when the change alters the structure in a way the update
/// does not cover or the result would need the full solver's second look; the caller then solves with
/// <see cref="FrameSolver"/>.
/// </summary>
internal static class FrameUpdates
{
    /// <summary>The case on the structure with the hinges of member <paramref name="element"/> removed.</summary>
    public static double[]? WithoutHinges(FactoredFrame f, int element, LoadCase loadCase, IReadOnlyList<EndRef> ends)
    {
        var frame = f.Frame;
        var e = frame.Elements[element];
        var released = e.Released;
        if (released.Length == 0) return null;
        // A joint where every member is hinged has its rotation held by a constraint; removing a hinge there frees it.
        foreach (int r in released)
        {
            int joint = r == 2 ? e.StartJoint : e.EndJoint;
            if (IsHeldRotation(f, joint) && !frame.Model.Joints[joint].Restraint.HasFlag(Restraint.Rotation)) return null;
        }
        var t = f.Transformation;
        var rigid = e with { Released = [], GlobalK = ElementMatrices.ToGlobal(e.LocalK, e.Cos, e.Sin) };
        // K_condensed = K − K[:,R]·K[R,R]⁻¹·K[R,:]: removing the hinges adds U·C·Uᵀ with U = K[:,R] (global), C⁻¹ = K[R,R].
        int rank = released.Length;
        var u = new double[rank][];
        var cInverse = new double[rank, rank];
        for (int a = 0; a < rank; a++)
        {
            var column = new double[6];
            for (int i = 0; i < 6; i++) column[i] = e.LocalK[i, released[a]];
            u[a] = Reduce(f, e, ElementMatrices.ToGlobal(column, e.Cos, e.Sin));
            for (int b = 0; b < rank; b++) cInverse[a, b] = e.LocalK[released[a], released[b]];
        }
        // Loads: the member's fixed-end actions are no longer condensed; the support movements meet the added stiffness.
        var local = f.Local(loadCase);
        var rhs = f.ReducedLoad(loadCase, local, movements: true);
        var change = new double[6];
        if (local.Fixed[element] is { } fixedLocal)
        {
            var (_, condensed) = ElementMatrices.Condense(e.LocalK, fixedLocal, released);
            var full = ElementMatrices.ToGlobal(fixedLocal, e.Cos, e.Sin);
            var cond = ElementMatrices.ToGlobal(condensed, e.Cos, e.Sin);
            for (int a = 0; a < 6; a++) change[a] -= full[a] - cond[a];
        }
        for (int a = 0; a < 6; a++)
            for (int b = 0; b < 6; b++)
                change[a] -= (rigid.GlobalK[a, b] - e.GlobalK[a, b]) * t.Constants[e.Dofs[b]];
        var extra = Reduce(f, e, change);
        for (int m = 0; m < rhs.Length; m++) rhs[m] += extra[m];
        var y = f.Solve(rhs);
        var z = u.Select(f.Solve).ToArray();
        // q = y − Z·(C⁻¹ + UᵀZ)⁻¹·Uᵀy.
        var s = new double[rank, rank];
        var uy = new double[rank];
        for (int a = 0; a < rank; a++)
        {
            uy[a] = Dot(u[a], y);
            for (int b = 0; b < rank; b++) s[a, b] = cInverse[a, b] + Dot(u[a], z[b]);
        }
        if (SolveSmall(s, uy) is not { } coef) return null;
        for (int a = 0; a < rank; a++)
            for (int m = 0; m < y.Length; m++) y[m] -= z[a][m] * coef[a];
        return f.Moments(t.Expand(y), local, ends, rigid);
    }

    /// <summary>The case with the rotation of support <paramref name="joint"/> held (a pin or roller treated as fixed).</summary>
    public static double[]? WithRotationHeld(FactoredFrame f, int joint, LoadCase loadCase, IReadOnlyList<EndRef> ends)
    {
        var t = f.Transformation;
        int dof = (3 * joint) + 2;
        if (t.Terms[dof] is not [(int master, 1.0)] || t.Constants[dof] != 0) return null;
        // The rotation as given for a fixed support (anticlockwise inside the solver).
        double target = -f.Frame.Model.Joints[joint].Movement.Rotation;
        var local = f.Local(loadCase);
        var q = f.SolveCase(loadCase, local);
        var unit = new double[q.Length];
        unit[master] = 1;
        var z = f.Solve(unit);
        if (!(z[master] > 0)) return null;
        double lambda = (target - q[master]) / z[master];
        for (int m = 0; m < q.Length; m++) q[m] += z[m] * lambda;
        q[master] = target;
        return f.Moments(t.Expand(q), local, ends);
    }

    /// <summary>The case with the rotation of fixed support <paramref name="joint"/> released (a fixed support treated as a pin).</summary>
    public static double[]? WithRotationReleased(FactoredFrame f, int joint, LoadCase loadCase, IReadOnlyList<EndRef> ends)
    {
        var frame = f.Frame;
        var t = f.Transformation;
        int dof = (3 * joint) + 2;
        if (t.Terms[dof].Length != 0) return null;
        var at = f.ElementsAt()[joint];
        // Every member hinged there: the released joint would carry no moment and have its rotation held instead.
        if (at.All(i => frame.Elements[i].Released.Contains(frame.Elements[i].StartJoint == joint ? 2 : 5))) return null;
        // The new unknown's column of the stiffness matrix: b over the old unknowns, κ on itself.
        var column = new double[frame.DofCount];
        foreach (int i in at)
        {
            var e = frame.Elements[i];
            int slot = e.StartJoint == joint ? 2 : 5;
            for (int a = 0; a < 6; a++) column[e.Dofs[a]] += e.GlobalK[a, slot];
            if (e.StartJoint == e.EndJoint) return null;
        }
        double kappa = column[dof];
        var b = t.Reduce(column);
        double d0 = t.Constants[dof];
        var local = f.Local(loadCase);
        var vector = LoadAssembly.JointVector(frame, t, loadCase, local);
        var rhs = t.Reduce(vector);
        // The prescribed rotation goes with the restraint: F − K·d0 loses its part.
        for (int m = 0; m < rhs.Length; m++) rhs[m] += b[m] * d0;
        double rhsNew = vector[dof] + (kappa * d0);
        var y = f.Solve(rhs);
        var z = f.Solve(b);
        double sigma = kappa - Dot(b, z);
        if (!(sigma > FactoredFrame.SuspectPivotRatio * kappa)) return null;
        double rotation = (rhsNew - Dot(b, y)) / sigma;
        for (int m = 0; m < y.Length; m++) y[m] -= z[m] * rotation;
        var d = t.Expand(y);
        d[dof] = rotation;
        return f.Moments(d, local, ends);
    }

    /// <summary>
    /// The braced structure: every translation the supports and rigid members leave free held, which leaves the rotation
    /// unknowns (the principal submatrix of the reduced stiffness). Null when that matrix needs the full solver's look.
    /// </summary>
    public static Braced? Brace(FactoredFrame f)
    {
        var t = f.Transformation;
        var keep = new List<int>();
        for (int m = 0; m < t.MasterCount; m++) if (t.Masters[m] % 3 == 2) keep.Add(m);
        var index = new int[t.MasterCount];
        Array.Fill(index, -1);
        for (int k = 0; k < keep.Count; k++) index[keep[k]] = k;
        var k2 = new SparseSymmetricMatrix(keep.Count);
        for (int k = 0; k < keep.Count; k++)
            foreach (var (j, v) in f.Stiffness.LowerRow(keep[k]))
                if (index[j] >= 0) k2.Add(k, index[j], v);
        try
        {
            var factor = AutoSolver.Instance.Factor(k2);
            return factor.MinPivotRatio < FactoredFrame.SuspectPivotRatio ? null : new Braced(f, keep, factor);
        }
        catch (SingularMatrixException)
        {
            return null;
        }
    }

    /// <summary>The braced structure's factor over the rotation unknowns.</summary>
    internal sealed class Braced(FactoredFrame frame, List<int> keep, ILinearFactor factor)
    {
        public double[] Moments(LoadCase loadCase, IReadOnlyList<EndRef> ends)
        {
            var local = frame.Local(loadCase);
            var rhs = frame.ReducedLoad(loadCase, local, movements: true);
            var q = factor.Solve(keep.Select(m => rhs[m]).ToArray());
            var full = new double[rhs.Length];
            for (int k = 0; k < keep.Count; k++) full[keep[k]] = q[k];
            return frame.Moments(frame.Expand(full, movements: true), local, ends);
        }
    }

    /// <summary>Whether the rotation of joint <paramref name="joint"/> is held by a constraint (a support or a joint every member is hinged at).</summary>
    private static bool IsHeldRotation(FactoredFrame f, int joint) => f.Transformation.Terms[(3 * joint) + 2].Length == 0;

    /// <summary>Tᵀ of a vector given at the six DOF of one member.</summary>
    private static double[] Reduce(FactoredFrame f, MemberElement e, double[] atMember)
    {
        var t = f.Transformation;
        var r = new double[t.MasterCount];
        for (int a = 0; a < 6; a++)
        {
            if (atMember[a] == 0) continue;
            foreach (var (m, c) in t.Terms[e.Dofs[a]]) r[m] += c * atMember[a];
        }
        return r;
    }

    private static double Dot(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
        return s;
    }

    /// <summary>Solves a 1×1 or 2×2 system; null when it is singular.</summary>
    private static double[]? SolveSmall(double[,] a, double[] b)
    {
        if (b.Length == 1) return a[0, 0] == 0 ? null : [b[0] / a[0, 0]];
        double det = (a[0, 0] * a[1, 1]) - (a[0, 1] * a[1, 0]);
        double scale = Math.Abs(a[0, 0] * a[1, 1]) + Math.Abs(a[0, 1] * a[1, 0]);
        if (!(Math.Abs(det) > 1e-14 * scale)) return null;
        return [((a[1, 1] * b[0]) - (a[0, 1] * b[1])) / det, ((a[0, 0] * b[1]) - (a[1, 0] * b[0])) / det];
    }
}
