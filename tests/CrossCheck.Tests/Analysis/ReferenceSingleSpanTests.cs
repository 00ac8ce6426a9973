using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>Group 2 of docs/REFERENCE-CHECKS.md: propped cantilevers, modified stiffness and related single spans.</summary>
public class ReferenceSingleSpanTests
{
    private const double L = 6, W = 18, P = 40, E = 200e6, I = 2.5e-4, EI = E * I;

    private static FrameBuilder Propped() => new FrameBuilder()
        .Joint("A", 0, 0, Restraint.Fixed).Joint("B", L, 0, Restraint.Roller).Member("AB", "A", "B", E, I);

    private static MemberResult Solve(FrameBuilder b) => b.Solve().Cases[0].Members["AB"];

    [Fact] // 2.1 — AISC Table 3-23 case 12 (from memory); Hicks Fig. 2.2 case 10 "M1 = WL/8".
    public void ProppedUdl()
    {
        var m = Solve(Propped().Udl("AB", W));
        Near.Equal(m.StartMoment, -W * L * L / 8);
        Near.Equal(m.EndMoment, 0);
    }

    [Fact] // 2.2 — AISC Table 3-23 case 13 (from memory): 3PL/16.
    public void ProppedCentralPoint() => Near.Equal(Solve(Propped().Point("AB", P, 3)).StartMoment, -3 * P * L / 16);

    [Fact] // 2.3 — AISC Table 3-23 case 14 (from memory): Pb(L² − b²)/(2L²), b from the prop.
    public void ProppedPointAnywhere()
    {
        double b = 4;
        Near.Equal(Solve(Propped().Point("AB", P, L - b)).StartMoment, -P * b * ((L * L) - (b * b)) / (2 * L * L));
    }

    [Fact] // 2.4a — modified-FEM rule FEM_AB − ½·FEM_BA (Hibbeler, from memory); Roark Table 8.1 case 2c (from memory).
    public void ProppedTriangleMaxAtProp()
    {
        var m = Solve(Propped().Linear("AB", 0, W));
        Near.Equal(m.StartMoment, -7 * W * L * L / 120);
        Near.Equal(m.EndMoment, 0);
    }

    [Fact] // 2.4b — same rule; Roark Table 8.1 case 2c (from memory): wL²/15.
    public void ProppedTriangleMaxAtFixedEnd() => Near.Equal(Solve(Propped().Linear("AB", W, 0)).StartMoment, -W * L * L / 15);

    [Fact] // 2.5a — slope-deflection / moment distribution basics (common practice; Hibbeler, from memory): carry-over ½, θ = ML/(4EI).
    public void MomentAtProp_CarriesOverHalf()
    {
        const double m0 = 30;
        var r = Propped().JointMoment("B", m0).Solve().Cases[0];
        Near.Equal(r.Members["AB"].EndMoment, m0);
        Near.Equal(r.Members["AB"].StartMoment, m0 / 2);
        Near.Equal(r.Displacements["B"].Rotation, m0 * L / (4 * EI), absolute: 1e-12);
    }

    [Fact] // 2.5b — "modified stiffness" 3EI/L rule (common practice; Hibbeler, from memory).
    public void MomentAtPinnedEnd_FarEndPinned_Uses3EIOverL()
    {
        const double m0 = 30;
        var r = new FrameBuilder().Joint("A", 0, 0, Restraint.Pinned).Joint("B", L, 0, Restraint.Roller)
            .Member("AB", "A", "B", E, I).JointMoment("A", m0).Solve().Cases[0];
        Near.Equal(r.Displacements["A"].Rotation, m0 * L / (3 * EI), absolute: 1e-12);
        Near.Equal(r.Members["AB"].StartMoment, m0);
        Near.Equal(r.Members["AB"].EndMoment, 0);
    }

    [Fact] // 2.6 — Roark Table 8.1 case 5c (from memory); slope-deflection, modified form: 3EIΔ/L².
    public void ProppedEndSettles()
    {
        const double delta = 0.010;
        var m = Solve(new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed)
            .Joint("B", L, 0, Restraint.Roller, new SupportMovement(0, -delta, 0)).Member("AB", "A", "B", E, I));
        Near.Equal(m.StartMoment, -3 * EI * delta / (L * L));
        Near.Equal(m.EndMoment, 0);
    }

    [Fact] // 2.7 — statics; AISC Table 3-23 "cantilever, concentrated load at free end" (from memory): PL.
    public void CantileverTipLoad()
    {
        var b = new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", L, 0).Member("AB", "A", "B", E, I)
            .Force("B", P, LoadDirection.Down);
        var m = Solve(b);
        Near.Equal(m.StartMoment, -P * L);
        Near.Equal(m.EndMoment, 0);
    }

    [Fact] // 2.8 — AISC Table 3-23 "fixed at one end, free to deflect vertically but not rotate at other — UDL" (from memory).
    public void FixedGuidedUdl()
    {
        var m = Solve(new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", L, 0, Restraint.Guided)
            .Member("AB", "A", "B", E, I).Udl("AB", W));
        Near.Equal(m.StartMoment, -W * L * L / 3);
        Near.Equal(m.EndMoment, -W * L * L / 6);
    }
}
