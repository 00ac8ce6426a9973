using CrossCheck.Jobs;
using CrossCheck.Memo;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Jobs;

/// <summary>The review job: its outcomes, and that "today" comes from the clock it is given.</summary>
public class ReviewJobTests
{
    /// <summary>A clock stopped at one instant, in UTC.</summary>
    private sealed class StoppedClock(DateTimeOffset now) : TimeProvider
    {
        public override DateTimeOffset GetUtcNow() => now;

        public override TimeZoneInfo LocalTimeZone => TimeZoneInfo.Utc;
    }

    private static readonly StoppedClock May6 = new(new DateTimeOffset(2031, 5, 6, 10, 20, 30, 123, TimeSpan.Zero));

    [Fact]
    public void Run_DatesTheMemoAndTheRegister_ByItsClock()
    {
        using var t = new TempSubmission();
        string memo = Path.Combine(t.Folder, "memo.md"), db = Path.Combine(t.Folder, "reg.db");
        var outcome = new ReviewJob(May6).Run(new ReviewRequest(CliRunner.Demo("footbridge.csv"), ReviewOptions.Default)
        {
            OutputPath = memo, RegisterPath = db,
        });
        outcome.Status.ShouldBe(ReviewJobStatus.Reviewed);
        outcome.WrittenTo.ShouldBe(memo);
        outcome.Review!.Options.Date.ShouldBe(new DateOnly(2031, 5, 6));
        File.ReadAllText(memo).ShouldContain("| Date of review | 2031-05-06 |");
        outcome.Rounds!.Review.Round.ShouldBe(1);
        using var r = ReviewRegister.Open(db);
        var row = r.Reviews().ShouldHaveSingleItem();
        row.ReviewDate.ShouldBe("2031-05-06");
        row.RecordedAt.ShouldBe("2031-05-06T10:20:30.123Z");
    }

    [Fact]
    public void Run_KeepsAGivenDate()
    {
        var review = new ReviewJob(May6).Review(CliRunner.Demo("footbridge.csv"), new ReviewOptions(Date: new DateOnly(2026, 12, 1))).Review!;
        review.Options.Date.ShouldBe(new DateOnly(2026, 12, 1));
    }

    [Fact]
    public void Run_RefusesAMissingTemplate_BeforeReadingAnything()
    {
        using var t = new TempSubmission();
        var outcome = new ReviewJob().Run(new ReviewRequest(Path.Combine(t.Folder, "no-such.csv"), ReviewOptions.Default)
        {
            TemplatePath = Path.Combine(t.Folder, "none.sbn"),
        });
        outcome.Status.ShouldBe(ReviewJobStatus.Refused);
        outcome.Problem.ShouldBe($"template '{Path.Combine(t.Folder, "none.sbn")}' does not exist.");
        outcome.Review.ShouldBeNull();
        outcome.Errors.ShouldBeEmpty();
    }

    [Fact]
    public void Run_BadInput_AsJson_ReturnsTheErrors_AndWritesNoMemo()
    {
        using var t = new TempSubmission();
        string bad = t.Write("bad.csv", "[joints]\njoint,x,y\nA,0,zero");
        var outcome = new ReviewJob().Run(new ReviewRequest(bad, ReviewOptions.Default, ReviewFormat.Json));
        outcome.Status.ShouldBe(ReviewJobStatus.InputError);
        outcome.Errors.ShouldContain(e => e.Message.Contains("'y' must be a number", StringComparison.Ordinal));
        outcome.Text.ShouldNotBeNull().ShouldContain("\"inputErrors\"");
        outcome.WrittenTo.ShouldBeNull();
        Directory.GetFiles(t.Folder).ShouldBe([bad]);
    }

    [Fact]
    public void Run_ShowWorking_ComputesTheReferenceWorking_InTheReview()
    {
        var outcome = new ReviewJob().Review(CliRunner.Demo("footbridge.csv"), new ReviewOptions(Date: new DateOnly(2026, 12, 1), ShowWorking: true));
        var working = outcome.Review!.Working.ShouldNotBeNull();
        working.Available.ShouldBeTrue();
        // Three-span beam under 14 kN/m: the distribution converges to the stiffness solver's 114.73 kN·m over B (three-moment equation by hand, see SolveCommandTests).
        var dl = working.Cases.First(c => c.Case == "DL");
        dl.Result.ShouldNotBeNull();
        dl.Final.Max(m => Math.Abs(m)).ShouldBe(114.727e3, 0.1e3);
        MemoRenderer.Render(MemoExtensions.Build(outcome.Review, MemoFormat.Markdown), MemoFormat.Markdown).ShouldContain("Appendix: reference moment distribution");
        new ReviewJob().Review(CliRunner.Demo("footbridge.csv"), ReviewOptions.Default).Review!.Working.ShouldBeNull();
    }

    [Fact]
    public void Screen_DatesTheBatchAndTheRegister_ByItsClock()
    {
        using var t = new TempSubmission();
        string subs = t.MakeFolder("subs");
        File.Copy(CliRunner.Demo("footbridge.csv"), Path.Combine(subs, "footbridge.csv"));
        string db = Path.Combine(t.Folder, "reg.db");
        var report = Screener.Run(subs, new ScreenOptions(ReviewOptions.Default, Path.Combine(t.Folder, "out"), MemoFormat.Markdown, RegisterPath: db) { Time = May6 });
        report.Options.Review.Date.ShouldBe(new DateOnly(2031, 5, 6));
        File.ReadAllText(Path.Combine(t.Folder, "out", Screener.IndexFile)).ShouldContain("reviewed 2031-05-06");
        File.ReadAllText(Path.Combine(t.Folder, "out", "footbridge-review.md")).ShouldContain("| Date of review | 2031-05-06 |");
        using var r = ReviewRegister.Open(db);
        r.Reviews().ShouldHaveSingleItem().RecordedAt.ShouldBe("2031-05-06T10:20:30.123Z");
    }
}
