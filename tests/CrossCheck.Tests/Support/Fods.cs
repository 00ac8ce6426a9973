using System.Globalization;
using System.Security;
using System.Text;

namespace CrossCheck.Tests.Support;

/// <summary>
/// Writes a spreadsheet as flat OpenDocument XML (<c>.fods</c>), the source a spreadsheet program turns into a workbook or
/// a PDF (<see cref="Producers.Spreadsheet"/>): sheets of text, numbers, formulas (the program computes and stores their
/// results), numbers shown with a unit by their number format, merged cells, hidden rows and columns, column widths.
/// </summary>
public sealed class Fods
{
    /// <summary>A formula (OpenFormula, e.g. <c>=1.35*B4</c>).</summary>
    public sealed record Formula(string Text);

    /// <summary>A number displayed with a unit by its number format (<c>0.0 "kNm"</c>), one decimal.</summary>
    public sealed record WithUnit(double Value, string Unit);

    /// <summary>A cell merged across <paramref name="Columns"/> columns.</summary>
    public sealed record Merged(string Text, int Columns);

    /// <summary>A row the sheet hides.</summary>
    public sealed record HiddenRow(object?[] Cells);

    private readonly List<(string Name, IReadOnlyList<object?[]> Rows, double WidthMm, IReadOnlySet<int> HiddenColumns)> _sheets = [];

    public Fods Sheet(string name, IReadOnlyList<object?[]> rows, double widthMm = 24, IReadOnlySet<int>? hiddenColumns = null)
    {
        _sheets.Add((name, rows, widthMm, hiddenColumns ?? new HashSet<int>()));
        return this;
    }

    public override string ToString()
    {
        var units = _sheets.SelectMany(s => s.Rows).SelectMany(Cells).OfType<WithUnit>().Select(u => u.Unit).Distinct().ToList();
        var sb = new StringBuilder();
        sb.Append("""
            <?xml version="1.0" encoding="UTF-8"?>
            <office:document xmlns:office="urn:oasis:names:tc:opendocument:xmlns:office:1.0" xmlns:table="urn:oasis:names:tc:opendocument:xmlns:table:1.0"
             xmlns:text="urn:oasis:names:tc:opendocument:xmlns:text:1.0" xmlns:style="urn:oasis:names:tc:opendocument:xmlns:style:1.0"
             xmlns:fo="urn:oasis:names:tc:opendocument:xmlns:xsl-fo-compatible:1.0" xmlns:number="urn:oasis:names:tc:opendocument:xmlns:datastyle:1.0"
             xmlns:of="urn:oasis:names:tc:opendocument:xmlns:of:1.2" office:version="1.2" office:mimetype="application/vnd.oasis.opendocument.spreadsheet">
            <office:automatic-styles>
            """);
        for (int i = 0; i < _sheets.Count; i++)
            sb.Append(CultureInfo.InvariantCulture, $"<style:style style:name=\"co{i}\" style:family=\"table-column\"><style:table-column-properties style:column-width=\"{_sheets[i].WidthMm}mm\"/></style:style>\n");
        for (int u = 0; u < units.Count; u++)
        {
            sb.Append(CultureInfo.InvariantCulture, $"<number:number-style style:name=\"N{u}\"><number:number number:decimal-places=\"1\" number:min-integer-digits=\"1\"/><number:text> {Xml(units[u])}</number:text></number:number-style>\n");
            sb.Append(CultureInfo.InvariantCulture, $"<style:style style:name=\"ce{u}\" style:family=\"table-cell\" style:data-style-name=\"N{u}\"/>\n");
        }
        sb.Append("</office:automatic-styles><office:body><office:spreadsheet>\n");
        for (int i = 0; i < _sheets.Count; i++)
        {
            var (name, rows, _, hidden) = _sheets[i];
            int width = rows.Select(r => Cells(r).Sum(c => c is Merged m ? m.Columns : 1)).DefaultIfEmpty(1).Max();
            sb.Append(CultureInfo.InvariantCulture, $"<table:table table:name=\"{Xml(name)}\">\n");
            for (int c = 1; c <= Math.Max(width, 1); c++)
                sb.Append(CultureInfo.InvariantCulture, $"<table:table-column table:style-name=\"co{i}\"{(hidden.Contains(c) ? " table:visibility=\"collapse\"" : "")}/>\n");
            foreach (var row in rows)
            {
                bool hiddenRow = row is [HiddenRow];
                sb.Append(hiddenRow ? "<table:table-row table:visibility=\"collapse\">" : "<table:table-row>");
                foreach (var cell in Cells(row)) sb.Append(Cell(cell, units));
                sb.Append("</table:table-row>\n");
            }
            sb.Append("</table:table>\n");
        }
        sb.Append("</office:spreadsheet></office:body></office:document>\n");
        return sb.ToString();
    }

    private static object?[] Cells(object?[] row) => row is [HiddenRow h] ? h.Cells : row;

    private static string Cell(object? cell, List<string> units) => cell switch
    {
        null => "<table:table-cell/>",
        string s => $"<table:table-cell office:value-type=\"string\"><text:p>{Xml(s)}</text:p></table:table-cell>",
        double or int => $"<table:table-cell office:value-type=\"float\" office:value=\"{Convert.ToDouble(cell, CultureInfo.InvariantCulture).ToString("R", CultureInfo.InvariantCulture)}\"/>",
        Formula f => $"<table:table-cell table:formula=\"of:{Xml(f.Text)}\"/>",
        WithUnit u => $"<table:table-cell table:style-name=\"ce{units.IndexOf(u.Unit)}\" office:value-type=\"float\" office:value=\"{u.Value.ToString("R", CultureInfo.InvariantCulture)}\"/>",
        Merged m => $"<table:table-cell table:number-columns-spanned=\"{m.Columns}\" office:value-type=\"string\"><text:p>{Xml(m.Text)}</text:p></table:table-cell>"
                     + string.Concat(Enumerable.Repeat("<table:covered-table-cell/>", m.Columns - 1)),
        _ => throw new ArgumentException($"not a cell: {cell}"),
    };

    private static string Xml(string s) => SecurityElement.Escape(s);
}
