using System.Globalization;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;

namespace CrossCheck.Tests.Import.Pdf;

/// <summary>
/// Cell-level accuracy of a reading: every non-empty cell of the reference tables (and every unit a column carries)
/// is a cell present; it is read right when the reading has the same value in the same table, row and column (numbers
/// compared as numbers, units by their factor to SI, text exactly). Title-block entries count one cell each.
/// </summary>
public static class CellAccuracy
{
    public sealed record Score(int Right, int Present, IReadOnlyList<string> Misses)
    {
        public double Ratio => Present == 0 ? 1 : (double)Right / Present;
        public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"{Right}/{Present} ({100 * Ratio:0.0} %)");
    }

    private sealed record View(TableSpec Spec, Dictionary<string, (int Index, string? Unit)> Columns, IReadOnlyList<RawRow> Rows);

    public static Score Compare(IReadOnlyList<RawTable> reference, IReadOnlyList<RawTable> reading)
    {
        int right = 0, present = 0;
        var misses = new List<string>();
        var got = reading.Select(ViewOf).Where(v => v is not null).GroupBy(v => v!.Spec).ToDictionary(g => g.Key, g => g.First()!);
        foreach (var refTable in reference)
        {
            var want = ViewOf(refTable);
            if (want is null) continue;
            got.TryGetValue(want.Spec, out var have);
            if (want.Spec == TableSchema.Info)
            {
                var values = have is null ? [] : have.Rows.GroupBy(r => Key(r.Cell(have.Columns["key"].Index)))
                    .ToDictionary(g => g.Key, g => g.First().Cell(have.Columns["value"].Index));
                foreach (var r in want.Rows.Where(r => r.Cell(want.Columns["value"].Index).Length > 0))
                {
                    present++;
                    string key = Key(r.Cell(want.Columns["key"].Index)), value = r.Cell(want.Columns["value"].Index);
                    if (values.TryGetValue(key, out var v) && Geometry.Collapse(v) == Geometry.Collapse(value)) right++;
                    else misses.Add($"info '{key}': want \"{value}\", got \"{(values.TryGetValue(key, out var x) ? x : "(none)")}\"");
                }
                continue;
            }
            foreach (var (name, (_, unit)) in want.Columns)
            {
                if (unit is null) continue;
                present++;
                var spec = want.Spec.Column(name);
                (int, string?) hc = default;
                bool ok = have is not null && have.Columns.TryGetValue(name, out hc) && hc.Item2 is { } hu && SameUnit(unit, hu, spec.Kind);
                if (ok) right++; else misses.Add($"{want.Spec.Name}.{name} unit: want [{unit}], got [{hc.Item2}]");
            }
            var rows = want.Rows.Where(r => !r.IsBlank).ToList();
            var haveRows = have?.Rows.Where(r => !r.IsBlank).ToList() ?? [];
            for (int i = 0; i < rows.Count; i++)
            {
                foreach (var (name, (index, _)) in want.Columns)
                {
                    string w = rows[i].Cell(index).Trim();
                    if (w.Length == 0) continue;
                    present++;
                    string g = i < haveRows.Count && have!.Columns.TryGetValue(name, out var c) ? haveRows[i].Cell(c.Index).Trim() : "(none)";
                    if (Same(w, g, want.Spec.Column(name).Type)) right++;
                    else misses.Add($"{want.Spec.Name} row {i + 1} {name}: want \"{w}\", got \"{g}\"");
                }
            }
            if (haveRows.Count > rows.Count) misses.Add($"{want.Spec.Name}: {haveRows.Count - rows.Count} row(s) more than printed");
        }
        foreach (var extra in got.Keys.Where(s => reference.All(r => TableSchema.Find(r.Name) != s)))
            misses.Add($"table '{extra.Name}' was read but is not printed");
        return new Score(right, present, misses);
    }

    /// <summary>Same factor to SI; words that are not units (<c>rel</c>) compared as text.</summary>
    private static bool SameUnit(string want, string got, QuantityKind kind) =>
        UnitReader.TryRead(want, kind)?.ToSi is double a
            ? UnitReader.TryRead(got, kind)?.ToSi is double b && Math.Abs(a - b) <= 1e-12 * Math.Abs(a)
            : TableSchema.Normalize(want) == TableSchema.Normalize(got);

    private static string Key(string printed) => TableSchema.InfoKey(printed) ?? TableSchema.Normalize(printed);

    private static bool Same(string want, string got, ColumnType type)
    {
        if (type != ColumnType.Number) return Geometry.Collapse(want) == Geometry.Collapse(got);
        return NumberText.TryParse(want, false, out double a) && NumberText.TryParse(got, false, out double b)
               && Math.Abs(a - b) <= 1e-9 * Math.Max(1, Math.Abs(a));
    }

    private static View? ViewOf(RawTable t)
    {
        var spec = TableSchema.Find(t.Name);
        if (spec is null) return null;
        var cols = new Dictionary<string, (int, string?)>(StringComparer.Ordinal);
        for (int i = 0; i < t.Header.Cells.Count; i++)
        {
            var (name, unit) = TableSchema.SplitHeader(t.Header.Cells[i]);
            var c = TableSchema.ResolveColumn(spec, name);
            if (c is null || cols.ContainsKey(c.Name)) continue;
            if (string.IsNullOrEmpty(unit) && t.ColumnUnits?.TryGetValue(i, out var u) == true) unit = u;
            cols[c.Name] = (i, c.Type == ColumnType.Number && !string.IsNullOrEmpty(unit) ? unit : null);
        }
        return new View(spec, cols, t.Rows);
    }
}
