using System.Text.RegularExpressions;

namespace CrossCheck.Import.Pdf;

/// <summary>A header cell of a table found in a PDF: where it is printed and what it stands for.</summary>
/// <param name="Printed">The header text as printed (all lines of a wrapped header, joined by spaces).</param>
/// <param name="Column">The column of the format, or null (unknown, or a double-subscript end-moment column).</param>
/// <param name="Name">The name part as printed, without its unit.</param>
/// <param name="Unit">The unit given in the header cell, if any.</param>
/// <param name="Subscript">For a double-subscript end-moment header (<c>M_AB</c>): the subscript (<c>AB</c>).</param>
internal sealed record HeaderCell(string Printed, double Left, double Right, ColumnSpec? Column, string Name, string? Unit, string? Subscript)
{
    public bool IsKnown => Column is not null || Subscript is not null;
}

/// <summary>A line (or two, for a wrapped header or a units row) recognised as the header row of a table.</summary>
internal sealed record HeaderMatch(TableSpec Spec, IReadOnlyList<HeaderCell> Cells, IReadOnlyList<TextLine> Lines, bool Tight)
{
    /// <summary>Another table whose header stands in the same line, beside this one (two tables side by side).</summary>
    public TableSpec? Beside { get; init; }

    public int Known => Cells.Count(c => c.IsKnown);
    public int Unknown => Cells.Count(c => !c.IsKnown);
    public int Units => Cells.Count(c => c.Unit is not null);
    /// <summary>Required columns of the format the header lacks (a wide end-moment header supplies member, at and moment).</summary>
    public int MissingRequired => Spec.Columns.Count(c => c.Required && !Cells.Any(x => x.Column == c)
        && !(IsWide && c.Name is "member" or "at" or "moment"));

    public double Score => (10.0 * Known) + Units - (2.0 * Unknown) - MissingRequired;
    public bool IsWide => Cells.Any(c => c.Subscript is not null);

    /// <summary>The columns of the format this header binds, in order (double-subscript columns as <c>moment</c>).</summary>
    public IEnumerable<string> Signature => Cells.Where(c => c.Column is not null).Select(c => c.Column!.Name)
        .Concat(Cells.Where(c => c.Subscript is not null).Select(c => "M_" + c.Subscript));

    public double Left => Cells.Min(c => c.Left);
    public double Right => Cells.Max(c => c.Right);
}

/// <summary>
/// Recognises a table's header row by the column names of <see cref="TableSchema"/> and their synonyms, in any
/// order and with units in brackets, in parentheses, as a trailing word or on a units row underneath. A header cell
/// is a piece of the line between wide gaps; in a tightly set header whose cells are one word apart, a piece is split
/// into names when every part is a known name. Double-subscript end-moment headers (<c>M_AB</c>, <c>MAB</c>,
/// <c>M(AB)</c>, <c>M AB</c>) are recognised for the <c>end-moments</c> table; they are resolved to members later.
/// </summary>
internal static partial class HeaderMatcher
{
    /// <summary>Most lines a header may take (a wrapped name, a vertically centred cell, a units row).</summary>
    public const int MaxLines = 3;

    /// <summary>
    /// The best reading of the lines from <paramref name="lines"/>[0] on as a header: one line, or up to
    /// <see cref="MaxLines"/> closely spaced lines combined column by column (a wrapped header, a cell centred
    /// between two lines, a units row underneath). A block of lines is preferred only when it reads better than the
    /// first line alone and better than any block starting one line further down.
    /// </summary>
    public static HeaderMatch? Match(IReadOnlyList<TextLine> lines)
    {
        if (lines.Count == 0) return null;
        var here = Blocks(lines, 0);
        var single = here[0];
        // A line that names every column it has, and all the table needs, is a header by itself: the lines under it are
        // its rows or units (a row of ids "A B" must not pass for the wrapped end of "JOINT" and "RESTRAINT").
        if (single is { Unknown: 0, MissingRequired: 0 } && !(lines.Count > 1 && UnitsOnly(lines[1]))) return single;
        var best = here.Where(m => m is not null).MaxBy(m => m!.Score);
        if (best is null || best == single) return single;
        var below = Blocks(lines, 1).Where(m => m is not null).Select(m => m!.Score).DefaultIfEmpty(double.NegativeInfinity).Max();
        return best.Score > below ? best : single;
    }

    /// <summary>A line alone, as a header.</summary>
    public static HeaderMatch? Match(TextLine line) => Match([line]);

    /// <summary>
    /// A line as the header of <paramref name="spec"/> when something outside it names the table (a caption above it,
    /// the sheet it is on): two cells that name its columns are enough, however many others the table's words do not
    /// know (their cells decide what they are).
    /// </summary>
    public static HeaderMatch? MatchNamed(TextLine line, TableSpec spec)
    {
        var pieces = Pieces(line);
        if (pieces.Count < 2 || pieces.Any(p => IsNumber(p.Text))) return null;
        var m = MatchSpec(spec, pieces, [line], relaxed: true);
        return m is null ? null : m with { Beside = Beside(m, pieces) };
    }

    private static List<HeaderMatch?> Blocks(IReadOnlyList<TextLine> lines, int start)
    {
        var result = new List<HeaderMatch?>();
        if (start >= lines.Count) return result;
        var block = new List<TextLine> { lines[start] };
        result.Add(Best(block));
        for (int k = start + 1; k < lines.Count && block.Count < MaxLines; k++)
        {
            var prev = block[^1];
            var next = lines[k];
            if (next.Page != prev.Page || prev.Baseline - next.Baseline > 2.2 * Math.Max(prev.Size, next.Size) || next.Baseline >= prev.Baseline) break;
            // A line with a number in it is a row of data, not the rest of a header.
            if (next.Chunks().Any(c => IsNumber(c.Text))) break;
            block.Add(next);
            result.Add(Best(block));
        }
        return result;
    }

    private static HeaderMatch? Best(List<TextLine> block)
    {
        var pieces = block.Count == 1 ? Pieces(block[0]) : Merge(block);
        if (pieces is null) return null;
        // A header holds no bare numbers: a row of data is not tried against every table.
        if (pieces.Any(p => IsNumber(p.Text))) return null;
        if (pieces.Count < 2 && !(pieces.Count == 1 && pieces[0].Words.Count >= 2)) return null;
        HeaderMatch? best = null;
        foreach (var spec in TableSchema.All)
        {
            var m = MatchSpec(spec, pieces, block.ToList());
            if (m is null) continue;
            if (best is null || m.Score > best.Score) best = m;
        }
        return best is null ? null : best with { Beside = Beside(best, pieces) };
    }

    /// <summary>A run of two or more unknown cells of a header that is itself the header of another table.</summary>
    private static TableSpec? Beside(HeaderMatch match, List<Piece> pieces)
    {
        var run = new List<Piece>();
        foreach (var cell in match.Cells.Append(null))
        {
            if (cell is { IsKnown: false }) { run.AddRange(pieces.Where(p => p.Left >= cell.Left - 0.01 && p.Right <= cell.Right + 0.01)); continue; }
            if (run.Count >= 2)
            {
                foreach (var spec in TableSchema.All.Where(s => s != match.Spec))
                    if (MatchSpec(spec, run, match.Lines) is { Unknown: 0 }) return spec;
            }
            run.Clear();
        }
        return null;
    }

    /// <summary>A line whose every piece is a unit (<c>[m]   [kN·m]</c>, <c>(m)</c>, <c>rel.</c>): a units row under a header.</summary>
    private static bool UnitsOnly(TextLine line) => line.Chunks().All(c =>
    {
        string u = c.Text.Trim().Trim('[', ']', '(', ')').Trim();
        return TableSchema.IsRelativeUnit(u) || UnitReader.IsKnownSpelling(u);
    });

    private static bool IsNumber(string text) =>
        NumberText.TryParse(text.Replace('\u2212', '-').Trim('(', ')'), false, out _)
        || NumberText.TryParse(text.Replace(",", "", StringComparison.Ordinal).Replace('\u2212', '-'), false, out _);

    /// <summary>A header cell candidate: words and the text they make.</summary>
    private sealed record Piece(IReadOnlyList<TextWord> Words, string Text)
    {
        public double Left => Words.Min(w => w.Left);
        public double Right => Words.Max(w => w.Right);
    }

    private static List<Piece> Pieces(TextLine line) => line.Chunks().Select(c => new Piece(c.Words, c.Text)).ToList();

    /// <summary>Header lines combined column by column: each piece of a lower line joins the piece above it, or starts a cell of its own.</summary>
    private static List<Piece>? Merge(List<TextLine> block)
    {
        var cells = new List<List<TextWord>>();
        foreach (var line in block)
        {
            // A line of notes or units set above a header is not part of it.
            if (PdfStatements.Units(line.Text) is not null || PdfStatements.KeyValues(line).Count > 0) return null;
            var lineCells = new List<(int Target, List<TextWord> Words)>();
            foreach (var p in Pieces(line))
            {
                int best = -1;
                double bestOv = 0;
                for (int i = 0; i < cells.Count; i++)
                {
                    double l = cells[i].Min(w => w.Left), r = cells[i].Max(w => w.Right);
                    double ov = Geometry.Overlap(p.Left, p.Right, l, r);
                    if (ov > bestOv) { bestOv = ov; best = i; }
                }
                lineCells.Add((best, p.Words.ToList()));
            }
            // A cell that reaches over two cells of the next line is a caption or a group header, not a wrapped name.
            if (lineCells.Where(c => c.Target >= 0).GroupBy(c => c.Target).Any(g => g.Count() > 1)) return null;
            foreach (var (target, words) in lineCells)
            {
                if (target >= 0) cells[target].AddRange(words);
                else cells.Add(words);
            }
        }
        return cells.Select(ws => new Piece(ws, string.Join(" ", ws.Select(w => w.Text)))).OrderBy(p => p.Left).ToList();
    }

    private static HeaderMatch? MatchSpec(TableSpec spec, List<Piece> pieces, IReadOnlyList<TextLine> lines, bool relaxed = false)
    {
        var cells = new List<HeaderCell>();
        var used = new HashSet<string>(StringComparer.Ordinal);
        bool tight = false;
        foreach (var piece in pieces)
        {
            var whole = MatchCell(spec, piece.Text);
            if (whole is not null && (whole.Column is null || !used.Contains(whole.Column.Name)))
            {
                Add(whole, piece.Words);
                continue;
            }
            var split = piece.Words.Count >= 2 && piece.Words.Count <= 30 ? Split(spec, piece.Words, used) : null;
            if (split is not null)
            {
                tight = true;
                foreach (var (m, words) in split) Add(m, words);
                continue;
            }
            cells.Add(new HeaderCell(piece.Text, piece.Left, piece.Right, null, piece.Text, null, null));
        }
        void Add(CellMatch m, IReadOnlyList<TextWord> words)
        {
            if (m.Column is not null) used.Add(m.Column.Name);
            string printed = string.Join(" ", words.Select(w => w.Text));
            cells.Add(new HeaderCell(printed, words.Min(w => w.Left), words.Max(w => w.Right), m.Column, m.Name, m.Unit, m.Subscript));
        }
        var match = new HeaderMatch(spec, cells, lines, tight);
        if (match.Known < 2 || (match.Known < match.Unknown && !relaxed)) return null;
        // A run of words cut into names counts when it names three columns or more, or two by words of their own
        // ("support restraint"); "Load case W" is a label, not the columns 'case' and 'w'.
        if (tight && pieces.Count == 1 && match.Known < 3 && cells.Any(c => !c.IsKnown || TableSchema.Normalize(c.Name).Length < 2)) return null;
        // Data rows are not headers: a header holds no bare numbers, and names at least one column by a word
        // (a row "A 41.7" must not pass for the columns 'a' and 'b').
        if (cells.Any(c => !c.IsKnown && IsNumber(c.Printed))) return null;
        if (!cells.Any(c => c.Subscript is not null || (c.Column is not null && TableSchema.Normalize(c.Name).Length >= 2))) return null;
        return match;
    }

    /// <summary>
    /// Splits a tightly set piece into consecutive word groups that are all known, distinct names. Of the ways to
    /// split it, the one whose cells hold the narrowest gaps wins (<c>span  length [m]</c> set with a wider gap after
    /// <c>span</c> is two cells, not the synonym <c>span length</c>); then the one with fewer cells.
    /// </summary>
    private static List<(CellMatch Match, IReadOnlyList<TextWord> Words)>? Split(TableSpec spec, IReadOnlyList<TextWord> words, HashSet<string> used)
    {
        int n = words.Count;
        var best = new (List<(CellMatch, IReadOnlyList<TextWord>)> Cells, double Gap)?[n + 1];
        best[0] = ([], 0);
        for (int end = 1; end <= n; end++)
        {
            for (int start = Math.Max(0, end - 6); start < end; start++)
            {
                if (best[start] is not { } prefix) continue;
                var group = words.Skip(start).Take(end - start).ToList();
                var m = MatchCell(spec, string.Join(" ", group.Select(w => w.Text)));
                if (m is null) continue;
                if (m.Column is not null && (used.Contains(m.Column.Name) || prefix.Cells.Any(p => p.Item1.Column == m.Column))) continue;
                double inner = 0;
                for (int k = 1; k < group.Count; k++) inner = Math.Max(inner, (group[k].Left - group[k - 1].Right) / Math.Max(1, group[k].Size));
                var candidate = (Cells: new List<(CellMatch, IReadOnlyList<TextWord>)>(prefix.Cells) { (m, group) }, Gap: Math.Max(prefix.Gap, inner));
                if (best[end] is not { } current || candidate.Gap < current.Gap - 0.05
                    || (Math.Abs(candidate.Gap - current.Gap) <= 0.05 && candidate.Cells.Count < current.Cells.Count))
                    best[end] = candidate;
            }
        }
        return best[n] is { Cells.Count: >= 2 } result ? result.Cells : null;
    }

    /// <summary>What one header cell's text stands for in a table of the format.</summary>
    internal sealed record CellMatch(ColumnSpec? Column, string Name, string? Unit, string? Subscript);

    // Every line not yet in a table is tried as a header against every table of the format, and the same texts recur
    // (member names, "udl", "fixed"): what a text stands for is remembered. Bounded, for long screening runs.
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<(TableSpec, string), CellMatch?> Matched = new();

    internal static CellMatch? MatchCell(TableSpec spec, string text)
    {
        if (Matched.TryGetValue((spec, text), out var known)) return known;
        var m = MatchCellUncached(spec, text);
        if (Matched.Count > 100_000) Matched.Clear();
        Matched[(spec, text)] = m;
        return m;
    }

    private static CellMatch? MatchCellUncached(TableSpec spec, string text)
    {
        string t = Geometry.Collapse(text).TrimEnd(':', '*', '†').Trim();
        if (t.Length == 0) return null;
        var (name, unit) = TableSchema.SplitHeader(t);
        if (unit is not null && unit.Length == 0) unit = null;
        // A name of the format comes first: "MOMENT (KNM)" and "MEMBER" are columns, not the member ends "OMENT" and "EMBER".
        if (spec == TableSchema.EndMoments && !(Column(spec, name) is not null && (unit is null || UnitReader.TryRead(unit, QuantityKind.Moment) is not null))
            && Wide(t) is { } wide)
            return wide;
        if (Column(spec, name) is { } c) return new CellMatch(c, name, c.Type == ColumnType.Number ? unit : null, null);
        if (unit is null)
        {
            // A unit written as the last word(s): "Moment kNm", "I mm4", "L, m".
            var words = name.Split(' ', StringSplitOptions.RemoveEmptyEntries);
            for (int k = 1; k <= Math.Min(2, words.Length - 1); k++)
            {
                string n = string.Join(" ", words[..^k]).TrimEnd(',', ';', ':');
                string u = string.Join(" ", words[^k..]);
                if (Column(spec, n) is { Type: ColumnType.Number } nc && UnitReader.TryRead(u, nc.Kind) is not null) return new CellMatch(nc, n, u, null);
            }
        }
        return null;
    }

    private static ColumnSpec? Column(TableSpec spec, string name)
    {
        if (TableSchema.ResolveColumn(spec, name) is { } c) return c;
        // Subscripts and footnote marks as printed: I_xx → Ixx, Moment¹ → Moment, No. → No.
        string plain = TrailingMarks().Replace(name, "").Replace("_", "", StringComparison.Ordinal).TrimEnd('.');
        return plain != name && plain.Length > 0 ? TableSchema.ResolveColumn(spec, plain) : null;
    }

    /// <summary>A double-subscript end-moment header, or null.</summary>
    private static CellMatch? Wide(string t)
    {
        foreach (var rx in new[] { WideUnderscore(), WideParen(), WideSpace(), WideBare() })
        {
            var m = rx.Match(t);
            if (!m.Success) continue;
            string sub = m.Groups["s"].Value.Trim().Trim('{', '}').Trim();
            string? unit = m.Groups["u"].Success && m.Groups["u"].Value.Length > 2 ? m.Groups["u"].Value[1..^1].Trim() : null;
            if (sub.Length == 0) continue;
            // "M (kNm)" and "M kNm" are a moment column with a unit, not a subscript.
            if (UnitReader.TryRead(sub, QuantityKind.Moment) is not null) return null;
            if (TableSchema.ResolveColumn(TableSchema.EndMoments, t) is not null) return null;
            return new CellMatch(null, "M", unit, sub);
        }
        return null;
    }

    [GeneratedRegex(@"^M\s*_\s*(?<s>\{[^}]+\}|[^\s\[\]()]+(?:\s*[,\-–]\s*[^\s\[\]()]+)?)\s*(?<u>\[[^\]]*\]|\([^)]*\))?$")]
    private static partial Regex WideUnderscore();

    [GeneratedRegex(@"^M\s*\(\s*(?<s>[^()]+?)\s*\)\s*(?<u>\[[^\]]*\])?$")]
    private static partial Regex WideParen();

    [GeneratedRegex(@"^M\s+(?<s>[A-Za-z0-9][A-Za-z0-9'\-,.]*)\s*(?<u>\[[^\]]*\]|\([^)]*\))?$")]
    private static partial Regex WideSpace();

    [GeneratedRegex(@"^M(?<s>[A-Z0-9][A-Z0-9']+)\s*(?<u>\[[^\]]*\]|\([^)]*\))?$")]
    private static partial Regex WideBare();

    [GeneratedRegex(@"[¹²³⁰⁴-⁹*†‡]+$")]
    private static partial Regex TrailingMarks();
}
