using System.CommandLine;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Register;
using CrossCheck.Review;
using Spectre.Console;

namespace CrossCheck.Cli.Commands;

/// <summary><c>crosscheck review SUBMISSION</c>: the main job — compare, check, and write the memo.</summary>
internal static class ReviewCommand
{
    public static Command Create(CliIo io)
    {
        var submission = new Argument<string>("submission") { Description = "A folder of CSV tables, a single CSV file with [table] sections, or a text PDF." };
        var format = new Option<string>("--format", "-f") { Description = "Memo format: md, html (self-contained, with diagrams), pdf (the html memo printed by headless Chromium) or json.", DefaultValueFactory = _ => "md" };
        format.AcceptOnlyFromAmong("md", "html", "pdf", "json");
        var output = new Option<string?>("--out", "-o") { Description = "Where to write the memo (default: <submission>-review.<format> in the current folder; json goes to standard output)." };
        var template = new Option<string?>("--template") { Description = "A Scriban template of your own for the md or html memo (html templates also serve pdf)." };
        var settings = new ReviewSettings();
        var quiet = new Option<bool>("--quiet", "-q") { Description = "Print no summary." };
        var register = new Option<string?>("--register") { Description = "Record the review in this register file and compare it with the previous round of the same reference." };
        var working = new Option<bool>("--show-working") { Description = "Add CrossCheck's own moment-distribution working table to the memo." };
        var limitOptions = new LimitOptions();
        var cmd = new Command("review", "Recompute the end moments, check the claimed numbers, and write a review memo.")
        {
            submission, format, output, template,
        };
        settings.AddTo(cmd);
        cmd.Add(quiet);
        cmd.Add(register);
        cmd.Add(working);
        limitOptions.AddTo(cmd);
        cmd.SetAction(pr =>
        {
            var options = settings.Read(pr, io);
            if (options is null) return ExitCodes.InputError;
            options = options with { ShowWorking = pr.GetValue(working) };
            var limits = limitOptions.Read(pr, io);
            if (limits is null) return ExitCodes.InputError;
            return Run(new Request(pr.GetValue(submission)!, pr.GetValue(format)!, pr.GetValue(output), pr.GetValue(template), options,
                pr.GetValue(quiet), pr.GetValue(register), limits), io);
        });
        return cmd;
    }

    private sealed record Request(string Path, string Format, string? Out, string? Template, ReviewOptions Options, bool Quiet, string? Register,
        InputLimits Limits);

    private static int Run(Request r, CliIo io)
    {
        bool json = r.Format == "json";
        bool pdf = r.Format == "pdf";
        string? browser = null;
        if (pdf && (browser = PdfPrinter.FindBrowser()) is null)
        {
            io.Error.WriteLine($"crosscheck: {PdfPrinter.MissingBrowserMessage}");
            return ExitCodes.InputError;
        }
        string? templateText = null;
        if (r.Template is not null)
        {
            if (json) { io.Error.WriteLine("crosscheck: --template applies to md and html memos, not json."); return ExitCodes.InputError; }
            if (!File.Exists(r.Template)) { io.Error.WriteLine($"crosscheck: template '{r.Template}' does not exist."); return ExitCodes.InputError; }
            templateText = File.ReadAllText(r.Template);
            try
            {
                MemoRenderer.Validate(templateText, r.Template);
            }
            catch (MemoTemplateException ex)
            {
                io.Error.WriteLine($"crosscheck: the memo template has an error: {ex.Message}");
                return ExitCodes.InputError;
            }
        }

        var outcome = ReviewPipeline.Run(r.Path, r.Options, r.Limits);
        foreach (var w in outcome.Warnings) io.Error.WriteLine($"warning: {w}");
        if (outcome.Review is not { } review)
        {
            if (json) _ = CommandSupport.Emit(r.Out, ReviewJson.WriteInputErrors(r.Path, outcome.Errors), io, announce: r.Out is not null);
            CommandSupport.ReportErrors(r.Path, outcome, io);
            return ExitCodes.InputError;
        }

        RoundComparison? rounds = null;
        if (r.Register is not null)
        {
            try
            {
                using var register = ReviewRegister.Open(r.Register);
                rounds = register.Record(review, review.ReferenceOr(SubmissionNames.BaseName(r.Path)), SubmissionNames.DisplayName(r.Path),
                    InputHash.Compute(r.Path));
            }
            catch (RegisterException ex)
            {
                io.Error.WriteLine($"crosscheck: {ex.Message}");
                return ExitCodes.InputError;
            }
        }

        string content;
        try
        {
            content = json ? ReviewJson.Write(review, rounds) : RenderMemo(review, r.Format is "html" or "pdf" ? MemoFormat.Html : MemoFormat.Markdown, templateText, r.Template, rounds);
        }
        catch (MemoTemplateException ex)
        {
            io.Error.WriteLine($"crosscheck: the memo template has an error: {ex.Message}");
            return ExitCodes.InputError;
        }
        string? target = r.Out ?? (json ? null : DefaultMemoPath(r.Path, r.Format));
        if (pdf)
        {
            byte[] printed;
            try
            {
                printed = PdfPrinter.Print(content, browser!);
            }
            catch (PdfPrintException ex)
            {
                io.Error.WriteLine($"crosscheck: the PDF memo could not be printed: {ex.Message} Write it with --format html and print it from a browser instead.");
                return ExitCodes.InputError;
            }
            if (!CommandSupport.TryWrite(target!, () => AtomicFile.WriteBytes(target!, printed), io)) return ExitCodes.InputError;
        }
        else if (!CommandSupport.Emit(target, content, io, announce: false))
        {
            return ExitCodes.InputError;
        }
        if (!r.Quiet && !(json && target is null)) PrintSummary(review, rounds, target, io);
        return review.Verdict == Verdict.Concur ? ExitCodes.Concur : ExitCodes.Comments;
    }

    internal static string RenderMemo(ReviewResult review, MemoFormat format, string? templateText, string? templateName, RoundComparison? rounds = null)
    {
        var model = MemoExtensions.Build(review, format, rounds);
        return templateText is null ? MemoRenderer.Render(model, format) : MemoRenderer.Render(model, templateText, templateName ?? "template");
    }

    private static string DefaultMemoPath(string submission, string format) =>
        $"{SubmissionNames.SafeStem(SubmissionNames.BaseName(submission))}-review.{format}";

    private static void PrintSummary(ReviewResult review, RoundComparison? rounds, string? memoPath, CliIo io)
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
        if (rounds is not null) console.MarkupLine(Markup.Escape(RoundsLine(rounds)));
        if (memoPath is not null) console.MarkupLine($"memo: {Markup.Escape(memoPath)}");
    }

    /// <summary>One line about the register round: <c>register: round 2 of DEMO-FB-01 — 2 closed, 1 persisting, 1 new (against round 1)</c>.</summary>
    internal static string RoundsLine(RoundComparison c) =>
        c.Previous is null
            ? $"register: round {c.Review.Round} of {c.Review.Reference} (first round{(c.Repeat ? ", repeat review" : "")})"
            : $"register: round {c.Review.Round} of {c.Review.Reference}{(c.Repeat ? " (repeat review)" : "")} — {c.Closed.Count} closed, {c.Persisting.Count} persisting, {c.New.Count} new against round {c.Previous.Round}";
}
