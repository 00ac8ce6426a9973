namespace CrossCheck.Review;

// What the review register computes and the memo shows: a review set against the previous round of its reference.
// It lives with the review so that the memo (which shows it) and the register (which computes it) need not know
// each other.

/// <summary>One recorded review of a submission (one row of the register's <c>reviews</c> table).</summary>
/// <param name="Id">Row id, increasing in the order reviews were recorded.</param>
/// <param name="Reference">What ties the rounds of one calculation together: the submission's <c>reference</c>, or its name when it gives none.</param>
/// <param name="Round">1 for the first submission of the reference; one more for every submission whose input files changed.</param>
/// <param name="Revision">The revision the submission states in its <c>info</c> table, if any.</param>
/// <param name="Submission">The submission's file or folder name.</param>
/// <param name="Source">The path it was reviewed from.</param>
/// <param name="ReviewDate">Date of the review, <c>yyyy-mm-dd</c>.</param>
/// <param name="RecordedAt">When the row was written, UTC, ISO 8601.</param>
/// <param name="InputHash">Fingerprint of the input files (<c>Import.InputHash</c>).</param>
/// <param name="Verdict">JSON word of the verdict (<c>concur</c>, <c>concur-with-comments</c>, <c>revise</c>).</param>
/// <param name="TopCause">Code of the most likely cause the diagnosis found, if any.</param>
/// <param name="FindingCount">Number of findings recorded with the review (a consistency check).</param>
public sealed record RegisterReview(
    long Id,
    string Reference,
    int Round,
    string? Revision,
    string? Title,
    string Submission,
    string Source,
    string ReviewDate,
    string RecordedAt,
    string? Reviewer,
    string ToolVersion,
    double AbsoluteTolerance,
    double RelativeTolerance,
    double MinorRelativeTolerance,
    string MomentUnit,
    string InputHash,
    string Verdict,
    int EndsAgree,
    int EndsMinor,
    int EndsDiscrepant,
    int EndsMissing,
    int EndsUnmatched,
    int MajorFlags,
    int MinorFlags,
    string? TopCause,
    int FindingCount);

/// <summary>A comment seen against the previous round.</summary>
/// <param name="FirstRaisedRound">The round from which the comment has been raised without a break.</param>
/// <param name="PreviousSeverity">Its severity in the previous round (persisting and closed comments), null for new ones.</param>
public sealed record ComparedComment(string Id, string Severity, string Case, string Where, string Text, int FirstRaisedRound, string? PreviousSeverity);

/// <summary>
/// A review set against the previous round of the same reference: which comments were closed (raised before, not
/// now), which persist, and which are new.
/// </summary>
/// <param name="Review">The review being compared.</param>
/// <param name="Previous">The latest review of the round before, or null for a first round.</param>
/// <param name="Repeat">True when the same input files had already been reviewed in this round.</param>
public sealed record RoundComparison(
    RegisterReview Review,
    RegisterReview? Previous,
    bool Repeat,
    IReadOnlyList<ComparedComment> Closed,
    IReadOnlyList<ComparedComment> Persisting,
    IReadOnlyList<ComparedComment> New);

