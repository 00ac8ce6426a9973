using System.Globalization;
using CrossCheck.Analysis;
using CrossCheck.Common;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// Explains the discrepancies of a load case by testing hypotheses about the author's mistake. Every hypothesis
/// recomputes the moments the author would have claimed had they made that mistake — from an altered model, an
/// altered method (moment distribution stopped early, a wrong carry-over factor), or a transformation of the
/// correct answer — and is scored by how much of the difference between claims and recomputed moments it
/// accounts for. Nothing is looked up or hard-coded: a cause is reported only when its recomputation matches.
/// </summary>
public sealed class Diagnoser
{
    /// <summary>Known factors between moment units, for the unit-scale hypothesis.</summary>
    private static readonly (double Factor, string Meaning)[] UnitFactors =
    [
        (1000, "a factor of 1000 (N·m written as kN·m, or kN·mm as kN·m)"),
        (1e6, "a factor of 10⁶ (N·mm written as kN·m)"),
        (12, "a factor of 12 (kip·in written as kip·ft)"),
        (1.3558179483314, "the kip·ft to kN·m factor 1.3558 (kN·m given where kip·ft was declared, or the reverse)"),
        (4.4482216152605, "the kip to kN factor 4.448"),
        (3.28083989501312, "the metre to foot factor 3.281"),
        (9.80665, "g = 9.81 (kgf or tonne-force mixed with kN)"),
        (100, "a factor of 100 (cm mixed with m)"),
        (10, "a factor of 10"),
    ];

    private readonly Submission _s;
    private readonly AnalysisResult _analysis;
    private readonly ReviewOptions _o;
    private readonly FrameSolver _solver = new();

    public Diagnoser(Submission submission, AnalysisResult analysis, ReviewOptions options)
    {
        _s = submission;
        _analysis = analysis;
        _o = options;
    }

    /// <param name="ConfidenceCap">Upper bound on confidence for hypotheses with fitted parameters (they fit more easily).</param>
    private sealed record Hypothesis(string Code, int Simplicity, double[] Predicted, string Message, string Evidence = "", double ConfidenceCap = 1);

    /// <summary>Likely causes of the case's discrepancies, best first; empty when nothing explains them.</summary>
    public IReadOnlyList<Cause> Diagnose(CaseReview review)
    {
        var ends = review.EndMoments.Where(e => e.Claimed is not null && e.Recomputed is not null && e.End is not null).ToList();
        if (ends.Count < 2) return [];
        var keys = ends.Select(e => (e.Member, e.End!.Value)).ToList();
        double[] c = ends.Select(e => e.Claimed!.Value).ToArray();
        double[] r = ends.Select(e => e.Recomputed!.Value).ToArray();
        double res0 = Norm2(c, r);
        double maxRes0 = MaxAbs(c, r);
        if (maxRes0 <= review.AgreeTolerance) return [];
        var loadCase = _s.Case(review.Case);
        if (loadCase is null) return [];

        var hypotheses = new List<Hypothesis>();
        void Try(Func<IEnumerable<Hypothesis>> make)
        {
            try { hypotheses.AddRange(make()); }
            catch (Exception ex) when (ex is StructureException or NotSupportedException or ArgumentException or InvalidOperationException)
            {
                // A hypothesis that cannot be formed for this structure (e.g. a mechanism) simply does not apply.
            }
        }
        var ctx = new Context(this, loadCase, ends, keys, c, r, review);
        Try(() => WorkingSlip(ctx));
        Try(() => Transformations(ctx));
        Try(() => CopyingSlips(ctx));
        Try(() => SwayOmitted(ctx));
        Try(() => StiffnessWithoutLength(ctx));
        Try(() => FarEndFixity(ctx));
        Try(() => FixedEndMoments(ctx));
        Try(() => CarryOver(ctx));
        Try(() => StoppedEarly(ctx));
        Try(() => LoadMisplaced(ctx));
        Try(() => HingesAndSettlement(ctx));

        var scored = hypotheses.Select(h =>
        {
            double res = Norm2(c, h.Predicted);
            double explains = res0 > 0 ? Math.Clamp(1 - (res / res0), 0, 1) : 0;
            double worst = MaxAbs(c, h.Predicted);
            return (H: h, Explains: explains, Worst: worst);
        })
        // A cause must remove most of the difference: all of it to within tolerance, or at least 90 % of it.
        // (Many variants are tried, so a partial fit to scattered errors is not evidence of anything.)
        .Where(x => x.Explains >= 0.5 && (x.Worst <= review.AgreeTolerance || (x.Explains >= 0.9 && x.Worst <= review.MinorTolerance)))
        // Within tolerance, the simplest specific mistake first; otherwise the one that explains most.
        .OrderBy(x => x.Worst <= review.AgreeTolerance ? 0 : x.Worst <= review.MinorTolerance ? 1 : 2)
        .ThenBy(x => x.Worst <= review.AgreeTolerance ? x.H.Simplicity : 0)
        .ThenByDescending(x => Math.Round(x.Explains, 4))
        .ThenBy(x => x.H.Simplicity)
        .ToList();
        // When a mistake reproduces the claims within tolerance, alternatives that do not come close are noise.
        if (scored.Count > 0 && scored[0].Worst <= review.AgreeTolerance)
            scored = scored.Where(x => x.Worst <= review.MinorTolerance).ToList();
        // One entry per code (its best variant); confidence shared between equally good explanations.
        var best = scored.GroupBy(x => x.H.Code).Select(g => g.First()).Take(3).ToList();
        // Equally good specific explanations share the confidence; fitted ones (capped) do not dilute it.
        int fully = best.Count(x => x.Worst <= review.AgreeTolerance && x.H.ConfidenceCap >= 1);
        return best.Select(x =>
        {
            double confidence = x.Worst <= review.AgreeTolerance ? 0.95 / Math.Max(1, fully)
                : x.Worst <= review.MinorTolerance ? 0.7 * x.Explains
                : 0.5 * x.Explains;
            confidence = Math.Min(confidence, x.H.ConfidenceCap);
            string fit = x.Worst <= review.AgreeTolerance
                ? "Redoing the analysis with this mistake reproduces every claimed moment within tolerance."
                : string.Create(CultureInfo.InvariantCulture,
                    $"Redoing the analysis with this mistake accounts for {x.Explains * 100:0} % of the differences (largest remaining difference {Moment(x.Worst)}).");
            return new Cause(x.H.Code, Math.Round(confidence, 3), Math.Round(x.Explains, 3), x.H.Message, (fit + " " + x.H.Evidence).Trim());
        }).ToList();
    }

    private string Moment(double si) => $"{Fmt.Number(_s.Info.Units.Moment.FromSi(si), "0.0#")} {_s.Info.Units.Moment.Symbol}";

    private sealed class Context(Diagnoser d, LoadCase loadCase, List<EndMomentFinding> ends, List<(string Member, MemberEnd End)> keys, double[] claimed,
        double[] recomputed, CaseReview review)
    {
        public Diagnoser D { get; } = d;
        public LoadCase Case { get; } = loadCase;
        /// <summary>The ends compared, in the order of <see cref="Keys"/>, <see cref="Claimed"/> and <see cref="Recomputed"/>.</summary>
        public List<EndMomentFinding> Ends { get; } = ends;
        public List<(string Member, MemberEnd End)> Keys { get; } = keys;
        public double[] Claimed { get; } = claimed;
        public double[] Recomputed { get; } = recomputed;
        public CaseReview Review { get; } = review;

        public double[] From(CaseResult result) => Keys.Select(k => result.EndMoment(k.Member, k.End)).ToArray();

        public double[] From(IReadOnlyDictionary<(string Member, MemberEnd End), double> moments) => Keys.Select(k => moments[k]).ToArray();
    }

    // ---- the author's own working -----------------------------------------------------------------------

    private IEnumerable<Hypothesis> WorkingSlip(Context x)
    {
        if (x.Review.Audit is not { First: { } first } audit) yield break;
        // If the slip were the only mistake, the claims would be the recomputed moments plus its knock-on.
        var knock = audit.KnockOns.ToDictionary(k => (k.Member, k.End), k => k.KnockOn);
        var predicted = x.Keys.Select((k, i) => x.Recomputed[i] + knock.GetValueOrDefault(k)).ToArray();
        yield return new Hypothesis("distribution-arithmetic", 1, predicted,
            $"An arithmetic slip in the moment-distribution table: row '{first.Row}', column {first.Column} ({first.Source.Citation}) does not follow from the cells before it, and the error is carried into the final moments.",
            "Correct that cell and carry the distribution on from there.");
    }

    // ---- transformations of the correct answer ------------------------------------------------------

    private IEnumerable<Hypothesis> Transformations(Context x)
    {
        var r = x.Recomputed;
        yield return new Hypothesis("sign-convention", 1, r.Select(v => -v).ToArray(),
            "Every claimed moment has the opposite sign to the analysis: the claims use the opposite sign convention (anticlockwise instead of clockwise, or hogging positive).");
        string declared = _s.Info.SignConvention == SignConvention.Sagging ? "sagging" : "clockwise";
        string other = _s.Info.SignConvention == SignConvention.Sagging ? "clockwise" : "sagging";
        yield return new Hypothesis("sign-convention", 2, x.Keys.Select((k, i) => k.End == MemberEnd.End ? -r[i] : r[i]).ToArray(),
            $"The claimed moments at the end of each member have the wrong sign, those at the start are right: the claims were written in the {other} convention while the submission declares {declared}. Set 'sign convention' in the info table to match the claims, or convert them.");
        foreach (var m in x.Keys.Select(k => k.Member).Distinct())
        {
            yield return new Hypothesis("sign-convention", 3, x.Keys.Select((k, i) => k.Member == m ? -r[i] : r[i]).ToArray(),
                $"The moments of member {m} have the opposite sign; the rest agree. Check the sign convention used for member {m} (for a column, which end is its start).");
            if (x.Keys.Count(k => k.Member == m) == 2)
            {
                int a = x.Keys.IndexOf((m, MemberEnd.Start)), b = x.Keys.IndexOf((m, MemberEnd.End));
                var p = (double[])r.Clone();
                (p[a], p[b]) = (r[b], r[a]);
                yield return new Hypothesis("ends-swapped", 2, p,
                    $"The two end moments of member {m} are exchanged: the value for {_s.Model.Member(m).Start} is the one the analysis gives at {_s.Model.Member(m).End}, and the reverse.");
            }
        }
        double rr = r.Sum(v => v * v);
        if (rr > 0)
        {
            double alpha = x.Claimed.Zip(r).Sum(t => t.First * t.Second) / rr;
            foreach (var (factor, meaning) in UnitFactors)
                foreach (var f in new[] { factor, 1 / factor })
                    if (Math.Abs((alpha / f) - 1) < 0.03)
                        yield return new Hypothesis("unit-scale", 1, r.Select(v => v * f).ToArray(),
                            string.Create(CultureInfo.InvariantCulture,
                                $"Every claimed moment is {alpha:0.####} times the analysis: {meaning}. Check the moment unit of the claims against the unit declared ({_s.Info.Units.Moment.Symbol})."));
        }
    }

    // ---- copying slips ---------------------------------------------------------------------------------

    /// <summary>
    /// A claim that is the analysis value miscopied: at the precision it was written to, two neighbouring digits
    /// exchanged, the sign lost, or the decimal point moved. Only those ends change; the rest of the prediction is the
    /// analysis itself, so the hypothesis fits only when every other claim agrees.
    /// </summary>
    private IEnumerable<Hypothesis> CopyingSlips(Context x)
    {
        var findings = x.Ends;
        var unit = _s.Info.Units.Moment;
        var slips = new List<(int Index, string What)>();
        for (int i = 0; i < x.Keys.Count; i++)
        {
            if (Math.Abs(x.Claimed[i] - x.Recomputed[i]) <= x.Review.AgreeTolerance) continue;
            double claimed = unit.FromSi(x.Claimed[i]), recomputed = unit.FromSi(x.Recomputed[i]);
            int decimals = DecimalsWritten(claimed, findings[i].Source?.Text);
            string c = Digits(claimed, decimals), r = Digits(recomputed, decimals);
            string? what = null;
            if (c == r && Math.Sign(claimed) != Math.Sign(recomputed)) what = "its sign lost";
            else if (Math.Sign(claimed) == Math.Sign(recomputed) && c.Length == r.Length && NeighboursExchanged(c, r))
                what = "two neighbouring digits exchanged";
            else if (Math.Sign(claimed) == Math.Sign(recomputed) && recomputed != 0)
                foreach (double shift in new[] { 10.0, 100.0, 0.1, 0.01 })
                    if (Math.Abs((claimed / (recomputed * shift)) - 1) < 0.5 * Math.Pow(10, -decimals) / Math.Abs(claimed) + 1e-9)
                    {
                        what = "its decimal point moved";
                        break;
                    }
            if (what is not null) slips.Add((i, what));
        }
        // Signs lost at several ends are a sign-convention pattern, not copying; one lost sign can be either.
        if (slips.Count > 1) slips.RemoveAll(s => s.What == "its sign lost");
        if (slips.Count == 0) yield break;
        string Describe((int Index, string What) s)
        {
            var f = findings[s.Index];
            string cite = f.Source is { } src ? $" ({src.Citation})" : "";
            return $"{f.Member} at {f.At}{cite}, written {Fmt.Number(unit.FromSi(x.Claimed[s.Index]), "0.0##")} where the analysis gives {Moment(x.Recomputed[s.Index])}: {s.What}";
        }
        var all = (double[])x.Recomputed.Clone();
        foreach (var s in slips) all[s.Index] = x.Claimed[s.Index];
        // Less specific than a systematic mistake that reproduces the same claims, so ranked after one.
        yield return new Hypothesis("copying-slip", 4, all,
            slips.Count == 1
                ? $"A copying slip, not an analysis error: the claim for {Describe(slips[0])}. Correct the figure where it was copied."
                : $"Copying slips, not analysis errors: {string.Join("; ", slips.Select(Describe))}. Correct the figures where they were copied.");
    }

    /// <summary>Decimals the claim was written with: from the text as read when known, else the fewest that give the value.</summary>
    private static int DecimalsWritten(double value, string? text)
    {
        if (text is { Length: > 0 })
        {
            string t = text.Trim();
            int dot = Math.Max(t.LastIndexOf('.'), t.LastIndexOf(','));
            if (dot >= 0)
            {
                int n = 0;
                for (int k = dot + 1; k < t.Length && char.IsAsciiDigit(t[k]); k++) n++;
                if (n > 0 && n <= 6) return n;
            }
            else if (t.Any(char.IsAsciiDigit)) return 0;
        }
        for (int d = 0; d <= 4; d++)
            if (Math.Abs(Math.Round(value, d) - value) <= 1e-9 * Math.Max(1, Math.Abs(value))) return d;
        return 4;
    }

    /// <summary>The digits of |value| at <paramref name="decimals"/> places, without the point.</summary>
    private static string Digits(double value, int decimals) =>
        Math.Abs(value).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture).Replace(".", "", StringComparison.Ordinal);

    private static bool NeighboursExchanged(string a, string b)
    {
        int first = -1;
        for (int k = 0; k < a.Length; k++)
        {
            if (a[k] == b[k]) continue;
            if (first >= 0) return k == first + 1 && a[first] == b[k] && a[k] == b[first] && a[(k + 1)..] == b[(k + 1)..];
            first = k;
        }
        return false;
    }

    // ---- altered models ------------------------------------------------------------------------------

    private CaseResult SolveAltered(StructureModel model, LoadCase loadCase, bool hold = false) =>
        _solver.Solve(model, [loadCase], hold).Cases[0];

    private IEnumerable<Hypothesis> SwayOmitted(Context x)
    {
        if (_s.Model.Axial != AxialBehaviour.Rigid) yield break;
        var kin = new Kinematics(_s.Model);
        if (!kin.CanSway) yield break;
        var braced = SolveAltered(_s.Model, x.Case, hold: true);
        var sway = x.Review.Flags.Any(f => f.Kind == FlagKind.StoreyShear && f.Severity == Severity.Major)
            ? "The storey-shear check of the claims fails too: the columns do not carry the lateral load." : "";
        yield return new Hypothesis("sway-omitted", 2, x.From(braced),
            "The claims are those of a braced (no-sway) analysis, but the frame can sway: sidesway was ignored. Add the sway correction (a sway case superposed with the storey shear equation) or analyse with the joints free to translate.",
            sway);
    }

    private IEnumerable<Hypothesis> StiffnessWithoutLength(Context x)
    {
        var lengths = _s.Model.Members.Select(_s.Model.Length).ToList();
        if (lengths.Max() - lengths.Min() <= 1e-9 * lengths.Max()) yield break;
        // Relative stiffness taken as I (or E·I) instead of I/L: the same as members with I·L in place of I.
        var members = _s.Model.Members.Select(m => m with { I = m.I * _s.Model.Length(m) }).ToList();
        var altered = new StructureModel(_s.Model.Joints, members, _s.Model.Axial, _s.Model.RelativeStiffness);
        yield return new Hypothesis("stiffness-without-length", 3, x.From(SolveAltered(altered, x.Case)),
            "The claims follow from member stiffnesses taken as I (or E·I) without dividing by the length: distribution factors must use K = EI/L (4EI/L, or 3EI/L with the far end pinned).");
    }

    private IEnumerable<Hypothesis> FarEndFixity(Context x)
    {
        foreach (var j in _s.Model.Joints.Where(j => j.IsSupport))
        {
            Restraint changed;
            string message;
            if (!j.Restraint.HasFlag(Restraint.Rotation))
            {
                changed = j.Restraint | Restraint.Rotation;
                message = $"The claims follow from treating support {j.Id} as fixed against rotation, but it is {Word(j.Restraint)}: for a member whose far end is pinned use the modified stiffness 3EI/L and carry nothing over to the pin.";
            }
            else
            {
                changed = j.Restraint & ~Restraint.Rotation;
                message = $"The claims follow from treating support {j.Id} as pinned, but it is fixed: its members need the full stiffness 4EI/L and a carry-over of ½ to the support.";
            }
            var joints = _s.Model.Joints.Select(k => k.Id == j.Id ? k with { Restraint = changed } : k).ToList();
            var altered = new StructureModel(joints, _s.Model.Members, _s.Model.Axial, _s.Model.RelativeStiffness);
            yield return new Hypothesis("far-end-fixity", 3, x.From(SolveAltered(altered, x.Case)), message);
        }
    }

    private static string Word(Restraint r) => r switch
    {
        Restraint.Pinned => "pinned",
        Restraint.Roller => "a roller",
        Restraint.Free => "free",
        _ => r.ToString().ToLowerInvariant(),
    };

    private IEnumerable<Hypothesis> FixedEndMoments(Context x)
    {
        // Influence of a unit locked-in end moment at each member end on the claimed ends (one factorisation).
        var src = new SourceRef("diagnosis");
        var unit = new List<LoadCase>();
        foreach (var m in _s.Model.Members)
        {
            unit.Add(new LoadCase($"{m.Id}|s", [new LockedEndMoments("u", m.Id, 1, 0, src)]));
            unit.Add(new LoadCase($"{m.Id}|e", [new LockedEndMoments("u", m.Id, 0, 1, src)]));
        }
        var influence = _solver.Solve(_s.Model, unit).Cases.ToDictionary(c => c.Case, x.From);
        double[] Shift((string Member, double D1, double D2)[] changes)
        {
            var p = (double[])x.Recomputed.Clone();
            foreach (var (m, d1, d2) in changes)
                for (int i = 0; i < p.Length; i++) p[i] += (d1 * influence[$"{m}|s"][i]) + (d2 * influence[$"{m}|e"][i]);
            return p;
        }
        var statics = new ClaimStatics(_s);
        (double S, double E) Fem(Member m, MemberLoad load)
        {
            var single = new LoadCase("·", [load with { Case = "·" }]);
            var sub = _s with { Cases = [single] };
            return new ClaimStatics(sub).FixedEndMoments("·", m);
        }
        string M(double v) => Moment(v);
        var systematic = new Dictionary<string, List<(string Member, double D1, double D2)>>();
        foreach (var load in x.Case.MemberLoads)
        {
            var m = _s.Model.Member(load.Member);
            double L = _s.Model.Length(m);
            var (f1, f2) = Fem(m, load);
            var candidates = new List<(string Slip, string Key, double F1, double F2)>();
            switch (load)
            {
                case PointLoad p when Math.Abs(p.A - (L / 2)) > 1e-6 * L:
                {
                    var (c1, c2) = Fem(m, p with { A = L / 2 });
                    candidates.Add(("used the central-load value PL/8 for a point load that is not at mid-span", "point-central", c1, c2));
                    candidates.Add(("used PL/4 (the simply supported span moment) for the point load", "point-pl4", 2 * c1, 2 * c2));
                    var (o1, o2) = Fem(m, p with { A = L - p.A });
                    candidates.Add(("measured the point load's position from the wrong end", "point-flipped", o1, o2));
                    break;
                }
                case PointLoad:
                    candidates.Add(("used PL/4 (the simply supported span moment) instead of PL/8 for the central point load", "point-pl4", 2 * f1, 2 * f2));
                    break;
                case DistributedLoad d when d.IsUniform && d.A <= 1e-9 * L && d.B >= L * (1 - 1e-9):
                    candidates.Add(("used wL²/8 (the simply supported span moment) instead of wL²/12 for the uniform load", "udl-8", 1.5 * f1, 1.5 * f2));
                    break;
                case DistributedLoad d when d.IsUniform:
                {
                    var (u1, u2) = Fem(m, d with { A = 0, B = L });
                    candidates.Add(("took the partial uniform load as acting over the whole member", "udl-full", u1, u2));
                    break;
                }
                case DistributedLoad d:
                {
                    var (s1, s2) = Fem(m, d with { WStart = d.WEnd, WEnd = d.WStart });
                    candidates.Add(("swapped the ends of the linearly varying load (wL²/30 and wL²/20 exchanged)", "linear-swapped", s1, s2));
                    break;
                }
                case MemberCouple cp:
                {
                    var (o1, o2) = Fem(m, cp with { A = L - cp.A });
                    candidates.Add(("measured the couple's position from the wrong end", "couple-flipped", o1, o2));
                    candidates.Add(("took the couple with the wrong sense", "couple-sign", -f1, -f2));
                    break;
                }
            }
            candidates.Add(("gave the fixed-end moment at the start the wrong sign", "sign-start", -f1, f2));
            candidates.Add(("gave the fixed-end moment at the end the wrong sign", "sign-end", f1, -f2));
            string what = Describe(load);
            foreach (var (slip, key, w1, w2) in candidates)
            {
                double d1 = w1 - f1, d2 = w2 - f2;
                if (Math.Abs(d1) + Math.Abs(d2) <= 1e-12 * (Math.Abs(f1) + Math.Abs(f2) + 1e-300)) continue;
                yield return new Hypothesis("fixed-end-moment", 3, Shift([(m.Id, d1, d2)]),
                    $"Member {m.Id}, {what}: the author appears to have {slip}. The claims match fixed-end moments of {M(w1)} / {M(w2)} instead of {M(f1)} / {M(f2)}.");
                if (!systematic.TryGetValue(key, out var list)) systematic[key] = list = [];
                list.Add((m.Id, d1, d2));
            }
        }
        foreach (var (key, changes) in systematic.Where(kv => kv.Value.Count > 1 && kv.Key is "udl-8" or "point-central" or "point-pl4" or "linear-swapped"))
        {
            string text = key switch
            {
                "udl-8" => "used wL²/8 instead of wL²/12 for every uniform load",
                "point-central" => "used PL/8 for every off-centre point load, as if it were central",
                "point-pl4" => "used PL/4 instead of the fixed-end formula for every point load",
                _ => "swapped the ends of every linearly varying load",
            };
            yield return new Hypothesis("fixed-end-moment", 3, Shift([.. changes]),
                $"The author appears to have {text} (members {string.Join(", ", changes.Select(c => c.Member).Distinct())}).");
        }
        // Generic: one member's fixed-end moments off by a fitted amount. Two fitted numbers explain any two claims,
        // so this needs at least two claims more than it fits, and must remove nearly all of the difference.
        if (x.Keys.Count < 4) yield break;
        var res0 = x.Claimed.Zip(x.Recomputed, (a, b) => a - b).ToArray();
        double res0Norm = Dot(res0, res0);
        foreach (var m in _s.Model.Members)
        {
            var i1 = influence[$"{m.Id}|s"];
            var i2 = influence[$"{m.Id}|e"];
            var res = x.Claimed.Zip(x.Recomputed, (a, b) => a - b).ToArray();
            double a11 = Dot(i1, i1), a12 = Dot(i1, i2), a22 = Dot(i2, i2), b1 = Dot(i1, res), b2 = Dot(i2, res);
            double det = (a11 * a22) - (a12 * a12);
            if (Math.Abs(det) <= 1e-12 * Math.Max(a11 * a22, 1e-300)) continue;
            double d1 = ((a22 * b1) - (a12 * b2)) / det, d2 = ((a11 * b2) - (a12 * b1)) / det;
            var (f1, f2) = statics.FixedEndMoments(x.Case.Id, m);
            var fitted = Shift([(m.Id, d1, d2)]);
            if (Norm2(x.Claimed, fitted) > 0.001 * res0Norm) continue;
            yield return new Hypothesis("fixed-end-moment", 6, fitted,
                $"The claims are consistent with member {m.Id} having fixed-end moments of {M(f1 + d1)} / {M(f2 + d2)} instead of {M(f1)} / {M(f2)}: check the fixed-end moments of its loads " +
                "(an arithmetic slip at this member during the distribution has the same effect).", ConfidenceCap: 0.6);
        }
    }

    private string Describe(MemberLoad load)
    {
        var u = _s.Info.Units;
        string F(double v) => $"{Fmt.Number(u.Force.FromSi(v), "0.###")} {u.Force.Symbol}";
        string W(double v) => $"{Fmt.Number(u.Force.FromSi(v) * u.Length.ToSi, "0.###")} {u.Force.Symbol}/{u.Length.Symbol}";
        string Lg(double v) => $"{Fmt.Number(u.Length.FromSi(v), "0.###")} {u.Length.Symbol}";
        return load switch
        {
            PointLoad p => $"point load {F(p.P)} at {Lg(p.A)} ({load.Source.Citation})",
            DistributedLoad d when d.IsUniform => $"uniform load {W(d.WStart)} ({load.Source.Citation})",
            DistributedLoad d => $"linear load {W(d.WStart)} to {W(d.WEnd)} ({load.Source.Citation})",
            MemberCouple c => $"couple at {Lg(c.A)} ({load.Source.Citation})",
            _ => $"load ({load.Source.Citation})",
        };
    }

    // ---- altered methods: moment distribution -----------------------------------------------------

    private IEnumerable<Hypothesis> CarryOver(Context x)
    {
        if (_s.Model.Axial != AxialBehaviour.Rigid) yield break;
        foreach (var (cof, text) in new[] { (0.0, "carried nothing over (carry-over factor 0)"), (-0.5, "carried over with the wrong sign (−½ instead of +½)"), (1.0, "carried over the full balance (factor 1 instead of ½)") })
        {
            foreach (bool modified in new[] { true, false })
            {
                var md = MomentDistribution.Run(_s.Model, x.Case, new DistributionOptions(ModifiedStiffness: modified, CarryOverFactor: cof, Cycles: 200, FinalBalance: false));
                if (!md.Converged) continue;
                yield return new Hypothesis("carry-over", 3, x.From(md.Moments),
                    $"The claims are those of a moment distribution that {text} to far ends that are fixed or continuous. The carry-over factor of a prismatic member is +½ (0 to a pinned end).");
            }
        }
    }

    private IEnumerable<Hypothesis> StoppedEarly(Context x)
    {
        // Many stopping points are tried: with fewer than five claimed ends one of them could match by chance.
        if (_s.Model.Axial != AxialBehaviour.Rigid || x.Keys.Count < 5) yield break;
        // The signature of stopping early is in the joints: after a final balance every joint balances; stopped after a
        // carry-over, each joint is out by exactly its last carry-overs. Many stopping points are tried, so without the
        // signature a match could be chance.
        bool jointsBalance = !x.Review.Flags.Any(f => f.Kind is FlagKind.JointEquilibrium or FlagKind.ReleasedEnd && f.Severity != Severity.Info);
        foreach (bool modified in new[] { true, false })
            foreach (bool finalBalance in new[] { true, false })
            {
                if (finalBalance && !jointsBalance) continue;
                foreach (var stop in MomentDistribution.StoppedAfterEachCycle(_s.Model, x.Case, modified, finalBalance, 15))
                {
                    int k = stop.Cycles;
                    string ending = finalBalance ? "with a final balance" : "straight after the carry-over, without a final balance";
                    string evidence = "";
                    if (!finalBalance)
                    {
                        var (worst, joints) = CarryOverMismatch(x, stop);
                        if (joints == 0 || worst > x.Review.AgreeTolerance) continue;
                        evidence = $"The claimed joints are out of balance by the last carry-overs (to within {Moment(worst)}).";
                    }
                    yield return new Hypothesis("stopped-early", 4, x.From(stop.Moments),
                        string.Create(CultureInfo.InvariantCulture,
                            $"The claims match a moment distribution ({(modified ? "modified stiffness at pinned ends" : "plain stiffness")}) stopped after {k} cycle{(k == 1 ? "" : "s")}, {ending}. Carry the distribution on until the carry-overs are negligible."),
                        evidence);
                }
            }
    }

    /// <summary>How far the claimed joint unbalances are from the last carry-overs of a distribution, and over how many joints.</summary>
    private static (double Worst, int Joints) CarryOverMismatch(Context x, MomentDistribution.Stopped stop)
    {
        if (stop.LastCarryOver is not { } last) return (0, 0);
        var model = x.D._s.Model;
        var cols = stop.Columns.ToList();
        double worst = 0;
        int joints = 0;
        foreach (var j in model.Joints.Where(j => !j.Restraint.HasFlag(Restraint.Rotation)))
        {
            var at = model.MembersAt(j.Id).Select(m => (m.Id, m.EndAt(j.Id)!.Value)).ToList();
            if (!at.All(k => x.Keys.Contains(k))) continue;
            double claimedSum = at.Sum(k => x.Claimed[x.Keys.IndexOf(k)]);
            double coSum = at.Sum(k => last[cols.IndexOf(k)]);
            double applied = x.Case.Loads.OfType<JointCouple>().Where(l => l.Joint == j.Id).Sum(l => l.M);
            worst = Math.Max(worst, Math.Abs(claimedSum - applied - coSum));
            joints++;
        }
        return (worst, joints);
    }

    // ---- loads, hinges, settlements -------------------------------------------------------------------

    private IEnumerable<Hypothesis> LoadMisplaced(Context x)
    {
        var loads = x.Case.Loads.ToList();
        var cases = new List<LoadCase>();
        for (int i = 0; i < loads.Count; i++) cases.Add(new LoadCase($"alone|{i}", [loads[i]]));
        // The same member load on another member of the same length: the nearest few, so that the work stays linear in
        // the size of a large frame (where every bay has the same span) instead of growing with its square.
        var moved = new List<(int Load, string To)>();
        for (int i = 0; i < loads.Count; i++)
        {
            if (loads[i] is not MemberLoad ml) continue;
            var from = _s.Model.Member(ml.Member);
            double L = _s.Model.Length(from);
            var candidates = _s.Model.Members.Where(o => o.Id != ml.Member && Math.Abs(_s.Model.Length(o) - L) <= 1e-6 * L)
                .OrderBy(o => Distance(from, o)).Take(MaxMovesPerLoad);
            foreach (var other in candidates)
            {
                moved.Add((i, other.Id));
                cases.Add(new LoadCase($"moved|{i}|{other.Id}", [ml with { Member = other.Id }]));
            }
        }
        var foreign = _s.Cases.Where(c => c.Id != x.Case.Id).SelectMany(c => c.Loads).ToList();
        for (int i = 0; i < foreign.Count; i++) cases.Add(new LoadCase($"foreign|{i}", [foreign[i]]));
        if (cases.Count == 0) yield break;
        var results = _solver.Solve(_s.Model, cases).Cases.ToDictionary(c => c.Case, x.From);
        for (int i = 0; i < loads.Count; i++)
        {
            var alone = results[$"alone|{i}"];
            yield return new Hypothesis("load-misplaced", 3, x.Recomputed.Zip(alone, (a, b) => a - b).ToArray(),
                $"The claims leave out the {LoadWords(loads[i])}.");
        }
        foreach (var (i, to) in moved)
        {
            var alone = results[$"alone|{i}"];
            var there = results[$"moved|{i}|{to}"];
            yield return new Hypothesis("load-misplaced", 4, x.Recomputed.Select((v, k) => v - alone[k] + there[k]).ToArray(),
                $"The claims put the {LoadWords(loads[i])} on member {to} instead.");
        }
        for (int i = 0; i < foreign.Count; i++)
        {
            var extra = results[$"foreign|{i}"];
            yield return new Hypothesis("load-misplaced", 4, x.Recomputed.Zip(extra, (a, b) => a + b).ToArray(),
                $"The claims include the {LoadWords(foreign[i])} of case {foreign[i].Case}, which does not belong to case {x.Case.Id}.");
        }
        foreach (var other in _analysis.Cases.Where(c => c.Case != x.Case.Id))
            yield return new Hypothesis("load-misplaced", 3, x.From(other),
                $"The claims for case {x.Case.Id} are the moments of case {other.Case}: the load cases appear to be mixed up.");
    }

    /// <summary>Most members a misplaced member load is tried on (the nearest of the same length).</summary>
    private const int MaxMovesPerLoad = 8;

    /// <summary>Distance between the mid-points of two members (m).</summary>
    private double Distance(Member a, Member b)
    {
        var (ax, ay) = Mid(a);
        var (bx, by) = Mid(b);
        return Math.Sqrt(((ax - bx) * (ax - bx)) + ((ay - by) * (ay - by)));
    }

    private (double X, double Y) Mid(Member m)
    {
        var s = _s.Model.Joint(m.Start);
        var e = _s.Model.Joint(m.End);
        return ((s.X + e.X) / 2, (s.Y + e.Y) / 2);
    }

    private string LoadWords(Load l) => l switch
    {
        MemberLoad ml => $"{Describe(ml)} on member {ml.Member}",
        JointForce f => $"{Fmt.Number(_s.Info.Units.Force.FromSi(f.P), "0.###")} {_s.Info.Units.Force.Symbol} force at joint {f.Joint} ({l.Source.Citation})",
        JointCouple c => $"couple at joint {c.Joint} ({l.Source.Citation})",
        _ => "load",
    };

    private IEnumerable<Hypothesis> HingesAndSettlement(Context x)
    {
        var hinged = _s.Model.Members.Where(m => m.Hinge != Hinge.None).ToList();
        if (hinged.Count > 0)
        {
            var none = new StructureModel(_s.Model.Joints, _s.Model.Members.Select(m => m with { Hinge = Hinge.None }).ToList(), _s.Model.Axial, _s.Model.RelativeStiffness);
            yield return new Hypothesis("hinge-ignored", 2, x.From(SolveAltered(none, x.Case)),
                $"The claims treat the hinge{(hinged.Count > 1 ? "s" : "")} of member{(hinged.Count > 1 ? "s" : "")} {string.Join(", ", hinged.Select(m => m.Id))} as rigid connections; a hinge carries no moment.");
            if (hinged.Count > 1)
                foreach (var h in hinged)
                {
                    var one = new StructureModel(_s.Model.Joints, _s.Model.Members.Select(m => m.Id == h.Id ? m with { Hinge = Hinge.None } : m).ToList(), _s.Model.Axial, _s.Model.RelativeStiffness);
                    yield return new Hypothesis("hinge-ignored", 3, x.From(SolveAltered(one, x.Case)),
                        $"The claims treat the hinge of member {h.Id} as a rigid connection; a hinge carries no moment.");
                }
        }
        if (_s.Model.HasSupportMovements)
        {
            var still = new StructureModel(_s.Model.Joints.Select(j => j with { Movement = default }).ToList(), _s.Model.Members, _s.Model.Axial, _s.Model.RelativeStiffness);
            var moving = _s.Model.Joints.Where(j => !j.Movement.IsZero).Select(j => j.Id);
            yield return new Hypothesis("settlement-ignored", 2, x.From(SolveAltered(still, x.Case)),
                $"The claims leave out the support movement{(moving.Count() > 1 ? "s" : "")} at {string.Join(", ", moving)}; settlement moments are 6EIΔ/L² at fixed ends (3EIΔ/L² with the far end pinned) and need the absolute E and I.");
        }
    }

    private static double Dot(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
        return s;
    }

    private static double Norm2(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += (a[i] - b[i]) * (a[i] - b[i]);
        return s;
    }

    private static double MaxAbs(double[] a, double[] b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s = Math.Max(s, Math.Abs(a[i] - b[i]));
        return s;
    }
}
