using CrossCheck.Analysis;
using System.CommandLine;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Memo;
using CrossCheck.Model;
using CrossCheck.Review;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary>What the commands share: reading a submission, reporting input problems, writing outputs.</summary>
internal static class CommandSupport
{
    /// <summary>The options that bound the work of reading a PDF.</summary>
    public static (Option<int> MaxPages, Option<double> TimeLimit) PdfLimitOptions() =>
    (
        new Option<int>("--max-pages") { Description = "Read PDFs of at most this many pages.", DefaultValueFactory = _ => PdfLimits.Default.MaxPages },
        new Option<double>("--time-limit") { Description = "Give up reading a PDF after this many seconds.", DefaultValueFactory = _ => PdfLimits.Default.TimeBudget.TotalSeconds }
    );

    /// <summary>The PDF limits asked for; null (after a message) when they make no sense.</summary>
    public static PdfLimits? Limits(ParseResult pr, Option<int> maxPages, Option<double> timeLimit, CliIo io)
    {
        int pages = pr.GetValue(maxPages);
        double seconds = pr.GetValue(timeLimit);
        if (pages < 1 || !(seconds > 0) || seconds > 3600)
        {
            io.Error.WriteLine("crosscheck: --max-pages must be at least 1 and --time-limit between 0 and 3600 seconds.");
            return null;
        }
        return PdfLimits.Default with { MaxPages = pages, TimeBudget = TimeSpan.FromSeconds(seconds) };
    }

    /// <summary>Reads a submission; on failure prints every problem and returns null.</summary>
    public static Submission? Read(string path, CliIo io, bool quietWarnings = false, PdfLimits? limits = null)
    {
        var result = SubmissionReader.Read(path, limits);
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

    /// <summary>Writes to <paramref name="outPath"/> atomically, or to standard output when it is null.</summary>
    public static void Emit(string? outPath, string content, CliIo io, bool announce = true)
    {
        if (outPath is null) { io.Output.Write(content); return; }
        AtomicFile.WriteText(outPath, content);
        if (announce) io.Error.WriteLine($"wrote {outPath}");
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
