using System.Diagnostics;

namespace CrossCheck.Tests.Support;

/// <summary>Named pipes and links for the tests of hostile files (Linux: <c>mkfifo</c> from coreutils).</summary>
public static class SpecialFiles
{
    /// <summary>Makes a named pipe at <paramref name="path"/>.</summary>
    public static string Fifo(string path)
    {
        var p = Process.Start(new ProcessStartInfo("mkfifo", [path]) { UseShellExecute = false }) ?? throw new InvalidOperationException("mkfifo did not start");
        p.WaitForExit(10_000).ShouldBeTrue("mkfifo finished");
        p.ExitCode.ShouldBe(0);
        return path;
    }

    /// <summary>Makes a symbolic link at <paramref name="path"/> to <paramref name="target"/>.</summary>
    public static string Link(string path, string target)
    {
        File.CreateSymbolicLink(path, target);
        return path;
    }

    /// <summary>Runs <paramref name="work"/>, failing the test if it has not finished after <paramref name="seconds"/> (a hang).</summary>
    public static T Within<T>(int seconds, Func<T> work)
    {
        var task = Task.Run(work);
        task.Wait(TimeSpan.FromSeconds(seconds)).ShouldBeTrue($"did not finish within {seconds} s (a hang)");
        return task.Result;
    }
}
