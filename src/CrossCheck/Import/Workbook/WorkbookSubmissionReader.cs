using CrossCheck.Import.Pdf;
using CrossCheck.Import.Pdf.Conversion;
using CrossCheck.Model;

namespace CrossCheck.Import.Workbook;

/// <summary>
/// Reads a submission from an <c>.xlsx</c> workbook: a sheet per table (a sheet named after a table of the format, its
/// header the first header row on it), or tables found on a calculation sheet among titles and notes by their header
/// rows, exactly as in a PDF (the sheet's rows are laid out as lines and read by the PDF reader's finder and
/// conversion). Every value is cited by its sheet and cell (<c>Loads!C7</c>).
/// </summary>
public static class WorkbookSubmissionReader
{
    /// <summary>Reads and builds the submission from the workbook's bytes. Never throws for bad input.</summary>
    public static ImportResult Read(byte[] bytes, string path, InputLimits limits)
    {
        ArgumentNullException.ThrowIfNull(limits);
        var x = Extract(bytes, path);
        if (x.Tables.Count == 0 || x.HasErrors && x.Problems.Any(p => p.IsError && p.Where.Row is null && p.Where.Table is null && p.Where.Sheet is null))
            return new ImportResult(null, x.Problems);
        var built = SubmissionBuilder.Build(path, x.Tables, x.Problems, limits);
        return built with { Problems = WithoutEchoes(built.Problems) };
    }

    /// <summary>Reads the tables of a workbook without building the submission (for <c>crosscheck extract</c>).</summary>
    public static PdfExtraction Extract(byte[] bytes, string path)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        ArgumentNullException.ThrowIfNull(path);
        string display = Path.GetFileName(path);
        var problems = new List<InputProblem>();
        var grid = WorkbookReader.Read(bytes, display, problems);
        if (grid is null) return new PdfExtraction(path, [], [], [], problems);
        var names = grid.Sheets.ToDictionary(s => s.Index, s => s.Name);
        var pageTables = grid.Sheets.Select(s => (s.Index, Spec: TableSchema.Find(s.Name))).Where(x => x.Spec is not null)
            .ToDictionary(x => x.Index, x => x.Spec!);
        var doc = grid.ToDocument() with { PageTables = pageTables };
        var found = new List<InputProblem>();
        var x = PdfSubmissionReader.Convert(new PdfReading(doc, found), path);
        var tables = x.Tables.Select(t => Cite(t, grid, names)).ToList();
        problems.AddRange(found.Select(p => p with { Where = Translate(p.Where, names, x.Tables, grid), Message = Reword(p.Message, grid) }));
        return new PdfExtraction(path, tables, x.Found.Select(f => f with { Where = Sheets(f.Where, names) }).ToList(),
            x.Ignored.Select(i => i with { Where = Translate(i.Where, names, x.Tables, grid) }).ToList(), problems)
        {
            Notes = x.Notes.Select(n => n with { Where = Translate(n.Where, names, x.Tables, grid) }).ToList(),
        };
    }

    /// <summary>The table with its sheet and the sheet column of every cell, so that every citation names the cell.</summary>
    private static RawTable Cite(RawTable t, WorkbookGrid grid, Dictionary<int, string> names)
    {
        RawRow Row(RawRow r)
        {
            if (r.Page is not int p) return r;
            var printed = r.Printed ?? r.Cells;
            var cells = grid.Cells(p, r.Line, printed);
            // A citation quotes a number as the sheet displays it; the value read is the number as stored.
            var shown = printed.Select((text, k) => cells[k] is { IsNumber: true } c ? c.Display : text).ToList();
            return r with { SheetColumns = cells.Select(c => c is null ? null : WorkbookGrid.Letters(c.Column)).ToList(), Printed = shown };
        }
        return t with { Header = Row(t.Header), Rows = t.Rows.Select(Row).ToList() } with { Sheets = names };
    }

    /// <summary>A place the reader cited by "page" and line, as the sheet and (when the column is a header the sheet prints) cell.</summary>
    private static SourceRef Translate(SourceRef where, Dictionary<int, string> names, IReadOnlyList<RawTable> tables, WorkbookGrid grid)
    {
        if (where.Page is not int page || !names.TryGetValue(page, out var sheet)) return where;
        string? column = null;
        if (where.Column is { } header)
            foreach (var t in tables.Where(t => t.Header.Page == page))
            {
                int k = t.Header.Printed?.ToList().IndexOf(header) ?? -1;
                if (k < 0) k = t.Header.Cells.ToList().IndexOf(header);
                if (k >= 0 && grid.Locate(page, t.Header.Line, t.Header.Printed ?? t.Header.Cells) is { } letters && letters[k] is { } l) { column = l; break; }
            }
        if (column is null && where.Column is { } text && where.Row is int row)
            column = grid.Locate(page, row, [where.Text ?? text])[0];
        return where with { Page = null, Sheet = sheet, SheetColumn = column };
    }

    private static string Sheets(string where, Dictionary<int, string> names)
    {
        foreach (var (page, name) in names) where = where.Replace($"p.{page} ", $"sheet '{name}' row{(where.Contains("lines", StringComparison.Ordinal) ? "s" : "")} ", StringComparison.Ordinal);
        return where.Replace("rows lines ", "rows ", StringComparison.Ordinal).Replace("row line ", "row ", StringComparison.Ordinal).Replace("rows line ", "row ", StringComparison.Ordinal);
    }

    private static string Reword(string message, WorkbookGrid grid) =>
        message.StartsWith("no table of the submission format", StringComparison.Ordinal)
            ? Messages.WorkbookNoTables(grid.Sheets.Select(s => s.Name).ToList())
            : message;

    /// <summary>
    /// A formula without a saved result is reported at its cell; the messages the empty cell would add there ('moment' is
    /// empty) say nothing more and are left out.
    /// </summary>
    private static List<InputProblem> WithoutEchoes(IReadOnlyList<InputProblem> problems)
    {
        var rows = problems.Where(p => p.Where.Text?.StartsWith('=') == true && p.Where.Sheet is not null).Select(p => (p.Where.Sheet, p.Where.Row)).ToHashSet();
        return problems.Where(p => p.Where.Text?.StartsWith('=') == true || !rows.Contains((p.Where.Sheet, p.Where.Row))
            || !(p.Message.Contains("is empty", StringComparison.Ordinal) || p.Message.Contains("needs a value", StringComparison.Ordinal))).ToList();
    }
}
