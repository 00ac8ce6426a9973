using System.Globalization;
using System.Text;

namespace CrossCheck.Model;

/// <summary>
/// Where a value or a problem came from: a file, the table inside it, the line (row) and column,
/// and for PDF input the page and line as printed. Every imported value keeps one of these so that
/// a finding can point back at the number the author wrote.
/// </summary>
/// <param name="File">File name as the reviewer knows it (relative to the submission).</param>
/// <param name="Table">Table name of the submission format (<c>members</c>, <c>loads</c>, ...).</param>
/// <param name="Row">1-based line in the file (CSV) or line on the page (PDF).</param>
/// <param name="Column">Column name as written in the header.</param>
/// <param name="Page">1-based page for PDF input; null for CSV.</param>
/// <param name="Text">The raw text of the cell as read, when known.</param>
public sealed record SourceRef(
    string File,
    string? Table = null,
    int? Row = null,
    string? Column = null,
    int? Page = null,
    string? Text = null)
{
    /// <summary>For a workbook: the worksheet (then <see cref="Row"/> is the sheet's row number).</summary>
    public string? Sheet { get; init; }

    /// <summary>For a workbook: the sheet column of the cell (<c>C</c>), when the reference is to one cell.</summary>
    public string? SheetColumn { get; init; }

    /// <summary>A reference to one cell of the same row.</summary>
    public SourceRef Cell(string column, string? text = null) => this with { Column = column, Text = text };

    /// <summary>The sheet as a formula writes it: <c>Loads</c>, or <c>'End moments'</c> when the name is not a plain word.</summary>
    private string SheetName => Sheet is null ? "" : Sheet.All(c => char.IsLetterOrDigit(c) || c == '_') ? Sheet : $"'{Sheet.Replace("'", "''", StringComparison.Ordinal)}'";

    /// <summary>The cell (<c>Loads!C7</c>) or the row (<c>Loads!7</c>) of a workbook reference.</summary>
    private string SheetPlace(bool cell) => string.Create(CultureInfo.InvariantCulture,
        $"{SheetName}!{(cell && SheetColumn is { Length: > 0 } col ? col : "")}{Row}");

    /// <summary>
    /// Compact form used in JSON and tables: <c>members.csv:7:I</c>, <c>calc.pdf:p3:14:I</c>, or for a workbook
    /// <c>calc.xlsx:Loads!C7:P</c> (<c>calc.xlsx:Loads!7</c> for a row).
    /// </summary>
    public string Compact
    {
        get
        {
            var sb = new StringBuilder(File);
            if (Sheet is not null)
            {
                if (Row is not null) sb.Append(':').Append(SheetPlace(true));
                else sb.Append(':').Append(SheetName);
            }
            else
            {
                if (Page is int p) sb.Append(CultureInfo.InvariantCulture, $":p{p}");
                if (Row is int r) sb.Append(CultureInfo.InvariantCulture, $":{r}");
            }
            if (Column is { Length: > 0 } c) sb.Append(':').Append(c);
            return sb.ToString();
        }
    }

    /// <summary>
    /// <see cref="Compact"/> with the table named when the file's own name does not say it: <c>calc.csv:28:case (table
    /// combinations)</c>, but <c>members.csv:7:I</c> for a folder's table file. For messages to a person.
    /// </summary>
    public string Located =>
        Table is { Length: > 0 } t && !string.Equals(System.IO.Path.GetFileNameWithoutExtension(File), t, StringComparison.OrdinalIgnoreCase)
            ? $"{Compact} (table {t})" : Compact;

    /// <summary>The row without the column: <c>end-moments.csv:4</c>, <c>calc.pdf:p3:14</c>, <c>calc.xlsx:Loads!7</c>.</summary>
    public string RowCompact => (this with { Column = null, SheetColumn = null }).Compact;

    /// <summary>
    /// How a memo cites it: <c>end-moments.csv line 4</c>, <c>calc.pdf p.3 line 14</c>, <c>calc.xlsx Loads!C7</c> (a cell of a
    /// workbook) or <c>calc.xlsx Loads row 7</c>.
    /// </summary>
    public string Citation
    {
        get
        {
            var sb = new StringBuilder(File);
            if (Sheet is not null)
            {
                if (Row is not null && SheetColumn is { Length: > 0 }) sb.Append(' ').Append(SheetPlace(true));
                else if (Row is int rr) sb.Append(CultureInfo.InvariantCulture, $" {SheetName} row {rr}");
                else sb.Append(" sheet ").Append(SheetName);
                return sb.ToString();
            }
            if (Page is int p) sb.Append(CultureInfo.InvariantCulture, $" p.{p}");
            if (Row is int r) sb.Append(CultureInfo.InvariantCulture, $" line {r}");
            return sb.ToString();
        }
    }

    /// <summary>Long form for messages: <c>members.csv, table 'members', line 7, column 'I'</c> (for a workbook, <c>sheet 'Loads', cell C7</c>).</summary>
    public string Describe()
    {
        var parts = new List<string> { File };
        if (Table is { Length: > 0 } t) parts.Add($"table '{t}'");
        if (Sheet is not null) parts.Add($"sheet '{Sheet}'");
        if (Page is int p) parts.Add(string.Create(CultureInfo.InvariantCulture, $"page {p}"));
        if (Row is int r)
            parts.Add(Sheet is not null && SheetColumn is { Length: > 0 } sc
                ? string.Create(CultureInfo.InvariantCulture, $"cell {sc}{r}")
                : string.Create(CultureInfo.InvariantCulture, $"{(Sheet is null ? "line" : "row")} {r}"));
        if (Column is { Length: > 0 } c) parts.Add($"column '{c}'");
        return string.Join(", ", parts);
    }

    public override string ToString() => Compact;

    /// <summary>Compact form of a span of rows of one table: <c>end-moments.csv:4-6</c>.</summary>
    public static string Span(IEnumerable<SourceRef?> refs)
    {
        var list = refs.OfType<SourceRef>().ToList();
        if (list.Count == 0) return "";
        var groups = list.GroupBy(r => (r.File, r.Page, r.Sheet));
        var pieces = new List<string>();
        foreach (var g in groups)
        {
            var rows = g.Where(r => r.Row is not null).Select(r => r.Row!.Value).Distinct().Order().ToList();
            if (g.Key.Sheet is not null)
            {
                // calc.xlsx:Loads!7-9,12
                string sheet = (g.First() with { Row = null, Column = null, SheetColumn = null }).Compact;
                pieces.Add(rows.Count == 0 ? sheet : sheet + "!" + string.Join(",", Runs(rows)));
                continue;
            }
            var head = g.Key.Page is int p ? string.Create(CultureInfo.InvariantCulture, $"{g.Key.File}:p{p}") : g.Key.File;
            if (rows.Count == 0) { pieces.Add(head); continue; }
            pieces.Add(head + ":" + string.Join(",", Runs(rows)));
        }
        return string.Join("; ", pieces);
    }

    private static IEnumerable<string> Runs(List<int> rows)
    {
        int start = rows[0], prev = rows[0];
        for (int i = 1; i <= rows.Count; i++)
        {
            if (i < rows.Count && rows[i] == prev + 1) { prev = rows[i]; continue; }
            yield return start == prev
                ? start.ToString(CultureInfo.InvariantCulture)
                : string.Create(CultureInfo.InvariantCulture, $"{start}-{prev}");
            if (i < rows.Count) { start = prev = rows[i]; }
        }
    }
}
