using System.Text;
using CrossCheck.Cli;
using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import.Pdf;

/// <summary>
/// Input the PDF reader must refuse, each with a clear message naming the file, and the page and line where there is
/// one: empty, not a PDF, damaged, encrypted, scanned, over a limit, no table of the format, unresolvable headers.
/// </summary>
public class PdfErrorTests
{
    private static string Fixture(string name) => Path.Combine(RepoPaths.Root, "fixtures", "pdf", "errors", name);

    private static InputProblem SingleError(ImportResult r)
    {
        r.Succeeded.ShouldBeFalse();
        var errors = r.Errors.ToList();
        errors.Count.ShouldBe(1, PdfTestData.Problems(r));
        return errors[0];
    }

    private static (int Page, int Line) Where(string pdf, string text)
    {
        var doc = PdfTextReader.Read(pdf, Path.GetFileName(pdf), PdfLimits.Default, [])!;
        var line = doc.Lines.First(l => l.Text.Contains(text, StringComparison.Ordinal));
        return (line.Page, line.Number);
    }

    /// <summary>Some problem starts with <paramref name="message"/> and cites the page and line of the PDF that hold <paramref name="text"/>.</summary>
    private static void ShouldSayAt(IEnumerable<InputProblem> problems, string pdf, string text, string message)
    {
        var (page, line) = Where(pdf, text);
        problems.ShouldContain(p => p.Message.StartsWith(message, StringComparison.Ordinal) && p.Where.Page == page && p.Where.Row == line);
    }

    /// <summary>A small valid submission as a PDF (a propped cantilever, kN and m).</summary>
    private static byte[] Sample(Action<PdfFixtureWriter>? extra = null, int pages = 1)
    {
        var w = PdfTestData.SampleBeam("Error fixture");
        extra?.Invoke(w);
        for (int p = 1; p < pages; p++) w.NewPage().Text($"Appendix page {p}");
        return w.Build();
    }

    [Fact]
    public void Sample_IsReadWithoutProblems()
    {
        using var t = new TempSubmission();
        var r = SubmissionReader.Read(t.WriteBytes("calc.pdf", Sample()));
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        r.Problems.ShouldBeEmpty();
    }

    [Fact]
    public void EmptyFile_SaysItIsEmpty()
    {
        using var t = new TempSubmission();
        var e = SingleError(SubmissionReader.Read(t.WriteBytes("calc.pdf", [])));
        e.Message.ShouldBe("the file is empty (0 bytes), not a PDF");
        e.Where.File.ShouldBe("calc.pdf");
    }

    [Fact]
    public void TextFileNamedPdf_SaysItIsNotAPdf()
    {
        using var t = new TempSubmission();
        var e = SingleError(SubmissionReader.Read(t.Write("calc.pdf", "member,start,end\nAB,A,B\n")));
        e.Message.ShouldStartWith("the file is not a PDF (it does not begin with '%PDF-')");
    }

    [Theory]
    [InlineData("garbage")]
    [InlineData("truncated")]
    public void DamagedPdf_SaysItIsDamaged(string how)
    {
        using var t = new TempSubmission();
        byte[] good = Sample();
        byte[] bad = how == "garbage"
            ? Encoding.ASCII.GetBytes("%PDF-1.7\n").Concat(Enumerable.Range(0, 4000).Select(i => (byte)((i * 7919) % 251))).ToArray()
            : good[..(good.Length / 3)];
        var r = SubmissionReader.Read(t.WriteBytes("calc.pdf", bad));
        var e = SingleError(r);
        e.Message.ShouldContain("damaged", Case.Insensitive);
        e.Where.Compact.ShouldBe("calc.pdf");
    }

    [Fact]
    public void EncryptedPdf_SaysItIsEncrypted()
    {
        // fixtures/pdf/errors/encrypted.pdf: the footbridge demo encrypted by qpdf with a user password (make-pdfs.sh).
        var e = SingleError(SubmissionReader.Read(Fixture("encrypted.pdf")));
        e.Message.ShouldBe("the PDF is encrypted with a password; CrossCheck cannot read it. Export an unprotected copy, or give the tables as CSV");
    }

    [Fact]
    public void ScannedPdf_SaysItHasNoTextAndSuggestsExportingTheTables()
    {
        // fixtures/pdf/errors/scanned.pdf: a page of the footbridge demo rasterised by pdftoppm and printed by chromium.
        var e = SingleError(SubmissionReader.Read(Fixture("scanned.pdf")));
        e.Message.ShouldStartWith("the PDF has no extractable text: its page is an image (a scan?)");
        e.Message.ShouldContain("export the calculation's tables as a text PDF or as CSV");
    }

    [Fact]
    public void OcrLayerOnly_IsNotRead()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter();
        w.InvisibleText("Member Start End I").InvisibleText("AB A B 250e6");
        var e = SingleError(SubmissionReader.Read(t.WriteBytes("calc.pdf", w.Build())));
        e.Message.ShouldStartWith("the PDF's only text is invisible: an OCR layer over scanned images");
    }

    [Fact]
    public void BlankPdf_SaysThereIsNoText()
    {
        using var t = new TempSubmission();
        // The fixture writer numbers its pages; a blank page has nothing at all.
        var builder = new UglyToad.PdfPig.Writer.PdfDocumentBuilder();
        builder.AddPage(UglyToad.PdfPig.Content.PageSize.A4);
        var e = SingleError(SubmissionReader.Read(t.WriteBytes("calc.pdf", builder.Build())));
        e.Message.ShouldStartWith("the PDF has no text on any page");
    }

    [Fact]
    public void TooManyPages_IsRefusedWithTheLimitAndHowToRaiseIt()
    {
        using var t = new TempSubmission();
        string path = t.WriteBytes("calc.pdf", Sample(pages: 3));
        var e = SingleError(SubmissionReader.Read(path, PdfLimits.Default with { MaxPages = 2 }));
        e.Message.ShouldBe("the PDF has 3 pages; CrossCheck reads at most 2 (raise the limit with --max-pages, or extract the calculation's pages)");
        SubmissionReader.Read(path, PdfLimits.Default with { MaxPages = 3 }).Succeeded.ShouldBeTrue();
    }

    [Fact]
    public void TimeBudget_StopsReadingWithAClearMessage()
    {
        using var t = new TempSubmission();
        string path = t.WriteBytes("calc.pdf", Sample(pages: 2));
        var e = SingleError(SubmissionReader.Read(path, PdfLimits.Default with { TimeBudget = TimeSpan.Zero }));
        e.Message.ShouldBe("reading the PDF took longer than the time budget of 0 s (stopped at page 1 of 2); raise it with --time-limit, or extract the calculation's pages");
    }

    [Fact]
    public void PageWithTooManyLetters_IsRefusedWithItsPage()
    {
        using var t = new TempSubmission();
        var e = SingleError(SubmissionReader.Read(t.WriteBytes("calc.pdf", Sample(pages: 2)), PdfLimits.Default with { MaxLettersPerPage = 100 }));
        e.Where.Page.ShouldBe(1);
        e.Message.ShouldContain("more than the 100 a page of tables can have");
    }

    [Fact]
    public void NoTableOfTheFormat_ListsTheHeaderRowsItSaw()
    {
        // fixtures/pdf/errors/no-tables.pdf (chromium): a bill of quantities, no submission table.
        var e = SingleError(SubmissionReader.Read(Fixture("no-tables.pdf")));
        e.Message.ShouldBe("no table of the submission format was recognised. Header rows seen: p.1 line 4: \"Item | Description | Qty | Rate\". " +
                           "Name the columns as in the submission format (or a listed synonym), or give the tables as CSV");
    }

    private static byte[] WideDocument(string[] joints, (string Id, string Start, string End)[] members, string[] wideHeader, string[] values)
    {
        var w = new PdfFixtureWriter(Face.DejaVuSans);
        w.Text("Units: kN, m");
        w.Table(new FixtureTable(["Joint", "x", "y", "Restraint"], joints.Select((j, i) => (IReadOnlyList<string>)[j, $"{3 * i}", "0", i == 0 ? "fixed" : "roller"]).ToList()));
        w.Table(new FixtureTable(["Member", "Start", "End", "I [mm⁴]", "E [GPa]"], members.Select(m => (IReadOnlyList<string>)[m.Id, m.Start, m.End, "100e6", "200"]).ToList()));
        w.Table(new FixtureTable(["Case", "On", "Kind", "w"], [[ "1", members[0].Id, "udl", "10"]]));
        w.Text("Final end moments [kN·m]");
        w.Table(new FixtureTable(["Case", .. wideHeader], [["1", .. values]]));
        return w.Build();
    }

    [Fact]
    public void WideHeaderNamingNoMember_IsAnInputErrorAtItsPageLineAndColumn()
    {
        using var t = new TempSubmission();
        string path = t.WriteBytes("calc.pdf", WideDocument(["A", "B", "C"], [("AB", "A", "B"), ("BC", "B", "C")], ["M_{AB}", "M_{BA}", "M_{AC}"], ["-7.5", "7.5", "0"]));
        var r = SubmissionReader.Read(path);
        r.Succeeded.ShouldBeFalse();
        var e = r.Errors.Single(p => p.Message.Contains("M_AC", StringComparison.Ordinal));
        e.Message.ShouldBe("end-moment column 'M_AC': 'AC' does not name the two joints of a member in the members table (M_AB is the moment at end A of the member from A to B)");
        var (page, line) = Where(path, "M_AB");
        (e.Where.Page, e.Where.Row, e.Where.Column).ShouldBe((page, line, "M_AC"));
        e.Where.Citation.ShouldBe($"calc.pdf p.{page} line {line}");
    }

    [Fact]
    public void WideHeaderWithTwoReadings_IsAnInputError()
    {
        // Joints A, AB, BC, C: "ABC" is end A of the member A–BC, or end AB of the member AB–C.
        using var t = new TempSubmission();
        string path = t.WriteBytes("calc.pdf", WideDocument(["A", "AB", "BC", "C"], [("M1", "A", "BC"), ("M2", "AB", "C"), ("M3", "BC", "C")],
            ["M_{ABC}", "M_{BCA}"], ["-7.5", "7.5"]));
        var r = SubmissionReader.Read(path);
        r.Errors.ShouldContain(e => e.Message == "end-moment column 'M_ABC' can be read more than one way (member M1 at A or member M2 at AB); write the subscript with a separator, e.g. M_A-B"
                                    && e.Where.Column == "M_ABC" && e.Where.Page == 1);
    }

    [Fact]
    public void WideTableWithoutMembers_SaysWhatItNeeds()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(Face.DejaVuSans);
        w.Text("Units: kN, m");
        w.Table(new FixtureTable(["Case", "M_{AB}", "M_{BA}"], [["1", "-7.5", "7.5"]]));
        var r = SubmissionReader.Read(t.WriteBytes("calc.pdf", w.Build()));
        r.Errors.ShouldContain(p => p.Message == "end-moment column 'M_AB' cannot be resolved: the document has no members (or spans) table naming the members' joints"
                                    && p.Where.Page == 1 && p.Where.Column == "M_AB");
    }

    [Fact]
    public void BadNumber_CitesPageLineColumnAndTheTextAsPrinted()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter();
        w.Text("Units: kN, m").NewPage();
        w.Table(new FixtureTable(["Joint", "x", "y", "Restraint"], [["A", "0", "0", "fixed"], ["B", "6.0.1", "0", "roller"]]));
        string path = t.WriteBytes("calc.pdf", w.Build());
        var e = SubmissionReader.Read(path).Errors.First(p => p.Where.Table == "joints");
        var (page, line) = Where(path, "6.0.1");
        e.Message.ShouldBe("'x' must be a number, got \"6.0.1\"");
        e.Where.Compact.ShouldBe($"calc.pdf:p{page}:{line}:x");
        e.Where.Text.ShouldBe("6.0.1");
        page.ShouldBe(2);
    }

    [Fact]
    public void ParenthesesWithoutANote_AreNotGuessed()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter();
        w.Text("Units: kN, m");
        w.Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "(81.0)"], ["1", "AB", "B", "0"]]));
        string path = t.WriteBytes("calc.pdf", w.Build());
        var r = SubmissionReader.Read(path);
        ShouldSayAt(r.Warnings, path, "(81.0)", "'moment' = \"(81.0)\" is in parentheses, and the document does not say");
        int line = Where(path, "(81.0)").Line;
        r.Errors.ShouldContain(p => p.Message == "'moment' must be a number, got \"(81.0)\"" && p.Where.Row == line);
    }

    [Fact]
    public void TwoTablesOfOneKindWithDifferentColumns_AreNotJoinedSilently()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter();
        w.Text("Units: kN, m");
        w.Table(new FixtureTable(["Joint", "x", "y"], [["A", "0", "0"], ["B", "6", "0"]]));
        w.Paragraph("Supports are listed separately below.");
        w.Table(new FixtureTable(["Joint", "x", "y", "Restraint"], [["C", "0", "0", "fixed"], ["D", "6", "0", "roller"]]));
        string path = t.WriteBytes("calc.pdf", w.Build());
        ShouldSayAt(SubmissionReader.Read(path).Errors, path, "Restraint", "a second 'joints' table with different columns (the first is at p.1 line");
    }

    [Fact]
    public void TablesSideBySide_AreNamedAsSuch()
    {
        // A layout known not to be read: two tables printed next to each other in one band of lines.
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter().Text("Units: kN, m")
            .Table(new FixtureTable(["Joint", "x", "y", "Restraint", "Member", "Start", "End", "E [GPa]", "I [mm4]"],
                [["A", "0", "0", "fixed", "AB", "A", "B", "200", "250e6"], ["B", "6", "0", "roller", "", "", "", "", ""]]) { GapEm = 2.5 });
        string path = PdfTestData.Save(t, "side-by-side.pdf", w.Build());
        ShouldSayAt(SubmissionReader.Read(path).Errors, path, "Restraint", "two tables stand side by side in this line ('joints' and 'members')");
    }

    [Theory]
    [InlineData("review")]
    [InlineData("solve")]
    [InlineData("extract")]
    public void Cli_RefusedPdf_ExitsWithTwo_AndPrintsNoStackTrace(string command)
    {
        using var t = new TempSubmission();
        string path = t.WriteBytes("calc.pdf", Encoding.ASCII.GetBytes("%PDF-1.4\n1 0 obj <<< broken"));
        string[] args = command == "extract" ? [command, path, "--out", Path.Combine(t.Folder, "out")] : [command, path];
        var r = CliRunner.Run(args);
        r.ExitCode.ShouldBe(ExitCodes.InputError);
        r.Err.ShouldContain("calc.pdf");
        r.Err.ShouldContain("damaged", Case.Insensitive);
        r.Err.ShouldNotContain("   at ");
        Directory.Exists(Path.Combine(t.Folder, "out")).ShouldBeFalse();
    }
}
