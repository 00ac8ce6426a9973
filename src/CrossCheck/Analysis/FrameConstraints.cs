using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// The constraints of one analysis: supports, support movements, moment-free joints and axially rigid members
/// (<see cref="Kinematics.Constraints"/>), plus the holds of a braced analysis. The holds are remembered, since
/// equilibrium is not checked in a held direction.
/// </summary>
internal sealed class FrameConstraints
{
    private FrameConstraints(ConstraintSet set, HashSet<int> held)
    {
        Set = set;
        Held = held;
        Transformation = set.Build();
    }

    public ConstraintSet Set { get; }

    /// <summary>Joint DOF held by the analysis rather than by a support.</summary>
    public HashSet<int> Held { get; }

    /// <summary>d = T·q + d0.</summary>
    public Transformation Transformation { get; }

    /// <param name="model">The structure.</param>
    /// <param name="cases">The load cases (a couple on a joint that cannot carry moment is refused).</param>
    /// <param name="holdTranslations">Hold every translation the supports and rigid members leave free (braced analysis).</param>
    /// <exception cref="StructureException">A couple no member can resist, or support movements that contradict rigid members.</exception>
    public static FrameConstraints Build(StructureModel model, IReadOnlyList<LoadCase> cases, bool holdTranslations)
    {
        // A couple on a joint that cannot carry moment is an error before anything else.
        foreach (var joint in Kinematics.MomentFreeJoints(model))
            foreach (var c in cases)
                if (c.Loads.OfType<JointCouple>().Any(l => l.Joint == joint.Id && l.M != 0))
                    throw new StructureException(
                        $"Case {c.Id} applies a couple at joint {joint.Id}, but every member is hinged there and no support holds its rotation, so nothing can resist it.",
                        joint.Id, "rotation");
        var cs = Kinematics.Constraints(model);
        var held = new HashSet<int>();
        if (holdTranslations)
            foreach (int dof in cs.Build().Masters.Where(d => d % 3 != 2))
            {
                cs.Add(new Dictionary<int, double> { [dof] = 1 }, 0, ("braced", dof, 0), out _);
                held.Add(dof);
            }
        return new FrameConstraints(cs, held);
    }
}
