namespace CrossCheck.Model;

/// <summary>Which displacements a support prevents at a joint.</summary>
[Flags]
public enum Restraint
{
    /// <summary>No support: the joint moves and rotates freely.</summary>
    Free = 0,
    /// <summary>Horizontal movement prevented.</summary>
    X = 1,
    /// <summary>Vertical movement prevented.</summary>
    Y = 2,
    /// <summary>Rotation prevented.</summary>
    Rotation = 4,
    /// <summary>Vertical only (a roller on a horizontal surface).</summary>
    Roller = Y,
    /// <summary>Both translations (a pin).</summary>
    Pinned = X | Y,
    /// <summary>Sliding clamp: horizontal movement and rotation prevented, free to move vertically.</summary>
    Guided = X | Rotation,
    /// <summary>Everything prevented.</summary>
    Fixed = X | Y | Rotation,
}

/// <summary>Where a member's ends are released (moment-free).</summary>
[Flags]
public enum Hinge
{
    None = 0,
    Start = 1,
    End = 2,
    Both = Start | End,
}

/// <summary>Which end of a member.</summary>
public enum MemberEnd
{
    Start,
    End,
}

/// <summary>How members deform along their axis.</summary>
public enum AxialBehaviour
{
    /// <summary>Members keep their length (as in hand methods); enforced exactly as constraints.</summary>
    Rigid,
    /// <summary>Members stretch with stiffness E·A/L; every member needs A.</summary>
    Elastic,
}

/// <summary>A prescribed movement of a support, applied in every load case.</summary>
/// <param name="X">Horizontal movement in metres, positive to the right.</param>
/// <param name="Y">Vertical movement in metres, positive up (a settlement is negative).</param>
/// <param name="Rotation">Rotation in radians, clockwise positive.</param>
public readonly record struct SupportMovement(double X, double Y, double Rotation)
{
    public bool IsZero => X == 0 && Y == 0 && Rotation == 0;
}

/// <summary>A joint of the structure.</summary>
/// <param name="Id">Id as written in the submission.</param>
/// <param name="X">Horizontal coordinate in metres.</param>
/// <param name="Y">Vertical coordinate in metres (up positive).</param>
/// <param name="Restraint">Support conditions.</param>
/// <param name="Movement">Prescribed support movement; zero when none was given.</param>
/// <param name="Source">Row the joint was read from.</param>
public sealed record Joint(string Id, double X, double Y, Restraint Restraint, SupportMovement Movement, SourceRef Source)
{
    public bool IsSupport => Restraint != Restraint.Free;
}

/// <summary>A prismatic Euler–Bernoulli member between two joints.</summary>
/// <param name="Id">Id as written in the submission.</param>
/// <param name="Start">Id of the start joint.</param>
/// <param name="End">Id of the end joint.</param>
/// <param name="E">Elastic modulus in pascals, or 1 when the submission gives relative stiffness only.</param>
/// <param name="I">Second moment of area in m⁴ (or relative).</param>
/// <param name="A">Area in m², when given.</param>
/// <param name="Hinge">Moment releases at the ends.</param>
/// <param name="Source">Row the member was read from.</param>
public sealed record Member(string Id, string Start, string End, double E, double I, double? A, Hinge Hinge, SourceRef Source)
{
    public string JointAt(MemberEnd end) => end == MemberEnd.Start ? Start : End;

    public bool IsReleased(MemberEnd end) =>
        end == MemberEnd.Start ? Hinge.HasFlag(Hinge.Start) : Hinge.HasFlag(Hinge.End);

    /// <summary>The end of this member at the given joint, or null when the member does not touch it.</summary>
    public MemberEnd? EndAt(string jointId) =>
        jointId == Start ? MemberEnd.Start : jointId == End ? MemberEnd.End : null;

    public string OtherJoint(string jointId) => jointId == Start ? End : Start;
}

/// <summary>
/// The structure: joints and members, in SI units (N, m, Pa). Immutable; lookups are built once.
/// </summary>
public sealed class StructureModel
{
    private readonly Dictionary<string, Joint> _joints;
    private readonly Dictionary<string, Member> _members;

    public StructureModel(IReadOnlyList<Joint> joints, IReadOnlyList<Member> members, AxialBehaviour axial, bool relativeStiffness)
    {
        ArgumentNullException.ThrowIfNull(joints);
        ArgumentNullException.ThrowIfNull(members);
        Joints = joints;
        Members = members;
        Axial = axial;
        RelativeStiffness = relativeStiffness;
        _joints = joints.ToDictionary(j => j.Id, StringComparer.Ordinal);
        _members = members.ToDictionary(m => m.Id, StringComparer.Ordinal);
    }

    public IReadOnlyList<Joint> Joints { get; }
    public IReadOnlyList<Member> Members { get; }
    public AxialBehaviour Axial { get; }

    /// <summary>True when E was not given: stiffness is relative and displacements are not meaningful.</summary>
    public bool RelativeStiffness { get; }

    public Joint Joint(string id) => _joints[id];
    public bool TryGetJoint(string id, out Joint joint) => _joints.TryGetValue(id, out joint!);
    public Member Member(string id) => _members[id];
    public bool TryGetMember(string id, out Member member) => _members.TryGetValue(id, out member!);

    public double Length(Member m)
    {
        var a = Joint(m.Start);
        var b = Joint(m.End);
        return Math.Sqrt(((b.X - a.X) * (b.X - a.X)) + ((b.Y - a.Y) * (b.Y - a.Y)));
    }

    private Dictionary<string, List<Member>>? _byJoint;

    /// <summary>Members meeting at a joint, in submission order.</summary>
    public IEnumerable<Member> MembersAt(string jointId)
    {
        _byJoint ??= BuildJointLookup();
        return _byJoint.TryGetValue(jointId, out var list) ? list : [];
    }

    private Dictionary<string, List<Member>> BuildJointLookup()
    {
        var map = new Dictionary<string, List<Member>>(StringComparer.Ordinal);
        foreach (var m in Members)
        {
            if (!map.TryGetValue(m.Start, out var a)) map[m.Start] = a = [];
            a.Add(m);
            if (m.End == m.Start) continue;
            if (!map.TryGetValue(m.End, out var b)) map[m.End] = b = [];
            b.Add(m);
        }
        return map;
    }

    public bool HasSupportMovements => Joints.Any(j => !j.Movement.IsZero);
}
