using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Review;
using CrossCheck.Tests.Import.Pdf;
using CrossCheck.Tests.Support;
using static CrossCheck.Tests.Import.Documents.CalcSources;

namespace CrossCheck.Tests.Import.Documents;

/// <summary>
/// One test per class of misreading seen on calc packages made by other programs (issue 16), each on a document made in
/// the test by another program (chromium, groff, enscript, LibreOffice; <see cref="Producers"/>): the document must review
/// exactly as the same calculation given as CSV. The calculation is <see cref="CalcSources"/> (support moment from Hicks
/// Table 2.1 and AISC Table 3-23).
/// </summary>
public class FailureClassTests
{
    internal static ReviewResult ReviewsLikeItsCsv(string document, string csv, Verdict verdict)
    {
        using var t = new TempSubmission();
        var fromDoc = PdfFixtureReviewTests.ReviewOf(document);
        var fromCsv = PdfFixtureReviewTests.ReviewOf(t.Write("twin.csv", csv));
        fromDoc.Verdict.ShouldBe(verdict);
        PdfFixtureReviewTests.Findings(fromDoc).ShouldBe(PdfFixtureReviewTests.Findings(fromCsv));
        return fromDoc;
    }

    private static readonly string LoadsTable = Table("Table 3: Loads", ["Case", "On", "Kind", "w (kN/m)", "P (kN)", "a (m)"],
        ["ULS-2", "AB", "udl", "18.0", "", ""], ["ULS-2", "BC", "udl", "18.0", "", ""], ["ULS-2", "AB", "point", "", "40.0", "3.00"]);

    private static readonly string MomentsTable = Table("Table 4: End moments", ["Case", "Member", "At", "Moment (kN·m)"],
        ["ULS-2", "AB", "A", "0.0"], ["ULS-2", "AB", "B", "103.5"], ["ULS-2", "BC", "B", "-103.5"], ["ULS-2", "BC", "C", "0.0"]);

    [FactNeeding("chromium", "groff", "enscript", "ps2pdf", "soffice")]
    public void RelativeSecondMoment_HeadedIRel_IsReadAsRelativeStiffness()
    {
        string pdf = Producers.Chromium(Html(HtmlGeometry(relative: true) + LoadsTable + MomentsTable), "i-rel");
        var r = SubmissionReader.Read(pdf);
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        r.Submission!.Model.RelativeStiffness.ShouldBeTrue();
        r.Submission.Model.Members.ShouldAllBe(m => m.E == 1 && m.I == 1);
        ReviewsLikeItsCsv(pdf, Csv(), Verdict.Concur);
    }

    internal static string LoadKindsPdf() => Producers.Chromium(Html(HtmlGeometry()
        + Table("Table 3: Loads, load case ULS-2", ["Span", "Load", "w (kN/m)", "P (kN)", "a (m)"],
            ["AB", "udl", "18.0", "", ""], ["BC", "udl", "18.0", "", ""], ["AB", "point", "", "40.0", "3.00"])
        + MomentsTable), "load-kinds");

    [FactNeeding("chromium", "groff", "enscript", "ps2pdf", "soffice")]
    public void ColumnHeadedLoad_HoldingLoadKinds_IsReadAsTheKind_WithAWarning()
    {
        string pdf = LoadKindsPdf();
        var r = SubmissionReader.Read(pdf);
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        var warning = r.Warnings.Single(w => w.Message.Contains("read as 'kind' from its contents", StringComparison.Ordinal));
        warning.Where.Page.ShouldBe(1);
        warning.Where.Row.ShouldNotBeNull();
        warning.Message.ShouldContain("3 of 3 cells are load kinds");
        ReviewsLikeItsCsv(pdf, Csv(), Verdict.Concur);
    }

    [FactNeeding("chromium", "groff", "enscript", "ps2pdf", "soffice")]
    public void ResultsTable_WithTheCaseInItsCaption_ContinuingUnderItsRepeatedHeader_IsOneTable()
    {
        string moments = Table("Table 4: End moments, load case ULS-2", ["Member", "At", "Moment (kN·m)"],
            ["AB", "A", "0.0"], ["AB", "B", "103.5"], ["BC", "B", "-103.5"], ["BC", "C", "0.0"]);
        string loads = Table("Loads (ULS-2)", ["On", "Kind", "w (kN/m)", "P (kN)", "a (m)"],
            ["AB", "udl", "18.0", "", ""], ["BC", "udl", "18.0", "", ""], ["AB", "point", "", "40.0", "3.00"]);
        // The filler pushes the end-moment table to the foot of page 1: chromium repeats its header on page 2.
        string pdf = Producers.Chromium(Html(HtmlGeometry() + loads + "<div style=\"height: 30mm\">Notes: spans as Table 2.</div>" + moments,
            "table:last-of-type td { height: 9mm; }"), "continued");
        var x = PdfSubmissionReader.Extract(pdf);
        x.HasErrors.ShouldBeFalse(string.Join("; ", x.Problems));
        var em = x.Tables.Single(t => t.Name == "end-moments");
        em.Rows.Select(r => r.Page).Distinct().Count().ShouldBe(2, "the table breaks across the page");
        em.Rows.ShouldAllBe(r => r.Cells.Contains("ULS-2"));
        ReviewsLikeItsCsv(pdf, Csv(), Verdict.Concur);
    }

    private const string GroffCalc = """
        .TL
        Kiln Lane footpath deck beam (test)
        .PP
        Force unit: kN
        .br
        Length unit: m
        .PP
        Supports
        .TS
        l l.
        Support	Restraint
        A	pinned
        B	roller
        C	roller
        .TE
        .PP
        Spans
        .TS
        l n n n.
        Span	Length (m)	E (N/mm2)	I (mm4)
        AB	6.00	210000	250000000
        BC	6.00	210000	250000000
        .TE
        .PP
        Loads (ULS-2)
        .TS
        l l n n n.
        On	Kind	w (kN/m)	P (kN)	a (m)
        AB	udl	18.0	\&	\&
        BC	udl	18.0	\&	\&
        AB	point	\&	40.0	3.00
        .TE
        .PP
        ULS-2: end moments
        .TS
        l l n.
        Member	At	Moment (kNm)
        AB	A	0.0
        AB	B	103.5
        BC	B	-103.5
        BC	C	0.0
        .TE
        """;

    [FactNeeding("chromium", "groff", "enscript", "ps2pdf", "soffice")]
    public void CaseInCaptions_InParenthesesAndBeforeAColon_AndUnitsWithoutCaret_FromATypesetter()
    {
        string pdf = Producers.Groff(GroffCalc, "typeset");
        var r = SubmissionReader.Read(pdf);
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        r.Submission!.Cases.Select(c => c.Id).ShouldBe(["ULS-2"]);
        r.Submission.Model.Members.ShouldAllBe(m => Math.Abs(m.E - 210e9) < 1);
        ReviewsLikeItsCsv(pdf, Csv(relative: false), Verdict.Concur);
    }

    private const string PlainTextCalc = """
        KILN LANE FOOTPATH DECK BEAM (TEST) - HAND CALCULATION PRINTOUT
        FORCE UNIT: KN
        LENGTH UNIT: M

        SUPPORTS
        SUPPORT   RESTRAINT
        -------   ---------
        A         PINNED
        B         ROLLER
        C         ROLLER

        SPANS
        SPAN   LENGTH (M)   E (KN/M2)      I (MM4)
        ----   ----------   ----------   ---------
        AB            6.0   2.1E8        250000000
        BC            6.0   2.1E8        250000000

        LOADS
        CASE    ON   KIND     W (KN/M)    P (KN)    A (M)
        -----   --   -----    --------    ------    -----
        ULS-2   AB   UDL          18.0
        ULS-2   BC   UDL          18.0
        ULS-2   AB   POINT                  40.0      3.0

        END MOMENTS
        CASE    MEMBER   AT   MOMENT (KNM)
        -----   ------   --   ------------
        ULS-2   AB       A             0.0
        ULS-2   AB       B           103.5
        ULS-2   BC       B          -103.5
        ULS-2   BC       C             0.0
        """;

    [FactNeeding("chromium", "groff", "enscript", "ps2pdf", "soffice")]
    public void MonospacePrintout_WithRuleLinesAndCapitalHeaders_IsRead()
    {
        string pdf = Producers.Enscript(PlainTextCalc, "printout");
        var x = PdfSubmissionReader.Extract(pdf);
        x.Tables.Select(t => t.Name).ShouldBe(["info", "supports", "spans", "loads", "end-moments"], ignoreOrder: true);
        x.Tables.Single(t => t.Name == "end-moments").Header.Cells.ShouldContain("MOMENT [KNM]");
        x.Tables.Single(t => t.Name == "spans").Rows.Count.ShouldBe(2, "the rule line under the header is not a row");
        ReviewsLikeItsCsv(pdf, Csv(relative: false), Verdict.Concur);
    }

    /// <summary>A calc sheet as a spreadsheet prints it: headers left-aligned, numbers right-aligned, so each number ends just left of the next header.</summary>
    internal static string CalcSheet(string mB) => new Fods().Sheet("Calc",
    [
        ["Kiln Lane footpath deck beam (test)"],
        ["Force unit:", "kN"],
        ["Length unit:", "m"],
        [],
        ["Supports"],
        ["Support", "Restraint"],
        ["A", "pinned"], ["B", "roller"], ["C", "roller"],
        [],
        ["Spans"],
        ["Span", "L (m)", "I (rel.)"],
        ["AB", 6.0, 1.0], ["BC", 6.0, 1.0],
        [],
        ["Loads"],
        ["Case", "On", "Kind", "w (kN/m)", "P (kN)", "a (m)"],
        ["ULS-2", "AB", "udl", 18.0, null, null],
        ["ULS-2", "BC", "udl", 18.0, null, null],
        ["ULS-2", "AB", "point", null, 40.0, 3.0],
        [],
        ["End moments"],
        ["Case", "Member", "At", "Moment (kNm)"],
        ["ULS-2", "AB", "A", 0.0], ["ULS-2", "AB", "B", double.Parse(mB, System.Globalization.CultureInfo.InvariantCulture)],
        ["ULS-2", "BC", "B", -double.Parse(mB, System.Globalization.CultureInfo.InvariantCulture)], ["ULS-2", "BC", "C", 0.0],
    ], widthMm: 26).ToString();

    [FactNeeding("chromium", "groff", "enscript", "ps2pdf", "soffice")]
    public void SpreadsheetPrintout_NumbersEndingUnderTheNextHeader_AreReadInTheirOwnColumns()
    {
        // The author typed 130.5 for the support moment (wL²/8 + 3PL/32 = 103.5): the review must say revise, as for the CSV.
        string pdf = Producers.Spreadsheet(CalcSheet("130.5"), "calc-sheet", "pdf");
        var x = PdfSubmissionReader.Extract(pdf);
        var loads = x.Tables.Single(t => t.Name == "loads");
        int w = loads.Header.Cells.ToList().FindIndex(h => h.StartsWith("w", StringComparison.Ordinal));
        int p = loads.Header.Cells.ToList().FindIndex(h => h.StartsWith("P", StringComparison.Ordinal));
        loads.Rows.Select(r => r.Cell(w)).ShouldBe(["18", "18", ""]);
        loads.Rows.Select(r => r.Cell(p)).ShouldBe(["", "", "40"]);
        ReviewsLikeItsCsv(pdf, Csv("130.5"), Verdict.Revise);
    }
}
