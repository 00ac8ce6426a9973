using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>What recovery gives for one case: the results, and the joint force balance the equilibrium check reads.</summary>
/// <param name="Result">Member end forces, displacements and reactions.</param>
/// <param name="OutOfBalance">Σ member end forces − applied joint loads at every joint DOF (global axes).</param>
/// <param name="EndForces">Local end forces of every element.</param>
/// <param name="Reactions">Reactions at supported joints.</param>
internal sealed record RecoveredCase(CaseResult Result, double[] OutOfBalance, double[][] EndForces, Dictionary<string, Reaction> Reactions);

/// <summary>
/// The recovery stage: from the joint displacements of a case, the member end forces (hinge rotations recovered,
/// fixed-end actions added), the axial forces of axially rigid members (constraint forces), the reactions and the
/// displacements in the clockwise convention of the interfaces.
/// </summary>
internal static class FrameRecovery
{
    public static RecoveredCase Recover(FrameLayout frame, LoadCase loadCase, CaseLoads local, double[] d, ConstraintSet constraints, ILinearSolver linear)
    {
        var model = frame.Model;
        var elements = frame.Elements;
        int n = frame.DofCount;
        var endForces = new double[elements.Length][];
        var localDisp = new double[elements.Length][];
        var residual = new double[n];
        for (int i = 0; i < elements.Length; i++)
        {
            var e = elements[i];
            var f = EndForces(e, d, local.Fixed[i], out var dl);
            endForces[i] = f;
            localDisp[i] = dl;
            var g = ElementMatrices.ToGlobal(f, e.Cos, e.Sin);
            for (int a = 0; a < 6; a++) residual[e.Dofs[a]] += g[a];
        }
        // Joint loads: the residual Σ member forces − applied joint loads must be carried by constraints.
        foreach (var jl in loadCase.JointLoads)
        {
            int j = frame.JointIndex[jl.Joint];
            switch (jl)
            {
                case JointForce p:
                    var (ux, uy) = p.Direction.Vector();
                    residual[3 * j] -= p.P * ux;
                    residual[(3 * j) + 1] -= p.P * uy;
                    break;
                case JointCouple c:
                    residual[(3 * j) + 2] -= -c.M;
                    break;
            }
        }
        if (model.Axial == AxialBehaviour.Rigid) RigidAxialForces.Add(frame, constraints, residual, endForces, linear);

        var members = new Dictionary<string, MemberResult>(StringComparer.Ordinal);
        var reactionVec = new double[n];
        for (int i = 0; i < elements.Length; i++)
        {
            var e = elements[i];
            members[e.Member.Id] = new MemberResult(e.Member, e.Length, e.Cos, e.Sin, endForces[i], localDisp[i], local.Actions[i]);
            var g = ElementMatrices.ToGlobal(endForces[i], e.Cos, e.Sin);
            for (int a = 0; a < 6; a++) reactionVec[e.Dofs[a]] += g[a];
        }
        foreach (var jl in loadCase.JointLoads)
        {
            int j = frame.JointIndex[jl.Joint];
            if (jl is JointForce p) { var (ux, uy) = p.Direction.Vector(); reactionVec[3 * j] -= p.P * ux; reactionVec[(3 * j) + 1] -= p.P * uy; }
            else if (jl is JointCouple c) reactionVec[(3 * j) + 2] += c.M;
        }
        var displacements = new Dictionary<string, JointDisplacement>(StringComparer.Ordinal);
        var reactions = new Dictionary<string, Reaction>(StringComparer.Ordinal);
        for (int j = 0; j < model.Joints.Count; j++)
        {
            var joint = model.Joints[j];
            displacements[joint.Id] = new JointDisplacement(d[3 * j], d[(3 * j) + 1], -d[(3 * j) + 2]);
            if (joint.IsSupport)
            {
                reactions[joint.Id] = new Reaction(
                    joint.Restraint.HasFlag(Restraint.X) ? reactionVec[3 * j] : 0,
                    joint.Restraint.HasFlag(Restraint.Y) ? reactionVec[(3 * j) + 1] : 0,
                    joint.Restraint.HasFlag(Restraint.Rotation) ? -reactionVec[(3 * j) + 2] : 0);
            }
        }
        return new RecoveredCase(new CaseResult(loadCase.Id, members, displacements, reactions), reactionVec, endForces, reactions);
    }

    /// <summary>
    /// Local end forces of one member (N1, V1, M1, N2, V2, M2, moments anticlockwise) from the joint displacements
    /// <paramref name="d"/> and the member's fixed-end actions: the rotations of released ends recovered first.
    /// </summary>
    public static double[] EndForces(MemberElement e, double[] d, double[]? fixedLocal, out double[] localDisplacements)
    {
        var dofs = e.Dofs;
        double[] dg = [d[dofs[0]], d[dofs[1]], d[dofs[2]], d[dofs[3]], d[dofs[4]], d[dofs[5]]];
        var dl = ElementMatrices.ToLocal(dg, e.Cos, e.Sin);
        fixedLocal ??= new double[6];
        ElementMatrices.RecoverReleased(e.LocalK, fixedLocal, e.Released, dl);
        var f = new double[6];
        for (int a = 0; a < 6; a++)
        {
            double s = fixedLocal[a];
            for (int b = 0; b < 6; b++) s += e.LocalK[a, b] * dl[b];
            f[a] = s;
        }
        localDisplacements = dl;
        return f;
    }
}

/// <summary>
/// Axial forces of axially rigid members are constraint forces: find λ with Σ λ_k·c_k = r (the out-of-balance joint
/// forces of the bending solution), minimum norm where rigid members form a self-straining loop, by iterated Tikhonov
/// on C·Cᵀ.
/// </summary>
internal static class RigidAxialForces
{
    public static void Add(FrameLayout frame, ConstraintSet constraints, double[] residual, double[][] endForces, ILinearSolver linear)
    {
        int n = frame.DofCount;
        var rows = constraints.Rows;
        int m = rows.Count;
        if (m == 0) return;
        // Constraint rows by DOF (compressed), then C·Cᵀ from the rows that share a DOF.
        var perDof = new int[n + 1];
        foreach (var row in rows) foreach (var dof in row.Coefficients.Keys) perDof[dof + 1]++;
        for (int i = 0; i < n; i++) perDof[i + 1] += perDof[i];
        var entryRow = new int[perDof[n]];
        var entryCoef = new double[perDof[n]];
        var next = (int[])perDof.Clone();
        for (int r = 0; r < m; r++)
            foreach (var (dof, c) in rows[r].Coefficients) { entryRow[next[dof]] = r; entryCoef[next[dof]++] = c; }
        var cct = new SparseSymmetricMatrix(m);
        for (int dof = 0; dof < n; dof++)
            for (int p1 = perDof[dof]; p1 < perDof[dof + 1]; p1++)
                for (int p2 = perDof[dof]; p2 < perDof[dof + 1]; p2++)
                    if (entryRow[p1] >= entryRow[p2]) cct.Add(entryRow[p1], entryRow[p2], entryCoef[p1] * entryCoef[p2]);
        double maxDiag = Enumerable.Range(0, m).Max(cct.Diagonal);
        double delta = 1e-10 * maxDiag;
        for (int r = 0; r < m; r++) cct.Add(r, r, delta);
        var b = new double[m];
        for (int r = 0; r < m; r++)
            foreach (var (dof, c) in rows[r].Coefficients) b[r] += c * residual[dof];
        ILinearFactor factor;
        try { factor = linear.Factor(cct); }
        catch (SingularMatrixException) { return; }
        var lambda = new double[m];
        for (int iter = 0; iter < 2; iter++)
        {
            // r_k = b − (C·Cᵀ)·λ, without the regularisation term.
            var mv = cct.Multiply(lambda);
            var rhs = new double[m];
            for (int r = 0; r < m; r++) rhs[r] = b[r] - (mv[r] - (delta * lambda[r]));
            var step = factor.Solve(rhs);
            for (int r = 0; r < m; r++) lambda[r] += step[r];
        }
        for (int r = 0; r < m; r++)
        {
            if (rows[r].Tag is not ValueTuple<string, string, int> { Item1: "rigid" } tag) continue;
            int i = frame.ElementIndex[tag.Item2];
            double tension = -lambda[r];
            endForces[i][0] += -tension;
            endForces[i][3] += tension;
        }
    }
}
