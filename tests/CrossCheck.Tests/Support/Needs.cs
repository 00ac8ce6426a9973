namespace CrossCheck.Tests.Support;

/// <summary>
/// Tests that need a program besides .NET (Debian's chromium and chromedriver, LibreOffice, groff, enscript,
/// ghostscript). <c>.ci/run</c> installs them and sets <c>CI</c>, and with <c>CI</c> set these tests always run (a missing
/// program fails them, saying so). On a developer's machine without a program, the tests that need it are reported as
/// skipped, naming what to install, so that a plain <c>dotnet test</c> on a fresh machine passes.
/// </summary>
public static class Needs
{
    /// <summary>Why a test needing <paramref name="programs"/> is skipped here, or null when it runs.</summary>
    public static string? Missing(params string[] programs)
    {
        if (!string.IsNullOrEmpty(Environment.GetEnvironmentVariable("CI"))) return null;
        var missing = programs.Where(p => !OnPath(p)).ToList();
        return missing.Count == 0 ? null
            : $"not run: needs {string.Join(", ", missing)} (apt-get install chromium chromium-driver libreoffice-calc groff enscript ghostscript; .ci/run installs them)";
    }

    private static bool OnPath(string program) =>
        (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries)
            .Any(dir => File.Exists(Path.Combine(dir, program)));
}

/// <summary>A fact that needs the named programs (skipped only as <see cref="Needs.Missing"/> allows).</summary>
public sealed class FactNeedingAttribute : FactAttribute
{
    public FactNeedingAttribute(params string[] programs)
    {
        if (Needs.Missing(programs) is { } reason) Skip = reason;
    }
}

/// <summary>A theory that needs the named programs (skipped only as <see cref="Needs.Missing"/> allows).</summary>
public sealed class TheoryNeedingAttribute : TheoryAttribute
{
    public TheoryNeedingAttribute(params string[] programs)
    {
        if (Needs.Missing(programs) is { } reason) Skip = reason;
    }
}
