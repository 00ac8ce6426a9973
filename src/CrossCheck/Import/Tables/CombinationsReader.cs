using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The optional <c>combinations</c> table: one row per case of a combination with its factor, grouped into combinations in
/// the order they first appear. A combination's name must differ from every load case (claims name both in one column);
/// each case of it must be a load case, given once; <c>pattern</c> is <c>no</c> (default) or <c>spans</c>, and
/// <c>factor unloaded</c> belongs to a patterned row only.
/// </summary>
internal sealed class CombinationsReader : ITableReader
{
    private static readonly string[] PatternWords = ["no", "spans"];

    public void Read(SubmissionDraft d)
    {
        if (d.Table("combinations") is not { } t) return;
        var v = d.View(t, TableSchema.Combinations);
        var caseIds = d.Cases.Select(c => c.Id).ToHashSet(StringComparer.Ordinal);
        var terms = new List<(string Name, CombinationTerm Term)>();
        var seen = new Dictionary<(string, string), SourceRef>();
        var rejected = new HashSet<string>(StringComparer.Ordinal);
        foreach (var row in v.Rows)
        {
            string? name = v.Id(row, "combination");
            string? c = v.Id(row, "case");
            double? factor = v.Number(row, "factor", required: true);
            double? unloaded = v.Number(row, "factor unloaded");
            if (name is null) continue;
            bool ok = c is not null && factor is not null;
            if (caseIds.Contains(name) || d.RejectedCases.Contains(name))
            {
                d.Error(v.CellRef(row, "combination"), Messages.CombinationNamedLikeCase(name));
                ok = false;
            }
            if (c is not null && !caseIds.Contains(c))
            {
                // A case whose loads were all left out for errors of their own is not reported again.
                if (!d.RejectedCases.Contains(c)) d.Error(v.CellRef(row, "case"), Messages.CombinationCaseUnknown(c));
                ok = false;
            }
            bool? patterned = Pattern(d, v, row);
            if (patterned is null) ok = false;
            if (unloaded is not null && patterned == false)
            {
                d.Error(v.CellRef(row, "factor unloaded"), Messages.UnloadedFactorWithoutPattern);
                ok = false;
            }
            if (c is not null && !seen.TryAdd((name, c), v.RowRef(row)))
            {
                d.Error(v.RowRef(row), Messages.CombinationCaseTwice(name, c, seen[(name, c)].Compact));
                ok = false;
            }
            if (!ok) { rejected.Add(name); continue; }
            terms.Add((name, new CombinationTerm(c!, factor!.Value, patterned == true, unloaded ?? 0, v.RowRef(row))));
        }
        foreach (var g in terms.GroupBy(x => x.Name, StringComparer.Ordinal))
        {
            // A combination with a row left out is incomplete: claims naming it are not reported again.
            if (rejected.Contains(g.Key)) continue;
            d.Combinations.Add(new Combination(g.Key, g.Select(x => x.Term).ToList(), g.First().Term.Source));
        }
        foreach (var name in rejected) d.RejectedCases.Add(name);
    }

    /// <summary>The <c>pattern</c> cell: false for <c>no</c> or empty, true for <c>spans</c>; null (reported) for anything else.</summary>
    private static bool? Pattern(SubmissionDraft d, TableView v, RawRow row)
    {
        string text = v.Text(row, "pattern");
        switch (TableSchema.Normalize(text))
        {
            case "" or "no": return false;
            case "spans": return true;
            default:
                d.Error(v.CellRef(row, "pattern"), Messages.BadWord("pattern", text, PatternWords));
                return null;
        }
    }
}
