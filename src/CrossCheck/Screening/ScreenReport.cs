using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Memo;
using CrossCheck.Review;

namespace CrossCheck.Screening;

/// <summary>How one submission of a screen came out, from best to worst.</summary>
public enum ScreenOutcome
{
    Concur,
    Comments,
    Revise,
    /// <summary>The submission could not be read or analysed; the row carries the error.</summary>
    InputError,
    /// <summary>A fault in CrossCheck or in writing the outputs while handling this submission.</summary>
    InternalError,
}

/// <summary>What the screen says about one submission.</summary>
/// <param name="Item">The submission as found.</param>
/// <param name="Outcome">Verdict, or the kind of error.</param>
/// <param name="Review">The review (null for an input or internal error).</param>
/// <param name="Errors">Why there is no review: the input problems with their places, or the fault.</param>
/// <param name="Reference">The reference its rounds are tracked by (null without a review).</param>
/// <param name="Rounds">The comparison with its previous round (null without a register).</param>
/// <param name="MemoFile">The memo's file name inside the output folder (null when none was written).</param>
/// <param name="Group">Which group of the summary it belongs to.</param>
/// <param name="Problem">An error while writing its memo or recording it, after the review itself succeeded.</param>
public sealed record ScreenRow(
    ScreenItem Item,
    ScreenOutcome Outcome,
    ReviewResult? Review,
    IReadOnlyList<InputProblem> Errors,
    string? Reference,
    RoundComparison? Rounds,
    string? MemoFile,
    ScreenGroupKey Group,
    string? Problem = null)
{
    public string Name => Item.Name;

    public int Discrepant => Review?.CountEnds(EndStatus.Discrepant) ?? 0;

    /// <summary>The first error as one line (<c>members.csv:7:I: ...</c>), or the problem after the review.</summary>
    public string? ErrorText => Errors.Count > 0
        ? Errors[0].ToString() + (Errors.Count > 1 ? $" (and {Errors.Count - 1} more)" : "")
        : Problem;

    /// <summary>The likely cause if the diagnosis found one, else the main finding's kind, else a dash.</summary>
    public string TopFinding => Review?.TopCause()?.Code ?? (Group.Kind == ScreenGroupKind.Flag ? Group.Code : "—");
}

public enum ScreenGroupKind
{
    Concur,
    Cause,
    Flag,
    /// <summary>End moments that differ from the analysis or are missing, with no finding of the checks of the claimed numbers.</summary>
    EndMoments,
    InputError,
    InternalError,
}

/// <summary>The group a submission falls in: a cause code, a flag kind, or an outcome.</summary>
public sealed record ScreenGroupKey(ScreenGroupKind Kind, string Code)
{
    public string Label => Kind switch
    {
        ScreenGroupKind.Concur => "concur, nothing to answer",
        ScreenGroupKind.Cause => $"likely cause: {Code}",
        ScreenGroupKind.Flag => $"main finding: {Code}",
        ScreenGroupKind.EndMoments => $"end moments {Code}, no other finding",
        ScreenGroupKind.InputError => "could not be read or analysed",
        _ => "internal error",
    };
}

/// <summary>A group of the summary: "12 submissions — likely cause: sway-omitted".</summary>
public sealed record ScreenGroup(ScreenGroupKey Key, IReadOnlyList<string> Submissions)
{
    public int Count => Submissions.Count;

    public string Sentence => $"{Count} submission{(Count == 1 ? "" : "s")} — {Key.Label}";
}

/// <summary>The result of screening a folder.</summary>
/// <param name="Rows">One per submission, worst outcome first, then by name.</param>
/// <param name="Groups">Largest group first.</param>
/// <param name="Notes">Entries passed over, references shared by several submissions, and the like.</param>
public sealed record ScreenReport(
    string Folder,
    string OutputFolder,
    string? RegisterPath,
    ScreenOptions Options,
    IReadOnlyList<ScreenRow> Rows,
    IReadOnlyList<ScreenGroup> Groups,
    IReadOnlyList<string> Notes,
    TimeSpan Elapsed,
    int Parallelism)
{
    public int Count(ScreenOutcome outcome) => Rows.Count(r => r.Outcome == outcome);

    /// <summary>The worst outcome (<see cref="ScreenOutcome.Concur"/> for an empty folder).</summary>
    public ScreenOutcome Worst => Rows.Count == 0 ? ScreenOutcome.Concur : Rows.Max(r => r.Outcome);

    public double SubmissionsPerSecond => Elapsed.TotalSeconds > 0 ? Rows.Count / Elapsed.TotalSeconds : 0;

    /// <summary>How long each stage took.</summary>
    public ScreenStages Stages { get; init; } = new(TimeSpan.Zero, TimeSpan.Zero, TimeSpan.Zero, TimeSpan.Zero);

    /// <summary>The submissions not screened because the screen was interrupted (none when it finished); a re-run completes them.</summary>
    public IReadOnlyList<string> Pending { get; init; } = [];

    /// <summary>True when the screen was interrupted before every submission was done.</summary>
    public bool Interrupted => Pending.Count > 0;
}

/// <summary>
/// Wall-clock time of each stage of a screen: reviewing (parallel); recording in the register (one at a time, alongside the
/// memos, so measured from the same start); memos (parallel, until the last is written); summary and index.
/// </summary>
public sealed record ScreenStages(TimeSpan Review, TimeSpan Register, TimeSpan Memos, TimeSpan Summary);

/// <summary>How a screen runs.</summary>
/// <param name="Review">Tolerances, reviewer and date for every review.</param>
/// <param name="OutputFolder">Where memos, <c>summary.csv</c> and <c>index.html</c> go.</param>
/// <param name="Format">Memo format.</param>
/// <param name="Parallelism">Submissions reviewed at once; 0 for one per processor.</param>
/// <param name="RegisterPath">The register to record every review in, or null for none.</param>
/// <param name="MemoTemplate">A firm's own memo template (<see cref="MemoTemplateFile.TryLoad"/>), or null for the shipped one.</param>
public sealed record ScreenOptions(
    ReviewOptions Review,
    string OutputFolder,
    MemoFormat Format = MemoFormat.Html,
    int Parallelism = 0,
    string? RegisterPath = null,
    MemoTemplateFile? MemoTemplate = null)
{
    /// <summary>Bounds on reading each submission (defaults when null).</summary>
    public InputLimits? Limits { get; init; }

    /// <summary>The clock for the review date (when <see cref="ReviewOptions.Date"/> gives none), the register and the timings.</summary>
    public TimeProvider Time { get; init; } = TimeProvider.System;
}

/// <summary>Groups submissions by their most likely cause when the diagnosis found one, otherwise by their main finding's kind.</summary>
public static class ScreenGrouping
{
    public static ScreenGroupKey Classify(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        if (review.Verdict == Verdict.Concur) return new(ScreenGroupKind.Concur, "concur");
        if (review.TopCause() is { } cause) return new(ScreenGroupKind.Cause, cause.Code);
        var main = review.AllFlags.Where(f => f.Severity != Severity.Info)
            .GroupBy(f => f.Kind)
            .OrderByDescending(g => g.Max(f => f.Severity))
            .ThenByDescending(g => g.Count(f => f.Severity == g.Max(x => x.Severity)))
            .ThenBy(g => g.Key)
            .FirstOrDefault();
        if (main is not null) return new(ScreenGroupKind.Flag, main.Key.Json());
        var worstEnd = review.AllEndMoments.Where(e => e.Status != EndStatus.Agree)
            .OrderByDescending(e => e.Status switch { EndStatus.Discrepant => 3, EndStatus.Missing => 2, EndStatus.Unmatched => 1, _ => 0 })
            .Select(e => e.Status.Json()).FirstOrDefault();
        return new(ScreenGroupKind.EndMoments, worstEnd ?? "differ");
    }

    public static IReadOnlyList<ScreenGroup> Groups(IEnumerable<ScreenRow> rows) =>
        rows.GroupBy(r => r.Group)
            .Select(g => new ScreenGroup(g.Key, g.Select(r => r.Name).Order(StringComparer.Ordinal).ToList()))
            .OrderByDescending(g => g.Count).ThenBy(g => g.Key.Kind).ThenBy(g => g.Key.Code, StringComparer.Ordinal)
            .ToList();
}
