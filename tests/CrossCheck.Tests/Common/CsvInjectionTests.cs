using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Model;
using CrossCheck.Register;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Common;

/// <summary>
/// Every CSV the tool writes goes through <see cref="CsvOut"/>: a cell a spreadsheet would run as a formula is defused
/// (OWASP, "CSV Injection": cells starting with = + - @, tab or carriage return), a number is not. One test per writer.
/// </summary>
public class CsvInjectionTests
{
    /// <summary>Cells a spreadsheet would evaluate (OWASP, "CSV Injection": = + - @ tab CR).</summary>
    public static TheoryData<string> Hostile => new() { "=DL", "+1", "@x", "\tx", "-x", "\rx", "=HYPERLINK(\"http://x\")" };

    [Theory]
    [MemberData(nameof(Hostile))]
    public void Writer_DefusesAFormulaLikeCell_AndQuotesIt(string cell)
    {
        using var csv = new CsvOut();
        csv.Header("a", "b").Text(cell).Number(-12.5).End();
        var back = CsvRecords.Parse(csv.ToString()).ShouldHaveSingleItem();
        back["a"].ShouldBe("'" + cell);
        back["b"].ShouldBe("-12.5");
        csv.ToString().ShouldContain("\"'");
    }

    [Theory]
    [InlineData("-12.5")]   // a negative number: - followed by a digit
    [InlineData("-0")]
    [InlineData("12")]
    [InlineData("DL")]
    [InlineData("a=b")]
    [InlineData("")]
    public void Writer_LeavesOrdinaryCellsAsTheyAre(string cell)
    {
        CsvOut.IsFormulaLike(cell).ShouldBeFalse();
        using var csv = new CsvOut();
        csv.Header("a").Text(cell).End();
        csv.ToString().ShouldBe(cell.Length == 0 ? "a\n\"\"\n" : $"a\n{cell}\n");
    }

    [Fact]
    public void Writer_QuotesWhatRfc4180Requires_AndEndsLinesWithLf()
    {
        using var csv = new CsvOut();
        csv.Header("a", "b", "c").Text("x,y").Text("say \"hi\"").Text("two\nlines").End();
        csv.ToString().ShouldBe("a,b,c\n\"x,y\",\"say \"\"hi\"\"\",\"two\nlines\"\n");
    }

    [Fact]
    public void Writer_RefusesANumeralThatIsNotANumber()
    {
        using var csv = new CsvOut();
        Should.Throw<ArgumentException>(() => csv.Numeral("=1+2"));
        Should.Throw<ArgumentException>(() => csv.Numeral("-"));
    }

    [Fact]
    public void Solve_DefusesCaseMemberAndJointNames_NotTheMoments()
    {
        // A cantilever with a point load at its tip: fixed-end moment P·L (statics), 10 × 2 = 20, hogging.
        // SI in the model (N, m); the report is in kN·m.
        var b = new FrameBuilder().Joint("+1", 0, 0, Restraint.Fixed).Joint("\tx", 2, 0).Member("@x", "+1", "\tx", 200e9, 1e-4);
        b.Point("@x", 10e3, 2, c: "=DL").Point("@x", 10e3, 2, c: "-x");
        var s = new Submission("calc.csv", SubmissionInfo.Empty, b.Model, b.Cases, Claims.None);
        var result = new FrameSolver().Solve(s.Model, s.Cases);
        var rows = CsvRecords.Parse(new SolveReport(s, result).ToCsv());
        rows.Select(r => r["case"]).Distinct().ShouldBe(["'=DL", "'-x"]);
        rows.ShouldAllBe(r => r["member"] == "'@x");
        rows.Select(r => r["at"]).Distinct().ShouldBe(["'+1", "'\tx"]);
        rows.First(r => r["at"] == "'+1")["moment [kN·m]"].ShouldBe("-20"); // clockwise on the member end at the support
    }

    [Fact]
    public void SolveCommand_DefusesALoadCaseNamedLikeAFormula()
    {
        using var t = new TempSubmission();
        string csv = File.ReadAllText(CliRunner.Demo("footbridge.csv")).Replace("\nDL,", "\n=DL,", StringComparison.Ordinal);
        var r = CliRunner.Run("solve", t.Write("calc.csv", csv), "--format", "csv");
        r.ExitCode.ShouldBe(0, r.Err);
        r.Out.ShouldContain("\n\"'=DL\",BC,B,-114.727273\n"); // three-moment equation by hand: 5889.33 / 51.333 (see SolveCommandTests)
        r.Out.ShouldNotContain("\n=DL");
    }

    [Fact]
    public void Extract_DefusesTextCells_KeepsNumbers_AndReadsBack()
    {
        var header = new RawRow(1, ["case", "member", "at", "moment [kN·m]"]);
        var table = new RawTable("end-moments", "calc.pdf", header, [
            new RawRow(2, ["=DL", "+1", "@x", "-12.5"], 1),
            new RawRow(3, ["-x", "AB", "A", "+5"], 1),
            new RawRow(4, ["LL", "AB", "B", "=1+2"], 1),
        ]);
        var file = ContractCsv.Render([table]).ShouldHaveSingleItem();
        file.Content.ShouldStartWith("# read from calc.pdf p.1 lines 2-4\ncase,member,at,moment [kN·m]\n");

        using var t = new TempSubmission();
        string path = t.Write(file.FileName, file.Content);
        var problems = new List<InputProblem>();
        var back = CsvTableReader.ReadSingle(path, file.FileName, "end-moments", problems).ShouldNotBeNull();
        problems.ShouldBeEmpty();
        back.Rows.Select(r => r.Cells).ShouldBe([
            ["'=DL", "'+1", "'@x", "-12.5"],
            ["'-x", "AB", "A", "+5"],      // a number stays a number, even with its sign written out
            ["LL", "AB", "B", "'=1+2"],    // a formula in a number column is text, and defused
        ]);
    }

    [Fact]
    public void ScreenSummary_DefusesNamesReferencesFilesAndErrors()
    {
        var group = new ScreenGroupKey(ScreenGroupKind.InputError, "input-error");
        ScreenRow Row(string name, string reference, string memo, string problem) =>
            new(new ScreenItem(name, name, "s", false), ScreenOutcome.InputError, null, [], reference, null, memo, group, problem);
        var rows = new[] { Row("=DL", "+1", "@x", "\tx"), Row("-x", "-12.5", "m.md", "-x") };
        var report = new ScreenReport("/in", "/out", null, new ScreenOptions(ReviewOptions.Default, "/out"), rows, ScreenGrouping.Groups(rows), [],
            TimeSpan.Zero, 1);
        var csv = CsvRecords.Parse(ScreenOutputs.SummaryCsv(report));
        csv[0]["submission"].ShouldBe("'=DL");
        csv[0]["reference"].ShouldBe("'+1");
        csv[0]["memo"].ShouldBe("'@x");
        csv[0]["error"].ShouldBe("'\tx");
        csv[1]["submission"].ShouldBe("'-x");
        csv[1]["reference"].ShouldBe("-12.5");
        csv[1]["error"].ShouldBe("'-x");
    }

    [Fact]
    public void RegisterExport_DefusesReferenceTitleReviewerAndSubmission()
    {
        using var t = new TempSubmission();
        string text = SampleText.With(info: SampleText.Info.Replace("title,Test beam", "title,-x", StringComparison.Ordinal) + "\nrevision,-12.5")
            .Replace("1,AB,A,-81", "1,AB,A,-70", StringComparison.Ordinal);
        var review = Reviewing.Of(text, new ReviewOptions(Reviewer: "@x", Date: new DateOnly(2026, 12, 1)));
        using var r = ReviewRegister.Open(Path.Combine(t.Folder, "reg.db"));
        r.Record(review, "=DL", "+1", "sha256:abc");

        var row = CsvRecords.Parse(r.ExportReviewsCsv()).ShouldHaveSingleItem();
        row["reference"].ShouldBe("'=DL");
        row["submission"].ShouldBe("'+1");
        row["title"].ShouldBe("'-x");
        row["reviewer"].ShouldBe("'@x");
        row["revision"].ShouldBe("-12.5");
        row["abs_tolerance"].ShouldBe("0.1");
        var findings = CsvRecords.Parse(r.ExportFindingsCsv());
        findings.ShouldNotBeEmpty();
        findings.ShouldAllBe(f => f["reference"] == "'=DL");
    }
}
