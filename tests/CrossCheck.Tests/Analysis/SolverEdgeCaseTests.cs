using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>Structures the solver must refuse clearly, or handle without fuss.</summary>
public class SolverEdgeCaseTests
{
    [Fact]
    public void PinnedPortalWithHingedBeam_IsAMechanism_NamingJointAndDirection()
    {
        // Pinned feet and a beam hinged at both ends: the frame sways freely under a horizontal load.
        var b = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Pinned).Joint("B", 0, 4).Joint("C", 6, 4).Joint("D", 6, 0, Restraint.Pinned)
            .Member("AB", "A", "B", 200e6, 2e-4).Member("BC", "B", "C", 200e6, 2e-4, hinge: Hinge.Both).Member("DC", "D", "C", 200e6, 2e-4)
            .Force("B", 10, LoadDirection.Right);
        var ex = Should.Throw<StructureException>(() => b.Solve());
        ex.Message.ShouldContain("mechanism");
        ex.Direction.ShouldBe("x");
        new[] { "B", "C" }.ShouldContain(ex.Joint);
    }

    [Fact]
    public void BeamOnRollersOnly_UnderVerticalLoad_IsAMechanism()
    {
        // Nothing holds the beam horizontally: three parallel reactions cannot stop a body moving across them (geometric
        // instability, common practice). No load pushes it that way, but a structure that cannot stand is refused
        // whatever the loads.
        var b = FrameBuilder.Beam([6, 6], [Restraint.Roller, Restraint.Roller, Restraint.Roller], 200e6, [2.5e-4, 2.5e-4])
            .Udl("S1", 18).Udl("S2", 18);
        var ex = Should.Throw<StructureException>(() => b.Solve());
        ex.Message.ShouldContain("can move horizontally (x)");
        ex.Direction.ShouldBe("x");
    }

    [Fact]
    public void BeamOnRollersOnly_UnderHorizontalLoad_IsAMechanism()
    {
        var b = FrameBuilder.Beam([6], [Restraint.Roller, Restraint.Roller], 200e6, [2.5e-4]).Udl("S1", 5, LoadDirection.Right);
        Should.Throw<StructureException>(() => b.Solve()).Direction.ShouldBe("x");
    }

    /// <summary>Two equal cantilevers AB and BC (5 m each, fixed at A and at C) joined by a pin at B: both members are hinged there.</summary>
    private static FrameBuilder CantileversPinnedTogether() => new FrameBuilder()
        .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 5, 0).Joint("C", 10, 0, Restraint.Fixed)
        .Member("AB", "A", "B", 200e6, 2e-4, hinge: Hinge.End).Member("BC", "B", "C", 200e6, 2e-4, hinge: Hinge.Start);

    [Fact]
    public void CoupleOnAJointWhereEveryMemberIsHinged_IsRefused()
    {
        var b = CantileversPinnedTogether().JointMoment("B", 10);
        Should.Throw<StructureException>(() => b.Solve()).Message.ShouldContain("every member is hinged there");
    }

    [Fact]
    public void JointWhereEveryMemberIsHinged_CarriesLoadWithoutMoment()
    {
        // Two fixed-ended cantilevers meeting at an internal pin: a point load at the pin splits by stiffness.
        var r = CantileversPinnedTogether().Force("B", 20, LoadDirection.Down).Solve().Cases[0];
        // Equal cantilevers share the load equally: M at each root = (P/2)·L (statics, common practice).
        Near.Equal(r.Members["AB"].StartMoment, -50);
        Near.Equal(r.Members["BC"].EndMoment, 50);
        Near.Equal(r.Members["AB"].EndMoment, 0);
    }

    [Fact]
    public void SupportMovementThatStretchesARigidMember_IsRefused()
    {
        var b = new FrameBuilder().Joint("A", 0, 0, Restraint.Pinned).Joint("B", 6, 0, Restraint.Pinned, new SupportMovement(0.01, 0, 0))
            .Member("AB", "A", "B", 200e6, 2e-4).Udl("AB", 1);
        Should.Throw<StructureException>(() => b.Solve()).Message.ShouldContain("axially rigid");
    }

    [Fact]
    public void SameMovement_WithElasticAxialBehaviour_IsSolved()
    {
        // Pin-pin bar pulled by 10 mm: N = EA·δ/L, no bending (common practice).
        var r = new FrameBuilder().Joint("A", 0, 0, Restraint.Pinned).Joint("B", 6, 0, Restraint.Pinned, new SupportMovement(0.01, 0, 0))
            .Member("AB", "A", "B", 200e6, 2e-4, a: 1e-3).Elastic().Solve().Cases[0];
        Near.Equal(r.Members["AB"].EndAxial, 200e6 * 1e-3 * 0.01 / 6);
        Near.Equal(r.Members["AB"].StartMoment, 0);
    }

    [Fact]
    public void RigidAxialForces_AreRecoveredFromEquilibrium()
    {
        // Portal with pinned feet, UDL on the beam: the beam carries the horizontal thrust H = wL²/(4h(2k+3)) in compression
        // (docs/REFERENCE-CHECKS.md 5.2; Kleinlogel, from memory), the columns carry wL/2 each.
        double k = 0.5, ib = k * 2e-4 * 6 / 4;
        var r = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Pinned).Joint("B", 0, 4).Joint("C", 6, 4).Joint("D", 6, 0, Restraint.Pinned)
            .Member("AB", "A", "B", 200e6, 2e-4).Member("BC", "B", "C", 200e6, ib).Member("DC", "D", "C", 200e6, 2e-4)
            .Udl("BC", 18).Solve().Cases[0];
        Near.Equal(r.Members["BC"].EndAxial, -18 * 36 / (4 * 4 * ((2 * k) + 3)), relative: 1e-8);
        Near.Equal(r.Members["AB"].EndAxial, -54, relative: 1e-8);
    }

    [Fact]
    public void DisconnectedJoint_IsRefused()
    {
        var b = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0).Joint("Z", 9, 9)
            .Member("AB", "A", "B", 200e6, 2e-4).Force("B", 1, LoadDirection.Down);
        Should.Throw<StructureException>(() => b.Solve()).Joint.ShouldBe("Z");
    }

    [Fact]
    public void SpanMoment_IsFoundAtZeroShear()
    {
        // Simply supported UDL: max wL²/8 at mid-span (common practice).
        var m = FrameBuilder.Beam([6], [Restraint.Pinned, Restraint.Roller], 200e6, [2e-4]).Udl("S1", 18).Solve().Cases[0].Members["S1"];
        Near.Equal(m.MaxSagging.Moment, 81);
        Near.Equal(m.MaxSagging.X, 3, absolute: 1e-9);
        Near.Equal(m.MomentAt(1.5), (18 * 1.5 * (6 - 1.5)) / 2);
    }
}
