using CrossCheck.Model;

namespace CrossCheck.Memo.Diagrams;

/// <summary>The elevation of the structure as read: members, joints, supports, hinges and labels, with the loads of one case when given.</summary>
internal static class ElevationDrawing
{
    /// <param name="dense">A structure too large to label: members, supports, hinges and loads are drawn, ids and values left to the tables.</param>
    public static string Render(StructureModel model, StructureSketch sketch, UnitText units, LoadCase? loads, string title, bool dense = false)
    {
        var svg = new SvgCanvas();
        var placer = new LabelPlacer();
        sketch.Members(svg, DiagramStyle.Ink, DiagramStyle.MemberWeight, "cc-member");
        sketch.Supports(svg, placer, DiagramStyle.Ink, units);
        sketch.Hinges(svg, placer, DiagramStyle.Ink);
        if (!dense) sketch.Joints(svg, placer, DiagramStyle.Ink, 2.6);
        LoadSketch? loadSketch = null;
        if (loads is not null)
        {
            loadSketch = new LoadSketch(sketch, model, units);
            loadSketch.Draw(svg, placer, loads);
        }
        if (!dense)
        {
            sketch.JointLabels(svg, placer, DiagramStyle.Ink, DiagramStyle.JointLabelSize);
            sketch.MemberTags(svg, placer, units, loadSketch?.LoadSides);
            loadSketch?.Labels(svg, placer);
        }
        if (loads is null) Legend(svg, model);
        return svg.Render(loads is null ? "cc-figure cc-elevation" : "cc-figure cc-loads", title, margin: 12);
    }

    /// <summary>A key to the support and hinge symbols that appear in the drawing.</summary>
    private static void Legend(SvgCanvas svg, StructureModel model)
    {
        var b = svg.Bounds;
        if (b.IsEmpty) return;
        var kinds = new List<(string Text, Restraint R)>();
        foreach (var (r, text) in new[]
                 {
                     (Restraint.Fixed, "fixed"), (Restraint.Pinned, "pinned"), (Restraint.Roller, "roller (slides)"), (Restraint.Guided, "guided"),
                 })
            if (model.Joints.Any(j => j.Restraint == r)) kinds.Add((text, r));
        foreach (var r in model.Joints.Select(j => j.Restraint).Distinct())
            if (r != Restraint.Free && !kinds.Any(k => k.R == r)) kinds.Add((r.ToString().ToLowerInvariant().Replace(", ", "+", StringComparison.Ordinal), r));
        bool hinges = model.Members.Any(m => m.Hinge != Hinge.None);
        if (kinds.Count == 0 && !hinges) return;

        double x = b.MinX, y = b.MaxY + 26;
        foreach (var (text, r) in kinds)
        {
            // A one-joint structure with a member going up, so the symbol sits as a foot.
            var src = new SourceRef("");
            var j = new Joint("k", 0, 0, r, default, src);
            var top = new Joint("t", 0, 1, Restraint.Free, default, src);
            var key = new StructureModel([j, top], [new Member("m", "k", "t", 1, 1, null, Hinge.None, src)], AxialBehaviour.Rigid, true);
            var sk = new StructureSketch(key, new View([(0, 0), (0, 1)], 10, 10, new Pt(x + 17, y - 10)));
            svg.Line(sk.At("k"), sk.At("k") + new Pt(0, -8), DiagramStyle.Ink, DiagramStyle.MemberWeight);
            sk.Support(svg, key.Joint("k"), DiagramStyle.Ink);
            svg.Text(new Pt(x + 40, y + 4), text, DiagramStyle.SmallSize, DiagramStyle.Muted, cssClass: "cc-legend", halo: false, anchor: "start");
            x += 52 + DiagramStyle.TextWidth(text, DiagramStyle.SmallSize);
        }
        if (hinges)
        {
            svg.Line(new Pt(x, y), new Pt(x + 24, y), DiagramStyle.Ink, DiagramStyle.MemberWeight);
            svg.Circle(new Pt(x + 16, y), 3.8, DiagramStyle.Paper, DiagramStyle.Ink, 1.5);
            svg.Text(new Pt(x + 32, y), "hinge (moment release)", DiagramStyle.SmallSize, DiagramStyle.Muted, cssClass: "cc-legend", halo: false, anchor: "start");
        }
    }
}
