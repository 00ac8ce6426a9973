using CrossCheck.Model;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// What the steps of one PDF conversion share: the tables found, the problems, what was left unread and the notes
/// on how numbers were read, the units statements of the document, and the number style every cell is read in.
/// </summary>
internal sealed class PdfReading(TextDocument doc, List<InputProblem> problems)
{
    private bool _warnedParentheses, _warnedThousands;

    public PdfTableFinder Finder { get; } = new(doc);

    /// <summary>The file name every citation carries.</summary>
    public string File { get; } = doc.File;

    public List<InputProblem> Problems { get; } = problems;

    /// <summary>What was not read, and why (for <c>extract</c>).</summary>
    public List<PdfIgnored> Ignored { get; } = [];

    /// <summary>How the numbers were read (decimal commas, parentheses as negatives).</summary>
    public List<PdfIgnored> Notes { get; } = [];

    /// <summary>Units lines outside the tables, in document order: each holds from where it stands until the next.</summary>
    public List<(TextLine Line, UnitsStatement Units)> DocUnits { get; } = [];

    /// <summary>The note saying that parentheses mean negative, wherever it is printed; it holds for the whole document.</summary>
    public TextLine? ParenthesesNote { get; set; }

    /// <summary>Headers of rows that are not a table of the format, for the message when no table is found.</summary>
    public List<string> SeenHeaders { get; } = [];

    /// <summary>How the document writes numbers (decided once, from all its number cells, before any cell is read).</summary>
    public NumberStyle Style { get; set; } = new(false, false);

    /// <summary>A cell in the form the importer reads: numbers normalised, dashes as empty.</summary>
    public string Cell(ColumnSpec? column, string raw, FoundTable t, TextLine line, string header)
    {
        if (PdfNumbers.IsBlank(raw)) return "";
        if (column?.Type != ColumnType.Number) return Geometry.Collapse(raw);
        string n = PdfNumbers.Normalize(raw, Style, out var notice);
        var where = new SourceRef(File, t.Spec.Name, line.Number, header, line.Page, raw);
        if (notice.HasFlag(PdfNumbers.Notice.Parentheses) && !_warnedParentheses)
        {
            _warnedParentheses = true;
            Problems.Add(new InputProblem(where, Messages.PdfParenthesesWithoutNote(column.Name, raw), ProblemSeverity.Warning));
        }
        if (notice.HasFlag(PdfNumbers.Notice.AmbiguousThousands) && !_warnedThousands)
        {
            _warnedThousands = true;
            Problems.Add(new InputProblem(where, Messages.PdfAmbiguousThousands(raw), ProblemSeverity.Warning));
        }
        return n;
    }

    public static string Shorten(string s) => s.Length > 60 ? s[..60] + "…" : s;
}
