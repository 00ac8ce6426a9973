using CrossCheck.Import;
using CrossCheck.Import.Loads;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Import;

/// <summary>
/// The load kinds of the format (<see cref="LoadKinds"/>): every word of the kind column reads as its load, on the
/// targets the kind allows, with its own columns and checks. Sample values are invented; the units are exact (kN, m).
/// </summary>
public class LoadKindTests
{
    private static ImportResult Read(string row) => TempSubmission.ReadText(SampleText.With(loads: $"""
        [loads]
        case,on,kind,P,w,w end,M,a,b,dir
        {row}
        """));

    private static Load Single(string row)
    {
        var r = Read(row);
        r.Succeeded.ShouldBeTrue(string.Join("\n", r.Problems));
        return r.Submission!.Cases.ShouldHaveSingleItem().Loads.ShouldHaveSingleItem();
    }

    /// <summary>The row is refused with one error, saying <paramref name="message"/> (at <paramref name="column"/> when given).</summary>
    private static void Refused(string row, string message, string? column = null)
    {
        var e = Read(row).Errors.ShouldHaveSingleItem();
        e.Message.ShouldBe(message);
        if (column is not null) e.Where.Column.ShouldBe(column);
    }

    [Theory]
    [InlineData("point")]
    [InlineData("Concentrated")]
    [InlineData("conc")]
    public void PointWords_ReadAPointLoadOnAMember(string word)
    {
        var p = Single($"1,AB,{word},10,,,,2,,up").ShouldBeOfType<PointLoad>();
        (p.Member, p.P, p.A, p.Direction).ShouldBe(("AB", 10e3, 2.0, LoadDirection.Up));
    }

    [Fact]
    public void PointLoadOnAJoint_IsAJointForce()
    {
        var f = Single("1,B,point,10,,,,,,left").ShouldBeOfType<JointForce>();
        (f.Joint, f.P, f.Direction).ShouldBe(("B", 10e3, LoadDirection.Left));
    }

    [Theory]
    [InlineData("udl")]
    [InlineData("uniform")]
    [InlineData("DISTRIBUTED")]
    public void UniformWords_ReadAUniformLoad_OverTheWholeMemberByDefault(string word)
    {
        var d = Single($"1,AB,{word},,5,,,,,").ShouldBeOfType<DistributedLoad>();
        (d.WStart, d.WEnd, d.A, d.B, d.Direction).ShouldBe((5e3, 5e3, 0.0, 6.0, LoadDirection.Down));
    }

    [Theory]
    [InlineData("linear")]
    [InlineData("trapezoidal")]
    [InlineData("triangular")]
    [InlineData("varying")]
    public void LinearWords_ReadAVaryingLoad_BetweenAAndB(string word)
    {
        var d = Single($"1,AB,{word},,2,8,,1,5,").ShouldBeOfType<DistributedLoad>();
        (d.WStart, d.WEnd, d.A, d.B).ShouldBe((2e3, 8e3, 1.0, 5.0));
    }

    [Fact]
    public void LinearLoad_NeedsItsEndIntensity() =>
        Refused("1,AB,linear,,2,,,,,", "'w end' is empty (a linear load)", column: "w end");

    [Theory]
    [InlineData("moment")]
    [InlineData("couple")]
    public void CoupleWords_ReadACoupleOnAMemberOrAJoint(string word)
    {
        var m = Single($"1,AB,{word},,,,12,3,,").ShouldBeOfType<MemberCouple>();
        (m.M, m.A).ShouldBe((12e3, 3.0));
        Single($"1,B,{word},,,,12,,,").ShouldBeOfType<JointCouple>().M.ShouldBe(12e3);
    }

    [Fact]
    public void DirectionOfACouple_IsWarnedAboutAndIgnored()
    {
        var r = Read("1,B,moment,,,,12,,,up");
        r.Succeeded.ShouldBeTrue();
        r.Warnings.ShouldHaveSingleItem().Message.ShouldBe("'dir' does not apply to a 'moment' load");
    }

    [Fact]
    public void ForceOnAMember_NamesTheMember() =>
        Refused("1,AB,force,10,,,,,,", "a 'force' load acts on a joint, but 'AB' is a member", column: "on");

    [Fact]
    public void DistributedLoadOnAJoint_NamesTheJoint() =>
        Refused("1,B,udl,,5,,,,,", "a 'udl' load acts on a member, but 'B' is a joint");

    [Fact]
    public void UnknownKind_ListsTheKindsInTheirOrder() =>
        Refused("1,AB,blanket,,5,,,,,", "'kind' = \"blanket\" is not recognised (use one of: point, udl, linear, moment, force)");

    [Fact]
    public void EveryWord_NamesExactlyOneKind()
    {
        var words = LoadKinds.All.SelectMany(k => k.Words).ToList();
        words.Distinct(StringComparer.Ordinal).Count().ShouldBe(words.Count);
        foreach (var kind in LoadKinds.All)
            foreach (var w in kind.Words)
            {
                w.ShouldBe(TableSchema.Normalize(w), "words are written normalised");
                LoadKinds.Find(w.ToUpperInvariant()).ShouldBeSameAs(kind);
            }
    }
}
