using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>Local stiffness of a plane frame member and the static condensation of released ends.</summary>
internal static class ElementMatrices
{
    /// <summary>
    /// Local 6×6 stiffness (u1, v1, θ1, u2, v2, θ2). <paramref name="ea"/> is zero for axially rigid members,
    /// whose length is held by a constraint instead.
    /// </summary>
    public static double[,] LocalStiffness(double ei, double ea, double length)
    {
        double L = length;
        double a = ea / L;
        double b = 12 * ei / (L * L * L);
        double c = 6 * ei / (L * L);
        double d = 4 * ei / L;
        double e = 2 * ei / L;
        return new double[,]
        {
            { a, 0, 0, -a, 0, 0 },
            { 0, b, c, 0, -b, c },
            { 0, c, d, 0, -c, e },
            { -a, 0, 0, a, 0, 0 },
            { 0, -b, -c, 0, b, -c },
            { 0, c, e, 0, -c, d },
        };
    }

    /// <summary>Indices of the local DOFs released by the member's hinges (2 = θ1, 5 = θ2).</summary>
    public static int[] Released(Hinge hinge) => hinge switch
    {
        Hinge.Start => [2],
        Hinge.End => [5],
        Hinge.Both => [2, 5],
        _ => [],
    };

    /// <summary>
    /// Condenses the released DOFs r out of k and f: k' = kaa − kar·krr⁻¹·kra, f' = fa − kar·krr⁻¹·fr.
    /// Rows and columns of released DOFs are zero in the result.
    /// </summary>
    public static (double[,] K, double[] F) Condense(double[,] k, double[] f, int[] released)
    {
        if (released.Length == 0) return (k, f);
        var kc = (double[,])k.Clone();
        var fc = (double[])f.Clone();
        // Condense one DOF at a time; sequential condensation equals joint condensation.
        foreach (int r in released)
        {
            double krr = kc[r, r];
            if (krr == 0) continue;
            for (int i = 0; i < 6; i++)
            {
                if (i == r) continue;
                double factor = kc[i, r] / krr;
                if (factor == 0) continue;
                for (int j = 0; j < 6; j++) kc[i, j] -= factor * kc[r, j];
                fc[i] -= factor * fc[r];
            }
            for (int j = 0; j < 6; j++) { kc[r, j] = 0; kc[j, r] = 0; }
            fc[r] = 0;
        }
        return (kc, fc);
    }

    /// <summary>
    /// Recovers the rotations of released ends from the retained local displacements:
    /// krr·dr = −(kra·da + fr), solved for the (at most two) released DOFs.
    /// </summary>
    public static void RecoverReleased(double[,] k, double[] f, int[] released, double[] d)
    {
        if (released.Length == 0) return;
        foreach (int r in released) d[r] = 0;
        double Rhs(int r)
        {
            double s = f[r];
            for (int j = 0; j < 6; j++) if (Array.IndexOf(released, j) < 0) s += k[r, j] * d[j];
            return -s;
        }
        if (released.Length == 1)
        {
            int r = released[0];
            d[r] = k[r, r] == 0 ? 0 : Rhs(r) / k[r, r];
            return;
        }
        int p = released[0], q = released[1];
        double a11 = k[p, p], a12 = k[p, q], a22 = k[q, q];
        double det = (a11 * a22) - (a12 * a12);
        double r1 = Rhs(p), r2 = Rhs(q);
        if (det == 0) return;
        d[p] = ((a22 * r1) - (a12 * r2)) / det;
        d[q] = ((a11 * r2) - (a12 * r1)) / det;
    }

    /// <summary>Local = T·global for one member (block diagonal rotation).</summary>
    public static double[] ToLocal(double[] global, double c, double s) =>
    [
        (c * global[0]) + (s * global[1]), (-s * global[0]) + (c * global[1]), global[2],
        (c * global[3]) + (s * global[4]), (-s * global[3]) + (c * global[4]), global[5],
    ];

    /// <summary>Global = Tᵀ·local.</summary>
    public static double[] ToGlobal(double[] local, double c, double s) =>
    [
        (c * local[0]) - (s * local[1]), (s * local[0]) + (c * local[1]), local[2],
        (c * local[3]) - (s * local[4]), (s * local[3]) + (c * local[4]), local[5],
    ];

    /// <summary>Global stiffness Tᵀ·k·T.</summary>
    public static double[,] ToGlobal(double[,] k, double c, double s)
    {
        var t = new double[6, 6];
        for (int blk = 0; blk < 2; blk++)
        {
            int o = 3 * blk;
            t[o, o] = c; t[o, o + 1] = s;
            t[o + 1, o] = -s; t[o + 1, o + 1] = c;
            t[o + 2, o + 2] = 1;
        }
        var kt = new double[6, 6];
        for (int i = 0; i < 6; i++)
            for (int j = 0; j < 6; j++)
            {
                double sum = 0;
                for (int m = 0; m < 6; m++) sum += k[i, m] * t[m, j];
                kt[i, j] = sum;
            }
        var g = new double[6, 6];
        for (int i = 0; i < 6; i++)
            for (int j = 0; j < 6; j++)
            {
                double sum = 0;
                for (int m = 0; m < 6; m++) sum += t[m, i] * kt[m, j];
                g[i, j] = sum;
            }
        return g;
    }
}
