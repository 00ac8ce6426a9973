using CrossCheck.Register;

namespace CrossCheck.Cli.Commands;

/// <summary>
/// Which register a command uses: <c>--register</c>, else <c>CROSSCHECK_REGISTER</c> from the environment (so that a
/// server's password need not be typed where other users can read it), else the command's default.
/// </summary>
internal static class RegisterChoice
{
    public static string Description(string fallback) =>
        "The review register: an SQLite file, or a PostgreSQL database shared by an office (postgresql://user@host/database, or an Npgsql " +
        $"connection string such as Host=...;Database=...). Default: ${RegisterLocation.EnvironmentVariable} when set, else {fallback}.";

    /// <summary>The register to use, or null for none; false (after a message) when the options contradict each other.</summary>
    public static bool TryResolve(string? given, bool none, string? fallback, CliIo io, out string? location)
    {
        location = null;
        if (none)
        {
            if (given is null) return true;
            CommandSupport.Fail("give --register or --no-register, not both.", io);
            return false;
        }
        if (given is not null)
        {
            WarnOfPassword(given, io);
            location = given;
            return true;
        }
        string? fromEnvironment = io.Variable(RegisterLocation.EnvironmentVariable);
        location = string.IsNullOrWhiteSpace(fromEnvironment) ? fallback : fromEnvironment;
        return true;
    }

    /// <summary>For commands that always need a register (history, register export and check).</summary>
    public static string Resolve(string? given, CliIo io)
    {
        TryResolve(given, false, ReviewRegister.DefaultFileName, io, out var location);
        return location!;
    }

    private static void WarnOfPassword(string given, CliIo io)
    {
        try
        {
            if (RegisterLocation.Parse(given).HasPassword)
                io.Error.WriteLine($"warning: the register's password is on the command line, where other users of this machine can read it; put the connection in {RegisterLocation.EnvironmentVariable}, or the password in PGPASSWORD or ~/.pgpass.");
        }
        catch (RegisterException)
        {
            // Reported when the register is opened.
        }
    }
}
