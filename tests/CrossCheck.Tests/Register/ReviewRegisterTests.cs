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
        using var t = new TempSubmission();
        string path = Path.Combine(t.Folder, "reg.db");
        using (var r = ReviewRegister.Open(path))
        {
            r.SchemaVersion.ShouldBe(ReviewRegister.LatestSchemaVersion);
            r.Reviews().ShouldBeEmpty();
            r.Check().ShouldBeEmpty();
        }
        Pragma<string>(path, "journal_mode").ShouldBe("wal");
        Pragma<long>(path, "user_version").ShouldBe(ReviewRegister.LatestSchemaVersion);
        Pragma<long>(path, "application_id").ShouldBe(0x43434B52);
    }

    [Fact]
    public void Record_KeepsEveryFieldAndEveryFindingWithItsCommentId()
    {
        using var t = new TempSubmission();
        var review = Review(Wrong);
        review.Verdict.ShouldBe(Verdict.Revise);
        review.Comments.Count.ShouldBeGreaterThan(0);
        using var r = ReviewRegister.Open(Path.Combine(t.Folder, "reg.db"));
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

    [Fact]
    public void SameFilesAgain_AreARepeatOfTheRound_ChangedFiles_ANewRound()
    {
        using var t = new TempSubmission();
        using var r = ReviewRegister.Open(Path.Combine(t.Folder, "reg.db"));
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

    [Fact]
    public void Export_GivesOneRowPerReview_AndOnePerFinding()
    {
        using var t = new TempSubmission();
        using var r = ReviewRegister.Open(Path.Combine(t.Folder, "reg.db"));
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

    [Fact]
    public void Migrations_RunOnceInOrder_KeepTheData_AndANewerRegisterIsRefused()
    {
        using var t = new TempSubmission();
        string path = Path.Combine(t.Folder, "reg.db");
        var v1 = RegisterSchema.Migrations;
        var v2 = v1.Append(new Migration(v1[^1].Version + 1, "a note per review", "ALTER TABLE reviews ADD COLUMN note TEXT")).ToList();
        using (var r = ReviewRegister.Open(path, v1, TimeSpan.FromSeconds(5)))
            r.Record(Review(Wrong), "PC-1", "calc.csv", "sha256:1");
        using (var r = ReviewRegister.Open(path, v2, TimeSpan.FromSeconds(5)))
        {
            r.SchemaVersion.ShouldBe(v2[^1].Version);
            r.Reviews().ShouldHaveSingleItem().Reference.ShouldBe("PC-1");
            r.Record(Review(Right), "PC-1", "calc.csv", "sha256:2").Review.Round.ShouldBe(2);
        }
        using (var r = ReviewRegister.Open(path, v2, TimeSpan.FromSeconds(5)))
            r.Reviews().Count.ShouldBe(2); // opening again applies nothing twice (ALTER would fail)
        Pragma<long>(path, "user_version").ShouldBe(v2[^1].Version);
        Should.Throw<RegisterException>(() => ReviewRegister.Open(path)).Message.ShouldContain("written by a newer CrossCheck");
    }

    [Fact]
    public void AFailingMigration_LeavesTheRegisterAsItWas()
    {
        using var t = new TempSubmission();
        string path = Path.Combine(t.Folder, "reg.db");
        using (var r = ReviewRegister.Open(path)) r.Record(Review(Wrong), "PC-1", "calc.csv", "sha256:1");
        var broken = RegisterSchema.Migrations
            .Append(new Migration(RegisterSchema.Migrations[^1].Version + 1, "two steps, the second wrong", "CREATE TABLE extra (x); ALTER TABLE nowhere ADD COLUMN y"))
            .ToList();
        Should.Throw<RegisterException>(() => ReviewRegister.Open(path, broken, TimeSpan.FromSeconds(5))).Message.ShouldContain("updating the schema");
        Pragma<long>(path, "user_version").ShouldBe(ReviewRegister.LatestSchemaVersion);
        using var again = ReviewRegister.Open(path);
        again.Reviews().Count.ShouldBe(1);
        again.Check().ShouldBeEmpty();
    }
}
