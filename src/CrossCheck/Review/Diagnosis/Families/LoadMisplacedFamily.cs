using CrossCheck.Model;

namespace CrossCheck.Review.Diagnosis.Families;

/// <summary>
/// A load left out, put on another member of the same length, taken from another case, or the cases mixed up. Each is
/// superposed from the load's own effect, solved on the structure without its support movements (which the recomputed
/// moments already hold once), so that a settlement elsewhere does not enter the hypothesis twice.
/// </summary>
internal sealed class LoadMisplacedFamily : IHypothesisFamily
{
    /// <summary>Most members a misplaced member load is tried on (the nearest of the same length).</summary>
    private const int MaxMovesPerLoad = 8;

    public IEnumerable<Hypothesis> Propose(DiagnosisContext x)
    {
        var loads = x.Case.Loads.ToList();
        var cases = new List<LoadCase>();
        for (int i = 0; i < loads.Count; i++) cases.Add(new LoadCase($"alone|{i}", [loads[i]]));
        // The same member load on another member of the same length: the nearest few, so that the work stays linear in
        // the size of a large frame (where every bay has the same span) instead of growing with its square.
        var moved = new List<(int Load, string To)>();
        for (int i = 0; i < loads.Count; i++)
        {
            if (loads[i] is not MemberLoad ml || !x.Model.TryGetMember(ml.Member, out var from)) continue;
            double L = x.Model.Length(from);
            var candidates = x.Model.Members.Where(o => o.Id != ml.Member && Math.Abs(x.Model.Length(o) - L) <= 1e-6 * L)
                .OrderBy(o => Distance(x.Model, from, o)).Take(MaxMovesPerLoad);
            foreach (var other in candidates)
            {
                moved.Add((i, other.Id));
                cases.Add(new LoadCase($"moved|{i}|{other.Id}", [ml with { Member = other.Id }]));
            }
        }
        var foreign = x.S.Cases.Where(c => c.Id != x.Case.Id).SelectMany(c => c.Loads).ToList();
        for (int i = 0; i < foreign.Count; i++) cases.Add(new LoadCase($"foreign|{i}", [foreign[i]]));
        if (cases.Count == 0) yield break;
        var results = x.SolveLoadsAlone(cases).ToDictionary(c => c.Case, x.From);
        for (int i = 0; i < loads.Count; i++)
        {
            var alone = results[$"alone|{i}"];
            yield return new Hypothesis(CauseCode.LoadMisplaced, 3, x.Recomputed.Zip(alone, (a, b) => a - b).ToArray(),
                $"The claims leave out the {x.LoadWords(loads[i])}.")
            { Identity = $"load-misplaced|{x.Case.Id}|out|{loads[i].Source.Compact}", Place = PlaceOf(loads[i]) };
        }
        foreach (var (i, to) in moved)
        {
            var alone = results[$"alone|{i}"];
            var there = results[$"moved|{i}|{to}"];
            yield return new Hypothesis(CauseCode.LoadMisplaced, 4, x.Recomputed.Select((v, k) => v - alone[k] + there[k]).ToArray(),
                $"The claims put the {x.LoadWords(loads[i])} on member {to} instead.")
            { Identity = $"load-misplaced|{x.Case.Id}|moved|{loads[i].Source.Compact}|{to}", Place = PlaceOf(loads[i]) };
        }
        for (int i = 0; i < foreign.Count; i++)
        {
            var extra = results[$"foreign|{i}"];
            yield return new Hypothesis(CauseCode.LoadMisplaced, 4, x.Recomputed.Zip(extra, (a, b) => a + b).ToArray(),
                $"The claims include the {x.LoadWords(foreign[i])} of case {foreign[i].Case}, which does not belong to case {x.Case.Id}.")
            { Identity = $"load-misplaced|{x.Case.Id}|foreign|{foreign[i].Source.Compact}", Place = PlaceOf(foreign[i]) };
        }
        foreach (var other in x.Analysis.Cases.Where(c => c.Case != x.Case.Id))
            yield return new Hypothesis(CauseCode.LoadMisplaced, 3, x.From(other),
                $"The claims for case {x.Case.Id} are the moments of case {other.Case}: the load cases appear to be mixed up.")
            { Identity = $"load-misplaced|{x.Case.Id}|case|{other.Case}" };
    }

    private static Place? PlaceOf(Load l) => l switch
    {
        MemberLoad ml => new MemberPlace(ml.Member),
        JointLoad jl => new JointPlace(jl.Joint),
        _ => null,
    };

    /// <summary>Distance between the mid-points of two members (m).</summary>
    private static double Distance(StructureModel model, Member a, Member b)
    {
        var (ax, ay) = Mid(model, a);
        var (bx, by) = Mid(model, b);
        return Math.Sqrt(((ax - bx) * (ax - bx)) + ((ay - by) * (ay - by)));
    }

    private static (double X, double Y) Mid(StructureModel model, Member m)
    {
        var s = model.Joint(m.Start);
        var e = model.Joint(m.End);
        return ((s.X + e.X) / 2, (s.Y + e.Y) / 2);
    }
}
