namespace CrossCheck.Analysis;

/// <summary>
/// Fixed-end actions of a prismatic member clamped at both ends: the forces the clamps apply to the
/// member, in local axes, order (N1, V1, M1, N2, V2, M2), moments anticlockwise positive.
/// </summary>
/// <remarks>
/// The end moments of a distributed load are obtained by integrating the point-load influence
/// (M1 = −Q·a·b²/L², M2 = +Q·a²·b/L²) with three-point Gauss–Legendre quadrature, which is exact for a
/// linearly varying load (the integrand is a quartic). Shears follow from statics of the member, so every
/// load kind satisfies equilibrium by construction.
/// </remarks>
internal static class FixedEndActions
{
    private static readonly double[] GaussPoints = [-Math.Sqrt(0.6), 0.0, Math.Sqrt(0.6)];
    private static readonly double[] GaussWeights = [5.0 / 9.0, 8.0 / 9.0, 5.0 / 9.0];

    public static double[] Compute(IEnumerable<LocalAction> actions, double length)
    {
        double L = length;
        double m1 = 0, m2 = 0, n1 = 0, n2 = 0;
        double sumQy = 0, sumQyX = 0, sumC = 0;

        foreach (var action in actions)
        {
            switch (action)
            {
                case LocalPoint p:
                {
                    double a = p.A, b = L - p.A;
                    m1 += -p.Qy * a * b * b / (L * L);
                    m2 += p.Qy * a * a * b / (L * L);
                    n1 += -p.Qx * b / L;
                    n2 += -p.Qx * a / L;
                    sumQy += p.Qy;
                    sumQyX += p.Qy * a;
                    break;
                }
                case LocalDistributed d:
                {
                    double half = (d.B - d.A) / 2, mid = (d.A + d.B) / 2;
                    for (int g = 0; g < 3; g++)
                    {
                        double s = mid + (half * GaussPoints[g]);
                        double w = half * GaussWeights[g];
                        double qy = d.QyAt(s) * w, qx = d.QxAt(s) * w;
                        double a = s, b = L - s;
                        m1 += -qy * a * b * b / (L * L);
                        m2 += qy * a * a * b / (L * L);
                        n1 += -qx * b / L;
                        n2 += -qx * a / L;
                        sumQy += qy;
                        sumQyX += qy * s;
                    }
                    break;
                }
                case LocalEndMoments e:
                    m1 += e.M1;
                    m2 += e.M2;
                    break;
                case LocalCouple c:
                {
                    double a = c.A, b = L - c.A;
                    m1 += c.C * b * ((2 * a) - b) / (L * L);
                    m2 += c.C * a * ((2 * b) - a) / (L * L);
                    sumC += c.C;
                    break;
                }
            }
        }

        // Statics of the clamped member: ΣFy = 0 and ΣM about the start = 0.
        double v2 = -(m1 + m2 + sumQyX + sumC) / L;
        double v1 = -sumQy - v2;
        return [n1, v1, m1, n2, v2, m2];
    }
}
