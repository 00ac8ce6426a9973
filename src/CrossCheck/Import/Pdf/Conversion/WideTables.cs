using CrossCheck.Model;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// Tables printed with one column per member end (<c>M_AB</c>, <c>M_BA</c>, ...): an end-moment table is turned into
/// rows of case, member, at and moment, and a moment-distribution working table into the <c>distribution</c> table's
/// <c>member@joint</c> columns. A double subscript is resolved against the members read from the same document.
/// </summary>
internal static class WideTables
{
    /// <summary>Members and their end joints, read from the document's members table (or spans and supports).</summary>
    internal sealed record MemberEnds(string Id, string Start, string End);

    public static List<MemberEnds>? MembersOf(List<Segment> segments)
    {
        var list = new List<MemberEnds>();
        var members = segments.Where(s => s.Spec == TableSchema.Members).ToList();
        foreach (var s in members)
        {
            int m = s.Index("member"), a = s.Index("start"), b = s.Index("end");
            if (m < 0 || a < 0 || b < 0) continue;
            list.AddRange(s.Rows.Where(r => r.Cells[m].Length > 0).Select(r => new MemberEnds(r.Cells[m], r.Cells[a], r.Cells[b])));
        }
        var spans = segments.Where(s => s.Spec == TableSchema.Spans).SelectMany(s => s.Rows.Select(r => (s, r))).ToList();
        var supports = segments.Where(s => s.Spec == TableSchema.Supports).SelectMany(s => s.Rows.Select(r => (s, r))).ToList();
        for (int i = 0; i < spans.Count && i + 1 < supports.Count; i++)
        {
            int si = spans[i].s.Index("span"), pi = supports[i].s.Index("support");
            if (si < 0 || pi < 0) continue;
            list.Add(new MemberEnds(spans[i].r.Cells[si], supports[i].r.Cells[pi], supports[i + 1].r.Cells[supports[i + 1].s.Index("support")]));
        }
        return members.Count == 0 && spans.Count == 0 ? null : list;
    }

    /// <summary>A wide end-moment table (one column per member end) in the long form: case, member, at, moment.</summary>
    public static Segment? Read(PdfReading r, FoundTable t, List<MemberEnds>? geometry)
    {
        var problems = r.Problems;
        // A table of member-end columns whose rows are steps (DF, FEM, balance, carry-over, final) is the author's
        // moment-distribution working, not a table of results.
        int stepK = -1;
        for (int k = 0; k < t.Columns.Count; k++)
        {
            var h = t.Columns[k].Header!;
            if (h.Subscript is null && TableSchema.Distribution.Column("step").Matches(TableSchema.Normalize(h.Printed))) stepK = k;
        }
        var labels = t.Placed.Select(p => stepK >= 0 ? p.Cells[stepK] ?? "" : p.Leading ?? "").ToList();
        if (stepK >= 0 || (labels.Count >= 3 && labels.Count(l => WorkingTableReader.ParseStep(l) is not null) * 2 > labels.Count))
            return Working(r, t, geometry, stepK, labels);
        var seg = new Segment(t.Spec, t);
        var caseCol = TableSchema.EndMoments.Column("case");
        var ends = new List<(int K, string Member, string At, string Printed)>();
        int caseK = -1;
        string? unit = null;
        bool ok = true;
        for (int k = 0; k < t.Columns.Count; k++)
        {
            var h = t.Columns[k].Header!;
            var where = new SourceRef(r.File, "end-moments", t.First.Number, h.Printed, t.First.Page);
            if (h.Column?.Name == "case") { caseK = k; continue; }
            if (h.Subscript is null)
            {
                problems.Add(new InputProblem(where, Messages.UnknownColumn(h.Printed, TableSchema.EndMoments), ProblemSeverity.Warning));
                continue;
            }
            string? u = h.Unit ?? t.UnitsRow?.GetValueOrDefault(k) ?? OutsideUnits.For(r, t, t.Columns[k], QuantityKind.Moment, false);
            if (u is not null)
            {
                if (unit is null) unit = u;
                else if (UnitReader.TryRead(u, QuantityKind.Moment)?.ToSi != UnitReader.TryRead(unit, QuantityKind.Moment)?.ToSi)
                {
                    problems.Add(new InputProblem(where, Messages.PdfWideUnits(unit, u)));
                    ok = false;
                }
            }
            if (geometry is null) { problems.Add(new InputProblem(where, Messages.PdfWideNoGeometry(h.Printed))); ok = false; continue; }
            var readings = Resolve(h.Subscript, geometry);
            if (readings.Count == 1) { ends.Add((k, readings[0].Member, readings[0].At, h.Printed)); continue; }
            if (readings.Count > 1)
            {
                problems.Add(new InputProblem(where, Messages.PdfWideAmbiguous(h.Printed, readings.Select(x => $"member {x.Member} at {x.At}"))));
                ok = false;
            }
            else if (h.Subscript.Any(char.IsLower) && !geometry.Any(g => h.Subscript.Contains(g.Start, StringComparison.Ordinal)))
            {
                // M_max, M_Ed: a design quantity, not a member end.
                problems.Add(new InputProblem(where, Messages.UnknownColumn(h.Printed, TableSchema.EndMoments), ProblemSeverity.Warning));
            }
            else
            {
                problems.Add(new InputProblem(where, Messages.PdfWideUnresolved(h.Printed, h.Subscript)));
                ok = false;
            }
        }
        if (!ok || ends.Count == 0) return null;
        seg.Columns.Add(new SegmentColumn(caseCol, "case", null, null, "case"));
        seg.Columns.Add(new SegmentColumn(TableSchema.EndMoments.Column("member"), "member", null, null, "member"));
        seg.Columns.Add(new SegmentColumn(TableSchema.EndMoments.Column("at"), "at", null, null, "at"));
        seg.Columns.Add(new SegmentColumn(TableSchema.EndMoments.Column("moment"), "moment", unit, null, "moment"));
        seg.WideFrom = ends.Select(e => e.Printed).ToList();
        string? captionCase = TableCells.CaptionCase(t);
        for (int i = 0; i < t.Placed.Count; i++)
        {
            var line = t.RowLines[i];
            var p = t.Placed[i];
            string casePrinted = caseK >= 0 ? p.Cells[caseK] ?? "" : p.Leading ?? (t.RowCase.TryGetValue(line, out var lc) ? lc.Label.Text : captionCase ?? "");
            string caseId = caseK >= 0 || p.Leading is not null ? Geometry.Collapse(casePrinted)
                : t.RowCase.TryGetValue(line, out var lc2) ? lc2.Case : captionCase ?? "";
            foreach (var (k, member, at, printed) in ends)
            {
                string raw = p.Cells[k] ?? "";
                if (PdfNumbers.IsBlank(raw)) continue;
                string value = r.Cell(seg.Columns[3].Column, raw, t, line, printed);
                seg.Rows.Add(new SegmentRow(line, [caseId, member, at, value], [casePrinted, printed, printed, raw]));
            }
        }
        return seg;
    }

    /// <summary>A moment-distribution working table: case, step, and one column per member end named <c>member@joint</c>.</summary>
    private static Segment? Working(PdfReading r, FoundTable t, List<MemberEnds>? geometry, int stepK, List<string> labels)
    {
        var seg = new Segment(TableSchema.Distribution, t);
        var ends = new List<(int K, ColumnSpec Column)>();
        string? unit = null;
        for (int k = 0; k < t.Columns.Count; k++)
        {
            if (k == stepK) continue;
            var h = t.Columns[k].Header!;
            var where = new SourceRef(r.File, "distribution", t.First.Number, h.Printed, t.First.Page);
            if (h.Subscript is null || geometry is null) continue;
            var readings = Resolve(h.Subscript, geometry);
            if (readings.Count != 1)
            {
                r.Problems.Add(new InputProblem(where, readings.Count > 1
                    ? Messages.PdfWideAmbiguous(h.Printed, readings.Select(x => $"member {x.Member} at {x.At}"))
                    : Messages.PdfWideUnresolved(h.Printed, h.Subscript)));
                return null;
            }
            unit ??= h.Unit ?? t.UnitsRow?.GetValueOrDefault(k) ?? OutsideUnits.For(r, t, t.Columns[k], QuantityKind.Moment, false);
            ends.Add((k, new ColumnSpec($"{readings[0].Member}@{readings[0].At}", ColumnType.Number, QuantityKind.Moment, false)));
        }
        if (ends.Count == 0) return null;
        seg.Columns.Add(new SegmentColumn(TableSchema.Distribution.Column("case"), "case", null, null, "case"));
        seg.Columns.Add(new SegmentColumn(TableSchema.Distribution.Column("step"), "step", null, null, "step"));
        foreach (var (k, column) in ends) seg.Columns.Add(new SegmentColumn(column, column.Name, unit, null, t.Columns[k].Header!.Printed));
        seg.WideFrom = ends.Select(e => t.Columns[e.K].Header!.Printed).ToList();
        string caseId = TableCells.CaptionCase(t) ?? "1";
        for (int i = 0; i < t.Placed.Count; i++)
        {
            var line = t.RowLines[i];
            var p = t.Placed[i];
            var cells = new List<string> { caseId, Geometry.Collapse(labels[i]) };
            var printed = new List<string> { caseId, labels[i] };
            foreach (var (k, column) in ends)
            {
                string raw = p.Cells[k] ?? "";
                cells.Add(r.Cell(column, raw, t, line, column.Name));
                printed.Add(raw);
            }
            seg.Rows.Add(new SegmentRow(line, cells, printed));
        }
        return seg;
    }

    /// <summary>The members and ends a double subscript can name: <c>AB</c> = end A of the member joining A and B.</summary>
    private static List<(string Member, string At)> Resolve(string sub, List<MemberEnds> members)
    {
        var splits = new List<(string Near, string Far)>();
        var parts = sub.Split([',', '-', '–', ' ', '.', ';', '/'], StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
        if (parts.Length == 2) splits.Add((parts[0], parts[1]));
        else if (parts.Length == 1)
            for (int k = 1; k < sub.Length; k++) splits.Add((sub[..k], sub[k..]));
        foreach (var cmp in new[] { StringComparison.Ordinal, StringComparison.OrdinalIgnoreCase })
        {
            var found = new List<(string, string)>();
            foreach (var (near, far) in splits)
                foreach (var m in members)
                {
                    if (string.Equals(m.Start, near, cmp) && string.Equals(m.End, far, cmp)) found.Add((m.Id, m.Start));
                    else if (string.Equals(m.End, near, cmp) && string.Equals(m.Start, far, cmp)) found.Add((m.Id, m.End));
                }
            found = found.Distinct().ToList();
            if (found.Count > 0) return found;
        }
        return [];
    }
}
