using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// How the joints of a structure can move, before any load is applied: supports, prescribed movements and
/// axially rigid members as constraints, eliminated so that every displacement is a combination of independent
/// unknowns. The solver builds on it; the review uses it to know which chord rotations are fixed by geometry
/// (a beam between joints that cannot move vertically) and which are free (sway), without using the solver's answer.
/// </summary>
public sealed class Kinematics
{
    private readonly StructureModel _model;
    private readonly Dictionary<string, int> _jointIndex;
    private readonly Transformation _t;

    public Kinematics(StructureModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        _model = model;
        _jointIndex = model.Joints.Select((j, i) => (j.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        _t = Constraints(model).Build();
    }

    /// <summary>Number of independent displacement unknowns.</summary>
    public int FreedomCount => _t.MasterCount;

    /// <summary>Clockwise rotation of a joint as Σ coef·q + constant over the independent unknowns q.</summary>
    public LinearForm JointRotation(string joint)
    {
        int dof = (3 * _jointIndex[joint]) + 2;
        // Internal rotations are anticlockwise: negate.
        return new LinearForm(_t.Terms[dof].ToDictionary(x => x.Master, x => -x.Coef), -_t.Constants[dof]);
    }

    /// <summary>Horizontal and vertical displacement of a joint as linear forms of the independent unknowns.</summary>
    public (LinearForm Ux, LinearForm Uy) JointTranslation(string joint)
    {
        int dof = 3 * _jointIndex[joint];
        LinearForm Form(int i) => new(_t.Terms[i].ToDictionary(x => x.Master, x => x.Coef), _t.Constants[i]);
        return (Form(dof), Form(dof + 1));
    }

    /// <summary>Independent unknowns that are translations (sway or joint drop), as opposed to joint rotations.</summary>
    public IReadOnlyList<int> TranslationUnknowns =>
        Enumerable.Range(0, _t.MasterCount).Where(m => _t.Masters[m] % 3 != 2).ToList();

    /// <summary>The joint and direction an independent unknown stands for (for messages).</summary>
    public (string Joint, string Direction) Describe(int unknown)
    {
        int dof = _t.Masters[unknown];
        return (_model.Joints[dof / 3].Id, (dof % 3) switch { 0 => "x", 1 => "y", _ => "rotation" });
    }

    /// <summary>Clockwise chord rotation ψ of a member (transverse end displacement difference / L).</summary>
    public LinearForm ChordRotation(Member member)
    {
        ArgumentNullException.ThrowIfNull(member);
        var a = _model.Joint(member.Start);
        var b = _model.Joint(member.End);
        double dx = b.X - a.X, dy = b.Y - a.Y, L = Math.Sqrt((dx * dx) + (dy * dy));
        double c = dx / L, s = dy / L;
        int i = 3 * _jointIndex[member.Start], j = 3 * _jointIndex[member.End];
        // Transverse (local y) displacement: −s·ux + c·uy; ψ clockwise = −(v_end − v_start)/L.
        var terms = new Dictionary<int, double>();
        double constant = 0;
        void Add(int dof, double factor)
        {
            constant += factor * _t.Constants[dof];
            foreach (var (m, coef) in _t.Terms[dof]) terms[m] = terms.GetValueOrDefault(m) + (factor * coef);
        }
        Add(j, s / L); Add(j + 1, -c / L); Add(i, -s / L); Add(i + 1, c / L);
        foreach (var k in terms.Where(kv => Math.Abs(kv.Value) < 1e-12 / L).Select(kv => kv.Key).ToList()) terms.Remove(k);
        return new LinearForm(terms, constant);
    }

    /// <summary>True when some member can rotate as a rigid chord (the frame can sway or a joint can drop).</summary>
    public bool CanSway => _model.Members.Any(m => !ChordRotation(m).IsConstant);

    /// <summary>Joints whose rotation no member and no support resists (every member hinged there).</summary>
    public static IEnumerable<Joint> MomentFreeJoints(StructureModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        var rigid = new HashSet<string>(StringComparer.Ordinal);
        foreach (var m in model.Members)
        {
            if (!m.Hinge.HasFlag(Hinge.Start)) rigid.Add(m.Start);
            if (!m.Hinge.HasFlag(Hinge.End)) rigid.Add(m.End);
        }
        return model.Joints.Where(j => !j.Restraint.HasFlag(Restraint.Rotation) && !rigid.Contains(j.Id)).ToList();
    }

    /// <summary>Supports, prescribed movements, moment-free joints and (for rigid axial behaviour) member lengths.</summary>
    /// <exception cref="StructureException">Support movements contradict the axially rigid members.</exception>
    internal static ConstraintSet Constraints(StructureModel model)
    {
        string[] dirNames = ["x", "y", "rotation"];
        var index = model.Joints.Select((j, i) => (j.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        var cs = new ConstraintSet(3 * model.Joints.Count);
        for (int j = 0; j < model.Joints.Count; j++)
        {
            var joint = model.Joints[j];
            void Fix(Restraint flag, int dir, double value)
            {
                if (!joint.Restraint.HasFlag(flag)) return;
                if (!cs.Add(new Dictionary<int, double> { [(3 * j) + dir] = 1 }, value, ("support", joint.Id, dir), out _))
                    throw new StructureException(
                        $"The movement prescribed at support {joint.Id} in {dirNames[dir]} contradicts the axially rigid members " +
                        "connecting it to other supports. Give member areas and set 'axial' to 'elastic', or remove the movement.",
                        joint.Id, dirNames[dir]);
            }
            Fix(Restraint.X, 0, joint.Movement.X);
            Fix(Restraint.Y, 1, joint.Movement.Y);
            Fix(Restraint.Rotation, 2, -joint.Movement.Rotation);
        }
        foreach (var joint in MomentFreeJoints(model))
        {
            int j = index[joint.Id];
            cs.Add(new Dictionary<int, double> { [(3 * j) + 2] = 1 }, 0, ("hinged-joint", joint.Id, 2), out _);
        }
        if (model.Axial == AxialBehaviour.Rigid)
        {
            foreach (var m in model.Members)
            {
                var a = model.Joint(m.Start);
                var b = model.Joint(m.End);
                double dx = b.X - a.X, dy = b.Y - a.Y, L = Math.Sqrt((dx * dx) + (dy * dy));
                if (!(L > 0)) continue;
                double c = dx / L, s = dy / L;
                int sj = index[m.Start], ej = index[m.End];
                var row = new Dictionary<int, double>();
                void Put(int dof, double v) { if (v != 0) row[dof] = row.GetValueOrDefault(dof) + v; }
                Put(3 * sj, -c);
                Put((3 * sj) + 1, -s);
                Put(3 * ej, c);
                Put((3 * ej) + 1, s);
                if (!cs.Add(row, 0, ("rigid", m.Id, 0), out _))
                    throw new StructureException(
                        $"The support movements stretch or shorten member {m.Id}, which is axially rigid. " +
                        "Give member areas and set 'axial' to 'elastic', or correct the movements.");
            }
        }
        return cs;
    }
}

/// <summary>A linear function of the independent displacement unknowns: Σ coef·q + constant.</summary>
public sealed record LinearForm(IReadOnlyDictionary<int, double> Terms, double Constant)
{
    public bool IsConstant => Terms.Count == 0;
}
