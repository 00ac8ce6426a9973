using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Model;
using CrossCheck.Review;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary>What the commands share: reading a submission, reporting input problems, writing outputs.</summary>
internal static class CommandSupport
{
    /// <summary>Reads a submission; on failure prints every problem and returns null.</summary>
    public static Submission? Read(string path, CliIo io, bool quietWarnings = false, InputLimits? limits = null)
    {
        var result = SubmissionReader.Read(path, limits ?? InputLimits.Default);
        if (!quietWarnings)
            foreach (var w in result.Warnings) io.Error.WriteLine($"warning: {w}");
        if (result.Succeeded) return result.Submission;
        var errors = result.Errors.ToList();
        io.Error.WriteLine($"crosscheck: '{path}' could not be read ({errors.Count} problem{(errors.Count == 1 ? "" : "s")}):");
        foreach (var e in errors) io.Error.WriteLine($"  {e.Where.Compact}: {e.Message}");
        return null;
    }

    /// <summary>Prints why a submission has no review: the input problems, or why its structure cannot be analysed.</summary>
    public static void ReportErrors(string path, ReviewOutcome outcome, CliIo io)
    {
        var errors = outcome.Errors;
        if (outcome.StructureProblem is { } problem)
        {
            io.Error.WriteLine($"crosscheck: '{path}' cannot be analysed: {problem}");
            return;
        }
        io.Error.WriteLine($"crosscheck: '{path}' could not be read ({errors.Count} problem{(errors.Count == 1 ? "" : "s")}):");
        foreach (var e in errors) io.Error.WriteLine($"  {e.Where.Compact}: {e.Message}");
    }

    /// <summary>Solves; on a structural problem (mechanism, ...) prints it and returns null.</summary>
    public static AnalysisResult? Solve(Submission s, CliIo io)
    {
        if (new FrameSolver().TrySolve(s.Model, s.Cases, out var result, out var problem)) return result;
        io.Error.WriteLine($"crosscheck: '{s.Source}' cannot be analysed: {problem!.Message}");
        return null;
    }

    /// <summary>Writes to <paramref name="outPath"/> atomically, or to standard output when it is null; false (after a message) when the file cannot be written.</summary>
    public static bool Emit(string? outPath, string content, CliIo io, bool announce = true)
    {
        if (outPath is null) { io.Output.Write(content); return true; }
        if (!TryWrite(outPath, () => AtomicFile.WriteText(outPath, content), io)) return false;
        if (announce) io.Error.WriteLine($"wrote {outPath}");
        return true;
    }

    /// <summary>
    /// Runs <paramref name="write"/>; a path that cannot be written (a folder of that name, no permission, a missing
    /// drive) is the user's to fix, so it is reported in a sentence, not as an internal error. Nothing is left half-written.
    /// </summary>
    public static bool TryWrite(string path, Action write, CliIo io)
    {
        try
        {
            write();
            return true;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            io.Error.WriteLine($"crosscheck: cannot write '{path}': {ex.Message}");
            return false;
        }
    }

    public static IAnsiConsole Console(CliIo io)
    {
        var console = AnsiConsole.Create(new AnsiConsoleSettings
        {
            Out = new AnsiConsoleOutput(io.Output),
            Ansi = io.Interactive ? AnsiSupport.Detect : AnsiSupport.No,
            ColorSystem = io.Interactive ? ColorSystemSupport.Detect : ColorSystemSupport.NoColors,
            Interactive = io.Interactive ? InteractionSupport.Detect : InteractionSupport.No,
        });
        if (!io.Interactive) console.Profile.Width = 132; // files and pipes: wide enough for the tables
        return console;
    }
}
