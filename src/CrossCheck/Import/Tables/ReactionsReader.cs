using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>The optional <c>reactions</c> table: claimed support reactions, read only beside the end moments they go with.</summary>
internal sealed class ReactionsReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (!d.Has("end-moments") || d.Table("reactions") is not { } rt) return;
        var rv = d.View(rt, TableSchema.Reactions);
        var reactions = new List<ClaimedReaction>();
        foreach (var row in rv.Rows)
        {
            string c = rv.Id(row, "case", required: false) ?? "1";
            string? joint = rv.Id(row, "joint");
            double? rx = rv.Number(row, "Rx"), ry = rv.Number(row, "Ry"), m = rv.Number(row, "M");
            if (joint is null || !d.ClaimCase(rv, row, c, unknownAllowed: true)) continue;
            reactions.Add(new ClaimedReaction(c, joint, rx, ry, m, rv.RowRef(row)));
        }
        d.Claims = d.Claims with { Reactions = reactions };
    }
}
