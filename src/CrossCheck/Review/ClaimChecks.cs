using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;
using MathNet.Numerics.LinearAlgebra;

namespace CrossCheck.Review;

/// <summary>
/// Checks of the claimed numbers on their own — equilibrium, released ends, storey shear, compatibility,
/// reactions and symmetry — using only statics, kinematics and the submission's own data, never the
/// recomputed answer. They tell the author *what kind* of error is in the claims.
/// </summary>
internal sealed class ClaimChecks
{
    private readonly Submission _s;
    private readonly StructureModel _model;
    private readonly ClaimStatics _statics;
    private readonly Kinematics _kinematics;
    private readonly ReviewOptions _options;
    private readonly UnitChoice _mu;
    private readonly UnitChoice _fu;

    public ClaimChecks(Submission submission, ReviewOptions options)
    {
        _s = submission;
        _model = submission.Model;
        _options = options;
        _statics = new ClaimStatics(submission);
        _kinematics = new Kinematics(submission.Model);
        _mu = submission.Info.Units.Moment;
        _fu = submission.Info.Units.Force;
    }

    private string M(double si) => $"{N(_mu.FromSi(si))} {_mu.Symbol}";
    private string F(double si) => $"{N(_fu.FromSi(si))} {_fu.Symbol}";
    private static string N(double v) => Fmt.Number(v, "0.0#");

    private sealed record Tolerances(double Agree, double Minor);

    public List<Flag> Run(string caseId)
    {
        var claims = _s.Claims.EndMoments.Where(c => c.Case == caseId && c.End is not null)
            .ToDictionary(c => (c.Member, c.End!.Value));
        var flags = new List<Flag>();
        if (claims.Count == 0) return flags;
        double peak = claims.Values.Max(c => Math.Abs(c.Moment));
        var tol = new Tolerances(
            Math.Max(_options.AbsoluteTolerance * _mu.ToSi, _options.RelativeTolerance * peak),
            Math.Max(_options.AbsoluteTolerance * _mu.ToSi, _options.MinorRelativeTolerance * peak));
        var loadCase = _s.Case(caseId) ?? new LoadCase(caseId, []);
        JointEquilibrium(loadCase, claims, tol, flags);
        ReleasedEnds(loadCase, claims, tol, flags);
        StoreyShear(loadCase, claims, tol, flags);
        Compatibility(loadCase, claims, tol, flags);
        ReactionsAgainstLoads(loadCase, tol, flags);
        Symmetry(loadCase, claims, tol, flags);
        return flags;
    }

    private static Severity Grade(double error, Tolerances tol) =>
        Math.Abs(error) <= tol.Agree ? Severity.Info : Math.Abs(error) <= tol.Minor ? Severity.Minor : Severity.Major;

    private double AppliedCouple(LoadCase c, string joint) => c.Loads.OfType<JointCouple>().Where(l => l.Joint == joint).Sum(l => l.M);

    private void JointEquilibrium(LoadCase c, Dictionary<(string, MemberEnd), ClaimedEndMoment> claims, Tolerances tol, List<Flag> flags)
    {
        foreach (var j in _model.Joints)
        {
            if (j.Restraint.HasFlag(Restraint.Rotation)) continue;
            var ends = _model.MembersAt(j.Id).Select(m => (Member: m, End: m.EndAt(j.Id)!.Value)).ToList();
            if (ends.Count < 2) continue; // single members: see released ends
            double sum = 0;
            var sources = new List<SourceRef>();
            bool complete = true;
            foreach (var (m, e) in ends)
            {
                if (claims.TryGetValue((m.Id, e), out var cl)) { sum += cl.Moment; sources.Add(cl.Source); }
                else if (!m.IsReleased(e)) { complete = false; break; }
            }
            if (!complete || sources.Count == 0) continue;
            double applied = AppliedCouple(c, j.Id);
            double error = sum - applied;
            var sev = Grade(error, tol);
            if (sev == Severity.Info) continue;
            string what = applied == 0 ? "zero (no couple is applied there)" : $"the applied couple {M(applied)}";
            flags.Add(new Flag(FlagKind.JointEquilibrium, sev, $"joint {j.Id}", error,
                $"The claimed member-end moments at joint {j.Id} sum to {M(sum)} but must sum to {what}: the joint is out of balance by {M(error)}. " +
                "A joint that does not balance points to an arithmetic or copying slip in the distribution.",
                sources));
        }
    }

    private void ReleasedEnds(LoadCase c, Dictionary<(string, MemberEnd), ClaimedEndMoment> claims, Tolerances tol, List<Flag> flags)
    {
        // Hinged member ends carry no moment.
        foreach (var m in _model.Members)
            foreach (var e in new[] { MemberEnd.Start, MemberEnd.End })
            {
                if (!m.IsReleased(e) || !claims.TryGetValue((m.Id, e), out var cl)) continue;
                var sev = Grade(cl.Moment, tol);
                if (sev == Severity.Info) continue;
                flags.Add(new Flag(FlagKind.ReleasedEnd, sev, $"member {m.Id} at {m.JointAt(e)}", cl.Moment,
                    $"Member {m.Id} is hinged at {m.JointAt(e)}, so its moment there must be zero; the claim is {M(cl.Moment)}.", [cl.Source]));
            }
        // A joint with one member and no rotational restraint (pin, roller, free end): the end moment equals the applied couple.
        foreach (var j in _model.Joints)
        {
            if (j.Restraint.HasFlag(Restraint.Rotation)) continue;
            var members = _model.MembersAt(j.Id).ToList();
            if (members.Count != 1) continue;
            var m = members[0];
            var e = m.EndAt(j.Id)!.Value;
            if (m.IsReleased(e) || !claims.TryGetValue((m.Id, e), out var cl)) continue;
            double applied = AppliedCouple(c, j.Id);
            double error = cl.Moment - applied;
            var sev = Grade(error, tol);
            if (sev == Severity.Info) continue;
            string kind = j.Restraint == Restraint.Free ? "a free end" : "a pinned or roller support with a single member";
            flags.Add(new Flag(FlagKind.ReleasedEnd, sev, $"member {m.Id} at {j.Id}", error,
                $"Joint {j.Id} is {kind}, so member {m.Id} must have {(applied == 0 ? "zero moment" : "the applied couple " + M(applied))} there; the claim is {M(cl.Moment)}.",
                [cl.Source]));
        }
        // The root of an overhang carries the statical cantilever moment of its own loads.
        foreach (var m in _model.Members)
        {
            foreach (var tipEnd in new[] { MemberEnd.Start, MemberEnd.End })
            {
                var tip = _model.Joint(m.JointAt(tipEnd));
                if (tip.Restraint != Restraint.Free || _model.MembersAt(tip.Id).Count() != 1) continue;
                var rootEnd = tipEnd == MemberEnd.Start ? MemberEnd.End : MemberEnd.Start;
                var root = _model.Joint(m.JointAt(rootEnd));
                if (_model.MembersAt(root.Id).Count() == 1 && root.Restraint == Restraint.Free) continue;
                if (!claims.TryGetValue((m.Id, rootEnd), out var cl)) continue;
                double statical = 0;
                foreach (var load in c.Loads)
                {
                    bool onIt = load is MemberLoad ml && ml.Member == m.Id || load is JointLoad jl && jl.Joint == tip.Id;
                    if (!onIt) continue;
                    statical += _statics.Resultant(load, root.X, root.Y).Moment;
                }
                if (m.IsReleased(rootEnd)) continue;
                double error = cl.Moment - statical;
                var sev = Grade(error, tol);
                if (sev == Severity.Info) continue;
                flags.Add(new Flag(FlagKind.ReleasedEnd, sev, $"member {m.Id} at {root.Id}", error,
                    $"Member {m.Id} is an overhang (cantilever) from {root.Id}: statics alone give {M(statical)} at {root.Id} from its own loads, but the claim is {M(cl.Moment)}.",
                    [cl.Source]));
            }
        }
    }

    private void StoreyShear(LoadCase c, Dictionary<(string, MemberEnd), ClaimedEndMoment> claims, Tolerances tol, List<Flag> flags)
    {
        double size = Math.Max(1, _model.Joints.Max(j => Math.Abs(j.Y)) - _model.Joints.Min(j => Math.Abs(j.Y)));
        var levels = _model.Joints.Select(j => j.Y).Order().ToList();
        var distinct = new List<double>();
        foreach (var y in levels) if (distinct.Count == 0 || y - distinct[^1] > 1e-6 * size) distinct.Add(y);
        int storey = 0;
        for (int k = 0; k + 1 < distinct.Count; k++)
        {
            double yCut = (distinct[k] + distinct[k + 1]) / 2;
            var crossing = _model.Members.Where(m =>
            {
                double y1 = _model.Joint(m.Start).Y, y2 = _model.Joint(m.End).Y;
                return Math.Min(y1, y2) < yCut && Math.Max(y1, y2) > yCut;
            }).ToList();
            if (crossing.Count == 0) continue;
            storey++;
            // Only vertical members crossing, and nothing above the cut held horizontally.
            if (crossing.Any(m => Math.Abs(_statics.Geometry(m).Cos) > 1e-9)) continue;
            if (_model.Joints.Any(j => j.Y > yCut && j.Restraint.HasFlag(Restraint.X))) continue;
            double columnShear = 0, invLengths = 0;
            var sources = new List<SourceRef>();
            bool complete = true;
            foreach (var m in crossing)
            {
                var (_, sin, L) = _statics.Geometry(m);
                double m1 = 0, m2 = 0;
                foreach (var e in new[] { MemberEnd.Start, MemberEnd.End })
                {
                    if (claims.TryGetValue((m.Id, e), out var cl)) { if (e == MemberEnd.Start) m1 = cl.Moment; else m2 = cl.Moment; sources.Add(cl.Source); }
                    else if (!m.IsReleased(e)) complete = false;
                }
                if (!complete) break;
                double sCut = (yCut - _model.Joint(m.Start).Y) / sin;
                double v1 = _statics.StartShear(c.Id, m, m1, m2);
                // Horizontal force on the part above the cut, whatever the member's direction.
                columnShear += -(v1 + _statics.TransverseLoadBefore(c.Id, m, sCut));
                invLengths += 2 / L;
            }
            if (!complete) continue;
            double lateral = 0, lateralAbs = 0;
            foreach (var load in c.Loads)
            {
                double fx = load switch
                {
                    JointForce jf when _model.Joint(jf.Joint).Y > yCut => _statics.Resultant(jf, 0, 0).Fx,
                    MemberLoad ml when _model.TryGetMember(ml.Member, out var mm) => ml is MemberCouple ? 0 : PartAbove(c.Id, mm, ml, yCut),
                    _ => 0,
                };
                lateral += fx;
                lateralAbs += Math.Abs(fx);
            }
            double residual = lateral + columnShear;
            double agree = (tol.Agree * invLengths) + (_options.RelativeTolerance * lateralAbs);
            double minor = (tol.Minor * invLengths) + (_options.MinorRelativeTolerance * lateralAbs);
            double err = Math.Abs(residual);
            if (err <= agree) continue;
            var sev = err <= minor ? Severity.Minor : Severity.Major;
            string where = string.Create(CultureInfo.InvariantCulture, $"storey {storey} (y {N(distinct[k])} to {N(distinct[k + 1])} {_s.Info.Units.Length.Symbol})");
            flags.Add(new Flag(FlagKind.StoreyShear, sev, where, residual,
                $"Across {where} the column shears implied by the claimed end moments add up to {F(-columnShear)}, but the horizontal load above " +
                $"needs {F(lateral)}: {F(residual)} of lateral load is not carried by the columns. This is what an analysis that ignores sidesway produces.",
                sources));
        }
    }

    private double PartAbove(string caseId, Member m, MemberLoad load, double yCut)
    {
        double y1 = _model.Joint(m.Start).Y, y2 = _model.Joint(m.End).Y;
        if (Math.Min(y1, y2) > yCut) return _statics.Resultant(load, 0, 0).Fx;
        if (Math.Max(y1, y2) <= yCut) return 0;
        // Member crosses the cut: only the part of this load above it.
        var single = new Submission(_s.Source, _s.Info, _model, [new LoadCase("·", [load with { Case = "·" }])], _s.Claims);
        return new ClaimStatics(single).HorizontalLoadAbove("·", m, yCut);
    }

    private void Compatibility(LoadCase c, Dictionary<(string, MemberEnd), ClaimedEndMoment> claims, Tolerances tol, List<Flag> flags)
    {
        // Slope-deflection (clockwise): M_ab = FEM_ab + (2EI/L)(2θa + θb − 3ψ), or with the far end hinged
        // M_ab = (FEM_ab − ½FEM_ba) + (3EI/L)(θa − ψ). Each claimed moment is one equation in the joint rotations
        // and chord rotations the supports and rigid members allow (Kinematics); the claims are compatible when one
        // set of rotations reproduces them all.
        var rows = new List<Equation>();
        foreach (var m in _model.Members)
        {
            if (m.Hinge == Hinge.Both) continue;
            var (_, _, L) = _statics.Geometry(m);
            double ei = m.E * m.I;
            var (fs, fe) = _statics.FixedEndMoments(c.Id, m);
            var psi = _kinematics.ChordRotation(m);
            var ta = _kinematics.JointRotation(m.Start);
            var tb = _kinematics.JointRotation(m.End);
            foreach (var end in new[] { MemberEnd.Start, MemberEnd.End })
            {
                if (m.IsReleased(end) || !claims.TryGetValue((m.Id, end), out var cl)) continue;
                var near = end == MemberEnd.Start ? ta : tb;
                var far = end == MemberEnd.Start ? tb : ta;
                double femNear = end == MemberEnd.Start ? fs : fe, femFar = end == MemberEnd.Start ? fe : fs;
                var terms = new List<(LinearForm Form, double Factor)>();
                double fem;
                if (m.Hinge == Hinge.None)
                {
                    double k = 2 * ei / L;
                    terms.Add((near, 2 * k)); terms.Add((far, k)); terms.Add((psi, -3 * k));
                    fem = femNear;
                }
                else
                {
                    double k = 3 * ei / L;
                    terms.Add((near, k)); terms.Add((psi, -k));
                    fem = femNear - (femFar / 2);
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
        if (rows.Count == 0) return;
        var unknowns = rows.SelectMany(r => r.Coef.Keys).Distinct().Order().ToList();
        var col = unknowns.Select((u, i) => (u, i)).ToDictionary(x => x.u, x => x.i);
        // Robust fit: repeatedly set aside the claim whose deletion residual (its misfit when the other claims decide
        // the rotations) is largest, so that one wrong claim is pinned on itself and not smeared over its neighbours.
        var active = Enumerable.Range(0, rows.Count).ToList();
        var culprits = new List<(int Row, double Error)>();
        // Each step is a full least-squares fit; past a few dozen wrong claims the author has a general problem, which the
        // flags already raised and the comparison show, and more steps would only make a large frame's review slow.
        while (active.Count > 0 && culprits.Count < MaxCompatibilityFlags)
        {
            var fit = Fit(rows, active, unknowns.Count, col);
            if (fit is null) break;
            // The claim whose removal reduces the squared misfit most (r²/(1 − h)) is the likeliest wrong one;
            // its deletion residual r/(1 − h) is how far it is from what the other claims imply.
            int worst = -1; double worstError = 0, bestScore = 0;
            for (int k = 0; k < active.Count; k++)
            {
                double h = fit.Value.Leverage[k];
                if (h > 1 - 1e-6) continue; // nothing else checks this claim
                double r = fit.Value.Residual[k];
                double score = r * r / (1 - h);
                if (score > bestScore) { bestScore = score; worstError = -r / (1 - h); worst = k; } // claimed − implied
            }
            if (worst < 0 || Grade(worstError, tol) == Severity.Info) break;
            culprits.Add((active[worst], worstError));
            active.RemoveAt(worst);
        }
        foreach (var (rowIndex, error) in culprits)
        {
            var row = rows[rowIndex];
            string joint = row.Member.JointAt(row.End);
            double expected = row.Claim.Moment - error;
            flags.Add(new Flag(FlagKind.Compatibility, Grade(error, tol), $"member {row.Member.Id} at {joint}", error,
                $"Compatibility: the joint rotations that the other claimed moments imply (through the slope-deflection equations with the submission's E, I, L " +
                $"and fixed-end moments) give {M(expected)} for member {row.Member.Id} at {joint}, but {M(row.Claim.Moment)} is claimed. Equilibrium alone does not catch this: " +
                "check this member's stiffness (I/L, not I), the distribution factors at the joint and the member's fixed-end moments.",
                [row.Claim.Source]));
        }
    }

    /// <summary>Most claims the compatibility check sets aside (and flags) in one case.</summary>
    private const int MaxCompatibilityFlags = 25;

    private sealed record Equation(Dictionary<int, double> Coef, double Rhs, Member Member, MemberEnd End, ClaimedEndMoment Claim);

    /// <summary>Least squares over the active equations (SVD, rank-revealing); null when nothing is redundant.</summary>
    private static (double[] Residual, double[] Leverage)? Fit(List<Equation> rows, List<int> active, int unknowns, Dictionary<int, int> col)
    {
        var A = Matrix<double>.Build.Dense(active.Count, Math.Max(unknowns, 1));
        var b = Vector<double>.Build.Dense(active.Count);
        for (int k = 0; k < active.Count; k++)
        {
            var r = rows[active[k]];
            foreach (var (u, v) in r.Coef) A[k, col[u]] = v;
            b[k] = r.Rhs;
        }
        var svd = A.Svd(true);
        var s = svd.S;
        double cut = Math.Max(s.Count > 0 ? s[0] : 0, 1e-300) * 1e-10;
        int rank = s.Count(v => v > cut);
        if (rank >= active.Count) return null;
        var utb = svd.U.TransposeThisAndMultiply(b);
        var y = Vector<double>.Build.Dense(A.ColumnCount);
        for (int i = 0; i < s.Count; i++) if (s[i] > cut) y[i] = utb[i] / s[i];
        var x = svd.VT.TransposeThisAndMultiply(y);
        var residual = (A * x) - b;
        var leverage = new double[active.Count];
        for (int k = 0; k < active.Count; k++)
            for (int i = 0; i < rank; i++) leverage[k] += svd.U[k, i] * svd.U[k, i];
        return (residual.ToArray(), leverage);
    }

    private void ReactionsAgainstLoads(LoadCase c, Tolerances tol, List<Flag> flags)
    {
        var claimed = _s.Claims.Reactions.Where(r => r.Case == c.Id).ToList();
        if (claimed.Count == 0) return;
        double fx = 0, fy = 0, mo = 0, scale = 0;
        var sources = new List<SourceRef>();
        foreach (var j in _model.Joints.Where(j => j.IsSupport))
        {
            var r = claimed.FirstOrDefault(x => x.Joint == j.Id);
            bool needX = j.Restraint.HasFlag(Restraint.X), needY = j.Restraint.HasFlag(Restraint.Y), needM = j.Restraint.HasFlag(Restraint.Rotation);
            if (r is null || (needY && r.Ry is null) || (needX && r.Rx is null && !IsHorizontalIdle(c)) || (needM && r.M is null)) return; // incomplete: no check
            double rx = r.Rx ?? 0, ry = r.Ry ?? 0, rm = r.M ?? 0;
            fx += rx; fy += ry; mo += (j.X * ry) - (j.Y * rx) - rm;
            scale += Math.Abs(rx) + Math.Abs(ry);
            sources.Add(r.Source);
        }
        foreach (var load in c.Loads)
        {
            var (lx, ly, lm) = _statics.Resultant(load, 0, 0);
            fx += lx; fy += ly; mo += lm;
            scale += Math.Abs(lx) + Math.Abs(ly);
        }
        double fTol = Math.Max(_options.AbsoluteTolerance * _fu.ToSi, _options.RelativeTolerance * scale / 2);
        double fMinor = Math.Max(_options.AbsoluteTolerance * _fu.ToSi, _options.MinorRelativeTolerance * scale / 2);
        foreach (var (name, value) in new[] { ("horizontal", fx), ("vertical", fy) })
        {
            if (Math.Abs(value) <= fTol) continue;
            var sev = Math.Abs(value) <= fMinor ? Severity.Minor : Severity.Major;
            flags.Add(new Flag(FlagKind.Reaction, sev, $"{name} equilibrium", value,
                $"The claimed reactions do not balance the loads {name}ly: the sum of reactions and loads is {F(value)} instead of zero.", sources, ValueKind.Force));
        }
        double size = _model.Joints.Max(j => Math.Abs(j.X) + Math.Abs(j.Y)) + 1;
        if (Math.Abs(mo) > Math.Max(tol.Agree, fTol * size))
        {
            var sev = Math.Abs(mo) <= Math.Max(tol.Minor, fMinor * size) ? Severity.Minor : Severity.Major;
            flags.Add(new Flag(FlagKind.Reaction, sev, "moment equilibrium", mo,
                $"The claimed reactions and the loads are out of moment balance by {M(mo)} (about the origin).", sources));
        }
    }

    private static bool IsHorizontalIdle(LoadCase c) => c.Loads.All(l => l switch
    {
        PointLoad p => p.Direction is LoadDirection.Up or LoadDirection.Down,
        DistributedLoad d => d.Direction is LoadDirection.Up or LoadDirection.Down,
        JointForce f => f.Direction is LoadDirection.Up or LoadDirection.Down,
        _ => true,
    });

    private void Symmetry(LoadCase c, Dictionary<(string, MemberEnd), ClaimedEndMoment> claims, Tolerances tol, List<Flag> flags)
    {
        var mirror = SymmetryFinder.Find(_model, c);
        if (mirror is null) return;
        var done = new HashSet<(string, MemberEnd)>();
        foreach (var ((member, end), cl) in claims)
        {
            var (m2, e2) = mirror.Map(member, end);
            if (done.Contains((member, end)) || !claims.TryGetValue((m2, e2), out var other)) continue;
            done.Add((m2, e2));
            done.Add((member, end));
            if (m2 == member && e2 == end) continue;
            double error = cl.Moment + other.Moment; // mirror images have opposite clockwise moments
            var sev = Grade(error, tol);
            if (sev == Severity.Info) continue;
            flags.Add(new Flag(FlagKind.Symmetry, sev, $"{member} at {_model.Member(member).JointAt(end)} / {m2} at {_model.Member(m2).JointAt(e2)}", error,
                $"Structure and loads of case {c.Id} are symmetric, so the moment of {member} at {_model.Member(member).JointAt(end)} ({M(cl.Moment)}) " +
                $"should be the mirror image of {m2} at {_model.Member(m2).JointAt(e2)} ({M(other.Moment)}), equal and opposite in the clockwise convention.",
                [cl.Source, other.Source]));
        }
    }
}
