using System.Globalization;
using System.Text;
using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Tests.Support;
using Xunit.Abstractions;

namespace CrossCheck.Tests.Analysis;

/// <summary>
/// Group 9 of docs/REFERENCE-CHECKS.md: envelopes over pattern loading of equal-span continuous beams (spans of 6 m, pin
/// at the first support and rollers elsewhere), exact by superposition (<see cref="CombinationAnalysis"/>), against the
/// coefficient tables of the structural handbooks for dead load on all spans and live load arranged for the worst
/// effect (moments × wL², shears × wL), the four-decimal values of group 9 (every arrangement enumerated by an
/// independent solver), and exact fractions by the three-moment equation (Clapeyron; Timoshenko &amp; Young, Theory of
/// Structures, from memory). The largest deviation from the printed coefficients is written to the test output.
/// </summary>
public class ReferenceEnvelopeTests(ITestOutputHelper output)
{
    private const double L = 6, G = 18, Q = 12;

    /// <summary>
    /// The coefficient tables of the handbooks for continuous beams over equal spans (e.g. the tables of bending moment and
    /// shear coefficients in Reynolds, Reinforced Concrete Designer's Handbook, and in the Steel Designer's Manual) — the
    /// three-decimal values are quoted from memory; their titles and numbers were not opened here.
    /// </summary>
    private const string Handbooks = "handbook coefficient tables for equal spans, dead load all spans / live load worst arrangement (from memory)";

    private static FrameBuilder Beam(int n)
    {
        var b = FrameBuilder.Beam(Enumerable.Repeat(L, n).ToArray(), Enumerable.Range(0, n + 1).Select(i => i == 0 ? Restraint.Pinned : Restraint.Roller).ToArray(),
            200e6, Enumerable.Repeat(2.5e-4, n).ToArray());
        for (int k = 1; k <= n; k++) b.Udl("S" + k, G, c: "G").Udl("S" + k, Q, c: "Q");
        return b;
    }

    private static Combination Patterned(string name, double g, double q) => new(name,
    [
        new CombinationTerm("G", g, false, 0, new SourceRef("test")),
        new CombinationTerm("Q", q, true, 0, new SourceRef("test")),
    ], new SourceRef("test"));

    private static Envelope EnvelopeOf(int spans, double g, double q)
    {
        var b = Beam(spans);
        return CombinationAnalysis.EnvelopeOf(b.Model, b.Cases, Patterned("C", g, q));
    }

    /// <summary>What one coefficient measures on an envelope: (value, governing arrangement).</summary>
    private static (double Value, IReadOnlyList<string> Loaded) Measure(Envelope e, string quantity)
    {
        var parts = quantity.Split(' ');
        string m = parts[1];
        switch (parts[0])
        {
            case "support": // hogging at the right end of span m, clockwise positive there
            {
                var x = e.Extremes(r => r.Members[m].EndMoment).Max;
                return (x.Value, x.Loaded);
            }
            case "span":
            {
                var x = e.SpanMaximum(m);
                return (x.Value, x.Loaded);
            }
            case "least":
                return (e.Curve(m).Min(s => s.Min), []);
            case "shear-start":
            {
                var x = e.Extremes(r => r.Members[m].StartV).Max;
                return (x.Value, x.Loaded);
            }
            case "shear-end":
            {
                var x = e.Extremes(r => -r.Members[m].EndV).Max;
                return (x.Value, x.Loaded);
            }
            default: throw new ArgumentException(quantity);
        }
    }

    /// <summary>spans, quantity, dead-load coefficient, live-load coefficient (three decimals, <see cref="Handbooks"/>), group-9 four-decimal worst (NaN when not listed).</summary>
    public static TheoryData<int, string, double, double, double> Coefficients => new()
    {
        { 2, "span S1", 0.070, 0.096, 0.0957 },
        { 2, "support S1", 0.125, 0.125, 0.1250 },
        { 2, "shear-start S1", 0.375, 0.438, double.NaN },
        { 2, "shear-end S1", 0.625, 0.625, 0.6250 },
        { 3, "span S1", 0.080, 0.101, 0.1013 },
        { 3, "span S2", 0.025, 0.075, 0.0750 },
        { 3, "support S1", 0.100, 0.117, 0.1167 },
        { 3, "shear-start S1", 0.400, 0.450, double.NaN },
        { 3, "shear-end S1", 0.600, 0.617, 0.6167 },
        { 3, "shear-start S2", 0.500, 0.583, 0.5833 },
        { 4, "span S1", 0.077, 0.100, 0.0996 },
        { 4, "span S2", 0.036, 0.081, 0.0805 },
        { 4, "support S1", 0.107, 0.121, 0.1205 },
        { 4, "support S2", 0.071, 0.107, 0.1071 },
        { 4, "shear-start S1", 0.393, 0.446, double.NaN },
        { 4, "shear-end S1", 0.607, 0.620, 0.6205 },
        { 4, "shear-start S2", 0.536, 0.603, 0.6027 },
        { 5, "span S1", 0.078, 0.100, 0.1001 },
        { 5, "span S2", 0.033, 0.079, 0.0790 },
        { 5, "span S3", 0.046, 0.086, 0.0855 },
        { 5, "support S1", 0.105, 0.120, 0.1196 },
        { 5, "support S2", 0.079, 0.111, 0.1112 },
        { 5, "shear-end S1", 0.605, 0.620, 0.6196 },
        { 5, "shear-start S2", 0.526, 0.598, 0.5981 },
        { 5, "shear-start S3", 0.500, 0.591, 0.5909 },
    };

    [Theory]
    [MemberData(nameof(Coefficients))]
    public void DeadLoadAllSpans_LiveLoadWorstArrangement(int spans, string quantity, double dead, double live, double exact)
    {
        double scale = quantity.StartsWith("shear", StringComparison.Ordinal) ? L : L * L;
        // Live load alone (factor 0 on G): the live-load coefficient; dead load alone: every arrangement gives the same.
        var liveOnly = Measure(EnvelopeOf(spans, 0, 1), quantity).Value / (Q * scale);
        var deadOnly = Measure(EnvelopeOf(spans, 1, 0), quantity).Value / (G * scale);
        // Both at once: dead load fixed, live load patterned; the extreme is the sum of the two coefficients (superposition).
        var both = Measure(EnvelopeOf(spans, 1, 1), quantity).Value / scale;
        Near.Equal(deadOnly, dead, relative: 0, absolute: 0.001 + 1e-9, what: $"{spans} spans {quantity} dead ({Handbooks})");
        Near.Equal(liveOnly, live, relative: 0, absolute: 0.001 + 1e-9, what: $"{spans} spans {quantity} live ({Handbooks})");
        // Support moments and end shears are at fixed places: the extreme of dead + live is the sum of the two coefficients.
        // Span maxima of the two need not fall at the same place, so their sum is an upper bound (as the tables' users know).
        if (quantity.StartsWith("span", StringComparison.Ordinal))
            both.ShouldBeLessThanOrEqualTo((deadOnly * G) + (liveOnly * Q) + 1e-9);
        else
            Near.Equal(both, (deadOnly * G) + (liveOnly * Q), what: $"{spans} spans {quantity} dead + live");
        // Group 9, docs/REFERENCE-CHECKS.md: four decimals, computed by enumerating every arrangement.
        if (!double.IsNaN(exact)) Near.Equal(liveOnly, exact, relative: 0, absolute: 0.00005 + 1e-9, what: $"{spans} spans {quantity} (group 9)");
    }

    [Fact]
    public void LargestDeviationFromThePrintedCoefficients()
    {
        double worst = 0;
        string at = "";
        var table = new StringBuilder("spans  quantity          dead: printed  exact     live: printed  exact\n");
        foreach (var row in Coefficients)
        {
            var (spans, quantity, dead, live) = ((int)row[0], (string)row[1], (double)row[2], (double)row[3]);
            double scale = quantity.StartsWith("shear", StringComparison.Ordinal) ? L : L * L;
            double d = Measure(EnvelopeOf(spans, 1, 0), quantity).Value / (G * scale);
            double l = Measure(EnvelopeOf(spans, 0, 1), quantity).Value / (Q * scale);
            table.Append(CultureInfo.InvariantCulture, $"{spans,5}  {quantity,-16}  {dead,14:0.000}  {d,-8:0.00000}  {live,13:0.000}  {l:0.00000}\n");
            foreach (var (printed, exact, which) in new[] { (dead, d, "dead"), (live, l, "live") })
                if (Math.Abs(printed - exact) > worst) { worst = Math.Abs(printed - exact); at = $"{spans} spans, {quantity}, {which}"; }
        }
        table.Append(CultureInfo.InvariantCulture, $"largest deviation from the printed three decimals: {worst:0.000000} ({at})\n");
        output.WriteLine(table.ToString());
        worst.ShouldBeLessThanOrEqualTo(0.001 + 1e-9, table.ToString());
    }

    [Fact]
    public void ExactFractionsByTheThreeMomentEquation()
    {
        // Two spans, live load on one span only: M_B = wL²/16, R_A = 7wL/16, largest span moment (7/16)²·wL²/2 = 49wL²/512
        // (engineersedge.com citing Lindeburg, Civil Engineering Reference Manual, 15th ed.; docs/REFERENCE-CHECKS.md 3.7).
        var two = EnvelopeOf(2, 0, 1);
        Near.Equal(two.SpanMaximum("S1").Value, 49.0 / 512 * Q * L * L, what: "2 spans, span maximum");
        two.SpanMaximum("S1").Loaded.ShouldBe(["S1"]);
        Near.Equal(two.SpanMaximum("S1").X, 7.0 / 16 * L, relative: 1e-7, what: "where");
        // Three spans: the supports beside a loaded pair (spans 1, 2) give 7wL²/60 (3.9); the end spans alone give wL²/20 at
        // both supports, so span 1 peaks at 0.45²/2 = 0.10125 wL² and span 2 hogs wL²/20 throughout (3.8).
        var three = EnvelopeOf(3, 0, 1);
        var b = three.Extremes(r => r.Members["S1"].EndMoment).Max;
        Near.Equal(b.Value, 7.0 / 60 * Q * L * L, what: "3 spans, support B");
        b.Loaded.ShouldBe(["S1", "S2"]);
        Near.Equal(three.SpanMaximum("S1").Value, 0.10125 * Q * L * L, what: "3 spans, span 1");
        three.SpanMaximum("S1").Loaded.ShouldBe(["S1", "S3"]);
        var least = three.Extremes(r => r.Members["S2"].MomentAt(L / 2)).Min;
        Near.Equal(least.Value, -Q * L * L / 20, what: "3 spans, least moment at the middle of span 2");
        least.Loaded.ShouldBe(["S1", "S3"]);
        Near.Equal(three.SpanMaximum("S2").Value, (Q * L * L / 8) - (Q * L * L / 20), what: "3 spans, span 2 alone");
        three.SpanMaximum("S2").Loaded.ShouldBe(["S2"]);
    }
}
