using System.Text;
using UglyToad.PdfPig.Content;
using UglyToad.PdfPig.Core;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// Letters into lines: the letters of a page become numbered lines of words by their vertical extent, small letters
/// (sub- and superscripts) joining the line of the full-size letter they touch. Lines are numbered from the top of
/// the page; that number is the "line" of every citation.
/// </summary>
internal static class PageLines
{
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

    /// <summary>
    /// Groups the letters of a page into numbered lines of words. The page is read in the direction most of its text
    /// runs: a wide table set sideways on a portrait page (text running up or down) is read as if the page were turned;
    /// text in the other directions is counted and not read.
    /// </summary>
    /// <summary>
    /// A letter placed far off the page: drawn, but no one sees it. The page is taken as a square of its longer side with half a
    /// side around it, so that a page turned by its /Rotate entry (whose letters keep the unturned coordinates) or a document whose
    /// boxes are set loosely loses nothing a person sees.
    /// </summary>
    private static bool OffPage(Letter l, double width, double height)
    {
        var box = l.BoundingBox;
        double side = Math.Max(width, height), margin = Math.Max(2, side / 2);
        return side > 0 && (box.Right < -margin || box.Left > side + margin || box.Top < -margin || box.Bottom > side + margin);
    }

    /// <summary>A letter filled in white (or nearly): unseen on a white page.</summary>
    private static bool White(Letter l)
    {
        if (l.RenderingMode is not (TextRenderingMode.Fill or TextRenderingMode.FillClip)) return false;
        try
        {
            var (r, g, b) = l.FillColor.ToRGBValues();
            return r >= 0.97 && g >= 0.97 && b >= 0.97;
        }
#pragma warning disable CA1031 // A colour the library cannot convert is taken as visible.
        catch (Exception)
#pragma warning restore CA1031
        {
            return false;
        }
    }

    public static (List<TextLine> Lines, int Invisible, int Rotated, bool Sideways) Build(IReadOnlyList<Letter> letters, int pageNumber, double width, double height)
    {
        var glyphs = new List<Glyph>(letters.Count);
        int invisible = 0, rotated = 0;
        // White letters on a page whose every letter is white: the page looks blank (white on a dark fill is kept elsewhere).
        bool whiteOnly = false;
        foreach (var l in letters)
        {
            if (string.IsNullOrWhiteSpace(l.Value) || l.RenderingMode is TextRenderingMode.Neither or TextRenderingMode.NeitherClip || OffPage(l, width, height)) continue;
            if (!White(l)) { whiteOnly = false; break; }
            whiteOnly = true;
        }
        var direction = PageDirection.Main(letters);
        // Coordinates in the page turned so that the text reads left to right, bottom up.
        var turn = PageDirection.Turn(direction, width, height);
        foreach (var l in letters)
        {
            if (string.IsNullOrEmpty(l.Value)) continue;
            if (l.RenderingMode is TextRenderingMode.Neither or TextRenderingMode.NeitherClip || OffPage(l, width, height) || (whiteOnly && White(l)))
            {
                if (!string.IsNullOrWhiteSpace(l.Value)) invisible++;
                continue;
            }
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
        bool sideways = PageDirection.IsSideways(direction);
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
            Scripts.Mark(visible);
            normal.Clear();
            foreach (var g in visible) if (g.Script == Script.None) normal.Add(g);
            double size = DominantSize(normal);
            main.Clear();
            foreach (var g in normal) if (g.Size >= 0.9 * size) main.Add(g.Base);
            main.Sort();
            double baseline = main[main.Count / 2];
            var words = Scripts.Words(b.Glyphs, size);
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
