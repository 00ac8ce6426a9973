using CrossCheck.Tests.Import.Pdf;
using CrossCheck.Tests.Support;
using static CrossCheck.Tests.Import.Documents.CalcSources;

namespace CrossCheck.Tests.Import.Documents;

/// <summary>
/// Every row checked by sense after reading, and the spellings and roles decided from contents, on tables given as text:
/// a misread must be an input error or a warning naming its cell, never a silent review.
/// </summary>
public class SenseCheckTests
{
    // The portal of docs/REFERENCE-CHECKS.md group 5 with relative stiffness (I) and lengths (L); {0} is the length given for BC.
    private const string Frame = Reviewing.KnM + "\n" + SampleText.PortalJoints + "\n\n" + """
        [members]
        member,start,end,I,L
        AB,A,B,1,4.00
        BC,B,C,1,{0}
        CD,C,D,1,4.00

        [loads]
        case,on,kind,w,P,a
        1,BC,udl,18,{1},

        [end-moments]
        member,at,moment
        AB,A,-10
        AB,B,20
        BC,B,-20
        BC,C,20
        CD,C,-20
        CD,D,10
        """;

    [Fact]
    public void MemberLength_DisagreeingWithTheJoints_IsAnInputErrorAtItsCell()
    {
        var r = TempSubmission.ReadText(string.Format(System.Globalization.CultureInfo.InvariantCulture, Frame, "8.00", ""));
        var error = r.Errors.ShouldHaveSingleItem();
        error.Where.Compact.ShouldBe("calc.csv:16:L");
        error.Message.ShouldContain("member 'BC' is given as 8.00 m long, but its joints are 6 m apart");
        // Rounded as printed (half a unit in the last digit) passes.
        TempSubmission.ReadText(string.Format(System.Globalization.CultureInfo.InvariantCulture, Frame, "6.0", "")).Errors.ShouldBeEmpty();
    }

    [Fact]
    public void ValueTheRowsKindDoesNotRead_IsAWarningNamingTheCell()
    {
        var r = TempSubmission.ReadText(string.Format(System.Globalization.CultureInfo.InvariantCulture, Frame, "6.00", "18"));
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        var warning = r.Warnings.Single(w => w.Where.Column == "P");
        warning.Where.Compact.ShouldBe("calc.csv:21:P");
        warning.Message.ShouldContain("'P' = \"18\" on a 'udl' row is not used (a 'udl' load reads 'w', 'a', 'b')");
    }

    [Fact]
    public void UnitsTypedWithoutACaret_OrInCapitals_AreRead()
    {
        string csv = Csv(relative: false).Replace("E [GPa],I [mm^4]", "E [KN/MM2],I [MM4]").Replace("w [kN/m]", "w [KN/M]").Replace("moment [kN·m]", "MOMENT (KNM)");
        var r = TempSubmission.ReadText(csv);
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        r.Submission!.Model.Members.ShouldAllBe(m => Math.Abs(m.E - 210e9) < 1 && Math.Abs(m.I - 250e-6) < 1e-12);
        r.Submission.Claims.EndMoments.Single(c => c.Member == "AB" && c.At == "B").Moment.ShouldBe(103.5e3, 1e-6);
        // N/mm2 and KN/M2 (SI: 1 N/mm² = 10⁶ Pa, 1 kN/m² = 10³ Pa, NIST SP 811).
        TempSubmission.ReadText(csv.Replace("E [KN/MM2]", "E [N/mm2]").Replace(",210,", ",210000,")).Submission!.Model.Members.ShouldAllBe(m => Math.Abs(m.E - 210e9) < 1);
        TempSubmission.ReadText(csv.Replace("E [KN/MM2]", "E [KN/M2]").Replace(",210,", ",2.1e8,")).Submission!.Model.Members.ShouldAllBe(m => Math.Abs(m.E - 210e9) < 1);
    }

    [Fact]
    public void RelativeSecondMoment_BesideAnEColumn_MakesStiffnessRelative_AndSaysTheEColumnIsNotUsed()
    {
        var r = TempSubmission.ReadText(Csv(relative: false).Replace("I [mm^4]", "I (rel.)").Replace(",250e6", ",1"));
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        r.Submission!.Model.RelativeStiffness.ShouldBeTrue();
        r.Submission.Model.Members.ShouldAllBe(m => m.E == 1 && m.I == 1);
        r.Warnings.ShouldContain(w => w.Message.Contains("the E column is not used", StringComparison.Ordinal));
        foreach (var header in new[] { "I/I0", "I/I₀", "rel. I", "k" })
            TempSubmission.ReadText(Csv().Replace("span,length [m],I", $"span,length [m],{header}")).Submission!.Model.RelativeStiffness.ShouldBeTrue(header);
    }

    [Fact]
    public void CsvColumnHeadedLoad_HoldingKinds_IsTheKind_AndTwoInseparableColumnsAreAnError()
    {
        var r = TempSubmission.ReadText(Csv().Replace("case,on,kind,w [kN/m]", "case,on,Load,w [kN/m]"));
        r.Succeeded.ShouldBeTrue(PdfTestData.Problems(r));
        r.Warnings.ShouldContain(w => w.Where.Column == "Load" && w.Message.Contains("read as 'kind' from its contents", StringComparison.Ordinal));
        // 'Force' and 'Load' are both synonyms of P, both hold forces: their cells cannot tell them apart.
        var two = TempSubmission.ReadText(Csv().Replace("w [kN/m],P [kN],a [m]", "w [kN/m],Force [kN],a [m],Load [kN]").Replace(",40,3", ",40,3,40"));
        two.Errors.ShouldContain(e => e.Message.Contains("columns 'Force [kN]' and 'Load [kN]' both read as 'P'", StringComparison.Ordinal));
    }
}
