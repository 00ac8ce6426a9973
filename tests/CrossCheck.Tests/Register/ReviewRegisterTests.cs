using CrossCheck.Common;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using Microsoft.Data.Sqlite;

namespace CrossCheck.Tests.Register;

public class ReviewRegisterTests
{
    private static ReviewResult Review(string csv, string? reviewer = "D. Register") =>
        Reviewing.Of(csv, new ReviewOptions(0.1, 0.01, 0.05, reviewer, new DateOnly(2026, 12, 1)));

    // Propped cantilever under UDL, claims −81 kN·m at the fixed end = −wL²/8 (Hicks, Civil Engineering Formulas, Fig. 2.2 case 10);
    // the wrong variant claims −70 kN·m there.
    private static readonly string Right = SampleText.With(info: SampleText.Info + "\nreference,PC-1\nrevision,A");
    private static readonly string Wrong = Right.Replace("1,AB,A,-81", "1,AB,A,-70", StringComparison.Ordinal);

    private static T Pragma<T>(string path, string pragma)
    {
        using var c = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = path, Pooling = false, Mode = SqliteOpenMode.ReadOnly }.ToString());
        c.Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = "PRAGMA " + pragma;
        return (T)Convert.ChangeType(cmd.ExecuteScalar()!, typeof(T), System.Globalization.CultureInfo.InvariantCulture);
    }

    [Fact]
    public void NewRegister_IsWal_MarkedAsARegister_AtTheLatestSchema()
    {
        using var db = new RegisterScratch(RegisterKind.SqliteFile);
        string path = db.Location;
        using (var r = db.Open())
        {
            r.SchemaVersion.ShouldBe(ReviewRegister.LatestSchemaVersion);
            r.Reviews().ShouldBeEmpty();
            r.Check().ShouldBeEmpty();
        }
        Pragma<string>(path, "journal_mode").ShouldBe("wal");
        Pragma<long>(path, "user_version").ShouldBe(ReviewRegister.LatestSchemaVersion);
        Pragma<long>(path, "application_id").ShouldBe(0x43434B52);
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void Record_KeepsEveryFieldAndEveryFindingWithItsCommentId(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        var review = Review(Wrong);
        review.Verdict.ShouldBe(Verdict.Revise);
        review.Comments.Count.ShouldBeGreaterThan(0);
        using var r = db.Open();
        var c = r.Record(review, "PC-1", "calc.csv", "sha256:abc");

        var row = r.Reviews().ShouldHaveSingleItem();
        row.ShouldBe(c.Review);
        row.Reference.ShouldBe("PC-1");
        row.Round.ShouldBe(1);
        row.Revision.ShouldBe("A");
        row.Title.ShouldBe("Test beam");
        row.Submission.ShouldBe("calc.csv");
        row.ReviewDate.ShouldBe("2026-12-01");
        row.Reviewer.ShouldBe("D. Register");
        row.ToolVersion.ShouldBe(ToolInfo.Version);
        row.AbsoluteTolerance.ShouldBe(0.1);
        row.RelativeTolerance.ShouldBe(0.01);
        row.MinorRelativeTolerance.ShouldBe(0.05);
        row.MomentUnit.ShouldBe("kN·m");
        row.InputHash.ShouldBe("sha256:abc");
        row.Verdict.ShouldBe("revise");
        row.EndsDiscrepant.ShouldBe(review.CountEnds(EndStatus.Discrepant));
        row.MajorFlags.ShouldBe(review.CountFlags(Severity.Major));
        row.FindingCount.ShouldBe(review.Comments.Count);
        DateTime.Parse(row.RecordedAt, System.Globalization.CultureInfo.InvariantCulture).ShouldBeInRange(DateTime.Now.AddMinutes(-5), DateTime.Now.AddMinutes(5));

        var findings = r.Findings(row.Id);
        findings.Select(f => f.CommentId).ShouldBe(review.Comments.Select(x => x.Id));
        findings.Select(f => f.Text).ShouldBe(review.Comments.Select(x => x.Text));
        findings.Select(f => f.Severity).ShouldBe(review.Comments.Select(x => x.Severity.Json()));
        findings[0].Kind.ShouldBe(findings[0].CommentId.Split('-')[0]);
        c.Previous.ShouldBeNull();
        c.New.Select(x => x.Id).ShouldBe(review.Comments.Select(x => x.Id));
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void SameFilesAgain_AreARepeatOfTheRound_ChangedFiles_ANewRound(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        using var r = db.Open();
        r.Record(Review(Wrong), "PC-1", "calc.csv", "sha256:1").Review.Round.ShouldBe(1);
        var again = r.Record(Review(Wrong), "PC-1", "calc.csv", "sha256:1");
        again.Review.Round.ShouldBe(1);
        again.Repeat.ShouldBeTrue();
        var next = r.Record(Review(Right), "PC-1", "calc.csv", "sha256:2");
        next.Review.Round.ShouldBe(2);
        next.Repeat.ShouldBeFalse();
        next.Previous!.Id.ShouldBe(again.Review.Id, "compared with the latest review of the previous round");
        r.Record(Review(Right), "PC-2", "other.csv", null).Review.Round.ShouldBe(1);
        var unhashed = r.Record(Review(Right), "PC-2", "other.csv", null);
        unhashed.Review.Round.ShouldBe(2, "files that could not be hashed never count as the same files");
        r.Check().ShouldBeEmpty();
        r.References().Select(x => (x.Reference, x.Rounds, x.Reviews)).ShouldBe([("PC-1", 2, 3), ("PC-2", 2, 2)]);
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void Export_GivesOneRowPerReview_AndOnePerFinding(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        using var r = db.Open();
        var wrong = Review(Wrong);
        r.Record(wrong, "PC-1", "calc.csv", "sha256:1");
        r.Record(Review(Right), "PC-1", "calc.csv", "sha256:2");
        var reviews = CsvRecords.Parse(r.ExportReviewsCsv());
        reviews.Select(x => x["round"]).ShouldBe(["1", "2"]);
        reviews.Select(x => x["verdict"]).ShouldBe(["revise", "concur"]);
        reviews[0]["reviewer"].ShouldBe("D. Register");
        reviews[0]["input_hash"].ShouldBe("sha256:1");
        reviews[0]["abs_tolerance"].ShouldBe("0.1");
        var findings = CsvRecords.Parse(r.ExportFindingsCsv());
        findings.Count.ShouldBe(wrong.Comments.Count);
        findings.Select(f => f["comment_id"]).ShouldBe(wrong.Comments.Select(c => c.Id));
        findings.ShouldAllBe(f => f["reference"] == "PC-1" && f["round"] == "1");
    }

    [Fact]
    public void Open_AFileThatIsNotARegister_SaysSo()
    {
        using var t = new TempSubmission();
        string text = t.Write("notes.db", new string('x', 4096));
        Should.Throw<RegisterException>(() => ReviewRegister.Open(text)).Message.ShouldContain("not a CrossCheck review register");

        string other = Path.Combine(t.Folder, "other.db");
        using (var c = new SqliteConnection($"Data Source={other};Pooling=False"))
        {
            c.Open();
            using var cmd = c.CreateCommand();
            cmd.CommandText = "CREATE TABLE customers (id INTEGER)";
            cmd.ExecuteNonQuery();
        }
        Should.Throw<RegisterException>(() => ReviewRegister.Open(other)).Message.ShouldContain("SQLite database but not a CrossCheck review register");

        Should.Throw<RegisterException>(() => ReviewRegister.Open(t.Folder)).Message.ShouldContain("is a folder");
        Should.Throw<RegisterException>(() => ReviewRegister.Open(Path.Combine(t.Folder, "no", "such", "reg.db"))).Message.ShouldContain("does not exist");
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void Migrations_RunOnceInOrder_KeepTheData_AndANewerRegisterIsRefused(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        var v1 = RegisterSchema.Migrations;
        var v2 = v1.Append(new Migration(v1[^1].Version + 1, "a note per review", "ALTER TABLE reviews ADD COLUMN note TEXT")).ToList();
        using (var r = ReviewRegister.Open(db.Location, v1, TimeSpan.FromSeconds(5)))
            r.Record(Review(Wrong), "PC-1", "calc.csv", "sha256:1");
        using (var r = ReviewRegister.Open(db.Location, v2, TimeSpan.FromSeconds(5)))
        {
            r.SchemaVersion.ShouldBe(v2[^1].Version);
            r.Reviews().ShouldHaveSingleItem().Reference.ShouldBe("PC-1");
            r.Record(Review(Right), "PC-1", "calc.csv", "sha256:2").Review.Round.ShouldBe(2);
        }
        using (var r = ReviewRegister.Open(db.Location, v2, TimeSpan.FromSeconds(5)))
            r.Reviews().Count.ShouldBe(2); // opening again applies nothing twice (ALTER would fail)
        db.Scalar("SELECT count(note) FROM reviews").ShouldBe(0, "the column the extra migration added is there");
        long before = db.Scalar("SELECT count(*) FROM reviews");
        var refused = Should.Throw<RegisterException>(() => db.Open());
        refused.Message.ShouldContain("written by a newer CrossCheck");
        refused.Message.ShouldContain("Nothing was written");
        db.Scalar("SELECT count(*) FROM reviews").ShouldBe(before);
    }

    /// <summary>A register made by the first release (schema version 1, before reviews were numbered within their round) opens and keeps counting.</summary>
    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void AVersion1Register_IsUpdated_ItsReviewsNumberedWithinTheirRounds(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        var v1 = RegisterSchema.Migrations.Take(1).ToList();
        using (var r = ReviewRegister.Open(db.Location, v1, TimeSpan.FromSeconds(5)))
        {
            // The first release's insert, by hand: two reviews of round 1 (the same files twice), one of round 2.
            foreach (var (round, hash) in new[] { (1, "sha256:a"), (1, "sha256:a"), (2, "sha256:b") })
                r.Write(tx =>
                {
                    tx.Execute("""
                        INSERT INTO reviews (reference, round, submission, source, review_date, recorded_at, tool_version, abs_tolerance, rel_tolerance,
                            minor_tolerance, moment_unit, input_hash, verdict, ends_agree, ends_minor, ends_discrepant, ends_missing, ends_unmatched,
                            major_flags, minor_flags, finding_count)
                        VALUES ('OLD-1', @round, 'calc.csv', 'calc.csv', '2026-11-02', '2026-11-02T09:00:00.000Z', '0.9', 0.1, 0.01, 0.05, 'kN·m',
                            @hash, 'concur', 4, 0, 0, 0, 0, 0, 0, 0)
                        """, ("@round", round), ("@hash", hash));
                    return 0;
                });
        }
        if (kind == RegisterKind.SqliteFile) Pragma<long>(db.Location, "user_version").ShouldBe(1);
        using var updated = db.Open();
        updated.SchemaVersion.ShouldBe(ReviewRegister.LatestSchemaVersion);
        updated.Check().ShouldBeEmpty();
        db.Scalar("SELECT count(*) FROM reviews WHERE round = 1 AND round_review = 2").ShouldBe(1);
        updated.History("OLD-1").Select(h => (h.Review.Round, h.Repeat)).ShouldBe([(1, false), (1, true), (2, false)]);
        var again = updated.Record(Review(Right), "OLD-1", "calc.csv", "sha256:b");
        (again.Review.Round, again.Repeat, again.Previous!.Round).ShouldBe((2, true, 1));
        updated.Record(Review(Right), "OLD-1", "calc.csv", "sha256:c").Review.Round.ShouldBe(3);
        updated.Check().ShouldBeEmpty();
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void AFailingMigration_LeavesTheRegisterAsItWas(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        using (var r = db.Open()) r.Record(Review(Wrong), "PC-1", "calc.csv", "sha256:1");
        var broken = RegisterSchema.Migrations
            .Append(new Migration(RegisterSchema.Migrations[^1].Version + 1, "two steps, the second wrong",
                "CREATE TABLE extra (x integer); ALTER TABLE nowhere ADD COLUMN y integer"))
            .ToList();
        Should.Throw<RegisterException>(() => ReviewRegister.Open(db.Location, broken, TimeSpan.FromSeconds(5))).Message.ShouldContain("updating the schema");
        using var again = db.Open();
        again.SchemaVersion.ShouldBe(ReviewRegister.LatestSchemaVersion);
        again.Reviews().Count.ShouldBe(1);
        again.Check().ShouldBeEmpty();
        Should.Throw<Exception>(() => db.Scalar("SELECT count(*) FROM extra")); // the first step was rolled back with the second
    }
}
