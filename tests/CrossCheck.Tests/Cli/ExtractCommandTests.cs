using System.Text.Json;
using System.Text.Json.Nodes;
using CrossCheck.Cli;
using CrossCheck.Tests.Import.Pdf;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Cli;

public class ExtractCommandTests
{
    private static string DemoPdf(string name) => CliRunner.Demo(name + ".pdf");

    /// <summary>The review JSON without the fields that say where the input was read.</summary>
    private static string WithoutSources(string json)
    {
        var node = JsonNode.Parse(json)!;
        void Strip(JsonNode? n)
        {
            switch (n)
            {
                case JsonObject o:
                    foreach (var key in o.Select(kv => kv.Key).Where(k => k is "source" or "sources" or "generated"
                        // Figures quoted as printed and the prose that cites lines differ between a CSV and its PDF by design.
                        or "claimedAsWritten" or "message" or "text" or "brief" or "evidence").ToList()) o.Remove(key);
                    foreach (var kv in o) Strip(kv.Value);
                    break;
                case JsonArray a:
                    foreach (var item in a) Strip(item);
                    break;
            }
        }
        Strip(node);
        // Messages cite where a value was printed ("footbridge.pdf p.1 line 20" / "loads.csv line 7"): the same finding
        // from either input differs only there.
        return System.Text.RegularExpressions.Regex.Replace(node.ToJsonString(new JsonSerializerOptions { WriteIndented = true }),
            @"[\w.-]+\.(csv|pdf)( p\.\d+)? line \d+", "<cited>");
    }

    [Theory]
    [InlineData("footbridge")]
    [InlineData("shed-frame")]
    public void Extract_WritesContractCsv_ThatReviewsLikeThePdf(string demo)
    {
        using var t = new TempSubmission();
        string dir = Path.Combine(t.Folder, "tables");
        var x = CliRunner.Run("extract", DemoPdf(demo), "--out", dir);
        x.ExitCode.ShouldBe(ExitCodes.Concur, x.Err);
        x.Out.ShouldContain($"{demo}.pdf: 6 tables read");
        x.Out.ShouldContain("end-moments:");
        x.Out.ShouldContain($"check the tables against the PDF, then run: crosscheck review {dir}");
        Directory.GetFiles(dir, "*.csv").Length.ShouldBe(6);

        var fromPdf = CliRunner.Run("review", DemoPdf(demo), "--format", "json");
        var fromCsv = CliRunner.Run("review", dir, "--format", "json");
        fromPdf.ExitCode.ShouldBe(ExitCodes.Comments);
        fromCsv.ExitCode.ShouldBe(ExitCodes.Comments);
        WithoutSources(fromCsv.Out.ShouldMatchReviewSchema()).ShouldBe(WithoutSources(fromPdf.Out.ShouldMatchReviewSchema()));
    }

    [Fact]
    public void Extract_RoundTripsTheTablesOfCombinationsEnvelopesSpanMomentsAndShears()
    {
        // The mezzanine-frame demo prints every new table; the folder extract writes must read back to the same submission as
        // the CSV it was printed from, and review alike.
        using var t = new TempSubmission();
        string dir = Path.Combine(t.Folder, "tables");
        var x = CliRunner.Run("extract", DemoPdf("mezzanine-frame"), "--out", dir);
        x.ExitCode.ShouldBe(ExitCodes.Concur, x.Err);
        foreach (var table in new[] { "combinations", "span-moments", "shears", "envelopes" })
            File.Exists(Path.Combine(dir, table + ".csv")).ShouldBeTrue(table);
        var folder = CrossCheck.Import.SubmissionReader.Read(dir).Submission!;
        var csv = CrossCheck.Import.SubmissionReader.Read(CliRunner.Demo("mezzanine-frame.csv")).Submission!;
        folder.Combinations.Select(c => c.Words).ShouldBe(csv.Combinations.Select(c => c.Words));
        folder.Claims.SpanMoments.Select(c => (c.Case, c.Member, c.Moment, c.X)).ShouldBe(csv.Claims.SpanMoments.Select(c => (c.Case, c.Member, c.Moment, c.X)));
        folder.Claims.Shears.Select(c => (c.Case, c.Member, c.End, c.V)).ShouldBe(csv.Claims.Shears.Select(c => (c.Case, c.Member, c.End, c.V)));
        folder.Claims.Envelopes.Select(c => (c.Combination, c.Member, c.End, c.IsSpan, c.Max, c.Min))
            .ShouldBe(csv.Claims.Envelopes.Select(c => (c.Combination, c.Member, c.End, c.IsSpan, c.Max, c.Min)));
        var fromPdf = CliRunner.Run("review", DemoPdf("mezzanine-frame"), "--format", "json");
        var fromFolder = CliRunner.Run("review", dir, "--format", "json");
        WithoutSources(fromFolder.Out.ShouldMatchReviewSchema()).ShouldBe(WithoutSources(fromPdf.Out.ShouldMatchReviewSchema()));
    }

    [Fact]
    public void Extract_SaysWhatItReadAndWhatNot()
    {
        using var t = new TempSubmission();
        var x = CliRunner.Run("extract", DemoPdf("footbridge"), "--out", Path.Combine(t.Folder, "out"));
        x.Out.ShouldContain("spans: 3 rows, p.1 lines 20-25");
        x.Out.ShouldContain("I [10⁶ mm⁴] → I [10⁶ mm⁴]");
        x.Out.ShouldContain("M_AB, M_BA, M_BC, M_CB, M_CD, M_DC → case, member, at, moment [kN·m]");
        x.Out.ShouldContain("Job No. → reference");
        File.ReadAllText(Path.Combine(t.Folder, "out", "end-moments.csv")).ShouldStartWith("# read from footbridge.pdf p.2 lines 7-8\ncase,member,at,moment [kN·m]\nDL,AB,A,0\n");
    }

    [Fact]
    public void Extract_IntoAFolderWithTables_NeedsForce_AndThenRemovesStaleTables()
    {
        using var t = new TempSubmission();
        string dir = Path.Combine(t.Folder, "out");
        t.Write("out/displacements.csv", "case,joint,ux [mm]\n1,B,3\n");
        var refused = CliRunner.Run("extract", DemoPdf("footbridge"), "--out", dir);
        refused.ExitCode.ShouldBe(ExitCodes.InputError);
        refused.Err.ShouldContain("already holds CSV files; give --force");
        File.Exists(Path.Combine(dir, "spans.csv")).ShouldBeFalse();

        var forced = CliRunner.Run("extract", DemoPdf("footbridge"), "--out", dir, "--force");
        forced.ExitCode.ShouldBe(ExitCodes.Concur, forced.Err);
        File.Exists(Path.Combine(dir, "displacements.csv")).ShouldBeFalse();
        File.Exists(Path.Combine(dir, "spans.csv")).ShouldBeTrue();
    }

    [Fact]
    public void Extract_WithProblemsInTheTables_WritesThemForCorrection_AndExitsWithTwo()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter().Text("Units: kN, m")
            .Table(new FixtureTable(["Joint", "x", "y", "Restraint"], [["A", "0", "0", "fixed"], ["B", "6", "0", "roler"]]))
            .Table(new FixtureTable(["Member", "Start", "End", "E [GPa]", "I [mm4]"], [["AB", "A", "B", "200", "250e6"]]))
            .Table(new FixtureTable(["Case", "On", "Kind", "w"], [["1", "AB", "udl", "18"]]))
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "-81"], ["1", "AB", "B", "0"]]));
        string pdf = t.WriteBytes("calc.pdf", w.Build());
        string dir = Path.Combine(t.Folder, "out");
        var x = CliRunner.Run("extract", pdf, "--out", dir);
        x.ExitCode.ShouldBe(ExitCodes.InputError);
        x.Err.ShouldContain($"correct them in {dir} and review the folder");
        x.Err.ShouldContain("'restraint' = \"roler\" is not recognised");
        x.Err.ShouldContain("calc.pdf:p1:");

        // The reviewer corrects the misread (here: misprinted) cell and reviews the folder.
        string joints = Path.Combine(dir, "joints.csv");
        File.WriteAllText(joints, File.ReadAllText(joints).Replace("roler", "roller", StringComparison.Ordinal));
        var review = CliRunner.Run("review", dir, "--out", Path.Combine(t.Folder, "memo.md"), "--quiet");
        review.ExitCode.ShouldBe(ExitCodes.Concur, review.Err); // −wL²/8 = −81 kN·m (Hicks Fig. 2.2 case 10)
    }

    [Fact]
    public void Extract_RefusesWhatIsNotAPdf()
    {
        var x = CliRunner.Run("extract", CliRunner.Demo("footbridge.csv"), "--out", Path.Combine(Path.GetTempPath(), "never-written"));
        x.ExitCode.ShouldBe(ExitCodes.InputError);
        x.Err.ShouldContain("is not a .pdf file");
    }

    [Fact]
    public void ReviewAndSolve_AcceptAPdf()
    {
        using var t = new TempSubmission();
        var review = CliRunner.Run("review", DemoPdf("shed-frame"), "--out", Path.Combine(t.Folder, "memo.md"));
        review.ExitCode.ShouldBe(ExitCodes.Comments, review.Err);
        review.Out.ShouldContain("verdict: revise");
        File.ReadAllText(Path.Combine(t.Folder, "memo.md")).ShouldContain("shed-frame.pdf p.2 line");

        var solve = CliRunner.Run("solve", DemoPdf("footbridge"), "--format", "csv");
        solve.ExitCode.ShouldBe(ExitCodes.Concur, solve.Err);
        solve.Out.ShouldContain("DL,BC,C,");
    }

    [Fact]
    public void PdfLimits_AreOptionsOfTheCommands()
    {
        var pages = CliRunner.Run("review", DemoPdf("footbridge"), "--max-pages", "1");
        pages.ExitCode.ShouldBe(ExitCodes.InputError);
        pages.Err.ShouldContain("the PDF has 2 pages; CrossCheck reads at most 1 (raise the limit with --max-pages");

        var time = CliRunner.Run("solve", DemoPdf("footbridge"), "--time-limit", "0");
        time.ExitCode.ShouldBe(ExitCodes.InputError);
        time.Err.ShouldContain("--time-limit between 0 and 3600 seconds");
    }
}
