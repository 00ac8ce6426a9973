using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The optional <c>shears</c> table: claimed member-end shears in the beam convention (V = dM/dx from start to end), each
/// matched to a member end like an end-moment claim.
/// </summary>
internal sealed class ShearsReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Table("shears") is not { } t) return;
        var v = d.View(t, TableSchema.Shears);
        var claims = EndClaimRows.Read(d, v, "V", Messages.ShearTwice)
            .Select(r => new ClaimedShear(r.Case, r.Member, r.At, r.End, r.Value, r.AsWritten, r.Source))
            .ToList();
        d.Claims = d.Claims with { Shears = claims };
    }
}

/// <summary>How a claim's <c>at</c> cell names a member end: the joint id, or <c>start</c> (<c>i</c>, <c>near</c>) / <c>end</c> (<c>j</c>, <c>far</c>).</summary>
internal static class MemberEndCell
{
    /// <summary>The end of <paramref name="member"/> that <paramref name="at"/> names; null when the model has no such member or end.</summary>
    public static MemberEnd? Resolve(StructureModel model, string member, string at)
    {
        if (!model.TryGetMember(member, out var m)) return null;
        string n = TableSchema.Normalize(at);
        return m.EndAt(at) ?? (n is "start" or "i" or "near" ? MemberEnd.Start : n is "end" or "j" or "far" ? MemberEnd.End : null);
    }
}
