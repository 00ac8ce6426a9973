using CrossCheck.Analysis;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo.Diagrams;

/// <summary>A labelled value of the recomputed diagram: at a member end or at the largest span moment.</summary>
/// <param name="Bending">Bending moment (N·m), positive when the right-hand fibre looking from start to end is in tension.</param>
/// <param name="X">Distance from the member's start (m).</param>
/// <param name="Axis">Point on the member axis (px).</param>
/// <param name="Tip">End of the ordinate (px).</param>
/// <param name="Outward">Unit vector from the axis towards the tension side at that point.</param>
internal sealed record ValueMark(string Member, double Bending, double X, Pt Axis, Pt Tip, Pt Outward, bool IsEnd);

/// <summary>A claimed member-end moment placed where it would plot on the diagram.</summary>
/// <param name="ClaimedBending">The claim as a bending moment (clockwise end moment at the start, minus it at the end); null when not claimed.</param>
/// <param name="Claimed">Where the claim plots (px), clamped to the drawing's range when <paramref name="OffScale"/>.</param>
internal sealed record ClaimMark(string Member, MemberEnd End, string Joint, Pt Axis, Pt RecomputedTip, Pt Claimed, EndStatus Status,
    double RecomputedBending, double? ClaimedBending, bool OffScale);

/// <summary>The diagram of one member: outline polygon (axis start, ordinates, axis end), claimed-implied line, values and claims.</summary>
/// <param name="Tension">Unit vector (px) along which a positive bending moment is drawn: the member's right-hand side looking from start to end.</param>
/// <param name="ClaimedLine">The diagram the claimed end moments imply with the same member loads; null unless both ends are claimed and one differs.</param>
internal sealed record MemberTrace(string Member, Pt Start, Pt End, Pt Tension, IReadOnlyList<Pt> Outline, IReadOnlyList<Pt>? ClaimedLine,
    IReadOnlyList<ValueMark> Values, IReadOnlyList<ClaimMark> Claims);

/// <summary>
/// Geometry of the bending-moment diagram of one load case, before any SVG is written: every ordinate is drawn
/// perpendicular to its member on the tension side, at one scale for the whole case, so the peak ordinate of the case
/// is <c>peakPixels</c> long.
/// </summary>
internal sealed class MomentLayout
{
    /// <summary>Claims further out than this multiple of the recomputed peak are drawn at this distance and marked off scale.</summary>
    public const double ClaimRange = 1.6;

    private MomentLayout(double pixelsPerNm, double peak, IReadOnlyList<MemberTrace> members)
    {
        PixelsPerNm = pixelsPerNm;
        Peak = peak;
        Members = members;
    }

    /// <summary>Ordinate scale (px per N·m); zero when the case has no bending at all.</summary>
    public double PixelsPerNm { get; }

    /// <summary>Largest recomputed bending moment in the case (N·m, magnitude).</summary>
    public double Peak { get; }

    public IReadOnlyList<MemberTrace> Members { get; }

    /// <summary>
    /// Lays out the case. <paramref name="review"/> supplies the claims (may be null); members of the model that the
    /// analysis does not have are skipped.
    /// </summary>
    /// <param name="coarse">Sample each member at eighths and its span extremes only (a large frame drawn small).</param>
    public static MomentLayout Build(StructureModel model, CaseResult result, CaseReview? review, StructureSketch sketch, double peakPixels, bool coarse = false)
    {
        var samples = new Dictionary<string, List<(double X, double M)>>(StringComparer.Ordinal);
        foreach (var m in model.Members)
            if (result.Members.TryGetValue(m.Id, out var r)) samples[m.Id] = coarse ? Coarse(r) : Samples(r);
        double peak = samples.Values.SelectMany(s => s).Select(s => Math.Abs(s.M)).DefaultIfEmpty(0).Max();

        var findings = review?.EndMoments.Where(e => e.End is not null && e.Recomputed is not null && samples.ContainsKey(e.Member)).ToList() ?? [];
        double claimPeak = findings.Where(e => e.Claimed is double).Select(e => Math.Abs(e.Claimed!.Value)).DefaultIfEmpty(0).Max();
        double range = Math.Max(peak, Math.Min(claimPeak, ClaimRange * peak));
        double k = range > 0 ? peakPixels / range : 0;
        var byMember = findings.GroupBy(f => f.Member, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.ToList(), StringComparer.Ordinal);

        var traces = new List<MemberTrace>();
        foreach (var m in model.Members)
        {
            if (!samples.TryGetValue(m.Id, out var list)) continue;
            var r = result.Members[m.Id];
            var (s, e) = sketch.Ends(m);
            var along = (e - s).Unit;
            var tension = along.TurnClockwise;
            double length = r.Length;
            Pt AxisAt(double x) => length > 0 ? Pt.Lerp(s, e, x / length) : s;
            Pt TipAt(double x, double bending) => AxisAt(x) + (tension * (bending * k));

            var outline = new List<Pt>(list.Count + 2) { s };
            outline.AddRange(list.Select(p => TipAt(p.X, p.M)));
            outline.Add(e);

            var values = new List<ValueMark>();
            Pt Out(double b) => b < 0 ? tension * -1 : tension;
            double startB = r.StartMoment, endB = -r.EndMoment;
            values.Add(new ValueMark(m.Id, startB, 0, s, TipAt(0, startB), Out(startB), IsEnd: true));
            values.Add(new ValueMark(m.Id, endB, length, e, TipAt(length, endB), Out(endB), IsEnd: true));
            foreach (var (x, b) in new[] { r.MaxSagging, r.MaxHogging })
            {
                bool interior = x > 0.02 * length && x < 0.98 * length;
                if (interior && Math.Abs(b) >= 0.02 * peak && b != 0)
                    values.Add(new ValueMark(m.Id, b, x, AxisAt(x), TipAt(x, b), Out(b), IsEnd: false));
            }

            var claims = new List<ClaimMark>();
            foreach (var f in byMember.GetValueOrDefault(m.Id) ?? [])
            {
                var end = f.End!.Value;
                double sign = end == MemberEnd.Start ? 1 : -1;
                double rb = sign * f.Recomputed!.Value;
                double? cb = f.Claimed is double c ? sign * c : null;
                var axis = end == MemberEnd.Start ? s : e;
                double x = end == MemberEnd.Start ? 0 : length;
                bool off = cb is double v && Math.Abs(v) > range * 1.0000001;
                double plotted = cb is double w ? Math.Clamp(w, -range, range) : rb;
                claims.Add(new ClaimMark(m.Id, end, f.At, axis, TipAt(x, rb), TipAt(x, plotted), f.Status, rb, cb, off));
            }

            IReadOnlyList<Pt>? claimedLine = null;
            var cs = claims.FirstOrDefault(c => c.End == MemberEnd.Start && c.ClaimedBending is not null);
            var ce = claims.FirstOrDefault(c => c.End == MemberEnd.End && c.ClaimedBending is not null);
            if (cs is not null && ce is not null && !(cs.OffScale || ce.OffScale)
                && (cs.Status != EndStatus.Agree || ce.Status != EndStatus.Agree))
            {
                // Same member loads, other end moments: the claimed diagram differs from the recomputed one by a straight line.
                double ds = cs.ClaimedBending!.Value - startB, de = ce.ClaimedBending!.Value - endB;
                claimedLine = list.Select(p => TipAt(p.X, p.M + ds + ((de - ds) * (length > 0 ? p.X / length : 0)))).ToList();
            }
            traces.Add(new MemberTrace(m.Id, s, e, tension, outline, claimedLine, values, claims));
        }
        return new MomentLayout(k, peak, traces);
    }

    /// <summary>The moment at eighths of the length and at both span extremes.</summary>
    internal static List<(double X, double M)> Coarse(MemberResult r)
    {
        var xs = Enumerable.Range(0, 9).Select(i => r.Length * i / 8).Append(r.MaxSagging.X).Append(r.MaxHogging.X).Order().Distinct();
        return [.. xs.Select(x => (x, r.MomentAt(x)))];
    }

    /// <summary>The analysis stations, refined to sixtieths of the length and including both span extremes.</summary>
    internal static List<(double X, double M)> Samples(MemberResult r)
    {
        var list = r.Stations.Select(s => (s.X, M: s.Moment)).ToList();
        double tol = 1e-9 * Math.Max(r.Length, 1);
        var extra = Enumerable.Range(1, 59).Select(i => r.Length * i / 60).Append(r.MaxSagging.X).Append(r.MaxHogging.X);
        foreach (var x in extra)
            if (x > 0 && x < r.Length && !list.Any(p => Math.Abs(p.X - x) <= tol)) list.Add((x, r.MomentAt(x)));
        return [.. list.OrderBy(p => p.X)];
    }
}
