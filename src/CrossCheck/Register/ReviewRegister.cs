using System.Data;
using System.Data.Common;
using CrossCheck.Common;
using CrossCheck.Review;

namespace CrossCheck.Register;

/// <summary>
/// The review register: every review (reference, round, date, reviewer, tool version, tolerances, a hash of the input
/// files, verdict and every finding with its stable comment id), so that a resubmission can be set against the
/// previous round. It lives in an SQLite file (one checker, one machine) or a PostgreSQL database (an office); both
/// hold the same tables and answer the same calls.
/// </summary>
/// <remarks>
/// Each review is written in one transaction: a process killed while writing leaves no half review. Several processes
/// may write to one register at once. SQLite admits one writer at a time; on PostgreSQL writers run side by side, and
/// two that would give a reference the same round collide on a unique index, the later one being run again on what
/// the first committed. Reads see one snapshot. One instance may be shared by threads (calls are serialised).
/// A new round starts when a reference's input files change; the same files reviewed again are a repeat review of the
/// same round and are compared with the round before.
/// </remarks>
public sealed class ReviewRegister : IDisposable
{
    /// <summary>File name of the register when none is given: <c>crosscheck-register.db</c>.</summary>
    public const string DefaultFileName = "crosscheck-register.db";

    /// <summary>Stored when the input files could not be hashed; never counts as "the same files".</summary>
    public const string HashUnavailable = "unavailable";

    /// <summary>Attempts at one write before giving up when other writers keep taking its round.</summary>
    private const int MaxAttempts = 50;

    private readonly TimeProvider _time;
    private readonly Lock _gate = new();
    private DbConnection _connection;

    private ReviewRegister(RegisterBackend backend, DbConnection connection, int schemaVersion, TimeProvider time)
    {
        Backend = backend;
        _connection = connection;
        SchemaVersion = schemaVersion;
        _time = time;
    }

    /// <summary>The register as it may be shown: the full path of the file, or "PostgreSQL database 'x' on host" (never a password).</summary>
    public string Path => Backend.Name;

    public RegisterLocation Location => Backend.Location;

    /// <summary>The schema version of the register after opening (the latest this version of CrossCheck knows).</summary>
    public int SchemaVersion { get; }

    /// <summary>The latest schema version this build writes.</summary>
    public static int LatestSchemaVersion => RegisterSchema.Latest(RegisterSchema.Migrations);

    /// <summary>Writes run again because another writer took their round first (on PostgreSQL), since opening.</summary>
    public int Retries { get; private set; }

    internal RegisterBackend Backend { get; }

    /// <summary>Test seam: called inside the transaction after the review row is written and before its findings.</summary>
    internal Action<long>? AfterReviewRow { get; set; }

    /// <summary>Opens (creating if needed) the register at <paramref name="location"/> (a file path, or a PostgreSQL URI or connection string).</summary>
    /// <param name="location">Where the register is (<see cref="RegisterLocation.Parse"/>).</param>
    /// <param name="time">The clock for the time each review is recorded (and the review date when a review has none).</param>
    /// <exception cref="RegisterException">Not a CrossCheck register, written by a newer version, or cannot be reached or opened.</exception>
    public static ReviewRegister Open(string location, TimeProvider? time = null) => Open(RegisterLocation.Parse(location), time);

    /// <inheritdoc cref="Open(string, TimeProvider?)"/>
    public static ReviewRegister Open(RegisterLocation location, TimeProvider? time = null) =>
        Open(location, RegisterSchema.Migrations, TimeSpan.FromSeconds(30), time, create: true);

    /// <summary>Opens a register that must already exist (reading never creates one).</summary>
    /// <exception cref="RegisterException">There is no register there, or it cannot be opened.</exception>
    public static ReviewRegister OpenExisting(RegisterLocation location, TimeProvider? time = null) =>
        Open(location, RegisterSchema.Migrations, TimeSpan.FromSeconds(30), time, create: false);

    internal static ReviewRegister Open(string location, IReadOnlyList<Migration> migrations, TimeSpan busyTimeout, TimeProvider? time = null) =>
        Open(RegisterLocation.Parse(location), migrations, busyTimeout, time, create: true);

    internal static ReviewRegister Open(RegisterLocation location, IReadOnlyList<Migration> migrations, TimeSpan busyTimeout, TimeProvider? time, bool create)
    {
        ArgumentNullException.ThrowIfNull(location);
        var backend = RegisterBackend.For(location, busyTimeout);
        DbConnection? connection = null;
        try
        {
            if (!create) backend.RequireExisting();
            connection = backend.Connect();
            int version = SchemaMigrator.Migrate(backend, connection, migrations, create);
            return new ReviewRegister(backend, connection, version, time ?? TimeProvider.System);
        }
        catch (Exception ex) when (backend.IsDatabaseError(ex))
        {
            connection?.Dispose();
            backend.Dispose();
            throw new RegisterException(backend.Describe(ex), ex);
        }
        catch
        {
            connection?.Dispose();
            backend.Dispose();
            throw;
        }
    }

    /// <summary>
    /// Records a review in one transaction and sets it against the previous round of the same reference.
    /// </summary>
    /// <param name="review">The review.</param>
    /// <param name="reference">The key of its rounds (usually <see cref="ReviewSummary.ReferenceOr"/>).</param>
    /// <param name="submissionName">The submission's file or folder name.</param>
    /// <param name="inputHash">Fingerprint of the input files (<see cref="Import.InputHash.Compute"/>); null when unavailable.</param>
    /// <exception cref="RegisterException">The register stayed locked or busy beyond its patience, or the database failed.</exception>
    public RoundComparison Record(ReviewResult review, string reference, string submissionName, string? inputHash)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentException.ThrowIfNullOrWhiteSpace(reference);
        ArgumentNullException.ThrowIfNull(submissionName);
        string hash = string.IsNullOrEmpty(inputHash) ? HashUnavailable : inputHash;
        return Write(tx => ReviewRecorder.Record(tx, _time, review, reference, submissionName, hash, AfterReviewRow));
    }

    /// <summary>Every review of <paramref name="reference"/>, oldest round first, each set against the round before it.</summary>
    public IReadOnlyList<RoundComparison> History(string reference)
    {
        ArgumentNullException.ThrowIfNull(reference);
        return Read(tx => RegisterQueries.Reviews(tx, "WHERE reference = @ref ORDER BY round, round_review", ("@ref", reference))
            .Select(r => RegisterQueries.Compare(tx, r)).ToList());
    }

    /// <summary>Every reference in the register with its latest review, in ordinal order.</summary>
    public IReadOnlyList<RegisterReference> References() => Read(RegisterQueries.References);

    /// <summary>Every review in the order recorded.</summary>
    public IReadOnlyList<RegisterReview> Reviews() => Read(tx => RegisterQueries.Reviews(tx, "ORDER BY id").Select(r => r.Row).ToList());

    /// <summary>The findings of one review, in schedule order.</summary>
    public IReadOnlyList<RegisterFinding> Findings(long reviewId) => Read(tx => RegisterQueries.Findings(tx, reviewId));

    /// <summary>
    /// Checks the register: the database's own checks (SQLite), every review's findings complete, rounds of each
    /// reference numbered without gaps, reviews within a round numbered without gaps and of one input hash.
    /// </summary>
    /// <returns>The problems found; empty when the register is sound.</returns>
    public IReadOnlyList<string> Check() => Read(tx => RegisterCheck.Problems(tx, Backend));

    /// <summary>How many reviews, references and findings the register holds, and a digest of all of them.</summary>
    public RegisterTally Tally() => Read(RegisterCheck.Tally);

    /// <summary>The <c>reviews</c> table as CSV, one row per review (text from submissions defused for spreadsheets, <see cref="CsvOut"/>).</summary>
    public string ExportReviewsCsv() => Read(RegisterExport.Reviews);

    /// <summary>Every finding as CSV, one row per finding, with the review it belongs to.</summary>
    public string ExportFindingsCsv() => Read(RegisterExport.Findings);

    /// <summary>Copies every review of this register into <paramref name="target"/>, which must be empty.</summary>
    /// <returns>The reviews and findings copied.</returns>
    public (int Reviews, int Findings) CopyTo(ReviewRegister target)
    {
        ArgumentNullException.ThrowIfNull(target);
        return RegisterCopy.Copy(this, target);
    }

    public void Dispose()
    {
        lock (_gate)
        {
            _connection.Dispose();
            Backend.Dispose();
        }
    }

    /// <summary>Runs <paramref name="body"/> in a read transaction (one snapshot, no write lock).</summary>
    internal T Read<T>(Func<RegisterTx, T> body)
    {
        lock (_gate)
        {
            try
            {
                using var tx = new RegisterTx(Connection(), Backend.BeginRead(_connection));
                var result = body(tx);
                tx.Commit();
                return result;
            }
            catch (Exception ex) when (Backend.IsDatabaseError(ex))
            {
                throw new RegisterException(Backend.Describe(ex), ex);
            }
            catch (Exception ex) when (ex is InvalidCastException or OverflowException or InvalidOperationException or FormatException)
            {
                throw RegisterValues.Damaged(Path, ex);
            }
        }
    }

    /// <summary>Runs <paramref name="body"/> in a write transaction, again when another writer took its round first.</summary>
    internal T Write<T>(Func<RegisterTx, T> body, bool retry = true)
    {
        lock (_gate)
        {
            for (int attempt = 1; ; attempt++)
            {
                try
                {
                    using var tx = new RegisterTx(Connection(), Backend.BeginWrite(_connection));
                    var result = body(tx);
                    tx.Commit();
                    return result;
                }
                catch (Exception ex) when (retry && Backend.IsWriteClash(ex) && attempt < MaxAttempts)
                {
                    Retries++;
                    // Writers that collided would collide again in step: wait a little, a different little each.
                    Thread.Sleep(Random.Shared.Next(1, 5 + Math.Min(attempt, 10) * 5));
                }
                catch (Exception ex) when (Backend.IsDatabaseError(ex))
                {
                    string why = Backend.IsWriteClash(ex) ? $"{Path}: other writers took the round {MaxAttempts} times running; try again." : Backend.Describe(ex);
                    throw new RegisterException(why, ex);
                }
                catch (Exception ex) when (ex is InvalidCastException or OverflowException or InvalidOperationException or FormatException)
                {
                    throw RegisterValues.Damaged(Path, ex);
                }
            }
        }
    }

    /// <summary>The connection, opened again if the server dropped it since the last call.</summary>
    private DbConnection Connection()
    {
        if (_connection.State != ConnectionState.Open)
        {
            _connection.Dispose();
            _connection = Backend.Connect();
        }
        return _connection;
    }
}
