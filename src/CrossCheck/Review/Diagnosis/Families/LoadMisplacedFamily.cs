using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// A load left out, put on another member of the same length, taken from another case, or the cases mixed up. Each is
/// superposed from the load's own effect, solved with the shared factor on the structure without its support movements
/// (which the recomputed moments already hold once), so that a settlement elsewhere does not enter the hypothesis twice.
/// A variant whose effect cannot overlap the differences enough to explain them (<see cref="Evidence.MayExplain(double)"/>)
/// is not formed.
/// </summary>
internal sealed class LoadMisplacedFamily : IHypothesisFamily
{
    /// <summary>Most members a misplaced member load is tried on (the nearest of the same length).</summary>
    private const int MaxMovesPerLoad = 8;

    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var loads = x.Case.Loads.ToList();
        var moved = Moves(x.Model, loads);
        var foreign = x.S.Cases.Where(c => c.Id != x.Case.Id).SelectMany(c => c.Loads).ToList();
        if (loads.Count == 0 && foreign.Count == 0) yield break;
        var alone = new Dictionary<int, double[]>();
        double[] Alone(int i) => alone.TryGetValue(i, out var known) ? known : alone[i] = x.LoadEffect([loads[i]]);
        // The overlap of each load's own effect with the differences, once per load (a moved load needs it eight times).
        var adjoint = x.Evidence.Adjoint;
        var overlap = adjoint is null ? null : loads.Select(adjoint.Of).ToArray();
        for (int i = 0; i < loads.Count; i++)
        {
            if (overlap is not null && !x.Evidence.MayExplain(-overlap[i])) continue;
            var effect = Alone(i);
            yield return new Hypothesis(CauseCode.LoadMisplaced, 3, x.Recomputed.Zip(effect, (a, b) => a - b).ToArray(),
                $"The claims leave out the {x.LoadWords(loads[i])}.")
            { Identity = $"load-misplaced|{x.Case.Id}|out|{loads[i].Source.Compact}", Place = PlaceOf(loads[i]) };
        }
        foreach (var (i, to) in moved)
        {
            var there = ((MemberLoad)loads[i]) with { Member = to };
            if (adjoint is not null && !x.Evidence.MayExplain(adjoint.Of(there) - overlap![i])) continue;
            var effect = Alone(i);
            var thereEffect = x.LoadEffect([there]);
            yield return new Hypothesis(CauseCode.LoadMisplaced, 4, x.Recomputed.Select((v, k) => v - effect[k] + thereEffect[k]).ToArray(),
                $"The claims put the {x.LoadWords(loads[i])} on member {to} instead.")
            { Identity = $"load-misplaced|{x.Case.Id}|moved|{loads[i].Source.Compact}|{to}", Place = PlaceOf(loads[i]) };
        }
        foreach (var load in foreign)
        {
            if (adjoint is not null && !x.Evidence.MayExplain(adjoint.Of(load))) continue;
            var extra = x.LoadEffect([load]);
            yield return new Hypothesis(CauseCode.LoadMisplaced, 4, x.Recomputed.Zip(extra, (a, b) => a + b).ToArray(),
                $"The claims include the {x.LoadWords(load)} of case {load.Case}, which does not belong to case {x.Case.Id}.")
            { Identity = $"load-misplaced|{x.Case.Id}|foreign|{load.Source.Compact}", Place = PlaceOf(load) };
        }
        foreach (var other in x.Analysis.Cases.Where(c => c.Case != x.Case.Id))
            yield return new Hypothesis(CauseCode.LoadMisplaced, 3, x.From(other),
                $"The claims for case {x.Case.Id} are the moments of case {other.Case}: the load cases appear to be mixed up.")
            { Identity = $"load-misplaced|{x.Case.Id}|case|{other.Case}" };
    }

    /// <summary>
    /// For every member load, the nearest members of the same length (by the distance between mid-points, ties in the
    /// model's order), at most <see cref="MaxMovesPerLoad"/>: the work stays linear in the size of a large frame (where
    /// every bay has the same span) instead of growing with its square.
    /// </summary>
    private static List<(int Load, string To)> Moves(StructureModel model, List<Load> loads)
    {
        var moves = new List<(int, string)>();
        var members = model.Members;
        int n = members.Count;
        var length = new double[n];
        var midX = new double[n];
        var midY = new double[n];
        for (int k = 0; k < n; k++)
        {
            var s = model.Joint(members[k].Start);
            var e = model.Joint(members[k].End);
            length[k] = model.Length(members[k]);
            (midX[k], midY[k]) = ((s.X + e.X) / 2, (s.Y + e.Y) / 2);
        }
        var byLength = Enumerable.Range(0, n).OrderBy(k => length[k]).ToArray();
        var sorted = byLength.Select(k => length[k]).ToArray();
        var index = Enumerable.Range(0, n).ToDictionary(k => members[k].Id, k => k, StringComparer.Ordinal);
        var best = new List<(double Distance, int Member)>(MaxMovesPerLoad + 1);
        for (int i = 0; i < loads.Count; i++)
        {
            if (loads[i] is not MemberLoad ml || !index.TryGetValue(ml.Member, out int from)) continue;
            double L = length[from];
            // Members whose length is within 1e-6·L, found by bisection on the lengths in order.
            int lo = LowerBound(sorted, L - (2e-6 * L));
            best.Clear();
            for (int p = lo; p < n && sorted[p] <= L + (2e-6 * L); p++)
            {
                int o = byLength[p];
                if (o == from || !(Math.Abs(length[o] - L) <= 1e-6 * L)) continue;
                double dx = midX[from] - midX[o], dy = midY[from] - midY[o];
                double d = Math.Sqrt((dx * dx) + (dy * dy));
                int at = best.Count;
                while (at > 0 && (best[at - 1].Distance > d || (best[at - 1].Distance == d && best[at - 1].Member > o))) at--;
                if (at >= MaxMovesPerLoad) continue;
                best.Insert(at, (d, o));
                if (best.Count > MaxMovesPerLoad) best.RemoveAt(MaxMovesPerLoad);
            }
            foreach (var (_, o) in best) moves.Add((i, members[o].Id));
        }
        return moves;
    }

    private static int LowerBound(double[] sorted, double value)
    {
        int lo = 0, hi = sorted.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) / 2;
            if (sorted[mid] < value) lo = mid + 1; else hi = mid;
        }
        return lo;
    }

    private static Place? PlaceOf(Load l) => l switch
    {
        MemberLoad ml => new MemberPlace(ml.Member),
        JointLoad jl => new JointPlace(jl.Joint),
        _ => null,
    };
}
