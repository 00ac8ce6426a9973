using CrossCheck.Model;

namespace CrossCheck.Benchmarks;

/// <summary>Regular n-storey × m-bay frames with gravity and lateral loads (invented, for timing only).</summary>
public static class FrameGenerator
{
    public static (StructureModel Model, IReadOnlyList<LoadCase> Cases) Regular(int storeys, int bays, bool elastic = false)
    {
        var src = new SourceRef("generated");
        var joints = new List<Joint>();
        var members = new List<Member>();
        var loads = new List<Load>();
        for (int i = 0; i <= bays; i++)
            for (int j = 0; j <= storeys; j++)
                joints.Add(new Joint($"J{i}_{j}", 6.0 * i, 3.5 * j, j == 0 ? Restraint.Fixed : Restraint.Free, default, src));
        for (int i = 0; i <= bays; i++)
            for (int j = 1; j <= storeys; j++)
                members.Add(new Member($"C{i}_{j}", $"J{i}_{j - 1}", $"J{i}_{j}", 200e9, 3e-4, elastic ? 1e-2 : null, Hinge.None, src));
        for (int i = 1; i <= bays; i++)
            for (int j = 1; j <= storeys; j++)
            {
                members.Add(new Member($"B{i}_{j}", $"J{i - 1}_{j}", $"J{i}_{j}", 200e9, 4e-4, elastic ? 8e-3 : null, Hinge.None, src));
                loads.Add(new DistributedLoad("1", $"B{i}_{j}", 20e3, 20e3, 0, 6, LoadDirection.Down, src));
            }
        for (int j = 1; j <= storeys; j++) loads.Add(new JointForce("1", $"J0_{j}", 10e3, LoadDirection.Right, src));
        return (new StructureModel(joints, members, elastic ? AxialBehaviour.Elastic : AxialBehaviour.Rigid, false), [new LoadCase("1", loads)]);
    }

    /// <summary>Storeys × bays giving about <paramref name="dof"/> joint degrees of freedom (3 per joint).</summary>
    public static (int Storeys, int Bays) ForDof(int dof, int bays)
    {
        int joints = dof / 3;
        return ((joints / (bays + 1)) - 1, bays);
    }
}
