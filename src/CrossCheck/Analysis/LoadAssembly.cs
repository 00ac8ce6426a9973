using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>A case's member loads in local axes by element, with their fixed-end actions (computed once per case).</summary>
internal sealed record CaseLoads(LocalAction[][] Actions, double[]?[] Fixed);

/// <summary>
/// Load vectors of the stiffness method: member loads resolved into local actions and fixed-end actions
/// (<see cref="LocalLoads"/>, <see cref="FixedEndActions"/>), joint loads, and their reduction onto the independent unknowns.
/// </summary>
internal static class LoadAssembly
{
    private static readonly LocalAction[] NoActions = [];

    /// <exception cref="StructureException">A load acts on a member that does not exist.</exception>
    public static CaseLoads LocalActions(FrameLayout frame, LoadCase loadCase)
    {
        var elements = frame.Elements;
        var lists = new List<LocalAction>?[elements.Length];
        foreach (var load in loadCase.MemberLoads)
        {
            if (!frame.ElementIndex.TryGetValue(load.Member, out int i))
                throw new StructureException($"A load of case {loadCase.Id} acts on member {load.Member}, which does not exist.");
            var e = elements[i];
            (lists[i] ??= []).Add(LocalLoads.Resolve(load, e.Cos, e.Sin));
        }
        var actions = new LocalAction[elements.Length][];
        var fixedActions = new double[]?[elements.Length];
        for (int i = 0; i < elements.Length; i++)
        {
            if (lists[i] is not { } list) { actions[i] = NoActions; continue; }
            actions[i] = [.. list];
            fixedActions[i] = FixedEndActions.Compute(list, elements[i].Length);
        }
        return new CaseLoads(actions, fixedActions);
    }

    /// <summary>The load vector F − Σ Tᵀ·f_fixed reduced onto the independent unknowns: Tᵀ(F − K·d0).</summary>
    /// <exception cref="StructureException">A load acts on a joint that does not exist.</exception>
    public static double[] ReducedLoad(FrameLayout frame, Transformation t, LoadCase loadCase, CaseLoads local) =>
        t.Reduce(JointVector(frame, t, loadCase, local));

    /// <summary>The load vector F − Σ f_fixed − K·d0 at every joint DOF, before reduction.</summary>
    /// <exception cref="StructureException">A load acts on a joint that does not exist.</exception>
    public static double[] JointVector(FrameLayout frame, Transformation t, LoadCase loadCase, CaseLoads local)
    {
        var f = new double[frame.DofCount];
        foreach (var jl in loadCase.JointLoads)
        {
            if (!frame.JointIndex.TryGetValue(jl.Joint, out int j))
                throw new StructureException($"A load of case {loadCase.Id} acts on joint {jl.Joint}, which does not exist.");
            switch (jl)
            {
                case JointForce p:
                    var (ux, uy) = p.Direction.Vector();
                    f[3 * j] += p.P * ux;
                    f[(3 * j) + 1] += p.P * uy;
                    break;
                case JointCouple c:
                    f[(3 * j) + 2] += -c.M;
                    break;
            }
        }
        var elements = frame.Elements;
        for (int i = 0; i < elements.Length; i++)
        {
            var e = elements[i];
            if (local.Fixed[i] is not { } fixedLocal) continue;
            var (_, condensed) = ElementMatrices.Condense(e.LocalK, fixedLocal, e.Released);
            var g = ElementMatrices.ToGlobal(condensed, e.Cos, e.Sin);
            for (int a = 0; a < 6; a++) f[e.Dofs[a]] -= g[a];
        }
        // Subtract K·d0 for prescribed movements.
        if (t.Constants.Any(c => c != 0))
        {
            foreach (var e in elements)
            {
                var d0 = e.Dofs.Select(i => t.Constants[i]).ToArray();
                if (d0.All(v => v == 0)) continue;
                for (int a = 0; a < 6; a++)
                {
                    double s = 0;
                    for (int b = 0; b < 6; b++) s += e.GlobalK[a, b] * d0[b];
                    f[e.Dofs[a]] -= s;
                }
            }
        }
        return f;
    }
}
