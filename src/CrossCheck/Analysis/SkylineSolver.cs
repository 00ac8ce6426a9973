namespace CrossCheck.Analysis;

/// <summary>
/// Sparse symmetric solver for large frames: reverse Cuthill–McKee ordering (nodes of very high degree, such as
/// the sway unknown of a wide storey, numbered last), then an LDLᵀ factorisation stored as a skyline (variable band)
/// on a Jacobi-scaled copy. Memory and time grow with n·b² for a band b, close to linear in frame size for regular frames.
/// </summary>
public sealed class SkylineSolver : ILinearSolver
{
    public static SkylineSolver Instance { get; } = new();

    public ILinearFactor Factor(SparseSymmetricMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int n = matrix.Size;
        var scale = new double[n];
        for (int i = 0; i < n; i++)
        {
            double d = matrix.Diagonal(i);
            if (!(d > 0)) throw new SingularMatrixException($"Zero or negative stiffness on unknown {i}.", i);
            scale[i] = 1 / Math.Sqrt(d);
        }
        var perm = Ordering.ReverseCuthillMcKee(matrix); // perm[new] = old
        var inv = new int[n];
        for (int k = 0; k < n; k++) inv[perm[k]] = k;

        // Profile: first column of each permuted row.
        var first = new int[n];
        for (int k = 0; k < n; k++) first[k] = k;
        for (int i = 0; i < n; i++)
            foreach (var (j, _) in matrix.LowerRow(i))
            {
                int a = inv[i], b = inv[j];
                if (a < b) (a, b) = (b, a);
                if (b < first[a]) first[a] = b;
            }
        var start = new long[n + 1];
        for (int k = 0; k < n; k++) start[k + 1] = start[k] + (k - first[k] + 1);
        if (start[n] > int.MaxValue) throw new InvalidOperationException("The stiffness matrix is too large for the skyline store.");
        var v = new double[start[n]];
        for (int i = 0; i < n; i++)
            foreach (var (j, value) in matrix.LowerRow(i))
            {
                int a = inv[i], b = inv[j];
                if (a < b) (a, b) = (b, a);
                v[start[a] + (b - first[a])] += value * scale[i] * scale[j];
            }

        // Row-oriented LDLᵀ (Crout): for row i, u_ij = L_ij·D_j first, then L_ij = u_ij / D_j.
        var diag = new double[n];
        double minRatio = double.PositiveInfinity;
        for (int i = 0; i < n; i++)
        {
            long ri = start[i];
            int fi = first[i];
            for (int j = fi; j < i; j++)
            {
                long rj = start[j];
                int fj = first[j];
                int k0 = Math.Max(fi, fj);
                double s = v[ri + (j - fi)];
                long pi = ri + (k0 - fi), pj = rj + (k0 - fj);
                for (int k = k0; k < j; k++, pi++, pj++) s -= v[pi] * v[pj];
                v[ri + (j - fi)] = s; // u_ij; the later rows read L_jk of finished rows only
            }
            double a = v[ri + (i - fi)];
            double di = a;
            for (int j = fi; j < i; j++)
            {
                long p = ri + (j - fi);
                double u = v[p];
                double l = u / diag[j];
                v[p] = l;
                di -= u * l;
            }
            diag[i] = di;
            v[ri + (i - fi)] = 1;
            double ratio = di / a; // the scaled diagonal is 1, so this is the pivot ratio
            if (!(ratio > DenseCholeskySolver.SingularPivotRatio))
                throw new SingularMatrixException(di <= 0 && ratio < -1e-9 ? "The stiffness matrix is not positive definite." : "The stiffness matrix is singular.", perm[i]);
            minRatio = Math.Min(minRatio, ratio);
        }
        return new Factorised(perm, first, start, v, diag, scale, n == 0 ? 1 : minRatio);
    }

    private sealed class Factorised(int[] perm, int[] first, long[] start, double[] v, double[] diag, double[] scale, double minRatio) : ILinearFactor
    {
        public int Size => perm.Length;
        public double MinPivotRatio => minRatio;

        public double[] Solve(double[] rhs)
        {
            int n = perm.Length;
            var y = new double[n];
            for (int k = 0; k < n; k++) y[k] = rhs[perm[k]] * scale[perm[k]];
            // L·z = y (unit lower triangle, row-oriented).
            for (int i = 0; i < n; i++)
            {
                double s = y[i];
                long p = start[i];
                for (int j = first[i]; j < i; j++, p++) s -= v[p] * y[j];
                y[i] = s;
            }
            for (int i = 0; i < n; i++) y[i] /= diag[i];
            // Lᵀ·x = z (column sweep over rows).
            for (int i = n - 1; i >= 0; i--)
            {
                double xi = y[i];
                long p = start[i];
                for (int j = first[i]; j < i; j++, p++) y[j] -= v[p] * xi;
            }
            var x = new double[n];
            for (int k = 0; k < n; k++) x[perm[k]] = y[k] * scale[perm[k]];
            return x;
        }
    }
}

/// <summary>Chooses the dense solver for small systems and the skyline solver above a size threshold.</summary>
public sealed class AutoSolver : ILinearSolver
{
    /// <summary>Unknowns above which the sparse path is used.</summary>
    public const int SparseThreshold = 300;

    public static AutoSolver Instance { get; } = new();

    public ILinearFactor Factor(SparseSymmetricMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        return matrix.Size > SparseThreshold ? SkylineSolver.Instance.Factor(matrix) : DenseCholeskySolver.Instance.Factor(matrix);
    }
}

/// <summary>Bandwidth-reducing orderings.</summary>
internal static class Ordering
{
    /// <summary>
    /// Reverse Cuthill–McKee from a pseudo-peripheral start in every connected part; nodes with a degree far above
    /// the typical one are left out of the sweep and numbered last, where they cost least in a skyline.
    /// </summary>
    /// <returns>perm[new index] = old index.</returns>
    public static int[] ReverseCuthillMcKee(SparseSymmetricMatrix a)
    {
        int n = a.Size;
        var adj = new List<int>[n];
        for (int i = 0; i < n; i++) adj[i] = [];
        for (int i = 0; i < n; i++)
            foreach (var (j, _) in a.LowerRow(i))
                if (j != i) { adj[i].Add(j); adj[j].Add(i); }
        var degree = adj.Select(l => l.Count).ToArray();
        if (n == 0) return [];
        var sorted = degree.Order().ToArray();
        int median = sorted[n / 2];
        // Only nodes far denser than the rest (the sway unknown of a very wide storey) are worth setting aside.
        int denseLimit = Math.Max(Math.Max(64, 10 * Math.Max(median, 1)), (int)(4 * Math.Sqrt(n)));
        var dense = new bool[n];
        for (int i = 0; i < n; i++) dense[i] = degree[i] > denseLimit;
        foreach (var l in adj) l.Sort((x, y) => degree[x].CompareTo(degree[y]));

        var order = new List<int>(n);
        var visited = (bool[])dense.Clone();
        for (int seed = 0; seed < n; seed++)
        {
            if (visited[seed]) continue;
            int startNode = PseudoPeripheral(seed, adj, dense);
            var queue = new Queue<int>();
            queue.Enqueue(startNode);
            visited[startNode] = true;
            while (queue.Count > 0)
            {
                int u = queue.Dequeue();
                order.Add(u);
                foreach (int w in adj[u])
                    if (!visited[w]) { visited[w] = true; queue.Enqueue(w); }
            }
        }
        order.Reverse();
        for (int i = 0; i < n; i++) if (dense[i]) order.Add(i);
        return [.. order];
    }

    private static int PseudoPeripheral(int seed, List<int>[] adj, bool[] dense)
    {
        int node = seed, lastDepth = -1;
        for (int pass = 0; pass < 4; pass++)
        {
            var (far, depth) = Farthest(node, adj, dense);
            if (depth <= lastDepth) break;
            lastDepth = depth;
            node = far;
        }
        return node;
    }

    private static (int Node, int Depth) Farthest(int start, List<int>[] adj, bool[] dense)
    {
        var level = new Dictionary<int, int> { [start] = 0 };
        var queue = new Queue<int>();
        queue.Enqueue(start);
        int far = start;
        while (queue.Count > 0)
        {
            int u = queue.Dequeue();
            far = u;
            foreach (int w in adj[u])
                if (!dense[w] && level.TryAdd(w, level[u] + 1)) queue.Enqueue(w);
        }
        return (far, level[far]);
    }
}
