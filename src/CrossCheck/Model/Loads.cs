namespace CrossCheck.Model;

/// <summary>Global direction of a force or distributed load.</summary>
public enum LoadDirection
{
    Down,
    Up,
    Left,
    Right,
}

/// <summary>
/// A load of one load case. Magnitudes are in SI (N, N/m, N·m), positive in the stated direction;
/// moments are clockwise positive. Positions are metres from the member's start joint.
/// </summary>
public abstract record Load(string Case, SourceRef Source)
{
    /// <summary>The same load times <paramref name="factor"/>, in case <paramref name="caseId"/> (a load combination).</summary>
    public abstract Load Scaled(double factor, string caseId);
}

/// <summary>A load that acts on a member.</summary>
public abstract record MemberLoad(string Case, string Member, SourceRef Source) : Load(Case, Source)
{
    /// <summary>
    /// The load as the analysis takes it: one of the <see cref="MemberLoadShape"/>s (a concentrated force, a linearly
    /// varying load or a concentrated couple). A member load one of them describes needs nothing new in the analysis:
    /// fixed-end actions and the moment and shear along the member follow from the shape.
    /// </summary>
    public abstract MemberLoadShape Shape();
}

/// <summary>A concentrated force <paramref name="P"/> at distance <paramref name="A"/> along the member.</summary>
public sealed record PointLoad(string Case, string Member, double P, double A, LoadDirection Direction, SourceRef Source)
    : MemberLoad(Case, Member, Source)
{
    public override MemberLoadShape Shape() => new ConcentratedForce(A, P, Direction);

    public override Load Scaled(double factor, string caseId) => this with { Case = caseId, P = P * factor };
}

/// <summary>
/// A distributed load per unit length along the member, varying linearly from <paramref name="WStart"/>
/// at <paramref name="A"/> to <paramref name="WEnd"/> at <paramref name="B"/> (a uniform load has equal ends).
/// </summary>
public sealed record DistributedLoad(string Case, string Member, double WStart, double WEnd, double A, double B, LoadDirection Direction, SourceRef Source)
    : MemberLoad(Case, Member, Source)
{
    public bool IsUniform => WStart == WEnd;

    public override MemberLoadShape Shape() => new LinearlyVaryingLoad(A, B, WStart, WEnd, Direction);

    public override Load Scaled(double factor, string caseId) => this with { Case = caseId, WStart = WStart * factor, WEnd = WEnd * factor };
}

/// <summary>A concentrated couple on a member, clockwise positive, at distance <paramref name="A"/>.</summary>
public sealed record MemberCouple(string Case, string Member, double M, double A, SourceRef Source)
    : MemberLoad(Case, Member, Source)
{
    public override MemberLoadShape Shape() => new ConcentratedCouple(A, M);

    public override Load Scaled(double factor, string caseId) => this with { Case = caseId, M = M * factor };
}

/// <summary>
/// What a member load is to the analysis (see <see cref="MemberLoad.Shape"/>). Magnitudes in SI, positive in the
/// stated direction; positions in metres from the member's start joint; couples clockwise positive.
/// </summary>
public abstract record MemberLoadShape;

/// <summary>A force <paramref name="P"/> at <paramref name="A"/>.</summary>
public sealed record ConcentratedForce(double A, double P, LoadDirection Direction) : MemberLoadShape;

/// <summary>A load per unit length varying linearly from <paramref name="WStart"/> at <paramref name="A"/> to <paramref name="WEnd"/> at <paramref name="B"/>.</summary>
public sealed record LinearlyVaryingLoad(double A, double B, double WStart, double WEnd, LoadDirection Direction) : MemberLoadShape;

/// <summary>A couple <paramref name="M"/>, clockwise positive, at <paramref name="A"/>.</summary>
public sealed record ConcentratedCouple(double A, double M) : MemberLoadShape;

/// <summary>A load applied directly to a joint.</summary>
public abstract record JointLoad(string Case, string Joint, SourceRef Source) : Load(Case, Source);

/// <summary>A force at a joint.</summary>
public sealed record JointForce(string Case, string Joint, double P, LoadDirection Direction, SourceRef Source)
    : JointLoad(Case, Joint, Source)
{
    public override Load Scaled(double factor, string caseId) => this with { Case = caseId, P = P * factor };
}

/// <summary>A couple at a joint, clockwise positive.</summary>
public sealed record JointCouple(string Case, string Joint, double M, SourceRef Source)
    : JointLoad(Case, Joint, Source)
{
    public override Load Scaled(double factor, string caseId) => this with { Case = caseId, M = M * factor };
}

/// <summary>A load case: its id and its loads in submission order. Support movements apply to every case.</summary>
public sealed record LoadCase(string Id, IReadOnlyList<Load> Loads)
{
    public IEnumerable<MemberLoad> MemberLoads => Loads.OfType<MemberLoad>();
    public IEnumerable<JointLoad> JointLoads => Loads.OfType<JointLoad>();
}

public static class LoadDirections
{
    /// <summary>Unit vector (x right, y up) of a direction.</summary>
    public static (double X, double Y) Vector(this LoadDirection d) => d switch
    {
        LoadDirection.Down => (0, -1),
        LoadDirection.Up => (0, 1),
        LoadDirection.Left => (-1, 0),
        LoadDirection.Right => (1, 0),
        _ => throw new ArgumentOutOfRangeException(nameof(d)),
    };
}
