using System.Data.Common;
using CrossCheck.Review;

namespace CrossCheck.Register;

/// <summary>A review as stored: the row, and its place within its round (1 for the first review of the round, 2 for its first repeat, ...).</summary>
internal sealed record StoredReview(RegisterReview Row, int RoundReview);

/// <summary>
/// The register's reads, in SQL both databases run alike: reviews, findings, and a review set against the previous
/// round of its reference. "Latest" is by round and then by the review's place within the round, never by id: ids
/// are handed out as transactions start, which on a server is not the order they commit in.
/// </summary>
internal static class RegisterQueries
{
    public const string ReviewColumns =
        "id, reference, round, revision, title, submission, source, review_date, recorded_at, reviewer, tool_version, abs_tolerance, " +
        "rel_tolerance, minor_tolerance, moment_unit, input_hash, verdict, ends_agree, ends_minor, ends_discrepant, ends_missing, " +
        "ends_unmatched, major_flags, minor_flags, top_cause, finding_count, round_review";

    public const string FindingColumns = "comment_id, kind, severity, load_case, place, message, source";

    public static List<StoredReview> Reviews(RegisterTx tx, string tail, params (string, object?)[] args) =>
        tx.Rows($"SELECT {ReviewColumns} FROM reviews {tail}", ReadReview, args);

    public static StoredReview ReadReview(DbDataReader r)
    {
        RegisterValues.Check(r, "");
        string? S(int i) => RegisterTx.Text(r, i);
        int I(int i) => RegisterTx.Int(r, i);
        double D(int i) => RegisterTx.Real(r, i);
        return new StoredReview(new RegisterReview(RegisterTx.Int64(r, 0), r.GetString(1), I(2), S(3), S(4), r.GetString(5), r.GetString(6), r.GetString(7),
            r.GetString(8), S(9), r.GetString(10), D(11), D(12), D(13), r.GetString(14), r.GetString(15), r.GetString(16), I(17), I(18), I(19), I(20),
            I(21), I(22), I(23), S(24), I(25)), I(26));
    }

    /// <summary>The latest review of <paramref name="reference"/> (highest round, then the last review in it), or null.</summary>
    public static StoredReview? Latest(RegisterTx tx, string reference) =>
        Reviews(tx, "WHERE reference = @ref ORDER BY round DESC, round_review DESC LIMIT 1", ("@ref", reference)).FirstOrDefault();

    public static List<RegisterFinding> Findings(RegisterTx tx, long reviewId) =>
        tx.Rows($"SELECT {FindingColumns} FROM findings WHERE review_id = @id ORDER BY seq", r =>
            new RegisterFinding(r.GetString(0), r.GetString(1), r.GetString(2), r.GetString(3), r.GetString(4), r.GetString(5), r.GetString(6)), ("@id", reviewId));

    /// <summary>Every reference with its number of rounds and reviews and its latest review, in ordinal order.</summary>
    public static List<RegisterReference> References(RegisterTx tx)
    {
        var counts = tx.Rows("SELECT reference, count(DISTINCT round), count(*) FROM reviews GROUP BY reference",
            r => (Ref: r.GetString(0), Rounds: RegisterTx.Int(r, 1), Reviews: RegisterTx.Int(r, 2)));
        var latest = Reviews(tx, """
            r WHERE NOT EXISTS (SELECT 1 FROM reviews q WHERE q.reference = r.reference
                AND (q.round > r.round OR (q.round = r.round AND q.round_review > r.round_review)))
            """).ToDictionary(x => x.Row.Reference, StringComparer.Ordinal);
        return counts.Select(c => new RegisterReference(c.Ref, c.Rounds, c.Reviews, latest[c.Ref].Row))
            .OrderBy(x => x.Reference, StringComparer.Ordinal).ToList();
    }

    /// <summary>Sets <paramref name="current"/> against the latest review of the round before it.</summary>
    public static RoundComparison Compare(RegisterTx tx, StoredReview current)
    {
        var row = current.Row;
        var currentFindings = Findings(tx, row.Id);
        var previous = Reviews(tx, "WHERE reference = @ref AND round < @round ORDER BY round DESC, round_review DESC LIMIT 1",
            ("@ref", row.Reference), ("@round", row.Round)).FirstOrDefault()?.Row;
        bool repeat = current.RoundReview > 1;

        // The comment ids of the latest review of each earlier round, to say since when a comment has stood.
        var byRound = new Dictionary<int, HashSet<string>>();
        foreach (var (round, id) in tx.Rows("""
            SELECT r.round, f.comment_id FROM findings f JOIN reviews r ON r.id = f.review_id
            WHERE r.reference = @ref AND r.round < @round AND r.round_review =
                (SELECT max(q.round_review) FROM reviews q WHERE q.reference = r.reference AND q.round = r.round)
            """, r => (RegisterTx.Int(r, 0), r.GetString(1)), ("@ref", row.Reference), ("@round", row.Round)))
        {
            if (!byRound.TryGetValue(round, out var set)) byRound[round] = set = new HashSet<string>(StringComparer.Ordinal);
            set.Add(id);
        }
        int Since(string id, int from)
        {
            int k = from;
            while (k > 1 && byRound.TryGetValue(k - 1, out var ids) && ids.Contains(id)) k--;
            return k;
        }

        if (previous is null)
            return new RoundComparison(row, null, repeat, [],
                [], currentFindings.Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, row.Round, null)).ToList());
        var before = Findings(tx, previous.Id).ToDictionary(f => f.CommentId, StringComparer.Ordinal);
        var now = currentFindings.Select(f => f.CommentId).ToHashSet(StringComparer.Ordinal);
        var closed = before.Values.Where(f => !now.Contains(f.CommentId))
            .Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, Since(f.CommentId, previous.Round), f.Severity)).ToList();
        var persisting = currentFindings.Where(f => before.ContainsKey(f.CommentId))
            .Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, Since(f.CommentId, row.Round), before[f.CommentId].Severity))
            .ToList();
        var fresh = currentFindings.Where(f => !before.ContainsKey(f.CommentId))
            .Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, row.Round, null)).ToList();
        return new RoundComparison(row, previous, repeat, closed, persisting, fresh);
    }
}
