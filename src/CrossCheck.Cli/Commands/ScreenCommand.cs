using System.CommandLine;
using System.Globalization;
using CrossCheck.Jobs;
using CrossCheck.Memo;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary><c>crosscheck screen FOLDER</c>: reviews every submission in a folder and writes memos, a summary and an index.</summary>
internal static class ScreenCommand
{
    public static Command Create(CliIo io)
    {
        var folder = new Argument<string>("folder") { Description = "A folder of submissions: CSV files, PDFs, and sub-folders of CSV tables." };
        var output = new Option<string?>("--out", "-o") { Description = "Where the memos, summary.csv and index.html go (default: <folder>-screen in the current folder)." };
        var format = new Option<string>("--format", "-f") { Description = "Memo format: html or md.", DefaultValueFactory = _ => "html" };
        format.AcceptOnlyFromAmong("html", "md");
        var template = new Option<string?>("--template") { Description = "A Scriban template of your own for the memos." };
        var register = new Option<string?>("--register") { Description = $"The review register (default: {ReviewRegister.DefaultFileName} beside the folder)." };
        var noRegister = new Option<bool>("--no-register") { Description = "Record nothing; compare with no earlier round." };
        var jobs = new Option<int>("--jobs", "-j") { Description = "Submissions reviewed at once (default: one per processor).", DefaultValueFactory = _ => 0 };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print only the totals." };
        var settings = new ReviewSettings();
        var limitOptions = new LimitOptions();
        var cmd = new Command("screen", "Review every submission in a folder in parallel: a memo each, a summary table and CSV, and an HTML index.")
        {
            folder, output, format, template, register, noRegister, jobs, quiet,
        };
        settings.AddTo(cmd);
        limitOptions.AddTo(cmd);
        cmd.SetAction(pr =>
        {
            var options = settings.Read(pr, io);
            if (options is null) return ExitCodes.InputError;
            var limits = limitOptions.Read(pr, io);
            if (limits is null) return ExitCodes.InputError;
            return Run(pr.GetValue(folder)!, pr.GetValue(output), pr.GetValue(format)!, pr.GetValue(template), pr.GetValue(register),
                pr.GetValue(noRegister), pr.GetValue(jobs), pr.GetValue(quiet), options, limits, io);
        });
        return cmd;
    }

    private static int Run(string folder, string? outDir, string format, string? templatePath, string? registerPath, bool noRegister, int jobs, bool quiet,
        ReviewOptions review, Import.InputLimits limits, CliIo io)
    {
        if (!Directory.Exists(folder))
        {
            io.Error.WriteLine(File.Exists(folder)
                ? $"crosscheck: '{folder}' is a file; screen takes a folder of submissions (use 'crosscheck review' for one)."
                : $"crosscheck: the folder '{folder}' does not exist.");
            return ExitCodes.InputError;
        }
        if (jobs < 0)
        {
            io.Error.WriteLine("crosscheck: --jobs must be 0 (one per processor) or more.");
            return ExitCodes.InputError;
        }
        if (noRegister && registerPath is not null)
        {
            io.Error.WriteLine("crosscheck: give --register or --no-register, not both.");
            return ExitCodes.InputError;
        }
        MemoTemplateFile? template = null;
        if (templatePath is not null && !MemoTemplateFile.TryLoad(templatePath, out template, out var problem))
        {
            CommandSupport.Fail(problem, io);
            return ExitCodes.InputError;
        }
        outDir ??= Screener.DefaultOutputFolder(folder);
        if (Screener.IsScreenedFolder(folder, outDir))
        {
            io.Error.WriteLine("crosscheck: --out must not be the folder screened (its summary.csv would be taken for a submission next time).");
            return ExitCodes.InputError;
        }
        if (!noRegister) registerPath ??= Screener.DefaultRegisterPath(folder);
        var options = new ScreenOptions(review, outDir, format == "md" ? MemoFormat.Markdown : MemoFormat.Html, jobs, registerPath, template) { Limits = limits };

        var console = CommandSupport.Console(io);
        ScreenReport report;
        try
        {
            if (io.Interactive && !quiet)
            {
                ScreenReport? result = null;
                console.Progress().AutoClear(false).HideCompleted(false)
                    .Columns(new TaskDescriptionColumn(), new ProgressBarColumn(), new PercentageColumn(), new RemainingTimeColumn(), new SpinnerColumn())
                    .Start(ctx => result = Screener.Run(folder, options, new BarProgress(ctx)));
                report = result!;
            }
            else
            {
                report = Screener.Run(folder, options, quiet ? null : new LineProgress(io.Output));
            }
        }
        catch (RegisterException ex)
        {
            io.Error.WriteLine($"crosscheck: {ex.Message}");
            return ExitCodes.InputError;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            io.Error.WriteLine($"crosscheck: cannot write the screening results to '{outDir}': {ex.Message}");
            return ExitCodes.InputError;
        }

        PrintSummary(report, quiet, console);
        return ExitCode(report);
    }

    /// <summary>3 if anything went wrong inside CrossCheck, else 2 if any input error, else 1 if any revise or comments, else 0.</summary>
    internal static int ExitCode(ScreenReport report) =>
        report.Rows.Any(r => r.Outcome == ScreenOutcome.InternalError || r.Problem is not null) ? ExitCodes.InternalError
        : report.Rows.Any(r => r.Outcome == ScreenOutcome.InputError) ? ExitCodes.InputError
        : report.Rows.Any(r => r.Outcome is ScreenOutcome.Revise or ScreenOutcome.Comments) ? ExitCodes.Comments
        : ExitCodes.Concur;

    private static void PrintSummary(ScreenReport report, bool quiet, IAnsiConsole console)
    {
        if (!quiet && report.Rows.Count > 0)
        {
            var table = new Table().Border(TableBorder.Simple);
            table.AddColumn("submission");
            table.AddColumn("verdict");
            table.AddColumn(new TableColumn("discrepant ends").RightAligned());
            table.AddColumn("top cause / main finding");
            table.AddColumn(new TableColumn("round").RightAligned());
            table.AddColumn("against previous round");
            foreach (var r in report.Rows)
            {
                string colour = r.Outcome switch
                {
                    ScreenOutcome.Concur => "green",
                    ScreenOutcome.Comments => "yellow",
                    ScreenOutcome.Revise => "red",
                    _ => "bold",
                };
                string rounds = ScreenOutputs.RoundsText(r.Rounds);
                string what = r.Review is null ? r.ErrorText ?? "" : r.TopFinding + (r.Problem is null ? "" : $" ({r.Problem})");
                table.AddRow(Markup.Escape(r.Name), $"[{colour}]{Markup.Escape(ScreenOutputs.OutcomeWord(r.Outcome))}[/]",
                    r.Review is null ? "" : r.Discrepant.ToString(CultureInfo.InvariantCulture), Markup.Escape(what),
                    r.Rounds?.Review.Round.ToString(CultureInfo.InvariantCulture) ?? "", Markup.Escape(rounds));
            }
            console.Write(table);
            foreach (var g in report.Groups) console.WriteLine($"  {g.Sentence}");
            foreach (var note in report.Notes) console.WriteLine($"note: {note}");
        }
        string internalErrors = report.Count(ScreenOutcome.InternalError) > 0 ? $", {report.Count(ScreenOutcome.InternalError)} internal errors" : "";
        console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{report.Rows.Count} submissions: {report.Count(ScreenOutcome.Concur)} concur, {report.Count(ScreenOutcome.Comments)} concur-with-comments, {report.Count(ScreenOutcome.Revise)} revise, {report.Count(ScreenOutcome.InputError)} input errors{internalErrors} ({report.Elapsed.TotalSeconds:0.0} s, {report.SubmissionsPerSecond:0.#} per second, {report.Parallelism} at a time)."));
        console.WriteLine($"index: {Path.Combine(report.OutputFolder, Screener.IndexFile)}");
        console.WriteLine($"summary: {Path.Combine(report.OutputFolder, Screener.SummaryFile)}");
        if (report.RegisterPath is not null) console.WriteLine($"register: {report.RegisterPath}");
    }

    /// <summary>A progress bar per stage on a terminal.</summary>
    private sealed class BarProgress(ProgressContext ctx) : IScreenProgress
    {
        private ProgressTask? _review;
        private ProgressTask? _write;

        public void Begin(int submissions)
        {
            _review = ctx.AddTask("reviewing", maxValue: Math.Max(1, submissions));
            _write = ctx.AddTask("memos", maxValue: Math.Max(1, submissions));
            if (submissions == 0) { _review.Value = 1; _write.Value = 1; }
        }

        public void Reviewed(ScreenItem item, ScreenOutcome outcome, int done) => _review?.Increment(1);

        public void Written(ScreenRow row, int done) => _write?.Increment(1);
    }

    /// <summary>Plain lines when the output is not a terminal: one per submission reviewed, and any problem writing its outputs.</summary>
    private sealed class LineProgress(TextWriter output) : IScreenProgress
    {
        private int _total;

        public void Begin(int submissions)
        {
            _total = submissions;
            output.WriteLine($"screening {submissions} submission{(submissions == 1 ? "" : "s")}");
        }

        public void Reviewed(ScreenItem item, ScreenOutcome outcome, int done) =>
            output.WriteLine($"[{done}/{_total}] {item.Name}: {ScreenOutputs.OutcomeWord(outcome)}");

        public void Written(ScreenRow row, int done)
        {
            if (row.Problem is not null) output.WriteLine($"  {row.Name}: {row.Problem}");
        }
    }
}
