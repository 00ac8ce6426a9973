using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>Group 7 of docs/REFERENCE-CHECKS.md: facts of the trade (common practice, no source).</summary>
public class ReferenceRulesOfThumbTests
{
    private const double L = 6, E = 200e6, I = 2.5e-4;

    [Fact] // 7.1 — carry-over factor ½ with the far end fixed (common practice; consistent with Erochko 4θEI/L, 2θEI/L).
    public void CarryOverHalf()
    {
        var m = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed, new SupportMovement(0, 0, 0.001))
            .Joint("B", L, 0, Restraint.Fixed).Member("AB", "A", "B", E, I).Solve().Cases[0].Members["AB"];
        Near.Equal(m.EndMoment / m.StartMoment, 0.5);
    }

    [Fact] // 7.2 — carry-over factor 0 with the far end pinned (common practice).
    public void CarryOverZeroToPinnedEnd()
    {
        var m = new FrameBuilder().Joint("A", 0, 0, Restraint.Pinned).Joint("B", L, 0, Restraint.Roller)
            .Member("AB", "A", "B", E, I).JointMoment("A", 30).Solve().Cases[0].Members["AB"];
        Near.Equal(m.EndMoment, 0);
    }

    [Fact] // 7.3 — distribution factors K/ΣK with 4EI/L (far end fixed) and 3EI/L (far end pinned) (common practice, Hardy Cross).
    public void DistributionFactorsAtAJoint()
    {
        var r = new FrameBuilder()
            .Joint("B", 0, 0).Joint("A", -5, 0, Restraint.Fixed).Joint("C", 6, 0, Restraint.Pinned).Joint("D", 0, -4, Restraint.Fixed)
            .Member("BA", "B", "A", E, 3.0e-4).Member("BC", "B", "C", E, 2.0e-4).Member("BD", "B", "D", E, 2.5e-4)
            .JointMoment("B", 100).Solve().Cases[0];
        double kba = 4 * 3.0e-4 / 5, kbc = 3 * 2.0e-4 / 6, kbd = 4 * 2.5e-4 / 4, sum = kba + kbc + kbd;
        Near.Equal(r.Members["BA"].StartMoment, 100 * kba / sum, what: "M_BA");
        Near.Equal(r.Members["BC"].StartMoment, 100 * kbc / sum, what: "M_BC");
        Near.Equal(r.Members["BD"].StartMoment, 100 * kbd / sum, what: "M_BD");
        Near.Equal(r.Members["BA"].EndMoment, 50 * kba / sum, what: "M_AB (carry-over ½)");
        Near.Equal(r.Members["BC"].EndMoment, 0, what: "M_CB (pinned)");
        Near.Equal(r.Members["BD"].EndMoment, 50 * kbd / sum, what: "M_DB (carry-over ½)");
        // The tabulated values of docs/REFERENCE-CHECKS.md 7.3.
        Near.Equal(r.Members["BA"].StartMoment, 40.677966, absolute: 1e-6);
        Near.Equal(r.Members["BD"].EndMoment, 21.186441, absolute: 1e-6);
    }

    [Fact] // 7.5 — symmetric portal under antisymmetric (sway) load: zero moment at mid-beam (common practice, antisymmetry).
    public void AntisymmetricLoad_ZeroMomentAtMidBeam()
    {
        var r = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 0, 4).Joint("C", 6, 4).Joint("D", 6, 0, Restraint.Fixed)
            .Member("AB", "A", "B", E, 2e-4).Member("BC", "B", "C", E, 1.5e-4).Member("DC", "D", "C", E, 2e-4)
            .Force("B", 30, LoadDirection.Right).Solve().Cases[0];
        Near.Equal(r.Members["BC"].MomentAt(3), 0, absolute: 1e-9);
        Near.Equal(r.Members["BC"].StartMoment, r.Members["BC"].EndMoment);
    }
}
