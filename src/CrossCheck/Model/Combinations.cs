namespace CrossCheck.Model;

/// <summary>
/// One row of the <c>combinations</c> table: a load case taken into a combination with a factor.
/// </summary>
/// <param name="Case">The load case id.</param>
/// <param name="Factor">Factor on every load of the case (member and joint loads alike).</param>
/// <param name="Patterned">
/// True for a variable case whose member loads may be present or absent member by member (<c>pattern</c> = <c>spans</c>):
/// the combination then has an envelope, not one answer. Joint loads of a patterned case are always present.
/// </param>
/// <param name="FactorUnloaded">Factor on the members where a patterned case is absent (0 unless given).</param>
/// <param name="Source">Where the row was read.</param>
public sealed record CombinationTerm(string Case, double Factor, bool Patterned, double FactorUnloaded, SourceRef Source);

/// <summary>
/// A load combination: factored load cases. Support movements enter a combination once, unfactored. Without a patterned
/// case it is a derived load case, claimed and compared like any other; with one, all its patterned cases share one
/// arrangement (each member loaded at <c>factor</c>, or unloaded at <c>factor unloaded</c>) and it has an envelope.
/// </summary>
/// <param name="Name">The combination's name, distinct from every load case.</param>
/// <param name="Terms">Its cases with their factors, in the order read.</param>
/// <param name="Source">Where its first row was read.</param>
public sealed record Combination(string Name, IReadOnlyList<CombinationTerm> Terms, SourceRef Source)
{
    /// <summary>True when a case of the combination is patterned (the combination has an envelope).</summary>
    public bool IsPatterned => Terms.Any(t => t.Patterned);

    /// <summary>
    /// The combination as one load case (every patterned case on every member at its factor): its loads are the cases'
    /// loads times their factors, under the combination's name.
    /// </summary>
    public LoadCase AllLoaded(IReadOnlyList<LoadCase> cases) => Factored(cases, _ => true);

    /// <summary>
    /// The combination with its patterned cases present on the members <paramref name="loaded"/> selects (at their factor)
    /// and absent elsewhere (at their unloaded factor); joint loads of every case at its factor.
    /// </summary>
    public LoadCase Factored(IReadOnlyList<LoadCase> cases, Func<string, bool> loaded)
    {
        ArgumentNullException.ThrowIfNull(cases);
        ArgumentNullException.ThrowIfNull(loaded);
        var loads = new List<Load>();
        foreach (var t in Terms)
        {
            if (cases.FirstOrDefault(c => c.Id == t.Case) is not { } lc) continue;
            foreach (var l in lc.Loads)
            {
                double f = t.Patterned && l is MemberLoad ml && !loaded(ml.Member) ? t.FactorUnloaded : t.Factor;
                if (f != 0) loads.Add(l.Scaled(f, Name));
            }
        }
        return new LoadCase(Name, loads);
    }

    /// <summary>"1.35 G + 1.5 Q (Q patterned, unloaded 0)" — the combination as an engineer writes it.</summary>
    public string Words => string.Join(" + ", Terms.Select(t => $"{Number(t.Factor)} {t.Case}")) +
                           (IsPatterned ? $" ({string.Join("; ", Terms.Where(t => t.Patterned).Select(t => $"{t.Case} patterned span by span, {Number(t.FactorUnloaded)} where unloaded"))})" : "");

    private static string Number(double v) => v.ToString("0.###", System.Globalization.CultureInfo.InvariantCulture);
}
