using CrossCheck.Import.Pdf;

namespace CrossCheck.Import;

/// <summary>
/// Every bound on what CrossCheck reads, in one place: a file from anywhere must not hang the tool, exhaust its memory
/// or produce numbers too large to compute with. Going over a bound is an input error (exit code 2) whose message
/// names the bound and, where the command line can change it, the option that raises it.
/// </summary>
/// <remarks>
/// The defaults are far above any hand or spreadsheet calculation (a calc package has tens of members) and take the
/// computer analysis of a building frame (thousands of members), while staying well inside what the review handles in
/// seconds: the diagnosis shares one factorisation of the structure and tries its hypotheses where the claims differ,
/// so a review of 5,000 members costs a small multiple of one analysis (README, "Performance"). The command line sets
/// <see cref="MaxRows"/>, <see cref="MaxMembers"/>, <see cref="MaxFileBytes"/> and the PDF limits (<c>--max-rows</c>,
/// <c>--max-members</c>, <c>--max-file-mb</c>, <c>--max-pages</c>, <c>--time-limit</c>).
/// </remarks>
public sealed record InputLimits
{
    /// <summary>The defaults.</summary>
    public static InputLimits Default { get; } = new();

    /// <summary>Largest CSV, tab-separated or workbook file read (bytes). A PDF has its own bound, <see cref="PdfLimits.MaxFileBytes"/>.</summary>
    public long MaxFileBytes { get; init; } = 20L * 1024 * 1024;

    /// <summary>Longest line of a CSV file (characters): a table row is a few hundred.</summary>
    public int MaxLineChars { get; init; } = 100_000;

    /// <summary>Longest cell (characters): ids, words and numbers are short; a title is a sentence.</summary>
    public int MaxCellChars { get; init; } = 2_000;

    /// <summary>
    /// Most rows in one table: the end moments of <see cref="MaxMembers"/> members in ten load cases (two ends each). A row
    /// costs well under a kilobyte read, so this bounds the memory of a table at tens of megabytes.
    /// </summary>
    public int MaxRows { get; init; } = 100_000;

    /// <summary>
    /// Most members (or spans): a building frame of 40 storeys and 60 bays. Measured on the 2-core machine, a review of a
    /// 5,000-member frame with one mistake takes a few seconds and a few hundred megabytes (README, "Performance").
    /// </summary>
    public int MaxMembers { get; init; } = 5_000;

    /// <summary>Most joints (or supports): twice <see cref="MaxMembers"/>, enough for any structure of that many members.</summary>
    public int MaxJoints { get; init; } = 10_000;

    /// <summary>Most load cases: each is analysed, compared and diagnosed on its own.</summary>
    public int MaxLoadCases { get; init; } = 50;

    /// <summary>
    /// Largest coordinate or member length, in metres. The longest spans built are about 2 km; a member of 100 km is a
    /// unit slip (millimetres read as metres), and far larger numbers would overflow the arithmetic.
    /// </summary>
    public double MaxLength { get; init; } = 100_000;

    /// <summary>Largest magnitude of any number once converted to SI units; beyond it products and squares lose meaning.</summary>
    public double MaxMagnitude { get; init; } = 1e30;

    /// <summary>Smallest non-zero magnitude in SI units; below it lie denormal numbers, which lose precision in every operation.</summary>
    public double MinMagnitude { get; init; } = 1e-280;

    /// <summary>
    /// Longest a review of one submission may take, reading, analysis, checks and diagnosis included (<c>--time-limit</c>, which
    /// also sets <see cref="PdfLimits.TimeBudget"/>); a review over it is stopped and reported as an input error, and in a
    /// screen that submission becomes a row with that error. A 300-member frame with every claim wrong takes tens of seconds.
    /// </summary>
    public TimeSpan TimeBudget { get; init; } = TimeSpan.FromSeconds(60);

    /// <summary>
    /// A folder every file read must lie in once its links are resolved (the folder screened), or null: then a folder
    /// submission's files must lie in that folder, and a file named on its own is read wherever its link leads.
    /// </summary>
    public string? Within { get; init; }

    /// <summary>Bounds on reading a PDF (pages, time, size, letters, decoded streams, nesting).</summary>
    public PdfLimits Pdf { get; init; } = PdfLimits.Default;

    /// <summary>
    /// Whether a submission must hold the claims (the <c>end-moments</c> table). A review has nothing to judge without
    /// them; recomputing the end moments of a model (<c>crosscheck solve</c>) needs none.
    /// </summary>
    public bool ClaimsRequired { get; init; } = true;
}
