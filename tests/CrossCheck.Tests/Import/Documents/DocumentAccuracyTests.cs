using CrossCheck.Import.Pdf;
using CrossCheck.Import.Workbook;
using CrossCheck.Review;
using CrossCheck.Tests.Import.Pdf;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;
using static CrossCheck.Tests.Import.Documents.CalcSources;

namespace CrossCheck.Tests.Import.Documents;

/// <summary>
/// Cells read right over the workbook fixtures and the documents other programs make in the tests (against the tables
/// they print), and how many header spellings were settled by their cells rather than by the synonym list. Run with
/// <c>--logger "console;verbosity=detailed"</c> to see the figures; every cell must be read right.
/// </summary>
public class DocumentAccuracyTests(ITestOutputHelper output)
{
    [FactNeeding("chromium", "soffice")]
    public void DemoWorkbook_ReviewsToRevise_NamesTheCause_AndCitesTheCell()
    {
        string xlsx = Path.Combine(RepoPaths.Root, "fixtures", "demo", "cycle-hub.xlsx");
        var review = PdfFixtureReviewTests.ReviewOf(xlsx);
        // Two spans 5 m and 7 m, pinned ends, w = 1.35 x 4.0 + 1.5 x 2.5 = 9.15 kN/m: M_B = w(L1³ + L2³) / (8(L1 + L2)) = 44.61 kN·m
        // (three-moment equation, Timoshenko & Young, Theory of Structures, from memory). The demo claims 42.32, the value
        // distribution factors of 0.5 / 0.5 give (stiffness I instead of I/L): revise, and that cause named.
        review.Verdict.ShouldBe(Verdict.Revise);
        var b = review.AllEndMoments.Single(e => e.Member == "AB" && e.At == "B");
        (b.Recomputed!.Value / 1e3).ShouldBe(9.15 * (125 + 343) / (8 * 12.0), 1e-6);
        b.Source!.Citation.ShouldBe("cycle-hub.xlsx Calc!C37");
        review.Comments.ShouldContain(c => c.Id.StartsWith("KL-", StringComparison.Ordinal));
    }

    [FactNeeding("chromium", "soffice")]
    public void CellsReadRight_OverTheWorkbookFixtures_AndTheDocumentsOtherProgramsMake()
    {
        using var t = new TempSubmission();
        var cases = new List<(string Name, string Reference, PdfExtraction Reading)>
        {
            ("demo/cycle-hub.xlsx", Path.Combine(RepoPaths.Root, "fixtures", "demo", "cycle-hub.expected.csv"), Workbook(Path.Combine(RepoPaths.Root, "fixtures", "demo", "cycle-hub.xlsx"))),
            ("LibreOffice calc sheet (xlsx)", t.Write("kiln-lane.csv", Csv("103.46", title: "Kiln Lane footpath")), Workbook(Producers.Spreadsheet(WorkbookTests.CalcWorkbook(), "kiln-lane", "xlsx"))),
            ("LibreOffice sheet per table (xlsx)", t.Write("sheet-per-table.csv", Csv(title: null)), Workbook(Producers.Spreadsheet(WorkbookTests.SheetPerTable(), "sheet-per-table", "xlsx"))),
            ("LibreOffice calc sheet printed (pdf)", t.Write("calc-sheet.csv", Csv("130.5", title: null)), PdfSubmissionReader.Extract(Producers.Spreadsheet(FailureClassTests.CalcSheet("130.5"), "calc-sheet", "pdf"))),
            ("chromium, loads headed 'Load' (pdf)", t.Write("load-kinds.csv", Csv(title: null)), PdfSubmissionReader.Extract(FailureClassTests.LoadKindsPdf())),
        };
        foreach (var demo in new[] { "footbridge.csv", "shed-frame", "school-hall.csv" })
        {
            string xlsx = t.WriteBytes(Path.GetFileNameWithoutExtension(demo) + ".xlsx", XlsxWriter.Tables(SubmissionPdf.ReadCsv(CliRunner.Demo(demo))));
            cases.Add(($"demo {demo} as a workbook", CliRunner.Demo(demo), Workbook(xlsx)));
        }
        int right = 0, present = 0;
        var failures = new List<string>();
        var byContents = new HashSet<string>(StringComparer.Ordinal);
        foreach (var (name, reference, reading) in cases)
        {
            var score = CellAccuracy.Compare(SubmissionPdf.ReadCsv(reference), reading.Tables);
            output.WriteLine($"{name}: {score}");
            right += score.Right;
            present += score.Present;
            if (score.Misses.Count > 0) failures.Add($"{name}: {string.Join("; ", score.Misses.Take(5))}");
            byContents.UnionWith(ContentSettled(reading));
        }
        output.WriteLine($"all: {right}/{present} cells read right");
        output.WriteLine($"header spellings settled by their cells here: {byContents.Count} ({string.Join(", ", byContents)})");
        failures.ShouldBeEmpty();
        right.ShouldBe(present);
    }

    /// <summary>The printed headers whose column was decided from the cells (as <c>crosscheck extract</c> reports it).</summary>
    internal static IEnumerable<string> ContentSettled(PdfExtraction x) =>
        x.Found.SelectMany(f => f.Columns).Where(c => c.Contains("by its contents", StringComparison.Ordinal) || c.Contains(", but ", StringComparison.Ordinal) && c.Contains(": read as", StringComparison.Ordinal))
            .Select(c => c[..c.IndexOf(" → ", StringComparison.Ordinal)]);

    private static PdfExtraction Workbook(string path) => WorkbookSubmissionReader.Extract(File.ReadAllBytes(path), path);
}
