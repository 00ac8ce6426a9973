using System.Text;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// Sub- and superscripts: which letters of a line are set as scripts, and how they are written into its words
/// (a subscript after an underscore, <c>M_AB</c>; a superscript as a superscript character, <c>mm⁴</c>, <c>10⁶</c>).
/// </summary>
internal static class Scripts
{
    /// <summary>
    /// Marks sub- and superscripts: a letter smaller than the letter it follows (touching it), set below or above that
    /// letter's baseline. Judged letter by letter, so that a header of many subscripts (<c>M_AB</c>, <c>M_BA</c>, ...)
    /// is read as well as a single <c>mm⁴</c>.
    /// </summary>
    public static void Mark(List<Glyph> glyphs)
    {
        var sorted = Glyph.StableSorted(glyphs, static (a, b) => a.X0.CompareTo(b.X0));
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

    /// <summary>The words of a line: letters joined left to right, cut at gaps, with their scripts written in.</summary>
    public static List<TextWord> Words(List<Glyph> glyphs, double lineSize)
    {
        var sorted = Glyph.StableSorted(glyphs, static (a, b) =>
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
}
