using System.Text.RegularExpressions;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// Walks a PDF's lines top to bottom and finds the tables of the submission format among prose, headings and page
/// furniture. A table starts at a header row (<see cref="HeaderMatcher"/>) and takes the lines below it while they
/// are rows of it (<see cref="TableLayout"/>): it ends at a wide vertical gap, a heading, a new header, a note or
/// units line, or a line of prose. A table that runs to the foot of a page continues on the next page, with its
/// header repeated or not. Running headers and footers (lines repeated at the same place on several pages, page
/// numbers) are skipped.
/// </summary>
internal sealed partial class PdfTableFinder
{
    private readonly List<TextLine> _lines;
    private readonly Dictionary<TextLine, int> _index = [];
    private readonly Dictionary<int, HeaderMatch?> _headers = [];

    private readonly TextDocument _doc;

    public PdfTableFinder(TextDocument doc)
    {
        _doc = doc;
        _lines = doc.Lines.ToList();
        for (int i = 0; i < _lines.Count; i++) _index[_lines[i]] = i;
        Furniture = FindFurniture(doc);
    }

    public List<FoundTable> Tables { get; } = [];

    /// <summary>Running headers, footers and page numbers.</summary>
    public HashSet<TextLine> Furniture { get; }

    /// <summary>Lines that belong to a table (header, rows, labels) or speak about one (caption, notes).</summary>
    public HashSet<TextLine> Consumed { get; } = [];

    public IReadOnlyList<TextLine> Lines => _lines;

    public TextDocument Document => _doc;

    public void Run()
    {
        FoundTable? open = null;
        int i = 0;
        while (i < _lines.Count)
        {
            var line = _lines[i];
            if (Furniture.Contains(line) || Consumed.Contains(line)) { i++; continue; }
            FoundTable? before = open;
            if (open is not null && line.Page != open.LastPage)
            {
                if (line.Page == open.LastPage + 1 && HeaderAt(i) is null && ContinuesWithoutHeader(open, line))
                {
                    i = ReadRows(open, i, null);
                    open = open.Open ? open : null;
                    continue;
                }
                open = null;
            }
            if (HeaderAt(i) is { } h)
            {
                var t = new FoundTable(h);
                // A header repeated at the top of the next page continues the table above it (a layout fact, not a new table).
                if (Tables.Count > 0 && Tables[^1] is var last && last.Spec == h.Spec && last.LastPage == line.Page - 1 && last.RowLines.Count > 0
                    && last.Header.Signature.Order(StringComparer.Ordinal).SequenceEqual(h.Signature.Order(StringComparer.Ordinal))
                    && !TabularAbove(i))
                    t.ContinuationOf = last;
                // The header repeated on the next page: the load-case label in force carries on.
                if (before is not null && before.Spec == h.Spec && before.Header.Signature.SequenceEqual(h.Signature) && before.RowLines.Count > 0
                    && before.RowCase.TryGetValue(before.RowLines[^1], out var inherited))
                    t.InheritedCase = inherited;
                AttachAbove(t, i);
                foreach (var l in h.Lines) Consumed.Add(l);
                Tables.Add(t);
                i = ReadRows(t, i + h.Lines.Count, h.Lines[^1].Baseline);
                open = t.Open ? t : null;
                continue;
            }
            i++;
        }
        foreach (var t in Tables)
            t.Placed = t.RowLines.Count == 0 ? [] : TableLayout.Place(t.Columns, t.RowLines, t.Header.Tight).Rows;
    }

    /// <summary>Whether a line of a table stands above line <paramref name="i"/> on its page (then a header there starts a table of its own).</summary>
    private bool TabularAbove(int i)
    {
        for (int k = i - 1; k >= 0 && _lines[k].Page == _lines[i].Page; k--)
            if (!Furniture.Contains(_lines[k]) && LooksTabular(_lines[k]) && !Tables.Any(t => t.Above.Contains(_lines[k]))) return true;
        return false;
    }

    private HeaderMatch? HeaderAt(int i)
    {
        if (_headers.TryGetValue(i, out var cached)) return cached;
        var block = new List<TextLine>();
        for (int k = i; k < _lines.Count && block.Count < HeaderMatcher.MaxLines + 1; k++)
        {
            if (Furniture.Contains(_lines[k]) || (k > i && Consumed.Contains(_lines[k]))) break;
            block.Add(_lines[k]);
        }
        var h = Furniture.Contains(_lines[i]) || block.Count == 0 ? null : HeaderMatcher.Match(block);
        // A header with words the format does not know, under a caption that names its table, or first on a sheet named after it.
        if (h is null && block.Count > 0 && !Furniture.Contains(_lines[i]) && NamedAbove(i) is { } named) h = HeaderMatcher.MatchNamed(_lines[i], named);
        _headers[i] = h;
        return h;
    }

    /// <summary>The table a caption just above line <paramref name="i"/> names (<c>Table 3 - Loads</c>), or the table its sheet is named after.</summary>
    private TableSpec? NamedAbove(int i)
    {
        var line = _lines[i];
        for (int k = i - 1; k >= 0 && k >= i - 2; k--)
        {
            var above = _lines[k];
            if (above.Page != line.Page || Consumed.Contains(above) || above.Baseline - line.Baseline > 4 * line.Size) break;
            if (Furniture.Contains(above) || above.Chunks().Count > 1) continue;
            if (PdfStatements.NamedTable(above.Text) is { } spec) return spec;
        }
        if (_doc.PageTables?.GetValueOrDefault(line.Page) is { } sheet && !Tables.Any(t => t.First.Page == line.Page && t.Spec == sheet)) return sheet;
        return null;
    }

    private bool ContinuesWithoutHeader(FoundTable t, TextLine line)
    {
        double size = t.First.Size;
        if (line.Size > 1.2 * size || line.Size < 0.8 * size) return false;
        var placed = TableLayout.PlaceLine(t.Columns, line, t.Header.Tight);
        return placed is not null && placed.WorstDistanceEm <= 1.0 && placed.Cells.Count(c => c is not null) >= Math.Min(2, t.Columns.Count);
    }

    /// <summary>Reads the rows of <paramref name="t"/> from line <paramref name="j"/> on; returns the index of the first line after them.</summary>
    private int ReadRows(FoundTable t, int j, double? lastBaseline)
    {
        if (j >= _lines.Count) { t.Open = false; return j; }
        int page = _lines[j].Page;
        double size = t.First.Size;
        bool hasCase = t.Spec.Columns.Any(c => c.Name == "case") && !t.Header.Cells.Any(c => c.Column?.Name == "case") && !t.Header.IsWide;
        var entries = new List<(int Index, TextLine Line, string? Label)>();
        var pitches = new List<double>(); // kept sorted
        bool toFoot = true;
        double? last = lastBaseline;
        while (j < _lines.Count && _lines[j].Page == page)
        {
            var line = _lines[j];
            if (Furniture.Contains(line)) { j++; continue; }
            double gap = last is double b ? b - line.Baseline : 0;
            double limit = pitches.Count == 0 ? 3.5 * size : Math.Max(2.2 * pitches[pitches.Count / 2], 1.9 * size);
            string? label = hasCase && line.Chunks().Count == 1 ? PdfStatements.CaseLabel(line.Text) : null;
            bool stop = gap > limit
                        || line.Size > 1.25 * size || line.Size < 0.7 * size
                        || (label is null && HeaderAt(j) is not null)
                        || IsStatement(line)
                        || (label is null && IsProse(line));
            if (stop) { toFoot = false; break; }
            if (entries.Count == 0 && t.RowLines.Count == 0 && t.UnitsRow is null && UnitsRow(t, line) is { } unitsRow)
            {
                // A units row the header block did not take in (set farther below the header than a wrapped line).
                t.UnitsRow = unitsRow;
                Consumed.Add(line);
                last = line.Baseline;
                j++;
                continue;
            }
            if (label is null && entries.Count > 0 && entries[^1].Label is null && gap <= 1.5 * size && Wrapped(t, entries[^1].Line, line) is int column)
            {
                // The second line of a cell whose text wrapped (a long restraint or note): part of the row above.
                if (!t.Wrapped.TryGetValue(entries[^1].Line, out var parts)) t.Wrapped[entries[^1].Line] = parts = [];
                parts.Add((line, column));
                last = line.Baseline;
                j++;
                continue;
            }
            entries.Add((j, line, label));
            if (last is not null)
            {
                int at = pitches.BinarySearch(gap);
                pitches.Insert(at < 0 ? ~at : at, gap);
            }
            last = line.Baseline;
            j++;
        }

        var rows = entries.Where(e => e.Label is null).Select(e => e.Line).ToList();
        int before = t.RowLines.Count;
        // The new rows are judged with the last rows already read, where the columns' values are known to sit
        // (all of them would make a long table quadratic in its length).
        var context = t.RowLines.Skip(Math.Max(0, before - 40)).ToList();
        var (_, firstBad) = rows.Count == 0 ? (null!, 0) : TableLayout.Place(t.Columns, context.Concat(rows).ToList(), t.Header.Tight);
        int accepted = Math.Max(0, firstBad - context.Count);
        if (accepted < rows.Count)
        {
            toFoot = false;
            j = _index[rows[accepted]];
            // Labels printed after the last accepted row belong to what follows.
            while (entries.Count > 0 && _index[entries[^1].Line] >= j) entries.RemoveAt(entries.Count - 1);
        }
        // A label stays in force across a page break, and into the part of the table printed under a repeated header.
        (string Case, TextLine Label)? current = before > 0 && t.RowCase.TryGetValue(t.RowLines[^1], out var held) ? held : t.InheritedCase;
        int taken = 0;
        foreach (var e in entries)
        {
            if (e.Label is not null)
            {
                current = (e.Label, e.Line);
                Consumed.Add(e.Line);
                continue;
            }
            if (taken >= accepted) break;
            t.RowLines.Add(e.Line);
            Consumed.Add(e.Line);
            if (t.Wrapped.TryGetValue(e.Line, out var wrapped)) foreach (var (w, _) in wrapped) Consumed.Add(w);
            if (current is { } c) t.RowCase[e.Line] = c;
            taken++;
        }
        t.Open = toFoot && t.RowLines.Count > 0;
        return t.Open ? j : AttachBelow(t, j);
    }

    /// <summary>
    /// The column a line continues when it is the wrapped second line of a text cell of <paramref name="row"/>: one run
    /// of words, under one column that is not a number column, where the row above has text.
    /// </summary>
    private static int? Wrapped(FoundTable t, TextLine row, TextLine line)
    {
        var chunks = line.Chunks();
        if (chunks.Count != 1) return null;
        var c = chunks[0];
        double em = Math.Max(1, line.Size);
        var under = t.Columns.Select((col, i) => (col, i)).Where(x => x.col.Distance(c.Left, c.Right) == 0).ToList();
        if (under.Count != 1 || under[0].col.Header?.Column is { Type: ColumnType.Number } || under[0].col.Header?.Subscript is not null) return null;
        var col = under[0].col;
        bool above = row.Chunks().Any(r => col.Distance(r.Left, r.Right) == 0 && Math.Abs(r.Left - c.Left) < 2 * em);
        return above ? under[0].i : null;
    }

    /// <summary>The units a line gives the columns it sits under, when every piece of it is a unit (<c>(m)</c>, <c>[kN·m]</c>, <c>kNm</c>).</summary>
    private static Dictionary<int, string>? UnitsRow(FoundTable t, TextLine line)
    {
        var placed = TableLayout.PlaceLine(t.Columns, line, t.Header.Tight);
        if (placed is null || placed.Leading is not null) return null;
        var units = new Dictionary<int, string>();
        for (int k = 0; k < placed.Cells.Length; k++)
        {
            if (placed.Cells[k] is not { } text) continue;
            string u = text.Trim();
            if (u.Length > 2 && (u[0], u[^1]) is ('(', ')') or ('[', ']')) u = u[1..^1].Trim();
            var kind = t.Columns[k].Header?.Column?.Kind;
            if (kind is null or QuantityKind.Number || UnitReader.TryRead(u, kind.Value) is null) return null;
            units[k] = u;
        }
        return units.Count > 0 ? units : null;
    }

    /// <summary>A run of six words or more, or a sentence of four (ending in a full stop or a colon), is prose, not a row.</summary>
    private static bool IsProse(TextLine line)
    {
        var chunks = line.Chunks();
        if (chunks.Any(c => c.Words.Count >= 6)) return true;
        string text = line.Text.TrimEnd();
        return chunks.Count == 1 && chunks[0].Words.Count >= 4 && (text.EndsWith('.') || text.EndsWith(':'));
    }

    /// <summary>Units lines, notes about parentheses and title-block lines end a table.</summary>
    private static bool IsStatement(TextLine line) =>
        PdfStatements.Units(line.Text) is not null || PdfStatements.SaysParenthesesNegative(line.Text) || PdfStatements.KeyValues(line).Count > 0
        || NoteLead().IsMatch(line.Text);

    /// <summary>Takes up to three caption lines just above a header (same page, not part of another table).</summary>
    private void AttachAbove(FoundTable t, int headerIndex)
    {
        double below = t.First.Baseline;
        for (int k = headerIndex - 1; k >= 0 && t.Above.Count < 3; k--)
        {
            var line = _lines[k];
            if (line.Page != t.First.Page || Consumed.Contains(line)) break;
            if (Furniture.Contains(line)) continue;
            if (line.Baseline - below > 3.5 * Math.Max(line.Size, t.First.Size)) break;
            if (LooksTabular(line) && HeaderAt(k) is null && t.Above.Count == 0 && line.Baseline - below > 2 * t.First.Size) break;
            t.Above.Add(line);
            Consumed.Add(line);
            below = line.Baseline;
        }
    }

    /// <summary>Takes the note lines just below a table (units, parentheses) and returns the index after them.</summary>
    private int AttachBelow(FoundTable t, int j)
    {
        if (t.RowLines.Count == 0) return j;
        double above = t.RowLines[^1].Baseline;
        int page = t.RowLines[^1].Page;
        int k = j;
        while (k < _lines.Count && t.Below.Count < 3)
        {
            var line = _lines[k];
            if (line.Page != page || Consumed.Contains(line)) break;
            if (Furniture.Contains(line)) { k++; continue; }
            if (above - line.Baseline > 3.5 * line.Size) break;
            bool note = PdfStatements.Units(line.Text) is not null || PdfStatements.SaysParenthesesNegative(line.Text) || NoteLead().IsMatch(line.Text);
            if (!note || HeaderAt(k) is not null) break;
            t.Below.Add(line);
            Consumed.Add(line);
            above = line.Baseline;
            k++;
        }
        return k;
    }

    /// <summary>A line with two or more pieces separated by wide gaps.</summary>
    public static bool LooksTabular(TextLine line) => line.Chunks().Count >= 2;

    // ---- page furniture ------------------------------------------------------------------------------

    private static HashSet<TextLine> FindFurniture(TextDocument doc)
    {
        var set = new HashSet<TextLine>();
        foreach (var page in doc.Pages)
            foreach (var line in page.Lines)
                if ((InMargin(line, page) && PdfStatements.IsPageNumber(line.Text)) || PdfStatements.IsRule(line.Text)) set.Add(line);
        if (doc.Pages.Count < 2) return set;
        var groups = new Dictionary<string, List<(TextLine Line, TextPage Page)>>(StringComparer.Ordinal);
        foreach (var page in doc.Pages)
            foreach (var line in page.Lines)
            {
                if (!InMargin(line, page)) continue;
                string key = PageWords().IsMatch(line.Text) ? PdfStatements.Shape(line.Text) : line.Text;
                if (!groups.TryGetValue(key, out var list)) groups[key] = list = [];
                list.Add((line, page));
            }
        foreach (var list in groups.Values)
        {
            foreach (var (line, page) in list)
            {
                bool repeated = list.Any(o => o.Page.Number != page.Number && Math.Abs(o.Line.Baseline - line.Baseline) < 2 * line.Size);
                if (repeated && HeaderMatcher.Match(line) is null) set.Add(line);
            }
        }
        return set;
    }

    /// <summary>In the top or bottom sixth of the page, where running headers and footers sit.</summary>
    private static bool InMargin(TextLine line, TextPage page) =>
        page.Height <= 0 || line.Baseline > page.Height * (5.0 / 6) || line.Baseline < page.Height / 6;

    [GeneratedRegex(@"\b(?:page|sheet|p\.|pg\.?)\s*\d", RegexOptions.IgnoreCase)]
    private static partial Regex PageWords();

    [GeneratedRegex(@"^\s*(?:notes?\b|\*|†|‡)", RegexOptions.IgnoreCase)]
    private static partial Regex NoteLead();
}
