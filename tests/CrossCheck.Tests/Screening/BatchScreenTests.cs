using System.Text.RegularExpressions;
using CrossCheck.Cli;
using CrossCheck.Cli.Commands;
using CrossCheck.Memo;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;
using CrossCheck.TestTools;

namespace CrossCheck.Tests.Screening;

/// <summary>
/// Screening a folder of generated submissions. The "correct" claims come from CrossCheck's own solver and the
/// wrong ones are altered from them on purpose: these tests check the batch mechanics (every submission reviewed,
/// counted, grouped, written and recorded), not the solver, which the reference tests check against handbooks.
/// </summary>
public partial class BatchScreenTests
{
    private static readonly ReviewOptions Options = new(Reviewer: "B. Screening", Date: new DateOnly(2026, 12, 1));

    private static ScreenOutcome Outcome(Expected e) => e switch
    {
        Expected.Concur => ScreenOutcome.Concur,
        Expected.Comments => ScreenOutcome.Comments,
        Expected.Revise => ScreenOutcome.Revise,
        _ => ScreenOutcome.InputError,
    };

    [Fact]
    public void Screen_SixtyGeneratedSubmissions_CountsGroupsAndFilesMatchWhatWasPlanted()
    {
        var plan = BatchPlan.For(60); // 24 correct, 6 with an end left out, 6 wrong claims, 6 sign flips, 6 sway omitted, 12 broken
        plan.Total.ShouldBe(60);
        using var batch = new GeneratedBatch(plan, variant: 11);
        var report = Screener.Run(batch.Folder, new ScreenOptions(Options, batch.Out, MemoFormat.Html, Parallelism: 2, RegisterPath: batch.Register));

        report.Rows.Count.ShouldBe(60);
        report.Count(ScreenOutcome.Concur).ShouldBe(24);
        report.Count(ScreenOutcome.Comments).ShouldBe(6);
        report.Count(ScreenOutcome.Revise).ShouldBe(18);
        report.Count(ScreenOutcome.InputError).ShouldBe(12);
        report.Count(ScreenOutcome.InternalError).ShouldBe(0);
        report.Rows.ShouldAllBe(r => r.Problem == null);
        ScreenCommand.ExitCode(report).ShouldBe(ExitCodes.InputError);

        // Each submission individually, by name.
        var byName = report.Rows.ToDictionary(r => r.Item.Name);
        foreach (var g in batch.Submissions)
        {
            var row = byName[Path.GetFileName(g.Path)];
            row.Outcome.ShouldBe(Outcome(g.Expected), $"{g.Name} ({g.Planted}, {g.Scenario})");
            if (g.Expected == Expected.InputError)
            {
                row.Errors.ShouldNotBeEmpty();
                row.ErrorText.ShouldNotBeNullOrWhiteSpace();
                row.Group.Kind.ShouldBe(ScreenGroupKind.InputError);
            }
            if (g.Planted == Planted.SwayOmitted) row.Group.ShouldBe(new ScreenGroupKey(ScreenGroupKind.Cause, "sway-omitted"), g.Name);
            if (g.Planted == Planted.Correct) row.Group.Kind.ShouldBe(ScreenGroupKind.Concur);
        }

        // Rows worst first; groups add up to the batch; the largest group first.
        report.Rows.Select(r => r.Outcome).ShouldBe(report.Rows.Select(r => r.Outcome).OrderDescending());
        report.Groups.Sum(g => g.Count).ShouldBe(60);
        report.Groups[0].Key.Kind.ShouldBe(ScreenGroupKind.Concur);
        report.Groups[0].Count.ShouldBe(24);
        report.Groups.Single(g => g.Key == new ScreenGroupKey(ScreenGroupKind.Cause, "sway-omitted")).Count.ShouldBeGreaterThanOrEqualTo(6);
        report.Groups.Single(g => g.Key.Kind == ScreenGroupKind.InputError).Sentence.ShouldBe("12 submissions — could not be read or analysed");

        // A memo per reviewed submission, an error list per broken one, nothing else but the summary and the index.
        var files = Directory.GetFiles(batch.Out).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
        files.Count(f => f!.EndsWith("-review.html", StringComparison.Ordinal)).ShouldBe(48);
        files.Count(f => f!.EndsWith("-input-errors.txt", StringComparison.Ordinal)).ShouldBe(12);
        files.ShouldContain(Screener.SummaryFile);
        files.ShouldContain(Screener.IndexFile);
        files.Count.ShouldBe(62);
        foreach (var r in report.Rows.Where(r => r.Review is not null))
            File.ReadAllText(Path.Combine(batch.Out, r.MemoFile!)).ShouldContain("Verdict: " + r.Review!.Verdict.Words());

        // The summary CSV: one record per submission, the same outcomes.
        var csv = CsvRecords.Parse(File.ReadAllText(Path.Combine(batch.Out, Screener.SummaryFile)));
        csv.Count.ShouldBe(60);
        csv.Count(r => r["outcome"] == "concur").ShouldBe(24);
        csv.Count(r => r["outcome"] == "concur-with-comments").ShouldBe(6);
        csv.Count(r => r["outcome"] == "revise").ShouldBe(18);
        csv.Count(r => r["outcome"] == "input-error").ShouldBe(12);
        csv.Where(r => r["outcome"] == "input-error").ShouldAllBe(r => r["error"].Length > 0 && r["memo"].EndsWith("-input-errors.txt"));
        csv.Where(r => r["outcome"] == "revise").ShouldAllBe(r => r["round"] == "1" && int.Parse(r["comments"]) > 0);

        // The index links every memo and error list, and every link resolves to a file in the output folder.
        string index = File.ReadAllText(Path.Combine(batch.Out, Screener.IndexFile));
        var links = Href().Matches(index).Select(m => Uri.UnescapeDataString(m.Groups[1].Value)).ToList();
        links.Count.ShouldBe(60);
        links.ShouldAllBe(l => File.Exists(Path.Combine(batch.Out, l)));
        index.ShouldContain("<b>24</b>concur");
        index.ShouldContain("<b>12</b>could not be read or analysed");
        index.ShouldContain("engineer of record remains responsible");

        // Every review is in the register, complete, as round 1 of its own reference.
        using var register = ReviewRegister.Open(batch.Register);
        register.Reviews().Count.ShouldBe(48);
        register.Check().ShouldBeEmpty();
        register.Reviews().ShouldAllBe(r => r.Round == 1);
    }

    [Fact]
    public void Screen_Cli_PrintsPlainLinesWhenRedirected_TheSummaryTable_AndExitsByTheWorstOutcome()
    {
        using var batch = new GeneratedBatch(new BatchPlan(Correct: 4, Omitted: 1, WrongClaim: 1, SignFlip: 0, SwayOmitted: 0, Broken: 0), variant: 5);
        var r = CliRunner.Run("screen", batch.Folder, "--out", batch.Out, "--reviewer", "C. Lines", "--date", "2026-12-01", "--jobs", "2");
        r.ExitCode.ShouldBe(ExitCodes.Comments, r.Err);
        r.Out.ShouldContain("screening 6 submissions");
        for (int k = 1; k <= 6; k++) r.Out.ShouldContain($"[{k}/6] ");
        r.Out.ShouldContain("discrepant ends");
        r.Out.ShouldContain("6 submissions: 4 concur, 1 concur-with-comments, 1 revise, 0 input errors");
        r.Out.ShouldContain("4 submissions — concur, nothing to answer");
        r.Out.ShouldNotContain("\u001b["); // no terminal control codes when redirected
        r.Out.ShouldContain($"register: {batch.Register}");
        File.Exists(batch.Register).ShouldBeTrue("the default register goes beside the screened folder");

        using var allGood = new GeneratedBatch(new BatchPlan(3, 0, 0, 0, 0, 0), variant: 6);
        CliRunner.Run("screen", allGood.Folder, "--out", allGood.Out, "--no-register", "-q").ExitCode.ShouldBe(ExitCodes.Concur);
        File.Exists(allGood.Register).ShouldBeFalse();
    }

    [Fact]
    public void Screen_OnATerminal_DrawsProgressAndStillSummarises()
    {
        using var batch = new GeneratedBatch(new BatchPlan(2, 0, 1, 0, 0, 1), variant: 8);
        var output = new StringWriter();
        var error = new StringWriter();
        var io = new CliIo(output, error, interactive: true);
        var cmd = ScreenCommand.Create(io);
        int code = cmd.Parse(["screen", batch.Folder, "--out", batch.Out, "--no-register"]).Invoke(new System.CommandLine.InvocationConfiguration { Output = output, Error = error });
        code.ShouldBe(ExitCodes.InputError, error.ToString());
        output.ToString().ShouldContain("4 submissions: 2 concur, 0 concur-with-comments, 1 revise, 1 input errors");
    }

    [Fact]
    public void Screen_BadArguments_AreInputErrorsWithAMessage()
    {
        using var t = new TempSubmission();
        var missing = CliRunner.Run("screen", Path.Combine(t.Folder, "nowhere"));
        missing.ExitCode.ShouldBe(ExitCodes.InputError);
        missing.Err.ShouldContain("does not exist");
        var file = CliRunner.Run("screen", t.Write("one.csv", SampleText.All));
        file.ExitCode.ShouldBe(ExitCodes.InputError);
        file.Err.ShouldContain("crosscheck review");
        string notRegister = t.Write("notes.db", "not a database at all, just text that is long enough to have a header of a hundred bytes ........................................");
        Directory.CreateDirectory(Path.Combine(t.Folder, "subs"));
        t.Write("subs/a.csv", SampleText.All);
        var reg = CliRunner.Run("screen", Path.Combine(t.Folder, "subs"), "--register", notRegister, "--out", Path.Combine(t.Folder, "out"));
        reg.ExitCode.ShouldBe(ExitCodes.InputError);
        reg.Err.ShouldContain("not a CrossCheck review register");
        var same = CliRunner.Run("screen", Path.Combine(t.Folder, "subs"), "--out", Path.Combine(t.Folder, "subs"), "--no-register");
        same.ExitCode.ShouldBe(ExitCodes.InputError);
        same.Err.ShouldContain("must not be the folder screened");
        var jobs = CliRunner.Run("screen", Path.Combine(t.Folder, "subs"), "--jobs", "-1");
        jobs.ExitCode.ShouldBe(ExitCodes.InputError);
    }

    [GeneratedRegex("<a href=\"([^\"]+)\">")]
    private static partial Regex Href();
}
