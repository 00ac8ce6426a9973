using CrossCheck.Model;
using MathNet.Numerics.LinearAlgebra;

namespace CrossCheck.Analysis;

/// <summary>
/// The elastic critical load factor α_cr of a frame under the axial forces of a first-order analysis: the lowest positive
/// λ with (K + λ·K_G)·φ = 0, K the elastic stiffness and K_G the geometric stiffness of the axial forces (EN 1993-1-1
/// clause 5.2.1: first-order analysis is enough when α_cr ≥ 10).
/// </summary>
/// <remarks>
/// The joint unknowns are those of the analysis, with its constraints (supports, axially rigid members) eliminated by the
/// same transformation d = T·q (<see cref="FrameConstraints"/>). A member that matters (below) is divided into
/// <see cref="SubElements"/> cubic elements along its length — the extra transverse displacements and rotations of the inner points, and the
/// member's own end rotation at a hinge, are unknowns of their own — with the consistent geometric stiffness
/// N/(30h)·[36, 3h, −36, 3h; 3h, 4h², −3h, −h²; …] of each: the elastic stiffness is the member's exactly, and the
/// critical loads of single columns come within 0.1 % of Euler's. A first solution with one element per member (an upper
/// bound) tells which members matter: those that at that factor carry more than <see cref="MemberShare"/> of their
/// pinned Euler load π²EI/L² are divided, the others (beams, upper columns, members in tension) stay one element — they add
/// unknowns, not accuracy. Small problems are solved densely (MathNet: a
/// Cholesky factor of K, the symmetric eigenvalues of L⁻¹·G·L⁻ᵀ), large ones by subspace iteration on a sparse
/// factorisation of K.
/// </remarks>
public static class CriticalLoadFactor
{
    /// <summary>Cubic elements per member.</summary>
    public const int SubElements = 4;

    /// <summary>
    /// The share of its pinned Euler load above which a member is divided (see the remarks): below it a single cubic
    /// element's stiffness differs from the exact (stability-function) one by well under 1 % (from memory: the consistent
    /// geometric stiffness carries the first-order term in P exactly, so the error is of second order in P).
    /// </summary>
    public const double MemberShare = 0.1;

    /// <summary>Unknowns up to which the eigenproblem is solved densely.</summary>
    public const int DenseLimit = 120;

    /// <summary>
    /// α_cr of <paramref name="model"/> under the axial forces <paramref name="axial"/> gives (start and end of each
    /// member, tension positive, N); null when no member is in compression, or when no positive factor exists.
    /// </summary>
    /// <exception cref="StructureException">The structure cannot be analysed (a mechanism).</exception>
    public static double? Of(StructureModel model, Func<string, (double Start, double End)> axial) => Of(model, axial, dense: null);

    /// <param name="dense">True or false to force the dense or the iterative eigensolver; null to choose by size.</param>
    /// <param name="divideAll">Divide every member in compression, not only those that matter (to test the choice).</param>
    internal static double? Of(StructureModel model, Func<string, (double Start, double End)> axial, bool? dense, bool divideAll = false)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(axial);
        var frame = new FrameLayout(model);
        var t = FrameConstraints.Build(model, [], holdTranslations: false).Transformation;
        var forces = frame.Elements.Select(e => axial(e.Member.Id)).ToList();
        // Each member's compression against its own flexural stiffness, P·L²/EI (π² over it is its pinned Euler factor).
        var ratio = frame.Elements.Select((e, i) =>
            Math.Max(0, -Math.Min(forces[i].Start, forces[i].End)) * e.Length * e.Length / (e.Member.E * e.Member.I)).ToArray();
        if (!(ratio.DefaultIfEmpty(0).Max() > 0)) return null;

        // The joint unknowns come first in both systems: the first solution's vectors start the second's iteration.
        List<double[]>? vectors = null;
        double? Solve(Func<int, int> parts)
        {
            var system = new BucklingSystem(t.MasterCount);
            for (int i = 0; i < frame.Elements.Length; i++) system.AddMember(frame.Elements[i], t, forces[i].Start, forces[i].End, parts(i));
            double? mu = dense ?? system.Size <= DenseLimit ? system.LargestDense() : system.LargestBySubspace(vectors, t.MasterCount, out vectors);
            return mu is double m && m > 0 ? 1 / m : null;
        }

        // One element per member first: an upper bound (its shapes are among the divided model's). A member that at that
        // factor would carry more than a tenth of its pinned Euler load is then divided, and the problem solved again.
        if (divideAll) return Solve(i => ratio[i] > 0 ? SubElements : 1);
        var coarse = Solve(_ => 1);
        var divided = Enumerable.Range(0, ratio.Length)
            .Where(i => coarse is double a ? a * ratio[i] > MemberShare * Math.PI * Math.PI : ratio[i] > 0).ToHashSet();
        return divided.Count == 0 ? coarse : Solve(i => divided.Contains(i) ? SubElements : 1);
    }

    /// <summary>The unknowns, K and G = −K_G (positive under compression), assembled member by member.</summary>
    private sealed class BucklingSystem(int masters)
    {
        private readonly List<(int I, int J, double V)> _k = [];
        private readonly List<(int I, int J, double V)> _g = [];

        public int Size { get; private set; } = masters;

        private int NewUnknown() => Size++;

        /// <summary>A unknown of the member written as a combination of the system's unknowns.</summary>
        private static (int, double)[] Of(Transformation t, int dof, double coef) =>
            coef == 0 ? [] : t.Terms[dof].Select(x => (x.Master, x.Coef * coef)).ToArray();

        public void AddMember(MemberElement e, Transformation t, double n1, double n2, int parts)
        {
            double c = e.Cos, s = e.Sin, length = e.Length, h = length / parts;
            var d = e.Dofs;
            // Local transverse displacement v = −s·ux + c·uy; rotations anticlockwise as in the analysis.
            var vStart = Of(t, d[0], -s).Concat(Of(t, d[1], c)).ToArray();
            var vEnd = Of(t, d[3], -s).Concat(Of(t, d[4], c)).ToArray();
            var thStart = e.Member.IsReleased(MemberEnd.Start) ? [(NewUnknown(), 1.0)] : Of(t, d[2], 1);
            var thEnd = e.Member.IsReleased(MemberEnd.End) ? [(NewUnknown(), 1.0)] : Of(t, d[5], 1);
            // Points 0..n along the member: transverse displacement and rotation of each.
            var nodes = new (int, double)[parts + 1][][];
            nodes[0] = [vStart, thStart];
            nodes[parts] = [vEnd, thEnd];
            for (int k = 1; k < parts; k++) nodes[k] = [[(NewUnknown(), 1.0)], [(NewUnknown(), 1.0)]];
            double ei = e.Member.E * e.Member.I;
            for (int k = 0; k < parts; k++)
            {
                double xm = (k + 0.5) * h;
                double n = n1 + ((n2 - n1) * xm / length);
                var dofs = new[] { nodes[k][0], nodes[k][1], nodes[k + 1][0], nodes[k + 1][1] };
                Add(_k, dofs, Bending(ei, h));
                if (n != 0) Add(_g, dofs, Geometric(-n, h));
            }
            if (e.Elastic)
            {
                // Axial stiffness EA/L between the end displacements along the member (u = c·ux + s·uy).
                double ea = e.Member.E * (e.Member.A ?? 0) / length;
                var uStart = Of(t, d[0], c).Concat(Of(t, d[1], s)).ToArray();
                var uEnd = Of(t, d[3], c).Concat(Of(t, d[4], s)).ToArray();
                Add(_k, [uStart, uEnd], new double[,] { { ea, -ea }, { -ea, ea } });
            }
        }

        private static double[,] Bending(double ei, double h)
        {
            double a = 12 * ei / (h * h * h), b = 6 * ei / (h * h), c4 = 4 * ei / h, c2 = 2 * ei / h;
            return new double[,] { { a, b, -a, b }, { b, c4, -b, c2 }, { -a, -b, a, -b }, { b, c2, -b, c4 } };
        }

        /// <summary>Consistent geometric stiffness of a cubic element under axial compression <paramref name="p"/> (positive), sign flipped: G = −K_G.</summary>
        private static double[,] Geometric(double p, double h)
        {
            double f = p / (30 * h);
            return new double[,]
            {
                { 36 * f, 3 * h * f, -36 * f, 3 * h * f },
                { 3 * h * f, 4 * h * h * f, -3 * h * f, -h * h * f },
                { -36 * f, -3 * h * f, 36 * f, -3 * h * f },
                { 3 * h * f, -h * h * f, -3 * h * f, 4 * h * h * f },
            };
        }

        private static void Add(List<(int, int, double)> target, (int Index, double Coef)[][] dofs, double[,] m)
        {
            for (int a = 0; a < dofs.Length; a++)
                for (int b = 0; b < dofs.Length; b++)
                {
                    double v = m[a, b];
                    if (v == 0) continue;
                    foreach (var (i, ci) in dofs[a])
                        foreach (var (j, cj) in dofs[b])
                            if (i >= j) target.Add((i, j, ci * v * cj));
                }
        }

        private SparseSymmetricMatrix Sparse(List<(int I, int J, double V)> entries)
        {
            var m = new SparseSymmetricMatrix(Size);
            foreach (var (i, j, v) in entries) m.Add(i, j, v);
            return m;
        }

        /// <summary>The largest μ of G·φ = μ·K·φ, densely: μ are the eigenvalues of L⁻¹·G·L⁻ᵀ with K = L·Lᵀ (both Jacobi-scaled).</summary>
        public double? LargestDense()
        {
            var k = Sparse(_k);
            var g = Sparse(_g);
            int n = Size;
            var scale = new double[n];
            for (int i = 0; i < n; i++)
            {
                double dd = k.Diagonal(i);
                if (!(dd > 0)) throw new StructureException("The structure has no stiffness in one of its buckling unknowns: it is a mechanism.");
                scale[i] = 1 / Math.Sqrt(dd);
            }
            var kd = Matrix<double>.Build.Dense(n, n);
            var gd = Matrix<double>.Build.Dense(n, n);
            Fill(kd, k, scale);
            Fill(gd, g, scale);
            Matrix<double> lInv;
            try { lInv = kd.Cholesky().Factor.Inverse(); }
            catch (ArgumentException ex) { throw new StructureException("The stiffness matrix of the buckling analysis is not positive definite.", ex); }
            var c = lInv * gd * lInv.Transpose();
            c = (c + c.Transpose()) * 0.5;
            var values = c.Evd(Symmetricity.Symmetric).EigenValues;
            double best = values.Select(v => v.Real).DefaultIfEmpty(0).Max();
            return best > 0 ? best : null;
        }

        private static void Fill(Matrix<double> dense, SparseSymmetricMatrix m, double[] scale)
        {
            for (int i = 0; i < m.Size; i++)
                foreach (var (j, v) in m.LowerRow(i))
                {
                    double sv = v * scale[i] * scale[j];
                    dense[i, j] = sv;
                    dense[j, i] = sv;
                }
        }

        /// <summary>
        /// The largest μ of G·φ = μ·K·φ by subspace iteration (Y = K⁻¹·G·X made K-orthonormal, then Rayleigh–Ritz:
        /// the eigenvalues of Yᵀ·G·Y), for problems too large to solve densely.
        /// </summary>
        /// <param name="start">Vectors to start from (their first <paramref name="shared"/> entries are used), or null.</param>
        /// <param name="shared">How many leading unknowns <paramref name="start"/> has in common with this system.</param>
        /// <param name="vectors">The Ritz vectors reached, to start a finer model of the same frame.</param>
        public double? LargestBySubspace(List<double[]>? start, int shared, out List<double[]>? vectors)
        {
            vectors = null;
            var k = Sparse(_k);
            var g = Sparse(_g);
            int n = Size, p = Math.Min(n, 8);
            ILinearFactor factor;
            try { factor = AutoSolver.Instance.Factor(k); }
            catch (SingularMatrixException ex) { throw new StructureException("The stiffness matrix of the buckling analysis is singular.", ex); }
            var rnd = new Random(1);
            var x = Enumerable.Range(0, p).Select(_ => Enumerable.Range(0, n).Select(_ => rnd.NextDouble() - 0.5).ToArray()).ToList();
            for (int v = 0; v < Math.Min(p, start?.Count ?? 0); v++)
            {
                Array.Clear(x[v]);
                Array.Copy(start![v], x[v], Math.Min(shared, Math.Min(n, start[v].Length)));
            }
            double previous = double.NaN;
            for (int iter = 0; iter < 300; iter++)
            {
                var y = KOrthonormal(x.Select(v => factor.Solve(g.Multiply(v))), k);
                if (y.Count == 0) return null;
                var gy = y.Select(g.Multiply).ToArray();
                var c = Matrix<double>.Build.Dense(y.Count, y.Count, (i, j) => 0.5 * (Dot(y[i], gy[j]) + Dot(y[j], gy[i])));
                var evd = c.Evd(Symmetricity.Symmetric);
                double best = evd.EigenValues.Select(v => v.Real).Max();
                x = Enumerable.Range(0, y.Count).Select(col => Combine(y, evd.EigenVectors.Column(col))).ToList();
                if (Math.Abs(best - previous) <= 1e-10 * Math.Abs(best))
                {
                    vectors = x;
                    return best > 0 ? best : null;
                }
                previous = best;
            }
            return previous > 0 ? previous : null;
        }

        /// <summary>
        /// Gram–Schmidt in the K inner product, twice over; vectors that vanish against the others are dropped. K·b is
        /// formed once per basis vector (K is symmetric, so bᵀ·K·v = (K·b)ᵀ·v): one product per vector, not one per pair.
        /// </summary>
        private static List<double[]> KOrthonormal(IEnumerable<double[]> vectors, SparseSymmetricMatrix k)
        {
            var basis = new List<double[]>();
            var kBasis = new List<double[]>();
            double largest = 0;
            foreach (var v0 in vectors)
            {
                var v = (double[])v0.Clone();
                var kv = k.Multiply(v);
                double before = Math.Sqrt(Math.Max(0, Dot(v, kv)));
                largest = Math.Max(largest, before);
                for (int pass = 0; pass < 2; pass++)
                    for (int j = 0; j < basis.Count; j++)
                    {
                        double proj = Dot(kBasis[j], v);
                        var b = basis[j];
                        for (int i = 0; i < v.Length; i++) v[i] -= proj * b[i];
                    }
                kv = k.Multiply(v);
                double norm = Math.Sqrt(Math.Max(0, Dot(v, kv)));
                if (!(norm > 1e-10 * largest) || norm == 0) continue;
                for (int i = 0; i < v.Length; i++)
                {
                    v[i] /= norm;
                    kv[i] /= norm;
                }
                basis.Add(v);
                kBasis.Add(kv);
            }
            return basis;
        }

        private static double[] Combine(List<double[]> y, Vector<double> coefs)
        {
            var r = new double[y[0].Length];
            for (int j = 0; j < y.Count; j++)
                for (int i = 0; i < r.Length; i++) r[i] += coefs[j] * y[j][i];
            return r;
        }

        private static double Dot(double[] a, double[] b)
        {
            double s = 0;
            for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
            return s;
        }
    }
}
