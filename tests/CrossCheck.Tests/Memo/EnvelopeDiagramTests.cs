using CrossCheck.Memo;
using CrossCheck.Memo.Diagrams;
using CrossCheck.Model;
using CrossCheck.Review;
using CrossCheck.Tests.Support;

namespace CrossCheck.Tests.Memo;

/// <summary>
/// The envelope drawing, checked on its geometry: two equal spans of 6 m, 1.35 × 18 kN/m fixed and 1.5 × 12 kN/m patterned.
/// At B the hogging reaches (24.3 + 18) × 36/8 = 190.35 kN·m with both spans loaded (docs/REFERENCE-CHECKS.md 3.1: wL²/8) and
/// falls to 24.3 × 36/8 = 109.35 kN·m with neither; the largest span moment comes with its own span loaded alone.
/// </summary>
public class EnvelopeDiagramTests
{
    private const double PeakPx = 60;

    private const string Beam = CombinationBeam.Sagging + """
        [combinations]
        combination,case,factor,pattern
        ENV,G,1.35,
        ENV,Q,1.5,spans

        [envelopes]
        combination,member,at,max,min
        ENV,AB,B,-109.35,-170.0
        """;

    [Fact]
    public void HoggingAboveAtTheSupport_SaggingBelowInTheSpans_ClaimsWhereTheyPlot()
    {
        var review = Reviewing.Of(Beam);
        var model = review.Submission.Model;
        var sketch = new StructureSketch(model, StructureSketch.ViewFor(model));
        var c = review.Cases.Single(x => x.Case == "ENV");
        var layout = EnvelopeLayout.Build(model, review.Analysis!.Envelope("ENV")!, c, SignConvention.Sagging, sketch, PeakPx);
        layout.Peak.ShouldBe(190.35e3, 1);
        var ab = layout.Members.Single(t => t.Member == "AB");
        double axisY = sketch.At("A").Y, scale = PeakPx / 190.35e3;
        // At B (the end of AB): the least moment, −190.35 (hogging), is drawn above the axis (y up the page is negative), the
        // largest, −109.35, above it too but shorter.
        ab.MinOutline[^2].Y.ShouldBe(axisY - (190.35e3 * scale), 0.01);
        ab.MaxOutline[^2].Y.ShouldBe(axisY - (109.35e3 * scale), 0.01);
        // Inside the span the largest moment sags, below the axis.
        ab.MaxOutline.Max(p => p.Y).ShouldBeGreaterThan(axisY + 20);
        // The claims: max −109.35 agrees (it plots on the max curve), min −170 lies on the unsafe side of −190.35.
        var max = ab.Claims.Single(k => k.Bound == "max");
        max.Status.ShouldBe(EndStatus.Agree);
        max.Claimed.Y.ShouldBe(axisY - (109.35e3 * scale), 0.01);
        var min = ab.Claims.Single(k => k.Bound == "min");
        min.Side.ShouldBe(EnvelopeSide.Unsafe);
        min.Claimed.Y.ShouldBe(axisY - (170e3 * scale), 0.01);
        min.TrueTip.Y.ShouldBe(axisY - (190.35e3 * scale), 0.01);
    }

    [Fact]
    public void HtmlMemo_DrawsTheEnvelope_MaxAndMinPerMember()
    {
        var review = Reviewing.Of(Beam);
        string html = MemoRenderer.Render(MemoExtensions.Build(review, MemoFormat.Html), MemoFormat.Html);
        html.ShouldContain("class=\"cc-figure cc-envelope\"");
        System.Text.RegularExpressions.Regex.Count(html, "class=\"cc-env-max\"").ShouldBe(2);
        System.Text.RegularExpressions.Regex.Count(html, "class=\"cc-env-min\"").ShouldBe(2);
        html.ShouldContain("claimed min 170");
    }
}
