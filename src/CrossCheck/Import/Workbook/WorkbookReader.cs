using System.Globalization;
using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;
using CrossCheck.Model;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;

namespace CrossCheck.Import.Workbook;

/// <summary>
/// Reads the visible cells of an <c>.xlsx</c> workbook (DocumentFormat.OpenXml) into a <see cref="WorkbookGrid"/>:
/// numbers as stored (not as displayed), a formula's saved result (a formula without one is an input error at its
/// cell), shared and rich text (a subscript run written <c>M_AB</c>), merged cells, and the unit a custom number format
/// shows (<c>0.0 "kNm"</c>: the cell reads <c>114.7 kNm</c>). Hidden sheets, rows and columns are left out with a
/// warning; images and charts are named with their cell and not read. Bounded by <see cref="InputLimits"/>.
/// </summary>
internal static partial class WorkbookReader
{
    /// <summary>Most cells read from one workbook (a calculation has hundreds).</summary>
    public const int MaxCells = 500_000;

    /// <summary>Most bytes the workbook's parts may expand to (a compression bomb is refused before it is opened).</summary>
    public const long MaxExpandedBytes = 256L * 1024 * 1024;

    public static WorkbookGrid? Read(byte[] bytes, string display, List<InputProblem> problems)
    {
        var whole = new SourceRef(display);
        if (bytes.Length == 0) { problems.Add(new InputProblem(whole, Messages.WorkbookEmpty)); return null; }
        if (Expanded(bytes) is not long expanded) { problems.Add(new InputProblem(whole, Messages.WorkbookNotXlsx)); return null; }
        if (expanded > MaxExpandedBytes) { problems.Add(new InputProblem(whole, Messages.WorkbookTooLarge(MaxExpandedBytes))); return null; }
        try
        {
            using var stream = new MemoryStream(bytes, writable: false);
            using var doc = SpreadsheetDocument.Open(stream, false);
            var wb = doc.WorkbookPart;
            if (wb?.Workbook?.Sheets is not { } sheetList) { problems.Add(new InputProblem(whole, Messages.WorkbookNotXlsx)); return null; }
            var shared = wb.SharedStringTablePart?.SharedStringTable?.Elements<SharedStringItem>().Select(Text).ToList() ?? [];
            var styles = new Styles(wb.WorkbookStylesPart?.Stylesheet);
            var sheets = new List<GridSheet>();
            int index = 0, cells = 0;
            foreach (var sheet in sheetList.Elements<Sheet>())
            {
                index++;
                string name = sheet.Name?.Value ?? $"Sheet{index}";
                if (sheet.State?.Value is { } state && state != SheetStateValues.Visible)
                {
                    problems.Add(new InputProblem(whole with { Sheet = name }, Messages.WorkbookHiddenSheet(name), ProblemSeverity.Warning));
                    continue;
                }
                if (sheet.Id?.Value is not { } id || wb.GetPartById(id) is not WorksheetPart part) continue;
                var grid = ReadSheet(part, name, index, shared, styles, display, problems, ref cells);
                if (grid is null) return null;
                sheets.Add(grid);
            }
            return new WorkbookGrid(display, sheets);
        }
#pragma warning disable CA1031 // A damaged or hostile file can fail in the package or XML layer in any way: an input error, never a crash.
        catch (Exception ex) when (ex is not OutOfMemoryException)
#pragma warning restore CA1031
        {
            problems.Add(new InputProblem(whole, Messages.WorkbookDamaged(ex.Message.Split('\n')[0])));
            return null;
        }
    }

    /// <summary>The bytes the zip's entries expand to, or null when the file is not a zip package.</summary>
    private static long? Expanded(byte[] bytes)
    {
        try
        {
            using var zip = new ZipArchive(new MemoryStream(bytes, writable: false), ZipArchiveMode.Read);
            long total = 0;
            foreach (var e in zip.Entries) total += e.Length;
            return zip.Entries.Any(e => e.FullName.StartsWith("xl/", StringComparison.Ordinal)) ? total : null;
        }
        catch (InvalidDataException)
        {
            return null;
        }
    }

    private static GridSheet? ReadSheet(WorksheetPart part, string name, int index, List<string> shared, Styles styles, string display,
        List<InputProblem> problems, ref int cellCount)
    {
        var ws = part.Worksheet;
        var sheetRef = new SourceRef(display) { Sheet = name };
        var hiddenColumns = new SortedSet<int>();
        foreach (var col in ws.GetFirstChild<Columns>()?.Elements<Column>() ?? [])
            if (col.Hidden?.Value == true && col.Min?.Value is uint min && col.Max?.Value is uint max)
                for (uint c = min; c <= Math.Min(max, min + 16384); c++) hiddenColumns.Add((int)c);
        // Merged ranges: the top-left cell stands for the range; the others are empty.
        var merges = new Dictionary<(int Row, int Col), int>();
        foreach (var m in ws.Elements<MergeCells>().SelectMany(x => x.Elements<MergeCell>()))
        {
            if (m.Reference?.Value?.Split(':') is not [var a, var b] || Address(a) is not var (r1, c1) || Address(b) is not var (_, c2)) continue;
            merges[(r1, c1)] = c2 - c1 + 1;
        }
        var rows = new List<GridRow>();
        var hiddenRows = new List<int>();
        var allHidden = new HashSet<int>();
        var formulas = new List<string>();
        int lastRow = 0;
        foreach (var row in ws.GetFirstChild<SheetData>()?.Elements<Row>() ?? [])
        {
            int number = (int)(row.RowIndex?.Value ?? (uint)(lastRow + 1));
            lastRow = number;
            var cells = new List<GridCell>();
            int lastCol = 0;
            foreach (var cell in row.Elements<Cell>())
            {
                var (_, col) = cell.CellReference?.Value is { } reference && Address(reference) is { } at ? at : (number, lastCol + 1);
                lastCol = col;
                if (++cellCount > MaxCells) { problems.Add(new InputProblem(sheetRef, Messages.WorkbookTooManyCells(MaxCells))); return null; }
                if (hiddenColumns.Contains(col)) continue;
                string? text = CellText(cell, shared, styles, out bool isNumber, out bool formulaWithoutValue, out string? shown);
                if (formulaWithoutValue)
                {
                    string formula = cell.CellFormula?.Text ?? "";
                    problems.Add(new InputProblem(new SourceRef(display, null, number, null, null, "=" + formula) { Sheet = name, SheetColumn = WorkbookGrid.Letters(col) },
                        Messages.WorkbookFormulaWithoutValue(formula)));
                    formulas.Add(WorkbookGrid.Letters(col) + number);
                    continue;
                }
                if (string.IsNullOrWhiteSpace(text)) continue;
                cells.Add(new GridCell(col, text.Trim(), isNumber, merges.GetValueOrDefault((number, col), 1), shown));
            }
            if (row.Hidden?.Value == true)
            {
                allHidden.Add(number);
                if (cells.Count > 0) hiddenRows.Add(number);
                continue;
            }
            if (cells.Count > 0) rows.Add(new GridRow(number, cells));
        }
        if (hiddenRows.Count > 0 || hiddenColumns.Count > 0)
            problems.Add(new InputProblem(sheetRef, Messages.WorkbookHiddenCells(name, hiddenRows, hiddenColumns.Select(WorkbookGrid.Letters).ToList()), ProblemSeverity.Warning));
        foreach (var anchor in Drawings(part))
            problems.Add(new InputProblem(sheetRef with { SheetColumn = anchor.Col, Row = anchor.Row }, Messages.WorkbookDrawing(name, anchor.Col + anchor.Row), ProblemSeverity.Warning));
        return new GridSheet(name, index, rows) { HiddenRows = allHidden };
    }

    /// <summary>The cell's text, or null when empty. A formula's saved result; a number as stored, with the unit its format shows.</summary>
    private static string? CellText(Cell cell, List<string> shared, Styles styles, out bool isNumber, out bool formulaWithoutValue, out string? shown)
    {
        shown = null;
        isNumber = false;
        formulaWithoutValue = false;
        string? value = cell.CellValue?.Text;
        var type = cell.DataType?.Value;
        if (cell.CellFormula is not null && value is null && type != CellValues.InlineString)
        {
            formulaWithoutValue = true;
            return null;
        }
        if (type == CellValues.SharedString)
            return int.TryParse(value, NumberStyles.Integer, CultureInfo.InvariantCulture, out int i) && i >= 0 && i < shared.Count ? shared[i] : null;
        if (type == CellValues.InlineString) return cell.InlineString is { } inline ? Text(inline) : value;
        if (type == CellValues.Boolean) return value == "1" ? "TRUE" : "FALSE";
        if (type == CellValues.String || type == CellValues.Error) return value;
        if (value is null) return null;
        if (!double.TryParse(value, NumberStyles.Float, CultureInfo.InvariantCulture, out double number)) return value;
        isNumber = true;
        var format = styles.Of(cell.StyleIndex?.Value);
        if (format.IsDate && number > 0 && number < 2_958_466)
        {
            isNumber = false;
            return DateTime.FromOADate(number).ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
        }
        string stored = WorkbookGrid.Stored(number);
        shown = format.Decimals is int d ? number.ToString((format.Thousands ? "N" : "F") + d.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture) : stored;
        if (format.Unit is { } unit) return $"{stored} {unit}";
        return stored;
    }

    /// <summary>Text of a shared or inline string: its runs joined, a subscript run after <c>_</c> (<c>M_AB</c>), a superscript in superscript digits.</summary>
    private static string Text(OpenXmlElement item)
    {
        var runs = item.Elements<Run>().ToList();
        if (runs.Count == 0) return item.InnerText;
        var sb = new StringBuilder();
        foreach (var run in runs)
        {
            string t = run.Text?.Text ?? "";
            var align = run.RunProperties?.GetFirstChild<VerticalTextAlignment>()?.Val?.Value;
            if (align == VerticalAlignmentRunValues.Subscript) sb.Append('_').Append(t);
            else if (align == VerticalAlignmentRunValues.Superscript) sb.Append(string.Concat(t.Select(c => c is >= '0' and <= '9' ? "⁰¹²³⁴⁵⁶⁷⁸⁹"[c - '0'] : c)));
            else sb.Append(t);
        }
        return sb.ToString();
    }

    /// <summary>The top-left cells of the images and charts drawn on a sheet.</summary>
    private static IEnumerable<(string Col, int Row)> Drawings(WorksheetPart part)
    {
        if (part.DrawingsPart?.WorksheetDrawing is not { } drawing) yield break;
        foreach (var from in drawing.Descendants<DocumentFormat.OpenXml.Drawing.Spreadsheet.FromMarker>())
        {
            if (!int.TryParse(from.ColumnId?.Text, out int c) || !int.TryParse(from.RowId?.Text, out int r)) continue;
            yield return (WorkbookGrid.Letters(c + 1), r + 1);
        }
    }

    private static (int Row, int Col)? Address(string reference)
    {
        var m = CellAddress().Match(reference.Replace("$", "", StringComparison.Ordinal));
        if (!m.Success) return null;
        return (int.Parse(m.Groups["r"].Value, CultureInfo.InvariantCulture), WorkbookGrid.Number(m.Groups["c"].Value));
    }

    [GeneratedRegex(@"^(?<c>[A-Z]{1,3})(?<r>\d{1,7})$")]
    private static partial Regex CellAddress();

    /// <summary>The number formats of the workbook's cell styles: which are dates, and the unit a custom format shows.</summary>
    private sealed partial class Styles
    {
        private readonly List<Format> _formats = [];

        /// <summary>A cell style's number format: a date, the unit it shows, the decimals of a fixed format (<c>0.0</c>), thousands separators.</summary>
        internal sealed record Format(bool IsDate, string? Unit, int? Decimals, bool Thousands);

        public Styles(Stylesheet? sheet)
        {
            var custom = sheet?.NumberingFormats?.Elements<NumberingFormat>()
                .Where(f => f.NumberFormatId?.Value is not null)
                .ToDictionary(f => f.NumberFormatId!.Value, f => f.FormatCode?.Value ?? "") ?? [];
            foreach (var xf in sheet?.CellFormats?.Elements<CellFormat>() ?? [])
            {
                uint id = xf.NumberFormatId?.Value ?? 0;
                string code = custom.GetValueOrDefault(id, id switch { 1 => "0", 2 => "0.00", 3 => "#,##0", 4 => "#,##0.00", _ => "" });
                var (decimals, thousands) = Fixed(code);
                _formats.Add(new Format(id is >= 14 and <= 22 || (code.Length > 0 && IsDateCode(code)), UnitOf(code), decimals, thousands));
            }
        }

        public Format Of(uint? styleIndex) =>
            styleIndex is uint i && i < _formats.Count ? _formats[(int)i] : new Format(false, null, null, false);

        /// <summary>The decimals of a fixed number format (<c>0.00</c>, <c>#,##0.0 "kNm"</c>); null for General and anything else.</summary>
        private static (int?, bool) Fixed(string code)
        {
            string plain = Literal().Replace(code.Split(';')[0], "").Trim();
            var m = FixedCode().Match(plain);
            return m.Success ? (m.Groups["d"].Value.Length, plain.Contains(',', StringComparison.Ordinal)) : (null, false);
        }

        [GeneratedRegex(@"^[#,]*0(?:\.(?<d>0*))?$")]
        private static partial Regex FixedCode();

        private static bool IsDateCode(string code)
        {
            string plain = Quoted().Replace(code, "");
            return plain.Contains("yy", StringComparison.OrdinalIgnoreCase) || plain.Contains("dd", StringComparison.OrdinalIgnoreCase);
        }

        /// <summary>The literal text a number format shows after the number (<c>0.0 "kNm"</c>, <c>0.00\ \k\N</c>): a unit when it reads as one.</summary>
        private static string? UnitOf(string code)
        {
            if (code.Length == 0) return null;
            string first = code.Split(';')[0];
            var sb = new StringBuilder();
            foreach (Match m in Literal().Matches(first)) sb.Append(m.Groups["q"].Success ? m.Groups["q"].Value : m.Groups["e"].Value);
            string unit = sb.ToString().Trim();
            return unit.Length is > 0 and <= 16 && unit.Any(char.IsLetter) ? unit : null;
        }

        [GeneratedRegex("\"[^\"]*\"")]
        private static partial Regex Quoted();

        [GeneratedRegex("\"(?<q>[^\"]*)\"|\\\\(?<e>.)")]
        private static partial Regex Literal();
    }
}
