using CrossCheck.Analysis;
using CrossCheck.Memo;
using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.Tests.Support;
using CsCheck;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// The numerical sanity layer: ill-conditioned stiffness is detected and reported with its condition estimate, and
/// every result is verified by joint and global equilibrium before it is used; an analysis that fails the check is
/// never returned.
/// </summary>
public class NumericalSanityTests
{
    /// <summary>A fixed-base portal, 4 m columns, 6 m beam, 10 kN sideways at the top; the beam <paramref name="ratio"/> times stiffer (I).</summary>
    private static FrameBuilder Portal(double ratio, bool elastic = false)
    {
        var b = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 0, 4).Joint("C", 6, 4).Joint("D", 6, 0, Restraint.Fixed)
            .Member("AB", "A", "B", 200e6, 1e-4, 1e-2).Member("BC", "B", "C", 200e6, 1e-4 * ratio, 1e-2).Member("CD", "C", "D", 200e6, 1e-4, 1e-2)
            .Force("B", 10, LoadDirection.Right);
        return elastic ? b.Elastic() : b;
    }

    [Fact]
    public void MemberAMillionTimesStiffer_IsReported_WithItsContrastAndConditionEstimate_AndTheResultsStillHold()
    {
        var b = Portal(3e6);
        var r = b.Solve();
        var n = r.Numerics;
        n.Contrast.ShouldNotBeNull();
        n.Contrast.Stiffer.ShouldBe("BC");
        n.Contrast.Ratio.ShouldBe(3e6 * 4 / 6, 1);            // (EI/L) of the beam over a column's
        n.IllConditioned.ShouldBeTrue();
        n.Trusted.ShouldBeTrue();
        n.WorstResidual.ShouldBeLessThan(1e-10);
        r.Notes.ShouldContain(s => s.StartsWith("Member BC is 2×10⁶ times stiffer (EI/L) than member AB", StringComparison.Ordinal)
                                   && s.Contains($"condition number of the stiffness matrix about {NumericalReport.Scientific(n.ConditionEstimate)}"));
        // The condition number grows with the contrast (ConditionNumberTests checks it against dense values).
        n.ConditionEstimate.ShouldBeGreaterThan(1e4);
        // A portal whose beam is rigid sways with both columns bent in double curvature and equal end moments H·h/4
        // (shear shared equally by equal columns, point of contraflexure at mid-height) — common practice, e.g. the
        // portal method; 10 kN × 4 m / 4 = 10 kN·m. The beam is not infinitely stiff, so within 0.01 %.
        var col = r.Cases[0].Members["AB"];
        Math.Abs(col.StartMoment).ShouldBe(10, 1e-3);
        col.EndMoment.ShouldBe(col.StartMoment, 1e-3);
    }

    [Fact]
    public void OrdinaryFrames_AreVerified_WithARoundOffResidual()
    {
        RandomFrames.Shapes().Sample(shape =>
        {
            var r = RandomFrames.Build(shape, loadCases: 2).Solve();
            r.Numerics.Trusted.ShouldBeTrue();
            r.Numerics.Cases.Count.ShouldBe(2);
            r.Numerics.WorstResidual.ShouldBeLessThan(1e-10);
        }, iter: 60);
    }

    [Fact]
    public void BracedAnalysis_IsVerifiedAtTheJointsItLeavesFree()
    {
        var b = Portal(1);
        var braced = new FrameSolver().Solve(b.Model, b.Cases, holdTranslations: true);
        braced.Numerics.Trusted.ShouldBeTrue();
    }

    [Fact]
    public void AnAnalysisOutOfBalance_IsNeverReturned()
    {
        // A linear solver that returns displacements 0.1 % off: compatible forces, but not in equilibrium.
        var b = Portal(1);
        var ex = Should.Throw<StructureException>(() => new FrameSolver(new Sloppy(1e-3)).Solve(b.Model, b.Cases));
        ex.Message.ShouldStartWith("The independent analysis failed its own equilibrium check: in case 1, ");
        ex.Message.ShouldContain("Its results cannot be trusted, so the claims were not judged against them.");
        // The same solver, accurate, passes.
        new FrameSolver(new Sloppy(0)).Solve(b.Model, b.Cases).Numerics.Trusted.ShouldBeTrue();
    }

    [Fact]
    public void StiffnessContrastBeyondDoublePrecision_IsRefused_NotReviewed()
    {
        // Elastic members 10¹³ apart: either the equilibrium check or the singular-matrix check refuses it.
        var b = Portal(1e13, elastic: true);
        var ex = Should.Throw<StructureException>(() => b.Solve());
        (ex.Message.Contains("failed its own equilibrium check", StringComparison.Ordinal) || ex.Message.Contains("numerically singular", StringComparison.Ordinal))
            .ShouldBeTrue(ex.Message);
    }

    [Fact]
    public void Review_CarriesTheConditioningFlagOnce_WithTheConditionEstimate_InTheMemoAndJson()
    {
        // The portal of docs/REFERENCE-CHECKS.md group 5 with a beam stiffer than its columns by a factor of 10⁶.
        string csv = SampleText.With(frame: SampleText.PortalJoints + "\n\n" + """
            [members]
            member,start,end,E [GPa],I [mm^4]
            AB,A,B,200,100e6
            BC,B,C,200,150e12
            CD,C,D,200,100e6
            """, loads: "[loads]\ncase,on,kind,P,dir,w\nW,B,force,10,right,\nG,BC,udl,,,5\n",
            claims: "[end-moments]\ncase,member,at,moment\nW,AB,A,-10\nW,AB,B,-10\nG,AB,A,0\n");
        var (s, analysis) = Reviewing.ReadAndSolve(csv);
        var review = ReviewEngine.Review(s, analysis);
        var flag = review.AllFlags.Where(f => f.Kind == FlagKind.Conditioning).ShouldHaveSingleItem();
        flag.Severity.ShouldBe(Severity.Minor);
        flag.Where.ShouldBe("member BC");
        flag.Message.ShouldContain("condition number of the stiffness matrix about");
        flag.Message.ShouldContain("This applies to every load case.");
        flag.SourceText.ShouldBe("calc.csv:16-17");
        review.Comments.ShouldContain(c => c.Id == "ST-W-BC");
        string md = MemoRenderer.Render(MemoExtensions.Build(review, MemoFormat.Markdown), MemoFormat.Markdown);
        md.ShouldContain("Every recomputed result was verified by equilibrium before it was used");
        md.ShouldContain("The stiffness matrix is ill-conditioned (condition estimate");
        string json = ReviewJson.Write(review).ShouldMatchReviewSchema();
        json.ShouldContain("\"verified\": true");
        json.ShouldContain("\"stiffer\": \"BC\"");
    }

    /// <summary>Dense Cholesky whose solutions are scaled by (1 + error) on every other unknown.</summary>
    private sealed class Sloppy(double error) : ILinearSolver
    {
        public ILinearFactor Factor(SparseSymmetricMatrix matrix) => new Factor_(DenseCholeskySolver.Instance.Factor(matrix), error);

        private sealed class Factor_(ILinearFactor inner, double error) : ILinearFactor
        {
            public int Size => inner.Size;
            public double MinPivotRatio => inner.MinPivotRatio;

            public double[] Solve(double[] rhs) => inner.Solve(rhs).Select((v, i) => i % 2 == 0 ? v * (1 + error) : v).ToArray();
        }
    }
}
