using System.CommandLine;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Model;
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
        var register = new Option<string?>("--register") { Description = RegisterChoice.Description("record nothing") + " Records the review and compares it with the previous round of the same reference." };
        var noRegister = new Option<bool>("--no-register") { Description = $"Record nothing, even when {RegisterLocation.EnvironmentVariable} names a register." };
        var working = new Option<bool>("--show-working") { Description = "Add CrossCheck's own moment-distribution working table to the memo." };
        var limitOptions = new LimitOptions();
        var cmd = new Command("review", "Recompute the end moments, check the claimed numbers, and write a review memo.")
        {
            submission, format, output, template,
        };
        settings.AddTo(cmd);
        cmd.Add(quiet);
        cmd.Add(register);
        cmd.Add(noRegister);
        cmd.Add(working);
        limitOptions.AddTo(cmd);
        cmd.SetAction(pr =>
        {
            var options = settings.Read(pr, io);
            if (options is null) return ExitCodes.InputError;
            options = options with { ShowWorking = pr.GetValue(working) };
            var limits = limitOptions.Read(pr, io);
            if (limits is null) return ExitCodes.InputError;
            if (!RegisterChoice.TryResolve(pr.GetValue(register), pr.GetValue(noRegister), null, io, out var registerLocation)) return ExitCodes.InputError;
            return Run(new Request(pr.GetValue(submission)!, pr.GetValue(format)!, pr.GetValue(output), pr.GetValue(template), options,
                pr.GetValue(quiet), registerLocation, limits), io);
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
        if (outcome.Bytes is not null) CommandSupport.WriteBytes(outcome.Bytes, io);
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
        if (!r.Quiet && outcome.Text is null && outcome.Bytes is null) PrintSummary(review, outcome.Rounds, outcome.WrittenTo, io);
        return review.Verdict == Verdict.Concur ? ExitCodes.Concur : ExitCodes.Comments;
    }

    private static void PrintSummary(ReviewResult review, RoundComparison? rounds, string? memoPath, CliIo io)
    {
        var console = CommandSupport.Console(io);
        var s = review.Submission;
        var quote = new Quoting(s);
        string colour = review.Verdict switch { Verdict.Concur => "green", Verdict.ConcurWithComments => "yellow", _ => "red" };
        CommandSupport.Line(console, (s.Info.Title ?? s.Source, new Style(decoration: Decoration.Bold)), ("  verdict: ", null),
            (review.Verdict.Json(), Style.Parse($"bold {colour}")));
        var counts = new Table().Border(TableBorder.Simple);
        counts.AddColumn("case");
        foreach (var h in new[] { "agree", "minor", "discrepant", "missing", "unmatched", "comments" }) counts.AddColumn(new TableColumn(h).RightAligned());
        counts.AddColumn("likely cause");
        foreach (var c in review.Cases)
        {
            int comments = review.Comments.Count(cm => cm.Cases.Contains(c.Case));
            counts.AddRow(CommandSupport.Cell(c.Case), Cell(c.Count(EndStatus.Agree)), Cell(c.Count(EndStatus.Minor)), Cell(c.Count(EndStatus.Discrepant)),
                Cell(c.Count(EndStatus.Missing)), Cell(c.Count(EndStatus.Unmatched)), Cell(comments), CommandSupport.Cell(c.AllCauses.FirstOrDefault()?.Kind.Term().Title ?? "—"));
        }
        console.Write(counts);
        var worst = review.AllEndMoments.Where(e => e.Status is EndStatus.Discrepant or EndStatus.Minor && e.Claim is not null && e.End is not null)
            .OrderByDescending(e => Math.Abs(e.Difference ?? 0)).Take(5).ToList();
        if (worst.Count > 0)
        {
            var t = new Table().Border(TableBorder.Simple).Title(Markup.Escape($"largest differences [{quote.ConventionNote}]"));
            foreach (var h in new[] { "case", "member", "at" }) t.AddColumn(h);
            foreach (var h in new[] { "claimed", "recomputed", "difference" }) t.AddColumn(new TableColumn(h).RightAligned());
            t.AddColumn("status");
            foreach (var e in worst)
            {
                var end = e.End!.Value;
                double diff = quote.MomentUnit.FromSi(s.Info.SignConvention.FromClockwise(e.Difference!.Value, end));
                t.AddRow(CommandSupport.Cell(e.Case), CommandSupport.Cell(e.Member), CommandSupport.Cell(e.At), CommandSupport.Cell(Quoting.ClaimNumber(e.Claim!)),
                    CommandSupport.Cell(quote.EndNumber(e.Recomputed!.Value, end)), CommandSupport.Cell(Fmt.Number(diff, "+0.0#;-0.0#;0.0")), CommandSupport.Cell(e.Status.Json()));
            }
            console.Write(t);
        }
        const int Listed = 8;
        foreach (var cm in review.Comments.Take(Listed))
        {
            string what = cm.Cause is { } cause ? cause.Term().Title : cm.Symptoms.Count > 0 ? Kind(cm.Symptoms[0].Kind) : "";
            CommandSupport.Line(console, ("  ", null), ($"{cm.Severity.Json(),-5}", Style.Parse(cm.Severity == Severity.Major ? "red" : "yellow")),
                ($" {cm.Id}  case {cm.Case}, {cm.Where}: {what}", null));
        }
        if (review.Comments.Count > Listed) console.MarkupLine($"  ... and {review.Comments.Count - Listed} more in the memo");
        if (rounds is not null) CommandSupport.Line(console, (RoundsLine(rounds), null));
        if (memoPath is not null) CommandSupport.Line(console, ("memo: " + memoPath, null));
    }

    private static Text Cell(int n) => CommandSupport.Cell(n.ToString(System.Globalization.CultureInfo.InvariantCulture));

    /// <summary>The words of a symptom's kind ("end moment", "joint equilibrium").</summary>
    private static string Kind(string code) => ReviewTerms.AllFlags.FirstOrDefault(t => t.Code == code)?.Title ?? code;

    /// <summary>One line about the register round: <c>register: round 2 of DEMO-FB-01 — 2 closed, 1 persisting, 1 new (against round 1)</c>.</summary>
    internal static string RoundsLine(RoundComparison c) =>
        c.Previous is null
            ? $"register: round {c.Review.Round} of {c.Review.Reference} (first round{(c.Repeat ? ", repeat review" : "")})"
            : $"register: round {c.Review.Round} of {c.Review.Reference}{(c.Repeat ? " (repeat review)" : "")} — {c.Closed.Count} closed, {c.Persisting.Count} persisting, {c.New.Count} new against round {c.Previous.Round}";
}
