using CrossCheck.Import.Roles;
using CrossCheck.Model;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// Decides each found table's column roles from its header and its placed cells (<see cref="ColumnRoles"/>), before the
/// cells are read: a column read from its contents gets the format's column in its header cell, a header whose words
/// were not kept loses its column. Geometry tables go first, so that ids in the other tables can be checked against them.
/// </summary>
internal static class TableRoles
{
    public static void Decide(PdfReading r)
    {
        var context = new RoleContext();
        var tables = r.Finder.Tables.Where(t => !t.Header.IsWide && t.Spec != TableSchema.Info && t.Spec != TableSchema.Distribution)
            .Select((t, i) => (t, i)).OrderBy(x => RoleContext.Order(x.t.Spec)).ThenBy(x => x.i).Select(x => x.t).ToList();
        foreach (var t in tables)
        {
            var columns = new List<RoleColumn>();
            for (int k = 0; k < t.Columns.Count; k++)
            {
                var h = t.Columns[k].Header!;
                var named = HeaderMatcher.MatchCell(t.Spec, h.Printed);
                var spec = named?.Column;
                bool byName = spec is not null && TableSchema.Normalize(named!.Name) == spec.NormalizedName;
                string? unit = h.Unit ?? t.UnitsRow?.GetValueOrDefault(k) ?? named?.Unit ?? TableSchema.SplitHeader(h.Printed).Unit;
                columns.Add(new RoleColumn(h.Printed, unit, t.Placed.Select(p => p.Cells[k] ?? "").ToList(), spec, byName));
            }
            var decisions = ColumnRoles.Decide(t.Spec, columns, context);
            context.Learn(t.Spec, columns, decisions);
            for (int k = 0; k < t.Columns.Count; k++)
            {
                var col = t.Columns[k];
                var h = col.Header!;
                var d = decisions[k];
                col.Decision = d;
                var where = new SourceRef(r.File, t.Spec.Name, t.First.Number, h.Printed, t.First.Page);
                if (d.Error is { } error) r.Problems.Add(new InputProblem(where, error));
                if (d.Warning is { } warning) r.Problems.Add(new InputProblem(where, warning, ProblemSeverity.Warning));
                if (d.Role == h.Column) continue;
                if (d.Role is not { } role) { col.Header = h with { Column = null, Unit = null }; continue; }
                var (name, unit) = TableSchema.SplitHeader(h.Printed);
                unit = role.Type == ColumnType.Number && unit is { Length: > 0 } && UnitReader.TryRead(unit, role.Kind) is not null ? unit : null;
                col.Header = h with { Column = role, Name = name, Unit = unit ?? (role == h.Column ? h.Unit : null) };
            }
        }
    }
}
