using System.Data.Common;
using CrossCheck.Common;

namespace CrossCheck.Register;

/// <summary>
/// Brings a register's schema up to date when it is opened, in one write transaction: a database that is not a
/// register is refused, one written by a newer CrossCheck is refused before anything is written, and the
/// migrations it lacks are applied in order (all or none).
/// </summary>
internal static class SchemaMigrator
{
    /// <returns>The schema version after opening.</returns>
    /// <exception cref="RegisterException">Not a register, no register (when <paramref name="create"/> is false), newer, or a migration failed.</exception>
    public static int Migrate(RegisterBackend backend, DbConnection connection, IReadOnlyList<Migration> migrations, bool create)
    {
        int latest = RegisterSchema.Latest(migrations);
        using var tx = new RegisterTx(connection, backend.BeginSchema(connection));
        backend.LockSchema(tx);
        var state = backend.ReadSchema(tx);
        if (state.Foreign is not null) throw new RegisterException(state.Foreign);
        if (!create && !state.Marked)
            throw new RegisterException($"there is no register {(backend.Location.Kind == RegisterKind.SqliteFile ? $"at '{backend.Name}'" : $"in {backend.Name}")} ('crosscheck screen' and 'crosscheck review --register' create one).");
        if (state.Version > latest)
            throw new RegisterException(
                $"register {backend.Name} has schema version {state.Version}, written by a newer CrossCheck; this version ({ToolInfo.Version}) knows up to version {latest}. " +
                "Nothing was written to it. Use a newer CrossCheck or another register.");
        foreach (var m in migrations.Where(m => m.Version > state.Version).OrderBy(m => m.Version))
        {
            try
            {
                tx.Execute(backend.SqlOf(m));
            }
            catch (Exception ex) when (backend.IsDatabaseError(ex))
            {
                throw new RegisterException($"register {backend.Name}: updating the schema to version {m.Version} ({m.Description}) failed: {backend.Describe(ex)}", ex);
            }
        }
        if (state.Version < latest || !state.Marked) backend.WriteSchema(tx, latest);
        tx.Commit();
        return Math.Max(state.Version, latest);
    }
}
