using System.Globalization;
using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// Across a cut through a storey of vertical columns, the column shears implied by the claimed end moments (statics of
/// each column with its own loads) must carry the horizontal load above the cut (common practice: the storey shear
/// equation of the sway correction in moment distribution).
/// </summary>
internal sealed class StoreyShearCheck : IClaimCheck
{
    public void Run(CheckContext x, List<Flag> flags)
    {
        var model = x.Model;
        double size = Math.Max(1, model.Joints.Max(j => Math.Abs(j.Y)) - model.Joints.Min(j => Math.Abs(j.Y)));
        var distinct = new List<double>();
        foreach (var y in model.Joints.Select(j => j.Y).Order())
            if (distinct.Count == 0 || y - distinct[^1] > 1e-6 * size) distinct.Add(y);
        int storey = 0;
        for (int k = 0; k + 1 < distinct.Count; k++)
        {
            double yCut = (distinct[k] + distinct[k + 1]) / 2;
            var crossing = model.Members.Where(m =>
            {
                double y1 = model.Joint(m.Start).Y, y2 = model.Joint(m.End).Y;
                return Math.Min(y1, y2) < yCut && Math.Max(y1, y2) > yCut;
            }).ToList();
            if (crossing.Count == 0) continue;
            storey++;
            // Only vertical members crossing, and nothing above the cut held horizontally.
            if (crossing.Any(m => Math.Abs(x.Statics.Geometry(m).Cos) > 1e-9)) continue;
            if (model.Joints.Any(j => j.Y > yCut && j.Restraint.HasFlag(Restraint.X))) continue;
            if (ColumnShear(x, crossing, yCut) is not { } carried) continue;
            var (lateral, lateralAbs) = LateralAbove(x, yCut);
            double residual = lateral + carried.Shear;
            // The moment bands spread over the columns' lever arms, plus the relative band of the load itself.
            double agree = (x.Band.Agree * carried.InverseLengths) + (x.Options.RelativeTolerance * lateralAbs);
            double minor = (x.Band.Minor * carried.InverseLengths) + (x.Options.MinorRelativeTolerance * lateralAbs);
            var sev = new ToleranceBand(agree, minor).Grade(residual);
            if (sev == Severity.Info) continue;
            var u = x.Submission.Info.Units.Length;
            string range = string.Create(CultureInfo.InvariantCulture,
                $"y {Fmt.Number(u.FromSi(distinct[k]), "0.0#")} to {Fmt.Number(u.FromSi(distinct[k + 1]), "0.0#")} {u.Symbol}");
            var place = new StoreyPlace(storey, range);
            flags.Add(new Flag(FlagKind.StoreyShear, sev, place, residual,
                ReviewMessages.StoreyShear(place.Words, x.Quote.Force(-carried.Shear), x.Quote.Force(lateral), x.Quote.Force(residual)),
                carried.Used.Select(c => c.Source).ToList(), ValueKind.Force)
            {
                Ends = carried.Used.Select(c => new EndKey(c.Member, c.End!.Value)).ToList(),
                Brief = ReviewMessages.StoreyShearBrief(place.Words, x.Quote.Force(residual)),
            });
        }
    }

    private sealed record Carried(double Shear, double InverseLengths, List<ClaimedEndMoment> Used);

    /// <summary>The horizontal force the columns' claimed end moments put on the part above the cut; null when a column end is not claimed.</summary>
    private static Carried? ColumnShear(CheckContext x, List<Member> crossing, double yCut)
    {
        double shear = 0, invLengths = 0;
        var used = new List<ClaimedEndMoment>();
        foreach (var m in crossing)
        {
            var (_, sin, L) = x.Statics.Geometry(m);
            double m1 = 0, m2 = 0;
            foreach (var e in new[] { MemberEnd.Start, MemberEnd.End })
            {
                if (x.Claims.TryGetValue(new EndKey(m.Id, e), out var cl))
                {
                    if (e == MemberEnd.Start) m1 = cl.Moment; else m2 = cl.Moment;
                    used.Add(cl);
                }
                else if (!m.IsReleased(e)) return null;
            }
            double sCut = (yCut - x.Model.Joint(m.Start).Y) / sin;
            double v1 = x.Statics.StartShear(x.Case.Id, m, m1, m2);
            // Horizontal force on the part above the cut, whatever the member's direction.
            shear += -(v1 + x.Statics.TransverseLoadBefore(x.Case.Id, m, sCut));
            invLengths += 2 / L;
        }
        return new Carried(shear, invLengths, used);
    }

    private static (double Lateral, double LateralAbs) LateralAbove(CheckContext x, double yCut)
    {
        double lateral = 0, lateralAbs = 0;
        foreach (var load in x.Case.Loads)
        {
            double fx = load switch
            {
                JointForce jf when x.Model.Joint(jf.Joint).Y > yCut => x.Statics.Resultant(jf, 0, 0).Fx,
                MemberLoad ml when x.Model.TryGetMember(ml.Member, out var mm) => ml.Shape() is ConcentratedCouple ? 0 : PartAbove(x, mm, ml, yCut),
                _ => 0,
            };
            lateral += fx;
            lateralAbs += Math.Abs(fx);
        }
        return (lateral, lateralAbs);
    }

    private static double PartAbove(CheckContext x, Member m, MemberLoad load, double yCut)
    {
        double y1 = x.Model.Joint(m.Start).Y, y2 = x.Model.Joint(m.End).Y;
        if (Math.Min(y1, y2) > yCut) return x.Statics.Resultant(load, 0, 0).Fx;
        if (Math.Max(y1, y2) <= yCut) return 0;
        // Member crosses the cut: only the part of this load above it.
        var s = x.Submission;
        var single = new Submission(s.Source, s.Info, s.Model, [new LoadCase("·", [load with { Case = "·" }])], s.Claims);
        return new ClaimStatics(single).HorizontalLoadAbove("·", m, yCut);
    }
}
