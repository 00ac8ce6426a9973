using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// A structure set out for moment distribution: one column per member end (start, then end, member by member), the
/// rotational stiffness and carry-over factor of each column, and which joints are balanced.
/// </summary>
internal sealed class DistributionFrame
{
    private readonly StructureModel _model;
    private readonly Dictionary<string, int> _joint;

    public DistributionFrame(StructureModel model, DistributionOptions o)
    {
        _model = model;
        Options = o;
        Kinematics = new Kinematics(model);
        Members = model.Members;
        _joint = model.Joints.Select((j, i) => (j.Id, i)).ToDictionary(x => x.Id, x => x.i, StringComparer.Ordinal);
        Columns = Members.SelectMany(m => new[] { (m.Id, MemberEnd.Start), (m.Id, MemberEnd.End) }).ToList();
        OverhangTip = Members.Select(m => IsOverhang(m)).ToArray();
        int n = Columns.Count;
        Stiffness = new double[n];
        Carry = new double[n];
        PinnedFar = new double[n].Select(_ => false).ToArray();
        JointOf = new int[n];
        for (int i = 0; i < n; i++)
        {
            var (mid, end) = Columns[i];
            var m = model.Member(mid);
            JointOf[i] = _joint[m.JointAt(end)];
            var far = end == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;
            double L = Length(m), ei = m.E * m.I;
            if (m.IsReleased(end) || OverhangTip[i / 2] is not null) continue;
            // Modified stiffness when the far end is hinged, or is a lone pin (unless this end is one too:
            // a member pinned at both ends is simply balanced at both).
            if (m.IsReleased(far) || (o.ModifiedStiffness && IsPinLike(m, far) && !IsPinLike(m, end)))
            {
                Stiffness[i] = 3 * ei / L;
                Carry[i] = 0;
                PinnedFar[i] = true;
            }
            else
            {
                Stiffness[i] = 4 * ei / L;
                Carry[i] = o.CarryOverFactor;
            }
        }
        Balanced = new bool[model.Joints.Count];
        for (int j = 0; j < model.Joints.Count; j++)
        {
            var joint = model.Joints[j];
            if (joint.Restraint.HasFlag(Restraint.Rotation)) continue;
            double k = 0;
            for (int i = 0; i < n; i++) if (JointOf[i] == j) k += Stiffness[i];
            bool released = o.ModifiedStiffness && IsReleasedPin(joint) && !IsPinLike(model.MembersAt(joint.Id).First(), OtherEnd(model.MembersAt(joint.Id).First(), joint.Id));
            Balanced[j] = k > 0 && !released;
        }
    }

    public StructureModel Model => _model;
    public DistributionOptions Options { get; }
    public Kinematics Kinematics { get; }
    public IReadOnlyList<Member> Members { get; }
    public List<(string Member, MemberEnd End)> Columns { get; }
    public int JointCount => _model.Joints.Count;

    /// <summary>Rotational stiffness at each column's end (0 when released).</summary>
    public double[] Stiffness { get; }

    /// <summary>Carry-over factor from each column to its far end.</summary>
    public double[] Carry { get; }

    /// <summary>The member's far end is a released pin (modified stiffness).</summary>
    public bool[] PinnedFar { get; }

    /// <summary>
    /// Per member: the free tip of an overhang, or null. As engineers distribute by hand, an overhang takes no
    /// distributed moment (stiffness 0 at its root) and its end moments are statical (common practice).
    /// </summary>
    public MemberEnd?[] OverhangTip { get; }

    /// <summary>Joint index of each column.</summary>
    public int[] JointOf { get; }

    /// <summary>Joint is balanced (rotation free and stiff).</summary>
    public bool[] Balanced { get; }

    public int JointIndex(string joint) => _joint[joint];

    public double Length(Member m) => _model.Length(m);

    /// <summary>The column at the other end of the same member.</summary>
    public static int FarColumn(int i) => i % 2 == 0 ? i + 1 : i - 1;

    /// <summary>
    /// The free tip of a member that is an overhang whose root does not move across it: the tip's translations turn this
    /// member's chord alone (so its moments are statical and no sway case is needed for them).
    /// </summary>
    private MemberEnd? IsOverhang(Member m)
    {
        if (LoadResultants.OverhangTip(_model, m) is not MemberEnd tip) return null;
        var own = Kinematics.ChordRotation(m).Terms.Keys;
        return own.All(u => Members.All(o => o.Id == m.Id || !Kinematics.ChordRotation(o).Terms.ContainsKey(u))) ? tip : null;
    }

    /// <summary>A pin or roller (or free end) with this member alone: released once at the start when using modified stiffness.</summary>
    private bool IsPinLike(Member m, MemberEnd end)
    {
        var j = _model.Joint(m.JointAt(end));
        return !j.Restraint.HasFlag(Restraint.Rotation) && _model.MembersAt(j.Id).Count() == 1 && !m.IsReleased(end);
    }

    private static MemberEnd OtherEnd(Member m, string joint) => m.EndAt(joint) == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;

    private bool IsReleasedPin(Joint j)
    {
        var members = _model.MembersAt(j.Id).ToList();
        return members.Count == 1 && IsPinLike(members[0], members[0].EndAt(j.Id)!.Value);
    }
}
