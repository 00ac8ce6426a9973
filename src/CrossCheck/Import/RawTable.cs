using CrossCheck.Model;

namespace CrossCheck.Import;

/// <summary>One row of a table as read, before any interpretation.</summary>
/// <param name="Line">1-based line in the file (CSV) or on the page (PDF).</param>
/// <param name="Cells">Cell texts, trimmed.</param>
/// <param name="Page">Page for PDF input.</param>
/// <param name="Printed">
/// The cells exactly as printed, when <paramref name="Cells"/> holds a normalised form (a PDF's <c>(1,250.5)</c>
/// read as <c>-1250.5</c>); provenance cites the printed text.
/// </param>
/// <param name="SheetColumns">For a workbook: the sheet column of each cell (<c>C</c>), when known.</param>
public sealed record RawRow(int Line, IReadOnlyList<string> Cells, int? Page = null, IReadOnlyList<string>? Printed = null, IReadOnlyList<string?>? SheetColumns = null)
{
    public string Cell(int i) => i < Cells.Count ? Cells[i] : "";
    public bool IsBlank => Cells.All(c => c.Length == 0);
}

/// <summary>
/// A table found in a file: its name, header and rows, as text. The CSV and PDF readers produce these;
/// <see cref="SubmissionBuilder"/> interprets them.
/// </summary>
/// <param name="Name">Table name as written (file name or section name).</param>
/// <param name="File">File name for provenance.</param>
/// <param name="Header">Header row.</param>
/// <param name="Rows">Data rows.</param>
/// <param name="DecimalComma">Numbers use a decimal comma (<c>;</c>-separated CSV).</param>
/// <param name="ColumnUnits">Units found outside the header (a units row or a <c>Units:</c> line), by column index.</param>
public sealed record RawTable(
    string Name,
    string File,
    RawRow Header,
    IReadOnlyList<RawRow> Rows,
    bool DecimalComma = false,
    IReadOnlyDictionary<int, string>? ColumnUnits = null)
{
    /// <summary>For a workbook: the worksheet of each "page" number its rows carry.</summary>
    public IReadOnlyDictionary<int, string>? Sheets { get; init; }

    /// <summary>
    /// The place of a line (and a column) of this table, as its source cites it: a page and line of a PDF, a line of a
    /// CSV file, or a sheet and cell of a workbook (<c>Loads!C7</c>).
    /// </summary>
    public SourceRef At(string table, int line, int? page, string? column = null, string? text = null, string? sheetColumn = null)
    {
        var r = new SourceRef(File, table, line, column, page, text);
        return Sheets is not null && page is int p && Sheets.TryGetValue(p, out var sheet) ? r with { Page = null, Sheet = sheet, SheetColumn = sheetColumn } : r;
    }

    /// <summary>The header row, or one of its cells.</summary>
    public SourceRef HeaderAt(string table, string? column = null, int? index = null) =>
        At(table, Header.Line, Header.Page, column, null, index is int i && Header.SheetColumns is { } sc && i < sc.Count ? sc[i] : null);

    /// <summary>A row.</summary>
    public SourceRef RowAt(string table, RawRow row) => At(table, row.Line, row.Page);

    /// <summary>A cell of a row.</summary>
    public SourceRef CellAt(string table, RawRow row, int index, string column, string? text) =>
        At(table, row.Line, row.Page, column, text, row.SheetColumns is { } sc && index >= 0 && index < sc.Count ? sc[index] : null);
}
