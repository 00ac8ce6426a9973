using System.CommandLine;
using System.Globalization;
using System.Text.RegularExpressions;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Review;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary><c>crosscheck review SUBMISSION</c>: the main job — compare, check, and write the memo.</summary>
internal static partial class ReviewCommand
{
    public static Command Create(CliIo io)
    {
        var submission = new Argument<string>("submission") { Description = "A folder of CSV tables, a single CSV file with [table] sections, or a text PDF." };
        var format = new Option<string>("--format", "-f") { Description = "Memo format: md, html or json.", DefaultValueFactory = _ => "md" };
        format.AcceptOnlyFromAmong("md", "html", "json");
        var output = new Option<string?>("--out", "-o") { Description = "Where to write the memo (default: <submission>-review.<format> in the current folder; json goes to standard output)." };
        var template = new Option<string?>("--template") { Description = "A Scriban template of your own for the md or html memo." };
        var reviewer = new Option<string?>("--reviewer") { Description = "Name of the checking engineer, printed in the memo." };
        var date = new Option<string?>("--date") { Description = "Review date (yyyy-mm-dd); default today." };
        var rel = new Option<double>("--tolerance") { Description = "Agreement band as a fraction of the case's peak moment.", DefaultValueFactory = _ => 0.01 };
        var abs = new Option<double>("--abs-tolerance") { Description = "Agreement floor in the submission's moment unit.", DefaultValueFactory = _ => 0.1 };
        var minor = new Option<double>("--minor-tolerance") { Description = "Differences up to this fraction of the peak are minor; beyond, discrepant.", DefaultValueFactory = _ => 0.05 };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print no summary." };
        var (maxPages, timeLimit) = CommandSupport.PdfLimitOptions();
        var cmd = new Command("review", "Recompute the end moments, check the claimed numbers, and write a review memo.")
        {
            submission, format, output, template, reviewer, date, rel, abs, minor, quiet, maxPages, timeLimit,
        };
        cmd.SetAction(pr =>
        {
            var limits = CommandSupport.Limits(pr, maxPages, timeLimit, io);
            if (limits is null) return ExitCodes.InputError;
            return Run(new Request(
                pr.GetValue(submission)!, pr.GetValue(format)!, pr.GetValue(output), pr.GetValue(template), pr.GetValue(reviewer), pr.GetValue(date),
                pr.GetValue(rel), pr.GetValue(abs), pr.GetValue(minor), pr.GetValue(quiet), limits), io);
        });
        return cmd;
    }

    private sealed record Request(string Path, string Format, string? Out, string? Template, string? Reviewer, string? Date,
        double Relative, double Absolute, double Minor, bool Quiet, Import.Pdf.PdfLimits Limits);

    private static int Run(Request r, CliIo io)
    {
        bool json = r.Format == "json";
        if (!(r.Relative >= 0) || !(r.Absolute >= 0) || !(r.Minor >= r.Relative))
        {
            io.Error.WriteLine("crosscheck: tolerances must be non-negative and --minor-tolerance must not be below --tolerance.");
            return ExitCodes.InputError;
        }
        DateOnly? date = null;
        if (r.Date is not null)
        {
            if (!DateOnly.TryParseExact(r.Date, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d))
            {
                io.Error.WriteLine($"crosscheck: --date '{r.Date}' is not a date of the form yyyy-mm-dd.");
                return ExitCodes.InputError;
            }
            date = d;
        }
        string? templateText = null;
        if (r.Template is not null)
        {
            if (json) { io.Error.WriteLine("crosscheck: --template applies to md and html memos, not json."); return ExitCodes.InputError; }
            if (!File.Exists(r.Template)) { io.Error.WriteLine($"crosscheck: template '{r.Template}' does not exist."); return ExitCodes.InputError; }
            templateText = File.ReadAllText(r.Template);
        }

        var imported = SubmissionReader.Read(r.Path, r.Limits);
        if (!imported.Succeeded)
        {
            var errors = imported.Errors.ToList();
            if (json) CommandSupport.Emit(r.Out, ReviewJson.WriteInputErrors(r.Path, errors), io, announce: r.Out is not null);
            io.Error.WriteLine($"crosscheck: '{r.Path}' could not be read ({errors.Count} problem{(errors.Count == 1 ? "" : "s")}):");
            foreach (var e in errors) io.Error.WriteLine($"  {e.Where.Compact}: {e.Message}");
            return ExitCodes.InputError;
        }
        var s = imported.Submission!;
        foreach (var w in imported.Warnings) io.Error.WriteLine($"warning: {w}");
        if (!new Analysis.FrameSolver().TrySolve(s.Model, s.Cases, out var analysis, out var problem))
        {
            var p = new InputProblem(new Model.SourceRef(System.IO.Path.GetFileName(System.IO.Path.TrimEndingDirectorySeparator(r.Path))), problem!.Message);
            if (json) CommandSupport.Emit(r.Out, ReviewJson.WriteInputErrors(r.Path, [p]), io, announce: r.Out is not null);
            io.Error.WriteLine($"crosscheck: '{r.Path}' cannot be analysed: {problem.Message}");
            return ExitCodes.InputError;
        }
        var options = new ReviewOptions(r.Absolute, r.Relative, r.Minor, r.Reviewer, date);
        var review = ReviewEngine.Review(s, analysis!, options, imported.Warnings.Select(w => w.ToString()));

        string content;
        try
        {
            content = json ? ReviewJson.Write(review) : RenderMemo(review, r.Format == "html" ? MemoFormat.Html : MemoFormat.Markdown, templateText, r.Template);
        }
        catch (MemoTemplateException ex)
        {
            io.Error.WriteLine($"crosscheck: the memo template has an error: {ex.Message}");
            return ExitCodes.InputError;
        }
        string? target = r.Out ?? (json ? null : DefaultMemoPath(r.Path, r.Format));
        CommandSupport.Emit(target, content, io, announce: false);
        if (!r.Quiet && !(json && target is null)) PrintSummary(review, target, io);
        return review.Verdict == Verdict.Concur ? ExitCodes.Concur : ExitCodes.Comments;
    }

    internal static string RenderMemo(ReviewResult review, MemoFormat format, string? templateText, string? templateName)
    {
        var model = MemoExtensions.Build(review, format);
        return templateText is null ? MemoRenderer.Render(model, format) : MemoRenderer.Render(model, templateText, templateName ?? "template");
    }

    private static string DefaultMemoPath(string submission, string format)
    {
        string name = System.IO.Path.GetFileNameWithoutExtension(System.IO.Path.TrimEndingDirectorySeparator(submission));
        name = UnsafeName().Replace(name, "_").Trim('.', '_');
        if (name.Length == 0) name = "submission";
        return $"{name}-review.{format}";
    }

    [GeneratedRegex(@"[^A-Za-z0-9._+-]+")]
    private static partial Regex UnsafeName();

    private static void PrintSummary(ReviewResult review, string? memoPath, CliIo io)
    {
        var console = CommandSupport.Console(io);
        var s = review.Submission;
        var mu = s.Info.Units.Moment;
        string colour = review.Verdict switch { Verdict.Concur => "green", Verdict.ConcurWithComments => "yellow", _ => "red" };
        console.MarkupLine($"[bold]{Markup.Escape(s.Info.Title ?? s.Source)}[/]  verdict: [bold {colour}]{Markup.Escape(review.Verdict.Words())}[/]");
        var counts = new Table().Border(TableBorder.Simple);
        foreach (var h in new[] { "case", "agree", "minor", "discrepant", "missing", "unmatched", "major flags", "minor flags", "likely cause" })
            counts.AddColumn(h);
        foreach (var c in review.Cases)
            counts.AddRow(Markup.Escape(c.Case), $"{c.Count(EndStatus.Agree)}", $"{c.Count(EndStatus.Minor)}", $"{c.Count(EndStatus.Discrepant)}",
                $"{c.Count(EndStatus.Missing)}", $"{c.Count(EndStatus.Unmatched)}", $"{c.Flags.Count(f => f.Severity == Severity.Major)}",
                $"{c.Flags.Count(f => f.Severity == Severity.Minor)}", Markup.Escape(c.Causes.FirstOrDefault()?.Code ?? "—"));
        console.Write(counts);
        var worst = review.AllEndMoments.Where(e => e.Status is EndStatus.Discrepant or EndStatus.Minor)
            .OrderByDescending(e => Math.Abs(e.Difference ?? 0)).Take(5).ToList();
        if (worst.Count > 0)
        {
            var t = new Table().Border(TableBorder.Simple).Title(Markup.Escape($"largest differences [{mu.Symbol}, clockwise]"));
            foreach (var h in new[] { "case", "member", "at", "claimed", "recomputed", "difference", "status" }) t.AddColumn(h);
            foreach (var e in worst)
                t.AddRow(Markup.Escape(e.Case), Markup.Escape(e.Member), Markup.Escape(e.At), Fmt.Number(mu.FromSi(e.Claimed ?? 0)),
                    Fmt.Number(mu.FromSi(e.Recomputed ?? 0)), Fmt.Number(mu.FromSi(e.Difference ?? 0)), e.Status.Json());
            console.Write(t);
        }
        foreach (var f in review.AllFlags.Where(f => f.Severity != Severity.Info).Take(8))
            console.MarkupLine($"  [{(f.Severity == Severity.Major ? "red" : "yellow")}]{f.Severity.Json()}[/] {Markup.Escape(f.Kind.Json())}, {Markup.Escape(f.Where)}");
        int more = review.AllFlags.Count(f => f.Severity != Severity.Info) - 8;
        if (more > 0) console.MarkupLine($"  ... and {more} more in the memo");
        if (memoPath is not null) console.MarkupLine($"memo: {Markup.Escape(memoPath)}");
    }
}
