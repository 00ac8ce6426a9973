using CrossCheck.Model;

namespace CrossCheck.Import.Loads;

/// <summary><c>force</c>: a force P at a joint.</summary>
internal sealed class JointForceKind : LoadKind
{
    public override IReadOnlyList<string> Words { get; } = ["force"];

    public override LoadTarget Target => LoadTarget.Joint;

    public override IReadOnlyList<string> Uses { get; } = ["P"];

    public override Load? Read(LoadRow row) => ReadForce(row);

    /// <summary>A joint force (also what a point load on a joint is).</summary>
    public static JointForce? ReadForce(LoadRow row)
    {
        double? p = row.Number("P", required: true, requiredBecause: "a joint force");
        if (p is null) return null;
        row.WarnNegative("P", p.Value);
        return new JointForce(row.Case, row.On, p.Value, row.Direction, row.Where);
    }
}
