using System.Globalization;
using CrossCheck.Model;

namespace CrossCheck.Import.Pdf;

/// <summary>A table read from a PDF, as the <c>extract</c> command reports it.</summary>
/// <param name="Table">The table of the format.</param>
/// <param name="Where">Where it was printed: <c>p.1 lines 12-18; p.2 lines 3-9</c>.</param>
/// <param name="Rows">Rows read.</param>
/// <param name="Columns">How each printed header was read: <c>L [m] → length [m]</c>, or <c>Notes → ignored</c>.</param>
/// <param name="Note">How the table was read when that is not obvious (a wide end-moment table, case labels).</param>
public sealed record PdfTableReport(string Table, string Where, int Rows, IReadOnlyList<string> Columns, string? Note);

/// <summary>Something in the PDF that was not read, and why.</summary>
public sealed record PdfIgnored(SourceRef Where, string What);

/// <summary>
/// What the PDF reader found: the tables as text (in the form of the CSV contract), what it skipped, how it read
/// the numbers (<see cref="Notes"/>: parentheses as negatives, decimal commas) and the problems.
/// </summary>
public sealed record PdfExtraction(
    string Source,
    IReadOnlyList<RawTable> Tables,
    IReadOnlyList<PdfTableReport> Found,
    IReadOnlyList<PdfIgnored> Ignored,
    IReadOnlyList<InputProblem> Problems)
{
    public IReadOnlyList<PdfIgnored> Notes { get; init; } = [];

    public bool HasErrors => Problems.Any(p => p.IsError);
}

/// <summary>
/// Reads a submission from a text PDF: finds the tables (<see cref="PdfTableFinder"/>), reads the title block's
/// <c>key: value</c> lines, applies units stated outside the headers, normalises numbers (<see cref="PdfNumbers"/>),
/// turns wide end-moment tables (<c>M_AB</c> columns) into the long form, joins the parts of a table printed in
/// several places, and hands the tables to <see cref="SubmissionBuilder"/>. Every value keeps its page and line.
/// </summary>
public static class PdfSubmissionReader
{
    /// <summary>Reads and builds the submission. Never throws for bad input.</summary>
    public static ImportResult Read(string path, PdfLimits? limits = null) =>
        Read(path, limits is null ? InputLimits.Default : InputLimits.Default with { Pdf = limits });

    /// <summary>Reads and builds the submission within <paramref name="limits"/>. Never throws for bad input.</summary>
    public static ImportResult Read(string path, InputLimits limits)
    {
        ArgumentNullException.ThrowIfNull(limits);
        var x = Extract(path, limits.Pdf);
        if (x.Tables.Count == 0) return new ImportResult(null, x.Problems);
        return SubmissionBuilder.Build(path, x.Tables, x.Problems, limits);
    }

    /// <summary>Reads the tables of a PDF without building the submission (for <c>crosscheck extract</c>).</summary>
    public static PdfExtraction Extract(string path, PdfLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        string display = Path.GetFileName(path);
        var problems = new List<InputProblem>();
        var doc = PdfTextReader.Read(path, display, limits ?? PdfLimits.Default, problems);
        if (doc is null) return new PdfExtraction(path, [], [], [], problems);
        return new Conversion(doc, problems).Run(path);
    }

    /// <summary>One reading of a document.</summary>
    private sealed class Conversion(TextDocument doc, List<InputProblem> problems)
    {
        private readonly PdfTableFinder _finder = new(doc);
        private readonly List<PdfIgnored> _ignored = [];
        private readonly List<PdfIgnored> _notes = [];
        private readonly string _file = doc.File;
        private readonly List<(TextLine Line, UnitsStatement Units)> _docUnits = [];
        private NumberStyle _style = new(false, false);
        private bool _warnedParentheses, _warnedThousands;

        public PdfExtraction Run(string path)
        {
            _finder.Run();
            var tableLines = new HashSet<TextLine>(_finder.Tables.SelectMany(t => t.Header.Lines.Concat(t.RowLines).Concat(t.RowCase.Values.Select(v => v.Label))));
            var attached = new HashSet<TextLine>(_finder.Tables.SelectMany(t => t.Above.Concat(t.Below)));
            var info = ReadStatements(tableLines, attached);
            var (comma, pointSeen) = PdfNumbers.Detect(NumberCells());
            _style = new NumberStyle(comma, _parenthesesNote is not null, pointSeen);
            if (comma) _notes.Add(new PdfIgnored(new SourceRef(_file), "numbers are read with decimal commas (the document's numbers use them)"));

            if (_finder.Tables.Count == 0)
            {
                problems.Add(new InputProblem(new SourceRef(_file), Messages.PdfNoTables(_seenHeaders.Take(8).ToList())));
                return new PdfExtraction(path, [], [], _ignored, problems);
            }

            foreach (var t in _finder.Tables.Where(t => t.Header.Beside is not null))
                problems.Add(new InputProblem(new SourceRef(_file, t.Spec.Name, t.First.Number, null, t.First.Page),
                    Messages.PdfSideBySide(t.Spec.Name, t.Header.Beside!.Name)));
            // A header with no rows under it (a running header that names columns, a table cut off) is dropped when
            // the table is printed elsewhere with rows.
            foreach (var empty in _finder.Tables.Where(t => t.RowLines.Count == 0 && _finder.Tables.Any(o => o.Spec == t.Spec && o.RowLines.Count > 0)).ToList())
            {
                _finder.Tables.Remove(empty);
                _ignored.Add(new PdfIgnored(new SourceRef(_file, empty.Spec.Name, empty.First.Number, null, empty.First.Page),
                    $"a header of table '{empty.Spec.Name}' with no rows under it (\"{Shorten(empty.First.Text)}\")"));
            }
            var segments = _finder.Tables.Where(t => !t.Header.IsWide).Select(Segment).ToList();
            var geometry = MembersOf(segments);
            foreach (var t in _finder.Tables.Where(t => t.Header.IsWide))
                if (Wide(t, geometry) is { } s) segments.Add(s);
            segments = segments.OrderBy(s => s.Source.First.Page).ThenBy(s => s.Source.First.Number).ToList();
            var merged = Merge(segments);
            var tables = new List<RawTable>();
            var infoTable = InfoTable(info, merged.FirstOrDefault(m => m.Spec == TableSchema.Info));
            if (infoTable is not null) tables.Add(infoTable);
            foreach (var m in merged.Where(m => m.Spec != TableSchema.Info)) tables.Add(m.ToRaw(_file));
            var reports = merged.Where(m => m.Spec != TableSchema.Info).Select(Report).ToList();
            if (infoTable is not null) reports.Insert(0, InfoReport(infoTable));
            return new PdfExtraction(path, tables, reports, _ignored, problems) { Notes = _notes };
        }

        // ---- statements outside the tables ---------------------------------------------------------------

        private List<(PdfStatements.KeyValue Pair, TextLine Line)> ReadStatements(HashSet<TextLine> tableLines, HashSet<TextLine> attached)
        {
            var info = new List<(PdfStatements.KeyValue, TextLine)>();
            var keys = new HashSet<string>(StringComparer.Ordinal);
            var tabularRun = new List<TextLine>();
            void FlushRun()
            {
                if (tabularRun.Count >= 2 || (tabularRun.Count == 1 && tabularRun[0].Chunks().Count >= 3))
                {
                    var first = tabularRun[0];
                    string span = tabularRun.Count == 1 ? $"line {first.Number}" : $"lines {first.Number}-{tabularRun[^1].Number}";
                    _ignored.Add(new PdfIgnored(new SourceRef(_file, null, first.Number, null, first.Page),
                        $"{span}: rows under a header that is not a table of the submission format (\"{Shorten(first.Text)}\")"));
                    _seenHeaders.Add($"p.{first.Page} line {first.Number}: \"{string.Join(" | ", first.Chunks().Select(c => c.Text))}\"");
                }
                tabularRun.Clear();
            }
            foreach (var line in _finder.Lines)
            {
                if (tableLines.Contains(line)) { FlushRun(); continue; }
                bool furniture = _finder.Furniture.Contains(line);
                var pairs = PdfStatements.KeyValues(line);
                foreach (var kv in pairs.Where(p => p.Key != "units"))
                    if (keys.Add(kv.Key)) info.Add((kv, line));
                // Units lines hold from where they stand until the next one; a note that parentheses mean negative
                // holds for the whole document (wherever it is printed, next to a table or not).
                var units = PdfStatements.Units(line.Text);
                if (units is not null) _docUnits.Add((line, units));
                if (PdfStatements.SaysParenthesesNegative(line.Text) && _parenthesesNote is null) _parenthesesNote = line;
                if (attached.Contains(line)) { FlushRun(); continue; }
                bool tabular = !furniture && pairs.Count == 0 && units is null && PdfTableFinder.LooksTabular(line);
                if (tabular && (tabularRun.Count == 0 || (tabularRun[^1].Page == line.Page && tabularRun[^1].Baseline - line.Baseline < 3 * line.Size)))
                {
                    tabularRun.Add(line);
                    continue;
                }
                FlushRun();
                if (tabular) tabularRun.Add(line);
            }
            FlushRun();
            if (_parenthesesNote is { } note)
                _notes.Add(new PdfIgnored(new SourceRef(_file, null, note.Number, null, note.Page),
                    "numbers in parentheses are read as negative, as this note says"));
            return info;
        }

        private readonly List<string> _seenHeaders = [];
        private TextLine? _parenthesesNote;

        private static string Shorten(string s) => s.Length > 60 ? s[..60] + "…" : s;

        private IEnumerable<string> NumberCells()
        {
            foreach (var t in _finder.Tables)
                foreach (var p in t.Placed)
                    for (int k = 0; k < t.Columns.Count; k++)
                        if ((t.Columns[k].Header?.Column?.Type == ColumnType.Number || t.Columns[k].Header?.Subscript is not null) && p.Cells[k] is { } c)
                            yield return c;
        }

        // ---- units -------------------------------------------------------------------------------------

        /// <summary>The unit a column gets from outside its header: a group header above it, a caption, a units line.</summary>
        private string? ExternalUnit(FoundTable t, FoundColumn col, QuantityKind kind, bool displacement)
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
            var before = _docUnits.Where(d => (d.Line.Page, d.Line.Number).CompareTo((t.First.Page, t.First.Number)) < 0).Select(d => d.Units).ToList();
            for (int i = before.Count - 1; i >= 0; i--)
                if (before[i].For(kind, displacement) is { } u) return u;
            return null;
        }

        // ---- tables → segments ---------------------------------------------------------------------------

        private Segment Segment(FoundTable t)
        {
            var seg = new Segment(t.Spec, t);
            var style = _style;
            var keep = new List<int>();
            for (int k = 0; k < t.Columns.Count; k++)
            {
                var h = t.Columns[k].Header!;
                if (h.Column is { } c)
                {
                    string? unit = c.Type == ColumnType.Number ? h.Unit ?? t.UnitsRow?.GetValueOrDefault(k) : null;
                    string? external = c.Type == ColumnType.Number && unit is null
                        ? ExternalUnit(t, t.Columns[k], c.Kind, t.Spec == TableSchema.Displacements) : null;
                    seg.Columns.Add(new SegmentColumn(c, HeaderName(t.Spec, h), unit, external, h.Printed));
                }
                else
                {
                    seg.Columns.Add(new SegmentColumn(null, h.Printed, null, null, h.Printed));
                }
                keep.Add(k);
            }
            string? captionCase = CaptionCase(t);
            bool addCase = t.Spec.Columns.Any(c => c.Name == "case") && !seg.Columns.Any(c => c.Column?.Name == "case")
                           && (t.RowCase.Count > 0 || captionCase is not null);
            if (addCase) seg.Columns.Add(new SegmentColumn(t.Spec.Column("case"), "case", null, null, "case"));
            int leading = t.Placed.Count(p => p.Leading is not null);
            if (leading > 0)
                _ignored.Add(new PdfIgnored(new SourceRef(_file, t.Spec.Name, t.First.Number, null, t.First.Page),
                    Messages.PdfUnlabelledColumn(t.Placed.First(p => p.Leading is not null).Leading!)));
            for (int r = 0; r < t.Placed.Count; r++)
            {
                var line = t.RowLines[r];
                var p = t.Placed[r];
                var cells = new List<string>();
                var printed = new List<string>();
                var wrapped = t.Wrapped.GetValueOrDefault(line);
                foreach (int k in keep)
                {
                    string raw = p.Cells[k] ?? "";
                    if (wrapped is not null)
                        foreach (var (w, column) in wrapped.Where(x => x.Column == k)) raw = Geometry.Collapse(raw + " " + w.Text);
                    printed.Add(raw);
                    cells.Add(Cell(seg.Columns[cells.Count].Column, raw, style, t, line, seg.Columns[cells.Count].Printed));
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
            CellUnits(seg, style);
            return seg;
        }

        /// <summary>
        /// Numbers printed with their unit in the cell (<c>8.0 m</c>, <c>14 kN/m</c>): the column takes the first such unit
        /// when its header gives none, and every value is written in the column's unit.
        /// </summary>
        private void CellUnits(Segment seg, NumberStyle style)
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

        private static string? CaptionCase(FoundTable t) => t.Above.Select(l => PdfStatements.CaptionCase(l.Text)).FirstOrDefault(c => c is not null);

        /// <summary>The header name to write: as printed when the format reads it the same way, else the format's name.</summary>
        private static string HeaderName(TableSpec spec, HeaderCell h) =>
            TableSchema.ResolveColumn(spec, h.Name) == h.Column ? h.Name : h.Column!.Name;

        /// <summary>A cell in the form the importer reads: numbers normalised, dashes as empty.</summary>
        private string Cell(ColumnSpec? column, string raw, NumberStyle style, FoundTable t, TextLine line, string header)
        {
            if (PdfNumbers.IsBlank(raw)) return "";
            if (column?.Type != ColumnType.Number) return Geometry.Collapse(raw);
            string n = PdfNumbers.Normalize(raw, style, out var notice);
            var where = new SourceRef(_file, t.Spec.Name, line.Number, header, line.Page, raw);
            if (notice.HasFlag(PdfNumbers.Notice.Parentheses) && !_warnedParentheses)
            {
                _warnedParentheses = true;
                problems.Add(new InputProblem(where, Messages.PdfParenthesesWithoutNote(column.Name, raw), ProblemSeverity.Warning));
            }
            if (notice.HasFlag(PdfNumbers.Notice.AmbiguousThousands) && !_warnedThousands)
            {
                _warnedThousands = true;
                problems.Add(new InputProblem(where, Messages.PdfAmbiguousThousands(raw), ProblemSeverity.Warning));
            }
            return n;
        }

        // ---- wide end-moment tables ----------------------------------------------------------------------

        /// <summary>Members and their end joints, read from the document's members table (or spans and supports).</summary>
        private sealed record MemberEnds(string Id, string Start, string End);

        private static List<MemberEnds>? MembersOf(List<Segment> segments)
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
        private Segment? Wide(FoundTable t, List<MemberEnds>? geometry)
        {
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
                return Working(t, geometry, stepK, labels);
            var seg = new Segment(t.Spec, t);
            var caseCol = TableSchema.EndMoments.Column("case");
            var ends = new List<(int K, string Member, string At, string Printed)>();
            int caseK = -1;
            string? unit = null;
            bool ok = true;
            for (int k = 0; k < t.Columns.Count; k++)
            {
                var h = t.Columns[k].Header!;
                var where = new SourceRef(_file, "end-moments", t.First.Number, h.Printed, t.First.Page);
                if (h.Column?.Name == "case") { caseK = k; continue; }
                if (h.Subscript is null)
                {
                    problems.Add(new InputProblem(where, Messages.UnknownColumn(h.Printed, TableSchema.EndMoments), ProblemSeverity.Warning));
                    continue;
                }
                string? u = h.Unit ?? t.UnitsRow?.GetValueOrDefault(k) ?? ExternalUnit(t, t.Columns[k], QuantityKind.Moment, false);
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
                    problems.Add(new InputProblem(where, Messages.PdfWideAmbiguous(h.Printed, readings.Select(r => $"member {r.Member} at {r.At}"))));
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
            var style = _style;
            string? captionCase = CaptionCase(t);
            for (int r = 0; r < t.Placed.Count; r++)
            {
                var line = t.RowLines[r];
                var p = t.Placed[r];
                string casePrinted = caseK >= 0 ? p.Cells[caseK] ?? "" : p.Leading ?? (t.RowCase.TryGetValue(line, out var lc) ? lc.Label.Text : captionCase ?? "");
                string caseId = caseK >= 0 || p.Leading is not null ? Geometry.Collapse(casePrinted)
                    : t.RowCase.TryGetValue(line, out var lc2) ? lc2.Case : captionCase ?? "";
                foreach (var (k, member, at, printed) in ends)
                {
                    string raw = p.Cells[k] ?? "";
                    if (PdfNumbers.IsBlank(raw)) continue;
                    string value = Cell(seg.Columns[3].Column, raw, style, t, line, printed);
                    seg.Rows.Add(new SegmentRow(line, [caseId, member, at, value], [casePrinted, printed, printed, raw]));
                }
            }
            return seg;
        }

        /// <summary>A moment-distribution working table: case, step, and one column per member end named <c>member@joint</c>.</summary>
        private Segment? Working(FoundTable t, List<MemberEnds>? geometry, int stepK, List<string> labels)
        {
            var seg = new Segment(TableSchema.Distribution, t);
            var ends = new List<(int K, ColumnSpec Column)>();
            string? unit = null;
            for (int k = 0; k < t.Columns.Count; k++)
            {
                if (k == stepK) continue;
                var h = t.Columns[k].Header!;
                var where = new SourceRef(_file, "distribution", t.First.Number, h.Printed, t.First.Page);
                if (h.Subscript is null || geometry is null) continue;
                var readings = Resolve(h.Subscript, geometry);
                if (readings.Count != 1)
                {
                    problems.Add(new InputProblem(where, readings.Count > 1
                        ? Messages.PdfWideAmbiguous(h.Printed, readings.Select(r => $"member {r.Member} at {r.At}"))
                        : Messages.PdfWideUnresolved(h.Printed, h.Subscript)));
                    return null;
                }
                unit ??= h.Unit ?? t.UnitsRow?.GetValueOrDefault(k) ?? ExternalUnit(t, t.Columns[k], QuantityKind.Moment, false);
                ends.Add((k, new ColumnSpec($"{readings[0].Member}@{readings[0].At}", ColumnType.Number, QuantityKind.Moment, false)));
            }
            if (ends.Count == 0) return null;
            seg.Columns.Add(new SegmentColumn(TableSchema.Distribution.Column("case"), "case", null, null, "case"));
            seg.Columns.Add(new SegmentColumn(TableSchema.Distribution.Column("step"), "step", null, null, "step"));
            foreach (var (k, column) in ends) seg.Columns.Add(new SegmentColumn(column, column.Name, unit, null, t.Columns[k].Header!.Printed));
            seg.WideFrom = ends.Select(e => t.Columns[e.K].Header!.Printed).ToList();
            string caseId = CaptionCase(t) ?? "1";
            for (int r = 0; r < t.Placed.Count; r++)
            {
                var line = t.RowLines[r];
                var p = t.Placed[r];
                var cells = new List<string> { caseId, Geometry.Collapse(labels[r]) };
                var printed = new List<string> { caseId, labels[r] };
                foreach (var (k, column) in ends)
                {
                    string raw = p.Cells[k] ?? "";
                    cells.Add(Cell(column, raw, _style, t, line, column.Name));
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

        // ---- joining the parts of a table ----------------------------------------------------------------

        private List<Segment> Merge(List<Segment> segments)
        {
            var result = new List<Segment>();
            foreach (var s in segments)
            {
                var baseSeg = result.FirstOrDefault(r => r.Spec == s.Spec);
                if (baseSeg is null) { result.Add(s); continue; }
                var where = new SourceRef(_file, s.Spec.Name, s.Source.First.Number, null, s.Source.First.Page);
                var a = baseSeg.Known.Select(c => c.Column!.Name).Order().ToList();
                var b = s.Known.Select(c => c.Column!.Name).Order().ToList();
                if (!a.SequenceEqual(b))
                {
                    problems.Add(new InputProblem(where, Messages.PdfIncompatibleTables(s.Spec.Name, baseSeg.Where)));
                    continue;
                }
                bool unitsAgree = true;
                foreach (var c in s.Known.Where(c => c.Column!.Type == ColumnType.Number))
                {
                    var other = baseSeg.Known.First(o => o.Column == c.Column);
                    if (SameUnit(c.EffectiveUnit, other.EffectiveUnit, c.Column!.Kind)) continue;
                    problems.Add(new InputProblem(where with { Column = c.Printed }, Messages.PdfUnitsDiffer(s.Spec.Name, c.Column.Name, baseSeg.Where)));
                    unitsAgree = false;
                }
                if (!unitsAgree) continue;
                baseSeg.Append(s);
            }
            return result;
        }

        private static bool SameUnit(string? a, string? b, QuantityKind kind)
        {
            if (a is null || b is null) return a is null && b is null;
            return UnitReader.TryRead(a, kind)?.ToSi is double fa && UnitReader.TryRead(b, kind)?.ToSi is double fb
                ? Math.Abs(fa - fb) <= 1e-12 * Math.Abs(fa)
                : string.Equals(a, b, StringComparison.Ordinal);
        }

        // ---- info --------------------------------------------------------------------------------------

        private RawTable? InfoTable(List<(PdfStatements.KeyValue Pair, TextLine Line)> pairs, Segment? table)
        {
            var rows = pairs.Select(p => new RawRow(p.Line.Number, [p.Pair.PrintedKey, p.Pair.Value], p.Line.Page)).ToList();
            var keys = pairs.Select(p => p.Pair.Key).ToHashSet(StringComparer.Ordinal);
            if (table is not null)
            {
                int k = table.Index("key"), v = table.Index("value");
                foreach (var r in table.Rows)
                {
                    string key = k >= 0 ? r.Cells[k] : "";
                    if (key.Length == 0 || !keys.Add(TableSchema.InfoKey(key) ?? TableSchema.Normalize(key))) continue;
                    rows.Add(new RawRow(r.Line.Number, [key, v >= 0 ? r.Cells[v] : ""], r.Line.Page));
                }
            }
            // Force and length units from the first units line that gives both, unless the title block gives them.
            if (_docUnits.FirstOrDefault(d => d.Units.ByKind.ContainsKey(QuantityKind.Force) && d.Units.ByKind.ContainsKey(QuantityKind.Length)) is { Units: not null } du)
            {
                if (keys.Add("force unit")) rows.Add(new RawRow(du.Line.Number, ["force unit", du.Units.ByKind[QuantityKind.Force]], du.Line.Page));
                if (keys.Add("length unit")) rows.Add(new RawRow(du.Line.Number, ["length unit", du.Units.ByKind[QuantityKind.Length]], du.Line.Page));
            }
            if (rows.Count == 0) return null;
            rows = rows.OrderBy(r => r.Page).ThenBy(r => r.Line).ToList();
            return new RawTable("info", _file, new RawRow(rows[0].Line, ["key", "value"], rows[0].Page), rows);
        }

        // ---- report ------------------------------------------------------------------------------------

        private static PdfTableReport InfoReport(RawTable info)
        {
            var pages = info.Rows.GroupBy(r => r.Page).Select(g => string.Create(CultureInfo.InvariantCulture,
                $"p.{g.Key} line{(g.Count() > 1 ? "s" : "")} {string.Join(", ", g.Select(r => r.Line).Distinct())}"));
            var keys = info.Rows.Select(r => $"{r.Cell(0)} → {TableSchema.InfoKey(r.Cell(0)) ?? TableSchema.Normalize(r.Cell(0))}").ToList();
            return new PdfTableReport("info", string.Join("; ", pages), info.Rows.Count, keys, "title block and settings from 'key: value' lines");
        }

        private PdfTableReport Report(Segment s)
        {
            string where = string.Join("; ", s.Parts.GroupBy(p => p.Page).Select(g =>
            {
                int first = g.Min(p => p.First), last = g.Max(p => p.Last);
                return first == last
                    ? string.Create(CultureInfo.InvariantCulture, $"p.{g.Key} line {first}")
                    : string.Create(CultureInfo.InvariantCulture, $"p.{g.Key} lines {first}-{last}");
            }));
            var columns = new List<string>();
            if (s.WideFrom is { } wide && s.Spec == TableSchema.Distribution)
            {
                columns.Add($"{string.Join(", ", wide)} → {string.Join(", ", s.Columns.Skip(2).Select(c => c.Header))}{(s.Columns.Count > 2 && s.Columns[2].EffectiveUnit is { } du ? $" [{du}]" : "")}");
            }
            else if (s.WideFrom is { } wide2)
            {
                columns.Add($"{string.Join(", ", wide2)} → case, member, at, moment{(s.Columns[3].EffectiveUnit is { } u ? $" [{u}]" : "")}");
            }
            else
            {
                foreach (var c in s.Columns)
                {
                    if (c.Column is null) { columns.Add($"{c.Printed} → ignored"); continue; }
                    string unit = c.EffectiveUnit is { } eu ? $" [{eu}]" : "";
                    string from = c.External is not null ? " (unit from outside the header)" : "";
                    columns.Add($"{c.Printed} → {c.Column.Name}{unit}{from}");
                }
            }
            string? note = s.Spec == TableSchema.Distribution ? "a moment-distribution working table, one column per member end"
                : s.WideFrom is not null ? "one column per member end, turned into one row per member end"
                : s.Source.RowCase.Count > 0 ? "load case taken from the labels between rows" : null;
            return new PdfTableReport(s.Spec.Name, where, s.Rows.Count, columns, note);
        }
    }

    /// <summary>A column of a segment: the format's column (null = not part of the format), and its unit.</summary>
    private sealed record SegmentColumn(ColumnSpec? Column, string Header, string? Unit, string? External, string Printed)
    {
        public string? EffectiveUnit => Unit ?? External;
    }

    private sealed record SegmentRow(TextLine Line, List<string> Cells, List<string> Printed);

    /// <summary>A table (or a printed part of one) as text cells, ready to become a <see cref="RawTable"/>.</summary>
    private sealed class Segment
    {
        public Segment(TableSpec spec, FoundTable source)
        {
            Spec = spec;
            Source = source;
            var lines = source.Header.Lines.Concat(source.RowLines).ToList();
            foreach (var g in lines.GroupBy(l => l.Page)) Parts.Add((g.Key, g.Min(l => l.Number), g.Max(l => l.Number)));
        }

        public TableSpec Spec { get; }
        public FoundTable Source { get; }
        public List<SegmentColumn> Columns { get; } = [];
        public List<SegmentRow> Rows { get; } = [];
        public List<string>? WideFrom { get; set; }
        public List<(int Page, int First, int Last)> Parts { get; } = [];

        public IEnumerable<SegmentColumn> Known => Columns.Where(c => c.Column is not null);

        public string Where => string.Create(CultureInfo.InvariantCulture, $"p.{Source.First.Page} line {Source.First.Number}");

        public int Index(string column) => Columns.FindIndex(c => c.Column?.Name == column);

        public void Append(Segment other)
        {
            var map = Columns.Select(c => c.Column is null ? -1 : other.Columns.FindIndex(o => o.Column == c.Column)).ToList();
            foreach (var r in other.Rows)
                Rows.Add(new SegmentRow(r.Line, map.Select(i => i < 0 ? "" : r.Cells[i]).ToList(), map.Select(i => i < 0 ? "" : r.Printed[i]).ToList()));
            if (other.WideFrom is { } w) WideFrom = [.. WideFrom ?? [], .. w];
            Parts.AddRange(other.Parts);
        }

        public RawTable ToRaw(string file)
        {
            var header = Columns.Select(c => c.Unit is { } u ? $"{c.Header} [{u}]" : c.Header).ToList();
            var units = new Dictionary<int, string>();
            for (int k = 0; k < Columns.Count; k++) if (Columns[k].Unit is null && Columns[k].External is { } e) units[k] = e;
            var rows = Rows.Select(r => new RawRow(r.Line.Number, r.Cells, r.Line.Page, r.Printed)).ToList();
            return new RawTable(Spec.Name, file, new RawRow(Source.First.Number, header, Source.First.Page), rows, false, units.Count > 0 ? units : null);
        }
    }
}
