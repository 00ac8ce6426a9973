using System.Diagnostics.CodeAnalysis;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Model;
using CrossCheck.Register;
using CrossCheck.Review;

namespace CrossCheck.Jobs;

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
    [MemberNotNullWhen(true, nameof(Review))]
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

/// <summary>What the review job writes.</summary>
public enum ReviewFormat
{
    Markdown,
    /// <summary>Self-contained HTML with the drawings.</summary>
    Html,
    /// <summary>The HTML memo printed by a headless browser (<see cref="PdfPrinter"/>).</summary>
    Pdf,
    /// <summary>The review as JSON (<see cref="ReviewJson"/>).</summary>
    Json,
}

/// <summary>One review to run: the submission, how to review it, and where the result goes.</summary>
/// <param name="Path">The submission (folder, CSV or PDF).</param>
/// <param name="Options">Tolerances and sign-off details (no date: today, by the job's clock).</param>
/// <param name="Format">What to write.</param>
public sealed record ReviewRequest(string Path, ReviewOptions Options, ReviewFormat Format = ReviewFormat.Markdown)
{
    /// <summary>Bounds on what is read.</summary>
    public InputLimits Limits { get; init; } = InputLimits.Default;

    /// <summary>The file to write; null for <see cref="ReviewJob.DefaultOutputPath"/>, or, for JSON, for none (the text is returned).</summary>
    public string? OutputPath { get; init; }

    /// <summary>A firm's own memo template (md, html and pdf only), or null for the shipped one.</summary>
    public string? TemplatePath { get; init; }

    /// <summary>The register to record the review in (and to compare it with the previous round), or null for none.</summary>
    public string? RegisterPath { get; init; }
}

public enum ReviewJobStatus
{
    /// <summary>The submission was reviewed and the result written (or returned).</summary>
    Reviewed,
    /// <summary>The submission could not be read or analysed; <see cref="ReviewJobOutcome.Errors"/> say why.</summary>
    InputError,
    /// <summary>The request could not be carried out (template, browser, register, output file); <see cref="ReviewJobOutcome.Problem"/> says why.</summary>
    Refused,
}

/// <summary>What the review job did, for the caller to report and map to an exit code.</summary>
public sealed record ReviewJobOutcome(ReviewJobStatus Status, string Path)
{
    public ReviewResult? Review { get; init; }
    public IReadOnlyList<InputProblem> Errors { get; init; } = [];
    public IReadOnlyList<InputProblem> Warnings { get; init; } = [];

    /// <summary>For a structure that cannot be analysed: the solver's explanation.</summary>
    public string? StructureProblem { get; init; }

    /// <summary>The comparison with the previous round, when the review was recorded in a register.</summary>
    public RoundComparison? Rounds { get; init; }

    /// <summary>The file written (the memo, the JSON, or the JSON of the input errors).</summary>
    public string? WrittenTo { get; init; }

    /// <summary>The output when it was not written to a file (JSON without an output path).</summary>
    public string? Text { get; init; }

    /// <summary>A sentence for the user: why the request was refused, or why the JSON of the input errors was not written.</summary>
    public string? Problem { get; init; }
}

/// <summary>
/// The review job: read → analyse → review (with the diagnosis, and the reference working when asked for) → record
/// in the register → render (Markdown, HTML, PDF or JSON) → write atomically. <c>crosscheck review</c> runs it whole
/// (<see cref="Run"/>); the screen runs its stages (<see cref="Review"/>, the register, <see cref="Render"/>) over a
/// batch. Bad input is an outcome, never an exception.
/// </summary>
/// <param name="time">The clock for the review date when none is given, and the register's recording time.</param>
public sealed class ReviewJob(TimeProvider? time = null)
{
    public TimeProvider Time { get; } = time ?? TimeProvider.System;

    /// <summary><paramref name="options"/> with today's date (by <see cref="Time"/>) when they give none.</summary>
    public ReviewOptions Dated(ReviewOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        return options.Date is null ? options with { Date = Clock.Today(Time) } : options;
    }

    /// <summary>Read → analyse → review. Bad input is returned as errors, never thrown.</summary>
    /// <param name="path">The submission.</param>
    /// <param name="options">Tolerances and sign-off details.</param>
    /// <param name="limits">Bounds on what is read (see <see cref="InputLimits"/>); the defaults when null.</param>
    public ReviewOutcome Review(string path, ReviewOptions options, InputLimits? limits = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        options = Dated(options);
        var imported = SubmissionReader.Read(path, limits ?? InputLimits.Default);
        var warnings = imported.Warnings.ToList();
        if (!imported.Succeeded) return new ReviewOutcome(path, null, imported.Errors.ToList(), warnings, ReviewFailure.Unreadable);
        var s = imported.Submission;
        if (!new FrameSolver().TrySolve(s.Model, s.Cases, out var analysis, out var problem))
        {
            var where = new SourceRef(SubmissionNames.DisplayName(path));
            return new ReviewOutcome(path, null, [new InputProblem(where, $"the structure cannot be analysed: {problem.Message}")], warnings,
                ReviewFailure.NotAnalysable, problem.Message);
        }
        var review = ReviewEngine.Review(s, analysis, options, warnings.Select(w => w.ToString()));
        if (options.ShowWorking) review = review with { Working = ReferenceWorking.Compute(s, review) };
        return new ReviewOutcome(path, review, [], warnings);
    }

    /// <summary>The register key of a review: its reference, or the submission's name when it states none.</summary>
    public static string Key(ReviewResult review, string path)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.ReferenceOr(SubmissionNames.BaseName(path));
    }

    /// <summary>The review as text: the memo (HTML for PDF, to be printed) or the JSON.</summary>
    /// <exception cref="MemoTemplateException">The template fails on this review.</exception>
    public static string Render(ReviewResult review, ReviewFormat format, MemoTemplateFile? template = null, RoundComparison? rounds = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        if (format == ReviewFormat.Json) return ReviewJson.Write(review, rounds);
        var memoFormat = format == ReviewFormat.Markdown ? MemoFormat.Markdown : MemoFormat.Html;
        var model = MemoExtensions.Build(review, memoFormat, rounds);
        return template is null ? MemoRenderer.Render(model, memoFormat) : template.Render(model);
    }

    /// <summary>
    /// <c>&lt;submission&gt;-review.&lt;ext&gt;</c> in the current folder. A submission that is not CSV (a PDF, a
    /// workbook) keeps its kind in the name (<c>hall-pdf-review.md</c>), so that the memos of <c>hall.csv</c> and
    /// <c>hall.pdf</c> neither overwrite each other nor leave the reader guessing which is which.
    /// </summary>
    public static string DefaultOutputPath(string submission, ReviewFormat format) => DefaultFileName(submission, format);

    /// <summary>The default memo file name of a submission (see <see cref="DefaultOutputPath"/>).</summary>
    public static string DefaultFileName(string submission, ReviewFormat format)
    {
        string stem = SubmissionNames.BaseName(submission);
        string ext = Directory.Exists(submission) ? "" : Path.GetExtension(submission).TrimStart('.').ToLowerInvariant();
        if (ext.Length > 0 && ext != "csv") stem = $"{stem}-{ext}";
        return $"{SubmissionNames.SafeStem(stem)}-review.{Extension(format)}";
    }

    /// <summary>The file to write: <paramref name="outPath"/> as given, or — when it names an existing folder — the default file name inside it.</summary>
    public static string Target(string outPath, string submission, ReviewFormat format) =>
        Directory.Exists(outPath) ? Path.Combine(outPath, DefaultFileName(submission, format)) : outPath;

    public static string Extension(ReviewFormat format) => format switch
    {
        ReviewFormat.Html => "html",
        ReviewFormat.Pdf => "pdf",
        ReviewFormat.Json => "json",
        _ => "md",
    };

    /// <summary>The whole job for one submission.</summary>
    public ReviewJobOutcome Run(ReviewRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        var format = request.Format;
        ReviewJobOutcome Refuse(string problem, ReviewOutcome? read = null) => new(ReviewJobStatus.Refused, request.Path)
        {
            Problem = problem, Review = read?.Review, Warnings = read?.Warnings ?? [],
        };

        // What can be refused before reading anything.
        string? browser = null;
        if (format == ReviewFormat.Pdf && (browser = PdfPrinter.FindBrowser()) is null) return Refuse(PdfPrinter.MissingBrowserMessage);
        MemoTemplateFile? template = null;
        if (request.TemplatePath is not null)
        {
            if (format == ReviewFormat.Json) return Refuse("--template applies to md and html memos, not json.");
            if (!MemoTemplateFile.TryLoad(request.TemplatePath, out template, out var problem)) return Refuse(problem);
        }

        var read = Review(request.Path, request.Options, request.Limits);
        if (!read.Succeeded) return InputErrors(request, read);
        var review = read.Review;

        RoundComparison? rounds = null;
        if (request.RegisterPath is not null)
        {
            try
            {
                using var register = ReviewRegister.Open(request.RegisterPath, Time);
                rounds = register.Record(review, Key(review, request.Path), SubmissionNames.DisplayName(request.Path), InputHash.Compute(request.Path));
            }
            catch (RegisterException ex)
            {
                return Refuse(ex.Message, read);
            }
        }

        string content;
        try
        {
            content = Render(review, format, template, rounds);
        }
        catch (MemoTemplateException ex)
        {
            return Refuse($"the memo template has an error: {ex.Message}", read);
        }
        var done = new ReviewJobOutcome(ReviewJobStatus.Reviewed, request.Path) { Review = review, Warnings = read.Warnings, Rounds = rounds };
        string? target = request.OutputPath is { } given ? Target(given, request.Path, format) : format == ReviewFormat.Json ? null : DefaultOutputPath(request.Path, format);
        if (target is null) return done with { Text = content };
        if (format == ReviewFormat.Pdf)
        {
            byte[] printed;
            try
            {
                printed = PdfPrinter.Print(content, browser!);
            }
            catch (PdfPrintException ex)
            {
                return Refuse($"the PDF memo could not be printed: {ex.Message} Write it with --format html and print it from a browser instead.", read);
            }
            if (!JobOutput.TryWrite(target, printed, out var notWritten)) return Refuse(notWritten, read);
        }
        else if (!JobOutput.TryWrite(target, content, out var notWritten))
        {
            return Refuse(notWritten, read);
        }
        return done with { WrittenTo = target };
    }

    /// <summary>A submission that could not be read or analysed: for JSON, the errors as JSON (written, or returned).</summary>
    private static ReviewJobOutcome InputErrors(ReviewRequest request, ReviewOutcome read)
    {
        var outcome = new ReviewJobOutcome(ReviewJobStatus.InputError, request.Path)
        {
            Errors = read.Errors, Warnings = read.Warnings, StructureProblem = read.StructureProblem,
        };
        if (request.Format != ReviewFormat.Json) return outcome;
        string json = ReviewJson.WriteInputErrors(request.Path, read.Errors);
        if (request.OutputPath is null) return outcome with { Text = json };
        string target = Target(request.OutputPath, request.Path, ReviewFormat.Json);
        return JobOutput.TryWrite(target, json, out var problem)
            ? outcome with { WrittenTo = target }
            : outcome with { Problem = problem };
    }
}
