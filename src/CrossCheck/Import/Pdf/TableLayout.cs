namespace CrossCheck.Import.Pdf;

/// <summary>A column of a table found in a PDF: its header cell (none for a column printed without one) and where its values sit.</summary>
internal sealed class FoundColumn(HeaderCell? header, double left, double right)
{
    /// <summary>The header cell; its column of the format is replaced when the column's role is decided from its cells.</summary>
    public HeaderCell? Header { get; set; } = header;

    /// <summary>How the column's role was decided (set once the document's tables are placed).</summary>
    public Roles.RoleDecision? Decision { get; set; }
    public double HeadLeft { get; } = left;
    public double HeadRight { get; } = right;

    /// <summary>Typical extent of the values (median left and right edges), once rows have been placed.</summary>
    public (double Left, double Right)? Data { get; set; }

    /// <summary>
    /// The band the column owns when the table's alignment was decided from its rows (<see cref="TableLayout"/>): from
    /// its header's left edge to the next header's (headers set left, numbers right, as a spreadsheet prints), or from
    /// the previous header's right edge to its own. Null: the header's own extent.
    /// </summary>
    public (double Left, double Right)? Zone { get; set; }

    /// <summary>Distance from a piece of text to this column (0 when it overlaps the header or the values).</summary>
    public double Distance(double l, double r)
    {
        double d = Zone is var (zl, zr) ? Geometry.Distance(l, r, zl, zr) : Geometry.Distance(l, r, HeadLeft, HeadRight);
        if (Data is var (dl, dr)) d = Math.Min(d, Geometry.Distance(l, r, dl, dr));
        return d;
    }
}

/// <summary>A piece of a row: one cell's words.</summary>
internal sealed record RowPiece(double Left, double Right, string Text, double Size);

/// <summary>
/// Places the words of table rows in columns. Cells are rebuilt from column extents, not from words: each row's
/// pieces (runs of words between wide gaps) are matched to the columns in order, at least cost, where the cost is the
/// horizontal distance to the column's header or to where the column's values sit in the other rows. That handles
/// right-aligned numbers under short left- or centre-aligned headers, empty cells, and a leading column printed
/// without a header. The column extents are refined over a few passes. A line that crosses two headers, or has more
/// pieces than the table has columns, is not a row: the table ends there.
/// </summary>
internal static class TableLayout
{
    /// <summary>Cost of leaving a piece out of every column, in font sizes.</summary>
    private const double DropEm = 4;

    /// <summary>Cost of placing the first piece in a column to the left of every header.</summary>
    private const double LeadingEm = 2;

    /// <summary>Farthest a piece may sit from the column it is placed in, in font sizes.</summary>
    private const double MaxDistanceEm = 8;

    /// <summary>A row placed in columns: the text per column (index −1 = the leading column without a header).</summary>
    internal sealed record Placed(string?[] Cells, string? Leading, double WorstDistanceEm);

    /// <summary>
    /// Places every line; returns the placements of the lines up to (not including) the first that is not a row of this
    /// table, and that line's index (or the count when all fit). Updates the columns' value extents.
    /// </summary>
    public static (List<Placed> Rows, int FirstBad) Place(List<FoundColumn> columns, IReadOnlyList<TextLine> lines, bool tight)
    {
        var first = PlaceBy(columns, lines, tight, out var edges);
        // Cells are placed by the header extents; when the columns they make are not each aligned on one edge, the
        // table may be set another way (headers left and numbers right, each number ending just left of the next
        // header): the bands the headers' left or right edges make are tried, and the reading whose rows fit best and
        // whose columns are aligned wins. Decided once per table.
        // A stray cell or two in a long table (a dash set centred) is not a sign of another alignment.
        int cells = edges.Sum(e => e.Lefts.Count), off = Misaligned(edges, lines);
        if (columns.Count < 2 || columns.Any(c => c.Zone is not null) || off == 0 || (off < 3 && 50 * off < cells)) return first;
        var data = columns.Select(c => c.Data).ToList();
        var best = (Rows: first, Score: (first.FirstBad, -off), Zones: (List<(double, double)?>?)null);
        foreach (var zones in new[] { LeftBands(columns), RightBands(columns) })
        {
            for (int k = 0; k < columns.Count; k++) { columns[k].Zone = zones[k]; columns[k].Data = null; }
            var trial = PlaceBy(columns, lines, tight, out var trialEdges);
            var score = (trial.FirstBad, -Misaligned(trialEdges, lines));
            if (score.CompareTo(best.Score) > 0) best = (trial, score, zones);
        }
        for (int k = 0; k < columns.Count; k++)
        {
            columns[k].Zone = best.Zones?[k];
            if (best.Zones is null) columns[k].Data = data[k];
        }
        if (best.Zones is not null) return PlaceBy(columns, lines, tight, out _);
        return first;
    }

    /// <summary>Bands from each header's left edge to the next one's: headers set left over numbers set right.</summary>
    private static List<(double, double)?> LeftBands(List<FoundColumn> columns)
    {
        var zones = new List<(double, double)?>();
        for (int k = 0; k < columns.Count; k++)
        {
            double left = columns[k].HeadLeft - 0.5, right = k + 1 < columns.Count ? columns[k + 1].HeadLeft - 0.2 : double.MaxValue / 4;
            zones.Add((left, Math.Max(right, columns[k].HeadRight)));
        }
        return zones;
    }

    /// <summary>Bands from the previous header's right edge to each header's own: headers set right over values set left.</summary>
    private static List<(double, double)?> RightBands(List<FoundColumn> columns)
    {
        var zones = new List<(double, double)?>();
        for (int k = 0; k < columns.Count; k++)
        {
            double left = k > 0 ? columns[k - 1].HeadRight + 0.2 : -double.MaxValue / 4, right = columns[k].HeadRight + 0.4;
            zones.Add((Math.Min(left, columns[k].HeadLeft), right));
        }
        return zones;
    }

    /// <summary>
    /// How many placed cells stand off their column's alignment: for each column, the cells that share neither its
    /// left edge, its right edge, its centre nor its decimal point (half a font size) with most of the column.
    /// </summary>
    private static int Misaligned(List<Edges> edges, IReadOnlyList<TextLine> lines)
    {
        double em = lines.Count == 0 ? 1 : Math.Max(1, lines[0].Size);
        int off = 0;
        foreach (var e in edges)
        {
            int n = e.Lefts.Count;
            if (n < 2) continue;
            int best = 0;
            foreach (var anchor in new[] { e.Lefts, e.Rights, e.Centres, e.Decimals })
            {
                var sorted = anchor.ToList();
                sorted.Sort();
                double median = sorted[n / 2];
                int near = 0;
                foreach (double x in anchor) if (Math.Abs(x - median) <= 0.5 * em) near++;
                best = Math.Max(best, near);
            }
            off += n - best;
        }
        return off;
    }

    /// <summary>Where the cells placed in one column sit: left and right edges, centres and decimal points.</summary>
    internal sealed class Edges
    {
        public List<double> Lefts { get; } = [];
        public List<double> Rights { get; } = [];
        public List<double> Centres { get; } = [];
        public List<double> Decimals { get; } = [];

        public void Add(RowPiece p)
        {
            Lefts.Add(p.Left);
            Rights.Add(p.Right);
            Centres.Add((p.Left + p.Right) / 2);
            int dot = p.Text.IndexOfAny(['.', ',']);
            Decimals.Add(dot < 0 || p.Text.Length == 0 ? p.Right : p.Left + ((p.Right - p.Left) * dot / p.Text.Length));
        }
    }

    private static (List<Placed> Rows, int FirstBad) PlaceBy(List<FoundColumn> columns, IReadOnlyList<TextLine> lines, bool tight, out List<Edges> lastEdges)
    {
        var placed = new List<Placed>();
        lastEdges = [];
        int firstBad = lines.Count;
        bool moved = true;
        for (int pass = 0; pass < 3; pass++)
        {
            // A line's placement depends only on the columns' extents: when the second pass left them as it found
            // them, the third would repeat it exactly.
            if (pass == 2 && !moved) break;
            moved = false;
            placed.Clear();
            var edges = columns.Select(_ => new Edges()).ToList();
            lastEdges = edges;
            firstBad = lines.Count;
            for (int i = 0; i < lines.Count; i++)
            {
                // The first pass only learns where each column's values sit; later passes judge every line.
                var p = PlaceLine(columns, lines[i], tight, edges, lenient: pass == 0);
                if (p is null) { firstBad = i; break; }
                placed.Add(p);
            }
            for (int k = 0; k < columns.Count; k++)
            {
                var ls = edges[k].Lefts;
                var rs = edges[k].Rights;
                if (ls.Count == 0) continue;
                ls.Sort();
                rs.Sort();
                var data = (ls[ls.Count / 2], rs[rs.Count / 2]);
                if (columns[k].Data != data) moved = true;
                columns[k].Data = data;
            }
        }
        return (placed, firstBad);
    }

    /// <summary>Places one line, or returns null when it is not a row of the table.</summary>
    public static Placed? PlaceLine(List<FoundColumn> columns, TextLine line, bool tight,
        List<Edges>? edges = null, bool lenient = false)
    {
        var pieces = Pieces(columns, line, tight);
        if (pieces is null || pieces.Count == 0 || pieces.Count > columns.Count + 2) return null;
        double em = Math.Max(1, line.Size);
        int n = columns.Count, m = pieces.Count;

        // dp[i, k+1]: least cost with the first i pieces placed and the last used column k (−1: none, or the leading column).
        // Flat arrays (row i at i * (n + 1)); each piece's distance to each column is computed once.
        int width = n + 1, size = (m + 1) * width;
        Span<double> dp = size <= 256 ? stackalloc double[size] : new double[size];
        Span<int> fromK = size <= 256 ? stackalloc int[size] : new int[size];
        Span<int> fromChoice = size <= 256 ? stackalloc int[size] : new int[size]; // column index, −1 leading, −2 drop, −3 join previous
        Span<double> dist = m * n <= 256 ? stackalloc double[m * n] : new double[m * n];
        dp.Fill(double.PositiveInfinity);
        fromK.Clear();
        fromChoice.Clear();
        for (int i = 0; i < m; i++)
            for (int j = 0; j < n; j++)
                dist[(i * n) + j] = columns[j].Distance(pieces[i].Left, pieces[i].Right);
        dp[0] = 0;
        double leadLimit = Math.Min(columns[0].HeadLeft, columns[0].Data?.Left ?? double.MaxValue) - (0.3 * em);
        double dropCost = (lenient ? 5 * DropEm : DropEm) * em;
        for (int i = 0; i < m; i++)
        {
            var p = pieces[i];
            int row = i * width, next = row + width;
            for (int k = 0; k <= n; k++)
            {
                double c0 = dp[row + k];
                if (double.IsPositiveInfinity(c0)) continue;
                int last = k - 1;
                for (int j = last + 1; j < n; j++)
                {
                    double c = c0 + dist[(i * n) + j];
                    if (c < dp[next + j + 1]) { dp[next + j + 1] = c; fromK[next + j + 1] = k; fromChoice[next + j + 1] = j; }
                }
                if (i == 0 && p.Right < leadLimit)
                {
                    double c = c0 + (LeadingEm * em);
                    if (c < dp[width]) { dp[width] = c; fromK[width] = k; fromChoice[width] = -1; }
                }
                if (last >= 0 && i > 0)
                {
                    double gap = p.Left - pieces[i - 1].Right;
                    double c = c0 + Math.Max(0, gap) + (0.3 * em);
                    if (gap < 3 * em && c < dp[next + k]) { dp[next + k] = c; fromK[next + k] = k; fromChoice[next + k] = -3; }
                }
                {
                    double c = c0 + dropCost;
                    if (c < dp[next + k]) { dp[next + k] = c; fromK[next + k] = k; fromChoice[next + k] = -2; }
                }
            }
        }
        int bestK = 0, end = m * width;
        for (int k = 1; k <= n; k++) if (dp[end + k] < dp[end + bestK]) bestK = k;
        if (double.IsPositiveInfinity(dp[end + bestK])) return null;

        Span<int> choice = m <= 64 ? stackalloc int[m] : new int[m];
        int kk = bestK;
        for (int i = m; i > 0; i--)
        {
            int prevK = fromK[(i * width) + kk], ch = fromChoice[(i * width) + kk];
            choice[i - 1] = ch == -3 ? kk - 1 : ch;
            if (ch == -2) choice[i - 1] = -2;
            kk = prevK;
        }
        var cells = new string?[n];
        string? leading = null;
        double worst = 0;
        for (int i = 0; i < m; i++)
        {
            var p = pieces[i];
            int c = choice[i];
            if (c == -2)
            {
                if (lenient) continue;
                return null; // a piece that belongs to no column: not a row of this table
            }
            if (c == -1) { leading = p.Text; continue; }
            double d = dist[(i * n) + c] / em;
            worst = Math.Max(worst, d);
            if (d > MaxDistanceEm && !lenient) return null;
            // A value that reaches under two headers is prose or another table, not a cell.
            int under = 0;
            for (int j = 0; j < n; j++)
                if (Geometry.Overlap(p.Left, p.Right, columns[j].HeadLeft, columns[j].HeadRight) > 0.15 * em) under++;
            if (under > 1) return null;
            cells[c] = cells[c] is null ? p.Text : cells[c] + " " + p.Text;
            edges?[c].Add(p);
        }
        // Text left of the first column belongs to it unless the first column has a value of its own in this row.
        if (leading is not null && cells.Length > 0 && cells[0] is null) { cells[0] = leading; leading = null; }
        int filled = leading is null ? 0 : 1;
        foreach (var cell in cells) if (cell is not null) filled++;
        if (filled < Math.Min(2, n)) return null;
        return new Placed(cells, leading, worst);
    }

    /// <summary>
    /// The row's pieces: runs of words between wide gaps. In a tightly set table (header cells one space apart) a run
    /// that reaches over two columns is cut into words, each in the column it sits in; otherwise such a line is not a
    /// row (null).
    /// </summary>
    private static List<RowPiece>? Pieces(List<FoundColumn> columns, TextLine line, bool tight)
    {
        var pieces = new List<RowPiece>();
        double em = Math.Max(1, line.Size);
        foreach (var chunk in line.Chunks())
        {
            int zones = 0;
            foreach (var c in columns) if (Overlaps(c, chunk.Left, chunk.Right, em)) zones++;
            if (zones <= 1 || chunk.Words.Count == 1)
            {
                pieces.Add(new RowPiece(chunk.Left, chunk.Right, chunk.Text, line.Size));
                continue;
            }
            // Where the header's cells stand apart, so do a row's: a run of words across two columns is prose.
            if (!tight) return null;
            // Cut into words, keeping together the words that share one column.
            var groups = new List<(int Column, List<TextWord> Words)>();
            foreach (var w in chunk.Words)
            {
                var under = columns.Select((c, i) => (c, i)).Where(t => Overlaps(t.c, w.Left, w.Right, em)).ToList();
                if (under.Count > 1) return null;
                int col = under.Count == 1 ? under[0].i : groups.Count > 0 ? groups[^1].Column : -1;
                if (col < 0) return null;
                if (groups.Count > 0 && groups[^1].Column == col) groups[^1].Words.Add(w);
                else groups.Add((col, [w]));
            }
            foreach (var (_, words) in groups)
                pieces.Add(new RowPiece(words[0].Left, words[^1].Right, string.Join(" ", words.Select(w => w.Text)), line.Size));
        }
        return pieces;
    }

    private static bool Overlaps(FoundColumn c, double l, double r, double em)
    {
        double tol = 0.1 * em;
        if (Geometry.Overlap(l, r, c.HeadLeft, c.HeadRight) > tol) return true;
        return c.Data is var (dl, dr) && Geometry.Overlap(l, r, dl, dr) > tol;
    }
}
