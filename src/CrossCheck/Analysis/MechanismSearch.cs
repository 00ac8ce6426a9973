namespace CrossCheck.Analysis;

/// <summary>
/// A structure that cannot stand is refused whatever its loads: a loose part (members connected to nothing that is
/// supported) by the topology, a mechanism by the stiffness. Mechanisms are found in the unit-stiffness matrix, whose
/// only near-zero modes are mechanisms (very different real stiffnesses cannot imitate one there), and named by the
/// joints that move and their directions.
/// </summary>
internal static class MechanismSearch
{
    /// <summary>Independent mechanisms looked for (and named) before the message says there are more.</summary>
    private const int MaxNamed = 3;

    /// <summary>Members, or joints, listed in a message before it says how many more there are.</summary>
    private const int MaxListed = 6;

    /// <summary>Refuses a structure any of whose connected parts has no supported joint, naming the part.</summary>
    /// <exception cref="StructureException">A loose part.</exception>
    public static void RefuseLooseParts(FrameLayout frame)
    {
        var model = frame.Model;
        int count = model.Joints.Count;
        var parent = Enumerable.Range(0, count).ToArray();
        int Root(int j)
        {
            while (parent[j] != j) j = parent[j] = parent[parent[j]];
            return j;
        }
        foreach (var e in frame.Elements) parent[Root(e.StartJoint)] = Root(e.EndJoint);
        var supported = new HashSet<int>();
        for (int j = 0; j < count; j++) if (model.Joints[j].IsSupport) supported.Add(Root(j));
        if (supported.Count == 0)
            throw new StructureException(
                "The structure has no supports: nothing holds it in place, so it is a mechanism whatever the loads. Give the supported joints their restraints.",
                count > 0 ? model.Joints[0].Id : null, null);
        var loose = frame.Elements.Where(e => !supported.Contains(Root(e.StartJoint))).GroupBy(e => Root(e.StartJoint)).ToList();
        if (loose.Count == 0) return;
        var part = loose[0].ToList();
        var joints = part.SelectMany(e => new[] { e.StartJoint, e.EndJoint }).Distinct().Order().Select(j => model.Joints[j].Id).ToList();
        string what = part.Count == 1
            ? $"Member {part[0].Member.Id} (joints {joints[0]} and {joints[1]}) is connected to nothing that is supported"
            : $"Members {List(part.Select(e => e.Member.Id).ToList())} (joints {List(joints)}) form a part connected to nothing that is supported";
        string others = loose.Count > 1 ? $" The structure has {loose.Count} such loose parts." : "";
        throw new StructureException(
            $"{what}: nothing holds it in place, so it is a mechanism whatever the loads.{others} " +
            "Connect it to the structure (check the joint names of its members) or remove it.", joints[0], null);
    }

    /// <summary>
    /// The independent mechanisms of the unit-stiffness matrix <paramref name="k"/> (up to <see cref="MaxNamed"/> + 1),
    /// each as a pattern of the independent unknowns: one mode is found, its largest unknown held, and the search
    /// repeated on what is left. Empty when the structure is stable.
    /// </summary>
    public static List<double[]> Modes(ILinearSolver linear, SparseSymmetricMatrix k)
    {
        int n = k.Size;
        var active = Enumerable.Range(0, n).ToList();
        var modes = new List<double[]>();
        var current = k;
        while (modes.Count <= MaxNamed && active.Count > 0)
        {
            if (Mode(linear, current) is not { } mode) break;
            var q = new double[n];
            int held = 0;
            for (int i = 0; i < active.Count; i++)
            {
                q[active[i]] = mode.Vector[i] * mode.Scale[i];
                if (Math.Abs(mode.Vector[i]) > Math.Abs(mode.Vector[held])) held = i;
            }
            modes.Add(q);
            active.RemoveAt(held);
            current = Without(current, held);
        }
        return modes;
    }

    /// <summary>The refusal of a mechanism: which joints can move, in which direction, for each mode found.</summary>
    public static StructureException Refusal(FrameLayout frame, Transformation t, List<double[]> modes, Exception? inner)
    {
        var (joint, dir, others) = Describe(frame, modes[0], t);
        string message = $"The structure is a mechanism: joint {joint} can {Motion(dir)}{Together(others)} without any member or support resisting it.";
        foreach (var mode in modes.Skip(1).Take(MaxNamed - 1))
        {
            var (j2, d2, o2) = Describe(frame, mode, t);
            message += $" Independently, joint {j2} can {Motion(d2)}{Together(o2)}.";
        }
        if (modes.Count > MaxNamed) message += $" It has more than {MaxNamed} independent free movements.";
        message += " A structure that cannot stand is not analysed, whatever the loads: check the supports, the hinges and the member connections.";
        return inner is null ? new StructureException(message, joint, dir) : new StructureException(message, joint, dir, inner);
    }

    /// <summary>
    /// The mechanism mode of the unit-stiffness matrix, if it has one: inverse iteration on a slightly shifted,
    /// Jacobi-scaled copy, confirmed by its Rayleigh quotient. Null when the structure is stable.
    /// </summary>
    private static (double[] Vector, double[] Scale)? Mode(ILinearSolver linear, SparseSymmetricMatrix k)
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

    /// <summary>The matrix without row and column <paramref name="removed"/> (a held unknown).</summary>
    private static SparseSymmetricMatrix Without(SparseSymmetricMatrix k, int removed)
    {
        var r = new SparseSymmetricMatrix(k.Size - 1);
        for (int i = 0; i < k.Size; i++)
        {
            if (i == removed) continue;
            foreach (var (j, v) in k.LowerRow(i))
                if (j != removed) r.Add(i > removed ? i - 1 : i, j > removed ? j - 1 : j, v);
        }
        return r;
    }

    private static string Motion(string dir) => dir switch
    {
        "x" => "move horizontally (x)",
        "y" => "move vertically (y)",
        _ => "rotate",
    };

    /// <summary>
    /// <c> (together with joints C (x) and A, D (rotation))</c>: the joints that move most, translations first, and how
    /// many more there are.
    /// </summary>
    private static string Together(List<(string Joint, string Direction)> all)
    {
        if (all.Count == 0) return "";
        var others = all.Take(MaxListed).ToList();
        string more = all.Count > MaxListed ? $"; and {all.Count - MaxListed} more" : "";
        var groups = others.GroupBy(o => o.Direction).OrderBy(g => Array.IndexOf(FrameLayout.DirectionNames, g.Key))
            .Select(g => $"{string.Join(", ", g.Select(o => o.Joint))} ({g.Key})").ToList();
        string listed = groups.Count == 1 ? groups[0] : $"{string.Join(", ", groups.Take(groups.Count - 1))} and {groups[^1]}";
        return $" (together with joint{(all.Count > 1 ? "s" : "")} {listed}{more})";
    }

    private static string List(List<string> ids) =>
        ids.Count <= MaxListed ? string.Join(", ", ids) : $"{string.Join(", ", ids.Take(MaxListed))} and {ids.Count - MaxListed} more";

    /// <summary>
    /// The joint and direction that move most in a mode <paramref name="q"/> (a translation rather than a rotation
    /// when there is one), and the other joints that move with it, each with its own main direction, most moving first.
    /// </summary>
    private static (string Joint, string Direction, List<(string Joint, string Direction)> Others) Describe(FrameLayout frame, double[] q, Transformation t)
    {
        var model = frame.Model;
        var d = t.Expand(q);
        for (int i = 0; i < d.Length; i++) d[i] -= t.Constants[i];
        double lref = frame.ReferenceLength;
        // Prefer naming a translation (what an engineer calls sway or a falling joint) over a rotation.
        double maxTrans = 0;
        for (int i = 0; i < d.Length; i++) if (i % 3 != 2) maxTrans = Math.Max(maxTrans, Math.Abs(d[i]));
        int best = 0; double bestVal = -1;
        var moving = new List<(int Joint, double Size, int Direction)>();
        for (int j = 0; j < model.Joints.Count; j++)
        {
            double size = 0, largestTranslation = 0;
            int main = 2;
            for (int dir = 0; dir < 3; dir++)
            {
                double v = Math.Abs(d[(3 * j) + dir]) * (dir == 2 ? lref : 1);
                size = Math.Max(size, v);
                if (dir != 2 && v > largestTranslation) { largestTranslation = v; main = dir; }
                bool eligible = dir != 2 || maxTrans <= 1e-9 * Math.Abs(d[(3 * j) + dir]) * lref;
                if (eligible && v > bestVal) { bestVal = v; best = (3 * j) + dir; }
            }
            moving.Add((j, size, largestTranslation > 1e-3 * size ? main : 2));
        }
        string joint = model.Joints[best / 3].Id;
        var others = moving.Where(m => m.Joint != best / 3 && m.Size > 1e-3 * bestVal).OrderByDescending(m => m.Size)
            .Select(m => (model.Joints[m.Joint].Id, FrameLayout.DirectionNames[m.Direction])).ToList();
        return (joint, FrameLayout.DirectionNames[best % 3], others);
    }
}
