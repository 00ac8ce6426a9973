namespace CrossCheck.Tests.Support;

/// <summary>
/// The continuous beam the combination tests share, as tables of a sectioned CSV submission without its <c>[info]</c>
/// table: two equal spans of 6 m (A pinned, B and C on rollers; E = 200 GPa, I = 250e6 mm⁴) under G = 18 kN/m and
/// Q = 12 kN/m on both spans. Support moment wL²/8 and end reaction 3wL/8 (docs/REFERENCE-CHECKS.md 3.1).
/// </summary>
public static class CombinationBeam
{
    /// <summary>The beam's supports (A pinned, B and C on rollers), which other two-span test beams share; no newline at the end.</summary>
    public const string Supports = """
        [supports]
        support,restraint
        A,pinned
        B,roller
        C,roller
        """;

    /// <summary>The beam's supports and spans without its loads (single-case tests load it their own way); no newline at the end.</summary>
    public const string Geometry = Supports + "\n\n" + """
        [spans]
        span,length,E [GPa],I [mm^4]
        AB,6,200,250e6
        BC,6,200,250e6
        """;

    public const string Tables = Geometry + "\n\n" + """
        [loads]
        case,on,kind,w
        G,AB,udl,18
        G,BC,udl,18
        Q,AB,udl,12
        Q,BC,udl,12

        """;

    /// <summary>The units of the tests (kN, m) with sagging-positive moments, and the beam.</summary>
    public const string Sagging = Reviewing.KnM + "sign convention,sagging\n\n" + Tables;
}
