namespace CrossCheck.Analysis;

/// <summary>
/// Sparse symmetric solver for large frames: reverse Cuthill–McKee ordering (nodes of very high degree, such as
/// the sway unknown of a wide storey, numbered last), then an LDLᵀ factorisation stored as a skyline (variable band)
/// on a Jacobi-scaled copy. Memory and time grow with n·b² for a band b, close to linear in frame size for regular frames.
/// </summary>
public sealed class SkylineSolver : ILinearSolver
{
    public static SkylineSolver Instance { get; } = new();

    public ILinearFactor Factor(SparseSymmetricMatrix matrix) => Decompose(matrix, dropBelow: null);

    /// <summary>
    /// The LDLᵀ factor of <paramref name="matrix"/>. With <paramref name="dropBelow"/>, a semi-definite matrix is accepted:
    /// a scaled pivot at or below it is taken as zero (its column of L too), so that the factor's solves give a
    /// generalised inverse and its <see cref="Factorised.Rank"/> is the numerical rank.
    /// </summary>
    internal static Factorised Decompose(SparseSymmetricMatrix matrix, double? dropBelow)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        int n = matrix.Size;
        var scale = new double[n];
        for (int i = 0; i < n; i++)
        {
            double d = matrix.Diagonal(i);
            // A semi-definite matrix may have an unknown nothing touches: its pivot is dropped.
            if (!(d > 0) && dropBelow is not null) { scale[i] = 1; continue; }
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
        int rank = 0;
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
                double l = diag[j] == 0 ? 0 : u / diag[j]; // a dropped pivot's column of L is zero
                v[p] = l;
                di -= u * l;
            }
            v[ri + (i - fi)] = 1;
            double ratio = di / a; // the scaled diagonal is 1, so this is the pivot ratio
            if (dropBelow is double drop)
            {
                diag[i] = ratio > drop ? di : 0;
                if (ratio > drop) rank++;
                continue;
            }
            diag[i] = di;
            if (!(ratio > DenseCholeskySolver.SingularPivotRatio))
                throw new SingularMatrixException(di <= 0 && ratio < -1e-9 ? "The stiffness matrix is not positive definite." : "The stiffness matrix is singular.", perm[i]);
            minRatio = Math.Min(minRatio, ratio);
            rank++;
        }
        return new Factorised(perm, first, start, v, diag, scale, n == 0 || dropBelow is not null ? 1 : minRatio, rank);
    }

    /// <summary>An LDLᵀ factor in skyline storage, on the Jacobi-scaled matrix in reverse Cuthill–McKee order.</summary>
    internal sealed class Factorised(int[] perm, int[] first, long[] start, double[] v, double[] diag, double[] scale, double minRatio, int rank) : ILinearFactor
    {
        public int Size => perm.Length;
        public double MinPivotRatio => minRatio;

        /// <summary>Pivots kept (all of them for a definite matrix).</summary>
        public int Rank => rank;

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
            for (int i = 0; i < n; i++) y[i] = diag[i] == 0 ? 0 : y[i] / diag[i];
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

        /// <summary>
        /// The entries of the (generalised) inverse Z = L⁻ᵀ·D⁺·L⁻¹ within the profile, by the Takahashi recurrences
        /// (Z_ii = 1/d_i − Σ_k L_ki·Z_ki, Z_ij = −Σ_k L_ki·Z_kj over the rows k &gt; i of column i): as costly as the factorisation.
        /// <see cref="Inverse"/> reads them.
        /// </summary>
        public double[] SelectedInverse()
        {
            int n = perm.Length;
            // Rows of each column within the profile.
            var count = new int[n + 1];
            for (int k = 0; k < n; k++) for (int i = first[k]; i < k; i++) count[i + 1]++;
            for (int i = 0; i < n; i++) count[i + 1] += count[i];
            var rows = new int[count[n]];
            var fill = (int[])count.Clone();
            for (int k = 0; k < n; k++) for (int i = first[k]; i < k; i++) rows[fill[i]++] = k;
            var z = new double[v.Length];
            for (int i = n - 1; i >= 0; i--)
            {
                // Z_ji for the rows j > i of column i (stored in row j), then Z_ii.
                for (int pj = count[i]; pj < count[i + 1]; pj++)
                {
                    int j = rows[pj];
                    double s = 0;
                    for (int pk = count[i]; pk < count[i + 1]; pk++)
                    {
                        int k = rows[pk];
                        double lki = v[start[k] + (i - first[k])];
                        if (lki != 0) s -= lki * (k >= j ? z[start[k] + (j - first[k])] : z[start[j] + (k - first[j])]);
                    }
                    z[start[j] + (i - first[j])] = s;
                }
                double zii = diag[i] == 0 ? 0 : 1 / diag[i];
                for (int pk = count[i]; pk < count[i + 1]; pk++)
                {
                    int k = rows[pk];
                    zii -= v[start[k] + (i - first[k])] * z[start[k] + (i - first[k])];
                }
                z[start[i] + (i - first[i])] = zii;
            }
            return z;
        }

        /// <summary>Entry (a, b) of the inverse of the original (unscaled, unpermuted) matrix from <see cref="SelectedInverse"/>; both must lie in the profile.</summary>
        public double Inverse(double[] z, int a, int b)
        {
            int[] inv = InversePermutation();
            int i = inv[a], j = inv[b];
            if (i < j) (i, j) = (j, i);
            if (j < first[i]) throw new ArgumentOutOfRangeException(nameof(b), "The entry lies outside the profile.");
            return z[start[i] + (j - first[i])] * scale[a] * scale[b];
        }

        private int[]? _inv;

        private int[] InversePermutation()
        {
            if (_inv is not null) return _inv;
            var inv = new int[perm.Length];
            for (int k = 0; k < perm.Length; k++) inv[perm[k]] = k;
            return _inv = inv;
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
        if (n == 0) return [];
        // Adjacency in compressed rows (two passes: count, then fill).
        var degree = new int[n];
        for (int i = 0; i < n; i++)
            foreach (var (j, _) in a.LowerRow(i))
                if (j != i) { degree[i]++; degree[j]++; }
        var start = new int[n + 1];
        for (int i = 0; i < n; i++) start[i + 1] = start[i] + degree[i];
        var adj = new int[start[n]];
        var fill = (int[])start.Clone();
        for (int i = 0; i < n; i++)
            foreach (var (j, _) in a.LowerRow(i))
                if (j != i) { adj[fill[i]++] = j; adj[fill[j]++] = i; }
        // Neighbours by increasing degree (insertion sort: the lists are short).
        for (int i = 0; i < n; i++)
            for (int k = start[i] + 1; k < start[i + 1]; k++)
            {
                int v = adj[k], dv = degree[v], m = k - 1;
                while (m >= start[i] && degree[adj[m]] > dv) { adj[m + 1] = adj[m]; m--; }
                adj[m + 1] = v;
            }

        var sorted = (int[])degree.Clone();
        Array.Sort(sorted);
        int median = sorted[n / 2];
        // Only nodes far denser than the rest (the sway unknown of a very wide storey) are worth setting aside.
        int denseLimit = Math.Max(Math.Max(64, 10 * Math.Max(median, 1)), (int)(4 * Math.Sqrt(n)));
        var dense = new bool[n];
        for (int i = 0; i < n; i++) dense[i] = degree[i] > denseLimit;

        var order = new int[n];
        int count = 0;
        var visited = (bool[])dense.Clone();
        var level = new int[n];
        var queue = new int[n];
        for (int first = 0; first < n; first++)
        {
            if (visited[first]) continue;
            int startNode = PseudoPeripheral(first, start, adj, dense, level, queue);
            int head = 0, tail = 0;
            queue[tail++] = startNode;
            visited[startNode] = true;
            while (head < tail)
            {
                int u = queue[head++];
                order[count++] = u;
                for (int k = start[u]; k < start[u + 1]; k++)
                {
                    int w = adj[k];
                    if (!visited[w]) { visited[w] = true; queue[tail++] = w; }
                }
            }
        }
        Array.Reverse(order, 0, count);
        for (int i = 0; i < n; i++) if (dense[i]) order[count++] = i;
        return order;
    }

    private static int PseudoPeripheral(int origin, int[] start, int[] adj, bool[] dense, int[] level, int[] queue)
    {
        int node = origin, lastDepth = -1;
        for (int pass = 0; pass < 4; pass++)
        {
            var (far, depth) = Farthest(node, start, adj, dense, level, queue);
            if (depth <= lastDepth) break;
            lastDepth = depth;
            node = far;
        }
        return node;
    }

    /// <summary>Breadth-first from <paramref name="origin"/>: the last node reached and its depth.</summary>
    private static (int Node, int Depth) Farthest(int origin, int[] start, int[] adj, bool[] dense, int[] level, int[] queue)
    {
        int head = 0, tail = 0;
        queue[tail++] = origin;
        level[origin] = 1; // 0 = not reached; depth + 1 otherwise
        int far = origin;
        while (head < tail)
        {
            int u = queue[head++];
            far = u;
            for (int k = start[u]; k < start[u + 1]; k++)
            {
                int w = adj[k];
                if (dense[w] || level[w] != 0) continue;
                level[w] = level[u] + 1;
                queue[tail++] = w;
            }
        }
        int depth = level[far] - 1;
        for (int q = 0; q < tail; q++) level[queue[q]] = 0; // reset only what was touched
        return (far, depth);
    }
}
