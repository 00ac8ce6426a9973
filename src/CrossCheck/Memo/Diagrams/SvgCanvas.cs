using System.Globalization;
using System.Text;

namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// Builds one SVG document as text and keeps the extent of what was drawn, so that the view box fits the content.
/// Every text and attribute value goes through <see cref="Escape"/>: ids and titles from a submission are never
/// written as markup.
/// </summary>
internal sealed class SvgCanvas
{
    private readonly StringBuilder _body = new();
    private Box _bounds = Box.Empty;

    public Box Bounds => _bounds;

    /// <summary>Escapes text for XML/HTML content and attribute values.</summary>
    public static string Escape(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (!NeedsEscape(text)) return text;
        var sb = new StringBuilder(text.Length + 8);
        foreach (char c in text)
        {
            switch (c)
            {
                case '&': sb.Append("&amp;"); break;
                case '<': sb.Append("&lt;"); break;
                case '>': sb.Append("&gt;"); break;
                case '"': sb.Append("&quot;"); break;
                case '\'': sb.Append("&#39;"); break;
                default:
                    // Control characters are not allowed in XML 1.0; they carry nothing a drawing needs.
                    if (c < ' ' && c != '\t' && c != '\n' && c != '\r') sb.Append('\uFFFD');
                    else sb.Append(c);
                    break;
            }
        }
        return sb.ToString();
    }

    /// <summary>Most of a drawing's text (numbers, colours, class names) has nothing to escape.</summary>
    private static bool NeedsEscape(string text)
    {
        foreach (char c in text)
            if (c is '&' or '<' or '>' or '"' or '\'' || (c < ' ' && c != '\t' && c != '\n' && c != '\r')) return true;
        return false;
    }

    /// <summary>A coordinate with at most two decimals, invariant culture, no "-0".</summary>
    public static string N(double v)
    {
        double r = Math.Round(v, 2);
        if (r == 0) return "0";
        // The shortest round-trip text of a value rounded to hundredths has at most two decimals: the same text as the
        // format "0.##", at a fraction of its cost (a drawing writes thousands of coordinates).
        if (Math.Abs(r) < 1e14) return r.ToString(CultureInfo.InvariantCulture);
        return r.ToString("0.##", CultureInfo.InvariantCulture);
    }

    public void Extend(Pt p) => _bounds = _bounds.Include(p);

    public void Extend(Box b) => _bounds = _bounds.Include(b);

    public void Open(string tag, params (string Name, string? Value)[] attrs)
    {
        _body.Append('<').Append(tag);
        AppendAttrs(attrs);
        _body.Append('>');
    }

    public void Close(string tag) => _body.Append("</").Append(tag).Append('>');

    public void Group(string? cssClass, string? label = null)
    {
        Open("g", ("class", cssClass), ("data-label", label));
    }

    public void EndGroup() => Close("g");

    public void Line(Pt a, Pt b, string stroke, double width, string? dash = null, string? cssClass = null)
    {
        Element("line", ("class", cssClass), ("x1", N(a.X)), ("y1", N(a.Y)), ("x2", N(b.X)), ("y2", N(b.Y)), ("stroke", stroke),
            ("stroke-width", N(width)), ("stroke-dasharray", dash), ("stroke-linecap", "round"));
        Extend(a);
        Extend(b);
    }

    /// <summary>A path through <paramref name="points"/>; closed when <paramref name="close"/>.</summary>
    public void Path(IReadOnlyList<Pt> points, bool close, string? fill, string? stroke, double width, string? dash = null,
        string? cssClass = null, params (string Name, string? Value)[] extra)
    {
        if (points.Count == 0) return;
        var d = new StringBuilder();
        for (int i = 0; i < points.Count; i++)
        {
            d.Append(i == 0 ? 'M' : 'L').Append(N(points[i].X)).Append(' ').Append(N(points[i].Y));
            if (i + 1 < points.Count) d.Append(' ');
            Extend(points[i]);
        }
        if (close) d.Append(" Z");
        var attrs = new List<(string, string?)>
        {
            ("class", cssClass), ("d", d.ToString()), ("fill", fill ?? "none"), ("stroke", stroke ?? "none"), ("stroke-width", N(width)),
            ("stroke-dasharray", dash), ("stroke-linejoin", "round"), ("stroke-linecap", "round"),
        };
        attrs.AddRange(extra);
        Element("path", [.. attrs]);
    }

    public void Circle(Pt c, double r, string fill, string? stroke, double width, string? dash = null, string? cssClass = null)
    {
        Element("circle", ("class", cssClass), ("cx", N(c.X)), ("cy", N(c.Y)), ("r", N(r)), ("fill", fill), ("stroke", stroke ?? "none"),
            ("stroke-width", N(width)), ("stroke-dasharray", dash));
        Extend(Box.Around(c, 2 * r, 2 * r));
    }

    public void Rect(Box b, string fill, string? stroke, double width, double radius = 0, string? cssClass = null)
    {
        Element("rect", ("class", cssClass), ("x", N(b.MinX)), ("y", N(b.MinY)), ("width", N(b.Width)), ("height", N(b.Height)),
            ("rx", radius > 0 ? N(radius) : null), ("fill", fill), ("stroke", stroke ?? "none"), ("stroke-width", N(width)));
        Extend(b);
    }

    /// <summary>
    /// Text centred on <paramref name="centre"/>, with a white halo so that it stays legible over lines.
    /// Returns the box it occupies (estimated from the character count).
    /// </summary>
    public Box Text(Pt centre, string text, double size, string fill, bool bold = false, bool italic = false, string? cssClass = null,
        bool halo = true, string anchor = "middle")
    {
        double w = DiagramStyle.TextWidth(text, size, bold);
        var box = anchor switch
        {
            "start" => new Box(centre.X, centre.Y - (size * 0.6), centre.X + w, centre.Y + (size * 0.6)),
            "end" => new Box(centre.X - w, centre.Y - (size * 0.6), centre.X, centre.Y + (size * 0.6)),
            _ => Box.Around(centre, w, size * 1.2),
        };
        Open("text", [("class", cssClass), ("x", N(centre.X)), ("y", N(centre.Y)), ("font-size", N(size)), ("fill", fill),
            ("text-anchor", anchor), ("dominant-baseline", "central"), ("font-weight", bold ? "700" : null), ("font-style", italic ? "italic" : null),
            ("stroke", halo ? DiagramStyle.Paper : null), ("stroke-width", halo ? "3" : null), ("stroke-linejoin", halo ? "round" : null), ("paint-order", halo ? "stroke" : null)]);
        _body.Append(Escape(text));
        Close("text");
        Extend(box);
        return box;
    }

    /// <summary>An arrow from <paramref name="tail"/> to <paramref name="tip"/> with a filled head.</summary>
    public void Arrow(Pt tail, Pt tip, string colour, double width, double head = 6.5, string? cssClass = null)
    {
        var dir = (tip - tail).Unit;
        var baseP = tip - (dir * head);
        var side = dir.TurnClockwise * (head * 0.42);
        Line(tail, baseP + (dir * 0.5), colour, width, cssClass: cssClass);
        Path([tip, baseP + side, baseP - side], close: true, colour, colour, 0.6, cssClass: cssClass);
    }

    private void Element(string tag, params (string Name, string? Value)[] attrs)
    {
        _body.Append('<').Append(tag);
        AppendAttrs(attrs);
        _body.Append("/>");
    }

    private void AppendAttrs((string Name, string? Value)[] attrs)
    {
        foreach (var (name, value) in attrs)
            if (value is not null) _body.Append(' ').Append(name).Append("=\"").Append(Escape(value)).Append('"');
    }

    /// <summary>The finished document: a view box around everything drawn plus <paramref name="margin"/> px.</summary>
    /// <param name="cssClass">Class of the svg element (e.g. <c>cc-figure cc-moments</c>).</param>
    /// <param name="title">Accessible title (escaped here).</param>
    /// <param name="minWidth">The view box is widened (centred) to at least this width, so small drawings do not blow up.</param>
    public string Render(string cssClass, string title, double margin = 10, double minWidth = 0)
    {
        var b = _bounds.IsEmpty ? new Box(0, 0, 10, 10) : _bounds.Grow(margin);
        if (b.Width < minWidth)
        {
            double extra = (minWidth - b.Width) / 2;
            b = new Box(b.MinX - extra, b.MinY, b.MaxX + extra, b.MaxY);
        }
        var sb = new StringBuilder(_body.Length + 400);
        sb.Append("<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"").Append(Escape(cssClass)).Append("\" viewBox=\"")
            .Append(N(b.MinX)).Append(' ').Append(N(b.MinY)).Append(' ').Append(N(b.Width)).Append(' ').Append(N(b.Height))
            .Append("\" width=\"").Append(N(b.Width)).Append("\" height=\"").Append(N(b.Height))
            .Append("\" role=\"img\" font-family=\"").Append(Escape(DiagramStyle.Font)).Append("\">")
            .Append("<title>").Append(Escape(title)).Append("</title>")
            .Append(_body)
            .Append("</svg>");
        return sb.ToString();
    }
}
