using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Review;
using Microsoft.Data.Sqlite;

namespace CrossCheck.Register;

/// <summary>
/// The review register: an SQLite file recording every review (reference, round, date, reviewer, tool version,
/// tolerances, a hash of the input files, verdict and every finding with its stable comment id), so that a
/// resubmission can be set against the previous round.
/// </summary>
/// <remarks>
/// Each review is written in one <c>BEGIN IMMEDIATE</c> transaction: a process killed while writing leaves no half
/// review. The file is in WAL mode with a busy timeout, so several processes (two screens at once) can write to one
/// register; SQLite serialises their transactions. One instance may be shared by threads (calls are serialised).
/// Synchronous mode is NORMAL: a killed process loses nothing committed; a power cut may lose the last few
/// reviews, never part of one.
/// A new round starts when a reference's input files change; the same files reviewed again are a repeat review of
/// the same round and are compared with the round before.
/// </remarks>
public sealed class ReviewRegister : IDisposable
{
    /// <summary>File name of the register when none is given: <c>crosscheck-register.db</c>.</summary>
    public const string DefaultFileName = "crosscheck-register.db";

    /// <summary>Stored when the input files could not be hashed; never counts as "the same files".</summary>
    public const string HashUnavailable = "unavailable";

    private const string ReviewColumns =
        "id, reference, round, revision, title, submission, source, review_date, recorded_at, reviewer, tool_version, abs_tolerance, " +
        "rel_tolerance, minor_tolerance, moment_unit, input_hash, verdict, ends_agree, ends_minor, ends_discrepant, ends_missing, " +
        "ends_unmatched, major_flags, minor_flags, top_cause, finding_count";

    private readonly SqliteConnection _connection;
    private readonly TimeProvider _time;
    private readonly Lock _gate = new();

    private ReviewRegister(string path, SqliteConnection connection, int schemaVersion, TimeProvider time)
    {
        Path = path;
        _connection = connection;
        SchemaVersion = schemaVersion;
        _time = time;
    }

    /// <summary>The register file (full path).</summary>
    public string Path { get; }

    /// <summary>The schema version of the file after opening (the latest this version of CrossCheck knows).</summary>
    public int SchemaVersion { get; }

    /// <summary>The latest schema version this build writes.</summary>
    public static int LatestSchemaVersion => RegisterSchema.Latest(RegisterSchema.Migrations);

    /// <summary>Test seam: called inside the transaction after the review row is written and before its findings.</summary>
    internal Action<long>? AfterReviewRow { get; set; }

    /// <summary>Opens (creating if needed) the register at <paramref name="path"/> and brings its schema up to date.</summary>
    /// <param name="path">The register file.</param>
    /// <param name="time">The clock for the time each review is recorded (and the review date when a review has none).</param>
    /// <exception cref="RegisterException">The file is not a CrossCheck register, was written by a newer version, or cannot be opened.</exception>
    public static ReviewRegister Open(string path, TimeProvider? time = null) => Open(path, RegisterSchema.Migrations, TimeSpan.FromSeconds(30), time);

    internal static ReviewRegister Open(string path, IReadOnlyList<Migration> migrations, TimeSpan busyTimeout, TimeProvider? time = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        string full = System.IO.Path.GetFullPath(path);
        if (Directory.Exists(full)) throw new RegisterException($"register '{path}' is a folder; give the path of a register file.");
        // A device or a named pipe would hang SQLite or be overwritten by it (and its -wal file made beside /dev/null).
        if (FileFacts.Of(full).Kind is not (FileKind.Regular or FileKind.Missing) and var kind)
            throw new RegisterException($"register '{path}' is {FileFacts.Describe(kind)}; give the path of a register file.");
        string? dir = System.IO.Path.GetDirectoryName(full);
        if (dir is not null && !Directory.Exists(dir)) throw new RegisterException($"register '{path}': the folder '{dir}' does not exist.");
        var csb = new SqliteConnectionStringBuilder
        {
            DataSource = full,
            Mode = SqliteOpenMode.ReadWriteCreate,
            Pooling = false,
            DefaultTimeout = (int)Math.Ceiling(busyTimeout.TotalSeconds),
        };
        var connection = new SqliteConnection(csb.ToString());
        try
        {
            connection.Open();
            Execute(connection, null, string.Create(CultureInfo.InvariantCulture, $"PRAGMA busy_timeout = {(long)busyTimeout.TotalMilliseconds}"));
            Execute(connection, null, "PRAGMA journal_mode = WAL");
            Execute(connection, null, "PRAGMA synchronous = NORMAL");
            Execute(connection, null, "PRAGMA foreign_keys = ON");
            int version = Migrate(connection, path, migrations);
            return new ReviewRegister(full, connection, version, time ?? TimeProvider.System);
        }
        catch (SqliteException ex)
        {
            connection.Dispose();
            throw new RegisterException(Describe(path, ex), ex);
        }
        catch
        {
            connection.Dispose();
            throw;
        }
    }

    private static int Migrate(SqliteConnection c, string path, IReadOnlyList<Migration> migrations)
    {
        int latest = RegisterSchema.Latest(migrations);
        using var tx = c.BeginTransaction(deferred: false);
        long appId = Scalar<long>(c, tx, "PRAGMA application_id");
        int version = (int)Scalar<long>(c, tx, "PRAGMA user_version");
        long objects = Scalar<long>(c, tx, "SELECT count(*) FROM sqlite_master");
        if (appId != RegisterSchema.ApplicationId && (version != 0 || objects > 0 || appId != 0))
            throw new RegisterException($"'{path}' is an SQLite database but not a CrossCheck review register; give another --register path.");
        if (version > latest)
            throw new RegisterException(
                $"register '{path}' has schema version {version}, written by a newer CrossCheck; this version ({ToolInfo.Version}) knows up to version {latest}. Use a newer CrossCheck or another register.");
        foreach (var m in migrations.Where(m => m.Version > version).OrderBy(m => m.Version))
        {
            try
            {
                Execute(c, tx, m.Sql);
            }
            catch (SqliteException ex)
            {
                throw new RegisterException($"register '{path}': updating the schema to version {m.Version} ({m.Description}) failed: {ex.Message}", ex);
            }
        }
        if (version < latest || appId != RegisterSchema.ApplicationId)
        {
            Execute(c, tx, string.Create(CultureInfo.InvariantCulture, $"PRAGMA application_id = {RegisterSchema.ApplicationId}"));
            Execute(c, tx, string.Create(CultureInfo.InvariantCulture, $"PRAGMA user_version = {latest}"));
        }
        tx.Commit();
        return Math.Max(version, latest);
    }

    /// <summary>
    /// Records a review in one transaction and sets it against the previous round of the same reference.
    /// </summary>
    /// <param name="review">The review.</param>
    /// <param name="reference">The key of its rounds (usually <see cref="ReviewSummary.ReferenceOr"/>).</param>
    /// <param name="submissionName">The submission's file or folder name.</param>
    /// <param name="inputHash">Fingerprint of the input files (<see cref="Import.InputHash.Compute"/>); null when unavailable.</param>
    /// <exception cref="RegisterException">The register stayed locked by another writer beyond the busy timeout, or the disk failed.</exception>
    public RoundComparison Record(ReviewResult review, string reference, string submissionName, string? inputHash)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentException.ThrowIfNullOrWhiteSpace(reference);
        ArgumentNullException.ThrowIfNull(submissionName);
        string hash = string.IsNullOrEmpty(inputHash) ? HashUnavailable : inputHash;
        lock (_gate)
        {
            try
            {
                using var tx = _connection.BeginTransaction(deferred: false);
                var latest = QueryReviews(tx, "WHERE reference = $ref ORDER BY round DESC, id DESC LIMIT 1", ("$ref", reference)).FirstOrDefault();
                bool repeat = latest is not null && hash != HashUnavailable && latest.InputHash == hash;
                int round = latest is null ? 1 : repeat ? latest.Round : latest.Round + 1;
                long id = InsertReview(tx, review, reference, round, submissionName, hash);
                AfterReviewRow?.Invoke(id);
                InsertFindings(tx, id, review.Comments);
                var current = QueryReviews(tx, "WHERE id = $id", ("$id", id)).Single();
                var comparison = Compare(tx, current);
                tx.Commit();
                return comparison;
            }
            catch (SqliteException ex)
            {
                throw new RegisterException(Describe(Path, ex), ex);
            }
            catch (Exception ex) when (ex is InvalidCastException or OverflowException or InvalidOperationException or FormatException)
            {
                throw RegisterValues.Damaged(Path, ex);
            }
        }
    }

    /// <summary>Every review of <paramref name="reference"/>, oldest first, each set against the round before it.</summary>
    public IReadOnlyList<RoundComparison> History(string reference)
    {
        ArgumentNullException.ThrowIfNull(reference);
        return Read(tx => QueryReviews(tx, "WHERE reference = $ref ORDER BY round, id", ("$ref", reference)).Select(r => Compare(tx, r)).ToList());
    }

    /// <summary>Every reference in the register with its latest review, in ordinal order.</summary>
    public IReadOnlyList<RegisterReference> References() => Read(tx =>
    {
        var rows = new List<(string Ref, int Rounds, int Reviews, long Latest)>();
        using (var cmd = Command(tx, "SELECT reference, count(DISTINCT round), count(*), max(id) FROM reviews GROUP BY reference ORDER BY reference"))
        using (var r = cmd.ExecuteReader())
            while (r.Read()) rows.Add((r.GetString(0), r.GetInt32(1), r.GetInt32(2), r.GetInt64(3)));
        return rows.Select(x => new RegisterReference(x.Ref, x.Rounds, x.Reviews, QueryReviews(tx, "WHERE id = $id", ("$id", x.Latest)).Single()))
            .OrderBy(x => x.Reference, StringComparer.Ordinal).ToList();
    });

    /// <summary>Every review in the order recorded.</summary>
    public IReadOnlyList<RegisterReview> Reviews() => Read(tx => QueryReviews(tx, "ORDER BY id"));

    /// <summary>The findings of one review, in schedule order.</summary>
    public IReadOnlyList<RegisterFinding> Findings(long reviewId) => Read(tx => QueryFindings(tx, reviewId));

    /// <summary>
    /// Checks the file: SQLite's integrity check, foreign keys, every review's findings complete, rounds of each
    /// reference numbered 1, 2, 3 ... without gaps. Returns the problems found (none for a sound register).
    /// </summary>
    public IReadOnlyList<string> Check() => Read(tx =>
    {
        var problems = new List<string>();
        using (var cmd = Command(tx, "PRAGMA integrity_check"))
        using (var r = cmd.ExecuteReader())
            while (r.Read())
                if (r.GetString(0) != "ok") problems.Add("integrity: " + r.GetString(0));
        using (var cmd = Command(tx, "PRAGMA foreign_key_check"))
        using (var r = cmd.ExecuteReader())
            while (r.Read()) problems.Add($"finding row {r.GetValue(1)} refers to a review that does not exist");
        using (var cmd = Command(tx, "SELECT r.id, r.reference, r.round, r.finding_count, (SELECT count(*) FROM findings f WHERE f.review_id = r.id) FROM reviews r"))
        using (var r = cmd.ExecuteReader())
            while (r.Read())
                if (r.GetInt64(3) != r.GetInt64(4))
                    problems.Add($"review {r.GetInt64(0)} ({TextSafety.Clean(Convert.ToString(r.GetValue(1), CultureInfo.InvariantCulture))} round {TextSafety.Clean(Convert.ToString(r.GetValue(2), CultureInfo.InvariantCulture))}) should have {TextSafety.Clean(Convert.ToString(r.GetValue(3), CultureInfo.InvariantCulture))} findings but has {r.GetInt64(4)}");
        using (var cmd = Command(tx, "SELECT reference, group_concat(round) FROM (SELECT DISTINCT reference, round FROM reviews ORDER BY reference, round) GROUP BY reference"))
        using (var r = cmd.ExecuteReader())
            while (r.Read())
            {
                if (r.IsDBNull(0) || r.IsDBNull(1)) continue; // a row without a reference or round is reported below
                var rounds = r.GetString(1).Split(',').Select(x => int.TryParse(x, NumberStyles.Integer, CultureInfo.InvariantCulture, out int n) ? n : 0).Order().ToList();
                if (!rounds.SequenceEqual(Enumerable.Range(1, rounds.Count)))
                    problems.Add($"reference {TextSafety.Clean(r.GetString(0))} has rounds {string.Join(", ", rounds)} (expected 1 to {rounds.Count})");
            }
        // Values of the wrong kind (text where a count belongs, a missing verdict): what would make 'history' print nonsense.
        using (var cmd = Command(tx, $"SELECT {ReviewColumns} FROM reviews ORDER BY id"))
        using (var r = cmd.ExecuteReader())
            while (r.Read())
            {
                try
                {
                    RegisterValues.Check(r, Path);
                }
                catch (RegisterException ex)
                {
                    problems.Add(ex.Message);
                }
            }
        return problems;
    });

    /// <summary>The <c>reviews</c> table as CSV, one row per review (text from submissions defused for spreadsheets, <see cref="CsvOut"/>).</summary>
    public string ExportReviewsCsv()
    {
        using var csv = new CsvOut();
        csv.Header("id", "reference", "round", "revision", "title", "submission", "source", "review_date", "recorded_at", "reviewer",
            "tool_version", "abs_tolerance", "rel_tolerance", "minor_tolerance", "moment_unit", "input_hash", "verdict", "ends_agree", "ends_minor",
            "ends_discrepant", "ends_missing", "ends_unmatched", "major_flags", "minor_flags", "top_cause", "findings");
        foreach (var r in Reviews())
            csv.Number(r.Id).Text(r.Reference).Number(r.Round).Text(r.Revision).Text(r.Title).Text(r.Submission).Text(r.Source).Text(r.ReviewDate)
                .Text(r.RecordedAt).Text(r.Reviewer).Text(r.ToolVersion).Number(r.AbsoluteTolerance).Number(r.RelativeTolerance)
                .Number(r.MinorRelativeTolerance).Text(r.MomentUnit).Text(r.InputHash).Text(r.Verdict).Number(r.EndsAgree).Number(r.EndsMinor)
                .Number(r.EndsDiscrepant).Number(r.EndsMissing).Number(r.EndsUnmatched).Number(r.MajorFlags).Number(r.MinorFlags).Text(r.TopCause)
                .Number(r.FindingCount).End();
        return csv.ToString();
    }

    /// <summary>Every finding as CSV, one row per finding, with the review it belongs to.</summary>
    public string ExportFindingsCsv() => Read(tx =>
    {
        using var csv = new CsvOut();
        csv.Header("review_id", "reference", "round", "review_date", "comment_id", "kind", "severity", "case", "where", "comment", "source");
        using var cmd = Command(tx, """
            SELECT r.id, r.reference, r.round, r.review_date, f.comment_id, f.kind, f.severity, f.load_case, f.place, f.message, f.source
            FROM findings f JOIN reviews r ON r.id = f.review_id ORDER BY r.id, f.seq
            """);
        using var r = cmd.ExecuteReader();
        while (r.Read())
        {
            csv.Number(r.GetInt64(0)).Text(r.GetString(1)).Number(r.GetInt32(2));
            for (int i = 3; i <= 10; i++) csv.Text(r.GetString(i));
            csv.End();
        }
        return csv.ToString();
    });

    public void Dispose()
    {
        lock (_gate) _connection.Dispose();
    }

    private T Read<T>(Func<SqliteTransaction, T> body)
    {
        lock (_gate)
        {
            try
            {
                // A deferred transaction: one consistent snapshot, no write lock.
                using var tx = _connection.BeginTransaction(deferred: true);
                var result = body(tx);
                tx.Commit();
                return result;
            }
            catch (SqliteException ex)
            {
                throw new RegisterException(Describe(Path, ex), ex);
            }
            catch (Exception ex) when (ex is InvalidCastException or OverflowException or InvalidOperationException or FormatException)
            {
                throw RegisterValues.Damaged(Path, ex);
            }
        }
    }

    private long InsertReview(SqliteTransaction tx, ReviewResult review, string reference, int round, string submissionName, string hash)
    {
        var s = review.Submission;
        var o = review.Options;
        using var cmd = Command(tx, """
            INSERT INTO reviews (reference, round, revision, title, submission, source, review_date, recorded_at, reviewer, tool_version,
                abs_tolerance, rel_tolerance, minor_tolerance, moment_unit, input_hash, verdict, ends_agree, ends_minor, ends_discrepant,
                ends_missing, ends_unmatched, major_flags, minor_flags, top_cause, finding_count)
            VALUES ($reference, $round, $revision, $title, $submission, $source, $date, $recorded, $reviewer, $tool,
                $abs, $rel, $minor, $unit, $hash, $verdict, $agree, $eminor, $discrepant,
                $missing, $unmatched, $majorFlags, $minorFlags, $cause, $findings)
            RETURNING id
            """);
        Bind(cmd, ("$reference", reference), ("$round", round), ("$revision", s.Info.Revision), ("$title", s.Info.Title),
            ("$submission", submissionName), ("$source", s.Source),
            ("$date", Clock.Iso(o.Date ?? Clock.Today(_time))), ("$recorded", Clock.UtcStamp(_time)),
            ("$reviewer", o.Reviewer), ("$tool", ToolInfo.Version), ("$abs", o.AbsoluteTolerance), ("$rel", o.RelativeTolerance),
            ("$minor", o.MinorRelativeTolerance), ("$unit", s.Info.Units.Moment.Symbol), ("$hash", hash), ("$verdict", review.Verdict.Json()),
            ("$agree", review.CountEnds(EndStatus.Agree)), ("$eminor", review.CountEnds(EndStatus.Minor)),
            ("$discrepant", review.CountEnds(EndStatus.Discrepant)), ("$missing", review.CountEnds(EndStatus.Missing)),
            ("$unmatched", review.CountEnds(EndStatus.Unmatched)), ("$majorFlags", review.CountFlags(Severity.Major)),
            ("$minorFlags", review.CountFlags(Severity.Minor)), ("$cause", review.TopCause()?.Code), ("$findings", review.Comments.Count));
        return Convert.ToInt64(cmd.ExecuteScalar(), CultureInfo.InvariantCulture);
    }

    private void InsertFindings(SqliteTransaction tx, long reviewId, IReadOnlyList<ReviewComment> comments)
    {
        using var cmd = Command(tx, """
            INSERT INTO findings (review_id, seq, comment_id, kind, severity, load_case, place, message, source)
            VALUES ($review, $seq, $id, $kind, $severity, $case, $place, $message, $source)
            """);
        var p = new[] { "$review", "$seq", "$id", "$kind", "$severity", "$case", "$place", "$message", "$source" }
            .Select(n => cmd.Parameters.Add(new SqliteParameter(n, null))).ToArray();
        cmd.Prepare();
        int seq = 0;
        foreach (var c in comments)
        {
            int dash = c.Id.IndexOf('-', StringComparison.Ordinal);
            object[] values = [reviewId, ++seq, c.Id, dash > 0 ? c.Id[..dash] : c.Id, c.Severity.Json(), c.Case, c.Where, c.Text, c.Source];
            for (int i = 0; i < p.Length; i++) p[i].Value = values[i];
            cmd.ExecuteNonQuery();
        }
    }

    private RoundComparison Compare(SqliteTransaction tx, RegisterReview current)
    {
        var currentFindings = QueryFindings(tx, current.Id);
        var previous = QueryReviews(tx, "WHERE reference = $ref AND round < $round ORDER BY round DESC, id DESC LIMIT 1",
            ("$ref", current.Reference), ("$round", current.Round)).FirstOrDefault();
        bool repeat = QueryScalarLong(tx, "SELECT count(*) FROM reviews WHERE reference = $ref AND round = $round AND id < $id",
            ("$ref", current.Reference), ("$round", current.Round), ("$id", current.Id)) > 0;

        // The comment ids of the latest review of each earlier round, to say since when a comment has stood.
        var byRound = new Dictionary<int, HashSet<string>>();
        using (var cmd = Command(tx, """
            SELECT r.round, f.comment_id FROM findings f JOIN reviews r ON r.id = f.review_id
            WHERE r.id IN (SELECT max(id) FROM reviews WHERE reference = $ref AND round < $round GROUP BY round)
            """))
        {
            Bind(cmd, ("$ref", current.Reference), ("$round", current.Round));
            using var r = cmd.ExecuteReader();
            while (r.Read())
            {
                int round = r.GetInt32(0);
                if (!byRound.TryGetValue(round, out var set)) byRound[round] = set = new HashSet<string>(StringComparer.Ordinal);
                set.Add(r.GetString(1));
            }
        }
        int Since(string id, int from)
        {
            int k = from;
            while (k > 1 && byRound.TryGetValue(k - 1, out var ids) && ids.Contains(id)) k--;
            return k;
        }

        if (previous is null)
            return new RoundComparison(current, null, repeat, [],
                [], currentFindings.Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, current.Round, null)).ToList());
        var before = QueryFindings(tx, previous.Id).ToDictionary(f => f.CommentId, StringComparer.Ordinal);
        var now = currentFindings.Select(f => f.CommentId).ToHashSet(StringComparer.Ordinal);
        var closed = before.Values.Where(f => !now.Contains(f.CommentId))
            .Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, Since(f.CommentId, previous.Round), f.Severity)).ToList();
        var persisting = currentFindings.Where(f => before.ContainsKey(f.CommentId))
            .Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, Since(f.CommentId, current.Round), before[f.CommentId].Severity))
            .ToList();
        var fresh = currentFindings.Where(f => !before.ContainsKey(f.CommentId))
            .Select(f => new ComparedComment(f.CommentId, f.Severity, f.Case, f.Where, f.Text, current.Round, null)).ToList();
        return new RoundComparison(current, previous, repeat, closed, persisting, fresh);
    }

    private List<RegisterReview> QueryReviews(SqliteTransaction tx, string tail, params (string, object?)[] args)
    {
        using var cmd = Command(tx, $"SELECT {ReviewColumns} FROM reviews {tail}");
        Bind(cmd, args);
        using var r = cmd.ExecuteReader();
        var list = new List<RegisterReview>();
        while (r.Read())
        {
            RegisterValues.Check(r, Path);
            string? S(int i) => r.IsDBNull(i) ? null : r.GetString(i);
            list.Add(new RegisterReview(r.GetInt64(0), r.GetString(1), r.GetInt32(2), S(3), S(4), r.GetString(5), r.GetString(6), r.GetString(7),
                r.GetString(8), S(9), r.GetString(10), r.GetDouble(11), r.GetDouble(12), r.GetDouble(13), r.GetString(14), r.GetString(15),
                r.GetString(16), r.GetInt32(17), r.GetInt32(18), r.GetInt32(19), r.GetInt32(20), r.GetInt32(21), r.GetInt32(22), r.GetInt32(23),
                S(24), r.GetInt32(25)));
        }
        return list;
    }

    private List<RegisterFinding> QueryFindings(SqliteTransaction tx, long reviewId)
    {
        using var cmd = Command(tx, "SELECT comment_id, kind, severity, load_case, place, message, source FROM findings WHERE review_id = $id ORDER BY seq");
        Bind(cmd, ("$id", reviewId));
        using var r = cmd.ExecuteReader();
        var list = new List<RegisterFinding>();
        while (r.Read())
        {
            for (int i = 0; i < 7; i++)
                if (r.IsDBNull(i)) throw new RegisterException($"register '{Path}' is damaged: a finding of review {reviewId} has no value in '{r.GetName(i)}'. Run 'crosscheck register check'.");
            list.Add(new RegisterFinding(r.GetString(0), r.GetString(1), r.GetString(2), r.GetString(3), r.GetString(4), r.GetString(5), r.GetString(6)));
        }
        return list;
    }

    private long QueryScalarLong(SqliteTransaction tx, string sql, params (string, object?)[] args)
    {
        using var cmd = Command(tx, sql);
        Bind(cmd, args);
        return Convert.ToInt64(cmd.ExecuteScalar(), CultureInfo.InvariantCulture);
    }

    private SqliteCommand Command(SqliteTransaction tx, string sql)
    {
        var cmd = _connection.CreateCommand();
        cmd.Transaction = tx;
        cmd.CommandText = sql;
        return cmd;
    }

    private static void Bind(SqliteCommand cmd, params (string Name, object? Value)[] args)
    {
        foreach (var (name, value) in args) cmd.Parameters.AddWithValue(name, value ?? DBNull.Value);
    }

    private static void Execute(SqliteConnection c, SqliteTransaction? tx, string sql)
    {
        using var cmd = c.CreateCommand();
        cmd.Transaction = tx;
        cmd.CommandText = sql;
        cmd.ExecuteNonQuery();
    }

    private static T Scalar<T>(SqliteConnection c, SqliteTransaction? tx, string sql)
    {
        using var cmd = c.CreateCommand();
        cmd.Transaction = tx;
        cmd.CommandText = sql;
        return (T)Convert.ChangeType(cmd.ExecuteScalar()!, typeof(T), CultureInfo.InvariantCulture);
    }

    private static string Describe(string path, SqliteException ex) => ex.SqliteErrorCode switch
    {
        26 => $"'{path}' is not a CrossCheck review register (it is not an SQLite database).",
        5 or 6 => $"register '{path}' stayed locked by another writer beyond the busy timeout; try again when the other screen has finished.",
        8 => $"register '{path}' is read-only.",
        13 => $"register '{path}': the disk is full.",
        14 => $"register '{path}' cannot be opened (check the folder exists and is writable).",
        11 => $"register '{path}' is damaged (SQLite reports: {ex.Message}).",
        _ => $"register '{path}': {ex.Message}",
    };
}
