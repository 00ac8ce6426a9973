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
        var current = InsertReview(tx, time, review, reference, round, place, submissionName, hash);
        afterReviewRow?.Invoke(current.Row.Id);
        InsertFindings(tx, current.Row.Id, review.Comments);
        return RegisterQueries.Compare(tx, current);
    }

    /// <summary>Inserts the review and reads it back as stored (one round trip: <c>RETURNING</c>).</summary>
    private static StoredReview InsertReview(RegisterTx tx, TimeProvider time, ReviewResult review, string reference, int round, int place, string submissionName,
        string hash)
    {
        var s = review.Submission;
        var o = review.Options;
        using var cmd = tx.Command($"""
            INSERT INTO reviews (reference, round, round_review, revision, title, submission, source, review_date, recorded_at, reviewer, tool_version,
                abs_tolerance, rel_tolerance, minor_tolerance, moment_unit, input_hash, verdict, ends_agree, ends_minor, ends_discrepant,
                ends_missing, ends_unmatched, major_flags, minor_flags, top_cause, finding_count)
            VALUES (@reference, @round, @place, @revision, @title, @submission, @source, @date, @recorded, @reviewer, @tool,
                @abs, @rel, @minor, @unit, @hash, @verdict, @agree, @eminor, @discrepant,
                @missing, @unmatched, @majorFlags, @minorFlags, @cause, @findings)
            RETURNING {RegisterQueries.ReviewColumns}
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
        using var r = cmd.ExecuteReader();
        r.Read();
        return RegisterQueries.ReadReview(r);
    }

    /// <summary>Rows per INSERT: one statement (one round trip to a server) for a review's findings, within SQLite's bound on parameters.</summary>
    private const int FindingsPerStatement = 200;

    private static void InsertFindings(RegisterTx tx, long reviewId, IReadOnlyList<ReviewComment> comments)
    {
        for (int start = 0; start < comments.Count; start += FindingsPerStatement)
        {
            int count = Math.Min(FindingsPerStatement, comments.Count - start);
            var rows = Enumerable.Range(0, count).Select(i => string.Create(CultureInfo.InvariantCulture,
                $"(@review, @s{i}, @i{i}, @k{i}, @v{i}, @c{i}, @p{i}, @m{i}, @o{i})"));
            using var cmd = tx.Command(
                $"INSERT INTO findings (review_id, seq, comment_id, kind, severity, load_case, place, message, source) VALUES {string.Join(", ", rows)}",
                ("@review", reviewId));
            for (int i = 0; i < count; i++)
            {
                var c = comments[start + i];
                int dash = c.Id.IndexOf('-', StringComparison.Ordinal);
                string n = i.ToString(CultureInfo.InvariantCulture);
                RegisterTx.Add(cmd, "@s" + n, start + i + 1);
                RegisterTx.Add(cmd, "@i" + n, c.Id);
                RegisterTx.Add(cmd, "@k" + n, dash > 0 ? c.Id[..dash] : c.Id);
                RegisterTx.Add(cmd, "@v" + n, c.Severity.Json());
                RegisterTx.Add(cmd, "@c" + n, c.Case);
                RegisterTx.Add(cmd, "@p" + n, c.Where);
                RegisterTx.Add(cmd, "@m" + n, c.Text);
                RegisterTx.Add(cmd, "@o" + n, c.Source);
            }
            cmd.ExecuteNonQuery();
        }
    }
}
