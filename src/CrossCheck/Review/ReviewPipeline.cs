using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Model;

namespace CrossCheck.Review;

/// <summary>
/// The outcome of reviewing one submission from its files: the review, or the problems that stopped it (the input
/// could not be read, or the structure it describes cannot be analysed).
/// </summary>
/// <param name="Path">The submission as given (folder, CSV or PDF).</param>
/// <param name="Review">The review; null when <see cref="Errors"/> is not empty.</param>
/// <param name="Errors">Why there is no review, each with its place in the input.</param>
/// <param name="Warnings">Import warnings (also carried into the review's memo).</param>
/// <param name="Failure">Which step stopped the review, if any.</param>
/// <param name="StructureProblem">For <see cref="ReviewFailure.NotAnalysable"/>: the solver's explanation (mechanism at joint ..., ...).</param>
public sealed record ReviewOutcome(string Path, ReviewResult? Review, IReadOnlyList<InputProblem> Errors, IReadOnlyList<InputProblem> Warnings,
    ReviewFailure Failure = ReviewFailure.None, string? StructureProblem = null)
{
    public bool Succeeded => Review is not null;
}

public enum ReviewFailure
{
    None,
    /// <summary>The files could not be read as a submission.</summary>
    Unreadable,
    /// <summary>The submission was read, but the structure it describes cannot be analysed (a mechanism, ...).</summary>
    NotAnalysable,
}

/// <summary>Read → solve → review: the steps every command that reviews a submission goes through.</summary>
public static class ReviewPipeline
{
    /// <summary>Reviews the submission at <paramref name="path"/>. Bad input is returned as errors, never thrown.</summary>
    public static ReviewOutcome Run(string path, ReviewOptions options) => Run(path, options, InputLimits.Default);

    /// <param name="path">The submission.</param>
    /// <param name="options">Tolerances and sign-off details.</param>
    /// <param name="pdfLimits">Page and time limits for PDF input (defaults when null).</param>
    public static ReviewOutcome Run(string path, ReviewOptions options, Import.Pdf.PdfLimits? pdfLimits) =>
        Run(path, options, pdfLimits is null ? InputLimits.Default : InputLimits.Default with { Pdf = pdfLimits });

    /// <param name="path">The submission.</param>
    /// <param name="options">Tolerances and sign-off details.</param>
    /// <param name="limits">Bounds on what is read (see <see cref="InputLimits"/>).</param>
    public static ReviewOutcome Run(string path, ReviewOptions options, InputLimits limits)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(limits);
        var imported = SubmissionReader.Read(path, limits);
        var warnings = imported.Warnings.ToList();
        if (!imported.Succeeded) return new ReviewOutcome(path, null, imported.Errors.ToList(), warnings, ReviewFailure.Unreadable);
        var s = imported.Submission!;
        if (!new FrameSolver().TrySolve(s.Model, s.Cases, out var analysis, out var problem))
        {
            var where = new SourceRef(SubmissionNames.DisplayName(path));
            return new ReviewOutcome(path, null, [new InputProblem(where, $"the structure cannot be analysed: {problem!.Message}")], warnings,
                ReviewFailure.NotAnalysable, problem.Message);
        }
        var review = ReviewEngine.Review(s, analysis!, options, warnings.Select(w => w.ToString()));
        if (options.ShowWorking) review = review with { Working = ReferenceWorking.Compute(s) };
        return new ReviewOutcome(path, review, [], warnings);
    }
}
