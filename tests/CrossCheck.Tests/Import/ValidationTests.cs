using CrossCheck.Import;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import;

/// <summary>
/// The validation a checking engineer expects before trusting a model: each bad input gives an error with the
/// file, table, line and column, and every problem is reported in one pass.
/// </summary>
public class ValidationTests
{
    private static InputProblem Single(string submission, string fragment) => Single(TempSubmission.ReadText(submission), fragment);

    private static InputProblem Single(ImportResult r, string fragment)
    {
        r.Succeeded.ShouldBeFalse();
        var hits = r.Errors.Where(e => e.Message.Contains(fragment, StringComparison.Ordinal)).ToList();
        hits.Count.ShouldBe(1, $"expected one error containing '{fragment}', got:\n{string.Join("\n", r.Problems)}");
        return hits[0];
    }

    private const string Joints = """
        [joints]
        joint,x,y,restraint
        A,0,0,fixed
        B,6,0,roller
        """;

    private static string Members(string row) => $"""
        [members]
        member,start,end,E [GPa],I [mm^4]
        {row}
        """;

    [Fact]
    public void UnknownJointInMembers_NamesRowAndColumn()
    {
        var p = Single(SampleText.With(frame: Joints + "\n\n" + Members("AB,A,Z,200,250e6")), "joint 'Z' is not in the joints table");
        p.Where.Compact.ShouldBe("calc.csv:14:end");
        p.Where.Table.ShouldBe("members");
    }

    [Fact]
    public void DuplicateJointId_PointsAtTheFirst()
    {
        var p = Single(SampleText.With(frame: Joints + "\nA,3,0,free\n\n" + Members("AB,A,B,200,250e6")), "defined twice");
        p.Where.Compact.ShouldBe("calc.csv:11:joint");
        p.Message.ShouldContain("first at calc.csv:9");
    }

    [Fact]
    public void DuplicateMemberId_IsAnError() =>
        Single(SampleText.With(frame: Joints + "\n\n" + Members("AB,A,B,200,250e6\nAB,B,A,200,250e6")), "member 'AB' is defined twice");

    [Fact]
    public void ZeroLengthMember_IsAnError()
    {
        var p = Single(SampleText.With(
            frame: Joints + "\nC,6,0,free\n\n" + Members("AB,A,B,200,250e6\nBC,B,C,200,250e6")), "zero length");
        p.Where.Row.ShouldBe(16);
    }

    [Fact]
    public void MemberFromAJointToItself_IsAnError() =>
        Single(SampleText.With(frame: Joints + "\n\n" + Members("AB,A,A,200,250e6")), "starts and ends at the same joint");

    [Theory]
    [InlineData("AB,A,B,0,250e6", "E")]
    [InlineData("AB,A,B,200,-250e6", "I")]
    public void NonPositiveStiffness_IsAnError(string row, string column)
    {
        var p = Single(SampleText.With(frame: Joints + "\n\n" + Members(row)), "must be greater than zero");
        p.Where.Column.ShouldStartWith(column);
        p.Where.Row.ShouldBe(14);
    }

    [Theory]
    [InlineData("abc", "must be a number, got \"abc\"")]
    [InlineData("NaN", "must be a number, got \"NaN\"")]
    [InlineData("Infinity", "must be a number, got \"Infinity\"")]
    [InlineData("1,5", "use '.' as the decimal point")]
    [InlineData("1e400", "must be a number")]
    public void TextOrNonFiniteInANumberColumn_IsAnError(string cell, string fragment)
    {
        var p = Single(SampleText.With(frame: Joints + "\n\n" + Members($"AB,A,B,\"{cell}\",250e6")), fragment);
        p.Where.Compact.ShouldBe("calc.csv:14:E [GPa]");
    }

    [Fact]
    public void MissingRequiredTable_IsNamed()
    {
        var r = TempSubmission.ReadText(string.Join("\n\n", SampleText.Info, SampleText.Frame, SampleText.Claims));
        Single(r, "no 'loads' table");
    }

    [Fact]
    public void MissingRequiredColumn_IsNamedAtTheHeader()
    {
        var p = Single(SampleText.With(frame: Joints + "\n\n[members]\nmember,start,end\nAB,A,B"), "needs a column 'I'");
        p.Where.Compact.ShouldBe("calc.csv:13:I");
    }

    [Theory]
    [InlineData("AB,point,10,7", "'a' = 7 m lies outside the member (length 6 m)")]
    [InlineData("AB,point,10,-1", "lies outside the member")]
    public void LoadOutsideTheMember_IsAnError(string row, string fragment)
    {
        var p = Single(SampleText.With(loads: "[loads]\non,kind,P,a\n" + row), fragment);
        p.Where.Column.ShouldBe("a");
        p.Where.Table.ShouldBe("loads");
    }

    [Fact]
    public void DistributedLoadEndingBeforeItStarts_IsAnError() =>
        Single(SampleText.With(loads: "[loads]\non,kind,w,a,b\nAB,udl,5,4,2"), "'b' must not be less than 'a'");

    [Fact]
    public void SettlementWithoutE_IsAnError()
    {
        var r = TempSubmission.ReadText(SampleText.With(frame: """
            [joints]
            joint,x,y,restraint,settle y
            A,0,0,fixed,
            B,6,0,roller,-0.01

            [members]
            member,start,end,I
            AB,A,B,1
            """));
        Single(r, "support movements need absolute stiffness");
    }

    [Fact]
    public void MovementOnAnUnrestrainedDirection_IsAnError() =>
        Single(SampleText.With(frame: """
            [joints]
            joint,x,y,restraint,settle x
            A,0,0,fixed,
            B,6,0,roller,0.01

            [members]
            member,start,end,E [GPa],I [mm^4]
            AB,A,B,200,250e6
            """), "not restrained in that direction");

    [Fact]
    public void LoadOnSomethingThatDoesNotExist_IsAnError()
    {
        var p = Single(SampleText.With(loads: "[loads]\non,kind,w\nXY,udl,5"), "'XY' is neither a member nor a joint");
        p.Where.Column.ShouldBe("on");
    }

    [Fact]
    public void PointLoadWithoutP_IsAnError() =>
        Single(SampleText.With(loads: "[loads]\non,kind,P,a\nAB,point,,3"), "'P' is empty (a point load)");

    [Fact]
    public void UnknownLoadKind_ListsTheChoices() =>
        Single(SampleText.With(loads: "[loads]\non,kind,w\nAB,snow,5"), "use one of: point, udl, linear, moment, force");

    [Fact]
    public void ClaimForACaseWithNoLoads_IsAnError()
    {
        var p = Single(SampleText.With(claims: "[end-moments]\ncase,member,at,moment\n2,AB,A,-81"), "load case '2' has no loads");
        p.Where.Column.ShouldBe("case");
    }

    [Fact]
    public void UnknownRestraint_IsAnError() =>
        Single(SampleText.With(frame: Joints.Replace("roller", "wobbly") + "\n\n" + Members("AB,A,B,200,250e6")), "\"wobbly\" is not recognised");

    [Fact]
    public void EveryProblem_IsReportedInOnePass()
    {
        var r = TempSubmission.ReadText(SampleText.With(
            frame: Joints + "\n\n" + Members("AB,A,Z,abc,-1"),
            loads: "[loads]\non,kind,w\nQQ,udl,5"));
        r.Errors.Count().ShouldBeGreaterThanOrEqualTo(4);
        r.Errors.Select(e => e.Where.Column).ShouldContain("end");
        r.Errors.Select(e => e.Where.Column).ShouldContain("E [GPa]");
        r.Errors.Select(e => e.Where.Column).ShouldContain("I [mm^4]");
        r.Errors.Select(e => e.Where.Column).ShouldContain("on");
    }

    [Fact]
    public void UnknownColumn_IsAWarningNotAnError()
    {
        var r = TempSubmission.ReadText(SampleText.With(frame: Joints.Replace("restraint", "restraint,notes").Replace("fixed", "fixed,base plate") + "\n\n" + Members("AB,A,B,200,250e6")));
        r.Succeeded.ShouldBeTrue();
        r.Warnings.ShouldContain(w => w.Message.Contains("column 'notes' is not part of table 'joints'"));
    }

    [Fact]
    public void BinaryGarbage_WithACsvName_IsRefusedClearly()
    {
        using var t = new TempSubmission();
        var r = SubmissionReader.Read(t.WriteBytes("calc.csv", [0x50, 0x4B, 0x03, 0x04, 0x00, 0x00, 0xFF, 0x13]));
        Single(r, "binary data");
    }

    [Fact]
    public void FileWithoutSections_SaysHowToIntroduceTables() =>
        Single("member,start,end\nAB,A,B", "introduces each table with a line such as [members]");

    [Fact]
    public void MissingPath_IsAnError() => Single(SubmissionReader.Read("/no/such/submission.csv"), "does not exist");
}
