using CrossCheck.Model;

namespace CrossCheck.Import.Pdf.Conversion;

/// <summary>
/// What the reader does not read, said with its page and line rather than guessed at: a header on two levels (a group
/// heading over sub-columns the format does not name, such as one column per load case) and tables drawn as images.
/// (Tables side by side are reported where they are found.)
/// </summary>
internal static class Refusals
{
    /// <summary>
    /// A group heading directly above a header, over two or more of its columns that were not read; or sub-columns
    /// set under one header cell (<c>Moment</c> over <c>ULS-1  ULS-2</c>): an input error at the heading.
    /// </summary>
    public static void TwoLevelHeaders(PdfReading r)
    {
        var index = new Dictionary<TextLine, int>();
        for (int i = 0; i < r.Finder.Lines.Count; i++) index[r.Finder.Lines[i]] = i;
        foreach (var t in r.Finder.Tables.Where(t => !t.Header.IsWide).ToList())
        {
            var last = t.Header.Lines[^1];
            if (index.TryGetValue(last, out int at) && at + 1 < r.Finder.Lines.Count && r.Finder.Lines[at + 1] is var below
                && below.Page == last.Page && last.Baseline - below.Baseline < 2.2 * last.Size)
            {
                foreach (var col in t.Columns.Where(c => c.Header?.Column is null or { Type: ColumnType.Number }))
                {
                    var subs = below.Chunks().Where(c => Geometry.Overlap(c.Left, c.Right, col.HeadLeft, col.HeadRight) > 0 && !Roles.ColumnRoles.LooksNumeric(c.Text)).ToList();
                    if (subs.Count < 2) continue;
                    r.Problems.Add(new InputProblem(new SourceRef(r.File, t.Spec.Name, last.Number, null, last.Page),
                        Messages.PdfTwoLevelHeader(col.Header!.Printed, subs.Select(c => c.Text).ToList())));
                    // Not read: its cells would only repeat the refusal as errors of their own.
                    r.Finder.Tables.Remove(t);
                    break;
                }
            }
            foreach (var line in t.Above.Where(l => l.Page == t.First.Page && l.Baseline - t.First.Baseline < 2.2 * t.First.Size))
            {
                foreach (var chunk in line.Chunks())
                {
                    var under = t.Columns.Where(c => Geometry.Overlap(chunk.Left, chunk.Right, c.HeadLeft, c.HeadRight) > 0).ToList();
                    if (under.Count < 2 || under.Count(c => c.Header?.Column is null) < 2) continue;
                    r.Problems.Add(new InputProblem(new SourceRef(r.File, t.Spec.Name, line.Number, null, line.Page),
                        Messages.PdfTwoLevelHeader(chunk.Text, under.Select(c => c.Header!.Printed).ToList())));
                }
            }
        }
    }

    /// <summary>Images on pages with text, larger than a logo: a warning naming the page and the lines around each.</summary>
    public static void Images(PdfReading r, TextDocument doc)
    {
        foreach (var page in doc.Pages)
        {
            foreach (var (left, bottom, right, top) in page.ImageBoxes)
            {
                if (right - left < 0.25 * page.Width || top - bottom < 0.04 * page.Height) continue;
                var above = page.Lines.LastOrDefault(l => l.Baseline > top);
                var below = page.Lines.FirstOrDefault(l => l.Baseline < bottom);
                int? line = above?.Number ?? below?.Number;
                r.Problems.Add(new InputProblem(new SourceRef(r.File, null, line, null, page.Number),
                    Messages.PdfImageNotRead(above?.Number, below?.Number), ProblemSeverity.Warning));
            }
        }
    }
}
