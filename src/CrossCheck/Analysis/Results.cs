using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>Displacement of a joint: ux right, uy up (m), rotation clockwise positive (rad).</summary>
public readonly record struct JointDisplacement(double Ux, double Uy, double Rotation);

/// <summary>Support reaction on the structure: Rx right, Ry up (N), M clockwise positive (N·m).</summary>
public readonly record struct Reaction(double Rx, double Ry, double M);

/// <summary>Bending moment and shear at a point along a member.</summary>
/// <param name="X">Distance from the start joint (m).</param>
/// <param name="Moment">Bending moment, positive when the right-hand fibre (facing start→end) is in tension (N·m).</param>
/// <param name="Shear">Shear, dM/dx (N).</param>
public readonly record struct Station(double X, double Moment, double Shear);

/// <summary>Recomputed forces of one member in one load case.</summary>
public sealed class MemberResult
{
    private readonly LocalAction[] _actions;
    private readonly double _v1;
    private readonly double _m1;

    internal MemberResult(Member member, double length, double cos, double sin, double[] localEndForces, double[] localDisplacements, LocalAction[] actions)
    {
        Member = member;
        Length = length;
        Cos = cos;
        Sin = sin;
        _actions = actions;
        LocalEndForces = localEndForces;
        LocalDisplacements = localDisplacements;
        _v1 = localEndForces[1];
        _m1 = localEndForces[2];
        // Stations and span extremes are worked out on first use: a large frame solved only for its end moments
        // should not pay for them.
        _stations = new Lazy<Station[]>(BuildStations);
        _extremes = new Lazy<((double, double), (double, double), (double, double))>(FindExtremes);
    }

    private readonly Lazy<Station[]> _stations;
    private readonly Lazy<((double X, double Moment) Sagging, (double X, double Moment) Hogging, (double X, double Moment) Top)> _extremes;

    public Member Member { get; }
    public double Length { get; }
    public double Cos { get; }
    public double Sin { get; }

    /// <summary>Forces of the joints on the member ends in local axes: N1, V1, M1, N2, V2, M2 (moments anticlockwise).</summary>
    public IReadOnlyList<double> LocalEndForces { get; }

    /// <summary>End displacements in local axes, including the rotation of released ends.</summary>
    public IReadOnlyList<double> LocalDisplacements { get; }

    /// <summary>Clockwise member-end moment at the start (N·m): the moment-distribution convention.</summary>
    public double StartMoment => -LocalEndForces[2];

    /// <summary>Clockwise member-end moment at the end (N·m).</summary>
    public double EndMoment => -LocalEndForces[5];

    public double MomentAtEnd(MemberEnd end) => end == MemberEnd.Start ? StartMoment : EndMoment;

    /// <summary>Transverse end forces on the member (local y, N).</summary>
    public double StartShear => LocalEndForces[1];
    public double EndShear => LocalEndForces[4];

    /// <summary>Axial force at the end joint, tension positive (N).</summary>
    public double EndAxial => LocalEndForces[3];

    /// <summary>Axial force at the start joint, tension positive (N).</summary>
    public double StartAxial => -LocalEndForces[0];

    /// <summary>Bending moment at x (sagging-type sign, see <see cref="Station"/>), just left of any load at x.</summary>
    public double MomentAt(double x) => Evaluate(x, includeAtX: false).Moment;

    /// <summary>Bending moment just right of x (differs from <see cref="MomentAt"/> only at a couple).</summary>
    public double MomentRightOf(double x) => Evaluate(x, includeAtX: true).Moment;

    public double ShearAt(double x) => Evaluate(x, includeAtX: false).Shear;

    /// <summary>Stations at twentieths of the length plus both sides of every concentrated load.</summary>
    public IReadOnlyList<Station> Stations => _stations.Value;

    /// <summary>Largest positive bending moment and where (x, M); (x, 0) when none is positive.</summary>
    public (double X, double Moment) MaxSagging => _extremes.Value.Sagging;

    /// <summary>Most negative bending moment and where.</summary>
    public (double X, double Moment) MaxHogging => _extremes.Value.Hogging;

    /// <summary>
    /// The span moment: the largest bending moment over the member, ends included, and where (for a member that never
    /// sags, its least hogging moment).
    /// </summary>
    public (double X, double Moment) SpanMaximum => _extremes.Value.Top;

    /// <summary>Shear at the start in the beam convention V = dM/dx along start→end (+wL/2 for a simple span under a downward load).</summary>
    public double StartV => LocalEndForces[1];

    /// <summary>Shear at the end in the beam convention (−wL/2 for a simple span under a downward load).</summary>
    public double EndV => -LocalEndForces[4];

    /// <summary>The end shear in the beam convention.</summary>
    public double VAtEnd(MemberEnd end) => end == MemberEnd.Start ? StartV : EndV;

    /// <summary>Loads on this member in local axes (for diagrams).</summary>
    internal IReadOnlyList<LocalAction> Actions => _actions;

    private (double Moment, double Shear) Evaluate(double x, bool includeAtX)
    {
        double m = -_m1 + (x * _v1);
        double v = _v1;
        foreach (var a in _actions)
        {
            switch (a)
            {
                case LocalPoint p when p.A < x || (includeAtX && p.A == x):
                    m += (x - p.A) * p.Qy;
                    v += p.Qy;
                    break;
                case LocalDistributed d:
                {
                    var (force, moment) = d.TransverseLeftOf(x);
                    m += moment;
                    v += force;
                    break;
                }
                case LocalCouple c when c.A < x || (includeAtX && c.A == x):
                    m -= c.C;
                    break;
            }
        }
        return (m, v);
    }

    private List<double> Breakpoints()
    {
        var points = new SortedSet<double> { 0, Length };
        foreach (var a in _actions)
            foreach (var b in a.Breakpoints)
                if (b > 0 && b < Length) points.Add(b);
        return [.. points];
    }

    private Station[] BuildStations()
    {
        var list = new List<Station>();
        var xs = new SortedSet<double>();
        for (int i = 0; i <= 20; i++) xs.Add(Length * i / 20);
        foreach (var b in Breakpoints()) xs.Add(b);
        foreach (var x in xs)
        {
            var left = Evaluate(x, includeAtX: false);
            var right = Evaluate(x, includeAtX: true);
            list.Add(new Station(x, left.Moment, left.Shear));
            if (x < Length && (Math.Abs(right.Moment - left.Moment) > 0 || Math.Abs(right.Shear - left.Shear) > 0))
                list.Add(new Station(x, right.Moment, right.Shear));
        }
        return [.. list];
    }

    private ((double, double), (double, double), (double, double)) FindExtremes()
    {
        var candidates = new List<double>();
        var bps = Breakpoints();
        foreach (var b in bps) candidates.Add(b);
        // Shear is a polynomial of degree ≤ 2 between breakpoints: bracket its sign changes and bisect.
        for (int k = 0; k + 1 < bps.Count; k++)
        {
            double lo = bps[k], hi = bps[k + 1];
            const int n = 32;
            double prevX = lo, prevV = Evaluate(lo, includeAtX: true).Shear;
            for (int i = 1; i <= n; i++)
            {
                double x = lo + ((hi - lo) * i / n);
                double v = Evaluate(x, includeAtX: false).Shear;
                if (prevV == 0) candidates.Add(prevX);
                else if (Math.Sign(v) != Math.Sign(prevV) && v != 0)
                {
                    double a = prevX, b = x, va = prevV;
                    for (int it = 0; it < 60; it++)
                    {
                        double mid = (a + b) / 2;
                        double vm = Evaluate(mid, includeAtX: false).Shear;
                        if (Math.Sign(vm) == Math.Sign(va)) { a = mid; va = vm; } else b = mid;
                    }
                    candidates.Add((a + b) / 2);
                }
                prevX = x; prevV = v;
            }
        }
        (double X, double M) max = (0, 0), min = (0, 0), top = (0, double.NegativeInfinity);
        foreach (var x in candidates)
        {
            foreach (var m in new[] { Evaluate(x, false).Moment, Evaluate(x, true).Moment })
            {
                if (m > max.M) max = (x, m);
                if (m < min.M) min = (x, m);
                if (m > top.M) top = (x, m);
            }
        }
        return (max, min, top);
    }
}

/// <summary>Recomputed results of one load case.</summary>
public sealed class CaseResult
{
    internal CaseResult(string caseId, IReadOnlyDictionary<string, MemberResult> members,
        IReadOnlyDictionary<string, JointDisplacement> displacements, IReadOnlyDictionary<string, Reaction> reactions)
    {
        Case = caseId;
        Members = members;
        Displacements = displacements;
        Reactions = reactions;
    }

    public string Case { get; }
    public IReadOnlyDictionary<string, MemberResult> Members { get; }
    public IReadOnlyDictionary<string, JointDisplacement> Displacements { get; }

    /// <summary>Reactions at supported joints only.</summary>
    public IReadOnlyDictionary<string, Reaction> Reactions { get; }

    /// <summary>Clockwise member-end moment (N·m).</summary>
    public double EndMoment(string member, MemberEnd end) => Members[member].MomentAtEnd(end);

    /// <summary>Largest absolute member-end or span moment of the case (N·m).</summary>
    public double PeakMoment => Members.Values.Select(m => Math.Max(Math.Max(Math.Abs(m.StartMoment), Math.Abs(m.EndMoment)),
        Math.Max(Math.Abs(m.MaxSagging.Moment), Math.Abs(m.MaxHogging.Moment)))).DefaultIfEmpty(0).Max();
}

/// <summary>Results of an analysis: one <see cref="CaseResult"/> per load case, and notes on what was assumed.</summary>
public sealed class AnalysisResult
{
    internal AnalysisResult(StructureModel model, IReadOnlyList<CaseResult> cases, IReadOnlyList<string> notes, double conditionEstimate)
    {
        Model = model;
        Cases = cases;
        Notes = notes;
        ConditionEstimate = conditionEstimate;
    }

    public StructureModel Model { get; }
    public IReadOnlyList<CaseResult> Cases { get; }

    /// <summary>What the reviewer should know about the analysis (e.g. an ill-conditioned stiffness matrix).</summary>
    public IReadOnlyList<string> Notes { get; }

    /// <summary>Condition number of the stiffness matrix, as <see cref="NumericalReport.ConditionEstimate"/>.</summary>
    public double ConditionEstimate { get; }

    /// <summary>
    /// The numerical sanity checks the results passed: condition estimate, the largest stiffness contrast between
    /// neighbouring members, and every case's equilibrium residual. An analysis that fails them is never returned.
    /// </summary>
    public NumericalReport Numerics { get; init; } = new(1, null, []);

    public CaseResult Case(string id) => Cases.First(c => c.Case == id);

    /// <summary>The envelopes of the combinations with a patterned case (<see cref="CombinationAnalysis"/>).</summary>
    public IReadOnlyList<Envelope> Envelopes { get; init; } = [];

    /// <summary>True when the combinations have been analysed: their derived cases are in <see cref="Cases"/>, their envelopes in <see cref="Envelopes"/>.</summary>
    public bool IncludesCombinations { get; init; }

    /// <summary>The envelope of combination <paramref name="name"/>, if it has one.</summary>
    public Envelope? Envelope(string name) => Envelopes.FirstOrDefault(e => e.Combination.Name == name);

    /// <summary>This analysis with the derived cases of the combinations added and their envelopes attached.</summary>
    internal AnalysisResult WithCombinations(AnalysisResult? derived, IReadOnlyList<Envelope> envelopes) =>
        new(Model, [.. Cases, .. derived?.Cases ?? []], [.. Notes, .. (derived?.Notes ?? []).Except(Notes)], ConditionEstimate)
        {
            Numerics = derived is null ? Numerics : Numerics with { Cases = [.. Numerics.Cases, .. derived.Numerics.Cases] },
            Envelopes = envelopes,
            IncludesCombinations = true,
        };
}
