using System.Globalization;
using CrossCheck.Common;

namespace CrossCheck.Import;

/// <summary>A table written as a CSV file of the submission format.</summary>
/// <param name="FileName">File name in the folder container (<c>end-moments.csv</c>).</param>
/// <param name="Content">The file's text.</param>
/// <param name="Dropped">Header cells that are not columns of the table and were left out.</param>
public sealed record ContractFile(string FileName, string Content, IReadOnlyList<string> Dropped);

/// <summary>
/// Writes tables (as read from a PDF, or any <see cref="RawTable"/>) as the CSV files of the folder container:
/// one file per table, the format's column names in the format's order, each unit in brackets in the header
/// (including units that were given outside the header), numbers as they were read. A comment line says where
/// each table was read. Reading the folder back gives the same submission. Written by <see cref="CsvOut"/>: a text cell
/// a spreadsheet would take for a formula is defused.
/// </summary>
public static class ContractCsv
{
    public static IReadOnlyList<ContractFile> Render(IReadOnlyList<RawTable> tables)
    {
        ArgumentNullException.ThrowIfNull(tables);
        var files = new List<ContractFile>();
        foreach (var t in tables)
        {
            var spec = TableSchema.Find(t.Name);
            if (spec is null) continue;
            var chosen = new Dictionary<ColumnSpec, (int Index, string? Unit)>();
            var dropped = new List<string>();
            for (int i = 0; i < t.Header.Cells.Count; i++)
            {
                string cell = t.Header.Cells[i];
                if (cell.Length == 0) continue;
                var (name, unit) = TableSchema.SplitHeader(cell);
                var col = TableSchema.ResolveColumn(spec, name);
                if (col is null || chosen.ContainsKey(col)) { dropped.Add(cell); continue; }
                if (string.IsNullOrEmpty(unit) && t.ColumnUnits?.TryGetValue(i, out var u) == true) unit = u;
                chosen[col] = (i, col.Type == ColumnType.Number && !string.IsNullOrEmpty(unit) ? unit : null);
            }
            var columns = spec.Columns.Where(chosen.ContainsKey).ToList();
            using var csv = new CsvOut('#', NeedsQuotes);
            if (Where(t) is { Length: > 0 } where) csv.Comment(" read from " + where);
            csv.Header([.. columns.Select(c => chosen[c].Unit is { } u ? $"{c.Name} [{u}]" : c.Name)]);
            foreach (var row in t.Rows)
            {
                if (row.IsBlank) continue;
                foreach (var c in columns)
                {
                    string cell = row.Cell(chosen[c].Index).Trim();
                    // A number stays as it is (a spreadsheet cannot run it, and reading it back must give the same number).
                    if (c.Type == ColumnType.Number && NumberText.TryParse(cell, false, out _)) csv.Numeral(cell);
                    else csv.Text(cell);
                }
                csv.End();
            }
            files.Add(new ContractFile($"{spec.Name}.csv", csv.ToString(), dropped));
        }
        return files;
    }

    /// <summary>True when <paramref name="name"/> names a table of the format (a file a folder container would read).</summary>
    public static bool IsTableName(string name) => TableSchema.Find(name) is not null;

    /// <summary><c>calc.pdf p.1 lines 12-18, p.2 lines 3-9</c>.</summary>
    private static string Where(RawTable t)
    {
        var rows = t.Rows.Where(r => !r.IsBlank).ToList();
        if (rows.Count == 0) return "";
        var parts = rows.GroupBy(r => r.Page).Select(g =>
        {
            int first = g.Min(r => r.Line), last = g.Max(r => r.Line);
            if (g.Key is int s && t.Sheets?.GetValueOrDefault(s) is { } sheet)
                return first == last ? string.Create(CultureInfo.InvariantCulture, $"sheet '{sheet}' row {first}") : string.Create(CultureInfo.InvariantCulture, $"sheet '{sheet}' rows {first}-{last}");
            string page = g.Key is int p ? string.Create(CultureInfo.InvariantCulture, $"p.{p} ") : "";
            return first == last
                ? string.Create(CultureInfo.InvariantCulture, $"{page}line {first}")
                : string.Create(CultureInfo.InvariantCulture, $"{page}lines {first}-{last}");
        });
        return $"{t.File} {string.Join(", ", parts)}";
    }

    /// <summary>
    /// Cells quoted beyond what RFC 4180 asks: a <c>;</c> (a reader might take the file for semicolon-separated) and
    /// white space at either end (a reader trims it).
    /// </summary>
    private static bool NeedsQuotes(string s) => s.Length > 0 && (s.Contains(';') || char.IsWhiteSpace(s[0]) || char.IsWhiteSpace(s[^1]));
}
