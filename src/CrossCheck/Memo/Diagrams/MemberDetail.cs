using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo.Diagrams;

/// <summary>
/// A larger drawing of one member in one case, laid out from its start joint (left) to its end joint (right): the
/// member with its loads above, and below it the recomputed diagram, the diagram the claimed end moments imply, and
/// both end values with their difference. Ordinates below the axis put the member's right-hand fibre (looking from
/// start to end) in tension, as in the case diagram.
/// </summary>
internal static class MemberDetail
{
    public const double Width = 520;
    public const double PeakPixels = 78;

    public static string Render(Member member, double length, CaseResult result, CaseReview? review, LoadCase? loads, UnitText units, string caseId)
    {
        var (single, sketch) = Straightened(member, length, new Pt(0, 0));
        var layout = MomentLayout.Build(single, result, review, sketch, PeakPixels);
        var svg = new SvgCanvas();
        var placer = new LabelPlacer();
        LoadSketch? loadSketch = null;

        var memberLoads = loads?.MemberLoads.Where(l => l.Member == member.Id).ToList() ?? [];
        if (memberLoads.Count > 0)
        {
            // The loads go on a copy of the member drawn above the diagram, turned with the member into its own axes.
            var r = result.Members[member.Id];
            Pt Local(LoadDirection d)
            {
                var (gx, gy) = d.Vector();
                double ux = (gx * r.Cos) + (gy * r.Sin), uy = (-gx * r.Sin) + (gy * r.Cos);
                return new Pt(ux, -uy).Unit;
            }
            bool fromBelow = memberLoads.Any(l => l is not MemberCouple && Local(Direction(l)).Y < -0.2);
            double top = layout.Members.SelectMany(t => t.Outline.Concat(t.ClaimedLine ?? [])).Select(p => p.Y).DefaultIfEmpty(0).Min();
            // Room above the diagram for the value and claim labels of its hogging ends.
            double stripY = Math.Min(0, top) - 58 - (fromBelow ? 56 : 0);
            var (stripModel, stripSketch) = Straightened(member, length, new Pt(0, stripY));
            stripSketch.Members(svg, DiagramStyle.Ink, DiagramStyle.MemberWeight, "cc-axis cc-load-strip");
            stripSketch.Hinges(svg, placer, DiagramStyle.Ink);
            loadSketch = new LoadSketch(stripSketch, stripModel, units, Local);
            loadSketch.Draw(svg, placer, new LoadCase(caseId, [.. memberLoads]));
            placer.Block(new Box(-4, stripY - 4, Width + 4, stripY + 4));
        }
        var shown = MomentDrawing.Draw(svg, placer, single, sketch, layout, units, detail: true);
        loadSketch?.Labels(svg, placer);
        MomentDrawing.Legend(svg, units, shown);
        return svg.Render("cc-figure cc-detail", $"Member {member.Id}, load case {caseId}: recomputed and claimed bending moments", margin: 12, minWidth: Width + 80);
    }

    private static LoadDirection Direction(MemberLoad l) => l switch
    {
        PointLoad p => p.Direction,
        DistributedLoad d => d.Direction,
        _ => LoadDirection.Down,
    };

    /// <summary>The member alone, start joint at the origin, end joint to the right, as its own little structure.</summary>
    private static (StructureModel Model, StructureSketch Sketch) Straightened(Member member, double length, Pt origin)
    {
        var src = new SourceRef("");
        var joints = new List<Joint>
        {
            new(member.Start, 0, 0, Restraint.Free, default, src),
            new(member.End, length, 0, Restraint.Free, default, src),
        };
        var single = new StructureModel(joints, [member], AxialBehaviour.Rigid, relativeStiffness: true);
        var view = new View(joints.Select(j => (j.X, j.Y)), Width, Width, origin);
        return (single, new StructureSketch(single, view));
    }
}
