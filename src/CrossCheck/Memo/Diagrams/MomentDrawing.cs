using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// Writes the bending-moment diagram of a case as SVG: the structure in outline, one filled path per member
/// (class <c>cc-bmd</c>) on the tension side, values at the member ends and at the largest span moments, and the
/// claimed end moments as markers whose shape tells their status.
/// </summary>
internal static class MomentDrawing
{
    public const string DiagramClass = "cc-bmd";

    public const string DetailClass = "cc-detail-bmd";

    /// <param name="dense">A structure too large to label throughout: agreeing claims are not marked, and ids and values are written only at the
    /// members whose claims differ (at most <see cref="MemoDiagrams.MaxLabelledMembers"/>, the worst first).</param>
    public static string Render(StructureModel model, StructureSketch sketch, MomentLayout layout, UnitText units, string caseId, bool dense = false)
    {
        var svg = new SvgCanvas();
        var placer = new LabelPlacer();
        var legend = Draw(svg, placer, model, sketch, layout, units, detail: false, dense);
        Legend(svg, units, legend);
        return svg.Render("cc-figure cc-moments", $"Bending moment diagram, load case {caseId}", margin: 12);
    }

    /// <summary>What a drawing showed, for its legend.</summary>
    internal sealed record Shown(bool ClaimedLine, HashSet<EndStatus> Marks);

    /// <summary>
    /// Draws the diagram, structure, claims and labels onto <paramref name="svg"/>. In <paramref name="detail"/> mode
    /// (one member, larger) the paths get <see cref="DetailClass"/> and the labels say more.
    /// </summary>
    internal static Shown Draw(SvgCanvas svg, LabelPlacer placer, StructureModel model, StructureSketch sketch, MomentLayout layout, UnitText units, bool detail,
        bool dense = false)
    {
        foreach (var t in layout.Members)
            svg.Path(t.Outline, close: true, DiagramStyle.MomentFill, DiagramStyle.Moment, DiagramStyle.OutlineWeight, cssClass: detail ? DetailClass : DiagramClass,
                extra: ("data-member", t.Member));
        sketch.Members(svg, DiagramStyle.Ink, detail ? DiagramStyle.MemberWeight : DiagramStyle.FaintMemberWeight, "cc-axis");
        if (!detail) sketch.Supports(svg, placer, DiagramStyle.Muted);
        sketch.Hinges(svg, placer, DiagramStyle.Ink);
        if (!dense) sketch.Joints(svg, placer, DiagramStyle.Ink, 2.2);
        // What gets labels: every member, or in a dense drawing the members whose claims differ, the worst first.
        var labelled = dense
            ? layout.Members.Where(t => t.Claims.Any(c => c.Status != EndStatus.Agree))
                .OrderByDescending(t => t.Claims.Max(c => c.Status == EndStatus.Discrepant ? 2 : c.Status == EndStatus.Agree ? 0 : 1))
                .ThenByDescending(t => t.Claims.Max(c => Math.Abs((c.ClaimedBending ?? c.RecomputedBending) - c.RecomputedBending)))
                .Take(MemoDiagrams.MaxLabelledMembers).ToList()
            : layout.Members;

        bool anyClaimedLine = false;
        var presentMarks = new HashSet<EndStatus>();
        foreach (var t in layout.Members.Where(t => t.ClaimedLine is not null))
        {
            svg.Path(t.ClaimedLine!, close: false, null, DiagramStyle.Ink, 1.2, "5 3", cssClass: "cc-claimed-line", extra: ("data-member", t.Member));
            anyClaimedLine = true;
        }
        foreach (var c in layout.Members.SelectMany(t => t.Claims).Where(c => !dense || c.Status != EndStatus.Agree))
        {
            placer.Block(Marker(svg, c));
            presentMarks.Add(c.Status);
        }

        var joints = dense
            ? labelled.SelectMany(t => { var m = model.Member(t.Member); return new[] { m.Start, m.End }; }).Distinct().Select(model.Joint).ToList()
            : model.Joints;
        JointLabels(svg, placer, model, joints, sketch, layout, detail);
        ValueLabels(svg, placer, labelled, layout.Peak, units, detail);
        ClaimLabels(svg, placer, labelled, layout.Peak, units, detail);
        return new Shown(anyClaimedLine, presentMarks);
    }

    /// <summary>Draws the marker of one claim; returns its extent.</summary>
    internal static Box Marker(SvgCanvas svg, ClaimMark c, bool legend = false)
    {
        var p = c.Claimed;
        if (c.Status != EndStatus.Agree && c.Status != EndStatus.Missing && p.DistanceTo(c.RecomputedTip) > 3)
            svg.Line(c.RecomputedTip, p, c.Status == EndStatus.Discrepant ? DiagramStyle.Major : DiagramStyle.Minor, 1.1, "2 2", cssClass: "cc-claim-gap");
        string data = legend ? "cc-legend-mark" : $"cc-claim cc-claim-{c.Status.Json()}";
        switch (c.Status)
        {
            case EndStatus.Agree:
                svg.Path([p + new Pt(0, -4.5), p + new Pt(4.5, 0), p + new Pt(0, 4.5), p + new Pt(-4.5, 0)], close: true, DiagramStyle.Ink, DiagramStyle.Paper, 0.8,
                    cssClass: data);
                return Box.Around(p, 10, 10);
            case EndStatus.Minor:
                svg.Path([p + new Pt(0, -6), p + new Pt(5.5, 4), p + new Pt(-5.5, 4)], close: true, DiagramStyle.Paper, DiagramStyle.Minor, 1.7, cssClass: data);
                return Box.Around(p, 13, 13);
            case EndStatus.Missing:
                svg.Rect(Box.Around(p, 9, 9), DiagramStyle.Paper, DiagramStyle.Ink, 1.2, cssClass: data);
                return Box.Around(p, 11, 11);
            default:
                svg.Circle(p, 6.5, DiagramStyle.Paper, DiagramStyle.Major, 2.3, cssClass: data);
                svg.Line(p + new Pt(-3.4, -3.4), p + new Pt(3.4, 3.4), DiagramStyle.Major, 1.7, cssClass: data);
                svg.Line(p + new Pt(-3.4, 3.4), p + new Pt(3.4, -3.4), DiagramStyle.Major, 1.7, cssClass: data);
                return Box.Around(p, 16, 16);
        }
    }

    private static void JointLabels(SvgCanvas svg, LabelPlacer placer, StructureModel model, IReadOnlyList<Joint> joints, StructureSketch sketch, MomentLayout layout,
        bool detail)
    {
        // The end ordinates drawn at each joint, so that its label keeps clear of them.
        var ordinates = new Dictionary<string, List<Pt>>(StringComparer.Ordinal);
        foreach (var t in layout.Members)
        {
            var m = model.Member(t.Member);
            foreach (var v in t.Values.Where(v => v.IsEnd && (v.Tip - v.Axis).Length > 4))
            {
                string at = v.X > 0 ? m.End : m.Start;
                if (!ordinates.TryGetValue(at, out var list)) ordinates[at] = list = [];
                list.Add(v.Tip - v.Axis);
            }
        }
        foreach (var j in joints)
        {
            var at = sketch.At(j.Id);
            var dirs = sketch.MemberDirections(j.Id);
            if (detail)
            {
                // One member drawn left to right: its end joints sit beyond its ends.
                double wd = DiagramStyle.TextWidth(j.Id, DiagramStyle.JointLabelSize, bold: true);
                var outward = dirs.Count > 0 ? dirs[0] * -1 : new Pt(-1, 0);
                var cd = placer.Place(LabelPlacer.Beyond(at + (outward * 6), outward, new Pt(0, 1), wd, DiagramStyle.JointLabelSize * 1.2, 2),
                    wd, DiagramStyle.JointLabelSize * 1.2);
                svg.Text(cd, j.Id, DiagramStyle.JointLabelSize, DiagramStyle.Ink, bold: true, cssClass: "cc-joint-label");
                continue;
            }
            if (j.IsSupport) dirs.Add(sketch.SupportDirection(j));
            foreach (var o in ordinates.GetValueOrDefault(j.Id) ?? []) dirs.Add(o.Unit);
            double size = DiagramStyle.JointLabelSize - 1;
            double w = DiagramStyle.TextWidth(j.Id, size, bold: true);
            var c = placer.Place(LabelPlacer.Around(at, StructureSketch.WidestGap(dirs), 7, w, size * 1.2), w, size * 1.2);
            svg.Text(c, j.Id, size, DiagramStyle.Ink, bold: true, cssClass: "cc-joint-label");
        }
    }

    private static void ValueLabels(SvgCanvas svg, LabelPlacer placer, IReadOnlyList<MemberTrace> members, double peak, UnitText units, bool detail)
    {
        double tiny = 0.005 * peak;
        var written = new Dictionary<string, List<Pt>>(StringComparer.Ordinal);
        // Ends first (they carry the claims), then span values.
        foreach (var v in members.SelectMany(t => t.Values.Select(v => (t, v))).OrderBy(p => p.v.IsEnd ? 0 : 1))
        {
            if (Math.Abs(v.v.Bending) <= tiny) continue;
            string text = units.MomentMagnitude(v.v.Bending, peak);
            if (detail && !v.v.IsEnd) text += $" at {units.Length(v.v.X)}";
            // One label where two members' ordinates meet at the same point with the same value (continuous beams).
            if (!written.TryGetValue(text, out var tips)) written[text] = tips = [];
            if (tips.Any(tip => tip.DistanceTo(v.v.Tip) < 4)) continue;
            tips.Add(v.v.Tip);
            var along = (v.t.End - v.t.Start).Unit;
            if (v.v.IsEnd && v.v.X > 0) along *= -1;
            double size = DiagramStyle.LabelSize, w = DiagramStyle.TextWidth(text, size, bold: !v.v.IsEnd), h = size * 1.2;
            var c = placer.Place(LabelPlacer.Beyond(v.v.Tip, v.v.Outward, along, w, h, 3), w, h);
            svg.Text(c, text, size, DiagramStyle.Ink, bold: !v.v.IsEnd, cssClass: v.v.IsEnd ? "cc-value cc-value-end" : "cc-value cc-value-span");
        }
    }

    private static void ClaimLabels(SvgCanvas svg, LabelPlacer placer, IReadOnlyList<MemberTrace> members, double peak, UnitText units, bool detail)
    {
        var written = new List<(Pt At, string Text)>();
        var differing = members.SelectMany(x => x.Claims).Where(o => o.Status != EndStatus.Agree).ToList();
        foreach (var t in members)
            foreach (var c in t.Claims.Where(c => c.Status is EndStatus.Minor or EndStatus.Discrepant or EndStatus.Missing
                         || (detail && Math.Abs(c.ClaimedBending ?? 0) > 0.005 * peak)))
            {
                string text = c.ClaimedBending is double b
                    ? $"claim {units.MomentMagnitude(b, peak)}{(c.OffScale ? " (off scale)" : "")}"
                    : "not claimed";
                // Claims of different members that plot close together (a frame corner) say whose they are.
                var others = differing.Where(o => o.Member != c.Member
                    && o.Claimed.DistanceTo(c.Claimed) < 24 && !(o.ClaimedBending is double ob && c.ClaimedBending is double tb
                    && units.MomentMagnitude(ob, peak) == units.MomentMagnitude(tb, peak) && o.Claimed.DistanceTo(c.Claimed) < 4));
                if (!detail && others.Any()) text = $"{c.Member}: {text}";
                if (detail && c.ClaimedBending is double cb)
                    text += c.Status == EndStatus.Agree ? ", agrees" : $", differs by {units.MomentMagnitude(cb - c.RecomputedBending, peak)}";
                // Two members claiming the same value at the same point (a continuous beam's support) get one label.
                if (written.Any(x => x.Text == text && x.At.DistanceTo(c.Claimed) < 4)) continue;
                written.Add((c.Claimed, text));
                var outward = c.Claimed - c.Axis;
                if (outward.Length < 1) outward = c.RecomputedTip - c.Axis;
                if (outward.Length < 1) outward = t.Tension;
                var along = (t.End - t.Start).Unit * (c.End == MemberEnd.Start ? 1 : -1);
                double size = DiagramStyle.LabelSize - 0.5, w = DiagramStyle.TextWidth(text, size, bold: c.Status == EndStatus.Discrepant), h = size * 1.2;
                var pos = placer.Place(LabelPlacer.Beyond(c.Claimed, outward, along, w, h, 8).Concat(LabelPlacer.Beyond(c.Claimed, along, outward, w, h, 8)), w, h);
                string colour = c.Status == EndStatus.Discrepant ? DiagramStyle.Major : c.Status == EndStatus.Minor ? DiagramStyle.Minor : DiagramStyle.Ink;
                svg.Text(pos, text, size, colour, bold: c.Status == EndStatus.Discrepant, italic: true, cssClass: "cc-claim-label");
            }
    }

    internal static void Legend(SvgCanvas svg, UnitText units, Shown shown)
    {
        bool claimedLine = shown.ClaimedLine;
        var marks = shown.Marks;
        var b = svg.Bounds;
        if (b.IsEmpty) return;
        var entries = new List<(string Text, Action<Pt> Swatch)>
        {
            ($"recomputed bending moment [{units.Units.Moment.Symbol}], on the tension side", p =>
                svg.Rect(Box.Around(p, 16, 9), DiagramStyle.MomentFill, DiagramStyle.Moment, DiagramStyle.OutlineWeight)),
        };
        if (claimedLine)
            entries.Add(("as the claimed end moments imply", p => svg.Line(p - new Pt(9, 0), p + new Pt(9, 0), DiagramStyle.Ink, 1.2, "5 3")));
        foreach (var (status, text) in new[]
                 {
                     (EndStatus.Agree, "claim agrees"), (EndStatus.Minor, "claim: minor difference"), (EndStatus.Discrepant, "claim discrepant"),
                     (EndStatus.Missing, "end not claimed"),
                 })
        {
            if (!marks.Contains(status)) continue;
            entries.Add((text, p => Marker(svg, new ClaimMark("", MemberEnd.Start, "", p, p, p, status, 0, 0, false), legend: true)));
        }
        LegendRows(svg, entries);
    }

    /// <summary>Sets legend entries (a swatch drawn at a point, then its text) in rows under the drawing.</summary>
    internal static void LegendRows(SvgCanvas svg, IEnumerable<(string Text, Action<Pt> Swatch)> entries)
    {
        var b = svg.Bounds;
        double x = b.MinX, y = b.MaxY + 20, maxX = Math.Max(b.MaxX, b.MinX + 420);
        foreach (var (text, swatch) in entries)
        {
            double w = 24 + DiagramStyle.TextWidth(text, DiagramStyle.SmallSize) + 16;
            if (x + w > maxX && x > b.MinX) { x = b.MinX; y += 18; }
            swatch(new Pt(x + 10, y));
            svg.Text(new Pt(x + 24, y), text, DiagramStyle.SmallSize, DiagramStyle.Muted, cssClass: "cc-legend", halo: false, anchor: "start");
            x += w;
        }
    }
}
