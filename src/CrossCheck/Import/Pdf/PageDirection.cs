using UglyToad.PdfPig.Content;
using UglyToad.PdfPig.Core;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// The direction a page is read in: the direction most of its text runs, so that a wide table set sideways on a
/// portrait page (text running up or down) is read as if the page were turned.
/// </summary>
internal static class PageDirection
{
    /// <summary>
    /// The direction most of the page's visible letters run (on a tie, the direction met first); horizontal when none.
    /// </summary>
    public static TextOrientation Main(IReadOnlyList<Letter> letters)
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

    /// <summary>Coordinates in the page turned so that text running in <paramref name="direction"/> reads left to right, bottom up.</summary>
    public static Func<double, double, (double X, double Y)> Turn(TextOrientation direction, double width, double height) => direction switch
    {
        TextOrientation.Rotate270 => (x, y) => (y, width - x),  // text running up the page
        TextOrientation.Rotate90 => (x, y) => (height - y, x),  // text running down the page
        TextOrientation.Rotate180 => (x, y) => (width - x, height - y),
        _ => (x, y) => (x, y),
    };

    /// <summary>Whether the page is read turned a quarter (its width and height exchange).</summary>
    public static bool IsSideways(TextOrientation direction) => direction is TextOrientation.Rotate90 or TextOrientation.Rotate270;
}
