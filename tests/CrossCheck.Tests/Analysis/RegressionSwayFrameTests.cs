using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Group 6 of docs/REFERENCE-CHECKS.md: sway frames with no closed form. NOT published values: regression values
/// from the independent cross-check script (slope-deflection solver D, exact axial rigidity, agreeing with a
/// stiffness solver within 1e-5 kN·m). Each frame is also checked by the equilibrium recipe of that group.
/// </summary>
public class RegressionSwayFrameTests
{
    private const double E = 200e6;

    private static FrameBuilder Frame6a(bool withAreas)
    {
        var b = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Fixed)
            .Joint("C", 0, 4.5).Joint("D", 6, 4.5).Joint("E", 0, 8).Joint("F", 6, 8)
            .Member("AC", "A", "C", E, 3.0e-4, withAreas ? 1.0e-2 : null).Member("BD", "B", "D", E, 3.0e-4, withAreas ? 1.0e-2 : null)
            .Member("CE", "C", "E", E, 2.0e-4, withAreas ? 8.0e-3 : null).Member("DF", "D", "F", E, 2.0e-4, withAreas ? 8.0e-3 : null)
            .Member("CD", "C", "D", E, 4.0e-4, withAreas ? 8.0e-3 : null).Member("EF", "E", "F", E, 3.0e-4, withAreas ? 6.0e-3 : null)
            .Udl("CD", 25).Udl("EF", 15).Force("C", 20, LoadDirection.Right).Force("E", 10, LoadDirection.Right);
        return withAreas ? b.Elastic() : b;
    }

    private static void Moments(CrossCheck.Analysis.CaseResult r, (string Member, bool AtStart, double Value)[] expected, double tol)
    {
        foreach (var (member, atStart, value) in expected)
        {
            var m = r.Members[member];
            Near.Equal(atStart ? m.StartMoment : m.EndMoment, value, relative: 0, absolute: tol, what: $"{member} at {(atStart ? "start" : "end")}");
        }
    }

    [Fact]
    public void Frame6a_TwoStoreys_RegressionValues()
    {
        var r = Frame6a(false).Solve().Cases[0];
        // Tolerance: 1e-5 relative of the largest moment (≈ 96 kN·m), as docs/REFERENCE-CHECKS.md recommends for G6.
        Moments(r,
        [
            ("AC", true, -25.997710), ("BD", true, -52.875347), ("AC", false, -1.185834), ("CD", true, -27.442010),
            ("CE", true, 28.627845), ("BD", false, -54.941109), ("CD", false, 95.680352), ("DF", true, -40.739244),
            ("CE", false, 23.365826), ("EF", true, -23.365826), ("DF", false, -46.254427), ("EF", false, 46.254427),
        ], 1e-3);
        Near.Equal(r.Displacements["E"].Ux, 4.384803e-3, relative: 1e-5, what: "roof drift");
        Near.Equal(r.Displacements["C"].Ux, 2.858039e-3, relative: 1e-5, what: "level-1 drift");
        // Equilibrium recipe (group 6): base shear, total gravity, storey shears from column moments.
        Near.Equal(r.Reactions["A"].Rx + r.Reactions["B"].Rx, -30);
        Near.Equal(r.Reactions["A"].Ry + r.Reactions["B"].Ry, 240);
        double Storey(string c1, string c2, double h) =>
            -(r.Members[c1].StartMoment + r.Members[c1].EndMoment + r.Members[c2].StartMoment + r.Members[c2].EndMoment) / h;
        Near.Equal(Storey("AC", "BD", 4.5), 30);
        Near.Equal(Storey("CE", "DF", 3.5), 10);
    }

    [Fact]
    public void Frame6a_WithAreas_RegressionValues()
    {
        var r = Frame6a(true).Solve().Cases[0];
        Moments(r,
        [
            ("AC", true, -25.938742), ("BD", true, -53.204835), ("AC", false, -0.679474), ("CD", true, -27.362143),
            ("CE", true, 28.041616), ("BD", false, -55.176950), ("CD", false, 95.406474), ("DF", true, -40.229525),
            ("CE", false, 23.077611), ("EF", true, -23.077611), ("DF", false, -45.889702), ("EF", false, 45.889702),
        ], 1e-3); // docs/REFERENCE-CHECKS.md G6, "frame 6a with member areas" (stiffness solver of the cross-check script)
        Near.Equal(r.Reactions["A"].Rx + r.Reactions["B"].Rx, -30); // statics: the base shear balances 20 + 10 kN
    }

    [Fact]
    public void Frame6b_TwoBays_MixedFeet_RegressionValues()
    {
        var r = new FrameBuilder()
            .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 5, 0, Restraint.Pinned).Joint("C", 12, 0, Restraint.Fixed)
            .Joint("D", 0, 4).Joint("E", 5, 4).Joint("F", 12, 4)
            .Member("AD", "A", "D", E, 2.0e-4).Member("BE", "B", "E", E, 3.0e-4).Member("CF", "C", "F", E, 2.0e-4)
            .Member("DE", "D", "E", E, 3.0e-4).Member("EF", "E", "F", E, 5.0e-4)
            .Udl("DE", 10).Point("DE", 50, 2).Udl("EF", 20).Force("D", 25, LoadDirection.Right)
            .Solve().Cases[0];
        Moments(r,
        [
            ("AD", true, -9.802116), ("BE", true, 0), ("CF", true, -40.264306), ("AD", false, 7.172488),
            ("DE", true, -7.172488), ("BE", false, -3.354173), ("DE", false, 83.046449), ("EF", true, -79.692276),
            ("CF", false, -53.751892), ("EF", false, 53.751892),
        ], 1e-3); // docs/REFERENCE-CHECKS.md G6 numeric values, frame 6b (regression, not a publication)
        Near.Equal(r.Displacements["D"].Ux, 1.785115e-3, relative: 1e-5, what: "drift"); // G6 "6b drift" (S and D agree)
        Near.Equal(r.Reactions["A"].Rx + r.Reactions["B"].Rx + r.Reactions["C"].Rx, -25); // statics: balances the 25 kN at D
        Near.Equal(r.Reactions["A"].Ry + r.Reactions["B"].Ry + r.Reactions["C"].Ry, 240); // statics: 10 × 5 + 50 + 20 × 7 kN
        Near.Equal(r.Reactions["C"].Rx, -23.504048, absolute: 1e-4); // G6 regression reactions table, 6b support C
    }
}
