using System.Globalization;
using CrossCheck.Import.Pdf;

namespace CrossCheck.Import.Workbook;

/// <summary>
/// A cell of a worksheet as read: its text (a number as stored, with the unit its number format shows), whether it is a
/// number, the columns it spans, and the text the sheet displays (a number in its format: what a citation quotes).
/// </summary>
internal sealed record GridCell(int Column, string Text, bool IsNumber, int Span = 1, string? Shown = null)
{
    public string Display => Shown ?? Text;
}

/// <summary>A visible row of a worksheet: its row number and its non-empty cells, left to right.</summary>
internal sealed record GridRow(int Number, IReadOnlyList<GridCell> Cells);

/// <summary>A visible worksheet: its name, its place among the sheets (the "page" of every citation inside the reader) and its rows.</summary>
internal sealed record GridSheet(string Name, int Index, IReadOnlyList<GridRow> Rows)
{
    /// <summary>Rows the sheet hides (not read, and not counted as blank spacer rows either).</summary>
    public IReadOnlySet<int> HiddenRows { get; init; } = new HashSet<int>();
}

/// <summary>
/// The visible cells of a workbook, and their layout as lines of text: each row a line, each cell a run of words at
/// its column (a merged cell reaching over the columns it covers), so that the tables on a sheet are found among its
/// titles and notes exactly as in a PDF (<see cref="PdfTableFinder"/>). One blank spacer row keeps a table together;
/// more end it.
/// </summary>
internal sealed class WorkbookGrid(string file, IReadOnlyList<GridSheet> sheets)
{
    private const double Size = 10, Char = 0.5 * Size, Space = 0.3 * Size, Pitch = 1.4 * Size;

    public string File { get; } = file;
    public IReadOnlyList<GridSheet> Sheets { get; } = sheets;

    /// <summary>The width of a column in the layout: the longest cell text of the workbook, and a wide gap.</summary>
    public double ColumnWidth { get; } = 4 * Size + (Char * Math.Max(8, sheets.SelectMany(s => s.Rows).SelectMany(r => r.Cells)
        .Where(c => c.Span == 1).Select(c => c.Text.Length).DefaultIfEmpty(8).Max()));

    public TextDocument ToDocument()
    {
        var pages = new List<TextPage>();
        foreach (var sheet in Sheets)
        {
            var lines = new List<TextLine>();
            double baseline = 1e6;
            int previous = 0;
            foreach (var row in sheet.Rows)
            {
                int blank = previous == 0 ? 0 : row.Number - previous - 1 - sheet.HiddenRows.Count(h => h > previous && h < row.Number);
                baseline -= Pitch * (1 + (0.6 * Math.Min(blank, 5)));
                previous = row.Number;
                var words = new List<TextWord>();
                foreach (var cell in row.Cells)
                {
                    double x = (cell.Column - 1) * ColumnWidth;
                    var parts = cell.Text.Split(' ', StringSplitOptions.RemoveEmptyEntries);
                    for (int i = 0; i < parts.Length; i++)
                    {
                        double right = x + (Char * parts[i].Length);
                        // A merged cell reaches over the columns it covers, so that values under any of them sit under it.
                        if (i == parts.Length - 1 && cell.Span > 1) right = Math.Max(right, ((cell.Column - 1 + cell.Span) * ColumnWidth) - (2 * Size));
                        words.Add(new TextWord(parts[i], x, right, Size));
                        x = right + Space;
                    }
                }
                if (words.Count > 0) lines.Add(new TextLine(sheet.Index, row.Number, words, baseline, Size));
            }
            pages.Add(new TextPage(sheet.Index, 1e6, 2e6, lines, 0));
        }
        return new TextDocument(File, pages);
    }

    /// <summary>The sheet column letters of a column number (1 = A, 27 = AA).</summary>
    public static string Letters(int column)
    {
        var sb = new System.Text.StringBuilder();
        for (int c = column; c > 0; c = (c - 1) / 26) sb.Insert(0, (char)('A' + ((c - 1) % 26)));
        return sb.ToString();
    }

    /// <summary>The column number of letters (<c>C</c> = 3), or 0.</summary>
    public static int Number(string letters)
    {
        int n = 0;
        foreach (char c in letters)
        {
            if (c is < 'A' or > 'Z') return 0;
            n = (n * 26) + (c - 'A' + 1);
        }
        return n;
    }

    /// <summary>
    /// The sheet columns of a row's cells as a table read them (printed texts, left to right): each cell is found in
    /// the sheet row at or right of the one before; a cell not found (a case from a caption) has none.
    /// </summary>
    public IReadOnlyList<string?> Locate(int sheetIndex, int rowNumber, IReadOnlyList<string> printed) =>
        Cells(sheetIndex, rowNumber, printed).Select(c => c is null ? null : Letters(c.Column)).ToList();

    /// <summary>The sheet cells of a row's cells as a table read them (see <see cref="Locate"/>).</summary>
    public IReadOnlyList<GridCell?> Cells(int sheetIndex, int rowNumber, IReadOnlyList<string> printed)
    {
        var result = new GridCell?[printed.Count];
        var row = Sheets.FirstOrDefault(s => s.Index == sheetIndex)?.Rows.FirstOrDefault(r => r.Number == rowNumber);
        if (row is null) return result;
        int from = 0;
        for (int k = 0; k < printed.Count; k++)
        {
            string want = Geometry.Collapse(printed[k]);
            if (want.Length == 0) continue;
            for (int c = from; c < row.Cells.Count; c++)
            {
                if (Geometry.Collapse(row.Cells[c].Text) != want) continue;
                result[k] = row.Cells[c];
                from = c + 1;
                break;
            }
        }
        return result;
    }

    /// <summary>The number as stored, in its shortest round-trip form (not as the sheet displays it).</summary>
    public static string Stored(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
