using CrossCheck.Model;

namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// Draws the loads of one case on an elevation: arrows pointing at the member or joint they act on, distributed loads
/// as a row of arrows whose length follows the intensity, couples as three-quarter arcs turning the way they act.
/// Several loads on the same side of a member are stacked outwards.
/// </summary>
internal sealed class LoadSketch
{
    private const double ArrowLength = 34;
    private const double MinBand = 10;
    private const double MaxBand = 26;

    private readonly StructureSketch _sketch;
    private readonly StructureModel _model;
    private readonly UnitText _units;
    private readonly Dictionary<(string On, Pt Side), double> _stack = [];
    private readonly List<(Pt Anchor, Pt Outward, Pt Along, string Text)> _labels = [];

    private readonly Func<LoadDirection, Pt> _towards;

    /// <param name="towards">Drawing direction of a load direction; by default the global one (down is down).</param>
    public LoadSketch(StructureSketch sketch, StructureModel model, UnitText units, Func<LoadDirection, Pt>? towards = null)
    {
        _sketch = sketch;
        _model = model;
        _units = units;
        _towards = towards ?? GlobalDirection;
    }

    /// <summary>For each member, the sum of the directions its loads come from (to keep its tag on the other side).</summary>
    public Dictionary<string, Pt> LoadSides { get; } = new(StringComparer.Ordinal);

    /// <summary>Draws the arrows and blocks their area; <see cref="Labels"/> places the values afterwards.</summary>
    public void Draw(SvgCanvas svg, LabelPlacer placer, LoadCase loadCase)
    {
        double wMax = loadCase.Loads.OfType<DistributedLoad>().Select(d => Math.Max(Math.Abs(d.WStart), Math.Abs(d.WEnd))).DefaultIfEmpty(0).Max();
        foreach (var load in loadCase.Loads)
        {
            switch (load)
            {
                case PointLoad p when _model.TryGetMember(p.Member, out var m):
                    Point(svg, placer, m, p, Towards(p.Direction));
                    break;
                case DistributedLoad d when _model.TryGetMember(d.Member, out var m):
                    Distributed(svg, placer, m, d, Towards(d.Direction), wMax);
                    break;
                case MemberCouple c when _model.TryGetMember(c.Member, out var m):
                {
                    var at = _sketch.Along(m, c.A);
                    Arc(svg, placer, at, 11, c.M, _units.Couple(c.M), (_sketch.Ends(m).End - _sketch.Ends(m).Start).Unit.TurnClockwise * -1);
                    break;
                }
                case JointForce f when _model.TryGetJoint(f.Joint, out _):
                {
                    var d = Towards(f.Direction);
                    var key = (f.Joint, d * -1);
                    double off = _stack.GetValueOrDefault(key);
                    var tip = _sketch.At(f.Joint) - (d * (6 + off));
                    // Longer and heavier than member-load arrows, so it stands out of a distributed load drawn at the same joint.
                    var tail = tip - (d * (ArrowLength + 14));
                    svg.Arrow(tail, tip, DiagramStyle.Load, DiagramStyle.LoadWeight + 1, head: 8, cssClass: "cc-load");
                    placer.Block(new Box(Math.Min(tail.X, tip.X), Math.Min(tail.Y, tip.Y), Math.Max(tail.X, tip.X), Math.Max(tail.Y, tip.Y)).Grow(3));
                    _labels.Add((tail, d * -1, d.TurnClockwise, _units.Force(f.P)));
                    _stack[key] = off + ArrowLength + 18;
                    break;
                }
                case JointCouple c when _model.TryGetJoint(c.Joint, out _):
                    Arc(svg, placer, _sketch.At(c.Joint), 16, c.M, _units.Couple(c.M), new Pt(0.6, -0.8));
                    break;
            }
        }
    }

    /// <summary>Places and writes the load values (after the joint labels have taken their places).</summary>
    public void Labels(SvgCanvas svg, LabelPlacer placer)
    {
        foreach (var (anchor, outward, along, text) in _labels)
        {
            double w = DiagramStyle.TextWidth(text, DiagramStyle.LabelSize), h = DiagramStyle.LabelSize * 1.2;
            var c = placer.Place(LabelPlacer.Beyond(anchor, outward, along, w, h, 3), w, h);
            svg.Text(c, text, DiagramStyle.LabelSize, DiagramStyle.Load, cssClass: "cc-load-label");
        }
    }

    private Pt Towards(LoadDirection d) => _towards(d);

    private static Pt GlobalDirection(LoadDirection d)
    {
        var (x, y) = d.Vector();
        return View.Direction(x, y);
    }

    private void NoteSide(string member, Pt from) =>
        LoadSides[member] = LoadSides.GetValueOrDefault(member) + from;

    private void Point(SvgCanvas svg, LabelPlacer placer, Member m, PointLoad p, Pt d)
    {
        var key = (m.Id, d * -1);
        double off = _stack.GetValueOrDefault(key);
        var tip = _sketch.Along(m, p.A) - (d * (2 + off));
        var tail = tip - (d * ArrowLength);
        svg.Arrow(tail, tip, DiagramStyle.Load, DiagramStyle.LoadWeight + 0.4, cssClass: "cc-load");
        placer.Block(new Box(Math.Min(tail.X, tip.X), Math.Min(tail.Y, tip.Y), Math.Max(tail.X, tip.X), Math.Max(tail.Y, tip.Y)).Grow(3));
        var (s, e) = _sketch.Ends(m);
        _labels.Add((tail, d * -1, (e - s).Unit, _units.Force(p.P)));
        NoteSide(m.Id, d * -1);
    }

    private void Distributed(SvgCanvas svg, LabelPlacer placer, Member m, DistributedLoad load, Pt d, double wMax)
    {
        var key = (m.Id, d * -1);
        double off = _stack.GetValueOrDefault(key);
        var (s, e) = _sketch.Ends(m);
        var along = (e - s).Unit;
        var a = _sketch.Along(m, load.A);
        var b = _sketch.Along(m, load.B);
        double span = (b - a).Length;
        int n = Math.Max(2, (int)Math.Ceiling(span / 24));
        double Height(double w) => wMax > 0 ? MinBand + ((MaxBand - MinBand) * Math.Abs(w) / wMax) : MinBand;
        var tails = new List<Pt>();
        var box = Box.Empty;
        double hMax = 0;
        for (int i = 0; i <= n; i++)
        {
            double f = (double)i / n;
            double w = load.WStart + ((load.WEnd - load.WStart) * f);
            var tip = Pt.Lerp(a, b, f) - (d * (2 + off));
            double h = Math.Abs(w) < 1e-12 ? 0 : Height(w);
            var tail = tip - (d * h);
            hMax = Math.Max(hMax, h);
            tails.Add(tail);
            box = box.Include(tip).Include(tail);
            if (h >= 5) svg.Arrow(tail, tip, DiagramStyle.Load, DiagramStyle.LoadWeight, head: Math.Min(5.5, h * 0.6), cssClass: "cc-load");
        }
        svg.Path(tails, close: false, null, DiagramStyle.Load, DiagramStyle.LoadWeight, cssClass: "cc-load");
        placer.Block(box.Grow(2));
        string text = load.IsUniform
            ? $"{_units.LineLoad(load.WStart)} {_units.LineLoadUnit}"
            : $"{_units.LineLoad(load.WStart)} → {_units.LineLoad(load.WEnd)} {_units.LineLoadUnit}";
        var top = tails[tails.Count / 2];
        if (Math.Abs(load.WStart) > Math.Abs(load.WEnd) * 1.5 || Math.Abs(load.WEnd) > Math.Abs(load.WStart) * 1.5)
            top = Math.Abs(load.WStart) >= Math.Abs(load.WEnd) ? tails[0] : tails[^1];
        _labels.Add((top, d * -1, along, text));
        _stack[key] = off + Math.Max(hMax, MinBand) + 16;
        NoteSide(m.Id, d * -1);
    }

    private void Arc(SvgCanvas svg, LabelPlacer placer, Pt centre, double r, double clockwise, string text, Pt labelSide)
    {
        // On screen (y down) a clockwise turn is an increasing angle.
        double sweep = 1.5 * Math.PI * (clockwise >= 0 ? 1 : -1);
        double a0 = -0.75 * Math.PI;
        var pts = new List<Pt>();
        for (int i = 0; i <= 28; i++)
        {
            double a = a0 + (sweep * i / 28);
            pts.Add(centre + (new Pt(Math.Cos(a), Math.Sin(a)) * r));
        }
        svg.Path(pts, close: false, null, DiagramStyle.Load, DiagramStyle.LoadWeight + 0.3, cssClass: "cc-load");
        var end = pts[^1];
        var tangent = (pts[^1] - pts[^3]).Unit;
        var baseP = end - (tangent * 6);
        var side = tangent.TurnClockwise * 2.6;
        svg.Path([end + (tangent * 1.5), baseP + side, baseP - side], close: true, DiagramStyle.Load, DiagramStyle.Load, 0.6, cssClass: "cc-load");
        placer.Block(Box.Around(centre, (2 * r) + 6, (2 * r) + 6));
        _labels.Add((centre + (labelSide.Unit * (r + 2)), labelSide, labelSide.TurnClockwise, text));
    }
}
