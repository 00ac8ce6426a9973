using CrossCheck.Model;

namespace CrossCheck.Import.Tables;

/// <summary>
/// The optional <c>envelopes</c> table: for a combination with a patterned case, the largest and least moment at a member
/// end (in the submission's own sign convention) or the largest span moment (<c>at</c> = <c>span</c>, sagging positive,
/// <c>max</c> only). Naming a combination without a patterned case, or none at all, is an input error.
/// </summary>
internal sealed class EnvelopesReader : ITableReader
{
    public void Read(SubmissionDraft d)
    {
        if (d.Table("envelopes") is not { } t) return;
        var v = d.View(t, TableSchema.Envelopes);
        d.Remember(v, "max", QuantityKind.Moment);
        double unit = v.Unit("max")?.ToSi ?? v.Unit("min")?.ToSi ?? 1;
        var claims = new List<ClaimedEnvelope>();
        var seen = new Dictionary<(string, string, string), SourceRef>();
        foreach (var row in v.Rows)
        {
            string? name = v.Id(row, "combination");
            string? member = v.Id(row, "member");
            string? at = v.Id(row, "at");
            double? max = v.Number(row, "max"), min = v.Number(row, "min");
            if (name is null || member is null || at is null) continue;
            if (!Patterned(d, v, row, name)) continue;
            bool span = TableSchema.Normalize(at) == "span";
            if (span && min is not null)
            {
                d.Warn(v.CellRef(row, "min"), Messages.EnvelopeSpanMinIgnored);
                min = null;
            }
            if (max is null && min is null)
            {
                if (v.Text(row, "max").Length == 0 && v.Text(row, "min").Length == 0) d.Error(v.RowRef(row), Messages.EnvelopeNeedsValue);
                continue;
            }
            var end = span ? null : MemberEndCell.Resolve(d.Model, member, at);
            string key = span ? "span" : end?.ToString() ?? at;
            if (!seen.TryAdd((name, member, key), v.RowRef(row)))
            {
                d.Error(v.RowRef(row), Messages.EnvelopeTwice(name, member, at, seen[(name, member, key)].Compact));
                continue;
            }
            claims.Add(new ClaimedEnvelope(name, member, at, end, span, max, min, v.RowRef(row))
            {
                MaxSource = max is null ? null : v.CellRef(row, "max"),
                MinSource = min is null ? null : v.CellRef(row, "min"),
                MaxAsWritten = max / unit,
                MinAsWritten = min / unit,
            });
        }
        d.Claims = d.Claims with { Envelopes = claims };
    }

    /// <summary>Whether the row names a combination with a patterned case (reported when not, unless the combination was left out).</summary>
    private static bool Patterned(SubmissionDraft d, TableView v, RawRow row, string name)
    {
        if (d.Combinations.FirstOrDefault(c => c.Name == name) is { } c)
        {
            if (c.IsPatterned) return true;
            d.Error(v.CellRef(row, "combination"), Messages.EnvelopeNotPatterned(name));
            return false;
        }
        if (!d.RejectedCases.Contains(name)) d.Error(v.CellRef(row, "combination"), Messages.EnvelopeUnknownCombination(name));
        return false;
    }
}
