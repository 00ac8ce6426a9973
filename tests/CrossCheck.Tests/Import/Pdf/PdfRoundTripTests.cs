using CrossCheck.Import;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import.Pdf;

/// <summary>
/// CSV submission → PDF (written with PdfPig's builder in many layouts) → PDF import → the same model and claims
/// as the CSV import. The CSV importer is the reference: whatever the layout, reading the PDF must not change a
/// single number, id, unit or sign.
/// </summary>
public class PdfRoundTripTests
{
    public static readonly Layout[] Layouts =
    [
        new("helvetica-brackets"),
        new("dejavu-synonyms-unitsrow-shuffled") { Face = Face.DejaVuSans, Synonyms = true, Units = UnitPlacement.UnitsRow, ShuffleVariant = 7, Numbers = NumberLook.UnicodeMinus, HeaderAlign = Align.Centre },
        new("times-parentheses-labels-break") { Face = Face.Times, Size = 10, Units = UnitPlacement.Parentheses, CaseLabels = true, BreakInTable = true, Prose = true },
        new("courier-wide-thousands-unitsline") { Face = Face.Courier, Size = 8, WideMoments = true, Numbers = NumberLook.Thousands, Units = UnitPlacement.UnitsLine, BreakInTable = true, RepeatHeader = false },
        new("stretched-landscape-negatives-in-brackets") { ColumnWidthEm = 9, HeaderAlign = Align.Centre, Numbers = NumberLook.Parentheses, Landscape = true, Synonyms = true },
        new("dejavu-tight") { Face = Face.DejaVuSans, GapEm = 0.45, RightAlign = false },
        new("running-header-break-without-header") { RunningHeader = "TEST-RT calculation sheet - fixture", BreakInTable = true, RepeatHeader = false, Prose = true, ShuffleVariant = 3 },
        new("dejavu-wide-labels-left-aligned") { Face = Face.DejaVuSans, WideMoments = true, RightAlign = false, Numbers = NumberLook.UnicodeMinus, Units = UnitPlacement.UnitsRow },
    ];

    public static readonly string[] Submissions = ["footbridge.csv", "shed-frame", "every-column", "random-1", "random-2"];

    public static IEnumerable<object[]> Cases()
    {
        foreach (var layout in Layouts)
            foreach (var submission in Submissions)
                yield return [submission, layout.Name];
    }

    public static string Source(string name, TempSubmission t) => name switch
    {
        "every-column" => t.Write("every-column.csv", PdfTestData.EveryColumn),
        "random-1" => t.Write("random-1.csv", PdfTestData.RandomFrame(variant: 11, bays: 2, storeys: 2)),
        "random-2" => t.Write("random-2.csv", PdfTestData.RandomFrame(variant: 12, bays: 3, storeys: 1)),
        _ => CliRunner.Demo(name),
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void CsvToPdfToImport_GivesTheSameModelAndClaims(string submission, string layoutName)
    {
        var layout = Layouts.Single(l => l.Name == layoutName);
        using var t = new TempSubmission();
        string csv = Source(submission, t);
        var fromCsv = SubmissionReader.Read(csv);
        fromCsv.Succeeded.ShouldBeTrue(PdfTestData.Problems(fromCsv));

        string pdf = PdfTestData.Save(t, $"{submission}-{layout.Name}.pdf", SubmissionPdf.Render(SubmissionPdf.ReadCsv(csv), layout));
        var fromPdf = SubmissionReader.Read(pdf);

        fromPdf.Succeeded.ShouldBeTrue(PdfTestData.Problems(fromPdf));
        fromPdf.Errors.ShouldBeEmpty();
        PdfTestData.Canon(fromPdf.Submission!).ShouldBe(PdfTestData.Canon(fromCsv.Submission!));
        // Every claim points at the page and line it was printed on.
        fromPdf.Submission!.Claims.EndMoments.ShouldAllBe(c => c.Source.Page != null && c.Source.Row != null && c.Source.File == Path.GetFileName(pdf));

        // Reviewed end to end, the PDF gives the CSV's verdict and findings.
        var pdfReview = PdfFixtureReviewTests.ReviewOf(pdf);
        PdfFixtureReviewTests.Findings(pdfReview).Order(StringComparer.Ordinal)
            .ShouldBe(PdfFixtureReviewTests.Findings(PdfFixtureReviewTests.ReviewOf(csv)).Order(StringComparer.Ordinal));
        pdfReview.Verdict.ShouldBe(submission switch
        {
            // The random frames claim the solver's own moments (to seven digits): nothing to find.
            "random-1" or "random-2" => Verdict.Concur,
            // The demos carry planted mistakes (fixtures/demo/README.md); the reading fixture's claims are invented.
            _ => Verdict.Revise,
        });
    }
}
