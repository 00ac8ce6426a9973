using System.CommandLine;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
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
        var format = r.Format switch { "html" => ReviewFormat.Html, "pdf" => ReviewFormat.Pdf, "json" => ReviewFormat.Json, _ => ReviewFormat.Markdown };
        var outcome = new ReviewJob().Run(new ReviewRequest(r.Path, r.Options, format)
        {
            Limits = r.Limits, OutputPath = r.Out, TemplatePath = r.Template, RegisterPath = r.Register,
        });
        CommandSupport.Warnings(outcome.Warnings, io);
        if (outcome.Text is not null) io.Output.Write(outcome.Text);
        switch (outcome.Status)
        {
            case ReviewJobStatus.Refused:
                CommandSupport.Fail(outcome.Problem!, io);
                return ExitCodes.InputError;
            case ReviewJobStatus.InputError:
                if (outcome.WrittenTo is not null) io.Error.WriteLine($"wrote {outcome.WrittenTo}");
                if (outcome.Problem is not null) CommandSupport.Fail(outcome.Problem, io);
                CommandSupport.ReportErrors(r.Path, outcome.Errors, outcome.StructureProblem, io);
                return ExitCodes.InputError;
        }
        var review = outcome.Review!;
        if (!r.Quiet && outcome.Text is null) PrintSummary(review, outcome.Rounds, outcome.WrittenTo, io);
        return review.Verdict == Verdict.Concur ? ExitCodes.Concur : ExitCodes.Comments;
    }

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
                $"{c.Flags.Count(f => f.Severity == Severity.Minor)}", Markup.Escape(c.AllCauses.FirstOrDefault()?.Code ?? "—"));
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
