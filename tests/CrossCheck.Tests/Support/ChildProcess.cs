using System.Diagnostics;

namespace CrossCheck.Tests.Support;

/// <summary>Starts CrossCheck's command line or the test tools as a separate process (to kill one, or to run two at once).</summary>
public static class ChildProcess
{
    private static string Dotnet => Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } p && File.Exists(p) ? p : "dotnet";

    /// <summary>The CLI (<c>crosscheck.dll</c>) copied beside the test assembly.</summary>
    public static Process Cli(params string[] args) => Start("crosscheck.dll", args);

    /// <summary>The CLI run in <paramref name="workingDirectory"/> (where default output paths land).</summary>
    public static Process CliIn(string workingDirectory, params string[] args) => Start("crosscheck.dll", args, workingDirectory);

    /// <summary>The test tools (<c>CrossCheck.TestTools.dll</c>): generator, register probe, timing harness.</summary>
    public static Process Tools(params string[] args) => Start("CrossCheck.TestTools.dll", args);

    private static Process Start(string dll, string[] args, string? workingDirectory = null)
    {
        var psi = new ProcessStartInfo(Dotnet)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        if (workingDirectory is not null) psi.WorkingDirectory = workingDirectory;
        psi.ArgumentList.Add("exec");
        psi.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, dll));
        foreach (var a in args) psi.ArgumentList.Add(a);
        return Process.Start(psi) ?? throw new InvalidOperationException($"could not start {dll}");
    }

    /// <summary>Waits for the process to end (failing the test after <paramref name="seconds"/>) and returns its exit code and output.</summary>
    public static (int Code, string Out, string Err) Finish(Process p, int seconds = 120)
    {
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(seconds * 1000))
        {
            p.Kill(entireProcessTree: true);
            throw new Shouldly.ShouldAssertException($"the child process did not finish within {seconds} s");
        }
        return (p.ExitCode, stdout.Result, stderr.Result);
    }
}
