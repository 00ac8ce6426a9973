using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

public class SolverSmokeTests
{
    [Fact]
    public void FixedFixedUdl_GivesWl2Over12()
    {
        // Hand check: wL²/12 = 18·36/12 = 54 kN·m (common practice).
        var r = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Fixed)
            .Member("AB", "A", "B", 200e6, 2.5e-4).Udl("AB", 18).Solve();
        var m = r.Cases[0].Members["AB"];
        m.StartMoment.ShouldBe(-54, 1e-9);
        m.EndMoment.ShouldBe(54, 1e-9);
    }
}
