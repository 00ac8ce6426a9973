namespace CrossCheck.Tests.Support;

/// <summary>
/// Small hand methods for continuous beams, written independently of the product for the diagnosis tests: they
/// make "the author's mistake" by a route that does not use the product's solver or distribution engine.
/// Moments clockwise on member ends; spans numbered from the left; supports 0..n.
/// </summary>
public static class HandMethods
{
    /// <summary>
    /// Slope-deflection for a continuous beam: M_ab = FEM_ab + 2k(2θa + θb), M_ba = FEM_ba + 2k(θa + 2θb), with k the
    /// member stiffness the author uses (EI/L normally) and a rotation unknown at every support not fixed.
    /// </summary>
    public static (double Start, double End)[] SlopeDeflection(double[] k, bool[] fixedSupport, (double Start, double End)[] fem)
    {
        int n = k.Length;
        var free = Enumerable.Range(0, n + 1).Where(j => !fixedSupport[j]).ToList();
        int u = free.Count;
        var a = new double[u, u];
        var b = new double[u];
        for (int row = 0; row < u; row++)
        {
            int j = free[row];
            // Joint equilibrium: Σ member-end moments at support j = 0.
            if (j > 0) { int i = j - 1; b[row] -= fem[i].End; Add(a, row, free, i, 2 * k[i]); Add(a, row, free, j, 4 * k[i]); }
            if (j < n) { int i = j; b[row] -= fem[i].Start; Add(a, row, free, j, 4 * k[i]); Add(a, row, free, j + 1, 2 * k[i]); }
        }
        var theta = Solve(a, b);
        double Th(int j) => free.IndexOf(j) is int p && p >= 0 ? theta[p] : 0;
        return Enumerable.Range(0, n).Select(i => (fem[i].Start + (2 * k[i] * ((2 * Th(i)) + Th(i + 1))), fem[i].End + (2 * k[i] * (Th(i) + (2 * Th(i + 1)))))).ToArray();
    }

    private static void Add(double[,] a, int row, List<int> free, int joint, double v)
    {
        int col = free.IndexOf(joint);
        if (col >= 0) a[row, col] += v;
    }

    /// <summary>
    /// Hardy Cross for a continuous beam with plain stiffness 4EI/L, pinned ends balanced every cycle, simultaneous
    /// balancing, a carry-over factor of the author's choosing, stopped after <paramref name="cycles"/> balance +
    /// carry-over cycles and a final balance.
    /// </summary>
    public static (double Start, double End)[] MomentDistribution(double[] ei, double[] l, bool[] fixedSupport, (double Start, double End)[] fem,
        int cycles, double carryOver = 0.5)
    {
        int n = ei.Length;
        var m = fem.Select(f => new[] { f.Start, f.End }).ToArray();
        double K(int i) => 4 * ei[i] / l[i];
        double[] Df(int j)
        {
            // [left member's end, right member's start] at support j.
            double left = j > 0 ? K(j - 1) : 0, right = j < n ? K(j) : 0, sum = left + right;
            return fixedSupport[j] ? [0, 0] : [left / sum, right / sum];
        }
        for (int c = 0; c <= cycles; c++)
        {
            var bal = new double[n][];
            for (int i = 0; i < n; i++) bal[i] = new double[2];
            for (int j = 0; j <= n; j++)
            {
                double unbalance = (j > 0 ? m[j - 1][1] : 0) + (j < n ? m[j][0] : 0);
                var df = Df(j);
                if (j > 0) bal[j - 1][1] = -df[0] * unbalance;
                if (j < n) bal[j][0] = -df[1] * unbalance;
            }
            for (int i = 0; i < n; i++) { m[i][0] += bal[i][0]; m[i][1] += bal[i][1]; }
            if (c == cycles) break; // final balance done
            for (int i = 0; i < n; i++) { m[i][0] += carryOver * bal[i][1]; m[i][1] += carryOver * bal[i][0]; }
        }
        return m.Select(x => (x[0], x[1])).ToArray();
    }

    private static double[] Solve(double[,] a, double[] b)
    {
        int n = b.Length;
        var x = (double[])b.Clone();
        var m = (double[,])a.Clone();
        for (int p = 0; p < n; p++)
        {
            int piv = p;
            for (int r = p + 1; r < n; r++) if (Math.Abs(m[r, p]) > Math.Abs(m[piv, p])) piv = r;
            for (int c = 0; c < n; c++) (m[p, c], m[piv, c]) = (m[piv, c], m[p, c]);
            (x[p], x[piv]) = (x[piv], x[p]);
            for (int r = p + 1; r < n; r++)
            {
                double f = m[r, p] / m[p, p];
                for (int c = p; c < n; c++) m[r, c] -= f * m[p, c];
                x[r] -= f * x[p];
            }
        }
        for (int p = n - 1; p >= 0; p--)
        {
            double s = x[p];
            for (int c = p + 1; c < n; c++) s -= m[p, c] * x[c];
            x[p] = s / m[p, p];
        }
        return x;
    }

    /// <summary>Fixed-end moments (clockwise) of a full UDL w: −wL²/12, +wL²/12 (Hicks, Fig. 2.2 case 5).</summary>
    public static (double, double) Udl(double w, double l) => (-w * l * l / 12, w * l * l / 12);

    /// <summary>Fixed-end moments of a point load P at a: −Pab²/L², +Pa²b/L² (Hicks, Fig. 2.2 case 6).</summary>
    public static (double, double) Point(double p, double a, double l) { double b = l - a; return (-p * a * b * b / (l * l), p * a * a * b / (l * l)); }

    public static (double, double) Sum(params (double S, double E)[] f) => (f.Sum(x => x.S), f.Sum(x => x.E));
}

/// <summary>A hand moment-distribution working table for a continuous beam, written row by row as an author would.</summary>
public static class HandTable
{
    /// <summary>
    /// Rows (label, values per column S1@J0, S1@J1, S2@J1, ...): DF, FEM, then balance / carry-over for
    /// <paramref name="cycles"/> cycles, a final balance and the final sums. Plain stiffness 4EI/L, pinned ends balanced
    /// every cycle, simultaneous balancing, carry-over ½ (common practice). A <paramref name="slip"/> writes a wrong value
    /// into one cell, and the author carries on from it as if it were right.
    /// </summary>
    public static List<(string Label, double[] Values)> Build(double[] ei, double[] l, bool[] fixedSupport, (double Start, double End)[] fem, int cycles,
        (string Label, int Column, double Value)? slip = null)
    {
        int n = ei.Length, cols = 2 * n;
        void Slip(string label, double[] row) { if (slip is var (sl, sc, sv) && sl == label) row[sc] = sv; }
        double K(int i) => 4 * ei[i] / l[i];
        var df = new double[cols];
        for (int j = 0; j <= n; j++)
        {
            if (fixedSupport[j]) continue;
            double left = j > 0 ? K(j - 1) : 0, right = j < n ? K(j) : 0, sum = left + right;
            if (j > 0) df[(2 * (j - 1)) + 1] = left / sum;
            if (j < n) df[2 * j] = right / sum;
        }
        Slip("DF", df);
        var rows = new List<(string, double[])> { ("DF", df) };
        var state = fem.SelectMany(f => new[] { f.Start, f.End }).ToArray();
        Slip("FEM", state);
        rows.Add(("FEM", (double[])state.Clone()));
        for (int c = 1; c <= cycles + 1; c++)
        {
            var bal = new double[cols];
            for (int j = 0; j <= n; j++)
            {
                double u = (j > 0 ? state[(2 * (j - 1)) + 1] : 0) + (j < n ? state[2 * j] : 0);
                if (j > 0) bal[(2 * (j - 1)) + 1] = -df[(2 * (j - 1)) + 1] * u;
                if (j < n) bal[2 * j] = -df[2 * j] * u;
            }
            Slip($"balance {c}", bal);
            for (int i = 0; i < cols; i++) state[i] += bal[i];
            rows.Add(($"balance {c}", bal));
            if (c == cycles + 1) break;
            var co = new double[cols];
            for (int i = 0; i < cols; i++) co[i % 2 == 0 ? i + 1 : i - 1] += 0.5 * bal[i];
            Slip($"carry-over {c}", co);
            for (int i = 0; i < cols; i++) state[i] += co[i];
            rows.Add(($"carry-over {c}", co));
        }
        var final = (double[])state.Clone();
        Slip("final", final);
        rows.Add(("final", final));
        return rows;
    }
}

/// <summary>
/// Statics of one span under a full uniform load w with its end moments given (clockwise, so the internal moment is m1 at
/// the start and −m2 at the end): the hand formulas of every continuous-beam text (common practice), written apart from the
/// product for the diagnosis tests of span moments and shears.
/// </summary>
public static class HandSpan
{
    /// <summary>Start shear V = wL/2 − (m1 + m2)/L (beam convention, V = dM/dx).</summary>
    public static double StartShear(double w, double l, double m1, double m2) => (w * l / 2) - ((m1 + m2) / l);

    /// <summary>End shear (beam convention): V_start − wL.</summary>
    public static double EndShear(double w, double l, double m1, double m2) => StartShear(w, l, m1, m2) - (w * l);

    /// <summary>The largest internal moment, ends included: m1 + V²/(2w) where the shear is zero inside the span.</summary>
    public static double Maximum(double w, double l, double m1, double m2)
    {
        double v = StartShear(w, l, m1, m2), best = Math.Max(m1, -m2);
        if (w > 0 && v > 0 && v < w * l) best = Math.Max(best, m1 + (v * v / (2 * w)));
        return best;
    }

    /// <summary>The moment at mid-span: (m1 − m2)/2 + wL²/8.</summary>
    public static double Midspan(double w, double l, double m1, double m2) => ((m1 - m2) / 2) + (w * l * l / 8);

    /// <summary>
    /// Support moment (hogging, positive) of two equal spans with uniform loads w1 and w2: (w1 + w2)L²/16, by the
    /// three-moment equation (Clapeyron; docs/REFERENCE-CHECKS.md 3.1 and 3.7).
    /// </summary>
    public static double TwoSpanSupport(double w1, double w2, double l) => (w1 + w2) * l * l / 16;
}
