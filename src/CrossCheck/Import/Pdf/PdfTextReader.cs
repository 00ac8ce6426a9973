using System.Diagnostics;
using System.Text;
using CrossCheck.Model;
using UglyToad.PdfPig;
using UglyToad.PdfPig.Content;
using UglyToad.PdfPig.Core;
using UglyToad.PdfPig.Exceptions;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// Reads the text of a PDF (PdfPig) as lines of words with positions, within <see cref="PdfLimits"/>.
/// Letters become lines by their vertical extent, so a subscript (<c>M</c> with <c>AB</c> below) or a superscript
/// (<c>mm</c> with <c>4</c> above) stays on its line: a superscript is written as a superscript character
/// (<c>mm⁴</c>, <c>10⁶</c>) and a subscript after an underscore (<c>M_AB</c>). Invisible text (an OCR layer) and
/// rotated text are not read. Problems (encrypted, damaged, scanned, over a limit) are reported, never thrown.
/// </summary>
internal static class PdfTextReader
{
    public static TextDocument? Read(string path, string display, PdfLimits limits, List<InputProblem> problems)
    {
        PreloadFontMetrics();
        var whole = new SourceRef(display);
        var info = new FileInfo(path);
        if (info.Length == 0) { problems.Add(new InputProblem(whole, Messages.PdfEmptyFile)); return null; }
        if (info.Length > limits.MaxFileBytes) { problems.Add(new InputProblem(whole, Messages.PdfTooLarge(info.Length, limits.MaxFileBytes))); return null; }
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (IOException ex)
        {
            problems.Add(new InputProblem(whole, Messages.PdfDamaged(ex.Message)));
            return null;
        }
        if (!StartsLikePdf(bytes)) { problems.Add(new InputProblem(whole, Messages.PdfNotPdf)); return null; }
        if (PdfCost.Nesting(bytes, limits.MaxNesting) > limits.MaxNesting) { problems.Add(new InputProblem(whole, Messages.PdfNestedTooDeep(limits.MaxNesting))); return null; }

        var progress = new Progress();
        using var cts = new CancellationTokenSource();
        var task = Task.Run(() => Extract(bytes, display, limits, progress, cts.Token), CancellationToken.None);
        // The reader checks the budget between pages; the wait is the backstop for a page that never finishes.
        if (!task.Wait(limits.TimeBudget + TimeSpan.FromSeconds(1)))
        {
            cts.Cancel();
            problems.Add(new InputProblem(whole, Messages.PdfTimeBudget(limits.TimeBudget.TotalSeconds, Math.Max(1, progress.Page), progress.Pages)));
            return null;
        }
        var (doc, found) = task.Result;
        problems.AddRange(found);
        return doc;
    }

    private static int _fontMetricsStarted;

    /// <summary>
    /// The PDF library parses the metrics of all standard 14 fonts (text files, tens of milliseconds) the first time a
    /// document is opened in the process, whether the document uses them or not. Started here on another core, that
    /// work overlaps reading the file and its cross-reference table; opening the document waits for it as before.
    /// </summary>
    private static void PreloadFontMetrics()
    {
        if (Interlocked.Exchange(ref _fontMetricsStarted, 1) != 0) return;
        _ = Task.Run(static () =>
        {
            try
            {
                _ = UglyToad.PdfPig.Fonts.Standard14Fonts.Standard14.IsFontInStandard14("Helvetica");
            }
#pragma warning disable CA1031 // A failure here recurs, and is reported, when the document is opened.
            catch (Exception)
#pragma warning restore CA1031
            {
            }
        });
    }

    private sealed class Progress
    {
        public volatile int Page;
        public volatile int Pages;
    }

    private static bool StartsLikePdf(byte[] bytes)
    {
        // The header may follow a little junk (the specification allows it within the first 1024 bytes).
        int n = Math.Min(bytes.Length, 1024);
        var head = Encoding.ASCII.GetString(bytes, 0, n);
        return head.Contains("%PDF-", StringComparison.Ordinal);
    }

    private static (TextDocument? Doc, List<InputProblem> Problems) Extract(byte[] bytes, string display, PdfLimits limits, Progress progress, CancellationToken token)
    {
        var problems = new List<InputProblem>();
        var whole = new SourceRef(display);
        var clock = Stopwatch.StartNew();
        var budget = new DecodeBudget(limits, token);
        try
        {
            using var pdf = PdfDocument.Open(bytes, new ParsingOptions
            {
                UseLenientParsing = true, SkipMissingFonts = true, ClipPaths = false,
                FilterProvider = new GuardedFilterProvider(budget), MaxStackDepth = limits.MaxNesting,
            });
            int n = pdf.NumberOfPages;
            progress.Pages = n;
            if (budget.Refusal is { } early) { problems.Add(new InputProblem(whole, early)); return (null, problems); }
            if (n == 0) { problems.Add(new InputProblem(whole, Messages.PdfNoPages)); return (null, problems); }
            if (n > limits.MaxPages) { problems.Add(new InputProblem(whole, Messages.PdfTooManyPages(n, limits.MaxPages))); return (null, problems); }
            var tree = PdfCost.Pages(pdf, n);
            var pages = new List<TextPage>();
            int imagePages = 0, textPages = 0, invisiblePages = 0;
            // The library reads page i on this thread while page i - 1's letters become lines on another core.
            (Page Page, Task<(List<TextLine> Lines, int Invisible, int Rotated, bool Sideways)> Lines)? pending = null;
            void Finish((Page Page, Task<(List<TextLine> Lines, int Invisible, int Rotated, bool Sideways)> Lines) p)
            {
                var page = p.Page;
                int i = page.Number;
                var (lines, invisible, rotated, sideways) = p.Lines.GetAwaiter().GetResult();
                var pageRef = new SourceRef(display, null, null, null, i);
                int images = lines.Count == 0 ? SafeImageCount(page) : 0;
                int visible = lines.Sum(l => l.Text.Count(c => !char.IsWhiteSpace(c)));
                // A page whose text is mostly invisible is an OCR layer over a scan, even with a printed page number.
                if (invisible > 0 && invisible > 4 * visible) { invisiblePages++; problems.Add(new InputProblem(pageRef, Messages.PdfPageInvisibleText, ProblemSeverity.Warning)); }
                else if (lines.Count > 0) textPages++;
                else if (images > 0) { imagePages++; problems.Add(new InputProblem(pageRef, Messages.PdfPageImageOnly, ProblemSeverity.Warning)); }
                if (rotated > 0 && lines.Count > 0) problems.Add(new InputProblem(pageRef, Messages.PdfRotatedText(rotated), ProblemSeverity.Warning));
                pages.Add(sideways ? new TextPage(i, page.Height, page.Width, lines, images) : new TextPage(i, page.Width, page.Height, lines, images));
            }
            for (int i = 1; i <= n; i++)
            {
                progress.Page = i;
                if (token.IsCancellationRequested) return (null, problems);
                if (clock.Elapsed > limits.TimeBudget)
                {
                    problems.Add(new InputProblem(whole, Messages.PdfTimeBudget(limits.TimeBudget.TotalSeconds, i, n)));
                    return (null, problems);
                }
                var pageRef = new SourceRef(display, null, null, null, i);
                if (tree.Count == n)
                {
                    // What the page would make the parser build, forms counted as often as they are painted: refused before it is built.
                    var cost = PdfCost.OfPage(pdf, tree[i - 1].Page, tree[i - 1].Resources, 2L * limits.MaxLettersPerPage, limits.MaxOperationsPerPage);
                    if (cost.Letters > 2L * limits.MaxLettersPerPage || cost.Operations > limits.MaxOperationsPerPage)
                    {
                        problems.Add(new InputProblem(pageRef, Messages.PdfPageTooCostly(cost.Letters, cost.Operations, limits.MaxLettersPerPage, limits.MaxOperationsPerPage)));
                        return (null, problems);
                    }
                }
                var page = pdf.GetPage(i);
                var letters = page.Letters;
                if (budget.Refusal is { } refused) { problems.Add(new InputProblem(whole, refused)); return (null, problems); }
                if (letters.Count > limits.MaxLettersPerPage)
                {
                    problems.Add(new InputProblem(pageRef, Messages.PdfTooManyLetters(letters.Count, limits.MaxLettersPerPage)));
                    return (null, problems);
                }
                double width = page.Width, height = page.Height;
                int number = i;
                var building = Task.Run(() => BuildLines(letters, number, width, height), CancellationToken.None);
                if (pending is { } previous) Finish(previous);
                pending = (page, building);
            }
            if (pending is { } last) Finish(last);
            if (textPages == 0)
            {
                problems.RemoveAll(p => p.Where.Page is not null && !p.IsError);
                problems.Add(new InputProblem(whole, invisiblePages > 0 ? Messages.PdfInvisibleOnly : imagePages > 0 ? Messages.PdfScanned(n) : Messages.PdfNoText));
                return (null, problems);
            }
            return (new TextDocument(display, pages), problems);
        }
        catch (PdfDocumentEncryptedException)
        {
            problems.Add(new InputProblem(whole, Messages.PdfEncrypted));
        }
        catch (PdfLimitException ex)
        {
            problems.Add(new InputProblem(whole, ex.Message));
        }
        catch (PdfDocumentStackDepthException)
        {
            problems.Add(new InputProblem(whole, Messages.PdfNestedTooDeep(limits.MaxNesting)));
        }
        catch (OperationCanceledException)
        {
            // Abandoned after the time budget; the caller has reported it.
        }
#pragma warning disable CA1031 // A parser fed a hostile file can fail in any way; every failure is an input error, not a crash.
        catch (Exception ex)
#pragma warning restore CA1031
        {
            if (budget.Refusal is { } refused)
                problems.Add(new InputProblem(whole, refused));
            else if (ex.Message.Contains("encrypt", StringComparison.OrdinalIgnoreCase) || ex.Message.Contains("password", StringComparison.OrdinalIgnoreCase))
                problems.Add(new InputProblem(whole, Messages.PdfEncrypted));
            else
                problems.Add(new InputProblem(whole, Messages.PdfDamaged(OneLine(ex.Message))));
        }
        return (null, problems);
    }

    private static int SafeImageCount(Page page)
    {
        try
        {
            return page.NumberOfImages;
        }
#pragma warning disable CA1031 // Counting images only decides the wording of a message.
        catch (Exception)
#pragma warning restore CA1031
        {
            return 0;
        }
    }

    private static string OneLine(string s)
    {
        s = Geometry.Collapse(s);
        return s.Length > 160 ? s[..160] + "…" : s;
    }

    // ---- letters → lines → words -------------------------------------------------------------------

    private enum Script { None, Super, Sub }

    private sealed class Glyph(string text, double x0, double x1, double baseline, double size)
    {
        public string Text { get; } = text;
        public double X0 { get; } = x0;
        public double X1 { get; } = x1;
        public double Base { get; } = baseline;
        public double Size { get; } = size;
        public double Bottom => Base - (0.25 * Size);
        public double Top => Base + (0.75 * Size);
        public double Centre => Base + (0.25 * Size);
        public bool IsSpace { get; } = text.All(char.IsWhiteSpace);
        public Script Script { get; set; }
    }

    private sealed class LineBuilder(Glyph first)
    {
        public List<Glyph> Glyphs { get; } = [first];
        public double Bottom { get; private set; } = first.Bottom;
        public double Top { get; private set; } = first.Top;
        private double _size = first.Size;

        public void Add(Glyph g)
        {
            Glyphs.Add(g);
            if (g.Size > 1.1 * _size) { _size = g.Size; Bottom = g.Bottom; Top = g.Top; }
        }
    }

    /// <summary>Groups the letters of a page into numbered lines of words.</summary>
    /// <summary>
    /// Groups the letters of a page into numbered lines of words. The page is read in the direction most of its text
    /// runs: a wide table set sideways on a portrait page (text running up or down) is read as if the page were turned;
    /// text in the other directions is counted and not read.
    /// </summary>
    private static (List<TextLine> Lines, int Invisible, int Rotated, bool Sideways) BuildLines(IReadOnlyList<Letter> letters, int pageNumber, double width, double height)
    {
        var glyphs = new List<Glyph>(letters.Count);
        int invisible = 0, rotated = 0;
        var direction = MainDirection(letters);
        // Coordinates in the page turned so that the text reads left to right, bottom up.
        Func<double, double, (double X, double Y)> turn = direction switch
        {
            TextOrientation.Rotate270 => (x, y) => (y, width - x),  // text running up the page
            TextOrientation.Rotate90 => (x, y) => (height - y, x),  // text running down the page
            TextOrientation.Rotate180 => (x, y) => (width - x, height - y),
            _ => (x, y) => (x, y),
        };
        foreach (var l in letters)
        {
            if (string.IsNullOrEmpty(l.Value)) continue;
            if (l.RenderingMode is TextRenderingMode.Neither or TextRenderingMode.NeitherClip) { if (!string.IsNullOrWhiteSpace(l.Value)) invisible++; continue; }
            if (l.TextOrientation != direction) { if (!string.IsNullOrWhiteSpace(l.Value)) rotated++; continue; }
            string text = CleanText(l.Value);
            if (text.Length == 0) continue;
            double size = l.PointSize > 0 && double.IsFinite(l.PointSize) ? l.PointSize : Math.Max(1, Math.Min(l.BoundingBox.Height, l.BoundingBox.Width));
            var (x0, y) = turn(l.StartBaseLine.X, l.StartBaseLine.Y);
            double x1 = turn(l.EndBaseLine.X, l.EndBaseLine.Y).X;
            if (!(x1 - x0 > 0.01)) x1 = x0 + Math.Max(l.Width, 0.01);
            if (!double.IsFinite(x0) || !double.IsFinite(x1) || !double.IsFinite(y)) continue;
            glyphs.Add(new Glyph(text, x0, x1, y, size));
        }
        bool sideways = direction is TextOrientation.Rotate90 or TextOrientation.Rotate270;
        if (glyphs.All(g => g.IsSpace)) return ([], invisible, rotated, sideways);

        glyphs.Sort((a, b) => b.Centre.CompareTo(a.Centre));
        var builders = new List<LineBuilder>();
        foreach (var g in glyphs)
        {
            LineBuilder? best = null;
            double bestOverlap = 0;
            for (int k = builders.Count - 1; k >= Math.Max(0, builders.Count - 4); k--)
            {
                var b = builders[k];
                double ov = Geometry.Overlap(g.Bottom, g.Top, b.Bottom, b.Top);
                if (ov >= 0.5 * Math.Min(g.Top - g.Bottom, b.Top - b.Bottom) && ov > bestOverlap) { best = b; bestOverlap = ov; }
            }
            if (best is null) builders.Add(new LineBuilder(g)); else best.Add(g);
        }

        Reattach(builders);
        var made = new List<(double Baseline, double Size, List<TextWord> Words, double? Space)>();
        var visible = new List<Glyph>();
        var normal = new List<Glyph>();
        var main = new List<double>();
        var spaces = new List<double>();
        foreach (var b in builders)
        {
            if (b.Glyphs.Count == 0) continue;
            visible.Clear();
            foreach (var g in b.Glyphs) if (!g.IsSpace) visible.Add(g);
            if (visible.Count == 0) continue;
            MarkScripts(visible);
            normal.Clear();
            foreach (var g in visible) if (g.Script == Script.None) normal.Add(g);
            double size = DominantSize(normal);
            main.Clear();
            foreach (var g in normal) if (g.Size >= 0.9 * size) main.Add(g.Base);
            main.Sort();
            double baseline = main[main.Count / 2];
            var words = Words(b.Glyphs, size);
            spaces.Clear();
            foreach (var g in b.Glyphs)
                if (g.IsSpace && g.Size >= 0.9 * size && g.X1 - g.X0 > 0.05 * size && g.X1 - g.X0 < 1.2 * size) spaces.Add(g.X1 - g.X0);
            spaces.Sort();
            double? space = spaces.Count == 0 ? null : spaces[spaces.Count / 2];
            if (words.Count > 0) made.Add((baseline, size, words, space));
        }
        made.Sort((a, b) => b.Baseline.CompareTo(a.Baseline));
        var lines = new List<TextLine>(made.Count);
        for (int i = 0; i < made.Count; i++)
        {
            var line = new TextLine(pageNumber, i + 1, made[i].Words, made[i].Baseline, made[i].Size, made[i].Space);
            _ = line.Chunks(); // cut here, on this core, rather than while the tables are looked for
            lines.Add(line);
        }
        return (lines, invisible, rotated, sideways);
    }

    /// <summary>
    /// Moves each small letter (a sub- or superscript) to the line of the full-size letter it touches. In a table
    /// whose header cells are centred vertically, the superscript of <c>mm⁴</c> on a units row can sit closer to the
    /// line above than to its own; what it touches decides.
    /// </summary>
    private static void Reattach(List<LineBuilder> builders)
    {
        var info = new List<(LineBuilder Builder, double Size)>(builders.Count);
        var visible = new List<Glyph>();
        foreach (var b in builders)
        {
            visible.Clear();
            foreach (var g in b.Glyphs) if (!g.IsSpace) visible.Add(g);
            info.Add((b, visible.Count == 0 ? 0 : DominantSize(visible)));
        }
        var moves = new List<(Glyph G, LineBuilder From, LineBuilder To)>();
        foreach (var (b, size) in info)
        {
            foreach (var g in b.Glyphs)
            {
                if (g.IsSpace || g.Size >= 0.9 * size) continue;
                LineBuilder? best = null;
                double bestGap = double.MaxValue;
                foreach (var (other, otherSize) in info)
                {
                    if (!(g.Size < 0.9 * otherSize) || Math.Abs(other.Top - g.Top) > 1.5 * otherSize) continue;
                    foreach (var h in other.Glyphs)
                    {
                        if (h.IsSpace || h.Size < 0.9 * otherSize) continue;
                        if (Math.Abs(h.Base - g.Base) > 0.6 * otherSize) continue;
                        double gap = Math.Min(Math.Abs(g.X0 - h.X1), Math.Abs(h.X0 - g.X1));
                        if (gap < bestGap) { bestGap = gap; best = other; }
                    }
                }
                if (best is not null && best != b && bestGap < 0.3 * g.Size) moves.Add((g, b, best));
            }
        }
        foreach (var (g, from, to) in moves)
        {
            from.Glyphs.Remove(g);
            to.Glyphs.Add(g);
        }
    }

    /// <summary>
    /// Marks sub- and superscripts: a letter smaller than the letter it follows (touching it), set below or above that
    /// letter's baseline. Judged letter by letter, so that a header of many subscripts (<c>M_AB</c>, <c>M_BA</c>, ...)
    /// is read as well as a single <c>mm⁴</c>.
    /// </summary>
    private static void MarkScripts(List<Glyph> glyphs)
    {
        var sorted = StableSorted(glyphs, static (a, b) => a.X0.CompareTo(b.X0));
        Glyph? basis = null, prev = null;
        foreach (var g in sorted)
        {
            // A script run goes on while its letters touch and keep the size and baseline of the run.
            if (prev is { Script: not Script.None } && basis is not null && g.X0 - prev.X1 < 0.3 * prev.Size
                && Math.Abs(g.Size - prev.Size) < 0.1 * prev.Size && Math.Abs(g.Base - prev.Base) < 0.1 * prev.Size)
            {
                g.Script = prev.Script;
                prev = g;
                continue;
            }
            if (basis is not null && prev is not null && g.X0 - prev.X1 < 0.3 * basis.Size && g.Size < 0.85 * basis.Size)
            {
                if (g.Base - basis.Base > 0.12 * basis.Size) { g.Script = Script.Super; prev = g; continue; }
                if (basis.Base - g.Base > 0.08 * basis.Size) { g.Script = Script.Sub; prev = g; continue; }
            }
            g.Script = Script.None;
            basis = g;
            prev = g;
        }
    }

    /// <summary>The font size most of the line's letters use.</summary>
    /// <remarks>Sizes are grouped by the half point; the largest group wins (on a tie, the larger sizes), and its largest size is returned.</remarks>
    private static double DominantSize(List<Glyph> glyphs)
    {
        if (glyphs.Count == 0) throw new InvalidOperationException("A line without letters has no size.");
        Span<(double Key, int Count, double Max)> small = stackalloc (double, int, double)[8];
        var groups = new List<(double Key, int Count, double Max)>();
        int n = 0;
        foreach (var g in glyphs)
        {
            double key = Math.Round(g.Size * 2) / 2;
            int at = -1;
            for (int i = 0; i < n; i++)
            {
                var k = i < small.Length ? small[i].Key : groups[i - small.Length].Key;
                if (k.Equals(key)) { at = i; break; }
            }
            if (at < 0)
            {
                if (n < small.Length) small[n] = (key, 1, g.Size); else groups.Add((key, 1, g.Size));
                n++;
                continue;
            }
            var e = at < small.Length ? small[at] : groups[at - small.Length];
            e = (e.Key, e.Count + 1, Math.Max(e.Max, g.Size));
            if (at < small.Length) small[at] = e; else groups[at - small.Length] = e;
        }
        var best = small[0];
        for (int i = 1; i < n; i++)
        {
            var e = i < small.Length ? small[i] : groups[i - small.Length];
            if (e.Count > best.Count || (e.Count == best.Count && e.Key.CompareTo(best.Key) > 0)) best = e;
        }
        return best.Max;
    }

    /// <summary>The glyphs sorted by <paramref name="compare"/>, glyphs that compare equal kept in their order (a stable sort).</summary>
    private static List<Glyph> StableSorted(List<Glyph> glyphs, Comparison<Glyph> compare)
    {
        var order = new int[glyphs.Count];
        for (int i = 0; i < order.Length; i++) order[i] = i;
        Array.Sort(order, (a, b) =>
        {
            int c = compare(glyphs[a], glyphs[b]);
            return c != 0 ? c : a.CompareTo(b);
        });
        var sorted = new List<Glyph>(order.Length);
        foreach (int i in order) sorted.Add(glyphs[i]);
        return sorted;
    }

    /// <summary>
    /// The direction most of the page's visible letters run (on a tie, the direction met first); horizontal when none.
    /// </summary>
    private static TextOrientation MainDirection(IReadOnlyList<Letter> letters)
    {
        var seen = new List<(TextOrientation Direction, int Count)>(4);
        foreach (var l in letters)
        {
            if (string.IsNullOrWhiteSpace(l.Value) || l.TextOrientation == TextOrientation.Other
                || l.RenderingMode is TextRenderingMode.Neither or TextRenderingMode.NeitherClip) continue;
            int at = -1;
            for (int i = 0; i < seen.Count; i++) if (seen[i].Direction == l.TextOrientation) { at = i; break; }
            if (at < 0) seen.Add((l.TextOrientation, 1));
            else seen[at] = (l.TextOrientation, seen[at].Count + 1);
        }
        if (seen.Count == 0) return TextOrientation.Horizontal;
        var best = seen[0];
        foreach (var e in seen) if (e.Count > best.Count) best = e;
        return best.Direction;
    }

    private static List<TextWord> Words(List<Glyph> glyphs, double lineSize)
    {
        var sorted = StableSorted(glyphs, static (a, b) =>
        {
            int c = a.X0.CompareTo(b.X0);
            return c != 0 ? c : b.Base.CompareTo(a.Base);
        });
        var words = new List<TextWord>();
        var sb = new StringBuilder();
        double left = 0, right = 0, wordSize = 0;
        Glyph? prev = null;
        Script prevScript = Script.None;
        void Flush()
        {
            if (sb.Length > 0) words.Add(new TextWord(sb.ToString(), left, right, wordSize));
            sb.Clear();
            prevScript = Script.None;
        }
        foreach (var g in sorted)
        {
            if (g.IsSpace) { Flush(); prev = null; continue; }
            if (prev is not null)
            {
                // The same letter printed twice, a hair apart (simulated bold): keep one.
                if (g.Text == prev.Text && Math.Abs(g.X0 - prev.X0) < 0.15 * g.Size && Math.Abs(g.Base - prev.Base) < 0.1 * g.Size) continue;
                double gap = g.X0 - prev.X1;
                if (gap > 0.15 * Math.Max(Math.Min(g.Size, prev.Size), 0.6 * lineSize)) Flush();
            }
            if (sb.Length == 0) { left = g.X0; wordSize = 0; }
            right = Math.Max(right, g.X1);
            if (sb.Length == 0) right = g.X1;
            if (g.Script == Script.None) wordSize = Math.Max(wordSize, g.Size);
            else if (wordSize == 0) wordSize = lineSize;
            switch (g.Script)
            {
                case Script.Sub:
                    if (prevScript != Script.Sub) sb.Append('_');
                    sb.Append(g.Text);
                    break;
                case Script.Super:
                    string sup = Superscript(g.Text);
                    if (sup.Length == 0 && prevScript != Script.Super) sb.Append('^');
                    sb.Append(sup.Length > 0 ? sup : g.Text);
                    break;
                default:
                    sb.Append(g.Text);
                    break;
            }
            prevScript = g.Script;
            prev = g;
        }
        Flush();
        return words;
    }

    private static string Superscript(string s)
    {
        var sb = new StringBuilder();
        foreach (char c in s)
        {
            char m = c switch
            {
                '0' => '⁰', '1' => '¹', '2' => '²', '3' => '³', '4' => '⁴', '5' => '⁵', '6' => '⁶', '7' => '⁷', '8' => '⁸', '9' => '⁹',
                '-' or '\u2212' or '\u2013' => '⁻', '+' => '⁺',
                _ => '\0',
            };
            if (m == '\0') return "";
            sb.Append(m);
        }
        return sb.ToString();
    }

    private static string CleanText(string value)
    {
        bool plain = true;
        foreach (char c in value)
        {
            if (c is (>= '\uFB00' and <= '\uFB04') or '\u00A0' or '\u2007' or '\u2009' or '\u202F' or '\t' or '\u00AD' or '\uFFFD' || char.IsControl(c))
            {
                plain = false;
                break;
            }
        }
        if (plain) return value;
        var sb = new StringBuilder(value.Length);
        foreach (char c in value)
        {
            switch (c)
            {
                case '\uFB00': sb.Append("ff"); break;
                case '\uFB01': sb.Append("fi"); break;
                case '\uFB02': sb.Append("fl"); break;
                case '\uFB03': sb.Append("ffi"); break;
                case '\uFB04': sb.Append("ffl"); break;
                case '\u00A0' or '\u2007' or '\u2009' or '\u202F' or '\t': sb.Append(' '); break;
                case '\u00AD': break; // soft hyphen
                default:
                    if (!char.IsControl(c) && c != '\uFFFD') sb.Append(c);
                    break;
            }
        }
        return sb.ToString();
    }
}
