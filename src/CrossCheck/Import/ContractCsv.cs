using System.Globalization;
using System.Text;

namespace CrossCheck.Import;

/// <summary>A table written as a CSV file of the submission format.</summary>
/// <param name="FileName">File name in the folder container (<c>end-moments.csv</c>).</param>
/// <param name="Content">The file's text.</param>
/// <param name="Dropped">Header cells that are not columns of the table and were left out.</param>
public sealed record ContractFile(string FileName, string Content, IReadOnlyList<string> Dropped);

/// <summary>
/// Writes tables (as read from a PDF, or any <see cref="RawTable"/>) as the CSV files of the folder container:
/// one file per table, the format's column names in the format's order, each unit in brackets in the header
/// (including units that were given outside the header), numbers in their plain form. A comment line says where
/// each table was read. Reading the folder back gives the same submission.
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
            var sb = new StringBuilder();
            if (Where(t) is { Length: > 0 } where) sb.Append("# read from ").Append(where).Append('\n');
            sb.Append(string.Join(",", columns.Select(c => Quote(chosen[c].Unit is { } u ? $"{c.Name} [{u}]" : c.Name)))).Append('\n');
            foreach (var row in t.Rows)
            {
                if (row.IsBlank) continue;
                sb.Append(string.Join(",", columns.Select(c => Quote(row.Cell(chosen[c].Index).Trim())))).Append('\n');
            }
            files.Add(new ContractFile($"{spec.Name}.csv", sb.ToString(), dropped));
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
            string page = g.Key is int p ? string.Create(CultureInfo.InvariantCulture, $"p.{p} ") : "";
            return first == last
                ? string.Create(CultureInfo.InvariantCulture, $"{page}line {first}")
                : string.Create(CultureInfo.InvariantCulture, $"{page}lines {first}-{last}");
        });
        return $"{t.File} {string.Join(", ", parts)}";
    }

    /// <summary>RFC 4180 quoting when a cell needs it; a first cell starting with <c>#</c> is quoted too.</summary>
    private static string Quote(string s)
    {
        bool needs = s.Length > 0 && (s.IndexOfAny([',', '"', '\n', '\r', ';']) >= 0 || s[0] == '#' || char.IsWhiteSpace(s[0]) || char.IsWhiteSpace(s[^1]));
        return needs ? "\"" + s.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : s;
    }
}
