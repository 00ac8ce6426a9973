using CrossCheck.Model;

namespace CrossCheck.Import.Loads;

/// <summary><c>moment</c>: a couple M, clockwise, at a on a member or at a joint. It has no direction.</summary>
internal sealed class CoupleLoadKind : LoadKind
{
    public override IReadOnlyList<string> Words { get; } = ["moment", "couple"];

    public override LoadTarget Target => LoadTarget.MemberOrJoint;

    public override IReadOnlyList<string> Uses { get; } = ["M", "a"];

    public override bool HasDirection => false;

    public override Load? Read(LoadRow row)
    {
        double? m = row.Number("M", required: true, requiredBecause: "a moment load");
        if (m is null) return null;
        if (!row.OnMember) return new JointCouple(row.Case, row.On, m.Value, row.Where);
        double? a = row.Number("a", required: true, requiredBecause: "the position of a couple on a member");
        if (a is null || !row.InMember("a", a.Value)) return null;
        return new MemberCouple(row.Case, row.On, m.Value, a.Value, row.Where);
    }
}
