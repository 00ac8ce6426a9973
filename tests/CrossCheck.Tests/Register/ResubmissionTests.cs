using System.Text.Json;
using CrossCheck.Cli;
using CrossCheck.Import;
using CrossCheck.Jobs;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Register;

/// <summary>
/// A calculation that goes back and forth: round 1 with three findings, round 2 fixing two and adding one, round 3
/// fixing the new one. The beam has every support fixed, so each span is a fixed-fixed beam under UDL whose end
/// moments are ∓wL²/12 (Hicks, Civil Engineering Formulas, Fig. 2.2 case 5; AISC Manual Table 3-23 case 15, from
/// memory): with w = 12 kN/m, ∓25 kN·m on the 5 m span AB, ∓36 on the 6 m span BC, ∓49 on the 7 m span CD.
/// </summary>
public class ResubmissionTests
{
    private static readonly (string Member, string Start, string End, double Fem)[] Spans = [("AB", "A", "B", 25), ("BC", "B", "C", 36), ("CD", "C", "D", 49)];

    /// <summary>The calculation at one revision: claims for cases 1–3, with some ends left out and some values replaced.</summary>
    private static string Calc(string revision, (string Case, string Member, string At)[] omit, (string Case, string Member, string At, double Moment)[] replace)
    {
        var lines = new List<string>
        {
            "[info]", "key,value", "title,Kestrel Yard loading bay beam (invented)", "reference,KY-LB-02", $"revision,{revision}",
            "force unit,kN", "length unit,m", "",
            "[supports]", "support,restraint", "A,fixed", "B,fixed", "C,fixed", "D,fixed", "",
            "[spans]", "span,length,E [GPa],I [mm^4]", "AB,5,200,250e6", "BC,6,200,250e6", "CD,7,200,250e6", "",
            "[loads]", "case,on,kind,w",
        };
        foreach (var c in new[] { "1", "2", "3" })
            foreach (var s in Spans) lines.Add($"{c},{s.Member},udl,12");
        lines.AddRange(["", "[end-moments]", "case,member,at,moment"]);
        foreach (var c in new[] { "1", "2", "3" })
            foreach (var s in Spans)
                foreach (var (at, m) in new[] { (s.Start, -s.Fem), (s.End, s.Fem) })
                {
                    if (omit.Contains((c, s.Member, at))) continue;
                    double v = replace.FirstOrDefault(r => r.Case == c && r.Member == s.Member && r.At == at) is { Member: not null } r ? r.Moment : m;
                    lines.Add(FormattableString.Invariant($"{c},{s.Member},{at},{v}"));
                }
        return string.Join("\n", lines) + "\n";
    }

    // Round 1: case 1 leaves out AB at A; case 2 claims −30 for BC at B (the fixed-end moment is −36).
    private static readonly string Round1 = Calc("A", [("1", "AB", "A")], [("2", "BC", "B", -30)]);

    // Round 2: BC at B corrected; AB at A still left out; CD at D now left out in case 3.
    private static readonly string Round2 = Calc("B", [("1", "AB", "A"), ("3", "CD", "D")], []);

    // Round 3: CD at D given again; AB at A still left out.
    private static readonly string Round3 = Calc("C", [("1", "AB", "A")], []);

    private static ReviewResult ReviewOf(string path) =>
        new ReviewJob().Review(path, new ReviewOptions(Reviewer: "E. Rounds", Date: new DateOnly(2026, 12, 1))).Review!;

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void Rounds_ClosedPersistingAndNewComments_AreTheOnesFixedKeptAndAdded(RegisterKind kind)
    {
        using var db = new RegisterScratch(kind);
        using var register = db.Open();
        string calc = Path.Combine(db.Folder, "calc.csv");
        RoundComparison Record(string text)
        {
            File.WriteAllText(calc, text);
            var review = ReviewOf(calc);
            return register.Record(review, review.ReferenceOr("calc"), "calc.csv", InputHash.Compute(calc));
        }

        var r1 = Record(Round1);
        r1.Review.Reference.ShouldBe("KY-LB-02");
        r1.Review.Round.ShouldBe(1);
        r1.Review.Verdict.ShouldBe("revise");
        r1.Previous.ShouldBeNull();
        // Case 2's one wrong figure (BC at B) is one comment, with the compatibility finding it causes beneath it.
        r1.New.Select(c => c.Id).ShouldBe(["EM-1-AB", "EM-2-BC-B"], ignoreOrder: true);

        var r2 = Record(Round2);
        r2.Review.Round.ShouldBe(2);
        r2.Review.Revision.ShouldBe("B");
        r2.Previous!.Round.ShouldBe(1);
        r2.Closed.Select(c => c.Id).ShouldBe(["EM-2-BC-B"]);
        r2.Persisting.Select(c => c.Id).ShouldBe(["EM-1-AB"]);
        r2.New.Select(c => c.Id).ShouldBe(["EM-3-CD"]);
        r2.Closed.ShouldAllBe(c => c.FirstRaisedRound == 1 && c.PreviousSeverity == "major");
        r2.Persisting[0].FirstRaisedRound.ShouldBe(1);
        r2.New[0].FirstRaisedRound.ShouldBe(2);
        r2.Review.Verdict.ShouldBe("concur-with-comments");

        var r3 = Record(Round3);
        r3.Closed.Select(c => c.Id).ShouldBe(["EM-3-CD"]);
        r3.Persisting.Select(c => c.Id).ShouldBe(["EM-1-AB"]);
        r3.Persisting[0].FirstRaisedRound.ShouldBe(1, "raised in every round since the first");
        r3.New.ShouldBeEmpty();

        // The same round-3 files again: a repeat of round 3, still compared with round 2.
        var again = Record(Round3);
        again.Review.Round.ShouldBe(3);
        again.Repeat.ShouldBeTrue();
        again.Previous!.Round.ShouldBe(2);
        again.Closed.Select(c => c.Id).ShouldBe(["EM-3-CD"]);

        var history = register.History("KY-LB-02");
        history.Select(h => (h.Review.Round, h.Repeat)).ShouldBe([(1, false), (2, false), (3, false), (3, true)]);
        history[1].Closed.Count.ShouldBe(1);
        register.Check().ShouldBeEmpty();
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void ReviewCommand_WithARegister_MemoJsonAndHistoryShowTheRounds(RegisterKind kind)
    {
        using var register = new RegisterScratch(kind);
        string db = register.Location, folder = register.Folder;
        string calc = Path.Combine(folder, "calc.csv");
        string memo = Path.Combine(folder, "memo.md");
        string[] common = ["--register", db, "--reviewer", "E. Rounds", "--date", "2026-12-01"];

        File.WriteAllText(calc, Round1);
        var first = CliRunner.Run(["review", calc, "--out", memo, .. common]);
        first.ExitCode.ShouldBe(ExitCodes.Comments, first.Err);
        first.Out.ShouldContain("register: round 1 of KY-LB-02 (first round)");
        string memo1 = File.ReadAllText(memo);
        memo1.ShouldContain("| Review register | round 1 of KY-LB-02 |");
        memo1.ShouldContain("there is no earlier round to compare with");

        File.WriteAllText(calc, Round2);
        var second = CliRunner.Run(["review", calc, "--out", memo, .. common]);
        second.Out.ShouldContain("register: round 2 of KY-LB-02 — 1 closed, 1 persisting, 1 new against round 1");
        string memo2 = File.ReadAllText(memo);
        memo2.ShouldContain("| Review register | round 2 of KY-LB-02 (previous: round 1, 2026-12-01) |");
        memo2.ShouldContain("### Against the previous round");
        memo2.ShouldContain("Against round 1 (revision A, reviewed 2026-12-01, verdict: Revise and resubmit): 1 comment closed, 1 persisting, 1 new.");
        memo2.ShouldContain("| closed | EM-2-BC-B |");
        memo2.ShouldContain("| **persisting** | EM-1-AB | minor | 1 |");
        memo2.ShouldContain("| **new** | EM-3-CD | minor | 3 |");
        memo2.ShouldContain("engineer of record remains responsible");

        string html = Path.Combine(folder, "memo.html");
        CliRunner.Run(["review", calc, "--format", "html", "--out", html, .. common]).ExitCode.ShouldBe(ExitCodes.Comments);
        string memoHtml = File.ReadAllText(html);
        memoHtml.ShouldContain("<h3>Against the previous round</h3>");
        memoHtml.ShouldContain("<span class=\"rs rs-persisting\">persisting</span>");
        memoHtml.ShouldContain("repeat review of that round");

        var json = CliRunner.Run(["review", calc, "--format", "json", .. common]);
        using (var doc = JsonDocument.Parse(json.Out.ShouldMatchReviewSchema()))
        {
            var reg = doc.RootElement.GetProperty("register");
            reg.GetProperty("reference").GetString().ShouldBe("KY-LB-02");
            reg.GetProperty("round").GetInt32().ShouldBe(2);
            reg.GetProperty("repeat").GetBoolean().ShouldBeTrue();
            reg.GetProperty("previousRound").GetInt32().ShouldBe(1);
            reg.GetProperty("closed").EnumerateArray().Select(e => e.GetString()).ShouldBe(["EM-2-BC-B"], ignoreOrder: true);
            reg.GetProperty("persisting").EnumerateArray().Select(e => e.GetString()).ShouldBe(["EM-1-AB"]);
            reg.GetProperty("new").EnumerateArray().Select(e => e.GetString()).ShouldBe(["EM-3-CD"]);
        }
        CliRunner.Run("review", calc, "--format", "json").Out.ShouldNotContain("\"register\"");

        var history = CliRunner.Run("history", "KY-LB-02", "--register", db);
        history.ExitCode.ShouldBe(ExitCodes.Concur, history.Err);
        history.Out.ShouldContain("KY-LB-02: 2 rounds, 4 reviews");
        history.Out.ShouldContain("round 2 against round 1: closed EM-2-BC-B; persisting EM-1-AB; new EM-3-CD");
        history.Out.ShouldContain("2 (repeat)");
        CliRunner.Run("history", "--register", db).Out.ShouldContain("KY-LB-02");
        var unknown = CliRunner.Run("history", "NOPE", "--register", db);
        unknown.ExitCode.ShouldBe(ExitCodes.InputError);
        unknown.Err.ShouldContain("no reviews of reference 'NOPE'");
        var none = CliRunner.Run("history", "KY-LB-02", "--register", Path.Combine(folder, "missing.db"));
        none.ExitCode.ShouldBe(ExitCodes.InputError);
        none.Err.ShouldContain("there is no register");
        File.Exists(Path.Combine(folder, "missing.db")).ShouldBeFalse("history never creates a register");

        string export = Path.Combine(folder, "reviews.csv");
        CliRunner.Run("register", "export", "--register", db, "--out", export).ExitCode.ShouldBe(ExitCodes.Concur);
        CsvRecords.Parse(File.ReadAllText(export)).Select(r => r["round"]).ShouldBe(["1", "2", "2", "2"]);
        var findings = CliRunner.Run("register", "export", "--register", db, "--findings");
        CsvRecords.Parse(findings.Out).Count(r => r["comment_id"] == "EM-1-AB").ShouldBe(4);
        var check = CliRunner.Run("register", "check", "--register", db);
        check.ExitCode.ShouldBe(ExitCodes.Concur);
        check.Out.ShouldContain($"sound (schema version {ReviewRegister.LatestSchemaVersion}, 4 reviews)");
        check.Out.ShouldContain($"4 reviews of 1 reference, {CsvRecords.Parse(findings.Out).Count} findings; contents sha256:");
    }

    [Theory]
    [InlineData(RegisterKind.SqliteFile)]
    [PostgresData]
    public void Screen_ResubmittedFolder_IndexAndSummaryShowTheRounds(RegisterKind kind)
    {
        using var register = new RegisterScratch(kind);
        string db = register.Location, folder = register.Folder;
        string subs = register.Files.MakeFolder("inbox");
        File.WriteAllText(Path.Combine(subs, "loading-bay.csv"), Round1);
        CliRunner.Run("screen", subs, "--out", Path.Combine(folder, "out1"), "--register", db, "-q").ExitCode.ShouldBe(ExitCodes.Comments);
        File.WriteAllText(Path.Combine(subs, "loading-bay.csv"), Round2);
        var r = CliRunner.Run("screen", subs, "--out", Path.Combine(folder, "out2"), "--register", db);
        r.Out.ShouldContain("1 closed, 1 persisting, 1 new");
        var row = CsvRecords.Parse(File.ReadAllText(Path.Combine(folder, "out2", "summary.csv"))).ShouldHaveSingleItem();
        (row["round"], row["closed"], row["persisting"], row["new"]).ShouldBe(("2", "1", "1", "1"));
        File.ReadAllText(Path.Combine(folder, "out2", "index.html")).ShouldContain("1 closed, 1 persisting, 1 new");
        File.ReadAllText(Path.Combine(folder, "out2", "loading-bay-review.html")).ShouldContain("Against the previous round");
    }
}
