using System.Globalization;

namespace CrossCheck.Analysis;

/// <summary>
/// Finds and names the free movements of a structure from its unit-stiffness matrix, whose only near-zero modes are
/// mechanisms (very different real stiffnesses cannot imitate one there).
/// </summary>
internal static class MechanismSearch
{
    /// <summary>
    /// The mechanism mode of the unit-stiffness matrix, if it has one: inverse iteration on a slightly shifted,
    /// Jacobi-scaled copy, confirmed by its Rayleigh quotient. Null when the structure is stable.
    /// </summary>
    public static (double[] Vector, double[] Scale)? Mode(ILinearSolver linear, SparseSymmetricMatrix k)
    {
        int n = k.Size;
        var scale = new double[n];
        for (int i = 0; i < n; i++) { double d = k.Diagonal(i); scale[i] = d > 0 ? 1 / Math.Sqrt(d) : 1; }
        // A unknown with no stiffness at all is a mode on its own.
        for (int i = 0; i < n; i++)
            if (!(k.Diagonal(i) > 0)) { var v = new double[n]; v[i] = 1; return (v, scale); }
        var shifted = new SparseSymmetricMatrix(n);
        for (int i = 0; i < n; i++)
            foreach (var (j, val) in k.LowerRow(i)) shifted.Add(i, j, val * scale[i] * scale[j]);
        for (int i = 0; i < n; i++) shifted.Add(i, i, 1e-10);
        ILinearFactor f;
        try { f = linear.Factor(shifted); }
        catch (SingularMatrixException) { return null; }
        var rnd = new Random(12345);
        var x = Enumerable.Range(0, n).Select(_ => rnd.NextDouble() - 0.5).ToArray();
        for (int it = 0; it < 8; it++)
        {
            x = f.Solve(x);
            double norm = Math.Sqrt(x.Sum(v => v * v));
            if (!(norm > 0) || !double.IsFinite(norm)) return null;
            for (int i = 0; i < n; i++) x[i] /= norm;
        }
        // Rayleigh quotient on the scaled unit matrix: a mechanism gives round-off, a stable frame at least ~1e-7.
        var kx = new double[n];
        for (int i = 0; i < n; i++)
            foreach (var (j, val) in k.LowerRow(i))
            {
                double sv = val * scale[i] * scale[j];
                kx[i] += sv * x[j];
                if (i != j) kx[j] += sv * x[i];
            }
        double rq = 0;
        for (int i = 0; i < n; i++) rq += x[i] * kx[i];
        return rq < 1e-9 ? (x, scale) : null;
    }

    /// <summary>
    /// A free movement of the structure: restrained with a note when no load drives it, a mechanism error when one does.
    /// </summary>
    public static List<(int Dof, string Note)> FreeMovements(FrameLayout frame, double[] mode, double[] scale, Transformation t,
        List<(double[] Full, double[] Reduced)> loads, List<string> caseIds)
    {
        int n = mode.Length;
        var modes = new List<double[]> { mode };
        var result = new List<(int, string)>();
        var taken = new HashSet<int>();
        foreach (var scaledMode in modes)
        {
            // Does any load case do work on this movement?
            for (int c = 0; c < loads.Count; c++)
            {
                double work = 0, norm = 0;
                for (int i = 0; i < n; i++)
                {
                    double fs = loads[c].Reduced[i] * scale[i];
                    work += scaledMode[i] * fs;
                    norm += fs * fs;
                }
                if (Math.Abs(work) > 1e-9 * Math.Sqrt(norm) && norm > 0)
                {
                    var (joint, dir, others) = Describe(frame, scaledMode, scale, t);
                    string also = others.Count > 0 ? $" (together with joint{(others.Count > 1 ? "s" : "")} {string.Join(", ", others)})" : "";
                    throw new StructureException(
                        $"The structure is a mechanism: joint {joint} can {Motion(dir)}{also} without any member or support resisting it, " +
                        $"and the loads of case {caseIds[c]} push it that way. Check the supports, the hinges and the member connections.",
                        joint, dir);
                }
            }
            int best = -1; double bestVal = 0;
            for (int i = 0; i < n; i++)
                if (!taken.Contains(i) && Math.Abs(scaledMode[i]) > bestVal + 1e-12) { bestVal = Math.Abs(scaledMode[i]); best = i; }
            if (best < 0) continue;
            taken.Add(best);
            int dof = t.Masters[best];
            string jointId = frame.Model.Joints[dof / 3].Id;
            result.Add((dof, string.Create(CultureInfo.InvariantCulture,
                $"Joint {jointId} is free to {Motion(FrameLayout.DirectionNames[dof % 3])} but no load drives that movement; it was held for the analysis (no effect on the results).")));
        }
        return result;
    }

    private static string Motion(string dir) => dir switch
    {
        "x" => "move horizontally (x)",
        "y" => "move vertically (y)",
        _ => "rotate",
    };

    /// <summary>The joint and direction that move most in a mode (a translation rather than a rotation when there is one), and the other joints that move with it.</summary>
    private static (string Joint, string Direction, List<string> Others) Describe(FrameLayout frame, double[] scaledMode, double[] scale, Transformation t)
    {
        var model = frame.Model;
        var q = scaledMode.Select((v, i) => v * scale[i]).ToArray();
        var d = t.Expand(q);
        for (int i = 0; i < d.Length; i++) d[i] -= t.Constants[i];
        double lref = frame.Elements.Length > 0 ? frame.Elements.Average(e => e.Length) : 1;
        // Prefer naming a translation (what an engineer calls sway or a falling joint) over a rotation.
        double maxTrans = 0;
        for (int i = 0; i < d.Length; i++) if (i % 3 != 2) maxTrans = Math.Max(maxTrans, Math.Abs(d[i]));
        int best = 0; double bestVal = -1;
        var moving = new List<(int Joint, double Size)>();
        for (int j = 0; j < model.Joints.Count; j++)
        {
            double size = 0;
            for (int dir = 0; dir < 3; dir++)
            {
                double v = Math.Abs(d[(3 * j) + dir]) * (dir == 2 ? lref : 1);
                size = Math.Max(size, v);
                bool eligible = dir != 2 || maxTrans <= 1e-9 * Math.Abs(d[(3 * j) + dir]) * lref;
                if (eligible && v > bestVal) { bestVal = v; best = (3 * j) + dir; }
            }
            moving.Add((j, size));
        }
        string joint = model.Joints[best / 3].Id;
        var others = moving.Where(m => m.Joint != best / 3 && m.Size > 1e-3 * bestVal)
            .Select(m => model.Joints[m.Joint].Id).Take(6).ToList();
        return (joint, FrameLayout.DirectionNames[best % 3], others);
    }
}
