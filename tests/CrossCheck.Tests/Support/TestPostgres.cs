using System.Reflection;
using CrossCheck.Register;
using Npgsql;
using Xunit.Sdk;

namespace CrossCheck.Tests.Support;

/// <summary>
/// The PostgreSQL server the register tests run against: <c>CROSSCHECK_TEST_POSTGRES</c> holds an Npgsql connection
/// string for a user that may create databases and schemas (<c>.ci/run</c> starts a throwaway cluster and sets it).
/// With <c>CI</c> set (as <c>.ci/run</c> sets it) and no server the PostgreSQL tests fail, saying so. On a developer's
/// machine without a server they are reported as skipped instead, so that a plain <c>dotnet test</c> on a fresh machine
/// passes.
/// </summary>
public static class TestPostgres
{
    public const string ServerVariable = "CROSSCHECK_TEST_POSTGRES";

    /// <summary>The database the tests make their registers in (one schema per test).</summary>
    public const string Database = "crosscheck_tests";

    private static readonly Lazy<PostgresServer> Instance = new(Start, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>Why the PostgreSQL tests are skipped, or null when they run (always null in CI).</summary>
    public static string? SkipReason
    {
        get
        {
            if (!string.IsNullOrWhiteSpace(Environment.GetEnvironmentVariable(ServerVariable))) return null;
            if (!string.IsNullOrEmpty(Environment.GetEnvironmentVariable("CI"))) return null;
            return $"not run: no PostgreSQL server (set {ServerVariable}, or run bash .ci/run, which starts one)";
        }
    }

    /// <summary>The server; fails the test loudly when none is configured.</summary>
    public static PostgresServer Server => Instance.Value;

    private static PostgresServer Start()
    {
        string? text = Environment.GetEnvironmentVariable(ServerVariable);
        if (string.IsNullOrWhiteSpace(text))
            throw new InvalidOperationException(
                $"No PostgreSQL server for the register tests: set {ServerVariable} to an Npgsql connection string for a user who may create " +
                $"databases (bash .ci/run starts a throwaway cluster and sets it; see DEVELOPERS.md). To report these tests as not run on a " +
                $"machine without a server, leave CI unset.");
        return new PostgresServer(new NpgsqlConnectionStringBuilder(text));
    }
}

/// <summary>A server the tests may create databases and schemas on; connections it hands out carry no password (it is in a passfile).</summary>
public sealed class PostgresServer
{
    private readonly NpgsqlConnectionStringBuilder _admin;

    internal PostgresServer(NpgsqlConnectionStringBuilder admin)
    {
        _admin = admin;
        Password = admin.Password ?? "";
        PassFile = Path.Combine(Path.GetTempPath(), $"crosscheck-pgpass-{Environment.ProcessId}");
        File.WriteAllText(PassFile, $"*:*:*:{Escape(admin.Username ?? "")}:{Escape(Password)}\n");
        if (!OperatingSystem.IsWindows()) File.SetUnixFileMode(PassFile, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        if (Scalar("postgres", $"SELECT count(*) FROM pg_database WHERE datname = '{TestPostgres.Database}'") == 0)
        {
            try
            {
                Execute("postgres", $"CREATE DATABASE {TestPostgres.Database}");
            }
            catch (PostgresException ex) when (ex.SqlState == PostgresErrorCodes.DuplicateDatabase)
            {
                // made by another test process meanwhile
            }
        }
    }

    public string Host => _admin.Host!;

    public int Port => _admin.Port;

    public string User => _admin.Username!;

    /// <summary>The test user's password (to check that it is never printed).</summary>
    public string Password { get; }

    /// <summary>A pgpass file holding the password, so that connections handed out need not.</summary>
    public string PassFile { get; }

    /// <summary>A connection string without the password: the database (default: the test database) and, optionally, the schema.</summary>
    public string Connection(string? database = null, string? schema = null)
    {
        var csb = new NpgsqlConnectionStringBuilder
        {
            Host = Host, Port = Port, Username = User, Database = database ?? TestPostgres.Database, Passfile = PassFile,
        };
        if (schema is not null) csb.SearchPath = schema;
        return csb.ConnectionString;
    }

    public void Execute(string database, string sql)
    {
        using var c = Open(database);
        using var cmd = new NpgsqlCommand(sql, c);
        cmd.ExecuteNonQuery();
    }

    public long Scalar(string database, string sql)
    {
        using var c = Open(database);
        using var cmd = new NpgsqlCommand(sql, c);
        return Convert.ToInt64(cmd.ExecuteScalar(), System.Globalization.CultureInfo.InvariantCulture);
    }

    public NpgsqlConnection Open(string database, string? schema = null)
    {
        var csb = new NpgsqlConnectionStringBuilder(_admin.ConnectionString) { Database = database };
        if (schema is not null) csb.SearchPath = schema;
        var c = new NpgsqlConnection(csb.ConnectionString);
        c.Open();
        return c;
    }

    private static string Escape(string s) => s.Replace("\\", "\\\\", StringComparison.Ordinal).Replace(":", "\\:", StringComparison.Ordinal);
}

/// <summary>Theory data: the PostgreSQL back end (skipped only as <see cref="TestPostgres.SkipReason"/> allows).</summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class PostgresDataAttribute : DataAttribute
{
    public PostgresDataAttribute()
    {
        Skip = TestPostgres.SkipReason!;
    }

    public override IEnumerable<object[]> GetData(MethodInfo testMethod) => [[RegisterKind.PostgreSql]];
}

/// <summary>A test that needs the PostgreSQL server (skipped only as <see cref="TestPostgres.SkipReason"/> allows).</summary>
[AttributeUsage(AttributeTargets.Method)]
public sealed class PostgresFactAttribute : FactAttribute
{
    public PostgresFactAttribute()
    {
        Skip = TestPostgres.SkipReason!;
    }
}

/// <summary>
/// A register for one test: an SQLite file in the test's folder, or a schema of its own in the test database (dropped
/// at the end). <see cref="Location"/> is what <c>--register</c> takes.
/// </summary>
public sealed class TestRegister : IDisposable
{
    private readonly string? _schema;

    private TestRegister(RegisterKind kind, string location, string? schema)
    {
        Kind = kind;
        Location = location;
        _schema = schema;
    }

    public RegisterKind Kind { get; }

    public string Location { get; }

    public ReviewRegister Open() => ReviewRegister.Open(Location);

    public static TestRegister Create(RegisterKind kind, string folder, string name = "reg.db")
    {
        if (kind == RegisterKind.SqliteFile) return new TestRegister(kind, Path.Combine(folder, name), null);
        var server = TestPostgres.Server;
        string schema = "t_" + Guid.NewGuid().ToString("N");
        server.Execute(TestPostgres.Database, $"CREATE SCHEMA {schema}");
        return new TestRegister(kind, server.Connection(schema: schema), schema);
    }

    /// <summary>Runs SQL on the register's own database as the test user (its schema first on the search path).</summary>
    public long Scalar(string sql)
    {
        if (_schema is null)
        {
            using var c = new Microsoft.Data.Sqlite.SqliteConnection($"Data Source={Location};Mode=ReadOnly;Pooling=False");
            c.Open();
            using var cmd = c.CreateCommand();
            cmd.CommandText = sql;
            return Convert.ToInt64(cmd.ExecuteScalar(), System.Globalization.CultureInfo.InvariantCulture);
        }
        using var pg = TestPostgres.Server.Open(TestPostgres.Database, _schema);
        using var command = new NpgsqlCommand(sql, pg);
        return Convert.ToInt64(command.ExecuteScalar(), System.Globalization.CultureInfo.InvariantCulture);
    }

    public void Dispose()
    {
        if (_schema is null) return;
        TestPostgres.Server.Execute(TestPostgres.Database, $"DROP SCHEMA IF EXISTS {_schema} CASCADE");
    }
}
