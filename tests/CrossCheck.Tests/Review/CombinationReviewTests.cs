using System.Globalization;
using CrossCheck.Memo;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Review;

/// <summary>
/// The review of combinations, envelopes, span moments and shears, from submissions read as CSV: the four checks of the
/// claims on their own, statuses against the analysis, the safe and unsafe sides of an envelope, the verdict, the comments
/// and the second-order flag. Two equal spans of 6 m under G = 18 and Q = 12 kN/m: support moment wL²/8 and end reaction
/// 3wL/8 (docs/REFERENCE-CHECKS.md 3.1, Hicks Table 2.1), largest span moment 9wL²/128 at 3L/8 (statics).
/// </summary>
public class CombinationReviewTests
{
    private const string Beam = Reviewing.KnM + "\n" + CombinationBeam.Tables + """
        [combinations]
        combination,case,factor,pattern
        ULS,G,1.35,
        ULS,Q,1.5,
        ENV,G,1.35,
        ENV,Q,1.5,spans

        """;

    // wL²/8 at B: G 81, Q 54, ULS 1.35 × 81 + 1.5 × 54 = 190.35 (clockwise: + on AB at B, − on BC at B).
    private const string EndMoments = """
        [end-moments]
        case,member,at,moment
        G,AB,B,81.0
        G,BC,B,-81.0
        Q,AB,B,54.0
        Q,BC,B,-54.0
        ULS,AB,B,{0}
        ULS,BC,B,-190.35

        """;

    private static ReviewResult Review(string extra, string uls = "190.35") =>
        Reviewing.Of(Beam + string.Format(CultureInfo.InvariantCulture, EndMoments, uls) + extra);

    private static CaseReview Case(ReviewResult r, string id) => r.Cases.Single(c => c.Case == id);

    [Fact]
    public void CorrectClaims_Concur()
    {
        // Span maximum 9wL²/128 at 3L/8 = 2.25 m; shears 3wL/8 = 40.5 kN (G) at A and −5wL/8 at B.
        var r = Review("""
            [span-moments]
            case,member,moment,x
            G,AB,45.56,2.25
            ULS,AB,107.07,2.25

            [shears]
            case,member,at,V
            G,AB,A,40.5
            G,AB,B,-67.5
            """);
        r.Verdict.ShouldBe(Verdict.Concur, string.Join("\n", r.Comments.Select(c => $"{c.Id}: {c.Text}")));
        Case(r, "ULS").Combination!.Name.ShouldBe("ULS");
        Case(r, "ULS").SpanMoments.Single().Status.ShouldBe(EndStatus.Agree);
        Case(r, "G").Shears.ShouldAllBe(s => s.Status == EndStatus.Agree);
    }

    [Fact]
    public void Superposition_FlagsACombinationClaimThatIsNotTheFactoredSum()
    {
        // 1.35 × 81.0 + 1.5 × 54.0 = 190.35; the claim 205.0 is out by 14.65.
        var r = Review("", uls: "205.0");
        var flag = r.Flags(FlagKind.Superposition).ShouldHaveSingleItem();
        flag.Severity.ShouldBe(Severity.Major);
        flag.Value!.Value.ShouldBe(14.65e3, 1);
        flag.Message.ShouldContain("1.35 × 81.0 + 1.5 × 54.0 = 190.35 kN·m");
        // The printed rounding: 190.4 for 190.35 is within half a digit × Σ|factor| of the agree band.
        Review("", uls: "190.4").Flags(FlagKind.Superposition).ShouldBeEmpty();
    }

    [Fact]
    public void SpanAndShearStatics_FlagClaimsThatDoNotFollowFromTheClaimedEndMoments()
    {
        var r = Review("""
            [span-moments]
            case,member,moment
            G,AB,81.0

            [shears]
            case,member,at,V
            G,AB,A,54.0
            """);
        var span = r.Flags(FlagKind.SpanStatics).ShouldHaveSingleItem();
        span.Value!.Value.ShouldBe((81 - 45.5625) * 1e3, 1);
        span.Message.ShouldContain("45.56 kN·m");
        var shear = r.Flags(FlagKind.ShearStatics).ShouldHaveSingleItem();
        shear.Value!.Value.ShouldBe(13.5e3, 1);
        // The diagnosis names both mistakes: the free moment wL²/8 and the simple-beam shear wL/2.
        Case(r, "G").SectionCauses.Select(c => c.Kind).ShouldBe([CauseCode.FreeMoment, CauseCode.ShearWithoutMoment]);
        r.Comments.Select(c => c.Id).ShouldContain("FM-G");
        r.Comments.Select(c => c.Id).ShouldContain("VM-G");
        r.Verdict.ShouldBe(Verdict.Revise);
    }

    [Fact]
    public void SpanLocation_IsANoteOnly()
    {
        var r = Review("""
            [span-moments]
            case,member,moment,x
            G,AB,45.56,3.0
            """);
        var note = r.AllFlags.Single(f => f.Kind == FlagKind.SpanMoment);
        note.Severity.ShouldBe(Severity.Info);
        note.Message.ShouldContain("at 2.25 m from its start, not at 3 m");
        r.Verdict.ShouldBe(Verdict.Concur);
    }

    [Fact]
    public void Envelope_UnsafeSideIsAFlag_SafeSideANote()
    {
        // Exact: the maximum hogging at B with both spans loaded is 42.3 × 36/8 = 190.35; the least, neither loaded, 24.3 × 4.5 = 109.35.
        var safe = Review("""
            [envelopes]
            combination,member,at,max,min
            ENV,AB,B,200.0,109.35
            """);
        var bound = Case(safe, "ENV").Envelope.Single(e => e.Bound == "max");
        bound.Side.ShouldBe(EnvelopeSide.Safe);
        bound.Governing.ShouldBe(["AB", "BC"]);
        safe.AllFlags.Single(f => f.Kind == FlagKind.Envelope).Severity.ShouldBe(Severity.Info);
        safe.Verdict.ShouldBe(Verdict.Concur);

        var unsafeReview = Review("""
            [envelopes]
            combination,member,at,max,min
            ENV,AB,B,190.35,150.0
            """);
        var low = Case(unsafeReview, "ENV").Envelope.Single(e => e.Bound == "min");
        low.Side.ShouldBe(EnvelopeSide.Unsafe);
        low.Recomputed!.Value.ShouldBe(109.35e3, 1);
        low.Governing.ShouldBeEmpty();
        unsafeReview.Flags(FlagKind.Envelope).ShouldContain(f => f.Severity == Severity.Major && f.Message.Contains("no patterned member loaded", StringComparison.Ordinal));
        unsafeReview.Verdict.ShouldBe(Verdict.Revise);
        unsafeReview.Comments.ShouldContain(c => c.Id == "EN-ENV-AB");
    }

    [Fact]
    public void Envelope_BelowTheAuthorsOwnArrangement_IsFlaggedWithoutTheAnalysis()
    {
        // The author's case claims give 1.35 × 81.0 + 1.5 × 54.0 = 190.35 at B with every span loaded; a maximum of 150 lies below it.
        var r = Review("""
            [envelopes]
            combination,member,at,max
            ENV,AB,B,150.0
            """);
        r.Flags(FlagKind.Envelope).ShouldContain(f => f.Message.Contains("author's own figures", StringComparison.Ordinal) && f.Message.Contains("190.35", StringComparison.Ordinal));
    }

    [Fact]
    public void PatternIgnored_IsDiagnosedAndCommentedOnce()
    {
        // Every span loaded: at B 190.35 both ways, span maximum 9/128 × 42.3 × 36 = 107.07.
        var r = Review("""
            [envelopes]
            combination,member,at,max,min
            ENV,AB,B,190.35,190.35
            ENV,AB,span,107.07,
            ENV,BC,span,107.07,
            """);
        var cause = Case(r, "ENV").SectionCauses.First();
        cause.Kind.ShouldBe(CauseCode.PatternIgnored);
        cause.Reproduces.ShouldBeTrue();
        var comment = r.Comments.Single(c => c.Cause == CauseCode.PatternIgnored);
        comment.Id.ShouldBe("PI-ENV");
        comment.Symptoms.Count.ShouldBeGreaterThanOrEqualTo(3);
        r.Comments.Count(c => c.Case == "ENV").ShouldBe(1, string.Join("\n", r.Comments.Select(c => c.Id)));
    }

    [Fact]
    public void Json_OfACombinationReview_ConformsToTheSchema()
    {
        var r = Review("""
            [span-moments]
            case,member,moment,x
            ULS,AB,95.0,3

            [shears]
            case,member,at,V
            ULS,AB,A,126.9

            [envelopes]
            combination,member,at,max,min
            ENV,AB,B,190.35,190.35
            ENV,AB,span,107.07,
            ENV,XY,span,1,
            """, uls: "205.0");
        string json = ReviewJson.Write(r).ShouldMatchReviewSchema();
        json.ShouldContain("\"combination\": {");
        json.ShouldContain("\"governing\": [");
    }

    [Fact]
    public void CombinationWithOnlySpanClaims_HasNoMissingEnds()
    {
        var r = Reviewing.Of(Beam + "[span-moments]\ncase,member,moment\nULS,AB,107.07\n");
        r.Cases.SelectMany(c => c.EndMoments).ShouldBeEmpty();
        r.Verdict.ShouldBe(Verdict.Concur);
    }

    [Theory]
    // Fixed-base portal, h = 4 m, L = 6 m, columns I = 2.5e-4 m⁴, E = 200 GPa, beam 10⁴ times stiffer: P_cr = π²EI/h² = 30 840 kN per
    // column (Euler, effective length h; docs/REFERENCE-CHECKS.md group 10).
    [InlineData(500, null)]          // α_cr ≈ 61.7: no flag
    [InlineData(5000, Severity.Minor)] // α_cr ≈ 6.2: amplify by 1/(1 − 1/α_cr)
    [InlineData(15000, Severity.Major)] // α_cr ≈ 2.06: below 3
    public void SecondOrder_FlagsACriticalLoadFactorBelowTen(double p, Severity? expected)
    {
        string load = p.ToString(CultureInfo.InvariantCulture);
        var r = Reviewing.Of(Portal($"1,B,force,{load},down\n1,C,force,{load},down"));
        var c = r.Cases[0];
        double euler = Math.PI * Math.PI * 200e6 * 2.5e-4 / 16 / p;
        c.AlphaCr!.Value.ShouldBe(euler, euler * 2e-3);
        var flag = c.Flags.SingleOrDefault(f => f.Kind == FlagKind.SecondOrder);
        if (expected is null) flag.ShouldBeNull();
        else
        {
            flag!.Severity.ShouldBe(expected.Value);
            flag.Message.ShouldContain("not a stability check");
        }
    }

    [Fact]
    public void SecondOrder_NotGivenForAHorizontalLoadAlone()
    {
        // α_cr is the factor on the design loading that brings elastic instability (EN 1993-1-1 clause 5.2.1(3)); a horizontal
        // load alone gives the columns only the small axial forces of the overturning couple (at most Hh/L; statics), so no factor is given. The
        // same portal with its vertical loads added gets one.
        var alone = Reviewing.Of(Portal("1,B,force,30,right"));
        alone.Cases[0].AlphaCr.ShouldBeNull();
        alone.AllFlags.ShouldNotContain(f => f.Kind == FlagKind.SecondOrder);
        var both = Reviewing.Of(Portal("1,B,force,30,right\n1,B,force,500,down\n1,C,force,500,down"));
        both.Cases[0].AlphaCr.ShouldNotBeNull();
    }

    private static string Portal(string loads) => Reviewing.KnM + $"""

            {SampleText.PortalJoints}

            [members]
            member,start,end,E [GPa],I [mm^4]
            AB,A,B,200,250e6
            BC,B,C,200,2.5e12
            DC,D,C,200,250e6

            [loads]
            case,on,kind,P,dir
            {loads}

            [end-moments]
            member,at,moment
            AB,A,0
            """;
}
