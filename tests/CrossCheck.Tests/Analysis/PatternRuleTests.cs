using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// The simplified load arrangements of the design codes as subsets of the exact envelope (docs/REFERENCE-CHECKS.md group 9):
/// EN 1992-1-1 clause 5.1.3(1)P — (a) alternate spans carrying γQ·Qk + γG·Gk, the others γG·Gk; (b) any two adjacent spans
/// carrying γQ·Qk + γG·Gk, the others γG·Gk — and ACI 318 clause 6.4.3 — factored live load on the span and on alternate
/// spans for the largest positive moment, on the two adjacent spans only for the largest negative moment at a support (both
/// quoted from memory). Each rule's arrangement is one of the 2ⁿ the exact envelope covers, so it can never exceed it; for
/// equal spans under one uniform load the alternate-span rule gives the exact span maxima, and the adjacent-span rule falls
/// short of the exact support moment from four spans on (spans beyond the pair, alternately loaded, add to it).
/// </summary>
public class PatternRuleTests(ITestOutputHelper output)
{
    private const double L = 6, G = 18, Q = 12;

    private static Envelope EnvelopeOf(double[] spans)
    {
        var b = FrameBuilder.Beam(spans, Enumerable.Range(0, spans.Length + 1).Select(i => i == 0 ? Restraint.Pinned : Restraint.Roller).ToArray(),
            200e6, spans.Select(_ => 2.5e-4).ToArray());
        for (int k = 1; k <= spans.Length; k++) b.Udl("S" + k, G, c: "G").Udl("S" + k, Q, c: "Q");
        var here = new SourceRef("test");
        var combo = new Combination("ULS", [new CombinationTerm("G", 1.35, false, 0, here), new CombinationTerm("Q", 1.5, true, 0, here)], here);
        return CombinationAnalysis.EnvelopeOf(b.Model, b.Cases, combo);
    }

    private static List<string> Alternate(int n, int span) => Enumerable.Range(1, n).Where(k => (k - span) % 2 == 0).Select(k => "S" + k).ToList();

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    public void EqualSpans_AlternateSpansGiveTheExactSpanMaxima_AdjacentSpansNeverExceedTheSupportMoments(int n)
    {
        var env = EnvelopeOf(Enumerable.Repeat(L, n).ToArray());
        for (int k = 1; k <= n; k++)
        {
            var exact = env.SpanMaximum("S" + k);
            double rule = env.Member("S" + k, Alternate(n, k)).SpanMaximum.Moment;
            Near.Equal(rule, exact.Value, relative: 1e-9, what: $"{n} spans, span {k}: alternate spans (EN 1992-1-1 5.1.3 (a), ACI 318 6.4.3)");
            exact.Loaded.ShouldBe(Alternate(n, k));
        }
        for (int k = 1; k < n; k++)
        {
            var exact = env.Extremes(r => r.Members["S" + k].EndMoment).Max;
            double rule = env.Member("S" + k, ["S" + k, "S" + (k + 1)]).EndMoment;
            rule.ShouldBeLessThanOrEqualTo(exact.Value + 1e-9);
            output.WriteLine($"{n} spans, support {k}: adjacent spans {rule:0.00}, exact {exact.Value:0.00} ({string.Join(" ", exact.Loaded)}), {100 * (1 - (rule / exact.Value)):0.0} % short");
            // Two or three spans: the pair beside the support is the worst arrangement (docs/REFERENCE-CHECKS.md 3.7, 3.9).
            if (n <= 3) Near.Equal(rule, exact.Value, what: $"{n} spans, support {k}: adjacent spans");
        }
    }

    [Fact]
    public void UnequalSpans_TheExactEnvelopeCanExceedTheCodeArrangements()
    {
        // Spans 8, 4, 8 m: loading the short middle span raises the hogging over its supports; the alternate pattern for the
        // middle span's maximum, and the code arrangements, stay within the exact envelope.
        double[] spans = [8, 4, 8];
        var env = EnvelopeOf(spans);
        foreach (var k in new[] { 1, 2, 3 })
            env.Member("S" + k, Alternate(3, k)).SpanMaximum.Moment.ShouldBeLessThanOrEqualTo(env.SpanMaximum("S" + k).Value + 1e-9);
        var support = env.Extremes(r => r.Members["S1"].EndMoment).Max;
        env.Member("S1", ["S1", "S2"]).EndMoment.ShouldBeLessThanOrEqualTo(support.Value + 1e-9);
        // The least moment in the short middle span (it may hog throughout): every span loaded but S2, an arrangement no simplified rule lists.
        var least = env.Extremes(r => r.Members["S2"].MomentAt(2)).Min;
        least.Loaded.ShouldBe(["S1", "S3"]);
    }
}
