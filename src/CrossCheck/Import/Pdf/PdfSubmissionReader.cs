using CrossCheck.Import.Pdf.Conversion;
using CrossCheck.Model;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// Reads a submission from a text PDF: finds the tables (<see cref="PdfTableFinder"/>), reads the title block's
/// <c>key: value</c> lines, applies units stated outside the headers, normalises numbers (<see cref="PdfNumbers"/>),
/// turns wide end-moment tables (<c>M_AB</c> columns) into the long form, joins the parts of a table printed in
/// several places, and hands the tables to <see cref="SubmissionBuilder"/>. Every value keeps its page and line.
/// Each of these steps has its class in <c>Import/Pdf/Conversion</c>; they share a <see cref="PdfReading"/>.
/// </summary>
public static class PdfSubmissionReader
{
    /// <summary>Reads and builds the submission. Never throws for bad input.</summary>
    public static ImportResult Read(string path, PdfLimits? limits = null) =>
        Read(path, limits is null ? InputLimits.Default : InputLimits.Default with { Pdf = limits });

    /// <summary>Reads and builds the submission within <paramref name="limits"/>. Never throws for bad input.</summary>
    public static ImportResult Read(string path, InputLimits limits)
    {
        ArgumentNullException.ThrowIfNull(limits);
        if (limits.Within is not null)
        {
            try
            {
                Common.InputFile.CheckInside(path, limits.Within);
            }
            catch (Common.InputFileException ex)
            {
                return new ImportResult(null, [new InputProblem(new SourceRef(Path.GetFileName(path)), ex.Message)]);
            }
        }
        var x = Extract(path, limits.Pdf);
        if (x.Tables.Count == 0) return new ImportResult(null, x.Problems);
        return SubmissionBuilder.Build(path, x.Tables, x.Problems, limits);
    }

    /// <summary>Reads the tables of a PDF without building the submission (for <c>crosscheck extract</c>).</summary>
    public static PdfExtraction Extract(string path, PdfLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        string display = Path.GetFileName(path);
        var problems = new List<InputProblem>();
        var doc = PdfTextReader.Read(path, display, limits ?? PdfLimits.Default, problems);
        if (doc is null) return new PdfExtraction(path, [], [], [], problems);
        return Convert(new PdfReading(doc, problems), path);
    }

    /// <summary>One reading of a document: its lines into the tables of the format.</summary>
    internal static PdfExtraction Convert(PdfReading r, string path)
    {
        var finder = r.Finder;
        finder.Run();
        TableRoles.Decide(r);
        Refusals.TwoLevelHeaders(r);
        Refusals.Images(r, r.Finder.Document);
        var tableLines = new HashSet<TextLine>(finder.Tables.SelectMany(t => t.Header.Lines.Concat(t.RowLines).Concat(t.RowCase.Values.Select(v => v.Label))));
        var attached = new HashSet<TextLine>(finder.Tables.SelectMany(t => t.Above.Concat(t.Below)));
        var info = DocumentStatements.Read(r, tableLines, attached);
        var (comma, pointSeen) = PdfNumbers.Detect(TableCells.NumberCells(r));
        r.Style = new NumberStyle(comma, r.ParenthesesNote is not null, pointSeen);
        if (comma) r.Notes.Add(new PdfIgnored(new SourceRef(r.File), "numbers are read with decimal commas (the document's numbers use them)"));

        if (finder.Tables.Count == 0)
        {
            r.Problems.Add(new InputProblem(new SourceRef(r.File), Messages.PdfNoTables(r.SeenHeaders.Take(8).ToList())));
            return new PdfExtraction(path, [], [], r.Ignored, r.Problems);
        }

        foreach (var t in finder.Tables.Where(t => t.Header.Beside is not null))
            r.Problems.Add(new InputProblem(new SourceRef(r.File, t.Spec.Name, t.First.Number, null, t.First.Page),
                Messages.PdfSideBySide(t.Spec.Name, t.Header.Beside!.Name)));
        // A header with no rows under it (a running header that names columns, a table cut off) is dropped when
        // the table is printed elsewhere with rows.
        foreach (var empty in finder.Tables.Where(t => t.RowLines.Count == 0 && finder.Tables.Any(o => o.Spec == t.Spec && o.RowLines.Count > 0)).ToList())
        {
            finder.Tables.Remove(empty);
            r.Ignored.Add(new PdfIgnored(new SourceRef(r.File, empty.Spec.Name, empty.First.Number, null, empty.First.Page),
                $"a header of table '{empty.Spec.Name}' with no rows under it (\"{PdfReading.Shorten(empty.First.Text)}\")"));
        }
        var segments = finder.Tables.Where(t => !t.Header.IsWide).Select(t => TableCells.Read(r, t)).ToList();
        var geometry = WideTables.MembersOf(segments);
        foreach (var t in finder.Tables.Where(t => t.Header.IsWide))
            if (WideTables.Read(r, t, geometry) is { } s) segments.Add(s);
        segments = segments.OrderBy(s => s.Source.First.Page).ThenBy(s => s.Source.First.Number).ToList();
        var merged = TableJoiner.Join(r, segments);
        var tables = new List<RawTable>();
        var infoTable = TitleBlock.Table(r, info, merged.FirstOrDefault(m => m.Spec == TableSchema.Info));
        if (infoTable is not null) tables.Add(infoTable);
        foreach (var m in merged.Where(m => m.Spec != TableSchema.Info)) tables.Add(m.ToRaw(r.File));
        var reports = merged.Where(m => m.Spec != TableSchema.Info).Select(ExtractReport.Of).ToList();
        if (infoTable is not null) reports.Insert(0, ExtractReport.Info(infoTable));
        return new PdfExtraction(path, tables, reports, r.Ignored, r.Problems) { Notes = r.Notes };
    }
}
