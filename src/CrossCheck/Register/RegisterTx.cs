using System.Data.Common;
using System.Globalization;

namespace CrossCheck.Register;

/// <summary>
/// One transaction on a register's connection, with the few ways the register talks to either database: commands
/// with <c>@name</c> parameters (both drivers read them), scalars, rows. Values are read through
/// <see cref="Convert"/>, because the two databases return integers of different widths.
/// </summary>
internal sealed class RegisterTx(DbConnection connection, DbTransaction transaction) : IDisposable
{
    public DbConnection Connection { get; } = connection;

    public DbTransaction Transaction { get; } = transaction;

    public DbCommand Command(string sql, params (string Name, object? Value)[] args)
    {
        var cmd = Connection.CreateCommand();
        cmd.Transaction = Transaction;
        cmd.CommandText = sql;
        foreach (var (name, value) in args) Add(cmd, name, value);
        return cmd;
    }

    /// <summary>Adds a parameter. Text never holds NUL (PostgreSQL refuses it in text): it is stored as U+FFFD on both back ends.</summary>
    public static DbParameter Add(DbCommand cmd, string name, object? value)
    {
        var p = cmd.CreateParameter();
        p.ParameterName = name;
        Set(p, value);
        cmd.Parameters.Add(p);
        return p;
    }

    /// <summary>Sets a parameter's value (null as SQL NULL, NUL in text as U+FFFD).</summary>
    public static void Set(DbParameter p, object? value) => p.Value = value switch
    {
        null => DBNull.Value,
        string s when s.Contains('\0', StringComparison.Ordinal) => s.Replace('\0', '\uFFFD'),
        _ => value,
    };

    public void Execute(string sql, params (string Name, object? Value)[] args)
    {
        using var cmd = Command(sql, args);
        cmd.ExecuteNonQuery();
    }

    public long Long(string sql, params (string Name, object? Value)[] args)
    {
        using var cmd = Command(sql, args);
        return Convert.ToInt64(cmd.ExecuteScalar(), CultureInfo.InvariantCulture);
    }

    public List<T> Rows<T>(string sql, Func<DbDataReader, T> map, params (string Name, object? Value)[] args)
    {
        using var cmd = Command(sql, args);
        using var r = cmd.ExecuteReader();
        var list = new List<T>();
        while (r.Read()) list.Add(map(r));
        return list;
    }

    public void Commit() => Transaction.Commit();

    public void Dispose() => Transaction.Dispose();

    public static int Int(DbDataReader r, int i) => Convert.ToInt32(r.GetValue(i), CultureInfo.InvariantCulture);

    public static long Int64(DbDataReader r, int i) => Convert.ToInt64(r.GetValue(i), CultureInfo.InvariantCulture);

    public static double Real(DbDataReader r, int i) => Convert.ToDouble(r.GetValue(i), CultureInfo.InvariantCulture);

    public static string? Text(DbDataReader r, int i) => r.IsDBNull(i) ? null : r.GetString(i);
}
