using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// A member's forces by statics alone: its two end moments given (clockwise, N·m) and its own loads, with no stiffness
/// analysis — what the checks of claimed numbers use (the span moment and end shears that follow from claimed end
/// moments), and, with both end moments zero, the free (simply supported) moments and shears of a hand method.
/// </summary>
internal static class MemberStatics
{
    /// <summary>The member result whose end moments are <paramref name="m1"/> and <paramref name="m2"/> (clockwise) under <paramref name="actions"/>.</summary>
    public static MemberResult FromEndMoments(Member member, double length, double cos, double sin, double m1, double m2, LocalAction[] actions)
    {
        double sumQy = 0, sumQyX = 0, sumC = 0, sumQx = 0;
        foreach (var a in actions)
        {
            switch (a)
            {
                case LocalPoint p: sumQy += p.Qy; sumQyX += p.Qy * p.A; sumQx += p.Qx; break;
                case LocalDistributed d:
                {
                    var (force, momentAboutL) = d.TransverseLeftOf(length);
                    sumQy += force;
                    sumQyX += (force * length) - momentAboutL; // ∫q·s ds = L·∫q − ∫q(L − s)
                    sumQx += (d.Qx1 + d.Qx2) / 2 * (d.B - d.A);
                    break;
                }
                case LocalCouple c: sumC += c.C; break;
            }
        }
        // ΣM about the start (anticlockwise): −m1 − m2 + V2·L + Σ Qy·x + ΣC = 0; ΣFy: V1 + V2 + ΣQy = 0.
        double v2 = (m1 + m2 - sumQyX - sumC) / length;
        double v1 = -sumQy - v2;
        double[] ends = [0, v1, -m1, -sumQx, v2, -m2];
        return new MemberResult(member, length, cos, sin, ends, new double[6], actions);
    }
}
