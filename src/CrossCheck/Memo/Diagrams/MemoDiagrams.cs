using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Model;
using CrossCheck.Review;

namespace CrossCheck.Memo.Diagrams;

/// <summary>A drawing for the HTML memo: a number, an SVG document (already safe to insert) and a caption (plain text, to be escaped).</summary>
public sealed record MemoFigure(int Number, string Kind, string Svg, string Caption);

/// <summary>
/// The drawings of a review, made for the HTML memo: the structure as read, and for every load case its loads, its
/// recomputed bending-moment diagram with the claims overlaid, and a detail of each member with a differing end.
/// </summary>
public sealed class MemoDiagrams
{
    /// <summary>At most this many member details per case; the memo says how many more there were.</summary>
    public const int MaxDetailsPerCase = 12;

    /// <summary>
    /// Above this many members the drawings of the whole structure are too small to label: they show the members,
    /// supports, hinges, loads and diagrams, mark only the claims that differ, and write ids and values only at the
    /// members whose claims differ (this many at most, the worst first). The tables give every figure.
    /// </summary>
    public const int MaxLabelledMembers = 150;

    private readonly Dictionary<string, IReadOnlyList<MemoFigure>> _case = new(StringComparer.Ordinal);
    private readonly Dictionary<string, IReadOnlyList<MemoFigure>> _details = new(StringComparer.Ordinal);
    private readonly Dictionary<string, int> _omitted = new(StringComparer.Ordinal);

    private MemoDiagrams(MemoFigure structure) => Structure = structure;

    public MemoFigure Structure { get; }

    /// <summary>The loads and bending-moment figures of a case (empty when the case was not analysed).</summary>
    public IReadOnlyList<MemoFigure> ForCase(string caseId) => _case.GetValueOrDefault(caseId) ?? [];

    /// <summary>Details of the members of a case whose claims differ, worst first.</summary>
    public IReadOnlyList<MemoFigure> DetailsFor(string caseId) => _details.GetValueOrDefault(caseId) ?? [];

    public int DetailsOmitted(string caseId) => _omitted.GetValueOrDefault(caseId);

    /// <summary>Draws everything for <paramref name="review"/>; null when the review carries no analysis.</summary>
    public static MemoDiagrams? For(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        if (review.Analysis is not { } analysis || review.Submission.Model.Members.Count == 0) return null;
        var s = review.Submission;
        var model = s.Model;
        var units = new UnitText(s.Info.Units);
        var sketch = new StructureSketch(model, StructureSketch.ViewFor(model));
        bool dense = model.Members.Count > MaxLabelledMembers;
        string large = dense
            ? $" The structure has {model.Members.Count.ToString(CultureInfo.InvariantCulture)} members, too many to label at this size: ids and values are left to the tables."
            : "";
        int n = 1;
        var structure = new MemoFigure(n++, "structure",
            ElevationDrawing.Render(model, sketch, units, null, "The structure as read", dense),
            (dense ? "The structure as read, to scale: members, supports and member-end hinges." : "The structure as read, to scale: joints (bold), members with their lengths, supports and member-end hinges.") +
            " Check it against the calculation's own sketch." + large);
        var result = new MemoDiagrams(structure);
        string mu = s.Info.Units.Moment.Symbol;
        bool sagging = s.Info.SignConvention == SignConvention.Sagging;

        foreach (var c in review.Cases)
        {
            if (analysis.Envelope(c.Case) is { } envelope)
            {
                var env = EnvelopeLayout.Build(model, envelope, c, s.Info.SignConvention, sketch, PeakPixelsFor(sketch, model));
                int unsafeClaims = c.Envelope.Count(x => x.Side == EnvelopeSide.Unsafe), safe = c.Envelope.Count(x => x.Side == EnvelopeSide.Safe);
                result._case[c.Case] = [new MemoFigure(n++, "envelope", EnvelopeDrawing.Render(model, sketch, env, units, c.Case),
                    $"Combination {c.Case}: envelope of the bending moment [{mu}] over every arrangement of its patterned load — filled: the largest, dashed: the least — " +
                    "drawn on the tension side of a positive moment at one scale. Each claimed envelope figure is marked where it would plot " +
                    $"(diamond: agrees or lies on the safe side; triangle: minor, unsafe side; ringed cross: discrepant, unsafe side). {Count(unsafeClaims, "claim")} on the unsafe side, {safe} conservative.")];
                continue;
            }
            var caseResult = analysis.Cases.FirstOrDefault(x => x.Case == c.Case);
            if (caseResult is null) continue;
            var loads = s.Case(c.Case);
            var figures = new List<MemoFigure>();
            if (loads is not null)
            {
                figures.Add(new MemoFigure(n++, "loads",
                    ElevationDrawing.Render(model, sketch, units, loads, $"Loads of case {c.Case}", dense),
                    $"Load case {c.Case}: the loads as read. Arrows point the way each load acts; the arrows of a distributed load grow with its intensity." + large));
            }
            var layout = MomentLayout.Build(model, caseResult, c, sketch, PeakPixelsFor(sketch, model), coarse: dense);
            int discrepant = c.EndMoments.Count(e => e.Status == EndStatus.Discrepant && e.End is not null);
            int minor = c.EndMoments.Count(e => e.Status == EndStatus.Minor && e.End is not null);
            figures.Add(new MemoFigure(n++, "moments",
                MomentDrawing.Render(model, sketch, layout, units, c.Case, dense),
                $"Load case {c.Case}: recomputed bending moment [{mu}], drawn on the tension side of each member at one scale for the case; " +
                "values are magnitudes at the member ends and at the largest span moments. Each claimed end moment is marked where it would plot " +
                $"(diamond: agrees; triangle: minor difference; ringed cross: discrepant; square: not claimed). {Count(discrepant, "discrepant end")}, {Count(minor, "minor difference")}." +
                (dense ? $" The structure has {model.Members.Count.ToString(CultureInfo.InvariantCulture)} members: only the claims that differ are marked, and values are written at the " +
                         $"members whose claims differ (at most {MaxLabelledMembers.ToString(CultureInfo.InvariantCulture)}, the worst first)." : "")));
            result._case[c.Case] = figures;

            var flagged = c.EndMoments
                .Where(e => e.End is not null && e.Status is EndStatus.Discrepant or EndStatus.Minor or EndStatus.Missing && caseResult.Members.ContainsKey(e.Member))
                .GroupBy(e => e.Member, StringComparer.Ordinal)
                .OrderByDescending(g => g.Max(e => Rank(e.Status)))
                .ThenByDescending(g => g.Max(e => Math.Abs(e.Difference ?? e.Recomputed ?? 0)))
                .Select(g => g.Key)
                .ToList();
            var details = new List<MemoFigure>();
            foreach (var id in flagged.Take(MaxDetailsPerCase))
            {
                var m = model.Member(id);
                double length = model.Length(m);
                details.Add(new MemoFigure(n++, "detail",
                    MemberDetail.Render(m, length, caseResult, c, loads, units, c.Case),
                    DetailCaption(m, c, units, mu, sagging)));
            }
            result._details[c.Case] = details;
            result._omitted[c.Case] = Math.Max(0, flagged.Count - MaxDetailsPerCase);
        }
        return result;
    }

    /// <summary>Length of the largest ordinate: a tenth of the drawing's larger side, between 40 and 64 px.</summary>
    internal static double PeakPixelsFor(StructureSketch sketch, StructureModel model)
    {
        var pts = model.Joints.Select(j => sketch.At(j.Id)).ToList();
        double w = pts.Max(p => p.X) - pts.Min(p => p.X), h = pts.Max(p => p.Y) - pts.Min(p => p.Y);
        return Math.Clamp(0.1 * Math.Max(w, h), 40, 64);
    }

    private static string Count(int n, string what) => n == 1 ? $"1 {what}" : $"{n.ToString(CultureInfo.InvariantCulture)} {what}s";

    private static int Rank(EndStatus s) => s switch
    {
        EndStatus.Discrepant => 3,
        EndStatus.Minor => 2,
        EndStatus.Missing => 1,
        _ => 0,
    };

    private static string DetailCaption(Member m, CaseReview c, UnitText units, string mu, bool sagging)
    {
        string Claim(MemberEnd end)
        {
            var f = c.EndMoments.FirstOrDefault(e => e.Member == m.Id && e.End == end);
            string at = m.JointAt(end);
            if (f is null) return $"at {at} nothing claimed";
            string fmt = "0.0##";
            double Conv(double cw) => sagging && end == MemberEnd.End ? -cw : cw;
            string claimed = f.Claimed is double cl ? Fmt.Number(units.Units.Moment.FromSi(Conv(cl)), fmt) : "not claimed";
            string rec = f.Recomputed is double r ? Fmt.Number(units.Units.Moment.FromSi(Conv(r)), "0.00") : "—";
            return $"at {at} claimed {claimed}, recomputed {rec} ({f.Status.Json()})";
        }
        string convention = sagging ? "sagging positive, as the submission states them" : "clockwise positive, as the submission states them";
        return $"Member {m.Id}, load case {c.Case}, drawn from {m.Start} (left) to {m.End} (right); ordinates below the axis put the member's " +
               $"right-hand fibre (looking from {m.Start} to {m.End}) in tension. Dashed: the diagram the claimed end moments imply with the same loads. " +
               $"End moments [{mu}, {convention}]: {Claim(MemberEnd.Start)}; {Claim(MemberEnd.End)}.";
    }
}
