using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Group 10 of docs/REFERENCE-CHECKS.md: the elastic critical load factor α_cr (lowest eigenvalue of K + λ·K_G under the
/// first-order axial forces) of portal frames, against Euler's critical loads (effective length 1.0·h for a sway column
/// fixed at both ends, 2.0·h for one pinned at its foot: from memory, any text on elastic stability, e.g. Timoshenko &amp;
/// Gere, Theory of Elastic Stability) and against the storey estimate α_cr = (H/V)·(h/δ) of EN 1993-1-1 clause 5.2.1(4)B
/// worked by hand with the drift of docs/REFERENCE-CHECKS.md case 5.3 (SEAINT, seen). kN and m.
/// </summary>
public class CriticalLoadFactorTests(ITestOutputHelper output)
{
    private const double E = 200e6, Ic = 2.5e-4, H = 4, Span = 6, P = 1000;

    private static FrameBuilder Portal(Restraint feet, double beamI, double? area = null) => new FrameBuilder()
        .Joint("A", 0, 0, feet).Joint("B", 0, H).Joint("C", Span, H).Joint("D", Span, 0, feet)
        .Member("AB", "A", "B", E, Ic, area).Member("BC", "B", "C", E, beamI, area).Member("DC", "D", "C", E, Ic, area);

    private static double? Alpha(FrameBuilder b, bool? dense = null, bool divideAll = false)
    {
        var r = b.Solve().Cases[0];
        return CriticalLoadFactor.Of(b.Model, m => (r.Members[m].StartAxial, r.Members[m].EndAxial), dense, divideAll);
    }

    [Fact]
    public void FixedFeet_RigidBeam_IsEulerWithEffectiveLengthH()
    {
        // A beam 10⁴ times stiffer than the columns stands in for a rigid one; each column carries P: P_cr = π²EI/h².
        var b = Portal(Restraint.Fixed, Ic * 1e4).Force("B", P, LoadDirection.Down).Force("C", P, LoadDirection.Down);
        double euler = Math.PI * Math.PI * E * Ic / (H * H) / P;
        Near.Equal(Alpha(b)!.Value, euler, relative: 2e-3, what: "α_cr, fixed feet");
        // The storey estimate by hand: δ = H·h³/(2·12EI) for two sway columns fixed at both ends, V = 2P:
        // α = (H/V)(h/δ) = 12EI/(P·h²), 12/π² = 1.216 times Euler (docs/REFERENCE-CHECKS.md group 10).
        double storey = 12 * E * Ic / (P * H * H);
        Near.Equal(storey / Alpha(b)!.Value, 12 / (Math.PI * Math.PI), relative: 2e-3, what: "storey estimate over eigenvalue");
    }

    [Fact]
    public void PinnedFeet_RigidBeam_IsEulerWithEffectiveLength2H()
    {
        var b = Portal(Restraint.Pinned, Ic * 1e4).Force("B", P, LoadDirection.Down).Force("C", P, LoadDirection.Down);
        Near.Equal(Alpha(b)!.Value, Math.PI * Math.PI * E * Ic / (4 * H * H) / P, relative: 2e-3, what: "α_cr, pinned feet");
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void FixedFeet_AgainstTheHandStoreyEstimate(double k)
    {
        // Portal 5.3 of docs/REFERENCE-CHECKS.md, k = (I_beam/I_col)(h/L): drift under H at the beam,
        // Δ = H·h³·(3k + 2)/(12·E·I_col·(6k + 1)) (SEAINT 1998, seen; agrees with slope-deflection).
        double beamI = k * Ic * Span / H, hLoad = 30;
        double delta = hLoad * H * H * H * ((3 * k) + 2) / (12 * E * Ic * ((6 * k) + 1));
        double storey = hLoad / (2 * P) * (H / delta); // EN 1993-1-1 5.2.1(4)B by hand
        var b = Portal(Restraint.Fixed, beamI).Force("B", P, LoadDirection.Down).Force("C", P, LoadDirection.Down);
        double alpha = Alpha(b)!.Value;
        output.WriteLine($"k = {k}: eigenvalue α_cr = {alpha:0.###}, storey estimate {storey:0.###}, ratio {storey / alpha:0.###}");
        // The storey estimate ignores the loss of column stiffness under load (exact only as P → 0): it is above the eigenvalue, by
        // less than Euler's 12/π² bound for the rigid beam.
        (storey / alpha).ShouldBeInRange(1.0, 12 / (Math.PI * Math.PI) + 1e-3);
    }

    [Fact]
    public void ElasticAxialMembers_GiveTheSameFactor()
    {
        var rigid = Portal(Restraint.Fixed, Ic * 3).Force("B", P, LoadDirection.Down).Force("C", P, LoadDirection.Down);
        var elastic = Portal(Restraint.Fixed, Ic * 3, area: 0.01).Elastic().Force("B", P, LoadDirection.Down).Force("C", P, LoadDirection.Down);
        Near.Equal(Alpha(elastic)!.Value, Alpha(rigid)!.Value, relative: 5e-3, what: "elastic against rigid members");
    }

    [Fact]
    public void NoCompression_NoFactor()
    {
        // A continuous beam under vertical load carries no axial force.
        var b = FrameBuilder.Beam([6, 6], [Restraint.Pinned, Restraint.Roller, Restraint.Roller], E, [Ic, Ic]).Udl("S1", 18).Udl("S2", 18);
        Alpha(b).ShouldBeNull();
    }

    [Fact]
    public void HingedBeam_OnSwayColumns()
    {
        // Beam pinned to both column heads: each column is a cantilever from its fixed foot, P_cr = π²EI/(4h²) (from memory).
        var b = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 0, H).Joint("C", Span, H).Joint("D", Span, 0, Restraint.Fixed)
            .Member("AB", "A", "B", E, Ic).Member("BC", "B", "C", E, Ic, hinge: Hinge.Both).Member("DC", "D", "C", E, Ic)
            .Force("B", P, LoadDirection.Down).Force("C", P, LoadDirection.Down);
        Near.Equal(Alpha(b)!.Value, Math.PI * Math.PI * E * Ic / (4 * H * H) / P, relative: 2e-3, what: "α_cr, hinged beam");
    }

    private static FrameBuilder SixStoreys()
    {
        var b = new FrameBuilder();
        for (int level = 0; level <= 6; level++)
            for (int col = 0; col <= 3; col++)
                b.Joint($"J{level}-{col}", col * 6.0, level * 3.5, level == 0 ? Restraint.Fixed : Restraint.Free);
        for (int level = 1; level <= 6; level++)
        {
            for (int col = 0; col <= 3; col++) b.Member($"C{level}-{col}", $"J{level - 1}-{col}", $"J{level}-{col}", E, Ic);
            for (int col = 0; col < 3; col++) b.Member($"B{level}-{col}", $"J{level}-{col}", $"J{level}-{col + 1}", E, 2 * Ic).Udl($"B{level}-{col}", 40);
        }
        return b;
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void MembersFarFromTheirOwnBuckling_StayOneElement_WithoutChangingTheFactor(bool dense)
    {
        // The beams and upper columns carry a small share of their Euler load at α_cr; dividing them adds unknowns only.
        // Against dividing every compressed member: the same factor to 1e-4 (the one-element stiffness error is of
        // second order in P, common practice).
        var b = SixStoreys();
        double chosen = Alpha(b, dense)!.Value, all = Alpha(b, dense, divideAll: true)!.Value;
        output.WriteLine($"chosen {chosen:0.######}, every compressed member divided {all:0.######}");
        Near.Equal(chosen, all, relative: 1e-4, what: "selective division against dividing every member");
    }

    [Fact]
    public void SubspaceIteration_AgreesWithTheDenseSolution()
    {
        // A three-bay, six-storey frame with gravity load on every beam: the same factor by both eigensolvers.
        var b = SixStoreys();
        double dense = Alpha(b, dense: true)!.Value, iterative = Alpha(b, dense: false)!.Value;
        output.WriteLine($"dense {dense:0.######}, subspace {iterative:0.######}");
        Near.Equal(iterative, dense, relative: 1e-7, what: "subspace against dense");
    }
}
