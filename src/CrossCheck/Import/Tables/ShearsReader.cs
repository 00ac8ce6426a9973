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
        var claims = new List<ClaimedShear>();
        var seen = new Dictionary<(string, string, MemberEnd), SourceRef>();
        foreach (var row in v.Rows)
        {
            string c = v.Id(row, "case", required: false) ?? "1";
            string? member = v.Id(row, "member");
            string? at = v.Id(row, "at");
            double? value = v.Number(row, "V", required: true);
            if (member is null || at is null || value is null || !d.ClaimCase(v, row, c)) continue;
            var end = MemberEndCell.Resolve(d.Model, member, at);
            if (end is MemberEnd e && !seen.TryAdd((c, member, e), v.RowRef(row)))
            {
                d.Error(v.RowRef(row), Messages.ShearTwice(member, at, c, seen[(c, member, e)].Compact));
                continue;
            }
            claims.Add(new ClaimedShear(c, member, at, end, value.Value, value.Value / (v.Unit("V")?.ToSi ?? 1), v.CellRef(row, "V")));
        }
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
