using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>The <c>joints</c> table of a frame: id, coordinates, restraint and support movements.</summary>
internal sealed class JointsReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Layout != GeometryLayout.Frame || d.Table("joints") is not { } table) return;
        var jv = d.View(table, TableSchema.Joints);
        d.Remember(jv, "x", QuantityKind.Length);
        var firstSeen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        foreach (var row in jv.Rows)
        {
            string? id = jv.Id(row, "joint");
            double? x = jv.Length(row, "x", required: true);
            double? y = jv.Length(row, "y", required: true);
            var restraint = GeometryCells.ReadRestraint(d, jv, row, "restraint", Restraint.Free);
            double sx = jv.Number(row, "settle x") ?? 0, sy = jv.Number(row, "settle y") ?? 0, sr = jv.Number(row, "settle rotation") ?? 0;
            if (id is null || x is null || y is null) continue;
            if (!firstSeen.TryAdd(id, jv.RowRef(row))) { d.Error(jv.CellRef(row, "joint"), Messages.DuplicateId("joint", id, firstSeen[id].Compact)); continue; }
            GeometryCells.CheckMovement(d, jv, row, restraint, id, sx, sy, sr, "settle x");
            d.Joints.Add(new Joint(id, x.Value, y.Value, restraint, new SupportMovement(sx, sy, sr), jv.RowRef(row)));
        }
        foreach (var (id, _) in d.RowsWithErrors(jv, "joint")) d.RejectedJoints.Add(id);
    }
}
