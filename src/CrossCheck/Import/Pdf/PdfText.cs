using System.Text;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// A word as printed: its text (sub- and superscripts folded in, see <see cref="PdfTextReader"/>), its horizontal
/// extent in points and the font size of its main letters.
/// </summary>
internal sealed record TextWord(string Text, double Left, double Right, double Size);

/// <summary>
/// One line of text on a page: the words that share a baseline (sub- and superscripts included), left to right.
/// <see cref="Number"/> counts the text lines of the page from the top, starting at 1; it is the "line" of a
/// citation such as <c>calc.pdf p.3 line 14</c>.
/// </summary>
internal sealed class TextLine
{
    public TextLine(int page, int number, IReadOnlyList<TextWord> words, double baseline, double size, double? spaceWidth = null)
    {
        SpaceWidth = spaceWidth;
        Page = page;
        Number = number;
        Words = words;
        Baseline = baseline;
        Size = size;
        Text = string.Join(" ", words.Select(w => w.Text));
    }

    public int Page { get; }
    public int Number { get; }
    public IReadOnlyList<TextWord> Words { get; }

    /// <summary>Baseline of the main letters, points from the bottom of the page.</summary>
    public double Baseline { get; }

    /// <summary>Font size of the main letters (points).</summary>
    public double Size { get; }

    /// <summary>Width of a space in the line's font, when the PDF sets spaces as letters (a monospace space is 0.6 em).</summary>
    public double? SpaceWidth { get; }

    /// <summary>The words joined by single spaces.</summary>
    public string Text { get; }

    public double Left => Words[0].Left;
    public double Right => Words[^1].Right;

    /// <summary>
    /// The line cut where the space between two words is wider than <paramref name="gapEm"/> times the font size
    /// (and clearly wider than one of the font's spaces): the pieces a table's column gaps leave (a header such as
    /// <c>L [m]</c> stays one piece).
    /// </summary>
    public IReadOnlyList<Chunk> Chunks(double gapEm = Chunk.DefaultGapEm)
    {
        if (gapEm == Chunk.DefaultGapEm && _chunks is not null) return _chunks;
        var chunks = new List<Chunk>();
        var current = new List<TextWord> { Words[0] };
        double space = 1.6 * (SpaceWidth ?? 0);
        for (int i = 1; i < Words.Count; i++)
        {
            double size = Math.Max(Words[i - 1].Size, Words[i].Size);
            if (Words[i].Left - Words[i - 1].Right > Math.Max(gapEm * size, space))
            {
                chunks.Add(new Chunk(current));
                current = [];
            }
            current.Add(Words[i]);
        }
        chunks.Add(new Chunk(current));
        if (gapEm == Chunk.DefaultGapEm) _chunks = chunks;
        return chunks;
    }

    private IReadOnlyList<Chunk>? _chunks;

    public override string ToString() => $"p{Page}:{Number}: {Text}";
}

/// <summary>Consecutive words of a line with no wide gap between them: a table cell, or a run of prose.</summary>
internal sealed class Chunk(IReadOnlyList<TextWord> words)
{
    /// <summary>Gap (in font sizes) wider than an ordinary word space: an inter-word space is 0.25–0.35 em.</summary>
    public const double DefaultGapEm = 0.6;

    public IReadOnlyList<TextWord> Words { get; } = words;
    public double Left { get; } = words[0].Left;
    public double Right { get; } = words[^1].Right;
    public string Text { get; } = string.Join(" ", words.Select(w => w.Text));
}

/// <summary>The text of one page, as lines from the top.</summary>
internal sealed record TextPage(int Number, double Width, double Height, IReadOnlyList<TextLine> Lines, int Images)
{
    /// <summary>The images drawn on a page that has text (left, bottom, right, top in points), to be named as not read.</summary>
    public IReadOnlyList<(double Left, double Bottom, double Right, double Top)> ImageBoxes { get; init; } = [];
}

/// <summary>The text of a PDF.</summary>
internal sealed record TextDocument(string File, IReadOnlyList<TextPage> Pages)
{
    /// <summary>The table a page is named after (a workbook's sheet named <c>Loads</c>): its first header row may use words the format does not know.</summary>
    public IReadOnlyDictionary<int, TableSpec>? PageTables { get; init; }

    public IEnumerable<TextLine> Lines => Pages.SelectMany(p => p.Lines);
}

/// <summary>Small helpers on intervals and text used by the PDF reader.</summary>
internal static class Geometry
{
    public static double Overlap(double l1, double r1, double l2, double r2) => Math.Min(r1, r2) - Math.Max(l1, l2);

    /// <summary>Horizontal distance between two intervals (0 when they touch or overlap).</summary>
    public static double Distance(double l1, double r1, double l2, double r2) => Math.Max(0, Math.Max(l1, l2) - Math.Min(r1, r2));

    public static string Collapse(string s)
    {
        var sb = new StringBuilder(s.Length);
        bool space = false;
        foreach (char c in s.Trim())
        {
            if (char.IsWhiteSpace(c)) { space = true; continue; }
            if (space && sb.Length > 0) sb.Append(' ');
            space = false;
            sb.Append(c);
        }
        return sb.ToString();
    }
}
