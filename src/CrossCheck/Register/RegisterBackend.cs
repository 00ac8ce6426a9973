using System.Data.Common;

namespace CrossCheck.Register;

/// <summary>What the register's schema marker says about a database before any migration.</summary>
/// <param name="Version">The schema version recorded (0 for a database without a register).</param>
/// <param name="Marked">True when the database is marked as a CrossCheck register.</param>
/// <param name="Empty">True when it holds nothing at all (a new file, a new database or schema).</param>
/// <param name="Foreign">Why the database is not a register and must not become one, or null.</param>
internal sealed record SchemaState(int Version, bool Marked, bool Empty, string? Foreign);

/// <summary>
/// The database under a register: how to connect, which transactions to use, where the schema version lives, and
/// how to say in a sentence what went wrong. Everything else (the schema, the queries) is the same for both.
/// </summary>
internal abstract class RegisterBackend : IDisposable
{
    protected RegisterBackend(RegisterLocation location)
    {
        Location = location;
    }

    public RegisterLocation Location { get; }

    /// <summary>The register as it is shown: the full path of a file, or the host and database of a server.</summary>
    public abstract string Name { get; }

    /// <exception cref="RegisterException">The driver refuses the connection's settings.</exception>
    public static RegisterBackend For(RegisterLocation location, TimeSpan busyTimeout)
    {
        if (location.Kind != RegisterKind.PostgreSql) return new SqliteBackend(location, busyTimeout);
        try
        {
            return new PostgresBackend(location);
        }
        catch (Exception ex) when (ex is ArgumentException or InvalidOperationException or NotSupportedException)
        {
            throw new RegisterException(location.Redact($"{location.Display}: the connection's settings cannot be used: {ex.Message}"), ex);
        }
    }

    /// <summary>Refuses, before connecting, a register that reading must not create (a file that is not there).</summary>
    public abstract void RequireExisting();

    /// <summary>An open connection, set up for the register.</summary>
    public abstract DbConnection Connect();

    /// <summary>A transaction that writes: it holds its snapshot, and a clash with another writer shows as <see cref="IsWriteClash"/>.</summary>
    public abstract DbTransaction BeginWrite(DbConnection connection);

    /// <summary>The transaction that brings the schema up to date (after <see cref="LockSchema"/>, it must see what others committed).</summary>
    public virtual DbTransaction BeginSchema(DbConnection connection) => BeginWrite(connection);

    /// <summary>A transaction that only reads: one consistent snapshot, no lock that would hold up a writer.</summary>
    public abstract DbTransaction BeginRead(DbConnection connection);

    /// <summary>True when a write failed only because another writer got there first (run it again).</summary>
    public abstract bool IsWriteClash(Exception ex);

    /// <summary>True for the driver's own exceptions (the database, the connection, the file).</summary>
    public abstract bool IsDatabaseError(Exception ex);

    /// <summary>A sentence for the user, naming the register (never a password).</summary>
    public abstract string Describe(Exception ex);

    /// <summary>Serialises schema updates among processes opening the register at once.</summary>
    public virtual void LockSchema(RegisterTx tx) { }

    public abstract SchemaState ReadSchema(RegisterTx tx);

    public abstract void WriteSchema(RegisterTx tx, int version);

    public abstract string SqlOf(Migration migration);

    /// <summary>Problems the database itself finds in its storage (SQLite's integrity and foreign-key checks).</summary>
    public virtual IEnumerable<string> StorageProblems(RegisterTx tx) => [];

    /// <summary>After rows were copied in with their ids: the next id must follow them.</summary>
    public virtual void AfterCopy(RegisterTx tx) { }

    public virtual void Dispose() { }
}
