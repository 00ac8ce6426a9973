using System.Data;
using System.Data.Common;
using System.Net.Sockets;
using Npgsql;

namespace CrossCheck.Register;

/// <summary>
/// The register in a PostgreSQL database (Npgsql through its slim data source: the basic types only, so the native
/// build needs no reflection). Writes run at REPEATABLE READ: each review is one transaction on one snapshot, and two
/// writers that give a reference the same round collide on the unique index <see cref="RegisterSchema.RoundIndex"/>
/// (or on the snapshot), after which the later one runs again. Reads run at REPEATABLE READ too: one snapshot, so
/// <c>history</c> shows whole reviews while screens are writing.
/// </summary>
internal sealed class PostgresBackend : RegisterBackend
{
    /// <summary>The key of the advisory lock that serialises schema updates (any fixed number; "CCKR").</summary>
    private const long SchemaLock = RegisterSchema.ApplicationId;

    private readonly NpgsqlDataSource _source;

    public PostgresBackend(RegisterLocation location) : base(location)
    {
        var builder = new NpgsqlSlimDataSourceBuilder(location.ConnectionString!);
        builder.EnableTransportSecurity(); // an office server may require TLS (sslmode=require)
        _source = builder.Build();
    }

    public override string Name => Location.Display;

    public override void RequireExisting() { } // known only once connected: see ReadSchema

    public override DbConnection Connect() => _source.OpenConnection();

    public override DbTransaction BeginWrite(DbConnection connection) => ((NpgsqlConnection)connection).BeginTransaction(IsolationLevel.RepeatableRead);

    // READ COMMITTED: the statements after the advisory lock see a schema another process committed while this one waited.
    public override DbTransaction BeginSchema(DbConnection connection) => ((NpgsqlConnection)connection).BeginTransaction(IsolationLevel.ReadCommitted);

    public override DbTransaction BeginRead(DbConnection connection) => ((NpgsqlConnection)connection).BeginTransaction(IsolationLevel.RepeatableRead);

    public override bool IsWriteClash(Exception ex) => ex is PostgresException p && p.SqlState switch
    {
        PostgresErrorCodes.UniqueViolation => p.ConstraintName == RegisterSchema.RoundIndex,
        PostgresErrorCodes.SerializationFailure or PostgresErrorCodes.DeadlockDetected => true,
        _ => false,
    };

    public override bool IsDatabaseError(Exception ex) => ex is NpgsqlException or TimeoutException;

    public override string Describe(Exception ex)
    {
        string where = Location.Display;
        string sentence = ex switch
        {
            PostgresException p => p.SqlState switch
            {
                PostgresErrorCodes.InvalidPassword => $"the server refused the user name or password for {where}.",
                PostgresErrorCodes.InvalidAuthorizationSpecification =>
                    $"the server refuses this connection to {where} (its pg_hba.conf lets no such user connect from here, or the user does not exist).",
                PostgresErrorCodes.InvalidCatalogName => $"{where} does not exist on the server (create it with createdb, or correct the database name).",
                PostgresErrorCodes.InvalidSchemaName => $"the schema named for {where} does not exist (create it first).",
                PostgresErrorCodes.InsufficientPrivilege => $"{where}: permission denied ({p.MessageText}); ask the database owner to grant it.",
                PostgresErrorCodes.TooManyConnections => $"{where}: the server has too many connections; try again later.",
                PostgresErrorCodes.AdminShutdown or PostgresErrorCodes.CrashShutdown or PostgresErrorCodes.CannotConnectNow =>
                    $"{where}: the server is shutting down or starting up; try again.",
                PostgresErrorCodes.ReadOnlySqlTransaction => $"{where} is read-only (a standby server?); point the register at the primary.",
                PostgresErrorCodes.DiskFull => $"{where}: the server's disk is full.",
                _ => $"{where}: the server reports: {p.MessageText} ({p.SqlState}).",
            },
            NpgsqlException { InnerException: SocketException s } => $"cannot reach the server of {where}: {s.Message} (is it running, and are the host and port right?).",
            NpgsqlException { InnerException: TimeoutException } or TimeoutException =>
                $"the server of {where} did not answer in time (is the host right, and does a firewall let the port through?).",
            NpgsqlException n when n.Message.Contains("password", StringComparison.OrdinalIgnoreCase) && n.Message.Contains("provided", StringComparison.OrdinalIgnoreCase) =>
                $"the server of {where} asks for a password and none was given: put it in {RegisterLocation.EnvironmentVariable}, PGPASSWORD or ~/.pgpass.",
            NpgsqlException n => $"{where}: {n.Message}",
            _ => $"{where}: {ex.Message}",
        };
        return Location.Redact(sentence);
    }

    public override void LockSchema(RegisterTx tx) => tx.Execute("SELECT pg_advisory_xact_lock(@key)", ("@key", SchemaLock));

    public override SchemaState ReadSchema(RegisterTx tx)
    {
        var (marker, reviews, tables) = tx.Rows("""
            SELECT to_regclass('crosscheck_register') IS NOT NULL, to_regclass('reviews') IS NOT NULL,
                   (SELECT count(*) FROM pg_catalog.pg_tables WHERE schemaname = current_schema())
            """, r => (r.GetBoolean(0), r.GetBoolean(1), RegisterTx.Int64(r, 2)))[0];
        if (!marker)
        {
            string? foreign = reviews
                ? $"{Location.Display} holds a table 'reviews' that is not a CrossCheck register's; give the register a database or schema of its own."
                : null;
            return new SchemaState(0, false, tables == 0, foreign);
        }
        var rows = tx.Rows("SELECT application, schema_version FROM crosscheck_register", r => (App: r.GetString(0), Version: RegisterTx.Int(r, 1)));
        if (rows.Count != 1 || rows[0].App != RegisterSchema.PostgresMarker)
            return new SchemaState(0, false, false, $"{Location.Display} has a table 'crosscheck_register' that is not a CrossCheck register's marker.");
        return new SchemaState(rows[0].Version, true, false, null);
    }

    public override void WriteSchema(RegisterTx tx, int version)
    {
        tx.Execute("CREATE TABLE IF NOT EXISTS crosscheck_register (application text NOT NULL, schema_version integer NOT NULL)");
        tx.Execute("DELETE FROM crosscheck_register");
        tx.Execute("INSERT INTO crosscheck_register (application, schema_version) VALUES (@app, @version)",
            ("@app", RegisterSchema.PostgresMarker), ("@version", version));
    }

    public override string SqlOf(Migration migration) => migration.Postgres;

    public override void AfterCopy(RegisterTx tx) =>
        tx.Execute("SELECT setval(pg_get_serial_sequence('reviews', 'id'), (SELECT coalesce(max(id), 0) + 1 FROM reviews), false)");

    public override void Dispose() => _source.Dispose();
}
