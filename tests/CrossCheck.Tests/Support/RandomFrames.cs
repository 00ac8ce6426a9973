using CrossCheck.Model;
using CsCheck;

namespace CrossCheck.Tests.Support;

/// <summary>Random regular frames (bays × storeys) with random sections, supports, hinges and loads, for property tests.</summary>
public sealed record FrameShape(int Bays, int Storeys, bool FixedBases, bool Elastic, bool Hinges, int Variant);

public static class RandomFrames
{
    public static readonly LoadDirection[] Directions = [LoadDirection.Down, LoadDirection.Up, LoadDirection.Left, LoadDirection.Right];

    /// <summary>
    /// Random shapes for property tests: 1 to 3 bays, 1 to <paramref name="maxStoreys"/> storeys, fixed or pinned bases,
    /// elastic supports or not, hinges or not (a frame with hinges always on fixed bases), any variant.
    /// </summary>
    public static Gen<FrameShape> Shapes(int maxStoreys = 3) =>
        Gen.Select(Gen.Int[1, 3], Gen.Int[1, maxStoreys], Gen.Bool, Gen.Bool, Gen.Bool, Gen.Int)
            .Select(t => new FrameShape(t.Item1, t.Item2, t.Item3 || t.Item5, t.Item4, t.Item5, t.Item6));

    /// <summary>Builds the frame; joints J{col}_{level}, columns C{col}_{storey}, beams B{bay}_{level}.</summary>
    public static FrameBuilder Build(FrameShape s, int loadCases = 1, Func<double, double, (double, double)>? map = null)
    {
        var rnd = new Random(s.Variant);
        map ??= (x, y) => (x, y);
        var b = new FrameBuilder();
        if (s.Elastic) b.Elastic();
        var xs = new double[s.Bays + 1];
        for (int i = 1; i <= s.Bays; i++) xs[i] = xs[i - 1] + 3 + (6 * rnd.NextDouble());
        var ys = new double[s.Storeys + 1];
        for (int j = 1; j <= s.Storeys; j++) ys[j] = ys[j - 1] + 2.5 + (2.5 * rnd.NextDouble());
        for (int i = 0; i <= s.Bays; i++)
            for (int j = 0; j <= s.Storeys; j++)
            {
                var (x, y) = map(xs[i], ys[j]);
                var r = j > 0 ? Restraint.Free : s.FixedBases || (i == 0) ? Restraint.Fixed : Restraint.Pinned;
                b.Joint($"J{i}_{j}", x, y, r);
            }
        double Area() => s.Elastic ? 5e-3 + (1.5e-2 * rnd.NextDouble()) : 0;
        for (int i = 0; i <= s.Bays; i++)
            for (int j = 1; j <= s.Storeys; j++)
                b.Member($"C{i}_{j}", $"J{i}_{j - 1}", $"J{i}_{j}", 200e6, 1e-4 + (7e-4 * rnd.NextDouble()), s.Elastic ? Area() : null);
        for (int i = 1; i <= s.Bays; i++)
            for (int j = 1; j <= s.Storeys; j++)
            {
                var hinge = s.Hinges ? (Hinge)rnd.Next(0, 4) : Hinge.None;
                b.Member($"B{i}_{j}", $"J{i - 1}_{j}", $"J{i}_{j}", 200e6, 1e-4 + (7e-4 * rnd.NextDouble()), s.Elastic ? Area() : null, hinge);
            }
        for (int c = 1; c <= loadCases; c++) AddLoads(b, s, rnd, c.ToString(System.Globalization.CultureInfo.InvariantCulture));
        return b;
    }

    private static void AddLoads(FrameBuilder b, FrameShape s, Random rnd, string caseId)
    {
        var members = new List<string>();
        for (int i = 0; i <= s.Bays; i++) for (int j = 1; j <= s.Storeys; j++) members.Add($"C{i}_{j}");
        for (int i = 1; i <= s.Bays; i++) for (int j = 1; j <= s.Storeys; j++) members.Add($"B{i}_{j}");
        int n = 1 + rnd.Next(5);
        for (int k = 0; k < n; k++)
        {
            string m = members[rnd.Next(members.Count)];
            double L = b.Length(m);
            var dir = Directions[rnd.Next(4)];
            switch (rnd.Next(6))
            {
                case 0: b.Udl(m, 5 + (20 * rnd.NextDouble()), dir, caseId); break;
                case 1: b.Point(m, 10 + (50 * rnd.NextDouble()), L * rnd.NextDouble(), dir, caseId); break;
                case 2:
                {
                    double a = L * rnd.NextDouble() * 0.5, e = a + ((L - a) * rnd.NextDouble());
                    b.Linear(m, 20 * rnd.NextDouble(), 20 * rnd.NextDouble(), a, e, dir, caseId);
                    break;
                }
                case 3: b.Couple(m, 40 * (rnd.NextDouble() - 0.5), L * rnd.NextDouble(), caseId); break;
                case 4: b.Force($"J{rnd.Next(s.Bays + 1)}_{1 + rnd.Next(s.Storeys)}", 5 + (30 * rnd.NextDouble()), dir, caseId); break;
                default: b.JointMoment($"J{rnd.Next(s.Bays + 1)}_{1 + rnd.Next(s.Storeys)}", 60 * (rnd.NextDouble() - 0.5), caseId); break;
            }
        }
    }
}
