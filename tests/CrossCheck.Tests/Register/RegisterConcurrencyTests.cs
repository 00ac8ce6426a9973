using System.Diagnostics;
using CrossCheck.Jobs;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;
using CrossCheck.TestTools;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Register;

/// <summary>
/// Several writers on one register (threads, processes, whole screens), and writers killed in the middle, on both back
/// ends: every review is recorded whole or not at all, and rounds stay numbered 1, 2, 3 ... without gaps or duplicates.
/// </summary>
public class RegisterConcurrencyTests(ITestOutputHelper log)
{
    private static readonly ReviewOptions Options = new(Reviewer: "F. Parallel", Date: new DateOnly(2026, 12, 1));

    /// <summary>A register in a scratch folder with a wrong submission (so that every recorded review carries findings) and its review.</summary>
    private sealed class Scene : IDisposable
    {
        public Scene(RegisterKind kind)
        {
            Db = new RegisterScratch(kind);
            Calc = Db.Files.Write("calc.csv", SampleText.With(claims: "[end-moments]\ncase,member,at,moment\n1,AB,A,-60\n1,AB,B,0"));
            Review = new ReviewJob().Review(Calc, Options).Review!;
            using (Db.Open()) { }
        }

        public string Calc { get; }

        public ReviewResult Review { get; }

        public RegisterScratch Db { get; }

        public void Dispose() => Db.Dispose();
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public async Task TwoConnectionsInOneProcess_RecordingTheSameReference_GiveUniqueContiguousRounds(RegisterKind kind)
    {
        using var scene = new Scene(kind);
        var (db, review) = (scene.Db, scene.Review);
        var tasks = Enumerable.Range(0, 2).Select(w => Task.Run(() =>
        {
            using var r = db.Open();
            for (int i = 0; i < 30; i++) r.Record(review, "SHARED", "calc.csv", $"sha256:w{w}-{i}");
            return r.Retries;
        })).ToArray();
        var retries = await Task.WhenAll(tasks);
        log.WriteLine($"{kind}: writes run again after a collision: {retries.Sum()}");
        using var check = db.Open();
        check.Check().ShouldBeEmpty();
        check.History("SHARED").Select(h => h.Review.Round).ShouldBe(Enumerable.Range(1, 60));
    }

    /// <summary>
    /// Two writers that read the same latest round: the first holds its transaction open after writing round 2; the
    /// second, wanting round 2 too, must wait (SQLite: the write lock; PostgreSQL: the unique index on the round) and,
    /// on PostgreSQL, collide and run again once the first commits — ending as round 3, never as a second round 2.
    /// </summary>
    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public async Task AWriterThatWouldTakeTheSameRound_WaitsAndTakesTheNext(RegisterKind kind)
    {
        using var scene = new Scene(kind);
        var (db, review) = (scene.Db, scene.Review);
        using var first = db.Open();
        using var second = db.Open();
        first.Record(review, "RACE", "calc.csv", "sha256:r1").Review.Round.ShouldBe(1);

        using var inside = new ManualResetEventSlim();
        using var release = new ManualResetEventSlim();
        first.AfterReviewRow = _ =>
        {
            inside.Set();
            release.Wait(TimeSpan.FromSeconds(60)).ShouldBeTrue();
        };
        var a = Task.Run(() => first.Record(review, "RACE", "calc.csv", "sha256:a"));
        inside.Wait(TimeSpan.FromSeconds(30)).ShouldBeTrue();
        var b = Task.Run(() => second.Record(review, "RACE", "calc.csv", "sha256:b"));
        (await Task.WhenAny(b, Task.Delay(700))).ShouldNotBe(b, "the second writer cannot record while the first holds round 2");
        release.Set();
        var (ra, rb) = (await a, await b);
        ra.Review.Round.ShouldBe(2);
        rb.Review.Round.ShouldBe(3);
        rb.Previous!.Id.ShouldBe(ra.Review.Id, "set against the round the first writer recorded");
        if (kind == RegisterKind.PostgreSql) second.Retries.ShouldBeGreaterThanOrEqualTo(1, "the second writer collided on the round and ran again");
        first.Check().ShouldBeEmpty();
    }

    /// <summary>Screens started together on a new register: one creates the tables, the others wait and find them made.</summary>
    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public async Task SixWritersOpeningANewRegisterAtOnce_AllOpenIt(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        using var go = new ManualResetEventSlim();
        var opens = Enumerable.Range(0, 6).Select(_ => Task.Run(() =>
        {
            go.Wait();
            using var r = db.Open();
            return r.SchemaVersion;
        })).ToArray();
        go.Set();
        (await Task.WhenAll(opens)).ShouldAllBe(v => v == ReviewRegister.LatestSchemaVersion);
        db.Scalar("SELECT count(*) FROM reviews").ShouldBe(0);
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void FourProcesses_WritingOneReferenceAtOnce_AllSucceed_WithUniqueRounds(RegisterKind kind)
    {
        using var scene = new Scene(kind);
        var (db, calc) = (scene.Db, scene.Calc);
        var writers = Enumerable.Range(0, 4).Select(_ => ChildProcess.Tools("register-write", db.Location, calc, "20", "SHARED")).ToList();
        // While they write, every read sees whole reviews and rounds without gaps (one snapshot per read).
        using (var reader = db.Open())
        {
            int reads = 0;
            while (writers.Any(w => !w.HasExited) && reads < 2000)
            {
                var seen = reader.History("SHARED");
                seen.Select(h => h.Review.Round).ShouldBe(Enumerable.Range(1, seen.Count), $"read {reads}");
                reader.Check().ShouldBeEmpty();
                reads++;
            }
            log.WriteLine($"{kind}: {reads} consistent reads while the writers ran");
        }
        foreach (var w in writers)
        {
            var (code, output, err) = ChildProcess.Finish(w);
            code.ShouldBe(0, err);
            log.WriteLine(output.Trim());
        }
        using var r = db.Open();
        r.Check().ShouldBeEmpty();
        var history = r.History("SHARED");
        history.Select(h => h.Review.Round).ShouldBe(Enumerable.Range(1, 80), "80 different inputs: 80 rounds, none lost, none twice");
        history.Select(h => h.Review.InputHash).Distinct().Count().ShouldBe(80);
        r.Reviews().ShouldAllBe(x => r.Findings(x.Id).Count == x.FindingCount);
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void TwoScreensOfOneRegister_AtTheSameTime_BothSucceed(RegisterKind kind)
    {
        using var one = new GeneratedBatch(new BatchPlan(6, 1, 1, 1, 1, 2), variant: 21);
        using var two = new GeneratedBatch(new BatchPlan(6, 1, 1, 1, 1, 2), variant: 22);
        using var db = TestRegister.Create(kind, one.Root, "shared.db");
        var a = ChildProcess.Cli("screen", one.Folder, "--out", one.Out, "--register", db.Location, "-q");
        var b = ChildProcess.Cli("screen", two.Folder, "--out", two.Out, "--register", db.Location, "-q");
        var ra = ChildProcess.Finish(a);
        var rb = ChildProcess.Finish(b);
        ra.Code.ShouldBe(2, ra.Err + ra.Out); // both batches hold broken submissions
        rb.Code.ShouldBe(2, rb.Err + rb.Out);
        ra.Out.ShouldContain("12 submissions: 6 concur, 1 concur-with-comments, 3 revise, 2 input errors");
        rb.Out.ShouldContain("12 submissions: 6 concur, 1 concur-with-comments, 3 revise, 2 input errors");
        using var r = db.Open();
        r.Check().ShouldBeEmpty();
        r.Reviews().Count.ShouldBe(20);
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public async Task AWriterKilledInsideItsTransaction_LeavesNoHalfReview(RegisterKind kind)
    {
        using var scene = new Scene(kind);
        var (db, calc, review) = (scene.Db, scene.Calc, scene.Review);
        using (var r = db.Open()) r.Record(review, "PAUSED", "calc.csv", "sha256:before");

        using var probe = ChildProcess.Tools("register-pause", db.Location, calc);
        Task<RoundComparison> other;
        using var waiting = db.Open();
        try
        {
            string? line = probe.StandardOutput.ReadLine(); // printed after the review row is written, before its findings
            if (line is null) throw new ShouldAssertException("the probe ended early: " + probe.StandardError.ReadToEnd());
            line.ShouldStartWith("in-transaction ");
            db.Scalar("SELECT count(*) FROM reviews").ShouldBe(1, "a review being written is not seen by others");
            // Another writer of the same reference waits for the probe: SQLite's write lock, or the probe's claim on round 2.
            other = Task.Run(() => waiting.Record(review, "PAUSED", "calc.csv", "sha256:after"));
            (await Task.WhenAny(other, Task.Delay(700))).ShouldNotBe(other);
        }
        finally
        {
            probe.Kill(entireProcessTree: true);
        }
        probe.WaitForExit(10_000).ShouldBeTrue();

        var next = await other;
        next.Review.Round.ShouldBe(2, "the killed review took no round");
        db.Scalar("SELECT count(*) FROM reviews").ShouldBe(2);
        db.Scalar("SELECT count(*) FROM reviews WHERE input_hash = 'sha256:paused'").ShouldBe(0);
        waiting.Check().ShouldBeEmpty();
        waiting.Findings(next.Review.Id).Count.ShouldBe(next.Review.FindingCount);
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void AScreenKilledMidBatch_LeavesAConsistentRegister_AndTheNextScreenCompletesIt(RegisterKind kind)
    {
        using var batch = new GeneratedBatch(new BatchPlan(60, 10, 10, 5, 5, 0), variant: 31);
        using var db = TestRegister.Create(kind, batch.Root, "crosscheck-register.db");
        using var screen = ChildProcess.Cli("screen", batch.Folder, "--out", batch.Out, "--register", db.Location, "-q", "--jobs", "1");
        var clock = Stopwatch.StartNew();
        try
        {
            // Kill it as soon as it has recorded a few reviews: the register phase is short, so poll often.
            while (!screen.HasExited && clock.Elapsed < TimeSpan.FromSeconds(120))
            {
                long recorded;
                try
                {
                    recorded = db.Scalar("SELECT count(*) FROM reviews");
                }
                catch (Exception ex) when (ex is Microsoft.Data.Sqlite.SqliteException or Npgsql.NpgsqlException)
                {
                    recorded = 0; // not created yet
                }
                if (recorded >= 3) break;
                Thread.Sleep(1);
            }
        }
        finally
        {
            if (!screen.HasExited) screen.Kill(entireProcessTree: true);
        }
        screen.WaitForExit(10_000).ShouldBeTrue();
        screen.ExitCode.ShouldNotBeInRange(0, 3, "the screen was killed before it finished");

        using (var r = db.Open())
        {
            r.Check().ShouldBeEmpty();
            var recorded = r.Reviews();
            // Usually part-way through the register phase; under heavy load it may have recorded all 90 before the kill.
            log.WriteLine($"{kind}: killed after {clock.ElapsedMilliseconds} ms with {recorded.Count} of 90 reviews recorded (exit code {screen.ExitCode})");
            foreach (var review in recorded) r.Findings(review.Id).Count.ShouldBe(review.FindingCount);
        }

        var rerun = ChildProcess.Finish(ChildProcess.Cli("screen", batch.Folder, "--out", batch.Out, "--register", db.Location, "-q"));
        rerun.Code.ShouldBe(1, rerun.Err + rerun.Out);
        using var final = db.Open();
        final.Check().ShouldBeEmpty();
        // Every submission is now recorded; the ones the killed screen had recorded are repeats of their round 1.
        final.References().Count.ShouldBe(90);
        final.References().ShouldAllBe(x => x.Rounds == 1);
        CsvRecords.Parse(File.ReadAllText(Path.Combine(batch.Out, Screener.SummaryFile))).Count.ShouldBe(90);
    }
}
