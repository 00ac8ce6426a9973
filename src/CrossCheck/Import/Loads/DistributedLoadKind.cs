using CrossCheck.Model;

namespace CrossCheck.Import.Loads;

/// <summary>A load per unit length from a to b (the whole member by default), starting at w.</summary>
internal abstract class DistributedLoadKind : LoadKind
{
    public override LoadTarget Target => LoadTarget.Member;

    /// <summary>The intensity at b, read after <paramref name="w"/> (the intensity at a).</summary>
    protected abstract double? EndIntensity(LoadRow row, double? w);

    public override Load? Read(LoadRow row)
    {
        double L = row.Length;
        double? w = row.Number("w", required: true, requiredBecause: "a distributed load");
        double? w2 = EndIntensity(row, w);
        double a = row.Number("a") ?? 0;
        double b = row.Number("b") ?? L;
        if (w is null || w2 is null) return null;
        if (!row.InMember("a", a) || !row.InMember("b", b)) return null;
        if (b < a) { row.Error("b", Messages.LoadEndsReversed); return null; }
        if (b == a) { row.Error("b", Messages.LoadOverNoLength); return null; }
        row.WarnNegative("w", w.Value);
        return new DistributedLoad(row.Case, row.On, w.Value, w2.Value, a, Math.Min(b, L), row.Direction, row.Where);
    }
}
