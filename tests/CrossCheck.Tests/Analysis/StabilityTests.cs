using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// A structure that cannot stand is refused whatever its loads, naming the joints and directions that are free (or the
/// loose part); a stable structure still solves. Whether a plane linkage can move is checked against the mobility count
/// of the Grübler–Kutzbach criterion, M = 3(links − 1) − 2·(pin joints) (textbook kinematics of mechanisms; pins joining
/// k links count k − 1), an outside check that knows nothing of stiffness.
/// </summary>
public class StabilityTests
{
    /// <summary>Portal frame, 4 m columns, 6 m beam; feet pinned, both column heads hinged (links: ground, AB, BC, DC; pins A, B, C, D: M = 9 − 8 = 1).</summary>
    private static FrameBuilder HingedHeadPortal(bool hingedHeads = true) => new FrameBuilder()
        .Joint("A", 0, 0, Restraint.Pinned).Joint("B", 0, 4).Joint("C", 6, 4).Joint("D", 6, 0, Restraint.Pinned)
        .Member("AB", "A", "B", 200e6, 8e-5, hinge: hingedHeads ? Hinge.End : Hinge.None)
        .Member("BC", "B", "C", 200e6, 2e-4)
        .Member("DC", "D", "C", 200e6, 8e-5, hinge: hingedHeads ? Hinge.End : Hinge.None)
        .Udl("BC", 12);

    [Fact]
    public void PinnedPortalWithHingedColumnHeads_UnderGravityOnly_IsRefused_NamingTheSway()
    {
        // Gravity does no work on the sway, but the frame cannot stand: M = 1 (Grübler–Kutzbach, see the class summary).
        var ex = Should.Throw<StructureException>(() => HingedHeadPortal().Solve());
        ex.Message.ShouldStartWith("The structure is a mechanism: joint B can move horizontally (x) (together with joints C (x) and A, D (rotation))");
        ex.Message.ShouldContain("whatever the loads");
        ex.Message.ShouldNotContain("Independently"); // one degree of freedom
        ex.Joint.ShouldBe("B");
        ex.Direction.ShouldBe("x");
    }

    [Fact]
    public void TheSameFrame_WithAVanishingLateralLoad_IsRefused()
    {
        var b = HingedHeadPortal().Force("B", 1e-12, LoadDirection.Right);
        var ex = Should.Throw<StructureException>(() => b.Solve());
        ex.Message.ShouldStartWith("The structure is a mechanism: joint B can move horizontally (x)");
    }

    [Fact]
    public void TheSameFrame_WithRigidColumnHeads_Solves_WithTheClosedFormThrust()
    {
        // Pins at the feet only: links ground, AB, BC, DC with pins A, D and rigid joints B, C (one link AB+BC+DC):
        // M = 3·1 − 2·2 = −1, stable (once redundant). Horizontal thrust H = wL²/(4h(2k+3)), k = (I_b/L)/(I_c/h)
        // (REFERENCE-CHECKS.md 5.2; Kleinlogel, from memory); the column head moment is H·h.
        var r = HingedHeadPortal(hingedHeads: false).Solve();
        double k = 2e-4 / 6 / (8e-5 / 4), h = 4;
        double thrust = 12 * 36 / (4 * h * ((2 * k) + 3));
        Near.Equal(Math.Abs(r.Cases[0].Members["AB"].EndMoment), thrust * h, relative: 1e-9);
        r.Notes.ShouldBeEmpty();
    }

    [Fact]
    public void ALooseMemberBesideAPortal_IsRefused_NamingIt()
    {
        var b = HingedHeadPortal(hingedHeads: false).Joint("E", 9, 4).Joint("F", 12, 4).Member("EF", "E", "F", 200e6, 8e-5);
        var ex = Should.Throw<StructureException>(() => b.Solve());
        ex.Message.ShouldStartWith("Member EF (joints E and F) is connected to nothing that is supported");
        ex.Joint.ShouldBe("E");
    }

    [Fact]
    public void ALoosePartOfSeveralMembers_IsNamedWithAllItsMembersAndJoints()
    {
        var b = HingedHeadPortal(hingedHeads: false).Joint("E", 9, 4).Joint("F", 12, 4).Joint("G", 12, 7)
            .Member("EF", "E", "F", 200e6, 8e-5).Member("FG", "F", "G", 200e6, 8e-5);
        Should.Throw<StructureException>(() => b.Solve()).Message
            .ShouldStartWith("Members EF, FG (joints E, F, G) form a part connected to nothing that is supported");
    }

    [Fact]
    public void AStructureWithoutSupports_IsRefused()
    {
        var b = new FrameBuilder().Joint("A", 0, 0).Joint("B", 5, 0).Member("AB", "A", "B", 200e6, 8e-5).Udl("AB", 1);
        Should.Throw<StructureException>(() => b.Solve()).Message.ShouldStartWith("The structure has no supports");
    }

    [Fact]
    public void TwoIndependentMechanisms_AreBothNamed()
    {
        // The hinged-head portal plus a link CE pinned at both ends and free at E: links ground, AB, BC, DC, CE; pins A, B,
        // D and two at C (three links meet there): M = 3·4 − 2·5 = 2 (Grübler–Kutzbach).
        var b = HingedHeadPortal().Joint("E", 9, 4).Member("CE", "C", "E", 200e6, 8e-5, hinge: Hinge.Both);
        var ex = Should.Throw<StructureException>(() => b.Solve());
        ex.Message.ShouldStartWith("The structure is a mechanism: ");
        ex.Message.ShouldContain(" Independently, joint ");
        ex.Message.ShouldNotContain("more than");
    }

    [Fact]
    public void ABracedAnalysis_OfAStableFrame_StillSolves()
    {
        var b = HingedHeadPortal(hingedHeads: false).Force("B", 5, LoadDirection.Right);
        new FrameSolver().Solve(b.Model, b.Cases, holdTranslations: true).Numerics.Trusted.ShouldBeTrue();
    }
}
