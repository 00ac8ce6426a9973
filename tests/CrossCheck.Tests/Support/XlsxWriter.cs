using System.Globalization;
using CrossCheck.Import;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;

namespace CrossCheck.Tests.Support;

/// <summary>
/// Writes small <c>.xlsx</c> workbooks in the test with the Open XML SDK: a sheet per table of a submission (numbers as
/// numbers, text as inline strings), or cells given one by one (a formula with or without a saved result).
/// </summary>
public static class XlsxWriter
{
    /// <summary>A cell: text, a number, or a formula with its saved result (null: none saved).</summary>
    public sealed record FormulaCell(string Formula, double? Result);

    /// <summary>A number shown with a fixed number of decimals (the number format <c>0.0</c>, ...), as a spreadsheet keeps 141.7 or -33.0.</summary>
    public sealed record Fixed(double Value, int Decimals);

    private const int MaxDecimals = 6;

    /// <summary>Each table of a submission (as read from CSV) on a sheet of its own, named after the table.</summary>
    public static byte[] Tables(IReadOnlyList<RawTable> tables) =>
        Write(tables.Select(t => (SheetName(t.Name), (IReadOnlyList<object?[]>)
            [[.. t.Header.Cells], .. t.Rows.Where(r => !r.IsBlank).Select(r => r.Cells.Select(Value).ToArray())])).ToList());

    private static string SheetName(string table) => table switch
    {
        "end-moments" => "End moments",
        _ => char.ToUpperInvariant(table[0]) + table[1..],
    };

    private static object? Value(string cell) =>
        cell.Length == 0 ? null
        : !NumberText.TryParse(cell, false, out double v) ? cell
        : cell.Contains('e', StringComparison.OrdinalIgnoreCase) || cell.IndexOf('.', StringComparison.Ordinal) is var dot && dot < 0 ? v
        : new Fixed(v, Math.Min(MaxDecimals, cell.Length - dot - 1));

    public static byte[] Write(IReadOnlyList<(string Name, IReadOnlyList<object?[]> Rows)> sheets)
    {
        using var ms = new MemoryStream();
        using (var doc = SpreadsheetDocument.Create(ms, SpreadsheetDocumentType.Workbook))
        {
            var wb = doc.AddWorkbookPart();
            wb.Workbook = new Workbook();
            var styles = wb.AddNewPart<WorkbookStylesPart>();
            var formats = new NumberingFormats();
            var xfs = new CellFormats(new CellFormat { NumberFormatId = 0 });
            for (int d = 0; d <= MaxDecimals; d++)
            {
                formats.Append(new NumberingFormat { NumberFormatId = (uint)(164 + d), FormatCode = d == 0 ? "0" : "0." + new string('0', d) });
                xfs.Append(new CellFormat { NumberFormatId = (uint)(164 + d), ApplyNumberFormat = true });
            }
            styles.Stylesheet = new Stylesheet(formats, new Fonts(new Font()), new Fills(new Fill()), new Borders(new Border()), xfs);
            var list = wb.Workbook.AppendChild(new Sheets());
            uint id = 1;
            foreach (var (name, rows) in sheets)
            {
                var part = wb.AddNewPart<WorksheetPart>();
                var data = new SheetData();
                for (int r = 0; r < rows.Count; r++)
                {
                    var row = new Row { RowIndex = (uint)(r + 1) };
                    for (int c = 0; c < rows[r].Length; c++)
                        if (Cell(rows[r][c], $"{Letters(c + 1)}{r + 1}") is { } cell) row.Append(cell);
                    data.Append(row);
                }
                part.Worksheet = new Worksheet(data);
                list.Append(new Sheet { Id = wb.GetIdOfPart(part), SheetId = id++, Name = name });
            }
        }
        return ms.ToArray();
    }

    private static Cell? Cell(object? value, string reference) => value switch
    {
        null => null,
        double or int => new Cell { CellReference = reference, CellValue = new CellValue(Convert.ToDouble(value, CultureInfo.InvariantCulture).ToString("R", CultureInfo.InvariantCulture)), DataType = CellValues.Number },
        Fixed x => new Cell { CellReference = reference, CellValue = new CellValue(x.Value.ToString("R", CultureInfo.InvariantCulture)), DataType = CellValues.Number, StyleIndex = (uint)(x.Decimals + 1) },
        FormulaCell f => new Cell { CellReference = reference, CellFormula = new CellFormula(f.Formula), CellValue = f.Result is double v ? new CellValue(v.ToString("R", CultureInfo.InvariantCulture)) : null },
        _ => new Cell { CellReference = reference, DataType = CellValues.InlineString, InlineString = new InlineString(new Text(value.ToString()!)) },
    };

    private static string Letters(int column)
    {
        string s = "";
        for (int c = column; c > 0; c = (c - 1) / 26) s = (char)('A' + ((c - 1) % 26)) + s;
        return s;
    }
}
