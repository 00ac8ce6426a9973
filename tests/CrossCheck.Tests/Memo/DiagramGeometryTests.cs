using System.Xml.Linq;
using CrossCheck.Memo;
using CrossCheck.Memo.Diagrams;
using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Memo;

/// <summary>Geometry of the memo drawings, checked without a browser: scale, tension side, where the claims plot.</summary>
public class DiagramGeometryTests
{
    private const double PeakPx = 60;

    // Fixed-fixed beam, L = 6 m, central P = 40 kN: M_AB = −PL/8 = −30 kN·m, M_BA = +PL/8 = +30 kN·m (clockwise), and by
    // statics the midspan moment is PL/4 − PL/8 = PL/8 = 30 kN·m sagging. docs/REFERENCE-CHECKS.md case 1.2 (AISC Table 3-23
    // case 16, from memory; Erochko fixed-end moment table, seen). The claim at B is wrong on purpose (45 instead of 30).
    private static readonly string FixedFixedCentralLoad = SampleText.With(
        info: Reviewing.KnM,
        frame: SampleText.Frame.Replace("B,6,0,roller", "B,6,0,fixed", StringComparison.Ordinal), // the sample beam with B fixed too
        loads: "[loads]\ncase,on,kind,P,a,dir\n1,AB,point,40,3,down",
        claims: "[end-moments]\ncase,member,at,moment\n1,AB,A,-30\n1,AB,B,45");

    private static (MomentLayout Layout, StructureSketch Sketch, ReviewResult Review) Lay(string csv, double peakPx = PeakPx)
    {
        var review = Reviewing.Of(csv);
        var model = review.Submission.Model;
        var sketch = new StructureSketch(model, StructureSketch.ViewFor(model));
        var layout = MomentLayout.Build(model, review.Analysis!.Cases[0], review.Cases[0], sketch, peakPx);
        return (layout, sketch, review);
    }

    [Fact]
    public void FixedFixedBeam_CentralLoad_HogsAboveAtTheEnds_SagsBelowAtMidspan_AtOneScale()
    {
        var (layout, sketch, _) = Lay(FixedFixedCentralLoad);
        var beam = layout.Members.ShouldHaveSingleItem();
        double axisY = sketch.At("A").Y;
        sketch.At("B").Y.ShouldBe(axisY);
        sketch.At("B").X.ShouldBeGreaterThan(sketch.At("A").X);

        // The claimed 45 kN·m is within 1.6 × the recomputed peak, so the scale takes it in: 45 kN·m ↔ 60 px.
        layout.Peak.ShouldBe(30e3, 1e-6 * 30e3);
        layout.PixelsPerNm.ShouldBe(PeakPx / 45e3, 1e-12);
        double px30 = 30e3 * PeakPx / 45e3;

        var start = beam.Values.Single(v => v.IsEnd && v.X == 0);
        var end = beam.Values.Single(v => v.IsEnd && v.X > 0);
        var mid = beam.Values.Single(v => !v.IsEnd);
        start.Bending.ShouldBe(-30e3, 1e-6 * 30e3); // hogging: top fibre in tension
        end.Bending.ShouldBe(-30e3, 1e-6 * 30e3);
        mid.Bending.ShouldBe(30e3, 1e-6 * 30e3);
        mid.X.ShouldBe(3, 1e-9);

        // Tension side: hogging ordinates above the beam (smaller SVG y), sagging below.
        start.Tip.Y.ShouldBe(axisY - px30, 1e-6);
        end.Tip.Y.ShouldBe(axisY - px30, 1e-6);
        mid.Tip.Y.ShouldBe(axisY + px30, 1e-6);
        mid.Tip.X.ShouldBe((sketch.At("A").X + sketch.At("B").X) / 2, 1e-6);
        start.Tip.X.ShouldBe(sketch.At("A").X, 1e-9);

        // The outline starts and ends on the axis and never strays beyond the peak ordinate.
        beam.Outline[0].ShouldBe(sketch.At("A"));
        beam.Outline[^1].ShouldBe(sketch.At("B"));
        beam.Outline.Max(p => Math.Abs(p.Y - axisY)).ShouldBe(px30, 1e-6);
    }

    [Fact]
    public void FixedFixedBeam_ClaimMarkers_PlotWhereTheClaimedMomentWould()
    {
        var (layout, sketch, _) = Lay(FixedFixedCentralLoad);
        var beam = layout.Members.Single();
        double axisY = sketch.At("A").Y;

        var a = beam.Claims.Single(c => c.End == MemberEnd.Start);
        a.Status.ShouldBe(EndStatus.Agree);
        a.Claimed.ShouldBe(a.RecomputedTip);

        // Claimed +45 clockwise at the end is a hogging bending moment of 45: above the beam, a full 60 px out.
        var b = beam.Claims.Single(c => c.End == MemberEnd.End);
        b.Status.ShouldBe(EndStatus.Discrepant);
        b.ClaimedBending!.Value.ShouldBe(-45e3, 1e-6);
        b.Claimed.Y.ShouldBe(axisY - PeakPx, 1e-6);
        b.Claimed.X.ShouldBe(sketch.At("B").X, 1e-9);
        b.RecomputedTip.Y.ShouldBe(axisY - (30e3 * PeakPx / 45e3), 1e-6);
        b.OffScale.ShouldBeFalse();

        // The claimed diagram: same load, end moments −30 and −45 → the recomputed one plus a line from 0 to −15 kN·m.
        beam.ClaimedLine.ShouldNotBeNull();
        beam.ClaimedLine![^1].Y.ShouldBe(b.Claimed.Y, 1e-6);
        beam.ClaimedLine[0].Y.ShouldBe(a.Claimed.Y, 1e-6);
    }

    [Fact]
    public void ClaimFarOutside_IsClampedAndMarkedOffScale()
    {
        var (layout, _, _) = Lay(FixedFixedCentralLoad.Replace("1,AB,B,45", "1,AB,B,3000", StringComparison.Ordinal));
        var b = layout.Members.Single().Claims.Single(c => c.End == MemberEnd.End);
        b.OffScale.ShouldBeTrue();
        // The range stops at 1.6 × the recomputed peak of 30 kN·m: the scale is 60 px per 48 kN·m and the marker sits at 60 px.
        layout.PixelsPerNm.ShouldBe(PeakPx / (MomentLayout.ClaimRange * 30e3), 1e-12);
        (b.Axis.Y - b.Claimed.Y).ShouldBe(PeakPx, 1e-6);
        layout.Members.Single().ClaimedLine.ShouldBeNull();
    }

    [Fact]
    public void CantileverColumn_PushedSideways_IsDrawnOnTheFaceTheLoadComesFrom()
    {
        // A fixed-base column 4 m tall with H = 10 kN to the right at its top: by statics the base moment is H·h = 40 kN·m
        // and the left (−x) face of the base is stretched (common practice: the face the load pushes from is in tension).
        var (layout, sketch, _) = Lay(Reviewing.KnM + """
            [joints]
            joint,x,y,restraint
            A,0,0,fixed
            B,0,4,free

            [members]
            member,start,end,I
            AB,A,B,1

            [loads]
            case,on,kind,P,dir
            1,B,force,10,right

            [end-moments]
            case,member,at,moment
            1,AB,A,40
            1,AB,B,0
            """);
        var col = layout.Members.Single();
        var a = sketch.At("A");
        sketch.At("B").Y.ShouldBeLessThan(a.Y); // drawn upwards
        var baseValue = col.Values.Single(v => v.IsEnd && v.X == 0);
        Math.Abs(baseValue.Bending).ShouldBe(40e3, 1e-6 * 40e3);
        baseValue.Tip.X.ShouldBe(a.X - PeakPx, 1e-6);
        baseValue.Tip.Y.ShouldBe(a.Y, 1e-9);
        col.Values.Single(v => v.IsEnd && v.X > 0).Tip.DistanceTo(sketch.At("B")).ShouldBeLessThan(1e-6); // free top: no moment
        // The claim (40 clockwise at the start = bending +40, the reference table's "M_ij > 0 at a column foot: tension on the
        // right face" is the opposite load) must plot on the right face: a sign error the drawing shows at a glance.
        var claim = col.Claims.Single(c => c.End == MemberEnd.Start);
        claim.Claimed.X.ShouldBe(a.X + PeakPx, 1e-6);
        claim.Status.ShouldBe(EndStatus.Discrepant);
    }

    [Fact]
    public void CaseDiagram_HasOnePathPerMember_AndIsWellFormedXml()
    {
        var review = Reviewing.Of(Reviewing.KnM + $"""
            {CombinationBeam.Supports}

            [spans]
            span,length,I
            AB,6,1
            BC,6,1

            [loads]
            case,on,kind,w
            1,AB,udl,10
            1,BC,udl,10
            2,AB,udl,10

            [end-moments]
            case,member,at,moment
            1,AB,B,45
            1,BC,B,-45
            2,AB,B,30
            2,BC,B,-30
            """);
        // Two equal spans, full UDL: support moment wL²/8 = 45 kN·m (Hicks Table 2.1, two spans, seen); one span loaded:
        // wL²/16 = 22.5 kN·m (Lindeburg, seen). Case 2's claims (30) are wrong.
        var diagrams = MemoDiagrams.For(review)!;
        foreach (var c in review.Cases)
        {
            var bmd = diagrams.ForCase(c.Case).Single(f => f.Kind == "moments");
            var svg = XDocument.Parse(bmd.Svg);
            XNamespace ns = "http://www.w3.org/2000/svg";
            svg.Descendants(ns + "path").Count(p => (string?)p.Attribute("class") == MomentDrawing.DiagramClass).ShouldBe(2);
            var texts = svg.Descendants(ns + "text").Select(t => t.Value).ToList();
            texts.ShouldContain("A");
            texts.ShouldContain("C");
        }
        var t1 = XDocument.Parse(diagrams.ForCase("1").Single(f => f.Kind == "moments").Svg).Descendants().Where(e => e.Name.LocalName == "text").Select(t => t.Value).ToList();
        t1.ShouldContain("45.0");
        var t2 = XDocument.Parse(diagrams.ForCase("2").Single(f => f.Kind == "moments").Svg).Descendants().Where(e => e.Name.LocalName == "text").Select(t => t.Value).ToList();
        t2.ShouldContain("22.5");
        t2.ShouldContain("claim 30.0");
        diagrams.DetailsFor("1").ShouldBeEmpty();
        diagrams.DetailsFor("2").Count.ShouldBe(2); // AB and BC both claim 30 at B
    }

    [Fact]
    public void Drawings_EscapeIdsFromTheSubmission()
    {
        var review = Reviewing.Of(Reviewing.KnM + """
            [joints]
            joint,x,y,restraint
            "<A&>",0,0,fixed
            "B""'",6,0,roller

            [members]
            member,start,end,I
            "<script>x</script>","<A&>","B""'",1

            [loads]
            case,on,kind,w
            "<c>","<script>x</script>",udl,18

            [end-moments]
            case,member,at,moment
            "<c>","<script>x</script>","<A&>",-60
            """);
        var d = MemoDiagrams.For(review)!;
        foreach (var f in d.ForCase("<c>").Concat(d.DetailsFor("<c>")).Append(d.Structure))
        {
            f.Svg.ShouldNotContain("<script");
            f.Svg.ShouldNotContain("<A&>");
            var doc = XDocument.Parse(f.Svg); // well-formed: everything from the submission was escaped
            doc.Descendants().Where(e => e.Name.LocalName == "text").Select(t => t.Value).ShouldContain("<A&>");
        }
    }

    [Fact]
    public void MarkdownMemo_CarriesNoDrawings_HtmlMemoDoes()
    {
        var review = Reviewing.Of(FixedFixedCentralLoad);
        var md = MemoExtensions.Build(review, MemoFormat.Markdown);
        md.HasDiagrams.ShouldBeFalse();
        md.Cases[0].Figures.ShouldBeEmpty();
        var html = MemoExtensions.Build(review, MemoFormat.Html);
        html.HasDiagrams.ShouldBeTrue();
        html.StructureFigure.ShouldNotBeNull();
        html.Cases[0].Figures.Select(f => f.Kind).ShouldBe(["loads", "moments"]);
        html.Cases[0].Details.Count.ShouldBe(1);
        // Figures are numbered in the order they appear.
        new[] { html.StructureFigure!.Number }.Concat(html.Cases[0].Figures.Select(f => f.Number)).Concat(html.Cases[0].Details.Select(f => f.Number))
            .ShouldBe([1, 2, 3, 4]);
    }
}
