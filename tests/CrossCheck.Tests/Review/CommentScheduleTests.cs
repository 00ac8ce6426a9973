using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.Tests.Review.Diagnosis;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Review;

/// <summary>
/// The schedule of comments is what the designer reads: one comment per mistake, in the author's own figures, with the
/// findings it stands for listed beneath it, and no explanation that the diagnosis has not shown to fit.
/// </summary>
public class CommentScheduleTests
{
    private const MemberEnd S = MemberEnd.Start, En = MemberEnd.End;

    // Fixed-base portal 5.3 of REFERENCE-CHECKS.md (k = 0.5, H = 30 kN at B): 37.5 kN·m at the feet and 22.5 kN·m at the
    // eaves (Kleinlogel, Rigid Frame Formulas, from memory; re-derived by slope-deflection there). Clockwise member ends.
    private static (string, MemberEnd, double)[] Portal53(double bcAtC = 22.5) =>
        [("AB", S, -37.5), ("AB", En, -22.5), ("BC", S, 22.5), ("BC", En, bcAtC), ("DC", En, -22.5), ("DC", S, -37.5)];

    [Fact]
    public void OneWrongFigureInAPortal_IsOneComment_WithItsSymptomsBeneath()
    {
        var review = DiagnosisTests.Review(ReferenceModels.Portal(0.5, Restraint.Fixed).Force("B", 30, LoadDirection.Right), Portal53(bcAtC: 29.5));
        var major = review.Comments.Where(c => c.Severity == Severity.Major).ToList();
        var comment = major.ShouldHaveSingleItem(string.Join("\n", review.Comments.Select(c => $"{c.Id}: {c.Text}")));
        comment.Id.ShouldBe("EM-1-BC-C");
        comment.Symptoms.Select(y => y.Kind).ShouldContain("end-moment");
        comment.Symptoms.Select(y => y.Kind).ShouldContain("joint-equilibrium");
        // The other five moments agree: nothing may tell the designer that sidesway was ignored.
        review.Comments.ShouldAllBe(c => !c.Text.Contains("sidesway", StringComparison.OrdinalIgnoreCase) && !c.Text.Contains("I/L", StringComparison.Ordinal));
        comment.Text.ShouldContain("29.5 kN·m is claimed");
    }

    [Fact]
    public void CorrectZeroAtAPin_IsNeverFlagged()
    {
        // Two equal spans under UDL (case 3.1; Hicks, Civil Engineering Formulas, Table 2.1): 0 at the end pins and wL²/8 =
        // 81 kN·m at B; the author writes 91.0 at B in span 1 only.
        var review = DiagnosisTests.Review(ReferenceModels.EqualSpans(2).Udl("S1", 18).Udl("S2", 18),
            [("S1", S, 0), ("S1", En, 91.0), ("S2", S, -81.0), ("S2", En, 0)]);
        review.AllFlags.Where(f => f.Severity != Severity.Info)
            .ShouldAllBe(f => f.Ends.All(e => !(e.Member == "S1" && e.End == S) && !(e.Member == "S2" && e.End == En)));
        review.Comments.Count(c => c.Severity == Severity.Major).ShouldBe(1);
    }

    [Fact]
    public void SaggingConvention_CommentsQuoteTheClaimsAsWritten()
    {
        // The footbridge demo with its moments written as internal (sagging-positive) moments: the hogging moment over C,
        // 114.7 kN·m, is written −114.7 at both sides, and the miscopied 141.7 as −141.7.
        var text = File.ReadAllText(CliRunner.Demo("footbridge.csv"))
            .Replace("sign convention,clockwise", "sign convention,sagging", StringComparison.Ordinal)
            .Replace("DL,AB,B,114.7", "DL,AB,B,-114.7", StringComparison.Ordinal)
            .Replace("DL,BC,C,141.7", "DL,BC,C,-141.7", StringComparison.Ordinal)
            .Replace("LL,AB,B,69.1", "LL,AB,B,-69.1", StringComparison.Ordinal)
            .Replace("LL,BC,C,69.1", "LL,BC,C,-69.1", StringComparison.Ordinal);
        var review = Reviewing.Of(text);
        var slip = review.Comments.First(c => c.Cause == CauseCode.CopyingSlip);
        slip.Text.ShouldContain("written -141.7");
        slip.Text.ShouldContain("-114.73 kN·m");
        review.Comments.ShouldAllBe(c => !c.Text.Contains("clockwise", StringComparison.Ordinal));
        var fem = review.Comments.First(c => c.Cause == CauseCode.FixedEndMoment);
        fem.Text.ShouldContain("(claimed -69.1)");
        fem.Text.ShouldContain("sagging positive");
    }

    [Fact]
    public void NoConventionStated_SaysItWasAssumed()
    {
        var text = File.ReadAllText(CliRunner.Demo("footbridge.csv")).Replace("sign convention,clockwise\n", "", StringComparison.Ordinal);
        var review = Reviewing.Of(text);
        review.Submission.Info.SignConventionStated.ShouldBeFalse();
        review.Comments.First(c => c.Cause == CauseCode.FixedEndMoment).Text.ShouldContain("assumed as the submission states no convention");
    }

    [Fact]
    public void Footbridge_OneMajorCommentPerMistake()
    {
        var review = Reviewing.Of(File.ReadAllText(CliRunner.Demo("footbridge.csv")));
        review.Comments.Select(c => c.Id).ShouldBe(["CS-DL-BC-C", "FEM-LL-BC"]);
        var fem = review.Comments[1];
        fem.Symptoms.Count(y => y.Kind == "end-moment").ShouldBe(4);
        // Pab²/L² and Pa²b/L² for P = 40 kN at a = 4 m on 10 m: 57.6 and 38.4 kN·m (Hicks, Fig. 2.2 case 6).
        fem.Text.ShouldContain("-57.6 kN·m at B and 38.4 kN·m at C");
    }
}
