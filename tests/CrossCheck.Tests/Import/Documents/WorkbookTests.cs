using System.Text.RegularExpressions;
using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Memo;
using CrossCheck.Review;
using CrossCheck.Tests.Import.Pdf;
using CrossCheck.Tests.Support;
using static CrossCheck.Tests.Import.Documents.CalcSources;

namespace CrossCheck.Tests.Import.Documents;

/// <summary>
/// <c>.xlsx</c> workbooks, made in the test by LibreOffice (which stores the results of its formulas) or by the Open XML
/// SDK: a calc sheet whose tables stand among titles and notes, a sheet per table, each spreadsheet feature the reader
/// must honour, and every demo submission written as a workbook reviewing to the same memo as its CSV.
/// </summary>
public partial class WorkbookTests
{
    /// <summary>
    /// The Kiln Lane calculation (<see cref="CalcSources"/>) on one calc sheet. Rows and columns are numbered as the
    /// sheet numbers them; the comments say what each exercises.
    /// </summary>
    internal static string CalcWorkbook() => new Fods().Sheet("Calc",
    [
        /* 1 */ ["Kiln Lane footpath deck beam (test)"],
        /* 2 */ ["Project:", "Kiln Lane footpath"],
        /* 3 */ ["Force unit:", "kN"],
        /* 4 */ ["Length unit:", "m"],
        /* 5 */ [],
        /* 6 */ ["Table 1 - Supports"],
        /* 7 */ ["Support", "Restraint"],
        /* 8 */ ["A", "pinned"],
        /* 9 */ ["B", "roller"],
        /* 10 */ ["C", "roller"],
        /* 11 */ [],
        /* 12 */ ["Table 2 - Spans"],
        /* 13 */ ["Span", "Length", "I (rel.)"],
        /* 14 */ [null, "m", null],                                         // a units row
        /* 15 */ ["AB", 6.0, 1.0],
        /* 16 */ ["BC", 6.0, 1.0],
        /* 17 */ [],
        /* 18 */ ["Table 3 - Loads (ULS-2)"],                                // the case in the caption
        /* 19 */ ["On", "Kind", "w (kN/m)", "P (kN)", "a (m)", null, "check"],
        /* 20 */ ["AB", "udl", new Fods.Formula("=1.5*12"), null, null, null, "ok"], // a formula: its saved result is read
        /* 21 */ ["BC", "udl", new Fods.Formula("=1.5*12"), null, null, null, "ok"],
        /* 22 */ [new Fods.HiddenRow(["XX", "udl", 99.0])],                  // a hidden row (a superseded load): not read
        /* 23 */ [],                                                         // a spacer row inside the table
        /* 24 */ ["AB", "point", null, 40.0, 3.0, null, "ok"],
        /* 25 */ [],
        /* 26 */ ["Note: loads are factored, 1.5 x characteristic."],
        /* 27 */ [],
        /* 28 */ ["Table 4 - End moments (ULS-2)"],
        /* 29 */ ["Member", "At", new Fods.Merged("End moment", 2)],          // a header merged over two columns, no unit
        /* 30 */ ["AB", "A", new Fods.WithUnit(0, "kNm")],                    // the unit shown by the number format
        /* 31 */ ["AB", "B", new Fods.WithUnit(103.46, "kNm")],               // stored 103.46, displayed 103.5 kNm
        /* 32 */ ["BC", "B", new Fods.WithUnit(-103.46, "kNm")],
        /* 33 */ ["BC", "C", new Fods.WithUnit(0, "kNm")],
    ], widthMm: 24, hiddenColumns: new HashSet<int> { 7 }).ToString();

    [FactNeeding("soffice")]
    public void CalcSheet_TablesAmongTitlesAndNotes_ReviewLikeTheCsv_AndCiteSheetAndCell()
    {
        string xlsx = Producers.Spreadsheet(CalcWorkbook(), "kiln-lane", "xlsx");
        var r = SubmissionReader.Read(xlsx);
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        // Hidden cells are named, not read.
        r.Warnings.ShouldContain(w => w.Message.Contains("row 22", StringComparison.Ordinal) && w.Message.Contains("column G", StringComparison.Ordinal));
        var s = r.Submission!;
        s.Cases.Single().Id.ShouldBe("ULS-2");
        s.Cases.Single().Loads.Count.ShouldBe(3, "the hidden row is not a load");
        // Numbers as stored (103.46), not as displayed (103.5 kNm); the unit from the number format.
        var claim = s.Claims.EndMoments.Single(c => c.Member == "AB" && c.At == "B");
        claim.Moment.ShouldBe(103.46e3, 1e-6);
        claim.Source.Citation.ShouldBe("kiln-lane.xlsx Calc!C31");
        s.Cases.Single().Loads.First().Source.Citation.ShouldBe("kiln-lane.xlsx Calc row 20");
        FailureClassTests.ReviewsLikeItsCsv(xlsx, Csv("103.46"), Verdict.Concur);
        // ... all the way to the memo.
        var review = PdfFixtureReviewTests.ReviewOf(xlsx);
        MemoRenderer.Render(MemoExtensions.Build(review, MemoFormat.Markdown), MemoFormat.Markdown).ShouldContain("kiln-lane.xlsx Calc!C31");
    }

    /// <summary>The Kiln Lane calculation a sheet per table, the loads headed in words the format does not know.</summary>
    internal static string SheetPerTable() => new Fods()
            .Sheet("Notes", [["Kiln Lane footpath deck beam (test): one table per sheet."], ["Force unit:", "kN"], ["Length unit:", "m"]])
            .Sheet("Supports", [["Support", "Restraint"], ["A", "pinned"], ["B", "roller"], ["C", "roller"]])
            .Sheet("Spans", [["Span", "Length (m)", "I (rel.)"], ["AB", 6.0, 1.0], ["BC", 6.0, 1.0]])
            .Sheet("Loads", [["Case", "Ref", "Load type", "q (kN/m)", "Conc. load (kN)", "Dist. from left (m)"],
                ["ULS-2", "AB", "udl", 18.0, null, null], ["ULS-2", "BC", "udl", 18.0, null, null], ["ULS-2", "AB", "point", null, 40.0, 3.0]])
            .Sheet("End moments", [["Case", "Member", "At", "Moment (kNm)"],
                ["ULS-2", "AB", "A", 0.0], ["ULS-2", "AB", "B", 103.5], ["ULS-2", "BC", "B", -103.5], ["ULS-2", "BC", "C", 0.0]])
            .ToString();

    [FactNeeding("soffice")]
    public void SheetPerTable_WithHeaderWordsTheFormatDoesNotKnow_IsReadByItsSheetNamesAndContents()
    {
        string xlsx = Producers.Spreadsheet(SheetPerTable(), "sheet-per-table", "xlsx");
        var r = SubmissionReader.Read(xlsx);
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        var byContents = r.Warnings.Where(w => w.Message.Contains("from its contents", StringComparison.Ordinal)).Select(w => w.Where.Column).ToList();
        byContents.ShouldBe(["Ref", "Conc. load (kN)", "Dist. from left (m)"], ignoreOrder: true);
        r.Warnings.Where(w => w.Where.Column == "Ref").ShouldAllBe(w => w.Where.Sheet == "Loads" && w.Where.SheetColumn == "B" && w.Where.Row == 1);
        FailureClassTests.ReviewsLikeItsCsv(xlsx, Csv(), Verdict.Concur);
    }

    [Fact]
    public void FormulaWithoutASavedResult_IsAnInputErrorAtItsCell()
    {
        using var t = new TempSubmission();
        var tables = SubmissionPdf.ReadCsv(t.Write("twin.csv", Csv()));
        var sheets = tables.Select(x => (x.Name, Rows: (IReadOnlyList<object?[]>)[[.. x.Header.Cells], .. x.Rows.Select(r => r.Cells.Cast<object?>().ToArray())])).ToList();
        var moments = sheets.FindIndex(s => s.Name == "end-moments");
        var rows = sheets[moments].Rows.ToList();
        rows[2] = ["ULS-2", "AB", "B", new XlsxWriter.FormulaCell("81+22.5", null)];
        sheets[moments] = ("End moments", rows);
        string path = t.WriteBytes("no-results.xlsx", XlsxWriter.Write([.. sheets.Select(s => (s.Name == "end-moments" ? "End moments" : s.Name, s.Rows))]));
        var r = SubmissionReader.Read(path);
        r.Succeeded.ShouldBeFalse();
        var error = r.Errors.ShouldHaveSingleItem();
        error.Where.Compact.ShouldBe("no-results.xlsx:'End moments'!D3");
        error.Message.ShouldContain("=81+22.5 has no saved result");
    }

    [Fact]
    public void FileThatIsNoWorkbook_IsRefusedWithASentence_AndTheCliExitsWith2()
    {
        using var t = new TempSubmission();
        SubmissionReader.Read(t.Write("text.xlsx", "case,on\n1,AB\n")).Errors.ShouldHaveSingleItem().Message.ShouldContain("is not an .xlsx workbook");
        SubmissionReader.Read(t.WriteBytes("empty.xlsx", [])).Errors.ShouldHaveSingleItem().Message.ShouldContain("empty");
        var (code, _, err) = CliRunner.Run("review", Path.Combine(t.Folder, "text.xlsx"), "--out", Path.Combine(t.Folder, "memo.md"));
        code.ShouldBe(2);
        err.ShouldNotContain("   at ");
        File.Exists(Path.Combine(t.Folder, "memo.md")).ShouldBeFalse();
    }

    [Fact]
    public void TabSeparatedCopy_IsReadLikeCsv_AndAFileWithTwoDelimitersSaysSoOnce()
    {
        using var t = new TempSubmission();
        string tsv = Csv().Replace(',', '\t');
        var r = SubmissionReader.Read(t.Write("pasted.tsv", tsv));
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        PdfFixtureReviewTests.Findings(PdfFixtureReviewTests.ReviewOf(t.Write("pasted.txt", tsv)))
            .ShouldBe(PdfFixtureReviewTests.Findings(PdfFixtureReviewTests.ReviewOf(t.Write("twin.csv", Csv()))));
        // A copy from a spreadsheet set to decimal commas.
        var comma = SubmissionReader.Read(t.Write("comma.tsv", tsv.Replace("103.5", "103,5")));
        comma.Succeeded.ShouldBeTrue(PdfTestData.Problems(comma));
        comma.Submission!.Claims.EndMoments.Single(c => c.Member == "AB" && c.At == "B").Moment.ShouldBe(103.5e3, 1e-6);
        // Half the lines tabbed, half comma-separated: one message, not one per column.
        string mixed = string.Join('\n', Csv().Split('\n').Select((l, i) => i < 14 ? l.Replace(',', '\t') : l));
        var bad = SubmissionReader.Read(t.Write("mixed.txt", mixed));
        bad.Errors.ShouldHaveSingleItem().Message.ShouldContain("the delimiter of this file cannot be decided");
    }

    public static IEnumerable<object[]> Demos() => [["footbridge.csv"], ["shed-frame"], ["school-hall.csv"]];

    [Theory]
    [MemberData(nameof(Demos))]
    public void DemoSubmission_WrittenAsAWorkbook_ReviewsToTheSameMemoAsItsCsv(string demo)
    {
        using var t = new TempSubmission();
        string xlsx = t.WriteBytes(Path.GetFileNameWithoutExtension(demo) + ".xlsx", XlsxWriter.Tables(SubmissionPdf.ReadCsv(CliRunner.Demo(demo))));
        string fromWorkbook = Memo(xlsx, demo), fromCsv = Memo(CliRunner.Demo(demo), demo);
        // Kept for a person to diff when they differ.
        File.WriteAllText(Path.Combine(Path.GetTempPath(), $"crosscheck-workbook-{demo}.md"), fromWorkbook);
        File.WriteAllText(Path.Combine(Path.GetTempPath(), $"crosscheck-csv-{demo}.md"), fromCsv);
        fromWorkbook.ShouldBe(fromCsv);
    }

    /// <summary>The Markdown memo, with the places numbers were read (CSV lines, sheet cells) masked: those differ by design.</summary>
    private static string Memo(string path, string demo)
    {
        var imported = SubmissionReader.Read(path);
        imported.Succeeded.ShouldBeTrue(PdfTestData.Problems(imported));
        var s = imported.Submission! with { Source = $"fixtures/demo/{demo}" };
        var review = ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases), new ReviewOptions(Reviewer: "R. Reviewer (demo)", Date: new DateOnly(2026, 12, 1)));
        string memo = MemoRenderer.Render(MemoExtensions.Build(review, MemoFormat.Markdown), MemoFormat.Markdown);
        memo = Citation().Replace(QuotedSheet().Replace(memo, "Sheet!"), "<source>");
        return Joined().Replace(memo, "<source>");
    }

    [GeneratedRegex(@"'[\w ]+'!")]
    private static partial Regex QuotedSheet();

    [GeneratedRegex(@"[\w.-]+\.(?:csv|xlsx)(?: line \d+| \w+![A-Z]*\d+| \w+ row \d+|:[^\s|;)]+)?")]
    private static partial Regex Citation();

    [GeneratedRegex(@"<source>(?:; <source>)+")]
    private static partial Regex Joined();
}
