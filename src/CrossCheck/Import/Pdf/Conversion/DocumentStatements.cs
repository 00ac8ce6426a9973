using CrossCheck.Model;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// The lines outside the tables: title-block <c>key: value</c> pairs, units statements, the note that parentheses mean
/// negative, and runs of rows under a header that is no table of the format (reported as not read).
/// </summary>
internal static class DocumentStatements
{
    /// <summary>
    /// Reads every line that is not part of a table; returns the title-block pairs (first of each key) and records the
    /// units lines, the parentheses note and what was left unread in <paramref name="r"/>.
    /// </summary>
    /// <param name="r">The conversion.</param>
    /// <param name="tableLines">Lines of the tables' headers and rows.</param>
    /// <param name="attached">Lines just above or below a table (captions, notes): read for statements, never as rows.</param>
    public static List<(PdfStatements.KeyValue Pair, TextLine Line)> Read(PdfReading r, HashSet<TextLine> tableLines, HashSet<TextLine> attached)
    {
        var info = new List<(PdfStatements.KeyValue, TextLine)>();
        var keys = new HashSet<string>(StringComparer.Ordinal);
        var tabularRun = new List<TextLine>();
        void FlushRun()
        {
            if (tabularRun.Count >= 2 || (tabularRun.Count == 1 && tabularRun[0].Chunks().Count >= 3))
            {
                var first = tabularRun[0];
                string span = tabularRun.Count == 1 ? $"line {first.Number}" : $"lines {first.Number}-{tabularRun[^1].Number}";
                r.Ignored.Add(new PdfIgnored(new SourceRef(r.File, null, first.Number, null, first.Page),
                    $"{span}: rows under a header that is not a table of the submission format (\"{PdfReading.Shorten(first.Text)}\")"));
                r.SeenHeaders.Add($"p.{first.Page} line {first.Number}: \"{string.Join(" | ", first.Chunks().Select(c => c.Text))}\"");
            }
            tabularRun.Clear();
        }
        foreach (var line in r.Finder.Lines)
        {
            if (tableLines.Contains(line)) { FlushRun(); continue; }
            bool furniture = r.Finder.Furniture.Contains(line);
            var pairs = PdfStatements.KeyValues(line);
            foreach (var kv in pairs.Where(p => p.Key != "units"))
                if (keys.Add(kv.Key)) info.Add((kv, line));
            // Units lines hold from where they stand until the next one; a note that parentheses mean negative
            // holds for the whole document (wherever it is printed, next to a table or not).
            var units = PdfStatements.Units(line.Text);
            if (units is not null) r.DocUnits.Add((line, units));
            if (PdfStatements.SaysParenthesesNegative(line.Text) && r.ParenthesesNote is null) r.ParenthesesNote = line;
            if (attached.Contains(line)) { FlushRun(); continue; }
            bool tabular = !furniture && pairs.Count == 0 && units is null && PdfTableFinder.LooksTabular(line);
            if (tabular && (tabularRun.Count == 0 || (tabularRun[^1].Page == line.Page && tabularRun[^1].Baseline - line.Baseline < 3 * line.Size)))
            {
                tabularRun.Add(line);
                continue;
            }
            FlushRun();
            if (tabular) tabularRun.Add(line);
        }
        FlushRun();
        if (r.ParenthesesNote is { } note)
            r.Notes.Add(new PdfIgnored(new SourceRef(r.File, null, note.Number, null, note.Page),
                "numbers in parentheses are read as negative, as this note says"));
        return info;
    }
}
