using CrossCheck.Import;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import;

/// <summary>Every rule of docs/SUBMISSION-FORMAT.md (contract v1) that the CSV importer implements.</summary>
public class CsvImportTests
{
    private static string Repo => RepoPaths.Root;

    [Fact]
    public void FolderContainer_ReadsEveryTable()
    {
        var r = SubmissionReader.Read(Path.Combine(Repo, "fixtures", "demo", "shed-frame"));
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var s = r.Submission!;
        s.Model.Joints.Count.ShouldBe(6);
        s.Model.Members.Count.ShouldBe(5);
        s.Cases.Select(c => c.Id).ShouldBe(["G", "G+W"]);
        s.Claims.EndMoments.Count.ShouldBe(20);
        s.Claims.Reactions.Count.ShouldBe(3);
        s.Info.Reference.ShouldBe("DEMO-SH-03");
        s.Model.Member("AB").E.ShouldBe(205e9, 1);
        s.Model.Member("BC").I.ShouldBe(250e6 * 1e-12, 1e-15);
        s.Claims.EndMoments[0].Source.Compact.ShouldBe("end-moments.csv:2:moment [kN·m]");
    }

    [Fact]
    public void SectionedFile_WithBeamShorthand_BuildsJointsLeftToRight()
    {
        var r = SubmissionReader.Read(Path.Combine(Repo, "fixtures", "demo", "footbridge.csv"));
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var m = r.Submission!.Model;
        m.Joints.Select(j => (j.Id, j.X)).ShouldBe([("A", 0.0), ("B", 8.0), ("C", 18.0), ("D", 26.0)]);
        m.Joints[0].Restraint.ShouldBe(Restraint.Pinned);
        m.Member("BC").Start.ShouldBe("B");
        m.Member("BC").End.ShouldBe("C");
    }

    [Fact]
    public void BeamShorthand_OverhangEndsAtAFreeSupport()
    {
        var r = TempSubmission.ReadText(SampleText.With(frame: """
            [supports]
            support,restraint
            A,pinned
            B,roller
            C,free

            [spans]
            span,length [m],I [mm^4]
            AB,6,100e6
            BC,2,100e6
            """, loads: """
            [loads]
            on,kind,P,a
            BC,point,10,2
            """));
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        r.Submission!.Model.Joint("C").Restraint.ShouldBe(Restraint.Free);
        r.Submission.Model.Joint("C").X.ShouldBe(8);
    }

    [Fact]
    public void CommentsBlankLinesAndSpreadsheetCommas_AreIgnored()
    {
        var r = TempSubmission.ReadText("# a comment\n\n[info],,\nkey,value,\nforce unit,kN,\nlength unit,m,\n,,\n" +
            SampleText.Frame + "\n# another\n" + SampleText.Loads + "\n" + SampleText.Claims);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
    }

    [Theory]
    [InlineData("Settle_Y")]
    [InlineData("settle-y")]
    [InlineData("  SETTLE   Y ")]
    public void HeaderNames_IgnoreCaseSpacesUnderscoresAndHyphens(string header)
    {
        var r = TempSubmission.ReadText(SampleText.With(frame: $"""
            [joints]
            joint,x,y,restraint,{header} [mm]
            A,0,0,fixed,
            B,6,0,roller,-10

            [members]
            member,start,end,E [GPa],I [mm^4]
            AB,A,B,200,250e6
            """));
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        r.Submission!.Model.Joint("B").Movement.Y.ShouldBe(-0.010, 1e-15);
    }

    [Theory] // Conversion factors: international inch 0.0254 m and pound-force 4.4482216152605 N exactly (NIST SP 811, Appendix B).
    [InlineData("kNm", 1.5, 1500.0)]
    [InlineData("kN-m", 1.5, 1500.0)]
    [InlineData("kN·m", 1.5, 1500.0)]
    [InlineData("kN*m", 1.5, 1500.0)]
    [InlineData("N.mm", 1.5e6, 1500.0)]
    [InlineData("kip-ft", 1.0, 4448.2216152605 * 0.3048)]
    [InlineData("k-ft", 1.0, 4448.2216152605 * 0.3048)]
    [InlineData("kip*in", 1.0, 4448.2216152605 * 0.0254)]
    public void MomentUnits_ConvertToNewtonMetres(string unit, double value, double newtonMetres)
    {
        var u = UnitReader.TryRead(unit, QuantityKind.Moment).ShouldNotBeNull();
        Near.Equal(value * u.ToSi, newtonMetres, relative: 1e-9);
    }

    // NIST SP 811 Appendix B definitions (in = 0.0254 m, lbf = 4.4482216152605 N, psi = lbf/in²).
    [Theory]
    [InlineData("mm^4", QuantityKind.SecondMoment, 1e-12)]
    [InlineData("mm4", QuantityKind.SecondMoment, 1e-12)]
    [InlineData("mm⁴", QuantityKind.SecondMoment, 1e-12)]
    [InlineData("10^6 mm^4", QuantityKind.SecondMoment, 1e-6)]
    [InlineData("x10^6 mm4", QuantityKind.SecondMoment, 1e-6)]
    [InlineData("cm^4", QuantityKind.SecondMoment, 1e-8)]
    [InlineData("in^4", QuantityKind.SecondMoment, 0.0254 * 0.0254 * 0.0254 * 0.0254)]
    [InlineData("in4", QuantityKind.SecondMoment, 0.0254 * 0.0254 * 0.0254 * 0.0254)]
    [InlineData("GPa", QuantityKind.Modulus, 1e9)]
    [InlineData("N/mm^2", QuantityKind.Modulus, 1e6)]
    [InlineData("N/mm²", QuantityKind.Modulus, 1e6)]
    [InlineData("ksi", QuantityKind.Modulus, 4448.2216152605 / (0.0254 * 0.0254))]
    [InlineData("psi", QuantityKind.Modulus, 4.4482216152605 / (0.0254 * 0.0254))]
    [InlineData("kN/m", QuantityKind.ForcePerLength, 1e3)]
    [InlineData("N/mm", QuantityKind.ForcePerLength, 1e3)]
    [InlineData("kip/ft", QuantityKind.ForcePerLength, 4448.2216152605 / 0.3048)]
    [InlineData("klf", QuantityKind.ForcePerLength, 4448.2216152605 / 0.3048)]
    [InlineData("plf", QuantityKind.ForcePerLength, 4.4482216152605 / 0.3048)]
    [InlineData("kip", QuantityKind.Force, 4448.2216152605)]
    [InlineData("kN", QuantityKind.Force, 1e3)]
    [InlineData("ft", QuantityKind.Length, 0.3048)]
    [InlineData("mm", QuantityKind.Length, 1e-3)]
    [InlineData("m^2", QuantityKind.Area, 1)]
    [InlineData("mm2", QuantityKind.Area, 1e-6)]
    [InlineData("deg", QuantityKind.Angle, Math.PI / 180)]
    public void Units_ConvertToSi(string unit, QuantityKind kind, double factor)
    {
        var u = UnitReader.TryRead(unit, kind).ShouldNotBeNull($"'{unit}' should be read as {kind}");
        Near.Equal(u.ToSi, factor, relative: 1e-12, absolute: 0);
    }

    [Theory] // Spellings outside the table go to UnitsNet.
    [InlineData("kgf", QuantityKind.Force, 9.80665)]
    [InlineData("dm", QuantityKind.Length, 0.1)]
    public void OtherSpellings_AreReadByUnitsNet(string unit, QuantityKind kind, double factor) =>
        Near.Equal(UnitReader.TryRead(unit, kind).ShouldNotBeNull().ToSi, factor, relative: 1e-9, absolute: 0);

    [Theory]
    [InlineData("kN", QuantityKind.Moment)]
    [InlineData("m", QuantityKind.Force)]
    [InlineData("furlong-ish", QuantityKind.Length)]
    public void Units_OfTheWrongKind_AreRefused(string unit, QuantityKind kind) => UnitReader.TryRead(unit, kind).ShouldBeNull();

    [Fact]
    public void InfoDefaults_ApplyToColumnsWithoutUnits()
    {
        var r = TempSubmission.ReadText(SampleText.All);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var s = r.Submission!;
        var load = s.Cases[0].Loads.OfType<DistributedLoad>().Single();
        load.WStart.ShouldBe(18e3); // kN/m from force unit kN and length unit m
        s.Claims.EndMoments[0].Moment.ShouldBe(-81e3); // kN·m
        s.Info.Units.Moment.Symbol.ShouldBe("kN·m");
    }

    [Fact]
    public void DimensionalColumnWithoutAnyUnit_IsAnErrorAtItsHeader()
    {
        var r = TempSubmission.ReadText(SampleText.With(info: "[info]\nkey,value\ntitle,No units"));
        r.Succeeded.ShouldBeFalse();
        var p = r.Errors.First(e => e.Where.Column == "x");
        p.Where.Compact.ShouldBe("calc.csv:6:x");
        p.Where.Table.ShouldBe("joints");
        p.Message.ShouldContain("has no unit");
    }

    [Fact]
    public void SemicolonFile_ReadsDecimalCommas()
    {
        var r = TempSubmission.ReadText("""
            [info]
            key;value
            force unit;kN
            length unit;m

            [joints]
            joint;x;y;restraint
            A;0;0;fixed
            B;6,5;0;roller

            [members]
            member;start;end;E [GPa];I [mm^4]
            AB;A;B;200;1.250.000,5

            [loads]
            on;kind;w
            AB;udl;17,5

            [end-moments]
            member;at;moment
            AB;A;-92,4
            """);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        r.Submission!.Model.Joint("B").X.ShouldBe(6.5);
        r.Submission.Model.Member("AB").I.ShouldBe(1250000.5e-12, 1e-20);
        r.Submission.Claims.EndMoments[0].Moment.ShouldBe(-92.4e3, 1e-9);
    }

    [Fact]
    public void SaggingConvention_FlipsTheSignAtTheEndOnly()
    {
        // docs/SUBMISSION-FORMAT.md: sagging at start = clockwise at start; sagging at end = − clockwise at end.
        var r = TempSubmission.ReadText(SampleText.With(
            info: SampleText.Info + "\nsign convention,sagging",
            claims: "[end-moments]\nmember,at,moment\nAB,A,-81\nAB,B,-12\nAB,end,-13"));
        // the second and third rows both name end B: a duplicate claim
        r.Errors.ShouldContain(e => e.Message.Contains("claimed twice"));
        r = TempSubmission.ReadText(SampleText.With(
            info: SampleText.Info + "\nsign convention,sagging",
            claims: "[end-moments]\nmember,at,moment\nAB,A,-81\nAB,end,-12"));
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        var c = r.Submission!.Claims.EndMoments;
        c[0].Moment.ShouldBe(-81e3);
        c[1].End.ShouldBe(MemberEnd.End);
        c[1].Moment.ShouldBe(12e3);
        c[1].AsWritten.ShouldBe(-12);
    }

    [Fact]
    public void ByteOrderMark_AtTheStart_IsAccepted()
    {
        using var t = new TempSubmission();
        var bytes = new byte[] { 0xEF, 0xBB, 0xBF }.Concat(System.Text.Encoding.UTF8.GetBytes(SampleText.All)).ToArray();
        SubmissionReader.Read(t.WriteBytes("calc.csv", bytes)).Succeeded.ShouldBeTrue();
    }

    [Fact]
    public void ClaimForAnEndTheModelDoesNotHave_IsKeptAsUnmatched()
    {
        var r = TempSubmission.ReadText(SampleText.With(claims: "[end-moments]\nmember,at,moment\nAB,A,-81\nXY,A,5\nAB,Q,3"));
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        r.Submission!.Claims.EndMoments.Count(c => c.End is null).ShouldBe(2);
    }

    [Fact]
    public void RelativeStiffness_WithoutE_NeedsNoUnitOnI()
    {
        var r = TempSubmission.ReadText(SampleText.With(frame: """
            [joints]
            joint,x,y,restraint
            A,0,0,fixed
            B,6,0,roller

            [members]
            member,start,end,I
            AB,A,B,2
            """));
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        r.Submission!.Model.RelativeStiffness.ShouldBeTrue();
        r.Submission.Model.Member("AB").E.ShouldBe(1);
    }
}
