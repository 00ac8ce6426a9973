namespace CrossCheck.Import.Pdf;

/// <summary>
/// Bounds on the work the PDF reader does, so that a hostile or broken file cannot hang the tool or exhaust memory.
/// Going over a bound is an input error with a message that names the bound and how to raise it. Part of
/// <see cref="InputLimits"/>, which holds every bound on input.
/// </summary>
/// <param name="MaxPages">Most pages read; a longer document is refused.</param>
/// <param name="TimeBudget">Longest time spent reading text out of the file.</param>
/// <param name="MaxFileBytes">Largest file accepted.</param>
/// <param name="MaxLettersPerPage">Most letters on one page (a page of tables has a few thousand).</param>
public sealed record PdfLimits(int MaxPages, TimeSpan TimeBudget, long MaxFileBytes, int MaxLettersPerPage)
{
    /// <summary>200 pages, 30 s, 100 MB, 200 000 letters per page; streams up to 64 MB decoded, 512 MB in all; nesting 100 deep.</summary>
    public static PdfLimits Default { get; } = new(200, TimeSpan.FromSeconds(30), 100L * 1024 * 1024, 200_000);

    /// <summary>
    /// Largest size of one stream once decompressed (bytes). A page's text is a few hundred kilobytes and a font a few
    /// megabytes; a stream that inflates beyond this is a compression bomb.
    /// </summary>
    public long MaxStreamBytes { get; init; } = 64L * 1024 * 1024;

    /// <summary>Most bytes decompressed from the whole document.</summary>
    public long MaxDecodedBytes { get; init; } = 512L * 1024 * 1024;

    /// <summary>Deepest nesting of arrays and dictionaries, in the file's objects and in page content.</summary>
    public int MaxNesting { get; init; } = 100;

    /// <summary>
    /// Most content operations one page may run, counting each form as often as it is painted (a page of tables runs
    /// a few thousand; a detailed drawing some hundred thousand).
    /// </summary>
    public long MaxOperationsPerPage { get; init; } = 1_000_000;
}
