using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// One member's forces as a weighted sum of results of the same member (superposition of load cases: a combination, one
/// arrangement of a patterned load). Signs as <see cref="MemberResult"/>: end moments clockwise, <see cref="MomentAt"/> the
/// internal moment (positive when the right-hand fibre, looking from start to end, is in tension), shears V = dM/dx.
/// </summary>
public sealed class SuperposedMember
{
    private readonly (MemberResult Result, double Weight)[] _parts;
    private (double X, double Moment)? _top;

    /// <param name="parts">Results of one member and their weights (at least one).</param>
    public SuperposedMember(IEnumerable<(MemberResult Result, double Weight)> parts)
    {
        ArgumentNullException.ThrowIfNull(parts);
        _parts = parts.ToArray();
        if (_parts.Length == 0) throw new ArgumentException("A superposition needs at least one result.", nameof(parts));
        Member = _parts[0].Result.Member;
        Length = _parts[0].Result.Length;
    }

    public Member Member { get; }
    public double Length { get; }

    private double Sum(Func<MemberResult, double> q)
    {
        double s = 0;
        foreach (var (r, w) in _parts) if (w != 0) s += w * q(r);
        return s;
    }

    /// <summary>Clockwise end moment at the start (N·m).</summary>
    public double StartMoment => Sum(r => r.StartMoment);

    /// <summary>Clockwise end moment at the end (N·m).</summary>
    public double EndMoment => Sum(r => r.EndMoment);

    public double MomentAtEnd(MemberEnd end) => end == MemberEnd.Start ? StartMoment : EndMoment;

    /// <summary>End shear in the beam convention (V = dM/dx from start to end).</summary>
    public double VAtEnd(MemberEnd end) => Sum(r => r.VAtEnd(end));

    /// <summary>Axial force at the start and at the end joint, tension positive (N).</summary>
    public (double Start, double End) Axial => (Sum(r => r.StartAxial), Sum(r => r.EndAxial));

    /// <summary>Internal bending moment just left of x.</summary>
    public double MomentAt(double x) => Sum(r => r.MomentAt(x));

    /// <summary>Internal bending moment just right of x.</summary>
    public double MomentRightOf(double x) => Sum(r => r.MomentRightOf(x));

    public double ShearAt(double x) => Sum(r => r.ShearAt(x));

    /// <summary>Where the moment may have a kink or a jump: the stations of every part (twentieths and load points).</summary>
    public IReadOnlyList<double> Breakpoints =>
        _parts.SelectMany(p => p.Result.Stations.Select(s => s.X)).Append(0).Append(Length).Distinct().Order().ToList();

    /// <summary>The largest internal moment over the member, ends included, and where (a member that never sags: its least hogging moment).</summary>
    public (double X, double Moment) SpanMaximum => _top ??= SpanSearch.Maximum(MomentAt, MomentRightOf, ShearAt, Breakpoints);
}

/// <summary>
/// The largest value of a member's bending moment: between breakpoints the moment is a polynomial of degree three at most,
/// so its maximum is at a breakpoint (either side) or where the shear changes sign, found by bracketing and bisection.
/// </summary>
internal static class SpanSearch
{
    private const int Samples = 16;

    public static (double X, double Moment) Maximum(Func<double, double> left, Func<double, double> right, Func<double, double> shear, IReadOnlyList<double> breakpoints)
    {
        (double X, double M) best = (0, double.NegativeInfinity);
        void Consider(double x, double m) { if (m > best.M) best = (x, m); }
        foreach (var x in breakpoints) { Consider(x, left(x)); Consider(x, right(x)); }
        for (int k = 0; k + 1 < breakpoints.Count; k++)
        {
            double lo = breakpoints[k], hi = breakpoints[k + 1];
            if (!(hi > lo)) continue;
            // Just inside the interval, so that a jump of shear at a load point does not count as a change of sign.
            double eps = 1e-9 * (hi - lo);
            double prevX = lo + eps, prevV = shear(prevX);
            for (int i = 1; i <= Samples; i++)
            {
                double x = i == Samples ? hi - eps : lo + ((hi - lo) * i / Samples);
                double v = shear(x);
                if (prevV > 0 && v <= 0)
                {
                    double a = prevX, b = x;
                    for (int it = 0; it < 60; it++)
                    {
                        double mid = (a + b) / 2;
                        if (shear(mid) > 0) a = mid; else b = mid;
                    }
                    double root = (a + b) / 2;
                    Consider(root, left(root));
                }
                prevX = x;
                prevV = v;
            }
        }
        return best;
    }
}
