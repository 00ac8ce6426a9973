using CrossCheck.Import;
using CrossCheck.Import.Pdf;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import.Pdf;

/// <summary>
/// What the PDF reader understands, one behaviour at a time, on small documents set by the fixture writer. The
/// structure throughout is a propped cantilever, 6 m, w = 18 kN/m: −wL²/8 = −81 kN·m at the fixed end (Hicks, Civil
/// Engineering Formulas, Fig. 2.2 case 10), so each reading can also be reviewed.
/// </summary>
public class PdfReaderTests
{
    private static readonly FixtureTable Joints = new(["Joint", "x", "y", "Restraint"], [["A", "0", "0", "fixed"], ["B", "6", "0", "roller"]]);
    private static readonly FixtureTable Members = new(["Member", "Start", "End", "E [GPa]", "I [mm⁴]"], [["AB", "A", "B", "200", "250e6"]]);
    private static readonly FixtureTable Loads = new(["Case", "On", "Kind", "w"], [["1", "AB", "udl", "18"]]);

    private static ImportResult Read(PdfFixtureWriter w, TempSubmission t, string name = "calc.pdf")
    {
        var r = SubmissionReader.Read(PdfTestData.Save(t, name, w.Build()));
        return r;
    }

    private static Submission Ok(ImportResult r)
    {
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        return r.Submission!;
    }

    private static double Claim(Submission s, string member, MemberEnd end, string c = "1") =>
        s.Claims.EndMoments.Single(e => e.Member == member && e.End == end && e.Case == c).Moment / 1e3;

    [Fact]
    public void UnitsLine_GivesTheForceAndLengthUnits()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter().Text("Units: kN, m unless noted otherwise").Table(Joints).Table(Members).Table(Loads)
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "-81"], ["1", "AB", "B", "0"]]));
        var s = Ok(Read(w, t));
        s.Info.Units.Force.Symbol.ShouldBe("kN");
        s.Info.Units.Moment.Symbol.ShouldBe("kN·m");
        Claim(s, "AB", MemberEnd.Start).ShouldBe(-81, 1e-9);
    }

    [Fact]
    public void UnitsRowUnderTheHeader_AndGroupHeaderAboveIt()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(Face.DejaVuSans)
            .Table(Joints with { Header = ["Joint", "x", "y", "Restraint"], Units = ["", "m", "m", ""] })
            .Table(Members)
            .Table(Loads with { Header = ["Case", "On", "Kind", "w"], Units = ["", "", "", "kN/m"] })
            // "End moments [kN·m]" set over the moment column only (it starts right of the table's first column).
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "-81"], ["1", "AB", "B", "0"]]) { Caption = "                                   End moments [kN·m]" });
        var s = Ok(Read(w, t));
        s.Model.Joint("B").X.ShouldBe(6);
        s.Cases[0].Loads.OfType<DistributedLoad>().Single().WStart.ShouldBe(18e3, 1e-6);
        Claim(s, "AB", MemberEnd.Start).ShouldBe(-81, 1e-9);
    }

    [Fact]
    public void NumbersAsCalcPackagesPrintThem()
    {
        // Unicode minus, thousands separators, a power of ten with a superscript, negatives in parentheses (with a note).
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(Face.DejaVuSans).Text("Units: kN, m").Text("Negative moments are shown in brackets.")
            .Table(Joints)
            .Table(new FixtureTable(["Member", "Start", "End", "E [kN/m²]", "I [m⁴]"], [["AB", "A", "B", "200,000,000", "2.5×10^{−4}"]]))
            .Table(Loads)
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "(81.0)"], ["1", "AB", "B", "−0.0"]]));
        var s = Ok(Read(w, t));
        s.Model.Member("AB").E.ShouldBe(200e9, 1);
        s.Model.Member("AB").I.ShouldBe(2.5e-4, 1e-12);
        Claim(s, "AB", MemberEnd.Start).ShouldBe(-81, 1e-9);
        s.Claims.EndMoments[0].Source.Text.ShouldBe("(81.0)");
    }

    [Fact]
    public void NumbersWithTheirUnitInTheCell()
    {
        // No units in the headers: the first cell with a unit gives its column one; other units are converted to it.
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(Face.DejaVuSans)
            .Table(new FixtureTable(["Joint", "x", "y", "Restraint"], [["A", "0 m", "0 m", "fixed"], ["B", "6000 mm", "0 m", "roller"]]))
            .Table(new FixtureTable(["Member", "Start", "End", "E", "I"], [["AB", "A", "B", "200 GPa", "250×10^{6} mm⁴"]]))
            .Table(new FixtureTable(["Case", "On", "Kind", "w"], [["1", "AB", "udl", "18 kN/m"]]))
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "−81.0 kN·m"], ["1", "AB", "B", "0 kN·m"]]));
        var s = Ok(Read(w, t));
        s.Model.Joint("B").X.ShouldBe(6, 1e-12);
        s.Model.Member("AB").I.ShouldBe(250e-6, 1e-15);
        s.Model.Member("AB").E.ShouldBe(200e9, 1);
        Claim(s, "AB", MemberEnd.Start).ShouldBe(-81, 1e-9);
        s.Info.Units.Moment.Symbol.ShouldBe("kN·m");
    }

    [Fact]
    public void DecimalCommas_AreRecognisedFromTheNumbersThemselves()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter().Text("Units: kN, m")
            .Table(Joints with { Rows = [["A", "0,0", "0,0", "fixed"], ["B", "6,0", "0,0", "roller"]] })
            .Table(Members with { Rows = [["AB", "A", "B", "200", "250.000.000"]] })
            .Table(Loads with { Rows = [["1", "AB", "udl", "18,0"]] })
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "-81,00"], ["1", "AB", "B", "0,00"]]));
        var s = Ok(Read(w, t));
        s.Model.Member("AB").I.ShouldBe(250e-6, 1e-15);
        Claim(s, "AB", MemberEnd.Start).ShouldBe(-81, 1e-9);
    }

    [Fact]
    public void LoadCaseLabelsBetweenRows_AndACaptionNamingTheCase()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter().Text("Units: kN, m").Table(Joints).Table(Members)
            .Table(new FixtureTable(["On", "Kind", "w", "P", "a"], [["AB", "udl", "18", "", ""], ["AB", "point", "", "40", "3"]])
            { Labels = new Dictionary<int, string> { [0] = "Load case UDL - full uniform load", [1] = "Load case PT: central point load" } })
            .Table(new FixtureTable(["Member", "At", "Moment"], [["AB", "A", "-81"], ["AB", "B", "0"]]) { Caption = "End moments, load case UDL" })
            .Table(new FixtureTable(["Member", "At", "Moment"], [["AB", "A", "-45"], ["AB", "B", "0"]]) { Caption = "End moments, load case PT" });
        var s = Ok(Read(w, t));
        s.Cases.Select(c => c.Id).ShouldBe(["UDL", "PT"]);
        Claim(s, "AB", MemberEnd.Start, "PT").ShouldBe(-45, 1e-9);
        Claim(s, "AB", MemberEnd.Start, "UDL").ShouldBe(-81, 1e-9);
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void TableContinuedOnTheNextPage_WithOrWithoutItsHeader(bool repeatHeader)
    {
        using var t = new TempSubmission();
        var rows = Enumerable.Range(1, 8).SelectMany(i => new IReadOnlyList<string>[] { [$"{i}", "AB", "A", "-81"], [$"{i}", "AB", "B", "0"] }).ToList();
        var loads = Enumerable.Range(1, 8).Select(i => (IReadOnlyList<string>)[$"{i}", "AB", "udl", "18"]).ToList();
        var w = new PdfFixtureWriter(runningHeader: "DEMO calculation - running header repeated on every page").Text("Units: kN, m")
            .Table(Joints).Table(Members).Table(Loads with { Rows = loads })
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], rows) { BreakBeforeRow = 7, RepeatHeader = repeatHeader });
        var s = Ok(Read(w, t));
        s.Claims.EndMoments.Count.ShouldBe(16);
        var eighth = s.Claims.EndMoments[7];
        eighth.Source.Page.ShouldBe(2);
        s.Claims.EndMoments[6].Source.Page.ShouldBe(1);
    }

    [Fact]
    public void SeveralTablesOnAPage_WithProseBetween_AndATitleBlock()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter()
            .Text("Project: Demo lintel                    Job No: DEMO-7                    Rev: C")
            .Text("Designed by: A. Person (demo)           Date: 2026-05-04")
            .Text("Units: kN, m")
            .Paragraph("The lintel is built in at A and propped at B. The tables below give the model, the load and the moments carried forward.")
            .Table(Joints)
            .Paragraph("Section properties are from the supplier's tables; the modulus is the nominal value.")
            .Table(Members).Table(Loads)
            .Paragraph("Moments from the hand calculation:")
            .Table(new FixtureTable(["Case", "Member", "At", "Moment", "Notes"], [["1", "AB", "A", "-81", "hogging at the wall"], ["1", "AB", "B", "0", "prop"]]));
        var r = Read(w, t);
        var s = Ok(r);
        (s.Info.Title, s.Info.Reference, s.Info.Revision, s.Info.PreparedBy, s.Info.Date).ShouldBe(("Demo lintel", "DEMO-7", "C", "A. Person (demo)", "2026-05-04"));
        r.Warnings.ShouldContain(p => p.Message.StartsWith("column 'Notes' is not part of table 'end-moments'", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("M_{{{0}{1}}}")] // subscript as printed
    [InlineData("M_{0}{1}")]    // typed with an underscore
    [InlineData("M({0}{1})")]
    [InlineData("M {0}{1}")]
    [InlineData("M{0}{1}")]
    public void WideEndMomentHeaders_ResolveAgainstTheMembers_WithLongIds(string form)
    {
        // Joints N1 and N10 (ids longer than one character): M_N1N10 is the moment at end N1 of member N1-N10.
        using var t = new TempSubmission();
        string H(string a, string b) => string.Format(System.Globalization.CultureInfo.InvariantCulture, form, a, b);
        var w = new PdfFixtureWriter(Face.DejaVuSans).Text("Units: kN, m")
            .Table(new FixtureTable(["Joint", "x", "y", "Restraint"], [["N1", "0", "0", "fixed"], ["N10", "6", "0", "roller"]]))
            .Table(new FixtureTable(["Member", "Start", "End", "E [GPa]", "I [mm⁴]"], [["G1", "N1", "N10", "200", "250e6"]]))
            .Table(new FixtureTable(["Case", "On", "Kind", "w"], [["1", "G1", "udl", "18"]]))
            .Text("End moments [kN·m]")
            .Table(new FixtureTable(["Case", H("N1", "N10"), H("N10", "N1")], [["1", "−81.0", "0.0"]]));
        var s = Ok(Read(w, t));
        s.Claims.EndMoments.Select(c => (c.Member, c.At, c.End)).ShouldBe([("G1", "N1", MemberEnd.Start), ("G1", "N10", MemberEnd.End)]);
        Claim(s, "G1", MemberEnd.Start).ShouldBe(-81, 1e-9);
    }

    [Fact]
    public void WrappedTextCell_BelongsToItsRow()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter().Text("Units: kN, m")
            .Table(new FixtureTable(["Joint", "x", "y", "Restraint", "Notes"],
                [["A", "0", "0", "fixed", "base plate\ncast in"], ["B", "6", "0", "roller\n(padstone)", "bearing"]]) { GapEm = 2 })
            .Table(Members).Table(Loads).Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "-81"], ["1", "AB", "B", "0"]]));
        string path = PdfTestData.Save(t, "calc.pdf", w.Build());
        var joints = PdfSubmissionReader.Extract(path).Tables.Single(tb => tb.Name == "joints");
        joints.Rows.Select(r => (r.Cell(3), r.Cell(4))).ShouldBe([("fixed", "base plate cast in"), ("roller (padstone)", "bearing")]);
        // "roller (padstone)" is not a restraint word: the reader keeps the text, the importer says what is wrong and where.
        var r = SubmissionReader.Read(path);
        r.Errors.ShouldContain(e => e.Message.StartsWith("'restraint' = \"roller (padstone)\" is not recognised", StringComparison.Ordinal) && e.Where.Page == 1);
    }

    [Fact]
    public void RunningHeadersAndPageNumbers_AreNotRead()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(runningHeader: "Case   Member   At   Moment   (column names in a running header)")
            .Text("Units: kN, m").Table(Joints).Table(Members).Table(Loads).NewPage()
            .Table(new FixtureTable(["Case", "Member", "At", "Moment"], [["1", "AB", "A", "-81"], ["1", "AB", "B", "0"]]));
        var x = PdfSubmissionReader.Extract(PdfTestData.Save(t, "calc.pdf", w.Build()));
        x.Found.Select(f => f.Table).ShouldBe(["info", "joints", "members", "loads", "end-moments"]);
        x.Found.Single(f => f.Table == "end-moments").Where.ShouldStartWith("p.2 ");
        x.Tables.Single(tb => tb.Name == "end-moments").Rows.Select(r => r.Page).ShouldBe([2, 2]);
        x.Ignored.ShouldContain(i => i.What.StartsWith("a header of table 'end-moments' with no rows under it", StringComparison.Ordinal));
        x.Tables.SelectMany(tb => tb.Rows).ShouldNotContain(r => r.Page == 1 && r.Line == 1);
    }

    [Fact]
    public void Provenance_EveryValueKeepsItsPageLineAndPrintedText()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(Face.DejaVuSans).Text("Units: kN, m").Table(Joints).Table(Members).Table(Loads).NewPage()
            .Table(new FixtureTable(["Case", "Member", "At", "Moment [kN·m]"], [["1", "AB", "A", "−81.0"], ["1", "AB", "B", "0"]]));
        string path = PdfTestData.Save(t, "calc.pdf", w.Build());
        var s = Ok(SubmissionReader.Read(path));
        var claim = s.Claims.EndMoments[0].Source;
        var doc = PdfTextReader.Read(path, "calc.pdf", PdfLimits.Default, [])!;
        int line = doc.Lines.Single(l => l.Page == 2 && l.Text.Contains("−81.0", StringComparison.Ordinal)).Number;
        claim.Citation.ShouldBe($"calc.pdf p.2 line {line}");
        claim.Text.ShouldBe("−81.0");
        claim.Column.ShouldBe("Moment [kN·m]");
        s.Model.Member("AB").Source.Page.ShouldBe(1);
    }

    [Fact]
    public void SubscriptsAndSuperscripts_AreFoldedIntoTheirWords()
    {
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(Face.Helvetica).Text("I_{xx} [mm^{4}] and M_{AB} [kNm]");
        var doc = PdfTextReader.Read(PdfTestData.Save(t, "calc.pdf", w.Build()), "calc.pdf", PdfLimits.Default, [])!;
        doc.Lines.First().Text.ShouldBe("I_xx [mm⁴] and M_AB [kNm]");
    }

    [Fact]
    public void ExtractedTables_ReviewLikeThePdf()
    {
        // The contract CSV written from a PDF reads back to the same model and claims.
        using var t = new TempSubmission();
        var w = new PdfFixtureWriter(Face.DejaVuSans).Text("Units: kN, m").Text("Negative values in brackets.")
            .Table(Joints).Table(Members with { Rows = [["AB", "A", "B", "200", "250,000,000"]] }).Table(Loads)
            .Text("End moments [kN·m]")
            .Table(new FixtureTable(["Case", "M_{AB}", "M_{BA}"], [["1", "(81.0)", "0.0"]]));
        string pdf = PdfTestData.Save(t, "calc.pdf", w.Build());
        var x = PdfSubmissionReader.Extract(pdf);
        string dir = t.MakeFolder("tables");
        foreach (var f in ContractCsv.Render(x.Tables)) File.WriteAllText(Path.Combine(dir, f.FileName), f.Content);
        File.ReadAllText(Path.Combine(dir, "end-moments.csv")).ShouldBe($"# read from calc.pdf p.1 line {x.Tables.Single(tb => tb.Name == "end-moments").Rows[0].Line}\ncase,member,at,moment [kN·m]\n1,AB,A,-81.0\n1,AB,B,0.0\n");
        PdfTestData.Canon(Ok(SubmissionReader.Read(dir))).ShouldBe(PdfTestData.Canon(Ok(SubmissionReader.Read(pdf))));
    }
}
