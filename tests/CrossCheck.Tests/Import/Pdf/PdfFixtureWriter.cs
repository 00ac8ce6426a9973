using System.Text;
using UglyToad.PdfPig.Content;
using UglyToad.PdfPig.Core;
using UglyToad.PdfPig.Fonts.Standard14Fonts;
using UglyToad.PdfPig.Writer;

namespace CrossCheck.Tests.Import.Pdf;

/// <summary>The typefaces the fixture writer can set text in.</summary>
public enum Face
{
    Helvetica,
    Times,
    Courier,
    /// <summary>DejaVu Sans, embedded as a TrueType font (Debian's fonts-dejavu-core): the real-world glyphs − · ⁴ ×.</summary>
    DejaVuSans,
}

public enum Align
{
    Left,
    Centre,
    Right,
}

/// <summary>A table for the fixture writer: header cells, rows, and how to set them.</summary>
/// <param name="Header">Header cells; <c>_{..}</c> and <c>^{..}</c> set a subscript or superscript (<c>M_{AB}</c>, <c>mm^{4}</c>).</param>
/// <param name="Rows">Cell texts.</param>
public sealed record FixtureTable(IReadOnlyList<string> Header, IReadOnlyList<IReadOnlyList<string>> Rows)
{
    /// <summary>A units row printed under the header, one cell per column (empty for none).</summary>
    public IReadOnlyList<string>? Units { get; init; }

    /// <summary>Columns whose cells are set flush right (numbers).</summary>
    public IReadOnlyList<bool>? RightAligned { get; init; }

    public Align HeaderAlign { get; init; } = Align.Left;

    /// <summary>Print the header again at the top of a page the table continues on.</summary>
    public bool RepeatHeader { get; init; } = true;

    /// <summary>Space between columns, in font sizes.</summary>
    public double GapEm { get; init; } = 1.5;

    /// <summary>Every column this wide (in font sizes) instead of fitting its text: a table stretched across the page.</summary>
    public double? ColumnWidthEm { get; init; }

    /// <summary>Labels printed on a line of their own before a row (<c>Load case DL</c>), by row index.</summary>
    public IReadOnlyDictionary<int, string>? Labels { get; init; }

    /// <summary>A line printed just above the header (a caption or a group header).</summary>
    public string? Caption { get; init; }

    /// <summary>Lines printed just below the table (notes).</summary>
    public IReadOnlyList<string>? Notes { get; init; }

    /// <summary>Start a new page before this row (a page break inside the table).</summary>
    public int? BreakBeforeRow { get; init; }
}

/// <summary>
/// Writes PDF fixtures with PdfPig's <see cref="PdfDocumentBuilder"/>: lines of text, wrapped paragraphs and tables,
/// page by page with a running header and page numbers, in a standard or an embedded TrueType font. The standard
/// fonts cannot set − × or superscript digits: those are written as <c>-</c>, <c>x</c> and raised small digits.
/// </summary>
public sealed class PdfFixtureWriter
{
    private const double Margin = 56;
    private readonly PdfDocumentBuilder _builder = new();
    private readonly PdfDocumentBuilder.AddedFont _font;
    private readonly PdfDocumentBuilder.AddedFont _bold;
    private readonly bool _standard;
    private readonly double _size;
    private readonly PageSize _pageSize;
    private readonly bool _portrait;
    private readonly string? _running;
    private PdfPageBuilder? _page;
    private double _y;
    private int _pages;

    public PdfFixtureWriter(Face face = Face.Helvetica, double size = 9, bool landscape = false, string? runningHeader = null, PageSize pageSize = PageSize.A4)
    {
        _size = size;
        _pageSize = pageSize;
        _portrait = !landscape;
        _running = runningHeader;
        switch (face)
        {
            case Face.DejaVuSans:
                _font = _builder.AddTrueTypeFont(File.ReadAllBytes(FontFile("DejaVuSans.ttf")));
                _bold = _builder.AddTrueTypeFont(File.ReadAllBytes(FontFile("DejaVuSans-Bold.ttf")));
                break;
            case Face.Times:
                _font = _builder.AddStandard14Font(Standard14Font.TimesRoman);
                _bold = _builder.AddStandard14Font(Standard14Font.TimesBold);
                _standard = true;
                break;
            case Face.Courier:
                _font = _builder.AddStandard14Font(Standard14Font.Courier);
                _bold = _builder.AddStandard14Font(Standard14Font.CourierBold);
                _standard = true;
                break;
            default:
                _font = _builder.AddStandard14Font(Standard14Font.Helvetica);
                _bold = _builder.AddStandard14Font(Standard14Font.HelveticaBold);
                _standard = true;
                break;
        }
    }

    /// <summary>Debian's fonts-dejavu-core; the CI script installs it.</summary>
    public static string FontFile(string name)
    {
        string path = Path.Combine("/usr/share/fonts/truetype/dejavu", name);
        if (!File.Exists(path))
            throw new InvalidOperationException($"{path} is missing: install Debian's fonts-dejavu-core (apt-get install -y fonts-dejavu-core); .ci/run does this");
        return path;
    }

    private double PageWidth()
    {
        var p = _page ?? throw new InvalidOperationException("no page");
        return p.PageSize.Width;
    }

    private double LineHeight(double size) => 1.45 * size;

    private void EnsurePage()
    {
        if (_page is null) NewPage();
    }

    public PdfFixtureWriter NewPage()
    {
        _page = _builder.AddPage(_pageSize, _portrait);
        _pages++;
        _y = _page.PageSize.Height - Margin;
        if (_running is not null)
        {
            Set(_running, Margin, _y, 0.8 * _size, _font);
            _y -= 2.2 * _size;
        }
        // Page number at the foot: furniture the reader must skip.
        Set($"Page {_pages}", (_page.PageSize.Width / 2) - 12, Margin / 2, 0.8 * _size, _font);
        return this;
    }

    private void Need(double height)
    {
        EnsurePage();
        if (_y - height < Margin) NewPage();
    }

    /// <summary>A line of text (<c>_{..}</c>, <c>^{..}</c> markup allowed).</summary>
    public PdfFixtureWriter Text(string text, double? size = null, bool bold = false, double indentEm = 0)
    {
        double s = size ?? _size;
        Need(LineHeight(s));
        _y -= s;
        Set(text, Margin + (indentEm * _size), _y, s, bold ? _bold : _font);
        _y -= LineHeight(s) - s;
        return this;
    }

    public PdfFixtureWriter Heading(string text) { Gap(0.6); return Text(text, 1.35 * _size, bold: true); }

    public PdfFixtureWriter Gap(double lines = 1)
    {
        EnsurePage();
        _y -= lines * LineHeight(_size);
        return this;
    }

    /// <summary>Prose wrapped to the page width.</summary>
    public PdfFixtureWriter Paragraph(string text)
    {
        EnsurePage();
        double max = PageWidth() - (2 * Margin);
        var line = new StringBuilder();
        foreach (var word in text.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            string candidate = line.Length == 0 ? word : line + " " + word;
            if (Measure(candidate, _size, _font) > max && line.Length > 0)
            {
                Text(line.ToString());
                line.Clear().Append(word);
            }
            else
            {
                line.Clear().Append(candidate);
            }
        }
        if (line.Length > 0) Text(line.ToString());
        return this;
    }

    public PdfFixtureWriter Table(FixtureTable t)
    {
        EnsurePage();
        int n = t.Header.Count;
        var widths = new double[n];
        for (int k = 0; k < n; k++)
        {
            double w = Measure(t.Header[k], _size, _bold);
            if (t.Units is { } u && k < u.Count) w = Math.Max(w, Measure(u[k], _size, _font));
            foreach (var r in t.Rows) if (k < r.Count) foreach (var part in r[k].Split('\n')) w = Math.Max(w, Measure(part, _size, _font));
            widths[k] = t.ColumnWidthEm is double cw ? Math.Max(w, cw * _size) : w;
        }
        var xs = new double[n];
        double x = Margin + (0.5 * _size);
        for (int k = 0; k < n; k++) { xs[k] = x; x += widths[k] + (t.GapEm * _size); }

        void Cell(string text, int k, Align align, PdfDocumentBuilder.AddedFont font)
        {
            double w = Measure(text, _size, font);
            double left = align switch
            {
                Align.Right => xs[k] + widths[k] - w,
                Align.Centre => xs[k] + ((widths[k] - w) / 2),
                _ => xs[k],
            };
            Set(text, left, _y, _size, font);
        }
        void Header()
        {
            Need(3 * LineHeight(_size));
            _y -= _size;
            for (int k = 0; k < n; k++) Cell(t.Header[k], k, t.HeaderAlign, _bold);
            _y -= LineHeight(_size) - _size;
            if (t.Units is { } units)
            {
                _y -= _size;
                for (int k = 0; k < n && k < units.Count; k++) if (units[k].Length > 0) Cell(units[k], k, t.HeaderAlign, _font);
                _y -= LineHeight(_size) - _size;
            }
            _page!.DrawLine(new PdfPoint(Margin, _y + (0.3 * _size)), new PdfPoint(x, _y + (0.3 * _size)), 0.5);
        }

        if (t.Caption is { } caption) { Need(4 * LineHeight(_size)); Text(caption); }
        Header();
        for (int r = 0; r < t.Rows.Count; r++)
        {
            bool pageBreak = t.BreakBeforeRow == r;
            if (pageBreak || _y - LineHeight(_size) < Margin)
            {
                NewPage();
                if (t.RepeatHeader) Header();
            }
            if (t.Labels?.TryGetValue(r, out var label) == true) Text(label, indentEm: 0.5);
            _y -= _size;
            var row = t.Rows[r];
            int extra = 0;
            for (int k = 0; k < n && k < row.Count; k++)
            {
                if (row[k].Length == 0) continue;
                bool right = t.RightAligned is { } ra && k < ra.Count && ra[k];
                // A cell with a line break wraps onto the lines below, inside its row.
                var parts = row[k].Split('\n');
                double top = _y;
                for (int p = 0; p < parts.Length; p++)
                {
                    _y = top - (p * 1.15 * _size);
                    Cell(parts[p], k, right ? Align.Right : Align.Left, _font);
                }
                _y = top;
                extra = Math.Max(extra, parts.Length - 1);
            }
            _y -= LineHeight(_size) - _size + (extra * 1.15 * _size);
        }
        if (t.Notes is { } notes) foreach (var note in notes) Text(note, 0.9 * _size);
        Gap(0.8);
        return this;
    }

    /// <summary>Sets invisible text (as an OCR layer over a scan would be).</summary>
    public PdfFixtureWriter InvisibleText(string text)
    {
        Need(LineHeight(_size));
        _page!.SetTextRenderingMode(TextRenderingMode.Neither);
        _y -= _size;
        Set(text, Margin, _y, _size, _font);
        _y -= LineHeight(_size) - _size;
        _page.SetTextRenderingMode(TextRenderingMode.Fill);
        return this;
    }

    /// <summary>An image filling most of the page (a scanned page).</summary>
    public PdfFixtureWriter Image(byte[] png)
    {
        EnsurePage();
        _page!.AddPng(png, new PdfRectangle(Margin, Margin, PageWidth() - Margin, _page.PageSize.Height - Margin));
        return this;
    }

    public byte[] Build()
    {
        EnsurePage();
        return _builder.Build();
    }

    public void Save(string path) => File.WriteAllBytes(path, Build());

    // ---- text with sub- and superscripts -------------------------------------------------------------

    private enum Script { None, Sub, Super }

    private List<(string Text, Script Script)> Segments(string text)
    {
        var list = new List<(string, Script)>();
        var sb = new StringBuilder();
        for (int i = 0; i < text.Length; i++)
        {
            char c = text[i];
            if ((c == '_' || c == '^') && i + 1 < text.Length && text[i + 1] == '{')
            {
                int close = text.IndexOf('}', i + 2);
                if (close > 0)
                {
                    if (sb.Length > 0) { list.Add((sb.ToString(), Script.None)); sb.Clear(); }
                    list.Add((text[(i + 2)..close], c == '_' ? Script.Sub : Script.Super));
                    i = close;
                    continue;
                }
            }
            if (_standard)
            {
                int sup = "⁰¹²³⁴⁵⁶⁷⁸⁹".IndexOf(c, StringComparison.Ordinal);
                if (sup >= 0)
                {
                    if (sb.Length > 0) { list.Add((sb.ToString(), Script.None)); sb.Clear(); }
                    list.Add((((char)('0' + sup)).ToString(), Script.Super));
                    continue;
                }
                c = c switch { '−' or '–' => '-', '×' => 'x', '·' => '.', _ => c };
            }
            sb.Append(c);
        }
        if (sb.Length > 0) list.Add((sb.ToString(), Script.None));
        return list;
    }

    private double Measure(string text, double size, PdfDocumentBuilder.AddedFont font)
    {
        EnsurePage();
        double w = 0;
        foreach (var (s, script) in Segments(text))
        {
            double sz = script == Script.None ? size : 0.7 * size;
            var letters = _page!.MeasureText(s, sz, new PdfPoint(0, 0), font);
            if (letters.Count > 0) w += letters[^1].EndBaseLine.X - letters[0].StartBaseLine.X;
        }
        return w;
    }

    private void Set(string text, double x, double y, double size, PdfDocumentBuilder.AddedFont font)
    {
        foreach (var (s, script) in Segments(text))
        {
            double sz = script == Script.None ? size : 0.7 * size;
            double dy = script switch { Script.Sub => -0.22 * size, Script.Super => 0.38 * size, _ => 0 };
            var letters = _page!.AddText(s, sz, new PdfPoint(x, y + dy), font);
            if (letters.Count > 0) x = letters[^1].EndBaseLine.X;
        }
    }
}
