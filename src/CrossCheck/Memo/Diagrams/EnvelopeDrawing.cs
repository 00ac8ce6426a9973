using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// Writes a combination's envelope as SVG: per member the largest moment over every arrangement (a filled outline, class
/// <c>cc-env-max</c>) and the least (a dashed outline, <c>cc-env-min</c>) on the tension side, values at the ends and at the
/// span extremes, and the claimed envelope figures as markers whose shape tells their status.
/// </summary>
internal static class EnvelopeDrawing
{
    public const string MaxClass = "cc-env-max";

    public const string MinClass = "cc-env-min";

    public static string Render(StructureModel model, StructureSketch sketch, EnvelopeLayout layout, UnitText units, string combination)
    {
        var svg = new SvgCanvas();
        var placer = new LabelPlacer();
        foreach (var t in layout.Members)
            svg.Path(t.MaxOutline, close: true, DiagramStyle.MomentFill, DiagramStyle.Moment, DiagramStyle.OutlineWeight, cssClass: MaxClass, extra: ("data-member", t.Member));
        foreach (var t in layout.Members)
            svg.Path(t.MinOutline, close: true, null, DiagramStyle.Ink, 1.2, "5 3", cssClass: MinClass, extra: ("data-member", t.Member));
        sketch.Members(svg, DiagramStyle.Ink, DiagramStyle.FaintMemberWeight, "cc-axis");
        sketch.Supports(svg, placer, DiagramStyle.Muted);
        sketch.Hinges(svg, placer, DiagramStyle.Ink);
        sketch.Joints(svg, placer, DiagramStyle.Ink, 2.2);
        var marks = new HashSet<EndStatus>();
        foreach (var c in layout.Members.SelectMany(t => t.Claims))
        {
            var status = c.Side == EnvelopeSide.Safe ? EndStatus.Agree : c.Status;
            placer.Block(MomentDrawing.Marker(svg, new ClaimMark(c.Member, MemberEnd.Start, "", c.Axis, c.TrueTip, c.Claimed, status, 0, c.ClaimedBending, c.OffScale)));
            marks.Add(status);
        }
        foreach (var j in model.Joints)
        {
            double size = DiagramStyle.JointLabelSize - 1, w = DiagramStyle.TextWidth(j.Id, size, bold: true);
            var at = sketch.At(j.Id);
            var dirs = sketch.MemberDirections(j.Id);
            if (j.IsSupport) dirs.Add(sketch.SupportDirection(j));
            svg.Text(placer.Place(LabelPlacer.Around(at, StructureSketch.WidestGap(dirs), 7, w, size * 1.2), w, size * 1.2), j.Id, size, DiagramStyle.Ink, bold: true,
                cssClass: "cc-joint-label");
        }
        var written = new List<(Pt Tip, string Text)>();
        foreach (var (t, v) in layout.Members.SelectMany(t => t.Values.Select(v => (t, v))))
        {
            string text = units.MomentMagnitude(v.Bending, layout.Peak);
            // One label where two members' ordinates meet at a support with the same value.
            if (written.Any(x => x.Text == text && x.Tip.DistanceTo(v.Tip) < 4)) continue;
            written.Add((v.Tip, text));
            var along = (t.End - t.Start).Unit * (v.IsEnd && v.X > 0 ? -1 : 1);
            double size = DiagramStyle.LabelSize, w = DiagramStyle.TextWidth(text, size), h = size * 1.2;
            svg.Text(placer.Place(LabelPlacer.Beyond(v.Tip, v.Outward, along, w, h, 3), w, h), text, size, DiagramStyle.Ink, cssClass: "cc-value");
        }
        var all = layout.Members.SelectMany(t => t.Claims).ToList();
        foreach (var (t, group) in layout.Members.SelectMany(t => t.Claims.Where(c => c.Status != EndStatus.Agree)
                     .GroupBy(c => (c.Claimed.X, c.Claimed.Y, c.ClaimedBending)).Select(g => (t, g.ToList()))))
        {
            var c = group[0];
            // One label for a maximum and a minimum claimed alike; the member named where another member's claim plots close by.
            string bound = group.Count > 1 ? "max and min" : c.Bound;
            string whose = all.Any(o => o.Member != c.Member && o.Claimed.DistanceTo(c.Claimed) < 24) ? $"{c.Member}: " : "";
            string text = $"{whose}claimed {bound} {units.MomentMagnitude(c.ClaimedBending, layout.Peak)}{(c.OffScale ? " (off scale)" : "")}{(c.Side == EnvelopeSide.Safe ? ", conservative" : "")}";
            var outward = c.Claimed - c.Axis;
            if (outward.Length < 1) outward = t.Tension;
            var along = (t.End - t.Start).Unit;
            double size = DiagramStyle.LabelSize - 0.5, w = DiagramStyle.TextWidth(text, size), h = size * 1.2;
            string colour = c.Side == EnvelopeSide.Safe ? DiagramStyle.Ink : c.Status == EndStatus.Discrepant ? DiagramStyle.Major : DiagramStyle.Minor;
            svg.Text(placer.Place(LabelPlacer.Beyond(c.Claimed, outward, along, w, h, 8).Concat(LabelPlacer.Beyond(c.Claimed, along, outward, w, h, 8)), w, h),
                text, size, colour, italic: true, cssClass: "cc-claim-label");
        }
        Legend(svg, units, marks);
        return svg.Render("cc-figure cc-envelope", $"Envelope of the bending moment, combination {combination}", margin: 12);
    }

    private static void Legend(SvgCanvas svg, UnitText units, HashSet<EndStatus> marks)
    {
        var b = svg.Bounds;
        if (b.IsEmpty) return;
        var entries = new List<(string Text, Action<Pt> Swatch)>
        {
            ($"largest moment over every arrangement [{units.Units.Moment.Symbol}]", p => svg.Rect(Box.Around(p, 16, 9), DiagramStyle.MomentFill, DiagramStyle.Moment, DiagramStyle.OutlineWeight)),
            ("least moment", p => svg.Line(p - new Pt(9, 0), p + new Pt(9, 0), DiagramStyle.Ink, 1.2, "5 3")),
        };
        foreach (var (status, text) in new[] { (EndStatus.Agree, "claim agrees (or is conservative)"), (EndStatus.Minor, "claim: minor, unsafe side"), (EndStatus.Discrepant, "claim discrepant, unsafe side") })
            if (marks.Contains(status))
                entries.Add((text, p => MomentDrawing.Marker(svg, new ClaimMark("", MemberEnd.Start, "", p, p, p, status, 0, 0, false), legend: true)));
        MomentDrawing.LegendRows(svg, entries);
    }
}
