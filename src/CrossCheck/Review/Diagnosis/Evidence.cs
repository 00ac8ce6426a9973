using CrossCheck.Analysis;
using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis;

/// <summary>
/// Where the claims of one case differ from the analysis, and the screens built on it that let the diagnosis try only
/// the hypotheses that can explain the claims.
/// </summary>
/// <remarks>
/// A hypothesis is reported only when it removes at least half of the squared differences and leaves none beyond the
/// minor band (<see cref="Diagnoser"/>). Two screens follow from that rule and drop only hypotheses that could not pass
/// it: <see cref="MayFit"/> for a hypothesis that changes a few ends (it is scored there exactly), and
/// <see cref="MayExplain(double)"/> for a load hypothesis, whose overlap with the differences the adjoint gives without solving
/// for it. Two bounds are a judgement, stated here and checked against the exhaustive search on every reference case
/// (<c>DiagnosisSearchTests</c>): a member-local change of the structure (a hinge ignored, a support's fixity) is tried
/// only at members whose ends, or whose neighbours' ends, differ — at most <see cref="MaxLocalCandidates"/>, those with
/// the largest differences first — because such a change shows first in the moments of the members it touches; and a
/// mistake of the distribution method (<see cref="MethodMistakePlausible"/>) only when the differences reach half of the
/// joints the distribution balances, because such a mistake is made at every joint, not at one.
/// </remarks>
internal sealed class Evidence
{
    /// <summary>Most member-local changes of the structure tried per family and case.</summary>
    public const int MaxLocalCandidates = 40;

    /// <summary>Joints the distribution balances up to which a method mistake is always tried (too few to tell).</summary>
    private const int FewJoints = 8;

    /// <summary>Allowance for round-off in the screens: they never drop a hypothesis that passes the rule.</summary>
    private const double Slack = 1e-9;

    /// <summary>Allowance for round-off in an overlap computed through the adjoint (relative to the squared differences).</summary>
    private const double AdjointSlack = 1e-4;

    private readonly DiagnosisContext _x;
    private readonly double _agree;
    private readonly double _minor;
    private int[]? _byMagnitude;
    private HashSet<string>? _nearJoints;
    private Dictionary<string, double>? _memberSquares;
    private Adjoint? _adjoint;
    private bool _adjointTried;

    public Evidence(DiagnosisContext x)
    {
        _x = x;
        _agree = x.Review.AgreeTolerance;
        _minor = x.Review.MinorTolerance;
        Residual = new double[x.Keys.Count];
        for (int i = 0; i < Residual.Length; i++)
        {
            Residual[i] = x.Claimed[i] - x.Recomputed[i];
            Squares += Residual[i] * Residual[i];
        }
    }

    /// <summary>Claimed − recomputed at every compared end.</summary>
    public double[] Residual { get; }

    /// <summary>Σ (claimed − recomputed)².</summary>
    public double Squares { get; }

    /// <summary>
    /// Whether a hypothesis that predicts <paramref name="predicted"/> at the compared ends <paramref name="changed"/> and the
    /// recomputed moment everywhere else can pass the rule (scored exactly, from the differences alone).
    /// </summary>
    public bool MayFit(ReadOnlySpan<int> changed, ReadOnlySpan<double> predicted)
    {
        if (_x.Exhaustive) return true;
        var order = _byMagnitude ??= Enumerable.Range(0, Residual.Length).OrderByDescending(i => Math.Abs(Residual[i])).ToArray();
        double worst = 0, squares = Squares;
        foreach (int i in order)
        {
            if (changed.Contains(i)) continue;
            worst = Math.Abs(Residual[i]);
            break;
        }
        for (int k = 0; k < changed.Length; k++)
        {
            double left = _x.Claimed[changed[k]] - predicted[k];
            worst = Math.Max(worst, Math.Abs(left));
            squares += (left * left) - (Residual[changed[k]] * Residual[changed[k]]);
        }
        double explains = Squares > 0 ? 1 - (squares / Squares) : 0;
        return explains >= 0.5 - Slack && (worst <= _agree * (1 + Slack) || (explains >= 0.9 - Slack && worst <= _minor * (1 + Slack)));
    }

    /// <summary>
    /// Whether a hypothesis whose change δ of the compared ends overlaps the differences e by e·δ can remove half of Σe²:
    /// ‖e − δ‖² ≤ ½‖e‖² needs 1 − √½ ≤ e·δ / ‖e‖² ≤ 1 + √½ (Cauchy–Schwarz).
    /// </summary>
    public bool MayExplain(double overlap)
    {
        if (_x.Exhaustive) return true;
        double ratio = overlap / Squares;
        return ratio >= 1 - Math.Sqrt(0.5) - AdjointSlack && ratio <= 1 + Math.Sqrt(0.5) + AdjointSlack;
    }

    /// <summary>The adjoint of Σ eᵢ·Mᵢ (one solve), to screen load hypotheses; null in the exhaustive search or without a factor.</summary>
    public Adjoint? Adjoint
    {
        get
        {
            if (_adjointTried) return _adjoint;
            _adjointTried = true;
            return _adjoint = _x.Exhaustive ? null : _x.Solver.AdjointOf(_x.Keys, Residual);
        }
    }

    /// <summary>
    /// Members whose ends or whose neighbours' ends differ (a neighbour shares a joint), at most
    /// <see cref="MaxLocalCandidates"/>, those with the largest differences first; every member in the exhaustive search.
    /// </summary>
    public IReadOnlyList<Member> NearMembers(IEnumerable<Member> candidates)
    {
        if (_x.Exhaustive) return candidates.ToList();
        var near = NearJoints();
        return Rank(candidates.Where(m => near.Contains(m.Start) || near.Contains(m.End)), m => Around(m.Start) + Around(m.End));
    }

    /// <summary>Supports at such members (the joint itself or the far end of a member touching it), ranked the same way.</summary>
    public IReadOnlyList<Joint> NearSupports(IEnumerable<Joint> candidates)
    {
        if (_x.Exhaustive) return candidates.ToList();
        var near = NearJoints();
        return Rank(candidates.Where(j => near.Contains(j.Id) || _x.Model.MembersAt(j.Id).Any(m => near.Contains(m.OtherJoint(j.Id)))),
            j => Around(j.Id) + _x.Model.MembersAt(j.Id).Sum(m => Around(m.OtherJoint(j.Id))));
    }

    /// <summary>
    /// Whether a mistake of the distribution method can have made the claims: always in the exhaustive search or with at most
    /// a few joints to balance; otherwise only when the claims differ at no fewer than half of the joints the distribution
    /// balances (free to rotate, with two or more compared ends).
    /// </summary>
    public bool MethodMistakePlausible
    {
        get
        {
            if (_x.Exhaustive) return true;
            var differing = DifferingJoints();
            var counts = new Dictionary<string, int>(StringComparer.Ordinal);
            foreach (var k in _x.Keys)
            {
                string j = _x.Model.Member(k.Member).JointAt(k.End);
                counts[j] = counts.GetValueOrDefault(j) + 1;
            }
            var balanced = counts.Where(kv => kv.Value >= 2 && !_x.Model.Joint(kv.Key).Restraint.HasFlag(Restraint.Rotation)).Select(kv => kv.Key).ToList();
            return balanced.Count <= FewJoints || 2 * balanced.Count(differing.Contains) >= balanced.Count;
        }
    }

    private List<T> Rank<T>(IEnumerable<T> candidates, Func<T, double> weight) =>
        candidates.Select((c, i) => (c, i, w: weight(c))).OrderByDescending(t => t.w).ThenBy(t => t.i).Take(MaxLocalCandidates).Select(t => t.c).ToList();

    /// <summary>Σ e² over the compared ends of the members at a joint.</summary>
    private double Around(string joint)
    {
        var squares = MemberSquares();
        return _x.Model.MembersAt(joint).Sum(m => squares.GetValueOrDefault(m.Id));
    }

    private Dictionary<string, double> MemberSquares()
    {
        if (_memberSquares is not null) return _memberSquares;
        var squares = new Dictionary<string, double>(StringComparer.Ordinal);
        for (int i = 0; i < Residual.Length; i++) squares[_x.Keys[i].Member] = squares.GetValueOrDefault(_x.Keys[i].Member) + (Residual[i] * Residual[i]);
        return _memberSquares = squares;
    }

    /// <summary>Joints where a compared end differs beyond the agreement band.</summary>
    private HashSet<string> DifferingJoints()
    {
        var joints = new HashSet<string>(StringComparer.Ordinal);
        for (int i = 0; i < Residual.Length; i++)
            if (Math.Abs(Residual[i]) > _agree) joints.Add(_x.Model.Member(_x.Keys[i].Member).JointAt(_x.Keys[i].End));
        return joints;
    }

    /// <summary>The joints of every member with a compared end that differs beyond the agreement band.</summary>
    private HashSet<string> NearJoints()
    {
        if (_nearJoints is not null) return _nearJoints;
        var joints = new HashSet<string>(StringComparer.Ordinal);
        for (int i = 0; i < Residual.Length; i++)
        {
            if (Math.Abs(Residual[i]) <= _agree) continue;
            var m = _x.Model.Member(_x.Keys[i].Member);
            joints.Add(m.Start);
            joints.Add(m.End);
        }
        return _nearJoints = joints;
    }
}
