using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using CsCheck;
using MathNet.Numerics.LinearAlgebra;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// The condition number of the stiffness matrix (<see cref="NumericalReport.ConditionEstimate"/>, a Hager–Higham 1-norm
/// estimate from the solver's own factorisation) against the exact condition numbers of the same matrices computed
/// densely by MathNet.Numerics (1-norm from the explicit inverse, 2-norm from the singular values), the matrices
/// written down from the slope-deflection stiffness coefficients 4EI/L, 2EI/L, 6EI/L², 12EI/L³ (common practice).
/// </summary>
public class ConditionNumberTests
{
    private const double E = 200e6, I = 1e-4, L = 6;

    /// <summary>Three 6 m spans, both ends fixed, rollers between: the unknowns are the rotations at J1 and J2.</summary>
    private static FrameBuilder Beam(double ratio) =>
        FrameBuilder.Beam([L, L, L], [Restraint.Fixed, Restraint.Roller, Restraint.Roller, Restraint.Fixed], E, [I * ratio, I, I])
            .Udl("S1", 10).Udl("S2", 10).Udl("S3", 10);

    private static (double One, double Two) Exact(Matrix<double> k) => (k.L1Norm() * k.Inverse().L1Norm(), k.ConditionNumber());

    [Theory]
    [InlineData(1e9)]
    [InlineData(1e10)]
    [InlineData(1e11)]
    public void SpanFarStifferThanItsNeighbours_GivesTheConditionNumberOfTheHandMatrix(double ratio)
    {
        double k = E * I / L, k1 = ratio * k;
        // θ1, θ2: [[4k1 + 4k, 2k], [2k, 4k + 4k]].
        var hand = Matrix<double>.Build.DenseOfArray(new[,] { { (4 * k1) + (4 * k), 2 * k }, { 2 * k, 8 * k } });
        var (one, two) = Exact(hand);
        var r = Beam(ratio).Solve();
        var n = r.Numerics;
        n.ConditionEstimate.ShouldBeLessThanOrEqualTo(one * (1 + 1e-9));
        n.ConditionEstimate.ShouldBeGreaterThanOrEqualTo(one / 3);
        n.ConditionEstimate.ShouldBeInRange(two / 2, two * 2); // ‖·‖₁ and ‖·‖₂ condition numbers agree within a factor n = 2
        n.IllConditioned.ShouldBeTrue();
        n.Trusted.ShouldBeTrue();
        // The smallest scaled pivot cannot see this (the scaled matrix is nearly the identity): it stays near 1.
        n.SmallestPivotRatio.ShouldBeGreaterThan(0.5);
        r.Notes.ShouldHaveSingleItem().ShouldContain($"condition number of the stiffness matrix about {NumericalReport.Scientific(n.ConditionEstimate)}");
    }

    [Fact]
    public void TheEstimate_GrowsInProportionToTheContrast()
    {
        var kappa = new[] { 1e9, 1e10, 1e11 }.Select(ratio => Beam(ratio).Solve().Numerics.ConditionEstimate).ToArray();
        (kappa[1] / kappa[0]).ShouldBe(10, 0.1);
        (kappa[2] / kappa[1]).ShouldBe(10, 0.1);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(1e9)]
    [InlineData(1e11)]
    public void PortalWithAStiffBeam_MatchesTheHandMatrix_WithSwayMeasuredInTheMemberLength(double ratio)
    {
        // A square portal (4 m columns, 4 m beam, fixed feet, axially rigid): unknowns θB, θC and the sway Δ. With Δ
        // measured in units of the member length h, every entry of the matrix is a moment: [[4kc + 4kb, 2kb, 6kc],
        // [2kb, 4kc + 4kb, 6kc], [6kc, 6kc, 24kc]] (the sign of the sway column does not change a condition number).
        double h = 4, kc = E * I / h, kb = ratio * kc;
        var hand = Matrix<double>.Build.DenseOfArray(new[,]
        {
            { (4 * kc) + (4 * kb), 2 * kb, 6 * kc },
            { 2 * kb, (4 * kc) + (4 * kb), 6 * kc },
            { 6 * kc, 6 * kc, 24 * kc },
        });
        var (one, two) = Exact(hand);
        var r = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 0, h).Joint("C", h, h).Joint("D", h, 0, Restraint.Fixed)
            .Member("AB", "A", "B", E, I).Member("BC", "B", "C", E, I * ratio).Member("DC", "D", "C", E, I)
            .Force("B", 10, LoadDirection.Right).Solve();
        r.Numerics.ConditionEstimate.ShouldBeLessThanOrEqualTo(one * (1 + 1e-9));
        r.Numerics.ConditionEstimate.ShouldBeGreaterThanOrEqualTo(one / 3);
        r.Numerics.ConditionEstimate.ShouldBeInRange(two / 3, two * 3);
        r.Numerics.IllConditioned.ShouldBe(ratio > 1);
    }

    [Fact]
    public void RandomFrames_TheEstimateIsALowerBoundWithinAFactorOfThreeOfTheDenseValue()
    {
        // Higham (ACM TOMS 14(4), 1988) reports the estimate exact in most cases and rarely below a third of the true value.
        Gen.Select(Gen.Int[1, 3], Gen.Int[1, 4], Gen.Bool, Gen.Bool, Gen.Bool, Gen.Int).Sample((bays, storeys, fixedBases, elastic, hinges, variant) =>
        {
            var b = RandomFrames.Build(new FrameShape(bays, storeys, fixedBases, elastic, hinges, variant));
            var capture = new Capture();
            var r = b.Solve(capture);
            var model = b.Model;
            var kin = new Kinematics(model);
            var translations = kin.TranslationUnknowns.ToHashSet();
            double lref = model.Members.Average(m => model.Length(m));
            var k = capture.Matrix!;
            var scaled = Matrix<double>.Build.Dense(k.Size, k.Size, (i, j) =>
                k[i, j] * (translations.Contains(i) ? lref : 1) * (translations.Contains(j) ? lref : 1));
            var (one, _) = Exact(scaled);
            r.Numerics.ConditionEstimate.ShouldBeLessThanOrEqualTo(one * (1 + 1e-8));
            r.Numerics.ConditionEstimate.ShouldBeGreaterThanOrEqualTo(one / 3);
            r.Numerics.IllConditioned.ShouldBeFalse();
        }, iter: 60);
    }

    /// <summary>The dense solver, remembering the first matrix it is given (the reduced stiffness matrix).</summary>
    private sealed class Capture : ILinearSolver
    {
        public SparseSymmetricMatrix? Matrix { get; private set; }

        public ILinearFactor Factor(SparseSymmetricMatrix matrix)
        {
            Matrix ??= matrix;
            return DenseCholeskySolver.Instance.Factor(matrix);
        }
    }
}
