using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Review;

/// <summary>
/// Each check of the claimed numbers passes on a published closed-form result and fails, at the right place and by
/// the right amount, when the claims are altered. Units: kN and m.
/// </summary>
public class ClaimCheckTests
{
    // Two equal spans 6 m, w = 18 kN/m on both: support moment wL²/8 = 81 kN·m (Hicks, Civil Engineering Formulas, Table 2.1).
    private const string TwoSpans = Reviewing.KnM + CombinationBeam.Geometry + "\n\n" + """
        [loads]
        on,kind,w
        AB,udl,18
        BC,udl,18

        """;

    [Fact]
    public void PublishedTwoSpanMoments_PassEveryCheck_AndTheReviewConcurs()
    {
        var r = Reviewing.Of(TwoSpans + Reviewing.Claims(("AB", "A", 0), ("AB", "B", 81), ("BC", "B", -81), ("BC", "C", 0)));
        r.AllFlags.Where(f => f.Severity != Severity.Info).ShouldBeEmpty();
        r.Verdict.ShouldBe(Verdict.Concur);
        r.AllEndMoments.ShouldAllBe(e => e.Status == EndStatus.Agree);
    }

    [Fact]
    public void JointEquilibrium_FailsWhereTheJointDoesNotBalance()
    {
        var r = Reviewing.Of(TwoSpans + Reviewing.Claims(("AB", "A", 0), ("AB", "B", 81), ("BC", "B", -75), ("BC", "C", 0)));
        var f = r.Flags(FlagKind.JointEquilibrium).ShouldHaveSingleItem();
        f.Where.ShouldBe("joint B");
        f.Value!.Value.ShouldBe(6e3, 1e-6); // 81 − 75 kN·m, in N·m
        f.Severity.ShouldBe(Severity.Major);
        r.Verdict.ShouldBe(Verdict.Revise);
    }

    [Fact]
    public void ReleasedEnd_PinnedEndWithAMoment_IsFlagged()
    {
        // Propped cantilever, UDL: M_AB = −wL²/8 = −81, M_BA = 0 (Hicks Fig. 2.2 case 10; AISC Table 3-23 case 12, from memory).
        string propped = Reviewing.KnM + """
            [supports]
            support,restraint
            A,fixed
            B,roller

            [spans]
            span,length,E [GPa],I [mm^4]
            AB,6,200,250e6

            [loads]
            on,kind,w
            AB,udl,18

            """;
        Reviewing.Of(propped + Reviewing.Claims(("AB", "A", -81), ("AB", "B", 0))).Flags(FlagKind.ReleasedEnd).ShouldBeEmpty();
        var f = Reviewing.Of(propped + Reviewing.Claims(("AB", "A", -81), ("AB", "B", 12))).Flags(FlagKind.ReleasedEnd).ShouldHaveSingleItem();
        f.Where.ShouldBe("member AB at B");
        f.Value!.Value.ShouldBe(12e3, 1e-6);
    }

    [Fact]
    public void ReleasedEnd_OverhangRootMustCarryTheStaticalMoment()
    {
        // Beam 6 m with a 2 m overhang carrying 10 kN at its tip: the root moment is P·a = 20 kN·m by statics (common practice).
        string beam = Reviewing.KnM + """
            [supports]
            support,restraint
            A,pinned
            B,roller
            C,free

            [spans]
            span,length,E [GPa],I [mm^4]
            AB,6,200,250e6
            BC,2,200,250e6

            [loads]
            on,kind,P,a
            BC,point,10,2

            """;
        // Clockwise member-end moments: at B the overhang's left end carries −20 (hogging), the span's right end +20.
        Reviewing.Of(beam + Reviewing.Claims(("AB", "B", 20), ("BC", "B", -20), ("BC", "C", 0), ("AB", "A", 0))).Flags(FlagKind.ReleasedEnd).ShouldBeEmpty();
        var f = Reviewing.Of(beam + Reviewing.Claims(("AB", "B", 25), ("BC", "B", -25), ("BC", "C", 0), ("AB", "A", 0)))
            .Flags(FlagKind.ReleasedEnd).ShouldHaveSingleItem();
        f.Where.ShouldBe("member BC at B");
        f.Value!.Value.ShouldBe(-5e3, 1e-6);
    }

    // Portal of docs/REFERENCE-CHECKS.md 5.3 (k = 0.5): fixed feet, H = 30 kN at B. Kleinlogel (from memory) / slope-deflection:
    // M_AB = M_DC = −Hh(3k+1)/(2(6k+1)) = −37.5, M_BA = M_CD = −3kHh/(2(6k+1)) = −22.5, M_BC = M_CB = +22.5.
    private const string Portal = Reviewing.KnM + SampleText.PortalJoints + "\n\n" + """
        [members]
        member,start,end,E [GPa],I [mm^4]
        AB,A,B,200,200e6
        BC,B,C,200,150e6
        DC,D,C,200,200e6

        [loads]
        on,kind,P,dir
        B,force,30,right

        """;

    [Fact]
    public void StoreyShear_PassesForTheSwaySolution()
    {
        var r = Reviewing.Of(Portal + Reviewing.Claims(("AB", "A", -37.5), ("AB", "B", -22.5), ("BC", "B", 22.5), ("BC", "C", 22.5), ("DC", "C", -22.5), ("DC", "D", -37.5)));
        r.AllFlags.Where(f => f.Severity != Severity.Info).ShouldBeEmpty();
        r.Verdict.ShouldBe(Verdict.Concur);
    }

    [Fact]
    public void StoreyShear_FailsWhenSwayIsIgnored()
    {
        // A braced (no-sway) analysis of a lateral joint load gives no moments at all: the columns carry none of the 30 kN.
        var r = Reviewing.Of(Portal + Reviewing.Claims(("AB", "A", 0), ("AB", "B", 0), ("BC", "B", 0), ("BC", "C", 0), ("DC", "C", 0), ("DC", "D", 0)));
        var f = r.Flags(FlagKind.StoreyShear).ShouldHaveSingleItem();
        f.Where.ShouldStartWith("storey 1");
        f.Value!.Value.ShouldBe(30e3, 1e-6);
        f.Severity.ShouldBe(Severity.Major);
        r.Flags(FlagKind.JointEquilibrium).ShouldBeEmpty(); // every joint balances: only the storey check sees it
    }

    // Three unequal spans of docs/REFERENCE-CHECKS.md 4a (Clapeyron three-moment equation, Timoshenko & Young; from memory):
    // M_B = 94.623912, M_C = 66.638413 kN·m.
    private const string Unequal = Reviewing.KnM + """
        [joints]
        joint,x,y,restraint
        A,0,0,pinned
        B,5,0,roller
        C,12.5,0,roller
        D,16.5,0,roller

        [members]
        member,start,end,E [GPa],I [mm^4]
        AB,A,B,200,200e6
        BC,B,C,200,400e6
        CD,C,D,200,150e6

        [loads]
        on,kind,w,P,a
        AB,udl,20,,
        BC,udl,12,,
        BC,point,,60,3
        CD,point,,45,1.5

        """;

    [Fact]
    public void Compatibility_PassesForTheThreeMomentSolution()
    {
        var r = Reviewing.Of(Unequal + Reviewing.Claims(("AB", "A", 0), ("AB", "B", 94.623912), ("BC", "B", -94.623912), ("BC", "C", 66.638413), ("CD", "C", -66.638413), ("CD", "D", 0)));
        r.Flags(FlagKind.Compatibility).ShouldBeEmpty();
    }

    [Fact]
    public void Compatibility_CatchesMomentsThatBalanceButAreNotCompatible()
    {
        // Change both sides of joint B by 8 kN·m: joint B still balances, but the moments no longer fit one set of rotations.
        var r = Reviewing.Of(Unequal + Reviewing.Claims(("AB", "A", 0), ("AB", "B", 86.6), ("BC", "B", -86.6), ("BC", "C", 66.638413), ("CD", "C", -66.638413), ("CD", "D", 0)));
        r.Flags(FlagKind.JointEquilibrium).ShouldBeEmpty();
        var f = r.Flags(FlagKind.Compatibility);
        f.ShouldNotBeEmpty();
        f.ShouldContain(x => x.Where.EndsWith("at B", StringComparison.Ordinal));
        f.Max(x => Math.Abs(x.Value!.Value)).ShouldBeGreaterThan(5e3);
    }

    [Fact]
    public void ReactionsAgainstLoads_CatchAnUnbalancedReaction()
    {
        // Two spans, first span loaded: R_A = 7wL/16 = 47.25 kN, M_B = wL²/16 = 40.5 kN·m (engineersedge.com citing
        // Lindeburg, Civil Engineering Reference Manual 15th ed.); R_B = 5wL/8 = 67.5, R_C = −wL/16 = −6.75 by statics.
        string beam = TwoSpans.Replace("BC,udl,18\n", "");
        string claims = Reviewing.Claims(("AB", "A", 0), ("AB", "B", 40.5), ("BC", "B", -40.5), ("BC", "C", 0));
        var ok = Reviewing.Of(beam + claims + "\n\n[reactions]\njoint,Ry\nA,47.25\nB,67.5\nC,-6.75");
        ok.Flags(FlagKind.Reaction).ShouldBeEmpty();
        ok.Verdict.ShouldBe(Verdict.Concur);
        var bad = Reviewing.Of(beam + claims + "\n\n[reactions]\njoint,Ry\nA,47.25\nB,67.5\nC,6.75");
        bad.Flags(FlagKind.Reaction).ShouldContain(f => f.Where == "vertical equilibrium" && Math.Abs(f.Value!.Value - 13.5e3) < 1e-6);
        bad.Flags(FlagKind.Reaction).ShouldContain(f => f.Where == "joint C Ry");
    }

    [Fact]
    public void Symmetry_FlagsMomentsThatAreNotMirrorImages()
    {
        // Three equal spans, all loaded: M_B = M_C = wL²/10 = 64.8 (Hicks Table 2.1). Structure and load are symmetric.
        string three = Reviewing.KnM + """
            [supports]
            support,restraint
            A,pinned
            B,roller
            C,roller
            D,pinned

            [spans]
            span,length,I
            AB,6,1
            BC,6,1
            CD,6,1

            [loads]
            on,kind,w
            AB,udl,18
            BC,udl,18
            CD,udl,18

            """;
        var good = Reviewing.Of(three + Reviewing.Claims(("AB", "B", 64.8), ("BC", "B", -64.8), ("BC", "C", 64.8), ("CD", "C", -64.8)));
        good.Flags(FlagKind.Symmetry).ShouldBeEmpty();
        var bad = Reviewing.Of(three + Reviewing.Claims(("AB", "B", 64.8), ("BC", "B", -64.8), ("BC", "C", 70.8), ("CD", "C", -70.8)));
        var f = bad.Flags(FlagKind.Symmetry);
        f.ShouldContain(x => x.Where == "AB at B / CD at C" && Math.Abs(Math.Abs(x.Value!.Value) - 6e3) < 1e-6);
    }
}
