using CrossCheck.Cli;
using CrossCheck.Register;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Register;

/// <summary>
/// <c>crosscheck register copy</c> moves a register from the SQLite file to a PostgreSQL database and back; both sides
/// then check sound and hold the same rounds, comments and hashes (the same digest, the same exports, the same history).
/// </summary>
public class RegisterCopyTests
{
    private static readonly string[] Common = ["--reviewer", "G. Mover", "--date", "2026-12-01", "-q"];

    /// <summary>Three rounds of one calculation and a second reference, recorded in an SQLite register.</summary>
    private static void Fill(TempSubmission t, string register)
    {
        string calc = Path.Combine(t.Folder, "calc.csv");
        string right = SampleText.With(info: SampleText.Info + "\nreference,MV-1");
        foreach (string text in new[] { right.Replace("1,AB,A,-81", "1,AB,A,-70", StringComparison.Ordinal), right, right })
        {
            File.WriteAllText(calc, text);
            CliRunner.Run(["review", calc, "--register", register, "--out", Path.Combine(t.Folder, "memo.md"), .. Common]).ExitCode.ShouldBeLessThan(2);
        }
        CliRunner.Run(["review", CliRunner.Demo("footbridge.csv"), "--register", register, "--out", Path.Combine(t.Folder, "fb.md"), .. Common])
            .ExitCode.ShouldBe(ExitCodes.Comments);
    }

    private static string Digest(string register)
    {
        var check = CliRunner.Run("register", "check", "--register", register);
        check.ExitCode.ShouldBe(ExitCodes.Concur, check.Err + check.Out);
        return check.Out[check.Out.IndexOf("4 reviews of 2 references", StringComparison.Ordinal)..].Trim();
    }

    [PostgresFact]
    public void SqliteToPostgresAndBack_KeepsRoundsCommentsAndHashes()
    {
        using var server = new RegisterScratch(RegisterKind.PostgreSql);
        string file = Path.Combine(server.Folder, "office.db"), back = Path.Combine(server.Folder, "back.db");
        Fill(server.Files, file);

        var there = CliRunner.Run("register", "copy", file, server.Location);
        there.ExitCode.ShouldBe(ExitCodes.Concur, there.Err + there.Out);
        there.Out.ShouldContain("copied 4 reviews and");
        there.Out.ShouldContain("Both registers check sound and hold the same rounds, comments and hashes.");
        var again = CliRunner.Run("register", "copy", back, server.Location);
        again.ExitCode.ShouldBe(ExitCodes.InputError);
        again.Err.ShouldContain("there is no register at");
        var home = CliRunner.Run("register", "copy", server.Location, back);
        home.ExitCode.ShouldBe(ExitCodes.Concur, home.Err + home.Out);

        Digest(server.Location).ShouldBe(Digest(file));
        Digest(back).ShouldBe(Digest(file));
        foreach (string[] export in new[] { new[] { "register", "export" }, ["register", "export", "--findings"], ["history"], ["history", "MV-1"] })
        {
            string original = CliRunner.Run([.. export, "--register", file]).Out;
            original.Length.ShouldBeGreaterThan(100);
            CliRunner.Run([.. export, "--register", server.Location]).Out.ShouldBe(original, string.Join(' ', export));
            CliRunner.Run([.. export, "--register", back]).Out.ShouldBe(original, string.Join(' ', export));
        }

        // The copy goes on as a register of its own: the next round follows on.
        string calc = Path.Combine(server.Folder, "calc.csv");
        File.AppendAllText(calc, "\n# resubmitted\n");
        var next = CliRunner.Run(["review", calc, "--register", server.Location, "--out", Path.Combine(server.Folder, "memo.md"), "--reviewer", "G. Mover", "--date", "2026-12-02"]);
        next.Out.ShouldContain("register: round 3 of MV-1");
        using var r = server.Open();
        r.Reviews().Select(x => x.Id).ShouldBe([1, 2, 3, 4, 5], "ids continue after the copied ones");
        r.Check().ShouldBeEmpty();
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void ACopyIntoARegisterThatHoldsReviews_IsRefused_AndChangesNothing(RegisterKind kind)
    {
        using var target = new RegisterScratch(kind, "target.db");
        string file = Path.Combine(target.Folder, "office.db");
        Fill(target.Files, file);
        CliRunner.Run(["review", CliRunner.Demo("footbridge.csv"), "--register", target.Location, "--out", Path.Combine(target.Folder, "x.md"), .. Common]);
        var r = CliRunner.Run("register", "copy", file, target.Location);
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Err.ShouldContain("already holds 1 review; copy into a new or empty register");
        target.Scalar("SELECT count(*) FROM reviews").ShouldBe(1);
        CliRunner.Run("register", "copy", file, file).Err.ShouldContain("onto itself");
    }
}
