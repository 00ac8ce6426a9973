using CrossCheck.Model;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// A found table in the form of the format: its columns with their units, its rows as the importer reads them
/// (numbers normalised, wrapped text joined, a load case from a caption or from labels between rows).
/// </summary>
internal static class TableCells
{
    public static Segment Read(PdfReading r, FoundTable t)
    {
        var seg = new Segment(t.Spec, t);
        var keep = new List<int>();
        for (int k = 0; k < t.Columns.Count; k++)
        {
            var h = t.Columns[k].Header!;
            if (h.Column is { } c)
            {
                string? unit = c.Type == ColumnType.Number ? h.Unit ?? t.UnitsRow?.GetValueOrDefault(k) ?? FirstPartUnit(t, c) : null;
                string? external = c.Type == ColumnType.Number && unit is null
                    ? OutsideUnits.For(r, t, t.Columns[k], c.Kind, t.Spec == TableSchema.Displacements)
                      ?? (t.Origin != t ? OutsideUnits.For(r, t.Origin, t.Origin.Columns.FirstOrDefault(o => o.Header?.Column == c) ?? t.Columns[k], c.Kind, t.Spec == TableSchema.Displacements) : null)
                    : null;
                seg.Columns.Add(new SegmentColumn(c, HeaderName(t.Spec, h), unit, external, h.Printed) { Decision = t.Columns[k].Decision });
            }
            else
            {
                // A header whose words name a column it was not read as is written blank, so that it is not read twice.
                string header = HeaderMatcher.MatchCell(t.Spec, h.Printed)?.Column is null ? h.Printed : "";
                seg.Columns.Add(new SegmentColumn(null, header, null, null, h.Printed) { Decision = t.Columns[k].Decision });
            }
            keep.Add(k);
        }
        string? captionCase = CaptionCase(t);
        bool addCase = t.Spec.Columns.Any(c => c.Name == "case") && !seg.Columns.Any(c => c.Column?.Name == "case")
                       && (t.RowCase.Count > 0 || captionCase is not null);
        if (addCase)
        {
            string how = t.RowCase.Count > 0 ? "from the load-case labels between its rows"
                : $"from the caption \"{PdfReading.Shorten(CaptionLine(t)?.Text ?? "")}\"";
            seg.Columns.Add(new SegmentColumn(t.Spec.Column("case"), "case", null, null, "case") { Decision = new Roles.RoleDecision(t.Spec.Column("case"), Roles.RoleBasis.Layout, 0.95, how) });
        }
        int leading = t.Placed.Count(p => p.Leading is not null);
        if (leading > 0)
            r.Ignored.Add(new PdfIgnored(new SourceRef(r.File, t.Spec.Name, t.First.Number, null, t.First.Page),
                Messages.PdfUnlabelledColumn(t.Placed.First(p => p.Leading is not null).Leading!)));
        for (int i = 0; i < t.Placed.Count; i++)
        {
            var line = t.RowLines[i];
            var p = t.Placed[i];
            var cells = new List<string>();
            var printed = new List<string>();
            var wrapped = t.Wrapped.GetValueOrDefault(line);
            foreach (int k in keep)
            {
                string raw = p.Cells[k] ?? "";
                if (wrapped is not null)
                    foreach (var (w, column) in wrapped.Where(x => x.Column == k)) raw = Geometry.Collapse(raw + " " + w.Text);
                printed.Add(raw);
                cells.Add(r.Cell(seg.Columns[cells.Count].Column, raw, t, line, seg.Columns[cells.Count].Printed));
            }
            if (addCase)
            {
                var label = t.RowCase.TryGetValue(line, out var lc) ? lc : default;
                string id = label.Case ?? captionCase ?? "";
                cells.Add(id);
                printed.Add(label.Label?.Text ?? id);
            }
            seg.Rows.Add(new SegmentRow(line, cells, printed));
        }
        OutsideUnits.FromCells(seg, r.Style);
        return seg;
    }

    /// <summary>Every number cell of the found tables, as printed (to decide how the document writes numbers).</summary>
    public static IEnumerable<string> NumberCells(PdfReading r)
    {
        foreach (var t in r.Finder.Tables)
            foreach (var p in t.Placed)
                for (int k = 0; k < t.Columns.Count; k++)
                    if ((t.Columns[k].Header?.Column?.Type == ColumnType.Number || t.Columns[k].Header?.Subscript is not null) && p.Cells[k] is { } c)
                        yield return c;
    }

    /// <summary>
    /// The load case a caption above the table names (<c>Load case 2: wind</c>, <c>Loads (ULS-2)</c>), if any; a part that
    /// continues a table on the next page under its repeated header takes the case of the first part's caption.
    /// </summary>
    public static string? CaptionCase(FoundTable t) => CaptionLine(t) is { } line ? PdfStatements.CaptionCase(line.Text) : null;

    /// <summary>The caption line that names the table's load case (the first part's, for a continuation), if any.</summary>
    private static TextLine? CaptionLine(FoundTable t) =>
        t.Above.FirstOrDefault(l => PdfStatements.CaptionCase(l.Text) is not null) ?? (t.ContinuationOf is { } first ? CaptionLine(first) : null);

    /// <summary>The unit the first part of a continued table gives a column (its header or units row), when this part repeats the header without it.</summary>
    private static string? FirstPartUnit(FoundTable t, ColumnSpec c)
    {
        if (t.ContinuationOf is not { } first) return null;
        int k = first.Columns.FindIndex(o => o.Header?.Column == c);
        return k < 0 ? null : first.Columns[k].Header!.Unit ?? first.UnitsRow?.GetValueOrDefault(k) ?? FirstPartUnit(first, c);
    }

    /// <summary>The header name to write: as printed when the format reads it the same way, else the format's name.</summary>
    private static string HeaderName(TableSpec spec, HeaderCell h) =>
        TableSchema.ResolveColumn(spec, h.Name) == h.Column ? h.Name : h.Column!.Name;
}
