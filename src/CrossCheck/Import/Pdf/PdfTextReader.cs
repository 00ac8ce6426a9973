using System.Diagnostics;
using System.Text;
using CrossCheck.Model;
using UglyToad.PdfPig;
using UglyToad.PdfPig.Content;
using UglyToad.PdfPig.Core;
using UglyToad.PdfPig.Exceptions;

namespace CrossCheck.Import.Pdf;

/// <summary>
/// Reads the text of a PDF (PdfPig) as lines of words with positions, within <see cref="PdfLimits"/>: opens the
/// file, refuses what it must not read, and hands each page's letters to <see cref="PageLines"/>.
/// Letters become lines by their vertical extent, so a subscript (<c>M</c> with <c>AB</c> below) or a superscript
/// (<c>mm</c> with <c>4</c> above) stays on its line: a superscript is written as a superscript character
/// (<c>mm⁴</c>, <c>10⁶</c>) and a subscript after an underscore (<c>M_AB</c>). Invisible text (an OCR layer) and
/// rotated text are not read. Problems (encrypted, damaged, scanned, over a limit) are reported, never thrown.
/// </summary>
internal static class PdfTextReader
{
    public static TextDocument? Read(string path, string display, PdfLimits limits, List<InputProblem> problems)
    {
        PreloadFontMetrics();
        var whole = new SourceRef(display);
        // Opened once, a regular file, counted against the size limit as it is read (InputFiles).
        if (InputFiles.ReadBytes(path, whole, null, limits.MaxFileBytes, problems, Messages.PdfTooLarge, Messages.PdfDamaged) is not { } bytes) return null;
        if (bytes.Length == 0) { problems.Add(new InputProblem(whole, Messages.PdfEmptyFile)); return null; }
        if (!StartsLikePdf(bytes)) { problems.Add(new InputProblem(whole, Messages.PdfNotPdf)); return null; }
        if (PdfCost.Nesting(bytes, limits.MaxNesting) > limits.MaxNesting) { problems.Add(new InputProblem(whole, Messages.PdfNestedTooDeep(limits.MaxNesting))); return null; }

        var progress = new Progress();
        using var cts = new CancellationTokenSource();
        var task = Task.Run(() => Extract(bytes, display, limits, progress, cts.Token), CancellationToken.None);
        // The reader checks the budget between pages; the wait is the backstop for a page that never finishes.
        if (!task.Wait(limits.TimeBudget + TimeSpan.FromSeconds(1)))
        {
            cts.Cancel();
            problems.Add(new InputProblem(whole, Messages.PdfTimeBudget(limits.TimeBudget.TotalSeconds, Math.Max(1, progress.Page), progress.Pages)));
            return null;
        }
        var (doc, found) = task.Result;
        problems.AddRange(found);
        return doc;
    }

    private static int _fontMetricsStarted;

    /// <summary>
    /// The PDF library parses the metrics of all standard 14 fonts (text files, tens of milliseconds) the first time a
    /// document is opened in the process, whether the document uses them or not. Started here on another core, that
    /// work overlaps reading the file and its cross-reference table; opening the document waits for it as before.
    /// </summary>
    private static void PreloadFontMetrics()
    {
        if (Interlocked.Exchange(ref _fontMetricsStarted, 1) != 0) return;
        _ = Task.Run(static () =>
        {
            try
            {
                _ = UglyToad.PdfPig.Fonts.Standard14Fonts.Standard14.IsFontInStandard14("Helvetica");
            }
#pragma warning disable CA1031 // A failure here recurs, and is reported, when the document is opened.
            catch (Exception)
#pragma warning restore CA1031
            {
            }
        });
    }

    private sealed class Progress
    {
        public volatile int Page;
        public volatile int Pages;
    }

    private static bool StartsLikePdf(byte[] bytes)
    {
        // The header may follow a little junk (the specification allows it within the first 1024 bytes).
        int n = Math.Min(bytes.Length, 1024);
        var head = Encoding.ASCII.GetString(bytes, 0, n);
        return head.Contains("%PDF-", StringComparison.Ordinal);
    }

    private static (TextDocument? Doc, List<InputProblem> Problems) Extract(byte[] bytes, string display, PdfLimits limits, Progress progress, CancellationToken token)
    {
        var problems = new List<InputProblem>();
        var whole = new SourceRef(display);
        var clock = Stopwatch.StartNew();
        var budget = new DecodeBudget(limits, token);
        try
        {
            using var pdf = PdfDocument.Open(bytes, new ParsingOptions
            {
                UseLenientParsing = true, SkipMissingFonts = true, ClipPaths = false,
                FilterProvider = new GuardedFilterProvider(budget), MaxStackDepth = limits.MaxNesting,
            });
            int n = pdf.NumberOfPages;
            progress.Pages = n;
            if (budget.Refusal is { } early) { problems.Add(new InputProblem(whole, early)); return (null, problems); }
            if (n == 0) { problems.Add(new InputProblem(whole, Messages.PdfNoPages)); return (null, problems); }
            if (n > limits.MaxPages) { problems.Add(new InputProblem(whole, Messages.PdfTooManyPages(n, limits.MaxPages))); return (null, problems); }
            var tree = PdfCost.Pages(pdf, n);
            var pages = new List<TextPage>();
            int imagePages = 0, textPages = 0, invisiblePages = 0;
            // The library reads page i on this thread while page i - 1's letters become lines on another core.
            (Page Page, Task<(List<TextLine> Lines, int Invisible, int Rotated, bool Sideways)> Lines)? pending = null;
            void Finish((Page Page, Task<(List<TextLine> Lines, int Invisible, int Rotated, bool Sideways)> Lines) p)
            {
                var page = p.Page;
                int i = page.Number;
                var (lines, invisible, rotated, sideways) = p.Lines.GetAwaiter().GetResult();
                var pageRef = new SourceRef(display, null, null, null, i);
                int images = lines.Count == 0 ? SafeImageCount(page) : 0;
                int visible = lines.Sum(l => l.Text.Count(c => !char.IsWhiteSpace(c)));
                // A page whose text is mostly invisible is an OCR layer over a scan, even with a printed page number.
                if (invisible > 0 && invisible > 4 * visible) { invisiblePages++; problems.Add(new InputProblem(pageRef, Messages.PdfPageInvisibleText, ProblemSeverity.Warning)); }
                else if (lines.Count > 0) textPages++;
                else if (images > 0) { imagePages++; problems.Add(new InputProblem(pageRef, Messages.PdfPageImageOnly, ProblemSeverity.Warning)); }
                if (rotated > 0 && lines.Count > 0) problems.Add(new InputProblem(pageRef, Messages.PdfRotatedText(rotated), ProblemSeverity.Warning));
                pages.Add(sideways ? new TextPage(i, page.Height, page.Width, lines, images)
                    : new TextPage(i, page.Width, page.Height, lines, images) { ImageBoxes = lines.Count > 0 ? SafeImageBoxes(page) : [] });
            }
            for (int i = 1; i <= n; i++)
            {
                progress.Page = i;
                if (token.IsCancellationRequested) return (null, problems);
                if (clock.Elapsed > limits.TimeBudget)
                {
                    problems.Add(new InputProblem(whole, Messages.PdfTimeBudget(limits.TimeBudget.TotalSeconds, i, n)));
                    return (null, problems);
                }
                var pageRef = new SourceRef(display, null, null, null, i);
                if (tree.Count == n)
                {
                    // What the page would make the parser build, forms counted as often as they are painted: refused before it is built.
                    var cost = PdfCost.OfPage(pdf, tree[i - 1].Page, tree[i - 1].Resources, 2L * limits.MaxLettersPerPage, limits.MaxOperationsPerPage);
                    if (cost.Letters > 2L * limits.MaxLettersPerPage || cost.Operations > limits.MaxOperationsPerPage)
                    {
                        problems.Add(new InputProblem(pageRef, Messages.PdfPageTooCostly(cost.Letters, cost.Operations, limits.MaxLettersPerPage, limits.MaxOperationsPerPage)));
                        return (null, problems);
                    }
                }
                var page = pdf.GetPage(i);
                var letters = page.Letters;
                if (budget.Refusal is { } refused) { problems.Add(new InputProblem(whole, refused)); return (null, problems); }
                if (letters.Count > limits.MaxLettersPerPage)
                {
                    problems.Add(new InputProblem(pageRef, Messages.PdfTooManyLetters(letters.Count, limits.MaxLettersPerPage)));
                    return (null, problems);
                }
                double width = page.Width, height = page.Height;
                int number = i;
                var building = Task.Run(() => PageLines.Build(letters, number, width, height), CancellationToken.None);
                if (pending is { } previous) Finish(previous);
                pending = (page, building);
            }
            if (pending is { } last) Finish(last);
            if (textPages == 0)
            {
                problems.RemoveAll(p => p.Where.Page is not null && !p.IsError);
                problems.Add(new InputProblem(whole, invisiblePages > 0 ? Messages.PdfInvisibleOnly : imagePages > 0 ? Messages.PdfScanned(n) : Messages.PdfNoText));
                return (null, problems);
            }
            return (new TextDocument(display, pages), problems);
        }
        catch (PdfDocumentEncryptedException)
        {
            problems.Add(new InputProblem(whole, Messages.PdfEncrypted));
        }
        catch (PdfLimitException ex)
        {
            problems.Add(new InputProblem(whole, ex.Message));
        }
        catch (PdfDocumentStackDepthException)
        {
            problems.Add(new InputProblem(whole, Messages.PdfNestedTooDeep(limits.MaxNesting)));
        }
        catch (OperationCanceledException)
        {
            // Abandoned after the time budget; the caller has reported it.
        }
#pragma warning disable CA1031 // A parser fed a hostile file can fail in any way; every failure is an input error, not a crash.
        catch (Exception ex)
#pragma warning restore CA1031
        {
            if (budget.Refusal is { } refused)
                problems.Add(new InputProblem(whole, refused));
            else if (ex.Message.Contains("encrypt", StringComparison.OrdinalIgnoreCase) || ex.Message.Contains("password", StringComparison.OrdinalIgnoreCase))
                problems.Add(new InputProblem(whole, Messages.PdfEncrypted));
            else
                problems.Add(new InputProblem(whole, Messages.PdfUnreadable));
        }
        return (null, problems);
    }

    /// <summary>Where the images of a page are drawn; none when the library cannot tell (it only decides a warning).</summary>
    private static List<(double, double, double, double)> SafeImageBoxes(Page page)
    {
        try
        {
            if (page.NumberOfImages == 0) return [];
            return page.GetImages().Select(im => (im.BoundingBox.Left, im.BoundingBox.Bottom, im.BoundingBox.Right, im.BoundingBox.Top)).ToList();
        }
#pragma warning disable CA1031 // Image positions only decide a warning.
        catch (Exception)
#pragma warning restore CA1031
        {
            return [];
        }
    }

    private static int SafeImageCount(Page page)
    {
        try
        {
            return page.NumberOfImages;
        }
#pragma warning disable CA1031 // Counting images only decides the wording of a message.
        catch (Exception)
#pragma warning restore CA1031
        {
            return 0;
        }
    }
}
