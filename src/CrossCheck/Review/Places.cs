using System.Text.RegularExpressions;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// Where in the structure a finding is: typed, so that later stages (grouping, comment ids, drawings) read the place
/// instead of parsing words back. <see cref="Words"/> is what a memo prints ("member BC at C"); <see cref="Key"/> is
/// the short stable part of a comment id ("BC-C").
/// </summary>
public abstract partial record Place
{
    /// <summary>The place in words for a sentence or a table.</summary>
    public abstract string Words { get; }

    /// <summary>The place in a comment id: letters, digits, <c>+ . _</c> and <c>-</c> between parts.</summary>
    public abstract string Key { get; }

    public sealed override string ToString() => Words;

    /// <summary>A stable comment id: <c>EQ-DL-C</c> (prefix, case, place).</summary>
    public static string CommentId(string prefix, string caseId, Place? place) =>
        place is null || place.Key.Length == 0 ? $"{prefix}-{IdPart(caseId)}" : $"{prefix}-{IdPart(caseId)}-{place.Key}";

    /// <summary>One part of an id: anything but letters, digits, <c>+</c> and <c>.</c> becomes <c>_</c>; at most 24 characters.</summary>
    public static string IdPart(string s)
    {
        var c = NotIdChar().Replace(s.Trim(), "_").Trim('_');
        return c.Length == 0 ? "x" : c.Length > 24 ? c[..24] : c;
    }

    [GeneratedRegex(@"[^A-Za-z0-9+.]+")]
    private static partial Regex NotIdChar();
}

/// <summary>A joint: "joint C".</summary>
public sealed record JointPlace(string Joint) : Place
{
    public override string Words => $"joint {Joint}";
    public override string Key => IdPart(Joint);
}

/// <summary>A whole member: "member BC".</summary>
public sealed record MemberPlace(string Member) : Place
{
    public override string Words => $"member {Member}";
    public override string Key => IdPart(Member);
}

/// <summary>One end of a member, named by its joint when the model has it: "member BC at C".</summary>
public sealed record MemberEndPlace(string Member, string At, MemberEnd? End = null) : Place
{
    public override string Words => $"member {Member} at {At}";
    public override string Key => $"{IdPart(Member)}-{IdPart(At)}";

    /// <summary>Short words for a list: "BC at C".</summary>
    public string Short => $"{Member} at {At}";
}

/// <summary>Two member ends that should mirror each other: "AB at A / CD at D".</summary>
public sealed record MirrorPlace(MemberEndPlace First, MemberEndPlace Second) : Place
{
    public override string Words => $"{First.Short} / {Second.Short}";
    public override string Key => $"{First.Key}-{Second.Key}";
}

/// <summary>A storey of a frame, numbered from the bottom, with its levels in the submission's length unit: "storey 1 (y 0 to 4 m)".</summary>
public sealed record StoreyPlace(int Number, string Range) : Place
{
    public override string Words => $"storey {Number} ({Range})";
    public override string Key => Number.ToString(System.Globalization.CultureInfo.InvariantCulture);
}

/// <summary>One component of a support reaction or joint displacement: "joint A Ry".</summary>
public sealed record ComponentPlace(string Joint, string Component) : Place
{
    public override string Words => $"joint {Joint} {Component}";
    public override string Key => $"{IdPart(Joint)}-{IdPart(Component)}";
}

/// <summary>The structure as a whole in one direction: "vertical equilibrium".</summary>
public sealed record OverallPlace(string What) : Place
{
    public override string Words => What;
    public override string Key => IdPart(What.Split(' ')[0]);
}

/// <summary>A cell of the author's moment-distribution table: "working table, case 1, balance 2 / AB@B".</summary>
public sealed record WorkingCellPlace(string Case, string? Row, string? Column) : Place
{
    public override string Words => Row is null ? $"working table, case {Case}" : $"working table, case {Case}, {Row} / {Column}";
    public override string Key => Row is null ? "table" : $"{IdPart(Row)}-{IdPart(Column ?? "")}";
}

/// <summary>The model as a whole, or one member of it named for a property of the model (conditioning): "stiffness matrix", "member BC".</summary>
public sealed record ModelPlace(string What, string? Member = null) : Place
{
    public override string Words => Member is null ? What : $"member {Member}";
    public override string Key => Member is null ? "model" : IdPart(Member);
}
