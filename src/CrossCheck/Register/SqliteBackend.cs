using System.Data.Common;
using System.Globalization;
using CrossCheck.Common;
using Microsoft.Data.Sqlite;

namespace CrossCheck.Register;

/// <summary>
/// The register as one SQLite file (Microsoft.Data.Sqlite, no pooling, WAL, a busy timeout, synchronous NORMAL,
/// foreign keys on). A write is a <c>BEGIN IMMEDIATE</c> transaction: SQLite lets one writer in at a time, so two
/// writers never clash; a killed process leaves nothing half-written (the journal rolls it back).
/// </summary>
internal sealed class SqliteBackend(RegisterLocation location, TimeSpan busyTimeout) : RegisterBackend(location)
{
    private readonly string _path = location.FilePath!;

    public override string Name => Path.GetFullPath(_path);

    public override void RequireExisting()
    {
        if (!File.Exists(_path))
            throw new RegisterException($"there is no register at '{_path}' ('crosscheck screen' and 'crosscheck review --register' create one).");
    }

    public override DbConnection Connect()
    {
        string full = Path.GetFullPath(_path);
        if (Directory.Exists(full)) throw new RegisterException($"register '{_path}' is a folder; give the path of a register file.");
        // A device or a named pipe would hang SQLite or be overwritten by it (and its -wal file made beside /dev/null).
        if (FileFacts.Of(full).Kind is not (FileKind.Regular or FileKind.Missing) and var kind)
            throw new RegisterException($"register '{_path}' is {FileFacts.Describe(kind)}; give the path of a register file.");
        string? dir = Path.GetDirectoryName(full);
        if (dir is not null && !Directory.Exists(dir)) throw new RegisterException($"register '{_path}': the folder '{dir}' does not exist.");
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
            Pragma(connection, string.Create(CultureInfo.InvariantCulture, $"busy_timeout = {(long)busyTimeout.TotalMilliseconds}"));
            Pragma(connection, "journal_mode = WAL");
            Pragma(connection, "synchronous = NORMAL");
            Pragma(connection, "foreign_keys = ON");
            return connection;
        }
        catch
        {
            connection.Dispose();
            throw;
        }
    }

    public override DbTransaction BeginWrite(DbConnection connection) => ((SqliteConnection)connection).BeginTransaction(deferred: false);

    public override DbTransaction BeginRead(DbConnection connection) => ((SqliteConnection)connection).BeginTransaction(deferred: true);

    // SQLITE_CONSTRAINT_UNIQUE on the round index: cannot happen while BEGIN IMMEDIATE admits one writer, but a retry is right if it does.
    public override bool IsWriteClash(Exception ex) =>
        ex is SqliteException { SqliteExtendedErrorCode: 2067 } s && s.Message.Contains("round_review", StringComparison.Ordinal);

    public override bool IsDatabaseError(Exception ex) => ex is SqliteException;

    public override string Describe(Exception ex) => ex is not SqliteException s ? $"register '{_path}': {ex.Message}" : s.SqliteErrorCode switch
    {
        26 => $"'{_path}' is not a CrossCheck review register (it is not an SQLite database).",
        5 or 6 => $"register '{_path}' stayed locked by another writer beyond the busy timeout; try again when the other screen has finished.",
        8 => $"register '{_path}' is read-only.",
        13 => $"register '{_path}': the disk is full.",
        14 => $"register '{_path}' cannot be opened (check the folder exists and is writable).",
        11 => $"register '{_path}' is damaged (SQLite reports: {s.Message}).",
        _ => $"register '{_path}': {s.Message}",
    };

    public override SchemaState ReadSchema(RegisterTx tx)
    {
        long appId = tx.Long("PRAGMA application_id");
        int version = (int)tx.Long("PRAGMA user_version");
        long objects = tx.Long("SELECT count(*) FROM sqlite_master");
        bool marked = appId == RegisterSchema.ApplicationId;
        string? foreign = !marked && (version != 0 || objects > 0 || appId != 0)
            ? $"'{_path}' is an SQLite database but not a CrossCheck review register; give another --register path."
            : null;
        return new SchemaState(version, marked, objects == 0 && version == 0 && appId == 0, foreign);
    }

    public override void WriteSchema(RegisterTx tx, int version)
    {
        tx.Execute(string.Create(CultureInfo.InvariantCulture, $"PRAGMA application_id = {RegisterSchema.ApplicationId}"));
        tx.Execute(string.Create(CultureInfo.InvariantCulture, $"PRAGMA user_version = {version}"));
    }

    public override string SqlOf(Migration migration) => migration.Sqlite;

    public override IEnumerable<string> StorageProblems(RegisterTx tx)
    {
        foreach (var line in tx.Rows("PRAGMA integrity_check", r => r.GetString(0)))
            if (line != "ok") yield return "integrity: " + line;
        foreach (var row in tx.Rows("PRAGMA foreign_key_check", r => r.GetValue(1)))
            yield return $"finding row {row} refers to a review that does not exist";
    }

    private static void Pragma(SqliteConnection c, string pragma)
    {
        using var cmd = c.CreateCommand();
        cmd.CommandText = "PRAGMA " + pragma;
        cmd.ExecuteNonQuery();
    }
}
