namespace CrossCheck.Import;

/// <summary>One row of a table as read, before any interpretation.</summary>
/// <param name="Line">1-based line in the file (CSV) or on the page (PDF).</param>
/// <param name="Cells">Cell texts, trimmed.</param>
/// <param name="Page">Page for PDF input.</param>
/// <param name="Printed">
/// The cells exactly as printed, when <paramref name="Cells"/> holds a normalised form (a PDF's <c>(1,250.5)</c>
/// read as <c>-1250.5</c>); provenance cites the printed text.
/// </param>
public sealed record RawRow(int Line, IReadOnlyList<string> Cells, int? Page = null, IReadOnlyList<string>? Printed = null)
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
    IReadOnlyDictionary<int, string>? ColumnUnits = null);
