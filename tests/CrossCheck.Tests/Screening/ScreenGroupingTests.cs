using CrossCheck.Analysis;
using CrossCheck.Import;
using CrossCheck.Review;
using CrossCheck.Screening;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Screening;

/// <summary>Submissions are grouped by their most likely cause when the diagnosis found one, otherwise by their main finding.</summary>
public class ScreenGroupingTests
{
    private static ReviewResult Demo(string name, bool diagnose = false)
    {
        var s = SubmissionReader.Read(CliRunner.Demo(name)).Submission!;
        return ReviewEngine.Review(s, new FrameSolver().Solve(s.Model, s.Cases), new ReviewOptions(Date: new DateOnly(2026, 12, 1), Diagnose: diagnose));
    }

    [Fact]
    public void WithTheDiagnosis_TheShedGroupsUnderSwayOmitted()
    {
        // The demo shed frame's G+W case ignores sway (fixtures/demo/README.md); the diagnosis names it.
        ScreenGrouping.Classify(Demo("shed-frame", diagnose: true)).ShouldBe(new ScreenGroupKey(ScreenGroupKind.Cause, "sway-omitted"));
    }

    [Fact]
    public void Concurring_GoesToTheConcurGroup()
    {
        // Propped cantilever under UDL: fixed-end moment −wL²/8 = −81 kN·m (Hicks, Civil Engineering Formulas, Fig. 2.2 case 10).
        ScreenGrouping.Classify(Reviewing.Of(SampleText.All)).ShouldBe(new ScreenGroupKey(ScreenGroupKind.Concur, "concur"));
    }

    [Fact]
    public void WithoutCauses_TheKindOfTheMainFindingGroups()
    {
        // The demo shed frame's G+W case ignores sway: the storey-shear check is its major finding (fixtures/demo/README.md).
        var review = Demo("shed-frame");
        review.Cases.SelectMany(c => c.Causes).ShouldBeEmpty();
        ScreenGrouping.Classify(review).ShouldBe(new ScreenGroupKey(ScreenGroupKind.Flag, "storey-shear"));
    }

    [Fact]
    public void WithCauses_TheMostLikelyCauseGroups()
    {
        var review = Demo("shed-frame");
        var withCauses = review with
        {
            Cases = review.Cases.Select(c => c.Case == "G+W"
                ? c with { Causes = [new Cause(CauseCode.UnitScale, 0.3, 0.4, "m"), new Cause(CauseCode.SwayOmitted, 0.93, 0.98, "m")] }
                : c).ToList(),
        };
        var key = ScreenGrouping.Classify(withCauses);
        key.ShouldBe(new ScreenGroupKey(ScreenGroupKind.Cause, "sway-omitted"));
        key.Label.ShouldBe("likely cause: sway-omitted");
    }

    [Fact]
    public void OnlyAMissingClaim_GroupsAsEndMomentsMissing()
    {
        // Fixed-fixed span under UDL: end moments ∓wL²/12 = ∓54 kN·m for w = 18 kN/m, L = 6 m (Hicks Fig. 2.2 case 5);
        // the claim at B is left out.
        var review = Reviewing.Of(SampleText.With(
            frame: SampleText.Frame.Replace("B,6,0,roller", "B,6,0,fixed", StringComparison.Ordinal),
            claims: "[end-moments]\ncase,member,at,moment\n1,AB,A,-54"));
        review.Verdict.ShouldBe(Verdict.ConcurWithComments);
        ScreenGrouping.Classify(review).ShouldBe(new ScreenGroupKey(ScreenGroupKind.EndMoments, "missing"));
    }

    [Fact]
    public void Groups_CountEachSubmissionOnce_LargestFirst()
    {
        ScreenRow Row(string name, ScreenGroupKey key) => new(new ScreenItem(name, name, name, false), ScreenOutcome.Revise, null, [], null, null, null, key);
        var sway = new ScreenGroupKey(ScreenGroupKind.Cause, "sway-omitted");
        var eq = new ScreenGroupKey(ScreenGroupKind.Flag, "joint-equilibrium");
        var groups = ScreenGrouping.Groups([Row("c", sway), Row("a", sway), Row("b", eq), Row("d", sway)]);
        groups.Select(g => g.Sentence).ShouldBe(["3 submissions — likely cause: sway-omitted", "1 submission — main finding: joint-equilibrium"]);
        groups[0].Submissions.ShouldBe(["a", "c", "d"]);
    }
}
