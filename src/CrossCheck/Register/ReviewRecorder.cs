using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Review;

namespace CrossCheck.Register;

/// <summary>
/// Writes one review into the register, inside the caller's write transaction: read the reference's latest review,
/// decide the round (same input hash → a repeat of that round, else the next round) and the review's place within
/// it, insert the review and its findings, and set it against the previous round. The round is never taken for free:
/// the insert claims (reference, round, place) under a unique index, so a writer that read the same latest review
/// as another collides with it and is run again by <see cref="ReviewRegister"/>.
/// </summary>
internal static class ReviewRecorder
{
    public static RoundComparison Record(RegisterTx tx, TimeProvider time, ReviewResult review, string reference, string submissionName, string hash,
        Action<long>? afterReviewRow)
    {
        var latest = RegisterQueries.Latest(tx, reference);
        bool repeat = latest is not null && hash != ReviewRegister.HashUnavailable && latest.Row.InputHash == hash;
        int round = latest is null ? 1 : repeat ? latest.Row.Round : latest.Row.Round + 1;
        int place = repeat ? latest!.RoundReview + 1 : 1;
        long id = InsertReview(tx, time, review, reference, round, place, submissionName, hash);
        afterReviewRow?.Invoke(id);
        InsertFindings(tx, id, review.Comments);
        var current = RegisterQueries.Reviews(tx, "WHERE id = @id", ("@id", id)).Single();
        return RegisterQueries.Compare(tx, current);
    }

    private static long InsertReview(RegisterTx tx, TimeProvider time, ReviewResult review, string reference, int round, int place, string submissionName,
        string hash)
    {
        var s = review.Submission;
        var o = review.Options;
        using var cmd = tx.Command("""
            INSERT INTO reviews (reference, round, round_review, revision, title, submission, source, review_date, recorded_at, reviewer, tool_version,
                abs_tolerance, rel_tolerance, minor_tolerance, moment_unit, input_hash, verdict, ends_agree, ends_minor, ends_discrepant,
                ends_missing, ends_unmatched, major_flags, minor_flags, top_cause, finding_count)
            VALUES (@reference, @round, @place, @revision, @title, @submission, @source, @date, @recorded, @reviewer, @tool,
                @abs, @rel, @minor, @unit, @hash, @verdict, @agree, @eminor, @discrepant,
                @missing, @unmatched, @majorFlags, @minorFlags, @cause, @findings)
            RETURNING id
            """,
            ("@reference", reference), ("@round", round), ("@place", place), ("@revision", s.Info.Revision), ("@title", s.Info.Title),
            ("@submission", submissionName), ("@source", s.Source),
            ("@date", Clock.Iso(o.Date ?? Clock.Today(time))), ("@recorded", Clock.UtcStamp(time)),
            ("@reviewer", o.Reviewer), ("@tool", ToolInfo.Version), ("@abs", o.AbsoluteTolerance), ("@rel", o.RelativeTolerance),
            ("@minor", o.MinorRelativeTolerance), ("@unit", s.Info.Units.Moment.Symbol), ("@hash", hash), ("@verdict", review.Verdict.Json()),
            ("@agree", review.CountEnds(EndStatus.Agree)), ("@eminor", review.CountEnds(EndStatus.Minor)),
            ("@discrepant", review.CountEnds(EndStatus.Discrepant)), ("@missing", review.CountEnds(EndStatus.Missing)),
            ("@unmatched", review.CountEnds(EndStatus.Unmatched)), ("@majorFlags", review.CountFlags(Severity.Major)),
            ("@minorFlags", review.CountFlags(Severity.Minor)), ("@cause", review.TopCause()?.Code), ("@findings", review.Comments.Count));
        return Convert.ToInt64(cmd.ExecuteScalar(), CultureInfo.InvariantCulture);
    }

    private static void InsertFindings(RegisterTx tx, long reviewId, IReadOnlyList<ReviewComment> comments)
    {
        if (comments.Count == 0) return;
        using var cmd = tx.Command("""
            INSERT INTO findings (review_id, seq, comment_id, kind, severity, load_case, place, message, source)
            VALUES (@review, @seq, @id, @kind, @severity, @case, @place, @message, @source)
            """);
        var p = new[] { "@review", "@seq", "@id", "@kind", "@severity", "@case", "@place", "@message", "@source" }
            .Select(n => RegisterTx.Add(cmd, n, "")).ToArray();
        int seq = 0;
        foreach (var c in comments)
        {
            int dash = c.Id.IndexOf('-', StringComparison.Ordinal);
            object[] values = [reviewId, ++seq, c.Id, dash > 0 ? c.Id[..dash] : c.Id, c.Severity.Json(), c.Case, c.Where, c.Text, c.Source];
            for (int i = 0; i < p.Length; i++) RegisterTx.Set(p[i], values[i]);
            cmd.ExecuteNonQuery();
        }
    }
}
