using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo.Diagrams;

/// <summary>An envelope claim placed where it would plot: its bending moment (tension side, as the diagram), the true extreme's tip, its own point.</summary>
internal sealed record EnvelopeClaimMark(string Member, string Bound, Pt Axis, Pt TrueTip, Pt Claimed, EndStatus Status, EnvelopeSide? Side, double ClaimedBending, bool OffScale);

/// <summary>One member's envelope: the largest and least bending moment over every arrangement as outlines (axis start, ordinates, axis end).</summary>
internal sealed record EnvelopeTrace(string Member, Pt Start, Pt End, Pt Tension, IReadOnlyList<Pt> MaxOutline, IReadOnlyList<Pt> MinOutline,
    IReadOnlyList<ValueMark> Values, IReadOnlyList<EnvelopeClaimMark> Claims);

/// <summary>
/// Geometry of a combination's envelope, before any SVG is written: for every member the largest and the least internal
/// moment over every arrangement (<see cref="Envelope.Curve"/>), drawn perpendicular to the member on the tension side of a
/// positive moment, at one scale for the combination, with the claimed envelope figures marked.
/// </summary>
internal sealed class EnvelopeLayout
{
    private EnvelopeLayout(double peak, IReadOnlyList<EnvelopeTrace> members)
    {
        Peak = peak;
        Members = members;
    }

    /// <summary>Largest magnitude of the envelope (N·m).</summary>
    public double Peak { get; }

    public IReadOnlyList<EnvelopeTrace> Members { get; }

    public static EnvelopeLayout Build(StructureModel model, Envelope envelope, CaseReview review, SignConvention convention, StructureSketch sketch, double peakPixels)
    {
        var curves = model.Members.ToDictionary(m => m.Id, m => envelope.Curve(m.Id), StringComparer.Ordinal);
        double peak = curves.Values.SelectMany(c => c).SelectMany(s => new[] { Math.Abs(s.Max), Math.Abs(s.Min) }).DefaultIfEmpty(0).Max();
        var claims = review.Envelope.Where(f => f.Recomputed is not null && curves.ContainsKey(f.Member)).ToList();
        double claimPeak = claims.Select(f => Math.Abs(f.Claimed)).DefaultIfEmpty(0).Max();
        double range = Math.Max(peak, Math.Min(claimPeak, MomentLayout.ClaimRange * peak));
        double k = range > 0 ? peakPixels / range : 0;
        var traces = new List<EnvelopeTrace>();
        foreach (var m in model.Members)
        {
            var curve = curves[m.Id];
            var (s, e) = sketch.Ends(m);
            var tension = (e - s).Unit.TurnClockwise;
            double length = model.Length(m);
            Pt AxisAt(double x) => length > 0 ? Pt.Lerp(s, e, x / length) : s;
            Pt TipAt(double x, double bending) => AxisAt(x) + (tension * (bending * k));
            Pt Out(double b) => b < 0 ? tension * -1 : tension;
            var max = new List<Pt> { s };
            max.AddRange(curve.Select(p => TipAt(p.X, p.Max)));
            max.Add(e);
            var min = new List<Pt> { s };
            min.AddRange(curve.Select(p => TipAt(p.X, p.Min)));
            min.Add(e);

            var values = new List<ValueMark>();
            foreach (var (x, b, isEnd) in Labelled(curve, length, peak))
                values.Add(new ValueMark(m.Id, b, x, AxisAt(x), TipAt(x, b), Out(b), isEnd));

            var marks = new List<EnvelopeClaimMark>();
            foreach (var f in claims.Where(f => f.Member == m.Id))
            {
                // End rows are in the submission's convention: at the end of a member a clockwise moment is minus the bending moment.
                double sign = !f.IsSpan && f.End == MemberEnd.End && convention == SignConvention.Clockwise ? -1 : 1;
                double x = f.IsSpan ? f.X ?? length / 2 : f.End == MemberEnd.Start ? 0 : length;
                double cb = sign * f.Claimed, tb = sign * f.Recomputed!.Value;
                bool off = Math.Abs(cb) > range * 1.0000001;
                marks.Add(new EnvelopeClaimMark(m.Id, f.Bound, AxisAt(x), TipAt(x, tb), TipAt(x, Math.Clamp(cb, -range, range)), f.Status, f.Side, cb, off));
            }
            traces.Add(new EnvelopeTrace(m.Id, s, e, tension, max, min, values, marks));
        }
        return new EnvelopeLayout(peak, traces);
    }

    /// <summary>The values worth a label: at each end the larger of the two extremes, inside the span the largest maximum and least minimum.</summary>
    private static IEnumerable<(double X, double Bending, bool IsEnd)> Labelled(IReadOnlyList<EnvelopeStation> curve, double length, double peak)
    {
        if (curve.Count == 0) yield break;
        foreach (var p in new[] { curve[0], curve[^1] })
        {
            double b = Math.Abs(p.Max) >= Math.Abs(p.Min) ? p.Max : p.Min;
            if (Math.Abs(b) >= 0.02 * peak) yield return (p.X, b, true);
        }
        var inner = curve.Where(p => p.X > 0.02 * length && p.X < 0.98 * length).ToList();
        if (inner.Count == 0) yield break;
        var top = inner.MaxBy(p => p.Max);
        if (top.Max > 0.02 * peak && top.Max > Math.Max(curve[0].Max, curve[^1].Max)) yield return (top.X, top.Max, false);
        var bottom = inner.MinBy(p => p.Min);
        if (bottom.Min < -0.02 * peak && bottom.Min < Math.Min(curve[0].Min, curve[^1].Min)) yield return (bottom.X, bottom.Min, false);
    }
}
