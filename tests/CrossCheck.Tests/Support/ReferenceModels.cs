using CrossCheck.Model;

namespace CrossCheck.Tests.Support;

/// <summary>
/// The structures and loads of docs/REFERENCE-CHECKS.md groups 1–7 (kN, m; E = 200 GPa = 200e6 kN/m²), for tests that
/// run every reference case through a second method.
/// </summary>
public static class ReferenceModels
{
    private const double E = 200e6;

    public static IEnumerable<(string Id, FrameBuilder Model)> All()
    {
        FrameBuilder Clamped() => new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Fixed).Member("AB", "A", "B", E, 2.5e-4);
        FrameBuilder Propped() => new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Roller).Member("AB", "A", "B", E, 2.5e-4);
        yield return ("1.1", Clamped().Udl("AB", 18));
        yield return ("1.2", Clamped().Point("AB", 40, 3));
        yield return ("1.3", Clamped().Point("AB", 40, 2));
        yield return ("1.4", Clamped().Udl("AB", 18, a: 0, b: 3));
        yield return ("1.5", Clamped().Udl("AB", 18, a: 1, b: 4));
        yield return ("1.6", Clamped().Linear("AB", 0, 18));
        yield return ("1.7", Clamped().Linear("AB", 0, 18, 0, 3).Linear("AB", 18, 0, 3, 6));
        yield return ("1.8a", Clamped().Couple("AB", 30, 1.5));
        yield return ("1.9", new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Fixed, new SupportMovement(0, -0.01, 0)).Member("AB", "A", "B", E, 2.5e-4));
        yield return ("1.10", new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed, new SupportMovement(0, 0, 0.001)).Joint("B", 6, 0, Restraint.Fixed).Member("AB", "A", "B", E, 2.5e-4));
        yield return ("2.1", Propped().Udl("AB", 18));
        yield return ("2.2", Propped().Point("AB", 40, 3));
        yield return ("2.3", Propped().Point("AB", 40, 2));
        yield return ("2.4a", Propped().Linear("AB", 0, 18));
        yield return ("2.4b", Propped().Linear("AB", 18, 0));
        yield return ("2.5a", Propped().JointMoment("B", 30));
        yield return ("2.5b", new FrameBuilder().Joint("A", 0, 0, Restraint.Pinned).Joint("B", 6, 0, Restraint.Roller).Member("AB", "A", "B", E, 2.5e-4).JointMoment("A", 30));
        yield return ("2.6", new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Roller, new SupportMovement(0, -0.01, 0)).Member("AB", "A", "B", E, 2.5e-4));
        yield return ("2.7", new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0).Member("AB", "A", "B", E, 2.5e-4).Force("B", 40, LoadDirection.Down));
        yield return ("2.8", new FrameBuilder().Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Guided).Member("AB", "A", "B", E, 2.5e-4).Udl("AB", 18));
        for (int n = 2; n <= 7; n++)
        {
            var b = EqualSpans(n);
            for (int k = 1; k <= n; k++) b.Udl("S" + k, 18);
            yield return ($"3.{n - 1} ({n} spans, all loaded)", b);
        }
        yield return ("3.7", EqualSpans(2).Udl("S1", 18));
        yield return ("3.8", EqualSpans(3).Udl("S1", 18).Udl("S3", 18));
        yield return ("3.9", EqualSpans(3).Udl("S1", 18).Udl("S2", 18));
        yield return ("3.10", EqualSpans(4).Udl("S1", 18).Udl("S3", 18));
        yield return ("3.11", EqualSpans(4).Udl("S1", 18).Udl("S2", 18).Udl("S4", 18));
        yield return ("3.12", EqualSpans(2).Point("S1", 40, 3));
        yield return ("3.13", EqualSpans(2).Point("S1", 40, 3).Point("S2", 40, 3));
        yield return ("3.14", EqualSpans(2).Point("S1", 40, 2));
        yield return ("3.15", FrameBuilder.Beam([5, 7], [Restraint.Pinned, Restraint.Roller, Restraint.Roller], E, [2.5e-4, 2.5e-4]).Udl("S1", 18).Udl("S2", 18));
        yield return ("4a", Unequal(Restraint.Pinned));
        yield return ("4b", Unequal(Restraint.Fixed));
        yield return ("4c", Unequal(Restraint.Pinned, new SupportMovement(0, -0.012, 0)));
        foreach (var k in new[] { 0.5, 2.0 })
        {
            yield return ($"5.1 (k={k})", Portal(k, Restraint.Fixed).Udl("BC", 18));
            yield return ($"5.2 (k={k})", Portal(k, Restraint.Pinned).Udl("BC", 18));
            yield return ($"5.3 (k={k})", Portal(k, Restraint.Fixed).Force("B", 30, LoadDirection.Right));
            yield return ($"5.4 (k={k})", Portal(k, Restraint.Pinned).Force("B", 30, LoadDirection.Right));
            yield return ($"5.5 (k={k})", Portal(k, Restraint.Fixed).Point("BC", 40, 3));
            yield return ($"5.6 (k={k})", Portal(k, Restraint.Pinned).Point("BC", 40, 3));
        }
        yield return ("6a", Frame6a());
        yield return ("6b", Frame6b());
        yield return ("7.3", new FrameBuilder()
            .Joint("B", 0, 0).Joint("A", -5, 0, Restraint.Fixed).Joint("C", 6, 0, Restraint.Pinned).Joint("D", 0, -4, Restraint.Fixed)
            .Member("BA", "B", "A", E, 3.0e-4).Member("BC", "B", "C", E, 2.0e-4).Member("BD", "B", "D", E, 2.5e-4).JointMoment("B", 100));
    }

    public static FrameBuilder EqualSpans(int n) =>
        FrameBuilder.Beam(Enumerable.Repeat(6.0, n).ToArray(), Enumerable.Range(0, n + 1).Select(i => i == 0 ? Restraint.Pinned : Restraint.Roller).ToArray(),
            E, Enumerable.Repeat(2.5e-4, n).ToArray());

    public static FrameBuilder Unequal(Restraint first, SupportMovement cMovement = default) => new FrameBuilder()
        .Joint("A", 0, 0, first).Joint("B", 5, 0, Restraint.Roller).Joint("C", 12.5, 0, Restraint.Roller, cMovement).Joint("D", 16.5, 0, Restraint.Roller)
        .Member("AB", "A", "B", E, 2.0e-4).Member("BC", "B", "C", E, 4.0e-4).Member("CD", "C", "D", E, 1.5e-4)
        .Udl("AB", 20).Udl("BC", 12).Point("BC", 60, 3.0).Point("CD", 45, 1.5);

    public static FrameBuilder Portal(double k, Restraint feet) => new FrameBuilder()
        .Joint("A", 0, 0, feet).Joint("B", 0, 4).Joint("C", 6, 4).Joint("D", 6, 0, feet)
        .Member("AB", "A", "B", E, 2.0e-4).Member("BC", "B", "C", E, k * 2.0e-4 * 6 / 4).Member("DC", "D", "C", E, 2.0e-4);

    public static FrameBuilder Frame6a() => new FrameBuilder()
        .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 6, 0, Restraint.Fixed).Joint("C", 0, 4.5).Joint("D", 6, 4.5).Joint("E", 0, 8).Joint("F", 6, 8)
        .Member("AC", "A", "C", E, 3.0e-4).Member("BD", "B", "D", E, 3.0e-4).Member("CE", "C", "E", E, 2.0e-4).Member("DF", "D", "F", E, 2.0e-4)
        .Member("CD", "C", "D", E, 4.0e-4).Member("EF", "E", "F", E, 3.0e-4)
        .Udl("CD", 25).Udl("EF", 15).Force("C", 20, LoadDirection.Right).Force("E", 10, LoadDirection.Right);

    public static FrameBuilder Frame6b() => new FrameBuilder()
        .Joint("A", 0, 0, Restraint.Fixed).Joint("B", 5, 0, Restraint.Pinned).Joint("C", 12, 0, Restraint.Fixed)
        .Joint("D", 0, 4).Joint("E", 5, 4).Joint("F", 12, 4)
        .Member("AD", "A", "D", E, 2.0e-4).Member("BE", "B", "E", E, 3.0e-4).Member("CF", "C", "F", E, 2.0e-4)
        .Member("DE", "D", "E", E, 3.0e-4).Member("EF", "E", "F", E, 5.0e-4)
        .Udl("DE", 10).Point("DE", 50, 2).Udl("EF", 20).Force("D", 25, LoadDirection.Right);
}
