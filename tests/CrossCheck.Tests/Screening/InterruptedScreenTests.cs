using System.Diagnostics;
using CrossCheck.Cli;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Memo;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;
using CrossCheck.TestTools;
using CsCheck;
using Microsoft.Data.Sqlite;

namespace CrossCheck.Tests.Screening;

/// <summary>
/// A screen stopped part-way (Ctrl-C, SIGTERM) writes the summary and index of what it did and leaves a note; the same command
/// run again completes the missing memos without recording the reviews again. A submission over its time budget, a link to a
/// device and a named pipe are rows with their errors; the batch goes on. A register or an output that fails is exit code 2.
/// </summary>
public class InterruptedScreenTests
{
    private static readonly ReviewOptions Options = new(Date: new DateOnly(2026, 12, 1));

    /// <summary>Stops the screen (as a signal would) once every submission has been reviewed, before any is recorded.</summary>
    private sealed class StopAfterReviews(CancellationTokenSource stop) : IScreenProgress
    {
        private int _total;

        public void Begin(int submissions) => _total = submissions;

        public void Reviewed(ScreenItem item, ScreenOutcome outcome, int done)
        {
            if (done == _total) stop.Cancel();
        }

        public void Written(ScreenRow row, int done) { }
    }

    private static string[] Leftovers(string folder) =>
        Directory.GetFiles(folder).Select(Path.GetFileName).Where(n => n!.EndsWith(".tmp", StringComparison.Ordinal)).ToArray()!;

    [Fact]
    public void AScreenStoppedBeforeRecording_WritesAnEmptySummaryAndItsNote_AndTheNextRunDoesEverything()
    {
        using var batch = new GeneratedBatch(new BatchPlan(Correct: 3, Omitted: 1, WrongClaim: 1, SignFlip: 0, SwayOmitted: 0, Broken: 1), variant: 19);
        var options = new ScreenOptions(Options, batch.Out, MemoFormat.Markdown, 1, batch.Register);
        using var stop = new CancellationTokenSource();
        var first = Screener.Run(batch.Folder, options, new StopAfterReviews(stop), stop.Token);
        first.Interrupted.ShouldBeTrue();
        first.Rows.ShouldBeEmpty("the register keys need every review, so nothing is recorded");
        first.Pending.Count.ShouldBe(6);
        File.Exists(Path.Combine(batch.Out, Screener.SummaryFile)).ShouldBeTrue();
        File.Exists(Path.Combine(batch.Out, Screener.IndexFile)).ShouldBeTrue();
        File.ReadAllText(Path.Combine(batch.Out, Screener.IndexFile)).ShouldContain("the screen was interrupted: 6 of 6 submissions were not screened");
        File.Exists(Path.Combine(batch.Out, ScreenJournal.FileName)).ShouldBeTrue();
        Leftovers(batch.Out).ShouldBeEmpty();

        var second = Screener.Run(batch.Folder, options);
        second.Interrupted.ShouldBeFalse();
        second.Rows.Count.ShouldBe(6);
        File.Exists(Path.Combine(batch.Out, ScreenJournal.FileName)).ShouldBeFalse();
        using var register = ReviewRegister.Open(batch.Register);
        register.Reviews().Count.ShouldBe(5);
    }

    [Fact]
    public void AScreenInterruptedAfterRecording_IsResumed_MissingMemosWritten_NothingRecordedTwice()
    {
        using var batch = new GeneratedBatch(new BatchPlan(Correct: 4, Omitted: 2, WrongClaim: 2, SignFlip: 0, SwayOmitted: 0, Broken: 1), variant: 23);
        var options = new ScreenOptions(Options, batch.Out, MemoFormat.Markdown, 1, batch.Register);
        string started = Clock.UtcStamp(TimeProvider.System);
        var first = Screener.Run(batch.Folder, options);
        first.Rows.Count.ShouldBe(9);
        // As a kill after recording leaves it: every review recorded, some memos missing, the note still there.
        File.WriteAllText(Path.Combine(batch.Out, ScreenJournal.FileName), string.Join('\n', "interrupted",
            "folder: " + Path.GetFullPath(batch.Folder), "register: " + Path.GetFullPath(batch.Register), "date: 2026-12-01", "started: " + started, ""));
        var lost = first.Rows.Where(r => r.MemoFile is not null && r.Review is not null).Take(3).Select(r => r.MemoFile!).ToList();
        foreach (var m in lost) File.Delete(Path.Combine(batch.Out, m));

        var second = Screener.Run(batch.Folder, options with { Review = Options with { Date = null } });
        second.Rows.Count.ShouldBe(9);
        foreach (var m in lost) File.ReadAllText(Path.Combine(batch.Out, m)).ShouldContain("2026-12-01", Case.Sensitive, "the resumed screen keeps the batch date");
        File.Exists(Path.Combine(batch.Out, ScreenJournal.FileName)).ShouldBeFalse();
        using var register = ReviewRegister.Open(batch.Register);
        register.Reviews().Count.ShouldBe(8, "one review per readable submission: the resumed ones are not recorded again");
        register.Check().ShouldBeEmpty();
        second.Rows.Where(r => r.Review is not null).ShouldAllBe(r => r.Rounds != null && r.Rounds.Review.Round == 1);
    }

    /// <summary>Stops the screen once <paramref name="after"/> submissions have been reviewed.</summary>
    private sealed class StopAfterReviewed(int after, CancellationTokenSource stop) : IScreenProgress
    {
        public void Begin(int submissions) { }

        public void Reviewed(ScreenItem item, ScreenOutcome outcome, int done)
        {
            if (done >= after) stop.Cancel();
        }

        public void Written(ScreenRow row, int done) { }
    }

    [Fact]
    public void Property_WhereverAScreenIsStopped_TheRerunLeavesEverySubmissionScreenedAndRecordedOnce()
    {
        Gen.Int[0, 6].Sample(after =>
        {
            using var batch = new GeneratedBatch(new BatchPlan(Correct: 2, Omitted: 1, WrongClaim: 1, SignFlip: 0, SwayOmitted: 0, Broken: 1), variant: 7 + after);
            var options = new ScreenOptions(Options, batch.Out, MemoFormat.Markdown, 2, batch.Register);
            using var stop = new CancellationTokenSource();
            var first = Screener.Run(batch.Folder, options, new StopAfterReviewed(after, stop), stop.Token);
            (first.Rows.Count + first.Pending.Count).ShouldBe(5);
            Leftovers(batch.Out).ShouldBeEmpty();
            var second = Screener.Run(batch.Folder, options);
            second.Interrupted.ShouldBeFalse();
            second.Rows.Count.ShouldBe(5);
            second.Rows.Where(r => r.Review is not null).ShouldAllBe(r => r.MemoFile != null && File.Exists(Path.Combine(batch.Out, r.MemoFile)));
            using var register = ReviewRegister.Open(batch.Register);
            register.Reviews().Count.ShouldBe(first.Interrupted ? 4 : 8);
            register.Check().ShouldBeEmpty();
        }, iter: 5, threads: 1);
    }

    [Fact]
    public void ScreenKilledBySigterm_ExitsWith143_OrFinishes_AndTheRerunLeavesOneReviewEach()
    {
        using var batch = new GeneratedBatch(new BatchPlan(30, 5, 5, 0, 0, 0), variant: 41);
        using var screen = ChildProcess.Cli("screen", batch.Folder, "--out", batch.Out, "--register", batch.Register, "-q", "--jobs", "1");
        var clock = Stopwatch.StartNew();
        while (!screen.HasExited && clock.Elapsed < TimeSpan.FromSeconds(120) && !File.Exists(batch.Register)) Thread.Sleep(5);
        if (!screen.HasExited)
        {
            using var kill = Process.Start(new ProcessStartInfo("kill", ["-TERM", screen.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)])
            {
                UseShellExecute = false,
            })!;
            kill.WaitForExit(10_000);
        }
        var (code, _, err) = ChildProcess.Finish(screen);
        code.ShouldBeOneOf([ExitCodes.Terminated, ExitCodes.Comments], err);
        if (code == ExitCodes.Terminated)
        {
            err.ShouldContain("interrupted");
            File.Exists(Path.Combine(batch.Out, Screener.SummaryFile)).ShouldBeTrue();
            File.Exists(Path.Combine(batch.Out, ScreenJournal.FileName)).ShouldBeTrue();
        }
        Leftovers(batch.Out).ShouldBeEmpty();

        var rerun = ChildProcess.Finish(ChildProcess.Cli("screen", batch.Folder, "--out", batch.Out, "--register", batch.Register, "-q"));
        rerun.Code.ShouldBe(ExitCodes.Comments, rerun.Err);
        using var register = ReviewRegister.Open(batch.Register);
        register.Reviews().Count.ShouldBe(code == ExitCodes.Terminated ? 40 : 80, "a resumed screen records no review twice; a finished one is screened again as repeats");
        File.Exists(Path.Combine(batch.Out, ScreenJournal.FileName)).ShouldBeFalse();
        Leftovers(batch.Out).ShouldBeEmpty();
    }

    [Fact]
    public void SubmissionsOverTheTimeBudget_LinksToDevices_AndPipes_AreRows_AndTheBatchGoesOn()
    {
        using var t = new TempSubmission();
        string inbox = t.MakeFolder("inbox");
        File.WriteAllText(Path.Combine(inbox, "good.csv"), SampleText.All);
        SpecialFiles.Link(Path.Combine(inbox, "zero.csv"), "/dev/zero");
        SpecialFiles.Link(Path.Combine(inbox, "passwd.csv"), "/etc/passwd");
        SpecialFiles.Fifo(Path.Combine(inbox, "pipe.pdf"));
        var report = SpecialFiles.Within(120, () => Screener.Run(inbox, new ScreenOptions(Options, Path.Combine(t.Folder, "out"), MemoFormat.Markdown)));
        report.Rows.Count.ShouldBe(4);
        report.Rows.Single(r => r.Name == "good.csv").Outcome.ShouldBe(ScreenOutcome.Concur);
        report.Rows.Single(r => r.Name == "zero.csv").ErrorText!.ShouldContain("is a link to '/dev/zero', outside the folder 'inbox'");
        report.Rows.Single(r => r.Name == "pipe.pdf").ErrorText!.ShouldContain("named pipe");
        report.Rows.Single(r => r.Name == "passwd.csv").ErrorText!.ShouldContain("outside the folder 'inbox'");
        File.ReadAllText(Path.Combine(t.Folder, "out", "passwd-input-errors.txt")).ShouldNotContain("root:");

        var tight = new ScreenOptions(Options, Path.Combine(t.Folder, "out2"), MemoFormat.Markdown)
        {
            Limits = InputLimits.Default with { TimeBudget = TimeSpan.FromTicks(1) },
        };
        var over = Screener.Run(inbox, tight);
        over.Rows.Single(r => r.Name == "good.csv").ErrorText!.ShouldContain("took longer than the time limit");
        over.Rows.ShouldAllBe(r => r.Outcome == ScreenOutcome.InputError);
    }

    [Fact]
    public void AReviewOverItsBudget_IsAnInputErrorNamingTheLimit_AndTheCliExitsWith2()
    {
        var outcome = new ReviewJob().Review(CliRunner.Demo("school-hall.csv"), ReviewOptions.Default, InputLimits.Default with { TimeBudget = TimeSpan.FromTicks(1) });
        outcome.Failure.ShouldBe(ReviewFailure.OverBudget);
        outcome.Errors.ShouldHaveSingleItem().Message.ShouldContain("raise it with --time-limit");
        var r = CliRunner.Run("review", CliRunner.Demo("school-hall.csv"), "--time-limit", "0.000001", "--out", "/dev/null");
        r.ExitCode.ShouldBe(ExitCodes.InputError, r.Err);
        r.Err.ShouldContain("took longer than the time limit");
    }

    [Fact]
    public void ATemplateFailingWhileRendering_InAScreen_IsExitCode2()
    {
        using var batch = new GeneratedBatch(new BatchPlan(2, 0, 0, 0, 0, 0), variant: 3);
        string template = Path.Combine(batch.Root, "broken.sbn");
        File.WriteAllText(template, "{{ model.Title }} {{ model.NoSuchThing }}");
        var r = CliRunner.Run("screen", batch.Folder, "--out", batch.Out, "--no-register", "--template", template, "-q");
        r.ExitCode.ShouldBe(ExitCodes.InputError, r.Out + r.Err);
    }

    [Fact]
    public void ADamagedRegister_AndOneWithBadValues_AreExitCode2_ForHistory_AndFoundByCheck()
    {
        using var t = new TempSubmission();
        string register = Path.Combine(t.Folder, "reg.db");
        CliRunner.Run("review", CliRunner.Demo("footbridge.csv"), "--register", register, "--out", "/dev/null", "-q").ExitCode.ShouldBe(ExitCodes.Comments);
        using (var c = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = register, Pooling = false }.ToString()))
        {
            c.Open();
            using var cmd = c.CreateCommand();
            cmd.CommandText = "UPDATE reviews SET round = 'one', ends_agree = -3";
            cmd.ExecuteNonQuery();
        }
        foreach (var args in new[] { new[] { "history", "--register", register }, ["history", "DEMO-FB-01", "--register", register] })
        {
            var h = CliRunner.Run(args);
            h.ExitCode.ShouldBe(ExitCodes.InputError, h.Out + h.Err);
            h.Err.ShouldContain("is damaged: review 1 has 'one' in 'round'");
            h.Err.ShouldNotContain("   at ");
        }
        var check = CliRunner.Run("register", "check", "--register", register);
        check.ExitCode.ShouldBe(ExitCodes.Comments, check.Err);
        check.Out.ShouldContain("has 'one' in 'round'");

        string garbage = Path.Combine(t.Folder, "garbage.db");
        File.WriteAllBytes(garbage, [.. "SQLite format 3\0"u8.ToArray(), .. HostileInputs.Garbage(8192, 5)]);
        foreach (var args in new[] { new[] { "history", "--register", garbage }, ["register", "check", "--register", garbage], ["register", "export", "--register", garbage] })
        {
            var r = CliRunner.Run(args);
            r.ExitCode.ShouldBe(ExitCodes.InputError, string.Join(" ", args) + "\n" + r.Err);
            r.Err.ShouldStartWith("crosscheck: ");
        }
    }

    [Fact]
    public void AFailedRecordOrMemo_IsExitCode2_NotAnInternalError()
    {
        var item = new ScreenItem("a.csv", "a.csv", "a", false);
        var key = new ScreenGroupKey(ScreenGroupKind.InputError, "input-error");
        var row = new ScreenRow(item, ScreenOutcome.Concur, null, [], null, null, null, key, "not recorded in the register: register 'r.db': the disk is full.");
        var report = new ScreenReport("/in", "/out", null, new ScreenOptions(ReviewOptions.Default, "/out"), [row], [], [], TimeSpan.Zero, 1);
        CrossCheck.Cli.Commands.ScreenCommand.ExitCode(report).ShouldBe(ExitCodes.InputError);
    }
}
