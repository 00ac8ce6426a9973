using System.Globalization;
using System.Text;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import.Documents;

/// <summary>
/// The invented calculation the failure-class tests print in other programs' layouts: the Kiln Lane footpath deck, a
/// beam continuous over two equal spans of 6 m, a UDL of 18 kN/m on both spans and 40 kN at the middle of span AB
/// (load case ULS-2). Support moment M_B = wL²/8 + 3PL/32 = 81 + 22.5 = 103.5 kN·m (wL²/8: Hicks, Civil Engineering
/// Formulas, Table 2.1; 3PL/32 for a central point load on one of two equal spans: AISC Manual Table 3-23, from memory).
/// </summary>
public static class CalcSources
{
    /// <summary>The calculation as the submission format's CSV, with the claimed moment at B given by <paramref name="mB"/>.</summary>
    public static string Csv(string mB = "103.5", bool relative = true, string caseId = "ULS-2", string? title = "Kiln Lane footpath deck beam (test)") => $"""
        [info]
        key,value
        {(title is null ? "# no title" : "title," + title)}
        force unit,kN
        length unit,m

        {CombinationBeam.Supports}

        [spans]
        span,length [m],{(relative ? "I" : "E [GPa],I [mm^4]")}
        AB,6,{(relative ? "1" : "210,250e6")}
        BC,6,{(relative ? "1" : "210,250e6")}

        [loads]
        case,on,kind,w [kN/m],P [kN],a [m]
        {caseId},AB,udl,18,,
        {caseId},BC,udl,18,,
        {caseId},AB,point,,40,3

        [end-moments]
        case,member,at,moment [kN·m]
        {caseId},AB,A,0
        {caseId},AB,B,{mB}
        {caseId},BC,B,-{mB}
        {caseId},BC,C,0
        """;

    /// <summary>An HTML page (A5, DejaVu Sans) with the given body, as an office's calc template would print it.</summary>
    public static string Html(string body, string extraStyle = "") => $$"""
        <!DOCTYPE html><html><head><meta charset="utf-8"><style>
        @page { size: A5; margin: 12mm; } body { font-family: 'DejaVu Sans'; font-size: 9pt; }
        table { border-collapse: collapse; margin-bottom: 4mm; } td, th { padding: 0.8mm 3mm; } th { border-bottom: 0.6pt solid #000; text-align: left; }
        td.n { text-align: right; } {{extraStyle}}
        </style></head><body>
        {{body}}
        </body></html>
        """;

    /// <summary>An HTML table: a caption paragraph, a header row (in a thead, repeated by the browser on a new page), the rows.</summary>
    public static string Table(string caption, string[] header, params string[][] rows)
    {
        var sb = new StringBuilder();
        if (caption.Length > 0) sb.Append("<p>").Append(caption).Append("</p>");
        sb.Append("<table><thead><tr>").Append(string.Concat(header.Select(h => $"<th>{h}</th>"))).Append("</tr></thead><tbody>");
        foreach (var r in rows)
            sb.Append("<tr>").Append(string.Concat(r.Select(c => double.TryParse(c, NumberStyles.Float, CultureInfo.InvariantCulture, out _) ? $"<td class=\"n\">{c}</td>" : $"<td>{c}</td>"))).Append("</tr>");
        return sb.Append("</tbody></table>").ToString();
    }

    /// <summary>The title block and the geometry tables every HTML variant shares.</summary>
    public static string HtmlGeometry(bool relative = true) =>
        "<h2>Kiln Lane footpath deck beam (test)</h2><p>Force unit: kN</p><p>Length unit: m</p>"
        + Table("Table 1: Supports", ["Support", "Restraint"], ["A", "pinned"], ["B", "roller"], ["C", "roller"])
        + (relative
            ? Table("Table 2: Spans", ["Span", "L (m)", "I (rel.)"], ["AB", "6.00", "1.0"], ["BC", "6.00", "1.0"])
            : Table("Table 2: Spans", ["Span", "L (m)", "E (GPa)", "I (mm4)"], ["AB", "6.00", "210", "250000000"], ["BC", "6.00", "210", "250000000"]));
}
