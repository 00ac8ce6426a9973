namespace CrossCheck.Review;

/// <summary>Short facts about a review for lists and registers: counts and the most likely cause.</summary>
public static class ReviewSummary
{
    /// <summary>The cause that is both most likely and explains most, over every case; null when the diagnosis found none.</summary>
    public static Cause? TopCause(this ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.Cases.SelectMany(c => c.AllCauses).OrderByDescending(c => c.Confidence * c.Explains).ThenBy(c => c.Code, StringComparer.Ordinal)
            .FirstOrDefault();
    }

    public static int CountEnds(this ReviewResult review, EndStatus status)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.AllEndMoments.Count(e => e.Status == status);
    }

    public static int CountFlags(this ReviewResult review, Severity severity)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.AllFlags.Count(f => f.Severity == severity);
    }

    /// <summary>What ties the rounds of one calculation together: its stated reference, or else its name.</summary>
    public static string ReferenceOr(this ReviewResult review, string name)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.Submission.Info.Reference?.Trim() is { Length: > 0 } r ? r : name;
    }
}
