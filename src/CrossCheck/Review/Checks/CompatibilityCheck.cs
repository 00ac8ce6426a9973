using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Checks;

/// <summary>
/// Compatibility: the claimed moments must fit one set of joint rotations and chord rotations through the
/// slope-deflection equations (Hibbeler, Structural Analysis, slope-deflection equations; from memory):
/// M_ab = FEM_ab + (2EI/L)(2θa + θb − 3ψ); with the far-end moment known exactly (a hinge, or a single member at a
/// pin, roller or free end, where statics gives it) M_ab = FEM_ab + (M_ba − FEM_ba)/2 + (3EI/L)(θa − ψ). Catches a
/// wrong relative stiffness or distribution factor even when every joint balances. Ends whose moment statics gives
/// exactly are checked by <see cref="ReleasedEndCheck"/>, not here.
/// </summary>
internal sealed class CompatibilityCheck : IClaimCheck
{
    /// <summary>Most claims the check sets aside (and flags) in one case.</summary>
    private const int MaxFlags = 25;

    private sealed record Equation(Dictionary<int, double> Coef, double Rhs, Member Member, MemberEnd End, ClaimedEndMoment Claim);

    public void Run(CheckContext x, List<Flag> flags)
    {
        var rows = Equations(x);
        if (rows.Count == 0) return;
        // Unknowns numbered in the order they are met; a coefficient that cancels to zero leaves its unknown out.
        var col = new Dictionary<int, int>();
        var equations = rows.Select(r =>
        {
            var used = r.Coef.Where(kv => kv.Value != 0).ToList();
            foreach (var (u, _) in used) col.TryAdd(u, col.Count);
            return new SparseEquation(used.Select(kv => col[kv.Key]).ToArray(), used.Select(kv => kv.Value).ToArray(), r.Rhs);
        }).ToList();
        // Robust fit: repeatedly set aside the claim whose deletion residual (its misfit when the other claims decide
        // the rotations) is largest, so that one wrong claim is pinned on itself and not smeared over its neighbours.
        // One sparse fit, each claim set aside as a rank-one downdate of it (SparseLeastSquares): the same residuals and
        // leverages as refitting from scratch, at the cost of one solve.
        var fit = SparseLeastSquares.Fit(equations, col.Count);
        var culprits = new List<(int Row, double Error)>();
        // Past a few dozen wrong claims the author has a general problem, which the flags already raised and the
        // comparison show.
        while (fit.ActiveCount > 0 && culprits.Count < MaxFlags && fit.Rank < fit.ActiveCount)
        {
            // The claim whose removal reduces the squared misfit most (r²/(1 − h)) is the likeliest wrong one;
            // its deletion residual r/(1 − h) is how far it is from what the other claims imply. Claims that score
            // alike to round-off go in their order.
            int worst = -1;
            double worstError = 0, bestScore = 0;
            for (int k = 0; k < rows.Count; k++)
            {
                if (!fit.IsActive(k)) continue;
                double h = fit.Leverage[k];
                if (h > 1 - 1e-6) continue; // nothing else checks this claim
                double r = fit.Residual[k];
                double score = r * r / (1 - h);
                if (score > bestScore * (1 + 1e-9)) { bestScore = score; worstError = -r / (1 - h); worst = k; } // claimed − implied
            }
            if (worst < 0 || x.Band.Grade(worstError) == Severity.Info) break;
            culprits.Add((worst, worstError));
            fit.Remove(worst);
        }
        foreach (var (rowIndex, error) in culprits)
        {
            var row = rows[rowIndex];
            string joint = row.Member.JointAt(row.End);
            var place = new MemberEndPlace(row.Member.Id, joint, row.End);
            flags.Add(new Flag(FlagKind.Compatibility, x.Band.Grade(error), place, error,
                ReviewMessages.Incompatible(place.Short, x.Quote.Claim(row.Claim), x.Quote.EndMoment(row.Claim.Moment - error, row.End)),
                [row.Claim.Source])
            {
                Ends = [new EndKey(row.Member.Id, row.End)],
                Brief = ReviewMessages.IncompatibleBrief(place.Short, x.Quote.Moment(Math.Abs(error))),
            });
        }
    }

    /// <summary>The moment statics gives exactly at an end: zero at a hinge; the applied couple where a single member meets a joint free to rotate.</summary>
    private static double? Known(CheckContext x, Member m, MemberEnd end)
    {
        if (m.IsReleased(end)) return 0;
        var j = x.Model.Joint(m.JointAt(end));
        if (j.Restraint.HasFlag(Restraint.Rotation) || x.Model.MembersAt(j.Id).Count() != 1) return null;
        return x.AppliedCouple(j.Id);
    }

    private static List<Equation> Equations(CheckContext x)
    {
        var rows = new List<Equation>();
        foreach (var m in x.Model.Members)
        {
            double? knownStart = Known(x, m, MemberEnd.Start), knownEnd = Known(x, m, MemberEnd.End);
            if (knownStart is not null && knownEnd is not null) continue; // statically determinate: nothing to fit
            var (_, _, L) = x.Statics.Geometry(m);
            double ei = m.E * m.I;
            var (fs, fe) = x.Statics.FixedEndMoments(x.Case.Id, m);
            var psi = x.Kinematics.ChordRotation(m);
            var ta = x.Kinematics.JointRotation(m.Start);
            var tb = x.Kinematics.JointRotation(m.End);
            foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
            {
                double? knownHere = end == MemberEnd.Start ? knownStart : knownEnd;
                if (knownHere is not null || !x.Claims.TryGetValue(new EndKey(m.Id, end), out var cl)) continue;
                var near = end == MemberEnd.Start ? ta : tb;
                var far = end == MemberEnd.Start ? tb : ta;
                double femNear = end == MemberEnd.Start ? fs : fe, femFar = end == MemberEnd.Start ? fe : fs;
                double? knownFar = end == MemberEnd.Start ? knownEnd : knownStart;
                var terms = new List<(LinearForm Form, double Factor)>();
                double fem;
                if (knownFar is not double mFar)
                {
                    double k = 2 * ei / L;
                    terms.Add((near, 2 * k)); terms.Add((far, k)); terms.Add((psi, -3 * k));
                    fem = femNear;
                }
                else
                {
                    double k = 3 * ei / L;
                    terms.Add((near, k)); terms.Add((psi, -k));
                    fem = femNear + ((mFar - femFar) / 2);
                }
                var coef = new Dictionary<int, double>();
                double constant = 0;
                foreach (var (form, factor) in terms)
                {
                    constant += factor * form.Constant;
                    foreach (var (q, v) in form.Terms) coef[q] = coef.GetValueOrDefault(q) + (factor * v);
                }
                rows.Add(new Equation(coef, cl.Moment - fem - constant, m, end, cl));
            }
        }
        return rows;
    }
}
