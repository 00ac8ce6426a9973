using System.Globalization;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// Units given outside a column's header: a group header or caption above the table, a units line next to it or
/// earlier in the document, or the unit printed with the numbers in the cells (<c>8.0 m</c>).
/// </summary>
internal static class OutsideUnits
{
    /// <summary>The unit a column gets from outside its header: a group header above it, a caption, a units line.</summary>
    public static string? For(PdfReading r, FoundTable t, FoundColumn col, QuantityKind kind, bool displacement)
    {
        // A group header directly above: "End moments [kN·m]" over some of the columns.
        // A caption ("Table 3: End moments (kN·m)") gives its unit to every column of that kind; a group header set
        // over some of the columns ("Settlements [mm]", starting right of the table's first column) only to those.
        foreach (var line in t.Above)
        {
            bool direct = line.Baseline - t.First.Baseline < 2.2 * t.First.Size;
            foreach (var chunk in line.Chunks())
            {
                var st = PdfStatements.Bracketed(chunk.Text);
                if (st is null) continue;
                bool caption = !direct || chunk.Left <= t.Header.Left + t.First.Size;
                bool over = Geometry.Overlap(chunk.Left, chunk.Right, col.HeadLeft, col.HeadRight) > 0;
                if (!caption && !over) continue;
                if (st.For(kind, displacement) is { } u) return u;
            }
        }
        foreach (var line in t.Above.Concat(t.Below))
            if (PdfStatements.Units(line.Text)?.For(kind, displacement) is { } u) return u;
        var before = r.DocUnits.Where(d => (d.Line.Page, d.Line.Number).CompareTo((t.First.Page, t.First.Number)) < 0).Select(d => d.Units).ToList();
        for (int i = before.Count - 1; i >= 0; i--)
            if (before[i].For(kind, displacement) is { } u) return u;
        return null;
    }

    /// <summary>
    /// Numbers printed with their unit in the cell (<c>8.0 m</c>, <c>14 kN/m</c>): the column takes the first such unit
    /// when its header gives none, and every value is written in the column's unit.
    /// </summary>
    public static void FromCells(Segment seg, NumberStyle style)
    {
        for (int k = 0; k < seg.Columns.Count; k++)
        {
            var col = seg.Columns[k];
            if (col.Column is not { Type: ColumnType.Number } spec) continue;
            foreach (var row in seg.Rows)
            {
                if (row.Cells[k].Length == 0 || NumberText.TryParse(row.Cells[k], false, out _)) continue;
                if (PdfNumbers.SplitUnit(row.Printed[k]) is not var (numberText, unitText)) continue;
                var unit = UnitReader.TryRead(unitText, spec.Kind);
                string number = PdfNumbers.Normalize(numberText, style, out _);
                if (unit is null || !NumberText.TryParse(number, false, out double value)) continue;
                if (col.EffectiveUnit is null) seg.Columns[k] = col = col with { External = unitText };
                var target = UnitReader.TryRead(col.EffectiveUnit!, spec.Kind);
                if (target is null) continue;
                row.Cells[k] = Math.Abs(target.ToSi - unit.ToSi) <= 1e-12 * target.ToSi
                    ? number
                    : (value * unit.ToSi / target.ToSi).ToString("R", CultureInfo.InvariantCulture);
            }
        }
    }
}
