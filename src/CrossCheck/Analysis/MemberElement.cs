using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// A member as the stiffness method sees it: its joints' DOF numbers, geometry, local stiffness, released ends and
/// its condensed stiffness in global axes (what assembly adds into the structure's matrix).
/// </summary>
internal sealed record MemberElement(Member Member, int StartJoint, int EndJoint, double Length, double Cos, double Sin,
    Mat6 LocalK, int[] Released, Mat6 GlobalK, bool Elastic)
{
    private Mat6? _unit;

    /// <summary>
    /// The same member with stiffness of unit size (4EI/L = 1, EA/L = 1): its null space is the structure's
    /// mechanisms, free of the conditioning that very different real stiffnesses bring. Built when first needed.
    /// </summary>
    public Mat6 UnitGlobalK => _unit ??= Unit();

    private Mat6 Unit()
    {
        var ku = ElementMatrices.LocalStiffness(Length / 4, Elastic ? Length : 0, Length);
        var (kuc, _) = ElementMatrices.Condense(ku, new double[6], Released);
        return ElementMatrices.ToGlobal(kuc, Cos, Sin);
    }

    /// <summary>Global DOF numbers of the six member-end displacements (u, v, θ at the start, then at the end).</summary>
    public int[] Dofs { get; } =
    [
        3 * StartJoint, (3 * StartJoint) + 1, (3 * StartJoint) + 2,
        3 * EndJoint, (3 * EndJoint) + 1, (3 * EndJoint) + 2,
    ];
}
