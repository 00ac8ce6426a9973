namespace CrossCheck.Import.Roles;

/// <summary>
/// Column roles for tables read as text cells (CSV, tab-separated text): each table's header cells are rewritten to the
/// format's names where <see cref="ColumnRoles"/> decided from the cells, and a header whose words name a column it
/// was not read as is blanked (so it is not read twice). Tables whose headers stand as they are come back unchanged.
/// </summary>
internal static class RawTableRoles
{
    public static List<RawTable> Apply(IReadOnlyList<RawTable> tables, List<InputProblem> problems)
    {
        var result = tables.ToList();
        var context = new RoleContext();
        var order = Enumerable.Range(0, tables.Count)
            .Select(i => (Index: i, Spec: TableSchema.Find(tables[i].Name)))
            .Where(x => x.Spec is not null && x.Spec != TableSchema.Info && x.Spec != TableSchema.Distribution)
            .OrderBy(x => RoleContext.Order(x.Spec!)).ThenBy(x => x.Index).ToList();
        foreach (var (i, spec) in order)
        {
            var t = tables[i];
            var columns = Columns(t, spec!);
            var decisions = ColumnRoles.Decide(spec!, columns, context);
            context.Learn(spec!, columns, decisions);
            result[i] = Rewrite(t, spec!, columns, decisions, problems);
        }
        return result;
    }

    /// <summary>What each header cell names, with its unit and cells.</summary>
    public static List<RoleColumn> Columns(RawTable t, TableSpec spec)
    {
        var columns = new List<RoleColumn>();
        for (int k = 0; k < t.Header.Cells.Count; k++)
        {
            string cell = t.Header.Cells[k];
            var (name, unit) = TableSchema.SplitHeader(cell);
            if (string.IsNullOrEmpty(unit)) unit = t.ColumnUnits?.GetValueOrDefault(k);
            var named = cell.Length == 0 ? null : TableSchema.ResolveColumn(spec, name);
            bool byName = named is not null && TableSchema.Normalize(name) == named.NormalizedName;
            var cells = t.Rows.Select(r => r.Cell(k)).ToList();
            columns.Add(new RoleColumn(cell, unit, cells, named, byName));
        }
        return columns;
    }

    private static RawTable Rewrite(RawTable t, TableSpec spec, List<RoleColumn> columns, RoleDecision[] decisions, List<InputProblem> problems)
    {
        var header = t.Header.Cells.ToList();
        bool changed = false;
        for (int k = 0; k < columns.Count; k++)
        {
            var d = decisions[k];
            var where = t.HeaderAt(spec.Name, columns[k].Header, k);
            if (d.Error is { } error) problems.Add(new InputProblem(where, error));
            if (d.Warning is { } warning) problems.Add(new InputProblem(where, warning, ProblemSeverity.Warning));
            if (d.Role == columns[k].Named) continue;
            changed = true;
            if (d.Role is not { } role) { header[k] = ""; continue; }
            string? unit = TableSchema.SplitHeader(columns[k].Header).Unit;
            header[k] = role.Type == ColumnType.Number && unit is { Length: > 0 } u && UnitReader.TryRead(u, role.Kind) is not null ? $"{role.Name} [{u}]" : role.Name;
        }
        return changed ? t with { Header = t.Header with { Cells = header } } : t;
    }
}
