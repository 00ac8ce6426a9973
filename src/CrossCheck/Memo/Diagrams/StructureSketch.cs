using CrossCheck.Model;

namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// Draws the elevation of a structure: members, joints, supports, member-end hinges, labels and the loads of a case.
/// Support symbols are built from two ideas: a solid plate where rotation is held, a hollow triangle (both
/// translations held) or a hollow ring (one held) where it is not; a single ground band where the support cannot
/// slide, and a band set off by a thin line where it can.
/// </summary>
internal sealed class StructureSketch
{
    private readonly StructureModel _model;
    private readonly Dictionary<string, Pt> _at;
    private readonly Pt _centre;

    public StructureSketch(StructureModel model, View view)
    {
        _model = model;
        View = view;
        _at = model.Joints.ToDictionary(j => j.Id, j => view.Map(j.X, j.Y), StringComparer.Ordinal);
        _centre = _at.Count == 0 ? new Pt(0, 0) : new Pt(_at.Values.Average(p => p.X), _at.Values.Average(p => p.Y));
    }

    public View View { get; }

    /// <summary>The view used for the memo's elevations: at most 720 × 260 px for the joints.</summary>
    public static View ViewFor(StructureModel model, double maxWidth = 720, double maxHeight = 260) =>
        new(model.Joints.Select(j => (j.X, j.Y)), maxWidth, maxHeight);

    public Pt At(string joint) => _at[joint];

    public (Pt Start, Pt End) Ends(Member m) => (_at[m.Start], _at[m.End]);

    /// <summary>Point at <paramref name="a"/> metres from the member's start.</summary>
    public Pt Along(Member m, double a)
    {
        var (s, e) = Ends(m);
        double length = _model.Length(m);
        return length > 0 ? Pt.Lerp(s, e, a / length) : s;
    }

    /// <summary>Unit vectors (drawing axes) from a joint along each member that meets there.</summary>
    public List<Pt> MemberDirections(string joint)
    {
        var p = _at[joint];
        return _model.MembersAt(joint).Select(m => (_at[m.OtherJoint(joint)] - p).Unit).Where(d => d.Length > 0).ToList();
    }

    public void Members(SvgCanvas svg, string colour, double weight, string cssClass)
    {
        foreach (var m in _model.Members)
        {
            var (s, e) = Ends(m);
            svg.Line(s, e, colour, weight, cssClass: cssClass);
        }
    }

    public void Joints(SvgCanvas svg, LabelPlacer placer, string colour, double radius)
    {
        foreach (var j in _model.Joints)
        {
            svg.Circle(_at[j.Id], radius, colour, null, 0, cssClass: "cc-joint");
            placer.Block(Box.Around(_at[j.Id], 6, 6));
        }
    }

    public void Hinges(SvgCanvas svg, LabelPlacer placer, string colour)
    {
        foreach (var m in _model.Members.Where(m => m.Hinge != Hinge.None))
        {
            var (s, e) = Ends(m);
            var t = (e - s).Unit;
            double off = Math.Min(8, (e - s).Length / 3);
            foreach (var (end, p, dir) in new[] { (MemberEnd.Start, s, t), (MemberEnd.End, e, t * -1) })
            {
                if (!m.IsReleased(end)) continue;
                var c = p + (dir * off);
                svg.Circle(c, 3.8, DiagramStyle.Paper, colour, 1.5, cssClass: "cc-hinge");
                placer.Block(Box.Around(c, 9, 9));
            }
        }
    }

    /// <summary>The direction a support symbol points away from its joint (drawing axes, one of the four axis directions).</summary>
    public Pt SupportDirection(Joint j)
    {
        bool rot = j.Restraint.HasFlag(Restraint.Rotation);
        bool tx = j.Restraint.HasFlag(Restraint.X);
        bool ty = j.Restraint.HasFlag(Restraint.Y);
        var dirs = MemberDirections(j.Id);
        var mean = dirs.Count == 0 ? new Pt(0, -1) : new Pt(dirs.Average(d => d.X), dirs.Average(d => d.Y));
        if (!rot && ty) return new Pt(0, 1);
        if (!rot && tx) return new Pt(mean.X > 0 ? -1 : 1, 0);
        var away = mean * -1;
        if (away.Length < 1e-6 || Math.Abs(away.Y) >= Math.Abs(away.X)) return new Pt(0, away.Y < -1e-6 ? -1 : 1);
        return new Pt(Math.Sign(away.X), 0);
    }

    public void Supports(SvgCanvas svg, LabelPlacer placer, string colour, UnitText? movements = null)
    {
        foreach (var j in _model.Joints.Where(j => j.IsSupport))
        {
            var box = Support(svg, j, colour);
            placer.Block(box);
            if (movements is not null && !j.Movement.IsZero)
            {
                string text = movements.Movement(j.Movement);
                var d = SupportDirection(j);
                double w = DiagramStyle.TextWidth(text, DiagramStyle.SmallSize);
                var c = placer.Place(LabelPlacer.Beyond(box.Centre + (d * (Math.Abs(d.X) * box.Width / 2 + Math.Abs(d.Y) * box.Height / 2)), d,
                    d.TurnClockwise, w, DiagramStyle.SmallSize * 1.2), w, DiagramStyle.SmallSize * 1.2);
                svg.Text(c, text, DiagramStyle.SmallSize, DiagramStyle.Muted, italic: true, cssClass: "cc-movement");
            }
        }
    }

    /// <summary>Draws one support symbol; returns its extent.</summary>
    public Box Support(SvgCanvas svg, Joint j, string colour)
    {
        var o = _at[j.Id];
        var v = SupportDirection(j);
        var u = v.TurnClockwise;
        Pt P(double uu, double vv) => o + (u * uu) + (v * vv);
        bool vertical = Math.Abs(v.Y) > 0.5;
        bool rot = j.Restraint.HasFlag(Restraint.Rotation);
        bool holdsV = vertical ? j.Restraint.HasFlag(Restraint.Y) : j.Restraint.HasFlag(Restraint.X);
        bool holdsU = vertical ? j.Restraint.HasFlag(Restraint.X) : j.Restraint.HasFlag(Restraint.Y);
        var box = Box.Around(o, 4, 4);
        void Poly(Pt[] pts, string fill, string? stroke, double w)
        {
            svg.Path(pts, close: true, fill, stroke, w, cssClass: "cc-support");
            foreach (var p in pts) box = box.Include(p);
        }

        double depth, half;
        if (rot)
        {
            depth = 6; half = 12;
            Poly([P(-half, 0), P(half, 0), P(half, depth), P(-half, depth)], colour, colour, 1);
        }
        else if (holdsU && holdsV)
        {
            depth = 13; half = 8;
            Poly([P(0, 0), P(half, depth), P(-half, depth)], DiagramStyle.Paper, colour, 1.5);
        }
        else
        {
            depth = 11; half = 5.5;
            var c = P(0, 5.5);
            svg.Circle(c, 5.5, DiagramStyle.Paper, colour, 1.5, cssClass: "cc-support");
            box = box.Include(Box.Around(c, 11, 11));
        }

        if (holdsV && holdsU)
        {
            Poly([P(-17, depth), P(17, depth), P(17, depth + 5), P(-17, depth + 5)], DiagramStyle.Ground, null, 0);
            svg.Line(P(-17, depth), P(17, depth), colour, 1.3, cssClass: "cc-support");
        }
        else if (holdsV)
        {
            // Free to slide along the ground: a thin line, a gap, then the ground band.
            svg.Line(P(-15, depth + 0.5), P(15, depth + 0.5), colour, 1.1, cssClass: "cc-support");
            Poly([P(-17, depth + 3.5), P(17, depth + 3.5), P(17, depth + 8.5), P(-17, depth + 8.5)], DiagramStyle.Ground, null, 0);
            svg.Line(P(-17, depth + 3.5), P(17, depth + 3.5), colour, 1.1, cssClass: "cc-support");
        }
        else if (holdsU)
        {
            // Free to slide away from the joint: sleeves on both sides of the plate.
            foreach (int s in new[] { -1, 1 })
            {
                double e = s * (half + 3);
                svg.Line(P(e, -4), P(e, depth + 6), colour, 1.1, cssClass: "cc-support");
                Poly([P(e + (s * 2.5), -4), P(e + (s * 6.5), -4), P(e + (s * 6.5), depth + 6), P(e + (s * 2.5), depth + 6)], DiagramStyle.Ground, null, 0);
            }
        }
        return box;
    }

    /// <summary>Joint ids, each in the widest gap between the members (and support) meeting there.</summary>
    public void JointLabels(SvgCanvas svg, LabelPlacer placer, string colour, double size)
    {
        foreach (var j in _model.Joints)
        {
            var dirs = MemberDirections(j.Id);
            if (j.IsSupport) dirs.Add(SupportDirection(j));
            var pref = WidestGap(dirs);
            double w = DiagramStyle.TextWidth(j.Id, size, bold: true);
            var c = placer.Place(LabelPlacer.Around(_at[j.Id], pref, 7, w, size * 1.2), w, size * 1.2);
            svg.Text(c, j.Id, size, colour, bold: true, cssClass: "cc-joint-label");
        }
    }

    /// <summary>Member tags (id and length) beside each member's middle, on the side away from its loads or the structure's centre.</summary>
    public void MemberTags(SvgCanvas svg, LabelPlacer placer, UnitText units, IReadOnlyDictionary<string, Pt>? loadSides = null)
    {
        foreach (var m in _model.Members)
        {
            var (s, e) = Ends(m);
            var mid = Pt.Lerp(s, e, 0.5);
            var t = (e - s).Unit;
            var n = t.TurnClockwise;
            Pt side;
            if (loadSides is not null && loadSides.TryGetValue(m.Id, out var ls) && ls.Length > 0) side = n.Dot(ls) >= 0 ? n * -1 : n;
            else
            {
                var outward = mid - _centre;
                side = Math.Abs(n.Dot(outward)) < 1 ? (n.Y <= 0 ? n : n * -1) : (n.Dot(outward) > 0 ? n : n * -1);
            }
            string length = units.Length(_model.Length(m));
            double wId = DiagramStyle.TextWidth(m.Id, DiagramStyle.LabelSize, bold: true);
            double wLen = DiagramStyle.TextWidth(length, DiagramStyle.SmallSize);
            double w = wId + wLen + 18, h = 17;
            var cands = LabelPlacer.Beyond(mid + (side * 3), side, t, w, h, 2)
                .Concat(LabelPlacer.Beyond(mid - (side * 3), side * -1, t, w, h, 2));
            var c = placer.Place(cands, w, h);
            var box = Box.Around(c, w, h);
            svg.Rect(box, DiagramStyle.Paper, DiagramStyle.Faint, 0.9, radius: 8, cssClass: "cc-member-tag");
            svg.Text(new Pt(box.MinX + 5, c.Y), m.Id, DiagramStyle.LabelSize, DiagramStyle.Ink, bold: true, italic: true, cssClass: "cc-member-label",
                halo: false, anchor: "start");
            svg.Text(new Pt(box.MaxX - 5, c.Y), length, DiagramStyle.SmallSize, DiagramStyle.Muted, cssClass: "cc-member-length", halo: false, anchor: "end");
        }
    }

    /// <summary>The bisector of the widest angular gap between directions; up-left when there are none.</summary>
    public static Pt WidestGap(IReadOnlyList<Pt> dirs)
    {
        if (dirs.Count == 0) return new Pt(-0.6, -0.8);
        var angles = dirs.Select(d => Math.Atan2(d.Y, d.X)).OrderBy(a => a).ToList();
        if (angles.Count == 1) return new Pt(-Math.Cos(angles[0]), -Math.Sin(angles[0])) + new Pt(0, -0.35);
        double best = -1, at = 0;
        for (int i = 0; i < angles.Count; i++)
        {
            double a = angles[i], b = i + 1 < angles.Count ? angles[i + 1] : angles[0] + (2 * Math.PI);
            // Prefer gaps above the structure slightly, so labels of beams sit above them.
            double mid = (a + b) / 2;
            double gap = b - a + (Math.Sin(mid) < 0 ? 0.15 : 0);
            if (gap > best) { best = gap; at = mid; }
        }
        return new Pt(Math.Cos(at), Math.Sin(at));
    }
}
