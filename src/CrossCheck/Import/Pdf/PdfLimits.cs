namespace CrossCheck.Import.Pdf;

/// <summary>
/// Bounds on the work the PDF reader does, so that a hostile or broken file cannot hang the tool or exhaust memory.
/// Going over a bound is an input error with a message that names the bound and how to raise it.
/// </summary>
/// <param name="MaxPages">Most pages read; a longer document is refused.</param>
/// <param name="TimeBudget">Longest time spent reading text out of the file.</param>
/// <param name="MaxFileBytes">Largest file accepted.</param>
/// <param name="MaxLettersPerPage">Most letters on one page (a page of tables has a few thousand).</param>
public sealed record PdfLimits(int MaxPages, TimeSpan TimeBudget, long MaxFileBytes, int MaxLettersPerPage)
{
    /// <summary>200 pages, 30 s, 100 MB, 200 000 letters per page.</summary>
    public static PdfLimits Default { get; } = new(200, TimeSpan.FromSeconds(30), 100L * 1024 * 1024, 200_000);
}
