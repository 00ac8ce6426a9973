using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>The optional <c>displacements</c> table: claimed joint displacements, read only beside the end moments they go with.</summary>
internal sealed class DisplacementsReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (!d.Has("end-moments") || d.Table("displacements") is not { } dt) return;
        var dv = d.View(dt, TableSchema.Displacements);
        d.Remember(dv, "ux", QuantityKind.Length, "displacement");
        d.Remember(dv, "uy", QuantityKind.Length, "displacement");
        var displacements = new List<ClaimedDisplacement>();
        foreach (var row in dv.Rows)
        {
            string c = dv.Id(row, "case", required: false) ?? "1";
            string? joint = dv.Id(row, "joint");
            double? ux = dv.Number(row, "ux"), uy = dv.Number(row, "uy"), rot = dv.Number(row, "rotation");
            if (joint is null || !d.ClaimCase(dv, row, c, unknownAllowed: true)) continue;
            displacements.Add(new ClaimedDisplacement(c, joint, ux, uy, rot, dv.RowRef(row)));
        }
        d.Claims = d.Claims with { Displacements = displacements };
    }
}
