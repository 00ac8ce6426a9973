using System.Globalization;
using Npgsql;

namespace CrossCheck.Register;

/// <summary>The two kinds of register: an SQLite file (one checker, one machine) or a PostgreSQL database (an office).</summary>
public enum RegisterKind
{
    SqliteFile,
    PostgreSql,
}

/// <summary>
/// Where a register is, as the user wrote it: a file path (the SQLite register), a PostgreSQL URI
/// (<c>postgresql://user@host:port/database?sslmode=require</c>) or an Npgsql connection string
/// (<c>Host=office-db;Database=crosscheck;Username=checker</c>). <see cref="ToString"/> and <see cref="Display"/> name
/// the file, or the host and database only: never the user or the password.
/// </summary>
public sealed class RegisterLocation
{
    /// <summary>The environment variable that names the register when <c>--register</c> is not given.</summary>
    public const string EnvironmentVariable = "CROSSCHECK_REGISTER";

    private readonly string? _password;

    private RegisterLocation(RegisterKind kind, string display, string? filePath, string? connectionString, string? password)
    {
        Kind = kind;
        Display = display;
        FilePath = filePath;
        ConnectionString = connectionString;
        _password = password;
    }

    public RegisterKind Kind { get; }

    /// <summary>For messages: the file as given, or "PostgreSQL database 'x' on host:port".</summary>
    public string Display { get; }

    /// <summary>The SQLite file as given (null for a server).</summary>
    public string? FilePath { get; }

    /// <summary>True when the text the location was read from holds a password (it should live in the environment or ~/.pgpass).</summary>
    public bool HasPassword => !string.IsNullOrEmpty(_password);

    /// <summary>The Npgsql connection string, password included: for the driver only, never for a message.</summary>
    internal string? ConnectionString { get; }

    public override string ToString() => Display;

    /// <summary>Reads a register location: a PostgreSQL URI or connection string, else a file path.</summary>
    /// <exception cref="RegisterException">A URI or connection string that cannot be read (the message names no password).</exception>
    public static RegisterLocation Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        string t = text.Trim();
        if (t.Length == 0) throw new RegisterException("the register is empty: give a file path or a PostgreSQL connection.");
        if (t.StartsWith("postgresql://", StringComparison.OrdinalIgnoreCase) || t.StartsWith("postgres://", StringComparison.OrdinalIgnoreCase))
            return FromUri(t);
        if (LooksLikeConnectionString(t)) return FromConnectionString(t);
        return new RegisterLocation(RegisterKind.SqliteFile, text, text, null, null);
    }

    /// <summary>True when <paramref name="text"/> starts with an Npgsql keyword followed by <c>=</c> (<c>Host=...</c>).</summary>
    public static bool LooksLikeConnectionString(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        int eq = text.IndexOf('=', StringComparison.Ordinal);
        if (eq <= 0) return false;
        string key = text[..eq].Trim();
        if (key.Length == 0 || !key.All(c => char.IsAsciiLetter(c) || c == ' ')) return false;
        return new NpgsqlConnectionStringBuilder().ContainsKey(key);
    }

    /// <summary>Removes the password from a message (a driver's message should never hold it; this makes sure).</summary>
    internal string Redact(string message) =>
        string.IsNullOrEmpty(_password) || _password.Length < 2 ? message : message.Replace(_password, "********", StringComparison.Ordinal);

    private static RegisterLocation FromConnectionString(string text)
    {
        NpgsqlConnectionStringBuilder csb;
        try
        {
            csb = new NpgsqlConnectionStringBuilder(text);
        }
        catch (Exception ex) when (ex is ArgumentException or FormatException or InvalidCastException or OverflowException)
        {
            // The driver's message may quote the text, password included: name the keys instead.
            var keys = text.Split(';', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)
                .Select(p => p.Split('=', 2)[0].Trim()).Where(k => k.Length > 0 && !new NpgsqlConnectionStringBuilder().ContainsKey(k)).ToList();
            throw new RegisterException(keys.Count > 0
                ? $"the register's connection string has keywords PostgreSQL's driver does not know: {string.Join(", ", keys.Select(k => $"'{k}'"))}."
                : "the register's connection string cannot be read (write it as Host=...;Database=...;Username=...).");
        }
        return Server(csb);
    }

    private static RegisterLocation FromUri(string text)
    {
        string rest = text[(text.IndexOf("://", StringComparison.Ordinal) + 3)..];
        string query = "";
        int q = rest.IndexOf('?', StringComparison.Ordinal);
        if (q >= 0) (query, rest) = (rest[(q + 1)..], rest[..q]);
        var csb = new NpgsqlConnectionStringBuilder();
        int slash = rest.IndexOf('/', StringComparison.Ordinal);
        if (slash >= 0)
        {
            string db = Decode(rest[(slash + 1)..]);
            if (db.Length > 0) csb.Database = db;
            rest = rest[..slash];
        }
        int at = rest.LastIndexOf('@');
        if (at >= 0)
        {
            string user = rest[..at];
            int colon = user.IndexOf(':', StringComparison.Ordinal);
            if (colon >= 0) csb.Password = Decode(user[(colon + 1)..]);
            string name = Decode(colon >= 0 ? user[..colon] : user);
            if (name.Length > 0) csb.Username = name;
            rest = rest[(at + 1)..];
        }
        var hosts = rest.Split(',', StringSplitOptions.RemoveEmptyEntries).Select(HostAndPort).ToList();
        if (hosts.Count == 1)
        {
            csb.Host = hosts[0].Host;
            if (hosts[0].Port is { } port) csb.Port = port;
        }
        else if (hosts.Count > 1)
        {
            csb.Host = string.Join(",", hosts.Select(h => h.Port is { } p ? string.Create(CultureInfo.InvariantCulture, $"{h.Host}:{p}") : h.Host));
        }
        foreach (var pair in query.Split('&', StringSplitOptions.RemoveEmptyEntries))
        {
            var kv = pair.Split('=', 2);
            string key = Decode(kv[0]), value = kv.Length > 1 ? Decode(kv[1]) : "";
            string keyword = UriKeyword(key);
            if (keyword == "SSL Mode") value = value.Replace("-", "", StringComparison.Ordinal);
            try
            {
                csb[keyword] = value;
            }
            catch (Exception ex) when (ex is ArgumentException or FormatException or InvalidCastException or OverflowException)
            {
                throw new RegisterException($"the register address has a parameter PostgreSQL's driver cannot take: '{key}'.");
            }
        }
        return Server(csb);
    }

    private static (string Host, int? Port) HostAndPort(string spec)
    {
        string host = spec;
        int? port = null;
        int close = spec.LastIndexOf(']');
        int colon = spec.LastIndexOf(':');
        if (colon > close && (spec.StartsWith('[') || spec.IndexOf(':', StringComparison.Ordinal) == colon))
        {
            if (!int.TryParse(spec[(colon + 1)..], NumberStyles.None, CultureInfo.InvariantCulture, out int p) || p is < 1 or > 65535)
                throw new RegisterException($"the register address has a port that is not a number from 1 to 65535: '{spec[(colon + 1)..]}'.");
            port = p;
            host = spec[..colon];
        }
        if (host.StartsWith('[') && host.EndsWith(']')) host = host[1..^1];
        return (Decode(host), port);
    }

    /// <summary>The libpq URI parameters people write, as the driver's keywords; others are taken as keywords (underscores as spaces).</summary>
    private static string UriKeyword(string key) => key.ToLowerInvariant() switch
    {
        "user" => "Username",
        "dbname" => "Database",
        "sslmode" => "SSL Mode",
        "connect_timeout" => "Timeout",
        "application_name" => "Application Name",
        "target_session_attrs" => "Target Session Attributes",
        "sslrootcert" => "Root Certificate",
        "sslcert" => "SSL Certificate",
        "sslkey" => "SSL Key",
        _ => key.Replace('_', ' '),
    };

    private static string Decode(string s)
    {
        try
        {
            return Uri.UnescapeDataString(s);
        }
        catch (UriFormatException)
        {
            throw new RegisterException("the register address has a malformed %-escape.");
        }
    }

    private static RegisterLocation Server(NpgsqlConnectionStringBuilder csb)
    {
        string? password = csb.Password;
        csb.Timeout = csb.Timeout == 15 ? 10 : csb.Timeout; // Npgsql's default is 15 s; say sooner that a server cannot be reached
        string host = string.IsNullOrEmpty(csb.Host) ? "the default host (PGHOST or the local socket)" : csb.Host;
        if (csb.Host?.StartsWith('/') == true) host = $"the local socket in {csb.Host}";
        string port = csb.Port != 5432 && !string.IsNullOrEmpty(csb.Host) && !csb.Host.Contains(',', StringComparison.Ordinal) && !csb.Host.StartsWith('/')
            ? string.Create(CultureInfo.InvariantCulture, $":{csb.Port}") : "";
        string database = string.IsNullOrEmpty(csb.Database) ? "the user's default database" : $"database '{csb.Database}'";
        string schema = string.IsNullOrEmpty(csb.SearchPath) ? "" : $" (schema '{csb.SearchPath}')";
        return new RegisterLocation(RegisterKind.PostgreSql, $"PostgreSQL {database}{schema} on {host}{port}", null, csb.ConnectionString, password);
    }
}
