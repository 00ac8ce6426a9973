using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Review;

/// <summary>
/// The comparison of docs/REVIEW-JSON.md, through <see cref="ReviewEngine.Review"/> alone: the tolerance bands at their
/// boundaries (the relative band, the absolute floor, the minor band), the verdict rule, and the comment ids. The
/// structures are single spans whose end moments are handbook formulas, in N and m so that one moment unit is one N·m
/// and a claim reaches the comparison exactly as written.
/// </summary>
public class ComparatorTests
{
    private const double W = 18, L = 6; // N/m, m

    private const string Units = "[info]\nkey,value\nforce unit,N\nlength unit,m\n\n";

    /// <summary>
    /// A beam on supports A, B, C ... (<paramref name="restraints"/>, in order) with spans of L = 6 m (E = 200 GPa,
    /// I = 250e6 mm⁴) named <paramref name="spans"/>, each under a UDL of w = 18 N/m in case <paramref name="caseId"/>.
    /// </summary>
    private static string Beam(string caseId, string[] restraints, params string[] spans)
    {
        var text = new StringBuilder(Units).Append("[supports]\nsupport,restraint\n");
        for (int i = 0; i < restraints.Length; i++) text.Append((char)('A' + i)).Append(',').Append(restraints[i]).Append('\n');
        text.Append("\n[spans]\nspan,length,E [GPa],I [mm^4]\n");
        foreach (var span in spans) text.Append(span).Append(",6,200,250e6\n");
        text.Append("\n[loads]\ncase,on,kind,w\n");
        foreach (var span in spans) text.Append(caseId).Append(',').Append(span).Append(",udl,18\n");
        return text.ToString();
    }

    /// <summary>A fixed at A, on a roller at B, UDL w over L: M_AB = −wL²/8, M_BA = 0 (Hicks, Civil Engineering Formulas, Fig. 2.2 case 10; docs/REFERENCE-CHECKS.md group 2).</summary>
    private static readonly string Propped = Beam("1", ["fixed", "roller"], "AB");

    /// <summary>Both ends fixed, UDL w over L: M_AB = −wL²/12, M_BA = +wL²/12 (docs/REFERENCE-CHECKS.md case 1.1; Hicks Fig. 2.2 case 5).</summary>
    private static readonly string Clamped = Beam("1", ["fixed", "fixed"], "AB");

    private static readonly ReviewOptions Defaults = new(Date: new DateOnly(2026, 12, 1));

    private static string Claims(params (string Member, string At, double Moment)[] rows) => Reviewing.Claims(rows);

    private static ReviewResult Review(string csv, ReviewOptions? options = null) => Reviewing.Of(csv, options ?? Defaults);

    private static EndStatus[] Statuses(ReviewResult r) => [.. r.Cases.SelectMany(c => c.EndMoments).Select(e => e.Status).Order()];

    /// <summary>The recomputed moment at A of the propped cantilever and the case's peak, checked against the handbook first.</summary>
    private static (double MA, double Peak) ProppedAnalysis()
    {
        var (_, a) = Reviewing.ReadAndSolve(Propped + Claims(("AB", "A", -81), ("AB", "B", 0)));
        var c = a.Cases.ShouldHaveSingleItem();
        double mA = c.EndMoment("AB", MemberEnd.Start);
        Near.Equal(mA, -W * L * L / 8, relative: 1e-9, absolute: 1e-9, what: "M_AB = −wL²/8");
        Near.Equal(c.PeakMoment, W * L * L / 8, relative: 1e-9, absolute: 1e-9, what: "peak = wL²/8 (the span maximum 9wL²/128 is smaller)");
        return (mA, c.PeakMoment);
    }

    // ---- the bands, in round numbers ------------------------------------------------------------------------------

    [Theory]
    // Peak wL²/8 = 81 N·m. Defaults (docs/REVIEW-JSON.md): agree band max(0.1 N·m, 1 % × 81) = 0.81 N·m,
    // minor band max(0.1 N·m, 5 % × 81) = 4.05 N·m, both ways.
    [InlineData(-81.0, EndStatus.Agree)]
    [InlineData(-80.2, EndStatus.Agree)]      // 0.80 inside 0.81
    [InlineData(-81.8, EndStatus.Agree)]      // −0.80
    [InlineData(-80.18, EndStatus.Minor)]     // 0.82 beyond 0.81
    [InlineData(-81.82, EndStatus.Minor)]     // −0.82
    [InlineData(-77.0, EndStatus.Minor)]      // 4.00 inside 4.05
    [InlineData(-76.9, EndStatus.Discrepant)] // 4.10 beyond 4.05
    [InlineData(-85.1, EndStatus.Discrepant)] // −4.10
    [InlineData(81.0, EndStatus.Discrepant)]  // the sign lost
    public void RelativeBands_OfThePeakMoment_GradeTheClaim(double claimA, EndStatus expected)
    {
        var r = Review(Propped + Claims(("AB", "A", claimA), ("AB", "B", 0)));
        var ends = r.Cases.ShouldHaveSingleItem().EndMoments;
        ends.Count.ShouldBe(2);
        // The claim at B (0, and 0 recomputed) agrees; the claim at A takes the expected status.
        Statuses(r).ShouldBe(expected == EndStatus.Agree ? [EndStatus.Agree, EndStatus.Agree] : new[] { EndStatus.Agree, expected }.Order().ToArray());
    }

    [Theory]
    // The same beam in kN and m with w = 0.018 kN/m: peak wL²/8 = 0.081 kN·m, so 1 % is 0.00081 kN·m and 5 % 0.00405;
    // the absolute floor of 0.1 (in the submission's moment unit, kN·m) governs both bands.
    [InlineData(-0.081, EndStatus.Agree)]
    [InlineData(0.009, EndStatus.Agree)]       // 0.090 inside the 0.1 floor (the sign lost, but the floor allows it)
    [InlineData(-0.171, EndStatus.Agree)]      // −0.090
    [InlineData(0.031, EndStatus.Discrepant)]  // 0.112: beyond the floor, and the minor band is the same floor
    [InlineData(-0.193, EndStatus.Discrepant)] // −0.112
    public void AbsoluteFloor_InTheSubmissionsMomentUnit_GovernsSmallMoments(double claimA, EndStatus expected)
    {
        string csv = Propped.Replace("force unit,N", "force unit,kN", StringComparison.Ordinal).Replace("1,AB,udl,18", "1,AB,udl,0.018", StringComparison.Ordinal);
        var r = Review(csv + Claims(("AB", "A", claimA), ("AB", "B", 0)));
        Statuses(r).ShouldBe(expected == EndStatus.Agree ? [EndStatus.Agree, EndStatus.Agree] : new[] { EndStatus.Agree, expected }.Order().ToArray());
    }

    // ---- the bands, at the last representable claim -------------------------------------------------------------

    /// <summary>
    /// The largest claim above <paramref name="recomputed"/> whose difference, as the comparison computes it, is within
    /// <paramref name="band"/>; the next representable number is beyond it.
    /// </summary>
    private static double LastInside(double recomputed, double band)
    {
        double c = recomputed + band;
        while (Math.Abs(c - recomputed) > band) c = Math.BitDecrement(c);
        while (Math.Abs(Math.BitIncrement(c) - recomputed) <= band) c = Math.BitIncrement(c);
        return c;
    }

    private EndStatus StatusAtA(double claimA, ReviewOptions? options = null)
    {
        var r = Review(Propped + Claims(("AB", "A", claimA), ("AB", "B", 0)), options);
        var statuses = Statuses(r);
        statuses.Count(s => s == EndStatus.Agree).ShouldBeGreaterThanOrEqualTo(1); // the claim at B
        return statuses.Length == 2 && statuses.All(s => s == EndStatus.Agree) ? EndStatus.Agree : statuses.Single(s => s != EndStatus.Agree);
    }

    [Fact]
    public void ClaimExactlyAtTheAgreeBand_Agrees_AndTheNextNumberIsMinor()
    {
        var (mA, peak) = ProppedAnalysis();
        double agree = Math.Max(0.1, 0.01 * peak); // docs/REVIEW-JSON.md: max(absolute × 1 moment unit, relative × peak)
        agree.ShouldBe(0.81, 1e-9);
        double atBand = LastInside(mA, agree);
        (atBand - mA).ShouldBe(agree, 2e-14); // within one spacing of doubles near 81 of the band
        StatusAtA(atBand).ShouldBe(EndStatus.Agree);
        StatusAtA(Math.BitIncrement(atBand)).ShouldBe(EndStatus.Minor);
        // And on the other side of the recomputed value.
        double below = -LastInside(-mA, agree);
        StatusAtA(below).ShouldBe(EndStatus.Agree);
        StatusAtA(Math.BitDecrement(below)).ShouldBe(EndStatus.Minor);
    }

    [Fact]
    public void ClaimExactlyAtTheMinorBand_IsMinor_AndTheNextNumberIsDiscrepant()
    {
        var (mA, peak) = ProppedAnalysis();
        double minor = Math.Max(0.1, 0.05 * peak);
        minor.ShouldBe(4.05, 1e-9);
        double atBand = LastInside(mA, minor);
        StatusAtA(atBand).ShouldBe(EndStatus.Minor);
        StatusAtA(Math.BitIncrement(atBand)).ShouldBe(EndStatus.Discrepant);
    }

    [Fact]
    public void AbsoluteFloorAboveTheRelativeBand_SetsTheAgreeBand_AndTheMinorBandStaysRelative()
    {
        var (mA, peak) = ProppedAnalysis();
        // A floor of 2 N·m against 1 % × 81 = 0.81: the floor governs agreement; 5 % × 81 = 4.05 still governs "minor".
        var options = Defaults with { AbsoluteTolerance = 2 };
        double atFloor = LastInside(mA, 2);
        (atFloor - mA).ShouldBe(2.0); // exactly at the band (2 is a multiple of the spacing of doubles near 81): the boundary agrees
        StatusAtA(atFloor, options).ShouldBe(EndStatus.Agree);
        StatusAtA(Math.BitIncrement(atFloor), options).ShouldBe(EndStatus.Minor);
        double atMinor = LastInside(mA, 0.05 * peak);
        StatusAtA(atMinor, options).ShouldBe(EndStatus.Minor);
        StatusAtA(Math.BitIncrement(atMinor), options).ShouldBe(EndStatus.Discrepant);
        // Without the floor the same claim just beyond 0.81 is minor: the floor, not the claim, made it agree.
        StatusAtA(LastInside(mA, 1.5)).ShouldBe(EndStatus.Minor);
    }

    [Fact]
    public void AbsoluteFloorAboveBothRelativeBands_LeavesNoMinorBand()
    {
        var (mA, _) = ProppedAnalysis();
        // A floor of 5 N·m exceeds 4.05 (5 % of 81): both bands are the floor, so beyond it a claim is discrepant at once.
        var options = Defaults with { AbsoluteTolerance = 5 };
        double atFloor = LastInside(mA, 5);
        (atFloor - mA).ShouldBe(5.0);
        StatusAtA(atFloor, options).ShouldBe(EndStatus.Agree);
        StatusAtA(Math.BitIncrement(atFloor), options).ShouldBe(EndStatus.Discrepant);
    }

    [Fact]
    public void UnclaimedEnd_IsMissing_OnlyWhenItsMomentIsBeyondTheAgreeBand()
    {
        // M_BA = 0 at the roller: leaving it out is no finding. M_AB = −81 N·m: leaving it out is "missing".
        Statuses(Review(Propped + Claims(("AB", "A", -81)))).ShouldBe([EndStatus.Agree]);
        Statuses(Review(Propped + Claims(("AB", "B", 0)))).ShouldBe([EndStatus.Agree, EndStatus.Missing]);
    }

    // ---- the verdict ----------------------------------------------------------------------------------------------

    [Theory]
    // Clamped beam: M_AB = −wL²/12 = −54, M_BA = +54 N·m; agree band 0.54, minor band 2.7 (1 % and 5 % of 54).
    [InlineData("every end agrees", "AB,A,-54\nAB,B,54", Verdict.Concur)]
    [InlineData("an end inside the agree band", "AB,A,-53.5\nAB,B,54", Verdict.Concur)]
    [InlineData("a minor end", "AB,A,-52\nAB,B,54", Verdict.ConcurWithComments)]
    [InlineData("a missing end", "AB,A,-54", Verdict.ConcurWithComments)]
    [InlineData("an unmatched claim", "AB,A,-54\nAB,B,54\nXY,X,3", Verdict.ConcurWithComments)]
    [InlineData("a discrepant end", "AB,A,-50\nAB,B,54", Verdict.Revise)]
    [InlineData("a discrepant end beside a minor one", "AB,A,-50\nAB,B,52", Verdict.Revise)]
    public void Verdict_FollowsTheStatusesOfTheEnds(string what, string rows, Verdict expected)
    {
        var r = Review(Clamped + "[end-moments]\nmember,at,moment\n" + rows + "\n");
        r.Verdict.ShouldBe(expected, what);
    }

    [Fact]
    public void Verdict_AnInfoFindingAlone_StillConcurs()
    {
        // Without E the stiffness is relative, so claimed displacements cannot be checked: an info finding, not a comment.
        string relative = Clamped.Replace("span,length,E [GPa],I [mm^4]\nAB,6,200,250e6", "span,length,I\nAB,6,1", StringComparison.Ordinal);
        var r = Review(relative + Claims(("AB", "A", -54), ("AB", "B", 54)) + "\n\n[displacements]\njoint,uy [mm]\nA,0\n");
        Statuses(r).ShouldAllBe(s => s == EndStatus.Agree);
        r.Comments.ShouldBeEmpty();
        r.Verdict.ShouldBe(Verdict.Concur);
    }

    [Fact]
    public void Verdict_ADiscrepantReaction_RevisesEvenWhenEveryEndAgrees()
    {
        // Vertical reaction at A of the clamped beam: wL/2 = 54 N by statics (symmetry); 70 N is 16 N out.
        var r = Review(Clamped + Claims(("AB", "A", -54), ("AB", "B", 54)) + "\n\n[reactions]\njoint,Ry\nA,70\n");
        Statuses(r).ShouldAllBe(s => s == EndStatus.Agree);
        r.Verdict.ShouldBe(Verdict.Revise);
    }

    // ---- comment ids -------------------------------------------------------------------------------------------------

    /// <summary>Two equal spans, UDL on both, case DL: M_B = wL²/8 = 81 N·m (Hicks, Civil Engineering Formulas, Table 2.1).</summary>
    private static string TwoSpans(string caseId, string span1 = "AB", string span2 = "BC") => Beam(caseId, ["pinned", "roller", "roller"], span1, span2);

    private static string CaseClaims(string caseId, params (string Member, string At, double Moment)[] rows) =>
        "[end-moments]\ncase,member,at,moment\n" +
        string.Join("\n", rows.Select(r => string.Create(CultureInfo.InvariantCulture, $"{caseId},{r.Member},{r.At},{r.Moment:R}"))) + "\n";

    /// <summary>The form of docs/REVIEW-JSON.md: PREFIX-CASE-PLACE[-N], letters, digits, + and . kept, anything else one _.</summary>
    private static readonly Regex IdForm = new(@"^(EM|EX|EQ|RL|SW|RX|DX|SY|MD|ST|CP|SO|KL|FX|FEM|CO|SE|SC|ES|UN|LD|HG|SM|CS)(-[A-Za-z0-9+._]{1,24})+$");

    private static string[] Ids(ReviewResult r) => [.. r.Comments.Select(c => c.Id)];

    [Fact]
    public void CommentIds_NameTheCheckTheCaseAndThePlace()
    {
        // B unbalanced by 81 − 75 = 6 N·m (beyond the minor band 4.05): joint equilibrium at B, and BC's end moment at B.
        var r = Review(TwoSpans("DL") + CaseClaims("DL", ("AB", "A", 0), ("AB", "B", 81), ("BC", "B", -75), ("BC", "C", 0)));
        var ids = Ids(r);
        // One wrong figure (BC at B; AB at B agrees): its own difference and the unbalance it causes are one comment
        // about that figure, with the joint-equilibrium finding beneath it.
        ids.ShouldContain("EM-DL-BC-B");
        r.Comments.Single(c => c.Id == "EM-DL-BC-B").Symptoms.ShouldContain(y => y.Kind == "joint-equilibrium" && y.Place.Words == "joint B");
        ids.ShouldNotContain("EM-DL-AB"); // AB agrees at both ends
        ids.ShouldBeUnique();
        ids.ShouldAllBe(id => IdForm.IsMatch(id));
    }

    [Fact]
    public void CommentIds_AreStable_WhateverTheValuesAndTheOrderOfTheRows()
    {
        var first = Ids(Review(TwoSpans("DL") + CaseClaims("DL", ("AB", "A", 0), ("AB", "B", 81), ("BC", "B", -75), ("BC", "C", 0))));
        var again = Ids(Review(TwoSpans("DL") + CaseClaims("DL", ("AB", "A", 0), ("AB", "B", 81), ("BC", "B", -75), ("BC", "C", 0))));
        var reordered = Ids(Review(TwoSpans("DL") + CaseClaims("DL", ("BC", "C", 0), ("BC", "B", -75), ("AB", "B", 81), ("AB", "A", 0))));
        var otherValue = Ids(Review(TwoSpans("DL") + CaseClaims("DL", ("AB", "A", 0), ("AB", "B", 81), ("BC", "B", -70), ("BC", "C", 0))));
        again.ShouldBe(first);
        reordered.ShouldBe(first, ignoreOrder: true);
        // Another wrong value at the same end is the same finding (member BC, joint B): the same ids. (Which claim the
        // compatibility fit blames may change with the values, so its comment is left out of this comparison.)
        static string[] SamePlace(string[] ids) => [.. ids.Where(id => id.StartsWith("EM-", StringComparison.Ordinal) || id.StartsWith("EQ-", StringComparison.Ordinal))];
        SamePlace(otherValue).ShouldBe(SamePlace(first), ignoreOrder: true);
        SamePlace(first).ShouldBe(["EM-DL-BC-B"], ignoreOrder: true);
    }

    [Fact]
    public void CommentIds_ReplaceOtherCharactersOfCaseAndPlace()
    {
        // Case "G + W": spaces become _, + is kept.
        var r = Review(TwoSpans("G + W") + CaseClaims("G + W", ("AB", "A", 0), ("AB", "B", 81), ("BC", "B", -75), ("BC", "C", 0)));
        Ids(r).ShouldContain("EM-G_+_W-BC-B");
    }

    [Fact]
    public void CommentIds_ThatWouldCollide_GetNumberedSuffixes()
    {
        // Spans "S 1" and "S/1" both become S_1 in an id: the second comment is S_1-2. Both spans leave out their
        // moment at B (wL²/8 = 81 kN·m, Hicks Table 2.1), so each member has a comment of its own.
        var r = Review(TwoSpans("1", "S 1", "S/1") + CaseClaims("1", ("S 1", "A", 0), ("S/1", "C", 0)));
        var em = Ids(r).Where(id => id.StartsWith("EM-", StringComparison.Ordinal)).ToList();
        em.ShouldBe(["EM-1-S_1", "EM-1-S_1-2"], ignoreOrder: true);
        Ids(r).ShouldBeUnique();
        Ids(r).ShouldAllBe(id => IdForm.IsMatch(id));
    }
}
