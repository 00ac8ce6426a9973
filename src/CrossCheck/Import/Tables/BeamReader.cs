using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The <c>supports</c> and <c>spans</c> tables of a continuous beam, read together: the supports are listed left to
/// right, and span i runs from support i to support i + 1.
/// </summary>
internal sealed class BeamReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Layout != GeometryLayout.Beam || d.Table("supports") is not { } supportsTable || d.Table("spans") is not { } spansTable) return;
        var sv = d.View(supportsTable, TableSchema.Supports);
        var pv = d.View(spansTable, TableSchema.Spans, relativeStiffness: !d.HasE);
        d.WarnEIgnored(pv);
        d.Remember(pv, "length", QuantityKind.Length);
        var supports = new List<(string Id, Restraint R, double Sy, double Sr, RawRow Row)>();
        var seen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        foreach (var row in sv.Rows)
        {
            string? id = sv.Id(row, "support");
            var r = GeometryCells.ReadRestraint(d, sv, row, "restraint", null);
            double sy = sv.Number(row, "settle y") ?? 0, sr = sv.Number(row, "settle rotation") ?? 0;
            if (id is null) continue;
            if (!seen.TryAdd(id, sv.RowRef(row))) { d.Error(sv.CellRef(row, "support"), Messages.DuplicateId("support", id, seen[id].Compact)); continue; }
            GeometryCells.CheckMovement(d, sv, row, r, id, 0, sy, sr, null);
            supports.Add((id, r, sy, sr, row));
        }
        var spans = new List<(string Id, double L, double? E, double? I, double? A, Hinge H, RawRow Row)>();
        var spanSeen = new Dictionary<string, SourceRef>(StringComparer.Ordinal);
        foreach (var row in pv.Rows)
        {
            string? id = pv.Id(row, "span");
            double? len = pv.Length(row, "length", required: true);
            if (len is <= 0) d.Error(pv.CellRef(row, "length"), Messages.NotPositive("length", pv.Text(row, "length")));
            var (E, I, A) = GeometryCells.Section(d, pv, row);
            var h = GeometryCells.ReadHinge(d, pv, row);
            if (id is null) continue;
            if (!spanSeen.TryAdd(id, pv.RowRef(row))) { d.Error(pv.CellRef(row, "span"), Messages.DuplicateId("span", id, spanSeen[id].Compact)); continue; }
            // A span whose length could not be read keeps its place, so that the supports still line up (its error is reported).
            spans.Add((id, len ?? double.NaN, E, I, A, h, row));
        }
        if (spans.Count > 0 && supports.Count != spans.Count + 1)
        {
            d.Error(sv.Raw.HeaderAt("supports") with { Page = null }, Messages.SpanSupportCount(spans.Count, supports.Count));
            d.GeometryIncomplete = true;
            return;
        }
        double x = 0;
        for (int i = 0; i < supports.Count; i++)
        {
            var s = supports[i];
            d.Joints.Add(new Joint(s.Id, x, 0, s.R, new SupportMovement(0, s.Sy, s.Sr), sv.RowRef(s.Row)));
            if (i < spans.Count && spans[i].L > 0) x += spans[i].L;
        }
        for (int i = 0; i < spans.Count; i++)
        {
            var p = spans[i];
            if (p.E is null || p.I is null || !(p.L > 0))
            {
                d.RejectedMembers.Add(p.Id);
                d.JointsOfRejectedMembers.Add(supports[i].Id);
                d.JointsOfRejectedMembers.Add(supports[i + 1].Id);
                continue;
            }
            d.Members.Add(new Member(p.Id, supports[i].Id, supports[i + 1].Id, p.E.Value, p.I.Value, p.A, p.H, pv.RowRef(p.Row)));
        }
    }
}
