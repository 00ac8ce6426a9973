using CrossCheck.Model;

namespace CrossCheck.Analysis;

/// <summary>
/// The load combinations of a submission: a combination without a patterned case is a derived load case (its factored
/// loads, support movements once) solved like any other; one with a patterned case gets an exact <see cref="Envelope"/>
/// by superposition — one analysis of its fixed part and one per member carrying a patterned load (on the structure
/// without support movements, which the fixed part holds once).
/// </summary>
public static class CombinationAnalysis
{
    /// <summary>
    /// The analysis of the load cases with the combinations added: derived cases appended to <see cref="AnalysisResult.Cases"/>
    /// under the combinations' names, envelopes in <see cref="AnalysisResult.Envelopes"/>. An analysis that already
    /// includes them, or a submission without combinations, is returned as it is.
    /// </summary>
    /// <exception cref="StructureException">The structure cannot be analysed under a combination.</exception>
    public static AnalysisResult Extend(AnalysisResult basic, IReadOnlyList<LoadCase> cases, IReadOnlyList<Combination> combinations, FrameSolver? solver = null)
    {
        ArgumentNullException.ThrowIfNull(basic);
        ArgumentNullException.ThrowIfNull(cases);
        ArgumentNullException.ThrowIfNull(combinations);
        if (basic.IncludesCombinations || combinations.Count == 0) return basic;
        solver ??= new FrameSolver();
        var derived = combinations.Where(c => !c.IsPatterned).Select(c => c.AllLoaded(cases)).ToList();
        var derivedResult = derived.Count > 0 ? solver.Solve(basic.Model, derived) : null;
        var envelopes = combinations.Where(c => c.IsPatterned).Select(c => EnvelopeOf(basic.Model, cases, c, solver)).ToList();
        return basic.WithCombinations(derivedResult, envelopes);
    }

    /// <summary>The exact envelope of a combination with a patterned case.</summary>
    public static Envelope EnvelopeOf(StructureModel model, IReadOnlyList<LoadCase> cases, Combination combination, FrameSolver? solver = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(combination);
        solver ??= new FrameSolver();
        var fixedPart = solver.Solve(model, [combination.Factored(cases, _ => false)]).Cases[0];
        var units = Contributions(cases, combination);
        var still = WithoutMovements(model);
        var solved = units.Count == 0 ? [] : solver.Solve(still, units.Select(u => u.Case).ToList()).Cases;
        var byMember = units.Select((u, i) => (u.Member, Result: solved[i])).ToDictionary(x => x.Member, x => x.Result, StringComparer.Ordinal);
        return new Envelope(combination, fixedPart, byMember, model.Members.Select(m => m.Id));
    }

    /// <summary>
    /// One load case per member that carries a member load of a patterned case: (factor − unloaded factor) times those
    /// loads, the member's contribution when it is loaded.
    /// </summary>
    private static List<(string Member, LoadCase Case)> Contributions(IReadOnlyList<LoadCase> cases, Combination combination)
    {
        var byMember = new Dictionary<string, List<Load>>(StringComparer.Ordinal);
        var order = new List<string>();
        foreach (var t in combination.Terms.Where(t => t.Patterned && t.Factor != t.FactorUnloaded))
        {
            if (cases.FirstOrDefault(c => c.Id == t.Case) is not { } lc) continue;
            foreach (var l in lc.MemberLoads)
            {
                if (!byMember.TryGetValue(l.Member, out var list)) { byMember[l.Member] = list = []; order.Add(l.Member); }
                list.Add(l.Scaled(t.Factor - t.FactorUnloaded, $"{combination.Name} · {l.Member} loaded"));
            }
        }
        return order.Select(m => (m, new LoadCase($"{combination.Name} · {m} loaded", byMember[m]))).ToList();
    }

    /// <summary>The structure without its support movements (for contributions that superpose on a part that holds them once).</summary>
    public static StructureModel WithoutMovements(StructureModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        return model.HasSupportMovements
            ? new StructureModel(model.Joints.Select(j => j with { Movement = default }).ToList(), model.Members, model.Axial, model.RelativeStiffness)
            : model;
    }
}
