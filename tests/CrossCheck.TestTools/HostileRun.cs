using System.Diagnostics;
using System.Globalization;

namespace CrossCheck.TestTools;

/// <summary>What a scenario must end in.</summary>
public enum Expect
{
    /// <summary>Refused: exit code 2 (or 1 for `register check` finding problems) with a `crosscheck:` sentence.</summary>
    Refused,
    /// <summary>Reviewed or run: exit code 0 or 1, with whatever the scenario's check asks of the outputs.</summary>
    Accepted,
    /// <summary>Stopped by a signal or finished: 0, 1, 2, 130 or 143, and a re-run completes it.</summary>
    Interrupted,
}

/// <summary>How a scenario ended, in the categories of the hostile-input report.</summary>
public enum Verdict
{
    ClearError,
    Reviewed,
    Crash,
    Hang,
    WrongAcceptance,
    Overwrite,
    Other,
    /// <summary>The scenario could not be set up on this machine; not counted.</summary>
    NotTried,
}

/// <summary>The end of one command run as a child process.</summary>
public sealed record Ran(int Code, string Out, string Err, bool TimedOut, TimeSpan Elapsed)
{
    public string All => Out + "\n" + Err;
}

/// <summary>
/// One hostile input or situation: made in its own folder, run through the command line as a separate process (so that a crash,
/// a hang or memory exhaustion is seen as it would be by a user), and judged.
/// </summary>
/// <param name="Category">Which class of hostility it belongs to.</param>
/// <param name="Name">What it is.</param>
/// <param name="Expect">What must happen.</param>
/// <param name="Setup">Makes the inputs in the folder and returns the command line (arguments after <c>crosscheck</c>).</param>
/// <param name="Check">Further checks once it has run (null: none); returns the verdict it finds wrong, or null when all is well.</param>
/// <param name="Protected">Paths (relative to the folder, or absolute) that must not change: inputs, devices, pipes.</param>
public sealed record Scenario(string Category, string Name, Expect Expect, Func<string, string[]> Setup, Func<string, Ran, Verdict?>? Check = null,
    IReadOnlyList<string>? Protected = null)
{
    /// <summary>Longest a command may take before it counts as a hang.</summary>
    public TimeSpan Timeout { get; init; } = TimeSpan.FromSeconds(90);

    /// <summary>For <see cref="Expect.Interrupted"/>: the signal sent and after how long.</summary>
    public (string Signal, TimeSpan After)? Interrupt { get; init; }
}

/// <summary>Runs scenarios as child processes of the CLI and sorts their ends into the report's categories.</summary>
public sealed partial class HostileRun(string cliDll)
{
    private static string Dotnet => Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } p && File.Exists(p) ? p : "dotnet";

    public Ran Cli(string folder, string[] args, TimeSpan timeout, (string Signal, TimeSpan After)? interrupt = null)
    {
        var psi = new ProcessStartInfo(Dotnet) { RedirectStandardOutput = true, RedirectStandardError = true, RedirectStandardInput = true, UseShellExecute = false, WorkingDirectory = folder };
        psi.ArgumentList.Add("exec");
        psi.ArgumentList.Add(cliDll);
        foreach (var a in args) psi.ArgumentList.Add(a);
        var clock = Stopwatch.StartNew();
        using var p = Process.Start(psi) ?? throw new InvalidOperationException("the CLI did not start");
        p.StandardInput.Close();
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (interrupt is { } s)
        {
            if (!p.WaitForExit(s.After))
            {
                using var kill = Process.Start(new ProcessStartInfo("kill", ["-" + s.Signal, p.Id.ToString(CultureInfo.InvariantCulture)]) { UseShellExecute = false });
                kill?.WaitForExit(5000);
            }
        }
        bool finished = p.WaitForExit(timeout);
        if (!finished) p.Kill(entireProcessTree: true);
        p.WaitForExit();
        return new Ran(finished ? p.ExitCode : -1, stdout.Result, stderr.Result, !finished, clock.Elapsed);
    }

    /// <summary>Runs one scenario in a fresh folder under <paramref name="root"/> and judges it.</summary>
    public (Verdict Verdict, string Why) Run(Scenario s, string root, int index)
    {
        string folder = Path.Combine(root, string.Create(CultureInfo.InvariantCulture, $"{index:D3}-{s.Category}"));
        Directory.CreateDirectory(folder);
        string[] args;
        try
        {
            args = s.Setup(folder);
        }
#pragma warning disable CA1031 // A scenario that cannot be set up here (SQLite refusing the damage asked for) is not tried.
        catch (Exception ex)
#pragma warning restore CA1031
        {
            return (Verdict.NotTried, "setup failed: " + ex.Message);
        }
        var before = Snapshot(folder, s.Protected ?? []);
        var ran = Cli(folder, args, s.Timeout, s.Interrupt);
        if (ran.TimedOut) return (Verdict.Hang, $"no end after {s.Timeout.TotalSeconds:0} s");
        if (ran.Code == 3 || StackTrace().IsMatch(ran.All) || ran.All.Contains("Unhandled exception", StringComparison.Ordinal)
            || ran.All.Contains("internal error", StringComparison.Ordinal) || (ran.Code is not (0 or 1 or 2 or 130 or 143) && !(ran.Code == 137 && s.Interrupt?.Signal == "KILL")))
            return (Verdict.Crash, $"exit {ran.Code}: {First(ran.Err)}");
        var after = Snapshot(folder, s.Protected ?? []);
        foreach (var (path, was) in before)
            if (after[path] != was) return (Verdict.Overwrite, $"{path} changed ({was} -> {after[path]})");
        if (ran.All.Contains('\u001b', StringComparison.Ordinal)) return (Verdict.Other, "an escape character reached the terminal");
        var verdict = s.Expect switch
        {
            Expect.Refused when ran.Code == 0 || (ran.Code == 1 && !args.Contains("check")) => (Verdict.WrongAcceptance, $"exit {ran.Code}"),
            // A screen says what is wrong with each submission in its row (summary, index, terminal table), not on standard error.
            Expect.Refused when !ran.Err.Contains("crosscheck:", StringComparison.Ordinal) && ran.Code == 2 && args[0] != "screen" => (Verdict.Other, "no sentence on standard error"),
            Expect.Refused => (Verdict.ClearError, First(ran.Err)),
            Expect.Accepted when ran.Code is 0 or 1 => (Verdict.Reviewed, ""),
            Expect.Accepted => (Verdict.Other, $"refused: {First(ran.Err)}"),
            _ => (Verdict.ClearError, $"exit {ran.Code}"),
        };
        if (s.Check?.Invoke(folder, ran) is { } wrong) return (wrong, "the scenario's check failed");
        if (Directory.EnumerateFiles(folder, "*.tmp", SearchOption.AllDirectories).Any()) return (Verdict.Other, "temporary files left behind");
        return verdict;
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"^\s+at [\w.`<>+]+\(.*\)", System.Text.RegularExpressions.RegexOptions.Multiline)]
    private static partial System.Text.RegularExpressions.Regex StackTrace();

    private static string First(string text) => text.Split('\n').FirstOrDefault(l => l.Length > 0)?.Trim() ?? "";

    /// <summary>What each protected path is: its kind and, for a regular file, its length and hash.</summary>
    private static Dictionary<string, string> Snapshot(string folder, IReadOnlyList<string> paths)
    {
        var map = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var p in paths)
        {
            string full = Path.IsPathRooted(p) ? p : Path.Combine(folder, p);
            var facts = Common.FileFacts.Of(full);
            string what = facts.Kind.ToString();
            if (facts.Kind == Common.FileKind.Regular)
                what += ":" + Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(File.ReadAllBytes(full)))[..16];
            map[p] = what;
        }
        return map;
    }
}

/// <summary>Makes the fresh set, runs it, and prints the counts per category (the `hostile` command of the test tools).</summary>
public static class HostileReport
{
    public static int Run(string cliDll, int variant, string demo)
    {
        string root = Directory.CreateTempSubdirectory("crosscheck-hostile-").FullName;
        var run = new HostileRun(cliDll);
        HostileSetMore.Runner = run;
        var scenarios = HostileSet.Make(variant, demo);
        var results = new List<(Scenario S, Verdict V, string Why)>();
        for (int i = 0; i < scenarios.Count; i++)
        {
            var (v, why) = run.Run(scenarios[i], root, i);
            results.Add((scenarios[i], v, why));
            if (v is not (Verdict.ClearError or Verdict.Reviewed)) Console.WriteLine($"  {v}: [{scenarios[i].Category}] {Clean(scenarios[i].Name)}: {Clean(why)}");
        }
        int notTried = results.RemoveAll(r => r.V == Verdict.NotTried);
        var verdicts = Enum.GetValues<Verdict>().Where(v => v != Verdict.NotTried).ToArray();
        Console.WriteLine();
        Console.WriteLine($"| category | tried | {string.Join(" | ", verdicts.Select(Words))} |");
        Console.WriteLine($"|---|---|{string.Concat(verdicts.Select(_ => "---|"))}");
        foreach (var g in results.GroupBy(r => r.S.Category))
            Console.WriteLine($"| {g.Key} | {g.Count()} | {string.Join(" | ", verdicts.Select(v => g.Count(r => r.V == v)))} |");
        Console.WriteLine($"| **all** | {results.Count} | {string.Join(" | ", verdicts.Select(v => results.Count(r => r.V == v)))} |");
        Console.WriteLine($"(variant {variant}; {notTried} scenario(s) could not be set up and are not counted; inputs left in {root})");
        return results.Any(r => r.V is Verdict.Crash or Verdict.Hang or Verdict.WrongAcceptance or Verdict.Overwrite) ? 1 : 0;
    }

    private static string Words(Verdict v) => v switch
    {
        Verdict.ClearError => "clear error",
        Verdict.Reviewed => "reviewed as it should be",
        Verdict.Crash => "crash",
        Verdict.Hang => "hang",
        Verdict.WrongAcceptance => "wrong acceptance",
        Verdict.Overwrite => "overwrite",
        _ => "other",
    };

    private static string Clean(string s) => Common.TextSafety.Clean(s);
}
