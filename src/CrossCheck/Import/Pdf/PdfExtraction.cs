using CrossCheck.Model;

namespace CrossCheck.Import.Pdf;

/// <summary>A table read from a PDF, as the <c>extract</c> command reports it.</summary>
/// <param name="Table">The table of the format.</param>
/// <param name="Where">Where it was printed: <c>p.1 lines 12-18; p.2 lines 3-9</c>.</param>
/// <param name="Rows">Rows read.</param>
/// <param name="Columns">How each printed header was read: <c>L [m] → length [m]</c>, or <c>Notes → ignored</c>.</param>
/// <param name="Note">How the table was read when that is not obvious (a wide end-moment table, case labels).</param>
public sealed record PdfTableReport(string Table, string Where, int Rows, IReadOnlyList<string> Columns, string? Note);

/// <summary>Something in the PDF that was not read, and why.</summary>
public sealed record PdfIgnored(SourceRef Where, string What);

/// <summary>
/// What the PDF reader found: the tables as text (in the form of the CSV contract), what it skipped, how it read
/// the numbers (<see cref="Notes"/>: parentheses as negatives, decimal commas) and the problems.
/// </summary>
public sealed record PdfExtraction(
    string Source,
    IReadOnlyList<RawTable> Tables,
    IReadOnlyList<PdfTableReport> Found,
    IReadOnlyList<PdfIgnored> Ignored,
    IReadOnlyList<InputProblem> Problems)
{
    public IReadOnlyList<PdfIgnored> Notes { get; init; } = [];

    public bool HasErrors => Problems.Any(p => p.IsError);
}
