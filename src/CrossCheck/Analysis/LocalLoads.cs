using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// A member load resolved into the member's local axes: x along the member from start to end,
/// y 90° anticlockwise from x. Forces are positive along the local axes, couples anticlockwise.
/// </summary>
internal abstract record LocalAction(Load Origin)
{
    /// <summary>Breakpoints along the member where the internal forces change character.</summary>
    public abstract IEnumerable<double> Breakpoints { get; }
}

/// <summary>Concentrated force at <paramref name="A"/>.</summary>
internal sealed record LocalPoint(Load Origin, double A, double Qx, double Qy) : LocalAction(Origin)
{
    public override IEnumerable<double> Breakpoints => [A];
}

/// <summary>Linearly varying load per unit length from <paramref name="A"/> to <paramref name="B"/>.</summary>
internal sealed record LocalDistributed(Load Origin, double A, double B, double Qx1, double Qx2, double Qy1, double Qy2) : LocalAction(Origin)
{
    public override IEnumerable<double> Breakpoints => [A, B];

    public double QyAt(double s) => B == A ? Qy1 : Qy1 + ((Qy2 - Qy1) * (s - A) / (B - A));

    public double QxAt(double s) => B == A ? Qx1 : Qx1 + ((Qx2 - Qx1) * (s - A) / (B - A));

    /// <summary>Resultant (∫q ds) and first moment about <paramref name="x"/> (∫q·(x−s) ds) of the transverse load left of x.</summary>
    public (double Force, double MomentAboutX) TransverseLeftOf(double x)
    {
        if (x <= A) return (0, 0);
        double end = Math.Min(x, B);
        double t = end - A;
        double k = B == A ? 0 : (Qy2 - Qy1) / (B - A);
        double xx = x - A;
        double force = (Qy1 * t) + (k * t * t / 2);
        double moment = (Qy1 * ((xx * t) - (t * t / 2))) + (k * ((xx * t * t / 2) - (t * t * t / 3)));
        return (force, moment);
    }
}

/// <summary>Concentrated couple (anticlockwise positive) at <paramref name="A"/>.</summary>
internal sealed record LocalCouple(Load Origin, double A, double C) : LocalAction(Origin)
{
    public override IEnumerable<double> Breakpoints => [A];
}

internal static class LocalLoads
{
    /// <summary>Resolves a member load given in global directions into local actions, through its <see cref="MemberLoad.Shape"/>.</summary>
    public static LocalAction Resolve(MemberLoad load, double cos, double sin)
    {
        // Local axes in global components: ex = (c, s), ey = (−s, c).
        (double qx, double qy) Components(LoadDirection dir)
        {
            var (gx, gy) = dir.Vector();
            return ((gx * cos) + (gy * sin), (-gx * sin) + (gy * cos));
        }

        switch (load.Shape())
        {
            case ConcentratedForce p:
            {
                var (ux, uy) = Components(p.Direction);
                return new LocalPoint(load, p.A, p.P * ux, p.P * uy);
            }
            case LinearlyVaryingLoad d:
            {
                var (ux, uy) = Components(d.Direction);
                return new LocalDistributed(load, d.A, d.B, d.WStart * ux, d.WEnd * ux, d.WStart * uy, d.WEnd * uy);
            }
            case ConcentratedCouple c:
                // Clockwise positive in the submission; anticlockwise positive here.
                return new LocalCouple(load, c.A, -c.M);
            case LockedEnds e:
                return new LocalEndMoments(load, -e.StartMoment, -e.EndMoment);
            default:
                throw new NotSupportedException($"Load kind {load.GetType().Name} is not supported on members.");
        }
    }
}

/// <summary>
/// End moments locked into a member as if its fixed-end moments were different: used to test the effect of a
/// wrong fixed-end moment. Clockwise positive, N·m. Not part of the submission format.
/// </summary>
public sealed record LockedEndMoments(string Case, string Member, double StartMoment, double EndMoment, SourceRef Source)
    : MemberLoad(Case, Member, Source)
{
    public override MemberLoadShape Shape() => new LockedEnds(StartMoment, EndMoment);

    public override Load Scaled(double factor, string caseId) => this with { Case = caseId, StartMoment = StartMoment * factor, EndMoment = EndMoment * factor };
}

/// <summary>The shape of <see cref="LockedEndMoments"/>: end moments that act only through the fixed-end actions.</summary>
internal sealed record LockedEnds(double StartMoment, double EndMoment) : MemberLoadShape;

/// <summary>Local form of <see cref="LockedEndMoments"/> (anticlockwise end moments).</summary>
internal sealed record LocalEndMoments(Load Origin, double M1, double M2) : LocalAction(Origin)
{
    public override IEnumerable<double> Breakpoints => [];
}
