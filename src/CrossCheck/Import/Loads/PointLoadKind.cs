using CrossCheck.Model;

namespace CrossCheck.Import.Loads;

/// <summary><c>point</c>: a concentrated force P at a on a member; on a joint, it is a joint force.</summary>
internal sealed class PointLoadKind : LoadKind
{
    public override IReadOnlyList<string> Words { get; } = ["point", "concentrated", "conc"];

    public override LoadTarget Target => LoadTarget.MemberOrJoint;

    public override IReadOnlyList<string> Uses { get; } = ["P", "a"];

    public override Load? Read(LoadRow row)
    {
        if (!row.OnMember) return JointForceKind.ReadForce(row);
        double? p = row.Number("P", required: true, requiredBecause: "a point load");
        double? a = row.Number("a", required: true, requiredBecause: "the position of a point load");
        if (p is null || a is null || !row.InMember("a", a.Value)) return null;
        row.WarnNegative("P", p.Value);
        return new PointLoad(row.Case, row.On, p.Value, a.Value, row.Direction, row.Where);
    }
}
