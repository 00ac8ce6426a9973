using CrossCheck.Model;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Group 5 of docs/REFERENCE-CHECKS.md: single-bay portals, h = 4 m, L = 6 m, I_col = 2.0e-4 m⁴, E = 200 GPa,
/// k = (I_beam/I_col)(h/L) = 0.5 or 2. Columns AB and DC are drawn bottom to top.
/// Sources: Kleinlogel, Rigid Frame Formulas (Ungar) — frame and load-case numbers from memory;
/// Pilkey, Formulas for Stress, Strain, and Structural Matrices, Table 13-2 cases 1 and 6
/// (M_C = WL/[4(βe+2)], M_A = WL/[8(βe+2)], pinned 3Wa(L−a)/[2L(2βe+3)], βe = k).
/// </summary>
public class ReferencePortalFrameTests
{
    private const double H = 4, L = 6, Ic = 2.0e-4, E = 200e6, W = 18, Hload = 30, P = 40;

    private static FrameBuilder Portal(double k, Restraint feet)
    {
        double ib = k * Ic * L / H;
        return new FrameBuilder()
            .Joint("A", 0, 0, feet).Joint("B", 0, H).Joint("C", L, H).Joint("D", L, 0, feet)
            .Member("AB", "A", "B", E, Ic).Member("BC", "B", "C", E, ib).Member("DC", "D", "C", E, Ic);
    }

    private static void Moments(CrossCheck.Analysis.CaseResult r, double mab, double mba, double mbc, double mcb, double mcd, double mdc)
    {
        Near.Equal(r.Members["AB"].StartMoment, mab, what: "M_AB");
        Near.Equal(r.Members["AB"].EndMoment, mba, what: "M_BA");
        Near.Equal(r.Members["BC"].StartMoment, mbc, what: "M_BC");
        Near.Equal(r.Members["BC"].EndMoment, mcb, what: "M_CB");
        Near.Equal(r.Members["DC"].EndMoment, mcd, what: "M_CD");
        Near.Equal(r.Members["DC"].StartMoment, mdc, what: "M_DC");
    }

    [Theory] // 5.1 — fixed feet, UDL on the beam.
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void FixedFeet_Udl(double k)
    {
        var r = Portal(k, Restraint.Fixed).Udl("BC", W).Solve().Cases[0];
        double m = W * L * L / (6 * (k + 2));
        Moments(r, m / 2, m, -m, m, -m, -m / 2);
        Near.Equal(r.Reactions["A"].Rx, W * L * L / (4 * H * (k + 2)), what: "H_A");
    }

    [Theory] // 5.2 — pinned feet, UDL on the beam.
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void PinnedFeet_Udl(double k)
    {
        var r = Portal(k, Restraint.Pinned).Udl("BC", W).Solve().Cases[0];
        double m = W * L * L / (4 * ((2 * k) + 3));
        Moments(r, 0, m, -m, m, -m, 0);
        Near.Equal(r.Reactions["A"].Rx, W * L * L / (4 * H * ((2 * k) + 3)), what: "H_A");
    }

    [Theory] // 5.3 — fixed feet, horizontal load at beam level; drift also in the SEAINT list 1998 (forum, seen).
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void FixedFeet_Sway(double k)
    {
        var r = Portal(k, Restraint.Fixed).Force("B", Hload, LoadDirection.Right).Solve().Cases[0];
        double foot = -Hload * H * ((3 * k) + 1) / (2 * ((6 * k) + 1));
        double knee = 3 * k * Hload * H / (2 * ((6 * k) + 1));
        Moments(r, foot, -knee, knee, knee, -knee, foot);
        Near.Equal(r.Displacements["B"].Ux, Hload * H * H * H * ((3 * k) + 2) / (12 * E * Ic * ((6 * k) + 1)), absolute: 1e-12, what: "drift");
        Near.Equal(r.Reactions["A"].Rx + r.Reactions["D"].Rx, -Hload);
    }

    [Theory] // 5.4 — pinned feet, horizontal load: M = Hh/2 at the knees, V_A = −Hh/L; drift Hh²/(12E)(2h/I_c + L/I_b) derived (docs/REFERENCE-CHECKS.md; the forum formula disagrees).
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void PinnedFeet_Sway(double k)
    {
        double ib = k * Ic * L / H;
        var r = Portal(k, Restraint.Pinned).Force("B", Hload, LoadDirection.Right).Solve().Cases[0];
        double m = Hload * H / 2;
        Moments(r, 0, -m, m, m, -m, 0);
        Near.Equal(r.Reactions["A"].Ry, -Hload * H / L, what: "V_A");
        Near.Equal(r.Displacements["C"].Ux, Hload * H * H / (12 * E) * ((2 * H / Ic) + (L / ib)), absolute: 1e-12, what: "drift");
    }

    [Theory] // 5.5 — fixed feet, central point load (Pilkey Table 13-2 case 1: M_A = WL/[8(k+2)], M_C = WL/[4(k+2)], M under load (WL/4)(k+1)/(k+2)).
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void FixedFeet_CentralPoint(double k)
    {
        var r = Portal(k, Restraint.Fixed).Point("BC", P, L / 2).Solve().Cases[0];
        double m = P * L / (4 * (k + 2));
        Moments(r, m / 2, m, -m, m, -m, -m / 2);
        Near.Equal(r.Members["BC"].MaxSagging.Moment, P * L / 4 * (k + 1) / (k + 2), what: "M under load");
        Near.Equal(r.Members["BC"].MaxSagging.X, L / 2, what: "position of max");
    }

    [Theory] // 5.6 — pinned feet, central point load (Pilkey Table 13-2 case 6: 3Wa(L−a)/[2L(2k+3)], a = L/2).
    [InlineData(0.5)]
    [InlineData(2.0)]
    public void PinnedFeet_CentralPoint(double k)
    {
        var r = Portal(k, Restraint.Pinned).Point("BC", P, L / 2).Solve().Cases[0];
        double m = 3 * P * L / (8 * ((2 * k) + 3));
        Moments(r, 0, m, -m, m, -m, 0);
    }
}
