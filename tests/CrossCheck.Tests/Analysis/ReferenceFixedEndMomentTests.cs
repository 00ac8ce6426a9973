using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Group 1 of docs/REFERENCE-CHECKS.md: fixed-end moments of a single clamped member.
/// Instance: L = 6 m, w = 18 kN/m, P = 40 kN, M0 = 30 kN·m, E = 200 GPa (200e6 kN/m²), I = 2.5e-4 m⁴.
/// Member-end moments clockwise positive; the solver sees none of these formulas.
/// </summary>
public class ReferenceFixedEndMomentTests
{
    private const double L = 6, W = 18, P = 40, M0 = 30, E = 200e6, I = 2.5e-4, EI = E * I;

    private static FrameBuilder Clamped() => new FrameBuilder()
        .Joint("A", 0, 0, Restraint.Fixed).Joint("B", L, 0, Restraint.Fixed).Member("AB", "A", "B", E, I);

    private static void Check(FrameBuilder b, double mab, double mba)
    {
        var m = b.Solve().Cases[0].Members["AB"];
        Near.Equal(m.StartMoment, mab, what: "M_AB");
        Near.Equal(m.EndMoment, mba, what: "M_BA");
    }

    [Fact] // 1.1 — AISC Manual Table 3-23 case 15 (from memory); Hicks, Civil Engineering Formulas, Fig. 2.2 case 5 (M = WL/12); Wikipedia "Fixed end moment".
    public void FullUdl_IsWl2Over12() => Check(Clamped().Udl("AB", W), -W * L * L / 12, W * L * L / 12);

    [Fact] // 1.2 — AISC Table 3-23 case 16 (from memory); Erochko, Fixed End Moment Table v1.0: PL/8.
    public void CentralPoint_IsPlOver8() => Check(Clamped().Point("AB", P, 3), -P * L / 8, P * L / 8);

    [Fact] // 1.3 — AISC Table 3-23 "fixed at both ends, concentrated load at any point" (case 17, from memory); Hicks Fig. 2.2 case 6: Pab²/L², Pa²b/L².
    public void PointAtA_IsPab2OverL2()
    {
        double a = 2, b = 4;
        Check(Clamped().Point("AB", P, a), -P * a * b * b / (L * L), P * a * a * b / (L * L));
    }

    [Fact] // 1.4 — Erochko FEM table; Roark Table 8.1 case 2e (from memory): partial UDL over 0..a.
    public void PartialUdlFromStart()
    {
        double a = 3;
        Check(Clamped().Udl("AB", W, a: 0, b: a),
            -W * a * a * ((6 * L * L) - (8 * a * L) + (3 * a * a)) / (12 * L * L),
            W * a * a * a * ((4 * L) - (3 * a)) / (12 * L * L));
    }

    [Fact] // 1.5 — integral of the point-load case (Wikipedia "Fixed end moment", method): UDL on c..d.
    public void PartialUdlBetweenCAndD()
    {
        double c = 1, d = 4;
        double F1(double x) => (L * L * x * x / 2) - (2 * L * x * x * x / 3) + (x * x * x * x / 4);
        double F2(double x) => (L * x * x * x / 3) - (x * x * x * x / 4);
        Check(Clamped().Udl("AB", W, a: c, b: d), -W / (L * L) * (F1(d) - F1(c)), W / (L * L) * (F2(d) - F2(c)));
    }

    [Fact] // 1.6 — Wikipedia "Fixed end moment" (cw+), Erochko FEM table: triangular 0 → w: wL²/30, wL²/20.
    public void Triangular_ZeroAtStart() => Check(Clamped().Linear("AB", 0, W), -W * L * L / 30, W * L * L / 20);

    [Fact] // 1.7 — Erochko FEM table: symmetric triangle, peak at mid-span: 5wL²/96.
    public void SymmetricTriangle()
    {
        var b = Clamped().Linear("AB", 0, W, 0, 3).Linear("AB", W, 0, 3, 6);
        Check(b, -5 * W * L * L / 96, 5 * W * L * L / 96);
    }

    [Theory] // 1.8a–c — Wikipedia "Fixed end moment" couple case (formula from memory, sign fixed by solver); Erochko table magnitudes Mb(b−2a)/L², Ma(2b−a)/L².
    [InlineData(1.5)]
    [InlineData(3.0)]
    [InlineData(2.0)]
    public void ClockwiseCouple(double a)
    {
        double b = L - a;
        Check(Clamped().Couple("AB", M0, a), M0 * b * ((2 * a) - b) / (L * L), M0 * a * ((2 * b) - a) / (L * L));
    }

    [Fact] // 1.9 — Erochko FEM table "6ΔEI/L²"; slope-deflection equation, Hibbeler, Structural Analysis (from memory).
    public void SettlementOfB_Is6EIDeltaOverL2()
    {
        const double delta = 0.010;
        var b = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed)
            .Joint("B", L, 0, Restraint.Fixed, new SupportMovement(0, -delta, 0)).Member("AB", "A", "B", E, I);
        Check(b, -6 * EI * delta / (L * L), -6 * EI * delta / (L * L));
    }

    [Fact] // 1.10 — Erochko FEM table "4θEI/L, 2θEI/L".
    public void ImposedRotationAtA_Is4EIThetaOverL()
    {
        const double theta = 0.001;
        var b = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed, new SupportMovement(0, 0, theta))
            .Joint("B", L, 0, Restraint.Fixed).Member("AB", "A", "B", E, I);
        Check(b, 4 * EI * theta / L, 2 * EI * theta / L);
    }

    [Theory] // Orientation spot check of docs/REFERENCE-CHECKS.md ("same propped-cantilever moment −81.0000 kN·m for members at 0°, 30°, 90°, 135°, 210°").
    [InlineData(0)]
    [InlineData(30)]
    [InlineData(90)]
    [InlineData(135)]
    [InlineData(210)]
    public void ProppedCantilever_AnyOrientation_GivesWl2Over8(double degrees)
    {
        double c = Math.Cos(degrees * Math.PI / 180), s = Math.Sin(degrees * Math.PI / 180);
        // Load perpendicular to the member: resolve a transverse load into global components with two loads.
        var b = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", L * c, L * s, Restraint.Pinned)
            .Member("AB", "A", "B", E, I);
        // Local −y direction in global components is (s, −c): split into horizontal and vertical parts.
        if (Math.Abs(s) > 1e-12) b.Udl("AB", W * Math.Abs(s), s > 0 ? LoadDirection.Right : LoadDirection.Left);
        if (Math.Abs(c) > 1e-12) b.Udl("AB", W * Math.Abs(c), c > 0 ? LoadDirection.Down : LoadDirection.Up);
        var m = b.Solve().Cases[0].Members["AB"];
        Near.Equal(m.StartMoment, -81.0, what: "M_AB"); // wL²/8 = 81 (Hicks Fig. 2.2 case 10)
        Near.Equal(m.EndMoment, 0, what: "M_BA");
    }
}
