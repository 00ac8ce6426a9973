using System.Diagnostics;
using CrossCheck.Jobs;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;
using CrossCheck.TestTools;
using Microsoft.Data.Sqlite;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Register;

/// <summary>
/// Several writers on one register, and writers killed in the middle: every review is recorded whole or not at all,
/// and rounds stay numbered 1, 2, 3 ... without gaps or duplicates.
/// </summary>
public class RegisterConcurrencyTests(ITestOutputHelper log)
{
    private static readonly ReviewOptions Options = new(Reviewer: "F. Parallel", Date: new DateOnly(2026, 12, 1));

    /// <summary>A wrong submission, so that every recorded review carries findings.</summary>
    private static string WrongSubmission(TempSubmission t) =>
        t.Write("calc.csv", SampleText.With(claims: "[end-moments]\ncase,member,at,moment\n1,AB,A,-60\n1,AB,B,0"));

    private static long Count(string db, string sql)
    {
        using var c = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = db, Mode = SqliteOpenMode.ReadOnly, Pooling = false }.ToString());
        c.Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = sql;
        return (long)cmd.ExecuteScalar()!;
    }

    [Fact]
    public async Task TwoConnectionsInOneProcess_RecordingTheSameReference_GiveUniqueContiguousRounds()
    {
        using var t = new TempSubmission();
        string db = Path.Combine(t.Folder, "reg.db");
        var review = new ReviewJob().Review(WrongSubmission(t), Options).Review!;
        using (ReviewRegister.Open(db)) { }
        var tasks = Enumerable.Range(0, 2).Select(w => Task.Run(() =>
        {
            using var r = ReviewRegister.Open(db);
            for (int i = 0; i < 30; i++) r.Record(review, "SHARED", "calc.csv", $"sha256:w{w}-{i}");
        })).ToArray();
        await Task.WhenAll(tasks);
        using var check = ReviewRegister.Open(db);
        check.Check().ShouldBeEmpty();
        check.History("SHARED").Select(h => h.Review.Round).ShouldBe(Enumerable.Range(1, 60));
    }

    [Fact]
    public void TwoProcesses_WritingAtOnce_BothSucceed()
    {
        using var t = new TempSubmission();
        string db = Path.Combine(t.Folder, "reg.db");
        string calc = WrongSubmission(t);
        var a = ChildProcess.Tools("register-write", db, calc, "40", "SHARED");
        var b = ChildProcess.Tools("register-write", db, calc, "40", "SHARED");
        var ra = ChildProcess.Finish(a);
        var rb = ChildProcess.Finish(b);
        ra.Code.ShouldBe(0, ra.Err);
        rb.Code.ShouldBe(0, rb.Err);
        using var r = ReviewRegister.Open(db);
        r.Check().ShouldBeEmpty();
        r.History("SHARED").Select(h => h.Review.Round).ShouldBe(Enumerable.Range(1, 80));
    }

    [Fact]
    public void TwoScreensOfOneRegister_AtTheSameTime_BothSucceed()
    {
        using var one = new GeneratedBatch(new BatchPlan(6, 1, 1, 1, 1, 2), seed: 21);
        using var two = new GeneratedBatch(new BatchPlan(6, 1, 1, 1, 1, 2), seed: 22);
        string db = Path.Combine(one.Root, "shared.db");
        var a = ChildProcess.Cli("screen", one.Folder, "--out", one.Out, "--register", db, "-q");
        var b = ChildProcess.Cli("screen", two.Folder, "--out", two.Out, "--register", db, "-q");
        var ra = ChildProcess.Finish(a);
        var rb = ChildProcess.Finish(b);
        ra.Code.ShouldBe(2, ra.Err + ra.Out); // both batches hold broken submissions
        rb.Code.ShouldBe(2, rb.Err + rb.Out);
        ra.Out.ShouldContain("12 submissions: 6 concur, 1 concur-with-comments, 3 revise, 2 input errors");
        rb.Out.ShouldContain("12 submissions: 6 concur, 1 concur-with-comments, 3 revise, 2 input errors");
        using var r = ReviewRegister.Open(db);
        r.Check().ShouldBeEmpty();
        r.Reviews().Count.ShouldBe(20);
    }

    [Fact]
    public void AWriterKilledInsideItsTransaction_LeavesNoHalfReview()
    {
        using var t = new TempSubmission();
        string db = Path.Combine(t.Folder, "reg.db");
        string calc = WrongSubmission(t);
        using (var r = ReviewRegister.Open(db)) r.Record(new ReviewJob().Review(calc, Options).Review!, "PAUSED", "calc.csv", "sha256:before");

        using var probe = ChildProcess.Tools("register-pause", db, calc);
        try
        {
            string? line = probe.StandardOutput.ReadLine(); // printed after the review row is written, before its findings
            if (line is null) throw new Shouldly.ShouldAssertException("the probe ended early: " + probe.StandardError.ReadToEnd());
            line.ShouldStartWith("in-transaction ");
            // Inside the transaction the probe holds the write lock: another writer cannot start one.
            using var other = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = db, Pooling = false, DefaultTimeout = 1 }.ToString());
            other.Open();
            using var cmd = other.CreateCommand();
            cmd.CommandText = "BEGIN IMMEDIATE";
            Should.Throw<SqliteException>(() => cmd.ExecuteNonQuery()).SqliteErrorCode.ShouldBe(5); // SQLITE_BUSY
        }
        finally
        {
            probe.Kill(entireProcessTree: true);
        }
        probe.WaitForExit(10_000).ShouldBeTrue();

        Count(db, "SELECT count(*) FROM reviews").ShouldBe(1);
        using var after = ReviewRegister.Open(db);
        after.Check().ShouldBeEmpty();
        var next = after.Record(new ReviewJob().Review(calc, Options).Review!, "PAUSED", "calc.csv", "sha256:after");
        next.Review.Round.ShouldBe(2, "the killed review took no round");
        after.Reviews().Count.ShouldBe(2);
    }

    [Fact]
    public void AScreenKilledMidBatch_LeavesAConsistentRegister_AndTheNextScreenCompletesIt()
    {
        using var batch = new GeneratedBatch(new BatchPlan(60, 10, 10, 5, 5, 0), seed: 31);
        using var screen = ChildProcess.Cli("screen", batch.Folder, "--out", batch.Out, "--register", batch.Register, "-q", "--jobs", "1");
        var clock = Stopwatch.StartNew();
        SqliteConnection? reader = null;
        try
        {
            // Kill it as soon as it has recorded a few reviews: the register phase is short, so poll on an open connection.
            while (!screen.HasExited && clock.Elapsed < TimeSpan.FromSeconds(120))
            {
                if (reader is null && File.Exists(batch.Register))
                {
                    reader = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = batch.Register, Mode = SqliteOpenMode.ReadOnly, Pooling = false }.ToString());
                    reader.Open();
                }
                if (reader is not null)
                {
                    using var cmd = reader.CreateCommand();
                    cmd.CommandText = "SELECT count(*) FROM reviews";
                    try
                    {
                        if ((long)cmd.ExecuteScalar()! >= 3) break;
                    }
                    catch (SqliteException)
                    {
                        Thread.Sleep(1); // created, but its schema not yet committed
                    }
                }
                else
                {
                    Thread.Sleep(1);
                }
            }
        }
        finally
        {
            if (!screen.HasExited) screen.Kill(entireProcessTree: true);
            reader?.Dispose();
        }
        screen.WaitForExit(10_000).ShouldBeTrue();
        screen.ExitCode.ShouldNotBeInRange(0, 3, "the screen was killed before it finished");

        using (var r = ReviewRegister.Open(batch.Register))
        {
            r.Check().ShouldBeEmpty();
            var recorded = r.Reviews();
            // Usually part-way through the register phase; under heavy load it may have recorded all 90 before the kill.
            log.WriteLine($"killed after {clock.ElapsedMilliseconds} ms with {recorded.Count} of 90 reviews recorded (exit code {screen.ExitCode})");
            foreach (var review in recorded) r.Findings(review.Id).Count.ShouldBe(review.FindingCount);
        }

        var rerun = ChildProcess.Finish(ChildProcess.Cli("screen", batch.Folder, "--out", batch.Out, "--register", batch.Register, "-q"));
        rerun.Code.ShouldBe(1, rerun.Err + rerun.Out);
        using var final = ReviewRegister.Open(batch.Register);
        final.Check().ShouldBeEmpty();
        // Every submission is now recorded; the ones the killed screen had recorded are repeats of their round 1.
        final.References().Count.ShouldBe(90);
        final.References().ShouldAllBe(x => x.Rounds == 1);
        CsvRecords.Parse(File.ReadAllText(Path.Combine(batch.Out, Screener.SummaryFile))).Count.ShouldBe(90);
    }
}
