namespace CrossCheck.Import.Pdf;

/// <summary>Whether a letter is set as a superscript or a subscript of the letter before it.</summary>
internal enum Script { None, Super, Sub }

/// <summary>A letter of a page, in the page's reading direction: its text, extent along the line, baseline and size (points).</summary>
internal sealed class Glyph(string text, double x0, double x1, double baseline, double size)
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

    /// <summary>The glyphs sorted by <paramref name="compare"/>, glyphs that compare equal kept in their order (a stable sort).</summary>
    public static List<Glyph> StableSorted(List<Glyph> glyphs, Comparison<Glyph> compare)
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
}
