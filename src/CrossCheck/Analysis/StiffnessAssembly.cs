namespace CrossCheck.Analysis;

/// <summary>
/// Assembly of the reduced stiffness matrix Tᵀ·K·T straight from the members' global matrices and the constraint
/// transformation d = T·q + d0 (<see cref="Transformation"/>): the full joint matrix K is never formed.
/// </summary>
internal static class StiffnessAssembly
{
    /// <summary>The reduced stiffness matrix over the independent unknowns.</summary>
    /// <param name="frame">Members and DOF numbering.</param>
    /// <param name="t">The constraint transformation.</param>
    /// <param name="unit">Use every member's unit-stiffness copy (<see cref="MemberElement.UnitGlobalK"/>) instead of its real stiffness.</param>
    public static SparseSymmetricMatrix Reduce(FrameLayout frame, Transformation t, bool unit = false)
    {
        var k = new SparseSymmetricMatrix(t.MasterCount);
        foreach (var e in frame.Elements)
        {
            var dofs = e.Dofs;
            for (int a = 0; a < 6; a++)
            {
                var ta = t.Terms[dofs[a]];
                if (ta.Length == 0) continue;
                for (int b = 0; b < 6; b++)
                {
                    double kab = unit ? e.UnitGlobalK[a, b] : e.GlobalK[a, b];
                    if (kab == 0) continue;
                    var tb = t.Terms[dofs[b]];
                    foreach (var (ma, ca) in ta)
                        foreach (var (mb, cb) in tb)
                            if (ma >= mb) k.Add(ma, mb, ca * kab * cb);
                }
            }
        }
        return k;
    }
}
