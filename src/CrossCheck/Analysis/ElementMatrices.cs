using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>A 6×6 member matrix stored flat (row-major): cheaper to make by the hundred thousand than a 2-D array.</summary>
internal readonly struct Mat6
{
    private readonly double[] _v;

    public Mat6(double[] values) => _v = values;

    public static Mat6 Zero() => new(new double[36]);

    public double this[int i, int j]
    {
        get => _v[(i * 6) + j];
        set => _v[(i * 6) + j] = value;
    }

    public Mat6 Clone() => new((double[])_v.Clone());
}

/// <summary>Local stiffness of a plane frame member and the static condensation of released ends.</summary>
internal static class ElementMatrices
{
    /// <summary>
    /// Local 6×6 stiffness (u1, v1, θ1, u2, v2, θ2). <paramref name="ea"/> is zero for axially rigid members,
    /// whose length is held by a constraint instead.
    /// </summary>
    public static Mat6 LocalStiffness(double ei, double ea, double length)
    {
        double L = length;
        double a = ea / L;
        double b = 12 * ei / (L * L * L);
        double c = 6 * ei / (L * L);
        double d = 4 * ei / L;
        double e = 2 * ei / L;
        return new Mat6(
        [
            a, 0, 0, -a, 0, 0,
            0, b, c, 0, -b, c,
            0, c, d, 0, -c, e,
            -a, 0, 0, a, 0, 0,
            0, -b, -c, 0, b, -c,
            0, c, e, 0, -c, d,
        ]);
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
    public static (Mat6 K, double[] F) Condense(Mat6 k, double[] f, int[] released)
    {
        if (released.Length == 0) return (k, f);
        var kc = k.Clone();
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
    public static void RecoverReleased(Mat6 k, double[] f, int[] released, double[] d)
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

    /// <summary>
    /// Closed form of Tᵀ·k·T for a member with no releases (k has the pattern of <see cref="LocalStiffness"/>): the
    /// usual plane-frame member in global axes.
    /// </summary>
    private static Mat6 ToGlobalPlain(Mat6 k, double c, double s)
    {
        double a = k[0, 0], b = k[1, 1], d = k[1, 2], e = k[2, 2], f = k[2, 5];
        double xx = (a * c * c) + (b * s * s), yy = (a * s * s) + (b * c * c), xy = (a - b) * c * s;
        double xr = -d * s, yr = d * c;
        return new Mat6(
        [
            xx, xy, xr, -xx, -xy, xr,
            xy, yy, yr, -xy, -yy, yr,
            xr, yr, e, -xr, -yr, f,
            -xx, -xy, -xr, xx, xy, -xr,
            -xy, -yy, -yr, xy, yy, -yr,
            xr, yr, f, -xr, -yr, e,
        ]);
    }

    /// <summary>Global stiffness Tᵀ·k·T, with T made of two 3×3 rotation blocks (no temporary matrices).</summary>
    public static Mat6 ToGlobal(Mat6 k, double c, double s)
    {
        if (k[2, 5] != 0 && k[0, 1] == 0 && k[0, 2] == 0 && k[1, 0] == 0) return ToGlobalPlain(k, c, s);
        // Rotation block R = [[c, s, 0], [−s, c, 0], [0, 0, 1]]; (Tᵀ k T)_ij = Σ R_mi k_mn R_nj within blocks.
        Span<double> r = [c, s, 0, -s, c, 0, 0, 0, 1];
        var g = Mat6.Zero();
        for (int bi = 0; bi < 2; bi++)
            for (int bj = 0; bj < 2; bj++)
                for (int i = 0; i < 3; i++)
                    for (int j = 0; j < 3; j++)
                    {
                        double sum = 0;
                        for (int m = 0; m < 3; m++)
                        {
                            double rmi = r[(m * 3) + i];
                            if (rmi == 0) continue;
                            for (int n = 0; n < 3; n++)
                            {
                                double rnj = r[(n * 3) + j];
                                if (rnj != 0) sum += rmi * k[(3 * bi) + m, (3 * bj) + n] * rnj;
                            }
                        }
                        g[(3 * bi) + i, (3 * bj) + j] = sum;
                    }
        return g;
    }
}
