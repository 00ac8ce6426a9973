using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>An extreme of a pattern-loading envelope: its value, the members loaded to reach it, and where along the member (span maxima).</summary>
/// <param name="Value">The extreme (N·m), in the sign of the quantity asked for.</param>
/// <param name="Loaded">The patterned members loaded in the arrangement that gives it, in the model's member order.</param>
/// <param name="X">Distance from the member's start (m); 0 or the length for an end.</param>
public sealed record EnvelopeExtreme(double Value, IReadOnlyList<string> Loaded, double X);

/// <summary>The largest and least internal moment at one section over every arrangement (for drawing the envelope).</summary>
public readonly record struct EnvelopeStation(double X, double Max, double Min);

/// <summary>
/// The envelope of a combination with a patterned case, exact by superposition: the fixed part (every case at its factor,
/// patterned member loads at their unloaded factor, support movements once) plus, for each member carrying a patterned
/// load, that member's contribution when loaded ((factor − unloaded factor) × its patterned loads, on the structure
/// without support movements). Any quantity of any arrangement is the fixed part plus the contributions of the members
/// loaded; its extreme over every arrangement takes each contribution where it is favourable, linear in the number of
/// members.
/// </summary>
public sealed class Envelope
{
    private readonly string[] _order;
    private readonly (CaseResult Result, double Weight)[] _extra;
    private readonly double _scale;

    internal Envelope(Combination combination, CaseResult fixedPart, IReadOnlyDictionary<string, CaseResult> contributions, IEnumerable<string> memberOrder)
        : this(combination, fixedPart, contributions, memberOrder.Where(contributions.ContainsKey).ToArray(), [], 1)
    {
    }

    private Envelope(Combination combination, CaseResult fixedPart, IReadOnlyDictionary<string, CaseResult> contributions, string[] order,
        (CaseResult, double)[] extra, double scale)
    {
        Combination = combination;
        Fixed = fixedPart;
        Contributions = contributions;
        _order = order;
        _extra = extra;
        _scale = scale;
    }

    /// <summary>
    /// The envelope of a variant of the combination: <paramref name="extra"/> results (times their weights) added to the
    /// fixed part, and every member's contribution times <paramref name="scale"/> — another factor on a case, a case left
    /// out (what the diagnosis recomputes).
    /// </summary>
    public Envelope Adjusted(IEnumerable<(CaseResult Result, double Weight)> extra, double scale)
    {
        ArgumentNullException.ThrowIfNull(extra);
        return new(Combination, Fixed, Contributions, _order, [.. _extra, .. extra], _scale * scale);
    }

    /// <summary>The fixed part's value of a quantity (with any added results).</summary>
    private double FixedValue(Func<CaseResult, double> quantity)
    {
        double v = quantity(Fixed);
        foreach (var (r, w) in _extra) v += w * quantity(r);
        return v;
    }

    public Combination Combination { get; }

    /// <summary>The part present in every arrangement.</summary>
    public CaseResult Fixed { get; }

    /// <summary>Each patterned member's contribution when it is loaded, by member id.</summary>
    public IReadOnlyDictionary<string, CaseResult> Contributions { get; }

    /// <summary>The members that carry a patterned load, in the model's order.</summary>
    public IReadOnlyList<string> Patterned => _order;

    /// <summary>Member <paramref name="member"/> with the patterned members <paramref name="loaded"/> loaded and the others not.</summary>
    public SuperposedMember Member(string member, IEnumerable<string> loaded)
    {
        ArgumentNullException.ThrowIfNull(loaded);
        var parts = new List<(MemberResult, double)> { (Fixed.Members[member], 1) };
        foreach (var (r, w) in _extra) parts.Add((r.Members[member], w));
        foreach (var m in loaded) if (Contributions.TryGetValue(m, out var c)) parts.Add((c.Members[member], _scale));
        return new SuperposedMember(parts);
    }

    /// <summary>Member <paramref name="member"/> with every patterned member loaded.</summary>
    public SuperposedMember AllLoaded(string member) => Member(member, _order);

    /// <summary>
    /// The largest and least value of a quantity (read from a <see cref="CaseResult"/>, linear in the loads) over every
    /// arrangement, with the arrangement of each.
    /// </summary>
    public (EnvelopeExtreme Max, EnvelopeExtreme Min) Extremes(Func<CaseResult, double> quantity, double x = 0)
    {
        ArgumentNullException.ThrowIfNull(quantity);
        double baseValue = FixedValue(quantity), max = baseValue, min = baseValue;
        var up = new List<string>();
        var down = new List<string>();
        var contributions = _order.Select(m => (Member: m, Value: _scale * quantity(Contributions[m]))).ToList();
        // A contribution at round-off level is no reason to load a member: it neither raises nor lowers the extreme.
        double negligible = 1e-10 * (contributions.Sum(c => Math.Abs(c.Value)) + Math.Abs(baseValue));
        foreach (var (m, c) in contributions)
        {
            if (c > negligible) { max += c; up.Add(m); }
            else if (c < -negligible) { min += c; down.Add(m); }
        }
        return (new EnvelopeExtreme(max, up, x), new EnvelopeExtreme(min, down, x));
    }

    /// <summary>The value of a quantity with every patterned member loaded.</summary>
    public double AllLoadedValue(Func<CaseResult, double> quantity)
    {
        ArgumentNullException.ThrowIfNull(quantity);
        return FixedValue(quantity) + (_scale * _order.Sum(m => quantity(Contributions[m])));
    }

    /// <summary>The largest and least internal moment at sections along the member (both sides of every load point).</summary>
    public IReadOnlyList<EnvelopeStation> Curve(string member)
    {
        var stations = new List<EnvelopeStation>();
        foreach (var x in Sections(member))
        {
            var (lMax, lMin) = PointExtremes(member, x, right: false);
            stations.Add(new EnvelopeStation(x, lMax, lMin));
            var (rMax, rMin) = PointExtremes(member, x, right: true);
            if (rMax != lMax || rMin != lMin) stations.Add(new EnvelopeStation(x, rMax, rMin));
        }
        return stations;
    }

    /// <summary>
    /// The largest span moment over every arrangement (the largest internal moment of the member, ends included) and the
    /// arrangement that gives it: the pointwise envelope is searched at sections along the member, and the span maximum
    /// of each of the best sections' arrangements is found exactly.
    /// </summary>
    public EnvelopeExtreme SpanMaximum(string member)
    {
        var candidates = Sections(member).SelectMany(x => new[] { (x, false), (x, true) })
            .Select(t => (Loaded: Favourable(member, t.x, t.Item2), Value: PointExtremes(member, t.x, t.Item2).Max))
            .OrderByDescending(t => t.Value).Take(4).Select(t => t.Loaded).DistinctBy(l => string.Join("\u0001", l)).ToList();
        EnvelopeExtreme? best = null;
        foreach (var loaded in candidates)
        {
            var (x, m) = Member(member, loaded).SpanMaximum;
            if (best is null || m > best.Value) best = new EnvelopeExtreme(m, loaded, x);
        }
        return best!;
    }

    /// <summary>The largest span moment with every patterned member loaded.</summary>
    public EnvelopeExtreme AllLoadedSpanMaximum(string member)
    {
        var (x, m) = AllLoaded(member).SpanMaximum;
        return new EnvelopeExtreme(m, _order, x);
    }

    private List<double> Sections(string member)
    {
        double length = Fixed.Members[member].Length;
        var xs = new SortedSet<double>();
        for (int i = 0; i <= 40; i++) xs.Add(length * i / 40);
        foreach (var s in Fixed.Members[member].Stations) xs.Add(s.X);
        // The other members' contributions vary linearly along this one (their loads are elsewhere): only its own has load points.
        if (Contributions.TryGetValue(member, out var own)) foreach (var s in own.Members[member].Stations) xs.Add(s.X);
        return [.. xs];
    }

    private (double Max, double Min) PointExtremes(string member, double x, bool right)
    {
        double M(CaseResult r) => right ? r.Members[member].MomentRightOf(x) : r.Members[member].MomentAt(x);
        double b = FixedValue(M), max = b, min = b;
        foreach (var m in _order)
        {
            double c = _scale * M(Contributions[m]);
            if (c > 0) max += c; else min += c;
        }
        return (max, min);
    }

    private List<string> Favourable(string member, double x, bool right) =>
        _order.Where(m => _scale * (right ? Contributions[m].Members[member].MomentRightOf(x) : Contributions[m].Members[member].MomentAt(x)) > 0).ToList();
}
