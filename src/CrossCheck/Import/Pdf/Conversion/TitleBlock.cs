namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// The <c>info</c> table of a PDF: the title block's <c>key: value</c> lines, the rows of a printed info table whose
/// keys they do not give, and force and length units from the document's first units line that gives both.
/// </summary>
internal static class TitleBlock
{
    public static RawTable? Table(PdfReading r, List<(PdfStatements.KeyValue Pair, TextLine Line)> pairs, Segment? table)
    {
        var rows = pairs.Select(p => new RawRow(p.Line.Number, [p.Pair.PrintedKey, p.Pair.Value], p.Line.Page)).ToList();
        var keys = pairs.Select(p => p.Pair.Key).ToHashSet(StringComparer.Ordinal);
        if (table is not null)
        {
            int k = table.Index("key"), v = table.Index("value");
            foreach (var row in table.Rows)
            {
                string key = k >= 0 ? row.Cells[k] : "";
                if (key.Length == 0 || !keys.Add(TableSchema.InfoKey(key) ?? TableSchema.Normalize(key))) continue;
                rows.Add(new RawRow(row.Line.Number, [key, v >= 0 ? row.Cells[v] : ""], row.Line.Page));
            }
        }
        // Force and length units from the first units line that gives both, unless the title block gives them.
        if (r.DocUnits.FirstOrDefault(d => d.Units.ByKind.ContainsKey(QuantityKind.Force) && d.Units.ByKind.ContainsKey(QuantityKind.Length)) is { Units: not null } du)
        {
            if (keys.Add("force unit")) rows.Add(new RawRow(du.Line.Number, ["force unit", du.Units.ByKind[QuantityKind.Force]], du.Line.Page));
            if (keys.Add("length unit")) rows.Add(new RawRow(du.Line.Number, ["length unit", du.Units.ByKind[QuantityKind.Length]], du.Line.Page));
        }
        if (rows.Count == 0) return null;
        rows = rows.OrderBy(x => x.Page).ThenBy(x => x.Line).ToList();
        return new RawTable("info", r.File, new RawRow(rows[0].Line, ["key", "value"], rows[0].Page), rows);
    }
}
